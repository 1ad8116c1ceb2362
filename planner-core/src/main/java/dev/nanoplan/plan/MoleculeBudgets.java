package dev.nanoplan.plan;

import dev.nanoplan.network.Crosstalk;
import dev.nanoplan.network.LinkEvaluation;
import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.Signalling;
import dev.nanoplan.scenario.Targets;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.ConcurrentHashMap;
import java.util.concurrent.atomic.AtomicInteger;
import java.util.function.DoubleConsumer;
import java.util.function.LongFunction;

/**
 * Molecule budgets, one per emitting node: the fewest molecules per symbol (top level N) that meet
 * the scenario's target on every route hop the node sends on.
 *
 * <p><b>Reading ({@value #INDEPENDENT}).</b> Per node: the node alone changes its N, every other
 * emitter stays at its file budget (its crosstalk at each receiver is fixed). Budgets of different
 * nodes are therefore not a joint design: raising two nodes together changes each other's crosstalk.
 *
 * <p><b>What a budget meets.</b> The hop's minimum error probability over decision thresholds at the
 * file's prior q, min_τ (1 − q)·P(Y ≥ τ | 0) + q·P(Y &lt; τ | 1) (for more levels the MAP symbol error
 * at uniform inputs) — the link's {@code min_error_probability}: the budget designs the detector, so
 * the threshold is re-chosen at every N. A hop's budget N meets {@code targets.max_error_probability}
 * under the scenario's count model, and N − 1 misses it (or N is the smallest N the levels allow,
 * M − 1 for M levels).
 *
 * <p><b>Count-blind targets.</b> A detector that ignores the count and always decides the likeliest
 * level errs with probability 1 − max_j w_j (binary: min(q, 1 − q)). A target at or above that is met
 * at any N, so it cannot size a budget: the budgets are then sized for {@code targets.min_rate_bits_per_s}
 * instead — each hop's mutual information at the operating prior per symbol period (bits per K·T for a
 * frame of K slots) must reach that rate, a necessary condition (the route's cascade and shared rates
 * deliver less; no N reaches a rate above the input entropy H(w) per symbol period, I(X;Y) ≤ H(X),
 * C. E. Shannon, "A mathematical theory of communication", 1948) — or, when no rate target is set,
 * they are not sized; the budget is flagged
 * ({@link BudgetReport#countBlindTarget()}) and {@link #warnings} says so.
 *
 * <p><b>Search per hop</b> (everything else fixed; every decision with the scenario's count model).
 * (1) The file N, the value of the link table. If it misses, 2^20 molecules (about 1.05e6, already a
 * large release for one machine): if that misses too, the hop is out of reach and the reason gives
 * that floor and what sets it (the floor without own ISI, without the crosstalk of the others at
 * their file budgets, without background). (2) Only when the scenario asks for the exact model: an
 * estimate with the what-if model ({@link LinkContext#whatIfModel()}, the moment-matched Gaussian,
 * much cheaper than exact convolution), doubling from 1, then bisection to 1 %. (3) From the estimate
 * (else the file N) up in growing steps until the target is met and down until it is missed, then
 * bisection on integers until N meets and N − 1 misses.
 *
 * <p><b>Monotonicity.</b> The bisection assumes the criterion is monotone in N (error non-increasing,
 * information non-decreasing) with the rest fixed. More own molecules raise the current symbol's
 * signal and the own leftovers (ISI) in proportion, so this holds whenever the current symbol's tap
 * dominates, but it is not a theorem for discrete counts with ISI. Guard: the found N is checked again
 * at 2N; if the target is missed there, the reason says the criterion is not monotone on this hop.
 *
 * <p><b>Per node.</b> N needed = the largest over the route hops it sends on. A node releases one
 * symbol per frame of K slots of its emitted species (K = 1 under all-active, {@link SlotSchedule})
 * whatever number of demands it carries, so molecules per second = mean molecules per symbol ÷ (K·T)
 * = (Σ_j w_j n_j)/(K·T) (binary: q·N/(K·T)); per mission = that × mission duration. A node on no
 * route still releases its configured N (it is an interferer): its needed N is reported as 0 and its
 * rate at the configured N.
 *
 * <p>Cost per hop: about 25 what-if evaluations (exact model only) and 10 to 25 with the scenario's
 * model, four more at 2^20 molecules for a hop out of reach.
 */
