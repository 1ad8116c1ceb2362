package dev.nanoplan.plan;

import java.util.HashMap;
import java.util.Map;
import java.util.Set;
import org.jgrapht.Graph;
import org.jgrapht.alg.color.BrownBacktrackColoring;
import org.jgrapht.alg.color.SaturationDegreeColoring;
import org.jgrapht.alg.connectivity.ConnectivityInspector;
import org.jgrapht.alg.interfaces.VertexColoringAlgorithm.Coloring;
import org.jgrapht.graph.AsSubgraph;

/**
 * A proper vertex colouring (adjacent vertices get different colours 0, 1, …) of a conflict graph, one
 * connected component at a time: components of at most {@link #EXACT_MAX_VERTICES} vertices exactly
 * (fewest colours, the chromatic number) by backtracking (J. R. Brown, "Chromatic scheduling and the
 * chromatic number problem", Management Science 19(4), 1972; JGraphT {@link BrownBacktrackColoring}),
 * larger ones by saturation degree (D. Brélaz, "New methods to color the vertices of a graph", Comm. ACM
 * 22(4), 1979; JGraphT {@link SaturationDegreeColoring}), which needs at most Δ + 1 colours.
 *
 * <p>Cost: exponential in the size of a small component (≤ 12 vertices: at most 12^12 partial colourings,
 * in practice a few thousand), O((V + E) log V) for the others.
 */
public final class SlotColouring {

    /** Largest component coloured exactly. */
    public static final int EXACT_MAX_VERTICES = 12;

    private SlotColouring() {
    }

    /** Colour of every vertex of {@code graph}. */
    public static <V, E> Map<V, Integer> of(Graph<V, E> graph) {
        Map<V, Integer> colour = new HashMap<>();
        for (Set<V> part : new ConnectivityInspector<>(graph).connectedSets()) {
            if (part.size() == 1) {
                // a lone vertex: colour 0 (JGraphT 1.5.3's backtracking indexes past a one-vertex graph)
                colour.put(part.iterator().next(), 0);
                continue;
            }
            Graph<V, E> sub = new AsSubgraph<>(graph, part);
            Coloring<V> c = part.size() <= EXACT_MAX_VERTICES ? new BrownBacktrackColoring<>(sub).getColoring()
                    : new SaturationDegreeColoring<>(sub).getColoring();
            // renumber 0, 1, … in order of first use, so the frame is the number of colours
            Map<Integer, Integer> dense = new HashMap<>();
            for (V v : part) {
                colour.put(v, dense.computeIfAbsent(c.getColors().get(v), k -> dense.size()));
            }
        }
        return colour;
    }
}
