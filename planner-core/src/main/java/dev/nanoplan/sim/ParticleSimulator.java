package dev.nanoplan.sim;

import dev.nanoplan.engine.Engine;
import dev.nanoplan.engine.LocalEngine;
import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.Scenario;
import java.util.function.BooleanSupplier;
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
 *   <li>receivers and relays sense their species and are transparent to others, by their
 *       scenario receiver model: an absorbing sphere counts a molecule once, at the first receiver
 *       it reaches, then removes it, crossings within a step counting with the Brownian-bridge
 *       probability; a reactive (Collins–Kimball) sphere adsorbs a molecule whose step ends inside
 *       it with probability κ√(πΔt/D) and reflects it otherwise (R. Erban and S. J. Chapman, Phys.
 *       Biol. 4, 2007; {@link Absorbers}); a passive observer counts the molecules inside it at its
 *       sampling instant of each slot, k·T + offset, and removes nothing ({@link Observers}; the
 *       run then lasts until the last sampling instant);</li>
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
 * sums). Each block is a work unit ({@link SimulationBlocks}) run by an {@link Engine}: a thread pool
 * by default, or a Spark cluster; progress is reported after each block; cancellation
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
     * Runs the simulation on a {@link LocalEngine} with {@link SimulationSettings#threads()} threads.
     *
     * @param scenario the layout
     * @param progress called after each finished block (from worker threads)
     * @param cancelled polled between blocks and during long blocks; once true, no new block
     *     starts and running blocks are abandoned
     * @return the simulated channel; {@code complete} false if cancelled
     * @throws IllegalArgumentException if the time step gives too many steps
     */
    public SimulatedChannel simulate(Scenario scenario, SimulationProgress progress, BooleanSupplier cancelled) {
        try (LocalEngine engine = new LocalEngine(settings.threads())) {
            return simulate(scenario, engine, progress, cancelled);
        }
    }

    /**
     * Runs the simulation's blocks ({@link SimulationBlocks}) on {@code engine}; the result is the same
     * on every engine.
     *
     * @param engine runs the blocks (its own threads or executors; {@link SimulationSettings#threads()}
     *     is then not used)
     * @see #simulate(Scenario, SimulationProgress, BooleanSupplier)
     */
    public SimulatedChannel simulate(Scenario scenario, Engine engine, SimulationProgress progress,
            BooleanSupplier cancelled) {
        SimulationBlocks blocks = blocks(scenario);
        return blocks.combine(engine.run(blocks, progress::update, cancelled));
    }

    /** The simulation of {@code scenario} with these settings as work units. */
    public SimulationBlocks blocks(Scenario scenario) {
        return new SimulationBlocks(scenario, settings.moleculesPerEmitter(), settings.seed(), timeStepS(scenario),
                settings.emitterIds());
    }
}
