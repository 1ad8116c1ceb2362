package dev.nanoplan.sim;

import dev.nanoplan.geometry.Vec3;
import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.Species;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.atomic.AtomicLong;
import java.util.function.BooleanSupplier;
import org.apache.commons.rng.JumpableUniformRandomProvider;
import org.apache.commons.rng.LongJumpableUniformRandomProvider;
import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.sampling.distribution.ZigguratSampler;
import org.apache.commons.rng.simple.RandomSource;

/**
 * Particle (Brownian dynamics) simulation of a scenario's channel: each emitter releases M
 * molecules at its centre at t = 0; the absorption times at the receivers, binned by symbol
 * time, give simulated taps p̂_k for slots k = 0..L (simulated until (L+1)T).
 *
 * <p>Model:
 * <ul>
 *   <li>molecules move independently; per step Δt each coordinate gains N(0, 2DΔt) plus the
 *       drift vΔt (none, uniform, or Poiseuille in a cylinder) — {@link Motion};</li>
 *   <li>walls reflect: box planes exactly, the cylinder's curved wall by radial mirroring
 *       (O(Δt) curvature error, see {@link Motion}); an open volume has no walls;</li>
 *   <li>receivers and relays are perfectly absorbing spheres for their species and transparent
 *       to others; a molecule is counted once, at the first receiver it reaches, then removed;
 *       crossings within a step count with the Brownian-bridge probability
 *       ({@link Absorbers});</li>
 *   <li>emitter bodies are transparent: a transmitter is a point source and its body neither
 *       absorbs nor reflects; a relay's own releases pass through its own body uncounted (it
 *       knows what it sent) but are absorbed by every other receiver of that species;</li>
 *   <li>first-order decay: each molecule's lifetime is drawn once, τ ~ Exp(λ), and the
 *       molecule is removed at the step nearest τ.</li>
 * </ul>
 *
 * <p>Engineering: molecules are simulated in blocks of {@value #BLOCK_SIZE} in
 * structure-of-arrays form ({@link MoleculeBlock}, {@value MoleculeBlock#STATE_BYTES_PER_MOLECULE}
 * bytes per molecule; one block per thread in flight). Block b of emitter e draws from its own
 * stream of the XoRoShiRo128++ generator (Commons RNG {@link RandomSource#XO_RO_SHI_RO_128_PP}
 * seeded from the master seed): emitter e's stream is the root after e long jumps (2^96 steps
 * each; e counts every emitter of the scenario, so a run of some emitters only,
 * {@link SimulationSettings#emitterIds()}, gives them the same taps as a run of all), block b's the emitter stream after b jumps (2^64 steps each), so streams never overlap
 * and results are bit-identical for a seed whatever the number of threads (counts are integer
 * sums). Blocks run on a fixed thread pool; progress is reported after each block; cancellation
 * is polled between blocks and every {@value BlockKernel#CANCEL_POLL_STEPS} steps, and a
 * cancelled result contains only the blocks that finished.
 *
 * <p>Cost: O(M × emitters × (L+1)T/Δt × spheres near each position) time.
 */
public final class ParticleSimulator {

    /** Molecules per block (fixed, so results do not depend on the number of threads). */
    public static final int BLOCK_SIZE = 4096;

    private final SimulationSettings settings;

    /** @param settings molecules, seed, time step, threads */
    public ParticleSimulator(SimulationSettings settings) {
        if (settings == null) {
            throw new IllegalArgumentException("settings: required");
        }
        this.settings = settings;
    }

    /** Simulates without progress reports or cancellation. */
    public static SimulatedChannel simulate(Scenario scenario, SimulationSettings settings) {
        return new ParticleSimulator(settings).simulate(scenario, SimulationProgress.NONE, () -> false);
    }

    /** The settings. */
    public SimulationSettings settings() {
        return settings;
    }

    /** Δt in s this simulator uses for the scenario (requested or automatic, aligned to T). */
    public double timeStepS(Scenario scenario) {
        double symbolTimeS = scenario.signalling().symbolTimeS();
        double requested = settings.timeStepS().orElse(TimeStepRule.automaticTimeStepS(scenario));
        return symbolTimeS / TimeStepRule.stepsPerSymbol(symbolTimeS, requested);
    }

    /** Whether receiver {@code r} absorbs what emitter {@code e} releases (never its own releases). */
    static boolean senses(Node e, Node r) {
        return e.role().emits() && r.role().absorbs() && r != e && r.species().equals(e.emitsSpecies());
    }

