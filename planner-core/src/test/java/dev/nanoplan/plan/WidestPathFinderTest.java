package dev.nanoplan.plan;

import static org.assertj.core.api.Assertions.assertThat;

import dev.nanoplan.info.ChannelCascade;
import dev.nanoplan.info.Entropy;
import java.util.List;
import java.util.stream.LongStream;
import java.util.stream.Stream;
import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.simple.RandomSource;
import org.jgrapht.GraphPath;
import org.jgrapht.alg.shortestpath.AllDirectedPaths;
import org.jgrapht.graph.DefaultDirectedWeightedGraph;
import org.jgrapht.graph.DefaultWeightedEdge;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;
import org.junit.jupiter.api.Test;

class WidestPathFinderTest {

    static Stream<Long> seeds() {
        return LongStream.range(1, 41).boxed();
    }

    @ParameterizedTest
    @MethodSource("seeds")
    void matchesExhaustiveSimplePathEnumeration(long seed) {
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(seed);
        int n = 4 + rng.nextInt(4);
        DefaultDirectedWeightedGraph<Integer, DefaultWeightedEdge> g =
                new DefaultDirectedWeightedGraph<>(DefaultWeightedEdge.class);
        for (int i = 0; i < n; i++) {
            g.addVertex(i);
        }
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                if (i != j && rng.nextDouble() < 0.45) {
                    // few distinct weights so that ties (and the hop tie-break) occur
                    g.setEdgeWeight(g.addEdge(i, j), (1 + rng.nextInt(4)) / 4.0);
                }
            }
        }
        List<GraphPath<Integer, DefaultWeightedEdge>> all =
                new AllDirectedPaths<>(g).getAllPaths(0, n - 1, true, null);
        double bestB = 0;
        int bestHops = Integer.MAX_VALUE;
        for (GraphPath<Integer, DefaultWeightedEdge> p : all) {
            double b = p.getEdgeList().stream().mapToDouble(g::getEdgeWeight).min().orElse(0);
            if (b > bestB || (b == bestB && p.getLength() < bestHops)) {
                bestB = b;
                bestHops = p.getLength();
            }
        }
        WidestPathFinder.Result<Integer> r = WidestPathFinder.find(g, 0, n - 1);
        // Reference: exhaustive enumeration of simple paths (JGraphT AllDirectedPaths), the definition
        // of the maximum-capacity path (Pollack 1960)
        assertThat(r.reachable()).isEqualTo(!all.isEmpty());
        if (!all.isEmpty()) {
            assertThat(r.bottleneck()).isEqualTo(bestB);
            assertThat(r.hops()).isEqualTo(bestHops);
            double onPath = Double.POSITIVE_INFINITY;
            for (int i = 0; i + 1 < r.vertices().size(); i++) {
                onPath = Math.min(onPath, g.getEdgeWeight(g.getEdge(r.vertices().get(i), r.vertices().get(i + 1))));
            }
            assertThat(onPath).isEqualTo(bestB);
        }
    }

    @Test
    void twoIdenticalBinarySymmetricHopsCascadeToTheCrossoverOfTwoFlips() {
        double p = 0.07;
        double[][] bsc = {{1 - p, p}, {p, 1 - p}};
        double c = ChannelCascade.capacityBits(bsc, bsc);
        // Silverman 1955 (IRE Trans. Inf. Theory IT-1): two BSC(p) in cascade form BSC(2p(1-p))
        assertThat(c).isCloseTo(1 - Entropy.binaryBits(2 * p * (1 - p)), org.assertj.core.data.Offset.offset(1e-9));
        // data-processing inequality (Cover & Thomas 2006, Thm 2.8.1): never above the weakest hop
        assertThat(c).isLessThanOrEqualTo(1 - Entropy.binaryBits(p));
    }

    @ParameterizedTest
    @MethodSource("seeds")
    void cascadeOfRandomBinaryHopsNeverExceedsTheWeakestHop(long seed) {
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(seed + 1000);
        int hops = 2 + rng.nextInt(3);
        double[][][] m = new double[hops][][];
        double weakest = Double.POSITIVE_INFINITY;
        for (int i = 0; i < hops; i++) {
            double e0 = 0.3 * rng.nextDouble();
            double e1 = 0.3 * rng.nextDouble();
            m[i] = new double[][] {{1 - e0, e0}, {e1, 1 - e1}};
            weakest = Math.min(weakest, dev.nanoplan.info.BinaryChannel.capacity(e0, e1).bits());
        }
        // data-processing inequality (Cover & Thomas 2006, Thm 2.8.1)
        assertThat(ChannelCascade.capacityBits(m)).isLessThanOrEqualTo(weakest + 1e-9);
    }
}
