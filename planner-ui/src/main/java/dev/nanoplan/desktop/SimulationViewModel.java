package dev.nanoplan.desktop;

import dev.nanoplan.plan.PlanOptions;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.sim.ChannelCache;
import dev.nanoplan.sim.ParticleSimulator;
import dev.nanoplan.sim.SimulatedChannel;
import dev.nanoplan.sim.SimulatedChannelMatrix;
import dev.nanoplan.sim.SimulationComparison;
import dev.nanoplan.sim.SimulationSettings;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.Objects;
import java.util.concurrent.CompletableFuture;
import java.util.concurrent.Executor;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import javafx.application.Platform;
import javafx.beans.property.BooleanProperty;
import javafx.beans.property.ReadOnlyBooleanProperty;
import javafx.beans.property.ReadOnlyBooleanWrapper;
import javafx.beans.property.ReadOnlyDoubleProperty;
import javafx.beans.property.ReadOnlyDoubleWrapper;
import javafx.beans.property.ReadOnlyStringProperty;
import javafx.beans.property.ReadOnlyStringWrapper;
import javafx.beans.property.SimpleBooleanProperty;
import javafx.beans.property.SimpleStringProperty;
import javafx.beans.property.StringProperty;
import javafx.beans.value.ChangeListener;
import javafx.collections.FXCollections;
import javafx.collections.ObservableList;

/**
 * State and commands of the Simulation tab (ViewModel of MVVM): runs planner-core's
 * {@link ParticleSimulator} on the current layout of a {@link PlannerViewModel} in the background,
 * with progress and cancel, and shows per link the closed-form versus simulated hit probability
 * ({@link SimulationComparison}) and the link's capacity in the analytic plan versus the plan on
 * the simulated taps ({@link PlanOptions#withChannel} with {@link SimulatedChannelMatrix}, as
 * {@code nanoplan plan --channel simulated} does). No physics here: every number comes from the core.
 *
 * <p>Life of a run: {@link #run()} validates the settings fields (a bad field is refused with a
 * one-line message naming it, and nothing starts), takes a snapshot of the layout, clears the
 * previous rows and starts the simulation on the {@code background} executor (never the UI
 * thread). Progress (molecules finished / molecules to simulate, 0..1) is coalesced: at most one
 * update is queued on the UI thread at a time and at most one every {@value #PROGRESS_INTERVAL_MS}
 * ms, the last one always. {@link #cancel()} stops the simulator between blocks (or within a block
 * every few hundred steps); a cancelled run shows "cancelled" and no rows at all, never a partial
 * result. When the layout is edited after (or during) a run the rows are marked stale; undoing back
 * to the simulated layout clears the mark. When another layout replaces the current one
 * ({@link #layoutReplaced()}: a file opened, a template loaded) or the window closes
 * ({@link #dispose()}), a run in progress is cancelled, since its result would be dropped.
 *
 * <p>Where the channel and the analytic plan come from (the simulated-channel cache, the planner's
 * exact plan of the same layout) is described at {@link SimulationRun}.
 *
 * <p>Threading: all public methods are called on the UI thread; results are applied through
 * {@code uiThread} (Platform.runLater in the application, a direct executor in tests).
 */
public final class SimulationViewModel {

    /** How a run ended. */
    public enum Outcome {
        /** Rows shown. */
        COMPLETE,
        /** Stopped by {@link #cancel()}; no rows. */
        CANCELLED,
        /** The core failed; the status says why, no rows. */
        FAILED
    }

    /** Largest molecules per emitter the field accepts (counts up to 1e9 stay exact in the core). */
    public static final long MAX_MOLECULES_PER_EMITTER = SimulationFields.MAX_MOLECULES_PER_EMITTER;
    /** Default seed, as in {@code nanoplan simulate}. */
    public static final long DEFAULT_SEED = 1;
    /** Shortest interval between two progress updates queued on the UI thread. */
    static final long PROGRESS_INTERVAL_MS = 50;

    /** Field names as the view labels them; validation messages start with them. */
    public static final String MOLECULES_FIELD = SimulationFields.MOLECULES_FIELD;
    public static final String SEED_FIELD = SimulationFields.SEED_FIELD;
    public static final String TIME_STEP_FIELD = SimulationFields.TIME_STEP_FIELD;

    private static final ExecutorService WORKER = Executors.newSingleThreadExecutor(r -> {
        Thread t = new Thread(r, "nanoplan-simulation");
        t.setDaemon(true);
        return t;
    });

