package dev.nanoplan.desktop;

import dev.nanoplan.report.Cautions;
import dev.nanoplan.scenario.Role;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.ScenarioException;
import dev.nanoplan.scenario.ScenarioReader;
import dev.nanoplan.scenario.SwarmGenerator;
import java.io.File;
import java.io.IOException;
import java.io.InputStream;
import java.nio.file.Path;
import java.util.List;
import javafx.collections.ListChangeListener;
import javafx.scene.control.Alert;
import javafx.scene.control.ButtonBar;
import javafx.scene.control.ButtonType;
import javafx.scene.control.Menu;
import javafx.scene.control.MenuBar;
import javafx.scene.control.MenuItem;
import javafx.scene.control.SeparatorMenuItem;
import javafx.scene.control.TextArea;
import javafx.scene.input.KeyCombination;
import javafx.stage.FileChooser;
import javafx.stage.Stage;

/**
 * Window-level actions: menus, file dialogs, the unsaved-changes guard, exports and the
 * About/Assumptions view. Everything that changes the layout is delegated to the view model, which
 * tells the other panes when a layout is replaced; this class knows no view.
 */
public final class AppActions {

    /** Bundled example layouts, shown under File ▸ New from template. */
    static final List<String> TEMPLATES = List.of("culture-tank", "vessel-segment", "relay-chain-relayed",
            "relay-chain-direct");

    private final Stage stage;
    private final PlannerViewModel vm;

    public AppActions(Stage stage, PlannerViewModel vm) {
        this.stage = stage;
        this.vm = vm;
    }

    MenuBar menuBar() {
        Menu file = new Menu("File");
        Menu templates = new Menu("New from template");
        for (String t : TEMPLATES) {
            templates.getItems().add(item(t, null, () -> openTemplate(t)));
        }
        templates.getItems().add(item("random swarm (40 nodes, open medium)", null,
                () -> guarded(() -> vm.load(SwarmGenerator.generate(40, System.nanoTime()), null))));
        Menu recent = new Menu("Open recent");
        Runnable fill = () -> {
            recent.getItems().clear();
            for (Path p : vm.document().recentFiles()) {
                recent.getItems().add(item(p.toString(), null, () -> guarded(() -> vm.open(p))));
            }
            recent.setDisable(recent.getItems().isEmpty());
        };
        fill.run();
        vm.document().recentFiles().addListener((ListChangeListener<Path>) c -> fill.run());
        file.getItems().addAll(templates, item("Open…", "Shortcut+O", this::open), recent, new SeparatorMenuItem(),
                item("Save", "Shortcut+S", this::save), item("Save As…", "Shortcut+Shift+S", this::saveAs),
                new SeparatorMenuItem(), item("Export 3D view as PNG…", null, this::exportPng),
                item("Export HTML report…", null, this::exportHtml), new SeparatorMenuItem(),
                item("Quit", "Shortcut+Q", () -> {
                    if (confirmDiscard()) {
                        stage.close();
                    }
                }));
        Menu edit = new Menu("Edit");
        edit.getItems().addAll(item("Undo", "Shortcut+Z", vm::undo), item("Redo", "Shortcut+Y", vm::redo),
                new SeparatorMenuItem(),
                item("Add transmitter", null, () -> vm.editor().addNode(Role.TRANSMITTER)),
                item("Add receiver", null, () -> vm.editor().addNode(Role.RECEIVER)),
                item("Add relay", null, () -> vm.editor().addNode(Role.RELAY)),
                item("Duplicate node", "Shortcut+D", () -> vm.editor().duplicateNode(vm.editor().selectedNodeIdProperty().get())),
                item("Delete node", "Delete", () -> vm.editor().deleteNode(vm.editor().selectedNodeIdProperty().get())));
        Menu help = new Menu("Help");
        help.getItems().add(item("About and assumptions", "F1", this::about));
        return new MenuBar(file, edit, help);
    }

    void open() {
        if (!confirmDiscard()) {
            return;
        }
        FileChooser fc = chooser("Open scenario");
        File f = fc.showOpenDialog(stage);
        if (f != null) {
            vm.open(f.toPath());
        }
    }

    void save() {
        if (!vm.save()) {
            saveAs();
        }
    }

    void saveAs() {
        FileChooser fc = chooser("Save scenario as");
        File f = fc.showSaveDialog(stage);
        if (f != null) {
            vm.saveAs(f.toPath());
        }
    }

