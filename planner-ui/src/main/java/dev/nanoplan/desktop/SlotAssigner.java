package dev.nanoplan.desktop;

import dev.nanoplan.plan.PlanOptions;
import dev.nanoplan.plan.SlotAssignment;
import dev.nanoplan.plan.SlotSchedule;
import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.Schedule;
import java.util.Map;
import java.util.Objects;
import java.util.TreeMap;
import java.util.concurrent.CancellationException;
import java.util.concurrent.CompletableFuture;
import java.util.concurrent.Executor;
import java.util.concurrent.atomic.AtomicBoolean;
import java.util.function.DoubleConsumer;
import javafx.beans.binding.Bindings;
import javafx.beans.binding.StringBinding;
import javafx.beans.property.ReadOnlyBooleanProperty;
import javafx.beans.property.ReadOnlyBooleanWrapper;
import javafx.beans.property.ReadOnlyDoubleProperty;
import javafx.beans.property.ReadOnlyDoubleWrapper;

/**
 * "Assign slots" (a part of the view model): runs the slot assignment with spatial reuse of
 * {@code nanoplan slots} ({@link SlotAssignment}) on the open layout in the background, with
 * progress and cancel, and applies its slot plan as one undoable edit (schedule {@code slots},
 * every emitter's slot; nothing else of the layout changes). When the layout is edited or replaced
 * while the assignment runs, its result is dropped with a message (it was computed for another
 * layout). Also gives the frame shown in the status bar. Never touches a control.
 *
 * <p>Threading: {@link #assign()} and {@link #cancel()} on the UI thread; the work runs on
 * {@code worker}, and its progress and result come back through {@code uiThread}.
 */
public final class SlotAssigner {

    /** Default budget of what-if plans, as {@code nanoplan slots}. */
    static final int EVALUATIONS = 60;

    /** The slot assignment: a scenario in, its slot plan out, progress in [0, 1] told on the way. */
    @FunctionalInterface
    interface Assignment {
        SlotAssignment.Result assign(Scenario scenario, DoubleConsumer progress);
    }

    private final ScenarioDocument document;
    private final Executor uiThread;
    private final Executor worker;
    private final Assignment assignment;
    private final ReadOnlyBooleanWrapper running = new ReadOnlyBooleanWrapper(false);
    private final ReadOnlyDoubleWrapper progress = new ReadOnlyDoubleWrapper(0);
    private final StringBinding frame;
    private Run current;
    private CompletableFuture<Boolean> finished = CompletableFuture.completedFuture(false);

    /** One run: its layout, cancel flag and progress hand-over. */
    private static final class Run {
        final Scenario scenario;
        final AtomicBoolean cancelled = new AtomicBoolean();
        final AtomicBoolean queued = new AtomicBoolean();
        volatile double latest;

        Run(Scenario scenario) {
            this.scenario = scenario;
        }
    }

    /**
     * @param document   the open layout; the result is applied to it as one edit
     * @param uiThread   where progress and the result are applied
     * @param worker     where the assignment runs (never the UI thread)
     * @param assignment the slot assignment ({@link #core()} in the application)
     */
    SlotAssigner(ScenarioDocument document, Executor uiThread, Executor worker, Assignment assignment) {
        this.document = Objects.requireNonNull(document, "document");
        this.uiThread = Objects.requireNonNull(uiThread, "uiThread");
        this.worker = Objects.requireNonNull(worker, "worker");
        this.assignment = Objects.requireNonNull(assignment, "assignment");
        frame = Bindings.createStringBinding(() -> frameText(document.scenario()), document.scenarioProperty());
        document.onReplaced(this::cancel);
    }

    /** The core's assignment with the CLI's defaults (no frame cap, {@value #EVALUATIONS} what-if plans). */
    static Assignment core() {
        return (s, p) -> new SlotAssignment(PlanOptions.DEFAULT, 0, EVALUATIONS).assign(s, p);
    }

    /** Runs each task on a new daemon thread, so a long assignment never holds up planning or exit. */
    static Executor daemonThreads() {
        return r -> {
            Thread t = new Thread(r, "nanoplan-slots");
            t.setDaemon(true);
            t.start();
        };
    }

