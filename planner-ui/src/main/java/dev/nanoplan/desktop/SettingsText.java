package dev.nanoplan.desktop;

/**
 * Reading the settings editor's text fields: numbers with one-line messages that name the field,
 * and the core's validation messages made one line and prefixed with where they apply.
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

    static IllegalArgumentException prefixed(String where, IllegalArgumentException e) {
        return new IllegalArgumentException(where + ": " + oneLine(e.getMessage()), e);
    }

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

    static int parseInt(String field, String text) {
        String t = trim(text);
        try {
            return Integer.parseInt(t);
        } catch (NumberFormatException e) {
            throw new IllegalArgumentException(field + ": not a whole number: '" + t + "'");
        }
    }
}
