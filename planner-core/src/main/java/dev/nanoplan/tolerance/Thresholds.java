package dev.nanoplan.tolerance;

import java.util.Locale;

/** Which detection thresholds a perturbed layout's receivers use. */
public enum Thresholds {
    /**
     * The nominal plan's thresholds, fixed at fabrication: the operating threshold(s) decide (and set
     * the link's mutual information and the relays' cascades), and the error target is judged at the
     * nominal minimum-error threshold.
     */
    DESIGN,
    /** Each sample re-chooses its thresholds (a receiver calibrated after deployment). */
    RECALIBRATED;

    /** The command-line word. */
    public String id() {
        return name().toLowerCase(Locale.ROOT);
    }

    /** @throws IllegalArgumentException naming the accepted words */
    public static Thresholds parse(String id) {
        for (Thresholds t : values()) {
            if (t.id().equals(id)) {
                return t;
            }
        }
        throw new IllegalArgumentException("unknown thresholds '" + id + "', expected design or recalibrated");
    }
}
