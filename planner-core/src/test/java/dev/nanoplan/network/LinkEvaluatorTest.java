package dev.nanoplan.network;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import dev.nanoplan.count.CountModelKind;
import dev.nanoplan.count.CountPmf;
import dev.nanoplan.physics.OpenSphereHitting;
import java.util.List;
import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.simple.RandomSource;
import org.apache.commons.statistics.distribution.BinomialDistribution;
import org.apache.commons.statistics.distribution.PoissonDistribution;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;

class LinkEvaluatorTest {

    @Test
    void nearPerfectLinkErrorIsExactFarBelowDoubleRange() {
        // Y|0 = 0 exactly, Y|1 ~ Bin(10000, 0.3): best τ = 1 and the error is q·P(Bin = 0) = ½·0.7^10000,
        // about 1e-1549 (binomial pmf, definition; e.g. Feller 1968, Vol. I, §VI.2)
        LinkSpec s = LinkSpec.binary(new double[] {0.3}, 0, 10_000, 0.5, 0, CountModelKind.EXACT, 1);
        LinkEvaluation e = LinkEvaluator.evaluate(s);
        double expected = Math.log10(0.5) + 10_000 * Math.log10(0.7);
        assertThat(e.minErrorThreshold()).isEqualTo(1);
        assertThat(e.log10ErrorProbability()).isCloseTo(expected, within(1e-9 * Math.abs(expected)));
        assertThat(e.minErrorProbability()).isZero();
        assertThat(e.capacityBits()).isLessThanOrEqualTo(1.0).isGreaterThan(1 - 1e-12);
    }

    @Test
    void errorAtAGivenThresholdIsExactInLogSpaceFarBelowDoubleRange() {
        // Y|0 ~ Poisson(1), Y|1 ~ Bin(5000, 0.3) + Poisson(1); at τ = 300 both tails are far below 1e-300
        LinkSpec s = LinkSpec.binary(new double[] {0.3}, 0, 5000, 0.4, 1, CountModelKind.EXACT, 1);
        var law0 = LinkEvaluator.lawGivenLevel(s, 0, List.of());
        var law1 = LinkEvaluator.lawGivenLevel(s, 1, List.of());
        long tau = 300;
        // Reference: log-sum-exp of Commons Statistics log pmfs: ln P(Pois(1) ≥ τ) over y = τ..τ+400, and
        // ln P(Bin + Pois < τ) over every pair j + k < τ (sum of independent terms, Feller 1968, §XI.2)
        PoissonDistribution pois = PoissonDistribution.of(1);
        BinomialDistribution bin = BinomialDistribution.of(5000, 0.3);
        List<Double> up = new java.util.ArrayList<>();
        for (int y = (int) tau; y < tau + 400; y++) {
            up.add(pois.logProbability(y));
        }
        List<Double> low = new java.util.ArrayList<>();
        for (int j = 0; j < tau; j++) {
            for (int k = 0; j + k < tau; k++) {
                low.add(bin.logProbability(j) + pois.logProbability(k));
            }
        }
        double expected = logSumExp(List.of(Math.log(0.6) + logSumExp(up), Math.log(0.4) + logSumExp(low)));
        assertThat(expected).isLessThan(-300 * Math.log(10));
        assertThat(LinkEvaluator.lnErrorAt(law0, law1, 0.4, tau)).isCloseTo(expected, within(1e-9 * Math.abs(expected)));
    }

    private static double logSumExp(List<Double> v) {
        double max = Double.NEGATIVE_INFINITY;
        for (double x : v) {
            max = Math.max(max, x);
        }
        double s = 0;
        for (double x : v) {
            s += Math.exp(x - max);
        }
        return max + Math.log(s);
    }

    @Test
    void operatingThresholdAndErrorAreOnePair() {
        // the README example: MI is best at τ = 56, the error is least at τ = 57
        LinkSpec s = LinkSpec.binary(OpenSphereHitting.of(15, 5, 100).taps(0.5, 5), 0, 500, 0.5, 0,
                CountModelKind.EXACT, 0.5);
        LinkEvaluation e = LinkEvaluator.evaluate(s);
        double[] err = e.binary().errorByThreshold();
        // the error reported is the error curve at the operating threshold, not its minimum
        assertThat(e.errorProbability()).isEqualTo(err[(int) (e.operatingThreshold() - e.binary().firstThreshold())]);
        assertThat(e.operatingThreshold()).isEqualTo(e.binary().miThreshold());
        assertThat(e.minErrorThreshold()).isNotEqualTo(e.operatingThreshold());
        assertThat(e.errorProbability()).isGreaterThan(e.minErrorProbability());
    }

