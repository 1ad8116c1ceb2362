package dev.nanoplan.desktop;

import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.Tolerances;
import dev.nanoplan.tolerance.Sampler;
import dev.nanoplan.tolerance.Thresholds;
import dev.nanoplan.tolerance.ToleranceResult;
import dev.nanoplan.tolerance.ToleranceRunner;
import dev.nanoplan.tolerance.ToleranceStudy;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Objects;
import java.util.concurrent.CompletableFuture;
import java.util.concurrent.Executor;
import java.util.concurrent.atomic.AtomicBoolean;
import java.util.concurrent.atomic.AtomicInteger;
import javafx.application.Platform;
import javafx.beans.property.ObjectProperty;
import javafx.beans.property.ReadOnlyBooleanProperty;
import javafx.beans.property.ReadOnlyBooleanWrapper;
import javafx.beans.property.ReadOnlyDoubleProperty;
import javafx.beans.property.ReadOnlyDoubleWrapper;
import javafx.beans.property.ReadOnlyStringProperty;
import javafx.beans.property.ReadOnlyStringWrapper;
import javafx.beans.property.SimpleObjectProperty;
import javafx.beans.property.SimpleStringProperty;
import javafx.beans.property.StringProperty;
import javafx.collections.FXCollections;
import javafx.collections.ObservableList;

/**
 * State and commands of the Tolerance tab (ViewModel of MVVM): runs planner-core's tolerance study
 * ({@link ToleranceStudy}, {@link ToleranceRunner}, as {@code nanoplan tolerance} does) on the current
 * layout in the background, with progress, an estimate of the time left, and Cancel, which returns the
 * samples that finished, marked partial. Shows per link and per demand the yield with its Wilson 95 %
 * interval ({@link ToleranceRow}; weak links first, likeliest failure first), the weak links for the 3D view (cleared when the layout changes), and
 * the capacity histogram of the selected link. No statistics here: every number comes from the core.
 *
 * <p>Tolerances: the fields start from the layout's {@code tolerances} section (its defaults; per-node
 * overrides are kept as they are). A layout without one is said so ({@link #noTolerancesProperty()});
 * {@link #useDemoDefaults()} fills the fields with invented demo values, and {@link #storeInLayout()}
 * writes the fields into the layout as one undoable edit. A run always uses the fields.
 *
 * <p>Threading: public methods on the UI thread; results applied through {@code uiThread}.
 */
public final class ToleranceViewModel {

    /** How a run ended. */
    public enum Outcome { COMPLETE, PARTIAL, CANCELLED, FAILED }

    /** One bar of the capacity histogram: samples whose bits lie in [lowBits, highBits). */
    public record Bin(double lowBits, double highBits, int count) {
    }

    /** A weak link for the 3D view: its failure probability 1 − yield sets the outline's thickness. */
    public record WeakLink(String from, String to, double failureProbability) {
    }

    /** Field labels (as in the scenario file); validation messages start with them. */
    public static final String SAMPLES = "samples";
    public static final String SEED = "seed";
    public static final String POSITION = "position_sd_um";
    public static final String RADIUS = "radius_percent";
    public static final String MOLECULES = "molecules_percent";
    public static final String DIFFUSION = "diffusion_percent";
    public static final String TEMPERATURE = "temperature_K";

    /**
     * Demo spreads offered for a layout without tolerances: invented demo values, the same as the
     * bundled scenarios/culture-tank.json states (not measured fabrication data).
     */
    static final Tolerances DEMO = new Tolerances(new Tolerances.NodeSpread(2.0, 5.0, 10.0), 5.0, 0.5,
            Map.of());
    /** Guard-band samples per step, as {@code nanoplan tolerance}'s default. */
    static final int GUARD_SAMPLES = 20;
    /** Bars of the capacity histogram (fewer when there are few samples). */
    static final int BINS = 20;
    static final long PROGRESS_INTERVAL_MS = 50;

    private static final Executor WORKER = PlannerViewModel.daemonScheduler("nanoplan-tolerance");

    private final PlannerViewModel planner;
    private final Executor uiThread;
    private final Executor background;
    private final int threads;

