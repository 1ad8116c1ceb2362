package dev.nanoplan.info;

/**
 * Shannon entropy in bits.
 *
 * <p>Definition: H(p) = −Σ p_i log₂ p_i with the convention 0·log 0 = 0 (C. E. Shannon,
 * "A mathematical theory of communication", Bell Syst. Tech. J. 27, 1948; T. M. Cover and
 * J. A. Thomas, <i>Elements of Information Theory</i>, 2nd ed., Wiley, 2006, §2.1).
 *
 * <p>Accuracy: the binary entropy uses {@code log1p} for the complement so that
 * h(p) for p down to the smallest subnormal is correct to a few ulp (h(1e-300) ≈ 1.0e-297,
 * not 0 and not NaN); h(0) = h(1) = 0 exactly and h(1/2) = 1 exactly.
 */
public final class Entropy {

    private static final double LN2 = Math.log(2);

    private Entropy() {
    }

    /**
     * Binary entropy h(p) = −p log₂ p − (1−p) log₂(1−p), in bits.
     *
     * @param p probability in [0, 1]
     * @return h(p) in [0, 1]; exactly 0 at p = 0 and p = 1
     * @throws IllegalArgumentException if p is NaN or outside [0, 1]
     */
    public static double binaryBits(double p) {
        if (!(p >= 0 && p <= 1)) {
            throw new IllegalArgumentException("p must be in [0, 1], got " + p);
        }
        return binaryNats(p) / LN2;
    }

    /** Binary entropy in nats, no argument check (p in [0, 1]). */
    static double binaryNats(double p) {
        if (p == 0 || p == 1) {
            return 0;
        }
        if (p <= 0.5) {
            return -(p * Math.log(p) + (1 - p) * Math.log1p(-p));
        }
        double c = 1 - p; // exact for p >= 1/2 (Sterbenz)
        return -(c * Math.log(c) + p * Math.log1p(-c));
    }

    /**
     * Binary entropy in nats from a probability and its separately known complement, so that
     * both tiny values keep their full relative precision. No argument check.
     */
    static double binaryNats(double p, double oneMinusP) {
        double s = 0;
        if (p > 0) {
            s -= p * Math.log(p);
        }
        if (oneMinusP > 0) {
            s -= oneMinusP * Math.log(oneMinusP);
        }
        return s;
    }

    /**
     * Entropy −Σ p_i log₂ p_i of a distribution, in bits (0·log 0 = 0).
     *
     * <p>Complexity O(n). The distribution is used as given (not renormalised).
     *
     * @param dist probabilities, each in [0, 1], summing to 1 within 1e-9
     * @return entropy in [0, log₂ n]
     * @throws IllegalArgumentException if {@code dist} is empty, has an entry that is NaN or
     *     outside [0, 1], or does not sum to 1 within 1e-9
     */
    public static double bits(double[] dist) {
        if (dist == null || dist.length == 0) {
            throw new IllegalArgumentException("dist must not be empty");
        }
        double sum = 0;
        double h = 0;
        for (int i = 0; i < dist.length; i++) {
            double p = dist[i];
            if (!(p >= 0 && p <= 1)) {
                throw new IllegalArgumentException("dist[" + i + "] must be in [0, 1], got " + p);
            }
            sum += p;
            if (p > 0) {
                h -= p * Math.log(p);
            }
        }
        if (Math.abs(sum - 1) > 1e-9) {
            throw new IllegalArgumentException("dist must sum to 1, sums to " + sum);
        }
        return Math.max(0, h / LN2);
    }
}