    /**
     * The frame of a layout under the {@code slots} schedule, e.g. {@code frame 4 slots}, with each
     * species' frame when they differ ({@code frame 4 slots (A 4, B 2)}); "" under other schedules.
     */
    static String frameText(Scenario s) {
        if (s == null || s.signalling().schedule() != Schedule.SLOTS) {
            return "";
        }
        SlotSchedule schedule = SlotSchedule.of(s);
        Map<String, Integer> bySpecies = new TreeMap<>();
        for (Node n : s.nodes()) {
            if (n.role().emits()) {
                bySpecies.put(n.emitsSpecies(), schedule.frameSlots(n.emitsSpecies()));
            }
        }
        int longest = schedule.longestFrame();
        String text = "frame " + longest + (longest == 1 ? " slot" : " slots");
        if (bySpecies.values().stream().distinct().count() > 1) {
            StringBuilder sb = new StringBuilder();
            bySpecies.forEach((sp, k) -> sb.append(sb.length() == 0 ? "" : ", ").append(sp).append(' ').append(k));
            text += " (" + sb + ")";
        }
        return text;
    }

    /**
     * Starts assigning slots to the open layout; false (with a message) when there is no layout or an
     * assignment is already running.
     */
    public boolean assign() {
        Scenario s = document.scenario();
        if (s == null || running.get()) {
            document.say(s == null ? "assign slots: no layout open" : "assign slots is already running");
            return false;
        }
        if (s.nodes().stream().noneMatch(n -> n.role().emits())) {
            document.say("assign slots: the layout has no emitter");
            return false;
        }
        Run run = new Run(s);
        current = run;
        CompletableFuture<Boolean> done = new CompletableFuture<>();
        finished = done;
        running.set(true);
        // not known until the first report (a progress bar shows -1 as "busy")
        progress.set(-1);
        document.say("assigning slots…");
        worker.execute(() -> {
            try {
                SlotAssignment.Result r = assignment.assign(run.scenario, f -> report(run, f));
                uiThread.execute(() -> done.complete(finish(run, r, null)));
            } catch (RuntimeException e) {
                uiThread.execute(() -> done.complete(finish(run, null, e)));
            }
        });
        return true;
    }

    /** Stops the running assignment (its result is dropped); nothing when none runs. */
    public void cancel() {
        Run r = current;
        if (r != null && running.get() && r.cancelled.compareAndSet(false, true)) {
            document.say("cancelling slot assignment…");
        }
    }

    /** Called on the worker: stops a cancelled run, else hands the fraction done to the UI thread (coalesced). */
    private void report(Run run, double fraction) {
        if (run.cancelled.get()) {
            throw new CancellationException("slot assignment cancelled");
        }
        run.latest = fraction;
        if (run.queued.compareAndSet(false, true)) {
            uiThread.execute(() -> {
                run.queued.set(false);
                if (current == run) {
                    progress.set(run.latest);
                }
            });
        }
    }

    /** On the UI thread: applies the result as one edit, or says why not. True when applied. */
    private boolean finish(Run run, SlotAssignment.Result r, RuntimeException error) {
        if (current == run) {
            running.set(false);
            progress.set(0);
            current = null;
        }
        if (run.cancelled.get()) {
            document.say("slot assignment cancelled: nothing changed");
            return false;
        }
        if (error != null) {
            document.say("slot assignment failed: " + SettingsText.oneLine(error.getMessage()));
            return false;
        }
        if (document.scenario() != run.scenario) {
            document.say("the layout changed while slots were assigned: nothing applied (assign again)");
            return false;
        }
        String what = "frame " + r.frameSlots() + (r.frameSlots() == 1 ? " slot" : " slots");
        boolean applied = document.edit("assign slots (" + what + ")",
                s -> LayoutEdits.withSignalling(s, r.scenario().signalling()));
        if (applied) {
            document.say("assigned slots: " + what + ", " + r.conflictEdges() + " conflict edge"
                    + (r.conflictEdges() == 1 ? "" : "s") + ", " + r.evaluations() + " what-if plans (undo to go back)");
        } else {
            document.say("slot plan unchanged: " + what);
        }
        return applied;
    }

    /** True while an assignment runs. */
    public ReadOnlyBooleanProperty runningProperty() {
        return running.getReadOnlyProperty();
    }

    /** Fraction of the running assignment done, in [0, 1]; -1 until the first report. */
    public ReadOnlyDoubleProperty progressProperty() {
        return progress.getReadOnlyProperty();
    }

    /** The frame of the open layout under the slots schedule ("" otherwise), for the status bar. */
    public StringBinding frameProperty() {
        return frame;
    }

    /** Completes (on the UI thread) when the latest run has ended: true when its slot plan was applied. */
    CompletableFuture<Boolean> finished() {
        return finished;
    }
}
