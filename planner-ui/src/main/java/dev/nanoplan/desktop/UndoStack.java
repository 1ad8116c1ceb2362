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
 *
 * <p>Saved state: every edit is a revision with its own number; the layout shown is the revision
 * of the last edit on the undo side (or the base before all of them). {@link #markSaved()} remembers
 * the current revision, and {@link #atSaved()} tells whether undo and redo have come back to it, so
 * undoing back to the saved layout clears the unsaved mark and redoing away sets it again.
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
    /** Revision number of each edit kept (the revision its "after" is). */
    private final Deque<Long> undoRevisions = new ArrayDeque<>();
    private final Deque<Long> redoRevisions = new ArrayDeque<>();
    private long lastRevision;
    /** Revision of the layout before the oldest edit kept. */
    private long baseRevision;
    private long savedRevision;
    private final ReadOnlyBooleanWrapper canUndo = new ReadOnlyBooleanWrapper(false);
    private final ReadOnlyBooleanWrapper canRedo = new ReadOnlyBooleanWrapper(false);
    private final ReadOnlyStringWrapper undoLabel = new ReadOnlyStringWrapper("");
    private final ReadOnlyStringWrapper redoLabel = new ReadOnlyStringWrapper("");

    /** Records a done edit and clears the redo side. */
    public void push(Edit e) {
        undo.push(e);
        undoRevisions.push(++lastRevision);
        if (undo.size() > LIMIT) {
            undo.removeLast();
            baseRevision = undoRevisions.removeLast();
        }
        redo.clear();
        redoRevisions.clear();
        refresh();
    }

    /** Takes the last edit for undoing, or null when there is none. */
    public Edit undo() {
        Edit e = undo.poll();
        if (e != null) {
            redo.push(e);
            redoRevisions.push(undoRevisions.pop());
        }
        refresh();
        return e;
    }

    /** Takes the last undone edit for redoing, or null when there is none. */
    public Edit redo() {
        Edit e = redo.poll();
        if (e != null) {
            undo.push(e);
            undoRevisions.push(redoRevisions.pop());
        }
        refresh();
        return e;
    }

    /** Forgets every edit (a new file was opened); the layout shown counts as saved. */
    public void clear() {
        undo.clear();
        redo.clear();
        undoRevisions.clear();
        redoRevisions.clear();
        baseRevision = ++lastRevision;
        savedRevision = baseRevision;
        refresh();
    }

    /** Remembers the layout shown now as the saved one. */
    public void markSaved() {
        savedRevision = currentRevision();
    }

    /** Whether the layout shown is the one last saved (or opened). */
    public boolean atSaved() {
        return currentRevision() == savedRevision;
    }

    private long currentRevision() {
        return undoRevisions.isEmpty() ? baseRevision : undoRevisions.peek();
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
