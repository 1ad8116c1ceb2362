package dev.nanoplan.desktop;

import static dev.nanoplan.desktop.Widgets.button;

import dev.nanoplan.plan.LinkReport;
import dev.nanoplan.plan.RouteReport;
import java.nio.file.Path;
import javafx.geometry.Insets;
import javafx.geometry.Orientation;
import javafx.geometry.Pos;
import javafx.scene.Node;
import javafx.scene.Parent;
import javafx.scene.control.Button;
import javafx.scene.control.Label;
import javafx.scene.control.ListView;
import javafx.scene.control.ProgressIndicator;
import javafx.scene.control.Separator;
import javafx.scene.control.SplitPane;
import javafx.scene.control.Tab;
import javafx.scene.control.TabPane;
import javafx.scene.control.TableView;
import javafx.scene.control.ToggleButton;
import javafx.scene.control.ToolBar;
import javafx.scene.control.Tooltip;
import javafx.scene.layout.BorderPane;
import javafx.scene.layout.Region;
import javafx.scene.layout.StackPane;
import javafx.scene.layout.VBox;

/**
 * The main window's content (the View of MVVM): tool bar, inspector, 3D view with legend, and the
 * link / route / budget / comparison / chart panels. Only binds to {@link PlannerViewModel} and
 * forwards events; file dialogs and menus live in {@link AppActions}.
 */
public final class MainView {

    private final PlannerViewModel vm;
    private final SceneView sceneView;
    private final BorderPane root = new BorderPane();
    private final PlanTablesView tables;
    private final TabPane tabs = new TabPane();
    private final LinkChartsView charts;
    private final SimulationViewModel simulation;
    private final ToleranceViewModel tolerance;
    private final ImproveViewModel improve;

    /** The window's content; simulated channels are cached where the command line caches them. */
    public MainView(PlannerViewModel vm, AppActions actions) {
        this(vm, actions, SimulationViewModel.defaultCacheDirectory());
    }

    /** The window's content, with simulated channels cached in {@code simulationCacheDir}. */
    public MainView(PlannerViewModel vm, AppActions actions, Path simulationCacheDir) {
        this.vm = vm;
        this.simulation = SimulationViewModel.forApplication(vm, simulationCacheDir);
        this.sceneView = new SceneView(vm);
        this.tolerance = ToleranceViewModel.forApplication(vm);
        this.improve = ImproveViewModel.forApplication(vm);
        new SceneOverlays(sceneView, vm, tolerance, improve);
        root.getStyleClass().add("nanoplan");
        root.getStylesheets().add(MainView.class.getResource("nanoplan.css").toExternalForm());

        StackPane centre = new StackPane(sceneView.node());
        Region legend = Legend.create(vm.maxCapacityBitsProperty());
        StackPane.setAlignment(legend, Pos.BOTTOM_LEFT);
        StackPane.setMargin(legend, new Insets(10));
        ProgressIndicator busy = new ProgressIndicator();
        busy.setMaxSize(36, 36);
        busy.visibleProperty().bind(vm.plans().busyProperty());
        busy.setId("busy");
        StackPane.setAlignment(busy, Pos.TOP_RIGHT);
        StackPane.setMargin(busy, new Insets(10));
        Label hint = new Label("drag: orbit · right-drag: pan · wheel: zoom · shift-drag node: move · F fit · 1/2/3 front/side/top");
        hint.getStyleClass().add("hint");
        StackPane.setAlignment(hint, Pos.TOP_LEFT);
        StackPane.setMargin(hint, new Insets(8));
        centre.getChildren().addAll(legend, busy, hint);
        centre.getStyleClass().add("centre");

        tables = new PlanTablesView(vm, () -> tabs.getSelectionModel().select(0));
        charts = new LinkChartsView(vm);
        tabs.getTabs().addAll(
                tab("Links", tables.linkTable()),
                tab("Routes", tables.routesPane()),
                tab("Budgets", tables.budgetTable()),
                tab("Compare", tables.comparePane()),
                tab("Link charts", charts.node()),
                tab("Simulation", new SimulationView(simulation).node()),
                tab("Tolerance", new ToleranceView(tolerance).node()),
                tab("Improve", new ImproveView(improve).node()),
                tab("Warnings", warningsPane()),
                tab("Settings", new SettingsPane(vm).node()));
        tabs.setTabClosingPolicy(TabPane.TabClosingPolicy.UNAVAILABLE);
        tabs.setMinWidth(300);

        SplitPane split = new SplitPane(new InspectorPane(vm, sceneView.dragPlaneProperty()).node(), centre, tabs);
        split.setDividerPositions(0.18, 0.62);
        SplitPane.setResizableWithParent(split.getItems().get(0), false);

        root.setTop(new VBox(actions == null ? new Region() : actions.menuBar(), toolBar(actions)));
        root.setCenter(split);
        root.setBottom(StatusBar.create(vm));
    }