    private final PlannerViewModel planner;
    private final Executor uiThread;
    private final Executor background;
    private final int threads;
    /** Where simulated channels are stored, or null for none. */
    private final ChannelCache cache;
    /** Whether the planner's plans are the core's default analytic plans (so they can be reused). */
    private final boolean reusePlannerPlans;

    private final StringProperty moleculesPerEmitter =
            new SimpleStringProperty(Long.toString(SimulationSettings.DEFAULT_MOLECULES_PER_EMITTER));
    private final StringProperty seed = new SimpleStringProperty(Long.toString(DEFAULT_SEED));
    private final StringProperty timeStepS = new SimpleStringProperty("");
    private final BooleanProperty ignoreCache = new SimpleBooleanProperty(false);
    private final ReadOnlyDoubleWrapper progress = new ReadOnlyDoubleWrapper(0);
    private final ReadOnlyBooleanWrapper running = new ReadOnlyBooleanWrapper(false);
    private final ReadOnlyBooleanWrapper cancelling = new ReadOnlyBooleanWrapper(false);
    private final ReadOnlyBooleanWrapper stale = new ReadOnlyBooleanWrapper(false);
    private final ReadOnlyStringWrapper status = new ReadOnlyStringWrapper("not run yet");
    private final ReadOnlyStringWrapper estimate = new ReadOnlyStringWrapper("");
    private final ObservableList<SimulationRow> rows = FXCollections.observableArrayList();

    /** The run in progress, or null (written on the UI thread, read by workers). */
    private volatile SimulationRun current;
    /** The layout the shown rows belong to, or null when no rows are shown. */
    private Scenario resultScenario;
    private CompletableFuture<Outcome> finished = new CompletableFuture<>();
    private final ChangeListener<Scenario> layoutListener;
    private boolean disposed;
    private boolean lastAnalyticReused;

    /** As the full constructor, with no cache and the analytic plan always computed here. */
    public SimulationViewModel(PlannerViewModel planner, Executor uiThread, Executor background, int threads) {
        this(planner, uiThread, background, threads, null, false);
    }

    /**
     * @param planner           whose current layout is simulated (read only; nothing in it is changed)
     * @param uiThread          where state changes are applied (the FX thread in the application)
     * @param background        where the simulation and the two plans run
     * @param threads           simulator worker threads, ≥ 1 (results do not depend on it)
     * @param cache             where simulated channels are looked up and stored; null for no cache
     * @param reusePlannerPlans true when {@code planner}'s plans are planner-core's default
     *                          analytic plans ({@link PlanService#core()}), so that its exact plan of
     *                          the simulated layout can stand for the analytic plan
     */
    public SimulationViewModel(PlannerViewModel planner, Executor uiThread, Executor background, int threads,
            ChannelCache cache, boolean reusePlannerPlans) {
        this.planner = Objects.requireNonNull(planner, "planner");
        this.uiThread = Objects.requireNonNull(uiThread, "uiThread");
        this.background = Objects.requireNonNull(background, "background");
        if (threads < 1) {
            throw new IllegalArgumentException("threads: must be >= 1, got " + threads);
        }
        this.threads = threads;
        this.cache = cache;
        this.reusePlannerPlans = reusePlannerPlans;
        layoutListener = (o, a, b) -> {
            stale.set(resultScenario != null && !resultScenario.equals(b));
            refreshEstimate();
        };
        planner.scenarioProperty().addListener(layoutListener);
        planner.onLayoutReplaced(() -> {
            if (!disposed) {
                layoutReplaced();
            }
        });
        moleculesPerEmitter.addListener((o, a, b) -> refreshEstimate());
        seed.addListener((o, a, b) -> refreshEstimate());
        timeStepS.addListener((o, a, b) -> refreshEstimate());
        refreshEstimate();
    }

    /**
     * The application's: FX thread for results, one shared daemon thread for runs, all processors,
     * the cache in {@code cacheDir}; the planner's plans are reused when it plans with the core.
     */
    public static SimulationViewModel forApplication(PlannerViewModel planner, Path cacheDir) {
        return new SimulationViewModel(planner, Platform::runLater, WORKER, Runtime.getRuntime().availableProcessors(),
                new ChannelCache(cacheDir), planner.planService() == PlanService.core());
    }

    /**
     * The cache folder {@code nanoplan plan --channel simulated} uses by default:
     * {@code $NANOPLAN_CACHE_DIR}, else {@code ~/.cache/nanoplan/channels}.
     */
    public static Path defaultCacheDirectory() {
        return ChannelCache.defaultDirectory(System.getenv(), System.getProperty("user.home"));
    }

