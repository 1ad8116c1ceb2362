package dev.nanoplan.plan;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.offset;

import dev.nanoplan.info.BinaryChannel;
import java.util.stream.IntStream;
import java.util.stream.LongStream;
import java.util.stream.Stream;
import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.simple.RandomSource;
import org.apache.commons.statistics.distribution.BinomialDistribution;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;

/** The normal (and normal-mixture) approximation of a link against Commons Statistics' binomial law. */
class NormalLinkApproximationTest {

    static Stream<long[]> seeds() {
        return IntStream.range(0, 40).mapToObj(i -> new long[] {1000L + i});
    }

    @ParameterizedTest
    @MethodSource("seeds")
    void binomialTailIsWithinTheBerryEsseenBound(long[] seed) {
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(seed[0]);
        int n = (int) Math.round(Math.exp(Math.log(20) + rng.nextDouble() * Math.log(1e6 / 20)));
        double p = 1e-3 + rng.nextDouble() * (0.5 - 1e-3);
        double mean = n * p;
        double sd = Math.sqrt(n * p * (1 - p));
        BinomialDistribution exact = BinomialDistribution.of(n, p);
        // Berry–Esseen for a sum of n i.i.d. Bernoulli(p): sup_x |F_n(x) − Φ((x − np)/σ)| ≤ C·ρ/(σ_1³√n),
        // ρ = p(1 − p)(p² + (1 − p)²), σ_1² = p(1 − p), C = 0.4748 (I. Shevtsova, "On the absolute
        // constants in the Berry–Esseen type inequalities for identically distributed summands", 2011);
        // at x = τ − ½ this bounds the continuity-corrected tail of Feller 1968, ch. VII
        double bound = 0.4748 * (p * p + (1 - p) * (1 - p)) / Math.sqrt(n * p * (1 - p));
        for (int i = 0; i < 20; i++) {
            long tau = Math.max(0, Math.round(mean + (rng.nextDouble() * 8 - 4) * sd));
            double reference = tau == 0 ? 1 : exact.survivalProbability((int) tau - 1);
            assertThat(NormalLinkApproximation.upperTail(mean, sd * sd, tau)).as("n=%d p=%g tau=%d", n, p, tau)
                    .isCloseTo(reference, offset(bound));
            double lower = tau == 0 ? 0 : exact.cumulativeProbability((int) tau - 1);
            assertThat(NormalLinkApproximation.lowerTail(mean, sd * sd, tau))
                    .isCloseTo(lower, offset(bound));
        }
    }

    /** max over integer τ of the BAC capacity with the exact binomial tails of both levels. */
    static double exactBinomialCapacity(int n0, int n1, double p) {
        BinomialDistribution b0 = BinomialDistribution.of(n0, p);
        BinomialDistribution b1 = BinomialDistribution.of(n1, p);
        double best = 0;
        for (int tau = 1; tau <= n1; tau++) {
            double e0 = b0.survivalProbability(tau - 1);
            double e1 = b1.cumulativeProbability(tau - 1);
            best = Math.max(best, BinaryChannel.capacity(e0, e1).bits());
        }
        return best;
    }

    @ParameterizedTest
    @MethodSource("seeds")
    void singleBinomialLinkCapacityIsCloseToTheExactBinomialChannel(long[] seed) {
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(seed[0]);
        double p = 0.005 + rng.nextDouble() * 0.3;
        // both levels with n·p(1 − p) ≥ 9, the usual condition for using the normal approximation of a
        // binomial (common practice); the signal spans weak to nearly perfect links
        int n0 = (int) Math.ceil(9 / (p * (1 - p))) + rng.nextInt(2000);
        int n1 = n0 + 1 + (int) (rng.nextDouble() * 12 * Math.sqrt(n0 * p * (1 - p)) / p);
        double exact = exactBinomialCapacity(n0, n1, p);
        double normal = NormalLinkApproximation.evaluate(new double[] {n0 * p, n1 * p},
                new double[] {n0 * p * (1 - p), n1 * p * (1 - p)}, 0.5).capacityBits();
        // tolerance 0.012 bit: ours, about 2× the largest difference measured over these 40 draws (0.0055)
        assertThat(normal).as("n0=%d n1=%d p=%g exact %f", n0, n1, p, exact)
                .isCloseTo(exact, offset(0.012));
    }

