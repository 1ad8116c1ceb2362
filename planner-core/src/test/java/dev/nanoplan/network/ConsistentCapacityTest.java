package dev.nanoplan.network;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import dev.nanoplan.count.CountModelKind;
import java.util.ArrayList;
import java.util.List;
import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.simple.RandomSource;
import org.apache.commons.statistics.distribution.BinomialDistribution;
import org.apache.commons.statistics.distribution.PoissonDistribution;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * The consistent capacity (own current and earlier symbols at one input law) against an independent
 * brute-force computation: every one of the M^L histories of the emitter's own earlier symbols,
 * weighted by its probability under the input law, each history's count pmf built by direct
 * convolution of Commons Statistics binomial and Poisson pmfs (molecules independent: the count is a
 * sum of independent binomials, W. Feller, An Introduction to Probability Theory, Vol. I, 1968,
 * §XI.2), mutual information by direct summation of its definition Σ_x Σ_y q_x W ln(W/r)
 * (C. E. Shannon 1948; T. M. Cover and J. A. Thomas, Elements of Information Theory, 2006, eq. 2.28).
 */
class ConsistentCapacityTest {

    private static final double LN2 = Math.log(2);

    /** Seeded random binary links with ISI: {taps, n1, background}. */
    static List<Object[]> randomIsiLinks() {
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(20261204L);
        List<Object[]> cases = new ArrayList<>();
        for (int c = 0; c < 10; c++) {
            int l = 1 + rng.nextInt(3);
            double[] taps = new double[l + 1];
            taps[0] = 0.05 + 0.35 * rng.nextDouble();
            for (int k = 1; k <= l; k++) {
                taps[k] = taps[0] * (0.1 + 0.8 * rng.nextDouble()) / k;
            }
            long n1 = 15 + rng.nextInt(120);
            double background = rng.nextDouble() < 0.5 ? 0 : 3 * rng.nextDouble();
            cases.add(new Object[] {taps, n1, background});
        }
        return cases;
    }

    @ParameterizedTest
    @MethodSource("randomIsiLinks")
    void binaryCapacityMatchesBruteForceOverAllSymbolHistories(double[] taps, long n1, double background) {
        LinkSpec spec = LinkSpec.binary(taps, 0, n1, 0.5, background, CountModelKind.EXACT, 1);
        LinkCapacity c = LinkEvaluator.evaluate(spec).capacity();
        Brute brute = new Brute(taps, new long[] {0, n1}, background);
        double[] ref = brute.maxOverPrior();
        // Reference: brute force over the 2^L own histories at one prior q (class comment), q on a
        // grid of step 1e-3 refined by golden section; the search is specified to 1e-6 bit
        assertThat(c.closedForm()).isFalse();
        assertThat(c.bits()).isCloseTo(ref[0], within(1e-6));
        // the reported (q, τ) pair really delivers the reported bits (same brute force at that q)
        assertThat(brute.binaryMiBits(c.priorOne(), c.threshold())).isCloseTo(c.bits(), within(1e-9));
    }

    @ParameterizedTest
    @MethodSource("randomIsiLinks")
    void operatingPointMatchesBruteForceAtTheFilePrior(double[] taps, long n1, double background) {
        double q = 0.05 + 0.9 * ((n1 * 7919) % 1000) / 1000.0;
        LinkSpec spec = LinkSpec.binary(taps, 0, n1, q, background, CountModelKind.EXACT, 1);
        LinkEvaluation e = LinkEvaluator.evaluate(spec);
        Brute brute = new Brute(taps, new long[] {0, n1}, background);
        // Reference: brute force at the file's prior, maximised over τ by enumeration
        assertThat(e.mutualInformationBits()).isCloseTo(brute.bestOverThresholds(q)[0], within(1e-9));
        assertThat(brute.binaryMiBits(q, e.operatingThreshold())).isCloseTo(e.mutualInformationBits(), within(1e-9));
        // Reference: error (1−q)·P(Y ≥ τ | 0) + q·P(Y < τ | 1) summed from the brute-force pmfs at that τ
        assertThat(e.errorProbability()).isCloseTo(brute.errorAt(q, e.operatingThreshold()), within(1e-12));
        assertThat(e.log10OperatingErrorProbability()).isCloseTo(Math.log10(e.errorProbability()), within(1e-9));
    }

