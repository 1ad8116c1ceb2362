package dev.nanoplan.desktop;

import dev.nanoplan.geometry.Vec3;
import dev.nanoplan.geometry.Volume;
import dev.nanoplan.plan.BudgetReport;
import dev.nanoplan.plan.LinkReport;
import dev.nanoplan.plan.Plan;
import dev.nanoplan.plan.RouteReport;
import dev.nanoplan.scenario.Demand;
import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.Role;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.ScenarioException;
import dev.nanoplan.scenario.ScenarioReader;
import dev.nanoplan.scenario.ScenarioWriter;
import dev.nanoplan.scenario.Species;
import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Objects;
import java.util.Set;
import java.util.concurrent.CompletableFuture;
import java.util.concurrent.Executor;
import java.util.concurrent.Executors;
import java.util.concurrent.ScheduledExecutorService;
import java.util.concurrent.ScheduledFuture;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicLong;
import java.util.function.UnaryOperator;
import javafx.application.Platform;
import javafx.beans.property.BooleanProperty;
import javafx.beans.property.ObjectProperty;
import javafx.beans.property.ReadOnlyBooleanProperty;
import javafx.beans.property.ReadOnlyBooleanWrapper;
import javafx.beans.property.ReadOnlyObjectProperty;
import javafx.beans.property.ReadOnlyObjectWrapper;
import javafx.beans.property.ReadOnlyStringProperty;
import javafx.beans.property.ReadOnlyStringWrapper;
import javafx.beans.property.SimpleBooleanProperty;
import javafx.beans.property.SimpleObjectProperty;
import javafx.beans.property.SimpleStringProperty;
import javafx.beans.property.StringProperty;
import javafx.collections.FXCollections;
import javafx.collections.ObservableList;

/**
 * State and commands of the desktop planner (the ViewModel of MVVM). It holds the current layout,
 * its plan, the selection and the inspector fields as JavaFX properties; every edit goes through
 * {@link #edit}, which builds the new {@link Scenario} (whose constructor validates the whole
 * layout), refuses invalid results with a message, records undo, and schedules a plan.
 *
 * <p>Planning runs on a background executor, debounced (a new edit within the delay replaces the
 * pending one) and cancellable; results are applied through the {@code uiThread} executor
 * (Platform.runLater in the application, a direct executor in tests) and dropped when a newer
 * edit has been made. Never touches a control, so it is tested without a window.
 *
 * <p>Progressive update: after each edit the service's {@link PlanService#preview fast preview} is
 * computed first (on the preview executor, after a much shorter debounce) and applied with
 * {@link #previewShownProperty()} true, so the view can mark it ("preview — exact plan running");
 * the exact plan then replaces it and clears the flag. A preview never replaces the exact plan of
 * the same layout (it is dropped when it comes late), the budgets table keeps the last exact
 * budgets while a preview is shown (a preview has none), and a newer edit drops and cancels both.
 *
 * <p>Threading: all methods except {@link #planned()} are called on the UI thread.
 */
public final class PlannerViewModel {

    /** Default debounce between the last edit and the start of planning. */
    public static final long DEFAULT_DEBOUNCE_MS = 150;
    /** Default debounce before the preview: none (edits come from drops and typed values, not every mouse move). */
    public static final long DEFAULT_PREVIEW_DEBOUNCE_MS = 0;

    private final PlanService service;
    private final Executor uiThread;
    private final ScheduledExecutorService background;
    private final long debounceMs;

