package dev.nanoplan.plan;

import dev.nanoplan.info.BinaryChannel;
import dev.nanoplan.info.BlahutArimoto;
import dev.nanoplan.info.ChannelCascade;
import dev.nanoplan.info.Entropy;
import dev.nanoplan.math.LogSpace;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Objects;
import org.apache.commons.numbers.gamma.Erfc;

/**
 * Detection and capacity of one link from the first two moments of its slot counts: the count
 * given level i is replaced by a normal law N(μ_i, σ_i²) with the same mean and variance — or, when
 * a few strong on/off terms are kept apart ({@link Mixture}), by a finite mixture of normal laws.
 *
 * <p><b>Model.</b> The slot count is a sum of many independent binomial (and Poisson) terms
 * (docs/architecture.md §5.6); by the central limit theorem it is close to normal when its variance is large.
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
 * <p><b>Strong terms.</b> One strong on/off term (a neighbour's current symbol landing with a large
 * tap) makes the count a mixture with well separated modes, which a single normal law smears into
 * one wide bump. A {@link Mixture} keeps up to a few such terms as their components (each level of
 * the term, with its prior weight, as the normal law of its Bin(n_j, p)): the count given level i is
 * then Σ_c w_c·N(μ_i + m_c, σ_i² + s_c²), the normal approximation applied per component (a
 * Gaussian-mixture approximation). Without strong terms it is the plain normal law.
 *
 * <p><b>Binary links.</b> Decide 1 iff Y ≥ τ; ε₀(τ) = Q((τ − ½ − μ₀)/σ₀), ε₁(τ) = Q((μ₁ − τ + ½)/σ₁).
 * The capacity is max over integer τ of the binary-asymmetric-channel capacity (closed form of
 * Silverman 1955, {@link BinaryChannel#capacity(double, double)}); the minimum error is
 * min over τ of (1 − q)ε₀ + qε₁, its logarithm computed with {@link LogSpace#logErfc} (ln erfc(x) = −x² + ln erfcx(x)), so
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
 * O(DENSE) or O(GRID · log_GRID width) thresholds, each 2 × components erfc evaluations, and,
 * through the bound of {@code Search.scan}, usually only a few BAC capacities for two levels;
 * O(M² · components + BA) otherwise. Measured: about 13 µs for a plain binary link and 110 µs with
 * 16 components (one core).
 */
public final class NormalLinkApproximation {

    /** Enumerate every threshold when the range holds at most this many integers. */
    static final int DENSE = 40;
    /** Coarse grid size for wider ranges. */
    static final int GRID = 20;
    /** Floor of a standard deviation, molecules. */
    static final double MIN_SIGMA = 0.01;
    /** Most components a {@link Mixture} may have. */
    public static final int MAX_COMPONENTS = 16;
    private static final double SQRT2 = Math.sqrt(2);
    private static final double LN10 = Math.log(10);
    private static final double LN_HALF = Math.log(0.5);
    private static final BlahutArimoto BA = new BlahutArimoto(1e-6, 20_000);

    private NormalLinkApproximation() {
    }

    /**
     * A discrete part shared by every level's count: independent terms each of which is one of a few
     * normal components (weight, mean, variance); the mixture holds every combination of them.
     *
     * @param weights   component weights, summing to 1
     * @param means     component means, molecules
     * @param variances component variances, ≥ 0
     */
    public record Mixture(double[] weights, double[] means, double[] variances) {

        /** No discrete part (one component of weight 1 at 0). */
        public static final Mixture NONE = new Mixture(new double[] {1}, new double[] {0}, new double[] {0});

        public Mixture {
            weights = weights.clone();
            means = means.clone();
            variances = variances.clone();
            if (weights.length == 0 || weights.length != means.length || weights.length != variances.length
                    || weights.length > MAX_COMPONENTS) {
                throw new IllegalArgumentException("mixture: need 1.." + MAX_COMPONENTS
                        + " components with one weight, mean and variance each, got " + weights.length + ", "
                        + means.length + ", " + variances.length);
            }
            double sum = 0;
            for (int c = 0; c < weights.length; c++) {
                if (!(weights[c] >= 0) || !Double.isFinite(means[c]) || !(variances[c] >= 0)
                        || Double.isInfinite(variances[c])) {
                    throw new IllegalArgumentException("mixture component " + c + ": weight >= 0, finite mean and "
                            + "variance >= 0 needed, got " + weights[c] + ", " + means[c] + ", " + variances[c]);
                }
                sum += weights[c];
            }
            if (Math.abs(sum - 1) > 1e-9) {
                throw new IllegalArgumentException("mixture: weights must sum to 1, got " + sum);
            }
        }

