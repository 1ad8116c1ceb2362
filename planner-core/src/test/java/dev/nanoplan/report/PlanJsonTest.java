package dev.nanoplan.report;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.JsonNodeType;
import dev.nanoplan.plan.Plan;
import java.util.Map;
import org.junit.jupiter.api.Test;

class PlanJsonTest {

    private static final Plan PLAN = PlanFixtures.demo("s3");

    private static JsonNode parsed() throws Exception {
        // A default ObjectMapper rejects NaN/Infinity tokens, as RFC 8259 §6 (T. Bray, 2017) requires
        return new ObjectMapper().readTree(PlanJson.of(PLAN).toString());
    }

    private static void assertKeys(JsonNode o, Map<String, JsonNodeType> keys) {
        keys.forEach((k, type) -> {
            assertThat(o.has(k)).as("key %s in %s", k, o).isTrue();
            if (!o.get(k).isNull()) {
                assertThat(o.get(k).getNodeType()).as(k).isEqualTo(type);
            }
        });
    }

    @Test
    void linksCarryEveryContractKeyWithItsType() throws Exception {
        JsonNode links = parsed().get("links");
        assertThat(links.size()).isEqualTo(4);
        for (JsonNode l : links) {
            // key list and types: docs/architecture.md §4.3, plan --json, links
            assertKeys(l, Map.ofEntries(Map.entry("from", JsonNodeType.STRING), Map.entry("to", JsonNodeType.STRING),
                    Map.entry("species", JsonNodeType.STRING), Map.entry("hit_probability", JsonNodeType.NUMBER),
                    Map.entry("taps", JsonNodeType.ARRAY), Map.entry("signal_mean", JsonNodeType.NUMBER),
                    Map.entry("interference_mean", JsonNodeType.NUMBER), Map.entry("threshold", JsonNodeType.NUMBER),
                    Map.entry("error_probability", JsonNodeType.NUMBER),
                    Map.entry("capacity_bits", JsonNodeType.NUMBER), Map.entry("rate_bits_per_s", JsonNodeType.NUMBER),
                    Map.entry("limited_by", JsonNodeType.STRING), Map.entry("top_interferer", JsonNodeType.STRING),
                    Map.entry("log10_error_probability", JsonNodeType.NUMBER)));
            assertThat(l.get("threshold").isIntegralNumber()).isTrue();
            assertThat(l.get("limited_by").asText()).isIn("signal", "isi", "crosstalk", "noise");
            assertThat(l.get("taps").size()).isEqualTo(4);
        }
        JsonNode first = links.get(0);
        assertThat(first.get("from").asText()).isEqualTo("s1");
        assertThat(first.get("capacity_bits").asDouble()).isEqualTo(0.82);
        assertThat(first.get("limited_by").asText()).isEqualTo("isi");
        // an error probability that underflowed keeps a finite log10
        assertThat(links.get(2).get("error_probability").asDouble()).isZero();
        assertThat(links.get(2).get("log10_error_probability").asDouble()).isEqualTo(-412.5);
    }

