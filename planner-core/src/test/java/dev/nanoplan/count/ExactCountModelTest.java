package dev.nanoplan.count;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.data.Offset.offset;

import java.util.ArrayList;
import java.util.List;
import java.util.stream.Stream;
import org.apache.commons.numbers.gamma.RegularizedBeta;
import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.simple.RandomSource;
import org.apache.commons.statistics.distribution.BinomialDistribution;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.params.provider.MethodSource;

class ExactCountModelTest {

    private static final ExactCountModel MODEL = ExactCountModel.DEFAULT;

    /** Plausible decaying taps p_k = p0·(k+1)^{-3/2}. */
    static double[] taps(double p0, int memory) {
        double[] t = new double[memory + 1];
        for (int k = 0; k <= memory; k++) {
            t[k] = p0 * Math.pow(k + 1, -1.5);
        }
        return t;
    }

    /** Count law given the current symbol is 1: ISI mixtures over earlier symbols, background. */
    static CountLaw isiLaw(int n0, int n1, double q, double[] taps, double background) {
        List<CountTerm> terms = new ArrayList<>();
        terms.add(new BinomialTerm(n1, taps[0]));
        for (int k = 1; k < taps.length; k++) {
            terms.add(MixtureTerm.of(q, new BinomialTerm(n0, taps[k]), new BinomialTerm(n1, taps[k])));
        }
        terms.add(new PoissonTerm(background));
        return new CountLaw(terms);
    }

    static Stream<Arguments> histories() {
        return Stream.of(
                Arguments.of(0, 40, 0.5, 0.3, 3, 0.5),
                Arguments.of(5, 30, 0.3, 0.4, 6, 1.5),
                Arguments.of(10, 60, 0.7, 0.2, 8, 0.0),
                Arguments.of(0, 200, 0.5, 0.5, 8, 2.0));
    }

    @ParameterizedTest
    @MethodSource("histories")
    void matchesEnumerationOfAllSymbolHistories(int n0, int n1, double q, double p0, int memory, double bg) {
        double[] taps = taps(p0, memory);
        CountLaw law = isiLaw(n0, n1, q, taps, bg);
        // convolutions truncated to [0, ymax] are exact there, all terms being non-negative
        int ymax = Math.min(400, n1 * (memory + 1) + 40);
        double[] expected = new double[ymax + 1];
        for (int h = 0; h < (1 << memory); h++) {
            double prob = 1;
            double[] pmf = Reference.pmf(new BinomialTerm(n1, taps[0]), ymax);
            for (int k = 1; k <= memory; k++) {
                boolean one = ((h >> (k - 1)) & 1) == 1;
                prob *= one ? q : 1 - q;
                pmf = Reference.convolve(pmf, Reference.pmf(new BinomialTerm(one ? n1 : n0, taps[k]), ymax));
            }
            pmf = Reference.convolve(pmf, Reference.pmf(new PoissonTerm(bg), ymax));
            for (int y = 0; y <= ymax; y++) {
                expected[y] += prob * pmf[y];
            }
        }
        CountPmf actual = MODEL.pmf(law);
        double peak = 0;
        for (double v : expected) {
            peak = Math.max(peak, v);
        }
        for (int y = 0; y <= ymax; y++) {
            // brute-force enumeration of the law of total probability (definition), 2^L histories,
            // each a direct convolution of Commons Statistics 1.2 pmfs
            assertThat(actual.probability(y)).as("y = %d", y)
                    .isCloseTo(expected[y], offset(1e-12 * expected[y] + 1e-15 * peak));
        }
    }

    @ParameterizedTest
    @CsvSource({"0, 1000, 0.5, 0.2", "300, 2000, 0.3, 0.05", "1000000, 1000000, 0.5, 0.01"})
    void mixtureMomentsFollowTheLawOfTotalVariance(int n0, int n1, double q, double p) {
        CountPmf pmf = MODEL.pmf(CountLaw.of(MixtureTerm.of(q, new BinomialTerm(n0, p), new BinomialTerm(n1, p))));
        double mean = 0;
        double second = 0;
        for (int i = 0; i < pmf.length(); i++) {
            double y = pmf.offset() + i;
            mean += y * pmf.massAt(i);
        }
        for (int i = 0; i < pmf.length(); i++) {
            double d = pmf.offset() + i - mean;
            second += d * d * pmf.massAt(i);
        }
        double m0 = n0 * p;
        double m1 = n1 * p;
        double mu = (1 - q) * m0 + q * m1;
        double var = (1 - q) * (n0 * p * (1 - p) + (m0 - mu) * (m0 - mu))
                + q * (n1 * p * (1 - p) + (m1 - mu) * (m1 - mu));
        // law of total expectation / total variance (e.g. Ross, A First Course in Probability,
        // 8th ed., 2010, §7.5), with binomial moments np and np(1 − p)
        assertThat(mean).isCloseTo(mu, offset(1e-12 * Math.max(1, mu)));
        assertThat(second).isCloseTo(var, offset(1e-10 * Math.max(1, var)));
    }

