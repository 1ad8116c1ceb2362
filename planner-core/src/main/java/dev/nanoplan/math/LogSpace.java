package dev.nanoplan.math;

import org.apache.commons.numbers.gamma.Erfc;
import org.apache.commons.numbers.gamma.Erfcx;

/**
 * Arithmetic on natural logarithms of small positive numbers, for probabilities far below the
 * smallest double (1e-308): the one place the project computes ln erfc and log-sum-exp.
 *
 * <h2>ln erfc(x)</h2>
 * Finite far beyond the point (x ≈ 26.5) where erfc(x) itself underflows a double. Method: for
 * x &lt; 0.5, {@code ln(Erfc.value(x))} (erfc(x) ∈ (0.47, 2), no underflow); for x ≥ 0.5 the
 * identity ln erfc(x) = −x² + ln erfcx(x), with the scaled complementary error function
 * erfcx(x) = exp(x²)·erfc(x) of Apache Commons Numbers 1.2 ({@link Erfcx}), which stays in (0, 1]
 * and never underflows for finite x. This replaces the asymptotic expansion
 * ln erfc(x) ~ −x² − ln(x√π) + ln(1 − 1/(2x²) + 3/(4x⁴) − …) (M. Abramowitz and I. A. Stegun,
 * <i>Handbook of Mathematical Functions</i>, 1964, eq. 7.1.23), which is used only to test it.
 * Accuracy: absolute error in the logarithm within a few units of 1e-16 · max(1, x²) (the rounding
 * of x² dominates for large x; measured against {@code ln(Erfc.value(x))} on [−3, 26.5] and
 * against eq. 7.1.23 for x up to 1e10). Special cases: NaN → NaN; +∞ → −∞; −∞ → ln 2;
 * x &gt; ~1.3e154 (x² overflows) → −∞. Cost: one Erfc or Erfcx evaluation.
 *
 * <h2>log-sum-exp</h2>
 * ln(e^a + e^b) = m + ln(1 + e^{−|a − b|}) with m = max(a, b) (the usual shift by the maximum,
 * e.g. N. J. Higham, <i>Accuracy and Stability of Numerical Algorithms</i>, 2nd ed., 2002; here
 * with {@code log1p}), which neither overflows nor underflows for finite inputs. −∞ stands for
 * a zero probability: ln(0 + 0) = −∞, never NaN. Cost: one exp and one log1p.
 */
public final class LogSpace {

    private static final double DIRECT_LIMIT = 0.5;

    private LogSpace() {
    }

    /**
     * @param x any double
     * @return ln erfc(x)
     */
    public static double logErfc(double x) {
        if (x < DIRECT_LIMIT) {
            return Math.log(Erfc.value(x));
        }
        if (x == Double.POSITIVE_INFINITY) {
            return Double.NEGATIVE_INFINITY;
        }
        // NaN falls through: NaN * NaN = NaN.
        return -(x * x) + Math.log(Erfcx.value(x));
    }

    /**
     * ln(e^a + e^b).
     *
     * @param a a logarithm, −∞ for a zero term
     * @param b a logarithm, −∞ for a zero term
     * @return ln(e^a + e^b); −∞ when both are −∞; +∞ when either is +∞
     */
    public static double logSumExp(double a, double b) {
        double max = Math.max(a, b);
        if (max == Double.NEGATIVE_INFINITY || max == Double.POSITIVE_INFINITY) {
            return max;
        }
        return max + Math.log1p(Math.exp(Math.min(a, b) - max));
    }

    /**
     * ln Σ e^{v_i} over all entries; entries of −∞ (zero terms) add nothing.
     *
     * @param logs logarithms, −∞ for zero terms
     * @return ln Σ e^{v_i}; −∞ for an empty array or only −∞ entries; +∞ when any is +∞
     */
    public static double logSumExp(double[] logs) {
        double max = Double.NEGATIVE_INFINITY;
        for (double v : logs) {
            max = Math.max(max, v);
        }
        if (max == Double.NEGATIVE_INFINITY || max == Double.POSITIVE_INFINITY) {
            return max;
        }
        double sum = 0;
        for (double v : logs) {
            if (v != Double.NEGATIVE_INFINITY) {
                sum += Math.exp(v - max);
            }
        }
        return max + Math.log(sum);
    }
}
