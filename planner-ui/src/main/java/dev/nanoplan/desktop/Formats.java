package dev.nanoplan.desktop;

import dev.nanoplan.report.Numbers;
import java.util.Locale;

/**
 * Every number the desktop shows is formatted here; table values and error probabilities follow the
 * shared {@link Numbers} format of the text and HTML reports. All formats use {@link Locale#ROOT} (a dot for decimals).
 */
final class Formats {

    private Formats() {
    }

    /**
     * A table cell or message value: the shared {@link Numbers#quantity} format of the text and HTML
     * reports (whole numbers as such, else 4 significant digits, scientific outside [1e-3, 1e4)),
     * {@value Numbers#MISSING} for NaN.
     */
    static String sig(double v) {
        return Numbers.quantity(v);
    }

    /** An error probability in the shared {@link Numbers#errorProbability} format (from its log10 when it underflows). */
    static String error(double p, double log10) {
        return Numbers.errorProbability(p, log10);
    }

    /** Molecules per second or per mission in the reports' {@link Numbers#molecules} format ("8,133"). */
    static String molecules(double v) {
        return Numbers.molecules(v);
    }

    /** A whole count (molecules per symbol) in the reports' {@link Numbers#count} format ("2,440"). */
    static String count(long n) {
        return Numbers.count(n);
    }

    /** Two significant digits: a rough size (work estimates). */
    static String twoDigits(double v) {
        return String.format(Locale.ROOT, "%.2g", v);
    }

    /** Four significant digits: a derived value shown in an editable field (D from Stokes–Einstein). */
    static String fourDigits(double v) {
        return String.format(Locale.ROOT, "%.4g", v);
    }

    /**
     * A value in an editable field: whole numbers without a decimal point, others in full
     * ({@link Double#toString}), so that reading the text back gives the same double.
     */
    static String field(double v) {
        return v == Math.rint(v) && Math.abs(v) < 1e15 ? Long.toString((long) v) : Double.toString(v);
    }

    /** A tick of a colour scale: whole numbers as such, others with two significant digits. */
    static String tick(double v) {
        return v == Math.rint(v) ? Long.toString((long) v) : twoDigits(v);
    }

    /** A fraction 0..1 as a whole percentage, right-aligned in three digits ("  7 %"). */
    static String percent(double fraction) {
        return String.format(Locale.ROOT, "%3.0f %%", 100 * fraction);
    }

    /** A signed value with one decimal ("+1.5", "-0.3"): relative differences in percent. */
    static String signedOneDecimal(double v) {
        return String.format(Locale.ROOT, "%+.1f", v);
    }
}
