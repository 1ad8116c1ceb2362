package dev.nanoplan.sim;

import dev.nanoplan.geometry.Volume;
import dev.nanoplan.scenario.Flow;

/**
 * One time step of free motion for one species: Gaussian displacement, drift, and reflection at
 * the walls of the volume (Euler–Maruyama step of dX = v(X)dt + √(2D) dW).
 *
 * <p>Each coordinate gains N(0, 2DΔt) plus vΔt, with v evaluated at the start of the step
 * (for Poiseuille flow v = 2u(1 − ρ²/R²) along +x, ρ the distance from the axis).
 *
 * <p>Walls:
 * <ul>
 *   <li>box: the position is mirrored in each plane it crossed; for a plane wall this is the
 *       exact law of reflected Brownian motion over the step (reflection principle, e.g.
 *       I. Karatzas, S. Shreve, <i>Brownian Motion and Stochastic Calculus</i>, 1991, §2.6);</li>
 *   <li>cylinder: the end planes x = 0 and x = L as for the box; the curved wall by mirroring
 *       the radial distance, ρ → 2R − ρ, keeping the direction from the axis. This treats the
 *       wall as its tangent plane over one step, an approximation whose error per reflection is
 *       of order σ²/R (σ² = 2DΔt), so O(Δt). Measured (cylinder R = 10 µm, long-time density in
 *       the outer layer of width 0.1R against the uniform law, 2e5 molecules, s.e. 0.5 %): the
 *       layer holds 0.3 % more at σ/R = 0.05, 1.2 % less at σ/R = 0.1, 6 % less at 0.2 and
 *       15 % less at 0.4; {@code MotionTest} checks σ/R = 0.1 within 5 %. Molecules are thus
 *       slightly depleted at a curved wall when Δt is coarse; halve Δt to check;</li>
 *   <li>open volume: no walls.</li>
 * </ul>
 * Steps longer than the box are folded repeatedly (never leaves the volume). Each call is O(1)
 * and allocation-free; the step loop itself is in {@link BlockKernel}. Instances are immutable and shared between threads.
 */
final class Motion {

    static final int OPEN = 0;
    static final int BOX = 1;
    static final int CYLINDER = 2;

    static final int NO_DRIFT = 0;
    static final int UNIFORM = 1;
    static final int POISEUILLE = 2;

    final double diffusionUm2PerS;
    final double timeStepS;
    /** σ = √(2DΔt), µm, standard deviation per coordinate per step. */
    final double sigmaUm;
    /** D·Δt in µm², used by the Brownian-bridge crossing probability. */
    final double diffusionTimesStepUm2;
    final int walls;
    final int drift;
    private final double minX;
    private final double minY;
    private final double minZ;
    private final double maxX;
    private final double maxY;
    private final double maxZ;
    private final double cylinderRadiusUm;
    private final double cylinderRadius2;
    private final double driftStepX;
    private final double driftStepY;
    private final double driftStepZ;
    /** 2uΔt: axial shift on the axis per step (Poiseuille). */
    private final double axialStepUm;

    Motion(Volume volume, Flow flow, double diffusionUm2PerS, double timeStepS) {
        if (!(diffusionUm2PerS > 0) || !Double.isFinite(diffusionUm2PerS)) {
            throw new IllegalArgumentException("diffusionUm2PerS: must be finite and > 0, got " + diffusionUm2PerS);
        }
        if (!(timeStepS > 0) || !Double.isFinite(timeStepS)) {
            throw new IllegalArgumentException("timeStepS: must be finite and > 0, got " + timeStepS);
        }
        this.diffusionUm2PerS = diffusionUm2PerS;
        this.timeStepS = timeStepS;
        this.sigmaUm = Math.sqrt(2 * diffusionUm2PerS * timeStepS);
        this.diffusionTimesStepUm2 = diffusionUm2PerS * timeStepS;
        double x0 = 0;
        double y0 = 0;
        double z0 = 0;
        double x1 = 0;
        double y1 = 0;
        double z1 = 0;
        double cr = 0;
        if (volume instanceof Volume.Box b) {
            walls = BOX;
            x0 = b.minUm().x();
            y0 = b.minUm().y();
            z0 = b.minUm().z();
            x1 = b.maxUm().x();
            y1 = b.maxUm().y();
            z1 = b.maxUm().z();
        } else if (volume instanceof Volume.Cylinder c) {
            walls = CYLINDER;
            x1 = c.lengthUm();
            cr = c.radiusUm();
        } else {
            walls = OPEN;
        }
        minX = x0;
        minY = y0;
        minZ = z0;
        maxX = x1;
        maxY = y1;
        maxZ = z1;
        cylinderRadiusUm = cr;
        cylinderRadius2 = cr * cr;
        double dx = 0;
        double dy = 0;
        double dz = 0;
        double axial = 0;
        int kind = NO_DRIFT;
        if (flow instanceof Flow.Uniform u) {
            kind = UNIFORM;
            dx = u.velocityUmPerS().x() * timeStepS;
            dy = u.velocityUmPerS().y() * timeStepS;
            dz = u.velocityUmPerS().z() * timeStepS;
        } else if (flow instanceof Flow.Poiseuille p) {
            if (walls != CYLINDER) {
                throw new IllegalArgumentException("flow: Poiseuille flow needs a cylinder volume");
            }
            kind = POISEUILLE;
            axial = 2 * p.meanSpeedUmPerS() * timeStepS;
        }
        drift = kind;
        driftStepX = dx;
        driftStepY = dy;
        driftStepZ = dz;
        axialStepUm = axial;
    }

    /** x-displacement by drift over one step starting at (y, z). */
    double driftX(double y, double z) {
        switch (drift) {
            case UNIFORM:
                return driftStepX;
            case POISEUILLE: {
                double s = (y * y + z * z) / cylinderRadius2;
                return s >= 1 ? 0 : axialStepUm * (1 - s);
            }
            default:
                return 0;
        }
    }

    double driftY() {
        return driftStepY;
    }

    double driftZ() {
        return driftStepZ;
    }

    /** Box walls or cylinder end planes: the x coordinate after reflection. */
    double wallX(double x) {
        return fold(x, minX, maxX);
    }

    /** Box walls: the y coordinate after reflection. */
    double wallY(double y) {
        return fold(y, minY, maxY);
    }

    /** Box walls: the z coordinate after reflection. */
    double wallZ(double z) {
        return fold(z, minZ, maxZ);
    }

    /**
     * Cylinder wall: the factor by which (y, z) is scaled so that a point at radial distance
     * ρ &gt; R is mirrored to 2R − ρ (1 inside). {@code rho2} = y² + z².
     */
    double radialScale(double rho2) {
        if (rho2 <= cylinderRadius2) {
            return 1;
        }
        double rho = Math.sqrt(rho2);
        return fold(rho, 0, cylinderRadiusUm) / rho;
    }

    /**
     * Mirror image of v in [lo, hi]: v itself when inside, else repeated reflection at the
     * ends (the fold of the real line onto the interval with period 2(hi − lo)).
     */
    static double fold(double v, double lo, double hi) {
        if (v >= lo && v <= hi) {
            return v;
        }
        if (v < lo && v >= 2 * lo - hi) {
            return 2 * lo - v;
        }
        if (v > hi && v <= 2 * hi - lo) {
            return 2 * hi - v;
        }
        double w = hi - lo;
        double u = (v - lo) % (2 * w);
        if (u < 0) {
            u += 2 * w;
        }
        return u <= w ? lo + u : lo + 2 * w - u;
    }
}