    private final StringProperty samples = new SimpleStringProperty("1000");
    private final StringProperty seed = new SimpleStringProperty("1");
    private final ObjectProperty<Sampler> sampler = new SimpleObjectProperty<>(Sampler.SOBOL);
    private final ObjectProperty<Thresholds> thresholds = new SimpleObjectProperty<>(Thresholds.DESIGN);
    private final StringProperty position = new SimpleStringProperty("0");
    private final StringProperty radius = new SimpleStringProperty("0");
    private final StringProperty molecules = new SimpleStringProperty("0");
    private final StringProperty diffusion = new SimpleStringProperty("0");
    private final StringProperty temperature = new SimpleStringProperty("0");
    private final ReadOnlyBooleanWrapper noTolerances = new ReadOnlyBooleanWrapper(true);
    private final ReadOnlyBooleanWrapper running = new ReadOnlyBooleanWrapper(false);
    private final ReadOnlyBooleanWrapper stale = new ReadOnlyBooleanWrapper(false);
    private final ReadOnlyDoubleWrapper progress = new ReadOnlyDoubleWrapper(0);
    private final ReadOnlyStringWrapper eta = new ReadOnlyStringWrapper("");
    private final ReadOnlyStringWrapper status = new ReadOnlyStringWrapper("not run yet");
    private final ObservableList<ToleranceRow> links = FXCollections.observableArrayList();
    private final ObservableList<ToleranceRow> demands = FXCollections.observableArrayList();
    private final ObservableList<WeakLink> weakLinks = FXCollections.observableArrayList();
    private final ObjectProperty<ToleranceRow> selectedLink = new SimpleObjectProperty<>();
    private final ObservableList<Bin> histogram = FXCollections.observableArrayList();
    private final ReadOnlyStringWrapper histogramTitle = new ReadOnlyStringWrapper("");

    private volatile Run current;
    private ToleranceResult result;
    private Scenario resultScenario;
    private CompletableFuture<Outcome> finished = new CompletableFuture<>();

    /** The work of one run, shared with its worker. */
    private static final class Run {
        final Scenario scenario;
        final int samples;
        final long startNanos = System.nanoTime();
        final AtomicInteger done = new AtomicInteger();
        final AtomicBoolean queued = new AtomicBoolean();
        final CompletableFuture<Outcome> finished = new CompletableFuture<>();
        volatile ToleranceRunner runner;
        volatile boolean cancelled;
        volatile long lastQueuedNanos;

        Run(Scenario scenario, int samples) {
            this.scenario = scenario;
            this.samples = samples;
        }
    }

    /**
     * @param planner    whose current layout is studied (only {@link #storeInLayout()} edits it)
     * @param uiThread   where state changes are applied (the FX thread in the application)
     * @param background where the study runs
     * @param threads    worker threads of the study, ≥ 1 (the result does not depend on it)
     */
    public ToleranceViewModel(PlannerViewModel planner, Executor uiThread, Executor background, int threads) {
        this.planner = Objects.requireNonNull(planner, "planner");
        this.uiThread = Objects.requireNonNull(uiThread, "uiThread");
        this.background = Objects.requireNonNull(background, "background");
        if (threads < 1) {
            throw new IllegalArgumentException("threads: must be >= 1, got " + threads);
        }
        this.threads = threads;
        planner.scenarioProperty().addListener((o, a, b) -> layoutChanged(a, b));
        selectedLink.addListener((o, a, b) -> refreshHistogram());
        layoutChanged(null, planner.scenarioProperty().get());
    }

    /** The application's: FX thread for results, one shared daemon worker, all processors. */
    public static ToleranceViewModel forApplication(PlannerViewModel planner) {
        return new ToleranceViewModel(planner, Platform::runLater, WORKER, Runtime.getRuntime().availableProcessors());
    }

    // ---------------------------------------------------------------- commands

