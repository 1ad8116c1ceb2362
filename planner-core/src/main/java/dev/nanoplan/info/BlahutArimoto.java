package dev.nanoplan.info;

import java.util.Arrays;
import java.util.Objects;

/**
 * Capacity of a discrete memoryless channel by the Blahut–Arimoto alternating maximisation.
 *
 * <p>Sources: R. E. Blahut, "Computation of channel capacity and rate-distortion functions",
 * IEEE Trans. Inf. Theory IT-18(4), 460–473, 1972; S. Arimoto, "An algorithm for computing the
 * capacity of arbitrary discrete memoryless channels", IEEE Trans. Inf. Theory IT-18(1),
 * 14–20, 1972.
 *
 * <p>Iteration (natural logs internally): output r = qW; divergences
 * D_x = D(W_x ‖ r) = Σ_y W(y|x) ln W(y|x) − Σ_y W(y|x) ln r(y); bounds
 * I(q) = Σ_x q_x D_x ≤ C ≤ max_x D_x (Arimoto 1972, Theorem 1); update
 * q_x ← q_x·exp(D_x − max D)/normaliser. The loop stops as soon as
 * max_x D_x − I(q) &lt; tolerance; the returned capacity is I(q) for the returned q (an
 * achievable rate), the returned gap bounds its shortfall from the true capacity.
 *
 * <p>Numerics: Σ_y W ln W is precomputed per row from the given entries (entries down to the
 * smallest subnormal are handled: each term is W·ln W, never ln of a sum), ln r(y) is taken
 * once per output per iteration, so an iteration costs O(|X|·|Y|) multiply-adds and |Y|
 * logarithms — wide output alphabets (thousands to 1e5 outputs) are fine. Rows are checked to
 * sum to 1 within 1e-6 and renormalised.
 *
 * <p>Edge cases: one input or identical rows → capacity 0 at once; inputs whose row is a
 * strict mixture of others get input mass that decays geometrically toward 0 (the optimum
 * puts none on them). Convergence is geometric for most channels but can be slow when
 * several inputs are nearly redundant; {@code maxIterations} bounds the work, and
 * {@link Result#converged()} says whether the tolerance was met.
 */
public final class BlahutArimoto {

    /** Tolerance 1e-12 bit, at most 200 000 iterations. */
    public static final BlahutArimoto DEFAULT = new BlahutArimoto(1e-12, 200_000);

    private static final double LN2 = Math.log(2);

    private final double toleranceBits;
    private final int maxIterations;

    /**
     * @param toleranceBits stop when the upper/lower bound gap falls below this, bits, &gt; 0
     * @param maxIterations maximum number of input updates, &ge; 1
     */
    public BlahutArimoto(double toleranceBits, int maxIterations) {
        if (!(toleranceBits > 0) || Double.isInfinite(toleranceBits)) {
            throw new IllegalArgumentException(
                    "toleranceBits must be finite and > 0, got " + toleranceBits);
        }
        if (maxIterations < 1) {
            throw new IllegalArgumentException("maxIterations must be >= 1, got " + maxIterations);
        }
        this.toleranceBits = toleranceBits;
        this.maxIterations = maxIterations;
    }

    public double toleranceBits() {
        return toleranceBits;
    }

    public int maxIterations() {
        return maxIterations;
    }

    /**
     * Result of a capacity computation.
     *
     * @param capacityBits I(q) in bits for the returned input distribution (lower bound on C)
     * @param gapBits max_x D(W_x ‖ qW) − I(q) in bits (C − capacityBits ≤ gapBits)
     * @param inputDistribution the input distribution q (copy)
     * @param iterations number of input updates performed
     * @param converged whether gapBits &lt; tolerance
     */
    public record Result(double capacityBits, double gapBits, double[] inputDistribution,
                         int iterations, boolean converged) {

        public Result {
            if (!(capacityBits >= 0)) {
                throw new IllegalArgumentException("capacityBits must be >= 0, got " + capacityBits);
            }
            if (!(gapBits >= 0)) {
                throw new IllegalArgumentException("gapBits must be >= 0, got " + gapBits);
            }
            if (iterations < 0) {
                throw new IllegalArgumentException("iterations must be >= 0, got " + iterations);
            }
            inputDistribution = inputDistribution.clone();
        }

        /** Upper bound max_x D(W_x ‖ qW) on the capacity, bits. */
        public double upperBoundBits() {
            return capacityBits + gapBits;
        }

        @Override
        public double[] inputDistribution() {
            return inputDistribution.clone();
        }

        @Override
        public boolean equals(Object o) {
            // every component, arrays by content
            return o instanceof Result other
                    && Double.compare(capacityBits, other.capacityBits) == 0
                    && Double.compare(gapBits, other.gapBits) == 0
                    && Arrays.equals(inputDistribution, other.inputDistribution)
                    && iterations == other.iterations
                    && converged == other.converged;
        }

        @Override
        public int hashCode() {
            int h = Objects.hash(capacityBits, gapBits, iterations, converged);
            h = 31 * h + Arrays.hashCode(inputDistribution);
            return h;
        }

        @Override
        public String toString() {
            return "Result[capacityBits=" + capacityBits + ", gapBits=" + gapBits + ", inputDistribution="
                    + Arrays.toString(inputDistribution) + ", iterations=" + iterations + ", converged="
                    + converged + "]";
        }
    }

