package dev.nanoplan.count;

import java.util.Arrays;

/**
 * Linear convolution of non-negative sequences: direct summation for narrow operands, a
 * hand-written radix-2 FFT for wide × wide.
 *
 * <p><b>Why hand-written.</b> Commons Math's {@code FastFourierTransformer} works on
 * {@code Complex} objects and allocates per element; this one works in place on primitive
 * arrays, packs both real inputs into one complex transform (Z = FFT(a + i·b), then
 * A·B = (Z_k² − conj(Z_{−k})²)/(4i)), recovers the real output with a half-length inverse,
 * skips both bit-reversal passes (decimation in frequency forward, in time backward), fuses two
 * radix-2 stages per pass over the data, and reads twiddle factors contiguously per stage from
 * one table computed directly by {@code Math.cos}/{@code Math.sin} (no recurrence, so no
 * drift). Measured (minimum thread CPU time, shared 2-core machine) 2.5–2.7× faster than the
 * former full-length radix-2 version with bit reversal: 3.0 ms instead of 7.8 ms for
 * 60,000 × 60,000 cells, 0.11 ms instead of 0.29 ms for 3,000 × 3,000.
 *
 * <p><b>Accuracy.</b> Direct: each output is a sum of non-negative products, relative error
 * ≤ (number of products)·2⁻⁵³. FFT: absolute error about 1e-16·log₂M·max(a)·Σb per output, so
 * outputs far below the peak (deep tails) are dominated by round-off; negative round-off is
 * clamped to 0. {@code ConvolutionTest} compares the FFT with direct summation, the transform
 * with Commons Math 3.6.1 {@code FastFourierTransformer}, and the convolution with the
 * convolution theorem evaluated by Commons Math (5e-15 of the peak from direct summation at
 * 2^14 points, where Commons Math itself is 2e-13 away).
 */
final class Convolution {

    /**
     * Direct summation is used when a·b is below this multiple of M·log₂M. Measured crossover
     * (minimum of 300 runs, this machine, 2026-12-02): at a·b = 2.44·M·log₂M direct 51 µs against
     * FFT 59 µs (40 × 3000) and 510 µs against 564 µs (60 × 20000); at 6.7·M·log₂M the FFT is 2.4×
     * faster; equal near 2.7–2.8.
     */
    static final double DIRECT_FACTOR = 2.75;

    /** Largest twiddle table built so far (see {@link #twiddles(int)}). */
    private static volatile double[] twiddleTable = new double[0];

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