    private final ReadOnlyObjectWrapper<Scenario> scenario = new ReadOnlyObjectWrapper<>();
    private final ReadOnlyObjectWrapper<Plan> plan = new ReadOnlyObjectWrapper<>();
    private final ReadOnlyObjectWrapper<Plan> baseline = new ReadOnlyObjectWrapper<>();
    private final javafx.beans.property.ReadOnlyDoubleWrapper maxCapacity =
            new javafx.beans.property.ReadOnlyDoubleWrapper(1.0);
    private final ReadOnlyBooleanWrapper busy = new ReadOnlyBooleanWrapper(false);
    private final ReadOnlyBooleanWrapper previewShown = new ReadOnlyBooleanWrapper(false);
    private final ReadOnlyBooleanWrapper dirty = new ReadOnlyBooleanWrapper(false);
    private final ReadOnlyStringWrapper message = new ReadOnlyStringWrapper("");
    private final ReadOnlyObjectWrapper<Path> file = new ReadOnlyObjectWrapper<>();
    private final ReadOnlyStringWrapper title = new ReadOnlyStringWrapper("nanoplan");
    private final StringProperty selectedNodeId = new SimpleStringProperty();
    private final ObjectProperty<LinkReport> selectedLink = new SimpleObjectProperty<>();
    private final ObjectProperty<RouteReport> selectedRoute = new SimpleObjectProperty<>();
    private final BooleanProperty showRoutesOnly = new SimpleBooleanProperty(false);
    private final ObservableList<LinkReport> links = FXCollections.observableArrayList();
    private final ObservableList<RouteReport> routes = FXCollections.observableArrayList();
    private final ObservableList<BudgetReport> budgets = FXCollections.observableArrayList();
    private final ObservableList<String> warnings = FXCollections.observableArrayList();
    private final ObservableList<DemandComparison> comparison = FXCollections.observableArrayList();
    private final NodeInspector inspector = new NodeInspector();
    private final ScenarioSettings settings = new ScenarioSettings();
    private final ObservableList<Species> unusedSpecies = FXCollections.observableArrayList();
    private final ObservableList<String> speciesNames = FXCollections.observableArrayList();
    private final UndoStack undo = new UndoStack();
    private final RecentFiles recent;

    private final AtomicLong generation = new AtomicLong();
    private ScheduledFuture<?> pending;
    private ScheduledFuture<?> pendingPreview;
    private volatile CompletableFuture<Plan> planned = new CompletableFuture<>();
    private volatile CompletableFuture<Plan> previewed = new CompletableFuture<>();
    private final Object planLock = new Object();
    private volatile long lastPlanNanos = -1;
    private volatile long lastPreviewNanos = -1;
    private final ScheduledExecutorService previewBackground;
    private final long previewDebounceMs;

