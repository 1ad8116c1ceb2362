package dev.nanoplan.plan;

import dev.nanoplan.network.Crosstalk;
import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.Signalling;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.function.DoubleConsumer;
import org.apache.commons.statistics.distribution.NormalDistribution;

/**
 * Joint molecule budgets ({@value MoleculeBudgets#JOINT}): every route emitter's molecules per symbol found
 * together, as a power-control problem ({@link JointBudgets}), then confirmed with the scenario's count model.
 *
 * <p><b>Gaussian stage.</b> With the counts moment-matched to Gaussians, adjacent levels a spacing
 * Δ = N_i·p_0/(M − 1) apart are told apart with symbol error ≈ 2(M − 1)/M · Q(Δ/(2σ)), so a hop meets the
 * target ε iff Δ/(2σ) ≥ z* = Q^{-1}(ε·M/(2(M − 1))). For large budgets σ² is dominated by the symbol
 * randomness of the own leftovers and of every other emitter j: σ² ≈ N_i² v·Σ_{k≥1} p_k² + Σ_j N_j² v·Σ_k p_jk²,
 * v the variance of the level fraction at the file's prior (binary: q(1 − q)). In the powers P = N² this is
 * Zander's linear form, with the normalised gain F_hj = v·Σ_k p_jk² / (p_0²/(4 z*²(M − 1)²) − v·Σ_{k≥1} p_k²)
 * (+∞ when the own leftovers alone forbid the target). The fixed point iterates P_i ← P_i·(z* ÷ z_i)², z_i
 * from the hop's error under the what-if Gaussian model ({@link LinkContext#whatIfModel()}) with every other
 * route emitter at its current budget, Poisson and background terms included. Emitters outside any route
 * stay at their file budgets (fixed crosstalk).
 *
 * <p><b>Conflicts.</b> When the radius is ≥ 1 the emitters carrying the Perron vector are reported infeasible
 * with the links in conflict and the radius, then left at their file budgets and the rest solved again;
 * likewise emitters still short at 2^20 molecules.
 *
 * <p><b>Exact stage.</b> From the Gaussian point, rounds of best responses with the scenario's count model
 * (each hop's search of {@link MoleculeBudgets#hop} with the others at their current budgets; a node takes
 * the largest over its hops), all nodes at once, until no budget changes (at most {@value #MAX_ROUNDS}
 * rounds). When settled, every budget meets the target and each N − 1 misses it with the others as
 * reported.
 */
final class JointMoleculeBudgets {

    static final int MAX_ROUNDS = 6;
    /**
     * Gaussian iterations at most: budgets are integers, so the iterate can hop between two neighbouring
     * counts without settling to 1e-3; the exact stage polishes what is left.
     */
    static final int GAUSSIAN_ITERATIONS = 300;
    private static final long MAX_MOLECULES = 1L << 20;
    private static final NormalDistribution STANDARD = NormalDistribution.of(0, 1);

    private JointMoleculeBudgets() {
    }