    // ---------------------------------------------------------------- commands

    /**
     * Starts a simulation of the current layout with the fields' settings.
     *
     * @return false, with the reason in {@link #statusProperty()}, when a run is in progress, no
     *     layout is open, the layout has no emitter, or a field is invalid; nothing is started then
     */
    public boolean run() {
        Scenario s = planner.scenarioProperty().get();
        String refused = disposed ? "the window is closing" : current != null ? "a simulation is already running"
                : s == null ? "open a layout first" : null;
        if (refused != null) {
            status.set("not started: " + refused);
            return false;
        }
        SimulationSettings settings;
        SimulationFields.Work work;
        try {
            settings = settings();
            work = SimulationFields.Work.of(s, settings);
        } catch (IllegalArgumentException e) {
            status.set("not started: " + e.getMessage());
            return false;
        }
        if (work.emitters() == 0) {
            status.set("not started: the layout has no transmitter or relay to simulate");
            return false;
        }
        SimulationRun r = new SimulationRun(s, settings, ignoreCache.get());
        current = r;
        finished = r.finished;
        rows.clear();
        resultScenario = null;
        stale.set(false);
        progress.set(0);
        cancelling.set(false);
        running.set(true);
        status.set(String.format(Locale.ROOT, (cache != null && !r.ignoreCache ? "from the cache if stored, else " : "")
                + "simulating %d emitter(s) × %d molecules (seed %d, Δt %s s)…",
                work.emitters(), settings.moleculesPerEmitter(), settings.seed(), Formats.sig(work.timeStepS())));
        background.execute(() -> execute(r));
        return true;
    }

    /** Asks the running simulation to stop; it ends as {@link Outcome#CANCELLED} with no rows. */
    public void cancel() {
        SimulationRun r = current;
        if (r == null || r.cancelled.get()) {
            return;
        }
        r.cancelled.set(true);
        cancelling.set(true);
        status.set("cancelling…");
    }

    /**
     * Another layout replaces the current one (a file opened, a template or swarm loaded): cancels
     * the run in progress (it ends {@link Outcome#CANCELLED}) and clears the rows, which belong to
     * the old layout.
     */
    public void layoutReplaced() {
        cancel();
        if (current == null) {
            rows.clear();
            resultScenario = null;
            stale.set(false);
            progress.set(0);
            status.set("not run yet");
        }
    }

    /**
     * The window is closing: cancels the run in progress (it ends {@link Outcome#CANCELLED}, nothing
     * is cached), refuses new runs and stops following the planner's layout. Idempotent.
     */
    public void dispose() {
        if (disposed) {
            return;
        }
        disposed = true;
        cancel();
        planner.scenarioProperty().removeListener(layoutListener);
    }

    /**
     * Completes when the latest started run has ended and its outcome has been applied to the
     * state (safe from any thread). Before the first run it never completes.
     */
    public CompletableFuture<Outcome> finished() {
        return finished;
    }

    /**
     * The settings the fields describe.
     *
     * @throws IllegalArgumentException with a one-line message starting with the field's name
     */
    public SimulationSettings settings() {
        return SimulationFields.parse(moleculesPerEmitter.get(), seed.get(), timeStepS.get(), threads);
    }

    // ---------------------------------------------------------------- background

    private void execute(SimulationRun r) {
        try {
            SimulationRun.Obtained got = r.obtain(cache, (done, total) -> onProgress(r, done, total));
            SimulatedChannel channel = got.channel();
            if (r.cancelled.get() || !channel.complete()) {
                long total = r.settings.moleculesPerEmitter() * channel.emitters().size();
                uiThread.execute(() -> endCancelled(r, channel.moleculesSimulated(), total));
                return;
            }
            List<SimulationRow> out = r.compare(channel, reusePlannerPlans ? r.reusable(planner.plans().planned()) : null, () -> uiThread.execute(() -> {
                if (current == r && !r.cancelled.get()) {
                    status.set("simulated; planning on the simulated taps…");
                }
            }));
            if (out == null) {
                uiThread.execute(() -> endCancelled(r, channel.moleculesSimulated(), channel.moleculesSimulated()));
                return;
            }
            uiThread.execute(() -> endComplete(r, out, channel, got.source()));
        } catch (RuntimeException | Error e) {
            uiThread.execute(() -> endFailed(r, e));
        }
    }

