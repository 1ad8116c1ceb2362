package dev.nanoplan.sim;

import dev.nanoplan.network.ChannelEntry;
import dev.nanoplan.network.ChannelMatrix;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.function.Function;

/**
 * Turns a {@link SimulatedChannel} into the {@link ChannelMatrix} the planner consumes
 * (docs/architecture.md §5.5: the simulator yields the same matrix as the closed forms).
 *
 * <p>One entry per emitter → receiver pair whose receiver absorbs the emitter's species
 * ({@link SimulatedTaps#senses()}; a relay's own releases and other species are left out), with
 * taps p̂_0..p̂_L = counts / M, source {@value ChannelMatrix#SIMULATED} and no model caveat.
 * Pairs no simulated molecule reached keep all-zero taps (an estimate of "below 1/M", not an
 * absent pair). The matrix notes state M, the seed, Δt and the largest tap standard error.
 * Cost O(emitters × receivers × (L+1)).
 */
public final class SimulatedChannelMatrix {

    private SimulatedChannelMatrix() {
    }

    /**
     * The channel matrix of a simulation.
     *
     * @param channel a simulation result; every emitter must have simulated at least one molecule
     * @return entries in (emitter, receiver) order of the simulation
     * @throws IllegalArgumentException if an emitter has no simulated molecule
     */
    public static ChannelMatrix of(SimulatedChannel channel) {
        return of(channel, t -> "particle simulation requested");
    }

    /**
     * As {@link #of(SimulatedChannel)}, each entry's reason being {@code why} of its taps followed by the
     * hits it rests on; a pair with fewer than {@link SimulationPrecision#MIN_HITS} hits over the memory
     * says "insufficient molecules" with the molecules per emitter that would give enough, and a note
     * counts such pairs.
     */
    public static ChannelMatrix of(SimulatedChannel channel, Function<SimulatedTaps, String> why) {
        if (channel == null) {
            throw new IllegalArgumentException("channel: required");
        }
        List<ChannelEntry> entries = new ArrayList<>();
        double maxSe = 0;
        int zeroPairs = 0;
        int fewHits = 0;
        for (EmitterRun run : channel.emitters()) {
            if (run.moleculesSimulated() == 0) {
                throw new IllegalArgumentException("channel: emitter " + run.emitterId()
                        + " has no simulated molecule; its taps are unknown");
            }
            for (SimulatedTaps t : run.receivers()) {
                if (!t.senses()) {
                    continue;
                }
                for (double se : t.tapsStandardError()) {
                    maxSe = Math.max(maxSe, se);
                }
                if (t.absorbedTotal() == 0) {
                    zeroPairs++;
                }
                long hits = t.absorbedTotal();
                String precision;
                if (SimulationPrecision.insufficient(hits)) {
                    fewHits++;
                    precision = SimulationPrecision.describe(hits, t.moleculesSimulated(),
                            SimulationPrecision.estimate(hits, t.moleculesSimulated(), 0), "over the memory");
                } else {
                    precision = String.format(Locale.ROOT, "%d hits of %d released", hits, t.moleculesSimulated());
                }
                entries.add(new ChannelEntry(t.emitterId(), t.receiverId(), run.species(), t.taps(),
                        ChannelMatrix.SIMULATED, null, why.apply(t) + "; " + precision));
            }
        }
        List<String> notes = new ArrayList<>();
        notes.add(String.format(Locale.ROOT,
                "simulated channel: %d molecules per emitter%s, seed %d, dt %.3g s; largest tap standard error %.2g",
                channel.moleculesRequestedPerEmitter(),
                channel.complete() ? "" : " requested (run stopped early: " + channel.moleculesSimulated()
                        + " finished in all)", channel.seed(), channel.timeStepS(), maxSe));
        if (zeroPairs > 0) {
            notes.add(String.format(Locale.ROOT,
                    "simulated channel: %d pair(s) caught no molecule; their taps are 0 (true value below about %.2g)",
                    zeroPairs, 3.0 / channel.moleculesRequestedPerEmitter()));
        }
        if (fewHits > 0) {
            notes.add(String.format(Locale.ROOT, "simulated channel: %d pair(s) with fewer than %d hits over the "
                    + "memory: insufficient molecules, their taps are rough (channel_reason names the molecules per "
                    + "emitter needed)", fewHits, SimulationPrecision.MIN_HITS));
        }
        return ChannelMatrix.of(entries, notes);
    }
}
