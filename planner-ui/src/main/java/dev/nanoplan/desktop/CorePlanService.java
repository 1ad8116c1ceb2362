package dev.nanoplan.desktop;

import dev.nanoplan.plan.NetworkPlanner;
import dev.nanoplan.plan.Plan;
import dev.nanoplan.plan.PlanOptions;
import dev.nanoplan.plan.PreviewPlanner;
import dev.nanoplan.scenario.Scenario;
import java.util.concurrent.CancellationException;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ForkJoinPool;
import java.util.concurrent.ForkJoinTask;
import java.util.concurrent.ForkJoinWorkerThread;
import java.util.concurrent.atomic.AtomicBoolean;

/**
 * {@link PlanService} backed by planner-core's {@link NetworkPlanner} with {@link PlanOptions#DEFAULT},
 * and {@link PreviewPlanner} for the preview.
 *
 * <p>Cancellation: the exact plan checks, at every progress report of the core (once per receiver),
 * whether the thread that asked for it has been interrupted (the view model cancels a superseded
 * plan with {@code Future.cancel(true)}), and if so stops with a {@link CancellationException}, so
 * a newer edit does not wait for a stale plan to finish.
 */
final class CorePlanService implements PlanService {

    static final CorePlanService INSTANCE = new CorePlanService();

    private CorePlanService() {
    }

    /**
     * Worker threads of the exact plan: one fewer than the processors (at least one), so the UI
     * thread and the renderer keep a core while a plan runs. The core planner's parallel stream runs
     * in the pool it is started from.
     */
    private static final ForkJoinPool POOL = new ForkJoinPool(
            Math.max(1, Runtime.getRuntime().availableProcessors() - 1), pool -> {
                ForkJoinWorkerThread t = ForkJoinPool.defaultForkJoinWorkerThreadFactory.newThread(pool);
                t.setDaemon(true);
                t.setName("nanoplan-plan-" + t.getPoolIndex());
                return t;
            }, null, false);

    /** Parallelism of the exact plan's pool. */
    static int planThreads() {
        return POOL.getParallelism();
    }

    @Override
    public Plan plan(Scenario scenario) {
        Thread caller = Thread.currentThread();
        AtomicBoolean abandoned = new AtomicBoolean();
        ForkJoinTask<Plan> task = POOL.submit(() -> NetworkPlanner.plan(scenario,
                PlanOptions.DEFAULT.withProgress(f -> {
                    if (abandoned.get() || caller.isInterrupted()) {
                        throw new CancellationException("superseded by a newer edit");
                    }
                })));
        try {
            return task.get();
        } catch (InterruptedException e) {
            abandoned.set(true);
            Thread.currentThread().interrupt();
            throw new CancellationException("superseded by a newer edit");
        } catch (ExecutionException e) {
            Throwable c = e.getCause();
            if (c instanceof RuntimeException r) {
                throw r;
            }
            if (c instanceof Error err) {
                throw err;
            }
            throw new IllegalStateException(c);
        }
    }

    @Override
    public Plan preview(Scenario scenario) {
        if (!PreviewPlanner.supports(scenario)) {
            return null;
        }
        return PreviewPlanner.plan(scenario, PlanOptions.DEFAULT);
    }
}