        /**
         * This mixture plus one more independent term whose value is, with probability w_j, normal
         * with mean m_j and variance v_j. Components multiply.
         *
         * @throws IllegalArgumentException when the result would exceed {@link #MAX_COMPONENTS}
         */
        public Mixture plus(double[] w, double[] m, double[] v) {
            int n = weights.length * w.length;
            if (n > MAX_COMPONENTS) {
                throw new IllegalArgumentException("mixture: at most " + MAX_COMPONENTS + " components, got " + n);
            }
            double[] cw = new double[n];
            double[] cm = new double[n];
            double[] cv = new double[n];
            int k = 0;
            for (int a = 0; a < weights.length; a++) {
                for (int b = 0; b < w.length; b++) {
                    cw[k] = weights[a] * w[b];
                    cm[k] = means[a] + m[b];
                    cv[k] = variances[a] + v[b];
                    k++;
                }
            }
            return new Mixture(cw, cm, cv);
        }

        /**
         * This mixture plus one more independent term ({@link #plus}), reduced to at most
         * {@code maxComponents} by merging components two at a time while keeping the mixture's mean
         * and variance exact: each step merges the pair of components adjacent in mean whose merge
         * costs least by Runnalls' upper bound on the Kullback–Leibler discrimination,
         * B(i, j) = ½[(w_i + w_j)·ln σ²_ij − w_i·ln σ²_i − w_j·ln σ²_j], σ²_ij the variance of the
         * merged pair (A. R. Runnalls, "Kullback-Leibler approach to Gaussian mixture reduction",
         * IEEE Trans. Aerosp. Electron. Syst. 43(3), 2007, eq. 21; the moment-preserving merge of
         * D. J. Salmond, 1990). Component variances enter the cost floored at 1 molecule² (counts are
         * integers; equal point masses then merge at no cost). Restricting merges to neighbours in
         * mean is a simplification of Runnalls' all-pairs greedy that keeps a step O(components).
         *
         * @param maxComponents at least 1 and at most {@link #MAX_COMPONENTS}
         */
        public Mixture plusReduced(double[] w, double[] m, double[] v, int maxComponents) {
            if (maxComponents < 1 || maxComponents > MAX_COMPONENTS) {
                throw new IllegalArgumentException("maxComponents: must be in [1, " + MAX_COMPONENTS + "], got "
                        + maxComponents);
            }
            int n = weights.length * w.length;
            double[][] comp = new double[n][];
            int k = 0;
            for (int a = 0; a < weights.length; a++) {
                for (int b = 0; b < w.length; b++) {
                    comp[k++] = new double[] {weights[a] * w[b], means[a] + m[b], variances[a] + v[b]};
                }
            }
            Arrays.sort(comp, (x, y) -> Double.compare(x[1], y[1]));
            List<double[]> list = new ArrayList<>(Arrays.asList(comp));
            while (list.size() > maxComponents) {
                int best = 0;
                double bestCost = Double.POSITIVE_INFINITY;
                for (int i = 0; i + 1 < list.size(); i++) {
                    double cost = mergeCost(list.get(i), list.get(i + 1));
                    if (cost < bestCost) {
                        bestCost = cost;
                        best = i;
                    }
                }
                list.set(best, merge(list.get(best), list.get(best + 1)));
                list.remove(best + 1);
            }
            double[] cw = new double[list.size()];
            double[] cm = new double[list.size()];
            double[] cv = new double[list.size()];
            double sum = 0;
            for (int c = 0; c < cw.length; c++) {
                sum += list.get(c)[0];
            }
            for (int c = 0; c < cw.length; c++) {
                cw[c] = list.get(c)[0] / sum;
                cm[c] = list.get(c)[1];
                cv[c] = list.get(c)[2];
            }
            return new Mixture(cw, cm, cv);
        }

