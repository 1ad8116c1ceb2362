package dev.nanoplan.desktop;

import java.util.Locale;

/**
 * Every number the desktop shows is formatted here, so the window can follow one shared formatter
 * by changing this class alone. All formats use {@link Locale#ROOT} (a dot for decimals).
 */
final class Formats {

    private Formats() {
    }

    /** Three significant digits, scientific below 1e-3 and from 1e5; "—" for NaN. Table cells and messages. */
    static String sig(double v) {
        if (Double.isNaN(v)) {
            return "—";
        }
        if (v == 0) {
            return "0";
        }
        double a = Math.abs(v);
        if (a >= 1e5 || a < 1e-3) {
            return String.format(Locale.ROOT, "%.2e", v);
        }
        return String.format(Locale.ROOT, "%.3g", v);
    }

    /** An error probability, from its log10 when it underflows. */
    static String error(double p, double log10) {
        if (p > 0) {
            return sig(p);
        }
        return Double.isFinite(log10) ? String.format(Locale.ROOT, "1e%.0f", log10) : "0";
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