    @ParameterizedTest
    @MethodSource("randomIsiLinks")
    void capacityIsAtLeastTheMutualInformationAtAnyPrior(double[] taps, long n1, double background) {
        LinkCapacity c = LinkEvaluator.evaluate(LinkSpec.binary(taps, 0, n1, 0.5, background, CountModelKind.EXACT, 1))
                .capacity();
        for (double q = 0.02; q < 0.99; q += 0.0625) {
            LinkEvaluation at = LinkEvaluator.evaluate(LinkSpec.binary(taps, 0, n1, q, background,
                    CountModelKind.EXACT, 1));
            // Definition: capacity = max over the prior of the mutual information (Cover and Thomas 2006, §7.1)
            assertThat(c.bits()).isGreaterThanOrEqualTo(at.mutualInformationBits() - 1e-12);
            assertThat(at.capacity().bits()).isCloseTo(c.bits(), within(1e-9));
        }
    }

    @Test
    void withoutLeftoversTheCapacityIsTheBinaryAsymmetricChannelClosedFormUnchanged() {
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(955L);
        for (int c = 0; c < 8; c++) {
            double p = 0.02 + 0.4 * rng.nextDouble();
            long n = 5 + rng.nextInt(200);
            double background = 4 * rng.nextDouble();
            double q = 0.1 + 0.8 * rng.nextDouble();
            // L = 0, and taps whose ISI entries are all 0: the pmfs do not depend on the prior
            for (double[] taps : new double[][] {{p}, {p, 0, 0}}) {
                LinkEvaluation e = LinkEvaluator.evaluate(LinkSpec.binary(taps, 0, n, q, background,
                        CountModelKind.EXACT, 1));
                LinkCapacity cap = e.capacity();
                assertThat(cap.closedForm()).isTrue();
                assertThat(cap.evaluations()).isZero();
                // unchanged: exactly the threshold search's Silverman (1955) closed form
                assertThat(cap.bits()).isEqualTo(e.binary().capacityBits());
                assertThat(cap.priorOne()).isEqualTo(e.binary().capacityPriorOne());
                assertThat(cap.threshold()).isEqualTo(e.binary().capacityThreshold());
                // Reference: brute-force max over q of the direct-sum mutual information (L = 0 case)
                double[] ref = new Brute(new double[] {p}, new long[] {0, n}, background).maxOverPrior();
                assertThat(cap.bits()).isCloseTo(ref[0], within(1e-9));
            }
        }
    }

    /** Seeded 3- and 4-level links with ISI: {taps, level molecules}. */
    static List<Object[]> randomMultiLevelLinks() {
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(1972L);
        List<Object[]> cases = new ArrayList<>();
        for (int c = 0; c < 6; c++) {
            int m = 3 + rng.nextInt(2);
            double[] taps = {0.1 + 0.3 * rng.nextDouble(), 0.02 + 0.1 * rng.nextDouble()};
            long top = 30 + rng.nextInt(80);
            cases.add(new Object[] {taps, LinkSpec.evenLevels(m, top)});
        }
        return cases;
    }

    @ParameterizedTest
    @MethodSource("randomMultiLevelLinks")
    void multiLevelFixedPointConvergesToAConsistentAchievableValue(double[] taps, long[] levels) {
        LinkEvaluation e = LinkEvaluator.evaluate(new LinkSpec(taps, levels, 0.5, 0.5, CountModelKind.EXACT, 1));
        LinkCapacity c = e.capacity();
        // convergence of the fixed-point iteration on these seeded links (documented behaviour)
        assertThat(c.converged()).isTrue();
        assertThat(c.bits()).isGreaterThanOrEqualTo(e.mutualInformationBits());
        // Reference: brute force over all M^L histories at the returned input law, mutual information of
        // the returned thresholds by direct summation: the reported value is delivered by that law
        Brute brute = new Brute(taps, levels, 0.5);
        assertThat(brute.miBits(c.inputDistribution(), c.thresholds())).isCloseTo(c.bits(), within(1e-9));
        // the operating point likewise, at uniform inputs
        double[] uniform = new double[levels.length];
        java.util.Arrays.fill(uniform, 1.0 / levels.length);
        assertThat(brute.miBits(uniform, e.operatingThresholds())).isCloseTo(e.mutualInformationBits(),
                within(1e-9));
    }

