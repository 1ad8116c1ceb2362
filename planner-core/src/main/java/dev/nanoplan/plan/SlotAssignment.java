package dev.nanoplan.plan;

import dev.nanoplan.network.ChannelMatrix;
import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.Schedule;
import dev.nanoplan.scenario.Signalling;
import dev.nanoplan.scenario.SlotPlan;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.function.DoubleConsumer;
import org.jgrapht.Graph;
import org.jgrapht.Graphs;
import org.jgrapht.graph.DefaultEdge;

/**
 * A slot plan with spatial reuse: every emitter's slot so that emitters far enough apart send together.
 *
 * <ol>
 *   <li>Route hops: the routes of the scenario planned under round-robin (each emitter of a species in its
 *       own slot: the least crosstalk time division allows).</li>
 *   <li>{@link SlotConflictGraph} over those hops, coloured per species by {@link SlotColouring}; colour =
 *       slot. With {@code maxFrame}, an emitter whose colour is beyond the cap takes the slot in which
 *       it has the fewest conflicting neighbours.</li>
 *   <li>Start: the best (by the score below) of the colouring, all-active and round-robin.</li>
 *   <li>Local search with the real planner ({@link IncrementalPlanner#whatIf}: only the receivers hearing a
 *       moved emitter are re-evaluated). A plan's score, compared in this order: more demands meeting
 *       the targets (reachable, shared rate ≥ {@code targets.min_rate_bits_per_s}), a shorter longest
 *       frame, a larger smallest shared rate, a larger sum of log shared rates. Moves: fold a species'
 *       last slot into the others (shortens its frame), and move the bottleneck emitter or the top
 *       interferer of the weakest demand's bottleneck hop to another slot. The best improving move is
 *       taken until none improves or {@code maxEvaluations} plans were evaluated.</li>
 * </ol>
 *
 * <p>Cost: two full plans without budgets or advice plus at most {@code maxEvaluations} incremental what-if plans.
 */
public final class SlotAssignment {

    /** Before/after figures of one demand. */
    public record DemandChange(String from, String to, double capacityBeforeBits, double capacityAfterBits,
            double sharedRateBeforeBitsPerS, double sharedRateAfterBitsPerS) {
    }

    /**
     * The slot plan found.
     *
     * @param scenario      the input scenario with {@code schedule: slots} and every emitter's slot
     * @param frameSlots    the longest frame over the species
     * @param slots         every emitter's slot by node id, in file order
     * @param conflictEdges edges of the conflict graph
     * @param demands       per demand, in file order
     * @param evaluations   what-if plans evaluated by the local search
     */
    public record Result(Scenario scenario, int frameSlots, Map<String, Integer> slots, int conflictEdges,
            List<DemandChange> demands, int evaluations) {
    }

    private final PlanOptions options;
    private final int maxFrame;
    private final int maxEvaluations;

    /**
     * @param options        planner options (floor, cutoff, channel)
     * @param maxFrame       most slots per frame, or 0 for no cap
     * @param maxEvaluations most what-if plans of the local search, ≥ 0
     */
    public SlotAssignment(PlanOptions options, int maxFrame, int maxEvaluations) {
        if (maxFrame < 0 || maxFrame > Signalling.MAX_FRAME_SLOTS) {
            throw new IllegalArgumentException("maxFrame: must be in 0.." + Signalling.MAX_FRAME_SLOTS + ", got "
                    + maxFrame);
        }
        if (maxEvaluations < 0) {
            throw new IllegalArgumentException("maxEvaluations: must be >= 0, got " + maxEvaluations);
        }
        this.options = options;
        this.maxFrame = maxFrame;
        this.maxEvaluations = maxEvaluations;
    }

    /** Finds the slot plan of {@code scenario} (see the class comment). */
    public Result assign(Scenario scenario) {
        return assign(scenario, f -> { });
    }

