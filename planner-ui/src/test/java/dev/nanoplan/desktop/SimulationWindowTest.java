package dev.nanoplan.desktop;

import static dev.nanoplan.desktop.MainWindowTest.onFx;
import static org.assertj.core.api.Assertions.assertThat;

import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.Scenario;
import java.util.concurrent.ScheduledExecutorService;
import java.util.concurrent.TimeUnit;
import javafx.application.Platform;
import javafx.scene.Scene;
import javafx.scene.control.Button;
import javafx.scene.control.Label;
import javafx.scene.control.ProgressBar;
import javafx.scene.control.Tab;
import javafx.scene.control.TableView;
import javafx.scene.control.TextField;
import javafx.stage.Stage;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.Assumptions;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.Timeout;
import org.testfx.util.WaitForAsyncUtils;

/**
 * Real window (under xvfb-run, like {@link MainWindowTest}): the Simulation tab runs a small
 * simulation of a bundled layout from its Run button and fills its table.
 */
@Timeout(value = 180, unit = TimeUnit.SECONDS)
class SimulationWindowTest {

    ScheduledExecutorService bg;
    Stage stage;

    @BeforeAll
    static void startFx() throws Exception {
        String display = System.getenv("DISPLAY");
        boolean ci = "true".equalsIgnoreCase(System.getenv("CI"));
        Assumptions.assumeTrue(ci || (display != null && !display.isBlank()),
                "no display: run the UI tests under xvfb-run (CI does)");
        DesktopLauncher.startPlatform();
    }

    @AfterEach
    void close() throws Exception {
        if (stage != null) {
            onFx(() -> {
                stage.close();
                return null;
            });
        }
        if (bg != null) {
            bg.shutdownNow();
        }
    }

    @Test
    void simulationTabRunsTheLayoutAndFillsTheTable() throws Exception {
        bg = PlannerViewModel.daemonScheduler();
        PlannerViewModel vm = onFx(() -> {
            PlannerViewModel v = new PlannerViewModel(PlanService.core(), Platform::runLater, bg, 0,
                    new RecentFiles(null));
            MainView view = new MainView(v, null);
            stage = new Stage();
            stage.setScene(new Scene(view.root(), 1200, 760));
            stage.show();
            assertThat(v.open(MainWindowTest.SCENARIOS.resolve("relay-chain-direct.json"))).isTrue();
            assertThat(view.showTab("Simulation")).isTrue();
            return v;
        });
        vm.planned().get(150, TimeUnit.SECONDS);
        WaitForAsyncUtils.waitForFxEvents();

        SimulationView sv = onFx(() -> {
            var tabs = ((javafx.scene.Parent) stage.getScene().getRoot()).lookup(".tab-pane");
            Tab tab = ((javafx.scene.control.TabPane) tabs).getSelectionModel().getSelectedItem();
            assertThat(tab.getText()).isEqualTo("Simulation");
            javafx.scene.Node content = tab.getContent();
            ProgressBar bar = (ProgressBar) content.lookup("#sim-progress");
            assertThat(bar.getProgress()).isZero();
            // 2000 molecules of the one transmitter: about 2e7 molecule-steps, a second or so
            ((TextField) content.lookup("#sim-molecules")).setText("2000");
            Button run = (Button) content.lookup("#sim-run");
            assertThat(run.isDisabled()).isFalse();
            run.fire();
            return (SimulationView) content.getUserData();
        });
        assertThat(sv.viewModel().finished().get(150, TimeUnit.SECONDS))
                .as(() -> sv.viewModel().statusProperty().get()).isEqualTo(SimulationViewModel.Outcome.COMPLETE);
        WaitForAsyncUtils.waitForFxEvents();

        onFx(() -> {
            javafx.scene.Node content = sv.node();
            assertThat(((ProgressBar) content.lookup("#sim-progress")).getProgress()).isEqualTo(1.0);
            @SuppressWarnings("unchecked")
            TableView<SimulationRow> table = (TableView<SimulationRow>) content.lookup("#sim-table");
            // one row per emitter → receiver pair of the same species: here src → dst only
            Scenario s = vm.scenarioProperty().get();
            long pairs = s.nodes().stream().filter(n -> n.role().emits()).mapToLong(e -> s.nodes().stream()
                    .filter(r -> r != e && r.role().absorbs() && r.species().equals(e.emitsSpecies())).count()).sum();
            assertThat(table.getItems()).hasSize((int) pairs);
            assertThat(table.getItems().get(0).from()).isEqualTo(firstEmitter(s).id());
            assertThat(((Label) content.lookup("#sim-status")).getText()).startsWith("done:");
            assertThat(content.lookup("#sim-stale").isVisible()).isFalse();
            return null;
        });

        // an edit after the run shows the stale mark
        onFx(() -> vm.moveNode("dst", new dev.nanoplan.geometry.Vec3(150, 0, 0)));
        WaitForAsyncUtils.waitForFxEvents();
        assertThat(onFx(() -> sv.node().lookup("#sim-stale").isVisible())).isTrue();
    }

    static Node firstEmitter(Scenario s) {
        return s.nodes().stream().filter(n -> n.role().emits()).findFirst().orElseThrow();
    }
}