    /**
     * Runs the simulation.
     *
     * @param scenario the layout
     * @param progress called after each finished block (from worker threads)
     * @param cancelled polled between blocks and during long blocks; once true, no new block
     *     starts and running blocks are abandoned
     * @return the simulated channel; {@code complete} false if cancelled
     * @throws IllegalArgumentException if the time step gives too many steps
     */
    public SimulatedChannel simulate(Scenario scenario, SimulationProgress progress, BooleanSupplier cancelled) {
        Plan plan = new Plan(scenario);
        long total = settings.moleculesPerEmitter() * plan.emitters.size();
        AtomicLong done = new AtomicLong();
        int threads = (int) Math.min(settings.threads(), Math.max(1, plan.totalBlocks));
        ExecutorService pool = Executors.newFixedThreadPool(threads, r -> {
            Thread t = new Thread(r, "nanoplan-sim");
            t.setDaemon(true);
            return t;
        });
        try {
            List<Future<?>> futures = new ArrayList<>();
            for (int w = 0; w < threads; w++) {
                futures.add(pool.submit(() -> work(plan, progress, cancelled, done, total)));
            }
            for (Future<?> f : futures) {
                try {
                    f.get();
                } catch (ExecutionException e) {
                    Throwable c = e.getCause();
                    if (c instanceof RuntimeException re) {
                        throw re;
                    }
                    throw new IllegalStateException("simulation worker failed", c);
                } catch (InterruptedException e) {
                    Thread.currentThread().interrupt();
                    plan.stop = true;
                    break;
                }
            }
        } finally {
            pool.shutdownNow();
        }
        return plan.result();
    }

    private void work(Plan plan, SimulationProgress progress, BooleanSupplier cancelled, AtomicLong done, long total) {
        MoleculeBlock block = new MoleculeBlock(BLOCK_SIZE);
        BooleanSupplier stop = () -> plan.stop || cancelled.getAsBoolean();
        while (true) {
            if (stop.getAsBoolean()) {
                plan.stop = true;
                return;
            }
            Task t = plan.next();
            if (t == null) {
                return;
            }
            EmitterPlan ep = plan.emitters.get(t.emitter);
            block.release(ep.origin.x(), ep.origin.y(), ep.origin.z(), t.molecules, ep.decayRatePerS,
                    plan.timeStepS, t.rng);
            long[] counts = new long[plan.receivers.size() * plan.slots];
            ZigguratSampler.NormalizedGaussian g = ZigguratSampler.NormalizedGaussian.of(t.rng);
            boolean finished = BlockKernel.advance(ep.motion, ep.absorbers, block, 0, plan.totalSteps,
                    plan.stepsPerSlot, counts, plan.slots, t.rng, g, stop);
            if (!finished) {
                plan.stop = true;
                return;
            }
            plan.add(t.emitter, t.molecules, counts, block.moleculeSteps);
            progress.update(done.addAndGet(t.molecules), total);
        }
    }

    /** One block to simulate: its emitter, size and random stream. */
    private record Task(int emitter, int molecules, UniformRandomProvider rng) {
    }

    /** Per-emitter constants. */
    private record EmitterPlan(Node node, Species species, Vec3 origin, double decayRatePerS, Motion motion,
            Absorbers absorbers, boolean[] senses, int streamIndex) {
    }

    /** Shared state of one run: what to do, the block dispenser, and the totals. */
    private final class Plan {
        final Scenario scenario;
        final List<Node> receivers = new ArrayList<>();
        final List<EmitterPlan> emitters = new ArrayList<>();
        final double timeStepS;
        final int stepsPerSlot;
        final int slots;
        final int totalSteps;
        final long blocksPerEmitter;
        final long totalBlocks;
        volatile boolean stop;
        // dispenser state (guarded by this)
        private final LongJumpableUniformRandomProvider root;
        private JumpableUniformRandomProvider emitterStream;
        private int nextEmitter;
        private int jumps;
        private long nextBlock;
        // totals (guarded by this)
        private final long[][] counts;
        private final long[] simulated;
        private final long[] moleculeSteps;