    /**
     * @param service    the planner
     * @param uiThread   where results are applied (the FX thread in the application)
     * @param background where plans are computed
     * @param debounceMs delay after the last edit before planning starts, ≥ 0
     * @param recent     recent-files store
     */
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
        this.previewBackground = Objects.requireNonNull(previewBackground, "previewBackground");
        if (previewDebounceMs < 0) {
            throw new IllegalArgumentException("previewDebounceMs must be >= 0, got " + previewDebounceMs);
        }
        this.previewDebounceMs = previewDebounceMs;
        this.service = Objects.requireNonNull(service, "service");
        this.uiThread = Objects.requireNonNull(uiThread, "uiThread");
        this.background = Objects.requireNonNull(background, "background");
        if (debounceMs < 0) {
            throw new IllegalArgumentException("debounceMs must be >= 0, got " + debounceMs);
        }
        this.debounceMs = debounceMs;
        this.recent = Objects.requireNonNull(recent, "recent");
        selectedNodeId.addListener((o, a, b) -> inspector.load(b == null ? null : nodeById(b)));
        file.addListener((o, a, b) -> refreshTitle());
        dirty.addListener((o, a, b) -> refreshTitle());
        scenario.addListener((o, a, b) -> refreshTitle());
    }

    /**
     * The application's view model: real planner, FX thread for results, 150 ms debounce for the
     * exact plan, previews at once on their own thread.
     */
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
        return Executors.newSingleThreadScheduledExecutor(r -> {
            Thread t = new Thread(r, name);
            t.setDaemon(true);
            return t;
        });
    }

    // ---------------------------------------------------------------- files

    /** Opens a scenario file; on failure keeps the current layout and shows why. */
    public boolean open(Path path) {
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

    /** Starts from an in-memory layout (a template or a generated swarm), not yet saved. */
    public void load(Scenario s, Path from) {
        undo.clear();
        file.set(from);
        selectedNodeId.set(null);
        selectedLink.set(null);
        selectedRoute.set(null);
        // the message comes before the plan is scheduled, so a fast planning failure is not overwritten
        message.set(from == null ? "new layout" : "opened " + from.getFileName());
        unusedSpecies.clear();
        settingsKey = null; // another layout: the settings editor always starts from the file
        setScenario(s);
        dirty.set(false);
    }

    /** Saves to the current file (atomic). False when there is no file yet or writing failed. */
    public boolean save() {
        return file.get() != null && saveAs(file.get());
    }

    /**
     * Writes the HTML report of the current plan (the same page as {@code nanoplan plan --out})
     * atomically. False, with a message, when there is no plan yet or writing failed.
     */
    public boolean exportHtml(Path path) {
        dev.nanoplan.plan.Plan p = plan.get();
        if (p == null || previewShown.get()) {
            message.set(p == null ? "no plan to export yet" : "the exact plan is still running: export when it is shown");
            return false;
        }
        try {
            dev.nanoplan.io.AtomicFiles.write(path,
                    dev.nanoplan.report.PlanHtml.render(p).getBytes(java.nio.charset.StandardCharsets.UTF_8));
        } catch (IOException e) {
            message.set("cannot export " + path + ": " + e.getMessage());
            return false;
        }
        message.set("exported " + path.getFileName());
        return true;
    }

    /** Saves to {@code path} atomically and makes it the current file. */
    public boolean saveAs(Path path) {
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
        dirty.set(false);
        recent.add(path);
        message.set("saved " + path.getFileName() + (unusedSpecies.isEmpty() ? ""
                : " (species no node uses are not saved: "
                        + String.join(", ", unusedSpecies.stream().map(Species::name).toList()) + ")"));
        return true;
    }

    // ---------------------------------------------------------------- edits

    /**
     * Applies an edit. The function builds the new layout from the current one; if it throws
     * {@link IllegalArgumentException} (the core's validation) the edit is refused, the layout
     * stays as it was and {@link #messageProperty()} says why.
     *
     * @return whether the edit was applied
     */
    public boolean edit(String label, UnaryOperator<Scenario> change) {
        Scenario before = scenario.get();
        if (before == null) {
            message.set(label + " refused: no layout open");
            return false;
        }
        Scenario after;
        try {
            after = change.apply(before);
        } catch (IllegalArgumentException e) {
            message.set(label + " refused: " + e.getMessage());
            return false;
        }
        if (after == null) {
            return false;
        }
        // species no node uses any more stay declared in the editor, beside the layout
        List<Species> unusedAfter = new ArrayList<>();
        Set<String> inLayout = new HashSet<>(after.speciesByName().keySet());
        for (Species sp : declaredSpecies(before)) {
            if (inLayout.add(sp.name())) {
                unusedAfter.add(sp);
            }
        }
        return commit(label, before, after, unusedAfter);
    }

    /** Records and shows an edit of the layout and its unused species; false if nothing changed. */
    private boolean commit(String label, Scenario before, Scenario after, List<Species> unusedAfter) {
        List<Species> unusedBefore = List.copyOf(unusedSpecies);
        if (after.equals(before) && unusedAfter.equals(unusedBefore)) {
            return false;
        }
        undo.push(new UndoStack.Edit(label, before, after, unusedBefore, unusedAfter));
        unusedSpecies.setAll(unusedAfter);
        setScenario(after);
        dirty.set(true);
        message.set(label);
        return true;
    }

    /** The layout's species followed by the unused ones declared in the editor. */
    private List<Species> declaredSpecies(Scenario s) {
        List<Species> all = new ArrayList<>(s.species());
        all.addAll(unusedSpecies);
        return all;
    }

    /** Undoes the last edit; false when there is none. */
    public boolean undo() {
        UndoStack.Edit e = undo.undo();
        if (e == null) {
            return false;
        }
        unusedSpecies.setAll(e.unusedBefore());
        setScenario(e.before());
        dirty.set(true);
        message.set("undid " + e.label());
        return true;
    }

    /** Redoes the last undone edit; false when there is none. */
    public boolean redo() {
        UndoStack.Edit e = undo.redo();
        if (e == null) {
            return false;
        }
        unusedSpecies.setAll(e.unusedAfter());
        setScenario(e.after());
        dirty.set(true);
        message.set("redid " + e.label());
        return true;
    }

    /** Replaces the node {@code id} by {@code node} (which may carry a new id; demands follow it). */
    public boolean replaceNode(String id, Node node) {
        return edit("edit " + id, s -> {
            List<Node> nodes = new ArrayList<>(s.nodes());
            int i = indexOf(nodes, id);
            nodes.set(i, node);
            List<Demand> demands = s.demands().stream()
                    .map(d -> new Demand(d.from().equals(id) ? node.id() : d.from(), d.to().equals(id) ? node.id() : d.to()))
                    .toList();
            return with(s, nodes, demands);
        }) && reselect(node.id());
    }

    /**
     * Applies the settings panel's fields (medium and flow, signalling, species added, renamed,
     * edited or removed) as one undoable edit; the plan is recomputed. A malformed or
     * out-of-range field is refused with a one-line message naming it and changes nothing;
     * settings equal to the current ones are not an edit.
     *
     * @return whether the layout (or its unused species) changed
     */
    public boolean applySettings() {
        String label = "edit settings";
        Scenario before = scenario.get();
        if (before == null) {
            message.set(label + " refused: no layout open");
            return false;
        }
        ScenarioSettings.Applied applied;
        try {
            applied = settings.apply(before, unusedSpecies);
        } catch (IllegalArgumentException e) {
            message.set(label + " refused: " + e.getMessage());
            return false;
        }
        boolean ok = commit(label, before, applied.scenario(), applied.unusedSpecies());
        if (!ok) {
            message.set("settings unchanged");
        }
        return ok;
    }

    /**
     * Removes a species row from the settings editor (the species leaves on Apply). Refused, with a
     * one-line message naming the nodes that still use it, when nodes use it; nothing changes then.
     *
     * @return whether the row was removed
     */
    public boolean removeSpecies(ScenarioSettings.SpeciesRow row) {
        try {
            settings.removeSpecies(row);
        } catch (IllegalArgumentException e) {
            message.set("remove species refused: " + e.getMessage());
            return false;
        }
        message.set("species " + row.name() + " will be removed on Apply");
        return true;
    }

    /** Applies the inspector's fields to the selected node. */
    public boolean applyInspector() {
        String id = selectedNodeId.get();
        if (id == null) {
            message.set("select a node first");
            return false;
        }
        Node n;
        try {
            n = inspector.toNode();
        } catch (IllegalArgumentException e) {
            message.set("edit " + id + " refused: " + e.getMessage());
            return false;
        }
        return replaceNode(id, n);
    }

    /** Moves a node to a new centre. */
    public boolean moveNode(String id, Vec3 positionUm) {
        Node n = nodeById(id);
        if (n == null) {
            return false;
        }
        boolean ok = edit("move " + id, s -> replace(s, id, new Node(n.id(), n.role(), positionUm, n.radiusUm(),
                n.species(), n.emitsSpecies(), n.moleculesPerSymbol())));
        if (ok) {
            inspector.load(nodeById(id));
        }
        return ok;
    }

    /** Adds a node of the given role at the first free place near the volume's centre. */
    public boolean addNode(Role role) {
        Scenario s = scenario.get();
        if (s == null) {
            return false;
        }
        String id = freshId(s, role == Role.TRANSMITTER ? "tx" : role == Role.RECEIVER ? "rx" : "relay");
        String sp = s.species().get(0).name();
        long molecules = role.emits() ? 1000 : 0;
        double r = 2.0;
        Vec3 centre = centre(s.volume(), s.nodes());
        Node proto = new Node(id, role, centre, r, sp, sp, molecules);
        return placeNear(s, proto, centre, "add " + id) && reselect(id);
    }

    /** Copies the node {@code id} to a free place beside it. */
    public boolean duplicateNode(String id) {
        Scenario s = scenario.get();
        Node n = nodeById(id);
        if (s == null || n == null) {
            return false;
        }
        String copyId = freshId(s, id + "-copy");
        Node proto = new Node(copyId, n.role(), n.positionUm(), n.radiusUm(), n.species(), n.emitsSpecies(),
                n.moleculesPerSymbol());
        return placeNear(s, proto, n.positionUm(), "duplicate " + id) && reselect(copyId);
    }

    /** Deletes a node and the demands that name it. */
    public boolean deleteNode(String id) {
        boolean ok = edit("delete " + id, s -> {
            List<Node> nodes = new ArrayList<>(s.nodes());
            nodes.remove(indexOf(nodes, id));
            List<Demand> demands = s.demands().stream().filter(d -> !d.from().equals(id) && !d.to().equals(id))
                    .toList();
            return with(s, nodes, demands);
        });
        if (ok) {
            selectedNodeId.set(null);
        }
        return ok;
    }

    /** Adds a demand from → to. */
    public boolean addDemand(String from, String to) {
        return edit("add demand " + from + " → " + to, s -> {
            List<Demand> demands = new ArrayList<>(s.demands());
            demands.add(new Demand(from, to));
            return with(s, s.nodes(), demands);
        });
    }

    /** Removes the demand from → to. */
    public boolean removeDemand(String from, String to) {
        return edit("remove demand " + from + " → " + to, s -> with(s, s.nodes(),
                s.demands().stream().filter(d -> !(d.from().equals(from) && d.to().equals(to))).toList()));
    }

    // ---------------------------------------------------------------- planning

    /** Cancels the pending or running plan (its result will be dropped). */
    public void cancelPlan() {
        generation.incrementAndGet();
        if (pending != null) {
            pending.cancel(true);
        }
        if (pendingPreview != null) {
            pendingPreview.cancel(true);
        }
        busy.set(false);
        message.set("planning cancelled");
    }

    /**
     * Completes with the plan of the latest requested layout once it has been applied (or
     * exceptionally when planning failed). Safe from any thread.
     */
    public CompletableFuture<Plan> planned() {
        return planned;
    }

    /** Wall time of the last plan computation in nanoseconds (−1 before the first). */
    public long lastPlanNanos() {
        return lastPlanNanos;
    }

    /**
     * Completes with the preview of the latest requested layout once it has been applied; stays
     * incomplete when the service has no preview or the exact plan came first. Safe from any thread.
     */
    public CompletableFuture<Plan> previewed() {
        return previewed;
    }

    /** Wall time of the last preview computation in nanoseconds (−1 before the first). */
    public long lastPreviewNanos() {
        return lastPreviewNanos;
    }

    /** Keeps the current plan for side-by-side comparison. */
    public void keepForComparison() {
        if (previewShown.get()) {
            // a preview is not a design's result: keep this layout's exact plan when it arrives
            Scenario kept = scenario.get();
            message.set("will keep the current design when its exact plan is ready");
            planned().thenAccept(p -> {
                if (p.scenario().equals(kept)) {
                    baseline.set(p);
                    refreshComparison();
                    message.set("kept the current design for comparison");
                } else {
                    message.set("the layout changed before its exact plan was ready: nothing kept");
                }
            });
            return;
        }
        baseline.set(plan.get());
        refreshComparison();
        message.set(plan.get() == null ? "nothing to keep yet" : "kept the current design for comparison");
    }

    /** The settings-relevant parts of the layout last loaded into the settings editor. */
    private List<Object> settingsKey;

    private void setScenario(Scenario s) {
        maxCapacity.set(Math.log(s.signalling().levels()) / Math.log(2));
        // planning starts before the listeners of the new layout (the 3D scene) rebuild, so the preview
        // is computed while the UI thread redraws; its result is applied through uiThread afterwards
        schedulePlan(s);
        scenario.set(s);
        // what the settings editor shows; a move leaves it alone, so the editor (and any unapplied
        // typing in it) is not rebuilt on every drag
        List<Object> key = List.of(s.medium(), s.signalling(), s.species(), List.copyOf(unusedSpecies),
                s.nodes().stream().map(n -> n.id() + '\u0000' + n.species() + '\u0000' + n.emitsSpecies()).toList());
        if (!key.equals(settingsKey)) {
            settingsKey = key;
            settings.load(s, unusedSpecies);
            speciesNames.setAll(declaredSpecies(s).stream().map(Species::name).toList());
        }
        String sel = selectedNodeId.get();
        if (sel != null && nodeById(sel) == null) {
            selectedNodeId.set(null);
        } else if (sel != null) {
            inspector.load(nodeById(sel));
        }
    }

    private void schedulePlan(Scenario s) {
        long gen;
        CompletableFuture<Plan> target;
        // the generation and the future move together, and results are published under the same
        // lock, so a plan of an older layout can never complete the future of a newer one
        CompletableFuture<Plan> previewTarget;
        synchronized (planLock) {
            gen = generation.incrementAndGet();
            if (planned.isDone()) {
                planned = new CompletableFuture<>();
            }
            target = planned;
            if (previewed.isDone()) {
                previewed = new CompletableFuture<>();
            }
            previewTarget = previewed;
        }
        if (pending != null) {
            pending.cancel(true);
        }
        if (pendingPreview != null) {
            pendingPreview.cancel(true);
        }
        busy.set(true);
        pendingPreview = previewBackground.schedule(() -> {
            if (Thread.currentThread().isInterrupted() || gen != generation.get()) {
                return;
            }
            Plan p;
            long t0 = System.nanoTime();
            try {
                p = service.preview(s);
            } catch (RuntimeException e) {
                return; // the exact plan reports failures
            }
            long dt = System.nanoTime() - t0;
            if (p == null) {
                return;
            }
            uiThread.execute(() -> {
                synchronized (planLock) {
                    if (gen == generation.get() && !target.isDone()) {
                        lastPreviewNanos = dt;
                        applyPlan(p, true);
                        previewTarget.complete(p);
                    }
                }
            });
        }, previewDebounceMs, TimeUnit.MILLISECONDS);
        pending = background.schedule(() -> {
            if (Thread.currentThread().isInterrupted() || gen != generation.get()) {
                return;
            }
            try {
                long t0 = System.nanoTime();
                Plan p = service.plan(s);
                long dt = System.nanoTime() - t0;
                uiThread.execute(() -> {
                    synchronized (planLock) {
                        if (gen == generation.get()) {
                            lastPlanNanos = dt;
                            applyPlan(p, false);
                            busy.set(false);
                            target.complete(p);
                        }
                    }
                });
            } catch (RuntimeException | Error e) {
                uiThread.execute(() -> {
                    synchronized (planLock) {
                        if (gen == generation.get()) {
                            busy.set(false);
                            message.set("planning failed: " + e.getMessage());
                            target.completeExceptionally(e);
                        }
                    }
                });
            }
        }, debounceMs, TimeUnit.MILLISECONDS);
    }

    private void applyPlan(Plan p, boolean preview) {
        LinkReport oldLink = selectedLink.get();
        RouteReport oldRoute = selectedRoute.get();
        previewShown.set(preview);
        plan.set(p);
        links.setAll(p.links());
        routes.setAll(p.routes());
        if (!preview) {
            budgets.setAll(p.budgets());
        }
        warnings.setAll(p.warnings());
        selectedLink.set(oldLink == null ? null : findLink(oldLink.from(), oldLink.to()));
        selectedRoute.set(oldRoute == null ? null
                : p.routes().stream().filter(r -> r.from().equals(oldRoute.from()) && r.to().equals(oldRoute.to()))
                        .findFirst().orElse(null));
        refreshComparison();
    }

    private void refreshComparison() {
        comparison.setAll(DemandComparison.of(baseline.get(), plan.get()));
    }

    // ---------------------------------------------------------------- selection

    /** Selects the link from → to of the current plan (null clears). */
    public void selectLink(String from, String to) {
        selectedLink.set(from == null ? null : findLink(from, to));
    }

    /** The link from → to of the current plan, or null. */
    public LinkReport findLink(String from, String to) {
        return links.stream().filter(l -> l.from().equals(from) && l.to().equals(to)).findFirst().orElse(null);
    }

    /**
     * The rate of this route of the current plan when the demands sharing an emitter time-share its
     * stream ({@link dev.nanoplan.plan.SharedRates}), or null when the route is not in the plan.
     */
    public dev.nanoplan.plan.SharedRates.Share sharedRate(RouteReport route) {
        Plan p = plan.get();
        if (p == null) {
            return null;
        }
        if (p != sharesPlan) {
            java.util.Map<RouteReport, dev.nanoplan.plan.SharedRates.Share> m = new java.util.IdentityHashMap<>();
            List<dev.nanoplan.plan.SharedRates.Share> all = dev.nanoplan.plan.SharedRates.of(p);
            for (int i = 0; i < all.size(); i++) {
                m.put(p.routes().get(i), all.get(i));
            }
            shares = m;
            sharesPlan = p;
        }
        return shares.get(route);
    }

    private Plan sharesPlan;
    private java.util.Map<RouteReport, dev.nanoplan.plan.SharedRates.Share> shares = java.util.Map.of();

    /** The node with this id in the current layout, or null. */
    public Node nodeById(String id) {
        Scenario s = scenario.get();
        if (s == null || id == null) {
            return null;
        }
        for (Node n : s.nodes()) {
            if (n.id().equals(id)) {
                return n;
            }
        }
        return null;
    }

    /** Largest capacity a symbol can carry in this layout: log2(levels) bits. */
    public double maxCapacityBits() {
        Scenario s = scenario.get();
        return s == null ? 1.0 : Math.log(s.signalling().levels()) / Math.log(2);
    }

    // ---------------------------------------------------------------- helpers

    private boolean reselect(String id) {
        selectedNodeId.set(null);
        selectedNodeId.set(id);
        return true;
    }

    private boolean placeNear(Scenario s, Node proto, Vec3 around, String label) {
        double step = Math.max(3 * proto.radiusUm(), 5);
        String lastProblem = "";
        for (int ring = 0; ring < 12; ring++) {
            for (int k = ring == 0 ? 0 : 1; k < (ring == 0 ? 1 : DIRECTIONS.length); k++) {
                Vec3 dir = DIRECTIONS[k];
                Vec3 p = new Vec3(around.x() + dir.x() * step * ring, around.y() + dir.y() * step * ring,
                        around.z() + dir.z() * step * ring);
                Node n = new Node(proto.id(), proto.role(), p, proto.radiusUm(), proto.species(), proto.emitsSpecies(),
                        proto.moleculesPerSymbol());
                try {
                    List<Node> nodes = new ArrayList<>(s.nodes());
                    nodes.add(n);
                    with(s, nodes, s.demands());
                } catch (IllegalArgumentException e) {
                    lastProblem = e.getMessage();
                    continue;
                }
                return edit(label, cur -> {
                    List<Node> nodes = new ArrayList<>(cur.nodes());
                    nodes.add(n);
                    return with(cur, nodes, cur.demands());
                });
            }
        }
        message.set(label + " refused: no free place found (" + lastProblem + ")");
        return false;
    }

    private static final Vec3[] DIRECTIONS = directions();

    private static Vec3[] directions() {
        List<Vec3> d = new ArrayList<>();
        d.add(Vec3.ZERO);
        for (int x = -1; x <= 1; x++) {
            for (int y = -1; y <= 1; y++) {
                for (int z = -1; z <= 1; z++) {
                    if (x != 0 || y != 0 || z != 0) {
                        double n = Math.sqrt(x * x + y * y + z * z);
                        d.add(new Vec3(x / n, y / n, z / n));
                    }
                }
            }
        }
        return d.toArray(Vec3[]::new);
    }

    static Vec3 centre(Volume v, List<Node> nodes) {
        if (v instanceof Volume.Box b) {
            return new Vec3((b.minUm().x() + b.maxUm().x()) / 2, (b.minUm().y() + b.maxUm().y()) / 2,
                    (b.minUm().z() + b.maxUm().z()) / 2);
        }
        if (v instanceof Volume.Cylinder c) {
            return new Vec3(c.lengthUm() / 2, 0, 0);
        }
        double x = 0;
        double y = 0;
        double z = 0;
        for (Node n : nodes) {
            x += n.positionUm().x();
            y += n.positionUm().y();
            z += n.positionUm().z();
        }
        int k = Math.max(1, nodes.size());
        return new Vec3(x / k, y / k, z / k);
    }

    private static String freshId(Scenario s, String base) {
        Set<String> ids = new HashSet<>();
        s.nodes().forEach(n -> ids.add(n.id()));
        if (!ids.contains(base)) {
            return base;
        }
        for (int i = 2;; i++) {
            if (!ids.contains(base + i)) {
                return base + i;
            }
        }
    }

    private static int indexOf(List<Node> nodes, String id) {
        for (int i = 0; i < nodes.size(); i++) {
            if (nodes.get(i).id().equals(id)) {
                return i;
            }
        }
        throw new IllegalArgumentException("no node '" + id + "'");
    }

    private Scenario replace(Scenario s, String id, Node n) {
        List<Node> nodes = new ArrayList<>(s.nodes());
        nodes.set(indexOf(nodes, id), n);
        return with(s, nodes, s.demands());
    }

    /**
     * The same scenario with other nodes and demands; the constructor validates the result. Its
     * species are the declared ones (the layout's and the editor's unused ones, in that order) that
     * the nodes use, so a node can take up an unused species and a species no node uses any more
     * moves out of the layout (it stays declared as unused, see {@link #edit}).
     */
    Scenario with(Scenario s, List<Node> nodes, List<Demand> demands) {
        Set<String> used = new HashSet<>();
        nodes.forEach(n -> {
            used.add(n.species());
            used.add(n.emitsSpecies());
        });
        Set<String> seen = new HashSet<>();
        List<Species> species = declaredSpecies(s).stream()
                .filter(sp -> used.contains(sp.name()) && seen.add(sp.name())).toList();
        return new Scenario(s.name(), s.volume(), s.medium(), species, s.signalling(), nodes, demands,
                s.targets());
    }

    private void refreshTitle() {
        Scenario s = scenario.get();
        String name = file.get() != null ? file.get().getFileName().toString()
                : s != null ? (s.name().isBlank() ? "untitled" : s.name()) : "";
        title.set((dirty.get() ? "• " : "") + (name.isEmpty() ? "" : name + " — ") + "nanoplan");
    }

    // ---------------------------------------------------------------- properties

    public ReadOnlyObjectProperty<Scenario> scenarioProperty() {
        return scenario.getReadOnlyProperty();
    }

    /** The service that makes this view model's plans. */
    PlanService planService() {
        return service;
    }

    public ReadOnlyObjectProperty<Plan> planProperty() {
        return plan.getReadOnlyProperty();
    }

    public ReadOnlyObjectProperty<Plan> baselineProperty() {
        return baseline.getReadOnlyProperty();
    }

    /** log2(levels): the most a symbol can carry, the top of the colour scale. */
    public javafx.beans.property.ReadOnlyDoubleProperty maxCapacityBitsProperty() {
        return maxCapacity.getReadOnlyProperty();
    }

    public ReadOnlyBooleanProperty busyProperty() {
        return busy.getReadOnlyProperty();
    }

    /** True while the plan shown is a fast preview and the exact plan is still to come. */
    public ReadOnlyBooleanProperty previewShownProperty() {
        return previewShown.getReadOnlyProperty();
    }

    public ReadOnlyBooleanProperty dirtyProperty() {
        return dirty.getReadOnlyProperty();
    }

    public ReadOnlyStringProperty messageProperty() {
        return message.getReadOnlyProperty();
    }

    public ReadOnlyObjectProperty<Path> fileProperty() {
        return file.getReadOnlyProperty();
    }

    public ReadOnlyStringProperty titleProperty() {
        return title.getReadOnlyProperty();
    }

    public StringProperty selectedNodeIdProperty() {
        return selectedNodeId;
    }

    public ObjectProperty<LinkReport> selectedLinkProperty() {
        return selectedLink;
    }

    public ObjectProperty<RouteReport> selectedRouteProperty() {
        return selectedRoute;
    }

    public BooleanProperty showRoutesOnlyProperty() {
        return showRoutesOnly;
    }

    public ObservableList<LinkReport> links() {
        return links;
    }

    public ObservableList<RouteReport> routes() {
        return routes;
    }

    public ObservableList<BudgetReport> budgets() {
        return budgets;
    }

    public ObservableList<String> warnings() {
        return warnings;
    }

    public ObservableList<DemandComparison> comparison() {
        return comparison;
    }

    public ObservableList<Path> recentFiles() {
        return recent.files();
    }

    public NodeInspector inspector() {
        return inspector;
    }

    /** The scenario-wide settings editor, reloaded from the layout after every change. */
    public ScenarioSettings settings() {
        return settings;
    }

    /**
     * Species declared in the settings editor that no node uses yet. They cannot be part of a
     * valid {@link Scenario} (nor of a file), so they are kept here, undone and redone with the
     * layout, and join it as soon as a node uses them.
     */
    public ObservableList<Species> unusedSpecies() {
        return FXCollections.unmodifiableObservableList(unusedSpecies);
    }

    /** Names a node may use: the layout's species, then the unused ones. */
    public ObservableList<String> speciesNames() {
        return FXCollections.unmodifiableObservableList(speciesNames);
    }

    public UndoStack undoStack() {
        return undo;
    }

    /** Shows a message in the status line (e.g. from the view's file dialogs). */
    public void say(String text) {
        message.set(text);
    }
}