    @Test
    void logSpaceRefinementAgreesWithWindowSumsWhereBothHold() {
        // error ≈ 1e-11: inside the window's resolution, so both exact paths must agree
        LinkSpec s = LinkSpec.binary(new double[] {0.3, 0.02}, 0, 70, 0.5, 0.4, CountModelKind.EXACT, 1);
        var laws = List.of(LinkEvaluator.lawGivenLevel(s, 0, List.of()), LinkEvaluator.lawGivenLevel(s, 1, List.of()));
        var e = LinkEvaluator.evaluate(s);
        long[] r = LinkEvaluator.refineInLogSpace(laws.get(0), laws.get(1), 0.5, e.minErrorThreshold());
        double lnErr = Double.longBitsToDouble(r[1]);
        assertThat(r[0]).isEqualTo(e.binary().minErrorThreshold());
        assertThat(Math.exp(lnErr)).isCloseTo(e.binary().minErrorProbability(),
                within(1e-8 * e.binary().minErrorProbability()));
    }

    static List<Object[]> randomBackgroundCases() {
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(20261201L);
        List<Object[]> cases = new java.util.ArrayList<>();
        for (int i = 0; i < 12; i++) {
            cases.add(new Object[] {10 + rng.nextInt(200), 0.02 + 0.5 * rng.nextDouble(), 5 * rng.nextDouble(),
                0.2 + 0.6 * rng.nextDouble()});
        }
        return cases;
    }

    @ParameterizedTest
    @MethodSource("randomBackgroundCases")
    void minimumErrorMatchesLibraryDistributions(int n, double p, double background, double q) {
        LinkSpec s = LinkSpec.binary(new double[] {p}, 0, n, q, background, CountModelKind.EXACT, 1);
        LinkEvaluation e = LinkEvaluator.evaluate(s);
        // Reference: Y|0 ~ Poisson(β), Y|1 ~ Bin(n, p) + Poisson(β), convolved from Commons Statistics
        // pmfs; the error of "decide 1 iff Y ≥ τ" is (1−q)P(Y≥τ|0) + qP(Y<τ|1) (docs/architecture.md §5.7).
        PoissonDistribution bg = PoissonDistribution.of(Math.max(background, 1e-300));
        BinomialDistribution sig = BinomialDistribution.of(n, p);
        double best = Double.POSITIVE_INFINITY;
        for (int tau = 0; tau <= n + 60; tau++) {
            double lower1 = 0;
            for (int y = 0; y < tau; y++) {
                for (int b = 0; b <= y; b++) {
                    lower1 += sig.probability(y - b) * (background == 0 ? (b == 0 ? 1 : 0) : bg.probability(b));
                }
            }
            double upper0 = background == 0 ? (tau <= 0 ? 1 : 0) : bg.survivalProbability(tau - 1);
            best = Math.min(best, (1 - q) * upper0 + q * lower1);
        }
        assertThat(e.minErrorProbability()).isCloseTo(best, within(1e-12 + 1e-9 * best));
    }