    /**
     * As {@link #assign(Scenario)}, telling {@code progress} the fraction done in [0, 1]: the first plan
     * is the first fifth, then one step per what-if plan of the budget. A caller may stop the work by
     * throwing from {@code progress} (the exception propagates; nothing is kept).
     */
    public Result assign(Scenario scenario, DoubleConsumer progress) {
        PlanOptions quiet = options.withProgress(f -> { });
        // the routes and shared rates are those of the full plan; budgets and advice are not needed here
        Plan before = IncrementalPlanner.exactWithoutBudgets(scenario, options.withProgress(f -> progress.accept(0.2 * f))).plan();
        Scenario rr = withSlots(scenario, SlotPlan.fileOrder(scenario.nodes()));
        IncrementalPlanner planner = IncrementalPlanner.exactWithoutBudgets(rr, quiet);
        List<LinkKey> hops = new ArrayList<>();
        for (RouteReport r : planner.plan().routes()) {
            for (int h = 0; h + 1 < r.hops().size(); h++) {
                hops.add(new LinkKey(r.hops().get(h), r.hops().get(h + 1)));
            }
        }
        ChannelMatrix channel = PlanPipeline.channel(PlanInputs.of(rr, options), f -> { });
        Graph<String, DefaultEdge> conflicts = SlotConflictGraph.of(scenario, channel, hops);
        Map<String, Integer> colour = SlotColouring.of(conflicts);
        Map<String, Integer> slots = new LinkedHashMap<>();
        for (Node n : scenario.nodes()) {
            if (n.role().emits()) {
                int c = colour.getOrDefault(n.id(), 0);
                slots.put(n.id(), maxFrame > 0 && c >= maxFrame ? quietestSlot(conflicts, slots, n.id()) : c);
            }
        }
        // start from the best of the colouring, all-active (every emitter in slot 0) and round-robin
        Scenario current = withSlots(scenario, slots);
        Score best = Score.of(planner.whatIf(current));
        int evaluations = 1;
        Map<String, Integer> zero = new LinkedHashMap<>();
        slots.keySet().forEach(id -> zero.put(id, 0));
        for (Map<String, Integer> seed : List.of(zero, SlotPlan.fileOrder(scenario.nodes()))) {
            Scenario candidate = withSlots(scenario, seed);
            if (maxFrame > 0 && SlotSchedule.of(candidate).longestFrame() > maxFrame) {
                continue;
            }
            // all slots 0 is the all-active plan (SlotsPlannerTest): an all-active input's plan is already at hand
            boolean asBefore = seed == zero && scenario.signalling().schedule() == Schedule.ALL_ACTIVE;
            Score sc = Score.of(asBefore ? before : planner.whatIf(candidate));
            evaluations++;
            if (sc.compareTo(best) > 0) {
                current = candidate;
                best = sc;
            }
        }
        boolean improved = true;
        while (improved && evaluations < maxEvaluations) {
            improved = false;
            Scenario bestMove = null;
            Score bestMoveScore = best;
            for (Map<String, Integer> move : moves(current, best.plan, conflicts)) {
                if (evaluations >= maxEvaluations) {
                    break;
                }
                Scenario candidate = withSlots(scenario, move);
                Score s = Score.of(planner.whatIf(candidate));
                evaluations++;
                progress.accept(0.2 + 0.8 * Math.min(1, evaluations / (double) Math.max(1, maxEvaluations)));
                if (s.compareTo(bestMoveScore) > 0) {
                    bestMove = candidate;
                    bestMoveScore = s;
                }
            }
            if (bestMove != null) {
                current = bestMove;
                best = bestMoveScore;
                improved = true;
            }
        }
        List<SharedRates.Share> shareBefore = SharedRates.of(before);
        List<SharedRates.Share> shareAfter = SharedRates.of(best.plan);
        List<DemandChange> demands = new ArrayList<>();
        for (int i = 0; i < before.routes().size(); i++) {
            RouteReport b = before.routes().get(i);
            RouteReport a = best.plan.routes().get(i);
            demands.add(new DemandChange(b.from(), b.to(), b.endToEndCapacityBits(), a.endToEndCapacityBits(),
                    shareBefore.get(i).rateBitsPerS(), shareAfter.get(i).rateBitsPerS()));
        }
        Map<String, Integer> finalSlots = new LinkedHashMap<>();
        for (Node n : current.nodes()) {
            if (n.role().emits()) {
                finalSlots.put(n.id(), current.signalling().slots().get(n.id()));
            }
        }
        progress.accept(1);
        return new Result(current, SlotSchedule.of(current).longestFrame(), finalSlots, conflicts.edgeSet().size(),
                demands, evaluations);
    }

    private static Scenario withSlots(Scenario s, Map<String, Integer> slots) {
        return new Scenario(s.name(), s.volume(), s.medium(), s.species(), s.signalling().withSlots(0, slots),
                s.nodes(), s.demands(), s.targets(), s.candidateSpecies(), s.tolerances());
    }

    /** The slot below the cap in which {@code id} has the fewest conflicting neighbours already placed. */
    private int quietestSlot(Graph<String, DefaultEdge> g, Map<String, Integer> placed, String id) {
        int[] count = new int[maxFrame];
        for (String nb : Graphs.neighborListOf(g, id)) {
            Integer s = placed.get(nb);
            if (s != null && s < maxFrame) {
                count[s]++;
            }
        }
        int best = 0;
        for (int s = 1; s < maxFrame; s++) {
            best = count[s] < count[best] ? s : best;
        }
        return best;
    }

