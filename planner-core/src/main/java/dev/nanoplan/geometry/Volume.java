package dev.nanoplan.geometry;

/**
 * The fluid region that holds a layout. All lengths in micrometres.
 *
 * <ul>
 *   <li>{@link Open}: unbounded space, no walls;</li>
 *   <li>{@link Box}: axis-aligned box between two corners;</li>
 *   <li>{@link Cylinder}: a vessel or channel segment whose axis is the x axis from x = 0 to
 *       x = L, centred on y = z = 0.</li>
 * </ul>
 *
 * <p>Walls are reflecting for the particle simulator; the closed-form channel models ignore them.
 */
public sealed interface Volume permits Volume.Open, Volume.Box, Volume.Cylinder {

    /** The shape name used in scenario files: {@code open}, {@code box} or {@code cylinder}. */
    String shape();

    /**
     * Whether a ball of radius {@code radiusUm} centred at {@code centreUm} lies entirely inside
     * (touching a wall counts as inside). O(1).
     *
     * @param centreUm ball centre
     * @param radiusUm ball radius, ≥ 0
     */
    boolean containsBall(Vec3 centreUm, double radiusUm);

    /** Unbounded space. */
    record Open() implements Volume {
        @Override
        public String shape() {
            return "open";
        }

        @Override
        public boolean containsBall(Vec3 centreUm, double radiusUm) {
            return true;
        }
    }

    /**
     * Axis-aligned box.
     *
     * @param minUm lower corner
     * @param maxUm upper corner, strictly greater than {@code minUm} on every axis
     */
    record Box(Vec3 minUm, Vec3 maxUm) implements Volume {
        /** @throws IllegalArgumentException if a corner is null or max ≤ min on some axis */
        public Box {
            if (minUm == null || maxUm == null) {
                throw new IllegalArgumentException("box corners minUm and maxUm are required");
            }
            if (!(maxUm.x() > minUm.x() && maxUm.y() > minUm.y() && maxUm.z() > minUm.z())) {
                throw new IllegalArgumentException("box maxUm must exceed minUm on every axis, got min "
                        + minUm + ", max " + maxUm);
            }
        }

        @Override
        public String shape() {
            return "box";
        }

        /** Edge lengths (max − min). */
        public Vec3 sizeUm() {
            return maxUm.minus(minUm);
        }

        @Override
        public boolean containsBall(Vec3 c, double r) {
            return c.x() - r >= minUm.x() && c.x() + r <= maxUm.x()
                    && c.y() - r >= minUm.y() && c.y() + r <= maxUm.y()
                    && c.z() - r >= minUm.z() && c.z() + r <= maxUm.z();
        }
    }

    /**
     * Circular cylinder along +x from x = 0 to x = {@code lengthUm}, centred on y = z = 0.
     *
     * @param radiusUm R, finite and > 0
     * @param lengthUm L, finite and > 0
     */
    record Cylinder(double radiusUm, double lengthUm) implements Volume {
        /** @throws IllegalArgumentException if R or L is not finite and positive */
        public Cylinder {
            if (!(radiusUm > 0) || !Double.isFinite(radiusUm)) {
                throw new IllegalArgumentException("cylinder radiusUm must be finite and > 0, got " + radiusUm);
            }
            if (!(lengthUm > 0) || !Double.isFinite(lengthUm)) {
                throw new IllegalArgumentException("cylinder lengthUm must be finite and > 0, got " + lengthUm);
            }
        }

        @Override
        public String shape() {
            return "cylinder";
        }

        @Override
        public boolean containsBall(Vec3 c, double r) {
            return c.x() - r >= 0 && c.x() + r <= lengthUm
                    && Math.hypot(c.y(), c.z()) + r <= radiusUm;
        }
    }
}
