package dev.nanoplan.physics;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.List;
import java.util.stream.Stream;

import org.junit.jupiter.api.TestInstance;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * Invariants every {@link HittingModel} must keep, whatever its physics: F is a sub-probability
 * distribution function (0 for t ≤ 0, non-decreasing, at most F(∞)), ln F agrees with F and
 * stays finite, taps are non-negative and add up to F((L+1)T) (docs/architecture.md §5.3). Subclasses list
 * models, including extreme geometries.
 */
@TestInstance(TestInstance.Lifecycle.PER_CLASS)
abstract class HittingModelContractTest {

    /** Models to check, including extremes (tiny gap, huge diffusion, ...). */
    abstract List<HittingModel> models();

    Stream<HittingModel> modelStream() {
        return models().stream();
    }

    @ParameterizedTest
    @MethodSource("modelStream")
    void zeroAtAndBeforeRelease(HittingModel model) {
        for (double t : new double[] {0, -0.0, -1, Double.NEGATIVE_INFINITY}) {
            assertThat(model.cumulative(t)).isZero();
            assertThat(model.density(t)).isZero();
            assertThat(model.logCumulative(t)).isEqualTo(Double.NEGATIVE_INFINITY);
        }
    }

    @ParameterizedTest
    @MethodSource("modelStream")
    void nonDecreasingAndBoundedByEventual(HittingModel model) {
        double eventual = model.eventual();
        assertThat(eventual).isGreaterThanOrEqualTo(0).isLessThanOrEqualTo(1);
        double previous = 0;
        for (double t = 1e-300; t < 1e300; t *= 1.05) {
            double value = model.cumulative(t);
            assertThat(value).as("F(%s)", t).isGreaterThanOrEqualTo(previous).isLessThanOrEqualTo(eventual);
            assertThat(model.density(t)).as("f(%s)", t).isGreaterThanOrEqualTo(0).isFinite();
            previous = value;
        }
        assertThat(model.cumulative(Double.POSITIVE_INFINITY)).isEqualTo(eventual);
        assertThat(model.cumulative(1e300)).isCloseTo(eventual, within(1e-12 * eventual));
        assertThat(model.density(Double.POSITIVE_INFINITY)).isZero();
    }

    @ParameterizedTest
    @MethodSource("modelStream")
    void logCumulativeIsFiniteAndMatchesCumulative(HittingModel model) {
        double previous = Double.NEGATIVE_INFINITY;
        for (double t = Double.MIN_VALUE; t < 1e300; t *= 1.5) {
            double log = model.logCumulative(t);
            assertThat(log).as("ln F(%s)", t).isFinite().isGreaterThanOrEqualTo(previous);
            double value = model.cumulative(t);
            if (value > 1e-300) {
                assertThat(log).as("ln F(%s)", t).isCloseTo(Math.log(value), within(1e-12 * Math.max(1, -log)));
            }
            previous = log;
        }
        assertThat(model.logCumulative(Double.POSITIVE_INFINITY)).isFinite();
        if (model.eventual() > 1e-300) {
            assertThat(model.logCumulative(Double.POSITIVE_INFINITY))
                .isCloseTo(Math.log(model.eventual()), within(1e-15 * Math.max(1, -Math.log(model.eventual()))));
        }
    }

    @ParameterizedTest
    @MethodSource("modelStream")
    void tapsAreNonNegativeAndSumToCumulative(HittingModel model) {
        for (double symbolTimeS : new double[] {1e-9, 1e-3, 0.1, 1, 100}) {
            int memory = 50;
            double[] taps = model.taps(symbolTimeS, memory);
            assertThat(taps).hasSize(memory + 1);
            double sum = 0;
            for (double tap : taps) {
                assertThat(tap).isGreaterThanOrEqualTo(0).isFinite();
                sum += tap;
            }
            double expected = model.cumulative((memory + 1) * symbolTimeS);
            // docs/architecture.md §5.3: the taps telescope to F((L+1)T)
            assertThat(sum).as("T = %s", symbolTimeS).isCloseTo(expected, within(1e-12 * expected + 1e-300));
        }
    }

    @ParameterizedTest
    @MethodSource("modelStream")
    void nanTimeGivesNan(HittingModel model) {
        assertThat(model.cumulative(Double.NaN)).isNaN();
        assertThat(model.density(Double.NaN)).isNaN();
        assertThat(model.logCumulative(Double.NaN)).isNaN();
    }
}
