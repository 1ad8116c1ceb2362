package dev.nanoplan.desktop;

import dev.nanoplan.plan.Plan;
import dev.nanoplan.plan.RouteReport;
import dev.nanoplan.io.AtomicFiles;
import dev.nanoplan.report.PlanHtml;
import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.Species;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.Executor;
import java.util.concurrent.ScheduledExecutorService;
import java.util.function.UnaryOperator;
import javafx.application.Platform;
import javafx.beans.binding.Bindings;
import javafx.beans.binding.StringBinding;
import javafx.beans.property.ReadOnlyDoubleProperty;
import javafx.beans.property.ReadOnlyDoubleWrapper;
import javafx.beans.property.ReadOnlyObjectProperty;
import javafx.beans.property.ReadOnlyStringProperty;
import javafx.beans.value.ObservableStringValue;
import javafx.collections.FXCollections;
import javafx.collections.ObservableList;

/**
 * State and commands of the desktop planner (the ViewModel of MVVM), as a façade over focused
 * parts: the {@link ScenarioDocument} (layout, file, title, dirty mark, undo/redo, status line),
 * the {@link LayoutEdits} (pure {@code Scenario → Scenario} edits), the {@link PlanScheduler}
 * (debounced preview and exact plans, cancellation) and the {@link PlanTables} (links, routes,
 * budgets, comparison, selection). It adds the node selection with its {@link NodeInspector} and
 * the {@link ScenarioSettings} editor, both reloaded from every layout shown. Never touches a
 * control, so it is tested without a window.
 *
 * <p>Progressive update: after each edit the service's fast preview is shown first with
 * {@link #previewShownProperty()} true; the exact plan then replaces it. A newer edit drops and
 * cancels both. Threading: all methods are called on the UI thread (the futures of
 * {@link PlanScheduler} may be waited on from any thread).
 */
public final class PlannerViewModel {

    /** Default debounce between the last edit and the start of planning. */
    public static final long DEFAULT_DEBOUNCE_MS = 150;
    /** Default debounce before the preview: none (edits come from drops and typed values, not every mouse move). */
    public static final long DEFAULT_PREVIEW_DEBOUNCE_MS = 0;

    private final ScenarioDocument document;
    private final PlanTables tables = new PlanTables();
    private final PlanScheduler scheduler;
    private final ReadOnlyDoubleWrapper maxCapacity = new ReadOnlyDoubleWrapper(1.0);
    private final LayoutEditor editor;
    private final ScenarioSettings settings = new ScenarioSettings();
    private final ObservableList<String> speciesNames = FXCollections.observableArrayList();
    private final StringBinding routeSummary;
    private final SlotAssigner slots;
    /** The settings-relevant parts of the layout last loaded into the settings editor. */
    private List<Object> settingsKey;

    /** As the full constructor, with previews on {@code background} and no preview debounce. */
    public PlannerViewModel(PlanService service, Executor uiThread, ScheduledExecutorService background,
            long debounceMs, RecentFiles recent) {
        this(service, uiThread, background, debounceMs, background, 0, recent);
    }

    /**
     * @param service           the planner
     * @param uiThread          where results are applied (the FX thread in the application)
     * @param background        where exact plans are computed
     * @param debounceMs        delay after the last edit before exact planning starts, ≥ 0
     * @param previewBackground where previews are computed (may be {@code background}; a separate
     *                          thread keeps previews live while an exact plan runs)
     * @param previewDebounceMs delay after the last edit before the preview starts, ≥ 0
     * @param recent            recent-files store
     */
    public PlannerViewModel(PlanService service, Executor uiThread, ScheduledExecutorService background,
            long debounceMs, ScheduledExecutorService previewBackground, long previewDebounceMs, RecentFiles recent) {
        scheduler = new PlanScheduler(service, uiThread, background, debounceMs, previewBackground, previewDebounceMs,
                new PlanScheduler.Sink() {
                    @Override
                    public void apply(Plan plan, boolean preview) {
                        tables.apply(plan, preview);
                    }

                    @Override
                    public void failed(Throwable error) {
                        document.say("planning failed: " + error.getMessage());
                    }

                    @Override
                    public void progress(String text) {
                        document.say(text);
                    }
                });
        document = new ScenarioDocument(recent, this::beforeShown);
        document.onShown(this::afterShown);
        editor = new LayoutEditor(document);
        slots = new SlotAssigner(document, uiThread, SlotAssigner.daemonThreads(), SlotAssigner.core());
        document.onReplaced(() -> {
            tables.clearSelection();
            settingsKey = null; // another layout: the settings editor always starts from the file
        });
        routeSummary = Bindings.createStringBinding(() -> {
            RouteReport r = tables.selectedRouteProperty().get();
            return RouteSummary.of(r, tables::findLink, r == null ? null : tables.sharedRate(r));
        }, tables.selectedRouteProperty(), tables.links());
    }

