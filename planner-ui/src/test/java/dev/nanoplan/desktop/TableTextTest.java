package dev.nanoplan.desktop;

import static org.assertj.core.api.Assertions.assertThat;

import dev.nanoplan.plan.BudgetReport;
import dev.nanoplan.plan.Impairment;
import dev.nanoplan.plan.RouteReport;
import dev.nanoplan.scenario.Role;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/** The plan tables' cell texts: roles in the scenario file's words, and "—" with a reason instead of sentinels. */
class TableTextTest {

    @ParameterizedTest(name = "{0} → {1}")
    @CsvSource({"TRANSMITTER, transmitter", "RECEIVER, receiver", "RELAY, relay"})
    void rolesReadAsTheWordsOfTheScenarioFile(Role role, String word) {
        // docs/architecture.md §4.1: "role": "transmitter" | "receiver" | "relay"
        assertThat(TableText.role(role)).isEqualTo(word);
    }

    @Test
    void everyImpairmentHasWordsAndNoneIsShownInCapitals() {
        for (Impairment i : Impairment.values()) {
            // the rule: words, never the enum constant
            assertThat(TableText.impairment(i)).isNotBlank().isNotEqualTo(i.name());
        }
        assertThat(TableText.impairment(null)).isEmpty();
    }

    @Test
    void aBudgetThatCannotBeSizedShowsADashWithItsReasonNotMinusOne() {
        // BudgetReport's Javadoc: −1 molecules per symbol, per second and per mission when there is no budget
        BudgetReport none = new BudgetReport("s05", -1, -1, -1, false, "out of reach of gw", "independent", false);
        for (TableText.Cell c : List.of(TableText.moleculesPerSymbol(none), TableText.moleculesPerS(none),
                TableText.moleculesPerMission(none))) {
            assertThat(c.text()).isEqualTo("—").doesNotContain("-1");
            assertThat(c.tooltip()).contains("not applicable").contains("out of reach of gw");
        }
    }

    @Test
    void aSizedBudgetShowsItsNumbersInTheSharedFormatWithoutTooltip() {
        BudgetReport b = new BudgetReport("s01", 2440, 8133.333, 2.928e7, true, "target met", "independent", false);
        // worked examples of whole molecules with thousands separators (the text and HTML reports'
        // budget columns), not "2.44e+03" as the issue saw
        assertThat(TableText.moleculesPerSymbol(b)).isEqualTo(TableText.Cell.of("2,440"));
        assertThat(TableText.moleculesPerS(b)).isEqualTo(TableText.Cell.of("8,133"));
        assertThat(TableText.moleculesPerMission(b).text()).isEqualTo("29,280,000");
    }

    @Test
    void anUnreachableRouteHasNoLatencyNorRateAndAMissingDirectLinkIsNotApplicable() {
        RouteReport unreachable = new RouteReport("s05", "gw", List.of(), 0, null, null, 0, 0, 0, null, null, "");
        // a route that does not exist has no latency (its record stores 0 hops × symbol time = 0)
        assertThat(TableText.latency(unreachable).text()).isEqualTo("—");
        assertThat(TableText.latency(unreachable).tooltip()).contains("gw cannot be reached from s05");
        assertThat(TableText.routeRate(unreachable).text()).isEqualTo("—");
        assertThat(TableText.direct(unreachable).tooltip()).contains("no direct link from s05 to gw");
        RouteReport two = new RouteReport("s01", "gw", List.of("s01", "relay-w", "gw"), 0.1332, "relay-w", "gw",
                0.133, 0.4433, 0.6, 0.0123, Impairment.CROSSTALK, "");
        // 2 hops × 0.3 s symbol time (RouteReport's Javadoc: latency = hops × symbol time)
        assertThat(TableText.latency(two)).isEqualTo(TableText.Cell.of("0.6"));
        assertThat(TableText.direct(two)).isEqualTo(TableText.Cell.of("0.0123"));
    }
}
