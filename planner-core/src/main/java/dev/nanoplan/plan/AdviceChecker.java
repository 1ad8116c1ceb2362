package dev.nanoplan.plan;

import dev.nanoplan.scenario.Scenario;
import java.util.ArrayList;
import java.util.Collections;
import java.util.Comparator;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.function.Function;
import java.util.stream.IntStream;

/**
 * Checks proposed advice by applying each change to the layout and re-planning it, and keeps only
 * the changes that help without hurting.
 *
 * <p><b>Effects.</b> Each distinct {@link ScenarioEdit} is applied once and the changed layout is
 * re-planned by the given function; for every demand the route before and after is compared:
 * reachable or not, end-to-end capacity C (bit/symbol) and rate R (bit/s). A rate counts as
 * changed when it moves by at least {@value #NOTICE_FRACTION} of the larger of the two values
 * (smaller moves are not stated).
 *
 * <p><b>Given or rejected.</b> A change proposed for demand r is given when
 * <ol>
 *   <li>it helps r: r stays reachable and its rate rises (by the notice fraction at least), and</li>
 *   <li>it does not hurt more than it helps: no other demand loses its route, no demand that met
 *       the rate target ({@code targets.min_rate_bits_per_s}, reachable and R ≥ target) stops
 *       meeting it, and the sum of the rates of all demands (unreachable ones count 0) does not
 *       fall.</li>
 * </ol>
 * A change whose layout is not valid (e.g. a moved node outside the volume or overlapping
 * another) is rejected with the validation message. A given line states the weakest hop's
 * capacity after the change, what the change does for r, and every other demand it raises,
 * lowers or cuts; when no change of a route is given the route says so and names the rejected
 * change that raised r most, with the reasons it was rejected.
 *
 * <p><b>Cost.</b> One re-plan per distinct change, at most {@link #maxReplans(int)} per plan:
 * {@value #MAX_REPLANS} for small layouts, fewer as the number of nodes grows so that re-plans ×
 * nodes stays within {@value #NODE_BUDGET} (none beyond that many nodes). The plan re-plans a change
 * incrementally ({@link IncrementalPlanner#whatIf}: only the receivers the change reaches are
 * re-evaluated, no budgets, no advice), which cost per re-plan, incremental against from scratch, on a
 * shared 2-core machine at load 12–15 ({@code AdviceCheckBench}): 65 against 95 ms for the 17-node
 * culture tank, 0.68 against 2.8 s for a generated 200-node swarm, 22 against 40 s for a generated
 * 1,000-node swarm (whose plan takes 70 s); the bound is twice the one for re-plans from scratch
 * (480), the smallest gain measured, so the check costs at most what it did then
 * (one re-plan per 960 nodes is about a third of the plan). Routes are served weakest first; a route whose
 * changes were not re-planned within the bound states its proposals as not checked.
 */
public final class AdviceChecker {

    /** Relative change of a demand's rate below which it counts as unchanged. */
    public static final double NOTICE_FRACTION = 0.005;
    /** Most re-plans per plan. */
    public static final int MAX_REPLANS = 24;
    /** Re-plans × nodes of the layout beyond which no more re-plans run. */
    public static final int NODE_BUDGET = 960;

    private AdviceChecker() {
    }

    /**
     * One demand before and after a change.
     *
     * @param from            demand source
     * @param to              demand destination
     * @param reachableBefore whether it had a route
     * @param reachableAfter  whether it has one after the change
     * @param bitsBefore      end-to-end capacity before, bit/symbol (0 when unreachable)
     * @param bitsAfter       after
     * @param rateBefore      rate before, bit/s (0 when unreachable)
     * @param rateAfter       after
     */
    public record Effect(String from, String to, boolean reachableBefore, boolean reachableAfter, double bitsBefore,
            double bitsAfter, double rateBefore, double rateAfter) {

        /** "from -> to". */
        public String name() {
            return from + " -> " + to;
        }

        /** Had a route and has none after. */
        public boolean lost() {
            return reachableBefore && !reachableAfter;
        }

        /** Has a route after, and had none or its rate rose noticeably. */
        public boolean raised() {
            return reachableAfter && (!reachableBefore || rateAfter - rateBefore >= NOTICE_FRACTION * rateAfter);
        }

        /** Kept its route and its rate fell noticeably. */
        public boolean lowered() {
            return reachableBefore && reachableAfter && rateBefore - rateAfter >= NOTICE_FRACTION * rateBefore;
        }

        /** Whether bit/s per bit/symbol changed (symbol time or frame), so rates must be stated too. */
        boolean rateFactorChanged() {
            return reachableBefore && reachableAfter && bitsBefore > 0 && bitsAfter > 0
                    && Math.abs(rateAfter / bitsAfter - rateBefore / bitsBefore) > 1e-9 * rateBefore / bitsBefore;
        }
    }