    /**
     * Linear convolution by FFT, m = the power of two ≥ a.length + b.length − 1:
     * <ol>
     *   <li>Z = DFT_m(a + i·b) by a decimation-in-frequency pass (natural order in,
     *       bit-reversed order out, so no reordering pass);</li>
     *   <li>product spectrum C_k = A_k·B_k = (Z_k² − conj(Z_{m−k})²)/(4i), the partner of
     *       position p being rev(m − rev(p));</li>
     *   <li>the real output is recovered by one complex inverse DFT of half size m/2: with
     *       E_k = C_k + C_{k+m/2} and O_k = (C_k − C_{k+m/2})·e^{2πik/m}, the inverse of
     *       Y = E + i·O is y_n = (c_{2n} + i·c_{2n+1})·m; in bit-reversed order C_k and
     *       C_{k+m/2} are neighbours (positions 2p and 2p + 1 for Y's position p), and a
     *       decimation-in-time pass turns bit-reversed input into natural output.</li>
     * </ol>
     * Cost ≈ 1.5 complex transforms of length m and no bit-reversal pass (the former version
     * did two full-length transforms, each with a bit-reversal pass).
     */
    static double[] fft(double[] a, double[] b) {
        int n = a.length + b.length - 1;
        int m = Integer.highestOneBit(Math.max(1, n - 1)) << 1;
        if (m < 0 || m > (1 << 30)) {
            throw new IllegalArgumentException("convolution too long: " + n);
        }
        if (m < 4) {
            return direct(a, b);
        }
        int bits = Integer.numberOfTrailingZeros(m);
        double[] tw = twiddles(bits);
        double[] re = new double[m];
        double[] im = new double[m];
        System.arraycopy(a, 0, re, 0, a.length);
        System.arraycopy(b, 0, im, 0, b.length);
        productSpectrum(re, im, tw);
        // fold to half length: Y_k = E_k + i·O_k at bit-reversed position p (k = rev_{m/2}(p))
        int h = m >> 1;
        int hShift = 33 - bits;
        for (int p = 0; p < h; p++) {
            int k = Integer.reverse(p) >>> hShift;
            double ar = re[2 * p];
            double ai = im[2 * p];
            double br = re[2 * p + 1];
            double bi = im[2 * p + 1];
            double er = ar + br;
            double ei = ai + bi;
            double dr = ar - br;
            double di = ai - bi;
            // e^{+2πik/m} = conj(tw[h + k])
            double c = tw[2 * (h + k)];
            double s = -tw[2 * (h + k) + 1];
            double or = dr * c - di * s;
            double oi = dr * s + di * c;
            re[p] = er - oi;
            im[p] = ei + or;
        }
        inverseDit(re, im, h, tw);
        double scale = 1.0 / m;
        double[] out = new double[n];
        for (int i = 0; i < h; i++) {
            int e = 2 * i;
            if (e < n) {
                double v = re[i] * scale;
                out[e] = v > 0 ? v : 0;
            }
            if (e + 1 < n) {
                double v = im[i] * scale;
                out[e + 1] = v > 0 ? v : 0;
            }
        }
        return out;
    }

    /**
     * Each of {@code each} convolved with both {@code p} and {@code s}: out_i = each_i ⊗ p ⊗ s,
     * with one transform for the common factor and one forward plus one inverse transform per two
     * outputs, all of length m = the power of two ≥ the longest output.
     *
     * <p><b>Why hand-written.</b> The planner convolves every level's count pmf with the same two
     * crosstalk pmfs (the prefix and suffix products of {@code ReceiverCrosstalk}); doing
     * (each_i ⊗ (p ⊗ s)) by {@link #fft} costs 1.5 transforms for p ⊗ s plus 1.5 per level, this
     * costs 1 plus 1 per level (binary: 3 instead of 4.5). Method: Z = DFT(p + i·s) gives the
     * spectrum of p ⊗ s as G_k = (Z_k² − conj(Z_{m−k})²)/(4i) (as in {@link #fft}); for a pair of
     * real inputs u, v, the DFT of u + i·v times G is the DFT of (u ⊗ g) + i·(v ⊗ g) (g real,
     * linearity), so one full-length inverse returns both outputs, in the real and imaginary parts.
     * Both transforms stay in bit-reversed order (decimation in frequency forward, in time back).
     *
     * <p><b>Accuracy.</b> As {@link #fft}: absolute error about 1e-16·log₂m·(peak of the output)
     * per cell; negative round-off is clamped to 0. {@code ConvolutionTest} checks it against
     * direct summation and against the convolution theorem evaluated with Commons Math 3.6.1.
     *
     * @param p    a non-empty non-negative sequence
     * @param s    a non-empty non-negative sequence
     * @param each non-empty non-negative sequences
     * @return per element of {@code each}, its linear convolution with p and s
     *     (length each_i.length + p.length + s.length − 2)
     */
    static double[][] convolveEach(double[] p, double[] s, double[][] each) {
        int n = 0;
        for (double[] w : each) {
            n = Math.max(n, w.length + p.length + s.length - 2);
        }
        int m = Integer.highestOneBit(Math.max(1, n - 1)) << 1;
        if (m < 0 || m > (1 << 30)) {
            throw new IllegalArgumentException("convolution too long: " + n);
        }
        double[][] out = new double[each.length][];
        if (m < 8) {
            double[] g = direct(p, s);
            for (int i = 0; i < each.length; i++) {
                out[i] = direct(each[i], g);
            }
            return out;
        }
        int bits = Integer.numberOfTrailingZeros(m);
        double[] tw = twiddles(bits);
        double[] gr = new double[m];
        double[] gi = new double[m];
        System.arraycopy(p, 0, gr, 0, p.length);
        System.arraycopy(s, 0, gi, 0, s.length);
        productSpectrum(gr, gi, tw);
        double scale = 1.0 / m;
        double[] re = new double[m];
        double[] im = new double[m];
        for (int i = 0; i < each.length; i += 2) {
            if (i > 0) {
                Arrays.fill(re, 0);
                Arrays.fill(im, 0);
            }
            // the two outputs share the transform's round-off: bring both inputs to a sum in [1, 2)
            // (exact power-of-two scaling, undone below; none for pmfs) so neither swamps the other
            int e0 = copyNormalised(each[i], re);
            int e1 = i + 1 < each.length ? copyNormalised(each[i + 1], im) : 0;
            forwardDif(re, im, tw);
            for (int k = 0; k < m; k++) {
                double zr = re[k];
                double zi = im[k];
                re[k] = zr * gr[k] - zi * gi[k];
                im[k] = zr * gi[k] + zi * gr[k];
            }
            inverseDit(re, im, m, tw);
            out[i] = scaledNonNegative(re, each[i].length + p.length + s.length - 2, Math.scalb(scale, e0));
            if (i + 1 < each.length) {
                out[i + 1] = scaledNonNegative(im, each[i + 1].length + p.length + s.length - 2, Math.scalb(scale, e1));
            }
        }
        return out;
    }

