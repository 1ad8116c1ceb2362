package dev.nanoplan.desktop;

import static dev.nanoplan.desktop.Widgets.button;

import dev.nanoplan.design.DesignMove;
import java.util.List;
import javafx.geometry.Pos;
import javafx.scene.control.Button;
import javafx.scene.control.CheckBox;
import javafx.scene.control.Label;
import javafx.scene.control.ProgressBar;
import javafx.scene.control.ScrollPane;
import javafx.scene.control.TableColumn;
import javafx.scene.control.TableView;
import javafx.scene.control.TextField;
import javafx.scene.control.Tooltip;
import javafx.scene.control.cell.CheckBoxTableCell;
import javafx.scene.layout.FlowPane;
import javafx.scene.layout.HBox;
import javafx.scene.layout.Priority;
import javafx.scene.layout.Region;
import javafx.scene.layout.VBox;

/**
 * The "Improve" tab (View of MVVM), opened by the tool bar's "Improve…": the parts the search may
 * change as tick boxes, a time limit, Run / Cancel with progress, then the proposal as a change table
 * with a tick per change, the demands before and after, and Apply / Discard. The 3D view shows the
 * ticked moves as ghosts ({@link SceneOverlays}). Only binds to {@link ImproveViewModel}.
 *
 * <p>Node ids for tests: {@code imp-run}, {@code imp-cancel}, {@code imp-progress}, {@code imp-status},
 * {@code imp-time}, {@code imp-allow-<move id>}, {@code imp-changes}, {@code imp-demands},
 * {@code imp-apply}, {@code imp-discard}.
 */
public final class ImproveView {

    static final String CAUTION = "A model-based proposal (analytic channel, open medium): check walls and flow "
            + "with a simulation before building it. Model estimates only — not validated for clinical use.";

    private final ImproveViewModel vm;
    private final TableView<ImproveViewModel.ChangeRow> changes = new TableView<>();
    private final TableView<ImproveViewModel.DemandRow> demands = new TableView<>();
    private final ScrollPane root;

    public ImproveView(ImproveViewModel vm) {
        this.vm = vm;
        FlowPane allow = new FlowPane(12, 6);
        for (DesignMove m : DesignMove.values()) {
            CheckBox c = new CheckBox(m.id());
            c.setId("imp-allow-" + m.id());
            c.selectedProperty().bindBidirectional(vm.allowedProperty(m));
            c.setTooltip(new Tooltip(tip(m)));
            allow.getChildren().add(c);
        }
        TextField time = new TextField();
        time.setId("imp-time");
        time.setPrefColumnCount(5);
        time.textProperty().bindBidirectional(vm.timeLimitSProperty());
        time.setTooltip(new Tooltip("Wall-clock limit: the best layout found by then is proposed"));
        Label timeLabel = new Label(ImproveViewModel.TIME_LIMIT);
        HBox limit = new HBox(6, timeLabel, time);
        limit.setAlignment(Pos.CENTER_LEFT);

        Button run = button("Run", "Search for a better layout in the background", vm::run);
        run.setId("imp-run");
        run.disableProperty().bind(vm.runningProperty());
        Button cancel = button("Cancel", "Stop and propose the best layout found so far", vm::cancel);
        cancel.setId("imp-cancel");
        cancel.disableProperty().bind(vm.runningProperty().not());
        ProgressBar bar = new ProgressBar();
        bar.setId("imp-progress");
        bar.progressProperty().bind(vm.progressProperty());
        bar.setMaxWidth(Double.MAX_VALUE);
        HBox.setHgrow(bar, Priority.ALWAYS);
        HBox controls = new HBox(8, run, cancel, bar);
        controls.setAlignment(Pos.CENTER_LEFT);
        Label progress = new Label();
        progress.textProperty().bind(vm.progressTextProperty());
        progress.getStyleClass().add("hint");
        progress.managedProperty().bind(vm.progressTextProperty().isNotEmpty());
        progress.setWrapText(true);
        Label status = new Label();
        status.setId("imp-status");
        status.textProperty().bind(vm.statusProperty());
        status.setWrapText(true);

        buildChangeTable();
        buildDemandTable();
        Button apply = button("Apply ticked", "Make the ticked changes as one edit (Undo takes them back)", vm::apply);
        apply.setId("imp-apply");
        apply.disableProperty().bind(vm.hasProposalProperty().not());
        Button discard = button("Discard", "Drop the proposal and its ghosts", vm::discard);
        discard.setId("imp-discard");
        discard.disableProperty().bind(vm.hasProposalProperty().not());
        Label ghostHint = new Label("3D view: wire ghosts where the ticked changes would put nodes, arrows from where they are now.");
        ghostHint.getStyleClass().add("hint");
        ghostHint.setWrapText(true);
        Label caution = new Label(CAUTION);
        caution.getStyleClass().add("caution");
        caution.setWrapText(true);

        VBox box = new VBox(8, Widgets.section("Improve the layout"),
                new Label("The search may change:"), allow, limit, controls, progress, status,
                Widgets.section("Proposed changes"), changes, new HBox(8, apply, discard), ghostHint,
                Widgets.section("Demands before → after"), demands, caution);
        root = Widgets.scrollingPanel(box, this);
    }

