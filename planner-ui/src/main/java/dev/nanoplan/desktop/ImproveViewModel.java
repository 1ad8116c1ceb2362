package dev.nanoplan.desktop;

import dev.nanoplan.design.Assessment;
import dev.nanoplan.design.Change;
import dev.nanoplan.design.DesignMove;
import dev.nanoplan.design.ImproveOptions;
import dev.nanoplan.design.Improvement;
import dev.nanoplan.design.LayoutImprover;
import dev.nanoplan.geometry.Vec3;
import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.Scenario;
import java.util.ArrayList;
import java.util.EnumMap;
import java.util.EnumSet;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Objects;
import java.util.Set;
import java.util.concurrent.CompletableFuture;
import java.util.concurrent.Executor;
import java.util.concurrent.atomic.AtomicBoolean;
import java.util.concurrent.atomic.AtomicReference;
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
import javafx.collections.FXCollections;
import javafx.collections.ObservableList;

/**
 * State and commands of "Improve…" (ViewModel of MVVM): runs planner-core's {@link LayoutImprover} (as
 * {@code nanoplan improve} does) on the current layout in the background, with progress (evaluations,
 * best objective, time left) and Cancel, which returns the best layout found so far. The proposal shows
 * as a change table with a tick per change and, for the 3D view, ghosts of the ticked moves (old
 * position → new) and added nodes; {@link #apply()} makes the ticked changes
 * ({@link Improvement#withOnly}) as one undoable edit; {@link #discard()} drops the proposal. An edit of
 * the layout while a proposal is shown drops it too (its changes were found for the old layout).
 *
 * <p>Threading: public methods on the UI thread; results applied through {@code uiThread}.
 */
public final class ImproveViewModel {

    /** How a search ended. */
    public enum Outcome { PROPOSAL, NOTHING_BETTER, CANCELLED, FAILED }

    /** One change of the proposal with its tick (ticked by default). */
    public static final class ChangeRow {
        private final Change change;
        private final BooleanProperty ticked = new SimpleBooleanProperty(true);

        ChangeRow(Change change) {
            this.change = change;
        }

        public Change change() {
            return change;
        }

        public BooleanProperty tickedProperty() {
            return ticked;
        }
    }

    /** One demand before and after the proposal. */
    public record DemandRow(String from, String to, boolean meetsBefore, boolean meetsAfter, double rateBeforeBitsPerS,
            double rateAfterBitsPerS) {
    }

    /** A node the ticked changes move (from ≠ to) or add (from null), for the 3D view. */
    public record Ghost(String node, Vec3 fromUm, Vec3 toUm, double radiusUm) {
    }

    /** Field label of the time limit; its messages start with it. */
    public static final String TIME_LIMIT = "time limit s";

    private static final Executor WORKER = PlannerViewModel.daemonScheduler("nanoplan-improve");

    private final PlannerViewModel planner;
    private final Executor uiThread;
    private final Executor background;
    private final Map<DesignMove, BooleanProperty> allowed = new EnumMap<>(DesignMove.class);
    private final StringProperty timeLimitS = new SimpleStringProperty("60");
    private final ReadOnlyBooleanWrapper running = new ReadOnlyBooleanWrapper(false);
    private final ReadOnlyBooleanWrapper hasProposal = new ReadOnlyBooleanWrapper(false);
    private final ReadOnlyDoubleWrapper progress = new ReadOnlyDoubleWrapper(0);
    private final ReadOnlyStringWrapper progressText = new ReadOnlyStringWrapper("");
    private final ReadOnlyStringWrapper status = new ReadOnlyStringWrapper("not run yet");
    private final ObservableList<ChangeRow> changes = FXCollections.observableArrayList();
    private final ObservableList<DemandRow> demands = FXCollections.observableArrayList();
    private final ObservableList<Ghost> ghosts = FXCollections.observableArrayList();

    private final AtomicBoolean cancel = new AtomicBoolean();
    private volatile boolean searching;
    private Improvement proposal;
    private CompletableFuture<Outcome> finished = new CompletableFuture<>();
    /** True while {@link #apply()} edits the layout (the edit must not drop the proposal mid-way). */
    private boolean applying;

    public ImproveViewModel(PlannerViewModel planner, Executor uiThread, Executor background) {
        this.planner = Objects.requireNonNull(planner, "planner");
        this.uiThread = Objects.requireNonNull(uiThread, "uiThread");
        this.background = Objects.requireNonNull(background, "background");
        Set<DesignMove> defaults = DesignMove.defaults();
        for (DesignMove m : DesignMove.values()) {
            allowed.put(m, new SimpleBooleanProperty(defaults.contains(m)));
        }
        planner.scenarioProperty().addListener((o, a, b) -> {
            if (proposal != null && !applying && !proposal.before().equals(b)) {
                clear();
                status.set("proposal dropped: the layout changed; run Improve again");
            }
        });
    }

