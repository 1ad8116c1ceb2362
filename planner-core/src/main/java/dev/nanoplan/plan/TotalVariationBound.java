package dev.nanoplan.plan;

/**
 * The pre-skip of the planners: an upper bound on a link's capacity that costs one logarithm.
 *
 * <p>Given level j the count is Bin(n_j, p_0) from the emitter's current release plus parts shared by
 * every level (leftovers, crosstalk, background). Couple the levels on one run of swing = n_max − n_min
 * Bernoulli(p_0) trials (level j uses the first n_j − n_min of them on top of a common Bin(n_min, p_0)):
 * with probability (1 − p_0)^swing every trial misses and the count does not depend on the level. So the
 * link is a degraded version of an erasure channel with erasure probability (1 − p_0)^swing, whose
 * capacity is (1 − (1 − p_0)^swing)·log2 M bits (T. M. Cover and J. A. Thomas, <i>Elements of
 * Information Theory</i>, 2nd ed., 2006, §7.1.5 and the data-processing inequality, §2.8). For binary
 * signalling that is the bound used here, C ≤ 1 − (1 − p_0)^swing. For M &gt; 2 levels the planners use
 * the same number without the factor log2 M (kept as it was, so plans stay byte-identical); it can skip
 * an M-level link whose capacity lies between the floor and log2 M times the floor — a known gap, noted
 * for the work on multi-level numbers.
 *
 * <p><b>Edge rule (one for every planner).</b> p_0 ≥ 1 gives 1 (the bound says nothing); otherwise
 * the bound is −expm1(swing·log1p(−p_0)), accurate for tiny p_0 and large swing (no cancellation);
 * swing = 0 gives 0. A pair is skipped when the bound is below the capacity floor or is 0.
 */
final class TotalVariationBound {

    private TotalVariationBound() {
    }

    /** 1 − (1 − p0)^swing, in [0, 1]; see the class comment for the edge rule. */
    static double bits(double p0, long swing) {
        return p0 >= 1 ? 1 : -Math.expm1(swing * Math.log1p(-p0));
    }

    /** Whether a link with first tap {@code p0} and level swing {@code swing} provably stays below the floor. */
    static boolean skips(double p0, long swing, double floorBits) {
        double bound = bits(p0, swing);
        return bound < floorBits || bound == 0;
    }
}
