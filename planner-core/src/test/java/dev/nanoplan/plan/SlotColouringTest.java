package dev.nanoplan.plan;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.HashSet;
import java.util.Map;
import java.util.stream.LongStream;
import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.simple.RandomSource;
import org.jgrapht.Graph;
import org.jgrapht.graph.DefaultEdge;
import org.jgrapht.graph.SimpleGraph;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;

/** {@link SlotColouring} on seeded random graphs (Erdős–Rényi G(n, p), Commons RNG). */
class SlotColouringTest {

    static LongStream seeds() {
        return LongStream.range(1, 31);
    }

    private static Graph<Integer, DefaultEdge> random(UniformRandomProvider rng, int n, double p) {
        Graph<Integer, DefaultEdge> g = new SimpleGraph<>(DefaultEdge.class);
        for (int v = 0; v < n; v++) {
            g.addVertex(v);
        }
        for (int a = 0; a < n; a++) {
            for (int b = a + 1; b < n; b++) {
                if (rng.nextDouble() < p) {
                    g.addEdge(a, b);
                }
            }
        }
        return g;
    }

    @ParameterizedTest
    @MethodSource("seeds")
    void noConflictingPairSharesASlot(long seed) {
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(seed);
        // large enough that components beyond the exact size are coloured by saturation degree
        Graph<Integer, DefaultEdge> g = random(rng, 10 + rng.nextInt(60), 0.02 + 0.3 * rng.nextDouble());
        Map<Integer, Integer> c = SlotColouring.of(g);
        assertThat(c.keySet()).isEqualTo(g.vertexSet());
        for (DefaultEdge e : g.edgeSet()) {
            // definition of a proper colouring: the two ends of every edge differ
            assertThat(c.get(g.getEdgeSource(e))).isNotEqualTo(c.get(g.getEdgeTarget(e)));
        }
        // saturation degree uses at most (max degree + 1) colours (Brélaz 1979), numbered from 0
        int maxDegree = g.vertexSet().stream().mapToInt(g::degreeOf).max().orElse(0);
        assertThat(c.values()).allMatch(k -> k >= 0 && k <= maxDegree);
    }

    @ParameterizedTest
    @MethodSource("seeds")
    void smallGraphsGetTheChromaticNumber(long seed) {
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(seed);
        int n = 2 + rng.nextInt(7);
        Graph<Integer, DefaultEdge> g = random(rng, n, 0.2 + 0.6 * rng.nextDouble());
        Map<Integer, Integer> c = SlotColouring.of(g);
        int used = new HashSet<>(c.values()).size();
        // the frame (largest slot + 1) is the number of colours
        assertThat(c.values().stream().mapToInt(Integer::intValue).max().orElse(-1) + 1).isEqualTo(used);
        // chromatic number by exhaustive search over every assignment of k colours, k = 1, 2, ...
        assertThat(used).isEqualTo(chromaticNumber(g, n));
    }

    private static int chromaticNumber(Graph<Integer, DefaultEdge> g, int n) {
        for (int k = 1; k <= n; k++) {
            int[] colour = new int[n];
            long total = (long) Math.pow(k, n);
            for (long code = 0; code < total; code++) {
                long x = code;
                for (int v = 0; v < n; v++) {
                    colour[v] = (int) (x % k);
                    x /= k;
                }
                boolean proper = true;
                for (DefaultEdge e : g.edgeSet()) {
                    proper &= colour[g.getEdgeSource(e)] != colour[g.getEdgeTarget(e)];
                }
                if (proper) {
                    return k;
                }
            }
        }
        return n;
    }
}
