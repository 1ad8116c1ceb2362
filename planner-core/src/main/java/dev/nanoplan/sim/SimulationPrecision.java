package dev.nanoplan.sim;

import java.util.Locale;

/**
 * When a simulated hit probability is too poorly known to act on, and how many molecules would fix it.
 *
 * <p>With k hits among M released molecules, p̂ = k/M has the binomial standard error
 * √(p̂(1 − p̂)/M), a relative error of about 1/√k. Below {@value #MIN_HITS} hits (relative error above
 * about 18 %) the normal approximation behind a z score and a 3-standard-error flag no longer holds
 * (the usual rule of thumb for the normal approximation of a binomial count, e.g. W. Feller,
 * <i>An Introduction to Probability Theory and Its Applications</i>, vol. I, 3rd ed., 1968, ch. VII),
 * and with no hit at all the standard error is 0 and says nothing. Such a link is "insufficient
 * molecules": it is neither flagged with a cause nor given a factor, and the message names the
 * molecules per emitter that give {@value #MIN_HITS} expected hits, ⌈{@value #MIN_HITS}/p⌉, with p
 * the best estimate at hand (p̂ when k &gt; 0; with no hit the smaller of the closed form and 3/M, the
 * 95 % upper bound of the rule of three).
 */
public final class SimulationPrecision {

    /** Fewest hits for a usable estimate. */
    public static final long MIN_HITS = 30;

    private SimulationPrecision() {
    }

    /** Whether {@code hits} hits are too few ({@code < MIN_HITS}, zero included). */
    public static boolean insufficient(long hits) {
        return hits < MIN_HITS;
    }

    /**
     * Molecules per emitter for {@value #MIN_HITS} expected hits at probability {@code p}: ⌈30/p⌉, or −1
     * when {@code p} is not positive (unknown).
     */
    public static long minimumMolecules(double p) {
        if (!(p > 0)) {
            return -1;
        }
        double m = Math.ceil(MIN_HITS / p);
        return m >= Long.MAX_VALUE ? Long.MAX_VALUE : (long) m;
    }

    /**
     * The best estimate of the probability: {@code hits/molecules} when there are hits, else the
     * smaller of {@code fallback} (e.g. the closed form; ≤ 0 for none) and 3/M.
     */
    public static double estimate(long hits, long molecules, double fallback) {
        if (molecules <= 0) {
            return fallback;
        }
        if (hits > 0) {
            return (double) hits / molecules;
        }
        // no hit: p is below 3/M with 95 % confidence (the rule of three; J. A. Hanley and
        // A. Lippman-Hand, JAMA 249(13), 1983)
        double upper = 3.0 / molecules;
        return fallback > 0 ? Math.min(fallback, upper) : upper;
    }

    /**
     * "insufficient molecules: 3 hits of 20000 released; at least 200000 molecules per emitter for 30 hits"
     * (or, without an estimate, "more than 200000").
     *
     * @param what which hits, e.g. "in the first symbol"
     */
    public static String describe(long hits, long molecules, double p, String what) {
        long need = minimumMolecules(p);
        String at = need > 0 ? String.format(Locale.ROOT, "at least %d", need)
                : String.format(Locale.ROOT, "well over %d", molecules);
        return String.format(Locale.ROOT, "insufficient molecules: %d hit%s %s of %d released; %s molecules per "
                + "emitter for %d hits (relative standard error about %.0f %%)", hits, hits == 1 ? "" : "s", what,
                molecules, at, MIN_HITS, 100 / Math.sqrt(MIN_HITS));
    }
}