    @Test
    void countBlindDetectorErrorIsTheSmallerPriorOrOneMinusOneOverM() {
        LinkEvaluation e = LinkEvaluator.evaluate(LinkSpec.binary(new double[] {0.2}, 0, 50, 0.05, 0,
                CountModelKind.EXACT, 1));
        // always deciding "0" errs exactly when a 1 is sent: probability q = 0.05 (definition)
        assertThat(e.countBlindErrorProbability()).isEqualTo(0.05);
        assertThat(e.countBlindMeets(0.06)).isTrue();
        assertThat(e.countBlindMeets(0.04)).isFalse();
        LinkEvaluation m = LinkEvaluator.evaluate(new LinkSpec(new double[] {0.2}, new long[] {0, 20, 40, 60}, 0.5, 0,
                CountModelKind.EXACT, 1));
        // four uniform levels: a fixed guess is right with probability 1/4 (definition)
        assertThat(m.countBlindErrorProbability()).isCloseTo(0.75, within(1e-15));
        assertThat(m.countBlindMeets(0.5)).isFalse();
    }

    /** Brute-force count pmfs: every own symbol history, direct convolutions of library pmfs. */
    static final class Brute {
        final int levels;
        final int memory;
        /** pmf[i][h]: count pmf given current level i and own history h (base-M digits, lag 1 first). */
        final double[][][] pmf;
        final int[][] digits;

        Brute(double[] taps, long[] n, double background) {
            levels = n.length;
            memory = taps.length - 1;
            int histories = (int) Math.pow(levels, memory);
            digits = new int[histories][memory];
            pmf = new double[levels][histories][];
            double[] noise = {1};
            if (background > 0) {
                PoissonDistribution pois = PoissonDistribution.of(background);
                int hi = pois.inverseSurvivalProbability(1e-18);
                noise = new double[hi + 1];
                for (int y = 0; y <= hi; y++) {
                    noise[y] = pois.probability(y);
                }
            }
            for (int h = 0; h < histories; h++) {
                int rest = h;
                double[] base = noise;
                for (int k = 1; k <= memory; k++) {
                    digits[h][k - 1] = rest % levels;
                    rest /= levels;
                    base = convolve(base, binomial(n[digits[h][k - 1]], taps[k]));
                }
                for (int i = 0; i < levels; i++) {
                    pmf[i][h] = convolve(base, binomial(n[i], taps[0]));
                }
            }
        }

        static double[] binomial(long n, double p) {
            BinomialDistribution b = BinomialDistribution.of((int) n, p);
            double[] v = new double[(int) n + 1];
            for (int y = 0; y <= n; y++) {
                v[y] = b.probability(y);
            }
            return v;
        }

        static double[] convolve(double[] a, double[] b) {
            double[] c = new double[a.length + b.length - 1];
            for (int i = 0; i < a.length; i++) {
                for (int j = 0; j < b.length; j++) {
                    c[i + j] += a[i] * b[j];
                }
            }
            return c;
        }

        /** Count pmf given level i with the own earlier symbols i.i.d. with law pi. */
        double[] given(int i, double[] pi) {
            int width = 0;
            for (double[] p : pmf[i]) {
                width = Math.max(width, p.length);
            }
            double[] out = new double[width];
            for (int h = 0; h < pmf[i].length; h++) {
                double w = 1;
                for (int k = 0; k < memory; k++) {
                    w *= pi[digits[h][k]];
                }
                double[] p = pmf[i][h];
                for (int y = 0; y < p.length; y++) {
                    out[y] += w * p[y];
                }
            }
            return out;
        }

