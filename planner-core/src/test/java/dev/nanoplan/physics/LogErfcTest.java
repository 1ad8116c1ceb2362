package dev.nanoplan.physics;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.stream.DoubleStream;

import org.apache.commons.numbers.gamma.Erfc;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;
import org.junit.jupiter.params.provider.ValueSource;

class LogErfcTest {

    static DoubleStream representableArguments() {
        // −3 .. 26.5 in steps of 0.25: erfc(x) is a normal double throughout
        return DoubleStream.iterate(-3, x -> x <= 26.5, x -> x + 0.25);
    }

    @ParameterizedTest(name = "x = {0}")
    @MethodSource("representableArguments")
    void agreesWithLogOfLibraryErfcWhereRepresentable(double x) {
        double tolerance = 4e-16 * Math.max(1, x * x);
        // Commons Numbers 1.2 Erfc, where erfc(x) does not underflow
        assertThat(LogErfc.value(x)).isCloseTo(Math.log(Erfc.value(x)), within(tolerance));
    }

    @ParameterizedTest(name = "x = {0}")
    @ValueSource(doubles = {27, 30, 100, 1e3, 1e6, 1e10})
    void followsAsymptoticSeriesBeyondUnderflow(double x) {
        double expected = -x * x - Math.log(x * Math.sqrt(Math.PI))
            + Math.log(ErfReferenceTest.asymptoticBracket(x));
        // Abramowitz & Stegun 1964, eq. 7.1.23, in log form
        assertThat(LogErfc.value(x)).isCloseTo(expected, within(2e-16 * Math.max(1, x * x)));
    }

    @Test
    void specialValues() {
        assertThat(LogErfc.value(Double.POSITIVE_INFINITY)).isEqualTo(Double.NEGATIVE_INFINITY);
        assertThat(LogErfc.value(Double.NaN)).isNaN();
        // erfc(−∞) = 2 (A&S 1964, eq. 7.1.2 with erf(−∞) = −1)
        assertThat(LogErfc.value(Double.NEGATIVE_INFINITY)).isCloseTo(Math.log(2), within(1e-16));
        // erfc(0) = 1 (A&S 1964, eq. 7.1.2)
        assertThat(LogErfc.value(0)).isEqualTo(0.0);
    }
}
