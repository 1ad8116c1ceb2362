package dev.nanoplan.network;

import dev.nanoplan.count.CountPmf;
import dev.nanoplan.detect.BinaryDetection;
import dev.nanoplan.detect.BinaryThresholdSearch;
import dev.nanoplan.detect.MultiLevelQuantizer;
import dev.nanoplan.detect.MultiLevelResult;
import java.util.Arrays;
import java.util.List;
import java.util.function.Function;
import org.apache.commons.math3.optim.MaxEval;
import org.apache.commons.math3.optim.nonlinear.scalar.GoalType;
import org.apache.commons.math3.optim.univariate.BrentOptimizer;
import org.apache.commons.math3.optim.univariate.SearchInterval;
import org.apache.commons.math3.optim.univariate.UnivariateObjectiveFunction;

/**
 * Capacity of a link whose emitter sends i.i.d. symbols with one input law: the law of the slot
 * count given the current level i depends on the input law through the leftovers of the emitter's
 * own earlier symbols (DESIGN model: Y = Bin(n_i, p_0) + Σ_{k≥1} Σ_j π_j Bin(n_j, p_k) as mixtures
 * + crosstalk + background), so the capacity is max over π of max over thresholds of I(π, τ; π),
 * with the ISI mixtures re-weighted at every π. Crosstalk terms keep the other emitters' own
 * priors.
 *
 * <p><b>Binary.</b> f(q) = max_τ I(q, τ) with the leftovers at q is continuous but need not be
 * unimodal in q (the best τ jumps), so the search first evaluates a grid q = 0.05, 0.10, …, 0.95
 * (plus the file's prior, already known), then runs Brent's method (R. P. Brent, <i>Algorithms for
 * Minimization without Derivatives</i>, 1973, ch. 5; Commons Math3 {@link BrentOptimizer}) on the
 * two grid cells around the best grid point, to an absolute q tolerance of {@value #Q_TOLERANCE}.
 * At a smooth maximum the loss in bits is of order f''·δq² ≤ 1e-10 bit; the returned value is the
 * best f seen over every evaluation, so it is achievable, at least the mutual information at the
 * file's prior, and at most the true maximum. Against a brute-force computation (all 2^L symbol
 * histories, q grid of step 1e-3 refined by golden section) it agrees within 1e-6 bit on seeded
 * random links ({@code ConsistentCapacityTest}). Cost: about 19 + 15–25 builds of the two count
 * pmfs and threshold searches, i.e. 35–45 times one link evaluation. When the own symbols leave
 * no leftovers (L = 0 or all taps p_1..p_L = 0) the pmfs do not depend on q and the closed form of
 * the binary asymmetric channel (R. A. Silverman, IRE Trans. Inf. Theory 1955) already computed by
 * the threshold search is returned unchanged, with no extra work.
 *
 * <p><b>More levels.</b> Fixed-point iteration: start from the capacity-achieving distribution of
 * the uniform-ISI pmfs; at π, rebuild the pmfs with the leftovers at π, record the consistent value
 * I(π, best thresholds at π; leftovers at π) (an exact threshold DP at π), then move π to the
 * Blahut–Arimoto / threshold alternation optimum of those pmfs ({@link MultiLevelQuantizer#optimise};
 * R. Blahut 1972, S. Arimoto 1972). It stops when π moves less than {@value #PI_TOLERANCE} in every
 * entry, or after {@value #MAX_ROUNDS} rounds; from round {@value #DAMP_AFTER} on the step is halved
 * (π ← (π + π')/2) to damp oscillation. The fixed point is a stationary point, not proven global;
 * the returned value is the best consistent value seen (uniform inputs included), so it is always
 * achievable and at least the operating point's mutual information.
 */
final class ConsistentCapacitySearch {

    /** Absolute tolerance on the prior q of the binary search. */
    static final double Q_TOLERANCE = 1e-7;
    /** Largest per-entry change of π that ends the fixed-point iteration. */
    static final double PI_TOLERANCE = 1e-6;
    static final int MAX_ROUNDS = 40;
    static final int DAMP_AFTER = 10;
    private static final double GRID_STEP = 0.05;
    private static final double EDGE = 1e-3;

    private ConsistentCapacitySearch() {
    }

