package dev.nanoplan.plan;

import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.Signalling;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.function.DoubleConsumer;

/**
 * Molecule budgets (the {@code budgets} of docs/architecture.md §4.3), one per emitting node.
 *
 * <p><b>Per hop.</b> The smallest molecules per top level N such that the hop's minimum error
 * probability is at most {@code targets.max_error_probability}, with its interference fixed:
 * doubling from 1, then bisection (to 1 %), taking the error as non-increasing in N; the search
 * uses the what-if count model and the result is confirmed with the scenario's model. A hop with no
 * such N below 2^20 (about 1.05e6, already a large release for one machine) is unreachable ("ISI/background floor").
 *
 * <p><b>Crosstalk grows with the budget.</b> In the all-active schedule every emitter would scale
 * its budget alike. When the hop has interferers and needs more than it has (scale s = N/N_now &gt; 1),
 * the hop is re-evaluated with every interferer's molecules scaled by s too; if the target is then
 * missed, s is doubled (up to 2^10) until met — the budget then says so — or the target is
 * reported unreachable: "crosstalk grows with the budget".
 *
 * <p><b>Per node.</b> N needed = the largest over the route hops it sends on. Under the all-active
 * schedule a node releases one symbol in every slot whatever number of demands it carries (a relay
 * forwarding k demands shares its slots among them, which divides each demand's rate by k but
 * does not multiply its release rate), so molecules per second = mean molecules per symbol ÷ T =
 * (Σ_j w_j n_j)/T, with binary n = {0, N} and w = {1 − q, q}: q·N/T; per mission = that × mission
 * duration. A node on no route still releases its configured N in every slot (it is an
 * interferer): its needed N is reported as 0 and its rate at the configured N.
 *
 * <p><b>Round-robin.</b> A node releases one symbol per frame of K slots of its emitted species
 * ({@link SlotSchedule}), so molecules per second = mean molecules per symbol ÷ (K·T). The hop
 * searches run on the link as heard in its emitter's slots (decimated taps), interferers scaled
 * alike as above.
 */
final class MoleculeBudgets {

    private static final long MAX_MOLECULES = 1L << 20;
    private static final double MAX_JOINT_SCALE = 1 << 10;

    private MoleculeBudgets() {
    }

