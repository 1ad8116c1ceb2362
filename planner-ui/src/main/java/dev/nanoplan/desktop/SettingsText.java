package dev.nanoplan.desktop;

/**
 * Text of the editors' fields and messages: trimming, and the core's validation messages made one
 * line (numbers are read through {@link FieldErrors}, whose messages name the field as the file does).
 */
final class SettingsText {

    private SettingsText() {
    }

    static String trim(String s) {
        return s == null ? "" : s.trim();
    }

    static String oneLine(String message) {
        return message == null ? "" : message.replace(":\n", ": ").replace("\n", "; ");
    }

    /** A finite number typed in a field outside the scenario file (a study's or a search's setting). */
    static double parse(String field, String text) {
        String t = trim(text);
        try {
            double v = Double.parseDouble(t);
            if (!Double.isFinite(v)) {
                throw new IllegalArgumentException(field + ": must be a finite number, got " + t);
            }
            return v;
        } catch (NumberFormatException e) {
            throw new IllegalArgumentException(field + ": not a number: '" + t + "'");
        }
    }

    /** A whole number typed in a field outside the scenario file. */
    static int parseInt(String field, String text) {
        String t = trim(text);
        try {
            return Integer.parseInt(t);
        } catch (NumberFormatException e) {
            throw new IllegalArgumentException(field + ": not a whole number: '" + t + "'");
        }
    }
}
