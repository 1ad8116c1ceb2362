package dev.nanoplan.design;

import dev.nanoplan.geometry.Vec3;
import dev.nanoplan.plan.BudgetReport;
import dev.nanoplan.plan.Plan;
import dev.nanoplan.plan.RouteReport;
import dev.nanoplan.plan.SlotSchedule;
import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.Role;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.Schedule;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.function.BooleanSupplier;
import java.util.function.Supplier;

/**
 * Improves a layout by local search on the lexicographic {@link Objective}: rounds of first-improvement
 * moves, each re-planned incrementally ({@link LayoutEvaluator}) and kept only when it makes the layout
 * strictly better, until a round changes nothing, the time limit passes or the caller cancels. The
 * result is therefore never worse than the input.
 *
 * <p><b>Screen, then confirm.</b> Candidates are screened on the preview planner (normal approximation,
 * {@link LayoutEvaluator#screen}; about 20× faster than the exact re-plan on the culture tank) and only
 * those the screen calls better than the current layout — at most {@value #CONFIRMATIONS} per step, best
 * screened first — are re-planned with the exact planner; a change is kept only on the exact objective.
 * The preview may thus turn down a change the exact planner would keep (a cost in search quality, never
 * in the objective). Layouts the preview does not cover (a slot plan whose frame is longer than one slot)
 * and the joint budgets are assessed exactly straight away.
 *
 * <p><b>Moves of a round</b>, each when allowed ({@link DesignMove}) and only on nodes that are not
 * {@code fixed}:
 * <ol>
 *   <li>budgets: each emitting node's molecules per symbol ×2, ×4, ×8, ×16 (a target a node misses may need
 *       several doublings, each of which alone only adds crosstalk), ×½ and ×0.8 (the first factor that
 *       helps is kept; at most 2^20; nodes on the routes of missing demands first, closest to the rate
 *       target first), and each link group's emitters together ×2 and ×½;</li>
 *   <li>species: each link group (a receiver and the emitters whose route hops end at it, which must share
 *       one species since a receiver senses one) is tried on every other species of the scenario and its
 *       {@code candidate_species}, and the best of them is kept; each demand's source is tried alone on
 *       every other species (it then routes to whichever receiver senses it), the best kept;</li>
 *   <li>relay positions: CMA-ES over each relay's centre ({@link RelayPlacement}) from its current centre
 *       and from the midpoint between the centroid of the emitters routed into it and the node it
 *       forwards to (the routes of the JGraphT link graph);</li>
 *   <li>new relays: for the demand that misses its targets with the smallest shared rate, a relay
 *       {@code relay-new-k} absorbing the source's species and emitting the destination's, placed by the
 *       same optimiser between the two, while fewer than {@code maxNewRelays} were added;</li>
 *   <li>slots: each emitter, those on the routes of missing demands first, in every other slot of its
 *       species' frame or in a new last slot (the frame grows by one, up to {@value #MAX_FRAME_SLOTS}
 *       slots), the best kept (schedule {@code slots}; an all-active layout is all slots 0);</li>
 *   <li>joint budgets (last, being the costliest step): the joint molecule budgets of the current layout
 *       (power control over every route emitter, one budgeted plan) set as the feasible nodes' molecules
 *       per symbol, or only where they raise them.</li>
 * </ol>
 * Deterministic for a given seed (and, like the planner, for any thread count).
 *
 * <p>Cost: per round about 6 screens per emitting node, species × groups screens,
 * 2 × {@value #EVALUATIONS_PER_START} screens per relay, up to {@value #MAX_FRAME_SLOTS} exact re-plans per
 * emitter for the slots, one budgeted plan, and up to {@value #CONFIRMATIONS} exact re-plans per step.
 */
public final class LayoutImprover {

