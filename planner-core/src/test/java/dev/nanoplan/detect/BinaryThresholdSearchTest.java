package dev.nanoplan.detect;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import dev.nanoplan.count.CountPmf;
import dev.nanoplan.info.BinaryCapacity;
import dev.nanoplan.info.BinaryChannel;
import java.util.stream.Stream;
import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.simple.RandomSource;
import org.apache.commons.statistics.distribution.BinomialDistribution;
import org.apache.commons.statistics.distribution.DiscreteDistribution;
import org.apache.commons.statistics.distribution.PoissonDistribution;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

class BinaryThresholdSearchTest {

    /**
     * Seeded random detection problems: "1" is Bin(n1, p); "0" is a weaker binomial Bin(n0, p)
     * or a Poisson background, its mean 0.5 to 6 standard deviations of "1" below the mean of
     * "1", so that the curves have a distinct maximum (well separated pmfs give flat curves
     * whose ties differ only by truncated tails below 1e-20).
     */
    static Stream<Arguments> cases() {
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(51L);
        return Stream.generate(() -> {
            int n1 = 20 + rng.nextInt(3000);
            double p = 0.01 + 0.5 * rng.nextDouble();
            double mean1 = n1 * p;
            double mean0 = Math.max(0.5, mean1 - (0.5 + 5.5 * rng.nextDouble()) * Math.sqrt(mean1 * (1 - p)));
            int n0 = Math.max(1, (int) Math.round(mean0 / p));
            DiscreteDistribution d1 = BinomialDistribution.of(n1, p);
            DiscreteDistribution d0 = rng.nextBoolean()
                    ? BinomialDistribution.of(n0, p)
                    : PoissonDistribution.of(mean0);
            double q = 0.05 + 0.9 * rng.nextDouble();
            boolean trim = rng.nextBoolean();
            return Arguments.of(d0, d1, q, trim, n1);
        }).limit(30);
    }

    private static CountPmf pmf(DiscreteDistribution d, boolean trim, int n1) {
        return trim || d instanceof PoissonDistribution
                ? LibraryPmfs.trimmed(d, 1e-20)
                : LibraryPmfs.full(d, ((BinomialDistribution) d).getNumberOfTrials());
    }

    private static double xlogx(double x) {
        return x > 0 ? x * Math.log(x) : 0;
    }

    /** I = H(Y) − H(Y|X) written out plainly from the four channel entries, bits. */
    private static double plainMi(double q, double e0, double c0, double e1, double c1) {
        double r1 = (1 - q) * e0 + q * c1;
        double r0 = (1 - q) * c0 + q * e1;
        double hy = -(xlogx(r0) + xlogx(r1));
        double hyx = -(1 - q) * (xlogx(e0) + xlogx(c0)) - q * (xlogx(e1) + xlogx(c1));
        return (hy - hyx) / Math.log(2);
    }

