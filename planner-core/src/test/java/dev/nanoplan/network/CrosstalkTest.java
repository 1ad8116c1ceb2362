package dev.nanoplan.network;

import static org.assertj.core.api.Assertions.assertThat;

import dev.nanoplan.count.CountModelKind;
import dev.nanoplan.info.BinaryChannel;
import java.util.ArrayList;
import java.util.List;
import org.apache.commons.statistics.distribution.BinomialDistribution;
import org.apache.commons.statistics.distribution.PoissonDistribution;
import org.junit.jupiter.api.Test;

class CrosstalkTest {

    private static final int MAX = 400;

    /** pmf on 0..MAX of the sum of Bin(n_i, p_i) and Poisson(b), by direct convolution of library pmfs. */
    private static double[] pmf(List<long[]> trials, List<Double> probs, double b) {
        double[] acc = new double[MAX + 1];
        PoissonDistribution pois = PoissonDistribution.of(Math.max(b, 1e-300));
        for (int y = 0; y <= MAX; y++) {
            acc[y] = b == 0 ? (y == 0 ? 1 : 0) : pois.probability(y);
        }
        for (int i = 0; i < trials.size(); i++) {
            int n = (int) trials.get(i)[0];
            BinomialDistribution bin = BinomialDistribution.of(n, probs.get(i));
            double[] next = new double[MAX + 1];
            for (int y = 0; y <= MAX; y++) {
                if (acc[y] == 0) {
                    continue;
                }
                for (int k = 0; k <= n && y + k <= MAX; k++) {
                    next[y + k] += acc[y] * bin.probability(k);
                }
            }
            acc = next;
        }
        return acc;
    }

    /** Brute force over all bit histories of both emitters, then the best threshold. */
    private static double bruteForceCapacity(double[] own, long n, double[] other, long m, double q, double b) {
        int l = own.length - 1;
        double[][] given = new double[2][MAX + 1];
        for (int x0 = 0; x0 <= 1; x0++) {
            for (int hist = 0; hist < (1 << l); hist++) {
                for (int ih = 0; ih < (1 << (l + 1)); ih++) {
                    double w = 1;
                    List<long[]> tr = new ArrayList<>();
                    List<Double> pr = new ArrayList<>();
                    tr.add(new long[] {x0 * n});
                    pr.add(own[0]);
                    for (int k = 1; k <= l; k++) {
                        int bit = (hist >> (k - 1)) & 1;
                        w *= bit == 1 ? q : 1 - q;
                        tr.add(new long[] {bit * n});
                        pr.add(own[k]);
                    }
                    for (int k = 0; k <= l; k++) {
                        int bit = (ih >> k) & 1;
                        w *= bit == 1 ? q : 1 - q;
                        tr.add(new long[] {bit * m});
                        pr.add(other[k]);
                    }
                    double[] p = pmf(tr, pr, b);
                    for (int y = 0; y <= MAX; y++) {
                        given[x0][y] += w * p[y];
                    }
                }
            }
        }
        double best = 0;
        for (int tau = 0; tau <= MAX + 1; tau++) {
            double e0 = 0;
            double e1 = 0;
            for (int y = 0; y <= MAX; y++) {
                if (y >= tau) {
                    e0 += given[0][y];
                } else {
                    e1 += given[1][y];
                }
            }
            best = Math.max(best, BinaryChannel.capacity(Math.min(1, e0), Math.min(1, e1)).bits());
        }
        return best;
    }

    @Test
    void threeNodeCrosstalkMatchesBruteForceOverBitHistories() {
        double[] own = {0.05, 0.02, 0.01};
        double[] other = {0.02, 0.015, 0.01};
        long n = 100;
        long m = 120;
        double q = 0.5;
        double b = 0.8;
        Crosstalk.Interferer i = new Crosstalk.Interferer("e2", other, new long[] {0, m}, new double[] {1 - q, q});
        LinkEvaluation ev = LinkEvaluator.evaluate(LinkSpec.binary(own, 0, n, q, b, CountModelKind.EXACT, 1.0),
                Crosstalk.exactTerms(List.of(i)));
        // Reference: docs/architecture.md §5.6 count model enumerated over all 2^(2L+2) bit histories with
        // Commons Statistics 1.2 binomial/Poisson pmfs; capacity of the induced binary channel
        // (Silverman, IRE Trans. Inf. Theory, 1955)
        assertThat(ev.capacityBits()).isCloseTo(bruteForceCapacity(own, n, other, m, q, b),
                org.assertj.core.data.Offset.offset(1e-9));
    }

    @Test
    void strongestEightExactPlusMomentMatchedRestIsWithinOneMicroBitOfAllExact() {
        double[] own = {0.03, 0.01, 0.005};
        List<Crosstalk.Interferer> list = new ArrayList<>();
        for (int j = 0; j < 12; j++) {
            double s = 0.02 * Math.pow(0.35, j);
            list.add(new Crosstalk.Interferer("e" + j, new double[] {s, s / 2, s / 4}, new long[] {0, 500},
                    new double[] {0.5, 0.5}));
        }
        LinkSpec spec = LinkSpec.binary(own, 0, 500, 0.5, 1.0, CountModelKind.EXACT, 1.0);
        double exact = LinkEvaluator.evaluate(spec, Crosstalk.exactTerms(list)).capacityBits();
        double split = LinkEvaluator.evaluate(spec, Crosstalk.terms(list, 8)).capacityBits();
        // Le Cam 1960 (Pacific J. Math. 10): the weak remainder is close to its moment-matched law
        assertThat(split).isCloseTo(exact, org.assertj.core.data.Offset.offset(1e-6));
        assertThat(Crosstalk.terms(list, 8)).hasSize(8 * 3 + 1);
    }

    @Test
    void momentMatchedTermKeepsTheMeanAndStatesTheVarianceItMisses() {
        List<Crosstalk.Interferer> rest = List.of(
                new Crosstalk.Interferer("a", new double[] {1e-3, 5e-4}, new long[] {0, 100}, new double[] {0.5, 0.5}),
                new Crosstalk.Interferer("b", new double[] {2e-3}, new long[] {0, 50}, new double[] {0.5, 0.5}));
        double mean = 0;
        double var = 0;
        for (var t : Crosstalk.exactTerms(rest)) {
            mean += t.mean();
            var += t.variance();
        }
        var m = Crosstalk.momentMatched(rest);
        // law of total variance (from memory): moments of the sum are sums of the terms' moments
        assertThat(m.mean()).isCloseTo(mean, org.assertj.core.data.Offset.offset(1e-12));
        // on/off emitters are over-dispersed here (var > mean): Poisson keeps the mean, the rest is stated
        assertThat(var).isGreaterThan(mean);
        assertThat(m.variance() + Crosstalk.remainderVarianceDeficit(rest))
                .isCloseTo(var, org.assertj.core.data.Offset.offset(1e-12));
    }
}
