package dev.nanoplan.detect;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import dev.nanoplan.count.CountPmf;
import java.util.List;
import org.apache.commons.statistics.distribution.BinomialDistribution;
import org.junit.jupiter.api.Test;

class FirstThresholdSweepTest {

    private static CountPmf binomial(int n, double p) {
        BinomialDistribution d = BinomialDistribution.of(n, p);
        double[] m = new double[n + 1];
        for (int k = 0; k <= n; k++) {
            m[k] = d.probability(k);
        }
        return new CountPmf(0, m, 0, 0);
    }

    @Test
    void twoLevelSweepIsTheBinaryMutualInformationCurve() {
        CountPmf zero = binomial(60, 0.1);
        CountPmf one = binomial(60, 0.3);
        double q = 0.4;
        FirstThresholdSweep.Curve c = FirstThresholdSweep.sweep(List.of(zero, one), new long[] {10},
                new double[] {1 - q, q});
        BinaryDetection b = BinaryThresholdSearch.search(zero, one, q);
        // both are I(X;Y) of the thresholded binary channel (Cover & Thomas 2006, eq. 2.28), computed two ways
        double[] mi = c.miBits();
        for (int i = 0; i < mi.length; i++) {
            long tau = c.firstThreshold() + i;
            assertThat(mi[i]).isCloseTo(b.miBitsByThreshold()[(int) (tau - b.firstThreshold())], within(1e-12));
        }
    }
}
