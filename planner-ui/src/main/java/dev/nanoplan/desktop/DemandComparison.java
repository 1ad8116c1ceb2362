package dev.nanoplan.desktop;

import dev.nanoplan.plan.Plan;
import dev.nanoplan.plan.RouteReport;
import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.Scenario;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;

/**
 * One demand in two designs: a kept one (the baseline) and the current one. Values of a design
 * that lacks the demand, or where it is unreachable, are NaN.
 *
 * <p>Molecules per bit of a route = Σ over its emitting hops of (mean molecules released per
 * symbol) ÷ end-to-end capacity in bits per symbol, where the mean release per symbol is
 * prior_one × molecules_per_symbol for two levels and half the top level for more (evenly spaced
 * levels, uniform inputs). Plain bookkeeping over the plan's numbers; no model is evaluated here.
 *
 * @param from               demand source
 * @param to                 demand destination
 * @param baselineCapacity   end-to-end bits per symbol in the kept design
 * @param capacity           end-to-end bits per symbol now
 * @param baselineRate       bit/s in the kept design
 * @param rate               bit/s now
 * @param baselineMolPerBit  molecules per bit in the kept design
 * @param molPerBit          molecules per bit now
 */
public record DemandComparison(String from, String to, double baselineCapacity, double capacity,
        double baselineRate, double rate, double baselineMolPerBit, double molPerBit) {

    /** Rows for every demand of the current plan (or of the baseline when there is no current plan). */
    public static List<DemandComparison> of(Plan baseline, Plan current) {
        List<DemandComparison> rows = new ArrayList<>();
        if (baseline == null || current == null) {
            return rows;
        }
        for (RouteReport r : current.routes()) {
            RouteReport b = baseline.routes().stream().filter(x -> x.from().equals(r.from()) && x.to().equals(r.to()))
                    .findFirst().orElse(null);
            rows.add(new DemandComparison(r.from(), r.to(),
                    b == null ? Double.NaN : capacity(b), capacity(r),
                    b == null ? Double.NaN : rate(b), rate(r),
                    b == null ? Double.NaN : moleculesPerBit(baseline.scenario(), b),
                    moleculesPerBit(current.scenario(), r)));
        }
        return rows;
    }

    private static double capacity(RouteReport r) {
        return r.reachable() ? r.endToEndCapacityBits() : Double.NaN;
    }

    private static double rate(RouteReport r) {
        return r.reachable() ? r.rateBitsPerS() : Double.NaN;
    }

    /** Molecules released per delivered bit along the route (see the class comment). */
    static double moleculesPerBit(Scenario s, RouteReport r) {
        if (!r.reachable() || !(r.endToEndCapacityBits() > 0)) {
            return Double.NaN;
        }
        Map<String, Node> byId = s.nodesById();
        double share = s.signalling().levels() == 2 ? s.signalling().priorOne() : 0.5;
        double perSymbol = 0;
        for (int i = 0; i + 1 < r.hops().size(); i++) {
            Node n = byId.get(r.hops().get(i));
            if (n != null) {
                perSymbol += share * n.moleculesPerSymbol();
            }
        }
        return perSymbol / r.endToEndCapacityBits();
    }
}
