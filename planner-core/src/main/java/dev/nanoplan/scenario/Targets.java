package dev.nanoplan.scenario;

/**
 * What the layout should achieve.
 *
 * @param maxErrorProbability largest acceptable per-symbol error probability in (0, 1)
 *     (file default 1e-3)
 * @param minRateBitsPerS smallest acceptable rate per demand in bit/s, finite and ≥ 0 (default 0)
 * @param missionDurationS how long the layout must run, in s, finite and > 0 (default 3600)
 */
public record Targets(double maxErrorProbability, double minRateBitsPerS, double missionDurationS) {

    /** Default targets: error 1e-3, no rate requirement, one hour. */
    public static final Targets DEFAULT = new Targets(1e-3, 0.0, 3600.0);

    /** @throws IllegalArgumentException if a value is out of range */
    public Targets {
        if (!(maxErrorProbability > 0 && maxErrorProbability < 1)) {
            throw new IllegalArgumentException("maxErrorProbability must be in (0, 1), got " + maxErrorProbability);
        }
        Checks.nonNegative("minRateBitsPerS", minRateBitsPerS);
        Checks.positive("missionDurationS", missionDurationS);
    }
}