    /**
     * Capacity of the channel with transition matrix {@code w[x][y] = P(y | x)}.
     *
     * @param w rows (one per input) of equal length, entries finite and &ge; 0, each row
     *     summing to 1 within 1e-6
     * @return capacity, input distribution, iterations and bound gap
     * @throws IllegalArgumentException on an empty, ragged or non-stochastic matrix
     */
    public Result compute(double[][] w) {
        return compute(w, Double.NEGATIVE_INFINITY);
    }

    /**
     * As {@link #compute(double[][])}, but stops early (not converged) as soon as the upper bound
     * max_x D(W_x ‖ qW) falls to {@code abandonAtOrBelowBits} or below: the capacity is then proven
     * not to exceed that value. For branch-and-bound searches over many channels.
     */
    public Result compute(double[][] w, double abandonAtOrBelowBits) {
        double abandonNats = abandonAtOrBelowBits * LN2;
        double[][] m = checkedCopy(w);
        int nx = m.length;
        int ny = m[0].length;
        double[] negH = new double[nx];
        for (int x = 0; x < nx; x++) {
            double s = 0;
            for (double v : m[x]) {
                if (v > 0) {
                    s += v * Math.log(v);
                }
            }
            negH[x] = s;
        }
        double tolNats = toleranceBits * LN2;
        double[] q = new double[nx];
        Arrays.fill(q, 1.0 / nx);
        double[] r = new double[ny];
        double[] logR = new double[ny];
        double[] d = new double[nx];
        int iter = 0;
        while (true) {
            Arrays.fill(r, 0);
            for (int x = 0; x < nx; x++) {
                double qx = q[x];
                if (qx == 0) {
                    continue;
                }
                double[] row = m[x];
                for (int y = 0; y < ny; y++) {
                    r[y] += qx * row[y];
                }
            }
            for (int y = 0; y < ny; y++) {
                // r(y) = 0 only where every active row is 0; use the smallest positive double so
                // that an inactive row with mass there gets a large (finite) divergence.
                logR[y] = Math.log(r[y] > 0 ? r[y] : Double.MIN_VALUE);
            }
            double lower = 0;
            double upper = Double.NEGATIVE_INFINITY;
            for (int x = 0; x < nx; x++) {
                double[] row = m[x];
                double s = 0;
                for (int y = 0; y < ny; y++) {
                    double v = row[y];
                    if (v > 0) {
                        s += v * logR[y];
                    }
                }
                d[x] = negH[x] - s;
                lower += q[x] * d[x];
                upper = Math.max(upper, d[x]);
            }
            lower = Math.max(0, lower);
            upper = Math.max(lower, upper);
            double gap = upper - lower;
            boolean converged = gap < tolNats;
            if (converged || iter >= maxIterations || upper <= abandonNats) {
                double cap = Math.min(lower, Math.log(Math.min(nx, ny))) / LN2;
                return new Result(Math.max(0, cap), gap / LN2, q, iter, converged);
            }
            double norm = 0;
            for (int x = 0; x < nx; x++) {
                q[x] *= Math.exp(d[x] - upper);
                norm += q[x];
            }
            for (int x = 0; x < nx; x++) {
                q[x] /= norm;
            }
            iter++;
        }
    }

    private static double[][] checkedCopy(double[][] w) {
        if (w == null || w.length == 0) {
            throw new IllegalArgumentException("w must have at least one row");
        }
        int ny = w[0] == null ? 0 : w[0].length;
        if (ny == 0) {
            throw new IllegalArgumentException("w must have at least one column");
        }
        double[][] m = new double[w.length][];
        for (int x = 0; x < w.length; x++) {
            if (w[x] == null || w[x].length != ny) {
                throw new IllegalArgumentException("w row " + x + " must have " + ny + " entries");
            }
            double s = 0;
            for (int y = 0; y < ny; y++) {
                double v = w[x][y];
                if (!(v >= 0) || v == Double.POSITIVE_INFINITY) {
                    throw new IllegalArgumentException(
                            "w[" + x + "][" + y + "] must be finite and >= 0, got " + v);
                }
                s += v;
            }
            if (Math.abs(s - 1) > 1e-6) {
                throw new IllegalArgumentException("w row " + x + " must sum to 1, sums to " + s);
            }
            m[x] = new double[ny];
            for (int y = 0; y < ny; y++) {
                m[x][y] = w[x][y] / s;
            }
        }
        return m;
    }
}
