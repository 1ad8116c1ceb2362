package dev.nanoplan.plan;

import dev.nanoplan.info.BinaryChannel;
import dev.nanoplan.info.BlahutArimoto;
import org.apache.commons.numbers.gamma.Erfc;
import org.apache.commons.numbers.gamma.Erfcx;

/**
 * Detection and capacity of one link from the first two moments of its slot counts only: the
 * count given level i is replaced by a normal law N(μ_i, σ_i²) with the same mean and variance.
 *
 * <p><b>Model.</b> The slot count is a sum of many independent binomial (and Poisson) terms
 * (DESIGN.md §5.6); by the central limit theorem it is close to normal when its variance is large.
 * A count is an integer, so the tail uses the continuity correction of ½ (the de Moivre–Laplace
 * approximation of the binomial: W. Feller, <i>An Introduction to Probability Theory and Its
 * Applications</i>, vol. 1, 3rd ed., Wiley, 1968, ch. VII, §2–3):
 * <pre>
 *   P(Y ≥ τ) ≈ Q((τ − ½ − μ)/σ),   Q(z) = ½·erfc(z/√2).
 * </pre>
 * Its error for a sum of independent terms is bounded by the Berry–Esseen inequality, at most
 * C·Σρ_j/σ³ with ρ_j the third absolute central moments (C ≤ 0.4748: I. Shevtsova, "On the
 * absolute constants in the Berry–Esseen type inequalities for identically distributed summands",
 * 2011) — small when σ is large, poor in the far tails (relative error) and for counts dominated
 * by one strong on/off interferer, whose law is bimodal (then the exact capacity can be several
 * times the estimate, see {@link dev.nanoplan.network.GaussianScreen}).
 *
 * <p><b>Binary links.</b> Decide 1 iff Y ≥ τ; ε₀(τ) = Q((τ − ½ − μ₀)/σ₀), ε₁(τ) = Q((μ₁ − τ + ½)/σ₁).
 * The capacity is max over integer τ of the binary-asymmetric-channel capacity (closed form of
 * Silverman 1955, {@link BinaryChannel#capacity(double, double)}); the minimum error is
 * min over τ of (1 − q)ε₀ + qε₁, its logarithm computed from ln erfc(x) = −x² + ln erfcx(x), so
 * it stays finite far below 1e-300. Thresholds: every integer of [μ_min − 8σ, μ_max + 8σ] when
 * there are at most {@value #DENSE} of them, else a grid of {@value #GRID} strides refined by finer
 * grids around the best point down to single integers (the objective is taken as having its maximum
 * in the best coarse cell, which holds for two normal laws whose means differ; a miss costs
 * accuracy, never validity).
 *
 * <p><b>More levels.</b> M − 1 thresholds, each at the integer nearest the point between adjacent
 * level means where both are the same number of their own standard deviations away
 * (μ_{i−1} + σ_{i−1}(μ_i − μ_{i−1})/(σ_{i−1} + σ_i) + ½); the M×M transition matrix of the normal
 * laws between them; capacity by Blahut–Arimoto (R. Blahut 1972; S. Arimoto 1972) to 1e-6 bit;
 * error = 1 − mean of the diagonal (uniform inputs).
 *
 * <p>Standard deviations are floored at {@value #MIN_SIGMA} molecules (a count with no variance is
 * a point mass; the floor keeps the formulas finite and moves a tail by less than Q(50)). Cost:
 * O(DENSE) or O(GRID · log_GRID width) erfc evaluations and, through the bound of
 * {@code Search.scan}, usually only a few BAC capacities for two levels, O(M² + BA) otherwise.
 */
public final class NormalLinkApproximation {

    /** Enumerate every threshold when the range holds at most this many integers. */
    static final int DENSE = 64;
    /** Coarse grid size for wider ranges. */
    static final int GRID = 32;
    /** Floor of a standard deviation, molecules. */
    static final double MIN_SIGMA = 0.01;
    private static final double SQRT2 = Math.sqrt(2);
    private static final double LN10 = Math.log(10);
    private static final double LN_HALF = Math.log(0.5);
    private static final BlahutArimoto BA = new BlahutArimoto(1e-6, 20_000);

