package dev.nanoplan.detect;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import dev.nanoplan.count.CountPmf;
import dev.nanoplan.info.BlahutArimoto;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.stream.Stream;
import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.simple.RandomSource;
import org.apache.commons.statistics.distribution.BinomialDistribution;
import org.apache.commons.statistics.distribution.DiscreteDistribution;
import org.apache.commons.statistics.distribution.PoissonDistribution;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

class MultiLevelQuantizerTest {

    private static final double LOG2 = Math.log(2);
    private static final BlahutArimoto LOOSE = new BlahutArimoto(1e-9, 100_000);

    /** Small seeded problems: M levels Bin(n, p_1 < ... < p_M) on the full support [0, n]. */
    static Stream<Arguments> smallCases() {
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(61L);
        return Stream.generate(() -> {
            int m = 3 + rng.nextInt(2);
            int n = 6 + rng.nextInt(m == 3 ? 20 : 10);
            double[] p = new double[m];
            double acc = 0.05 + 0.2 * rng.nextDouble();
            for (int i = 0; i < m; i++) {
                p[i] = Math.min(0.97, acc);
                acc += 0.05 + 0.25 * rng.nextDouble();
            }
            List<DiscreteDistribution> d = new ArrayList<>();
            for (double pi : p) {
                d.add(BinomialDistribution.of(n, pi));
            }
            double[] input = randomSimplex(rng, m);
            return Arguments.of(d, n, input);
        }).limit(16);
    }

    static double[] randomSimplex(UniformRandomProvider rng, int m) {
        double[] x = new double[m];
        double s = 0;
        for (int i = 0; i < m; i++) {
            x[i] = 0.1 + rng.nextDouble();
            s += x[i];
        }
        for (int i = 0; i < m; i++) {
            x[i] /= s;
        }
        return x;
    }

    private static List<CountPmf> full(List<DiscreteDistribution> d, int n) {
        List<CountPmf> l = new ArrayList<>();
        for (DiscreteDistribution x : d) {
            l.add(LibraryPmfs.full(x, n));
        }
        return l;
    }

    /** P(a <= Y < b) from the library CDF (Commons Statistics 1.2). */
    private static double cell(DiscreteDistribution d, long a, long b) {
        double hi = b - 1 < 0 ? 0 : d.cumulativeProbability((int) (b - 1));
        double lo = a - 1 < 0 ? 0 : d.cumulativeProbability((int) (a - 1));
        return Math.max(0, hi - lo);
    }

    /** Mutual information Σ_j Σ_i π_i W_ij log2(W_ij / r_j) written out plainly (bits). */
    private static double mi(List<DiscreteDistribution> d, double[] pi, long[] cuts, long end) {
        int m = pi.length;
        double total = 0;
        for (int j = 0; j < m; j++) {
            long a = j == 0 ? 0 : cuts[j - 1];
            long b = j == m - 1 ? end : cuts[j];
            double[] w = new double[m];
            double r = 0;
            for (int i = 0; i < m; i++) {
                w[i] = cell(d.get(i), a, b);
                r += pi[i] * w[i];
            }
            for (int i = 0; i < m; i++) {
                if (w[i] > 0 && pi[i] > 0) {
                    total += pi[i] * w[i] * Math.log(w[i] / r);
                }
            }
        }
        return total / LOG2;
    }

    /** Every strictly increasing threshold tuple in [0, end], lexicographic order. */
    private static List<long[]> allTuples(int k, long end) {
        List<long[]> out = new ArrayList<>();
        long[] t = new long[k];
        fill(out, t, 0, 0, end);
        return out;
    }

    private static void fill(List<long[]> out, long[] t, int j, long from, long end) {
        if (j == t.length) {
            out.add(t.clone());
            return;
        }
        for (long v = from; v <= end; v++) {
            t[j] = v;
            fill(out, t, j + 1, v + 1, end);
        }
    }

