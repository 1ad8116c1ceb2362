package dev.nanoplan.design;

import java.util.Comparator;
import java.util.Locale;

/**
 * The lexicographic objective of a layout search (docs/architecture.md §5, design search): first the
 * number of demands meeting both targets, then the smallest shared rate over all demands, then the
 * total molecules released per second. {@link #compareTo} orders better layouts as greater.
 *
 * @param demandsMeetingTargets   demands whose every route hop meets {@code targets.max_error_probability}
 *                                and whose shared rate is at least {@code targets.min_rate_bits_per_s}
 * @param minSharedRateBitsPerS   the smallest shared rate of any demand, bit/s (0 when one is unreachable
 *                                or there are no demands)
 * @param moleculesPerS           molecules released per second by every emitting node, summed
 */
public record Objective(int demandsMeetingTargets, double minSharedRateBitsPerS, double moleculesPerS)
        implements Comparable<Objective> {

    /** More demands, then a larger smallest rate, then fewer molecules: greater is better. */
    private static final Comparator<Objective> ORDER = Comparator.comparingInt(Objective::demandsMeetingTargets)
            .thenComparingDouble(Objective::minSharedRateBitsPerS)
            .thenComparing(Objective::moleculesPerS, Comparator.reverseOrder());

    public Objective {
        if (demandsMeetingTargets < 0) {
            throw new IllegalArgumentException("demandsMeetingTargets: must be >= 0, got " + demandsMeetingTargets);
        }
        if (!(minSharedRateBitsPerS >= 0) || Double.isInfinite(minSharedRateBitsPerS)) {
            throw new IllegalArgumentException("minSharedRateBitsPerS: must be finite and >= 0, got "
                    + minSharedRateBitsPerS);
        }
        if (!(moleculesPerS >= 0) || Double.isInfinite(moleculesPerS)) {
            throw new IllegalArgumentException("moleculesPerS: must be finite and >= 0, got " + moleculesPerS);
        }
    }

    @Override
    public int compareTo(Objective other) {
        return ORDER.compare(this, other);
    }

    /** True when this is strictly better than {@code other}. */
    public boolean betterThan(Objective other) {
        return compareTo(other) > 0;
    }

    /**
     * A single number that orders layouts as the first two components do, for the continuous optimiser
     * of relay positions: count + r/(r + r₀) with r the smallest shared rate and r₀ &gt; 0 a rate scale
     * (the rate target); the fraction lies in [0, 1), so one more demand meeting the targets always
     * outweighs any rate.
     */
    public double scalar(double rateScaleBitsPerS) {
        return demandsMeetingTargets + minSharedRateBitsPerS / (minSharedRateBitsPerS + rateScaleBitsPerS);
    }

    /** E.g. {@code "3 demands meet the targets, min shared rate 0.0162 bit/s, 12,345 molecules/s"}. */
    public String describe() {
        return String.format(Locale.ROOT, "%d %s the targets, min shared rate %.4g bit/s, %,.0f molecules/s",
                demandsMeetingTargets, demandsMeetingTargets == 1 ? "demand meets" : "demands meet",
                minSharedRateBitsPerS, moleculesPerS);
    }
}