    @ParameterizedTest
    @MethodSource("randomBackgroundCases")
    void countPmfsAloneAreTheEvaluationsPmfsAndMatchLibraryDistributions(int n, double p, double background,
            double q) {
        LinkSpec s = LinkSpec.binary(new double[] {p}, 0, n, q, background, CountModelKind.EXACT, 1);
        List<CountPmf> pmfs = LinkEvaluator.countPmfs(s, List.of());
        List<CountPmf> full = LinkEvaluator.evaluate(s).givenLevel();
        for (int level = 0; level < 2; level++) {
            assertThat(pmfs.get(level).offset()).isEqualTo(full.get(level).offset());
            assertThat(pmfs.get(level).last()).isEqualTo(full.get(level).last());
            for (long y = full.get(level).offset(); y <= full.get(level).last(); y++) {
                assertThat(pmfs.get(level).probability(y)).isEqualTo(full.get(level).probability(y));
            }
        }
        // Reference: Y|1 ~ Bin(n, p) + Poisson(β), convolved from Commons Statistics pmfs
        PoissonDistribution bg = PoissonDistribution.of(Math.max(background, 1e-300));
        BinomialDistribution sig = BinomialDistribution.of(n, p);
        for (int y = 0; y <= n; y += Math.max(1, n / 20)) {
            double expected = 0;
            for (int b = 0; b <= y; b++) {
                expected += sig.probability(y - b) * (background == 0 ? (b == 0 ? 1 : 0) : bg.probability(b));
            }
            assertThat(pmfs.get(1).probability(y)).isCloseTo(expected, within(1e-12 + 1e-9 * expected));
        }
    }

    @Test
    void closerReceiverNeverLowersCapacityWithoutIsi() {
        double previous = -1;
        // moving closer raises F(T) = (r/d) erfc((d − r)/√(4DT)) (Redner 2001), hence the capacity
        for (double d = 60; d >= 6; d -= 6) {
            double[] taps = OpenSphereHitting.of(d, 5, 80).taps(0.5, 0);
            double c = LinkEvaluator.evaluate(LinkSpec.binary(taps, 0, 300, 0.5, 1, CountModelKind.EXACT, 0.5))
                    .capacityBits();
            assertThat(c).isGreaterThanOrEqualTo(previous - 1e-12);
            previous = c;
        }
    }

    @Test
    void multiLevelCapacityIsBoundedAndAtLeastBinaryWithSameTopLevel() {
        double[] taps = OpenSphereHitting.of(15, 5, 100).taps(0.5, 5);
        double binary = LinkEvaluator.evaluate(LinkSpec.binary(taps, 0, 2000, 0.5, 0, CountModelKind.EXACT, 0.5))
                .capacityBits();
        for (int m = 3; m <= 4; m++) {
            LinkSpec s = new LinkSpec(taps, LinkSpec.evenLevels(m, 2000), 0.5, 0, CountModelKind.EXACT, 0.5);
            LinkEvaluation e = LinkEvaluator.evaluate(s);
            // capacity ≤ log2 M (Cover & Thomas 2006, Thm 7.1.1 (from memory))
            assertThat(e.capacityBits()).isLessThanOrEqualTo(Math.log(m) / Math.log(2) + 1e-12);
            assertThat(e.multiLevel().softCapacityBits()).isGreaterThanOrEqualTo(e.capacityBits() - 1e-9);
            assertThat(e.minErrorProbability()).isBetween(0.0, 1.0);
            assertThat(e.capacityBits()).isGreaterThan(0.5 * binary);
        }
    }

    @Test
    void gaussianShortcutApproachesExactAsMoleculesGrow() {
        // the normal approximation of a binomial improves as N grows (Berry–Esseen theorem, from memory)
        double[] taps = {0.1};
        double previousGap = Double.POSITIVE_INFINITY;
        for (long n : new long[] {20, 200, 2000, 20000}) {
            double exact = LinkEvaluator.evaluate(LinkSpec.binary(taps, n / 2, n, 0.5, 0, CountModelKind.EXACT, 1))
                    .capacityBits();
            double gauss = LinkEvaluator.evaluate(LinkSpec.binary(taps, n / 2, n, 0.5, 0, CountModelKind.GAUSSIAN, 1))
                    .capacityBits();
            double gap = Math.abs(exact - gauss);
            assertThat(gap).isLessThan(previousGap);
            previousGap = gap;
        }
    }

    @Test
    void rejectsBadSpecsNamingTheField() {
        org.assertj.core.api.Assertions.assertThatThrownBy(
                () -> LinkSpec.binary(new double[] {0.6, 0.6}, 0, 10, 0.5, 0, CountModelKind.EXACT, 1))
                .hasMessageContaining("taps");
        org.assertj.core.api.Assertions.assertThatThrownBy(
                () -> LinkSpec.binary(new double[] {0.1}, 0, 10, 1.0, 0, CountModelKind.EXACT, 1))
                .hasMessageContaining("prior");
    }
}