    @ParameterizedTest
    @MethodSource("smallCases")
    void dpEqualsBruteForceOverAllThresholdTuples(List<DiscreteDistribution> d, int n, double[] pi) {
        MultiLevelQuantizer.Quantization q = MultiLevelQuantizer.DEFAULT.bestThresholds(full(d, n), pi);
        long end = n + 1; // thresholds range over [0, n + 1]
        double best = -1;
        long[] arg = null;
        for (long[] t : allTuples(pi.length - 1, end)) {
            double v = mi(d, pi, t, end);
            if (v > best) {
                best = v;
                arg = t;
            }
        }
        assertThat(q.exactOverAllCuts()).isTrue();
        // Brute force over all threshold tuples with library CDFs (Commons Statistics 1.2) and the
        // definition of mutual information (Cover & Thomas 2006, eq. 2.28)
        assertThat(q.mutualInformationBits()).isCloseTo(best, within(1e-12));
        assertThat(q.thresholds()).containsExactly(arg);
    }

    static Stream<Arguments> binaryCases() {
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(62L);
        return Stream.generate(() -> {
            int n1 = 30 + rng.nextInt(1500);
            double p = 0.02 + 0.4 * rng.nextDouble();
            double mean1 = n1 * p;
            double mean0 = Math.max(0.5, mean1 - (0.5 + 4 * rng.nextDouble()) * Math.sqrt(mean1));
            DiscreteDistribution d0 = PoissonDistribution.of(mean0);
            DiscreteDistribution d1 = BinomialDistribution.of(n1, p);
            return Arguments.of(LibraryPmfs.trimmed(d0, 1e-18), LibraryPmfs.trimmed(d1, 1e-18),
                    0.1 + 0.8 * rng.nextDouble());
        }).limit(12);
    }

    @ParameterizedTest
    @MethodSource("binaryCases")
    void twoLevelsMatchBinaryThresholdSearch(CountPmf given0, CountPmf given1, double q) {
        MultiLevelQuantizer.Quantization dp =
                MultiLevelQuantizer.DEFAULT.bestThresholds(List.of(given0, given1), new double[] {1 - q, q});
        BinaryDetection search = BinaryThresholdSearch.search(given0, given1, q);
        assertThat(dp.thresholds()).containsExactly(search.miThreshold());
        assertThat(dp.mutualInformationBits()).isCloseTo(search.mutualInformationBits(), within(1e-12));
    }

    @ParameterizedTest
    @MethodSource("smallCases")
    void optimisedCapacityIsBracketed(List<DiscreteDistribution> d, int n, double[] ignored) {
        List<CountPmf> levels = full(d, n);
        MultiLevelResult r = MultiLevelQuantizer.DEFAULT.optimise(levels);
        int m = levels.size();
        double tol = 1e-9;
        // Data-processing inequality (Cover & Thomas 2006, Theorem 2.8.1): hard <= soft; and
        // C <= log2 |X| (Cover & Thomas 2006, §7.1)
        assertThat(r.capacityBits()).isLessThanOrEqualTo(r.softCapacityBits() + tol);
        assertThat(r.softCapacityBits()).isLessThanOrEqualTo(Math.log(m) / LOG2 + 1e-12);
        // Capacity is a maximum over inputs, so it is at least the uniform-input value
        assertThat(r.capacityBits()).isGreaterThanOrEqualTo(r.uniformMutualInformationBits() - 1e-12);
        assertThat(Arrays.stream(r.inputDistribution()).sum()).isCloseTo(1.0, within(1e-12));
        // The reported capacity is the mutual information of the reported thresholds and input
        // (definition, Cover & Thomas 2006, eq. 2.28, with library CDFs)
        assertThat(r.capacityBits()).isCloseTo(mi(d, r.inputDistribution(), r.thresholds(), n + 1), within(1e-12));
        assertThat(r.uniformMutualInformationBits())
                .isCloseTo(mi(d, uniform(m), r.uniformThresholds(), n + 1), within(1e-12));
        // Never above the best over all threshold tuples of the Blahut-Arimoto capacity (brute force)
        if (m == 3) {
            double best = 0;
            for (long[] t : allTuples(2, n + 1)) {
                double[][] w = new double[m][m];
                for (int i = 0; i < m; i++) {
                    w[i][0] = cell(d.get(i), 0, t[0]);
                    w[i][1] = cell(d.get(i), t[0], t[1]);
                    w[i][2] = cell(d.get(i), t[1], n + 1);
                }
                // the Blahut-Arimoto upper bound max_x D(W_x||qW) holds at any iterate (Arimoto 1972)
                best = Math.max(best, LOOSE.compute(w).upperBoundBits());
            }
            assertThat(r.capacityBits()).isLessThanOrEqualTo(best + 1e-12);
        }
    }

