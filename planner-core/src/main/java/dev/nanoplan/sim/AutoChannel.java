package dev.nanoplan.sim;

import dev.nanoplan.network.AnalyticChannel;
import dev.nanoplan.network.ChannelApplicability;
import dev.nanoplan.network.ChannelEntry;
import dev.nanoplan.network.ChannelMatrix;
import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.Species;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.function.BooleanSupplier;
import java.util.function.DoubleConsumer;

/**
 * The {@code auto} channel of a layout, the default of every shell: closed forms where they hold,
 * particle simulation where they do not.
 *
 * <p>Steps: (1) the analytic channel ({@link AnalyticChannel}), each entry judged by
 * {@link ChannelApplicability} (flow, walls, other absorbers of the species); (2) the emitters to
 * simulate: every emitter with a pair that fails, and every emitter whose species flow carries
 * further than diffusion at the diffusion length over the memory (then even pairs below the analytic
 * cutoff may be reached); (3) when there are none, the analytic channel itself, unchanged (a plan on
 * it is byte for byte the analytic plan); else a particle simulation of those emitters only
 * ({@link SimulationSettings#withEmitters}; each keeps the random stream it has in a run of all, so
 * its taps equal {@code --channel simulated}'s), obtained through {@link SimulatedChannels} and its
 * cache; (4) the merged channel: the closed-form entries of the other emitters, in their order, then
 * every simulated pair of the simulated emitters ({@link SimulatedChannelMatrix}), each with its
 * reason. When every emitter is simulated the merged channel equals the simulated one but for the
 * reasons.
 *
 * <p>Cost: the analytic channel plus, for the emitters simulated, the simulation
 * ({@link ParticleSimulator}).
 */
public final class AutoChannel {

    private AutoChannel() {
    }

    /**
     * What the closed forms cover.
     *
     * @param analytic  the analytic channel with each entry's verdict as its reason
     * @param toSimulate emitters to simulate, in scenario order, each with why (one failing pair or flow)
     */
    public record Decision(ChannelMatrix analytic, Map<String, String> toSimulate) {

        /** Whether nothing needs simulating (the analytic channel is the auto channel). */
        public boolean analyticOnly() {
            return toSimulate.isEmpty();
        }
    }

    /**
     * Step (1) and (2) of the class comment.
     *
     * @param cutoffMolecules the analytic channel's spatial cutoff (the plan's)
     */
    public static Decision decide(Scenario scenario, double cutoffMolecules) {
        return decide(scenario, cutoffMolecules, f -> { });
    }

    /**
     * As {@link #decide(Scenario, double)}, reporting the analytic channel's fraction of receivers done
     * to {@code progress} ({@link AnalyticChannel#build(Scenario, double, DoubleConsumer)}; a callback that
     * throws stops the work, as the planner's progress does).
     */
    public static Decision decide(Scenario scenario, double cutoffMolecules, DoubleConsumer progress) {
        ChannelMatrix analytic = AnalyticChannel.build(scenario, cutoffMolecules, progress);
        ChannelApplicability tests = ChannelApplicability.of(scenario);
        Map<String, Species> species = scenario.speciesByName();
        Map<String, String> why = new LinkedHashMap<>();
        Map<String, String> failing = new LinkedHashMap<>();
        for (ChannelEntry e : analytic.entries()) {
            if (!AnalyticChannel.covered(e)) {
                failing.putIfAbsent(e.emitter(), e.emitter() + " -> " + e.receiver() + ": "
                        + e.channelReason().substring(AnalyticChannel.NOT_COVERED.length()));
            }
        }
        for (Node n : scenario.nodes()) {
            if (!n.role().emits()) {
                continue;
            }
            if (failing.containsKey(n.id())) {
                why.put(n.id(), failing.get(n.id()));
                continue;
            }
            Species sp = species.get(n.emitsSpecies());
            if (tests.flowRulesOut(sp)) {
                why.put(n.id(), String.format(Locale.ROOT, "flow: Péclet number %.2g > %s at the diffusion length "
                        + "over the memory", tests.peclet(0, sp), ChannelApplicability.MAX_PECLET));
            }
        }
        return new Decision(analytic, why);
    }

