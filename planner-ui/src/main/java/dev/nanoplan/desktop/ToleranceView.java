package dev.nanoplan.desktop;

import static dev.nanoplan.desktop.Widgets.button;

import dev.nanoplan.tolerance.Sampler;
import dev.nanoplan.tolerance.Thresholds;
import java.util.List;
import java.util.function.Function;
import javafx.beans.binding.Bindings;
import javafx.collections.ListChangeListener;
import javafx.geometry.Pos;
import javafx.scene.chart.BarChart;
import javafx.scene.chart.CategoryAxis;
import javafx.scene.chart.NumberAxis;
import javafx.scene.chart.XYChart;
import javafx.scene.control.Button;
import javafx.scene.control.ComboBox;
import javafx.scene.control.Label;
import javafx.scene.control.ProgressBar;
import javafx.scene.control.ScrollPane;
import javafx.scene.control.TableCell;
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
import javafx.util.StringConverter;

/**
 * The "Tolerance" tab (View of MVVM): study settings and the tolerance fields, Run / Cancel with a
 * progress bar and the time left, tables of yields per link and per demand, and the selected link's
 * capacity histogram. Only binds to {@link ToleranceViewModel} and forwards clicks.
 *
 * <p>Node ids for tests: {@code tol-run}, {@code tol-cancel}, {@code tol-progress}, {@code tol-status},
 * {@code tol-none}, {@code tol-demo}, {@code tol-store}, {@code tol-samples}, {@code tol-links},
 * {@code tol-demands}, {@code tol-histogram}, {@code tol-stale}.
 */
public final class ToleranceView {

    static final String CAUTION = "Tolerances are your assumptions; yields are model estimates (analytic channel, "
            + "open medium). Model estimates only — not validated for clinical use.";

    private final ToleranceViewModel vm;
    private final TableView<ToleranceRow> links = new TableView<>();
    private final TableView<ToleranceRow> demands = new TableView<>();
    private final BarChart<String, Number> histogram = new BarChart<>(new CategoryAxis(), new NumberAxis());
    private final ScrollPane root;