    /** Seeded random pmfs on [0, n] (arbitrary shapes, not only binomials): M = 3 and 4 levels. */
    static Stream<Arguments> randomPmfCases() {
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(20261204L);
        return Stream.generate(() -> {
            int m = 3 + rng.nextInt(2);
            int n = 5 + rng.nextInt(m == 3 ? 25 : 9);
            List<CountPmf> levels = new ArrayList<>();
            for (int i = 0; i < m; i++) {
                double[] v = new double[n + 1];
                double s = 0;
                // a bump that moves up with the level, times random noise: overlapping, irregular pmfs
                double centre = (i + 0.5) * n / m;
                for (int y = 0; y <= n; y++) {
                    v[y] = Math.exp(-Math.abs(y - centre) / (1 + 3 * rng.nextDouble())) * (0.2 + rng.nextDouble());
                    s += v[y];
                }
                for (int y = 0; y <= n; y++) {
                    v[y] /= s;
                }
                levels.add(new CountPmf(0, v, 0, 0));
            }
            return Arguments.of(levels, n);
        }).limit(24);
    }

    @ParameterizedTest
    @MethodSource("randomPmfCases")
    void capacityIsTheGlobalMaximumOverThresholdSetsOrCertified(List<CountPmf> levels, int n) {
        MultiLevelResult r = MultiLevelQuantizer.DEFAULT.optimise(levels);
        int m = levels.size();
        // Reference: exhaustive enumeration of every strictly increasing threshold tuple in [0, n + 1],
        // the Blahut–Arimoto capacity of each induced channel (Blahut 1972; Arimoto 1972), maximum taken
        BlahutArimoto tight = new BlahutArimoto(1e-13, 1_000_000);
        double best = 0;
        for (long[] t : allTuples(m - 1, n + 1)) {
            double[][] w = new double[m][m];
            for (int i = 0; i < m; i++) {
                double[] v = levels.get(i).masses();
                for (int y = 0; y <= n; y++) {
                    int cell = 0;
                    while (cell < m - 1 && y >= t[cell]) {
                        cell++;
                    }
                    w[i][cell] += v[y];
                }
            }
            best = Math.max(best, tight.compute(w).capacityBits());
        }
        assertThat(r.capacityBits()).isLessThanOrEqualTo(best + 1e-9);
        assertThat(r.certifiedGapBits()).isNotNaN();
        if (m == 3) {
            // exact global search for three levels
            assertThat(r.capacityBits()).isCloseTo(best, within(1e-9));
            assertThat(r.certifiedGapBits()).isLessThanOrEqualTo(1e-9);
        } else {
            // the certificate is a valid bound: the true maximum lies within the certified gap
            assertThat(best - r.capacityBits()).isLessThanOrEqualTo(r.certifiedGapBits() + 1e-9);
        }
    }

    private static double[] uniform(int m) {
        double[] u = new double[m];
        Arrays.fill(u, 1.0 / m);
        return u;
    }

