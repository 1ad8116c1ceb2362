package dev.nanoplan.desktop;

import java.util.List;
import javafx.beans.binding.Bindings;
import javafx.beans.property.StringProperty;
import javafx.geometry.Insets;
import javafx.geometry.Pos;
import javafx.scene.control.Button;
import javafx.scene.control.CheckBox;
import javafx.scene.control.Label;
import javafx.scene.control.ProgressBar;
import javafx.scene.control.TableColumn;
import javafx.scene.control.TableRow;
import javafx.scene.control.TableView;
import javafx.scene.control.TextField;
import javafx.scene.control.Tooltip;
import javafx.scene.layout.GridPane;
import javafx.scene.layout.HBox;
import javafx.scene.layout.Priority;
import javafx.scene.layout.Region;
import javafx.scene.layout.VBox;

/**
 * The "Simulation" tab (View of MVVM): settings fields, Run / Cancel, a progress bar, the work
 * estimate, a status line, a stale mark and a sortable table of {@link SimulationRow}s, flagged
 * rows marked and their reason in a column and a tooltip. Only binds to
 * {@link SimulationViewModel} and forwards clicks.
 *
 * <p>Node ids for tests: {@code sim-run}, {@code sim-cancel}, {@code sim-progress},
 * {@code sim-status}, {@code sim-stale}, {@code sim-table}, {@code sim-molecules}, {@code sim-seed},
 * {@code sim-dt}, {@code sim-dt-hint}, {@code sim-resimulate}, {@code sim-selected}.
 */
public final class SimulationView {

    /** Shown under the table: the simulated numbers are estimates with sampling error. */
    static final String CAUTION = "Simulated values carry Monte-Carlo error (± is one binomial standard error; "
            + "z is the difference in standard errors). The closed form assumes an open medium: no walls, no flow, "
            + "no other absorbers. Model estimates — not validated for clinical use.";

    private final SimulationViewModel vm;
    private final TableView<SimulationRow> table = new TableView<>();
    private final VBox root;

    public SimulationView(SimulationViewModel vm) {
        this.vm = vm;
        TextField molecules = field(vm.moleculesPerEmitterProperty(), "sim-molecules", 9);
        TextField seed = field(vm.seedProperty(), "sim-seed", 6);
        TextField dt = field(vm.timeStepSProperty(), "sim-dt", 7);
        // the prompt shows while the field is empty; its colour is the theme's muted text (nanoplan.css)
        dt.setPromptText("auto");
        molecules.setTooltip(new Tooltip("Molecules each transmitter or relay releases at t = 0; the standard "
                + "error of a hit probability p is √(p(1 − p)/M)"));
        seed.setTooltip(new Tooltip("Master seed: the same seed, layout and settings give the same result"));
        dt.setTooltip(new Tooltip("Simulation time step in seconds; blank = chosen from the geometry"));
        GridPane fields = new GridPane();
        fields.setHgap(6);
        fields.setVgap(5);
        fields.addRow(0, label(SimulationViewModel.MOLECULES_FIELD), molecules);
        fields.addRow(1, label(SimulationViewModel.SEED_FIELD), seed);
        // the hint sits in its own column, after the field at its full width, so it never covers it
        Label auto = new Label("blank = automatic");
        auto.getStyleClass().add("hint");
        auto.setId("sim-dt-hint");
        auto.setMinWidth(Region.USE_PREF_SIZE);
        fields.addRow(2, label(SimulationViewModel.TIME_STEP_FIELD), dt, auto);
        CheckBox resimulate = new CheckBox("Re-simulate (ignore cache)");
        resimulate.setId("sim-resimulate");
        resimulate.selectedProperty().bindBidirectional(vm.ignoreCacheProperty());
        resimulate.setTooltip(new Tooltip("A layout simulated before with the same physics, molecules, seed and time "
                + "step is read from the cache" + (vm.cache() == null ? "" : " (" + vm.cache().directory() + ", shared "
                + "with nanoplan plan --channel simulated)") + ". Tick to simulate again and replace the cached result."));
        fields.add(resimulate, 1, 3, 2, 1);

        Button run = new Button("Run");
        run.setId("sim-run");
        run.setTooltip(new Tooltip("Simulate the current layout in the background"));
        run.setOnAction(e -> vm.run());
        run.disableProperty().bind(vm.runningProperty());
        Button cancel = new Button("Cancel");
        cancel.setId("sim-cancel");
        cancel.setTooltip(new Tooltip("Stop the simulation; nothing of it is shown"));
        cancel.setOnAction(e -> vm.cancel());
        cancel.disableProperty().bind(vm.runningProperty().not().or(vm.cancellingProperty()));
        ProgressBar bar = new ProgressBar();
        bar.setId("sim-progress");
        bar.progressProperty().bind(vm.progressProperty());
        bar.setMaxWidth(Double.MAX_VALUE);
        HBox.setHgrow(bar, Priority.ALWAYS);
        Label percent = new Label();
        percent.textProperty().bind(Bindings.createStringBinding(
                () -> Formats.percent(vm.progressProperty().get()), vm.progressProperty()));
        percent.setMinWidth(Region.USE_PREF_SIZE);
        HBox controls = new HBox(8, run, cancel, bar, percent);
        controls.setAlignment(Pos.CENTER_LEFT);

        Label estimate = new Label();
        estimate.textProperty().bind(vm.estimateProperty());
        estimate.getStyleClass().add("hint");
        estimate.setWrapText(true);
        Label status = new Label();
        status.setId("sim-status");
        status.textProperty().bind(vm.statusProperty());
        status.setWrapText(true);
        Label stale = new Label("Stale: the layout changed after this run — run again to update these rows.");
        stale.setId("sim-stale");
        stale.getStyleClass().add("sim-stale");
        stale.setWrapText(true);
        stale.visibleProperty().bind(vm.staleProperty());
        stale.managedProperty().bind(vm.staleProperty());

        buildTable();
        Label selected = new Label();
        selected.setId("sim-selected");
        selected.setWrapText(true);
        selected.textProperty().bind(Bindings.createStringBinding(() -> {
            SimulationRow r = table.getSelectionModel().getSelectedItem();
            return r == null ? "Select a row to read why it is or is not flagged (⚑ = clear and relevant difference)."
                    : r.from() + " → " + r.to() + (r.flagged() ? " ⚑ " : ": ") + r.reason();
        }, table.getSelectionModel().selectedItemProperty()));
        Label caution = new Label(CAUTION);
        caution.getStyleClass().add("caution");
        caution.setWrapText(true);

        Label head = new Label("Particle simulation versus the closed form");
        head.getStyleClass().add("section");
        VBox.setVgrow(table, Priority.ALWAYS);
        root = new VBox(8, head, fields, estimate, controls, status, stale, table, selected, caution);
        root.setPadding(new Insets(10));
        root.getStyleClass().add("inspector");
        root.setUserData(this);
    }