    /**
     * Exact capacity of the link whose count given level i is Bin(n_i, p) plus, with probability ½,
     * an independent Bin(nI, pI) (one on/off interferer): pmfs from Commons Statistics, convolved here.
     */
    static double exactWithOnOffInterferer(int n0, int n1, double p, int nI, double pI) {
        BinomialDistribution in = BinomialDistribution.of(nI, pI);
        double[][] pmf = new double[2][];
        int[] n = {n0, n1};
        for (int i = 0; i < 2; i++) {
            BinomialDistribution own = BinomialDistribution.of(n[i], p);
            double[] y = new double[n[i] + nI + 1];
            for (int a = 0; a <= n[i]; a++) {
                double pa = own.probability(a);
                if (pa < 1e-300) {
                    continue;
                }
                y[a] += 0.5 * pa;
                for (int b = 0; b <= nI; b++) {
                    y[a + b] += 0.5 * pa * in.probability(b);
                }
            }
            pmf[i] = y;
        }
        double best = 0;
        double e0 = 1;
        double e1 = 0;
        for (int tau = 1; tau < pmf[1].length; tau++) {
            e0 -= tau - 1 < pmf[0].length ? pmf[0][tau - 1] : 0;
            e1 += pmf[1][tau - 1];
            best = Math.max(best, BinaryChannel.capacity(Math.max(0, e0), Math.min(1, e1)).bits());
        }
        return best;
    }

    @ParameterizedTest
    @MethodSource("seeds")
    void mixtureFollowsOneStrongOnOffInterfererBetterThanOneNormalLaw(long[] seed) {
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(seed[0]);
        double p = 0.02 + rng.nextDouble() * 0.1;
        int n0 = 0;
        int n1 = 200 + rng.nextInt(800);
        // the interferer swings 2 to 6 times the signal: a bimodal count
        double pI = 0.05 + rng.nextDouble() * 0.2;
        int nI = (int) Math.round((2 + 4 * rng.nextDouble()) * n1 * p / pI);
        double exact = exactWithOnOffInterferer(n0, n1, p, nI, pI);
        double[] means = {n0 * p, n1 * p};
        double[] vars = {n0 * p * (1 - p), n1 * p * (1 - p)};
        NormalLinkApproximation.Mixture onOff = NormalLinkApproximation.Mixture.NONE.plus(new double[] {0.5, 0.5},
                new double[] {0, nI * pI}, new double[] {0, nI * pI * (1 - pI)});
        double mixture = NormalLinkApproximation.evaluate(means, vars, onOff, 0.5).capacityBits();
        double single = NormalLinkApproximation.evaluate(new double[] {means[0] + onOff.mean(), means[1] + onOff.mean()},
                new double[] {vars[0] + onOff.variance(), vars[1] + onOff.variance()}, 0.5).capacityBits();
        // the mixture's moments equal the single law's (law of total variance), so only the shape differs
        assertThat(Math.abs(mixture - exact)).as("exact %f mixture %f single %f", exact, mixture, single)
                .isLessThanOrEqualTo(Math.abs(single - exact));
        // tolerance 0.012 bit: ours, about 2× the largest mixture difference measured over these draws
        // (0.0058; one normal law was off by 0.22 to 0.31 bit on every draw)
        assertThat(mixture).isCloseTo(exact, offset(0.012));
    }

    @ParameterizedTest
    @MethodSource("seeds")
    void upperBoundIsNeverBelowTheCapacity(long[] seed) {
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(seed[0]);
        for (int i = 0; i < 20; i++) {
            double m0 = rng.nextDouble() * 200;
            double m1 = m0 + rng.nextDouble() * 60;
            double v0 = rng.nextDouble() * 400;
            double v1 = v0 + rng.nextDouble() * 100;
            NormalLinkApproximation.Mixture mix = NormalLinkApproximation.Mixture.NONE;
            for (int t = rng.nextInt(3); t > 0; t--) {
                double w = 0.1 + 0.8 * rng.nextDouble();
                mix = mix.plus(new double[] {1 - w, w}, new double[] {0, rng.nextDouble() * 100},
                        new double[] {0, rng.nextDouble() * 50});
            }
            double c = NormalLinkApproximation.evaluate(new double[] {m0, m1}, new double[] {v0, v1}, mix, 0.5)
                    .capacityBits();
            // Pinsker and the divergence bound on capacity (Cover & Thomas 2006, Lemma 11.6.1, Thm 13.1.1)
            assertThat(NormalLinkApproximation.capacityUpperBoundBits(m0, v0, m1, v1, mix))
                    .isGreaterThanOrEqualTo(c - 1e-12);
        }
    }