        /** The moment-preserving merge of two components {weight, mean, variance}. */
        private static double[] merge(double[] x, double[] y) {
            double w = x[0] + y[0];
            if (!(w > 0)) {
                return new double[] {0, (x[1] + y[1]) / 2, Math.max(x[2], y[2])};
            }
            double mean = (x[0] * x[1] + y[0] * y[1]) / w;
            double var = (x[0] * x[2] + y[0] * y[2]) / w + x[0] * y[0] * (x[1] - y[1]) * (x[1] - y[1]) / (w * w);
            return new double[] {w, mean, var};
        }

        /** Runnalls' cost B(i, j) of merging two components, variances floored at 1. */
        private static double mergeCost(double[] x, double[] y) {
            double w = x[0] + y[0];
            if (!(w > 0)) {
                return 0;
            }
            double merged = Math.max(1, merge(x, y)[2]);
            return 0.5 * (w * Math.log(merged) - x[0] * Math.log(Math.max(1, x[2]))
                    - y[0] * Math.log(Math.max(1, y[2])));
        }

        /** Number of components. */
        public int size() {
            return weights.length;
        }

        /** Mean of the mixture. */
        public double mean() {
            double s = 0;
            for (int c = 0; c < weights.length; c++) {
                s += weights[c] * means[c];
            }
            return s;
        }

        /** Variance of the mixture (law of total variance). */
        public double variance() {
            double mu = mean();
            double s = 0;
            for (int c = 0; c < weights.length; c++) {
                s += weights[c] * (variances[c] + (means[c] - mu) * (means[c] - mu));
            }
            return s;
        }

        @Override
        public boolean equals(Object o) {
            // every component, arrays by content
            return o instanceof Mixture other
                    && Arrays.equals(weights, other.weights)
                    && Arrays.equals(means, other.means)
                    && Arrays.equals(variances, other.variances);
        }

