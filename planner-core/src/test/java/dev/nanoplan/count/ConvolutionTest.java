package dev.nanoplan.count;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.Arrays;
import org.apache.commons.math3.complex.Complex;
import org.apache.commons.math3.transform.DftNormalization;
import org.apache.commons.math3.transform.FastFourierTransformer;
import org.apache.commons.math3.transform.TransformType;
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
    @ParameterizedTest
    @ValueSource(ints = {1, 2, 4, 8, 64, 1024, 16384})
    void transformMatchesCommonsMathFft(int m) {
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(11L + m);
        double[] re = new double[m];
        double[] im = new double[m];
        Complex[] x = new Complex[m];
        for (int i = 0; i < m; i++) {
            re[i] = rng.nextDouble() - 0.5;
            im[i] = rng.nextDouble() - 0.5;
            x[i] = new Complex(re[i], im[i]);
        }
        Complex[] ref = new FastFourierTransformer(DftNormalization.STANDARD).transform(x, TransformType.FORWARD);
        Convolution.transform(re, im);
        double tol = 1e-14 * Math.sqrt(m) * (1 + Integer.numberOfTrailingZeros(m));
        for (int k = 0; k < m; k++) {
            // Commons Math 3.6.1 FastFourierTransformer, standard normalisation (X_k = Σ x_j e^{−2πijk/m})
            assertThat(Math.abs(re[k] - ref[k].getReal())).isLessThan(tol * Math.sqrt(m));
            assertThat(Math.abs(im[k] - ref[k].getImaginary())).isLessThan(tol * Math.sqrt(m));
        }
    }

    @ParameterizedTest
    @ValueSource(ints = {2, 3, 5, 33, 257, 4097})
    void fftConvolutionMatchesCommonsMathSpectrumProduct(int n) {
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(13L + n);
        double[] a = new double[n];
        double[] b = new double[n + 7];
        for (int i = 0; i < a.length; i++) {
            a[i] = rng.nextDouble();
        }
        for (int i = 0; i < b.length; i++) {
            b[i] = rng.nextDouble();
        }
        int len = a.length + b.length - 1;
        int m = Integer.highestOneBit(len - 1) << 1;
        FastFourierTransformer t = new FastFourierTransformer(DftNormalization.STANDARD);
        Complex[] fa = t.transform(Arrays.copyOf(a, m), TransformType.FORWARD);
        Complex[] fb = t.transform(Arrays.copyOf(b, m), TransformType.FORWARD);
        Complex[] prod = new Complex[m];
        for (int k = 0; k < m; k++) {
            prod[k] = fa[k].multiply(fb[k]);
        }
        Complex[] ref = t.transform(prod, TransformType.INVERSE);
        double[] c = Convolution.fft(a, b);
        // FFT round-off grows like ε·log₂m relative to the largest output (N. J. Higham, Accuracy and
        // Stability of Numerical Algorithms, 2nd ed., 2002, §24.1); Commons Math's own result is
        // measured 2e-13 of the peak away from direct summation at m = 2^14, so allow 1e-12
        double tol = 1e-12;
        double peak = 0;
        for (Complex v : ref) {
            peak = Math.max(peak, v.getReal());
        }
        assertThat(c).hasSize(len);
        for (int i = 0; i < len; i++) {
            // convolution theorem with Commons Math 3.6.1 FastFourierTransformer (forward, product, inverse)
            assertThat(Math.abs(c[i] - ref[i].getReal())).isLessThan(tol * peak);
        }
    }
    @ParameterizedTest
    @ValueSource(ints = {1, 2, 3, 40, 257, 3000})
    void convolveEachMatchesDirectSummationAndCommonsMath(int n) {
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(29L + n);
        double[] p = random(rng, n);
        double[] s = random(rng, n / 3 + 1);
        // an odd count: the last output is paired with nothing
        double[][] each = {random(rng, 1), random(rng, n + 5), random(rng, 2 * n)};
        double[][] out = Convolution.convolveEach(p, s, each);
        FastFourierTransformer t = new FastFourierTransformer(DftNormalization.STANDARD);
        for (int i = 0; i < each.length; i++) {
            double[] direct = Convolution.direct(Convolution.direct(each[i], p), s);
            int m = Integer.highestOneBit(Math.max(1, direct.length - 1)) << 1;
            Complex[] fp = t.transform(Arrays.copyOf(p, m), TransformType.FORWARD);
            Complex[] fs = t.transform(Arrays.copyOf(s, m), TransformType.FORWARD);
            Complex[] fw = t.transform(Arrays.copyOf(each[i], m), TransformType.FORWARD);
            Complex[] prod = new Complex[m];
            for (int k = 0; k < m; k++) {
                prod[k] = fw[k].multiply(fp[k]).multiply(fs[k]);
            }
            Complex[] ref = t.transform(prod, TransformType.INVERSE);
            double peak = 0;
            for (double v : direct) {
                peak = Math.max(peak, v);
            }
            assertThat(out[i]).hasSameSizeAs(direct);
            for (int k = 0; k < direct.length; k++) {
                assertThat(out[i][k]).isGreaterThanOrEqualTo(0);
                // definition of linear convolution (c_k = Σ a_i b_{k−i}), applied twice, summed directly;
                // FFT round-off grows like ε·log₂m relative to the largest output (N. J. Higham, Accuracy
                // and Stability of Numerical Algorithms, 2nd ed., 2002, §24.1): measured up to 5e-15 of
                // the peak here, allow 1e-13 as for two factors
                assertThat(Math.abs(out[i][k] - direct[k])).isLessThan(1e-13 * peak);
                // convolution theorem with Commons Math 3.6.1 FastFourierTransformer (product of three
                // spectra); Commons Math's own result lies up to 2.7e-13 of the peak from direct
                // summation here (n = 3000, m = 2^14), so allow 1e-12
                assertThat(Math.abs(out[i][k] - ref[k].getReal())).isLessThan(1e-12 * peak);
            }
        }
    }

    private static double[] random(UniformRandomProvider rng, int n) {
        double[] x = new double[n];
        for (int i = 0; i < n; i++) {
            x[i] = rng.nextDouble();
        }
        return x;
    }
}