    public Parent root() {
        return root;
    }

    public SceneView sceneView() {
        return sceneView;
    }

    public TableView<LinkReport> linkTable() {
        return tables.linkTable();
    }

    public TableView<RouteReport> routeTable() {
        return tables.routeTable();
    }

    LinkChartsView charts() {
        return charts;
    }

    /** The Simulation tab's view model. */
    public SimulationViewModel simulation() {
        return simulation;
    }

    /** The Tolerance tab's view model. */
    public ToleranceViewModel tolerance() {
        return tolerance;
    }

    /** The Improve tab's view model. */
    public ImproveViewModel improve() {
        return improve;
    }

    /** Shows the panel tab with this title; false when there is none. */
    public boolean showTab(String title) {
        for (Tab t : tabs.getTabs()) {
            if (t.getText().equalsIgnoreCase(title)) {
                tabs.getSelectionModel().select(t);
                return true;
            }
        }
        return false;
    }

    public TabPane tabs() {
        return tabs;
    }

    // ------------------------------------------------------------------ pieces

    private ToolBar toolBar(AppActions actions) {
        Button undo = button("Undo", "Undo the last edit (Ctrl+Z)", vm::undo);
        undo.disableProperty().bind(vm.document().undoStack().canUndoProperty().not());
        Button redo = button("Redo", "Redo (Ctrl+Y)", vm::redo);
        redo.disableProperty().bind(vm.document().undoStack().canRedoProperty().not());
        Button fit = button("Fit", "Fit the nodes in view (F)", sceneView::fit);
        Button volume = button("Volume", "Show the whole volume (V)", () -> sceneView.preset(SceneView.Preset.VOLUME));
        ToggleButton ids = new ToggleButton("Ids");
        ids.setTooltip(new Tooltip("Show node ids (a label that would overlap another is left out)"));
        ids.selectedProperty().bindBidirectional(sceneView.showLabelsProperty());
        Button front = button("Front", "Look along +y (1)", () -> sceneView.preset(SceneView.Preset.FRONT));
        Button side = button("Side", "Look along the x axis (2)", () -> sceneView.preset(SceneView.Preset.SIDE));
        Button top = button("Top", "Look down the z axis (3)", () -> sceneView.preset(SceneView.Preset.TOP));
        Button persp = button("3D", "Perspective view (0)", () -> sceneView.preset(SceneView.Preset.PERSPECTIVE));
        ToggleButton routesOnly = new ToggleButton("Routes only");
        routesOnly.selectedProperty().bindBidirectional(vm.tables().showRoutesOnlyProperty());
        Button keep = button("Keep for compare", "Keep this design's numbers to compare with later edits",
                vm::keepForComparison);
        Button improveB = button("Improve…", "Search for a better layout: species, budgets, relay positions",
                () -> showTab("Improve"));
        Button cancel = button("Cancel", "Cancel the running plan", vm::cancelPlan);
        cancel.visibleProperty().bind(vm.plans().busyProperty());
        ToolBar bar = new ToolBar();
        if (actions != null) {
            bar.getItems().addAll(button("Open…", "Open a scenario file", actions::open),
                    button("Save", "Save (atomic)", actions::save), new Separator(Orientation.VERTICAL));
        }
        bar.getItems().addAll(undo, redo, new Separator(Orientation.VERTICAL), fit, volume, persp, front, side, top,
                ids, routesOnly, new Separator(Orientation.VERTICAL), keep, improveB, cancel);
        return bar;
    }

    private Region warningsPane() {
        ListView<String> list = new ListView<>(vm.tables().warnings());
        list.setPlaceholder(new Label("no warnings"));
        return list;
    }

    // ------------------------------------------------------------------ helpers

    private static Tab tab(String name, Node content) {
        return new Tab(name, content);
    }

}