    /** The application's: FX thread for results, one shared daemon worker. */
    public static ImproveViewModel forApplication(PlannerViewModel planner) {
        return new ImproveViewModel(planner, Platform::runLater, WORKER);
    }

    // ---------------------------------------------------------------- commands

    /**
     * Starts a search from the current layout with the ticked parts and the time limit.
     *
     * @return false, with the reason in {@link #statusProperty()}, when a search is running, no layout
     *     is open, no part is ticked or the time limit is not a number &gt; 0
     */
    public boolean run() {
        Scenario s = planner.scenarioProperty().get();
        if (searching || s == null) {
            status.set("not started: " + (s == null ? "open a layout first" : "a search is already running"));
            return false;
        }
        Set<DesignMove> moves = EnumSet.noneOf(DesignMove.class);
        allowed.forEach((m, p) -> {
            if (p.get()) {
                moves.add(m);
            }
        });
        double limit;
        try {
            if (moves.isEmpty()) {
                throw new IllegalArgumentException("allowed: tick at least one part the search may change");
            }
            limit = SettingsText.parse(TIME_LIMIT, timeLimitS.get());
            if (!(limit > 0)) {
                throw new IllegalArgumentException(TIME_LIMIT + ": must be > 0, got " + SettingsText.trim(timeLimitS.get()));
            }
        } catch (IllegalArgumentException e) {
            status.set("not started: " + e.getMessage());
            return false;
        }
        clear();
        cancel.set(false);
        searching = true;
        CompletableFuture<Outcome> done = new CompletableFuture<>();
        finished = done;
        running.set(true);
        progress.set(0);
        progressText.set("first plan…");
        status.set("searching (" + String.join(", ", moves.stream().map(DesignMove::id).toList()) + ")…");
        AtomicReference<ImproveOptions.Progress> latest = new AtomicReference<>();
        AtomicBoolean queued = new AtomicBoolean();
        ImproveOptions options = ImproveOptions.defaults().withAllowed(moves).withTimeLimit(limit)
                .withCancel(cancel::get).withProgress(p -> {
                    latest.set(p);
                    if (queued.compareAndSet(false, true)) {
                        uiThread.execute(() -> {
                            queued.set(false);
                            showProgress(latest.get(), limit);
                        });
                    }
                });
        background.execute(() -> {
            try {
                Improvement r = LayoutImprover.improve(s, options);
                uiThread.execute(() -> end(r, null, done));
            } catch (RuntimeException | Error e) {
                uiThread.execute(() -> end(null, e, done));
            }
        });
        return true;
    }

    /** Stops the search; the best layout found so far becomes the proposal. */
    public void cancel() {
        if (searching && !cancel.getAndSet(true)) {
            status.set("cancelling: keeping the best layout so far…");
        }
    }

    /** Makes the ticked changes as one undoable edit and drops the proposal; false (with why) otherwise. */
    public boolean apply() {
        if (proposal == null) {
            status.set("nothing to apply: run Improve first");
            return false;
        }
        List<Change> ticked = changes.stream().filter(r -> r.tickedProperty().get()).map(ChangeRow::change).toList();
        if (ticked.isEmpty()) {
            status.set("nothing ticked: tick the changes to apply, or Discard");
            return false;
        }
        Improvement p = proposal;
        applying = true;
        boolean ok;
        try {
            ok = planner.edit(ticked.size() == changes.size() ? "apply the proposal"
                    : "apply " + ticked.size() + " of " + changes.size() + " proposed changes", s -> p.withOnly(ticked));
        } finally {
            applying = false;
        }
        if (ok) {
            clear();
            status.set("applied " + ticked.size() + " change(s) as one edit (Undo takes them back)");
        } else {
            status.set("not applied: " + planner.messageProperty().get());
        }
        return ok;
    }

    /** Drops the proposal and its ghosts. */
    public void discard() {
        if (proposal != null) {
            clear();
            status.set("proposal discarded");
        }
    }

    /** Completes when the latest search has ended and its outcome is shown; never before the first. */
    public CompletableFuture<Outcome> finished() {
        return finished;
    }

    // ---------------------------------------------------------------- progress and endings (UI thread)

    private void showProgress(ImproveOptions.Progress p, double limitS) {
        if (!searching || p == null) {
            return;
        }
        progress.set(Math.min(1, p.elapsedS() / limitS));
        progressText.set(String.format(Locale.ROOT, "%,d evaluations · best: %s · %s · at most %s s left",
                p.evaluations(), p.best().describe(), p.step(), Formats.twoDigits(p.remainingS())));
    }