    public ToleranceView(ToleranceViewModel vm) {
        this.vm = vm;
        GridPane study = Widgets.grid();
        TextField samples = field(vm.samplesProperty().get(), 7, "tol-samples");
        samples.textProperty().bindBidirectional(vm.samplesProperty());
        TextField seed = field(null, 5, "tol-seed");
        seed.textProperty().bindBidirectional(vm.seedProperty());
        ComboBox<Sampler> sampler = combo(Sampler.values(), Sampler::id);
        sampler.valueProperty().bindBidirectional(vm.samplerProperty());
        sampler.setTooltip(new Tooltip("sobol: low-discrepancy points (smaller error at equal samples); random: plain seeded draws"));
        ComboBox<Thresholds> thresholds = combo(Thresholds.values(), Thresholds::id);
        thresholds.valueProperty().bindBidirectional(vm.thresholdsProperty());
        thresholds.setTooltip(new Tooltip("design: receivers keep the nominal plan's thresholds (set at fabrication); "
                + "recalibrated: each sample re-chooses them"));
        study.addRow(0, label("samples"), samples, label("seed"), seed);
        study.addRow(1, label("sampler"), sampler, label("thresholds"), thresholds);

        Label none = new Label("This layout has no \"tolerances\" section: every sample would be the nominal layout. "
                + "Enter spreads below, or use the demo defaults (invented values).");
        none.setId("tol-none");
        none.getStyleClass().add("caution");
        none.setWrapText(true);
        none.visibleProperty().bind(vm.noTolerancesProperty());
        none.managedProperty().bind(vm.noTolerancesProperty());
        GridPane spreads = Widgets.grid();
        List<String> names = ToleranceViewModel.toleranceFieldNames();
        for (int i = 0; i < names.size(); i++) {
            TextField f = field(null, 5, "tol-" + names.get(i));
            f.textProperty().bindBidirectional(vm.toleranceFields().get(i));
            spreads.add(label(names.get(i)), (i % 3) * 2, i / 3);
            spreads.add(f, (i % 3) * 2 + 1, i / 3);
        }
        Button demo = button("Demo defaults", "Fill the fields with invented demo spreads (those of the bundled "
                + "culture tank)", vm::useDemoDefaults);
        demo.setId("tol-demo");
        Button store = button("Store in layout", "Write these spreads into the layout's \"tolerances\" section "
                + "(one undoable edit; per-node overrides are kept)", vm::storeInLayout);
        store.setId("tol-store");
        HBox spreadButtons = new HBox(8, demo, store);

        Button run = button("Run", "Draw perturbed layouts and plan each, in the background", vm::run);
        run.setId("tol-run");
        run.disableProperty().bind(vm.runningProperty());
        Button cancel = button("Cancel", "Stop; the samples that finished are shown, marked partial", vm::cancel);
        cancel.setId("tol-cancel");
        cancel.disableProperty().bind(vm.runningProperty().not());
        ProgressBar bar = new ProgressBar();
        bar.setId("tol-progress");
        bar.progressProperty().bind(vm.progressProperty());
        bar.setMaxWidth(Double.MAX_VALUE);
        HBox.setHgrow(bar, Priority.ALWAYS);
        Label percent = new Label();
        percent.textProperty().bind(Bindings.createStringBinding(() -> Formats.percent(vm.progressProperty().get()),
                vm.progressProperty()));
        percent.setMinWidth(Region.USE_PREF_SIZE);
        HBox controls = new HBox(8, run, cancel, bar, percent);
        controls.setAlignment(Pos.CENTER_LEFT);
        Label eta = new Label();
        eta.textProperty().bind(vm.etaProperty());
        eta.getStyleClass().add("hint");
        eta.managedProperty().bind(vm.etaProperty().isNotEmpty());
        Label status = new Label();
        status.setId("tol-status");
        status.textProperty().bind(vm.statusProperty());
        status.setWrapText(true);
        Label stale = new Label("Stale: the layout changed after this study — outlines cleared; run again to update.");
        stale.setId("tol-stale");
        stale.getStyleClass().add("sim-stale");
        stale.setWrapText(true);
        stale.visibleProperty().bind(vm.staleProperty());
        stale.managedProperty().bind(vm.staleProperty());

        buildLinkTable();
        buildDemandTable();
        buildHistogram();
        Label caution = new Label(CAUTION);
        caution.getStyleClass().add("caution");
        caution.setWrapText(true);

        VBox box = new VBox(8, Widgets.section("Yield under fabrication tolerances"), study, none,
                Widgets.section("Spreads (standard deviations, as in the file)"), spreads, spreadButtons, controls, eta,
                status, stale, Widgets.section("Links (⚠ weak: below 95 % yield; outlined in 3D)"), links,
                Widgets.section("Demands"), demands, histogram, caution);
        root = Widgets.scrollingPanel(box, this);
    }

    /** The tab's content. */
    public Region node() {
        return root;
    }

    ToleranceViewModel viewModel() {
        return vm;
    }

    TableView<ToleranceRow> linkTable() {
        return links;
    }

    BarChart<String, Number> histogram() {
        return histogram;
    }