    /**
     * Copies x into the front of dest scaled by 2^−e, e the binary exponent of Σx (0 when x is all
     * zero or the scaled values could leave the normal range), and returns e.
     */
    private static int copyNormalised(double[] x, double[] dest) {
        double sum = 0;
        for (double v : x) {
            sum += v;
        }
        int e = sum > 0 && sum < Double.POSITIVE_INFINITY ? Math.getExponent(sum) : 0;
        if (e < Double.MIN_EXPONENT + 60 || e > Double.MAX_EXPONENT - 60) {
            e = 0;
        }
        for (int k = 0; k < x.length; k++) {
            dest[k] = Math.scalb(x[k], -e);
        }
        return e;
    }

    /** The first n entries of x times scale, negative round-off set to 0. */
    private static double[] scaledNonNegative(double[] x, int n, double scale) {
        double[] out = new double[n];
        for (int i = 0; i < n; i++) {
            double v = x[i] * scale;
            out[i] = v > 0 ? v : 0;
        }
        return out;
    }

    /**
     * Replaces Z at positions p and q (holding Z_k and Z_{m−k}) by the product spectrum
     * C_k = (Z_k² − conj(Z_{m−k})²)/(4i) and C_{m−k} = conj(C_k) (the output is real).
     */
    /**
     * Transforms the packed pair re + i·im (bit-reversed output) and replaces it in place by the
     * spectrum of the product of the two real sequences, each conjugate pair (k, m − k) once. In
     * bit-reversed order positions 0 (k = 0) and 1 (k = m/2) pair with themselves, and for
     * 2^j ≤ p &lt; 2^{j+1} the partner of p is 3·2^j − 1 − p (the block read from both ends, sequentially).
     */
    private static void productSpectrum(double[] re, double[] im, double[] tw) {
        forwardDif(re, im, tw);
        int m = re.length;
        product(re, im, 0, 0);
        product(re, im, 1, 1);
        for (int lo = 2; lo < m; lo <<= 1) {
            for (int p = lo, q = 2 * lo - 1; p < q; p++, q--) {
                product(re, im, p, q);
            }
        }
    }

    private static void product(double[] re, double[] im, int p, int q) {
        double zr = re[p];
        double zi = im[p];
        double wr = re[q];
        double wi = -im[q];
        double sr = zr * zr - zi * zi - (wr * wr - wi * wi);
        double si = 2 * (zr * zi - wr * wi);
        double cr = si * 0.25;
        double ci = -sr * 0.25;
        re[p] = cr;
        im[p] = ci;
        re[q] = cr;
        im[q] = -ci;
    }

