package dev.nanoplan.count;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.data.Offset.offset;

import java.util.stream.Stream;
import org.apache.commons.numbers.gamma.RegularizedBeta;
import org.apache.commons.statistics.distribution.BinomialDistribution;
import org.apache.commons.statistics.distribution.PoissonDistribution;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.params.provider.MethodSource;

class LogTailsTest {

    @Test
    void binomialLowerTailAtOneIsAllFailures() {
        CountLaw law = CountLaw.of(new BinomialTerm(10000, 0.3));
        // P(Bin(n,p) < 1) = P(0) = (1−p)^n (binomial pmf definition)
        assertThat(LogTails.logLowerTail(law, 1)).isCloseTo(10000 * Math.log(0.7), offset(1e-12 * 3567));
        // P(Bin(n,p) ≥ n) = p^n (binomial pmf definition)
        assertThat(LogTails.logUpperTail(law, 10000)).isCloseTo(10000 * Math.log(0.3), offset(1e-12 * 12040));
    }

    @ParameterizedTest
    @CsvSource({"10000, 0.3, 5000", "10000, 0.3, 3200", "10000, 0.3, 2700", "10000, 0.3, 1",
        "2000, 0.05, 1000", "1000000, 0.001, 2000", "1000000, 0.001, 1", "1000000, 0.001, 500",
        "100, 0.5, 100", "100, 0.5, 50"})
    void singleBinomialMatchesLogSumOfLibraryLogProbabilities(int n, double p, int tau) {
        BinomialDistribution d = BinomialDistribution.of(n, p);
        double[] logPmf = new double[n + 1];
        for (int y = 0; y <= n; y++) {
            logPmf[y] = d.logProbability(y);
        }
        CountLaw law = CountLaw.of(new BinomialTerm(n, p));
        double up = Reference.logSum(logPmf, tau, n);
        double low = Reference.logSum(logPmf, 0, tau - 1);
        // log-sum-exp of Commons Statistics 1.2 BinomialDistribution.logProbability over the tail
        assertThat(LogTails.logUpperTail(law, tau)).isCloseTo(up, offset(1e-11 * Math.max(1, -up)));
        assertThat(LogTails.logLowerTail(law, tau)).isCloseTo(low, offset(1e-11 * Math.max(1, -low)));
    }

    @ParameterizedTest
    @CsvSource({"10000, 0.3, 3400", "1000000, 0.001, 1200", "1000000, 0.001, 850", "2000, 0.05, 160"})
    void reusedTiltsAtNearbyThresholdsMatchLibraryLogProbabilities(int n, double p, int centre) {
        BinomialDistribution d = BinomialDistribution.of(n, p);
        double[] logPmf = new double[n + 1];
        for (int y = 0; y <= n; y++) {
            logPmf[y] = d.logProbability(y);
        }
        CountLaw law = CountLaw.of(new BinomialTerm(n, p));
        LogTails.Reuse reuse = new LogTails.Reuse(law);
        // centre first, then its neighbours: most of them are read from the centre's tilted pmf
        for (int tau : new int[] {centre, centre - 9, centre + 9, centre - 3, centre + 1, centre + 4}) {
            double up = Reference.logSum(logPmf, tau, n);
            double low = Reference.logSum(logPmf, 0, tau - 1);
            // log-sum-exp of Commons Statistics 1.2 BinomialDistribution.logProbability over the tail
            assertThat(reuse.logUpperTail(tau)).isCloseTo(up, offset(1e-11 * Math.max(1, -up)));
            assertThat(reuse.logLowerTail(tau)).isCloseTo(low, offset(1e-11 * Math.max(1, -low)));
        }
    }

    @Test
    void deepTailBelowTheSmallestDoubleIsFinite() {
        CountLaw law = CountLaw.of(new BinomialTerm(2000, 0.05));
        double ln = LogTails.logUpperTail(law, 1000);
        assertThat(ln).isFinite().isLessThan(-1000);
        BinomialDistribution d = BinomialDistribution.of(2000, 0.05);
        double ref = Double.NEGATIVE_INFINITY;
        for (int y = 1000; y <= 2000; y++) {
            ref = Reference.logAdd(ref, d.logProbability(y));
        }
        // log-sum-exp of Commons Statistics 1.2 BinomialDistribution.logProbability
        assertThat(ln).isCloseTo(ref, offset(1e-12 * -ref));
    }

    @ParameterizedTest
    @CsvSource({"10, 500", "10, 30", "10, 1", "1000, 1300", "1000, 800", "0.01, 40"})
    void poissonMatchesLogSumOfLibraryLogProbabilities(double mean, int tau) {
        PoissonDistribution d = PoissonDistribution.of(mean);
        CountLaw law = CountLaw.of(new PoissonTerm(mean));
        double up = Double.NEGATIVE_INFINITY;
        for (int y = tau; y < tau + 5000; y++) {
            up = Reference.logAdd(up, d.logProbability(y));
        }
        double low = Double.NEGATIVE_INFINITY;
        for (int y = 0; y < tau; y++) {
            low = Reference.logAdd(low, d.logProbability(y));
        }
        // log-sum-exp of Commons Statistics 1.2 PoissonDistribution.logProbability
        assertThat(LogTails.logUpperTail(law, tau)).isCloseTo(up, offset(1e-11 * Math.max(1, -up)));
        assertThat(LogTails.logLowerTail(law, tau)).isCloseTo(low, offset(1e-11 * Math.max(1, -low)));
    }

