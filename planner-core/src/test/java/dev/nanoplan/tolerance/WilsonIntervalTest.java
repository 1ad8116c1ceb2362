package dev.nanoplan.tolerance;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

class WilsonIntervalTest {

    // R. G. Newcombe, "Two-sided confidence intervals for the single proportion: comparison of seven
    // methods", Statistics in Medicine 17, 1998, Table II, method 3 (Wilson score, no continuity
    // correction), given to 4 decimals
    @ParameterizedTest
    @CsvSource({"81, 263, 0.2553, 0.3662", "15, 148, 0.0624, 0.1605", "0, 20, 0.0000, 0.1611",
        "1, 29, 0.0061, 0.1718"})
    void wilsonIntervalMatchesNewcombesWorkedExamples(int successes, int n, double lo, double hi) {
        double[] ci = WilsonInterval.of95(successes, n);
        assertThat(ci[0]).isCloseTo(lo, within(5e-5));
        assertThat(ci[1]).isCloseTo(hi, within(5e-5));
    }
}
