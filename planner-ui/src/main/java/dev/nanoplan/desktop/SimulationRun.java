package dev.nanoplan.desktop;

import dev.nanoplan.network.ChannelMatrix;
import dev.nanoplan.plan.LinkReport;
import dev.nanoplan.plan.NetworkPlanner;
import dev.nanoplan.plan.Plan;
import dev.nanoplan.plan.PlanOptions;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.sim.ChannelCache;
import dev.nanoplan.sim.LinkComparison;
import dev.nanoplan.sim.ParticleSimulator;
import dev.nanoplan.sim.SimulatedChannel;
import dev.nanoplan.sim.SimulatedChannels;
import dev.nanoplan.sim.SimulatedChannelMatrix;
import dev.nanoplan.sim.SimulationComparison;
import dev.nanoplan.sim.SimulationProgress;
import dev.nanoplan.sim.SimulationSettings;
import java.io.IOException;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.CompletableFuture;
import java.util.concurrent.atomic.AtomicBoolean;
import java.util.concurrent.atomic.AtomicLong;

/**
 * One simulation run of the Simulation tab: its layout snapshot, settings, cancel flag, progress
 * coalescing state and outcome, and how it gets its simulated channel (from the cache, or by
 * simulating and then storing it).
 *
 * <p>Simulated-channel cache: with a {@link ChannelCache} (the application uses the same folder as
 * {@code nanoplan plan --channel simulated}, so both share results), a run whose layout physics, M,
 * seed and Δt were simulated before loads the stored channel instead of simulating (the status then
 * says "from cache"); a complete new run is stored. {@link SimulationViewModel#ignoreCacheProperty()} ("Re-simulate")
 * forces a new simulation, whose result replaces the stored one. A cancelled run is never stored.
 *
 * <p>Analytic plan: the closed-form plan the simulated one is compared with is taken from the
 * planner when it already holds the exact plan of the very same layout ({@link PlanScheduler#planned()}
 * completed, its plan's scenario equal to the simulated one, and the planner's service being the
 * core's default planner); otherwise it is computed again here. {@code planned()} only completes
 * with exact plans, never with a fast preview, which is why the plan is not read from
 * {@link PlanTables#planProperty()}.
 */
final class SimulationRun {

    final Scenario scenario;
    final SimulationSettings settings;
    final boolean ignoreCache;
    final AtomicBoolean cancelled = new AtomicBoolean();
    final AtomicBoolean progressQueued = new AtomicBoolean();
    final AtomicLong lastQueuedNanos = new AtomicLong(Long.MIN_VALUE / 2);
    volatile double latest;
    /** Whether the analytic plan was the planner's (set on the worker before the result is queued). */
    volatile boolean analyticReused;
    final CompletableFuture<SimulationViewModel.Outcome> finished = new CompletableFuture<>();

    SimulationRun(Scenario scenario, SimulationSettings settings, boolean ignoreCache) {
        this.scenario = scenario;
        this.settings = settings;
        this.ignoreCache = ignoreCache;
    }

    /** A simulated channel and where it came from. */
    record Obtained(SimulatedChannel channel, String source) {
    }

    /**
     * The channel of this run: from the cache when allowed and present, else simulated (and stored
     * when complete; {@code cache} null = none; a failed store is reported in the source, not as a failure of the run).
     */
    Obtained obtain(ChannelCache cache, SimulationProgress progress) {
        ParticleSimulator simulator = new ParticleSimulator(settings);
        SimulatedChannels.Obtained o = SimulatedChannels.obtain(scenario, settings, cache, ignoreCache,
                sc -> simulator.simulate(sc, progress, cancelled::get), cancelled::get, dt -> { });
        return new Obtained(o.channel(), o.source());
    }

    /** The operating mutual information of the link compared in {@code c} in plan {@code p}, or NaN when the plan lacks it. */
    private static double capacity(Plan p, LinkComparison c) {
        for (LinkReport l : p.links()) {
            if (l.from().equals(c.from()) && l.to().equals(c.to())) {
                return l.mutualInformationBits();
            }
        }
        return Double.NaN;
    }

    /**
     * The rows of the links compared on {@code channel}: closed-form versus simulated hit probability
     * ({@link SimulationComparison}) and the link's capacity in the analytic plan ({@code reused}
     * when given, else planned here) versus the plan on the simulated taps. Null when the run is
     * cancelled in between. {@code planning} is called before the two plans start.
     */
    List<SimulationRow> compare(SimulatedChannel channel, Plan reused, Runnable planning) {
        List<LinkComparison> comparisons = SimulationComparison.compare(scenario, channel);
        planning.run();
        analyticReused = reused != null;
        Plan analytic = reused != null ? reused : NetworkPlanner.plan(scenario, PlanOptions.DEFAULT);
        if (cancelled.get()) {
            return null;
        }
        Plan simulated = NetworkPlanner.plan(scenario, PlanOptions.DEFAULT.withChannel(SimulatedChannelMatrix.of(channel)));
        if (cancelled.get()) {
            return null;
        }
        List<SimulationRow> out = new ArrayList<>(comparisons.size());
        for (LinkComparison c : comparisons) {
            out.add(SimulationRow.of(c, capacity(analytic, c), capacity(simulated, c)));
        }
        return out;
    }

    /**
     * Records progress from a simulator worker; true when the caller should queue one UI update:
     * none is queued yet and {@code intervalNanos} have passed since the last (the last update, at
     * {@code done ≥ total}, always). The caller clears {@link #progressQueued} when it runs.
     */
    boolean progress(long done, long total, long intervalNanos) {
        latest = total <= 0 ? 1 : Math.min(1, (double) done / total);
        long now = System.nanoTime();
        if (done < total && now - lastQueuedNanos.get() < intervalNanos) {
            return false;
        }
        if (progressQueued.compareAndSet(false, true)) {
            lastQueuedNanos.set(now);
            return true;
        }
        return false;
    }

    /** The planner's exact plan {@code planned} when it is done, analytic and of this run's layout; else null. */
    Plan reusable(CompletableFuture<Plan> planned) {
        if (!planned.isDone() || planned.isCompletedExceptionally()) {
            return null;
        }
        Plan p = planned.getNow(null);
        return p != null && ChannelMatrix.ANALYTIC.equals(p.channel()) && scenario.equals(p.scenario()) ? p : null;
    }
}
