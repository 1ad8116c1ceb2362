package dev.nanoplan.plan;

/**
 * How far the preview's operating mutual information of a link may be from the exact plan's: the
 * band the preview states in its first warning ({@link PreviewPlanner#warning}).
 *
 * <p><b>Binary signalling: {@value #BINARY_BAND_BITS} bit.</b> Not a proven bound: the normal and
 * normal-mixture approximations have none for the mutual information (continuity of the information in
 * a distribution error δ gives 2·h(δ), and the Berry–Esseen δ of the normally treated part, 0.56·L
 * with L its Lyapunov ratio — I. Shevtsova, Doklady Mathematics 82, 2010 — was tried as a class and
 * did not rank the measured differences: the largest, 0.063 bit, is at L = 0.08, and links at L &gt; 1
 * differ by 0.004 bit). The band is the largest difference measured on the bundled scenarios and the
 * seeded swarms (0.063 bit, swarm(160, 7), t81 → r131) with a margin of about 1.5×;
 * {@code PreviewPlannerTest} checks every link of those layouts against it.
 *
 * <p><b>More levels: log2 M bit</b>, i.e. nothing beyond the trivial (no bundled layout checks a
 * multi-level preview).
 */
final class PreviewDeviation {

    /** The stated band of a binary link, bits. */
    static final double BINARY_BAND_BITS = 0.1;

    private PreviewDeviation() {
    }

    /** The band of a link with {@code levels} signalling levels, bits. */
    static double bandBits(int levels) {
        return levels == 2 ? BINARY_BAND_BITS : Math.log(levels) / Math.log(2);
    }
}