    /**
     * Starts a study of the current layout with the fields' settings.
     *
     * @return false, with the reason in {@link #statusProperty()}, when a run is in progress, no layout
     *     is open, or a field is invalid (the message names it); nothing starts then
     */
    public boolean run() {
        Scenario s = planner.scenarioProperty().get();
        if (current != null || s == null) {
            status.set("not started: " + (s == null ? "open a layout first" : "a study is already running"));
            return false;
        }
        int n;
        long sd;
        Scenario studied;
        ToleranceStudy study;
        try {
            n = SettingsText.parseInt(SAMPLES, samples.get());
            if (n < 1) {
                throw new IllegalArgumentException(SAMPLES + ": must be >= 1, got " + n);
            }
            sd = SettingsText.parseInt(SEED, seed.get());
            studied = withTolerances(s, tolerances(s));
            study = new ToleranceStudy(studied, sampler.get(), sd, thresholds.get());
        } catch (IllegalArgumentException e) {
            status.set("not started: " + e.getMessage());
            return false;
        }
        Run r = new Run(s, n);
        r.runner = new ToleranceRunner(study, threads, GUARD_SAMPLES);
        current = r;
        finished = r.finished;
        progress.set(0);
        eta.set("");
        running.set(true);
        status.set(String.format(Locale.ROOT, "drawing %,d perturbed layouts (%s, seed %d, %s thresholds)…", n,
                sampler.get().id(), sd, thresholds.get().id()));
        background.execute(() -> execute(r));
        return true;
    }

    /** Stops the study after the samples in progress; the finished ones are shown, marked partial. */
    public void cancel() {
        Run r = current;
        if (r == null || r.cancelled) {
            return;
        }
        r.cancelled = true;
        r.runner.cancel();
        status.set("cancelling: finishing the samples in progress…");
    }

    /** Fills the tolerance fields with the invented demo values ({@link #DEMO}). */
    public void useDemoDefaults() {
        show(DEMO);
    }

    /** Writes the fields into the layout's {@code tolerances} section as one undoable edit. */
    public boolean storeInLayout() {
        Scenario s = planner.scenarioProperty().get();
        if (s == null) {
            status.set("open a layout first");
            return false;
        }
        try {
            Tolerances t = tolerances(s);
            return planner.edit("set tolerances", x -> withTolerances(x, t));
        } catch (IllegalArgumentException e) {
            status.set("not stored: " + e.getMessage());
            return false;
        }
    }

    /** Completes when the latest run has ended and its outcome is shown; never before the first run. */
    public CompletableFuture<Outcome> finished() {
        return finished;
    }

    // ---------------------------------------------------------------- background

    private void execute(Run r) {
        try {
            ToleranceResult res = r.runner.run(r.samples, done -> onProgress(r, done));
            uiThread.execute(() -> end(r, res, null));
        } catch (IllegalStateException none) {
            uiThread.execute(() -> end(r, null, r.cancelled ? null : none));
        } catch (RuntimeException | Error e) {
            uiThread.execute(() -> end(r, null, e));
        }
    }

    /** From worker threads: remembers the count, queues at most one UI update per interval. */
    private void onProgress(Run r, int done) {
        r.done.accumulateAndGet(done, Math::max);
        long now = System.nanoTime();
        boolean last = done >= r.samples;
        if ((last || now - r.lastQueuedNanos >= PROGRESS_INTERVAL_MS * 1_000_000L) && r.queued.compareAndSet(false, true)) {
            r.lastQueuedNanos = now;
            uiThread.execute(() -> {
                r.queued.set(false);
                if (current == r) {
                    showProgress(r);
                }
            });
        }
    }

    private void showProgress(Run r) {
        int d = r.done.get();
        progress.set(d / (double) r.samples);
        double elapsedS = (System.nanoTime() - r.startNanos) / 1e9;
        if (d >= r.samples) {
            eta.set("samples done; sizing the guard bands of the weak links…");
        } else if (d > 0) {
            eta.set(String.format(Locale.ROOT, "%,d of %,d samples · %s s · about %s s left", d, r.samples,
                    Formats.twoDigits(elapsedS), Formats.twoDigits(elapsedS / d * (r.samples - d))));
        }
    }

    // ---------------------------------------------------------------- endings (UI thread)

