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
}