    /** Per node id: the budget (≥ 1) or −1, with the reason. */
    static Map<String, MoleculeBudgets.HopBudget> compute(Scenario scenario, Map<String, List<EvaluatedLink>> sends,
            MoleculeBudgets.Criterion c, DoubleConsumer progress) {
        Map<String, MoleculeBudgets.HopBudget> out = new LinkedHashMap<>();
        Map<String, Long> budget = new HashMap<>();
        for (String id : sends.keySet()) {
            budget.put(id, scenario.nodesById().get(id).moleculesPerSymbol());
        }
        List<String> open = new ArrayList<>(sends.keySet());
        String gaussian = "";
        while (!open.isEmpty()) {
            Map<String, Integer> index = new HashMap<>();
            for (int i = 0; i < open.size(); i++) {
                index.put(open.get(i), i);
            }
            List<JointBudgets.Hop> hops = new ArrayList<>();
            List<EvaluatedLink> links = new ArrayList<>();
            for (String id : open) {
                for (EvaluatedLink e : sends.get(id)) {
                    hops.add(gaussianHop(e.context(), index, c.target()));
                    links.add(e);
                }
            }
            double[] start = new double[open.size()];
            for (int i = 0; i < start.length; i++) {
                double n = budget.get(open.get(i));
                start[i] = n * n;
            }
            int levels = scenario.signalling().levels();
            double floor = (double) (levels - 1) * (levels - 1);
            JointBudgets.Result r = JointBudgets.solve(open.size(), hops, start, floor,
                    (double) MAX_MOLECULES * MAX_MOLECULES, 1e-3, GAUSSIAN_ITERATIONS);
            if (r.feasible()) {
                for (int i = 0; i < open.size(); i++) {
                    budget.put(open.get(i), (long) Math.ceil(Math.sqrt(r.power()[i])));
                }
                gaussian = String.format(Locale.ROOT, "Gaussian fixed point after %d iteration(s), spectral radius %.3g",
                        r.iterations(), r.spectralRadius());
                break;
            }
            List<String> names = new ArrayList<>();
            for (int i = 0; i < links.size(); i++) {
                if (r.conflict().contains(hops.get(i).emitter())) {
                    names.add(links.get(i).report().from() + " -> " + links.get(i).report().to());
                }
            }
            // an infinite radius (a link whose target no budget reaches) reads as a word, not "Infinity"
            String radius = Double.isFinite(r.spectralRadius())
                    ? String.format(Locale.ROOT, "%.3g", r.spectralRadius()) : "unbounded";
            String why = r.spectralRadius() >= 1
                    ? String.format(Locale.ROOT, "joint budgets infeasible: the links %s conflict (spectral radius of "
                            + "the normalised crosstalk-gain matrix %s, at least 1); left at the file budget",
                            String.join(", ", names), radius)
                    : String.format(Locale.ROOT, "joint budgets out of reach: %s still miss the target at 2^20 "
                            + "molecules with the others (spectral radius %.3g); left at the file budget",
                            String.join(", ", names), r.spectralRadius());
            List<String> dropped = new ArrayList<>();
            for (int i : r.conflict()) {
                dropped.add(open.get(i));
            }
            for (String id : dropped) {
                out.put(id, new MoleculeBudgets.HopBudget(-1, why));
            }
            open.removeAll(dropped);
        }
        polish(scenario, sends, c, open, budget, out, gaussian, progress);
        return out;
    }

    /** The exact stage (see the class comment) over the nodes of {@code open}. */
    private static void polish(Scenario scenario, Map<String, List<EvaluatedLink>> sends, MoleculeBudgets.Criterion c,
            List<String> open, Map<String, Long> budget, Map<String, MoleculeBudgets.HopBudget> out, String gaussian,
            DoubleConsumer progress) {
        Map<String, MoleculeBudgets.HopBudget> last = new HashMap<>();
        int round = 0;
        boolean changed = true;
        while (changed && round < MAX_ROUNDS && !open.isEmpty()) {
            round++;
            Map<String, Long> now = Map.copyOf(budget);
            List<EvaluatedLink> all = new ArrayList<>();
            for (String id : open) {
                all.addAll(sends.get(id));
            }
            Map<LinkKey, MoleculeBudgets.HopBudget> found = new java.util.concurrent.ConcurrentHashMap<>();
            all.parallelStream().forEach(e -> found.put(e.key(), MoleculeBudgets.hop(atBudgets(e.context(), now), c, true)));
            changed = false;
            for (String id : new ArrayList<>(open)) {
                MoleculeBudgets.HopBudget worst = null;
                String hop = null;
                for (EvaluatedLink e : sends.get(id)) {
                    MoleculeBudgets.HopBudget b = found.get(e.key());
                    String name = e.report().from() + " -> " + e.report().to();
                    if (b.molecules() < 0) {
                        worst = new MoleculeBudgets.HopBudget(-1, "joint: out of reach on " + name + " with the "
                                + "others at their joint budgets: " + b.reason());
                        hop = null;
                        break;
                    }
                    if (worst == null || b.molecules() > worst.molecules()) {
                        worst = b;
                        hop = name;
                    }
                }
                if (hop == null) {
                    out.put(id, worst);
                    open.remove(id);
                    changed = true;
                    continue;
                }
                changed |= worst.molecules() != now.get(id);
                budget.put(id, worst.molecules());
                last.put(id, new MoleculeBudgets.HopBudget(worst.molecules(), "set by " + hop + ": " + worst.reason()));
            }
            progress.accept(Math.min(1, round / (double) MAX_ROUNDS));
        }
        String settled = changed ? String.format(Locale.ROOT, "; not settled after %d exact rounds", round)
                : String.format(Locale.ROOT, "; exact model settled after %d round(s)", round);
        for (String id : open) {
            MoleculeBudgets.HopBudget b = last.get(id);
            out.put(id, new MoleculeBudgets.HopBudget(b.molecules(), b.reason() + "; joint with " + (open.size() - 1)
                    + " other route emitter(s): " + gaussian + settled));
        }
    }