    private void end(Run r, ToleranceResult res, Throwable error) {
        if (current != r) {
            return;
        }
        current = null;
        running.set(false);
        eta.set("");
        Outcome outcome;
        if (res == null) {
            outcome = error == null ? Outcome.CANCELLED : Outcome.FAILED;
            status.set(error == null ? "cancelled before any sample finished; nothing to show"
                    : "study failed: " + (error.getMessage() == null ? error.getClass().getSimpleName() : error.getMessage()));
        } else {
            show(res, r.scenario);
            outcome = res.partial() ? Outcome.PARTIAL : Outcome.COMPLETE;
            progress.set(res.samples() / (double) r.samples);
            status.set(String.format(Locale.ROOT, "%s: %,d samples, layout yield %s (95 %% interval %s – %s), "
                    + "%d weak link(s), %,d redraws%s", res.partial() ? "partial (cancelled)" : "done", res.samples(),
                    Formats.sig(res.layoutYield()), Formats.sig(res.layoutInterval().get(0)),
                    Formats.sig(res.layoutInterval().get(1)), res.weakLinks().size(), res.redraws(),
                    res.partial() ? "; guard bands not sized" : ""));
        }
        r.finished.complete(outcome);
    }

    private void show(ToleranceResult res, Scenario s) {
        result = res;
        resultScenario = s;
        // weak links first, likeliest failure first; then the others in the plan's order
        List<ToleranceRow> rows = new ArrayList<>();
        for (int l : res.weakLinks()) {
            rows.add(ToleranceRow.of(res.links().get(l), rows.size() + 1));
        }
        for (int l = 0; l < res.links().size(); l++) {
            if (!res.weakLinks().contains(l)) {
                rows.add(ToleranceRow.of(res.links().get(l), 0));
            }
        }
        links.setAll(rows);
        demands.setAll(res.demands().stream().map(ToleranceRow::of).toList());
        List<WeakLink> weak = new ArrayList<>();
        for (int l : res.weakLinks()) {
            ToleranceResult.LinkYield y = res.links().get(l);
            weak.add(new WeakLink(y.from(), y.to(), 1 - y.yield()));
        }
        weakLinks.setAll(weak);
        stale.set(!s.equals(planner.scenarioProperty().get()));
        if (stale.get()) {
            weakLinks.clear();
        }
        selectedLink.set(rows.isEmpty() ? null : rows.get(0));
        refreshHistogram();
    }

    private void layoutChanged(Scenario before, Scenario after) {
        if (after != null && (before == null || !before.tolerances().equals(after.tolerances()))) {
            noTolerances.set(after.tolerances().none());
            show(after.tolerances());
        }
        if (resultScenario != null && !resultScenario.equals(after)) {
            weakLinks.clear(); // the outlines belong to the studied layout
            stale.set(true);
        }
    }

    private void show(Tolerances t) {
        position.set(Formats.field(t.defaults().positionSdUm()));
        radius.set(Formats.field(t.defaults().radiusPercent()));
        molecules.set(Formats.field(t.defaults().moleculesPercent()));
        diffusion.set(Formats.field(t.diffusionPercent()));
        temperature.set(Formats.field(t.temperatureK()));
    }

    private void refreshHistogram() {
        ToleranceRow row = selectedLink.get();
        histogram.clear();
        if (row == null || row.link() == null) {
            histogramTitle.set("Select a link to see its capacity over the samples.");
            return;
        }
        histogram.setAll(bins(row.link().bits(), BINS));
        histogramTitle.set("Capacity of " + row.name() + " over " + row.link().bits().size()
                + " samples (bits per symbol at the operating threshold)");
    }

    /**
     * Equal-width bins over [min, max] of {@code values} (common practice for a histogram), at most
     * {@code max} and about √n of them; a single bin when every value is the same. Counts add up to n.
     */
    static List<Bin> bins(List<Double> values, int max) {
        if (values.isEmpty()) {
            return List.of();
        }
        double lo = values.stream().mapToDouble(Double::doubleValue).min().orElseThrow();
        double hi = values.stream().mapToDouble(Double::doubleValue).max().orElseThrow();
        int k = hi > lo ? Math.max(1, Math.min(max, (int) Math.ceil(Math.sqrt(values.size())))) : 1;
        int[] counts = new int[k];
        double width = (hi - lo) / k;
        for (double v : values) {
            int i = width > 0 ? (int) Math.floor((v - lo) / width) : 0;
            counts[Math.min(k - 1, Math.max(0, i))]++;
        }
        List<Bin> out = new ArrayList<>(k);
        for (int i = 0; i < k; i++) {
            out.add(new Bin(lo + i * width, i == k - 1 ? hi : lo + (i + 1) * width, counts[i]));
        }
        return out;
    }