final class MoleculeBudgets {

    /** The {@link BudgetReport#method()} of every budget: per node, the others at their file budgets. */
    static final String INDEPENDENT = "independent";
    /** The {@link BudgetReport#method()} of budgets found together ({@link JointMoleculeBudgets}). */
    static final String JOINT = "joint";

    private static final long MAX_MOLECULES = 1L << 20;

    private MoleculeBudgets() {
    }

    static List<BudgetReport> compute(Scenario scenario, List<List<EvaluatedLink>> routes,
            DoubleConsumer progress) {
        return compute(scenario, routes, progress, false);
    }

    /**
     * The budgets, {@code joint} ({@link JointMoleculeBudgets}) or independent (above). A count-blind error
     * target sizes budgets for a rate, which has no Gaussian power-control form: those stay independent.
     */
    static List<BudgetReport> compute(Scenario scenario, List<List<EvaluatedLink>> routes,
            DoubleConsumer progress, boolean joint) {
        Map<String, List<EvaluatedLink>> sends = new LinkedHashMap<>();
        Map<String, Integer> carried = new LinkedHashMap<>();
        Map<LinkKey, EvaluatedLink> uniqueHops = new LinkedHashMap<>();
        for (List<EvaluatedLink> r : routes) {
            for (EvaluatedLink e : r) {
                LinkKey k = e.key();
                if (uniqueHops.putIfAbsent(k, e) == null) {
                    sends.computeIfAbsent(e.report().from(), x -> new ArrayList<>()).add(e);
                }
                carried.merge(e.report().from(), 1, Integer::sum);
            }
        }
        Targets targets = scenario.targets();
        Signalling sig = scenario.signalling();
        double[] w = LinkContext.weights(sig);
        SlotSchedule slots = SlotSchedule.of(scenario);
        Criterion criterion = Criterion.of(scenario);
        Map<LinkKey, HopBudget> hopBudgets = new ConcurrentHashMap<>();
        List<EvaluatedLink> hops = new ArrayList<>(uniqueHops.values());
        AtomicInteger done = new AtomicInteger();
        Map<String, HopBudget> together = null;
        if (joint && criterion != null && criterion.error()) {
            together = JointMoleculeBudgets.compute(scenario, sends, criterion, progress);
        } else if (criterion != null) {
            hops.parallelStream().forEach(e -> {
                hopBudgets.put(e.key(), hop(e.context(), criterion));
                progress.accept(done.incrementAndGet() / (double) Math.max(1, hops.size()));
            });
        }
        boolean blind = countBlind(scenario);
        List<BudgetReport> out = new ArrayList<>();
        for (Node n : scenario.nodes()) {
            if (!n.role().emits()) {
                continue;
            }
            List<EvaluatedLink> mine = sends.get(n.id());
            // one symbol per frame of K slots (K = 1 under all-active)
            int frame = slots.frameSlots(n.emitsSpecies());
            if (mine == null) {
                double rate = meanMolecules(sig, w, n.moleculesPerSymbol()) / (frame * sig.symbolTimeS());
                out.add(new BudgetReport(n.id(), 0, rate, rate * targets.missionDurationS(), true,
                        "on no route; still releases its configured " + n.moleculesPerSymbol()
                                + " per symbol (" + sig.schedule().id() + ")", INDEPENDENT, blind));
                continue;
            }
            if (criterion == null) {
                out.add(new BudgetReport(n.id(), -1, -1, -1, true, String.format(Locale.ROOT,
                        "not sized: the error target %.3g is met without counting (a detector that always decides "
                                + "the likeliest level errs with %.3g) and targets.min_rate_bits_per_s is 0; set a "
                                + "rate target, or an error target below %.3g", targets.maxErrorProbability(),
                        blindError(sig), blindError(sig)), INDEPENDENT, true));
                continue;
            }
            long needed = 0;
            String reason = null;
            boolean feasible = true;
            if (together != null) {
                HopBudget b = together.get(n.id());
                needed = b.molecules;
                reason = b.reason;
                feasible = needed >= 0;
                mine = List.of();
            }
            String method = together != null ? JOINT : INDEPENDENT;
            for (EvaluatedLink e : mine) {
                HopBudget b = hopBudgets.get(e.key());
                if (b.molecules < 0) {
                    feasible = false;
                    reason = "out of reach on " + e.report().from() + " -> " + e.report().to() + ": " + b.reason;
                    break;
                }
                if (reason == null || b.molecules > needed) {
                    needed = b.molecules;
                    reason = "set by " + e.report().from() + " -> " + e.report().to() + ": " + b.reason;
                }
            }
            if (!feasible) {
                out.add(new BudgetReport(n.id(), -1, -1, -1, false, reason, method, blind));
                continue;
            }
            double rate = meanMolecules(sig, w, needed) / (frame * sig.symbolTimeS());
            int k = carried.getOrDefault(n.id(), 0);
            String r = frame == 1
                    ? String.format(Locale.ROOT, "%s; sends every slot for %d route hop(s)", reason, k)
                    : String.format(Locale.ROOT, "%s; sends 1 slot in %d for %d route hop(s)", reason, frame, k);
            out.add(new BudgetReport(n.id(), needed, rate, rate * targets.missionDurationS(), true, r, method, blind));
        }
        return out;
    }

