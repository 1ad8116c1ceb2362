package dev.nanoplan.count;

import static org.assertj.core.api.Assertions.assertThat;

import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.simple.RandomSource;
import org.apache.commons.statistics.distribution.BinomialDistribution;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

class ConvolutionTest {

    @ParameterizedTest
    @ValueSource(ints = {1, 2, 3, 17, 100, 1000, 5000})
    void fftMatchesDirectSummationOnRandomData(int n) {
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(7L + n);
        double[] a = new double[n];
        double[] b = new double[n / 2 + 1];
        for (int i = 0; i < a.length; i++) {
            a[i] = rng.nextDouble();
        }
        for (int i = 0; i < b.length; i++) {
            b[i] = rng.nextDouble();
        }
        double[] direct = Convolution.direct(a, b);
        double[] fft = Convolution.fft(a, b);
        double peak = 0;
        for (double v : direct) {
            peak = Math.max(peak, v);
        }
        assertThat(fft).hasSameSizeAs(direct);
        for (int i = 0; i < direct.length; i++) {
            // definition of linear convolution (c_k = Σ a_i b_{k−i}), summed directly
            assertThat(Math.abs(fft[i] - direct[i])).isLessThan(1e-13 * peak);
        }
    }

    @ParameterizedTest
    @ValueSource(ints = {200, 3000})
    void fftOfTwoBinomialsIsTheBinomialOfTheSummedTrials(int n) {
        // Bin(n, p) + Bin(n, p) = Bin(2n, p) (sum of independent Bernoulli trials, definition)
        double p = 0.37;
        BinomialDistribution one = BinomialDistribution.of(n, p);
        BinomialDistribution two = BinomialDistribution.of(2 * n, p);
        double[] a = new double[n + 1];
        for (int y = 0; y <= n; y++) {
            a[y] = one.probability(y);
        }
        double[] c = Convolution.fft(a, a);
        double peak = two.probability((int) (2 * n * p));
        for (int y = 0; y <= 2 * n; y++) {
            assertThat(c[y]).isGreaterThanOrEqualTo(0);
            // Commons Statistics 1.2 BinomialDistribution.probability
            assertThat(Math.abs(c[y] - two.probability(y))).isLessThan(1e-14 * peak + 1e-300);
        }
    }
}
