package dev.nanoplan.network;

import java.util.Arrays;

/**
 * Tail truncation of a long ISI memory: the leftovers of releases so old that, all together, they
 * are counted with negligible probability are dropped before the count laws are built.
 *
 * <p><b>Bound.</b> Given the taps p_0..p_L of one pair and at most n molecules per release, the
 * molecules of lags beyond L' that are counted in the current slot number Z, with
 * E[Z] ≤ n·Σ_{k&gt;L'} p_k. Dropping them couples the kept count Y' with the full count Y = Y' + Z, so
 * P(Y ≠ Y') ≤ P(Z ≥ 1) ≤ E[Z] (union bound over the molecules, i.e. Markov's inequality; exact as an
 * upper bound, no approximation). Hence each count pmf moves by at most that much in total variation
 * (the coupling inequality: D. A. Levin, Y. Peres and E. L. Wilmer, <i>Markov Chains and Mixing
 * Times</i>, 2009, Prop. 4.7), and so does the error probability of any decision rule. Over the pairs
 * heard by one receiver the bounds add. The same union bound is the "sum of p_k" term of L. Le Cam's
 * Poisson approximation inequality (Pacific J. Math. 10, 1960).
 *
 * <p><b>Rule.</b> The first {@value #ALWAYS_KEPT} lags are always kept (so every memory used by the
 * demo scenarios is planned exactly as before); beyond, the taps are cut after the first lag L' at
 * which n·Σ_{k&gt;L'} p_k ≤ {@value #BOUND} with n = {@value #MOLECULE_MARGIN} × the pair's molecules
 * (the margin covers budget searches that raise the molecules up to that factor). With a half-life
 * the taps fall exponentially and a memory of 10,000 keeps a few dozen lags; without decay they fall
 * like k^(−3/2) (tail like k^(−1/2)) and little or nothing can be dropped. Cost O(L).
 */
public final class IsiTail {

    /** Lags always kept. */
    public static final int ALWAYS_KEPT = 64;
    /** Largest expected number of dropped molecules counted per pair (at the margin), the TV bound. */
    public static final double BOUND = 1e-12;
    /** Factor on the pair's molecules covered by the bound. */
    public static final double MOLECULE_MARGIN = 1e3;

    private IsiTail() {
    }

    /**
     * Number of taps to keep, in [min(length, {@value #ALWAYS_KEPT} + 1), length].
     *
     * @param taps      p_0..p_L, each in [0, 1]
     * @param molecules molecules per release of the emitter, ≥ 0
     */
    public static int kept(double[] taps, double molecules) {
        if (!(molecules >= 0) || Double.isInfinite(molecules)) {
            throw new IllegalArgumentException("molecules: must be finite and >= 0, got " + molecules);
        }
        int floor = Math.min(taps.length, ALWAYS_KEPT + 1);
        double n = molecules * MOLECULE_MARGIN;
        double tail = 0; // Σ_{k ≥ len} p_k, summed from the smallest end
        int len = taps.length;
        while (len > floor && n * (tail + taps[len - 1]) <= BOUND) {
            tail += taps[len - 1];
            len--;
        }
        return len;
    }

    /** The first {@link #kept} taps (the array itself when nothing is dropped). */
    public static double[] truncate(double[] taps, double molecules) {
        int len = kept(taps, molecules);
        return len == taps.length ? taps : Arrays.copyOf(taps, len);
    }

    /** n·Σ_{k ≥ from} p_k: the bound on the total-variation change when taps from {@code from} on are dropped. */
    public static double droppedBound(double[] taps, int from, double molecules) {
        double tail = 0;
        for (int k = taps.length - 1; k >= from; k--) {
            tail += taps[k];
        }
        return molecules * tail;
    }
}
