package dev.nanoplan.plan;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.JsonNode;
import dev.nanoplan.report.PlanJson;
import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.Scenario;
import java.util.Iterator;
import java.util.List;
import java.util.Map;
import org.assertj.core.data.Percentage;
import org.junit.jupiter.api.Test;

/**
 * The plan JSON has no sentinel values: what is unknown or does not exist is null with its reason in
 * the sibling {@code null_reasons}; and {@code compare} uses shared rates and prior-weighted molecules.
 */
class NoSentinelsTest {

    @Test
    void everyNullOfEveryBundledPlanHasAReasonAndNoBudgetIsNegative() throws Exception {
        for (Map.Entry<String, Scenario> e : PlanGoldenTest.layouts().entrySet()) {
            if (e.getKey().startsWith("swarm-")) {
                continue; // the generated swarms are covered byte for byte by PlanGoldenTest; this keeps the test short
            }
            JsonNode plan = PlanJson.of(NetworkPlanner.plan(e.getValue(), PlanOptions.DEFAULT));
            for (String section : List.of("links", "routes", "budgets")) {
                for (JsonNode entry : plan.get(section)) {
                    JsonNode why = entry.get(PlanJson.NULL_REASONS);
                    assertThat(why).as(e.getKey() + " " + section).isNotNull();
                    for (Iterator<Map.Entry<String, JsonNode>> it = entry.fields(); it.hasNext();) {
                        Map.Entry<String, JsonNode> f = it.next();
                        if (f.getValue().isNull()) {
                            assertThat(why.path(f.getKey()).asText()).as(e.getKey() + " " + section + "." + f.getKey())
                                    .isNotBlank();
                        }
                        if (f.getKey().startsWith("molecules_per") && f.getValue().isNumber()) {
                            // a molecule count or rate is never negative (no −1 for "unknown")
                            assertThat(f.getValue().asDouble()).as(e.getKey() + " " + f.getKey()).isNotNegative();
                        }
                    }
                }
            }
        }
    }

    @Test
    void compareUsesTheSharedRateAndThePriorWeightedMolecules() throws Exception {
        Scenario tank = PlanGoldenTest.layouts().get("culture-tank");
        Plan p = NetworkPlanner.plan(tank, PlanOptions.DEFAULT);
        PlanComparison c = PlanComparison.of(p, p);
        List<SharedRates.Share> shares = SharedRates.of(p);
        Map<String, Node> nodes = tank.nodesById();
        double q = tank.signalling().priorOne();
        for (int i = 0; i < p.routes().size(); i++) {
            RouteReport r = p.routes().get(i);
            PlanComparison.Side side = c.rows().get(i).a();
            assertThat(side.rateBitsPerS()).isEqualTo(shares.get(i).rateBitsPerS());
            if (!r.reachable()) {
                continue;
            }
            // on–off keying sends N for a 1 (probability q) and 0 for a 0: mean q·N per symbol per emitter
            double molecules = 0;
            for (int h = 0; h + 1 < r.hops().size(); h++) {
                molecules += q * nodes.get(r.hops().get(h)).moleculesPerSymbol();
            }
            assertThat(side.moleculesPerBit()).isCloseTo(molecules / r.endToEndCapacityBits(),
                    Percentage.withPercentage(1e-9));
        }
    }
}
