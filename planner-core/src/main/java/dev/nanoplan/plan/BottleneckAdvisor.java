package dev.nanoplan.plan;

import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.Species;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.function.Function;

/**
 * Proposes changes that would fix a route's weak link, by searching the one quantity that would
 * fix it with everything else held fixed:
 * <ul>
 *   <li>distance: bisection on the centre distance between touching and the current one for the
 *       distance at which the link reaches the target capacity (analytic channels only);</li>
 *   <li>symbol time: doubling then bisection on T (own and interferers' taps and background
 *       recomputed, memory L kept) — for ISI-limited links (analytic only);</li>
 *   <li>molecules: doubling then bisection on the emitter's molecules per symbol, interference
 *       fixed — for signal- and noise-limited links;</li>
 *   <li>crosstalk: the top interferer gets its own species, and the nodes that decode it on the
 *       plan's routes follow it (analytic only: a given channel was obtained for the current
 *       species).</li>
 * </ul>
 * Capacity is taken as non-decreasing in each searched direction (closer, longer T, more
 * molecules), which holds for the models here away from pathological ISI; the answer is the
 * bisection bracket's safe end, rounded outward. Each proposal only looks at the one link; what
 * it does to the route and to every other demand is found by {@link AdviceChecker}, which
 * re-plans the layout with the change applied.
 */
final class BottleneckAdvisor {

    private static final int BISECTIONS = 30;
    private static final long MAX_MOLECULES = 1L << 24;
    private static final double MAX_T_FACTOR = 64;

    private BottleneckAdvisor() {
    }

    /**
     * What one route's weakest hop could use.
     *
     * @param candidates changes to check, in the order proposed
     * @param note       a statement that is not a change (the hop already meets the target, or no
     *                   single quantity reaches it), or empty
     * @param targetBits the hop capacity the searches aimed at, bit/symbol
     */
    record Proposal(List<Advice> candidates, String note, double targetBits) {

        Proposal {
            candidates = List.copyOf(candidates);
        }
    }

    /**
     * The proposals for the weakest hop {@code link} of a route.
     *
     * @param scenario  the planned layout (a kept link's context may refer to an earlier one)
     * @param followers the ids of the nodes that decode a given emitter on the plan's routes
     */
    static Proposal propose(Scenario scenario, LinkContext ctx, LinkReport link, double targetBits,
            Function<String, List<String>> followers) {
        String hop = link.from() + " -> " + link.to();
        if (link.mutualInformationBits() >= targetBits) {
            return new Proposal(List.of(), String.format(Locale.ROOT,
                    "weakest hop %s already carries %.3f bit/symbol (target %.2f)", hop, link.mutualInformationBits(),
                    targetBits), targetBits);
        }
        List<Advice> candidates = new ArrayList<>();
        String note = "";
        switch (link.limitedBy()) {
            case CROSSTALK -> {
                String top = link.topInterferer();
                String why = String.format(Locale.ROOT, "it brings %.0f%% of the crosstalk at %s",
                        100 * link.topInterfererShare(), link.to());
                if (ctx.analytic) {
                    String species = scenario.nodesById().get(top).emitsSpecies();
                    candidates.add(new Advice(new ScenarioEdit.OwnSpecies(top,
                            ScenarioEdit.OwnSpecies.freshName(scenario, species, top), followers.apply(top)), why,
                            link.from(), link.to()));
                } else {
                    note = "crosstalk limits " + hop + " (" + why + "); a change of species is not checked on a "
                            + "simulated channel";
                }
            }
            case ISI -> {
                Double t = ctx.analytic ? symbolTimeFor(ctx, targetBits, scenario.nodesById()) : null;
                if (t != null) {
                    candidates.add(new Advice(new ScenarioEdit.SymbolTime(t), "ISI limits " + hop, link.from(),
                            link.to()));
                } else {
                    note = "ISI limits " + hop + ": lengthening the symbol time alone does not reach the target; "
                            + isiRemedy(ctx.species);
                }
            }
            case SIGNAL, NOISE -> {
                Long n = moleculesFor(ctx, targetBits);
                if (n != null) {
                    candidates.add(new Advice(new ScenarioEdit.Molecules(link.from(), n), "", link.from(),
                            link.to()));
                } else {
                    note = "more molecules alone do not reach the target at " + hop;
                }
            }
            default -> throw new IllegalStateException();
        }
        if (ctx.analytic) {
            Double d = distanceFor(ctx, targetBits);
            if (d != null) {
                candidates.add(new Advice(new ScenarioEdit.MoveToward(link.from(), link.to(), d), "",
                        link.from(), link.to()));
            }
        }
        return new Proposal(candidates, note, targetBits);
    }

    /**
     * What else shortens the tail of the channel: a species that degrades (or degrades faster,
     * naming the current half-life), or shorter distances.
     */
    static String isiRemedy(Species species) {
        if (species.isStable()) {
            return "use a degrading species or move the nodes closer";
        }
        return String.format(Locale.ROOT, "use a species that degrades faster than %s (half-life %.3g s) or move the "
                + "nodes closer", species.name(), species.halfLifeS());
    }

    /** Largest centre distance at which the link reaches the target, or null. */
    static Double distanceFor(LinkContext ctx, double targetBits) {
        double lo = ctx.receiver.radiusUm() + ctx.emitter.radiusUm() + 1e-3;
        double hi = ctx.distance();
        if (hi <= lo || ctx.atDistance(lo).mutualInformationBits() < targetBits) {
            return null;
        }
        for (int i = 0; i < BISECTIONS && hi - lo > 1e-3; i++) {
            double mid = 0.5 * (lo + hi);
            if (ctx.atDistance(mid).mutualInformationBits() >= targetBits) {
                lo = mid;
            } else {
                hi = mid;
            }
        }
        return Math.floor(lo * 10) / 10;
    }

    /** Smallest molecules per symbol reaching the target capacity, interference fixed, or null. */
    static Long moleculesFor(LinkContext ctx, double targetBits) {
        long lo = ctx.emitter.moleculesPerSymbol();
        long hi = lo;
        while (ctx.withMoleculesBits(hi) < targetBits) {
            lo = hi;
            hi *= 2;
            if (hi > MAX_MOLECULES) {
                return null;
            }
        }
        while (hi - lo > Math.max(1, lo / 100)) {
            long mid = lo + (hi - lo) / 2;
            if (ctx.withMoleculesBits(mid) >= targetBits) {
                hi = mid;
            } else {
                lo = mid;
            }
        }
        return hi;
    }

    /** Smallest symbol time reaching the target (≤ 64 T), or null. */
    static Double symbolTimeFor(LinkContext ctx, double targetBits, Map<String, Node> nodes) {
        double lo = ctx.symbolTimeS();
        double hi = lo;
        while (ctx.withSymbolTime(hi, nodes).mutualInformationBits() < targetBits) {
            lo = hi;
            hi *= 2;
            if (hi > MAX_T_FACTOR * ctx.symbolTimeS()) {
                return null;
            }
        }
        for (int i = 0; i < 12 && hi - lo > 1e-3 * hi; i++) {
            double mid = 0.5 * (lo + hi);
            if (ctx.withSymbolTime(mid, nodes).mutualInformationBits() >= targetBits) {
                hi = mid;
            } else {
                lo = mid;
            }
        }
        return hi;
    }
}