    private void end(Improvement r, Throwable error, CompletableFuture<Outcome> done) {
        searching = false;
        running.set(false);
        progressText.set("");
        Outcome outcome;
        if (r == null) {
            outcome = Outcome.FAILED;
            status.set("search failed: " + (error.getMessage() == null ? error.getClass().getSimpleName()
                    : SettingsText.oneLine(error.getMessage())));
        } else if (!r.before().equals(planner.scenarioProperty().get())) {
            outcome = Outcome.CANCELLED;
            status.set("the layout changed during the search: proposal dropped");
        } else if (r.changes().isEmpty()) {
            outcome = cancel.get() ? Outcome.CANCELLED : Outcome.NOTHING_BETTER;
            status.set(String.format(Locale.ROOT, "%s after %,d evaluations in %s s: %s",
                    cancel.get() ? "cancelled; nothing better found" : "no better layout found",
                    r.evaluations(), Formats.twoDigits(r.seconds()), r.assessedBefore().objective().describe()));
        } else {
            outcome = Outcome.PROPOSAL;
            show(r);
            status.set(String.format(Locale.ROOT, "%s: %d change(s) after %,d evaluations in %s s. Before: %s. After: %s.",
                    r.stoppedEarly() ? "best so far (stopped early)" : "proposal", r.changes().size(), r.evaluations(),
                    Formats.twoDigits(r.seconds()), r.assessedBefore().objective().describe(),
                    r.assessedAfter().objective().describe()));
        }
        progress.set(r == null ? 0 : 1);
        done.complete(outcome);
    }

    private void show(Improvement r) {
        proposal = r;
        List<ChangeRow> rows = r.changes().stream().map(ChangeRow::new).toList();
        rows.forEach(row -> row.tickedProperty().addListener((o, a, b) -> refreshGhosts()));
        changes.setAll(rows);
        List<DemandRow> d = new ArrayList<>();
        for (int i = 0; i < r.assessedBefore().demands().size(); i++) {
            Assessment.DemandOutcome b = r.assessedBefore().demands().get(i);
            Assessment.DemandOutcome a = r.assessedAfter().demands().get(i);
            d.add(new DemandRow(b.from(), b.to(), b.meetsTargets(), a.meetsTargets(), b.sharedRateBitsPerS(),
                    a.sharedRateBitsPerS()));
        }
        demands.setAll(d);
        hasProposal.set(true);
        refreshGhosts();
    }

    private void refreshGhosts() {
        List<Ghost> out = new ArrayList<>();
        if (proposal != null) {
            Map<String, Node> before = proposal.before().nodesById();
            Map<String, Node> after = proposal.after().nodesById();
            for (ChangeRow row : changes) {
                Change c = row.change();
                if (!row.tickedProperty().get()) {
                    continue;
                }
                Node a = after.get(c.node());
                if ("position_um".equals(c.field())) {
                    out.add(new Ghost(c.node(), before.get(c.node()).positionUm(), a.positionUm(), a.radiusUm()));
                } else if ("node".equals(c.field())) {
                    out.add(new Ghost(c.node(), null, a.positionUm(), a.radiusUm()));
                }
            }
        }
        ghosts.setAll(out);
    }

    private void clear() {
        proposal = null;
        changes.clear();
        demands.clear();
        ghosts.clear();
        hasProposal.set(false);
    }

    // ---------------------------------------------------------------- properties

    /** Whether the search may change {@code move} (a tick box each). */
    public BooleanProperty allowedProperty(DesignMove move) {
        return allowed.get(move);
    }

    /** Wall-clock limit in seconds (text field). */
    public StringProperty timeLimitSProperty() {
        return timeLimitS;
    }

    public ReadOnlyBooleanProperty runningProperty() {
        return running.getReadOnlyProperty();
    }

    /** True while a proposal is shown (Apply and Discard enabled). */
    public ReadOnlyBooleanProperty hasProposalProperty() {
        return hasProposal.getReadOnlyProperty();
    }

    /** Elapsed / time limit, 0..1 (1 when the search ended). */
    public ReadOnlyDoubleProperty progressProperty() {
        return progress.getReadOnlyProperty();
    }

    /** Evaluations, best objective, step and time left, while searching. */
    public ReadOnlyStringProperty progressTextProperty() {
        return progressText.getReadOnlyProperty();
    }

    public ReadOnlyStringProperty statusProperty() {
        return status.getReadOnlyProperty();
    }

    public ObservableList<ChangeRow> changes() {
        return changes;
    }

    public ObservableList<DemandRow> demands() {
        return demands;
    }

    /** Moves and added nodes of the ticked changes. */
    public ObservableList<Ghost> ghosts() {
        return ghosts;
    }

    /** The proposal shown, or null. */
    public Improvement proposal() {
        return proposal;
    }
}
