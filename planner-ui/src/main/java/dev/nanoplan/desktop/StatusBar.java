package dev.nanoplan.desktop;

import dev.nanoplan.plan.PreviewPlanner;
import dev.nanoplan.report.Cautions;
import dev.nanoplan.report.Numbers;
import javafx.beans.binding.Bindings;
import javafx.geometry.Insets;
import javafx.scene.control.Label;
import javafx.scene.control.Tooltip;
import javafx.scene.layout.HBox;
import javafx.scene.layout.Priority;
import javafx.scene.layout.Region;

/**
 * The status bar (a View): the view model's message, the preview badge, the slot frame (under the
 * slots schedule), the layout's counts and
 * the standing caution with its full text as a tooltip.
 */
final class StatusBar {

    private StatusBar() {
    }

    static Region create(PlannerViewModel vm) {
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
            return s == null ? "" : s.nodes().size() + " nodes · " + vm.tables().links().size() + " links · "
                    + vm.tables().routes().size() + " routes";
        }, vm.scenarioProperty(), vm.tables().links(), vm.tables().routes()));
        // a preview (normal approximation) is on screen until the exact plan replaces it
        Label preview = new Label();
        // the band the preview states (PreviewPlanner.deviationBits), checked against the exact plan in the core's tests
        preview.textProperty().bind(Bindings.createStringBinding(() -> {
            var p = vm.tables().planProperty().get();
            double band = p == null ? 0 : PreviewPlanner.deviationBits(p);
            return band > 0 ? "preview (each link within ±" + Numbers.bits(band) + " bit) — exact plan running"
                    : "preview — exact plan running";
        }, vm.tables().planProperty()));
        preview.setId("preview-badge");
        preview.getStyleClass().add("preview-badge");
        preview.setTooltip(new Tooltip("Links and routes from the normal approximation of the counts; "
                + "budgets and advice are those of the last exact plan until it arrives"));
        preview.visibleProperty().bind(vm.tables().previewShownProperty());
        preview.managedProperty().bind(vm.tables().previewShownProperty());
        // the frame of the slots schedule ("frame 4 slots"); empty and hidden under the other schedules
        Label frame = new Label();
        frame.textProperty().bind(vm.slots().frameProperty());
        frame.setId("slot-frame");
        frame.visibleProperty().bind(frame.textProperty().isNotEmpty());
        frame.managedProperty().bind(frame.visibleProperty());
        HBox bar = new HBox(12, msg, preview, grow, frame, counts, caution);
        bar.getStyleClass().add("status-bar");
        bar.setPadding(new Insets(4, 10, 4, 10));
        return bar;
    }
}