    /** The fields as tolerances, keeping the layout's per-node overrides. */
    private Tolerances tolerances(Scenario s) {
        Tolerances.NodeSpread d = new Tolerances.NodeSpread(spread(POSITION, position), spread(RADIUS, radius),
                spread(MOLECULES, molecules));
        return new Tolerances(d, spread(DIFFUSION, diffusion), spread(TEMPERATURE, temperature), s.tolerances().nodes());
    }

    private static double spread(String name, StringProperty p) {
        double v = SettingsText.parse(name, p.get());
        if (v < 0) {
            throw new IllegalArgumentException(name + ": must be >= 0, got " + SettingsText.trim(p.get()));
        }
        return v;
    }

    static Scenario withTolerances(Scenario s, Tolerances t) {
        return new Scenario(s.name(), s.volume(), s.medium(), s.species(), s.signalling(), s.nodes(), s.demands(),
                s.targets(), s.candidateSpecies(), t);
    }

    // ---------------------------------------------------------------- properties

    public StringProperty samplesProperty() {
        return samples;
    }

    public StringProperty seedProperty() {
        return seed;
    }

    public ObjectProperty<Sampler> samplerProperty() {
        return sampler;
    }

    public ObjectProperty<Thresholds> thresholdsProperty() {
        return thresholds;
    }

    /** The tolerance fields by file name: position_sd_um, radius_percent, molecules_percent, diffusion_percent, temperature_K. */
    public List<StringProperty> toleranceFields() {
        return List.of(position, radius, molecules, diffusion, temperature);
    }

    /** The labels of {@link #toleranceFields()}, in the same order. */
    public static List<String> toleranceFieldNames() {
        return List.of(POSITION, RADIUS, MOLECULES, DIFFUSION, TEMPERATURE);
    }

    /** True when the layout has no tolerances (or all zero): every sample would be the nominal layout. */
    public ReadOnlyBooleanProperty noTolerancesProperty() {
        return noTolerances.getReadOnlyProperty();
    }

    public ReadOnlyBooleanProperty runningProperty() {
        return running.getReadOnlyProperty();
    }

    /** True when the shown rows belong to a layout other than the current one. */
    public ReadOnlyBooleanProperty staleProperty() {
        return stale.getReadOnlyProperty();
    }

    /** Finished samples / samples asked, 0..1. */
    public ReadOnlyDoubleProperty progressProperty() {
        return progress.getReadOnlyProperty();
    }

    /** Samples done, elapsed and left, while running. */
    public ReadOnlyStringProperty etaProperty() {
        return eta.getReadOnlyProperty();
    }

    public ReadOnlyStringProperty statusProperty() {
        return status.getReadOnlyProperty();
    }

    /** The last result, or null. */
    public ToleranceResult result() {
        return result;
    }

    public ObservableList<ToleranceRow> links() {
        return links;
    }

    public ObservableList<ToleranceRow> demands() {
        return demands;
    }

    /** Weak links of the last result, likeliest failure first; empty once the layout changed. */
    public ObservableList<WeakLink> weakLinks() {
        return weakLinks;
    }

    public ObjectProperty<ToleranceRow> selectedLinkProperty() {
        return selectedLink;
    }

    /** The selected link's capacity histogram. */
    public ObservableList<Bin> histogram() {
        return histogram;
    }

    public ReadOnlyStringProperty histogramTitleProperty() {
        return histogramTitle.getReadOnlyProperty();
    }

    /** "sobol_first_order" or "src": how the drivers of the last result were found. */
    public String driversMethod() {
        return result == null ? "" : result.driversMethod();
    }

    /** Whether the last result is partial. */
    public boolean partial() {
        return result != null && result.partial();
    }
}