    private NormalLinkApproximation() {
    }

    /**
     * The evaluated link.
     *
     * @param capacityBits          max over thresholds (and inputs) of the mutual information, bits
     * @param thresholds            capacity-achieving thresholds (one for binary), integers ≥ 0
     * @param channel               transition matrix at those thresholds, channel[i][j] = P(decide j | i)
     * @param minErrorProbability   binary: min over τ of (1 − q)ε₀ + qε₁; more levels: symbol error
     *                              at the capacity thresholds and uniform inputs; may underflow to 0
     * @param log10ErrorProbability log10 of the previous, finite
     */
    public record Result(double capacityBits, long[] thresholds, double[][] channel, double minErrorProbability,
            double log10ErrorProbability) {

        public Result {
            thresholds = thresholds.clone();
        }

        @Override
        public long[] thresholds() {
            return thresholds.clone();
        }

        /** First threshold. */
        public long threshold() {
            return thresholds[0];
        }

        /** P(decide anything else | lowest level). */
        public double crossoverZero() {
            return Math.max(0, Math.min(1, 1 - channel[0][0]));
        }

        /** P(decide anything else | highest level). */
        public double crossoverOne() {
            int m = channel.length - 1;
            return Math.max(0, Math.min(1, 1 - channel[m][m]));
        }
    }

    /**
     * P(Y ≥ τ) for Y ≈ N(μ, σ²) with the continuity correction: Q((τ − ½ − μ)/σ).
     *
     * @param mean     μ, molecules
     * @param variance σ², ≥ 0 (floored at {@value #MIN_SIGMA}²)
     * @param tau      threshold, an integer count
     */
    public static double upperTail(double mean, double variance, long tau) {
        return 0.5 * Erfc.value((tau - 0.5 - mean) / (sigma(variance) * SQRT2));
    }

    /** P(Y &lt; τ) = Q((μ − τ + ½)/σ) for Y ≈ N(μ, σ²) with the continuity correction. */
    public static double lowerTail(double mean, double variance, long tau) {
        return 0.5 * Erfc.value((mean - tau + 0.5) / (sigma(variance) * SQRT2));
    }

    /** ln P(Y ≥ τ) of {@link #upperTail}, finite far below 1e-300. */
    public static double logUpperTail(double mean, double variance, long tau) {
        return LN_HALF + logErfc((tau - 0.5 - mean) / (sigma(variance) * SQRT2));
    }

    /** ln P(Y &lt; τ) of {@link #lowerTail}, finite far below 1e-300. */
    public static double logLowerTail(double mean, double variance, long tau) {
        return LN_HALF + logErfc((mean - tau + 0.5) / (sigma(variance) * SQRT2));
    }

    /**
     * An upper bound on the binary capacity {@link #evaluate} can return for two levels, in bits:
     * the capacity of a binary asymmetric channel is at most its total variation |1 − ε₀ − ε₁|, every
     * integer threshold's |1 − ε₀ − ε₁| is at most the total variation distance of the two normal laws,
     * and that is at most √(KL/2) (Pinsker's inequality; T. M. Cover and J. A. Thomas, <i>Elements of
     * Information Theory</i>, 2nd ed., 2006, Lemma 11.6.1) with the Kullback–Leibler divergence of two
     * normal laws KL = ln(σ₁/σ₀) + (σ₀² + (μ₁ − μ₀)²)/(2σ₁²) − ½ nats (either direction; the smaller is
     * used). Standard deviations floored as in {@link #evaluate}. O(1), no special functions.
     */
    public static double capacityUpperBoundBits(double m0, double v0, double m1, double v1) {
        double s0 = sigma(v0);
        double s1 = sigma(v1);
        double d2 = (m1 - m0) * (m1 - m0);
        double kl01 = Math.log(s1 / s0) + (s0 * s0 + d2) / (2 * s1 * s1) - 0.5;
        double kl10 = Math.log(s0 / s1) + (s1 * s1 + d2) / (2 * s0 * s0) - 0.5;
        return Math.min(1, Math.sqrt(Math.max(0, Math.min(kl01, kl10)) / 2));
    }