    void exportPng() {
        if (stage.getScene() == null) {
            return;
        }
        FileChooser fc = new FileChooser();
        fc.setTitle("Export 3D view");
        fc.getExtensionFilters().add(new FileChooser.ExtensionFilter("PNG image", "*.png"));
        File f = fc.showSaveDialog(stage);
        if (f == null) {
            return;
        }
        try {
            Snapshots.writePng(stage.getScene().snapshot(null), f.toPath());
            vm.say("exported " + f.getName());
        } catch (IOException e) {
            vm.say("cannot export: " + e.getMessage());
        }
    }

    void exportHtml() {
        FileChooser fc = new FileChooser();
        fc.setTitle("Export HTML report");
        fc.getExtensionFilters().add(new FileChooser.ExtensionFilter("HTML page", "*.html"));
        File f = fc.showSaveDialog(stage);
        if (f != null) {
            vm.exportHtml(f.toPath());
        }
    }

    void about() {
        aboutDialog().showAndWait();
    }

    /** The About and assumptions dialog, styled with the app's dark stylesheet (not yet shown). */
    Alert aboutDialog() {
        StringBuilder sb = new StringBuilder("nanoplan desktop planner\n\n");
        Cautions.FULL.forEach(l -> sb.append(l).append("\n\n"));
        sb.append("Every result rests on these assumptions:\n");
        Cautions.ASSUMPTIONS.forEach(a -> sb.append(" • ").append(a).append('\n'));
        Alert a = new Alert(Alert.AlertType.INFORMATION);
        a.initOwner(stage);
        a.setTitle("About nanoplan");
        a.setHeaderText("About and assumptions");
        TextArea t = new TextArea(sb.toString());
        t.setEditable(false);
        t.setWrapText(true);
        t.setPrefSize(560, 320);
        a.getDialogPane().setContent(t);
        // the dialog is a scene of its own: the app's stylesheet makes it dark like the window
        a.getDialogPane().getStylesheets().add(AppActions.class.getResource("nanoplan.css").toExternalForm());
        return a;
    }

    /** Asks what to do with unsaved changes; true when it is fine to go on. */
    boolean confirmDiscard() {
        if (!vm.document().dirtyProperty().get()) {
            return true;
        }
        ButtonType saveB = new ButtonType("Save", ButtonBar.ButtonData.YES);
        ButtonType discard = new ButtonType("Discard", ButtonBar.ButtonData.NO);
        Alert a = new Alert(Alert.AlertType.CONFIRMATION, "The layout has unsaved changes.", saveB, discard,
                ButtonType.CANCEL);
        a.initOwner(stage);
        a.setHeaderText("Save changes?");
        ButtonType r = a.showAndWait().orElse(ButtonType.CANCEL);
        if (r == saveB) {
            save();
            return !vm.document().dirtyProperty().get();
        }
        return r == discard;
    }

    private void openTemplate(String name) {
        guarded(() -> {
            Scenario s = template(name);
            if (s != null) {
                vm.load(s, null);
            }
        });
    }

    /** A bundled template by name, or null (with a message) when it is missing. */
    Scenario template(String name) {
        try (InputStream in = AppActions.class.getResourceAsStream("templates/" + name + ".json")) {
            if (in == null) {
                vm.say("template " + name + " is not bundled");
                return null;
            }
            return ScenarioReader.strict().read(in);
        } catch (IOException | ScenarioException e) {
            vm.say("template " + name + ": " + e.getMessage());
            return null;
        }
    }

    private void guarded(Runnable r) {
        if (confirmDiscard()) {
            r.run();
        }
    }

    private FileChooser chooser(String title) {
        FileChooser fc = new FileChooser();
        fc.setTitle(title);
        fc.getExtensionFilters().add(new FileChooser.ExtensionFilter("nanoplan scenario", "*.json"));
        Path cur = vm.document().fileProperty().get();
        if (cur != null && cur.toAbsolutePath().getParent() != null) {
            fc.setInitialDirectory(cur.toAbsolutePath().getParent().toFile());
        }
        return fc;
    }

    private static MenuItem item(String text, String accel, Runnable r) {
        MenuItem m = new MenuItem(text);
        if (accel != null) {
            m.setAccelerator(KeyCombination.keyCombination(accel));
        }
        m.setOnAction(e -> r.run());
        return m;
    }
}
