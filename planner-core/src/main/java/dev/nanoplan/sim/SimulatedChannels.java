package dev.nanoplan.sim;

import dev.nanoplan.scenario.Scenario;
import java.io.IOException;
import java.nio.file.Path;
import java.util.Optional;
import java.util.function.BooleanSupplier;

/**
 * The one way to get the simulated channel of a layout, for every shell (command line and
 * desktop): from the {@link ChannelCache} when it holds the same physics, M, seed and Δt, else by
 * running the simulation, and storing the result when it is complete and was not cancelled.
 *
 * <p>A failed store does not lose the simulation: it is returned in {@link Obtained#storeFailure()}
 * and the caller decides whether that is an error (the command line) or a note (the desktop).
 */
public final class SimulatedChannels {

    private SimulatedChannels() {
    }

    /**
     * A simulated channel and where it came from.
     *
     * @param channel the channel, with the current scenario's ids (possibly incomplete when the run was stopped)
     * @param fromCache true when read from the cache (no simulation ran)
     * @param file the cache file of this key, or null without a cache
     * @param stored true when a new complete run was written to the cache
     * @param reSimulated true when the cache was ignored on request
     * @param storeFailure why a complete run could not be stored, or null
     */
    public record Obtained(SimulatedChannel channel, boolean fromCache, Path file, boolean stored,
            boolean reSimulated, Exception storeFailure) {

        /** Where the channel came from, in words: "from cache", "simulated, cached", … */
        public String source() {
            if (fromCache) {
                return "from cache";
            }
            if (storeFailure != null) {
                return "simulated (not cached: " + storeFailure.getMessage() + ")";
            }
            if (stored) {
                return reSimulated ? "re-simulated, cache updated" : "simulated, cached";
            }
            return "simulated";
        }

        /** Throws {@link #storeFailure()}, if any, for callers to whom a failed store is an error. */
        public void throwStoreFailure() throws IOException {
            if (storeFailure instanceof IOException e) {
                throw e;
            }
            if (storeFailure instanceof RuntimeException e) {
                throw e;
            }
        }
    }

    /** Called once, just before a simulation runs (after a cache miss, or when the cache is ignored). */
    @FunctionalInterface
    public interface MissListener {
        /** @param timeStepS the Δt the simulation will use, s */
        void simulating(double timeStepS);
    }

    /**
     * The simulated channel of {@code scenario} for {@code settings}.
     *
     * @param cache the cache, or null to always simulate and store nothing
     * @param ignoreCache true to simulate even when the cache holds the channel (the new run replaces it)
     * @param simulation runs the simulation (normally {@link ParticleSimulator#simulate} with progress and
     *        cancellation), called at most once
     * @param cancelled true once the caller gave up: a run finished after that is not stored
     * @param onMiss told before a simulation runs
     */
    public static Obtained obtain(Scenario scenario, SimulationSettings settings, ChannelCache cache,
            boolean ignoreCache, ChannelCache.Simulation simulation, BooleanSupplier cancelled, MissListener onMiss) {
        double dt = new ParticleSimulator(settings).timeStepS(scenario);
        String key = null;
        Path file = null;
        if (cache != null) {
            key = ChannelCache.key(scenario, settings.moleculesPerEmitter(), settings.seed(), dt,
                    settings.emitterIds());
            file = cache.file(key);
            if (!ignoreCache) {
                Optional<SimulatedChannel> cached = cache.load(scenario, key);
                if (cached.isPresent()) {
                    return new Obtained(cached.get(), true, file, false, false, null);
                }
            }
        }
        onMiss.simulating(dt);
        SimulatedChannel channel = simulation.run(scenario);
        if (cache == null || !channel.complete() || cancelled.getAsBoolean()) {
            return new Obtained(channel, false, file, false, ignoreCache, null);
        }
        try {
            cache.store(key, channel, scenario);
            return new Obtained(channel, false, file, true, ignoreCache, null);
        } catch (IOException | RuntimeException e) {
            return new Obtained(channel, false, file, false, ignoreCache, e);
        }
    }
}