    /** Re-plans per CMA-ES start. */
    static final int EVALUATIONS_PER_START = 40;
    /** Largest molecules per symbol the search sets (as the budget search's cap). */
    static final long MAX_MOLECULES = 1L << 20;
    /** Candidates of one step confirmed with the exact planner, best screened first. */
    static final int CONFIRMATIONS = 3;
    /** Longest frame the slot moves make, slots. */
    static final int MAX_FRAME_SLOTS = 3;
    /** Most rounds. */
    private static final int MAX_ROUNDS = 12;
    private static final double[] NODE_FACTORS = {2, 4, 8, 16, 0.5, 0.8};
    private static final double[] GROUP_FACTORS = {2, 0.5};

    private final ImproveOptions options;
    private final long startNanos;
    private final BooleanSupplier stop;
    private LayoutEvaluator evaluator;
    private int added;

    private LayoutImprover(ImproveOptions options) {
        this.options = options;
        this.startNanos = System.nanoTime();
        this.stop = () -> options.cancelled().getAsBoolean() || elapsedS() > options.timeLimitS();
    }

    /**
     * The best layout the search finds for {@code scenario}.
     *
     * @throws IllegalArgumentException as the planner, for a layout it cannot plan
     */
    public static Improvement improve(Scenario scenario, ImproveOptions options) {
        return new LayoutImprover(options).run(scenario);
    }

    private double elapsedS() {
        return (System.nanoTime() - startNanos) / 1e9;
    }

    private Improvement run(Scenario scenario) {
        evaluator = new LayoutEvaluator(scenario, options.planOptions());
        Assessment before = evaluator.current();
        report("first plan");
        boolean converged = false;
        for (int round = 0; round < MAX_ROUNDS && !stop.getAsBoolean(); round++) {
            boolean improved = false;
            if (options.allowed().contains(DesignMove.BUDGETS)) {
                improved |= budgetMoves();
            }
            if (options.allowed().contains(DesignMove.SPECIES)) {
                improved |= speciesMoves();
            }
            if (options.allowed().contains(DesignMove.MOVE_RELAYS)) {
                improved |= relayMoves(round);
            }
            if (options.allowed().contains(DesignMove.ADD_RELAYS) && added < options.maxNewRelays()) {
                improved |= insertRelay(round);
            }
            if (options.allowed().contains(DesignMove.SLOTS)) {
                improved |= slotMoves();
            }
            if (options.allowed().contains(DesignMove.BUDGETS)) {
                // last: one budgeted plan per round, the costliest step (seconds on the culture tank)
                improved |= jointBudgetMove();
            }

            report("round " + (round + 1) + " done");
            if (!improved) {
                converged = !stop.getAsBoolean();
                break;
            }
        }
        Scenario after = evaluator.scenario();
        return new Improvement(scenario, after, before, evaluator.current(), ChangeList.of(scenario, after),
                evaluator.evaluations(), elapsedS(), !converged);
    }

    private void report(String step) {
        options.progress().accept(new ImproveOptions.Progress(evaluator.evaluations(),
                evaluator.current().objective(), elapsedS(), Math.max(0, options.timeLimitS() - elapsedS()), step));
    }

    /** Re-plans {@code candidate} and keeps it when strictly better; false when invalid or not better. */
    private boolean tryAccept(Scenario candidate, String step) {
        if (stop.getAsBoolean() || candidate.equals(evaluator.scenario())) {
            return false;
        }
        LayoutEvaluator.Screened sc;
        try {
            sc = evaluator.screen(candidate);
        } catch (IllegalArgumentException invalid) {
            return false;
        }
        return sc.promising() && confirm(candidate, sc, step);
    }

    /**
     * Accepts a screened candidate when the exact planner calls it strictly better than the current layout
     * (re-planned exactly unless the screen already was exact).
     */
    private boolean confirm(Scenario candidate, LayoutEvaluator.Screened sc, String step) {
        Assessment exact;
        try {
            exact = sc.exact() ? sc.assessment() : evaluator.assess(candidate);
        } catch (IllegalArgumentException invalid) {
            return false;
        }
        if (!exact.objective().betterThan(evaluator.current().objective())) {
            return false;
        }
        evaluator.accept(candidate);
        report(step);
        return true;
    }

