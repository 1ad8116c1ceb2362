package dev.nanoplan.sim;

import org.apache.commons.rng.UniformRandomProvider;

/**
 * The absorbing spheres one emitter's molecules can reach, with a uniform grid so that a step
 * checks only the spheres near its end point.
 *
 * <p>A molecule is absorbed in a step if its end point lies inside a sphere, or, when both ends
 * lie outside, with the Brownian-bridge probability of having touched the sphere in between.
 * The sphere is replaced by its tangent plane over the step, for which the probability that a
 * Brownian path with per-axis variance 2DΔt, pinned at distances d₁, d₂ &gt; 0 from the plane,
 * touches it is P = exp(−d₁d₂/(DΔt)) (R. Mannella, "Absorbing boundaries and optimal stopping in
 * a stochastic differential equation", Phys. Lett. A 254, 1999; S. S. Andrews, D. Bray,
 * "Stochastic simulation of chemical reactions with spatial resolution and single molecule
 * detail", Phys. Biol. 1, 2004). The correction removes the O(√Δt) leading error of plain
 * end-point checks; the tangent-plane error is of relative order √(DΔt)/r.
 *
 * <p><b>Reactive spheres</b> (the Collins–Kimball boundary D∂c/∂n = κc, F. C. Collins and G. E.
 * Kimball, J. Colloid Sci. 4, 1949): a sphere with adsorption probability P &lt; 1 uses the
 * partially reflecting scheme of R. Erban and S. J. Chapman, "Reactive boundary conditions for
 * stochastic simulations of reaction–diffusion processes", Phys. Biol. 4 (2007) 16–28, §3 (the
 * Brownian-dynamics model): a molecule whose step ends inside the sphere is adsorbed with
 * probability P = κ·√(π·Δt/D), else reflected (its end point mirrored radially in the surface,
 * ρ → 2r − ρ); no bridge test, because P is derived for end-point checks (the same constant
 * √π appears in A. Singer, Z. Schuss, A. Osipov, D. Holcman, "Partially reflected diffusion", SIAM
 * J. Appl. Math. 68(3), 2008: κ = P√D/√π). The relation holds to leading order as Δt → 0
 * (P ≪ 1 and a step short against r); when κ√(πΔt/D) ≥ 1 the surface adsorbs every molecule that
 * reaches it at this resolution and the sphere is treated as absorbing (P = 1, with the bridge
 * test), so κ → ∞ gives the absorbing sphere exactly. A reflected end point may land inside a
 * neighbouring sphere only if the two nearly touch; it is then left there and judged next step.
 *
 * <p>Spheres farther than a reach of r + {@value #REACH_SIGMAS}σ from the end point are skipped:
 * for them the bridge probability needs a jump of more than ~{@value #REACH_SIGMAS}σ, a chance
 * below 1e-12 per step. The first sphere found wins (spheres do not overlap, so at most one can
 * contain a point; two bridge hits in one step are a second-order event).
 *
 * <p>Grid: cells of edge h = max(largest reach, bounding extent / {@value #MAX_CELLS_PER_AXIS}),
 * so a cell lists few spheres and most cells none (at most 128³ cells, 8 MB of offsets), each listing the spheres whose reach ball meets it;
 * with at most {@value #DIRECT_LIMIT} spheres the list is scanned directly. Query O(1 + spheres
 * per cell). Immutable, shared between threads.
 */
final class Absorbers {

    static final double REACH_SIGMAS = 8;
    static final int DIRECT_LIMIT = 4;
    static final int MAX_CELLS_PER_AXIS = 128;
    /** Bridge exponents above this give probabilities below e^{-40} ≈ 4e-18: skipped. */
    private static final double MAX_EXPONENT = 40;

    /** {@link #absorb} result: the end point was reflected by a reactive sphere (the new one is in {@code out}). */
    static final int REFLECTED = -2;

    final int count;
    /** Per sphere: the adsorption probability at a crossing (1: absorbing, with the bridge test). */
    private final double[] adsorb;
    /** Per sphere i, at 6i: centre x, y, z, radius, radius², reach² (packed for locality). */
    private final double[] sphere;
    private final double[] cx;
    private final double[] cy;
    private final double[] cz;
    private final double[] radius2;
    private final double[] reach2;
    /** Index of each sphere in the simulation's receiver list. */
    private final int[] receiverIndex;
    private final double diffusionTimesStepUm2;

    private final boolean grid;
    private final double gx0;
    private final double gy0;
    private final double gz0;
    private final double invCell;
    private final int nx;
    private final int ny;
    private final int nz;
    private final int[] cellStart;
    private final int[] cellItems;
    private final int[] all;

