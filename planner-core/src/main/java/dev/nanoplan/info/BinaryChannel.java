package dev.nanoplan.info;

/**
 * Mutual information and capacity of the binary asymmetric channel (BAC).
 *
 * <p>Input X ∈ {0, 1} with P(X = 1) = q; crossovers e0 = P(Y = 1 | X = 0) and
 * e1 = P(Y = 0 | X = 1). Transition matrix W = [[1−e0, e0], [e1, 1−e1]].
 *
 * <p><b>Mutual information</b> is computed as Σ_x q_x D(W_x ‖ r) with r the output
 * distribution (a sum of non-negative terms with a single log of a ratio each), never as the
 * difference H(Y) − H(Y|X) of two nearly equal entropies. The overloads taking complements
 * ({@code oneMinusE0}, {@code oneMinusE1}) keep full relative precision when a crossover is
 * within 1e-16 of 1 (e.g. when a detector's threshold sits far in a tail and 1 − ε is only
 * known as a separately summed tail). Results are clamped to [0, 1] bit; absolute error is a
 * few 1e-16 bit.
 *
 * <p><b>Capacity</b> uses the closed form of R. A. Silverman, "On binary channels and their
 * cascades", IRE Trans. Inf. Theory IT-1(3), 19–27, 1955. With Δ = 1 − e0 − e1 (the
 * determinant of W) and h the binary entropy:
 * <pre>
 *   C = log₂(1 + 2^{(h(e0) − h(e1))/Δ}) − ((1 − e1)·h(e0) − e0·h(e1))/Δ,
 *   output P(Y = 1) = r₁* = 1 / (1 + 2^{(h(e1) − h(e0))/Δ}),   q* = (r₁* − e0)/Δ.
 * </pre>
 * (Derivation: at the optimum D(W_x ‖ r*) = C for both inputs; solving the 2×2 linear system
 * W·z = −h with z_y = log₂ r*_y + C gives the two lines above.) Guards:
 * <ul>
 *   <li>Δ &lt; 0 (e0 + e1 &gt; 1): the output labels are swapped, which changes neither C nor q*;</li>
 *   <li>Δ = 0: rows equal, C = 0, q* reported as 1/2;</li>
 *   <li>the reported capacity is the mutual information evaluated at q* (so it is always an
 *       achievable value in [0, 1] and tiny crossovers such as 1e-300 give at most 1 bit);</li>
 *   <li>when |Δ| is so small that q* = (r₁* − e0)/Δ loses more than ~1e-7 to cancellation,
 *       q* is found instead by golden-section search of the concave I(q) on [0, 1]
 *       (80 steps, bracket 1e-16).</li>
 * </ul>
 * Cost: O(1), about 15 logarithms (a few hundred in the golden-section fallback).
 */
public final class BinaryChannel {

    private static final double LN2 = Math.log(2);
    private static final double GOLDEN = (Math.sqrt(5) - 1) / 2;
    private static final double EPS = 0x1.0p-52;

    /** Mutual information below which the batch method returns 0 without logarithms, bits. */
    public static final double NEGLIGIBLE_BITS = 1e-20;

    private BinaryChannel() {
    }

    /**
     * Mutual information I(X;Y) in bits of the BAC at prior q = P(X = 1).
     *
     * @param priorOne q in [0, 1]
     * @param e0 P(Y = 1 | X = 0) in [0, 1]
     * @param e1 P(Y = 0 | X = 1) in [0, 1]
     * @return I in [0, 1]
     */
    public static double mutualInformationBits(double priorOne, double e0, double e1) {
        checkProbability("e0", e0);
        checkProbability("e1", e1);
        return mutualInformationBits(priorOne, e0, 1 - e0, e1, 1 - e1);
    }

    /**
     * Mutual information in bits with the complements given separately (each pair must be
     * non-negative and sum to 1 within 1e-6; it is renormalised to sum to 1, so an entry such
     * as 1 + 4e-16 from summed tails is accepted).
     *
     * @param priorOne q in [0, 1]
     * @param e0 P(Y = 1 | X = 0)
     * @param oneMinusE0 P(Y = 0 | X = 0)
     * @param e1 P(Y = 0 | X = 1)
     * @param oneMinusE1 P(Y = 1 | X = 1)
     * @return I in [0, 1]
     */
    public static double mutualInformationBits(double priorOne, double e0, double oneMinusE0,
                                               double e1, double oneMinusE1) {
        checkProbability("priorOne", priorOne);
        double s0 = checkPair("e0", e0, oneMinusE0);
        double s1 = checkPair("e1", e1, oneMinusE1);
        return miNats(priorOne, e0 / s0, oneMinusE0 / s0, e1 / s1, oneMinusE1 / s1) / LN2;
    }

