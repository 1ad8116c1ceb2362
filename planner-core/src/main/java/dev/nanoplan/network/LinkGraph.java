package dev.nanoplan.network;

import java.util.Collection;
import org.jgrapht.Graph;
import org.jgrapht.graph.DefaultDirectedWeightedGraph;

/**
 * The link graph: vertices are node ids, edges the links whose capacity is at least the floor,
 * with the capacity (bits per symbol) as edge weight.
 */
public final class LinkGraph {

    private final DefaultDirectedWeightedGraph<String, LinkEdge> graph;
    private final double floorBits;

    private LinkGraph(DefaultDirectedWeightedGraph<String, LinkEdge> graph, double floorBits) {
        this.graph = graph;
        this.floorBits = floorBits;
    }

    /**
     * Builds the graph. O(|V| + |E|).
     *
     * @param vertices  every node id (nodes without links stay as isolated vertices)
     * @param links     candidate links; those below {@code floorBits} are left out
     * @param floorBits capacity floor, ≥ 0
     */
    public static LinkGraph of(Collection<String> vertices, Collection<LinkEdge> links, double floorBits) {
        if (!(floorBits >= 0)) {
            throw new IllegalArgumentException("floorBits: must be >= 0, got " + floorBits);
        }
        DefaultDirectedWeightedGraph<String, LinkEdge> g = new DefaultDirectedWeightedGraph<>(LinkEdge.class);
        vertices.forEach(g::addVertex);
        for (LinkEdge e : links) {
            if (e.capacityBits() >= floorBits) {
                g.addVertex(e.from());
                g.addVertex(e.to());
                g.addEdge(e.from(), e.to(), e);
                g.setEdgeWeight(e, e.capacityBits());
            }
        }
        return new LinkGraph(g, floorBits);
    }

    /** The JGraphT graph (live; do not modify). */
    public Graph<String, LinkEdge> graph() {
        return graph;
    }

    /** The capacity floor the graph was built with. */
    public double floorBits() {
        return floorBits;
    }

    /** The link from → to, or null. */
    public LinkEdge link(String from, String to) {
        if (!graph.containsVertex(from) || !graph.containsVertex(to)) {
            return null;
        }
        return graph.getEdge(from, to);
    }
}