    private boolean movable(Scenario s, String id) {
        Node n = s.nodesById().get(id);
        return n != null && !n.fixed();
    }

    /** Receiver id → the emitters whose route hops end at it, from the current routes. */
    private Map<String, Set<String>> linkGroups() {
        Map<String, Set<String>> groups = new LinkedHashMap<>();
        for (RouteReport r : evaluator.plan().routes()) {
            for (int h = 0; h + 1 < r.hops().size(); h++) {
                groups.computeIfAbsent(r.hops().get(h + 1), k -> new LinkedHashSet<>()).add(r.hops().get(h));
            }
        }
        return groups;
    }

    private boolean speciesMoves() {
        boolean improved = false;
        for (Map.Entry<String, Set<String>> g : linkGroups().entrySet()) {
            Scenario s = evaluator.scenario();
            String receiver = g.getKey();
            if (!movable(s, receiver) || !g.getValue().stream().allMatch(e -> movable(s, e))) {
                continue;
            }
            String now = s.nodesById().get(receiver).species();
            List<Scenario> candidates = new ArrayList<>();
            for (String sp : LayoutEdits.speciesChoices(s)) {
                if (!sp.equals(now)) {
                    candidates.add(safely(() -> LayoutEdits.groupSpecies(s, receiver, g.getValue(), sp)));
                }
            }
            improved |= acceptBest(candidates, "species of " + receiver + "'s group");
        }
        for (String source : demandSources()) {
            Scenario s = evaluator.scenario();
            Node n = s.nodesById().get(source);
            if (n == null || n.fixed() || n.role() != Role.TRANSMITTER) {
                continue;
            }
            List<Scenario> candidates = new ArrayList<>();
            for (String sp : LayoutEdits.speciesChoices(s)) {
                if (!sp.equals(n.emitsSpecies())) {
                    candidates.add(safely(() -> LayoutEdits.node(s, source, m -> LayoutEdits.withSpecies(m, sp, sp))));
                }
            }
            improved |= acceptBest(candidates, "species of " + source);
        }
        return improved;
    }

    /**
     * Screens every candidate, confirms the {@value #CONFIRMATIONS} the screen ranks best among those it calls
     * better than the current layout (or, when it calls none better, the one it ranks best) with the exact
     * planner, and keeps the best of them when it is strictly better than the current layout on the exact
     * objective.
     */
    private boolean acceptBest(List<Scenario> candidates, String step) {
        return acceptBest(candidates, step, false);
    }

    /**
     * As {@link #acceptBest(List, String)}, but with {@code exactOnly} every candidate is assessed with the exact
     * planner straight away (for a few costly candidates the preview could turn down wrongly).
     */
    private boolean acceptBest(List<Scenario> candidates, String step, boolean exactOnly) {
        record Ranked(Scenario scenario, LayoutEvaluator.Screened screened) {
        }
        List<Ranked> promising = new ArrayList<>();
        Ranked bestScreened = null;
        for (Scenario c : candidates) {
            if (stop.getAsBoolean()) {
                break;
            }
            if (c.equals(evaluator.scenario())) {
                continue;
            }
            try {
                LayoutEvaluator.Screened sc = exactOnly ? evaluator.exactly(c) : evaluator.screen(c);
                if (sc.promising()) {
                    promising.add(new Ranked(c, sc));
                }
                if (bestScreened == null
                        || sc.assessment().objective().betterThan(bestScreened.screened().assessment().objective())) {
                    bestScreened = new Ranked(c, sc);
                }
            } catch (IllegalArgumentException invalid) {
                // not a plannable layout: skipped
            }
        }
        if (promising.isEmpty() && bestScreened != null && !bestScreened.screened().exact()) {
            // the preview can be off by tenths of a bit where a few on/off terms dominate: its best is checked anyway
            promising.add(bestScreened);
        }
        // stable sort: ties keep the candidates' order, so a run stays deterministic
        promising.sort(Comparator.comparing((Ranked r) -> r.screened().assessment().objective()).reversed());
        Scenario best = null;
        Objective bestObjective = evaluator.current().objective();
        for (Ranked r : promising.subList(0, Math.min(CONFIRMATIONS, promising.size()))) {
            if (stop.getAsBoolean()) {
                break;
            }
            try {
                Objective o = r.screened().exact() ? r.screened().assessment().objective()
                        : evaluator.assess(r.scenario()).objective();
                if (o.betterThan(bestObjective)) {
                    best = r.scenario();
                    bestObjective = o;
                }
            } catch (IllegalArgumentException invalid) {
                // not a plannable layout: skipped
            }
        }
        if (best == null) {
            return false;
        }
        evaluator.accept(best);
        report(step);
        return true;
    }