    /**
     * Mutual information in bits of many binary channels at one prior: element i uses
     * (e0[i], oneMinusE0[i], e1[i], oneMinusE1[i]) as in
     * {@link #mutualInformationBits(double, double, double, double, double)}, with the same
     * checks. Meant for threshold sweeps (one call per sweep, at most four logarithms per
     * channel, no allocation besides the result). Entries whose rigorous upper bound
     * Δ·h(q) is below {@value #NEGLIGIBLE_BITS} bit are returned as 0 without evaluating
     * logarithms (absolute error below that bound); Δ = |1 − e0 − e1| is the total-variation
     * distance of the rows, and a binary-input channel with distance Δ is a degraded binary
     * erasure channel with erasure probability 1 − Δ, whose mutual information at prior q is
     * Δ·h(q) (data-processing inequality, T. M. Cover and J. A. Thomas, <i>Elements of
     * Information Theory</i>, 2nd ed., 2006, Theorem 2.8.1).
     *
     * @return a new array of the common length, each entry in [0, 1]
     * @throws IllegalArgumentException on arrays of unequal length or an invalid entry
     */
    public static double[] mutualInformationBits(double priorOne, double[] e0, double[] oneMinusE0,
                                                 double[] e1, double[] oneMinusE1) {
        checkProbability("priorOne", priorOne);
        int n = e0.length;
        if (oneMinusE0.length != n || e1.length != n || oneMinusE1.length != n) {
            throw new IllegalArgumentException("crossover arrays must have equal lengths");
        }
        double[] out = new double[n];
        double hq = Entropy.binaryBits(priorOne);
        for (int i = 0; i < n; i++) {
            double s0 = checkPair("e0", e0[i], oneMinusE0[i]);
            double s1 = checkPair("e1", e1[i], oneMinusE1[i]);
            double lowSum = oneMinusE0[i] + e1[i];
            double highSum = oneMinusE1[i] + e0[i];
            double delta = lowSum <= highSum
                    ? Math.abs(oneMinusE0[i] - e1[i]) + 4 * EPS * lowSum
                    : Math.abs(oneMinusE1[i] - e0[i]) + 4 * EPS * highSum;
            if (delta * hq < NEGLIGIBLE_BITS) {
                continue; // out[i] = 0 within the bound
            }
            double a0 = 1 / s0;
            double a1 = 1 / s1;
            out[i] = miNats(priorOne, e0[i] * a0, oneMinusE0[i] * a0, e1[i] * a1,
                    oneMinusE1[i] * a1) / LN2;
        }
        return out;
    }

    /**
     * Capacity of the BAC (maximum of I over the prior) and the optimal prior.
     *
     * @param e0 P(Y = 1 | X = 0) in [0, 1]
     * @param e1 P(Y = 0 | X = 1) in [0, 1]
     * @return capacity in bits and the capacity-achieving P(X = 1)
     */
    public static BinaryCapacity capacity(double e0, double e1) {
        checkProbability("e0", e0);
        checkProbability("e1", e1);
        return capacity(e0, 1 - e0, e1, 1 - e1);
    }

    /**
     * Capacity with the complements given separately (each pair must sum to 1 within 1e-6;
     * it is renormalised).
     */
    public static BinaryCapacity capacity(double e0, double oneMinusE0, double e1,
                                          double oneMinusE1) {
        double s0 = checkPair("e0", e0, oneMinusE0);
        double s1 = checkPair("e1", e1, oneMinusE1);
        return capacityNormalised(e0 / s0, oneMinusE0 / s0, e1 / s1, oneMinusE1 / s1);
    }