    /** The link's context with its emitter and every route emitter among its interferers at {@code budget}. */
    static LinkContext atBudgets(LinkContext ctx, Map<String, Long> budget) {
        Signalling sig = ctx.signalling();
        List<Crosstalk.Interferer> others = new ArrayList<>(ctx.interferers.size());
        for (Crosstalk.Interferer i : ctx.interferers) {
            Long n = budget.get(i.id());
            others.add(n == null ? i : new Crosstalk.Interferer(i.id(), i.taps(), LinkContext.levelsOf(sig, n),
                    i.weights()));
        }
        Node e = ctx.emitter;
        long own = budget.getOrDefault(e.id(), e.moleculesPerSymbol());
        Node emitter = new Node(e.id(), e.role(), e.positionUm(), e.radiusUm(), e.species(), e.emitsSpecies(), own,
                e.fixed());
        return LinkContext.builder(ctx.scenario, emitter, ctx.receiver, ctx.species, ctx.entry)
                .interferers(others, ctx.exactCount).schedule(ctx.slots, ctx.physical).build();
    }

    /** z at symbol error {@code e}: Q^{-1}(e·M/(2(M − 1))), the error clamped to [1e-300, 0.5). */
    private static double z(double e, int levels) {
        double tail = e * levels / (2.0 * (levels - 1));
        return STANDARD.inverseSurvivalProbability(Math.max(1e-300, Math.min(0.5 - 1e-12, tail)));
    }

    /** The Gaussian hop of one link (see the class comment). */
    private static JointBudgets.Hop gaussianHop(LinkContext ctx, Map<String, Integer> index, double target) {
        Signalling sig = ctx.signalling();
        int levels = sig.levels();
        double zNeed = z(target, levels);
        double[] w = LinkContext.weights(sig);
        long[] unit = LinkContext.levelsOf(sig, levels - 1);
        double m1 = 0;
        double m2 = 0;
        for (int j = 0; j < w.length; j++) {
            double u = unit[j] / (double) (levels - 1);
            m1 += w[j] * u;
            m2 += w[j] * u * u;
        }
        double v = m2 - m1 * m1;
        double[] taps = ctx.entry.taps();
        double isi = 0;
        for (int k = 1; k < taps.length; k++) {
            isi += taps[k] * taps[k];
        }
        double spacing = taps[0] / (levels - 1);
        double denominator = spacing * spacing / (4 * zNeed * zNeed) - v * isi;
        double[] gains = new double[index.size()];
        for (Crosstalk.Interferer i : ctx.interferers) {
            Integer j = index.get(i.id());
            if (j == null) {
                continue;
            }
            double s = 0;
            for (double p : i.taps()) {
                s += p * p;
            }
            gains[j] += denominator > 0 ? v * s / denominator : Double.POSITIVE_INFINITY;
        }
        int me = index.get(ctx.emitter.id());
        if (!(denominator > 0)) {
            gains[me] = Double.POSITIVE_INFINITY;
        }
        double bg = ctx.scenario.medium().backgroundMoleculesPerS();
        return new JointBudgets.Hop() {
            @Override
            public int emitter() {
                return me;
            }

            @Override
            public double[] gains() {
                return gains.clone();
            }

            @Override
            public double ratio(double[] p) {
                List<Crosstalk.Interferer> others = new ArrayList<>(ctx.interferers.size());
                for (Crosstalk.Interferer i : ctx.interferers) {
                    Integer j = index.get(i.id());
                    others.add(j == null ? i : new Crosstalk.Interferer(i.id(), i.taps(),
                            LinkContext.levelsOf(sig, Math.round(Math.sqrt(p[j]))), i.weights()));
                }
                double e = ctx.whatIf(taps, Math.round(Math.sqrt(p[me])), ctx.symbolTimeS(), bg, others)
                        .minErrorProbability();
                double zNow = z(e, levels);
                return zNow > 0 ? (zNeed / zNow) * (zNeed / zNow) : 1e6;
            }
        };
    }
}
