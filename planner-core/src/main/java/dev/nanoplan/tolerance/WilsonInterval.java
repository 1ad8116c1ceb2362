package dev.nanoplan.tolerance;

/**
 * The Wilson score interval of a binomial proportion (E. B. Wilson, "Probable inference, the law of
 * succession, and statistical inference", J. Amer. Statist. Assoc. 22(158), 1927): the p with
 * |p̂ − p| ≤ z·√(p(1 − p)/n), i.e. (p̂ + z²/2n ± z·√(p̂(1 − p̂)/n + z²/4n²)) / (1 + z²/n). Unlike the
 * normal (Wald) interval it stays inside [0, 1] and is not empty at p̂ = 0 or 1.
 */
public final class WilsonInterval {

    /** z of a two-sided 95 % interval, Φ⁻¹(0.975). */
    public static final double Z95 = 1.959963984540054;

    private WilsonInterval() {
    }

    /**
     * The interval [lo, hi] for {@code successes} of {@code n} trials at normal quantile z.
     *
     * @throws IllegalArgumentException unless 0 ≤ successes ≤ n, n ≥ 1, z > 0
     */
    public static double[] of(long successes, long n, double z) {
        if (n < 1 || successes < 0 || successes > n || !(z > 0)) {
            throw new IllegalArgumentException("need 0 <= successes <= n, n >= 1, z > 0; got " + successes + ", " + n
                    + ", " + z);
        }
        double p = successes / (double) n;
        double z2n = z * z / n;
        double centre = (p + z2n / 2) / (1 + z2n);
        double half = z * Math.sqrt(p * (1 - p) / n + z2n / (4 * n)) / (1 + z2n);
        return new double[] {Math.max(0, centre - half), Math.min(1, centre + half)};
    }

    /** The 95 % interval. */
    public static double[] of95(long successes, long n) {
        return of(successes, n, Z95);
    }
}
