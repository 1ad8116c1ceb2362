package dev.nanoplan.desktop;

import dev.nanoplan.tolerance.GuardBand;
import dev.nanoplan.tolerance.ToleranceResult;
import dev.nanoplan.tolerance.ToleranceSummary;
import java.util.List;
import java.util.stream.Collectors;

/**
 * One row of the Tolerance tab's tables: a link or a demand with its yield and Wilson 95 % interval,
 * and for a link the capacity percentiles, the drivers of its failures and its guard band. Cell texts
 * go through {@link Formats} and {@link TableText}: a value that does not apply is a word with its
 * reason as a tooltip, never a sentinel. Plain data; no JavaFX.
 *
 * @param from      emitter (link) or source (demand)
 * @param to        receiver (link) or destination (demand)
 * @param link      the core's link result, or null for a demand
 * @param yield     fraction of samples meeting the targets
 * @param interval  Wilson 95 % interval [lo, hi]
 * @param weakRank  1 for the likeliest failure among the weak links, 2 for the next…; 0 when not weak
 */
public record ToleranceRow(String from, String to, ToleranceResult.LinkYield link, double yield,
        List<Double> interval, int weakRank) {

    public ToleranceRow {
        interval = List.copyOf(interval);
    }

    static ToleranceRow of(ToleranceResult.LinkYield l, int weakRank) {
        return new ToleranceRow(l.from(), l.to(), l, l.yield(), l.yieldInterval(), weakRank);
    }

    static ToleranceRow of(ToleranceResult.DemandYield d) {
        return new ToleranceRow(d.from(), d.to(), null, d.yield(), d.yieldInterval(), 0);
    }

    /** "src → dst". */
    public String name() {
        return from + " → " + to;
    }

    /** Whether the link is below {@link ToleranceSummary#WEAK_YIELD} yield. */
    public boolean weak() {
        return weakRank > 0;
    }

    /** The yield as a number ("0.953"). */
    String yieldText() {
        return Formats.sig(yield);
    }

    /** The interval as "0.94 – 0.97". */
    String intervalText() {
        return Formats.sig(interval.get(0)) + " – " + Formats.sig(interval.get(1));
    }

    /** A capacity percentile of a link, bits per symbol. */
    TableText.Cell capacity(double bits) {
        return TableText.number(bits, "not applicable: the link fell out of every sample");
    }

    /** The tolerances that drive the failures, largest share first ("position of s05 0.62, …"), or a word. */
    TableText.Cell drivers(String method) {
        if (link == null) {
            return TableText.Cell.of("");
        }
        if (link.drivers().isEmpty()) {
            return TableText.Cell.notApplicable("not applicable: the error of this link does not vary with any tolerance");
        }
        String text = link.drivers().stream().map(d -> d.tolerance() + " " + Formats.twoDigits(d.index()))
                .collect(Collectors.joining(", "));
        return new TableText.Cell(text, "share of the variance of log10 error: "
                + ("sobol_first_order".equals(method) ? "first-order Sobol' indices"
                        : "squared standardised regression coefficients (too few samples for Sobol' indices)"));
    }

    /** The release per symbol at which a weak link reaches the yield, or words saying why there is none. */
    TableText.Cell guardBand(boolean partial) {
        if (link == null) {
            return TableText.Cell.of("");
        }
        if (!weak()) {
            return new TableText.Cell("not needed", "the link already meets its target in "
                    + Formats.percent(ToleranceSummary.WEAK_YIELD).trim() + " of the samples");
        }
        if (partial) {
            return new TableText.Cell("not sized", "the run was cancelled before the guard bands were sized");
        }
        Long m = link.guardBandMoleculesPerSymbol();
        return m == null ? new TableText.Cell("not reached", "even " + Formats.tick(GuardBand.MAX_FACTOR)
                + "× the release does not reach the yield: the link is not limited by its own release")
                : new TableText.Cell(Formats.count(m), "molecules per symbol of " + from + " for "
                        + Formats.percent(ToleranceSummary.WEAK_YIELD).trim() + " yield");
    }
}
