package dev.nanoplan.report;

import java.util.Locale;

/**
 * The one way human-readable output writes numbers (text and HTML; JSON and CSV keep full
 * precision). One set of thresholds and symbols:
 * <ul>
 *   <li>{@link #probability}: 3 significant digits, fixed point from 1e-3 up ({@code 0.0123},
 *       {@code 0.500}), else scientific ({@code 4.56e-07});</li>
 *   <li>{@link #errorProbability}: a probability as above down to 1e-300, below that (or where it
 *       underflows to 0) its base-10 logarithm as {@code 10^-412.5};</li>
 *   <li>{@link #bits}: bits per symbol (capacity, mutual information) with 4 decimals ({@code 0.7312});</li>
 *   <li>{@link #quantity}: rates (bit/s), times, mean counts and physical parameters: a whole number
 *       below 1e7 as an integer ({@code 310}), else 4 significant digits, fixed point without
 *       trailing zeros in [1e-3, 1e4) ({@code 0.3125}, {@code 12.35}, {@code 0.69}), scientific
 *       outside ({@code 1.235e+05});</li>
 *   <li>{@link #molecules}: molecules per second or per mission, rounded to whole molecules with
 *       thousands separators below 1e12 ({@code 1,234,567}), else {@code 1.235e+13};</li>
 *   <li>{@link #count}: integers such as molecules per symbol, with thousands separators;</li>
 *   <li>{@link #threshold}: a detection threshold τ (a count), plain digits.</li>
 * </ul>
 * Not-a-number and infinities read {@value #MISSING}; zero reads {@code 0}. Locale-independent
 * ({@link Locale#ROOT}: decimal point, comma as thousands separator).
 */
public final class Numbers {

    /** What a missing or non-finite value reads. */
    public static final String MISSING = "–";

    /** Below this a value is written in scientific notation (probabilities and quantities). */
    public static final double SMALL = 1e-3;

    /** From this magnitude up a quantity is written in scientific notation. */
    public static final double LARGE = 1e4;

    /** Whole numbers below this magnitude are written as integers. */
    public static final double WHOLE_LIMIT = 1e7;

    /** Molecule totals from this magnitude up are written in scientific notation. */
    public static final double MOLECULES_LIMIT = 1e12;

    /** Error probabilities below this are written as a power of ten from their logarithm. */
    public static final double TINY_PROBABILITY = 1e-300;

    private Numbers() {
    }

    /** A probability (hit probability, tap, prior): 3 significant digits. */
    public static String probability(double p) {
        if (!Double.isFinite(p)) {
            return MISSING;
        }
        if (p == 0) {
            return "0";
        }
        return Math.abs(p) >= SMALL ? String.format(Locale.ROOT, "%.3g", p) : String.format(Locale.ROOT, "%.2e", p);
    }

    /**
     * An error probability, read from its base-10 logarithm where the probability itself is below
     * {@value #TINY_PROBABILITY} or underflowed to 0.
     *
     * @param p the probability (may be 0 where it underflowed)
     * @param log10 its base-10 logarithm (−∞ only for a true 0)
     */
    public static String errorProbability(double p, double log10) {
        if (Double.isFinite(p) && p >= TINY_PROBABILITY) {
            return probability(p);
        }
        if (Double.isFinite(log10)) {
            return String.format(Locale.ROOT, "10^%.1f", log10);
        }
        return log10 == Double.NEGATIVE_INFINITY && p == 0 ? "0" : MISSING;
    }

    /** Bits per symbol: 4 decimals. */
    public static String bits(double v) {
        return Double.isFinite(v) ? String.format(Locale.ROOT, "%.4f", v) : MISSING;
    }

    /** A rate, time, mean count or physical parameter: an integer when whole, else 4 significant digits. */
    public static String quantity(double v) {
        if (!Double.isFinite(v)) {
            return MISSING;
        }
        if (v == Math.rint(v) && Math.abs(v) < WHOLE_LIMIT) {
            return Long.toString((long) v);
        }
        double a = Math.abs(v);
        if (a >= SMALL && a < LARGE) {
            String fixed = String.format(Locale.ROOT, "%.4g", v);
            if (fixed.indexOf('e') >= 0 || fixed.indexOf('.') < 0) {
                return fixed; // scientific (rounded up to LARGE) or no decimals: nothing to trim
            }
            int end = fixed.length();
            while (fixed.charAt(end - 1) == '0') {
                end--;
            }
            return fixed.charAt(end - 1) == '.' ? fixed.substring(0, end - 1) : fixed.substring(0, end);
        }
        return String.format(Locale.ROOT, "%.3e", v);
    }

    /** Molecules per second or per mission: whole molecules with separators, scientific from 1e12. */
    public static String molecules(double v) {
        if (!Double.isFinite(v)) {
            return MISSING;
        }
        return Math.abs(v) < MOLECULES_LIMIT ? String.format(Locale.ROOT, "%,.0f", v)
                : String.format(Locale.ROOT, "%.3e", v);
    }

    /** An integer count (molecules per symbol): digits with thousands separators. */
    public static String count(long n) {
        return String.format(Locale.ROOT, "%,d", n);
    }

    /** A detection threshold τ: plain digits. */
    public static String threshold(long tau) {
        return Long.toString(tau);
    }
}