    /** The application's: real planner, FX thread for results, 150 ms exact debounce, previews at once on their own thread. */
    public static PlannerViewModel forApplication() {
        return new PlannerViewModel(PlanService.core(), Platform::runLater, daemonScheduler(), DEFAULT_DEBOUNCE_MS,
                daemonScheduler("nanoplan-preview"), DEFAULT_PREVIEW_DEBOUNCE_MS, RecentFiles.inUserHome());
    }

    /** A single daemon thread for planning, so a pending plan never keeps the JVM alive. */
    public static ScheduledExecutorService daemonScheduler() {
        return daemonScheduler("nanoplan-planner");
    }

    /** A single daemon thread of the given name. */
    public static ScheduledExecutorService daemonScheduler(String name) {
        return PlanScheduler.daemonScheduler(name);
    }

    // ---------------------------------------------------------------- layout shown

    private void beforeShown(Scenario s) {
        maxCapacity.set(maxCapacityBits(s));
        // planning starts before the listeners of the new layout (the 3D scene) rebuild, so the preview
        // is computed while the UI thread redraws; its result is applied through uiThread afterwards
        scheduler.schedule(s);
    }

    private void afterShown(Scenario s) {
        // what the settings editor shows; a move leaves it alone, so unapplied typing in it survives a drag
        List<Object> key = List.of(s.medium(), s.signalling(), s.species(), List.copyOf(document.unusedSpecies()),
                s.nodes().stream().map(n -> n.id() + '\u0000' + n.species() + '\u0000' + n.emitsSpecies()).toList());
        if (!key.equals(settingsKey)) {
            settingsKey = key;
            settings.load(s, document.unusedSpecies());
            speciesNames.setAll(LayoutEdits.declared(s, document.unusedSpecies()).stream().map(Species::name).toList());
        }
    }

    // ---------------------------------------------------------------- files

    /** Opens a scenario file; on failure keeps the current layout and shows why. */
    public boolean open(Path path) {
        return document.open(path);
    }

    /** Starts from an in-memory layout (a template or a generated swarm), not yet saved. */
    public void load(Scenario s, Path from) {
        document.load(s, from);
    }

    /** Saves to the current file (atomic). False when there is no file yet or writing failed. */
    public boolean save() {
        return document.save();
    }

    /** Saves to {@code path} atomically and makes it the current file. */
    public boolean saveAs(Path path) {
        return document.saveAs(path);
    }

    /** Writes the HTML report of the exact plan (as {@code nanoplan plan --out}) atomically; false, with a message, otherwise. */
    public boolean exportHtml(Path path) {
        Plan p = tables.planProperty().get();
        if (p == null || tables.previewShownProperty().get()) {
            say(p == null ? "no plan to export yet" : "the exact plan is still running: export when it is shown");
            return false;
        }
        try {
            AtomicFiles.write(path, PlanHtml.render(p).getBytes(StandardCharsets.UTF_8));
        } catch (IOException e) {
            say("cannot export " + path + ": " + e.getMessage());
            return false;
        }
        say("exported " + path.getFileName());
        return true;
    }

    /** Runs {@code r} each time another layout replaces the current one (a file opened, a template loaded). */
    public void onLayoutReplaced(Runnable r) {
        document.onReplaced(r);
    }

    // ---------------------------------------------------------------- edits

    /** Applies an edit; an {@link IllegalArgumentException} from {@code change} refuses it with a message. */
    public boolean edit(String label, UnaryOperator<Scenario> change) {
        return document.edit(label, change);
    }

    public boolean undo() {
        return document.undo();
    }

