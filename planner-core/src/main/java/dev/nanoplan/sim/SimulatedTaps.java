package dev.nanoplan.sim;

import java.util.Arrays;
import java.util.Objects;

/**
 * Simulated absorption-time histogram of one emitter → receiver pair.
 *
 * <p>Tap estimate p̂_k = count_k / M, the fraction of the M released molecules absorbed by this
 * receiver in slot k = [kT, (k+1)T) (for a passive observer: inside it at its sampling instant of
 * slot k); standard error √(p̂_k(1 − p̂_k)/M) (binomial). An absorbing or reactive receiver counts
 * a molecule at most once, a passive observer once per slot it is inside at the sampling instant,
 * so only each slot's count is bounded by M.
 *
 * @param emitterId the releasing node
 * @param receiverId the absorbing node
 * @param senses whether the receiver absorbs the emitter's species (false: other species, or a
 *     relay's own releases, which pass through its body; counts are then all zero)
 * @param moleculesSimulated M, molecules released whose trajectories finished, ≥ 0
 * @param absorbedPerSlot molecules absorbed in slot k (passive: inside at slot k's sampling instant),
 *     k = 0..L (copied)
 */
public record SimulatedTaps(String emitterId, String receiverId, boolean senses, long moleculesSimulated,
        long[] absorbedPerSlot) {

    /** @throws IllegalArgumentException if a count is negative or exceeds M */
    public SimulatedTaps {
        if (moleculesSimulated < 0) {
            throw new IllegalArgumentException("moleculesSimulated: must be >= 0, got " + moleculesSimulated);
        }
        absorbedPerSlot = absorbedPerSlot.clone();
        for (long c : absorbedPerSlot) {
            if (c < 0) {
                throw new IllegalArgumentException("absorbedPerSlot: counts must be >= 0, got " + c);
            }
            if (c > moleculesSimulated) {
                throw new IllegalArgumentException("absorbedPerSlot: count " + c + " exceeds moleculesSimulated "
                        + moleculesSimulated);
            }
        }
    }

    /** A copy of the counts. */
    @Override
    public long[] absorbedPerSlot() {
        return absorbedPerSlot.clone();
    }

    /** p̂_0..p̂_L; all zero when no molecule was simulated. */
    public double[] taps() {
        double[] p = new double[absorbedPerSlot.length];
        for (int k = 0; k < p.length; k++) {
            p[k] = fraction(absorbedPerSlot[k]);
        }
        return p;
    }

    /** Binomial standard errors √(p̂_k(1 − p̂_k)/M). */
    public double[] tapsStandardError() {
        double[] s = new double[absorbedPerSlot.length];
        for (int k = 0; k < s.length; k++) {
            s[k] = standardError(fraction(absorbedPerSlot[k]));
        }
        return s;
    }

    /** p̂_0 = simulated F(T), the fraction absorbed within the first symbol time. */
    public double hitProbability() {
        return absorbedPerSlot.length == 0 ? 0 : fraction(absorbedPerSlot[0]);
    }

    /** Standard error of {@link #hitProbability()}. */
    public double hitProbabilityStandardError() {
        return standardError(hitProbability());
    }

    /** Molecules absorbed in all slots, k = 0..L. */
    public long absorbedTotal() {
        long s = 0;
        for (long c : absorbedPerSlot) {
            s += c;
        }
        return s;
    }

    private double fraction(long count) {
        return moleculesSimulated == 0 ? 0 : (double) count / moleculesSimulated;
    }

    private double standardError(double p) {
        return moleculesSimulated == 0 ? 0 : Math.sqrt(p * (1 - p) / moleculesSimulated);
    }

    @Override
    public boolean equals(Object o) {
        // every component, arrays by content
        return o instanceof SimulatedTaps other
                && Objects.equals(emitterId, other.emitterId)
                && Objects.equals(receiverId, other.receiverId)
                && senses == other.senses
                && moleculesSimulated == other.moleculesSimulated
                && Arrays.equals(absorbedPerSlot, other.absorbedPerSlot);
    }

    @Override
    public int hashCode() {
        int h = Objects.hash(emitterId, receiverId, senses, moleculesSimulated);
        h = 31 * h + Arrays.hashCode(absorbedPerSlot);
        return h;
    }
}