    @ParameterizedTest
    @MethodSource("cases")
    void fastSearchMatchesPerThresholdLibraryCdf(DiscreteDistribution d0, DiscreteDistribution d1,
                                                 double q, boolean trim, int n1) {
        BinaryDetection fast = BinaryThresholdSearch.search(pmf(d0, trim, n1), pmf(d1, trim, n1), q);
        long bestMiT = Long.MIN_VALUE;
        double bestMi = -1;
        long bestErrT = Long.MIN_VALUE;
        double bestErr = 2;
        long bestCapT = Long.MIN_VALUE;
        double bestCap = -1;
        double[] miCurve = fast.miBitsByThreshold();
        double[] errCurve = fast.errorByThreshold();
        for (long t = fast.firstThreshold(); t <= fast.lastThreshold(); t++) {
            // Fresh library CDF calls per threshold: P(Y >= t) = survival(t - 1), P(Y < t) = cdf(t - 1)
            int k = (int) (t - 1);
            double e0 = d0.survivalProbability(k);
            double c0 = d0.cumulativeProbability(k);
            double e1 = d1.cumulativeProbability(k);
            double c1 = d1.survivalProbability(k);
            double mi = plainMi(q, e0, c0, e1, c1);
            double err = (1 - q) * e0 + q * e1;
            int i = (int) (t - fast.firstThreshold());
            // Cover & Thomas 2006, eq. (2.39) on library (Commons Statistics 1.2) tail probabilities
            assertThat(miCurve[i]).isCloseTo(mi, within(1e-12));
            assertThat(errCurve[i]).isCloseTo(err, within(1e-13));
            if (mi > bestMi) {
                bestMi = mi;
                bestMiT = t;
            }
            if (err < bestErr) {
                bestErr = err;
                bestErrT = t;
            }
            BinaryCapacity c = BinaryChannel.capacity(e0, c0, e1, c1);
            if (c.bits() > bestCap) {
                bestCap = c.bits();
                bestCapT = t;
            }
        }
        assertThat(fast.miThreshold()).isEqualTo(bestMiT);
        assertThat(fast.mutualInformationBits()).isCloseTo(bestMi, within(1e-12));
        assertThat(fast.minErrorThreshold()).isEqualTo(bestErrT);
        assertThat(fast.minErrorProbability()).isCloseTo(bestErr, within(1e-13 + 1e-10 * bestErr));
        assertThat(fast.capacityThreshold()).isEqualTo(bestCapT);
        assertThat(fast.capacityBits()).isCloseTo(bestCap, within(1e-12));
        // Trivial ends: always 1 (ε0 = 1, ε1 = 0) and always 0.
        assertThat(miCurve[0]).isEqualTo(0.0);
        assertThat(miCurve[miCurve.length - 1]).isEqualTo(0.0);
        assertThat(errCurve[0]).isCloseTo(1 - q, within(1e-12));
        assertThat(errCurve[errCurve.length - 1]).isCloseTo(q, within(1e-12));
    }

    @ParameterizedTest
    @MethodSource("cases")
    void searchWithoutCurveMatchesPerThresholdLibraryCdf(DiscreteDistribution d0, DiscreteDistribution d1,
                                                         double q, boolean trim, int n1) {
        BinaryDetection best = BinaryThresholdSearch.searchBest(pmf(d0, trim, n1), pmf(d1, trim, n1), q);
        BinaryDetection full = BinaryThresholdSearch.search(pmf(d0, trim, n1), pmf(d1, trim, n1), q);
        long bestMiT = Long.MIN_VALUE;
        double bestMi = -1;
        double[] mi = best.miBitsByThreshold();
        double hq = -(xlogx(q) + xlogx(1 - q)) / Math.log(2);
        int evaluated = 0;
        for (long t = best.firstThreshold(); t <= best.lastThreshold(); t++) {
            int k = (int) (t - 1);
            double e0 = d0.survivalProbability(k);
            double c0 = d0.cumulativeProbability(k);
            double e1 = d1.cumulativeProbability(k);
            double c1 = d1.survivalProbability(k);
            double ref = plainMi(q, e0, c0, e1, c1);
            int i = (int) (t - best.firstThreshold());
            if (Double.isNaN(mi[i])) {
                // skipped only where I <= Δ·h(q) < max I (degraded erasure channel; Cover & Thomas 2006,
                // Theorem 2.8.1), on library (Commons Statistics 1.2) tail probabilities
                assertThat(Math.abs(c0 - e1) * hq).isLessThan(full.mutualInformationBits() + 1e-9);
            } else {
                evaluated++;
                // Cover & Thomas 2006, eq. (2.39) on library (Commons Statistics 1.2) tail probabilities
                assertThat(mi[i]).isCloseTo(ref, within(1e-12));
            }
            if (ref > bestMi) {
                bestMi = ref;
                bestMiT = t;
            }
        }
        assertThat(evaluated).isPositive();
        assertThat(best.miThreshold()).isEqualTo(bestMiT).isEqualTo(full.miThreshold());
        assertThat(best.mutualInformationBits()).isCloseTo(bestMi, within(1e-12))
                .isEqualTo(full.mutualInformationBits());
        assertThat(best.minErrorThreshold()).isEqualTo(full.minErrorThreshold());
        assertThat(best.minErrorProbability()).isEqualTo(full.minErrorProbability());
        assertThat(best.capacityThreshold()).isEqualTo(full.capacityThreshold());
        assertThat(best.capacityBits()).isEqualTo(full.capacityBits());
        assertThat(best.errorByThreshold()).isEqualTo(full.errorByThreshold());
    }

