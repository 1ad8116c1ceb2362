package dev.nanoplan.desktop;

import static org.assertj.core.api.Assertions.assertThat;

import dev.nanoplan.plan.Impairment;
import dev.nanoplan.plan.LinkReport;
import dev.nanoplan.plan.RouteReport;
import dev.nanoplan.plan.SharedRates;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;

/** The text under the routes table, on hand-made routes whose expected text is written out in full. */
class RouteSummaryTest {

    static LinkReport link(String from, String to, double capacityBits) {
        return new LinkReport(from, to, "A", 0.1, new double[] {0.1}, 10, 0, 0, 0, 5, 0.01, -2, 5, 0.01, capacityBits, 1, null,
                null, 0.01, 0.01, false, Impairment.SIGNAL, null, 0, null);
    }

    static final Map<String, LinkReport> LINKS = Map.of("s1>r", link("s1", "r", 0.912), "r>gw", link("r", "gw", 0.25));

    static LinkReport find(String from, String to) {
        return LINKS.get(from + ">" + to);
    }

    static final RouteReport RELAYED = new RouteReport("s1", "gw", List.of("s1", "r", "gw"), 0.25, "r", "gw", 0.2,
            2.0, 0.2, 0.05, Impairment.CROSSTALK, "move r closer to gw");

    @Test
    void noSelectionAsksForOne() {
        // worked example: the placeholder sentence, unchanged from the window's former binding
        assertThat(RouteSummary.of(null, RouteSummaryTest::find, null))
                .isEqualTo("Select a route to see its per-hop information and what limits it.");
    }

    @Test
    void aRelayedRouteListsItsHopsBottleneckAndAdvice() {
        // worked example: hops in order with three significant digits, then the bottleneck and its impairment id
        assertThat(RouteSummary.of(RELAYED, RouteSummaryTest::find, null)).isEqualTo(
                "s1 → gw: s1→r 0.912 bit, r→gw 0.25 bit\nBottleneck r → gw (limited by crosstalk). move r closer to gw");
    }

    @Test
    void aHopMissingFromThePlanShowsAQuestionMark() {
        RouteReport r = new RouteReport("s1", "gw", List.of("s1", "x", "gw"), 0.25, "x", "gw", 0.2, 2.0, 0.2, null,
                null, null);
        // worked example: an unknown hop and no impairment or advice
        assertThat(RouteSummary.of(r, RouteSummaryTest::find, null))
                .isEqualTo("s1 → gw: s1→x ? bit, x→gw ? bit\nBottleneck x → gw. ");
    }

    @Test
    void anUnreachableDemandGivesTheAdviceOnly() {
        RouteReport r = new RouteReport("s9", "gw", List.of(), 0, null, null, 0, 0, 0, null, null, "add a relay");
        // worked example
        assertThat(RouteSummary.of(r, RouteSummaryTest::find, null)).isEqualTo("s9 → gw: no route. add a relay");
    }

    @Test
    void aSharedStreamAddsItsRateOnlyWhenItLimitsTheRoute() {
        String base = RouteSummary.of(RELAYED, RouteSummaryTest::find, null);
        // worked example: max-min fair time-sharing (Bertsekas and Gallager, Data Networks, 1992, §6.5.2)
        // of r's stream among 3 demands leaves this route 0.667 bit/s
        assertThat(RouteSummary.of(RELAYED, RouteSummaryTest::find, new SharedRates.Share(2.0 / 3, "r", 3)))
                .isEqualTo(base + "\nShared: 0.6667 bit/s, because r's slots carry 3 demands (max-min fair "
                        + "time-sharing).");
        // a route alone on its stream, or not limited by sharing, reads as without a share
        assertThat(RouteSummary.of(RELAYED, RouteSummaryTest::find, new SharedRates.Share(2.0, null, 1)))
                .isEqualTo(base);
        assertThat(RouteSummary.of(RELAYED, RouteSummaryTest::find, new SharedRates.Share(2.0, "r", 1)))
                .isEqualTo(base);
    }
}