    public boolean redo() {
        return document.redo();
    }

    /** Applies the settings panel's fields as one undoable edit; a bad field is refused naming it. */
    public boolean applySettings() {
        String label = "edit settings";
        Scenario before = document.scenario();
        if (before == null) {
            say(label + " refused: no layout open");
            return false;
        }
        ScenarioSettings.Applied applied;
        try {
            applied = settings.apply(before, document.unusedSpecies());
        } catch (IllegalArgumentException e) {
            // the settings editor also shows the message beside the field (ScenarioSettings.errors())
            say(label + " refused: " + e.getMessage());
            return false;
        }
        boolean ok = document.commit(label, before, applied.scenario(), applied.unusedSpecies());
        if (!ok) {
            say("settings unchanged");
        }
        return ok;
    }

    /** Removes a species row from the settings editor (it leaves on Apply); refused while nodes use it. */
    public boolean removeSpecies(SpeciesRow row) {
        try {
            settings.removeSpecies(row);
        } catch (IllegalArgumentException e) {
            say("remove species refused: " + e.getMessage());
            return false;
        }
        say("species " + row.name() + " will be removed on Apply");
        return true;
    }

    // ---------------------------------------------------------------- planning and comparison

    /** Cancels the pending or running plan (its result will be dropped). */
    public void cancelPlan() {
        scheduler.cancel();
        say("planning cancelled");
    }

    /** Keeps the current design's exact plan (when a preview is shown: once it arrives) for comparison. */
    public void keepForComparison() {
        if (!tables.previewShownProperty().get()) {
            Plan p = tables.planProperty().get();
            tables.keep(p);
            say(p == null ? "nothing to keep yet" : "kept the current design for comparison");
            return;
        }
        Scenario kept = document.scenario();
        say("will keep the current design when its exact plan is ready");
        scheduler.planned().thenAccept(p -> {
            if (p.scenario().equals(kept)) {
                tables.keep(p);
                say("kept the current design for comparison");
            } else {
                say("the layout changed before its exact plan was ready: nothing kept");
            }
        });
    }

    // ---------------------------------------------------------------- queries and parts

    /** Largest capacity a symbol can carry in this layout: log2(levels) bits. */
    public double maxCapacityBits() {
        return maxCapacityBits(document.scenario());
    }

    private static double maxCapacityBits(Scenario s) {
        return s == null ? 1.0 : Math.log(s.signalling().levels()) / Math.log(2);
    }

    /** Shows a message in the status line (e.g. from the view's file dialogs). */
    public void say(String text) {
        document.say(text);
    }

    /** The service that makes this view model's plans. */
    PlanService planService() {
        return scheduler.service();
    }

    /** Node and demand commands with the selected node and its inspector. */
    public LayoutEditor editor() {
        return editor;
    }

    /** "Assign slots" in the background, and the frame under the slots schedule. */
    public SlotAssigner slots() {
        return slots;
    }

    /** The layout as a document: file, title, unsaved mark, undo history, unused species. */
    public ScenarioDocument document() {
        return document;
    }

    /** The shown plan's tables, selection of link and route, and the comparison. */
    public PlanTables tables() {
        return tables;
    }

    /** The background planner: busy flag, futures of the latest preview and exact plan, timings. */
    public PlanScheduler plans() {
        return scheduler;
    }

    public ReadOnlyObjectProperty<Scenario> scenarioProperty() {
        return document.scenarioProperty();
    }

    public ReadOnlyStringProperty messageProperty() {
        return document.messageProperty();
    }

    /** log2(levels): the most a symbol can carry, the top of the colour scale. */
    public ReadOnlyDoubleProperty maxCapacityBitsProperty() {
        return maxCapacity.getReadOnlyProperty();
    }

    /** The selected route's hops, bottleneck, advice and shared rate as text ({@link RouteSummary}). */
    public ObservableStringValue routeSummary() {
        return routeSummary;
    }

    /** The scenario-wide settings editor, reloaded from the layout after every change. */
    public ScenarioSettings settings() {
        return settings;
    }

    /** Names a node may use: the layout's species, then the unused ones. */
    public ObservableList<String> speciesNames() {
        return FXCollections.unmodifiableObservableList(speciesNames);
    }
}
