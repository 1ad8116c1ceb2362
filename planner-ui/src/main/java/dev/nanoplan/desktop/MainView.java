package dev.nanoplan.desktop;

import dev.nanoplan.count.CountModelKind;
import dev.nanoplan.plan.BudgetReport;
import dev.nanoplan.plan.LinkReport;
import dev.nanoplan.plan.RouteReport;
import dev.nanoplan.report.Cautions;
import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.Role;
import dev.nanoplan.scenario.Schedule;
import java.util.List;
import java.util.function.Function;
import javafx.beans.binding.Bindings;
import javafx.beans.property.ReadOnlyObjectWrapper;
import javafx.beans.property.ReadOnlyStringWrapper;
import javafx.beans.value.ObservableValue;
import javafx.collections.ListChangeListener;
import javafx.geometry.Insets;
import javafx.geometry.Orientation;
import javafx.geometry.Pos;
import javafx.scene.Parent;
import javafx.scene.control.Button;
import javafx.scene.control.ChoiceBox;
import javafx.scene.control.ComboBox;
import javafx.scene.control.Label;
import javafx.scene.control.ListView;
import javafx.scene.control.ProgressIndicator;
import javafx.scene.control.Separator;
import javafx.scene.control.SplitPane;
import javafx.scene.control.Tab;
import javafx.scene.control.TabPane;
import javafx.scene.control.TableColumn;
import javafx.scene.control.TableView;
import javafx.scene.control.TextArea;
import javafx.scene.control.TextField;
import javafx.scene.control.ToggleButton;
import javafx.scene.control.ToolBar;
import javafx.scene.control.Tooltip;
import javafx.scene.layout.BorderPane;
import javafx.scene.layout.GridPane;
import javafx.scene.layout.HBox;
import javafx.scene.layout.Priority;
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
    private final TableView<LinkReport> linkTable = new TableView<>();
    private final TableView<RouteReport> routeTable = new TableView<>();
    private final TableView<BudgetReport> budgetTable = new TableView<>();
    private final TabPane tabs = new TabPane();
    private boolean syncing;
    private final LinkChartsView charts;
    private final SimulationViewModel simulation;

    /** The window's content; simulated channels are cached where the command line caches them. */
    public MainView(PlannerViewModel vm, AppActions actions) {
        this(vm, actions, SimulationViewModel.defaultCacheDirectory());
    }

    /** The window's content, with simulated channels cached in {@code simulationCacheDir}. */
    public MainView(PlannerViewModel vm, AppActions actions, java.nio.file.Path simulationCacheDir) {
        this.vm = vm;
        this.simulation = SimulationViewModel.forApplication(vm, simulationCacheDir);
        this.sceneView = new SceneView(vm);
        root.getStyleClass().add("nanoplan");
        root.getStylesheets().add(MainView.class.getResource("nanoplan.css").toExternalForm());

        StackPane centre = new StackPane(sceneView.node());
        Region legend = Legend.create(vm.maxCapacityBitsProperty());
        StackPane.setAlignment(legend, Pos.BOTTOM_LEFT);
        StackPane.setMargin(legend, new Insets(10));
        ProgressIndicator busy = new ProgressIndicator();
        busy.setMaxSize(36, 36);
        busy.visibleProperty().bind(vm.busyProperty());
        busy.setId("busy");
        StackPane.setAlignment(busy, Pos.TOP_RIGHT);
        StackPane.setMargin(busy, new Insets(10));
        Label hint = new Label("drag: orbit · right-drag: pan · wheel: zoom · shift-drag node: move · F fit · 1/2/3 front/side/top");
        hint.getStyleClass().add("hint");
        StackPane.setAlignment(hint, Pos.TOP_LEFT);
        StackPane.setMargin(hint, new Insets(8));
        centre.getChildren().addAll(legend, busy, hint);
        centre.getStyleClass().add("centre");

        buildTables();
        charts = new LinkChartsView(vm);
        tabs.getTabs().addAll(
                tab("Links", linkTable),
                tab("Routes", routesPane()),
                tab("Budgets", budgetTable),
                tab("Compare", comparePane()),
                tab("Link charts", charts.node()),
                tab("Simulation", new SimulationView(simulation).node()),
                tab("Warnings", warningsPane()),
                tab("Settings", settingsPane()));
        tabs.setTabClosingPolicy(TabPane.TabClosingPolicy.UNAVAILABLE);
        tabs.setMinWidth(300);

        SplitPane split = new SplitPane(inspector(), centre, tabs);
        split.setDividerPositions(0.18, 0.62);
        SplitPane.setResizableWithParent(split.getItems().get(0), false);

        root.setTop(new VBox(actions == null ? new Region() : actions.menuBar(), toolBar(actions)));
        root.setCenter(split);
        root.setBottom(statusBar());
    }

    public Parent root() {
        return root;
    }

    public SceneView sceneView() {
        return sceneView;
    }

    public TableView<LinkReport> linkTable() {
        return linkTable;
    }

    public TableView<RouteReport> routeTable() {
        return routeTable;
    }

    LinkChartsView charts() {
        return charts;
    }

    /** The Simulation tab's view model. */
    public SimulationViewModel simulation() {
        return simulation;
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
        undo.disableProperty().bind(vm.undoStack().canUndoProperty().not());
        Button redo = button("Redo", "Redo (Ctrl+Y)", vm::redo);
        redo.disableProperty().bind(vm.undoStack().canRedoProperty().not());
        Button fit = button("Fit", "Fit the layout in view (F)", sceneView::fit);
        Button front = button("Front", "Look along +y (1)", () -> sceneView.preset(SceneView.Preset.FRONT));
        Button side = button("Side", "Look along the x axis (2)", () -> sceneView.preset(SceneView.Preset.SIDE));
        Button top = button("Top", "Look down the z axis (3)", () -> sceneView.preset(SceneView.Preset.TOP));
        Button persp = button("3D", "Perspective view (0)", () -> sceneView.preset(SceneView.Preset.PERSPECTIVE));
        ToggleButton routesOnly = new ToggleButton("Routes only");
        routesOnly.selectedProperty().bindBidirectional(vm.showRoutesOnlyProperty());
        Button keep = button("Keep for compare", "Keep this design's numbers to compare with later edits",
                vm::keepForComparison);
        Button cancel = button("Cancel", "Cancel the running plan", vm::cancelPlan);
        cancel.visibleProperty().bind(vm.busyProperty());
        ToolBar bar = new ToolBar();
        if (actions != null) {
            bar.getItems().addAll(button("Open…", "Open a scenario file", actions::open),
                    button("Save", "Save (atomic)", actions::save), new Separator(Orientation.VERTICAL));
        }
        bar.getItems().addAll(undo, redo, new Separator(Orientation.VERTICAL), fit, persp, front, side, top,
                routesOnly, new Separator(Orientation.VERTICAL), keep, cancel);
        return bar;
    }

    private Region inspector() {
        NodeInspector in = vm.inspector();
        GridPane g = new GridPane();
        g.setHgap(6);
        g.setVgap(5);
        int row = 0;
        TextField id = field(in.idProperty());
        ChoiceBox<Role> role = new ChoiceBox<>();
        role.getItems().addAll(Role.values());
        role.valueProperty().bindBidirectional(in.roleProperty());
        g.addRow(row++, new Label("id"), id);
        g.addRow(row++, new Label("role"), role);
        g.addRow(row++, new Label("x µm"), field(in.xUmProperty()));
        g.addRow(row++, new Label("y µm"), field(in.yUmProperty()));
        g.addRow(row++, new Label("z µm"), field(in.zUmProperty()));
        g.addRow(row++, new Label("radius µm"), field(in.radiusUmProperty()));
        ComboBox<String> species = new ComboBox<>();
        species.setEditable(true);
        species.valueProperty().bindBidirectional(in.speciesProperty());
        ComboBox<String> emits = new ComboBox<>();
        emits.setEditable(true);
        emits.valueProperty().bindBidirectional(in.emitsSpeciesProperty());
        // the layout's species and those declared in the Settings tab that no node uses yet
        species.setItems(vm.speciesNames());
        emits.setItems(vm.speciesNames());
        emits.disableProperty().bind(in.roleProperty().isNotEqualTo(Role.RELAY));
        g.addRow(row++, new Label("species"), species);
        g.addRow(row++, new Label("emits"), emits);
        g.addRow(row++, new Label("molecules/symbol"), field(in.moleculesPerSymbolProperty()));
        Button apply = button("Apply", "Apply the fields to the selected node (Enter)", vm::applyInspector);
        apply.setDefaultButton(true);
        apply.disableProperty().bind(vm.selectedNodeIdProperty().isNull());
        Button dup = button("Duplicate", "Copy the selected node beside it",
                () -> vm.duplicateNode(vm.selectedNodeIdProperty().get()));
        dup.disableProperty().bind(vm.selectedNodeIdProperty().isNull());
        Button del = button("Delete", "Delete the selected node and its demands",
                () -> vm.deleteNode(vm.selectedNodeIdProperty().get()));
        del.disableProperty().bind(vm.selectedNodeIdProperty().isNull());
        HBox editRow = new HBox(6, apply, dup, del);
        HBox addRow = new HBox(6, button("+ Tx", "Add a transmitter", () -> vm.addNode(Role.TRANSMITTER)),
                button("+ Rx", "Add a receiver", () -> vm.addNode(Role.RECEIVER)),
                button("+ Relay", "Add a relay", () -> vm.addNode(Role.RELAY)));
        ChoiceBox<SceneView.DragPlane> plane = new ChoiceBox<>();
        plane.getItems().addAll(SceneView.DragPlane.values());
        plane.valueProperty().bindBidirectional(sceneView.dragPlaneProperty());
        HBox planeRow = new HBox(6, new Label("drag in plane"), plane);
        planeRow.setAlignment(Pos.CENTER_LEFT);

        ComboBox<String> from = new ComboBox<>();
        ComboBox<String> to = new ComboBox<>();
        vm.scenarioProperty().addListener((o, a, b) -> {
            if (b != null) {
                from.getItems().setAll(b.nodes().stream().filter(n -> n.role().emits()).map(Node::id).toList());
                to.getItems().setAll(b.nodes().stream().filter(n -> n.role().absorbs()).map(Node::id).toList());
            }
        });
        from.setPrefWidth(90);
        to.setPrefWidth(90);
        Button addDemand = button("+ Demand", "Add a demand from → to",
                () -> vm.addDemand(from.getValue(), to.getValue()));
        addDemand.disableProperty().bind(from.valueProperty().isNull().or(to.valueProperty().isNull()));
        Button removeDemand = button("− Demand", "Remove the selected route's demand", () -> {
            RouteReport r = vm.selectedRouteProperty().get();
            if (r != null) {
                vm.removeDemand(r.from(), r.to());
            }
        });
        removeDemand.disableProperty().bind(vm.selectedRouteProperty().isNull());
        Label head = new Label("Node");
        head.getStyleClass().add("section");
        Label dhead = new Label("Demands");
        dhead.getStyleClass().add("section");
        VBox box = new VBox(8, head, g, editRow, addRow, planeRow, new Separator(), dhead,
                new HBox(4, from, new Label("→"), to), new HBox(6, addDemand, removeDemand));
        box.setPadding(new Insets(10));
        box.getStyleClass().add("inspector");
        box.setMinWidth(230);
        return box;
    }

    private void buildTables() {
        linkTable.getColumns().addAll(List.of(
                text("from", LinkReport::from),
                text("to", LinkReport::to),
                text("species", LinkReport::species),
                number("capacity bit", LinkReport::capacityBits),
                number("rate bit/s", LinkReport::rateBitsPerS),
                numberText("error", l -> l.errorProbability() > 0 ? l.errorProbability() : Math.pow(10, l.log10ErrorProbability()),
                        l -> Formats.error(l.errorProbability(), l.log10ErrorProbability())),
                number("τ", l -> (double) l.threshold()),
                text("limited by", l -> l.limitedBy() == null ? "" : l.limitedBy().id()),
                text("top interferer", l -> l.topInterferer() == null ? "" : l.topInterferer())));
        linkTable.setItems(vm.links());
        linkTable.setPlaceholder(new Label("no links above the planner's capacity floor"));
        linkTable.setId("link-table");
        linkTable.getSelectionModel().selectedItemProperty().addListener((o, a, b) -> {
            if (!syncing && b != null) {
                syncing = true;
                vm.selectedLinkProperty().set(b);
                syncing = false;
            }
        });
        vm.selectedLinkProperty().addListener((o, a, b) -> {
            if (syncing) {
                return;
            }
            syncing = true;
            if (b == null) {
                linkTable.getSelectionModel().clearSelection();
            } else {
                int i = indexOf(b);
                if (i >= 0) {
                    linkTable.getSelectionModel().clearAndSelect(i);
                    linkTable.scrollTo(i);
                    tabs.getSelectionModel().select(0);
                }
            }
            syncing = false;
        });
        vm.links().addListener((ListChangeListener<LinkReport>) c -> {
            LinkReport sel = vm.selectedLinkProperty().get();
            if (sel != null) {
                syncing = true;
                int i = indexOf(sel);
                if (i >= 0) {
                    linkTable.getSelectionModel().clearAndSelect(i);
                }
                syncing = false;
            }
        });

        routeTable.getColumns().addAll(List.of(
                text("from", RouteReport::from),
                text("to", RouteReport::to),
                text("hops", r -> r.reachable() ? String.join(" → ", r.hops()) : "unreachable"),
                number("bottleneck bit", RouteReport::bottleneckCapacityBits),
                text("bottleneck hop", r -> r.bottleneckFrom() == null ? "" : r.bottleneckFrom() + " → " + r.bottleneckTo()),
                number("end-to-end bit", RouteReport::endToEndCapacityBits),
                number("rate bit/s", RouteReport::rateBitsPerS),
                number("shared bit/s", r -> {
                    var sh = vm.sharedRate(r);
                    return sh == null ? Double.NaN : sh.rateBitsPerS();
                }),
                number("latency s", RouteReport::latencyS),
                number("direct bit", r -> r.directCapacityBits() == null ? Double.NaN : r.directCapacityBits())));
        routeTable.setItems(vm.routes());
        routeTable.setPlaceholder(new Label("no demands"));
        routeTable.getSelectionModel().selectedItemProperty().addListener((o, a, b) -> {
            if (b != null) {
                vm.selectedRouteProperty().set(b);
            }
        });

        budgetTable.getColumns().addAll(List.of(
                text("node", BudgetReport::node),
                number("needed molecules/symbol", b -> (double) b.moleculesPerSymbolNeeded()),
                number("molecules/s", BudgetReport::moleculesPerS),
                number("per mission", BudgetReport::moleculesPerMission),
                text("feasible", b -> b.feasible() ? "yes" : "no"),
                text("reason", BudgetReport::reason)));
        budgetTable.setItems(vm.budgets());
        budgetTable.setPlaceholder(new Label("no budgets"));
    }

    private int indexOf(LinkReport l) {
        for (int i = 0; i < linkTable.getItems().size(); i++) {
            LinkReport x = linkTable.getItems().get(i);
            if (x.from().equals(l.from()) && x.to().equals(l.to())) {
                return i;
            }
        }
        return -1;
    }

    private Region routesPane() {
        TextArea advice = new TextArea();
        advice.setEditable(false);
        advice.setWrapText(true);
        advice.setPrefRowCount(4);
        advice.textProperty().bind(Bindings.createStringBinding(() -> {
            RouteReport r = vm.selectedRouteProperty().get();
            if (r == null) {
                return "Select a route to see its per-hop capacity and what limits it.";
            }
            if (!r.reachable()) {
                return r.from() + " → " + r.to() + ": no route. " + (r.advice() == null ? "" : r.advice());
            }
            StringBuilder sb = new StringBuilder();
            sb.append(r.from()).append(" → ").append(r.to()).append(": ");
            for (int i = 0; i + 1 < r.hops().size(); i++) {
                LinkReport l = vm.findLink(r.hops().get(i), r.hops().get(i + 1));
                sb.append(i == 0 ? "" : ", ").append(r.hops().get(i)).append("→").append(r.hops().get(i + 1))
                        .append(" ").append(l == null ? "?" : Formats.sig(l.capacityBits())).append(" bit");
            }
            sb.append("\nBottleneck ").append(r.bottleneckFrom()).append(" → ").append(r.bottleneckTo())
                    .append(r.bottleneckLimitedBy() == null ? "" : " (limited by " + r.bottleneckLimitedBy().id() + ")")
                    .append(". ").append(r.advice() == null ? "" : r.advice());
            var sh = vm.sharedRate(r);
            if (sh != null && sh.limitedAt() != null && sh.sharedWith() > 1) {
                sb.append("\nShared: ").append(Formats.sig(sh.rateBitsPerS())).append(" bit/s, because ")
                        .append(sh.limitedAt()).append("'s slots carry ").append(sh.sharedWith())
                        .append(" demands (max-min fair time-sharing).");
            }
            return sb.toString();
        }, vm.selectedRouteProperty(), vm.links()));
        VBox.setVgrow(routeTable, Priority.ALWAYS);
        return new VBox(6, routeTable, advice);
    }

    private Region comparePane() {
        TableView<DemandComparison> t = new TableView<>(vm.comparison());
        t.getColumns().addAll(List.of(
                text("from", DemandComparison::from),
                text("to", DemandComparison::to),
                number("kept bit", DemandComparison::baselineCapacity),
                number("now bit", DemandComparison::capacity),
                number("kept bit/s", DemandComparison::baselineRate),
                number("now bit/s", DemandComparison::rate),
                number("kept mol/bit", DemandComparison::baselineMolPerBit),
                number("now mol/bit", DemandComparison::molPerBit)));
        t.setPlaceholder(new Label("Press \"Keep for compare\", edit the layout, and compare here."));
        return t;
    }

    /**
     * Medium (with bulk flow), signalling (with the slot schedule) and species settings of the whole
     * layout; species can be added, renamed and removed. Apply makes it one undoable edit.
     */
    private Region settingsPane() {
        ScenarioSettings st = vm.settings();
        GridPane medium = grid();
        int row = 0;
        medium.addRow(row++, new Label("temperature K"), field(st.temperatureKProperty()));
        medium.addRow(row++, new Label("viscosity mPa·s"), field(st.viscosityMPaSProperty()));
        medium.addRow(row++, new Label("background molecules/s"), field(st.backgroundMoleculesPerSProperty()));
        ChoiceBox<String> flow = new ChoiceBox<>();
        flow.getItems().addAll(ScenarioSettings.FLOW_PROFILES);
        flow.valueProperty().bindBidirectional(st.flowProfileProperty());
        flow.setId("flow-profile");
        flow.setTooltip(new Tooltip("Bulk flow of the medium: none (still fluid), uniform (the same drift "
                + "everywhere) or poiseuille (laminar flow along +x, cylinder volumes only)"));
        medium.addRow(row++, new Label("flow"), flow);
        HBox velocity = new HBox(4);
        for (var p : List.of(st.flowVxUmPerSProperty(), st.flowVyUmPerSProperty(), st.flowVzUmPerSProperty())) {
            TextField c = smallField(p, "0");
            c.setPrefColumnCount(3);
            velocity.getChildren().add(c);
        }
        Label velocityLabel = new Label("velocity µm/s (x, y, z)");
        showWhen(st, ScenarioSettings.FLOW_PROFILES.get(1), velocityLabel, velocity);
        // the uniform and the poiseuille fields share one row: only one of them is shown
        medium.addRow(row, velocityLabel, velocity);
        TextField meanSpeed = field(st.flowMeanSpeedUmPerSProperty());
        meanSpeed.setTooltip(new Tooltip("Mean speed over the cross-section; the speed on the axis is twice this "
                + "and zero at the wall (Hagen–Poiseuille)"));
        Label meanSpeedLabel = new Label("mean speed µm/s");
        showWhen(st, ScenarioSettings.FLOW_PROFILES.get(2), meanSpeedLabel, meanSpeed);
        medium.addRow(row++, meanSpeedLabel, meanSpeed);

        GridPane signalling = grid();
        // the medium and signalling fields line up in one column
        for (GridPane g : List.of(medium, signalling)) {
            javafx.scene.layout.ColumnConstraints labels = new javafx.scene.layout.ColumnConstraints();
            labels.setMinWidth(150);
            g.getColumnConstraints().add(labels);
        }
        row = 0;
        signalling.addRow(row++, new Label("symbol time s"), field(st.symbolTimeSProperty()));
        signalling.addRow(row++, new Label("ISI memory symbols"), field(st.isiMemorySymbolsProperty()));
        signalling.addRow(row++, new Label("levels"), field(st.levelsProperty()));
        signalling.addRow(row++, new Label("prior one"), field(st.priorOneProperty()));
        ChoiceBox<CountModelKind> count = new ChoiceBox<>();
        count.getItems().addAll(CountModelKind.values());
        count.setConverter(new javafx.util.StringConverter<>() {
            @Override
            public String toString(CountModelKind k) {
                return k == null ? "" : k.id();
            }

            @Override
            public CountModelKind fromString(String text) {
                return CountModelKind.parse(text);
            }
        });
        count.valueProperty().bindBidirectional(st.countModelProperty());
        signalling.addRow(row++, new Label("count model"), count);
        ChoiceBox<Schedule> schedule = new ChoiceBox<>();
        schedule.getItems().addAll(Schedule.values());
        schedule.setConverter(new javafx.util.StringConverter<>() {
            @Override
            public String toString(Schedule k) {
                return k == null ? "" : k.id();
            }

            @Override
            public Schedule fromString(String text) {
                return Schedule.parse(text);
            }
        });
        schedule.valueProperty().bindBidirectional(st.scheduleProperty());
        schedule.setId("schedule");
        Tooltip scheduleTip = new Tooltip(ScenarioSettings.SCHEDULE_HELP);
        scheduleTip.setWrapText(true);
        scheduleTip.setMaxWidth(360);
        schedule.setTooltip(scheduleTip);
        Label scheduleLabel = new Label("schedule");
        scheduleLabel.setTooltip(scheduleTip);
        signalling.addRow(row++, scheduleLabel, schedule);

        GridPane species = grid();
        species.setId("species-grid");
        Runnable fillSpecies = () -> {
            species.getChildren().clear();
            species.addRow(0, new Label("name"), new Label("D µm²/s"), new Label("radius nm"),
                    new Label("half-life s"), new Label("used by"));
            int r = 1;
            for (ScenarioSettings.SpeciesRow sp : st.species()) {
                TextField name = smallField(sp.nameProperty(), "name");
                name.setTooltip(new Tooltip("Renaming renames the species in every node on Apply"));
                name.setId("species-name-" + (r - 1));
                TextField d = smallField(sp.diffusionUm2PerSProperty(), "D");
                d.setPrefColumnCount(6);
                d.setTooltip(new Tooltip("Diffusion coefficient; give this or the hydrodynamic radius"));
                d.setId("species-d-" + (r - 1));
                TextField radius = smallField(sp.hydrodynamicRadiusNmProperty(), "—");
                radius.setTooltip(new Tooltip("Hydrodynamic radius: D then follows from Stokes–Einstein, "
                        + "D = kT/(6πηr), at the medium's temperature and viscosity"));
                TextField half = smallField(sp.halfLifeSProperty(), "stable");
                Label used = new Label();
                used.textProperty().bind(sp.usageProperty());
                used.getStyleClass().add("hint");
                if (!sp.usedBy().isEmpty()) {
                    used.setTooltip(new Tooltip(String.join(", ", sp.usedBy())));
                }
                Button remove = button("−", "Remove this species on Apply (refused while nodes use it)",
                        () -> vm.removeSpecies(sp));
                remove.setId("remove-species-" + (r - 1));
                species.addRow(r++, name, d, radius, half, used, remove);
            }
        };
        fillSpecies.run();
        st.species().addListener((ListChangeListener<ScenarioSettings.SpeciesRow>) c -> fillSpecies.run());
        Button addSpecies = button("+ Species", "Add a species row: give a name and a diffusion coefficient or "
                + "a hydrodynamic radius, then Apply", st::addSpecies);
        addSpecies.setId("add-species");
        addSpecies.disableProperty().bind(vm.scenarioProperty().isNull());

        Button apply = button("Apply", "Apply these settings to the layout (undoable); the plan is recomputed",
                vm::applySettings);
        apply.disableProperty().bind(vm.scenarioProperty().isNull());
        apply.setId("apply-settings");
        Button revert = button("Revert", "Show the layout's current settings again",
                () -> st.load(vm.scenarioProperty().get(), vm.unusedSpecies()));
        revert.disableProperty().bind(vm.scenarioProperty().isNull());
        Label hint = new Label("Give each species a diffusion coefficient or a hydrodynamic radius; half-life "
                + "blank = stable. A species no node uses yet is kept here and offered in the inspector, but is "
                + "not saved until a node uses it.");
        hint.getStyleClass().add("hint");
        hint.setWrapText(true);
        VBox box = new VBox(8, section("Medium"), medium, new Separator(), section("Signalling"), signalling,
                new Separator(), section("Species"), species, addSpecies, hint, new Separator(),
                new HBox(6, apply, revert));
        box.setPadding(new Insets(10));
        box.getStyleClass().add("inspector");
        javafx.scene.control.ScrollPane scroll = new javafx.scene.control.ScrollPane(box);
        scroll.setFitToWidth(true);
        scroll.getStyleClass().add("inspector");
        return scroll;
    }

    /** Shows (and lays out) the nodes only while the flow profile is {@code profile}. */
    private static void showWhen(ScenarioSettings st, String profile, javafx.scene.Node... nodes) {
        for (javafx.scene.Node n : nodes) {
            n.visibleProperty().bind(st.flowProfileProperty().isEqualTo(profile));
            n.managedProperty().bind(n.visibleProperty());
        }
    }

    private static TextField smallField(javafx.beans.property.StringProperty p, String prompt) {
        TextField f = field(p);
        f.setPrefColumnCount(4);
        f.setPromptText(prompt);
        return f;
    }

    private static GridPane grid() {
        GridPane g = new GridPane();
        g.setHgap(6);
        g.setVgap(5);
        return g;
    }

    private static Label section(String text) {
        Label l = new Label(text);
        l.getStyleClass().add("section");
        return l;
    }

    private Region warningsPane() {
        ListView<String> list = new ListView<>(vm.warnings());
        list.setPlaceholder(new Label("no warnings"));
        return list;
    }

    private Region statusBar() {
        Label msg = new Label();
        msg.textProperty().bind(vm.messageProperty());
        msg.setId("status");
        Label caution = new Label("Model estimates — not validated for clinical use");
        caution.getStyleClass().add("caution");
        caution.setTooltip(new Tooltip(String.join("\n", Cautions.FULL)));
        Region grow = new Region();
        HBox.setHgrow(grow, Priority.ALWAYS);
        Label counts = new Label();
        counts.textProperty().bind(Bindings.createStringBinding(() -> {
            var s = vm.scenarioProperty().get();
            return s == null ? "" : s.nodes().size() + " nodes · " + vm.links().size() + " links · "
                    + vm.routes().size() + " routes";
        }, vm.scenarioProperty(), vm.links(), vm.routes()));
        // a preview (normal approximation) is on screen until the exact plan replaces it
        Label preview = new Label("preview — exact plan running");
        preview.setId("preview-badge");
        preview.getStyleClass().add("preview-badge");
        preview.setTooltip(new Tooltip("Links and routes from the normal approximation of the counts; "
                + "budgets and advice are those of the last exact plan until it arrives"));
        preview.visibleProperty().bind(vm.previewShownProperty());
        preview.managedProperty().bind(vm.previewShownProperty());
        javafx.css.PseudoClass previewing = javafx.css.PseudoClass.getPseudoClass("preview");
        vm.previewShownProperty().addListener((o, a, b) -> {
            linkTable.pseudoClassStateChanged(previewing, b);
            routeTable.pseudoClassStateChanged(previewing, b);
            budgetTable.pseudoClassStateChanged(previewing, b);
        });
        HBox bar = new HBox(12, msg, preview, grow, counts, caution);
        bar.getStyleClass().add("status-bar");
        bar.setPadding(new Insets(4, 10, 4, 10));
        return bar;
    }

    // ------------------------------------------------------------------ helpers

    private static Tab tab(String name, javafx.scene.Node content) {
        return new Tab(name, content);
    }

    private static Button button(String text, String tip, Runnable action) {
        Button b = new Button(text);
        b.setTooltip(new Tooltip(tip));
        b.setOnAction(e -> action.run());
        return b;
    }

    private static TextField field(javafx.beans.property.StringProperty p) {
        TextField f = new TextField();
        f.textProperty().bindBidirectional(p);
        f.setPrefColumnCount(8);
        return f;
    }

    static <T> TableColumn<T, String> text(String name, Function<T, String> f) {
        TableColumn<T, String> c = new TableColumn<>(name);
        c.setCellValueFactory(cd -> new ReadOnlyStringWrapper(f.apply(cd.getValue())));
        return c;
    }

    static <T> TableColumn<T, Double> number(String name, Function<T, Double> f) {
        return numberText(name, f, t -> Formats.sig(f.apply(t)));
    }

    static <T> TableColumn<T, Double> numberText(String name, Function<T, Double> value, Function<T, String> shown) {
        TableColumn<T, Double> c = new TableColumn<>(name);
        c.setCellValueFactory(cd -> (ObservableValue<Double>) new ReadOnlyObjectWrapper<>(value.apply(cd.getValue())));
        c.setCellFactory(col -> new javafx.scene.control.TableCell<>() {
            @Override
            protected void updateItem(Double item, boolean empty) {
                super.updateItem(item, empty);
                if (empty || getTableRow() == null || getTableRow().getItem() == null) {
                    setText(null);
                } else {
                    setText(shown.apply(getTableRow().getItem()));
                }
            }
        });
        c.setComparator((a, b) -> Double.compare(a == null ? Double.NaN : a, b == null ? Double.NaN : b));
        c.getStyleClass().add("number");
        return c;
    }
}
