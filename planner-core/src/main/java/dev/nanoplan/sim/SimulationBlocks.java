package dev.nanoplan.sim;

import dev.nanoplan.engine.UnitResults;
import dev.nanoplan.engine.WorkUnits;
import dev.nanoplan.geometry.Vec3;
import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.ReceiverModel;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.ScenarioException;
import dev.nanoplan.scenario.ScenarioReader;
import dev.nanoplan.scenario.ScenarioWriter;
import dev.nanoplan.scenario.Species;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.function.BooleanSupplier;
import org.apache.commons.rng.JumpableUniformRandomProvider;
import org.apache.commons.rng.LongJumpableUniformRandomProvider;
import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.sampling.distribution.ZigguratSampler;
import org.apache.commons.rng.simple.RandomSource;

/**
 * The particle simulation as work units: unit u is block b = u mod B of emitter e = u div B, where B is
 * the number of blocks of {@value ParticleSimulator#BLOCK_SIZE} molecules per emitter (the last block of
 * an emitter may be smaller). A unit is a pure function of the scenario (kept as its file text, so it
 * travels to other machines), M, Δt, the seed and u.
 *
 * <p><b>Random streams.</b> Block b of emitter e draws from XoRoShiRo128++ (Commons RNG
 * {@link RandomSource#XO_RO_SHI_RO_128_PP}) seeded with the master seed, advanced by e long jumps
 * (2^96 steps each) and then b jumps (2^64 steps each): streams never overlap. Reaching a stream costs
 * e + b jumps from the root; each thread keeps its last stream, so a thread that takes increasing units
 * (every engine does within a partition) pays one jump per unit.
 *
 * <p>{@link #combine} adds the blocks' integer counts per emitter in unit order: the channel is the
 * same whatever the engine, the partitioning and the number of threads.
 */
public final class SimulationBlocks implements WorkUnits<BlockCounts> {

    private static final long serialVersionUID = 1L;

    private final String scenarioJson;
    private final long moleculesPerEmitter;
    private final long seed;
    private final double timeStepS;
    private final Set<String> emitterIds;
    private final int emitterCount;
    private final long blocksPerEmitter;
    private transient volatile Layout layout;
    private transient volatile ThreadLocal<Cursor> cursors;

    /**
     * @param scenario the layout
     * @param moleculesPerEmitter M ≥ 1
     * @param seed master seed
     * @param timeStepS Δt, s (a whole fraction of the symbol time)
     * @param emitterIds the emitters to simulate (empty: every emitter); emitter k of the scenario keeps its
     *     own stream (k long jumps, k counting every emitter), so its taps do not depend on the others
     * @throws IllegalArgumentException if Δt needs more than 2^31 − 1 steps, or the units overflow an int
     */
    public SimulationBlocks(Scenario scenario, long moleculesPerEmitter, long seed, double timeStepS,
            Set<String> emitterIds) {
        if (moleculesPerEmitter < 1) {
            throw new IllegalArgumentException("moleculesPerEmitter: must be >= 1, got " + moleculesPerEmitter);
        }
        this.scenarioJson = ScenarioWriter.toJson(scenario);
        this.moleculesPerEmitter = moleculesPerEmitter;
        this.seed = seed;
        this.timeStepS = timeStepS;
        this.emitterIds = Set.copyOf(emitterIds);
        this.layout = new Layout(scenario, timeStepS, this.emitterIds);
        this.emitterCount = layout.emitters.size();
        this.blocksPerEmitter = (moleculesPerEmitter + ParticleSimulator.BLOCK_SIZE - 1) / ParticleSimulator.BLOCK_SIZE;
        if (blocksPerEmitter * emitterCount > Integer.MAX_VALUE) {
            throw new IllegalArgumentException("moleculesPerEmitter: " + moleculesPerEmitter + " gives more than "
                    + Integer.MAX_VALUE + " blocks over " + emitterCount + " emitters");
        }
    }

    @Override
    public int count() {
        return (int) (blocksPerEmitter * emitterCount);
    }

    @Override
    public long work(int index) {
        long first = (index % blocksPerEmitter) * ParticleSimulator.BLOCK_SIZE;
        return Math.min(ParticleSimulator.BLOCK_SIZE, moleculesPerEmitter - first);
    }

