package dev.nanoplan.network;

import java.util.Arrays;
import java.util.Objects;

/**
 * Taps of one emitter → receiver pair that share a species (the emitter's emitted species is the
 * receiver's absorbed species).
 *
 * @param emitter     emitter node id
 * @param receiver    receiver node id
 * @param species     the species carried
 * @param taps        p_0..p_L: probability that one molecule released at the start of slot 0 is
 *                    counted in slot k; each in [0, 1], summing to at most 1
 * @param source      how the taps were obtained: {@value ChannelMatrix#ANALYTIC} or
 *                    {@value ChannelMatrix#SIMULATED} (or any other non-blank word)
 * @param modelCaveat null, "walls", "flow" or "walls+flow" when the open-medium closed form may be
 *                    wrong for this pair; null for simulated taps
 * @param channelReason why this pair's taps come from {@code source}, in words (the verdict of
 *                    {@link ChannelApplicability} for closed-form taps, what the simulation caught for
 *                    simulated ones), or null when nobody said
 */
public record ChannelEntry(String emitter, String receiver, String species, double[] taps, String source,
        String modelCaveat, String channelReason) {

    /** An entry without a stated reason. */
    public ChannelEntry(String emitter, String receiver, String species, double[] taps, String source,
            String modelCaveat) {
        this(emitter, receiver, species, taps, source, modelCaveat, null);
    }

    public ChannelEntry {
        if (emitter == null || emitter.isBlank()) {
            throw new IllegalArgumentException("emitter: must be a non-blank id");
        }
        if (receiver == null || receiver.isBlank()) {
            throw new IllegalArgumentException("receiver: must be a non-blank id");
        }
        if (emitter.equals(receiver)) {
            throw new IllegalArgumentException("receiver: a node does not count its own releases, got " + emitter);
        }
        if (species == null || species.isBlank()) {
            throw new IllegalArgumentException("species: must be non-blank");
        }
        if (source == null || source.isBlank()) {
            throw new IllegalArgumentException("source: must be non-blank");
        }
        if (taps == null || taps.length == 0) {
            throw new IllegalArgumentException("taps: at least one tap is needed");
        }
        taps = taps.clone();
        double sum = 0;
        for (int k = 0; k < taps.length; k++) {
            if (!(taps[k] >= 0 && taps[k] <= 1)) {
                throw new IllegalArgumentException("taps[" + k + "]: must be in [0, 1], got " + taps[k]);
            }
            sum += taps[k];
        }
        if (sum > 1 + 1e-9) {
            throw new IllegalArgumentException("taps: must sum to at most 1, got " + sum);
        }
    }

    @Override
    public double[] taps() {
        return taps.clone();
    }

    /** This entry with another source and reason (same pair, species, taps and caveat). */
    public ChannelEntry withReason(String newSource, String reason) {
        return new ChannelEntry(emitter, receiver, species, taps, newSource, modelCaveat, reason);
    }

    /** Tap k without copying. */
    public double tap(int k) {
        return taps[k];
    }

    /** Σ_k p_k: fraction of one release counted within the memory. */
    public double tapSum() {
        double s = 0;
        for (double p : taps) {
            s += p;
        }
        return s;
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof ChannelEntry e && emitter.equals(e.emitter) && receiver.equals(e.receiver)
                && species.equals(e.species) && Arrays.equals(taps, e.taps) && source.equals(e.source)
                && Objects.equals(modelCaveat, e.modelCaveat) && Objects.equals(channelReason, e.channelReason);
    }

    @Override
    public int hashCode() {
        return emitter.hashCode() * 31 + receiver.hashCode();
    }

    @Override
    public String toString() {
        return "ChannelEntry[" + emitter + "->" + receiver + " " + species + " " + Arrays.toString(taps) + " "
                + source + (modelCaveat == null ? "" : " caveat=" + modelCaveat) + "]";
    }
}
