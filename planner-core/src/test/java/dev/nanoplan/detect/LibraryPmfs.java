package dev.nanoplan.detect;

import dev.nanoplan.count.CountPmf;
import org.apache.commons.statistics.distribution.DiscreteDistribution;

/** Builds count pmf windows from Commons Statistics distributions, for tests. */
final class LibraryPmfs {

    private LibraryPmfs() {
    }

    /** Window [lo, hi] with the library's exact truncated tail masses. */
    static CountPmf window(DiscreteDistribution d, long lo, long hi) {
        double[] m = new double[(int) (hi - lo + 1)];
        for (int k = 0; k < m.length; k++) {
            m[k] = d.probability((int) (lo + k));
        }
        double below = lo > 0 ? d.cumulativeProbability((int) (lo - 1)) : 0;
        double above = d.survivalProbability((int) hi);
        return new CountPmf(lo, m, below, above);
    }

    /** Window trimmed where the library puts less than {@code tail} in each tail. */
    static CountPmf trimmed(DiscreteDistribution d, double tail) {
        long lo = Math.max(0, d.inverseCumulativeProbability(tail) - 1);
        long hi = d.inverseSurvivalProbability(tail) + 1;
        return window(d, lo, hi);
    }

    /** Window covering the whole support [0, n]. */
    static CountPmf full(DiscreteDistribution d, int n) {
        return window(d, 0, n);
    }
}
