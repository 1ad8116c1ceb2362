package dev.nanoplan.plan;

import dev.nanoplan.scenario.Node;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;

/**
 * Rates of the demands when their routes share emitters: the max-min fair time-share of every
 * emitter's symbol slots, by progressive filling (D. Bertsekas and R. Gallager, <i>Data Networks</i>,
 * 2nd ed., 1992, §6.5.2).
 *
 * <p><b>Relay model: symbol forwarding.</b> A relay decodes each symbol it hears and re-emits it in
 * one of its own slots, the model of the routes' decode-and-forward cascade ({@link RouteReport}). An
 * emitter has one symbol slot per frame of K slots of its species (K = 1 under all-active), that is
 * 1/(K_e·T) slots per second. A demand f alone on its route delivers r_f = c_f/(K_f·T) bit/s
 * ({@link RouteReport#rateBitsPerS()}), where c_f is its cascade information per forwarded symbol and
 * K_f the longest frame on the route. Sharing, demand f gets a fraction s_{f,e} of the slots of every
 * emitter e on its route; delivering x_f bit/s takes x_f/c_f symbols per second through each of them,
 * so s_{f,e} = x_f·K_e/(K_f·r_f) (= x_f/r_f under all-active) and each emitter's slots bound
 * Σ_{f through e} x_f·K_e/(K_f·r_f) ≤ 1. With one shared emitter and all-active, every demand through
 * it gets 1/Σ_f (1/r_f) bit/s when that emitter is the only bottleneck. Receivers are not a shared
 * resource here: every incoming link is a separate emitter's stream, already evaluated with the others
 * as crosstalk.
 *
 * <p><b>Algorithm.</b> All unfrozen demands' rates grow at the same pace until an emitter's slots are
 * used up; the demands through it freeze; repeat. The result is the unique max-min fair allocation:
 * a feasible allocation in which every demand has a bottleneck (a saturated emitter on its route
 * where no demand is faster) is max-min fair (Bertsekas and Gallager 1992, §6.5.2; the argument holds
 * for any positive weights in the resource constraints, as here). Cost O(F·(F + E)·H) for F demands,
 * E emitters and H hops per route.
 */
public final class SharedRates {

    /** Relative slack under which a resource counts as used up. */
    private static final double SATURATED = 1e-12;

    /**
     * The shared rate of one demand.
     *
     * @param rateBitsPerS shared rate, bit/s (0 when unreachable)
     * @param limitedAt    the emitter whose slots are used up, or null when the demand gets the rate it
     *                     would have alone (or is unreachable)
     * @param sharedWith   how many demands' routes pass through {@code limitedAt} (1 when none)
     */
    public record Share(double rateBitsPerS, String limitedAt, int sharedWith) {
    }

    private SharedRates() {
    }

    /** One share per route of the plan, in the plan's order. */
    public static List<Share> of(Plan plan) {
        SlotSchedule slots = SlotSchedule.of(plan.scenario());
        Map<String, Node> nodes = plan.scenario().nodesById();
        Map<String, Integer> emitterIndex = new LinkedHashMap<>();
        List<RouteReport> routes = plan.routes();
        int[][] uses = new int[routes.size()][];
        double[][] slotsPerBit = new double[routes.size()][];
        for (int f = 0; f < routes.size(); f++) {
            RouteReport r = routes.get(f);
            List<String> hops = r.hops();
            boolean flows = r.reachable() && r.rateBitsPerS() > 0;
            int n = flows ? hops.size() - 1 : 0;
            uses[f] = new int[n];
            slotsPerBit[f] = new double[n];
            int longest = 1;
            for (int h = 0; h < n; h++) {
                longest = Math.max(longest, frame(slots, nodes, hops.get(h)));
            }
            for (int h = 0; h < n; h++) {
                uses[f][h] = emitterIndex.computeIfAbsent(hops.get(h), k -> emitterIndex.size());
                slotsPerBit[f][h] = frame(slots, nodes, hops.get(h)) / (longest * r.rateBitsPerS());
            }
        }
        double[] capacity = new double[emitterIndex.size()];
        Arrays.fill(capacity, 1.0);
        int[] limit = new int[routes.size()];
        double[] rates = maxMinFair(slotsPerBit, uses, capacity, limit);
        String[] names = emitterIndex.keySet().toArray(new String[0]);
        int[] count = new int[capacity.length];
        for (int[] u : uses) {
            for (int e : u) {
                count[e]++;
            }
        }
        List<Share> out = new ArrayList<>(routes.size());
        for (int f = 0; f < routes.size(); f++) {
            int e = limit[f];
            // a demand that gets its alone rate is limited by its own route, not by sharing (the rate is then
            // the route's own, without the rounding of 1/(1/r))
            double own = routes.get(f).rateBitsPerS();
            boolean alone = e < 0 || rates[f] >= own * (1 - 1e-9);
            out.add(alone ? new Share(e < 0 ? rates[f] : own, null, 1) : new Share(rates[f], names[e], count[e]));
        }
        return out;
    }

