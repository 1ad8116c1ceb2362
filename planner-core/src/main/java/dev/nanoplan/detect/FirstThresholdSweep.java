package dev.nanoplan.detect;

import dev.nanoplan.count.CountPmf;
import java.util.Arrays;
import java.util.List;

/**
 * Mutual information of a multi-level quantizer as its first threshold moves while the other
 * thresholds and the input distribution stay fixed: the curve a user reads to see how sharp
 * the optimum is.
 *
 * <p>Uses the same count window and cell-mass mutual information as {@link MultiLevelQuantizer}
 * (truncated mass included at the window edges); O(W·M) per point for a window of W counts.
 */
public final class FirstThresholdSweep {

    private static final double LN2 = Math.log(2);

    /** The curve: {@code miBits[i]} is the MI when the first threshold is {@code firstThreshold + i}. */
    public record Curve(long firstThreshold, double[] miBits) {
        public Curve {
            miBits = miBits.clone();
        }

        @Override
        public double[] miBits() {
            return miBits.clone();
        }

        @Override
        public boolean equals(Object o) {
            // every component, arrays by content
            return o instanceof Curve other && firstThreshold == other.firstThreshold
                    && Arrays.equals(miBits, other.miBits);
        }

        @Override
        public int hashCode() {
            return 31 * Long.hashCode(firstThreshold) + Arrays.hashCode(miBits);
        }

        @Override
        public String toString() {
            return "Curve[firstThreshold=" + firstThreshold + ", miBits=" + Arrays.toString(miBits) + "]";
        }
    }

    private FirstThresholdSweep() {
    }

    /**
     * @param givenLevel  pmf of the count given each level (M ≥ 2)
     * @param thresholds  M−1 strictly increasing thresholds; the first one is swept over
     *                    [lowest count + 1, thresholds[1] − 1] (or the window's end for M = 2)
     * @param input       input distribution, M entries summing to 1
     */
    public static Curve sweep(List<CountPmf> givenLevel, long[] thresholds, double[] input) {
        int m = givenLevel.size();
        if (m < 2 || thresholds.length != m - 1 || input.length != m) {
            throw new IllegalArgumentException("need M >= 2 pmfs, M - 1 thresholds and M input probabilities");
        }
        CountWindow w = CountWindow.of(givenLevel);
        int[] cuts = new int[m - 1];
        for (int j = 0; j < m - 1; j++) {
            cuts[j] = (int) Math.max(0, Math.min(w.size, thresholds[j] - w.first));
        }
        int from = 1;
        int to = m > 2 ? cuts[1] - 1 : w.size - 1;
        if (to < from) {
            to = from;
        }
        double[] mi = new double[to - from + 1];
        for (int c = from; c <= to; c++) {
            cuts[0] = c;
            mi[c - from] = MultiLevelQuantizer.miNats(w, input, cuts) / LN2;
        }
        return new Curve(w.first + from, mi);
    }
}
