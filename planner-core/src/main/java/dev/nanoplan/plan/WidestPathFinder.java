package dev.nanoplan.plan;

import java.util.ArrayDeque;
import java.util.ArrayList;
import java.util.Collections;
import java.util.HashMap;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.PriorityQueue;
import java.util.Set;
import org.jgrapht.Graph;

/**
 * Widest (maximum-bottleneck) path with the fewest hops among the widest: maximises the smallest
 * edge weight along a directed path, then minimises the number of edges.
 *
 * <p>Two phases, because the lexicographic label (bottleneck ↓, hops ↑) is not preserved by path
 * extension (a wide long prefix and a narrow short one tie once a narrower edge caps both), so a
 * single label-setting pass could keep the wrong prefix:
 * <ol>
 *   <li>the largest achievable bottleneck B* by the modified Dijkstra algorithm of
 *       M. Pollack, "The maximum capacity through a network", Operations Research 8(5), 1960,
 *       pp. 733–736 (labels = best bottleneck so far, settled in decreasing order);</li>
 *   <li>breadth-first search for the fewest hops using only edges of weight ≥ B*.</li>
 * </ol>
 * Both paths found are simple. Unreachable target → no path ({@link Result#reachable()} false,
 * bottleneck 0). A path from a vertex to itself is refused.
 *
 * <p>Complexity O((V + E) log V) for phase 1 and O(V + E) for phase 2.
 *
 * @param <V> vertex type
 * @param <E> edge type
 */
public final class WidestPathFinder<V, E> {

    /**
     * A found path.
     *
     * @param vertices       source first, target last; empty when unreachable
     * @param bottleneck     smallest edge weight on the path (0 when unreachable)
     */
    public record Result<V>(List<V> vertices, double bottleneck) {
        public Result {
            vertices = List.copyOf(vertices);
        }

        /** Whether a path exists. */
        public boolean reachable() {
            return !vertices.isEmpty();
        }

        /** Number of edges. */
        public int hops() {
            return Math.max(0, vertices.size() - 1);
        }
    }

    private final Graph<V, E> graph;

    /** @param graph directed graph whose edge weights are the capacities (≥ 0) */
    public WidestPathFinder(Graph<V, E> graph) {
        if (graph == null) {
            throw new IllegalArgumentException("graph: must not be null");
        }
        this.graph = graph;
    }

    /** One-off shortcut. */
    public static <V, E> Result<V> find(Graph<V, E> graph, V source, V target) {
        return new WidestPathFinder<>(graph).path(source, target);
    }

    /**
     * The widest path, fewest hops among equally wide ones.
     *
     * @throws IllegalArgumentException if a vertex is missing or source equals target
     */
    public Result<V> path(V source, V target) {
        if (!graph.containsVertex(source) || !graph.containsVertex(target)) {
            throw new IllegalArgumentException("source/target: must be vertices of the graph");
        }
        if (source.equals(target)) {
            throw new IllegalArgumentException("source and target must differ");
        }
        double best = widest(source, target);
        if (!(best > Double.NEGATIVE_INFINITY)) {
            return new Result<>(List.of(), 0);
        }
        // phase 2: fewest hops over edges of weight >= best
        Map<V, V> parent = new HashMap<>();
        ArrayDeque<V> queue = new ArrayDeque<>();
        parent.put(source, source);
        queue.add(source);
        while (!queue.isEmpty()) {
            V u = queue.poll();
            if (u.equals(target)) {
                break;
            }
            for (E e : graph.outgoingEdgesOf(u)) {
                if (graph.getEdgeWeight(e) < best) {
                    continue;
                }
                V v = graph.getEdgeTarget(e);
                if (!parent.containsKey(v)) {
                    parent.put(v, u);
                    queue.add(v);
                }
            }
        }
        List<V> path = new ArrayList<>();
        for (V v = target; !v.equals(source); v = parent.get(v)) {
            path.add(v);
        }
        path.add(source);
        Collections.reverse(path);
        return new Result<>(path, best);
    }

    /** Phase 1: best bottleneck to target, −∞ when unreachable. */
    private double widest(V source, V target) {
        Map<V, Double> label = new HashMap<>();
        PriorityQueue<Map.Entry<V, Double>> heap =
                new PriorityQueue<>((a, b) -> Double.compare(b.getValue(), a.getValue()));
        label.put(source, Double.POSITIVE_INFINITY);
        heap.add(Map.entry(source, Double.POSITIVE_INFINITY));
        Set<V> settled = new HashSet<>();
        while (!heap.isEmpty()) {
            Map.Entry<V, Double> top = heap.poll();
            V u = top.getKey();
            if (!settled.add(u)) {
                continue;
            }
            if (u.equals(target)) {
                return top.getValue();
            }
            for (E e : graph.outgoingEdgesOf(u)) {
                V v = graph.getEdgeTarget(e);
                if (settled.contains(v)) {
                    continue;
                }
                double w = Math.min(top.getValue(), graph.getEdgeWeight(e));
                Double old = label.get(v);
                if (old == null || w > old) {
                    label.put(v, w);
                    heap.add(Map.entry(v, w));
                }
            }
        }
        return Double.NEGATIVE_INFINITY;
    }
}