    /**
     * In-place forward DFT X_k = Σ x_j e^{−2πijk/m} (m = re.length, a power of two) by
     * decimation in frequency: natural-order input, output X_k at position rev(k) (bit reversal
     * over log₂m bits). Two radix-2 stages are fused per pass over the data (same operations in
     * the same order as two separate passes, half the memory traffic); an odd stage count ends
     * with one radix-2 pass.
     */
    static void forwardDif(double[] re, double[] im, double[] tw) {
        int m = re.length;
        int half = m >> 1;
        for (; half >= 2; half >>= 2) {
            int q = half >> 1;
            int len = half << 1;
            int outer = 2 * half;
            int inner = 2 * q;
            for (int start = 0; start < m; start += len) {
                for (int j = 0; j < q; j++) {
                    int p0 = start + j;
                    int p1 = p0 + q;
                    int p2 = p1 + q;
                    int p3 = p2 + q;
                    // stage of span 2·half: (p0, p2) with w^j, (p1, p3) with w^{j+q}
                    double w0r = tw[outer + 2 * j];
                    double w0i = tw[outer + 2 * j + 1];
                    double w1r = tw[outer + 2 * (j + q)];
                    double w1i = tw[outer + 2 * (j + q) + 1];
                    double x0r = re[p0];
                    double x0i = im[p0];
                    double x2r = re[p2];
                    double x2i = im[p2];
                    double a0r = x0r + x2r;
                    double a0i = x0i + x2i;
                    double dr = x0r - x2r;
                    double di = x0i - x2i;
                    double a2r = dr * w0r - di * w0i;
                    double a2i = dr * w0i + di * w0r;
                    double x1r = re[p1];
                    double x1i = im[p1];
                    double x3r = re[p3];
                    double x3i = im[p3];
                    double a1r = x1r + x3r;
                    double a1i = x1i + x3i;
                    dr = x1r - x3r;
                    di = x1i - x3i;
                    double a3r = dr * w1r - di * w1i;
                    double a3i = dr * w1i + di * w1r;
                    // stage of span half: (p0, p1) and (p2, p3), both with w^j
                    double vr = tw[inner + 2 * j];
                    double vi = tw[inner + 2 * j + 1];
                    re[p0] = a0r + a1r;
                    im[p0] = a0i + a1i;
                    dr = a0r - a1r;
                    di = a0i - a1i;
                    re[p1] = dr * vr - di * vi;
                    im[p1] = dr * vi + di * vr;
                    re[p2] = a2r + a3r;
                    im[p2] = a2i + a3i;
                    dr = a2r - a3r;
                    di = a2i - a3i;
                    re[p3] = dr * vr - di * vi;
                    im[p3] = dr * vi + di * vr;
                }
            }
        }
        if (half == 1) {
            for (int p = 0; p < m; p += 2) {
                // span 2, twiddle 1 (tw entry (1, 0) exactly): same as the general butterfly
                double ur = re[p];
                double ui = im[p];
                double vr = re[p + 1];
                double vi = im[p + 1];
                re[p] = ur + vr;
                im[p] = ui + vi;
                double dr = ur - vr;
                double di = ui - vi;
                re[p + 1] = dr * tw[2] - di * tw[3];
                im[p + 1] = dr * tw[3] + di * tw[2];
            }
        }
    }

