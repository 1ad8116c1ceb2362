package dev.nanoplan.detect;

import dev.nanoplan.count.CountPmf;
import java.util.List;

/**
 * Mutual information of a multi-level quantizer as its first threshold moves while the other
 * thresholds and the input distribution stay fixed: the curve a user reads to see how sharp
 * the optimum is.
 *
 * <p>Cell masses come from prefix sums of each level's pmf, so the sweep costs
 * O(W·M²) for a window of W counts and M levels. Mass truncated from a pmf's window is ignored
 * (it is below 1e-15 by construction of the count models).
 */
public final class FirstThresholdSweep {

    /** The curve: {@code miBits[i]} is the MI when the first threshold is {@code firstThreshold + i}. */
    public record Curve(long firstThreshold, double[] miBits) {
        public Curve {
            miBits = miBits.clone();
        }

        @Override
        public double[] miBits() {
            return miBits.clone();
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
        long lo = Long.MAX_VALUE;
        long hi = Long.MIN_VALUE;
        for (CountPmf p : givenLevel) {
            lo = Math.min(lo, p.offset());
            hi = Math.max(hi, p.last());
        }
        int w = (int) (hi - lo + 1);
        // cdf[i][k] = P(Y < lo + k | level i), k = 0..w
        double[][] cdf = new double[m][w + 1];
        for (int i = 0; i < m; i++) {
            CountPmf p = givenLevel.get(i);
            double s = 0;
            for (int k = 0; k < w; k++) {
                cdf[i][k] = s;
                s += p.probability(lo + k);
            }
            cdf[i][w] = s;
        }
        long from = lo + 1;
        long to = m > 2 ? thresholds[1] - 1 : hi;
        if (to < from) {
            to = from;
        }
        double[] mi = new double[(int) (to - from + 1)];
        long[] cuts = thresholds.clone();
        double[][] ch = new double[m][m];
        for (long t = from; t <= to; t++) {
            cuts[0] = t;
            for (int i = 0; i < m; i++) {
                double prev = 0;
                for (int j = 0; j < m; j++) {
                    double upTo = j < m - 1 ? cdf[i][(int) Math.min(w, Math.max(0, cuts[j] - lo))] : cdf[i][w];
                    ch[i][j] = Math.max(0, upTo - prev) / cdf[i][w];
                    prev = Math.max(prev, upTo);
                }
            }
            mi[(int) (t - from)] = mutualInformationBits(ch, input);
        }
        return new Curve(from, mi);
    }

    /** I(X;Y) in bits of channel w[x][y] with input distribution px; never negative. */
    static double mutualInformationBits(double[][] w, double[] px) {
        int m = w.length;
        int n = w[0].length;
        double[] qy = new double[n];
        for (int i = 0; i < m; i++) {
            for (int j = 0; j < n; j++) {
                qy[j] += px[i] * w[i][j];
            }
        }
        double s = 0;
        for (int i = 0; i < m; i++) {
            if (px[i] == 0) {
                continue;
            }
            for (int j = 0; j < n; j++) {
                if (w[i][j] > 0) {
                    s += px[i] * w[i][j] * Math.log(w[i][j] / qy[j]);
                }
            }
        }
        return Math.max(0, s / Math.log(2));
    }
}
