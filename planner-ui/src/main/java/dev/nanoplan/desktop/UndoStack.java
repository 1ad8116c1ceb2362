package dev.nanoplan.desktop;

import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.Species;
import java.util.ArrayDeque;
import java.util.Deque;
import java.util.List;
import java.util.Objects;
import javafx.beans.property.ReadOnlyBooleanProperty;
import javafx.beans.property.ReadOnlyBooleanWrapper;
import javafx.beans.property.ReadOnlyStringProperty;
import javafx.beans.property.ReadOnlyStringWrapper;

/**
 * Undo/redo of scenario edits. Scenarios are immutable records, so an edit is the pair of the
 * layout before and after it (plus the editor's unused species); undoing restores "before",
 * redoing restores "after". A new edit
 * clears the redo side. At most {@value #LIMIT} edits are kept (oldest dropped). O(1) per call.
 */
public final class UndoStack {

    /** Most edits kept. */
    public static final int LIMIT = 500;

    /**
     * One edit: a label for menus, the layouts around it, and the species declared in the editor
     * that no node uses yet before and after it (they cannot be part of a valid {@link Scenario}).
     */
    public record Edit(String label, Scenario before, Scenario after, List<Species> unusedBefore,
            List<Species> unusedAfter) {
        public Edit {
            Objects.requireNonNull(label, "label");
            Objects.requireNonNull(before, "before");
            Objects.requireNonNull(after, "after");
            unusedBefore = List.copyOf(unusedBefore);
            unusedAfter = List.copyOf(unusedAfter);
        }

        /** An edit of the layout alone (no unused species on either side). */
        public Edit(String label, Scenario before, Scenario after) {
            this(label, before, after, List.of(), List.of());
        }
    }

    private final Deque<Edit> undo = new ArrayDeque<>();
    private final Deque<Edit> redo = new ArrayDeque<>();
    private final ReadOnlyBooleanWrapper canUndo = new ReadOnlyBooleanWrapper(false);
    private final ReadOnlyBooleanWrapper canRedo = new ReadOnlyBooleanWrapper(false);
    private final ReadOnlyStringWrapper undoLabel = new ReadOnlyStringWrapper("");
    private final ReadOnlyStringWrapper redoLabel = new ReadOnlyStringWrapper("");

    /** Records a done edit and clears the redo side. */
    public void push(Edit e) {
        undo.push(e);
        if (undo.size() > LIMIT) {
            undo.removeLast();
        }
        redo.clear();
        refresh();
    }

    /** Takes the last edit for undoing, or null when there is none. */
    public Edit undo() {
        Edit e = undo.poll();
        if (e != null) {
            redo.push(e);
        }
        refresh();
        return e;
    }

    /** Takes the last undone edit for redoing, or null when there is none. */
    public Edit redo() {
        Edit e = redo.poll();
        if (e != null) {
            undo.push(e);
        }
        refresh();
        return e;
    }

    /** Forgets every edit (a new file was opened). */
    public void clear() {
        undo.clear();
        redo.clear();
        refresh();
    }

    public ReadOnlyBooleanProperty canUndoProperty() {
        return canUndo.getReadOnlyProperty();
    }

    public ReadOnlyBooleanProperty canRedoProperty() {
        return canRedo.getReadOnlyProperty();
    }

    public ReadOnlyStringProperty undoLabelProperty() {
        return undoLabel.getReadOnlyProperty();
    }

    public ReadOnlyStringProperty redoLabelProperty() {
        return redoLabel.getReadOnlyProperty();
    }

    private void refresh() {
        canUndo.set(!undo.isEmpty());
        canRedo.set(!redo.isEmpty());
        undoLabel.set(undo.isEmpty() ? "" : undo.peek().label());
        redoLabel.set(redo.isEmpty() ? "" : redo.peek().label());
    }
}
