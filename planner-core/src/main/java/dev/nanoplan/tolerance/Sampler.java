package dev.nanoplan.tolerance;

import java.util.Locale;

/** How the unit-cube points behind a study's normal draws are chosen. */
public enum Sampler {
    /**
     * Sobol' low-discrepancy points (I. M. Sobol', USSR Comput. Math. Math. Phys. 7(4), 1967; Apache
     * Commons Math {@code SobolSequenceGenerator}, Joe–Kuo direction numbers) with a random shift
     * modulo 1 drawn from the seed (R. Cranley, T. N. L. Patterson, SIAM J. Numer. Anal. 13(6), 1976).
     */
    SOBOL,
    /** Independent seeded pseudo-random points (XO_RO_SHI_RO_128_PP, Apache Commons RNG). */
    RANDOM;

    /** The command-line word. */
    public String id() {
        return name().toLowerCase(Locale.ROOT);
    }

    /** @throws IllegalArgumentException naming the accepted words */
    public static Sampler parse(String id) {
        for (Sampler s : values()) {
            if (s.id().equals(id)) {
                return s;
            }
        }
        throw new IllegalArgumentException("unknown sampler '" + id + "', expected sobol or random");
    }
}