    private static int frame(SlotSchedule slots, Map<String, Node> nodes, String emitter) {
        Node n = nodes.get(emitter);
        return n == null ? 1 : slots.frameSlots(n.emitsSpecies());
    }

    /**
     * One warning per emitter whose shared slots leave some demand through it below the scenario's
     * {@code targets.min_rate_bits_per_s} although the demand alone would meet it, with what to do.
     * Empty when the target is 0.
     */
    public static List<String> warnings(Plan plan) {
        double target = plan.scenario().targets().minRateBitsPerS();
        List<String> out = new ArrayList<>();
        if (!(target > 0)) {
            return out;
        }
        List<Share> shares = of(plan);
        Map<String, List<String>> starved = new LinkedHashMap<>();
        Map<String, Share> byEmitter = new HashMap<>();
        for (int i = 0; i < shares.size(); i++) {
            Share sh = shares.get(i);
            RouteReport r = plan.routes().get(i);
            if (sh.limitedAt() != null && sh.rateBitsPerS() < target && r.rateBitsPerS() >= target) {
                starved.computeIfAbsent(sh.limitedAt(), k -> new ArrayList<>()).add(r.from() + " -> " + r.to());
                byEmitter.put(sh.limitedAt(), sh);
            }
        }
        starved.forEach((emitter, demands) -> {
            Share sh = byEmitter.get(emitter);
            out.add(String.format(Locale.ROOT, "%s's slots carry %d demands: %s get %.3g bit/s each when they "
                    + "time-share them, below the target %.3g bit/s they would meet alone; spread them over more "
                    + "relays or species", emitter, sh.sharedWith(), String.join(", ", demands),
                    sh.rateBitsPerS(), target));
        });
        return out;
    }

    /**
     * Progressive filling with weighted resources: max-min fair x subject to
     * Σ_{f uses e} weight[f][h]·x_f ≤ capacity[e] for every resource e (h the position of e in
     * {@code uses[f]}).
     *
     * @param weight    per flow and use, the resource consumed per unit of rate, &gt; 0 and finite
     * @param uses      the resources each flow passes through (each at most once); a flow with none
     *                  gets 0
     * @param capacity  each resource's capacity, ≥ 0
     * @param limitedBy out: per flow the resource that froze it, or −1 when it has no resource
     * @return the max-min fair rates
     * @throws IllegalArgumentException if a weight is not positive and finite
     */
    static double[] maxMinFair(double[][] weight, int[][] uses, double[] capacity, int[] limitedBy) {
        int flows = uses.length;
        double[] rate = new double[flows];
        boolean[] frozen = new boolean[flows];
        double[] load = new double[capacity.length];
        Arrays.fill(limitedBy, -1);
        for (int f = 0; f < flows; f++) {
            frozen[f] = uses[f].length == 0;
            for (double w : weight[f]) {
                if (!(w > 0 && w < Double.POSITIVE_INFINITY)) {
                    throw new IllegalArgumentException("weight of flow " + f + ": must be > 0 and finite, got " + w);
                }
            }
        }
        double[] active = new double[capacity.length];
        while (true) {
            Arrays.fill(active, 0);
            boolean open = false;
            for (int f = 0; f < flows; f++) {
                if (!frozen[f]) {
                    open = true;
                    for (int h = 0; h < uses[f].length; h++) {
                        active[uses[f][h]] += weight[f][h];
                    }
                }
            }
            if (!open) {
                return rate;
            }
            double step = Double.POSITIVE_INFINITY;
            for (int e = 0; e < capacity.length; e++) {
                if (active[e] > 0) {
                    step = Math.min(step, Math.max(0, capacity[e] - load[e]) / active[e]);
                }
            }
            for (int f = 0; f < flows; f++) {
                if (!frozen[f]) {
                    rate[f] += step;
                }
            }
            for (int e = 0; e < capacity.length; e++) {
                load[e] += step * active[e];
            }
            boolean froze = false;
            for (int f = 0; f < flows; f++) {
                if (frozen[f]) {
                    continue;
                }
                for (int e : uses[f]) {
                    if (load[e] >= capacity[e] * (1 - SATURATED)) {
                        frozen[f] = true;
                        limitedBy[f] = e;
                        froze = true;
                        break;
                    }
                }
            }
            if (!froze) {
                throw new IllegalStateException("progressive filling made no progress");
            }
        }
    }
}
