package dev.nanoplan.geometry;

/**
 * A vector or point in three dimensions with finite components.
 *
 * <p>The type carries no unit; the name of the field or parameter that holds it does
 * (for example {@code positionUm} in micrometres, {@code velocityUmPerS} in µm/s).
 *
 * @param x first component, finite
 * @param y second component, finite
 * @param z third component, finite
 */
public record Vec3(double x, double y, double z) {

    /** The origin (0, 0, 0). */
    public static final Vec3 ZERO = new Vec3(0, 0, 0);

    /**
     * @throws IllegalArgumentException if a component is NaN or infinite
     */
    public Vec3 {
        if (!Double.isFinite(x) || !Double.isFinite(y) || !Double.isFinite(z)) {
            throw new IllegalArgumentException(
                    "vector components must be finite, got (" + x + ", " + y + ", " + z + ")");
        }
    }

    /** Builds a vector from an array of exactly three components. */
    public static Vec3 of(double[] xyz) {
        if (xyz.length != 3) {
            throw new IllegalArgumentException("a vector needs 3 components, got " + xyz.length);
        }
        return new Vec3(xyz[0], xyz[1], xyz[2]);
    }

    /** The components as a new array {x, y, z}. */
    public double[] toArray() {
        return new double[] {x, y, z};
    }

    /** this − other. */
    public Vec3 minus(Vec3 other) {
        return new Vec3(x - other.x, y - other.y, z - other.z);
    }

    /** this + other. */
    public Vec3 plus(Vec3 other) {
        return new Vec3(x + other.x, y + other.y, z + other.z);
    }

    /** Euclidean length, computed with {@link Math#hypot} so it neither overflows nor underflows. */
    public double norm() {
        return Math.hypot(Math.hypot(x, y), z);
    }

    /** Euclidean distance to {@code other}. */
    public double distance(Vec3 other) {
        return Math.hypot(Math.hypot(x - other.x, y - other.y), z - other.z);
    }
}