    static List<BudgetReport> compute(Scenario scenario, List<List<EvaluatedLink>> routes,
            DoubleConsumer progress) {
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
        double target = scenario.targets().maxErrorProbability();
        Signalling sig = scenario.signalling();
        double[] w = LinkContext.weights(sig);
        SlotSchedule slots = SlotSchedule.of(scenario);
        Map<LinkKey, HopBudget> hopBudgets = new java.util.concurrent.ConcurrentHashMap<>();
        List<EvaluatedLink> hops = new ArrayList<>(uniqueHops.values());
        java.util.concurrent.atomic.AtomicInteger done = new java.util.concurrent.atomic.AtomicInteger();
        hops.parallelStream().forEach(e -> {
            hopBudgets.put(e.key(), hop(e.context(), target));
            progress.accept(done.incrementAndGet() / (double) Math.max(1, hops.size()));
        });
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
                out.add(new BudgetReport(n.id(), 0, rate, rate * scenario.targets().missionDurationS(), true,
                        "on no route; still releases its configured " + n.moleculesPerSymbol()
                                + " per symbol (" + sig.schedule().id() + ")"));
                continue;
            }
            long needed = 0;
            String reason = null;
            boolean feasible = true;
            for (EvaluatedLink e : mine) {
                HopBudget b = hopBudgets.get(e.key());
                if (b.molecules < 0) {
                    feasible = false;
                    reason = "unreachable on " + e.report().from() + " -> " + e.report().to() + ": " + b.reason;
                    break;
                }
                if (b.molecules > needed) {
                    needed = b.molecules;
                    reason = "set by " + e.report().from() + " -> " + e.report().to() + b.reason;
                }
            }
            if (!feasible) {
                out.add(new BudgetReport(n.id(), -1, -1, -1, false,
                        reason));
                continue;
            }
            double rate = meanMolecules(sig, w, needed) / (frame * sig.symbolTimeS());
            int k = carried.getOrDefault(n.id(), 0);
            String r = frame == 1
                    ? String.format(Locale.ROOT, "%s; error target %.3g; sends every slot for %d route hop(s)",
                            reason, target, k)
                    : String.format(Locale.ROOT, "%s; error target %.3g; sends 1 slot in %d for %d route hop(s)",
                            reason, target, frame, k);
            out.add(new BudgetReport(n.id(), needed, rate, rate * scenario.targets().missionDurationS(), true, r));
        }
        return out;
    }

    static double meanMolecules(Signalling sig, double[] w, long top) {
        long[] lv = LinkContext.levelsOf(sig, top);
        double m = 0;
        for (int j = 0; j < lv.length; j++) {
            m += w[j] * lv[j];
        }
        return m;
    }

    record HopBudget(long molecules, String reason) {
    }

    /**
     * The search runs on the what-if model ({@link LinkContext#whatIfModel()}); the budget it finds is
     * checked with the scenario's own model and raised in 10 % steps (at most 30) until that model
     * meets the target too. Returns −1 when it never does below 2^20 molecules.
     */
    static long confirmWithScenarioModel(LinkContext ctx, double target, long found) {
        if (ctx.whatIfModel() == ctx.signalling().countModel()) {
            return found;
        }
        long n = found;
        for (int i = 0; i < 30 && n <= MAX_MOLECULES; i++) {
            if (ctx.withMoleculesExact(n).minErrorProbability() <= target) {
                return n;
            }
            n = Math.max(n + 1, Math.round(n * 1.1));
        }
        return -1;
    }

    static HopBudget hop(LinkContext ctx, double target) {
        // one evaluation at the cap settles an error floor (ISI or background) before any search
        if (ctx.withMolecules(MAX_MOLECULES).minErrorProbability() > target) {
            return new HopBudget(-1, "error floor above the target even at 2^20 molecules (ISI or background)");
        }
        long lo = 0;
        long hi = 1;
        while (ctx.withMolecules(hi).minErrorProbability() > target) {
            lo = hi;
            hi *= 2;
            if (hi > MAX_MOLECULES) {
                return new HopBudget(-1, "error floor above the target even at 2^20 molecules (ISI or background)");
            }
        }
        while (hi - lo > Math.max(1, lo / 100)) {
            long mid = lo + (hi - lo) / 2;
            if (ctx.withMolecules(mid).minErrorProbability() <= target) {
                hi = mid;
            } else {
                lo = mid;
            }
        }
        hi = confirmWithScenarioModel(ctx, target, hi);
        if (hi < 0) {
            return new HopBudget(-1, "error floor above the target even at 2^20 molecules (ISI or background)");
        }
        long now = ctx.emitter.moleculesPerSymbol();
        if (ctx.interferers.isEmpty() || hi <= now) {
            return new HopBudget(hi, "");
        }
        double s = (double) hi / now;
        long loudest = now;
        for (var i : ctx.interferers) {
            long[] lv = i.levelMolecules();
            loudest = Math.max(loudest, lv[lv.length - 1]);
        }
        if (s * loudest > MAX_MOLECULES) {
            return new HopBudget(hi, " (with interference fixed; scaling every emitter alike exceeds 2^20 molecules"
                    + " and was not checked)");
        }
        if (ctx.allScaled(s).minErrorProbability() <= target) {
            return new HopBudget(hi, "");
        }
        while (s < MAX_JOINT_SCALE && 2 * s * loudest <= MAX_MOLECULES) {
            s *= 2;
            if (ctx.allScaled(s).minErrorProbability() <= target) {
                return new HopBudget(Math.round(s * now), String.format(Locale.ROOT,
                        " (crosstalk grows with the budget: met only with every emitter scaled x%.3g)", s));
            }
        }
        return new HopBudget(-1, "unreachable: crosstalk grows with the budget");
    }

}