    @Test
    void routesCarryEveryContractKeyAndNullsWhereAbsent() throws Exception {
        JsonNode routes = parsed().get("routes");
        assertThat(routes.size()).isEqualTo(4);
        for (JsonNode r : routes) {
            // key list and types: docs/architecture.md §4.3, plan --json, routes
            assertKeys(r, Map.of("from", JsonNodeType.STRING, "to", JsonNodeType.STRING, "hops", JsonNodeType.ARRAY,
                    "bottleneck_capacity_bits", JsonNodeType.NUMBER, "bottleneck_link", JsonNodeType.OBJECT,
                    "end_to_end_capacity_bits", JsonNodeType.NUMBER, "rate_bits_per_s", JsonNodeType.NUMBER,
                    "latency_s", JsonNodeType.NUMBER, "direct_capacity_bits", JsonNodeType.NUMBER));
        }
        JsonNode r0 = routes.get(0);
        assertThat(r0.get("hops").toString()).isEqualTo("[\"s1\",\"relay\",\"gw\"]");
        assertThat(r0.get("bottleneck_link").get("from").asText()).isEqualTo("s1");
        assertThat(r0.get("bottleneck_link").get("to").asText()).isEqualTo("relay");
        // docs/architecture.md §4.3: direct_capacity_bits is null when there is no direct link
        assertThat(r0.get("direct_capacity_bits").isNull()).isTrue();
        assertThat(routes.get(2).get("direct_capacity_bits").asDouble()).isEqualTo(0.12);
        JsonNode unreachable = routes.get(3);
        assertThat(unreachable.get("hops").size()).isZero();
        assertThat(unreachable.get("bottleneck_link").isNull()).isTrue();
        assertThat(unreachable.get("reachable").asBoolean()).isFalse();
        // derived by hand (max-min fair time-share of the relay's slots, Bertsekas and Gallager, Data Networks,
        // 1992, §6.5.2): s1 (alone 0.80 bit/s) and s2 (alone 0.53 bit/s) both pass the relay; x/0.80 + x/0.53 = 1
        // gives x = 0.80·0.53/1.33 = 0.318797 bit/s each
        for (int i = 0; i < 2; i++) {
            assertThat(routes.get(i).get("shared_rate_bits_per_s").asDouble()).isCloseTo(0.424 / 1.33, within(1e-12));
            assertThat(routes.get(i).get("shared_at").asText()).isEqualTo("relay");
            assertThat(routes.get(i).get("shared_with").asInt()).isEqualTo(2);
        }
        // alone on its emitter: its own route rate
        assertThat(routes.get(2).get("shared_rate_bits_per_s").asDouble()).isEqualTo(0.12);
        assertThat(routes.get(2).get("shared_at").isNull()).isTrue();
        assertThat(unreachable.get("shared_rate_bits_per_s").asDouble()).isZero();
    }

    @Test
    void budgetsAndTopLevelKeys() throws Exception {
        JsonNode root = parsed();
        for (JsonNode b : root.get("budgets")) {
            // key list and types: docs/architecture.md §4.3, plan --json, budgets
            assertKeys(b, Map.of("node", JsonNodeType.STRING, "molecules_per_symbol_needed", JsonNodeType.NUMBER,
                    "molecules_per_s", JsonNodeType.NUMBER, "molecules_per_mission", JsonNodeType.NUMBER,
                    "feasible", JsonNodeType.BOOLEAN, "reason", JsonNodeType.STRING, "method", JsonNodeType.STRING,
                    "count_blind_target", JsonNodeType.BOOLEAN));
        }
        assertThat(root.get("budgets").get(0).get("molecules_per_symbol_needed").asLong()).isEqualTo(3100);
        JsonNode bad = root.get("budgets").get(2);
        assertThat(bad.get("molecules_per_symbol_needed").isNull()).isTrue();
        assertThat(bad.get("molecules_per_s").isNull()).isTrue();
        assertThat(bad.get("molecules_per_mission").isNull()).isTrue();
        assertThat(bad.get("feasible").asBoolean()).isFalse();

        assertThat(root.get("scenario").asText()).isEqualTo(PLAN.scenario().name());
        assertThat(root.get("channel").asText()).isEqualTo("analytic");
        assertThat(root.get("warnings").size()).isEqualTo(2);
        assertThat(root.get("assumptions").size()).isEqualTo(Cautions.ASSUMPTIONS.size());
        assertThat(root.get("caution").asText()).isEqualTo(Cautions.SHORT);
    }

    @Test
    void nonFiniteNumbersBecomeNull() throws Exception {
        var nan = PlanFixtures.link("a", "b", "A", Double.NaN, Double.NaN, null, null, Double.POSITIVE_INFINITY);
        String text = PlanJson.link(nan).toString();
        assertThat(text).doesNotContain("NaN").doesNotContain("Infinity");
        JsonNode j = new ObjectMapper().readTree(text);
        assertThat(j.get("capacity_bits").isNull()).isTrue();
        assertThat(j.get("error_probability").isNull()).isTrue();
        assertThat(j.get("limited_by").isNull()).isTrue();
        assertThat(j.get("top_interferer").isNull()).isTrue();
        assertThat(PlanJson.of(PLAN).toString()).doesNotContain("NaN").doesNotContain("Infinity");
    }
}