    /**
     * A change applied and re-planned once.
     *
     * @param edit       the change
     * @param invalid    why the changed layout is not valid, or null
     * @param effects    one per demand in the scenario's order (empty when invalid)
     * @param hopBits    capacity of each proposing route's hop after the change, bit/symbol; 0 when
     *                   the link fell below the floor
     */
    public record Outcome(ScenarioEdit edit, String invalid, List<Effect> effects, Map<LinkKey, Double> hopBits) {

        public Outcome {
            effects = List.copyOf(effects);
            hopBits = Map.copyOf(hopBits);
        }

        /** Sum of the demands' rates before, bit/s. */
        public double totalRateBefore() {
            return effects.stream().mapToDouble(Effect::rateBefore).sum();
        }

        /** Sum of the demands' rates after, bit/s. */
        public double totalRateAfter() {
            return effects.stream().mapToDouble(Effect::rateAfter).sum();
        }
    }

    /**
     * One proposal judged for one route.
     *
     * @param advice  the proposal
     * @param demand  index of the route's demand
     * @param outcome the re-plan with the change
     * @param given   whether it helps without hurting
     * @param reasons why it was rejected (empty when given)
     * @param text    the line: the change, then what it achieves and costs
     */
    public record Verdict(Advice advice, int demand, Outcome outcome, boolean given, List<String> reasons,
            String text) {

        public Verdict {
            reasons = List.copyOf(reasons);
        }

        /** Rate gain of the route, bit/s; −∞ when invalid or the route is lost. */
        double gain() {
            if (outcome.invalid() != null || !outcome.effects().get(demand).reachableAfter()) {
                return Double.NEGATIVE_INFINITY;
            }
            Effect e = outcome.effects().get(demand);
            return e.rateAfter() - e.rateBefore();
        }
    }

    /**
     * The checked advice of one route.
     *
     * @param given        changes that help without hurting, best first
     * @param bestRejected the rejected change that raised the route most, or null (named in the
 *                     text only when no change is given)
     * @param text         the route's advice line
     */
    public record RouteAdvice(List<Verdict> given, Verdict bestRejected, String text) {

        public RouteAdvice {
            given = List.copyOf(given);
        }
    }

    /**
     * The plan with checked advice.
     *
     * @param plan    the base plan with each route's advice replaced by the checked line
     * @param routes  per route, the checked advice, or null where the route had no proposal
     * @param replans how many re-plans ran (distinct changes checked)
     * @param skipped distinct changes not re-planned because of the bound
     */
    public record Result(Plan plan, List<RouteAdvice> routes, int replans, int skipped) {

        public Result {
            routes = Collections.unmodifiableList(new ArrayList<>(routes));
        }
    }

    /** The re-plan bound for a layout of {@code nodes} nodes: min(24, ⌊960 / nodes⌋). */
    public static int maxReplans(int nodes) {
        return Math.min(MAX_REPLANS, NODE_BUDGET / Math.max(1, nodes));
    }

    /**
     * Checks the proposals of every route.
     *
     * @param base      the plan as laid out
     * @param proposals per route of {@code base}, its proposal, or null to keep the route's advice
     * @param replan    plans a changed layout (routes are all that is read)
     * @throws IllegalArgumentException if there is not one proposal slot per route
     */
    static Result check(Plan base, List<BottleneckAdvisor.Proposal> proposals, Function<Scenario, Plan> replan) {
        List<RouteReport> routes = base.routes();
        if (proposals.size() != routes.size()) {
            throw new IllegalArgumentException("proposals: need one per route (" + routes.size() + "), got "
                    + proposals.size());
        }
        int bound = maxReplans(base.scenario().nodes().size());
        Map<ScenarioEdit, Outcome> outcomes = new LinkedHashMap<>();
        Map<ScenarioEdit, List<Advice>> aims = new HashMap<>();
        for (int i = 0; i < routes.size(); i++) {
            if (proposals.get(i) != null) {
                for (Advice a : proposals.get(i).candidates()) {
                    aims.computeIfAbsent(a.edit(), k -> new ArrayList<>()).add(a);
                }
            }
        }
        List<Integer> weakestFirst = IntStream.range(0, routes.size())
                .filter(i -> proposals.get(i) != null && !proposals.get(i).candidates().isEmpty()).boxed()
                .sorted(Comparator.comparingDouble((Integer i) -> routes.get(i).endToEndCapacityBits())
                        .thenComparingInt(i -> i))
                .toList();
        for (int i : weakestFirst) {
            for (Advice a : proposals.get(i).candidates()) {
                if (!outcomes.containsKey(a.edit()) && outcomes.size() < bound) {
                    outcomes.put(a.edit(), outcome(base, a.edit(), aims.get(a.edit()), replan));
                }
            }
        }
        int skipped = aims.size() - outcomes.size();
        List<RouteAdvice> checked = new ArrayList<>();
        List<RouteReport> out = new ArrayList<>();
        for (int i = 0; i < routes.size(); i++) {
            RouteReport r = routes.get(i);
            BottleneckAdvisor.Proposal p = proposals.get(i);
            if (p == null) {
                checked.add(null);
                out.add(r);
                continue;
            }
            RouteAdvice ra = judgeRoute(i, p, outcomes, bound, base.scenario().nodes().size(),
                    base.scenario().targets().minRateBitsPerS());
            checked.add(ra);
            out.add(new RouteReport(r.from(), r.to(), r.hops(), r.bottleneckCapacityBits(), r.bottleneckFrom(),
                    r.bottleneckTo(), r.endToEndCapacityBits(), r.rateBitsPerS(), r.latencyS(),
                    r.directCapacityBits(), r.bottleneckLimitedBy(), ra.text()));
        }
        Plan plan = new Plan(base.scenario(), base.channel(), base.links(), out, base.budgets(), base.warnings());
        return new Result(plan, checked, outcomes.size(), skipped);
    }