    /**
     * @param centres x,y,z triples of the sphere centres, µm
     * @param radii sphere radii, µm, &gt; 0
     * @param receiverIndex for each sphere, its index in the receiver list
     * @param sigmaUm per-axis step standard deviation √(2DΔt), µm
     * @param diffusionTimesStepUm2 DΔt, µm²
     */
    Absorbers(double[][] centres, double[] radii, int[] receiverIndex, double sigmaUm, double diffusionTimesStepUm2) {
        this(centres, radii, receiverIndex, null, sigmaUm, diffusionTimesStepUm2);
    }

    /**
     * @param adsorb per sphere, the adsorption probability P at a crossing in (0, 1] (1: a perfect
     *     absorber); null for all perfect absorbers
     * @see #Absorbers(double[][], double[], int[], double, double)
     */
    Absorbers(double[][] centres, double[] radii, int[] receiverIndex, double[] adsorb, double sigmaUm,
            double diffusionTimesStepUm2) {
        count = radii.length;
        this.adsorb = new double[count];
        for (int i = 0; i < count; i++) {
            this.adsorb[i] = adsorb == null ? 1 : Math.min(1, adsorb[i]);
        }
        cx = new double[count];
        cy = new double[count];
        cz = new double[count];
        sphere = new double[6 * count];
        radius2 = new double[count];
        reach2 = new double[count];
        this.receiverIndex = receiverIndex.clone();
        this.diffusionTimesStepUm2 = diffusionTimesStepUm2;
        all = new int[count];
        double margin = REACH_SIGMAS * sigmaUm;
        double maxReach = 0;
        double lox = Double.POSITIVE_INFINITY;
        double loy = Double.POSITIVE_INFINITY;
        double loz = Double.POSITIVE_INFINITY;
        double hix = Double.NEGATIVE_INFINITY;
        double hiy = Double.NEGATIVE_INFINITY;
        double hiz = Double.NEGATIVE_INFINITY;
        for (int i = 0; i < count; i++) {
            cx[i] = centres[i][0];
            cy[i] = centres[i][1];
            cz[i] = centres[i][2];
            radius2[i] = radii[i] * radii[i];
            double reach = radii[i] + margin;
            reach2[i] = reach * reach;
            maxReach = Math.max(maxReach, reach);
            all[i] = i;
            sphere[6 * i] = cx[i];
            sphere[6 * i + 1] = cy[i];
            sphere[6 * i + 2] = cz[i];
            sphere[6 * i + 3] = radii[i];
            sphere[6 * i + 4] = radius2[i];
            sphere[6 * i + 5] = reach2[i];
            lox = Math.min(lox, cx[i] - reach);
            loy = Math.min(loy, cy[i] - reach);
            loz = Math.min(loz, cz[i] - reach);
            hix = Math.max(hix, cx[i] + reach);
            hiy = Math.max(hiy, cy[i] + reach);
            hiz = Math.max(hiz, cz[i] + reach);
        }
        grid = count > DIRECT_LIMIT;
        if (!grid) {
            gx0 = gy0 = gz0 = invCell = 0;
            nx = ny = nz = 0;
            cellStart = null;
            cellItems = null;
            return;
        }
        double extent = Math.max(hix - lox, Math.max(hiy - loy, hiz - loz));
        double h = Math.max(maxReach, extent / MAX_CELLS_PER_AXIS);
        gx0 = lox;
        gy0 = loy;
        gz0 = loz;
        invCell = 1 / h;
        nx = Math.max(1, (int) Math.ceil((hix - lox) * invCell));
        ny = Math.max(1, (int) Math.ceil((hiy - loy) * invCell));
        nz = Math.max(1, (int) Math.ceil((hiz - loz) * invCell));
        int cells = nx * ny * nz;
        int[] perCell = new int[cells + 1];
        int[] builtItems = null;
        // two passes: count, then fill (compressed row storage)
        for (int pass = 0; pass < 2; pass++) {
            int[] fill = pass == 1 ? perCell.clone() : null;
            int[] items = pass == 1 ? new int[perCell[cells]] : null;
            for (int i = 0; i < count; i++) {
                double reach = Math.sqrt(reach2[i]);
                int ix0 = clamp((int) Math.floor((cx[i] - reach - gx0) * invCell), nx);
                int ix1 = clamp((int) Math.floor((cx[i] + reach - gx0) * invCell), nx);
                int iy0 = clamp((int) Math.floor((cy[i] - reach - gy0) * invCell), ny);
                int iy1 = clamp((int) Math.floor((cy[i] + reach - gy0) * invCell), ny);
                int iz0 = clamp((int) Math.floor((cz[i] - reach - gz0) * invCell), nz);
                int iz1 = clamp((int) Math.floor((cz[i] + reach - gz0) * invCell), nz);
                for (int ix = ix0; ix <= ix1; ix++) {
                    for (int iy = iy0; iy <= iy1; iy++) {
                        for (int iz = iz0; iz <= iz1; iz++) {
                            int c = (ix * ny + iy) * nz + iz;
                            if (pass == 0) {
                                perCell[c + 1]++;
                            } else {
                                items[fill[c]++] = i;
                            }
                        }
                    }
                }
            }
            if (pass == 0) {
                for (int c = 0; c < cells; c++) {
                    perCell[c + 1] += perCell[c];
                }
            } else {
                builtItems = items;
            }
        }
        cellStart = perCell;
        cellItems = builtItems;
    }