    /**
     * Step (4): the closed-form entries of the emitters not simulated, then the simulated pairs of
     * {@code simulated} (a run of {@code decision.toSimulate()}'s emitters, complete).
     */
    public static ChannelMatrix merge(Decision decision, SimulatedChannel simulated) {
        Map<String, String> reasons = new LinkedHashMap<>();
        for (ChannelEntry e : decision.analytic().entries()) {
            if (decision.toSimulate().containsKey(e.emitter()) && !AnalyticChannel.covered(e)) {
                reasons.put(e.emitter() + '\u0000' + e.receiver(),
                        e.channelReason().substring(AnalyticChannel.NOT_COVERED.length()));
            }
        }
        ChannelMatrix sim = SimulatedChannelMatrix.of(simulated, t -> {
            String own = reasons.get(t.emitterId() + '\u0000' + t.receiverId());
            if (own != null) {
                return own;
            }
            String emitter = decision.toSimulate().get(t.emitterId());
            return "emitter simulated for its other pairs (" + (emitter == null ? "requested" : emitter) + ")";
        });
        List<ChannelEntry> entries = new ArrayList<>();
        for (ChannelEntry e : decision.analytic().entries()) {
            if (!decision.toSimulate().containsKey(e.emitter())) {
                entries.add(e);
            }
        }
        List<String> notes = new ArrayList<>();
        if (!entries.isEmpty()) {
            notes.addAll(decision.analytic().notes());
        }
        entries.addAll(sim.entries());
        notes.addAll(sim.notes());
        return ChannelMatrix.of(entries, notes);
    }

    /**
     * The auto channel and how it was obtained.
     *
     * @param channel   the merged channel, or null when the simulation was stopped before it completed
     * @param decision  what the closed forms cover
     * @param obtained  the simulation and where it came from, or null when nothing was simulated
     */
    public record Result(ChannelMatrix channel, Decision decision, SimulatedChannels.Obtained obtained) {
    }

    /** Runs the simulation of some emitters (normally {@link ParticleSimulator} with progress and cancel). */
    @FunctionalInterface
    public interface Runner {
        /** Simulates {@code scenario} with {@code settings} (which name the emitters). */
        SimulatedChannel run(Scenario scenario, SimulationSettings settings);
    }

    /**
     * Steps (1) to (4): the auto channel of {@code scenario}.
     *
     * @param settings   M, seed, Δt and threads of the simulation (its emitter set is replaced)
     * @param cache      the simulated-channel cache, or null
     * @param runner     runs the simulation on a cache miss
     * @param cancelled  true once the caller gave up (a run finished after that is not stored)
     * @param onMiss     told before a simulation runs
     */
    public static Result obtain(Scenario scenario, double cutoffMolecules, SimulationSettings settings,
            ChannelCache cache, Runner runner, BooleanSupplier cancelled, SimulatedChannels.MissListener onMiss) {
        return obtain(scenario, cutoffMolecules, settings, cache, runner, cancelled, onMiss, f -> { });
    }

    /**
     * As above, with the analytic step's progress ({@link #decide(Scenario, double, DoubleConsumer)}).
     */
    public static Result obtain(Scenario scenario, double cutoffMolecules, SimulationSettings settings,
            ChannelCache cache, Runner runner, BooleanSupplier cancelled, SimulatedChannels.MissListener onMiss,
            DoubleConsumer analyticProgress) {
        Decision decision = decide(scenario, cutoffMolecules, analyticProgress);
        if (decision.analyticOnly()) {
            return new Result(decision.analytic(), decision, null);
        }
        SimulationSettings some = settings.withEmitters(decision.toSimulate().keySet());
        SimulatedChannels.Obtained got = SimulatedChannels.obtain(scenario, some, cache, false,
                s -> runner.run(s, some), cancelled, onMiss);
        if (!got.channel().complete()) {
            return new Result(null, decision, got);
        }
        return new Result(merge(decision, got.channel()), decision, got);
    }
}
