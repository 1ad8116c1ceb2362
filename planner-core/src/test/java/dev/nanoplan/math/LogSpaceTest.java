package dev.nanoplan.math;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.stream.DoubleStream;
import java.util.stream.IntStream;
import org.apache.commons.numbers.gamma.Erfc;
import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.simple.RandomSource;
import org.apache.commons.statistics.distribution.BinomialDistribution;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.params.provider.MethodSource;
import org.junit.jupiter.params.provider.ValueSource;

/** The log-space helpers against Commons Numbers / Statistics and published identities. */
class LogSpaceTest {

    static DoubleStream representableArguments() {
        // −3 .. 26.5 in steps of 0.25: erfc(x) is a normal double throughout
        return DoubleStream.iterate(-3, x -> x <= 26.5, x -> x + 0.25);
    }

    @ParameterizedTest(name = "x = {0}")
    @MethodSource("representableArguments")
    void agreesWithLogOfLibraryErfcWhereRepresentable(double x) {
        double tolerance = 4e-16 * Math.max(1, x * x);
        // Commons Numbers 1.2 Erfc, where erfc(x) does not underflow
        assertThat(LogSpace.logErfc(x)).isCloseTo(Math.log(Erfc.value(x)), within(tolerance));
    }

    @ParameterizedTest(name = "x = {0}")
    @ValueSource(doubles = {27, 30, 100, 1e3, 1e6, 1e10})
    void followsAsymptoticSeriesBeyondUnderflow(double x) {
        double expected = -x * x - Math.log(x * Math.sqrt(Math.PI))
            + Math.log(ErfReferenceTest.asymptoticBracket(x));
        // Abramowitz & Stegun 1964, eq. 7.1.23, in log form
        assertThat(LogSpace.logErfc(x)).isCloseTo(expected, within(2e-16 * Math.max(1, x * x)));
    }

    @Test
    void specialValues() {
        assertThat(LogSpace.logErfc(Double.POSITIVE_INFINITY)).isEqualTo(Double.NEGATIVE_INFINITY);
        assertThat(LogSpace.logErfc(Double.NaN)).isNaN();
        // erfc(−∞) = 2 (A&S 1964, eq. 7.1.2 with erf(−∞) = −1)
        assertThat(LogSpace.logErfc(Double.NEGATIVE_INFINITY)).isCloseTo(Math.log(2), within(1e-16));
        // erfc(0) = 1 (A&S 1964, eq. 7.1.2)
        assertThat(LogSpace.logErfc(0)).isEqualTo(0.0);
    }

    @ParameterizedTest(name = "seed {0}")
    @ValueSource(longs = {1, 2, 3, 4, 5})
    void logSumExpOfTwoAgreesWithDirectSumWhereRepresentable(long seed) {
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(seed);
        for (int i = 0; i < 200; i++) {
            double a = -600 + 1200 * rng.nextDouble();
            double b = a - 40 + 80 * rng.nextDouble();
            double expected = Math.log(Math.exp(a) + Math.exp(b));
            // brute force: the definition ln(e^a + e^b), evaluated where neither term over- or underflows
            assertThat(LogSpace.logSumExp(a, b)).isCloseTo(expected, within(1e-15 * Math.max(1, Math.abs(expected))));
            // the two-term and the array form compute the same sum
            assertThat(LogSpace.logSumExp(new double[] {a, b})).isCloseTo(expected,
                    within(1e-15 * Math.max(1, Math.abs(expected))));
        }
    }

    @Test
    void logSumExpStaysFiniteWhereTheTermsUnderflow() {
        // ln(e^x + e^x) = x + ln 2 (definition), at x far below ln(Double.MIN_VALUE) ≈ −745
        assertThat(LogSpace.logSumExp(-1e5, -1e5)).isCloseTo(-1e5 + Math.log(2), within(1e-11));
        // ln(e^a + e^b) − c = ln(e^{a−c} + e^{b−c}) (definition), shifted by c = 5000
        assertThat(LogSpace.logSumExp(-5000.25, -5003.5)).isCloseTo(LogSpace.logSumExp(-0.25, -3.5) - 5000,
                within(1e-12));
        // a term below the other's ulp adds nothing: ln(e^0 + e^{-800}) = log1p(e^{-800}) = 0 in doubles
        assertThat(LogSpace.logSumExp(0, -800)).isEqualTo(0.0);
    }

    @Test
    void logSumExpOfZeroTermsIsMinusInfinityNotNaN() {
        // ln 0 = −∞ (definition)
        assertThat(LogSpace.logSumExp(Double.NEGATIVE_INFINITY, Double.NEGATIVE_INFINITY))
                .isEqualTo(Double.NEGATIVE_INFINITY);
        assertThat(LogSpace.logSumExp(new double[0])).isEqualTo(Double.NEGATIVE_INFINITY);
        // ln(0 + e^x) = x
        assertThat(LogSpace.logSumExp(Double.NEGATIVE_INFINITY, -3.0)).isEqualTo(-3.0);
        assertThat(LogSpace.logSumExp(new double[] {Double.NEGATIVE_INFINITY, -3.0, Double.NEGATIVE_INFINITY}))
                .isEqualTo(-3.0);
        assertThat(LogSpace.logSumExp(Double.POSITIVE_INFINITY, 1.0)).isEqualTo(Double.POSITIVE_INFINITY);
    }

    @ParameterizedTest(name = "n = {0}, p = {1}")
    @CsvSource({"10, 0.5", "2000, 0.5", "10000, 0.3", "100000, 0.001"})
    void logSumExpOfABinomialLawIsZeroEvenShiftedFarBelowUnderflow(int n, double p) {
        BinomialDistribution law = BinomialDistribution.of(n, p);
        double[] logPmf = IntStream.rangeClosed(0, n).mapToDouble(law::logProbability).toArray();
        // binomial theorem: Σ_k C(n,k) p^k (1−p)^{n−k} = 1; log pmf of Commons Statistics 1.2
        assertThat(LogSpace.logSumExp(logPmf)).isCloseTo(0.0, within(1e-12));
        double shift = -2000;
        double[] shifted = DoubleStream.of(logPmf).map(v -> v + shift).toArray();
        // the same sum times e^{−2000}, where every term underflows a double
        assertThat(LogSpace.logSumExp(shifted)).isCloseTo(shift, within(1e-12 * -shift));
    }
}
