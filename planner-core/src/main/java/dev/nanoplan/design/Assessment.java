package dev.nanoplan.design;

import dev.nanoplan.plan.LinkKey;
import dev.nanoplan.plan.LinkReport;
import dev.nanoplan.plan.Plan;
import dev.nanoplan.plan.RouteReport;
import dev.nanoplan.plan.SharedRates;
import dev.nanoplan.plan.SlotSchedule;
import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.Signalling;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

/**
 * How a planned layout stands against its targets: the {@link Objective} and each demand's outcome.
 *
 * <p><b>Meeting the targets.</b> A demand meets them when it has a route, every hop of the route has a
 * minimum error probability over decision thresholds (the plan's {@code min_error_probability}, with the
 * scenario's count model: exact by default) at most {@code targets.max_error_probability} (the criterion
 * the molecule budgets size each hop for), and its max-min fair shared rate ({@link SharedRates}) is at
 * least {@code targets.min_rate_bits_per_s}.
 *
 * <p><b>Molecules per second.</b> Each emitting node releases one symbol per frame of K slots of its
 * species (K = 1 under all-active) whatever it carries: mean molecules per symbol ÷ (K·T), the mean
 * being q·N for binary signalling at prior q of "1", and N/2 for M &gt; 2 evenly spaced levels sent with
 * equal probability (the reading of the plan's budgets).
 *
 * @param objective the lexicographic objective
 * @param demands   one outcome per demand, in the scenario's order
 */
public record Assessment(Objective objective, List<DemandOutcome> demands) {

    public Assessment {
        demands = List.copyOf(demands);
    }

    /**
     * One demand.
     *
     * @param from                demand source
     * @param to                  demand destination
     * @param meetsTargets        both targets met (class comment)
     * @param sharedRateBitsPerS  max-min fair shared rate, bit/s (0 when unreachable)
     */
    public record DemandOutcome(String from, String to, boolean meetsTargets, double sharedRateBitsPerS) {
    }

    /** The assessment of {@code plan} (any plan: budgets and advice are not read). */
    public static Assessment of(Plan plan) {
        Scenario s = plan.scenario();
        double target = s.targets().maxErrorProbability();
        double minRate = s.targets().minRateBitsPerS();
        Map<LinkKey, LinkReport> links = new HashMap<>();
        for (LinkReport l : plan.links()) {
            links.put(new LinkKey(l.from(), l.to()), l);
        }
        List<SharedRates.Share> shares = SharedRates.of(plan);
        List<DemandOutcome> out = new ArrayList<>();
        int meeting = 0;
        double smallest = Double.POSITIVE_INFINITY;
        for (int i = 0; i < plan.routes().size(); i++) {
            RouteReport r = plan.routes().get(i);
            double rate = r.reachable() ? shares.get(i).rateBitsPerS() : 0;
            boolean meets = r.reachable() && rate >= minRate && hopsMeet(r.hops(), links, target);
            meeting += meets ? 1 : 0;
            smallest = Math.min(smallest, rate);
            out.add(new DemandOutcome(r.from(), r.to(), meets, rate));
        }
        double small = Double.isInfinite(smallest) ? 0 : smallest;
        return new Assessment(new Objective(meeting, small, moleculesPerS(s)), out);
    }

    private static boolean hopsMeet(List<String> hops, Map<LinkKey, LinkReport> links, double target) {
        for (int h = 0; h + 1 < hops.size(); h++) {
            LinkReport l = links.get(new LinkKey(hops.get(h), hops.get(h + 1)));
            if (l == null || !(l.minErrorProbability() <= target)) {
                return false;
            }
        }
        return true;
    }

    /** Molecules per second of all emitting nodes (class comment). */
    static double moleculesPerS(Scenario s) {
        Signalling sig = s.signalling();
        SlotSchedule slots = SlotSchedule.of(s);
        double meanFraction = sig.levels() == 2 ? sig.priorOne() : 0.5;
        double total = 0;
        for (Node n : s.nodes()) {
            if (n.role().emits()) {
                total += meanFraction * n.moleculesPerSymbol() / (slots.frameSlots(n.emitsSpecies()) * sig.symbolTimeS());
            }
        }
        return total;
    }
}