    /** The layout {@code edit} gives, or the current layout when the edit is invalid (then not accepted). */
    private Scenario safely(Supplier<Scenario> edit) {
        try {
            return edit.get();
        } catch (IllegalArgumentException invalid) {
            return evaluator.scenario();
        }
    }

    private List<String> demandSources() {
        Set<String> out = new LinkedHashSet<>();
        evaluator.scenario().demands().forEach(d -> out.add(d.from()));
        return new ArrayList<>(out);
    }

    /**
     * Joint molecule budgets: the exact plan of the current layout with joint budgets (power control over every
     * route emitter, {@code JointMoleculeBudgets}; no advice), its feasible budgets
     * set as the movable nodes' molecules per symbol; also the variant that only raises budgets. The better
     * of the two is kept when it improves the layout.
     */
    private boolean jointBudgetMove() {
        Scenario s = evaluator.scenario();
        Plan full;
        try {
            full = evaluator.withJointBudgets(f -> {
                if (stop.getAsBoolean()) {
                    throw new RelayPlacement.Stopped();
                }
            });
        } catch (IllegalArgumentException | RelayPlacement.Stopped ended) {
            return false;
        }
        Map<String, Long> need = new LinkedHashMap<>();
        for (BudgetReport b : full.budgets()) {
            if (b.feasible() && b.moleculesPerSymbolNeeded() >= 1 && movable(s, b.node())) {
                need.put(b.node(), Math.min(MAX_MOLECULES, b.moleculesPerSymbolNeeded()));
            }
        }
        if (need.isEmpty()) {
            return false;
        }
        Scenario exactly = safely(() -> LayoutEdits.mapNodes(s, m -> need.containsKey(m.id())
                ? LayoutEdits.withMolecules(m, need.get(m.id())) : m));
        Scenario raised = safely(() -> LayoutEdits.mapNodes(s, m -> need.containsKey(m.id())
                ? LayoutEdits.withMolecules(m, Math.max(m.moleculesPerSymbol(), need.get(m.id()))) : m));
        return acceptBest(List.of(exactly, raised), "joint budgets", true);
    }

    /**
     * Slot moves (schedule {@code slots}): each movable emitter, those on the routes of missing demands
     * first, is tried in every other slot of its species' frame and in a new last slot (which grows the
     * frame by one, up to {@value #MAX_FRAME_SLOTS}); the best is kept. An all-active or round-robin layout
     * enters the slots schedule with its own slots (all 0, or the file order) the first time a move helps.
     */
    private boolean slotMoves() {
        boolean improved = false;
        for (Node n : budgetOrder()) {
            Scenario s = evaluator.scenario();
            if (stop.getAsBoolean()) {
                break;
            }
            if (!n.role().emits() || !movable(s, n.id())) {
                continue;
            }
            SlotSchedule schedule = SlotSchedule.of(s);
            Map<String, Integer> slots = LayoutEdits.slotsOf(s);
            int fixedFrame = s.signalling().schedule() == Schedule.SLOTS ? s.signalling().frameSlots() : 0;
            int frame = fixedFrame > 0 ? fixedFrame : schedule.frameSlots(n.emitsSpecies());
            int now = slots.get(n.id());
            List<Scenario> candidates = new ArrayList<>();
            for (int k = 0; k <= frame && k < MAX_FRAME_SLOTS; k++) {
                if (k != now) {
                    Map<String, Integer> next = new LinkedHashMap<>(slots);
                    next.put(n.id(), k);
                    int f = fixedFrame > 0 ? Math.max(fixedFrame, k + 1) : 0;
                    candidates.add(safely(() -> LayoutEdits.withSlots(s, f, next)));
                }
            }
            improved |= acceptBest(candidates, "slot of " + n.id());
        }
        return improved;
    }