    @ParameterizedTest
    @CsvSource({"20, 0.3", "1000, 0.02", "1000000, 0.3", "1000000, 0.5"})
    void singleBinomialMatchesLibrary(int n, double p) {
        CountPmf pmf = MODEL.pmf(CountLaw.of(new BinomialTerm(n, p)));
        BinomialDistribution d = BinomialDistribution.of(n, p);
        for (int i = 0; i < pmf.length(); i++) {
            double ref = d.probability((int) (pmf.offset() + i));
            // Commons Statistics 1.2 BinomialDistribution.probability
            assertThat(pmf.massAt(i)).isCloseTo(ref, offset(1e-12 * ref));
        }
    }

    @ParameterizedTest
    @CsvSource({"100, 0.3, 30", "100, 0.3, 45", "5000, 0.01, 70", "1000000, 0.3, 300800",
        "1000000, 0.3, 301000", "1000000, 0.3, 299000"})
    void binomialUpperTailIsTheRegularisedIncompleteBeta(int n, double p, int k) {
        CountPmf pmf = MODEL.pmf(CountLaw.of(new BinomialTerm(n, p)));
        double tail = pmf.massAbove();
        for (long y = Math.max(k, pmf.offset()); y <= pmf.last(); y++) {
            tail += pmf.probability(y);
        }
        double ref = RegularizedBeta.value(p, k, n - k + 1.0);
        // P(Bin(n,p) >= k) = I_p(k, n-k+1): DLMF 8.17.5 / Abramowitz & Stegun 26.5.24 (from memory);
        // Commons Numbers 1.2 RegularizedBeta
        assertThat(tail).isCloseTo(ref, offset(1e-12 * ref + 2e-15));
    }

    static Stream<Arguments> randomLaws() {
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(99L);
        return Stream.generate(() -> {
            int n1 = 10 + rng.nextInt(200000);
            int n0 = rng.nextInt(n1 / 4 + 1);
            double p0 = 0.01 + 0.4 * rng.nextDouble();
            int memory = rng.nextInt(20);
            double q = rng.nextDouble();
            double bg = 50 * rng.nextDouble();
            return Arguments.of(isiLaw(n0, n1, q, taps(p0, memory), bg));
        }).limit(12);
    }

    @ParameterizedTest
    @MethodSource("randomLaws")
    void windowMassPlusRecordedTruncationIsOne(CountLaw law) {
        CountPmf pmf = MODEL.pmf(law);
        double sum = Window.sum(pmf.masses());
        // normalisation axiom (Kolmogorov): total probability 1
        assertThat(sum + pmf.truncatedMass()).isCloseTo(1.0, offset(1e-14));
        assertThat(pmf.truncatedMass()).isLessThan(MODEL.truncationMass());
        // linearity of expectation: mean of the sum = sum of the terms' means
        assertThat(pmf.mean()).isCloseTo(law.mean(), offset(1e-12 * law.mean() + 1e-12));
    }

    @ParameterizedTest
    @CsvSource({"1000000000, 1e-6", "1000000000, 0.5", "1000000000, 1e-300", "1000000, 1e-300"})
    void extremeTrialsAndProbabilities(int n, double p) {
        CountLaw law = CountLaw.of(new BinomialTerm(n, p), new PoissonTerm(0));
        CountPmf pmf = MODEL.pmf(law);
        double sum = 0;
        for (int i = 0; i < pmf.length(); i++) {
            assertThat(pmf.massAt(i)).isNotNaN().isGreaterThanOrEqualTo(0);
            sum += pmf.massAt(i);
        }
        // normalisation axiom
        assertThat(sum + pmf.truncatedMass()).isCloseTo(1.0, offset(1e-13));
        // binomial mean np (definition)
        assertThat(pmf.mean()).isCloseTo(n * p, offset(1e-11 * n * p + 1e-15));
    }

    @Test
    void pointMassesAreSingleCells() {
        CountPmf pmf = MODEL.pmf(CountLaw.of(new BinomialTerm(0, 0.3), new BinomialTerm(7, 0),
                new BinomialTerm(12, 1), new PoissonTerm(0)));
        assertThat(pmf.length()).isEqualTo(1);
        // Bin(n, 1) is the point mass at n (definition)
        assertThat(pmf.offset()).isEqualTo(12);
        assertThat(pmf.massAt(0)).isEqualTo(1.0);
        assertThat(MODEL.pmf(new CountLaw(List.of())).probability(0)).isEqualTo(1.0);
    }

    @Test
    void pointMassShiftsTheRest() {
        CountPmf shifted = MODEL.pmf(CountLaw.of(new BinomialTerm(50, 1), new BinomialTerm(100, 0.4)));
        BinomialDistribution d = BinomialDistribution.of(100, 0.4);
        for (int y = 0; y <= 100; y++) {
            double ref = d.probability(y);
            // Y = 50 + Bin(100, 0.4); Commons Statistics 1.2 BinomialDistribution.probability
            // (cells outside the window were dropped and are below the truncation mass)
            assertThat(shifted.probability(50 + y)).isCloseTo(ref,
                    offset(50 + y < shifted.offset() || 50 + y > shifted.last() ? 1e-15 : 1e-12 * ref));
        }
    }

    @Test
    void rejectsBadTruncationMass() {
        assertThatThrownBy(() -> new ExactCountModel(0)).isInstanceOf(IllegalArgumentException.class)
                .hasMessageContaining("truncationMass");
        assertThatThrownBy(() -> new ExactCountModel(Double.NaN)).isInstanceOf(IllegalArgumentException.class);
    }
}
