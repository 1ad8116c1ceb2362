package dev.nanoplan.scenario;

/** Argument checks shared by the records of this package; messages name the parameter. */
final class Checks {

    private Checks() {
    }

    static double positive(String name, double v) {
        if (!(v > 0) || !Double.isFinite(v)) {
            throw new IllegalArgumentException(name + " must be finite and > 0, got " + v);
        }
        return v;
    }

    static double nonNegative(String name, double v) {
        if (!(v >= 0) || !Double.isFinite(v)) {
            throw new IllegalArgumentException(name + " must be finite and >= 0, got " + v);
        }
        return v;
    }

    static <T> T required(String name, T v) {
        if (v == null) {
            throw new IllegalArgumentException(name + " is required");
        }
        return v;
    }

    static String nonBlank(String name, String v) {
        if (v == null || v.isBlank()) {
            throw new IllegalArgumentException(name + " must be a non-empty string, got "
                    + (v == null ? "null" : "'" + v + "'"));
        }
        return v;
    }
}