    private void buildLinkTable() {
        links.getColumns().addAll(List.of(
                Widgets.text("weak", r -> r.weak() ? "⚠ " + r.weakRank() : ""),
                Widgets.text("link", ToleranceRow::name),
                Widgets.numberText("yield", ToleranceRow::yield, ToleranceRow::yieldText),
                Widgets.text("95 % interval", ToleranceRow::intervalText),
                Widgets.cell("C P5 bit", r -> r.link().capacityP5Bits(), r -> r.capacity(r.link().capacityP5Bits())),
                Widgets.cell("C P50 bit", r -> r.link().capacityP50Bits(), r -> r.capacity(r.link().capacityP50Bits())),
                Widgets.cell("C P95 bit", r -> r.link().capacityP95Bits(), r -> r.capacity(r.link().capacityP95Bits())),
                textCell("guard band molecules/symbol", r -> r.guardBand(vm.partial())),
                textCell("drivers (share of variance)", r -> r.drivers(vm.driversMethod()))));
        links.setItems(vm.links());
        links.setId("tol-links");
        links.setPrefHeight(200);
        links.setPlaceholder(new Label("Press Run to estimate the yield of every link and demand."));
        links.setRowFactory(t -> new TableRow<>() {
            @Override
            protected void updateItem(ToleranceRow item, boolean empty) {
                super.updateItem(item, empty);
                getStyleClass().remove("tol-weak");
                if (!empty && item != null && item.weak()) {
                    getStyleClass().add("tol-weak");
                }
            }
        });
        Widgets.fitColumns(links);
        links.getSelectionModel().selectedItemProperty().addListener((o, a, b) -> {
            if (b != null) {
                vm.selectedLinkProperty().set(b);
            }
        });
        vm.selectedLinkProperty().addListener((o, a, b) -> {
            if (b != null && links.getSelectionModel().getSelectedItem() != b) {
                links.getSelectionModel().select(b);
            }
        });
    }

    private void buildDemandTable() {
        demands.getColumns().addAll(List.of(
                Widgets.text("demand", ToleranceRow::name),
                Widgets.numberText("yield", ToleranceRow::yield, ToleranceRow::yieldText),
                Widgets.text("95 % interval", ToleranceRow::intervalText)));
        demands.setItems(vm.demands());
        demands.setId("tol-demands");
        demands.setPrefHeight(120);
        demands.setPlaceholder(new Label("no demands yet"));
        Widgets.fitColumns(demands);
    }

    private void buildHistogram() {
        histogram.setId("tol-histogram");
        histogram.setAnimated(false);
        histogram.setLegendVisible(false);
        histogram.setBarGap(0);
        histogram.setCategoryGap(1);
        histogram.setPrefHeight(240);
        histogram.setMinHeight(200);
        histogram.getXAxis().setLabel("capacity, bits per symbol (bin centre)");
        histogram.getYAxis().setLabel("samples");
        histogram.titleProperty().bind(vm.histogramTitleProperty());
        Runnable fill = () -> {
            XYChart.Series<String, Number> s = new XYChart.Series<>();
            for (ToleranceViewModel.Bin b : vm.histogram()) {
                s.getData().add(new XYChart.Data<>(Formats.twoDigits((b.lowBits() + b.highBits()) / 2), b.count()));
            }
            histogram.getData().setAll(List.of(s));
        };
        vm.histogram().addListener((ListChangeListener<ToleranceViewModel.Bin>) c -> fill.run());
        fill.run();
    }

    private static TableColumn<ToleranceRow, String> textCell(String name,
            Function<ToleranceRow, TableText.Cell> cell) {
        TableColumn<ToleranceRow, String> c = Widgets.text(name, r -> cell.apply(r).text());
        c.setCellFactory(col -> new TableCell<>() {
            @Override
            protected void updateItem(String item, boolean empty) {
                super.updateItem(item, empty);
                ToleranceRow row = empty || getTableRow() == null ? null : getTableRow().getItem();
                TableText.Cell shown = row == null ? null : cell.apply(row);
                setText(shown == null ? null : shown.text());
                setTooltip(shown == null || shown.tooltip() == null ? null : new Tooltip(shown.tooltip()));
            }
        });
        return c;
    }

    private static <T> ComboBox<T> combo(T[] values, Function<T, String> name) {
        ComboBox<T> c = new ComboBox<>();
        c.getItems().setAll(values);
        c.setConverter(new StringConverter<>() {
            @Override
            public String toString(T t) {
                return t == null ? "" : name.apply(t);
            }

            @Override
            public T fromString(String s) {
                return null;
            }
        });
        return c;
    }

    private static TextField field(String text, int columns, String id) {
        TextField f = new TextField(text);
        f.setPrefColumnCount(columns);
        f.setMinWidth(Region.USE_PREF_SIZE);
        f.setId(id);
        return f;
    }

    private static Label label(String text) {
        Label l = new Label(text);
        l.setMinWidth(Region.USE_PREF_SIZE);
        return l;
    }
}