    /**
     * Evaluates a link.
     *
     * @param means     μ_i of the count given each level i, increasing in i (2..16 levels)
     * @param variances σ_i², ≥ 0
     * @param priorOne  binary prior q in (0, 1) (used for the minimum error)
     */
    public static Result evaluate(double[] means, double[] variances, double priorOne) {
        check(means, variances, priorOne);
        return means.length == 2 ? binary(means[0], variances[0], means[1], variances[1], priorOne)
                : multiLevel(means, variances);
    }

    /**
     * The capacity of {@link #evaluate} alone (no error search), bits: for what-if comparisons.
     */
    public static double capacityBits(double[] means, double[] variances, double priorOne) {
        check(means, variances, priorOne);
        if (means.length != 2) {
            return multiLevel(means, variances).capacityBits();
        }
        return Math.max(0, binarySearch(means[0], variances[0], means[1], variances[1], priorOne, true).best);
    }

    private static void check(double[] means, double[] variances, double priorOne) {
        if (means.length < 2 || means.length != variances.length) {
            throw new IllegalArgumentException("means/variances: need at least 2 levels and one variance per mean, got "
                    + means.length + " and " + variances.length);
        }
        for (int i = 0; i < means.length; i++) {
            if (!Double.isFinite(means[i]) || !(variances[i] >= 0) || Double.isInfinite(variances[i])) {
                throw new IllegalArgumentException("level " + i + ": mean and variance must be finite (variance >= 0), got "
                        + means[i] + ", " + variances[i]);
            }
        }
        if (!(priorOne > 0 && priorOne < 1)) {
            throw new IllegalArgumentException("priorOne: must be in (0, 1), got " + priorOne);
        }
    }

    /**
     * Best integer threshold of one objective on [μ_min − 8σ, μ_max + 8σ]: successive grids, each of
     * at most {@value #GRID} strides around the best point of the previous one, down to stride 1.
     */
    private static Search binarySearch(double m0, double v0, double m1, double v1, double q, boolean capacity) {
        double s0 = sigma(v0);
        double s1 = sigma(v1);
        long lo = Math.max(0, (long) Math.floor(Math.min(m0 - 8 * s0, m1 - 8 * s1)));
        long hi = Math.max(lo + 1, (long) Math.ceil(Math.max(m0 + 8 * s0, m1 + 8 * s1)) + 1);
        Search s = new Search(m0, v0, m1, v1, q, capacity);
        long stride = hi - lo <= DENSE ? 1 : Math.max(1, (hi - lo) / GRID);
        s.scan(lo, hi, stride);
        while (stride > 1) {
            long a = Math.max(lo, s.bestTau - stride);
            long b = Math.min(hi, s.bestTau + stride);
            stride = Math.max(1, (b - a) / GRID);
            s.scan(a, b, stride);
        }
        return s;
    }

    private static Result binary(double m0, double v0, double m1, double v1, double q) {
        Search cap = binarySearch(m0, v0, m1, v1, q, true);
        Search err = binarySearch(m0, v0, m1, v1, q, false);
        long tau = cap.bestTau;
        double e0 = upperTail(m0, v0, tau);
        double e1 = lowerTail(m1, v1, tau);
        double[][] w = {{1 - e0, e0}, {e1, 1 - e1}};
        double lnErr = logError(m0, v0, m1, v1, q, err.bestTau);
        return new Result(Math.max(0, cap.best), new long[] {tau}, w, Math.exp(lnErr), lnErr / LN10);
    }

    /** ln[(1 − q)·P(Y ≥ τ | 0) + q·P(Y &lt; τ | 1)], by log-sum-exp of the two log tails. */
    static double logError(double m0, double v0, double m1, double v1, double q, long tau) {
        double a = Math.log1p(-q) + logUpperTail(m0, v0, tau);
        double b = Math.log(q) + logLowerTail(m1, v1, tau);
        double hiV = Math.max(a, b);
        return hiV + Math.log1p(Math.exp(Math.min(a, b) - hiV));
    }