    private boolean budgetMoves() {
        boolean improved = false;
        for (Node n : budgetOrder()) {
            if (!n.role().emits() || n.fixed()) {
                continue;
            }
            for (double f : NODE_FACTORS) {
                long now = evaluator.scenario().nodesById().get(n.id()).moleculesPerSymbol();
                long to = scaled(now, f);
                if (to != now && tryAccept(safely(() -> LayoutEdits.node(evaluator.scenario(), n.id(),
                        m -> LayoutEdits.withMolecules(m, to))), "molecules of " + n.id())) {
                    improved = true;
                    break;
                }
            }
        }
        for (Map.Entry<String, Set<String>> g : linkGroups().entrySet()) {
            Set<String> members = g.getValue();
            if (!members.stream().allMatch(e -> movable(evaluator.scenario(), e))) {
                continue;
            }
            for (double f : GROUP_FACTORS) {
                if (tryAccept(safely(() -> LayoutEdits.mapNodes(evaluator.scenario(), m -> members.contains(m.id())
                        ? LayoutEdits.withMolecules(m, scaled(m.moleculesPerSymbol(), f)) : m)),
                        "molecules of " + g.getKey() + "'s senders")) {
                    improved = true;
                    break;
                }
            }
        }
        return improved;
    }

    /**
     * Emitting nodes, those on the routes of demands that miss their targets first, the demands closest
     * to the rate target (largest shared rate) first; then the rest in file order.
     */
    private List<Node> budgetOrder() {
        Map<String, Node> nodes = evaluator.scenario().nodesById();
        List<Assessment.DemandOutcome> missing = new ArrayList<>();
        Map<String, List<String>> hops = new LinkedHashMap<>();
        List<RouteReport> routes = evaluator.plan().routes();
        for (int i = 0; i < routes.size(); i++) {
            Assessment.DemandOutcome d = evaluator.current().demands().get(i);
            if (!d.meetsTargets()) {
                missing.add(d);
                hops.put(d.from() + "\u0000" + d.to(), routes.get(i).hops());
            }
        }
        missing.sort(Comparator.comparingDouble(Assessment.DemandOutcome::sharedRateBitsPerS).reversed());
        Set<String> order = new LinkedHashSet<>();
        for (Assessment.DemandOutcome d : missing) {
            List<String> h = hops.get(d.from() + "\u0000" + d.to());
            for (int k = 0; k + 1 < h.size(); k++) {
                order.add(h.get(k));
            }
        }
        order.addAll(nodes.keySet());
        List<Node> out = new ArrayList<>();
        order.forEach(id -> out.add(nodes.get(id)));
        return out;
    }

    static long scaled(long molecules, double factor) {
        return Math.max(1, Math.min(MAX_MOLECULES, Math.round(molecules * factor)));
    }