    @Override
    public BlockCounts compute(int index, BooleanSupplier cancelled) {
        if (index < 0 || index >= count()) {
            throw new IllegalArgumentException("index: must be in 0.." + (count() - 1) + ", got " + index);
        }
        Layout l = layout();
        int e = (int) (index / blocksPerEmitter);
        long b = index % blocksPerEmitter;
        int molecules = (int) work(index);
        EmitterPlan ep = l.emitters.get(e);
        UniformRandomProvider rng = stream(e, ep.streamIndex, b);
        MoleculeBlock block = new MoleculeBlock(molecules);
        block.release(ep.origin.x(), ep.origin.y(), ep.origin.z(), molecules, ep.decayRatePerS, l.timeStepS, rng);
        long[] counts = new long[l.receivers.size() * l.slots];
        ZigguratSampler.NormalizedGaussian g = ZigguratSampler.NormalizedGaussian.of(rng);
        boolean finished = BlockKernel.advance(ep.motion, ep.absorbers, ep.observers, block, 0, l.totalSteps,
                l.stepsPerSlot, counts, l.slots, rng, g, cancelled);
        return finished ? new BlockCounts(e, molecules, counts, block.moleculeSteps) : null;
    }

    /**
     * The simulated channel from the finished blocks, added per emitter in unit order; {@code complete}
     * false when some block did not finish.
     */
    public SimulatedChannel combine(UnitResults<BlockCounts> results) {
        Layout l = layout();
        long[][] counts = new long[emitterCount][l.receivers.size() * l.slots];
        long[] simulated = new long[emitterCount];
        long[] steps = new long[emitterCount];
        for (BlockCounts b : results.finished()) {
            b.addTo(counts[b.emitter()]);
            simulated[b.emitter()] += b.molecules();
            steps[b.emitter()] += b.moleculeSteps();
        }
        List<EmitterRun> runs = new ArrayList<>();
        List<String> emitterIds = new ArrayList<>();
        boolean complete = true;
        for (int e = 0; e < emitterCount; e++) {
            EmitterPlan ep = l.emitters.get(e);
            emitterIds.add(ep.node.id());
            List<SimulatedTaps> taps = new ArrayList<>();
            long absorbed = 0;
            for (int r = 0; r < l.receivers.size(); r++) {
                long[] perSlot = new long[l.slots];
                System.arraycopy(counts[e], r * l.slots, perSlot, 0, l.slots);
                if (l.receivers.get(r).absorbs()) { // a passive observer's samples remove nothing
                    for (long v : perSlot) {
                        absorbed += v;
                    }
                }
                taps.add(new SimulatedTaps(ep.node.id(), l.receivers.get(r).id(), ep.senses[r], simulated[e], perSlot));
            }
            complete &= simulated[e] == moleculesPerEmitter;
            runs.add(new EmitterRun(ep.node.id(), ep.species.name(), simulated[e], simulated[e] - absorbed, steps[e],
                    taps));
        }
        return new SimulatedChannel(emitterIds, l.receivers.stream().map(Node::id).toList(),
                l.scenario.signalling().symbolTimeS(), l.slots - 1, l.timeStepS, seed, moleculesPerEmitter, complete,
                runs);
    }

    private Layout layout() {
        Layout l = layout;
        if (l == null) {
            synchronized (this) {
                if (layout == null) {
                    try {
                        layout = new Layout(ScenarioReader.lenient().parse(scenarioJson).scenario(), timeStepS,
                                emitterIds);
                    } catch (ScenarioException e) {
                        throw new IllegalStateException("scenario: its own file text does not read back: "
                                + e.getMessage(), e);
                    }
                }
                l = layout;
            }
        }
        return l;
    }

    /** Block b of emitter e's generator (see the class comment), from this thread's last one when it can. */
    private UniformRandomProvider stream(int e, int streamIndex, long b) {
        ThreadLocal<Cursor> tl = cursors;
        if (tl == null) {
            synchronized (this) {
                if (cursors == null) {
                    cursors = new ThreadLocal<>();
                }
                tl = cursors;
            }
        }
        Cursor c = tl.get();
        if (c == null || c.emitter != e || c.block > b) {
            LongJumpableUniformRandomProvider root =
                    (LongJumpableUniformRandomProvider) RandomSource.XO_RO_SHI_RO_128_PP.create(seed);
            for (int i = 0; i < streamIndex; i++) {
                root.longJump();
            }
            c = new Cursor(e, 0, root);
            tl.set(c);
        }
        while (c.block < b) {
            c.stream.jump();
            c.block++;
        }
        // a copy of the stream at block b; the cursor moves on to block b + 1
        UniformRandomProvider rng = c.stream.jump();
        c.block++;
        return rng;
    }

    /** A thread's position in the streams: emitter e's generator advanced to block {@code block}. */
    private static final class Cursor {
        final int emitter;
        long block;
        final JumpableUniformRandomProvider stream;

        Cursor(int emitter, long block, JumpableUniformRandomProvider stream) {
            this.emitter = emitter;
            this.block = block;
            this.stream = stream;
        }
    }