    /** The error of a detector that ignores the count: 1 − the largest level prior (binary: min(q, 1 − q)). */
    static double blindError(Signalling sig) {
        double max = 0;
        for (double x : LinkContext.weights(sig)) {
            max = Math.max(max, x);
        }
        return 1 - max;
    }

    /** Whether the scenario's error target is met by a detector that ignores the count. */
    static boolean countBlind(Scenario scenario) {
        return scenario.targets().maxErrorProbability() >= blindError(scenario.signalling());
    }

    /**
     * The plan warning of a count-blind error target (empty list otherwise): what it means and what the
     * budgets are sized for instead.
     */
    static List<String> warnings(Scenario scenario) {
        if (!countBlind(scenario)) {
            return List.of();
        }
        Targets t = scenario.targets();
        double blind = blindError(scenario.signalling());
        return List.of(String.format(Locale.ROOT, "targets.max_error_probability %.3g is met by a detector that "
                + "ignores the count (always deciding the likeliest level errs with %.3g), so it says nothing about "
                + "the links; %s", t.maxErrorProbability(), blind, t.minRateBitsPerS() > 0
                        ? String.format(Locale.ROOT, "budgets are sized for targets.min_rate_bits_per_s %.3g instead",
                                t.minRateBitsPerS())
                        : "budgets are not sized (no targets.min_rate_bits_per_s); set an error target below "
                                + String.format(Locale.ROOT, "%.3g", blind)));
    }

    static double meanMolecules(Signalling sig, double[] w, long top) {
        long[] lv = LinkContext.levelsOf(sig, top);
        double m = 0;
        for (int j = 0; j < lv.length; j++) {
            m += w[j] * lv[j];
        }
        return m;
    }

    /** Mutual information per symbol at the operating prior (uniform inputs for more levels), bits. */
    static double operatingBits(LinkEvaluation e) {
        return e.binary() != null ? e.binary().mutualInformationBits() : e.multiLevel().uniformMutualInformationBits();
    }

    /**
     * What a hop's budget must meet: the minimum error probability at most {@code target}, or (for a
     * count-blind error target) the operating-point rate at least {@code target} bit/s.
     */
    record Criterion(boolean error, double target) {

        /** The criterion of the scenario's targets, or null when the budgets cannot be sized. */
        static Criterion of(Scenario s) {
            if (!countBlind(s)) {
                return new Criterion(true, s.targets().maxErrorProbability());
            }
            return s.targets().minRateBitsPerS() > 0 ? new Criterion(false, s.targets().minRateBitsPerS()) : null;
        }