    private static Outcome outcome(Plan base, ScenarioEdit edit, List<Advice> aims, Function<Scenario, Plan> replan) {
        Scenario changed;
        try {
            changed = edit.applyTo(base.scenario());
        } catch (IllegalArgumentException e) {
            String msg = e.getMessage() == null ? "" : e.getMessage().replaceFirst("^invalid scenario:\\s*", "")
                    .replace('\n', ';').replace(";", "; ").replaceAll("\\s+", " ").trim();
            return new Outcome(edit, msg, List.of(), Map.of());
        }
        Plan after = replan.apply(changed);
        List<Effect> effects = new ArrayList<>();
        for (int i = 0; i < base.routes().size(); i++) {
            RouteReport b = base.routes().get(i);
            RouteReport a = after.routes().get(i);
            effects.add(new Effect(b.from(), b.to(), b.reachable(), a.reachable(), b.endToEndCapacityBits(),
                    a.endToEndCapacityBits(), b.rateBitsPerS(), a.rateBitsPerS()));
        }
        Map<LinkKey, Double> hopBits = new HashMap<>();
        for (Advice a : aims) {
            hopBits.put(new LinkKey(a.hopFrom(), a.hopTo()), 0.0);
        }
        for (LinkReport l : after.links()) {
            hopBits.computeIfPresent(LinkKey.of(l), (k, v) -> l.mutualInformationBits());
        }
        return new Outcome(edit, null, effects, hopBits);
    }

    static RouteAdvice judgeRoute(int demand, BottleneckAdvisor.Proposal p, Map<ScenarioEdit, Outcome> outcomes,
            int bound, int nodes, double minRate) {
        List<Verdict> given = new ArrayList<>();
        Verdict bestRejected = null;
        List<String> unchecked = new ArrayList<>();
        for (Advice a : p.candidates()) {
            Outcome o = outcomes.get(a.edit());
            if (o == null) {
                unchecked.add(a.text());
                continue;
            }
            Verdict v = judge(a, demand, o, minRate);
            if (v.given()) {
                given.add(v);
            } else if (bestRejected == null || v.gain() > bestRejected.gain()) {
                bestRejected = v;
            }
        }
        given.sort(Comparator.comparingDouble(Verdict::gain).reversed());
        String text;
        if (!given.isEmpty()) {
            text = String.join("; or ", given.stream().map(Verdict::text).toList());
        } else {
            List<String> parts = new ArrayList<>();
            if (bestRejected != null) {
                parts.add("no single change found that helps without hurting other demands; best rejected: "
                        + bestRejected.text());
            }
            if (!unchecked.isEmpty()) {
                parts.add(String.format(Locale.ROOT, "not checked (a layout of %d nodes re-plans at most %d distinct "
                        + "changes, spent on weaker routes): %s (aimed at %.2f bit/symbol on the hop with every other "
                        + "node fixed; what it does to the route and other demands is not known)", nodes, bound,
                        String.join("; or ", unchecked), p.targetBits()));
            }
            if (!p.note().isEmpty()) {
                parts.add(p.note());
            }
            text = String.join("; ", parts);
        }
        return new RouteAdvice(given, bestRejected, text);
    }

