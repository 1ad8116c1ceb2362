package dev.nanoplan.desktop;

import java.util.Locale;

/** Number formats of the tables. */
final class Formats {

    private Formats() {
    }

    /** Three significant digits; "—" for NaN. */
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
}