    private static int clamp(int i, int n) {
        return i < 0 ? 0 : (i >= n ? n - 1 : i);
    }

    /** No absorbers at all. */
    static Absorbers none(double sigmaUm, double diffusionTimesStepUm2) {
        return new Absorbers(new double[0][], new double[0], new int[0], sigmaUm, diffusionTimesStepUm2);
    }

    /**
     * The adsorption probability of a reactive sphere at a crossing, P = κ·√(π·Δt/D) (Erban and
     * Chapman 2007, §3; see the class comment), capped at 1.
     *
     * @param bindingRateUmPerS κ, µm/s
     * @param timeStepS Δt, s
     * @param diffusionUm2PerS D, µm²/s
     */
    static double adsorptionProbability(double bindingRateUmPerS, double timeStepS, double diffusionUm2PerS) {
        return Math.min(1, bindingRateUmPerS * Math.sqrt(Math.PI * timeStepS / diffusionUm2PerS));
    }

    /**
     * The receiver that absorbs a molecule stepping from (x0,y0,z0) to (x1,y1,z1), or −1: the
     * {@link #absorb(double, double, double, double, double, double, UniformRandomProvider, double[])}
     * of layouts with perfect absorbers only (which never reflect).
     */
    int absorb(double x0, double y0, double z0, double x1, double y1, double z1, UniformRandomProvider rng) {
        return absorb(x0, y0, z0, x1, y1, z1, rng, null);
    }

    /**
     * The receiver that absorbs a molecule stepping from (x0,y0,z0) to (x1,y1,z1), −1 for none, or
     * {@link #REFLECTED} when a reactive sphere reflected it; the new end point is then in
     * {@code out} (x, y, z; the caller's scratch array, needed only with reactive spheres). Draws one
     * uniform variate from {@code rng} per perfectly absorbing sphere within reach that the end point
     * is outside of, and one per reactive sphere the end point is inside of.
     */
    int absorb(double x0, double y0, double z0, double x1, double y1, double z1, UniformRandomProvider rng,
            double[] out) {
        int from;
        int to;
        int[] list;
        if (grid) {
            double fx = (x1 - gx0) * invCell;
            double fy = (y1 - gy0) * invCell;
            double fz = (z1 - gz0) * invCell;
            if (!(fx >= 0 && fx < nx && fy >= 0 && fy < ny && fz >= 0 && fz < nz)) {
                return -1;
            }
            int c = ((int) fx * ny + (int) fy) * nz + (int) fz;
            from = cellStart[c];
            to = cellStart[c + 1];
            list = cellItems;
        } else {
            from = 0;
            to = count;
            list = all;
        }
        final double[] sp = sphere;
        for (int k = from; k < to; k++) {
            int i = list[k];
            int o = 6 * i;
            double scx = sp[o];
            double scy = sp[o + 1];
            double scz = sp[o + 2];
            double dx = x1 - scx;
            double dy = y1 - scy;
            double dz = z1 - scz;
            double e2 = dx * dx + dy * dy + dz * dz;
            if (e2 >= sp[o + 5]) {
                continue;
            }
            double p = adsorb[i];
            if (e2 <= sp[o + 4]) {
                if (p >= 1 || rng.nextDouble() < p) {
                    return receiverIndex[i];
                }
                // reflect radially in the surface: ρ → 2r − ρ (the centre itself goes out along x)
                double rho = Math.sqrt(e2);
                if (rho > 0) {
                    double scale = (2 * sp[o + 3] - rho) / rho;
                    out[0] = scx + dx * scale;
                    out[1] = scy + dy * scale;
                    out[2] = scz + dz * scale;
                } else {
                    out[0] = scx + 2 * sp[o + 3];
                    out[1] = scy;
                    out[2] = scz;
                }
                return REFLECTED;
            }
            if (p < 1) {
                continue; // reactive: end points only (class comment)
            }
            double r = sp[o + 3];
            double d2 = Math.sqrt(e2) - r;
            double ax = x0 - scx;
            double ay = y0 - scy;
            double az = z0 - scz;
            double d1 = Math.sqrt(ax * ax + ay * ay + az * az) - r;
            if (d1 <= 0) {
                return receiverIndex[i];
            }
            double exponent = d1 * d2 / diffusionTimesStepUm2;
            if (exponent < MAX_EXPONENT && rng.nextDouble() < Math.exp(-exponent)) {
                return receiverIndex[i];
            }
        }
        return -1;
    }
}
