package dev.nanoplan.report;

import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.nanoplan.plan.PlanComparison;

/** The {@code compare --json} object: per demand, both plans' figures side by side. */
public final class ComparisonJson {

    private ComparisonJson() {
    }

    public static ObjectNode of(PlanComparison c) {
        ObjectNode o = LinkJson.MAPPER.createObjectNode();
        o.put("plan_a", c.nameA());
        o.put("plan_b", c.nameB());
        ArrayNode rows = o.putArray("demands");
        for (PlanComparison.Row r : c.rows()) {
            ObjectNode row = rows.addObject();
            row.put("from", r.from());
            row.put("to", r.to());
            side(row, "a", r.a());
            side(row, "b", r.b());
        }
        o.put("caution", Cautions.SHORT);
        return o;
    }

    private static void side(ObjectNode row, String key, PlanComparison.Side s) {
        if (s == null) {
            row.putNull(key);
            return;
        }
        ObjectNode o = row.putObject(key);
        num(o, "capacity_bits", s.capacityBits());
        num(o, "rate_bits_per_s", s.rateBitsPerS());
        num(o, "latency_s", s.latencyS());
        o.put("hops", s.hops());
        num(o, "molecules_per_bit", s.moleculesPerBit());
        if (!Double.isFinite(s.moleculesPerBit())) {
            o.putObject("null_reasons").put("molecules_per_bit", "nothing is delivered (unreachable or 0 bit/symbol)");
        }
        if (s.bottleneck() == null) {
            o.putNull("bottleneck");
        } else {
            o.put("bottleneck", s.bottleneck());
        }
        if (s.bottleneckLimitedBy() == null) {
            o.putNull("limited_by");
        } else {
            o.put("limited_by", s.bottleneckLimitedBy().id());
        }
    }

    private static void num(ObjectNode o, String k, double v) {
        if (Double.isFinite(v)) {
            o.put(k, v);
        } else {
            o.putNull(k);
        }
    }
}
