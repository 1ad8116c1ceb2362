package dev.nanoplan.desktop;

import dev.nanoplan.plan.BudgetReport;
import dev.nanoplan.plan.Impairment;
import dev.nanoplan.plan.RouteReport;
import dev.nanoplan.scenario.Role;

/**
 * The words and cell texts of the plan tables: roles and impairments in words, numbers through
 * {@link Formats}, and {@value #NOT_APPLICABLE} with the reason as a tooltip where a value does not
 * apply (a budget that cannot be sized, an unreachable route), never a sentinel such as −1.
 * Plain strings; no JavaFX.
 */
final class TableText {

    /** Shown in a cell whose value does not apply; the cell's tooltip says why. */
    static final String NOT_APPLICABLE = "—";

    /** A cell's text and its tooltip (null when the text says it all). */
    record Cell(String text, String tooltip) {

        static Cell of(String text) {
            return new Cell(text, null);
        }

        static Cell notApplicable(String why) {
            return new Cell(NOT_APPLICABLE, why);
        }
    }

    private TableText() {
    }

    /** A role in words: "transmitter", "receiver", "relay". */
    static String role(Role r) {
        return r.id();
    }

    /** What limits a link, in words (empty when nothing is named). */
    static String impairment(Impairment i) {
        if (i == null) {
            return "";
        }
        return switch (i) {
            case SIGNAL -> "weak signal";
            case ISI -> "earlier symbols (ISI)";
            case CROSSTALK -> "crosstalk";
            case NOISE -> "background noise";
        };
    }

    /** A value in the shared number format, or not applicable with {@code why} when it is null or not finite. */
    static Cell number(Double v, String why) {
        return v == null || !Double.isFinite(v) ? Cell.notApplicable(why) : Cell.of(Formats.sig(v));
    }

    private static Cell molecules(double v, String why) {
        return Double.isFinite(v) ? Cell.of(Formats.molecules(v)) : Cell.notApplicable(why);
    }

    /** Molecules per symbol a node needs: not applicable (with the budget's reason) when there is no budget. */
    static Cell moleculesPerSymbol(BudgetReport b) {
        return b.moleculesPerSymbolNeeded() < 0 ? Cell.notApplicable(noBudget(b))
                : Cell.of(Formats.count(b.moleculesPerSymbolNeeded()));
    }

    /** Molecules per second at the needed budget: not applicable when there is no budget. */
    static Cell moleculesPerS(BudgetReport b) {
        return b.moleculesPerSymbolNeeded() < 0 || b.moleculesPerS() < 0 ? Cell.notApplicable(noBudget(b))
                : molecules(b.moleculesPerS(), noBudget(b));
    }

    /** Molecules over the mission at the needed budget: not applicable when there is no budget. */
    static Cell moleculesPerMission(BudgetReport b) {
        return b.moleculesPerSymbolNeeded() < 0 || b.moleculesPerMission() < 0 ? Cell.notApplicable(noBudget(b))
                : molecules(b.moleculesPerMission(), "not applicable: the mission duration is not finite");
    }

    /** A route's latency: not applicable when the route is unreachable. */
    static Cell latency(RouteReport r) {
        return r.reachable() ? number(r.latencyS(), "no latency") : Cell.notApplicable(unreachable(r));
    }

    /** A route's rate: not applicable when the route is unreachable. */
    static Cell routeRate(RouteReport r) {
        return r.reachable() ? number(r.rateBitsPerS(), "no rate") : Cell.notApplicable(unreachable(r));
    }

    /** The direct link's information: not applicable when there is no direct link. */
    static Cell direct(RouteReport r) {
        return number(r.directCapacityBits(), "no direct link from " + r.from() + " to " + r.to());
    }

    private static String noBudget(BudgetReport b) {
        String why = b.reason() == null || b.reason().isBlank() ? "no budget meets the target" : b.reason();
        return "not applicable: " + why;
    }

    private static String unreachable(RouteReport r) {
        return "not applicable: " + r.to() + " cannot be reached from " + r.from();
    }
}
