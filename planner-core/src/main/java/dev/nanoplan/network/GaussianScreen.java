package dev.nanoplan.network;

import dev.nanoplan.count.CountLaw;
import dev.nanoplan.count.CountTerm;
import dev.nanoplan.info.BinaryChannel;
import java.util.List;
import org.apache.commons.numbers.gamma.Erfc;

/**
 * A cheap estimate of a link's capacity, used to skip hopeless links before the exact evaluation.
 *
 * <p>The counts given the lowest and the highest level are replaced by normal laws with the same
 * means and variances (the moments of the terms, O(terms)); decide "high" iff Y ≥ τ with a
 * continuity correction of ½, for 256 thresholds spread over [μ_low − 6σ, μ_high + 6σ]; the
 * estimate is the best binary-asymmetric-channel capacity over them (Silverman 1955, via
 * {@link BinaryChannel#capacity(double, double)}). This is the textbook Gaussian shortcut (docs/architecture.md
 * §5.6), not a bound: with strong on/off interferers the true count law is multimodal and the
 * exact capacity was seen up to about 6× above the estimate, so callers skip a link only when the
 * estimate is below {@link #SAFETY_FACTOR}⁻¹ × the floor. Cost O(terms + 256).
 */
public final class GaussianScreen {

    /** Links are skipped only when the estimate is below floor / SAFETY_FACTOR. */
    public static final double SAFETY_FACTOR = 10;
    private static final int THRESHOLDS = 256;

    private GaussianScreen() {
    }

    /** Estimated capacity in bits (binary sub-channel of the extreme levels). */
    public static double estimateBits(LinkSpec spec, List<CountTerm> interference) {
        return scan(spec, interference, 0, false);
    }

    /**
     * Whether {@code estimateBits(spec, interference) * SAFETY_FACTOR >= floorBits}, the planner's
     * test for evaluating a link, decided with less work: the scan stops at the first threshold
     * that passes, and thresholds whose total variation |1 − e0 − e1| (an upper bound on their
     * capacity, see the class comment of {@link #estimateBits}) cannot pass are not evaluated.
     * Same thresholds and same arithmetic as {@link #estimateBits}, so the same answer (up to a
     * relative margin of 1e-12 on the bound, which only makes it evaluate more).
     */
    public static boolean passes(LinkSpec spec, List<CountTerm> interference, double floorBits) {
        return scan(spec, interference, floorBits, true) * SAFETY_FACTOR >= floorBits;
    }

    /**
     * Best capacity over the thresholds; with {@code early}, skips thresholds whose bound cannot
     * reach {@code floorBits} / SAFETY_FACTOR and returns once the best reaches it.
     */
    private static double scan(LinkSpec spec, List<CountTerm> interference, double floorBits, boolean early) {
        double need = floorBits / SAFETY_FACTOR * (1 - 1e-12);
        CountLaw low = LinkEvaluator.lawGivenLevel(spec, 0, interference);
        CountLaw high = LinkEvaluator.lawGivenLevel(spec, spec.levels() - 1, interference);
        double m0 = low.mean();
        double m1 = high.mean();
        double s0 = Math.sqrt(Math.max(low.variance(), 1e-4));
        double s1 = Math.sqrt(Math.max(high.variance(), 1e-4));
        double lo = Math.min(m0 - 6 * s0, m1 - 6 * s1);
        double hi = Math.max(m0 + 6 * s0, m1 + 6 * s1);
        double best = 0;
        for (int i = 0; i <= THRESHOLDS; i++) {
            double tau = lo + (hi - lo) * i / THRESHOLDS;
            double e0 = 0.5 * Erfc.value((tau - 0.5 - m0) / (s0 * Math.sqrt(2)));
            double e1 = 0.5 * Erfc.value(-(tau - 0.5 - m1) / (s1 * Math.sqrt(2)));
            // a binary-input channel's capacity is at most the total variation |1 − e0 − e1| bits
            // (degraded erasure channel; Cover and Thomas 2006, Theorem 2.8.1): skip what cannot win
            double tv = Math.abs(1 - e0 - e1);
            if (tv <= best || tv < need) {
                continue;
            }
            best = Math.max(best, BinaryChannel.capacity(e0, e1).bits());
            if (early && best * SAFETY_FACTOR >= floorBits) {
                return best;
            }
        }
        return best;
    }
}
