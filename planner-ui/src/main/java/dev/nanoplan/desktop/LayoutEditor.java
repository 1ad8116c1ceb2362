package dev.nanoplan.desktop;

import dev.nanoplan.geometry.Vec3;
import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.Role;
import dev.nanoplan.scenario.Scenario;
import java.util.List;
import java.util.Objects;
import javafx.beans.property.SimpleStringProperty;
import javafx.beans.property.StringProperty;

/**
 * Node and demand commands on the open {@link ScenarioDocument}, with the selected node and its
 * {@link NodeInspector}. Each command is one undoable edit built by a pure function of
 * {@link LayoutEdits}; a refused edit leaves the layout as it was and the status line says why.
 * Threading: the UI thread only.
 */
public final class LayoutEditor {

    private final ScenarioDocument document;
    private final StringProperty selectedNodeId = new SimpleStringProperty();
    private final NodeInspector inspector = new NodeInspector();

    LayoutEditor(ScenarioDocument document) {
        this.document = Objects.requireNonNull(document, "document");
        selectedNodeId.addListener((o, a, b) -> inspector.load(document.scenario(), b == null ? null : nodeById(b)));
        document.onReplaced(() -> selectedNodeId.set(null));
        document.onShown(s -> {
            String sel = selectedNodeId.get();
            if (sel != null && nodeById(sel) == null) {
                selectedNodeId.set(null);
            } else if (sel != null) {
                inspector.load(s, nodeById(sel));
            }
        });
    }

    /** Replaces the node {@code id} by {@code node} (which may carry a new id; demands follow it). */
    public boolean replaceNode(String id, Node node) {
        return document.edit("edit " + id, (s, unused) -> LayoutEdits.replaceNode(s, unused, id, node))
                && reselect(node.id());
    }

    /**
     * Applies the inspector's fields (and, under the slots schedule, the slot) to the selected node as
     * one edit; a bad field is refused naming it, with the message beside the field.
     */
    public boolean applyInspector() {
        String id = selectedNodeId.get();
        if (id == null) {
            document.say("select a node first");
            return false;
        }
        NodeInspector.Edit e;
        try {
            e = inspector.toEdit();
        } catch (IllegalArgumentException ex) {
            document.say("edit " + id + " refused: " + ex.getMessage());
            return false;
        }
        Node n = e.node();
        ScenarioDocument.EditFunction change = (s, unused) -> LayoutEdits.withSlot(
                LayoutEdits.replaceNode(s, unused, id, n), n.id(), e.slot());
        try {
            // the layout's own checks (overlap, outside the volume) are marked beside the field too
            change.apply(document.scenario(), List.copyOf(document.unusedSpecies()));
        } catch (IllegalArgumentException ex) {
            inspector.placeLayoutProblem(ex);
        }
        return document.edit("edit " + id, change) && reselect(n.id());
    }

    /** Moves a node to a new centre. */
    public boolean moveNode(String id, Vec3 positionUm) {
        if (nodeById(id) == null) {
            return false;
        }
        boolean ok = document.edit("move " + id, (s, unused) -> LayoutEdits.moveNode(s, unused, id, positionUm));
        if (ok) {
            inspector.load(document.scenario(), nodeById(id));
        }
        return ok;
    }

    /** Adds a node of the given role at the first free place near the volume's centre, and selects it. */
    public boolean addNode(Role role) {
        Scenario s = document.scenario();
        if (s == null) {
            return false;
        }
        Node proto = LayoutEdits.newNode(s, role);
        return document.edit("add " + proto.id(),
                (cur, unused) -> LayoutEdits.addNear(cur, unused, proto, proto.positionUm())) && reselect(proto.id());
    }

    /** Copies the node {@code id} to a free place beside it, and selects the copy. */
    public boolean duplicateNode(String id) {
        Scenario s = document.scenario();
        Node n = nodeById(id);
        if (s == null || n == null) {
            return false;
        }
        Node proto = LayoutEdits.copyOf(s, n);
        return document.edit("duplicate " + id,
                (cur, unused) -> LayoutEdits.addNear(cur, unused, proto, n.positionUm())) && reselect(proto.id());
    }

    /** Deletes a node and the demands that name it. */
    public boolean deleteNode(String id) {
        boolean ok = document.edit("delete " + id, (s, unused) -> LayoutEdits.deleteNode(s, unused, id));
        if (ok) {
            selectedNodeId.set(null);
        }
        return ok;
    }

    /** Adds the demand from → to. */
    public boolean addDemand(String from, String to) {
        return document.edit("add demand " + from + " → " + to, (s, u) -> LayoutEdits.addDemand(s, u, from, to));
    }

    /** Removes the demand from → to. */
    public boolean removeDemand(String from, String to) {
        return document.edit("remove demand " + from + " → " + to,
                (s, u) -> LayoutEdits.removeDemand(s, u, from, to));
    }

    /** The node with this id in the current layout, or null. */
    public Node nodeById(String id) {
        Scenario s = document.scenario();
        return s == null || id == null ? null : s.nodesById().get(id);
    }

    /** The id of the selected node, or null; selecting loads the inspector. */
    public StringProperty selectedNodeIdProperty() {
        return selectedNodeId;
    }

    /** The selected node's fields as text. */
    public NodeInspector inspector() {
        return inspector;
    }

    private boolean reselect(String id) {
        selectedNodeId.set(null);
        selectedNodeId.set(id);
        return true;
    }
}
