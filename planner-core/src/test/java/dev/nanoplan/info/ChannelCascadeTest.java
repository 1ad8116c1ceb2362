package dev.nanoplan.info;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.util.stream.Stream;
import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.simple.RandomSource;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

class ChannelCascadeTest {

    static Stream<Double> crossovers() {
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(41L);
        return Stream.generate(() -> 0.5 * rng.nextDouble()).limit(12);
    }

    static Stream<Arguments> randomChains() {
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(42L);
        return Stream.generate(() -> {
            int hops = 2 + rng.nextInt(2);
            int[] sizes = new int[hops + 1];
            for (int i = 0; i <= hops; i++) {
                sizes[i] = 2 + rng.nextInt(4);
            }
            double[][][] chain = new double[hops][][];
            for (int i = 0; i < hops; i++) {
                chain[i] = randomStochastic(rng, sizes[i], sizes[i + 1]);
            }
            return Arguments.of((Object) chain);
        }).limit(15);
    }

    static double[][] randomStochastic(UniformRandomProvider rng, int rows, int cols) {
        double[][] m = new double[rows][cols];
        for (double[] row : m) {
            double s = 0;
            for (int j = 0; j < cols; j++) {
                row[j] = Math.pow(rng.nextDouble(), 3); // skewed rows -> varied capacities
                s += row[j];
            }
            for (int j = 0; j < cols; j++) {
                row[j] /= s;
            }
        }
        return m;
    }

    @ParameterizedTest
    @MethodSource("crossovers")
    void twoBinarySymmetricHops(double p) {
        double[][] bsc = {{1 - p, p}, {p, 1 - p}};
        double[][] both = ChannelCascade.compose(bsc, bsc);
        double p2 = 2 * p * (1 - p);
        // Silverman, "On binary channels and their cascades", IRE Trans. IT-1, 1955: BSC(p)·BSC(p) = BSC(2p(1-p))
        assertThat(both[0][1]).isCloseTo(p2, within(1e-15));
        assertThat(both[1][0]).isCloseTo(p2, within(1e-15));
        // Cover & Thomas 2006, eq. (7.15) (from memory): C = 1 - h(p2)
        assertThat(ChannelCascade.capacityBits(bsc, bsc)).isCloseTo(1 - Entropy.binaryBits(p2), within(1e-11));
    }

    @ParameterizedTest
    @MethodSource("randomChains")
    void cascadeNeverBeatsWeakestHop(double[][][] chain) {
        double cascade = ChannelCascade.capacityBits(chain);
        double weakest = Double.POSITIVE_INFINITY;
        for (double[][] hop : chain) {
            BlahutArimoto.Result r = BlahutArimoto.DEFAULT.compute(hop);
            weakest = Math.min(weakest, r.upperBoundBits());
        }
        // Cover & Thomas 2006, Theorem 2.8.1 (data-processing inequality)
        assertThat(cascade).isLessThanOrEqualTo(weakest + 1e-12);
        double[][] w = ChannelCascade.compose(chain);
        for (double[] row : w) {
            assertThat(java.util.Arrays.stream(row).sum()).isCloseTo(1.0, within(1e-14));
        }
    }

    @Test
    void validation() {
        double[][] a = {{1, 0}, {0, 1}};
        double[][] b = {{1, 0, 0}, {0, 1, 0}, {0, 0, 1}};
        assertThatThrownBy(() -> ChannelCascade.compose(a, b))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("hop 1");
        assertThatThrownBy(() -> ChannelCascade.compose())
                .isInstanceOf(IllegalArgumentException.class);
        assertThat(ChannelCascade.compose(a)).isDeepEqualTo(a);
    }
}