    private boolean relayMoves(int round) {
        boolean improved = false;
        RelayPlacement placement = new RelayPlacement(evaluator, EVALUATIONS_PER_START, options.seed() + 1000L * round,
                stop);
        for (Node n : evaluator.scenario().nodes()) {
            if (n.role() != Role.RELAY || n.fixed() || stop.getAsBoolean()) {
                continue;
            }
            Scenario base = evaluator.scenario();
            Node now = base.nodesById().get(n.id());
            List<Vec3> starts = new ArrayList<>();
            starts.add(now.positionUm());
            Vec3 guided = guidedStart(base, n.id());
            double sigma = 5;
            if (guided != null) {
                starts.add(guided);
                sigma = Math.max(2, 0.25 * guided.distance(now.positionUm()));
            }
            RelayPlacement.Placed p = placement.place(base, n.id(), starts, sigma);
            if (p != null && p.screened().promising() && confirm(p.scenario(), p.screened(), "moved " + n.id())) {
                improved = true;
            }
        }
        return improved;
    }

    /**
     * The midpoint between the centroid of the emitters whose routes enter {@code relay} and the node
     * the relay forwards to, or null when no route passes through it.
     */
    private Vec3 guidedStart(Scenario s, String relay) {
        Map<String, Node> nodes = s.nodesById();
        Set<String> in = new LinkedHashSet<>();
        String next = null;
        for (RouteReport r : evaluator.plan().routes()) {
            List<String> h = r.hops();
            int i = h.indexOf(relay);
            if (i > 0 && i + 1 < h.size()) {
                in.add(h.get(i - 1));
                next = next == null ? h.get(i + 1) : next;
            }
        }
        if (next == null) {
            return null;
        }
        double x = 0;
        double y = 0;
        double z = 0;
        for (String e : in) {
            Vec3 p = nodes.get(e).positionUm();
            x += p.x();
            y += p.y();
            z += p.z();
        }
        Vec3 to = nodes.get(next).positionUm();
        int k = in.size();
        return new Vec3((x / k + to.x()) / 2, (y / k + to.y()) / 2, (z / k + to.z()) / 2);
    }

    private boolean insertRelay(int round) {
        Scenario base = evaluator.scenario();
        Map<String, Node> nodes = base.nodesById();
        Assessment.DemandOutcome worst = evaluator.current().demands().stream()
                .filter(d -> !d.meetsTargets())
                .min(Comparator.comparingDouble(Assessment.DemandOutcome::sharedRateBitsPerS))
                .orElse(null);
        if (worst == null) {
            return false;
        }
        Node from = nodes.get(worst.from());
        Node to = nodes.get(worst.to());
        String id = freshRelayId(nodes.keySet());
        double radius = base.nodes().stream().filter(n -> n.role() == Role.RELAY).mapToDouble(Node::radiusUm)
                .max().orElse(to.radiusUm());
        long molecules = base.nodes().stream().filter(n -> n.role() == Role.RELAY)
                .mapToLong(Node::moleculesPerSymbol).max().orElse(scaled(from.moleculesPerSymbol(), 10));
        List<Vec3> starts = new ArrayList<>();
        for (double t : new double[] {0.5, 0.33, 0.67}) {
            Vec3 a = from.positionUm();
            Vec3 b = to.positionUm();
            starts.add(new Vec3(a.x() + t * (b.x() - a.x()), a.y() + t * (b.y() - a.y()), a.z() + t * (b.z() - a.z())));
        }
        RelayPlacement placement = new RelayPlacement(evaluator, EVALUATIONS_PER_START, options.seed() + 7919L * (round
                + 1), stop);
        RelayPlacement.Placed p = placement.place(base, at -> {
            List<Node> more = new ArrayList<>(base.nodes());
            more.add(Node.relay(id, at, radius, from.emitsSpecies(), to.species(), molecules));
            return LayoutEdits.withNodes(base, more);
        }, starts, Math.max(2, 0.15 * from.positionUm().distance(to.positionUm())));
        if (p != null && p.screened().promising() && confirm(p.scenario(), p.screened(), "added " + id)) {
            added++;
            return true;
        }
        return false;
    }

    private static String freshRelayId(Set<String> taken) {
        int k = 1;
        while (taken.contains("relay-new-" + k)) {
            k++;
        }
        return "relay-new-" + k;
    }
}
