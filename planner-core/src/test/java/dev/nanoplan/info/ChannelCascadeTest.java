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

    /**
     * The cascade's mutual information at an input law against a brute-force sum over the joint law
     * p(x)·W(y|x) of I = Σ p(x, y) log2[p(x, y) / (p(x) p(y))] (Cover and Thomas 2006, eq. 2.28), and
     * never above the first hop's at the same law (data processing, ibid. Theorem 2.8.1).
     */
    @ParameterizedTest
    @MethodSource("randomChains")
    void mutualInformationAtAnInputLawMatchesTheJointLawSum(double[][][] chain) {
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(chain.length * 31L + chain[0].length);
        double[] input = randomStochastic(rng, 1, chain[0].length)[0];
        double[][] w = ChannelCascade.compose(chain);
        double[] out = new double[w[0].length];
        for (int x = 0; x < w.length; x++) {
            for (int y = 0; y < out.length; y++) {
                out[y] += input[x] * w[x][y];
            }
        }
        double brute = 0;
        for (int x = 0; x < w.length; x++) {
            for (int y = 0; y < out.length; y++) {
                double joint = input[x] * w[x][y];
                if (joint > 0) {
                    brute += joint * Math.log(joint / (input[x] * out[y])) / Math.log(2);
                }
            }
        }
        assertThat(ChannelCascade.mutualInformationBits(input, chain)).isCloseTo(brute, within(1e-12));
        assertThat(ChannelCascade.mutualInformationBits(input, chain))
                .isLessThanOrEqualTo(ChannelCascade.mutualInformationBits(input, chain[0]) + 1e-12);
    }

    /**
     * Two binary hops at prior q: the end-to-end crossovers by hand, e0 = a0(1 − b1) + (1 − a0)b0 and
     * e1 = a1(1 − b0) + (1 − a1)b1 (Silverman 1955), whose BAC information at q is
     * h((1−q)e0 + q(1−e1)) − (1−q)h(e0) − q·h(e1) (Cover and Thomas 2006, eq. 2.43, h the binary entropy).
     */
    @Test
    void twoBinaryHopsAtAPriorMatchTheHandProduct() {
        double a0 = 0.1;
        double a1 = 0.02;
        double b0 = 0.05;
        double b1 = 0.2;
        double q = 0.3;
        double e0 = a0 * (1 - b1) + (1 - a0) * b0;
        double e1 = a1 * (1 - b0) + (1 - a1) * b1;
        double expected = Entropy.binaryBits((1 - q) * e0 + q * (1 - e1)) - (1 - q) * Entropy.binaryBits(e0)
                - q * Entropy.binaryBits(e1);
        double[][] h1 = {{1 - a0, a0}, {a1, 1 - a1}};
        double[][] h2 = {{1 - b0, b0}, {b1, 1 - b1}};
        assertThat(ChannelCascade.mutualInformationBits(new double[] {1 - q, q}, h1, h2))
                .isCloseTo(expected, within(1e-14));
    }
}
