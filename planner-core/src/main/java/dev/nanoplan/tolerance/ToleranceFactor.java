package dev.nanoplan.tolerance;

import java.io.Serializable;

/**
 * One varied input of a tolerance study: a coordinate of a node's position, its radius or release,
 * a species' diffusion coefficient, or the medium's temperature. Each gets one standard-normal draw
 * z per sample (truncated at ±4); the varied value is nominal + sd·z (position, temperature) or
 * nominal·(1 + sd·z) (relative spreads).
 *
 * @param kind    what varies
 * @param subject node id, species name, or "medium"
 * @param axis    0, 1, 2 for x, y, z of a position; 0 otherwise
 * @param sd      standard deviation: µm (position), K (temperature), or a fraction (1 % = 0.01)
 */
public record ToleranceFactor(Kind kind, String subject, int axis, double sd) implements Serializable {

    /** What a factor varies. */
    public enum Kind {
        /** A node's position on one axis (µm). */
        POSITION("position"),
        /** A node's radius (relative). */
        RADIUS("radius"),
        /** A node's mean release per symbol (relative). */
        MOLECULES("molecules"),
        /** A species' diffusion coefficient (relative). */
        DIFFUSION("diffusion"),
        /** The medium's temperature (K). */
        TEMPERATURE("temperature");

        private final String id;

        Kind(String id) {
            this.id = id;
        }

        /** The word used in reports. */
        public String id() {
            return id;
        }
    }

    /** @throws IllegalArgumentException if sd is not finite and > 0 */
    public ToleranceFactor {
        if (!(sd > 0) || !Double.isFinite(sd)) {
            throw new IllegalArgumentException("sd must be finite and > 0, got " + sd);
        }
    }

    /**
     * The name of the tolerance a driver report uses: "position of s05", "radius of gw", "molecules of
     * s05", "diffusion of A", "temperature" (the three axes of a position share one name).
     */
    public String tolerance() {
        return kind == Kind.TEMPERATURE ? kind.id() : kind.id() + " of " + subject;
    }
}
