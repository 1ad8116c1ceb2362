package dev.nanoplan.plan;

import dev.nanoplan.network.ChannelEntry;
import dev.nanoplan.network.ChannelMatrix;
import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.Scenario;
import java.util.List;
import java.util.Map;
import org.apache.commons.statistics.distribution.NormalDistribution;
import org.jgrapht.Graph;
import org.jgrapht.graph.DefaultEdge;
import org.jgrapht.graph.SimpleGraph;

/**
 * The conflict graph of a slot plan: one vertex per emitter, an edge between two emitters of a species
 * when one of them, sending in the other's slot, would be too loud at a receiver that the other's route
 * hops use.
 *
 * <p><b>Too loud.</b> Hop i → r (top level N_i, current-symbol tap p_0) separates its two hypotheses by
 * Δ = N_i·p_0 molecules. With a moment-matched Gaussian count (docs/architecture.md §5.6, Gaussian
 * model) the error at the mid threshold is about Q(Δ / 2σ), so the target ε allows a count variance of
 * at most (Δ / 2γ)², γ = Q⁻¹(ε) (at least 1). Another emitter j sending in the same slot adds, through
 * its current symbol alone (tap p^j_0 at r, prior q of a top level), the variance
 * v_j = N_j²·(p^j_0)²·q(1 − q) + q·N_j·p^j_0(1 − p^j_0) (law of total variance of a thinned on–off
 * release). An edge joins i and j when v_j exceeds {@value #SHARE} of that allowance: j alone would take
 * a quarter of what the hop may suffer. The test is pairwise; the sum of many quiet neighbours is
 * judged by the real planner in {@link SlotAssignment}'s local search.
 *
 * <p>Cost: O(Σ_hops emitters heard at the hop's receiver).
 */
public final class SlotConflictGraph {

    /** Share of a hop's variance allowance that one same-slot neighbour may take without an edge. */
    static final double SHARE = 0.25;

    private SlotConflictGraph() {
    }

    /**
     * The conflict graph of {@code scenario}'s emitters for the route hops {@code hops} (emitter, receiver
     * pairs) over {@code channel}.
     */
    public static Graph<String, DefaultEdge> of(Scenario scenario, ChannelMatrix channel, List<LinkKey> hops) {
        Graph<String, DefaultEdge> g = new SimpleGraph<>(DefaultEdge.class);
        Map<String, Node> nodes = scenario.nodesById();
        for (Node n : scenario.nodes()) {
            if (n.role().emits()) {
                g.addVertex(n.id());
            }
        }
        double eps = scenario.targets().maxErrorProbability();
        double gamma = Math.max(1, NormalDistribution.of(0, 1).inverseSurvivalProbability(Math.min(0.5, eps)));
        double q = LinkContext.weights(scenario.signalling())[scenario.signalling().levels() - 1];
        for (LinkKey hop : hops) {
            Node tx = nodes.get(hop.from());
            ChannelEntry own = channel.entry(hop.from(), hop.to());
            if (tx == null || own == null) {
                continue;
            }
            double gap = tx.moleculesPerSymbol() * own.tap(0);
            double allowance = Math.pow(gap / (2 * gamma), 2);
            for (ChannelEntry other : channel.atReceiver(hop.to())) {
                Node j = nodes.get(other.emitter());
                if (j == null || j.id().equals(tx.id()) || !j.emitsSpecies().equals(tx.emitsSpecies())) {
                    continue;
                }
                double mean = j.moleculesPerSymbol() * other.tap(0);
                double variance = mean * mean * q * (1 - q) + q * mean * (1 - other.tap(0));
                if (variance > SHARE * allowance) {
                    g.addEdge(tx.id(), j.id());
                }
            }
        }
        return g;
    }
}
