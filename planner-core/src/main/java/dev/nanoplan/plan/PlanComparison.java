package dev.nanoplan.plan;

import dev.nanoplan.scenario.Schedule;
import dev.nanoplan.scenario.Signalling;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.HashSet;
import java.util.IdentityHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;

/**
 * Side-by-side comparison of two plans, demand by demand (matched by from/to).
 *
 * <p>Molecules per delivered bit of a route = Σ over its hops' emitters of their mean molecules per
 * symbol (the levels' molecules weighted by the input prior: the file's {@code prior_one} for two
 * levels, uniform for more, as in the budgets' release rates) ÷ end-to-end bits per symbol; +∞ when
 * nothing is delivered. The rate is the demand's share when routes share emitters ({@link SharedRates},
 * max-min fair), the figure the plan's routes table shows.
 *
 * @param nameA first plan's scenario name
 * @param nameB second plan's scenario name
 * @param rows  one per demand present in either plan (A's order, then B-only demands)
 */
public record PlanComparison(String nameA, String nameB, List<Row> rows) {

    /**
     * One demand in both plans; a side is null when that plan lacks the demand.
     *
     * @param from demand source
     * @param to   demand destination
     * @param a    the demand in plan A, or null
     * @param b    the demand in plan B, or null
     */
    public record Row(String from, String to, Side a, Side b) {
    }

    /**
     * One plan's figures for a demand.
     *
     * @param capacityBits          end-to-end bits per symbol (0 when unreachable)
     * @param rateBitsPerS          end-to-end rate shared with the other demands ({@link SharedRates})
     * @param latencyS              hops × T (0 when unreachable)
     * @param hops                  number of hops (0 when unreachable)
     * @param moleculesPerBit       molecules released along the route per delivered bit
     * @param bottleneck            "from->to" of the weakest hop, or null
     * @param bottleneckLimitedBy   its impairment, or null
     */
    public record Side(double capacityBits, double rateBitsPerS, double latencyS, int hops, double moleculesPerBit,
            String bottleneck, Impairment bottleneckLimitedBy) {
    }

    public PlanComparison {
        rows = List.copyOf(rows);
    }

    /** Compares two plans. */
    public static PlanComparison of(Plan a, Plan b) {
        Map<LinkKey, RouteReport> inB = new HashMap<>();
        b.routes().forEach(r -> inB.put(new LinkKey(r.from(), r.to()), r));
        Map<RouteReport, Double> sharedA = shared(a);
        Map<RouteReport, Double> sharedB = shared(b);
        List<Row> rows = new ArrayList<>();
        Set<LinkKey> seen = new HashSet<>();
        for (RouteReport r : a.routes()) {
            LinkKey k = new LinkKey(r.from(), r.to());
            if (seen.add(k)) {
                RouteReport rb = inB.get(k);
                rows.add(new Row(r.from(), r.to(), side(a, r, sharedA.get(r)), rb == null ? null
                        : side(b, rb, sharedB.get(rb))));
            }
        }
        for (RouteReport r : b.routes()) {
            if (seen.add(new LinkKey(r.from(), r.to()))) {
                rows.add(new Row(r.from(), r.to(), null, side(b, r, sharedB.get(r))));
            }
        }
        return new PlanComparison(label(a), label(b), rows);
    }

    /** The scenario's name, followed by its schedule when that is not all-active (rates differ in kind). */
    static String label(Plan p) {
        var schedule = p.scenario().signalling().schedule();
        return schedule == Schedule.ALL_ACTIVE ? p.scenario().name()
                : p.scenario().name() + " [schedule " + schedule.id() + "]";
    }

    /** The shared rate of every route of {@code p}, by identity of the route. */
    private static Map<RouteReport, Double> shared(Plan p) {
        Map<RouteReport, Double> out = new IdentityHashMap<>();
        List<SharedRates.Share> shares = SharedRates.of(p);
        for (int i = 0; i < p.routes().size(); i++) {
            out.put(p.routes().get(i), shares.get(i).rateBitsPerS());
        }
        return out;
    }

    static Side side(Plan p, RouteReport r, double sharedRateBitsPerS) {
        if (!r.reachable()) {
            return new Side(0, 0, 0, 0, Double.POSITIVE_INFINITY, null, null);
        }
        var nodes = p.scenario().nodesById();
        Signalling sig = p.scenario().signalling();
        double[] w = LinkContext.weights(sig);
        double molecules = 0;
        for (int i = 0; i + 1 < r.hops().size(); i++) {
            molecules += MoleculeBudgets.meanMolecules(sig, w, nodes.get(r.hops().get(i)).moleculesPerSymbol());
        }
        double perBit = r.endToEndCapacityBits() > 0 ? molecules / r.endToEndCapacityBits() : Double.POSITIVE_INFINITY;
        return new Side(r.endToEndCapacityBits(), sharedRateBitsPerS, r.latencyS(), r.hops().size() - 1, perBit,
                r.bottleneckFrom() + "->" + r.bottleneckTo(), r.bottleneckLimitedBy());
    }

    /** Plain-text table, one line per demand and plan. */
    public String toText() {
        StringBuilder sb = new StringBuilder();
        sb.append("A: ").append(nameA).append('\n').append("B: ").append(nameB).append('\n');
        sb.append("(bit/s: the demand's fair share when routes share emitters; mol/bit: mean molecules released"
                + " along the route per delivered bit, levels weighted by the input prior)\n");
        sb.append(String.format(Locale.ROOT, "%-24s %-4s %10s %10s %9s %5s %12s %s%n", "demand", "plan", "bit/sym",
                "bit/s", "latency s", "hops", "mol/bit", "bottleneck"));
        for (Row r : rows) {
            line(sb, r.from() + " -> " + r.to(), "A", r.a());
            line(sb, "", "B", r.b());
        }
        return sb.toString();
    }

    private static void line(StringBuilder sb, String demand, String plan, Side s) {
        if (s == null) {
            sb.append(String.format(Locale.ROOT, "%-24s %-4s %s%n", demand, plan, "(no such demand)"));
            return;
        }
        String perBit = Double.isFinite(s.moleculesPerBit()) ? String.format(Locale.ROOT, "%12.4g", s.moleculesPerBit())
                : String.format(Locale.ROOT, "%12s", "-");
        sb.append(String.format(Locale.ROOT, "%-24s %-4s %10.4f %10.4g %9.3g %5d %s %s%n", demand, plan,
                s.capacityBits(), s.rateBitsPerS(), s.latencyS(), s.hops(), perBit,
                s.bottleneck() == null ? "unreachable" : s.bottleneck() + " (" + s.bottleneckLimitedBy().id() + ")"));
    }
}
