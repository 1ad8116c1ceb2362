package dev.nanoplan.design;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.nanoplan.plan.IncrementalPlanner;
import dev.nanoplan.plan.Plan;
import dev.nanoplan.plan.PlanOptions;
import dev.nanoplan.plan.RouteReport;
import dev.nanoplan.scenario.ScenarioReader;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;

/** Sweep points: grid order, and each point equal to planning the hand-edited file. */
class SweepPointsTest {

    private static String bundled(String name) throws Exception {
        Path dir = Path.of("").toAbsolutePath();
        while (!Files.isDirectory(dir.resolve("scenarios"))) {
            dir = dir.getParent();
        }
        return Files.readString(dir.resolve("scenarios/" + name));
    }

    @Test
    void theFirstFieldVariesSlowest() throws Exception {
        SweepPoints units = new SweepPoints(bundled("relay-chain-relayed.json"),
                List.of(SweepPath.parse("signalling.symbol_time_s"), SweepPath.parse("nodes[relay1].molecules_per_symbol")),
                List.of(List.of(4.0, 5.0), List.of(10000.0, 20000.0, 30000.0)));
        // expected order written out by hand (mixed radix, last field fastest)
        assertThat(units.count()).isEqualTo(6);
        assertThat(List.of(units.valuesAt(0), units.valuesAt(1), units.valuesAt(2), units.valuesAt(3), units.valuesAt(5)))
                .containsExactly(List.of(4.0, 10000.0), List.of(4.0, 20000.0), List.of(4.0, 30000.0),
                        List.of(5.0, 10000.0), List.of(5.0, 30000.0));
    }

    @Test
    void aPointIsThePlanOfTheEditedFile() throws Exception {
        String text = bundled("relay-chain-relayed.json");
        SweepPoints units = new SweepPoints(text, List.of(SweepPath.parse("signalling.symbol_time_s")),
                List.of(List.of(3.0, 6.0)));
        SweepPoint got = units.compute(1, () -> false);
        // oracle: the file edited by hand with Jackson, read and planned directly; figures taken from the plan
        ObjectNode tree = (ObjectNode) new ObjectMapper().readTree(text);
        ((ObjectNode) tree.get("signalling")).put("symbol_time_s", 6.0);
        Plan plan = IncrementalPlanner.exactWithoutBudgets(ScenarioReader.strict().parse(tree.toString()).scenario(),
                PlanOptions.DEFAULT).plan();
        Assessment a = Assessment.of(plan);
        assertThat(got.values()).containsExactly(6.0);
        assertThat(got.demandsMeetingTargets()).isEqualTo(a.objective().demandsMeetingTargets());
        assertThat(got.minSharedRateBitsPerS()).isEqualTo(a.objective().minSharedRateBitsPerS());
        assertThat(got.moleculesPerS()).isEqualTo(a.objective().moleculesPerS());
        double minE2e = plan.routes().stream().mapToDouble(r -> r.reachable() ? r.endToEndCapacityBits() : 0).min()
                .orElseThrow();
        assertThat(got.minEndToEndCapacityBits()).isEqualTo(minE2e);
        assertThat(got.maxLatencyS()).isEqualTo(plan.routes().stream().filter(RouteReport::reachable)
                .mapToDouble(RouteReport::latencyS).max().orElseThrow());
        // latency: hops × symbol time for an all-active schedule (the route model of docs/architecture.md)
        RouteReport r0 = plan.routes().get(0);
        assertThat(r0.latencyS()).isEqualTo((r0.hops().size() - 1) * 6.0);
    }

    @Test
    void aValueTheReaderRefusesNamesTheFieldAndValue() throws Exception {
        String text = bundled("relay-chain-relayed.json");
        assertThatThrownBy(() -> new SweepPoints(text, List.of(SweepPath.parse("signalling.symbol_time_s")),
                List.of(List.of(1.0, -2.0)))).isInstanceOf(IllegalArgumentException.class)
                .hasMessageStartingWith("signalling.symbol_time_s=-2.0: ")
                .satisfies(e -> assertThat(e.getMessage()).doesNotContain("\n"));
        assertThatThrownBy(() -> new SweepPoints(text, List.of(SweepPath.parse("nodes[nope].radius_um")),
                List.of(List.of(1.0)))).hasMessageStartingWith("nodes[nope].radius_um: no such field");
    }
}