        /** Mutual information (bits) of the interval detector with these thresholds, law pi throughout. */
        double miBits(double[] pi, long[] thresholds) {
            double[][] w = new double[levels][levels];
            for (int i = 0; i < levels; i++) {
                double[] p = given(i, pi);
                for (int y = 0; y < p.length; y++) {
                    int cell = 0;
                    while (cell < thresholds.length && y >= thresholds[cell]) {
                        cell++;
                    }
                    w[i][cell] += p[y];
                }
            }
            double s = 0;
            for (int j = 0; j < levels; j++) {
                double r = 0;
                for (int i = 0; i < levels; i++) {
                    r += pi[i] * w[i][j];
                }
                for (int i = 0; i < levels; i++) {
                    if (pi[i] > 0 && w[i][j] > 0) {
                        s += pi[i] * w[i][j] * Math.log(w[i][j] / r);
                    }
                }
            }
            return s / LN2;
        }

        double binaryMiBits(double q, long tau) {
            return miBits(new double[] {1 - q, q}, new long[] {tau});
        }

        double errorAt(double q, long tau) {
            double[] p0 = given(0, new double[] {1 - q, q});
            double[] p1 = given(1, new double[] {1 - q, q});
            double e0 = 0;
            double e1 = 0;
            for (int y = 0; y < p0.length; y++) {
                e0 += y >= tau ? p0[y] : 0;
            }
            for (int y = 0; y < p1.length; y++) {
                e1 += y < tau ? p1[y] : 0;
            }
            return (1 - q) * e0 + q * e1;
        }

        /** {best bits, best τ} over every threshold at prior q (running tail sums, direct-sum MI). */
        double[] bestOverThresholds(double q) {
            double[] p0 = given(0, new double[] {1 - q, q});
            double[] p1 = given(1, new double[] {1 - q, q});
            int width = Math.max(p0.length, p1.length);
            double[] above0 = new double[width + 2];
            double[] above1 = new double[width + 2];
            for (int y = width - 1; y >= 0; y--) {
                above0[y] = above0[y + 1] + (y < p0.length ? p0[y] : 0);
                above1[y] = above1[y + 1] + (y < p1.length ? p1[y] : 0);
            }
            double below0 = 0;
            double below1 = 0;
            double best = -1;
            long arg = 0;
            for (int t = 0; t <= width; t++) {
                // decide 1 iff y >= t: W(0|0) = below0, W(1|1) = 1 − below1
                double[][] w = {{below0, above0[t]}, {below1, above1[t]}};
                double v = 0;
                for (int j = 0; j < 2; j++) {
                    double r = (1 - q) * w[0][j] + q * w[1][j];
                    if (w[0][j] > 0) {
                        v += (1 - q) * w[0][j] * Math.log(w[0][j] / r);
                    }
                    if (w[1][j] > 0) {
                        v += q * w[1][j] * Math.log(w[1][j] / r);
                    }
                }
                v /= LN2;
                if (v > best) {
                    best = v;
                    arg = t;
                }
                below0 += t < p0.length ? p0[t] : 0;
                below1 += t < p1.length ? p1[t] : 0;
            }
            return new double[] {best, arg};
        }

        /** {max bits, argmax q}: grid of step 1e-3, then golden section on the best grid cell pair. */
        double[] maxOverPrior() {
            double bestQ = 0.5;
            double best = -1;
            for (int j = 1; j < 1000; j++) {
                double v = bestOverThresholds(j / 1000.0)[0];
                if (v > best) {
                    best = v;
                    bestQ = j / 1000.0;
                }
            }
            double lo = Math.max(1e-4, bestQ - 1e-3);
            double hi = Math.min(1 - 1e-4, bestQ + 1e-3);
            double g = (Math.sqrt(5) - 1) / 2;
            for (int it = 0; it < 60; it++) {
                double a = hi - g * (hi - lo);
                double b = lo + g * (hi - lo);
                double fa = bestOverThresholds(a)[0];
                double fb = bestOverThresholds(b)[0];
                best = Math.max(best, Math.max(fa, fb));
                if (fa < fb) {
                    lo = a;
                } else {
                    hi = b;
                }
            }
            return new double[] {best, 0.5 * (lo + hi)};
        }
    }
}
