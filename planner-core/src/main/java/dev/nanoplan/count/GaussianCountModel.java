package dev.nanoplan.count;

import org.apache.commons.statistics.distribution.NormalDistribution;

/**
 * Moment-matched normal approximation (the textbook shortcut): Y ≈ N(μ, σ²) with μ and σ² the
 * law's mean and variance (central limit theorem; its error for sums of independent terms is
 * O(1/σ) by the Berry–Esseen theorem — A. C. Berry, Trans. AMS 49 (1941) 122–136;
 * C.-G. Esseen, Ark. Mat. Astr. Fys. 28A (1942)).
 *
 * <p>Two variants:
 * <ul>
 *   <li>{@link Variant#CONTINUITY_CORRECTED}: P(Y = y) = Φ((y+½−μ)/σ) − Φ((y−½−μ)/σ) (each
 *       count owns a unit cell); window + massBelow + massAbove = 1 to rounding, where
 *       massBelow = Φ((lo−½−μ)/σ) includes all the normal mass below 0;</li>
 *   <li>{@link Variant#DENSITY}: P(Y = y) = φ((y−μ)/σ)/σ (no correction). The masses then sum
 *       to 1 only up to the Riemann-sum error, about 2·exp(−2π²σ²) by the Poisson summation
 *       formula (so not a probability for σ below about 0.5); massBelow and massAbove are the
 *       normal masses beyond the outer half-cell edges, as above.</li>
 * </ul>
 * Cells differing in sign are taken as differences of upper tails on the right of μ and of
 * lower tails on the left, so small cells do not cancel. The window is [max(0, ⌊μ − zσ⌋),
 * ⌈μ + zσ⌉] with Φ(−z) = truncationMass/2. Variance 0 (or σ below 1e-9) gives the point mass
 * at round(μ). Cost O(σ) evaluations of Φ or φ.
 */
public final class GaussianCountModel implements CountModel {

    /** How counts take their mass from the normal law. */
    public enum Variant {
        /** Integrate the normal density over [y − ½, y + ½]. */
        CONTINUITY_CORRECTED,
        /** Sample the normal density at y. */
        DENSITY
    }

    private static final NormalDistribution STANDARD = NormalDistribution.of(0, 1);
    private static final double MIN_SIGMA = 1e-9;

    /** Continuity-corrected model with truncation 1e-15. */
    public static final GaussianCountModel DEFAULT =
            new GaussianCountModel(Variant.CONTINUITY_CORRECTED, ExactCountModel.DEFAULT_TRUNCATION_MASS);


    private final Variant variant;
    private final double truncationMass;
    private final double z;

    /**
     * @param variant continuity-corrected cells or sampled density
     * @param truncationMass total normal mass left outside the window, in (0, 0.5]
     */
    public GaussianCountModel(Variant variant, double truncationMass) {
        if (variant == null) {
            throw new IllegalArgumentException("variant must not be null");
        }
        if (!(truncationMass > 0 && truncationMass <= 0.5)) {
            throw new IllegalArgumentException("truncationMass must be in (0, 0.5], got "
                    + truncationMass);
        }
        this.variant = variant;
        this.truncationMass = truncationMass;
        this.z = STANDARD.inverseSurvivalProbability(truncationMass / 2);
    }

    /** Model of the given variant with truncation 1e-15. */
    public GaussianCountModel(Variant variant) {
        this(variant, ExactCountModel.DEFAULT_TRUNCATION_MASS);
    }

    public Variant variant() {
        return variant;
    }

    @Override
    public CountPmf pmf(CountLaw law) {
        double mu = law.mean();
        double sigma = Math.sqrt(law.variance());
        if (!(sigma >= MIN_SIGMA)) {
            return Window.point(Math.max(0, Math.round(mu))).toPmf();
        }
        long lo = Math.max(0, (long) Math.floor(mu - z * sigma));
        long hi = Math.max(lo, (long) Math.ceil(mu + z * sigma));
        if (hi - lo + 1 > TermWindows.MAX_CELLS) {
            throw new IllegalArgumentException("normal window too wide: " + (hi - lo + 1) + " cells");
        }
        double[] p = new double[(int) (hi - lo + 1)];
        if (variant == Variant.CONTINUITY_CORRECTED) {
            // consecutive cells share an edge ((y − 1) + ½ = y − ½ exactly): one tail per edge
            double a = (lo - 0.5 - mu) / sigma;
            double ta = tail(a);
            for (int i = 0; i < p.length; i++) {
                double b = (lo + i + 0.5 - mu) / sigma;
                double tb = tail(b);
                p[i] = cell(a, ta, b, tb);
                a = b;
                ta = tb;
            }
        } else {
            for (int i = 0; i < p.length; i++) {
                double y = lo + i;
                p[i] = STANDARD.density((y - mu) / sigma) / sigma;
            }
        }
        double below = STANDARD.cumulativeProbability((lo - 0.5 - mu) / sigma);
        double above = STANDARD.survivalProbability((hi + 0.5 - mu) / sigma);
        return new CountPmf(lo, p, below, above);
    }

    /** Φ(b) − Φ(a) for a &lt; b, without cancellation in either tail. */
    static double cell(double a, double b) {
        return cell(a, tail(a), b, tail(b));
    }

    /** The smaller-side tail at x: 1 − Φ(x) for x &gt; 0, Φ(x) for x ≤ 0 (both ½ at 0). */
    private static double tail(double x) {
        return x > 0 ? STANDARD.survivalProbability(x) : STANDARD.cumulativeProbability(x);
    }

    /** {@link #cell(double, double)} from the edges' tails {@link #tail(double)}. */
    private static double cell(double a, double ta, double b, double tb) {
        if (a >= 0) {
            return ta - tb;
        }
        if (b <= 0) {
            return tb - ta;
        }
        return 1 - ta - tb;
    }
}
