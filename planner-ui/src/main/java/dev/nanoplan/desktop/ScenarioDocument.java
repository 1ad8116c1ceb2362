package dev.nanoplan.desktop;

import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.ScenarioException;
import dev.nanoplan.scenario.ScenarioReader;
import dev.nanoplan.scenario.ScenarioWriter;
import dev.nanoplan.scenario.Species;
import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import java.util.function.Consumer;
import java.util.function.UnaryOperator;
import javafx.beans.property.ReadOnlyBooleanProperty;
import javafx.beans.property.ReadOnlyBooleanWrapper;
import javafx.beans.property.ReadOnlyObjectProperty;
import javafx.beans.property.ReadOnlyObjectWrapper;
import javafx.beans.property.ReadOnlyStringProperty;
import javafx.beans.property.ReadOnlyStringWrapper;
import javafx.collections.FXCollections;
import javafx.collections.ObservableList;

/**
 * The open layout as a document: the scenario, the file it came from, the unsaved-changes mark
 * and the window title, the undo/redo history, opening, loading and saving, and the status line.
 *
 * <p>Every change of the shown layout goes through one place: {@code beforeShown} (given to the
 * constructor) sees the new layout just before {@link #scenarioProperty()} changes, even when the
 * new layout equals the old one (an edit of the unused species only), so the planner can start at
 * once. When another layout <em>replaces</em> the current one ({@link #open}, {@link #load}), the
 * listeners added with {@link #onReplaced} run once, before the new layout is shown; no caller of
 * {@code load} has to remember to tell the other panes.
 *
 * <p>The species declared in the settings editor that no node uses yet ({@link #unusedSpecies()})
 * travel with the layout through undo and redo. Threading: the UI thread only.
 */
public final class ScenarioDocument {

    private final RecentFiles recent;
    private final Consumer<Scenario> beforeShown;
    private final ReadOnlyObjectWrapper<Scenario> scenario = new ReadOnlyObjectWrapper<>();
    private final ReadOnlyBooleanWrapper dirty = new ReadOnlyBooleanWrapper(false);
    private final ReadOnlyStringWrapper message = new ReadOnlyStringWrapper("");
    private final ReadOnlyObjectWrapper<Path> file = new ReadOnlyObjectWrapper<>();
    private final ReadOnlyStringWrapper title = new ReadOnlyStringWrapper("nanoplan");
    private final ObservableList<Species> unusedSpecies = FXCollections.observableArrayList();
    private final UndoStack undo = new UndoStack();
    private final List<Runnable> replacedListeners = new ArrayList<>();
    private final List<Consumer<Scenario>> shownListeners = new ArrayList<>();

    /**
     * @param recent      recent-files store, told of every file opened or saved
     * @param beforeShown called with every layout about to be shown
     */
    ScenarioDocument(RecentFiles recent, Consumer<Scenario> beforeShown) {
        this.recent = Objects.requireNonNull(recent, "recent");
        this.beforeShown = Objects.requireNonNull(beforeShown, "beforeShown");
        file.addListener((o, a, b) -> refreshTitle());
        dirty.addListener((o, a, b) -> refreshTitle());
        scenario.addListener((o, a, b) -> refreshTitle());
    }

    /** Runs {@code r} each time another layout replaces the current one, before it is shown. */
    void onReplaced(Runnable r) {
        replacedListeners.add(Objects.requireNonNull(r, "r"));
    }

    /**
     * Runs {@code c} with every layout just shown, after the scenario's own listeners, even when it
     * equals the previous one (an edit of the unused species only changes nothing else).
     */
    void onShown(Consumer<Scenario> c) {
        shownListeners.add(Objects.requireNonNull(c, "c"));
    }

    /** Opens a scenario file; on failure keeps the current layout and says why. */
    boolean open(Path path) {
        Scenario s;
        try {
            s = ScenarioReader.strict().read(path);
        } catch (ScenarioException e) {
            message.set("cannot open " + path + ": " + e.getMessage());
            return false;
        }
        load(s, path);
        recent.add(path);
        return true;
    }

    /** Replaces the layout by {@code s} read from {@code from} (null: a template or swarm, not yet saved). */
    void load(Scenario s, Path from) {
        undo.clear();
        file.set(from);
        // the message comes before the plan is scheduled, so a fast planning failure is not overwritten
        message.set(from == null ? "new layout" : "opened " + from.getFileName());
        unusedSpecies.clear();
        replacedListeners.forEach(Runnable::run);
        show(s);
        dirty.set(false);
    }

    /** Saves to the current file (atomic). False when there is no file yet or writing failed. */
    boolean save() {
        return file.get() != null && saveAs(file.get());
    }