    /**
     * In-place unscaled inverse DFT x_j = Σ X_k e^{+2πijk/n} of the first n entries by
     * decimation in time: input X_k at position rev(k) (over log₂n bits), natural-order output.
     * An odd stage count starts with one radix-2 pass; then two stages are fused per pass, as in
     * {@link #forwardDif}.
     */
    static void inverseDit(double[] re, double[] im, int n, double[] tw) {
        int half = 1;
        if (Integer.numberOfTrailingZeros(n) % 2 == 1) {
            for (int p = 0; p < n; p += 2) {
                double wr = tw[2];
                double wi = -tw[3];
                double xr = re[p + 1] * wr - im[p + 1] * wi;
                double xi = re[p + 1] * wi + im[p + 1] * wr;
                re[p + 1] = re[p] - xr;
                im[p + 1] = im[p] - xi;
                re[p] += xr;
                im[p] += xi;
            }
            half = 2;
        }
        for (; half < n; half <<= 2) {
            int q = half;
            int len = half << 2;
            int inner = 2 * q;
            int outer = 4 * q;
            for (int start = 0; start < n; start += len) {
                for (int j = 0; j < q; j++) {
                    int p0 = start + j;
                    int p1 = p0 + q;
                    int p2 = p1 + q;
                    int p3 = p2 + q;
                    // stage of span 2q: (p0, p1) and (p2, p3) with conj(w^j)
                    double vr = tw[inner + 2 * j];
                    double vi = -tw[inner + 2 * j + 1];
                    double xr = re[p1] * vr - im[p1] * vi;
                    double xi = re[p1] * vi + im[p1] * vr;
                    double b1r = re[p0] - xr;
                    double b1i = im[p0] - xi;
                    double b0r = re[p0] + xr;
                    double b0i = im[p0] + xi;
                    xr = re[p3] * vr - im[p3] * vi;
                    xi = re[p3] * vi + im[p3] * vr;
                    double b3r = re[p2] - xr;
                    double b3i = im[p2] - xi;
                    double b2r = re[p2] + xr;
                    double b2i = im[p2] + xi;
                    // stage of span 4q: (p0, p2) with conj(w^j), (p1, p3) with conj(w^{j+q})
                    double w0r = tw[outer + 2 * j];
                    double w0i = -tw[outer + 2 * j + 1];
                    double w1r = tw[outer + 2 * (j + q)];
                    double w1i = -tw[outer + 2 * (j + q) + 1];
                    xr = b2r * w0r - b2i * w0i;
                    xi = b2r * w0i + b2i * w0r;
                    re[p2] = b0r - xr;
                    im[p2] = b0i - xi;
                    re[p0] = b0r + xr;
                    im[p0] = b0i + xi;
                    xr = b3r * w1r - b3i * w1i;
                    xi = b3r * w1i + b3i * w1r;
                    re[p3] = b1r - xr;
                    im[p3] = b1i - xi;
                    re[p1] = b1r + xr;
                    im[p1] = b1i + xi;
                }
            }
        }
    }

    /** In-place forward DFT X_k = Σ x_j e^{−2πijk/m}, m a power of two, natural order in and out. */
    static void transform(double[] re, double[] im) {
        int m = re.length;
        if (m == 1) {
            return;
        }
        int bits = Integer.numberOfTrailingZeros(m);
        forwardDif(re, im, twiddles(bits));
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
    }

    /**
     * Twiddles laid out per butterfly span: for each power of two h &lt; 2^bits and j &lt; h,
     * entries 2(h + j), 2(h + j) + 1 hold (cos, −sin)(πj/h) = e^{−2πij/(2h)}, so every stage reads
     * its factors contiguously. Entries depend only on (h, j): the table of the largest size built
     * so far serves every smaller size. Computed directly by Math.cos/Math.sin (no recurrence).
     */
    private static double[] twiddles(int bits) {
        double[] tw = twiddleTable;
        if (tw.length >= (2 << bits)) {
            return tw;
        }
        synchronized (Convolution.class) {
            tw = twiddleTable;
            if (tw.length < (2 << bits)) {
                int m = 1 << bits;
                double[] t = new double[2 * m];
                for (int h = 1; h < m; h <<= 1) {
                    for (int j = 0; j < h; j++) {
                        double ang = Math.PI * j / h;
                        t[2 * (h + j)] = Math.cos(ang);
                        t[2 * (h + j) + 1] = -Math.sin(ang);
                    }
                }
                twiddleTable = t;
                tw = t;
            }
        }
        return tw;
    }
}