    /**
     * @param pmfsAt      the count pmfs (given 0, given 1) with the own leftovers at the given weights
     * @param atPrior     the threshold search at the file's prior (its pmfs use the leftovers at it)
     * @param priorOne    the file's prior
     * @param leftovers   whether any tap p_1..p_L is positive
     */
    static LinkCapacity binary(Function<double[], List<CountPmf>> pmfsAt, BinaryDetection atPrior,
            double priorOne, boolean leftovers) {
        if (!leftovers) {
            double q = atPrior.capacityPriorOne();
            return new LinkCapacity(atPrior.capacityBits(), new double[] {1 - q, q},
                    new long[] {atPrior.capacityThreshold()}, 0, true, true);
        }
        Best best = new Best(pmfsAt);
        best.offer(priorOne, atPrior.mutualInformationBits(), atPrior.miThreshold());
        int cells = (int) Math.round(1 / GRID_STEP);
        double[] grid = new double[cells + 1];
        double[] value = new double[cells + 1];
        grid[0] = EDGE;
        grid[cells] = 1 - EDGE;
        int arg = 1;
        for (int j = 1; j < cells; j++) {
            grid[j] = j * GRID_STEP;
            value[j] = best.f(grid[j]);
            if (value[j] > value[arg]) {
                arg = j;
            }
        }
        double lo = grid[arg - 1];
        double hi = grid[arg + 1];
        BrentOptimizer brent = new BrentOptimizer(1e-10, Q_TOLERANCE);
        boolean converged = true;
        try {
            brent.optimize(new MaxEval(200), new UnivariateObjectiveFunction(best::f), GoalType.MAXIMIZE,
                    new SearchInterval(lo, hi, grid[arg]));
        } catch (org.apache.commons.math3.exception.TooManyEvaluationsException e) {
            converged = false;
        }
        return new LinkCapacity(best.bits, new double[] {1 - best.q, best.q}, new long[] {best.tau},
                best.evaluations, false, converged);
    }

    /** The best (q, f(q), τ) seen, over every evaluation. */
    private static final class Best {
        final Function<double[], List<CountPmf>> pmfsAt;
        double q;
        double bits = -1;
        long tau;
        int evaluations;

        Best(Function<double[], List<CountPmf>> pmfsAt) {
            this.pmfsAt = pmfsAt;
        }

        double f(double prior) {
            List<CountPmf> p = pmfsAt.apply(new double[] {1 - prior, prior});
            BinaryDetection d = BinaryThresholdSearch.searchBest(p.get(0), p.get(1), prior);
            evaluations++;
            offer(prior, d.mutualInformationBits(), d.miThreshold());
            return d.mutualInformationBits();
        }

        void offer(double prior, double v, long t) {
            if (v > bits) {
                bits = v;
                q = prior;
                tau = t;
            }
        }
    }

    /**
     * @param pmfsAt     the count pmfs given each level with the own leftovers at the given weights
     * @param atUniform  the quantizer result of the uniform-leftover pmfs (the operating point)
     * @param leftovers  whether any tap p_1..p_L is positive
     */
    static LinkCapacity multiLevel(Function<double[], List<CountPmf>> pmfsAt, MultiLevelResult atUniform,
            boolean leftovers) {
        int m = atUniform.inputDistribution().length;
        if (!leftovers) {
            return new LinkCapacity(atUniform.capacityBits(), atUniform.inputDistribution(), atUniform.thresholds(),
                    0, true, true);
        }
        double[] uniform = new double[m];
        Arrays.fill(uniform, 1.0 / m);
        double bestBits = atUniform.uniformMutualInformationBits();
        double[] bestPi = uniform;
        long[] bestTh = atUniform.uniformThresholds();
        double[] pi = atUniform.inputDistribution();
        int evaluations = 0;
        boolean converged = false;
        for (int round = 0; round < MAX_ROUNDS; round++) {
            List<CountPmf> pmfs = pmfsAt.apply(pi);
            evaluations++;
            MultiLevelQuantizer.Quantization atPi = MultiLevelQuantizer.DEFAULT.bestThresholds(pmfs, pi);
            if (atPi.mutualInformationBits() > bestBits) {
                bestBits = atPi.mutualInformationBits();
                bestPi = pi;
                bestTh = atPi.thresholds();
            }
            double[] next = MultiLevelQuantizer.DEFAULT.optimise(pmfs).inputDistribution();
            double move = 0;
            for (int i = 0; i < m; i++) {
                move = Math.max(move, Math.abs(next[i] - pi[i]));
            }
            if (move < PI_TOLERANCE) {
                converged = true;
                break;
            }
            if (round >= DAMP_AFTER) {
                for (int i = 0; i < m; i++) {
                    next[i] = 0.5 * (next[i] + pi[i]);
                }
            }
            pi = next;
        }
        return new LinkCapacity(bestBits, bestPi, bestTh, evaluations, false, converged);
    }
}
