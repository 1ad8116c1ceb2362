package dev.nanoplan.count;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.stream.Stream;
import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.simple.RandomSource;
import org.apache.commons.statistics.distribution.BinomialDistribution;
import org.apache.commons.statistics.distribution.PoissonDistribution;
import org.assertj.core.data.Offset;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.params.provider.MethodSource;

/** The hand-written recurrence windows against Commons Statistics 1.2 distributions. */
class TermWindowsTest {

    private static final double EPS = 1e-15 / 4;

    static Stream<Arguments> randomBinomials() {
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(20240611L);
        return Stream.generate(() -> Arguments.of(
                        1 + (int) Math.exp(rng.nextDouble() * Math.log(1e6)),
                        Math.exp(rng.nextDouble() * Math.log(1e-6))))
                .limit(25);
    }

    @ParameterizedTest
    @CsvSource({"10, 0.3", "1000, 0.5", "1000, 0.001", "1000000, 0.3", "1000000, 0.5",
        "1000000, 1e-6", "50, 0.999", "1000000, 0.9999"})
    void binomialMatchesLibrary(int n, double p) {
        checkBinomial(n, p);
    }

    @ParameterizedTest
    @MethodSource("randomBinomials")
    void randomBinomialMatchesLibrary(int n, double p) {
        checkBinomial(n, p);
    }

    private static void checkBinomial(int n, double p) {
        Window w = TermWindows.binomial(n, p, EPS);
        BinomialDistribution d = BinomialDistribution.of(n, p);
        double maxRel = 0;
        for (int i = 0; i < w.length(); i++) {
            double ref = d.probability((int) (w.offset + i));
            maxRel = Math.max(maxRel, Math.abs(w.p[i] - ref) / ref);
        }
        // Commons Statistics 1.2 BinomialDistribution.probability (saddle-point expansion)
        assertThat(maxRel).as("max relative error on the window").isLessThan(1e-12);
        double below = w.offset == 0 ? 0 : d.cumulativeProbability((int) w.offset - 1);
        double above = d.survivalProbability((int) (w.offset + w.length() - 1));
        // Commons Statistics 1.2 BinomialDistribution cumulative / survival probability
        assertThat(w.below).isCloseTo(below, Offset.offset(1e-12 * below + 1e-300));
        assertThat(w.above).isCloseTo(above, Offset.offset(1e-12 * above + 1e-300));
        assertThat(w.below).isLessThan(EPS);
        assertThat(w.above).isLessThan(EPS);
    }

    @ParameterizedTest
    @CsvSource({"0.5", "10", "1000", "123456.7", "1e8"})
    void poissonMatchesLibrary(double mean) {
        Window w = TermWindows.poisson(mean, EPS);
        PoissonDistribution d = PoissonDistribution.of(mean);
        double maxRel = 0;
        for (int i = 0; i < w.length(); i++) {
            double ref = d.probability((int) (w.offset + i));
            maxRel = Math.max(maxRel, Math.abs(w.p[i] - ref) / ref);
        }
        // Commons Statistics 1.2 PoissonDistribution.probability
        assertThat(maxRel).isLessThan(1e-12);
        double below = w.offset == 0 ? 0 : d.cumulativeProbability((int) w.offset - 1);
        double above = d.survivalProbability((int) (w.offset + w.length() - 1));
        // Commons Statistics 1.2 PoissonDistribution cumulative / survival probability
        assertThat(w.below).isCloseTo(below, Offset.offset(1e-12 * below + 1e-300));
        assertThat(w.above).isCloseTo(above, Offset.offset(1e-12 * above + 1e-300));
    }
}