    /** The tab's content. */
    public Region node() {
        return root;
    }

    TableView<SimulationRow> table() {
        return table;
    }

    SimulationViewModel viewModel() {
        return vm;
    }

    private void buildTable() {
        TableColumn<SimulationRow, String> flag = Widgets.text("", r -> r.flagged() ? "⚑" : "");
        flag.setComparator((a, b) -> b.compareTo(a));
        flag.setPrefWidth(28);
        TableColumn<SimulationRow, String> reason = Widgets.text("reason", SimulationRow::reason);
        reason.setPrefWidth(340);
        table.getColumns().addAll(List.of(
                flag,
                width(Widgets.text("emitter", SimulationRow::from), 70),
                width(Widgets.text("receiver", SimulationRow::to), 70),
                width(Widgets.number("p0 analytic", SimulationRow::analyticHitProbability), 80),
                width(Widgets.number("p0 simulated", SimulationRow::simulatedHitProbability), 100),
                width(Widgets.number("± s.e.", SimulationRow::standardError), 70),
                width(Widgets.number("z", SimulationRow::zScore), 75),
                width(Widgets.numberText("Δ %", r -> r.relativeDifference() * 100,
                        r -> Double.isNaN(r.relativeDifference()) ? "—"
                                : Formats.signedOneDecimal(r.relativeDifference() * 100)), 75),
                width(Widgets.numberText("C analytic bit", SimulationRow::analyticCapacityBits,
                        r -> capacity(r.analyticCapacityBits())), 95),
                width(Widgets.numberText("C simulated bit", SimulationRow::simulatedCapacityBits,
                        r -> capacity(r.simulatedCapacityBits())), 105),
                reason));
        for (TableColumn<SimulationRow, ?> c : table.getColumns()) {
            c.setMinWidth(Region.USE_PREF_SIZE);
        }
        table.setItems(vm.rows());
        table.setId("sim-table");
        table.setPlaceholder(new Label("Press Run to simulate the layout and compare each link with the closed form."));
        table.setRowFactory(t -> new TableRow<>() {
            @Override
            protected void updateItem(SimulationRow item, boolean empty) {
                super.updateItem(item, empty);
                getStyleClass().remove("sim-flagged");
                if (empty || item == null) {
                    setTooltip(null);
                    return;
                }
                if (item.flagged()) {
                    getStyleClass().add("sim-flagged");
                }
                setTooltip(new Tooltip(item.from() + " → " + item.to() + ": " + (item.flagged() ? "flagged — " : "")
                        + item.reason()));
            }
        });
    }

    private static <T, V> TableColumn<T, V> width(TableColumn<T, V> c, double px) {
        c.setPrefWidth(px);
        return c;
    }

    private static Label label(String text) {
        Label l = new Label(text);
        l.setMinWidth(Region.USE_PREF_SIZE);
        return l;
    }

    /** A plan's capacity, or "below floor" when the plan left the link out. */
    private static String capacity(double bits) {
        return Double.isNaN(bits) ? "below floor" : Formats.sig(bits);
    }

    private static TextField field(StringProperty p, String id, int columns) {
        TextField f = new TextField();
        f.textProperty().bindBidirectional(p);
        f.setPrefColumnCount(columns);
        f.setMinWidth(Region.USE_PREF_SIZE);
        f.setId(id);
        return f;
    }
}