    /** Saves to {@code path} atomically and makes it the current file. */
    boolean saveAs(Path path) {
        if (scenario.get() == null) {
            return false;
        }
        try {
            ScenarioWriter.write(scenario.get(), path);
        } catch (IOException e) {
            message.set("cannot save " + path + ": " + e.getMessage());
            return false;
        }
        file.set(path);
        undo.markSaved();
        dirty.set(false);
        recent.add(path);
        message.set("saved " + path.getFileName() + (unusedSpecies.isEmpty() ? ""
                : " (species no node uses are not saved: "
                        + String.join(", ", unusedSpecies.stream().map(Species::name).toList()) + ")"));
        return true;
    }

    /**
     * Applies an edit: {@code change} builds the new layout from the current one and the unused
     * species; an {@link IllegalArgumentException} from it (the core's validation) refuses the edit
     * with "label refused: why" and changes nothing. A null result or an unchanged layout is no edit.
     */
    boolean edit(String label, EditFunction change) {
        Scenario before = scenario.get();
        if (before == null) {
            message.set(label + " refused: no layout open");
            return false;
        }
        Scenario after;
        try {
            after = change.apply(before, List.copyOf(unusedSpecies));
        } catch (IllegalArgumentException e) {
            message.set(label + " refused: " + e.getMessage());
            return false;
        }
        if (after == null) {
            return false;
        }
        return commit(label, before, after, LayoutEdits.unusedAfter(before, unusedSpecies, after));
    }

    /** As {@link #edit(String, EditFunction)} for a change that does not need the unused species. */
    boolean edit(String label, UnaryOperator<Scenario> change) {
        return edit(label, (s, unused) -> change.apply(s));
    }

    /** Records and shows an edit of the layout and its unused species; false if nothing changed. */
    boolean commit(String label, Scenario before, Scenario after, List<Species> unusedAfter) {
        List<Species> unusedBefore = List.copyOf(unusedSpecies);
        if (after.equals(before) && unusedAfter.equals(unusedBefore)) {
            return false;
        }
        undo.push(new UndoStack.Edit(label, before, after, unusedBefore, unusedAfter));
        unusedSpecies.setAll(unusedAfter);
        show(after);
        dirty.set(!undo.atSaved());
        message.set(label);
        return true;
    }

    /** Undoes the last edit; false when there is none. */
    boolean undo() {
        return restore(undo.undo(), true);
    }

    /** Redoes the last undone edit; false when there is none. */
    boolean redo() {
        return restore(undo.redo(), false);
    }

    /** Shows the layout before ({@code back}) or after edit {@code e}; false when {@code e} is null. */
    private boolean restore(UndoStack.Edit e, boolean back) {
        if (e == null) {
            return false;
        }
        unusedSpecies.setAll(back ? e.unusedBefore() : e.unusedAfter());
        show(back ? e.before() : e.after());
        // back at the saved layout (undo or redo), the unsaved mark goes
        dirty.set(!undo.atSaved());
        message.set((back ? "undid " : "redid ") + e.label());
        return true;
    }

    /** Shows a message in the status line. */
    void say(String text) {
        message.set(text);
    }

    private void show(Scenario s) {
        beforeShown.accept(s);
        scenario.set(s);
        shownListeners.forEach(c -> c.accept(s));
    }

    private void refreshTitle() {
        Scenario s = scenario.get();
        String name = file.get() != null ? file.get().getFileName().toString()
                : s != null ? (s.name().isBlank() ? "untitled" : s.name()) : "";
        title.set((dirty.get() ? "• " : "") + (name.isEmpty() ? "" : name + " — ") + "nanoplan");
    }

    /** An edit of the layout that may use the unused species. */
    @FunctionalInterface
    interface EditFunction {
        /** The new layout from the current one and the unused species (a copy). */
        Scenario apply(Scenario current, List<Species> unused);
    }

    public ReadOnlyObjectProperty<Scenario> scenarioProperty() {
        return scenario.getReadOnlyProperty();
    }

    Scenario scenario() {
        return scenario.get();
    }

    public ReadOnlyBooleanProperty dirtyProperty() {
        return dirty.getReadOnlyProperty();
    }

    ReadOnlyStringProperty messageProperty() {
        return message.getReadOnlyProperty();
    }

    public ReadOnlyObjectProperty<Path> fileProperty() {
        return file.getReadOnlyProperty();
    }

    public ReadOnlyStringProperty titleProperty() {
        return title.getReadOnlyProperty();
    }

    /** Species declared in the editor that no node uses yet (modifiable only through edits). */
    public ObservableList<Species> unusedSpecies() {
        return FXCollections.unmodifiableObservableList(unusedSpecies);
    }

    /** The recent files, newest first. */
    public ObservableList<Path> recentFiles() {
        return recent.files();
    }

    public UndoStack undoStack() {
        return undo;
    }
}