        /** The error probability or the rate in bit/s. */
        double value(LinkEvaluation e) {
            return error ? e.minErrorProbability() : operatingBits(e) / e.spec().symbolTimeS();
        }

        boolean meets(LinkEvaluation e) {
            double v = value(e);
            return error ? v <= target : v >= target;
        }

        String name() {
            return error ? "min error" : "rate";
        }

        /** Six significant digits: the values at N and N − 1 differ in the last few. */
        String describe(double v) {
            String n = v == 0 ? "0" : String.format(Locale.ROOT, "%.6g", v);
            return error ? n : n + " bit/s";
        }

        String targetText() {
            return error ? String.format(Locale.ROOT, "error target %.3g", target)
                    : String.format(Locale.ROOT, "rate target %.3g bit/s per hop (the error target is count-blind)",
                            target);
        }
    }

    /** A hop's budget: molecules ≥ 1, or −1 when out of reach; reason in words. */
    record HopBudget(long molecules, String reason) {
    }

    /** The search of one hop (see the class comment). */
    static HopBudget hop(LinkContext ctx, Criterion c) {
        return hop(ctx, c, false);
    }

    /**
     * The search of one hop; with {@code startAtCurrent}, when the emitter's budget as given meets the
     * criterion and one molecule fewer misses it, that budget is the answer at once (two evaluations instead of
     * a search: the joint rounds start every hop from the previous round's answer, which mostly still holds).
     */
    static HopBudget hop(LinkContext ctx, Criterion c, boolean startAtCurrent) {
        if (!c.error()) {
            // at the operating prior no N carries more than the input entropy H(w) bits per symbol
            double periodS = ctx.symbolTimeS() * ctx.frameSlots;
            double entropyBits = 0;
            for (double w : LinkContext.weights(ctx.signalling())) {
                entropyBits -= w > 0 ? w * Math.log(w) / Math.log(2) : 0;
            }
            if (c.target() * periodS > entropyBits) {
                return new HopBudget(-1, String.format(Locale.ROOT, "no budget reaches the %s: it needs %.4g bit per "
                        + "symbol (%.3g s), above the %.4g bit the input entropy at the file's prior allows at any N",
                        c.targetText(), c.target() * periodS, periodS, entropyBits));
            }
        }
        Map<Long, LinkEvaluation> memo = new HashMap<>();
        LongFunction<LinkEvaluation> exact = n -> memo.computeIfAbsent(n, ctx::withMoleculesExact);
        int levels = ctx.signalling().levels();
        // below M − 1 the levels are clamped to 0..M−1: N = M − 2 acts as the conventional miss
        long lo = levels - 2;
        long hi = -1;
        long now = Math.max(levels - 1, ctx.emitter.moleculesPerSymbol());
        if (now <= MAX_MOLECULES) {
            if (c.meets(exact.apply(now))) {
                hi = now;
            } else {
                lo = now;
            }
        }
        if (startAtCurrent && hi > levels - 1 && !c.meets(exact.apply(hi - 1))) {
            lo = hi - 1;
        }
        long estimate = hi > 0 ? hi : lo + 1;
        boolean sameModel = ctx.whatIfModel() == ctx.signalling().countModel();
        if (hi < 0) {
            // the file N misses: settle a floor of the node's own budget, with the scenario's model
            LinkEvaluation atCap = exact.apply(MAX_MOLECULES);
            if (!c.meets(atCap)) {
                return new HopBudget(-1, floorReason(ctx, c, atCap));
            }
            estimate = lo + 1;
        }
        if (!sameModel && (hi < 0 || hi - lo > 1)) {
            estimate = whatIfEstimate(ctx, c, levels - 1);
        }
        estimate = Math.max(lo + 1, hi > 0 ? Math.min(hi, estimate) : estimate);
        if (c.meets(exact.apply(estimate))) {
            hi = estimate;
        } else {
            lo = estimate;
        }
        // widen to a bracket: lo misses, hi meets
        long step = Math.max(1, lo / 10);
        while (hi < 0) {
            long next = lo + step;
            // the cap is known to meet
            next = Math.min(next, MAX_MOLECULES);
            if (c.meets(exact.apply(next))) {
                hi = next;
            } else {
                lo = next;
                step *= 2;
            }
        }
        step = Math.max(1, hi / 10);
        while (hi - lo > 1) {
            long next = hi - step;
            if (next <= lo) {
                break;
            }
            if (c.meets(exact.apply(next))) {
                hi = next;
                step *= 2;
            } else {
                lo = next;
            }
        }
        while (hi - lo > 1) {
            long mid = lo + (hi - lo) / 2;
            if (c.meets(exact.apply(mid))) {
                hi = mid;
            } else {
                lo = mid;
            }
        }
        double at = c.value(exact.apply(hi));
        String reason = lo >= levels - 1
                ? String.format(Locale.ROOT, "%s %s at N, %s at N - 1; %s", c.name(), c.describe(at),
                        c.describe(c.value(exact.apply(lo))), c.targetText())
                : String.format(Locale.ROOT, "%s %s at the fewest molecules the levels allow; %s", c.name(),
                        c.describe(at), c.targetText());
        long twice = 2 * hi;
        if (twice <= MAX_MOLECULES && !c.meets(exact.apply(twice))) {
            reason += String.format(Locale.ROOT, "; not monotone in N here: %s %s at 2N", c.name(),
                    c.describe(c.value(exact.apply(twice))));
        }
        return new HopBudget(hi, reason);
    }