    /** Best integer threshold of one objective: capacity (maximised) or error (minimised, as −error). */
    private static final class Search {
        final double m0;
        final double v0;
        final double m1;
        final double v1;
        final double q;
        final boolean capacity;
        double best = Double.NEGATIVE_INFINITY;
        long bestTau;

        Search(double m0, double v0, double m1, double v1, double q, boolean capacity) {
            this.m0 = m0;
            this.v0 = v0;
            this.m1 = m1;
            this.v1 = v1;
            this.q = q;
            this.capacity = capacity;
        }

        /**
         * Offers τ = a, a + stride, …, b. For the capacity, branch and bound: a binary-input channel
         * carries at most its total variation |1 − ε₀ − ε₁| bits (it is a degraded erasure channel), so
         * the points are visited in decreasing total variation (two erfc each) and the BAC capacity (about
         * fifteen logarithms) is computed only while that bound can still beat the best.
         */
        void scan(long a, long b, long stride) {
            int n = (int) ((b - a) / stride) + 1;
            double[] e0 = new double[n];
            double[] e1 = new double[n];
            for (int i = 0; i < n; i++) {
                long t = a + i * stride;
                e0[i] = upperTail(m0, v0, t);
                e1[i] = lowerTail(m1, v1, t);
                if (!capacity) {
                    offer(t, -((1 - q) * e0[i] + q * e1[i]));
                }
            }
            if (!capacity) {
                return;
            }
            Integer[] order = new Integer[n];
            double[] tv = new double[n];
            for (int i = 0; i < n; i++) {
                order[i] = i;
                tv[i] = Math.abs(1 - e0[i] - e1[i]);
            }
            java.util.Arrays.sort(order, (x, y) -> Double.compare(tv[y], tv[x]));
            for (int i : order) {
                if (tv[i] <= best) {
                    break;
                }
                offer(a + i * stride, BinaryChannel.capacity(e0[i], e1[i]).bits());
            }
        }

        void offer(long t, double v) {
            if (v > best) {
                best = v;
                bestTau = t;
            }
        }
    }

    private static Result multiLevel(double[] means, double[] variances) {
        int m = means.length;
        long[] tau = new long[m - 1];
        for (int i = 1; i < m; i++) {
            double sa = sigma(variances[i - 1]);
            double sb = sigma(variances[i]);
            double x = means[i - 1] + sa * (means[i] - means[i - 1]) / (sa + sb) + 0.5;
            tau[i - 1] = Math.max(i == 1 ? 0 : tau[i - 2] + 1, Math.round(x));
        }
        double[][] w = new double[m][m];
        double diag = 0;
        for (int i = 0; i < m; i++) {
            double prev = 0;
            for (int j = 0; j < m - 1; j++) {
                double below = lowerTail(means[i], variances[i], tau[j]);
                w[i][j] = Math.max(0, below - prev);
                prev = Math.max(prev, below);
            }
            w[i][m - 1] = Math.max(0, 1 - prev);
            double sum = 0;
            for (double v : w[i]) {
                sum += v;
            }
            for (int j = 0; j < m; j++) {
                w[i][j] /= sum;
            }
            diag += w[i][i];
        }
        double cap = BA.compute(w).capacityBits();
        double err = Math.max(0, 1 - diag / m);
        double log10 = err > 0 ? Math.log10(err) : -300;
        return new Result(cap, tau, w, err, log10);
    }

    private static double sigma(double variance) {
        return Math.max(Math.sqrt(Math.max(variance, 0)), MIN_SIGMA);
    }

    /**
     * ln erfc(x): direct for x &lt; 0.5, else −x² + ln erfcx(x) with the scaled function of Commons
     * Numbers ({@link Erfcx}), which never underflows (the same identity as the physics package's
     * log-erfc, which is not visible here).
     */
    static double logErfc(double x) {
        if (x < 0.5) {
            return Math.log(Erfc.value(x));
        }
        if (x == Double.POSITIVE_INFINITY) {
            return Double.NEGATIVE_INFINITY;
        }
        return -x * x + Math.log(Erfcx.value(x));
    }
}
