package dev.nanoplan.report;

import static org.assertj.core.api.Assertions.assertThat;

import java.math.BigDecimal;
import java.math.MathContext;
import java.math.RoundingMode;
import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.simple.RandomSource;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.params.provider.ValueSource;

/** The one number format of text and HTML output. */
class NumbersTest {

    @ParameterizedTest(name = "{0} -> {1}")
    @CsvSource({"0.5, 0.500", "0.0123, 0.0123", "0.001, 0.00100", "0.000999, 9.99e-04", "4.5678e-7, 4.57e-07",
        "1, 1.00", "0, 0"})
    void probabilitiesHaveThreeSignificantDigits(double p, String expected) {
        // worked by hand from the stated rule: 3 significant digits, scientific below 1e-3
        assertThat(Numbers.probability(p)).isEqualTo(expected);
    }

    @ParameterizedTest(name = "{0} -> {1}")
    @CsvSource({"310, 310", "310.15, 310.2", "0.69, 0.69", "0.3, 0.3", "12.3456, 12.35", "499.98, 500",
        "1234567, 1234567", "12345.6, 1.235e+04", "0.00012345, 1.235e-04", "-2.5, -2.5", "1e8, 1.000e+08"})
    void quantitiesAreWholeOrFourSignificantDigits(double v, String expected) {
        // worked by hand from the stated rule; java.util.Formatter rounds the decimal form 310.15 half up
        assertThat(Numbers.quantity(v)).isEqualTo(expected);
    }

    @Test
    void errorProbabilitiesBelowTheDoubleRangeReadAsPowersOfTen() {
        // a representable probability reads like any probability
        assertThat(Numbers.errorProbability(0.0476, Math.log10(0.0476))).isEqualTo("0.0476");
        // below 1e-300 the logarithm is written with one decimal
        assertThat(Numbers.errorProbability(0, -412.54)).isEqualTo("10^-412.5");
        assertThat(Numbers.errorProbability(3e-305, Math.log10(3e-305))).isEqualTo("10^-304.5");
        // log10 = −∞ is a true zero; NaN is missing
        assertThat(Numbers.errorProbability(0, Double.NEGATIVE_INFINITY)).isEqualTo("0");
        assertThat(Numbers.errorProbability(Double.NaN, Double.NaN)).isEqualTo(Numbers.MISSING);
    }

    @Test
    void bitsMoleculesCountsAndThresholds() {
        assertThat(Numbers.bits(0.70276)).isEqualTo("0.7028");
        assertThat(Numbers.bits(1)).isEqualTo("1.0000");
        assertThat(Numbers.molecules(121.8)).isEqualTo("122");
        assertThat(Numbers.molecules(438_300.4)).isEqualTo("438,300");
        assertThat(Numbers.molecules(1.23456e13)).isEqualTo("1.235e+13");
        assertThat(Numbers.count(2435)).isEqualTo("2,435");
        assertThat(Numbers.threshold(904)).isEqualTo("904");
    }

    @ParameterizedTest(name = "{0}")
    @ValueSource(doubles = {Double.NaN, Double.POSITIVE_INFINITY, Double.NEGATIVE_INFINITY})
    void nonFiniteValuesAreMissingNotNaN(double v) {
        assertThat(Numbers.probability(v)).isEqualTo(Numbers.MISSING);
        assertThat(Numbers.quantity(v)).isEqualTo(Numbers.MISSING);
        assertThat(Numbers.bits(v)).isEqualTo(Numbers.MISSING);
        assertThat(Numbers.molecules(v)).isEqualTo(Numbers.MISSING);
    }

    @ParameterizedTest(name = "seed {0}")
    @ValueSource(longs = {1, 2, 3})
    void textReadsBackAsTheValueRoundedToItsSignificantDigits(long seed) {
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(seed);
        for (int i = 0; i < 2000; i++) {
            double v = Math.pow(10, -12 + 24 * rng.nextDouble());
            if (v == Math.rint(v)) {
                continue;
            }
            // independent reference: BigDecimal rounding of the shortest decimal form (Double.toString) half up,
            // the rounding the java.util.Formatter documentation states for %g and %e
            double four = BigDecimal.valueOf(v).round(new MathContext(4, RoundingMode.HALF_UP)).doubleValue();
            assertThat(Double.parseDouble(Numbers.quantity(v))).isEqualTo(four);
            double three = BigDecimal.valueOf(v).round(new MathContext(3, RoundingMode.HALF_UP)).doubleValue();
            assertThat(Double.parseDouble(Numbers.probability(v))).isEqualTo(three);
        }
    }
}