    @Test
    void logTailsStayFiniteFarBelowTheSmallestDouble() {
        for (double z : new double[] {0.5, 2, 10, 30}) {
            double viaExp = Math.log(NormalLinkApproximation.upperTail(0, 1, Math.round(z + 0.5)));
            assertThat(NormalLinkApproximation.logUpperTail(0, 1, Math.round(z + 0.5))).isCloseTo(viaExp,
                    offset(1e-12 * Math.max(1, Math.abs(viaExp))));
        }
        for (double z : new double[] {40, 100, 1e3, 1e5}) {
            long tau = Math.round(z + 0.5); // (τ − ½ − 0)/1 = z
            double x = tau - 0.5;
            // asymptotic expansion of the normal upper tail, Q(x) ~ φ(x)/x·(1 − 1/x² + 3/x⁴ − 15/x⁶)
            // (M. Abramowitz and I. A. Stegun, Handbook of Mathematical Functions, 1964, eq. 26.2.12)
            double ref = -x * x / 2 - Math.log(x * Math.sqrt(2 * Math.PI))
                    + Math.log1p(-1 / (x * x) + 3 / Math.pow(x, 4) - 15 / Math.pow(x, 6));
            assertThat(NormalLinkApproximation.logUpperTail(0, 1, tau)).isCloseTo(ref,
                    offset(1e-9 * Math.abs(ref)));
        }
        // a near-perfect link: the minimum error underflows but its log is finite and matches the tail
        NormalLinkApproximation.Result r = NormalLinkApproximation.evaluate(new double[] {0, 2000},
                new double[] {25, 2000}, 0.5);
        assertThat(r.minErrorProbability()).isZero();
        assertThat(r.log10ErrorProbability()).isFinite().isLessThan(-300);
        assertThat(r.capacityBits()).isCloseTo(1.0, offset(1e-12));
    }

    @Test
    void badInputIsRefusedWithTheParameterNamed() {
        assertThatThrownBy(() -> NormalLinkApproximation.evaluate(new double[] {1}, new double[] {1}, 0.5))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("means");
        assertThatThrownBy(() -> NormalLinkApproximation.evaluate(new double[] {1, 2}, new double[] {1, -1}, 0.5))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("variance");
        assertThatThrownBy(() -> NormalLinkApproximation.evaluate(new double[] {1, 2}, new double[] {1, 1}, 1.0))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("priorOne");
        assertThatThrownBy(() -> new NormalLinkApproximation.Mixture(new double[] {0.5}, new double[] {0},
                new double[] {0})).isInstanceOf(IllegalArgumentException.class).hasMessageContaining("sum to 1");
    }

    @ParameterizedTest
    @MethodSource("mixtureSeeds")
    void aReducedMixtureKeepsTheMeanAndVarianceOfTheFullProductAndItsComponentLimit(long seed) {
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(seed);
        NormalLinkApproximation.Mixture full = NormalLinkApproximation.Mixture.NONE;
        NormalLinkApproximation.Mixture reduced = NormalLinkApproximation.Mixture.NONE;
        double mean = 0;
        double variance = 0;
        for (int t = 0; t < 8; t++) {
            double q = 0.02 + 0.5 * rng.nextDouble();
            double on = 1 + 500 * rng.nextDouble();
            double[] w = {1 - q, q};
            double[] m = {0, on};
            double[] v = {0, on * rng.nextDouble()};
            // independent sums: means and variances add; each term by the law of total variance
            mean += q * on;
            variance += q * v[1] + q * (1 - q) * on * on;
            reduced = reduced.plusReduced(w, m, v, NormalLinkApproximation.MAX_COMPONENTS);
            if (t < 4) {
                full = full.plus(w, m, v);
            }
        }
        assertThat(reduced.size()).isLessThanOrEqualTo(NormalLinkApproximation.MAX_COMPONENTS);
        // moment-preserving merges (Runnalls 2007, Salmond 1990): brute-force sum of the terms' moments
        assertThat(reduced.mean()).isCloseTo(mean, offset(1e-9 * (1 + mean)));
        assertThat(reduced.variance()).isCloseTo(variance, offset(1e-9 * (1 + variance)));
        // four terms fit in 16 components: no merge, the reduced mixture equals the full product (sorted by mean)
        NormalLinkApproximation.Mixture four = NormalLinkApproximation.Mixture.NONE;
        UniformRandomProvider again = RandomSource.XO_RO_SHI_RO_128_PP.create(seed);
        for (int t = 0; t < 4; t++) {
            double q = 0.02 + 0.5 * again.nextDouble();
            double on = 1 + 500 * again.nextDouble();
            four = four.plusReduced(new double[] {1 - q, q}, new double[] {0, on}, new double[] {0, on * again.nextDouble()},
                    NormalLinkApproximation.MAX_COMPONENTS);
        }
        assertThat(four.size()).isEqualTo(full.size());
        assertThat(four.variance()).isCloseTo(full.variance(), offset(1e-9 * (1 + full.variance())));
    }

    static LongStream mixtureSeeds() {
        return LongStream.of(1, 2, 3, 5, 8);
    }
}
