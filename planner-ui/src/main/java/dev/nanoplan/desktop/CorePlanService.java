package dev.nanoplan.desktop;

import dev.nanoplan.network.ChannelMatrix;
import dev.nanoplan.plan.NetworkPlanner;
import dev.nanoplan.plan.Plan;
import dev.nanoplan.plan.PlanOptions;
import dev.nanoplan.plan.PreviewPlanner;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.sim.AutoChannel;
import dev.nanoplan.sim.ChannelCache;
import dev.nanoplan.sim.ParticleSimulator;
import dev.nanoplan.sim.SimulationSettings;
import java.util.concurrent.CancellationException;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ForkJoinPool;
import java.util.concurrent.ForkJoinTask;
import java.util.concurrent.ForkJoinWorkerThread;
import java.util.concurrent.atomic.AtomicBoolean;
import java.util.concurrent.atomic.AtomicInteger;
import java.util.function.BooleanSupplier;
import java.util.function.Consumer;

/**
 * {@link PlanService} backed by planner-core's {@link NetworkPlanner} with {@link PlanOptions#DEFAULT} on
 * the auto channel (as {@code nanoplan plan}), and {@link PreviewPlanner} (closed forms) for the preview.
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
        return plan(scenario, text -> { });
    }

    /**
     * The exact plan on the auto channel ({@link AutoChannel}: closed forms where they hold, the particle
     * simulation of the other emitters with the command line's defaults and cache), telling
     * {@code status} how the simulation advances.
     */
    @Override
    public Plan plan(Scenario scenario, Consumer<String> status) {
        Thread caller = Thread.currentThread();
        AtomicBoolean abandoned = new AtomicBoolean();
        BooleanSupplier stop = () -> abandoned.get() || caller.isInterrupted();
        ForkJoinTask<Plan> task = POOL.submit(() -> {
            PlanOptions options = PlanOptions.DEFAULT.withProgress(f -> {
                if (stop.getAsBoolean()) {
                    throw new CancellationException("superseded by a newer edit");
                }
            });
            ChannelMatrix channel = autoChannel(scenario, status, stop);
            return NetworkPlanner.plan(scenario, channel == null ? options : options.withChannel(channel));
        });
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

    /** The auto channel, or null when the closed forms cover the layout (the planner's default). */
    private static ChannelMatrix autoChannel(Scenario scenario, Consumer<String> status, BooleanSupplier stop) {
        AutoChannel.Decision decision = AutoChannel.decide(scenario, PlanOptions.DEFAULT.cutoffMolecules());
        if (decision.analyticOnly()) {
            return null;
        }
        String what = "simulating the channel of " + decision.toSimulate().size() + " emitter(s) ("
                + decision.toSimulate().values().iterator().next() + ")";
        status.accept(what + "...");
        SimulationSettings settings = SimulationSettings.of(SimulationSettings.DEFAULT_MOLECULES_PER_EMITTER, 1)
                .withThreads(planThreads());
        ChannelCache cache = new ChannelCache(SimulationViewModel.defaultCacheDirectory());
        AtomicInteger shown = new AtomicInteger(-1);
        AutoChannel.Result r = AutoChannel.obtain(scenario, PlanOptions.DEFAULT.cutoffMolecules(), settings, cache,
                (s, st) -> new ParticleSimulator(st).simulate(s, (done, total) -> {
                    int pc = (int) (100 * done / Math.max(1, total));
                    if (pc / 10 > shown.getAndSet(pc / 10)) {
                        status.accept(what + ": " + pc + " %");
                    }
                }, stop), stop, dt -> { });
        if (r.channel() == null) {
            throw new CancellationException("superseded by a newer edit");
        }
        status.accept(r.obtained().fromCache() ? "channel: simulated part read from the cache; planning..."
                : "channel simulated and cached; planning...");
        return r.channel();
    }

    @Override
    public Plan preview(Scenario scenario) {
        if (!PreviewPlanner.supports(scenario)) {
            return null;
        }
        return PreviewPlanner.plan(scenario, PlanOptions.DEFAULT);
    }
}