    /** Called from simulator workers: remembers the fraction and queues at most one UI update. */
    private void onProgress(SimulationRun r, long done, long total) {
        if (r.progress(done, total, PROGRESS_INTERVAL_MS * 1_000_000L)) {
            uiThread.execute(() -> {
                r.progressQueued.set(false);
                if (current == r) {
                    progress.set(r.latest);
                }
            });
        }
    }

    // ---------------------------------------------------------------- endings (UI thread)

    private void endComplete(SimulationRun r, List<SimulationRow> out, SimulatedChannel channel, String source) {
        if (current != r) {
            return;
        }
        if (r.cancelled.get()) {
            endCancelled(r, channel.moleculesSimulated(), channel.moleculesSimulated());
            return;
        }
        current = null;
        progress.set(1);
        rows.setAll(out);
        resultScenario = r.scenario;
        stale.set(!r.scenario.equals(planner.scenarioProperty().get()));
        long flagged = out.stream().filter(SimulationRow::flagged).count();
        status.set(String.format(Locale.ROOT, "done: %d link(s) compared, %d flagged — %s: %d molecules per emitter, "
                + "seed %d, Δt %s s", out.size(), flagged, source, channel.moleculesRequestedPerEmitter(),
                channel.seed(), Formats.sig(channel.timeStepS())));
        cancelling.set(false);
        running.set(false);
        lastAnalyticReused = r.analyticReused;
        r.finished.complete(Outcome.COMPLETE);
    }

    private void endCancelled(SimulationRun r, long done, long total) {
        endWithoutRows(r, String.format(Locale.ROOT, "cancelled after %d of %d molecules; no result shown", done,
                total), Outcome.CANCELLED);
    }

    private void endFailed(SimulationRun r, Throwable e) {
        endWithoutRows(r, "simulation failed: " + (e.getMessage() == null ? e.getClass().getSimpleName()
                : e.getMessage()), Outcome.FAILED);
    }

    private void endWithoutRows(SimulationRun r, String why, Outcome outcome) {
        if (current != r) {
            return;
        }
        current = null;
        rows.clear();
        resultScenario = null;
        stale.set(false);
        progress.set(0);
        status.set(why);
        cancelling.set(false);
        running.set(false);
        r.finished.complete(outcome);
    }

    private void refreshEstimate() {
        Scenario s = planner.scenarioProperty().get();
        if (s == null) {
            estimate.set("open a layout to simulate it");
            return;
        }
        try {
            estimate.set(SimulationFields.estimate(s, settings()));
        } catch (IllegalArgumentException e) {
            estimate.set(e.getMessage());
        }
    }

    // ---------------------------------------------------------------- properties

    /** Whether the last complete run took its analytic plan from the planner (for tests). */
    boolean lastAnalyticReused() {
        return lastAnalyticReused;
    }

    /** The simulated-channel cache, or null when runs are not cached. */
    public ChannelCache cache() {
        return cache;
    }

    /** "Re-simulate": when true, Run simulates even if the cache holds this run, and replaces it. */
    public BooleanProperty ignoreCacheProperty() {
        return ignoreCache;
    }

    /** Molecules each emitter releases (text field). */
    public StringProperty moleculesPerEmitterProperty() {
        return moleculesPerEmitter;
    }

    /** Master seed (text field). */
    public StringProperty seedProperty() {
        return seed;
    }

    /** Time step in s (text field); blank or "auto" = chosen from the geometry. */
    public StringProperty timeStepSProperty() {
        return timeStepS;
    }

    /** Molecules finished / molecules to simulate, 0..1 (1 when rows are shown). */
    public ReadOnlyDoubleProperty progressProperty() {
        return progress.getReadOnlyProperty();
    }

    public ReadOnlyBooleanProperty runningProperty() {
        return running.getReadOnlyProperty();
    }

    /** True between {@link #cancel()} and the end of the run. */
    public ReadOnlyBooleanProperty cancellingProperty() {
        return cancelling.getReadOnlyProperty();
    }

    /** True when the shown rows belong to a layout other than the current one. */
    public ReadOnlyBooleanProperty staleProperty() {
        return stale.getReadOnlyProperty();
    }

    /** One line: what happened last (started, done, cancelled, refused and why, failed). */
    public ReadOnlyStringProperty statusProperty() {
        return status.getReadOnlyProperty();
    }

    /** The work a run would do with the current fields (Δt, steps, molecules), or why it cannot run. */
    public ReadOnlyStringProperty estimateProperty() {
        return estimate.getReadOnlyProperty();
    }

    /** One row per compared link of the last complete run, in emitter then receiver order. */
    public ObservableList<SimulationRow> rows() {
        return rows;
    }
}