        Plan(Scenario scenario) {
            this.scenario = scenario;
            Map<String, Species> species = scenario.speciesByName();
            for (Node n : scenario.nodes()) {
                if (n.role().absorbs()) {
                    receivers.add(n);
                }
            }
            timeStepS = timeStepS(scenario);
            stepsPerSlot = TimeStepRule.stepsPerSymbol(scenario.signalling().symbolTimeS(), timeStepS);
            slots = scenario.signalling().isiMemorySymbols() + 1;
            long steps = (long) stepsPerSlot * slots;
            if (steps > Integer.MAX_VALUE) {
                throw new IllegalArgumentException("timeStepS: " + timeStepS + " s needs " + steps
                        + " steps to cover " + slots + " symbol times; use a larger time step or a shorter ISI memory");
            }
            totalSteps = (int) steps;
            int streamIndex = -1;
            for (Node e : scenario.nodes()) {
                if (!e.role().emits()) {
                    continue;
                }
                streamIndex++;
                if (!settings.simulates(e.id())) {
                    continue;
                }
                Species s = species.get(e.emitsSpecies());
                Motion motion = new Motion(scenario.volume(), scenario.medium().flow(), s.diffusionUm2PerS(), timeStepS);
                List<double[]> centres = new ArrayList<>();
                List<Double> radii = new ArrayList<>();
                List<Integer> index = new ArrayList<>();
                boolean[] senses = new boolean[receivers.size()];
                for (int r = 0; r < receivers.size(); r++) {
                    Node rn = receivers.get(r);
                    if (senses(e, rn)) {
                        senses[r] = true;
                        centres.add(rn.positionUm().toArray());
                        radii.add(rn.radiusUm());
                        index.add(r);
                    }
                }
                Absorbers absorbers = new Absorbers(centres.toArray(new double[0][]),
                        radii.stream().mapToDouble(Double::doubleValue).toArray(),
                        index.stream().mapToInt(Integer::intValue).toArray(),
                        motion.sigmaUm, motion.diffusionTimesStepUm2);
                emitters.add(new EmitterPlan(e, s, e.positionUm(), s.decayRatePerS(), motion, absorbers, senses,
                        streamIndex));
            }
            long m = settings.moleculesPerEmitter();
            blocksPerEmitter = (m + BLOCK_SIZE - 1) / BLOCK_SIZE;
            totalBlocks = blocksPerEmitter * emitters.size();
            root = (LongJumpableUniformRandomProvider) RandomSource.XO_RO_SHI_RO_128_PP.create(settings.seed());
            counts = new long[emitters.size()][receivers.size() * slots];
            simulated = new long[emitters.size()];
            moleculeSteps = new long[emitters.size()];
        }

        /** The next block in (emitter, block) order, its stream derived by jumps; null when none is left. */
        synchronized Task next() {
            if (stop || nextEmitter >= emitters.size()) {
                return null;
            }
            if (nextBlock == 0) {
                // emitter k of the scenario draws from the root's state after k long jumps, whichever are simulated
                int target = emitters.get(nextEmitter).streamIndex;
                while (jumps <= target) {
                    emitterStream = root.longJump();
                    jumps++;
                }
            }
            UniformRandomProvider rng = emitterStream.jump();
            long first = nextBlock * BLOCK_SIZE;
            int n = (int) Math.min(BLOCK_SIZE, settings.moleculesPerEmitter() - first);
            Task t = new Task(nextEmitter, n, rng);
            if (++nextBlock == blocksPerEmitter) {
                nextBlock = 0;
                nextEmitter++;
            }
            return t;
        }

        synchronized void add(int emitter, int molecules, long[] blockCounts, long steps) {
            long[] c = counts[emitter];
            for (int i = 0; i < c.length; i++) {
                c[i] += blockCounts[i];
            }
            simulated[emitter] += molecules;
            moleculeSteps[emitter] += steps;
        }

        synchronized SimulatedChannel result() {
            List<String> emitterIds = new ArrayList<>();
            List<EmitterRun> runs = new ArrayList<>();
            List<String> receiverIds = receivers.stream().map(Node::id).toList();
            boolean complete = true;
            for (int e = 0; e < emitters.size(); e++) {
                EmitterPlan ep = emitters.get(e);
                emitterIds.add(ep.node.id());
                List<SimulatedTaps> taps = new ArrayList<>();
                long absorbed = 0;
                for (int r = 0; r < receivers.size(); r++) {
                    long[] perSlot = new long[slots];
                    System.arraycopy(counts[e], r * slots, perSlot, 0, slots);
                    for (long v : perSlot) {
                        absorbed += v;
                    }
                    taps.add(new SimulatedTaps(ep.node.id(), receivers.get(r).id(), ep.senses[r], simulated[e], perSlot));
                }
                complete &= simulated[e] == settings.moleculesPerEmitter();
                runs.add(new EmitterRun(ep.node.id(), ep.species.name(), simulated[e], simulated[e] - absorbed,
                        moleculeSteps[e], taps));
            }
            return new SimulatedChannel(emitterIds, receiverIds, scenario.signalling().symbolTimeS(),
                    slots - 1, timeStepS, settings.seed(), settings.moleculesPerEmitter(), complete, runs);
        }
    }
}
