package dev.nanoplan.plan;

import dev.nanoplan.info.ChannelCascade;
import dev.nanoplan.network.LinkGraph;
import dev.nanoplan.network.LinkSpec;
import dev.nanoplan.scenario.Demand;
import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.Signalling;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;

/**
 * Turns a demand into its route, the same way for every plan: the widest path on the link graph
 * ({@link WidestPathFinder}); when there is none, the reason in words (the source cannot send, the
 * destination cannot receive, the source has no link above the floor, the destination hears none,
 * or no chain joins them) and the advice to add a relay or move closer; otherwise the
 * operating point of the symbol-forwarding cascade: the mutual information of the product of the
 * hops' transition matrices at their operating thresholds ({@link ChannelCascade}) at the file's
 * input law (binary: prior q; more levels: uniform), never above the weakest hop, the evaluator's
 * advice for the weakest hop, and a warning when the rate is below the target. Every figure is the
 * operating mutual information (what the demands deliver at the file's prior), never the capacity.
 *
 * <p>Rates and latency: one symbol per frame, so a route's rate is its end-to-end information over
 * the longest frame K_max·T of its hops, its latency Σ K_h·T (all-active: frames of one slot, rate
 * I/T, latency hops × T).
 */
final class RouteAssembler {

    private final PlanInputs in;
    private final LinkGraph graph;
    private final Map<LinkKey, EvaluatedLink> byPair;
    private final Map<LinkKey, Double> evaluatedCapacity;
    private final ReceiverEvaluator evaluator;

    /**
     * @param byPair            the plan's links (those in {@code graph})
     * @param evaluatedCapacity operating mutual information of every evaluated pair, the routes' "direct"
     *                          figure
     */
    RouteAssembler(PlanInputs in, LinkGraph graph, Map<LinkKey, EvaluatedLink> byPair,
            Map<LinkKey, Double> evaluatedCapacity, ReceiverEvaluator evaluator) {
        this.in = in;
        this.graph = graph;
        this.byPair = byPair;
        this.evaluatedCapacity = evaluatedCapacity;
        this.evaluator = evaluator;
    }

    /**
     * The route of one demand; its hops' links are added to {@code hopsOut} (nothing when unreachable),
     * its warnings (unreachable, below the rate target) to {@code warnings}.
     */
    RouteReport route(Demand d, List<EvaluatedLink> hopsOut, List<String> warnings) {
        Map<String, Node> nodes = in.nodes();
        Node src = nodes.get(d.from());
        Node dst = nodes.get(d.to());
        Double direct = evaluatedCapacity.get(new LinkKey(d.from(), d.to()));
        WidestPathFinder.Result<String> path = WidestPathFinder.find(graph.graph(), d.from(), d.to());
        if (!path.reachable()) {
            String why;
            boolean speciesSent = nodes.values().stream()
                    .anyMatch(n -> n.role().emits() && n.emitsSpecies().equals(dst.species()));
            if (dst.role().absorbs() && !speciesSent) {
                // no placement helps: nothing of its species is ever released (the scenario reader warns too)
                String advice = "no route: " + d.to() + " senses species " + dst.species() + ", which no emitter "
                        + "sends; give it a species an emitter sends, or add an emitter of " + dst.species();
                warnings.add("demand " + d.from() + " -> " + d.to() + ": " + advice);
                return new RouteReport(d.from(), d.to(), List.of(), 0, null, null, 0, 0, 0, direct, null, advice);
            }
            if (!src.role().emits()) {
                why = d.from() + " is a " + src.role().id() + " and cannot send";
            } else if (!dst.role().absorbs()) {
                why = d.to() + " is a " + dst.role().id() + " and cannot receive";
            } else if (graph.graph().outDegreeOf(d.from()) == 0) {
                why = d.from() + " has no link above " + bits(graph.floorBits()) + " bit to any node";
            } else if (graph.graph().inDegreeOf(d.to()) == 0) {
                why = d.to() + " hears no emitter above " + bits(graph.floorBits()) + " bit";
            } else {
                why = "no chain of links above " + bits(graph.floorBits()) + " bit joins them";
            }
            String advice = "no route: " + why + "; add a relay between them or move " + d.from() + " closer to "
                    + d.to();
            warnings.add("demand " + d.from() + " -> " + d.to() + ": " + advice);
            return new RouteReport(d.from(), d.to(), List.of(), 0, null, null, 0, 0, 0, direct, null, advice);
        }
        List<String> v = path.vertices();
        List<double[][]> matrices = new ArrayList<>();
        EvaluatedLink weakest = null;
        int frameSlotsSum = 0;
        int frameSlotsMax = 1;
        for (int i = 0; i + 1 < v.size(); i++) {
            EvaluatedLink e = byPair.get(new LinkKey(v.get(i), v.get(i + 1)));
            hopsOut.add(e);
            frameSlotsSum += e.frameSlots();
            frameSlotsMax = Math.max(frameSlotsMax, e.frameSlots());
            matrices.add(e.edge().channel());
            if (weakest == null || e.report().mutualInformationBits() < weakest.report().mutualInformationBits()) {
                weakest = e;
            }
        }
        Signalling sig = in.scenario().signalling();
        double symbolT = sig.symbolTimeS();
        double weakestBits = weakest.report().mutualInformationBits();
        double endToEnd = matrices.size() == 1 ? weakestBits
                : Math.min(ChannelCascade.mutualInformationBits(LinkSpec.symbolWeights(sig.levels(), sig.priorOne()),
                        matrices.toArray(new double[0][][])), weakestBits);
        String advice = evaluator.advice(in, weakest);
        double rate = endToEnd / (frameSlotsMax * symbolT);
        double minRate = in.scenario().targets().minRateBitsPerS();
        if (rate < minRate) {
            warnings.add(String.format(Locale.ROOT, "demand %s -> %s: %.3g bit/s is below the target %.3g bit/s",
                    d.from(), d.to(), rate, minRate));
        }
        return new RouteReport(d.from(), d.to(), v, weakestBits, weakest.report().from(),
                weakest.report().to(), endToEnd, rate, frameSlotsSum * symbolT, direct,
                weakest.report().limitedBy(), advice);
    }

    /** A capacity in bits for the "why unreachable" text: three significant digits. */
    private static String bits(double v) {
        return String.format(Locale.ROOT, "%.3g", v);
    }
}