    /** Candidate slot plans one move away from {@code current} (see the class comment). */
    private List<Map<String, Integer>> moves(Scenario current, Plan plan, Graph<String, DefaultEdge> g) {
        Map<String, Integer> slots = current.signalling().slots();
        SlotSchedule schedule = SlotSchedule.of(current);
        Map<String, Node> nodes = current.nodesById();
        List<Map<String, Integer>> out = new ArrayList<>();
        // fold the last slot of each species into the others
        Map<String, Map<String, Integer>> folds = new HashMap<>();
        for (Node n : current.nodes()) {
            int k = schedule.frameSlots(n.emitsSpecies());
            if (n.role().emits() && k > 1 && slots.get(n.id()) == k - 1) {
                Map<String, Integer> fold = folds.computeIfAbsent(n.emitsSpecies(), x -> new HashMap<>(slots));
                int[] count = new int[k - 1];
                for (String nb : Graphs.neighborListOf(g, n.id())) {
                    Integer s = fold.get(nb);
                    if (s != null && s < k - 1) {
                        count[s]++;
                    }
                }
                int best = 0;
                for (int s = 1; s < k - 1; s++) {
                    best = count[s] < count[best] ? s : best;
                }
                fold.put(n.id(), best);
            }
        }
        out.addAll(folds.values());
        // move the weakest demand's bottleneck emitter or its top interferer
        List<SharedRates.Share> shares = SharedRates.of(plan);
        int weakest = -1;
        for (int i = 0; i < shares.size(); i++) {
            if (weakest < 0 || rate(shares.get(i)) < rate(shares.get(weakest))) {
                weakest = i;
            }
        }
        if (weakest >= 0) {
            RouteReport r = plan.routes().get(weakest);
            List<String> movers = new ArrayList<>();
            if (r.bottleneckFrom() != null) {
                movers.add(r.bottleneckFrom());
                plan.links().stream().filter(l -> l.from().equals(r.bottleneckFrom()) && l.to().equals(r.bottleneckTo()))
                        .findFirst().map(LinkReport::topInterferer)
                        .filter(id -> nodes.containsKey(id) && nodes.get(id).role().emits()).ifPresent(movers::add);
            }
            for (String id : movers) {
                int k = schedule.frameSlots(nodes.get(id).emitsSpecies());
                int limit = maxFrame > 0 ? Math.min(maxFrame, k + 1) : k + 1;
                for (int s = 0; s < limit; s++) {
                    if (s != slots.get(id)) {
                        Map<String, Integer> m = new HashMap<>(slots);
                        m.put(id, s);
                        out.add(m);
                    }
                }
            }
        }
        return out;
    }

    private static double rate(SharedRates.Share s) {
        return Double.isFinite(s.rateBitsPerS()) ? s.rateBitsPerS() : 0;
    }

    /** The lexicographic score of a plan (see the class comment). */
    private record Score(Plan plan, int meeting, int frame, double minRate, double sumLogRate)
            implements Comparable<Score> {

        static Score of(Plan plan) {
            double target = plan.scenario().targets().minRateBitsPerS();
            List<SharedRates.Share> shares = SharedRates.of(plan);
            int meeting = 0;
            double min = Double.POSITIVE_INFINITY;
            double sumLog = 0;
            for (int i = 0; i < shares.size(); i++) {
                double r = rate(shares.get(i));
                meeting += plan.routes().get(i).hops().isEmpty() || r < target || r <= 0 ? 0 : 1;
                min = Math.min(min, r);
                sumLog += Math.log(Math.max(r, 1e-300));
            }
            return new Score(plan, meeting, SlotSchedule.of(plan.scenario()).longestFrame(),
                    shares.isEmpty() ? 0 : min, sumLog);
        }

        @Override
        public int compareTo(Score o) {
            if (meeting != o.meeting) {
                return Integer.compare(meeting, o.meeting);
            }
            if (frame != o.frame) {
                return Integer.compare(o.frame, frame);
            }
            if (Math.abs(minRate - o.minRate) > 1e-12 * Math.max(1, Math.abs(o.minRate))) {
                return Double.compare(minRate, o.minRate);
            }
            return Double.compare(sumLogRate, o.sumLogRate) > 0 && sumLogRate - o.sumLogRate > 1e-9 ? 1
                    : sumLogRate < o.sumLogRate - 1e-9 ? -1 : 0;
        }
    }
}
