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
import java.nio.file.Path;
import java.util.Locale;
import java.util.OptionalDouble;
import java.util.TreeSet;
import java.util.concurrent.CancellationException;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ForkJoinPool;
import java.util.concurrent.ForkJoinTask;
import java.util.concurrent.ForkJoinWorkerThread;
import java.util.concurrent.atomic.AtomicBoolean;
import java.util.function.BooleanSupplier;
import java.util.function.Consumer;

/**
 * {@link PlanService} backed by planner-core's {@link NetworkPlanner} with {@link PlanOptions#DEFAULT}
 * on the {@code auto} channel ({@link AutoChannel}: closed forms where they hold, the particle
 * simulation for the emitters they do not cover, with the command line's defaults: 20,000 molecules
 * per emitter, seed 1, the automatic time step, and the same on-disk cache,
 * {@link ChannelCache#defaultDirectory}), and {@link PreviewPlanner} for the preview.
 *
 * <p>Cancellation: the exact plan checks, at every progress report of the core (once per receiver),
 * and the simulation between its blocks and every few hundred steps, whether the thread that asked for
 * it has been interrupted (the view model cancels a superseded plan with {@code Future.cancel(true)}),
 * and if so stops with a {@link CancellationException}, so a newer edit does not wait for a stale plan
 * to finish. A stopped simulation is not cached.
 */
final class CorePlanService implements PlanService {

    static final CorePlanService INSTANCE = new CorePlanService(SimulationSettings.DEFAULT_MOLECULES_PER_EMITTER,
            null);

    private final long moleculesPerEmitter;
    private final Path cacheDir;

    /**
     * @param moleculesPerEmitter molecules each simulated emitter releases
     * @param cacheDir the simulated-channel cache, or null for {@link ChannelCache#defaultDirectory}
     */
    CorePlanService(long moleculesPerEmitter, Path cacheDir) {
        this.moleculesPerEmitter = moleculesPerEmitter;
        this.cacheDir = cacheDir;
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

    @Override
    public Plan plan(Scenario scenario, Consumer<String> progress) {
        Thread caller = Thread.currentThread();
        AtomicBoolean abandoned = new AtomicBoolean();
        BooleanSupplier stop = () -> abandoned.get() || caller.isInterrupted();
        ForkJoinTask<Plan> task = POOL.submit(() -> {
            ChannelMatrix channel = autoChannel(scenario, progress, stop);
            return NetworkPlanner.plan(scenario, PlanOptions.DEFAULT.withChannel(channel).withProgress(f -> {
                if (stop.getAsBoolean()) {
                    throw new CancellationException("superseded by a newer edit");
                }
            }));
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

    /**
     * The auto channel of {@code scenario}; reports the simulation's share done to {@code progress}.
     *
     * @throws CancellationException when {@code stop} turned true during the analytic screen or the simulation
     */
    private ChannelMatrix autoChannel(Scenario scenario, Consumer<String> progress, BooleanSupplier stop) {
        double cutoff = PlanOptions.DEFAULT.cutoffMolecules();
        ChannelCache cache = new ChannelCache(cacheDir != null ? cacheDir
                : ChannelCache.defaultDirectory(System.getenv(), System.getProperty("user.home")));
        AutoChannel.Result r = AutoChannel.obtain(scenario, cutoff, settings(), cache, (s, st) -> {
            String who = String.join(", ", new TreeSet<>(st.emitterIds()));
            progress.accept("simulating the channel of " + who + ": 0 %");
            return new ParticleSimulator(st).simulate(s, (done, total) -> progress.accept(String.format(Locale.ROOT,
                    "simulating the channel of %s: %d %%", who, 100 * done / Math.max(1, total))), stop);
        }, stop, dt -> { }, f -> {
            if (stop.getAsBoolean()) {
                throw new CancellationException("superseded by a newer edit");
            }
        });
        if (r.channel() == null || stop.getAsBoolean()) {
            throw new CancellationException("superseded by a newer edit");
        }
        if (r.obtained() != null) {
            int simulated = r.decision().toSimulate().size();
            long emitters = scenario.nodes().stream().filter(n -> n.role().emits()).count();
            progress.accept("channel: " + simulated + " emitter(s) simulated (" + r.obtained().source() + ")"
                    + (simulated < emitters ? ", the others by closed forms" : ""));
        }
        return r.channel();
    }

    /** The simulation settings of the auto channel: M, seed 1, the automatic Δt, the plan's threads. */
    SimulationSettings settings() {
        return new SimulationSettings(moleculesPerEmitter, 1, OptionalDouble.empty(), planThreads());
    }

    @Override
    public Plan preview(Scenario scenario) {
        if (!PreviewPlanner.supports(scenario)) {
            return null;
        }
        return PreviewPlanner.plan(scenario, PlanOptions.DEFAULT);
    }
}
