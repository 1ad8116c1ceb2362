package dev.nanoplan.physics;

import org.apache.commons.numbers.gamma.Erfc;
import org.apache.commons.numbers.gamma.Erfcx;

/**
 * Natural logarithm of the complementary error function, ln erfc(x), finite far beyond the
 * point (x ≈ 26.5) where erfc(x) itself underflows a double.
 *
 * <p>Method: for x &lt; 0.5, {@code ln(Erfc.value(x))} (erfc(x) ∈ (0.47, 2), no underflow);
 * for x ≥ 0.5 the identity ln erfc(x) = −x² + ln erfcx(x), with the scaled complementary error
 * function erfcx(x) = exp(x²)·erfc(x) of Apache Commons Numbers 1.2 ({@link Erfcx}), which
 * stays in (0, 1] and never underflows for finite x. This replaces the asymptotic expansion
 * ln erfc(x) ~ −x² − ln(x√π) + ln(1 − 1/(2x²) + 3/(4x⁴) − …) (M. Abramowitz and I. A. Stegun,
 * Handbook of Mathematical Functions, 1964, eq. 7.1.23), which is used only to test it.
 *
 * <p>Accuracy: absolute error in the logarithm within a few units of 1e-16 · max(1, x²)
 * (the rounding of x² dominates for large x; measured against {@code ln(Erfc.value(x))} on
 * [0, 26] and against eq. 7.1.23 for x up to 1e10). Special cases: NaN → NaN; +∞ → −∞;
 * x &gt; ~1.3e154 (x² overflows) → −∞. Cost: one Erfc or Erfcx evaluation.
 */
final class LogErfc {

    private static final double DIRECT_LIMIT = 0.5;

    private LogErfc() {
    }

    /**
     * @param x any double
     * @return ln erfc(x)
     */
    static double value(double x) {
        if (x < DIRECT_LIMIT) {
            return Math.log(Erfc.value(x));
        }
        if (x == Double.POSITIVE_INFINITY) {
            return Double.NEGATIVE_INFINITY;
        }
        // NaN falls through: NaN * NaN = NaN.
        return -(x * x) + Math.log(Erfcx.value(x));
    }
}