    @ParameterizedTest
    @CsvSource({"100, 0.3, 45", "5000, 0.01, 90", "1000000, 0.3, 302000"})
    void upperTailIsTheLogOfTheRegularisedIncompleteBeta(int n, double p, int k) {
        double ref = Math.log(RegularizedBeta.value(p, k, n - k + 1.0));
        // P(Bin(n,p) ≥ k) = I_p(k, n−k+1): DLMF 8.17.5 / A&S 26.5.24 (from memory); Commons Numbers 1.2
        assertThat(LogTails.logUpperTail(CountLaw.of(new BinomialTerm(n, p)), k))
                .isCloseTo(ref, offset(1e-11 * Math.max(1, -ref)));
    }

    static Stream<Arguments> smallLaws() {
        CountLaw a = CountLaw.of(new BinomialTerm(40, 0.2),
                MixtureTerm.of(0.3, new BinomialTerm(0, 0.1), new BinomialTerm(30, 0.1)),
                MixtureTerm.of(0.6, new BinomialTerm(5, 0.05), new BinomialTerm(30, 0.05)),
                new PoissonTerm(0.5));
        CountLaw b = CountLaw.of(new BinomialTerm(60, 0.5),
                MixtureTerm.of(0.5, new BinomialTerm(0, 0.3), new BinomialTerm(60, 0.3)),
                new BinomialTerm(25, 0.01));
        return Stream.of(Arguments.of(a, 0.5), Arguments.of(b, 0.0));
    }

    @ParameterizedTest
    @MethodSource("smallLaws")
    void multiTermLawsMatchLogDomainBruteForceConvolution(CountLaw law, double background) {
        int ymax = (int) Math.min(law.maxValue(), 10_000) + (background > 0 ? 400 : 0);
        double[] log = null;
        for (CountTerm t : law.terms()) {
            double[] lt = Reference.logPmf(t, ymax);
            log = log == null ? lt : Reference.logConvolve(log, lt);
        }
        int max = (int) Math.min(law.maxValue(), ymax);
        for (int tau = 1; tau <= Math.min(max, 140); tau++) {
            double up = Reference.logSum(log, tau, ymax);
            double low = Reference.logSum(log, 0, tau - 1);
            // brute-force log-domain convolution (log-sum-exp over all values, definition) of
            // Commons Statistics 1.2 log-pmfs
            assertThat(LogTails.logUpperTail(law, tau)).as("upper τ=%d", tau)
                    .isCloseTo(up, offset(1e-10 * Math.max(1, -up)));
            assertThat(LogTails.logLowerTail(law, tau)).as("lower τ=%d", tau)
                    .isCloseTo(low, offset(1e-10 * Math.max(1, -low)));
        }
    }

    @ParameterizedTest
    @CsvSource({"290", "300", "305", "320", "350"})
    void upperAndLowerTailsAddUpToOne(long tau) {
        CountLaw law = ExactCountModelTest.isiLaw(10, 600, 0.5, ExactCountModelTest.taps(0.3, 10), 2);
        double sum = Math.exp(LogTails.logUpperTail(law, tau)) + Math.exp(LogTails.logLowerTail(law, tau));
        // complementary events: P(Y ≥ τ) + P(Y < τ) = 1 (probability axioms)
        assertThat(sum).isCloseTo(1.0, offset(1e-13));
    }

    @Test
    void edgesOfTheSupport() {
        CountLaw law = CountLaw.of(new BinomialTerm(7, 1), new BinomialTerm(10, 0.4));
        // the support is [7, 17] (Bin(7,1) is the point mass at 7)
        assertThat(LogTails.logUpperTail(law, 7)).isZero();
        assertThat(LogTails.logLowerTail(law, 7)).isEqualTo(Double.NEGATIVE_INFINITY);
        assertThat(LogTails.logUpperTail(law, 18)).isEqualTo(Double.NEGATIVE_INFINITY);
        assertThat(LogTails.logLowerTail(law, 18)).isZero();
        // P(Y ≥ 17) = 0.4^10 (binomial pmf definition)
        assertThat(LogTails.logUpperTail(law, 17)).isCloseTo(10 * Math.log(0.4), offset(1e-12));
        // P(Y < 8) = 0.6^10
        assertThat(LogTails.logLowerTail(law, 8)).isCloseTo(10 * Math.log(0.6), offset(1e-12));
    }

    @Test
    void hugeTrialsAndTinyProbabilitiesStayFinite() {
        CountLaw law = CountLaw.of(new BinomialTerm(1_000_000_000L, 1e-6), new PoissonTerm(3));
        double up = LogTails.logUpperTail(law, 2000);
        double low = LogTails.logLowerTail(law, 400);
        assertThat(up).isFinite().isLessThan(-100);
        assertThat(low).isFinite().isLessThan(-100);
        CountLaw tiny = CountLaw.of(new BinomialTerm(1000, 1e-300));
        // P(Bin(n, p) ≥ 1) = 1 − (1−p)^n ≈ np for np ≪ 1 (binomial pmf definition)
        assertThat(LogTails.logUpperTail(tiny, 1)).isCloseTo(Math.log(1000 * 1e-300), offset(1e-9));
    }
}