    /** What-if model: the smallest N to 1 % (doubling, then bisection); the cap is known to meet. */
    private static long whatIfEstimate(LinkContext ctx, Criterion c, long first) {
        long lo = 0;
        long hi = Math.max(1, first);
        while (hi < MAX_MOLECULES && !c.meets(ctx.withMolecules(hi))) {
            lo = hi;
            hi = Math.min(MAX_MOLECULES, hi * 2);
        }
        while (hi - lo > Math.max(1, lo / 100)) {
            long mid = lo + (hi - lo) / 2;
            if (c.meets(ctx.withMolecules(mid))) {
                hi = mid;
            } else {
                lo = mid;
            }
        }
        return hi;
    }

    /**
     * Why the node's own budget cannot reach the target on this hop: the value at 2^20 molecules (the
     * others at their file budgets) and the same without each impairment, with the scenario's model.
     */
    private static String floorReason(LinkContext ctx, Criterion c, LinkEvaluation atCap) {
        double bg = ctx.scenario.medium().backgroundMoleculesPerS();
        double[] taps = ctx.entry.taps();
        double t = ctx.symbolTimeS();
        Map<String, LinkEvaluation> without = new LinkedHashMap<>();
        if (!ctx.interferers.isEmpty()) {
            without.put("crosstalk", ctx.evaluate(taps, MAX_MOLECULES, t, bg, List.<Crosstalk.Interferer>of()));
        }
        if (taps.length > 1) {
            without.put("own ISI", ctx.evaluate(new double[] {taps[0]}, MAX_MOLECULES, t, bg, ctx.interferers));
        }
        if (bg > 0) {
            without.put("background", ctx.evaluate(taps, MAX_MOLECULES, t, 0, ctx.interferers));
        }
        List<String> parts = new ArrayList<>();
        String setBy = null;
        for (Map.Entry<String, LinkEvaluation> w : without.entrySet()) {
            parts.add("without " + w.getKey() + " " + c.describe(c.value(w.getValue())));
            if (c.meets(w.getValue())) {
                setBy = setBy == null ? w.getKey() : setBy + " or " + w.getKey();
            }
        }
        return String.format(Locale.ROOT, "this node's own budget cannot reach the %s: at 2^20 molecules (others at "
                + "their file budgets) the %s is %s%s%s", c.targetText(), c.name(), c.describe(c.value(atCap)),
                parts.isEmpty() ? "" : " (" + String.join(", ", parts) + ")",
                setBy == null ? "" : "; removing " + setBy + " would meet it");
    }
}
