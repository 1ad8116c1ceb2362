package dev.nanoplan.info;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.util.stream.Stream;
import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.simple.RandomSource;
import org.apache.commons.statistics.distribution.BinomialDistribution;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;
import org.junit.jupiter.params.provider.ValueSource;

class BlahutArimotoTest {

    private static final double LOG2 = Math.log(2);
    private static final BlahutArimoto PRECISE = new BlahutArimoto(1e-13, 2_000_000);

    static Stream<Double> crossovers() {
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(31L);
        return Stream.generate(rng::nextDouble).limit(12);
    }

    @ParameterizedTest
    @MethodSource("crossovers")
    void binarySymmetricChannel(double p) {
        BlahutArimoto.Result r = PRECISE.compute(new double[][] {{1 - p, p}, {p, 1 - p}});
        // Cover & Thomas, Elements of Information Theory, 2nd ed., 2006, eq. (7.15) (from memory)
        assertThat(r.capacityBits()).isCloseTo(1 - Entropy.binaryBits(p), within(1e-13));
        assertThat(r.converged()).isTrue();
        assertThat(r.inputDistribution()[0]).isCloseTo(0.5, within(1e-12));
    }

    @ParameterizedTest
    @MethodSource("crossovers")
    void zChannel(double p) {
        BlahutArimoto.Result r = PRECISE.compute(new double[][] {{1, 0}, {p, 1 - p}});
        double expected = Math.log1p((1 - p) * Math.pow(p, p / (1 - p))) / LOG2;
        // Cover & Thomas 2006, Problem 7.8 (from memory): C = log2(1 + (1-p) p^{p/(1-p)})
        assertThat(r.capacityBits()).isCloseTo(expected, within(1e-12));
        assertThat(r.gapBits()).isLessThan(1e-13);
        assertThat(r.upperBoundBits()).isGreaterThanOrEqualTo(expected - 1e-14);
    }

    @ParameterizedTest
    @ValueSource(doubles = {0.05, 0.2, 0.4})
    void redundantInputGetsNoMass(double p) {
        // Three inputs of a weakly symmetric 3x4 channel (rows are permutations of each other on
        // outputs 0..2, output 3 gets 1/4 from each row, all column sums equal 3/4) plus a fourth
        // input whose row is the average of rows 0 and 1.
        double a = 0.75 - p;
        double b = p / 2;
        double[][] w = {
            {a, b, b, 0.25},
            {b, a, b, 0.25},
            {b, b, a, 0.25},
            {(a + b) / 2, (a + b) / 2, b, 0.25}
        };
        BlahutArimoto.Result r = PRECISE.compute(w);
        double rowEntropy = Entropy.bits(new double[] {a, b, b, 0.25});
        // Cover & Thomas 2006, Theorem 7.2.1 (from memory): weakly symmetric channel C = log2|Y| - H(row);
        // the averaged row cannot raise capacity (convexity of D, Cover & Thomas 2006, Theorem 2.7.2)
        assertThat(r.capacityBits()).isCloseTo(2 - rowEntropy, within(1e-11));
        assertThat(r.inputDistribution()[3]).isLessThan(1e-6);
        for (int x = 0; x < 3; x++) {
            assertThat(r.inputDistribution()[x]).isCloseTo(1.0 / 3, within(1e-6));
        }
        // Independent computation: the 3x4 channel without the redundant row.
        BlahutArimoto.Result three = PRECISE.compute(new double[][] {w[0], w[1], w[2]});
        assertThat(r.capacityBits()).isCloseTo(three.capacityBits(), within(1e-11));
    }

    @ParameterizedTest
    @ValueSource(ints = {6, 26})
    void noisyTypewriter(int n) {
        double[][] w = new double[n][n];
        for (int x = 0; x < n; x++) {
            w[x][x] = 0.5;
            w[x][(x + 1) % n] = 0.5;
        }
        // Cover & Thomas 2006, §7.1.4 (from memory): noisy typewriter capacity log2(n/2), 26 letters -> log2 13
        assertThat(PRECISE.compute(w).capacityBits()).isCloseTo(Math.log(n / 2.0) / LOG2, within(1e-12));
    }

    @Test
    void wideOutputAlphabetWithTinyEntries() {
        // Two inputs: counts Bin(2000, 0.30) vs Bin(2000, 0.32); row entries reach 1e-300 and below.
        int n = 2000;
        BinomialDistribution d0 = BinomialDistribution.of(n, 0.30);
        BinomialDistribution d1 = BinomialDistribution.of(n, 0.32);
        double[][] w = new double[2][n + 1];
        for (int k = 0; k <= n; k++) {
            w[0][k] = d0.probability(k);
            w[1][k] = d1.probability(k);
        }
        BlahutArimoto.Result r = PRECISE.compute(w);
        // Any quantisation is a post-processing, so it cannot beat the full alphabet (data
        // processing inequality, Cover & Thomas 2006, Theorem 2.8.1): compare with the best
        // single-threshold binary channel built from library CDFs.
        double best = 0;
        for (int t = 600; t <= 640; t++) {
            double e0 = d0.survivalProbability(t - 1);
            double e1 = d1.cumulativeProbability(t - 1);
            best = Math.max(best, BinaryChannel.capacity(e0, e1).bits());
        }
        assertThat(r.capacityBits()).isGreaterThanOrEqualTo(best - 1e-12).isLessThanOrEqualTo(1.0);
        assertThat(r.converged()).isTrue();
        assertThat(Double.isFinite(r.capacityBits())).isTrue();
    }

    @Test
    void trivialChannelsAndValidation() {
        assertThat(BlahutArimoto.DEFAULT.compute(new double[][] {{0.2, 0.8}}).capacityBits()).isEqualTo(0.0);
        assertThat(BlahutArimoto.DEFAULT.compute(new double[][] {{0.2, 0.8}, {0.2, 0.8}}).iterations()).isZero();
        assertThatThrownBy(() -> new BlahutArimoto(0, 10)).isInstanceOf(IllegalArgumentException.class)
                .hasMessageContaining("toleranceBits");
        assertThatThrownBy(() -> new BlahutArimoto(1e-9, 0)).isInstanceOf(IllegalArgumentException.class)
                .hasMessageContaining("maxIterations");
        assertThatThrownBy(() -> BlahutArimoto.DEFAULT.compute(new double[][] {{0.5, 0.4}}))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("sum");
        assertThatThrownBy(() -> BlahutArimoto.DEFAULT.compute(new double[][] {{0.5, 0.5}, {1}}))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("row 1");
        assertThatThrownBy(() -> BlahutArimoto.DEFAULT.compute(new double[0][]))
                .isInstanceOf(IllegalArgumentException.class);
    }
}
