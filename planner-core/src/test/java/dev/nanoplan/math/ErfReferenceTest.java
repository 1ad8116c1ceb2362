package dev.nanoplan.math;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.apache.commons.numbers.gamma.Erf;
import org.apache.commons.numbers.gamma.Erfc;
import org.apache.commons.numbers.gamma.Erfcx;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvFileSource;
import org.junit.jupiter.params.provider.ValueSource;

/** The error functions of Commons Numbers 1.2 that the hitting models rest on. */
public class ErfReferenceTest {

    /** Half a unit in the 10th decimal of the table, plus double rounding. */
    private static final double TABLE_TOLERANCE = 5.1e-11;

    @ParameterizedTest(name = "erf({0}) = {1}")
    @CsvFileSource(resources = "erf-abramowitz-stegun-table-7-1.csv", numLinesToSkip = 1)
    void erfMatchesHandbookTable(double x, double erfX) {
        // Abramowitz & Stegun 1964, Table 7.1
        assertThat(Erf.value(x)).isCloseTo(erfX, within(TABLE_TOLERANCE));
        // Abramowitz & Stegun 1964, Table 7.1, with erfc x = 1 − erf x (eq. 7.1.2)
        assertThat(Erfc.value(x)).isCloseTo(1 - erfX, within(TABLE_TOLERANCE));
    }

    /**
     * x with exactly representable x², so the reference e^{−x²} carries only the rounding of
     * {@link Math#exp}.
     */
    @ParameterizedTest(name = "x = {0}")
    @ValueSource(doubles = {6, 7.5, 10, 12.5, 15, 20, 25, 26})
    void erfcMatchesAsymptoticSeriesForLargeArgument(double x) {
        double expected = Math.exp(-x * x) / (x * Math.sqrt(Math.PI)) * asymptoticBracket(x);
        // Abramowitz & Stegun 1964, eq. 7.1.23 (asymptotic expansion of erfc, truncated at its smallest term)
        assertThat(Erfc.value(x)).isCloseTo(expected, within(1e-13 * expected));
    }

    @ParameterizedTest(name = "x = {0}")
    @ValueSource(doubles = {6, 10, 26, 30, 100, 1e4, 1e8})
    void scaledErfcMatchesAsymptoticSeries(double x) {
        double expected = asymptoticBracket(x) / (x * Math.sqrt(Math.PI));
        // Abramowitz & Stegun 1964, eq. 7.1.23, multiplied by e^{x²}: erfcx x = e^{x²} erfc x
        assertThat(Erfcx.value(x)).isCloseTo(expected, within(1e-14 * expected));
    }

    /**
     * 1 + Σ_{m≥1} (−1)^m (1·3···(2m−1)) / (2x²)^m, stopped before the terms start to grow
     * (A&S 1964, eq. 7.1.23); its truncation error is below the first omitted term.
     */
    public static double asymptoticBracket(double x) {
        double sum = 1;
        double term = 1;
        for (int m = 1; m < 200; m++) {
            double next = -term * (2 * m - 1) / (2 * x * x);
            if (Math.abs(next) >= Math.abs(term)) {
                break;
            }
            term = next;
            sum += term;
        }
        return sum;
    }
}
