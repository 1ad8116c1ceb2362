package dev.nanoplan.desktop;

import static dev.nanoplan.desktop.Widgets.button;
import static dev.nanoplan.desktop.Widgets.field;

import dev.nanoplan.plan.RouteReport;
import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.Role;
import java.util.Locale;
import javafx.beans.property.ObjectProperty;
import javafx.geometry.Insets;
import javafx.geometry.Pos;
import javafx.scene.control.Button;
import javafx.scene.control.ChoiceBox;
import javafx.scene.control.ComboBox;
import javafx.scene.control.Label;
import javafx.scene.control.Separator;
import javafx.scene.control.TextField;
import javafx.scene.layout.GridPane;
import javafx.scene.layout.HBox;
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

    private Region build() {
        NodeInspector in = vm.editor().inspector();
        GridPane g = new GridPane();
        g.setHgap(6);
        g.setVgap(5);
        int row = 0;
        TextField id = field(in.idProperty());
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
        Button apply = button("Apply", "Apply the fields to the selected node (Enter)", vm.editor()::applyInspector);
        apply.setDefaultButton(true);
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
                new HBox(4, from, new Label("→"), to), new HBox(6, addDemand, removeDemand));
        box.setPadding(new Insets(10));
        box.getStyleClass().add("inspector");
        box.setMinWidth(230);
        return box;
    }
}
