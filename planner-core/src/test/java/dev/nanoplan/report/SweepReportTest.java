package dev.nanoplan.report;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.nanoplan.design.SweepPoint;
import dev.nanoplan.design.SweepResult;
import java.util.List;
import org.junit.jupiter.api.Test;

/** The sweep's JSON keys and CSV rows as the command-line contract lists them (issue text, verbatim). */
class SweepReportTest {

    private static SweepResult result() {
        return SweepResult.of(List.of("signalling.symbol_time_s", "nodes[relay-w].molecules_per_symbol"), List.of(
                new SweepPoint(List.of(0.5, 10000.0), 0, 0.0, 0.0, 8800, null),
                new SweepPoint(List.of(1.0, 30000.0), 2, 0.25, 0.5, 5400, 2.0)));
    }

    @Test
    void jsonHasExactlyTheListedKeys() {
        ObjectNode j = SweepReport.json(result());
        assertThat(j.fieldNames()).toIterable().containsExactly("fields", "points");
        assertThat(j.get("fields").get(1).asText()).isEqualTo("nodes[relay-w].molecules_per_symbol");
        JsonNode p = j.get("points").get(1);
        assertThat(p.fieldNames()).toIterable().containsExactly("values", "demands_meeting_targets",
                "min_shared_rate_bits_per_s", "min_end_to_end_capacity_bits", "molecules_per_s", "max_latency_s",
                "pareto");
        assertThat(p.get("values").get("signalling.symbol_time_s").asDouble()).isEqualTo(1.0);
        assertThat(p.get("pareto").asBoolean()).isTrue();
        // the first point: fewer demands, lower rate and more molecules: dominated; no route: latency null
        assertThat(j.get("points").get(0).get("pareto").asBoolean()).isFalse();
        assertThat(j.get("points").get(0).get("max_latency_s").isNull()).isTrue();
    }

    @Test
    void csvHasOneRowPerPointAndHtmlOnePlotPerFieldAndMetricPlusTheFront() {
        String csv = SweepReport.csv(result());
        assertThat(csv.split("\n")).hasSize(3);
        assertThat(csv.split("\n")[2]).isEqualTo("1.0,30000.0,2,0.25,0.5,5400.0,2.0,true");
        String html = SweepReport.html("demo", result());
        // 2 fields × 4 metrics + the Pareto front
        assertThat(html.split("<svg", -1)).hasSize(2 * 4 + 1 + 1);
        assertThat(html).contains(PlanHtml.CSS);
    }
}
