package dev.nanoplan.plan;

import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.Species;
import java.util.Locale;
import java.util.Map;

/**
 * Turns a weak link into an action a device engineer can take, by searching the one quantity that
 * would fix it with everything else held fixed:
 * <ul>
 *   <li>distance: bisection on the centre distance between touching and the current one for the
 *       distance at which the link reaches the target capacity (analytic channels only);</li>
 *   <li>symbol time: doubling then bisection on T (own and interferers' taps and background
 *       recomputed, memory L kept) — for ISI-limited links (analytic only);</li>
 *   <li>molecules: doubling then bisection on the emitter's molecules per symbol, interference
 *       fixed — for signal- and noise-limited links;</li>
 *   <li>crosstalk: the top interferer gets its own species.</li>
 * </ul>
 * Capacity is taken as non-decreasing in each searched direction (closer, longer T, more
 * molecules), which holds for the models here away from pathological ISI; the answer is the
 * bisection bracket's safe end, rounded outward.
 */
final class BottleneckAdvisor {

    private static final int BISECTIONS = 30;
    private static final long MAX_MOLECULES = 1L << 24;
    private static final double MAX_T_FACTOR = 64;

    private BottleneckAdvisor() {
    }

    static String advise(LinkContext ctx, LinkReport link, double targetBits, Map<String, Node> nodes) {
        String hop = link.from() + " -> " + link.to();
        if (link.mutualInformationBits() >= targetBits) {
            return String.format(Locale.ROOT, "weakest hop %s already carries %.3f bit/symbol (target %.2f)", hop,
                    link.mutualInformationBits(), targetBits);
        }
        StringBuilder sb = new StringBuilder();
        switch (link.limitedBy()) {
            case CROSSTALK -> sb.append(String.format(Locale.ROOT,
                    "give %s its own species (it brings %.0f%% of the crosstalk at %s)", link.topInterferer(),
                    100 * link.topInterfererShare(), link.to()));
            case ISI -> {
                Double t = ctx.analytic ? symbolTimeFor(ctx, targetBits, nodes) : null;
                sb.append(t != null
                        ? String.format(Locale.ROOT, "lengthen the symbol time to %.3g s (ISI limits %s)", t, hop)
                        : "ISI limits " + hop + ": lengthening the symbol time alone does not reach the target; "
                                + isiRemedy(ctx.species));
            }
            case SIGNAL, NOISE -> {
                Long n = moleculesFor(ctx, targetBits);
                sb.append(n != null
                        ? String.format(Locale.ROOT, "release more molecules (>= %d per symbol at %s)", n,
                                link.from())
                        : "more molecules alone do not reach the target at " + hop);
            }
            default -> throw new IllegalStateException();
        }
        if (ctx.analytic) {
            Double d = distanceFor(ctx, targetBits);
            if (d != null) {
                sb.append(String.format(Locale.ROOT, "; or move %s within %.1f µm of %s", link.from(), d, link.to()));
            }
        }
        sb.append(String.format(Locale.ROOT, " (to reach %.2f bit/symbol)", targetBits));
        return sb.toString();
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