    /** Per-emitter constants. */
    private record EmitterPlan(Node node, Species species, Vec3 origin, double decayRatePerS, Motion motion,
            Absorbers absorbers, Observers observers, boolean[] senses, int streamIndex) {
    }

    /** What every block of a run shares: receivers, emitters with their motion and absorbers, steps. */
    private static final class Layout {
        final Scenario scenario;
        final List<Node> receivers = new ArrayList<>();
        final List<EmitterPlan> emitters = new ArrayList<>();
        final double timeStepS;
        final int stepsPerSlot;
        final int slots;
        final int totalSteps;

        Layout(Scenario scenario, double timeStepS, Set<String> emitterIds) {
            this.scenario = scenario;
            this.timeStepS = timeStepS;
            Map<String, Species> species = scenario.speciesByName();
            for (Node n : scenario.nodes()) {
                if (n.role().absorbs()) {
                    receivers.add(n);
                }
            }
            stepsPerSlot = TimeStepRule.stepsPerSymbol(scenario.signalling().symbolTimeS(), timeStepS);
            slots = scenario.signalling().isiMemorySymbols() + 1;
            long steps = (long) stepsPerSlot * slots;
            if (steps > Integer.MAX_VALUE) {
                throw new IllegalArgumentException("timeStepS: " + timeStepS + " s needs " + steps
                        + " steps to cover " + slots + " symbol times; use a larger time step or a shorter ISI memory");
            }
            int lastStep = (int) steps;
            int streamIndex = -1;
            for (Node e : scenario.nodes()) {
                if (!e.role().emits()) {
                    continue;
                }
                streamIndex++;
                if (!emitterIds.isEmpty() && !emitterIds.contains(e.id())) {
                    continue;
                }
                Species s = species.get(e.emitsSpecies());
                Motion motion = new Motion(scenario.volume(), scenario.medium().flow(), s.diffusionUm2PerS(), timeStepS);
                Spheres sinks = new Spheres();
                Spheres watchers = new Spheres();
                boolean[] senses = new boolean[receivers.size()];
                for (int r = 0; r < receivers.size(); r++) {
                    Node rn = receivers.get(r);
                    if (!ParticleSimulator.senses(e, rn)) {
                        continue;
                    }
                    senses[r] = true;
                    ReceiverModel rm = rn.receiver();
                    switch (rm.kind()) {
                        case ABSORBING -> sinks.add(rn, r, 1);
                        case REACTIVE -> sinks.add(rn, r, Absorbers.adsorptionProbability(rm.bindingRateUmPerS(),
                                timeStepS, s.diffusionUm2PerS()));
                        case PASSIVE -> watchers.add(rn, r,
                                Observers.offsetSteps(rm.samplingOffsetS(), timeStepS, stepsPerSlot));
                    }
                }
                Absorbers absorbers = new Absorbers(sinks.centres(), sinks.radii(), sinks.indices(),
                        sinks.allOnes() ? null : sinks.values(), motion.sigmaUm, motion.diffusionTimesStepUm2);
                Observers observers = new Observers(watchers.centres(), watchers.radii(), watchers.indices(),
                        watchers.wholeValues(), stepsPerSlot, slots);
                lastStep = Math.max(lastStep, observers.lastStep);
                emitters.add(new EmitterPlan(e, s, e.positionUm(), s.decayRatePerS(), motion, absorbers, observers,
                        senses, streamIndex));
            }
            totalSteps = lastStep;
        }
    }

    /** Receiver spheres of one kind for one emitter, with one number each (adsorption probability or offset). */
    private static final class Spheres {
        private final List<double[]> centres = new ArrayList<>();
        private final List<Double> radii = new ArrayList<>();
        private final List<Integer> indices = new ArrayList<>();
        private final List<Double> values = new ArrayList<>();

        void add(Node n, int receiverIndex, double value) {
            centres.add(n.positionUm().toArray());
            radii.add(n.radiusUm());
            indices.add(receiverIndex);
            values.add(value);
        }

        double[][] centres() {
            return centres.toArray(new double[0][]);
        }

        double[] radii() {
            return radii.stream().mapToDouble(Double::doubleValue).toArray();
        }

        int[] indices() {
            return indices.stream().mapToInt(Integer::intValue).toArray();
        }

        double[] values() {
            return values.stream().mapToDouble(Double::doubleValue).toArray();
        }

        int[] wholeValues() {
            return values.stream().mapToInt(Double::intValue).toArray();
        }

        boolean allOnes() {
            return values.stream().allMatch(v -> v >= 1);
        }
    }
}
