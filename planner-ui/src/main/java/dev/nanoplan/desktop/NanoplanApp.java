package dev.nanoplan.desktop;

import java.nio.file.Path;
import java.util.List;
import javafx.application.Application;
import javafx.scene.Scene;
import javafx.stage.Stage;

/**
 * The desktop planner application. Not a jar's main class (JavaFX refuses that on a plain class
 * path): start it with {@link DesktopLauncher#launch(Path)}. The first raw parameter, if any, is
 * the scenario file to open.
 */
public final class NanoplanApp extends Application {

    @Override
    public void start(Stage stage) {
        PlannerViewModel vm = PlannerViewModel.forApplication();
        AppActions actions = new AppActions(stage, vm);
        MainView view = new MainView(vm, actions);
        Scene scene = new Scene(view.root(), 1400, 860);
        stage.setScene(scene);
        stage.titleProperty().bind(vm.document().titleProperty());
        stage.setOnCloseRequest(e -> {
            if (!actions.confirmDiscard()) {
                e.consume();
            }
        });
        // closed by the window's button or File ▸ Quit: a simulation in progress would be dropped
        stage.setOnHidden(e -> {
            view.simulation().dispose();
            view.tolerance().cancel();
            view.improve().cancel();
        });
        List<String> raw = getParameters().getRaw();
        if (!raw.isEmpty()) {
            vm.open(Path.of(raw.get(0)));
        } else {
            var t = actions.template("culture-tank");
            if (t != null) {
                vm.load(t, null);
            }
        }
        stage.show();
    }
}
