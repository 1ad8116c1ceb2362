package dev.nanoplan.desktop;

import dev.nanoplan.plan.Plan;
import dev.nanoplan.scenario.Scenario;
import java.util.Objects;
import java.util.concurrent.CompletableFuture;
import java.util.concurrent.Executor;
import java.util.concurrent.Executors;
import java.util.concurrent.ScheduledExecutorService;
import java.util.concurrent.ScheduledFuture;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicLong;
import javafx.beans.property.ReadOnlyBooleanProperty;
import javafx.beans.property.ReadOnlyBooleanWrapper;

/**
 * Plans layouts in the background: for each {@link #schedule requested} layout a fast preview
 * (after {@code previewDebounceMs}, on the preview executor) and the exact plan (after
 * {@code debounceMs}, on the exact executor). A newer request within the delay replaces the
 * pending one; a newer request or {@link #cancel()} interrupts the running computations and drops
 * their results. Results reach the {@link Sink} through the {@code uiThread} executor, and only
 * while they belong to the latest request; a preview that comes after the exact plan of the same
 * request is dropped.
 *
 * <p>Threading: {@link #schedule} and {@link #cancel} on the UI thread; {@link #planned()} and
 * {@link #previewed()} from any thread.
 */
public final class PlanScheduler {

    /** Where results go (always called through {@code uiThread}). */
    interface Sink {
        /** A preview ({@code preview} true) or the exact plan of the latest request. */
        void apply(Plan plan, boolean preview);

        /** The exact planner failed on the latest request. */
        void failed(Throwable error);

        /** What the exact planner of the latest request is doing (e.g. simulating, 40 %). */
        default void progress(String text) {
        }
    }

    private final PlanService service;
    private final Executor uiThread;
    private final ScheduledExecutorService background;
    private final long debounceMs;
    private final ScheduledExecutorService previewBackground;
    private final long previewDebounceMs;
    private final Sink sink;
    private final ReadOnlyBooleanWrapper busy = new ReadOnlyBooleanWrapper(false);

    private final AtomicLong generation = new AtomicLong();
    private final Object lock = new Object();
    private ScheduledFuture<?> pending;
    private ScheduledFuture<?> pendingPreview;
    private volatile CompletableFuture<Plan> planned = new CompletableFuture<>();
    private volatile CompletableFuture<Plan> previewed = new CompletableFuture<>();
    private volatile long lastPlanNanos = -1;
    private volatile long lastPreviewNanos = -1;

    /**
     * @param service           the planner
     * @param uiThread          where results are handed to {@code sink}
     * @param background        where exact plans are computed
     * @param debounceMs        delay after the last request before the exact plan starts, ≥ 0
     * @param previewBackground where previews are computed (may be {@code background})
     * @param previewDebounceMs delay after the last request before the preview starts, ≥ 0
     * @param sink              receives the results
     */
    PlanScheduler(PlanService service, Executor uiThread, ScheduledExecutorService background, long debounceMs,
            ScheduledExecutorService previewBackground, long previewDebounceMs, Sink sink) {
        this.service = Objects.requireNonNull(service, "service");
        this.uiThread = Objects.requireNonNull(uiThread, "uiThread");
        this.background = Objects.requireNonNull(background, "background");
        this.previewBackground = Objects.requireNonNull(previewBackground, "previewBackground");
        this.sink = Objects.requireNonNull(sink, "sink");
        if (debounceMs < 0) {
            throw new IllegalArgumentException("debounceMs must be >= 0, got " + debounceMs);
        }
        if (previewDebounceMs < 0) {
            throw new IllegalArgumentException("previewDebounceMs must be >= 0, got " + previewDebounceMs);
        }
        this.debounceMs = debounceMs;
        this.previewDebounceMs = previewDebounceMs;
    }

    /** A single daemon thread of the given name, so a pending plan never keeps the JVM alive. */
    static ScheduledExecutorService daemonScheduler(String name) {
        return Executors.newSingleThreadScheduledExecutor(r -> {
            Thread t = new Thread(r, name);
            t.setDaemon(true);
            return t;
        });
    }

    /** Plans {@code s}, superseding every earlier request. */
    void schedule(Scenario s) {
        long gen;
        CompletableFuture<Plan> target;
        CompletableFuture<Plan> previewTarget;
        // the generation and the futures move together, and results are published under the same
        // lock, so a plan of an older layout can never complete the future of a newer one
        synchronized (lock) {
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
        stopPending();
        busy.set(true);
        pendingPreview = previewBackground.schedule(() -> runPreview(s, gen, target, previewTarget),
                previewDebounceMs, TimeUnit.MILLISECONDS);
        pending = background.schedule(() -> runExact(s, gen, target), debounceMs, TimeUnit.MILLISECONDS);
    }

    /** Cancels the pending or running plan and preview; their results will be dropped. */
    void cancel() {
        generation.incrementAndGet();
        stopPending();
        busy.set(false);
    }

    private void stopPending() {
        if (pending != null) {
            pending.cancel(true);
        }
        if (pendingPreview != null) {
            pendingPreview.cancel(true);
        }
    }

    private void runPreview(Scenario s, long gen, CompletableFuture<Plan> target, CompletableFuture<Plan> previewTarget) {
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
            synchronized (lock) {
                if (gen == generation.get() && !target.isDone()) {
                    lastPreviewNanos = dt;
                    sink.apply(p, true);
                    previewTarget.complete(p);
                }
            }
        });
    }

    private void runExact(Scenario s, long gen, CompletableFuture<Plan> target) {
        if (Thread.currentThread().isInterrupted() || gen != generation.get()) {
            return;
        }
        try {
            long t0 = System.nanoTime();
            Plan p = service.plan(s, text -> uiThread.execute(() -> {
                synchronized (lock) {
                    if (gen == generation.get()) {
                        sink.progress(text);
                    }
                }
            }));
            long dt = System.nanoTime() - t0;
            uiThread.execute(() -> {
                synchronized (lock) {
                    if (gen == generation.get()) {
                        lastPlanNanos = dt;
                        sink.apply(p, false);
                        busy.set(false);
                        target.complete(p);
                    }
                }
            });
        } catch (RuntimeException | Error e) {
            uiThread.execute(() -> {
                synchronized (lock) {
                    if (gen == generation.get()) {
                        busy.set(false);
                        sink.failed(e);
                        target.completeExceptionally(e);
                    }
                }
            });
        }
    }

    /** The service that makes the plans. */
    PlanService service() {
        return service;
    }

    /** True from a request until its exact plan (or failure) is applied, or until {@link #cancel()}. */
    public ReadOnlyBooleanProperty busyProperty() {
        return busy.getReadOnlyProperty();
    }

    /** Completes with the exact plan of the latest request once applied (exceptionally when it failed). */
    public CompletableFuture<Plan> planned() {
        return planned;
    }

    /** Completes with the preview of the latest request once applied; stays incomplete when there is none. */
    public CompletableFuture<Plan> previewed() {
        return previewed;
    }

    /** Wall time of the last exact plan in nanoseconds (−1 before the first). */
    public long lastPlanNanos() {
        return lastPlanNanos;
    }

    /** Wall time of the last preview in nanoseconds (−1 before the first). */
    public long lastPreviewNanos() {
        return lastPreviewNanos;
    }
}
