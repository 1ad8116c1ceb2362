package dev.nanoplan.desktop;

import static dev.nanoplan.desktop.Widgets.button;
import static dev.nanoplan.desktop.Widgets.field;
import static dev.nanoplan.desktop.Widgets.fieldRow;

import dev.nanoplan.plan.RouteReport;
import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.ReceiverModel;
import dev.nanoplan.scenario.Role;
import java.util.List;
import java.util.Locale;
import javafx.beans.binding.Bindings;
import javafx.beans.binding.BooleanBinding;
import javafx.beans.binding.StringBinding;
import javafx.beans.property.ObjectProperty;
import javafx.geometry.Insets;
import javafx.geometry.Pos;
import javafx.scene.control.Button;
import javafx.scene.control.CheckBox;
import javafx.scene.control.ChoiceBox;
import javafx.scene.control.Control;
import javafx.scene.control.ComboBox;
import javafx.scene.control.Label;
import javafx.scene.control.ProgressBar;
import javafx.scene.control.Separator;
import javafx.scene.control.TextField;
import javafx.scene.control.Tooltip;
import javafx.scene.layout.ColumnConstraints;
import javafx.scene.layout.GridPane;
import javafx.scene.layout.HBox;
import javafx.scene.layout.Priority;
import javafx.scene.layout.Region;
import javafx.scene.layout.VBox;
import javafx.util.StringConverter;

/**
 * The inspector on the left of the window (a View): the selected node's fields bound to the
 * {@link NodeInspector}, node commands, the plane a dragged node moves in, and the demand editor.
 */
final class InspectorPane {

    private final PlannerViewModel vm;
    private final ObjectProperty<SceneView.DragPlane> dragPlane;
    private final Region node;

    /** @param dragPlane the 3D view's drag plane, chosen here */
    InspectorPane(PlannerViewModel vm, ObjectProperty<SceneView.DragPlane> dragPlane) {
        this.vm = vm;
        this.dragPlane = dragPlane;
        this.node = build();
    }

    /** The pane: node fields with Apply, Duplicate, Delete, add buttons, drag plane, and demands. */
    Region node() {
        return node;
    }

    /**
     * "Assign slots": runs the slot assignment with spatial reuse in the background (progress bar and
     * Cancel while it runs) and applies the slot plan as one undoable edit.
     */
    private Region slotsSection() {
        SlotAssigner slots = vm.slots();
        Button assign = button("Assign slots", "Give every emitter a time slot so that emitters far apart send "
                + "together (schedule slots, as nanoplan slots); one undoable edit", slots::assign);
        assign.setId("assign-slots");
        assign.disableProperty().bind(vm.scenarioProperty().isNull().or(slots.runningProperty()));
        ProgressBar bar = new ProgressBar();
        bar.progressProperty().bind(slots.progressProperty());
        bar.setPrefWidth(110);
        Button cancel = button("Cancel", "Stop assigning slots; the layout stays as it is", slots::cancel);
        cancel.setId("cancel-slots");
        for (javafx.scene.Node n : List.of(bar, cancel)) {
            n.visibleProperty().bind(slots.runningProperty());
            n.managedProperty().bind(slots.runningProperty());
        }
        Label frame = new Label();
        frame.textProperty().bind(slots.frameProperty());
        frame.getStyleClass().add("hint");
        HBox run = new HBox(6, assign, bar, cancel);
        run.setAlignment(Pos.CENTER_LEFT);
        return new VBox(6, Widgets.section("Slots"), run, frame);
    }

    /**
     * Fits the grid in the narrow inspector: labels never clipped, fields sharing the rest, and
     * no gap left by the rows hidden for other receiver models or schedules (the gap is a margin of
     * the shown controls instead of the grid's vgap, which counts hidden rows too).
     */
    private static void fitNarrow(GridPane g) {
        ColumnConstraints labels = new ColumnConstraints();
        labels.setMinWidth(Region.USE_PREF_SIZE);
        ColumnConstraints fields = new ColumnConstraints();
        fields.setHgrow(Priority.ALWAYS);
        fields.setMinWidth(60);
        g.getColumnConstraints().setAll(labels, fields);
        g.setVgap(0);
        for (javafx.scene.Node n : g.getChildren()) {
            GridPane.setMargin(n, new Insets(2.5, 0, 2.5, 0));
            if (n instanceof Control c && Integer.valueOf(1).equals(GridPane.getColumnIndex(n))) {
                c.setPrefWidth(110);
                c.setMaxWidth(Double.MAX_VALUE);
            }
        }
    }

