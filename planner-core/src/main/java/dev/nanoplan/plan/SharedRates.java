package dev.nanoplan.plan;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * Rates of the demands when their routes share emitters: max-min fair allocation by progressive
 * filling (D. Bertsekas and R. Gallager, <i>Data Networks</i>, 2nd ed., 1992, §6.5.2).
 *
 * <p><b>Model.</b> Every emitting node sends one symbol stream; the flows it originates or
 * relays time-share that stream, and every next hop it serves must decode the whole stream, so
 * the flows through emitter X may together carry at most min over the route hops X → Y of the
 * link rate C(X→Y)/T bit/s. A flow is also never faster than its own route's decode-and-forward
 * rate ({@link RouteReport#rateBitsPerS()}). Receivers are not a shared resource here: every
 * incoming link is a separate emitter's stream, already evaluated with the others as crosstalk.
 *
 * <p><b>Algorithm.</b> All unfrozen flows grow at the same pace until a resource (an emitter's
 * stream, or a flow's own route rate) is used up; the flows held by it freeze; repeat. The
 * result is the unique max-min fair allocation: no flow can be raised without lowering a flow
 * that is no faster (Bertsekas and Gallager 1992, §6.5.2). Cost O(F·(F + E)·H) for F flows,
 * E emitters and H hops per route.
 */
public final class SharedRates {

    /** Relative slack under which a resource counts as used up. */
    private static final double SATURATED = 1e-12;

    /**
     * The shared rate of one demand.
     *
     * @param rateBitsPerS shared rate, bit/s (0 when unreachable)
     * @param limitedAt    the emitter whose stream is used up, or null when the route's own rate
     *                     (or unreachability) limits the demand
     * @param sharedWith   how many demands' routes pass through {@code limitedAt} (1 when none)
     */
    public record Share(double rateBitsPerS, String limitedAt, int sharedWith) {
    }

    private SharedRates() {
    }

    /** One share per route of the plan, in the plan's order. */
    public static List<Share> of(Plan plan) {
        Map<LinkKey, Double> linkRate = new HashMap<>();
        for (LinkReport l : plan.links()) {
            linkRate.put(LinkKey.of(l), l.rateBitsPerS());
        }
        Map<String, Integer> emitterIndex = new LinkedHashMap<>();
        List<Double> emitterCap = new ArrayList<>();
        List<RouteReport> routes = plan.routes();
        int[][] uses = new int[routes.size()][];
        double[] own = new double[routes.size()];
        for (int f = 0; f < routes.size(); f++) {
            RouteReport r = routes.get(f);
            List<String> hops = r.hops();
            own[f] = r.reachable() ? r.rateBitsPerS() : 0;
            uses[f] = new int[Math.max(0, hops.size() - 1)];
            for (int h = 0; h + 1 < hops.size(); h++) {
                Double c = linkRate.get(new LinkKey(hops.get(h), hops.get(h + 1)));
                if (c == null) {
                    throw new IllegalArgumentException("route " + r.from() + " -> " + r.to() + " uses hop "
                            + hops.get(h) + " -> " + hops.get(h + 1) + " that is not among the plan's links");
                }
                int e = emitterIndex.computeIfAbsent(hops.get(h), k -> {
                    emitterCap.add(Double.POSITIVE_INFINITY);
                    return emitterCap.size() - 1;
                });
                emitterCap.set(e, Math.min(emitterCap.get(e), c));
                uses[f][h] = e;
            }
        }
        double[] caps = emitterCap.stream().mapToDouble(Double::doubleValue).toArray();
        int[] limit = new int[routes.size()];
        double[] rates = maxMinFair(own, caps, uses, limit);
        String[] names = emitterIndex.keySet().toArray(new String[0]);
        int[] count = new int[caps.length];
        for (int[] u : uses) {
            for (int e : u) {
                count[e]++;
            }
        }
        List<Share> out = new ArrayList<>(routes.size());
        for (int f = 0; f < routes.size(); f++) {
            int e = limit[f];
            out.add(new Share(rates[f], e >= 0 ? names[e] : null, e >= 0 ? count[e] : 1));
        }
        return out;
    }

    /**
     * One warning per emitter whose shared stream leaves some demand through it below the scenario's
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
            out.add(String.format(java.util.Locale.ROOT, "%s's stream carries %d demands: %s get %.3g bit/s each when "
                    + "they share it, below the target %.3g bit/s they would meet alone; spread them over more relays "
                    + "or species", emitter, sh.sharedWith(), String.join(", ", demands),
                    sh.rateBitsPerS(), target));
        });
        return out;
    }

    /**
     * Progressive filling.
     *
     * @param flowCap     each flow's own ceiling, ≥ 0 (0 = the flow gets nothing)
     * @param resourceCap each shared resource's capacity, ≥ 0
     * @param uses        the resources each flow passes through (each at most once)
     * @param limitedBy   out: per flow the resource that froze it, or −1 when its own ceiling did
     * @return the max-min fair rates
     */
    static double[] maxMinFair(double[] flowCap, double[] resourceCap, int[][] uses, int[] limitedBy) {
        int flows = flowCap.length;
        double[] rate = new double[flows];
        boolean[] frozen = new boolean[flows];
        double[] load = new double[resourceCap.length];
        java.util.Arrays.fill(limitedBy, -1);
        for (int f = 0; f < flows; f++) {
            if (!(flowCap[f] > 0)) {
                frozen[f] = true;
            }
        }
        while (true) {
            int[] active = new int[resourceCap.length];
            int open = 0;
            for (int f = 0; f < flows; f++) {
                if (!frozen[f]) {
                    open++;
                    for (int e : uses[f]) {
                        active[e]++;
                    }
                }
            }
            if (open == 0) {
                return rate;
            }
            double step = Double.POSITIVE_INFINITY;
            for (int e = 0; e < resourceCap.length; e++) {
                if (active[e] > 0) {
                    step = Math.min(step, Math.max(0, resourceCap[e] - load[e]) / active[e]);
                }
            }
            for (int f = 0; f < flows; f++) {
                if (!frozen[f]) {
                    step = Math.min(step, flowCap[f] - rate[f]);
                }
            }
            for (int f = 0; f < flows; f++) {
                if (!frozen[f]) {
                    rate[f] += step;
                    for (int e : uses[f]) {
                        load[e] += step;
                    }
                }
            }
            boolean froze = false;
            for (int f = 0; f < flows; f++) {
                if (frozen[f]) {
                    continue;
                }
                if (rate[f] >= flowCap[f] * (1 - SATURATED)) {
                    rate[f] = Math.min(rate[f], flowCap[f]);
                    frozen[f] = true;
                    froze = true;
                    continue;
                }
                for (int e : uses[f]) {
                    if (load[e] >= resourceCap[e] * (1 - SATURATED)) {
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