    @Test
    void candidateSetPathIsNearBruteForceAndFlagged() {
        List<DiscreteDistribution> d = List.of(PoissonDistribution.of(200), PoissonDistribution.of(240),
                PoissonDistribution.of(290));
        List<CountPmf> levels = new ArrayList<>();
        for (DiscreteDistribution x : d) {
            levels.add(LibraryPmfs.window(x, 100, 420));
        }
        double[] pi = uniform(3);
        MultiLevelQuantizer coarse = new MultiLevelQuantizer(16, BlahutArimoto.DEFAULT, 1e-12, 50);
        MultiLevelQuantizer.Quantization q = coarse.bestThresholds(levels, pi);
        MultiLevelQuantizer.Quantization exact = MultiLevelQuantizer.DEFAULT.bestThresholds(levels, pi);
        // brute force over all threshold pairs in [180, 320] (library CDFs, Commons Statistics 1.2)
        double best = 0;
        for (long a = 180; a <= 320; a++) {
            for (long b = a + 1; b <= 320; b++) {
                best = Math.max(best, mi(d, pi, new long[] {a, b}, Integer.MAX_VALUE - 1L));
            }
        }
        assertThat(q.exactOverAllCuts()).isFalse();
        assertThat(exact.exactOverAllCuts()).isTrue();
        assertThat(exact.mutualInformationBits()).isCloseTo(best, within(1e-11));
        assertThat(q.mutualInformationBits()).isLessThanOrEqualTo(best + 1e-11).isGreaterThan(best - 1e-4);
    }

    @Test
    void candidatePathCannotGainByMovingAnyOneThresholdToAnyInteger() {
        // four Poisson levels over a window of 701 counts, wider than the 64 candidates allowed
        List<DiscreteDistribution> d = List.of(PoissonDistribution.of(150), PoissonDistribution.of(210),
                PoissonDistribution.of(300), PoissonDistribution.of(420));
        List<CountPmf> levels = new ArrayList<>();
        for (DiscreteDistribution x : d) {
            levels.add(LibraryPmfs.window(x, 0, 700));
        }
        double[] pi = {0.4, 0.3, 0.2, 0.1};
        MultiLevelQuantizer small = new MultiLevelQuantizer(64, BlahutArimoto.DEFAULT, 1e-12, 50);
        MultiLevelQuantizer.Quantization q = small.bestThresholds(levels, pi);
        long[] t = q.thresholds();
        // mutual information recomputed from library CDFs (Commons Statistics 1.2) at every single-
        // threshold move over all integers between the neighbours: none beats the result (the
        // coordinate sweep's guarantee); common practice for checking a local optimum
        double at = mi(d, pi, t, Integer.MAX_VALUE - 1L);
        assertThat(q.mutualInformationBits()).isCloseTo(at, within(1e-11));
        for (int j = 0; j < t.length; j++) {
            long lo = j == 0 ? 0 : t[j - 1] + 1;
            long hi = j == t.length - 1 ? 701 : t[j + 1] - 1;
            for (long v = lo; v <= hi; v++) {
                long[] moved = t.clone();
                moved[j] = v;
                assertThat(mi(d, pi, moved, Integer.MAX_VALUE - 1L)).isLessThanOrEqualTo(at + 1e-12);
            }
        }
        assertThat(q.exactOverAllCuts()).isFalse();
    }

    @Test
    void validation() {
        CountPmf a = new CountPmf(0, new double[] {1}, 0, 0);
        assertThatThrownBy(() -> MultiLevelQuantizer.DEFAULT.optimise(List.of(a)))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("at least 2");
        assertThatThrownBy(() -> MultiLevelQuantizer.DEFAULT.bestThresholds(List.of(a, a), new double[] {0.5}))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("inputDistribution");
        assertThatThrownBy(() -> new MultiLevelQuantizer(4, BlahutArimoto.DEFAULT, 1e-9, 10))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("maxCandidates");
        assertThatThrownBy(() -> MultiLevelQuantizer.DEFAULT.optimise(List.of(a, a, a, a)))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("threshold positions");
    }
}