    private static StringBinding error(NodeInspector in, String key) {
        return in.errors().message(key);
    }

    /** Shows the label, field and message of grid row {@code row} only while the receiver model is {@code kind}. */
    private static void showWhen(GridPane g, int row, NodeInspector in, ReceiverModel.Kind kind) {
        BooleanBinding shown = in.receiverProperty().isEqualTo(kind).and(Bindings.createBooleanBinding(
                () -> in.roleProperty().get() != null && in.roleProperty().get().absorbs(), in.roleProperty()));
        for (javafx.scene.Node n : g.getChildren()) {
            Integer r = GridPane.getRowIndex(n);
            if (r != null && (r == row || r == row + 1) && !(r == row + 1 && n.visibleProperty().isBound())) {
                n.visibleProperty().bind(shown);
                n.managedProperty().bind(shown);
            }
        }
    }

    private Region build() {
        NodeInspector in = vm.editor().inspector();
        GridPane g = new GridPane();
        g.setHgap(6);
        g.setVgap(5);
        int row = 0;
        TextField id = field(in.idProperty(), "inspector-id");
        ChoiceBox<Role> role = new ChoiceBox<>();
        role.getItems().addAll(Role.values());
        role.setConverter(new StringConverter<>() {
            @Override
            public String toString(Role r) {
                return r == null ? "" : TableText.role(r);
            }

            @Override
            public Role fromString(String s) {
                return Role.valueOf(s.toUpperCase(Locale.ROOT));
            }
        });
        role.valueProperty().bindBidirectional(in.roleProperty());
        // each field's message sits under it; the keys follow the loaded node's index (nodes[i].radius_um)
        row = fieldRow(g, row, new Label("id"), id, error(in, NodeInspector.ID));
        g.addRow(row++, new Label("role"), role);
        row = fieldRow(g, row, new Label("x µm"), field(in.xUmProperty(), "inspector-x"), error(in, NodeInspector.X));
        row = fieldRow(g, row, new Label("y µm"), field(in.yUmProperty(), "inspector-y"), error(in, NodeInspector.Y));
        row = fieldRow(g, row, new Label("z µm"), field(in.zUmProperty(), "inspector-z"), error(in, NodeInspector.Z));
        row = fieldRow(g, row, new Label("radius µm"), field(in.radiusUmProperty(), "inspector-radius"),
                error(in, NodeInspector.RADIUS));
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
        row = fieldRow(g, row, new Label("species"), species, error(in, NodeInspector.SPECIES));
        row = fieldRow(g, row, new Label("emits"), emits, error(in, NodeInspector.EMITS));
        TextField molecules = field(in.moleculesPerSymbolProperty(), "inspector-molecules");
        molecules.disableProperty().bind(in.roleProperty().isEqualTo(Role.RECEIVER));
        row = fieldRow(g, row, new Label("molecules/symbol"), molecules, error(in, NodeInspector.MOLECULES));

        // receiver model: receivers and relays only; κ for reactive, the sampling instant for passive
        ChoiceBox<ReceiverModel.Kind> receiver = new ChoiceBox<>();
        receiver.getItems().addAll(ReceiverModel.Kind.values());
        receiver.setConverter(new StringConverter<>() {
            @Override
            public String toString(ReceiverModel.Kind k) {
                return k == null ? "" : k.id();
            }

            @Override
            public ReceiverModel.Kind fromString(String text) {
                return ReceiverModel.Kind.parse(text);
            }
        });
        receiver.valueProperty().bindBidirectional(in.receiverProperty());
        receiver.setId("inspector-receiver");
        receiver.setTooltip(new Tooltip("absorbing: every molecule reaching the surface is counted and removed; "
                + "reactive: receptors bind at the surface at the finite rate κ (Collins–Kimball); "
                + "passive: counts the molecules inside at one instant per slot, removing none"));
        receiver.disableProperty().bind(Bindings.createBooleanBinding(
                () -> in.roleProperty().get() == null || !in.roleProperty().get().absorbs(), in.roleProperty()));
        Label receiverLabel = new Label("receiver");
        row = fieldRow(g, row, receiverLabel, receiver, error(in, NodeInspector.RECEIVER));
        TextField binding = field(in.bindingRateUmPerSProperty(), "inspector-binding-rate");
        binding.setPromptText("κ");
        Label bindingLabel = new Label("binding rate µm/s");
        int bindingRow = row;
        row = fieldRow(g, row, bindingLabel, binding, error(in, NodeInspector.BINDING_RATE));
        showWhen(g, bindingRow, in, ReceiverModel.Kind.REACTIVE);
        TextField sampling = field(in.samplingOffsetSProperty(), "inspector-sampling-offset");
        sampling.setPromptText("end of slot");
        sampling.setTooltip(new Tooltip("When each slot's count is taken, after the slot starts; blank = the end "
                + "of the slot"));
        Label samplingLabel = new Label("sampling offset s");
        int samplingRow = row;
        row = fieldRow(g, row, samplingLabel, sampling, error(in, NodeInspector.SAMPLING_OFFSET));
        showWhen(g, samplingRow, in, ReceiverModel.Kind.PASSIVE);

        // the emitter's slot under the slots schedule
        TextField slot = field(in.slotProperty(), "inspector-slot");
        slot.promptTextProperty().bind(in.slotHintProperty());
        Label slotLabel = new Label("slot");
        int slotRow = row;
        row = fieldRow(g, row, slotLabel, slot, error(in, NodeInspector.SLOT));
        BooleanBinding slotShown = in.slotsScheduleProperty().and(Bindings.createBooleanBinding(
                () -> in.roleProperty().get() != null && in.roleProperty().get().emits(), in.roleProperty()));
        for (javafx.scene.Node n : List.of(slotLabel, slot)) {
            n.visibleProperty().bind(slotShown);
            n.managedProperty().bind(slotShown);
        }
        Label slotHint = new Label();
        slotHint.textProperty().bind(in.slotHintProperty());
        slotHint.getStyleClass().add("hint");
        slotHint.visibleProperty().bind(slotShown);
        slotHint.managedProperty().bind(slotShown);
        g.add(slotHint, 0, row++, 2, 1);

        CheckBox fixed = new CheckBox("fixed");
        fixed.setTooltip(new Tooltip("Design aids (nanoplan improve) never move or re-assign a fixed node"));
        fixed.selectedProperty().bindBidirectional(in.fixedProperty());
        fixed.setId("inspector-fixed");
        g.add(fixed, 1, row++);
        fitNarrow(g);
        Button apply = button("Apply", "Apply the fields to the selected node (Enter)", vm.editor()::applyInspector);
        apply.setDefaultButton(true);
        apply.setId("apply-node");
        apply.disableProperty().bind(vm.editor().selectedNodeIdProperty().isNull());
        Button dup = button("Duplicate", "Copy the selected node beside it",
                () -> vm.editor().duplicateNode(vm.editor().selectedNodeIdProperty().get()));
        dup.disableProperty().bind(vm.editor().selectedNodeIdProperty().isNull());
        Button del = button("Delete", "Delete the selected node and its demands",
                () -> vm.editor().deleteNode(vm.editor().selectedNodeIdProperty().get()));
        del.disableProperty().bind(vm.editor().selectedNodeIdProperty().isNull());
        HBox editRow = new HBox(6, apply, dup, del);
        HBox addRow = new HBox(6, button("+ Tx", "Add a transmitter", () -> vm.editor().addNode(Role.TRANSMITTER)),
                button("+ Rx", "Add a receiver", () -> vm.editor().addNode(Role.RECEIVER)),
                button("+ Relay", "Add a relay", () -> vm.editor().addNode(Role.RELAY)));
        ChoiceBox<SceneView.DragPlane> plane = new ChoiceBox<>();
        plane.getItems().addAll(SceneView.DragPlane.values());
        plane.valueProperty().bindBidirectional(dragPlane);
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
                () -> vm.editor().addDemand(from.getValue(), to.getValue()));
        addDemand.disableProperty().bind(from.valueProperty().isNull().or(to.valueProperty().isNull()));
        Button removeDemand = button("− Demand", "Remove the selected route's demand", () -> {
            RouteReport r = vm.tables().selectedRouteProperty().get();
            if (r != null) {
                vm.editor().removeDemand(r.from(), r.to());
            }
        });
        removeDemand.disableProperty().bind(vm.tables().selectedRouteProperty().isNull());
        Label head = new Label("Node");
        head.getStyleClass().add("section");
        Label dhead = new Label("Demands");
        dhead.getStyleClass().add("section");
        VBox box = new VBox(8, head, g, editRow, addRow, planeRow, new Separator(), dhead,
                new HBox(4, from, new Label("→"), to), new HBox(6, addDemand, removeDemand), new Separator(),
                slotsSection());
        box.setPadding(new Insets(10));
        box.getStyleClass().add("inspector");
        box.setMinWidth(230);
        return box;
    }
}
