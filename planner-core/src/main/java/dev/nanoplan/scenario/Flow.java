package dev.nanoplan.scenario;

import dev.nanoplan.geometry.Vec3;

/**
 * Bulk flow of the medium: none, uniform drift, or laminar (Poiseuille) flow in a cylinder.
 *
 * <p>File form: {@code {"profile": "none"}}, {@code {"profile": "uniform", "velocity_um_per_s":
 * [vx,vy,vz]}}, {@code {"profile": "poiseuille", "mean_speed_um_per_s": u}}.
 */
public sealed interface Flow permits Flow.None, Flow.Uniform, Flow.Poiseuille {

    /** The profile name used in files: {@code none}, {@code uniform}, {@code poiseuille}. */
    String profile();

    /** Still fluid. */
    record None() implements Flow {
        @Override
        public String profile() {
            return "none";
        }
    }

    /**
     * The same drift velocity everywhere.
     *
     * @param velocityUmPerS drift velocity in µm/s
     */
    record Uniform(Vec3 velocityUmPerS) implements Flow {
        /** @throws IllegalArgumentException if the velocity is null */
        public Uniform {
            Checks.required("velocityUmPerS", velocityUmPerS);
        }

        @Override
        public String profile() {
            return "uniform";
        }
    }

    /**
     * Laminar flow along +x in a cylindrical volume: v(ρ) = 2u·(1 − ρ²/R²) at distance ρ from the
     * axis, so u is the mean over the cross-section and 2u the speed on the axis (Hagen–Poiseuille;
     * e.g. F. M. White, <i>Fluid Mechanics</i>, 7th ed., 2011, §6.4). Only valid with a
     * {@link dev.nanoplan.geometry.Volume.Cylinder} volume (checked by the scenario validator).
     *
     * @param meanSpeedUmPerS u, mean speed in µm/s, finite and ≥ 0
     */
    record Poiseuille(double meanSpeedUmPerS) implements Flow {
        /** @throws IllegalArgumentException if u is negative or not finite */
        public Poiseuille {
            Checks.nonNegative("meanSpeedUmPerS", meanSpeedUmPerS);
        }

        @Override
        public String profile() {
            return "poiseuille";
        }

        /**
         * Axial speed at distance {@code rhoUm} from the axis of a cylinder of radius
         * {@code cylinderRadiusUm}: 2u(1 − ρ²/R²), 0 at and beyond the wall.
         */
        public double axialSpeedUmPerS(double rhoUm, double cylinderRadiusUm) {
            double s = rhoUm / cylinderRadiusUm;
            return s >= 1 ? 0.0 : 2 * meanSpeedUmPerS * (1 - s * s);
        }
    }
}