        @Override
        public int hashCode() {
            int h = Arrays.hashCode(weights);
            h = 31 * h + Arrays.hashCode(means);
            h = 31 * h + Arrays.hashCode(variances);
            return h;
        }
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
     * @param mutualInformationBits operating point: binary, the mutual information at the prior q
     *                              (the leftovers in the given moments are at the same prior)
     *                              maximised over τ; more levels, at uniform inputs with
     *                              {@code thresholds}
     * @param operatingThresholds   the thresholds of the operating point (binary: the τ maximising
     *                              the mutual information at q, the least-error one on ties)
     * @param operatingChannel      transition matrix at the operating thresholds
     * @param errorProbability      error at the operating thresholds ((1 − q)ε₀ + qε₁; more levels the
     *                              symbol error at uniform inputs), may underflow to 0
     * @param log10OperatingErrorProbability log10 of the previous, finite
     * @param minErrorThreshold     binary: τ of the minimum error; −1 for more levels
     */
    public record Result(double capacityBits, long[] thresholds, double[][] channel, double minErrorProbability,
            double log10ErrorProbability, double mutualInformationBits, long[] operatingThresholds,
            double[][] operatingChannel, double errorProbability, double log10OperatingErrorProbability,
            long minErrorThreshold) {

        public Result {
            thresholds = thresholds.clone();
            operatingThresholds = operatingThresholds.clone();
        }

        @Override
        public long[] operatingThresholds() {
            return operatingThresholds.clone();
        }

        /** The operating threshold (binary), or the first one. */
        public long operatingThreshold() {
            return operatingThresholds[0];
        }

        /** P(decide anything else | lowest level) at the operating thresholds. */
        public double operatingCrossoverZero() {
            return Math.max(0, Math.min(1, operatingChannel.length == 2 ? operatingChannel[0][1]
                    : 1 - operatingChannel[0][0]));
        }

        /** P(decide anything else | highest level) at the operating thresholds. */
        public double operatingCrossoverOne() {
            int m = operatingChannel.length - 1;
            return Math.max(0, Math.min(1, m == 1 ? operatingChannel[1][0] : 1 - operatingChannel[m][m]));
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

        @Override
        public boolean equals(Object o) {
            // every component, arrays by content
            return o instanceof Result other
                    && Double.compare(capacityBits, other.capacityBits) == 0
                    && Arrays.equals(thresholds, other.thresholds)
                    && Arrays.deepEquals(channel, other.channel)
                    && Double.compare(minErrorProbability, other.minErrorProbability) == 0
                    && Double.compare(log10ErrorProbability, other.log10ErrorProbability) == 0
                    && Double.compare(mutualInformationBits, other.mutualInformationBits) == 0
                    && Arrays.equals(operatingThresholds, other.operatingThresholds)
                    && Arrays.deepEquals(operatingChannel, other.operatingChannel)
                    && Double.compare(errorProbability, other.errorProbability) == 0
                    && Double.compare(log10OperatingErrorProbability, other.log10OperatingErrorProbability) == 0
                    && minErrorThreshold == other.minErrorThreshold;
        }

        @Override
        public int hashCode() {
            int h = Objects.hash(capacityBits, minErrorProbability, log10ErrorProbability, mutualInformationBits,
                    errorProbability, log10OperatingErrorProbability, minErrorThreshold);
            h = 31 * h + Arrays.hashCode(thresholds);
            h = 31 * h + Arrays.hashCode(operatingThresholds);
            h = 31 * h + Arrays.deepHashCode(channel);
            return h;
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
        return LN_HALF + LogSpace.logErfc((tau - 0.5 - mean) / (sigma(variance) * SQRT2));
    }

    /** ln P(Y &lt; τ) of {@link #lowerTail}, finite far below 1e-300. */
    public static double logLowerTail(double mean, double variance, long tau) {
        return LN_HALF + LogSpace.logErfc((mean - tau + 0.5) / (sigma(variance) * SQRT2));
    }

    /** P(Y ≥ τ) for Y = N(μ, σ²) + the mixture: Σ_c w_c·Q((τ − ½ − μ − m_c)/√(σ² + s_c²)). */
    static double upperTail(double mean, double variance, Mixture mix, long tau) {
        double s = 0;
        for (int c = 0; c < mix.weights.length; c++) {
            s += mix.weights[c] * upperTail(mean + mix.means[c], variance + mix.variances[c], tau);
        }
        return Math.min(1, s);
    }

    /** P(Y &lt; τ) for Y = N(μ, σ²) + the mixture. */
    static double lowerTail(double mean, double variance, Mixture mix, long tau) {
        double s = 0;
        for (int c = 0; c < mix.weights.length; c++) {
            s += mix.weights[c] * lowerTail(mean + mix.means[c], variance + mix.variances[c], tau);
        }
        return Math.min(1, s);
    }

    /**
     * An upper bound on the binary capacity {@link #evaluate} can return for two levels, in bits.
     * The evaluated channel is a quantisation (by an integer threshold) of the two continuous laws
     * Y₀, Y₁, so by data processing its capacity is at most (i) its total variation |1 − ε₀ − ε₁| (a
     * binary-input channel is a degraded erasure channel), itself at most TV(Y₀, Y₁) ≤ √(KL/2)
     * (Pinsker's inequality), and (ii) max_x D(W_x ‖ W_other) ≤ KL(Y₁ ‖ Y₀)/ln 2 bits and likewise the
     * other way round (the capacity is at most the divergence of each input's output law from any
     * fixed output law; T. M. Cover and J. A. Thomas, <i>Elements of Information Theory</i>, 2nd ed.,
     * 2006, Theorem 13.1.1 and Lemma 11.6.1). For normal laws KL(N(μ₀,σ₀²) ‖ N(μ₁,σ₁²)) = ln(σ₁/σ₀) +
     * (σ₀² + (μ₁ − μ₀)²)/(2σ₁²) − ½ nats. With a mixture (same weights and shifts for both levels)
     * TV and KL are jointly convex, so the weighted sums over components bound those of the mixtures.
     * Standard deviations floored as in {@link #evaluate}. O(components), logarithms only.
     */
    public static double capacityUpperBoundBits(double m0, double v0, double m1, double v1, Mixture mix) {
        double tv = 0;
        double kl01 = 0;
        double kl10 = 0;
        double d2 = (m1 - m0) * (m1 - m0);
        for (int c = 0; c < mix.weights.length; c++) {
            double s0 = sigma(v0 + mix.variances[c]);
            double s1 = sigma(v1 + mix.variances[c]);
            double a = Math.max(0, Math.log(s1 / s0) + (s0 * s0 + d2) / (2 * s1 * s1) - 0.5);
            double b = Math.max(0, Math.log(s0 / s1) + (s1 * s1 + d2) / (2 * s0 * s0) - 0.5);
            kl01 += mix.weights[c] * a;
            kl10 += mix.weights[c] * b;
            tv += mix.weights[c] * Math.min(1, Math.sqrt(Math.min(a, b) / 2));
        }
        return Math.min(1, Math.min(tv, Math.min(kl01, kl10) / Math.log(2)));
    }

    /** {@link #capacityUpperBoundBits(double, double, double, double, Mixture)} without a mixture. */
    public static double capacityUpperBoundBits(double m0, double v0, double m1, double v1) {
        return capacityUpperBoundBits(m0, v0, m1, v1, Mixture.NONE);
    }

    /**
     * Evaluates a link whose counts are normal (no strong terms).
     *
     * @param means     μ_i of the count given each level i, increasing in i (2..16 levels)
     * @param variances σ_i², ≥ 0
     * @param priorOne  binary prior q in (0, 1) (used for the minimum error)
     */
    public static Result evaluate(double[] means, double[] variances, double priorOne) {
        return evaluate(means, variances, Mixture.NONE, priorOne);
    }

    /**
     * Evaluates a link whose count given level i is N(μ_i, σ_i²) plus the independent mixture.
     *
     * @param means     μ_i, increasing in i (2..16 levels)
     * @param variances σ_i², ≥ 0
     * @param mix       the strong terms shared by every level ({@link Mixture#NONE} for none)
     * @param priorOne  binary prior q in (0, 1) (used for the minimum error)
     */
    public static Result evaluate(double[] means, double[] variances, Mixture mix, double priorOne) {
        check(means, variances, priorOne);
        return means.length == 2 ? binary(means[0], variances[0], means[1], variances[1], mix, priorOne)
                : multiLevel(means, variances, mix);
    }

    /** The capacity of {@link #evaluate} alone (no error search), bits: for what-if comparisons. */
    public static double capacityBits(double[] means, double[] variances, Mixture mix, double priorOne) {
        check(means, variances, priorOne);
        if (means.length != 2) {
            return multiLevel(means, variances, mix).capacityBits();
        }
        return Math.max(0, binarySearch(means[0], variances[0], means[1], variances[1], mix, priorOne, false).best);
    }

    /**
     * The operating mutual information of {@link #evaluate} alone, bits: binary at the prior q
     * maximised over τ, more levels at uniform inputs (for what-if comparisons).
     */
    public static double mutualInformationBits(double[] means, double[] variances, Mixture mix, double priorOne) {
        check(means, variances, priorOne);
        if (means.length != 2) {
            return multiLevel(means, variances, mix).mutualInformationBits();
        }
        return Math.max(0, binarySearch(means[0], variances[0], means[1], variances[1], mix, priorOne, false, true)
                .miBest);
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
     * Best integer threshold of one objective on [μ_min − 8σ, μ_max + 8σ] (σ of the whole count):
     * successive grids, each of at most {@value #GRID} strides around the best point of the previous
     * one, down to stride 1.
     */
    private static Search binarySearch(double m0, double v0, double m1, double v1, Mixture mix, double q,
            boolean errorToo) {
        return binarySearch(m0, v0, m1, v1, mix, q, errorToo, errorToo);
    }

    private static Search binarySearch(double m0, double v0, double m1, double v1, Mixture mix, double q,
            boolean errorToo, boolean miToo) {
        double mm = mix.mean();
        double mv = mix.variance();
        double s0 = sigma(v0 + mv);
        double s1 = sigma(v1 + mv);
        long lo = Math.max(0, (long) Math.floor(Math.min(m0 + mm - 8 * s0, m1 + mm - 8 * s1)));
        long hi = Math.max(lo + 1, (long) Math.ceil(Math.max(m0 + mm + 8 * s0, m1 + mm + 8 * s1)) + 1);
        Search s = new Search(m0, v0, m1, v1, mix, q, errorToo, miToo);
        long first = hi - lo <= DENSE ? 1 : Math.max(1, (hi - lo) / GRID);
        // seeds: per component, the point between the two levels' modes where both are the same number
        // of their standard deviations away; a mixture's best threshold can sit in a narrow gap next to
        // one of them that a coarse grid steps over
        for (int c = 0; first > 1 && c < mix.size(); c++) {
            double a0 = sigma(v0 + mix.variances[c]);
            double a1 = sigma(v1 + mix.variances[c]);
            long seed = Math.round(m0 + mix.means[c] + a0 * (m1 - m0) / (a0 + a1) + 0.5);
            if (seed >= lo && seed <= hi) {
                s.scan(seed, seed, 1);
            }
        }
        s.scan(lo, hi, first);
        long stride = first;
        while (stride > 1) {
            long a = Math.max(lo, s.bestTau - stride);
            long b = Math.min(hi, s.bestTau + stride);
            stride = Math.max(1, (b - a) / GRID);
            s.scan(a, b, stride);
        }
        // the mutual information's and the error's best grid points were found on the same grids;
        // refine them the same way
        stride = first;
        while (miToo && stride > 1) {
            long a = Math.max(lo, s.miTau - stride);
            long b = Math.min(hi, s.miTau + stride);
            stride = Math.max(1, (b - a) / GRID);
            s.scan(a, b, stride);
        }
        stride = first;
        while (errorToo && stride > 1) {
            long a = Math.max(lo, s.errTau - stride);
            long b = Math.min(hi, s.errTau + stride);
            stride = Math.max(1, (b - a) / GRID);
            s.scan(a, b, stride);
        }
        return s;
    }

    private static Result binary(double m0, double v0, double m1, double v1, Mixture mix, double q) {
        Search cap = binarySearch(m0, v0, m1, v1, mix, q, true);
        long tau = cap.bestTau;
        double e0 = upperTail(m0, v0, mix, tau);
        double e1 = lowerTail(m1, v1, mix, tau);
        double[][] w = {{1 - e0, e0}, {e1, 1 - e1}};
        double lnErr = logError(m0, v0, m1, v1, mix, q, cap.errTau);
        // the operating τ: the mutual-information maximiser at q; the least-error τ when it ties
        long op = cap.miTau;
        double errE0 = upperTail(m0, v0, mix, cap.errTau);
        double errE1 = lowerTail(m1, v1, mix, cap.errTau);
        if (BinaryChannel.mutualInformationBits(q, errE0, errE1) >= cap.miBest) {
            op = cap.errTau;
        }
        double o0 = upperTail(m0, v0, mix, op);
        double o1 = lowerTail(m1, v1, mix, op);
        double mi = Math.max(0, Math.max(cap.miBest, BinaryChannel.mutualInformationBits(q, o0, o1)));
        double lnOp = op == cap.errTau ? lnErr : logError(m0, v0, m1, v1, mix, q, op);
        return new Result(Math.max(0, cap.best), new long[] {tau}, w, Math.exp(lnErr), lnErr / LN10, mi,
                new long[] {op}, new double[][] {{1 - o0, o0}, {o1, 1 - o1}}, Math.exp(lnOp), lnOp / LN10, cap.errTau);
    }

    /**
     * ln[(1 − q)·P(Y ≥ τ | 0) + q·P(Y &lt; τ | 1)], by log-sum-exp of the components' log tails, so it
     * stays finite far below 1e-300.
     */
    static double logError(double m0, double v0, double m1, double v1, Mixture mix, double q, long tau) {
        int n = mix.size();
        double[] terms = new double[2 * n];
        double lnQ0 = Math.log1p(-q);
        double lnQ1 = Math.log(q);
        for (int c = 0; c < n; c++) {
            double lw = Math.log(mix.weights[c]);
            terms[2 * c] = lnQ0 + lw + logUpperTail(m0 + mix.means[c], v0 + mix.variances[c], tau);
            terms[2 * c + 1] = lnQ1 + lw + logLowerTail(m1 + mix.means[c], v1 + mix.variances[c], tau);
        }
        return LogSpace.logSumExp(terms);
    }

    /** Best integer thresholds of the capacity (maximised) and, optionally, of the error (minimised). */
    private static final class Search {
        final double m0;
        final double v0;
        final double m1;
        final double v1;
        final Mixture mix;
        final double q;
        final boolean errorToo;
        final boolean miToo;
        final double hq;
        double best = Double.NEGATIVE_INFINITY;
        long bestTau;
        double miBest = Double.NEGATIVE_INFINITY;
        long miTau;
        double err = Double.POSITIVE_INFINITY;
        long errTau;

        Search(double m0, double v0, double m1, double v1, Mixture mix, double q, boolean errorToo, boolean miToo) {
            this.miToo = miToo;
            this.hq = Entropy.binaryBits(q);
            this.m0 = m0;
            this.v0 = v0;
            this.m1 = m1;
            this.v1 = v1;
            this.mix = mix;
            this.q = q;
            this.errorToo = errorToo;
        }

        /**
         * Offers τ = a, a + stride, …, b. For the capacity, branch and bound: a binary-input channel
         * carries at most its total variation |1 − ε₀ − ε₁| bits (it is a degraded erasure channel), so
         * the points are visited in decreasing total variation and the BAC capacity (about fifteen
         * logarithms) is computed only while that bound can still beat the best.
         */
        void scan(long a, long b, long stride) {
            int n = (int) ((b - a) / stride) + 1;
            double[] e0 = new double[n];
            double[] e1 = new double[n];
            Integer[] order = new Integer[n];
            double[] tv = new double[n];
            for (int i = 0; i < n; i++) {
                long t = a + i * stride;
                e0[i] = upperTail(m0, v0, mix, t);
                e1[i] = lowerTail(m1, v1, mix, t);
                double e = (1 - q) * e0[i] + q * e1[i];
                if (errorToo && e < err) {
                    err = e;
                    errTau = t;
                }
                order[i] = i;
                tv[i] = Math.abs(1 - e0[i] - e1[i]);
            }
            Arrays.sort(order, (x, y) -> Double.compare(tv[y], tv[x]));
            // the mutual information at q is at most Δ·h(q) (the same degraded-erasure argument)
            for (int i : order) {
                boolean capOpen = tv[i] > best;
                boolean miOpen = miToo && tv[i] * hq > miBest;
                if (!capOpen && !miOpen) {
                    break;
                }
                if (capOpen) {
                    double v = BinaryChannel.capacity(e0[i], e1[i]).bits();
                    if (v > best) {
                        best = v;
                        bestTau = a + i * stride;
                    }
                }
                if (miOpen) {
                    double v = BinaryChannel.mutualInformationBits(q, e0[i], e1[i]);
                    if (v > miBest || (v == miBest && a + i * stride < miTau)) {
                        miBest = v;
                        miTau = a + i * stride;
                    }
                }
            }
        }
    }

    private static Result multiLevel(double[] means, double[] variances, Mixture mix) {
        int m = means.length;
        long[] tau = new long[m - 1];
        double mm = mix.mean();
        double mv = mix.variance();
        for (int i = 1; i < m; i++) {
            double sa = sigma(variances[i - 1] + mv);
            double sb = sigma(variances[i] + mv);
            double x = means[i - 1] + mm + sa * (means[i] - means[i - 1]) / (sa + sb) + 0.5;
            tau[i - 1] = Math.max(i == 1 ? 0 : tau[i - 2] + 1, Math.round(x));
        }
        double[][] w = new double[m][m];
        double diag = 0;
        for (int i = 0; i < m; i++) {
            double prev = 0;
            for (int j = 0; j < m - 1; j++) {
                double below = lowerTail(means[i], variances[i], mix, tau[j]);
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
        double[] uniform = new double[m];
        Arrays.fill(uniform, 1.0 / m);
        double mi = Math.min(cap, ChannelCascade.mutualInformationBits(uniform, w));
        return new Result(cap, tau, w, err, log10, mi, tau, w, err, log10, -1);
    }

    private static double sigma(double variance) {
        return Math.max(Math.sqrt(Math.max(variance, 0)), MIN_SIGMA);
    }

}