    /** Capacity without argument checks; pairs already sum to 1. */
    static BinaryCapacity capacityNormalised(double e0, double c0, double e1, double c1) {
        // Δ = 1 − e0 − e1 = c0 − e1 = c1 − e0: use the pair with the smaller operands.
        double delta = (c0 + e1 <= c1 + e0) ? c0 - e1 : c1 - e0;
        if (delta == 0) {
            return new BinaryCapacity(0, 0.5);
        }
        double a = e0;
        double ca = c0;
        double b = e1;
        double cb = c1;
        if (delta < 0) {
            // Swap the output labels: e0' = 1 − e0, e1' = 1 − e1; C and q* unchanged.
            a = c0;
            ca = e0;
            b = c1;
            cb = e1;
            delta = -delta;
        }
        double ha = Entropy.binaryNats(a, ca);
        double hb = Entropy.binaryNats(b, cb);
        double d = (hb - ha) / delta; // nats; ln((1 − r₁*)/r₁*)
        double r1 = d > 0 ? Math.exp(-d) / (1 + Math.exp(-d)) : 1 / (1 + Math.exp(d));
        double q = (r1 - a) / delta;
        // Propagated rounding error of q (first order): from ha, hb, the division and r1 − a.
        double errD = 4 * EPS * ((ha + hb) / delta + Math.abs(d));
        double errQ = (r1 * (1 - r1) * errD + 2 * EPS * (r1 + a)) / delta;
        if (!(errQ <= 1e-7) || !(q >= -1e-9 && q <= 1 + 1e-9)) {
            q = goldenSection(a, ca, b, cb);
        }
        q = Math.min(1, Math.max(0, q));
        double bits = Math.min(1, miNats(q, a, ca, b, cb) / LN2);
        return new BinaryCapacity(Math.max(0, bits), q);
    }

    /** Maximises the concave I(q) on [0, 1] by golden-section search. */
    private static double goldenSection(double a, double ca, double b, double cb) {
        double lo = 0;
        double hi = 1;
        double x1 = hi - GOLDEN * (hi - lo);
        double x2 = lo + GOLDEN * (hi - lo);
        double f1 = miNats(x1, a, ca, b, cb);
        double f2 = miNats(x2, a, ca, b, cb);
        for (int i = 0; i < 80 && hi - lo > 1e-16; i++) {
            if (f1 < f2) {
                lo = x1;
                x1 = x2;
                f1 = f2;
                x2 = lo + GOLDEN * (hi - lo);
                f2 = miNats(x2, a, ca, b, cb);
            } else {
                hi = x2;
                x2 = x1;
                f2 = f1;
                x1 = hi - GOLDEN * (hi - lo);
                f1 = miNats(x1, a, ca, b, cb);
            }
        }
        return 0.5 * (lo + hi);
    }

    /**
     * Mutual information in nats, no checks; (e0, c0) and (e1, c1) each sum to 1. Computed as
     * Σ_x q_x Σ_y W(y|x) ln(W(y|x)/r(y)), terms with W = 0 or q_x = 0 dropped.
     */
    static double miNats(double q1, double e0, double c0, double e1, double c1) {
        double q0 = 1 - q1;
        double r1 = q0 * e0 + q1 * c1;
        double r0 = q0 * c0 + q1 * e1;
        double s = 0;
        if (q0 > 0) {
            s += q0 * (term(c0, r0) + term(e0, r1));
        }
        if (q1 > 0) {
            s += q1 * (term(e1, r0) + term(c1, r1));
        }
        return Math.min(LN2, Math.max(0, s));
    }

    private static double term(double w, double r) {
        if (w == 0 || r == 0) {
            return 0;
        }
        double ratio = w / r;
        return w * (ratio < Double.POSITIVE_INFINITY ? Math.log(ratio) : Math.log(w) - Math.log(r));
    }

    private static void checkProbability(String name, double p) {
        if (!(p >= 0 && p <= 1)) {
            throw new IllegalArgumentException(name + " must be in [0, 1], got " + p);
        }
    }

    private static double checkPair(String name, double p, double oneMinusP) {
        if (!(p >= 0) || !(oneMinusP >= 0)) {
            throw new IllegalArgumentException(
                    name + " and its complement must be >= 0, got " + p + " and " + oneMinusP);
        }
        double s = p + oneMinusP;
        if (Math.abs(s - 1) > 1e-6) {
            throw new IllegalArgumentException(
                    name + " and its complement must sum to 1, sum to " + s);
        }
        return s;
    }
}
