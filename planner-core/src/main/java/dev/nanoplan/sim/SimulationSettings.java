package dev.nanoplan.sim;

import java.util.OptionalDouble;
import java.util.Set;

/**
 * Settings of one particle simulation.
 *
 * @param moleculesPerEmitter M, molecules released by each emitter, ≥ 1
 * @param seed master seed; every result is a function of the scenario, M, Δt and this seed only
 *     (not of the number of threads)
 * @param timeStepS Δt in s, finite and &gt; 0, or empty to choose it from the geometry
 *     ({@link TimeStepRule}); either way it is shortened so that the symbol time is a whole
 *     number of steps
 * @param threads worker threads, ≥ 1
 * @param emitterIds the emitters to simulate (ids); empty for every emitter. Emitter e always draws from
 *     the same random stream (its index among all emitters), so its taps do not depend on which others
 *     are simulated
 */
public record SimulationSettings(long moleculesPerEmitter, long seed, OptionalDouble timeStepS, int threads,
        Set<String> emitterIds) {

    /** Settings that simulate every emitter. */
    public SimulationSettings(long moleculesPerEmitter, long seed, OptionalDouble timeStepS, int threads) {
        this(moleculesPerEmitter, seed, timeStepS, threads, Set.of());
    }

    /**
     * Default M for the command line: 2·10⁴ molecules per emitter puts the binomial standard error
     * of a hit probability p at √(p(1 − p)/M) ≤ 0.0036 (0.1 % absolute near p = 0.02) and keeps a
     * layout of a few emitters within a minute or two on 2 cores.
     */
    public static final long DEFAULT_MOLECULES_PER_EMITTER = 20_000;

    /** @throws IllegalArgumentException naming the bad parameter */
    public SimulationSettings {
        if (moleculesPerEmitter < 1) {
            throw new IllegalArgumentException("moleculesPerEmitter: must be >= 1, got " + moleculesPerEmitter);
        }
        if (timeStepS == null) {
            throw new IllegalArgumentException("timeStepS: must not be null (use OptionalDouble.empty())");
        }
        if (timeStepS.isPresent()) {
            double dt = timeStepS.getAsDouble();
            if (!(dt > 0) || !Double.isFinite(dt)) {
                throw new IllegalArgumentException("timeStepS: must be finite and > 0, got " + dt);
            }
        }
        if (threads < 1) {
            throw new IllegalArgumentException("threads: must be >= 1, got " + threads);
        }
        if (emitterIds == null) {
            throw new IllegalArgumentException("emitterIds: must not be null (use Set.of() for every emitter)");
        }
        emitterIds = Set.copyOf(emitterIds);
    }

    /** M molecules per emitter, the given seed, automatic Δt, one thread per available processor. */
    public static SimulationSettings of(long moleculesPerEmitter, long seed) {
        return new SimulationSettings(moleculesPerEmitter, seed, OptionalDouble.empty(),
                Runtime.getRuntime().availableProcessors());
    }

    /** The same settings with a fixed time step. */
    public SimulationSettings withTimeStepS(double dt) {
        return new SimulationSettings(moleculesPerEmitter, seed, OptionalDouble.of(dt), threads, emitterIds);
    }

    /** The same settings with another number of threads. */
    public SimulationSettings withThreads(int n) {
        return new SimulationSettings(moleculesPerEmitter, seed, timeStepS, n, emitterIds);
    }

    /** The same settings simulating only the emitters {@code ids} (empty: every emitter). */
    public SimulationSettings withEmitters(Set<String> ids) {
        return new SimulationSettings(moleculesPerEmitter, seed, timeStepS, threads, ids);
    }

    /** Whether emitter {@code id} is simulated. */
    public boolean simulates(String id) {
        return emitterIds.isEmpty() || emitterIds.contains(id);
    }
}