    /** Judges one change for one route (rules in the class comment) and writes its line. */
    static Verdict judge(Advice a, int demand, Outcome o, double minRate) {
        String head = a.text();
        if (o.invalid() != null) {
            String why = "the changed layout is not valid: " + o.invalid();
            return new Verdict(a, demand, o, false, List.of(why), head + ": " + why);
        }
        Effect own = o.effects().get(demand);
        List<String> reasons = new ArrayList<>();
        List<String> says = new ArrayList<>();
        double hop = o.hopBits().getOrDefault(new LinkKey(a.hopFrom(), a.hopTo()), 0.0);
        if (!a.hopFrom().equals(own.from()) || !a.hopTo().equals(own.to())) {
            says.add(hop > 0 ? String.format(Locale.ROOT, "%s -> %s then carries %s bit/symbol", a.hopFrom(),
                    a.hopTo(), fmt(hop)) : a.hopFrom() + " -> " + a.hopTo() + " falls below the capacity floor");
        }
        if (own.raised()) {
            says.add("raises " + own.name() + " to " + values(own, true) + unit(own) + " (from " + values(own, false)
                    + ")");
        } else if (own.lost()) {
            says.add("cuts the route of " + own.name());
            reasons.add("it cuts the route of " + own.name());
        } else {
            says.add("does not raise " + own.name() + " (" + values(own, false) + " -> " + values(own, true)
                    + unit(own) + ")");
            reasons.add("it does not raise " + own.name());
        }
        List<String> raised = new ArrayList<>();
        List<String> lowered = new ArrayList<>();
        List<String> lost = new ArrayList<>();
        List<String> belowTarget = new ArrayList<>();
        for (int i = 0; i < o.effects().size(); i++) {
            Effect e = o.effects().get(i);
            if (i == demand) {
                continue;
            }
            if (e.lost()) {
                lost.add(e.name());
            } else if (e.lowered()) {
                lowered.add(e.name() + " from " + values(e, false) + " to " + values(e, true) + unit(e));
            } else if (e.raised()) {
                raised.add(e.name());
            }
            boolean metBefore = e.reachableBefore() && e.rateBefore() >= minRate;
            boolean metAfter = e.reachableAfter() && e.rateAfter() >= minRate;
            if (metBefore && !metAfter && !e.lost()) {
                belowTarget.add(e.name());
            }
        }
        if (!raised.isEmpty()) {
            says.add("also raises " + list(raised));
        }
        if (!lowered.isEmpty()) {
            says.add("lowers " + list(lowered));
        }
        if (!lost.isEmpty()) {
            String l = list(lost) + (lost.size() == 1 ? " loses its route" : " lose their route");
            says.add(l);
            reasons.add(l);
        }
        if (!belowTarget.isEmpty()) {
            reasons.add(list(belowTarget) + " no longer " + (belowTarget.size() == 1 ? "meets" : "meet")
                    + String.format(Locale.ROOT, " the rate target %s bit/s", fmt(minRate)));
        }
        double before = o.totalRateBefore();
        double after = o.totalRateAfter();
        if (after < before) {
            reasons.add(String.format(Locale.ROOT, "the total rate of all demands falls from %s to %s bit/s",
                    fmt(before), fmt(after)));
        }
        if (raised.isEmpty() && lowered.isEmpty() && lost.isEmpty()) {
            says.add(o.effects().size() > 1 ? "no other demand changes" : "no other demand");
        }
        boolean given = reasons.isEmpty();
        String text = head + ": " + String.join("; ", says) + (given ? "" : "; rejected: " + String.join("; ",
                reasons));
        return new Verdict(a, demand, o, given, reasons, text);
    }

    /**
     * "0.702" (bit/symbol, the unit follows once: {@link #unit}), or "0.702 bit/symbol = 0.351 bit/s"
     * when bit/s per bit/symbol changed (symbol time or frame).
     */
    private static String values(Effect e, boolean after) {
        double bits = after ? e.bitsAfter() : e.bitsBefore();
        double rate = after ? e.rateAfter() : e.rateBefore();
        return e.rateFactorChanged() ? fmt(bits) + " bit/symbol = " + fmt(rate) + " bit/s" : fmt(bits);
    }

    private static String unit(Effect e) {
        return e.rateFactorChanged() ? "" : " bit/symbol";
    }

    private static String list(List<String> items) {
        int shown = 4;
        if (items.size() <= shown + 1) {
            return String.join(", ", items);
        }
        return String.join(", ", items.subList(0, shown)) + " and " + (items.size() - shown) + " more";
    }

    /** Three significant digits, as every number of an advice line is printed. */
    static String fmt(double v) {
        return String.format(Locale.ROOT, "%.3g", v);
    }
}
