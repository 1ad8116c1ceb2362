package dev.nanoplan.count;

import java.util.concurrent.atomic.AtomicReferenceArray;

/**
 * Linear convolution of non-negative sequences: direct summation for narrow operands, a
 * hand-written radix-2 FFT for wide × wide.
 *
 * <p><b>Why hand-written.</b> Commons Math's {@code FastFourierTransformer} works on
 * {@code Complex} objects and allocates per element; this one works in place on primitive
 * arrays, packs both real inputs into one complex transform (Z = FFT(a + i·b), then
 * A·B = (Z_k² − conj(Z_{−k})²)/(4i)) and caches twiddle factors computed directly by
 * {@code Math.cos}/{@code Math.sin} (no recurrence, so no drift).
 *
 * <p><b>Accuracy.</b> Direct: each output is a sum of non-negative products, relative error
 * ≤ (number of products)·2⁻⁵³. FFT: absolute error about 1e-16·log₂M·max(a)·Σb per output, so
 * outputs far below the peak (deep tails) are dominated by round-off; negative round-off is
 * clamped to 0. {@code ConvolutionTest} compares both against each other.
 */
final class Convolution {

    /** Direct summation is used when a·b is below this multiple of M·log₂M. */
    static final double DIRECT_FACTOR = 4.0;

    private static final AtomicReferenceArray<double[]> TWIDDLES = new AtomicReferenceArray<>(31);

    private Convolution() {
    }

    static double[] convolve(double[] a, double[] b) {
        if (a.length > b.length) {
            double[] t = a;
            a = b;
            b = t;
        }
        int n = a.length + b.length - 1;
        int m = Integer.highestOneBit(Math.max(1, n - 1)) << 1;
        double fftCost = (double) m * Integer.numberOfTrailingZeros(m);
        if ((double) a.length * b.length <= DIRECT_FACTOR * fftCost || a.length < 32) {
            return direct(a, b);
        }
        return fft(a, b);
    }

    static double[] direct(double[] a, double[] b) {
        double[] out = new double[a.length + b.length - 1];
        if (a.length > b.length) {
            double[] t = a;
            a = b;
            b = t;
        }
        int nb = b.length;
        for (int i = 0; i < a.length; i++) {
            double ai = a[i];
            if (ai == 0) {
                continue;
            }
            for (int j = 0; j < nb; j++) {
                out[i + j] += ai * b[j];
            }
        }
        return out;
    }

    static double[] fft(double[] a, double[] b) {
        int n = a.length + b.length - 1;
        int m = Integer.highestOneBit(Math.max(1, n - 1)) << 1;
        if (m < 0 || m > (1 << 30)) {
            throw new IllegalArgumentException("convolution too long: " + n);
        }
        double[] re = new double[m];
        double[] im = new double[m];
        System.arraycopy(a, 0, re, 0, a.length);
        System.arraycopy(b, 0, im, 0, b.length);
        transform(re, im);
        // product spectrum C_k = (Z_k^2 - conj(Z_{-k})^2) / (4i), computed for pairs (k, m-k)
        for (int k = 0; k <= m / 2; k++) {
            int j = (m - k) & (m - 1);
            double zr = re[k];
            double zi = im[k];
            double wr = re[j];
            double wi = -im[j];
            // Z_k^2 - W^2 with W = conj(Z_{-k})
            double sr = zr * zr - zi * zi - (wr * wr - wi * wi);
            double si = 2 * zr * zi - 2 * wr * wi;
            // divide by 4i: (sr + i si)/(4i) = si/4 - i sr/4
            double cr = si * 0.25;
            double ci = -sr * 0.25;
            re[k] = cr;
            im[k] = ci;
            if (j != k) {
                // C_{m-k} = conj(C_k) since the result is real
                re[j] = cr;
                im[j] = -ci;
            }
        }
        // inverse via conjugation
        for (int k = 0; k < m; k++) {
            im[k] = -im[k];
        }
        transform(re, im);
        double scale = 1.0 / m;
        double[] out = new double[n];
        for (int k = 0; k < n; k++) {
            double v = re[k] * scale;
            out[k] = v > 0 ? v : 0;
        }
        return out;
    }

    /** In-place forward DFT X_k = Σ x_j e^{−2πijk/m}, m a power of two. */
    static void transform(double[] re, double[] im) {
        int m = re.length;
        if (m == 1) {
            return;
        }
        int bits = Integer.numberOfTrailingZeros(m);
        for (int i = 0; i < m; i++) {
            int j = Integer.reverse(i) >>> (32 - bits);
            if (j > i) {
                double t = re[i];
                re[i] = re[j];
                re[j] = t;
                t = im[i];
                im[i] = im[j];
                im[j] = t;
            }
        }
        double[] tw = twiddles(bits);
        for (int len = 2; len <= m; len <<= 1) {
            int half = len >> 1;
            int stride = m / len;
            for (int start = 0; start < m; start += len) {
                for (int j = 0, t = 0; j < half; j++, t += stride) {
                    double wr = tw[2 * t];
                    double wi = tw[2 * t + 1];
                    int p = start + j;
                    int q = p + half;
                    double xr = re[q] * wr - im[q] * wi;
                    double xi = re[q] * wi + im[q] * wr;
                    re[q] = re[p] - xr;
                    im[q] = im[p] - xi;
                    re[p] += xr;
                    im[p] += xi;
                }
            }
        }
    }

    /** Interleaved (cos, −sin)(2πt/m) for t < m/2, cached per size. */
    private static double[] twiddles(int bits) {
        double[] tw = TWIDDLES.get(bits);
        if (tw == null) {
            int m = 1 << bits;
            tw = new double[m];
            for (int t = 0; t < m / 2; t++) {
                double ang = 2 * Math.PI * t / m;
                tw[2 * t] = Math.cos(ang);
                tw[2 * t + 1] = -Math.sin(ang);
            }
            TWIDDLES.compareAndSet(bits, null, tw);
            tw = TWIDDLES.get(bits);
        }
        return tw;
    }
}