    /** The tab's content. */
    public Region node() {
        return root;
    }

    ImproveViewModel viewModel() {
        return vm;
    }

    private static String tip(DesignMove m) {
        return switch (m) {
            case SPECIES -> "The species of each receiver and the emitters routed into it";
            case SLOTS -> "The slot plan (searched once the slots schedule is supported by the search)";
            case BUDGETS -> "Molecules per symbol of each emitting node";
            case MOVE_RELAYS -> "Relay positions (inside the volume, no overlaps; fixed nodes stay)";
            case ADD_RELAYS -> "New relays relay-new-1, … for demands that miss their targets";
        };
    }

    private void buildChangeTable() {
        TableColumn<ImproveViewModel.ChangeRow, Boolean> tick = new TableColumn<>("apply");
        tick.setCellValueFactory(cd -> cd.getValue().tickedProperty());
        tick.setCellFactory(CheckBoxTableCell.forTableColumn(tick));
        tick.setEditable(true);
        tick.setPrefWidth(50);
        TableColumn<ImproveViewModel.ChangeRow, String> node = Widgets.text("node", r -> r.change().node());
        TableColumn<ImproveViewModel.ChangeRow, String> what = Widgets.text("change", r -> r.change().reason());
        changes.getColumns().addAll(List.of(tick, node, what));
        changes.setEditable(true);
        changes.setItems(vm.changes());
        changes.setId("imp-changes");
        changes.setPrefHeight(200);
        changes.setPlaceholder(new Label("Press Run: the proposed changes are listed here, each with a tick."));
        Widgets.fitColumns(changes);
        tick.setPrefWidth(50);
    }

    private void buildDemandTable() {
        demands.getColumns().addAll(List.of(
                Widgets.text("demand", r -> r.from() + " → " + r.to()),
                Widgets.text("meets targets", r -> meets(r.meetsBefore()) + " → " + meets(r.meetsAfter())),
                Widgets.numberText("rate before bit/s", ImproveViewModel.DemandRow::rateBeforeBitsPerS,
                        r -> Formats.sig(r.rateBeforeBitsPerS())),
                Widgets.numberText("rate after bit/s", ImproveViewModel.DemandRow::rateAfterBitsPerS,
                        r -> Formats.sig(r.rateAfterBitsPerS()))));
        demands.setItems(vm.demands());
        demands.setId("imp-demands");
        demands.setPrefHeight(160);
        demands.setPlaceholder(new Label("no proposal"));
        Widgets.fitColumns(demands);
    }

    private static String meets(boolean yes) {
        return yes ? "yes" : "no";
    }
}