    @Test
    void tinyTailErrorsKeepRelativePrecision() {
        BinomialDistribution d0 = BinomialDistribution.of(1000, 0.01);
        BinomialDistribution d1 = BinomialDistribution.of(1000, 0.5);
        BinaryDetection r = BinaryThresholdSearch.search(LibraryPmfs.full(d0, 1000), LibraryPmfs.full(d1, 1000), 0.5);
        int k = (int) (r.minErrorThreshold() - 1);
        double lib = 0.5 * d0.survivalProbability(k) + 0.5 * d1.cumulativeProbability(k);
        // Commons Statistics 1.2 binomial tails (regularised beta): relative agreement deep in the tails
        assertThat(r.minErrorProbability()).isLessThan(1e-60).isCloseTo(lib, within(1e-9 * lib));
        assertThat(r.capacityBits()).isGreaterThan(1 - 1e-12).isLessThanOrEqualTo(1.0);
    }

    @Test
    void separatedAndIdenticalPmfs() {
        CountPmf low = new CountPmf(0, new double[] {0.5, 0.5}, 0, 0);
        CountPmf high = new CountPmf(5, new double[] {0.25, 0.75}, 0, 0);
        BinaryDetection sep = BinaryThresholdSearch.search(low, high, 0.3);
        // Noiseless binary channel: I = H(X) = h(q), C = 1, error 0 (Cover & Thomas 2006, §7.1.1)
        assertThat(sep.mutualInformationBits()).isCloseTo(dev.nanoplan.info.Entropy.binaryBits(0.3), within(1e-15));
        assertThat(sep.capacityBits()).isEqualTo(1.0);
        assertThat(sep.minErrorProbability()).isEqualTo(0.0);
        assertThat(sep.miThreshold()).isEqualTo(2L); // smallest of the tied thresholds 2..5
        assertThat(sep.capacityThreshold()).isEqualTo(2L);
        assertThat(sep.minErrorThreshold()).isEqualTo(2L);
        BinaryDetection same = BinaryThresholdSearch.search(low, low, 0.5);
        assertThat(same.capacityBits()).isEqualTo(0.0);
        assertThat(same.mutualInformationBits()).isEqualTo(0.0);
        assertThatThrownBy(() -> BinaryThresholdSearch.search(low, high, 1.5))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("priorOne");
        assertThatThrownBy(() -> BinaryThresholdSearch.search(low, new CountPmf(0, new double[] {0.5}, 0, 0), 0.5))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("sum");
    }

    @Test
    void truncatedMassIsCountedOutsideTheWindow() {
        // Window [3, 4] holding 0.6 with 0.3 below and 0.1 above; the 1-pmf sits at 10.
        CountPmf zero = new CountPmf(3, new double[] {0.4, 0.2}, 0.3, 0.1);
        CountPmf one = new CountPmf(10, new double[] {1.0}, 0, 0);
        BinaryDetection r = BinaryThresholdSearch.search(zero, one, 0.5);
        assertThat(r.firstThreshold()).isEqualTo(2L);
        double[] err = r.errorByThreshold();
        // τ = 3: ε0 = P(Y >= 3 | 0) = 0.7 (the 0.3 below the window is below τ)
        assertThat(err[1]).isCloseTo(0.5 * 0.7, within(1e-15));
        // τ = 6 (past the 0.1 placed at count 5): ε0 = 0
        assertThat(err[4]).isEqualTo(0.0);
    }
}
