package dev.nanoplan.physics;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatIllegalArgumentException;
import static org.assertj.core.api.Assertions.within;

import java.util.function.DoubleUnaryOperator;
import java.util.stream.Stream;

import org.apache.commons.numbers.gamma.ErfDifference;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;

/** Per-slot hit probabilities p_k = F((k+1)T) − F(kT) (docs/architecture.md §5.3) of both hitting models. */
class TapsTest {

    private static final double RELATIVE_TOLERANCE = 1e-10;

    static Stream<RandomGeometry> randomPoints() {
        return RandomGeometry.draw(99L, 40);
    }

    @ParameterizedTest
    @MethodSource("randomPoints")
    void openTapsEqualSlotIntegralsOfDensity(RandomGeometry p) {
        HittingModel model = OpenSphereHitting.of(p.distanceUm(), p.radiusUm(), p.diffusionUm2PerS());
        assertTapsMatchQuadrature(model, p, 0, p.timeS(), 25);
    }

    @ParameterizedTest
    @MethodSource("randomPoints")
    void decayingTapsEqualSlotIntegralsOfDecayedDensity(RandomGeometry p) {
        DecayingSphereHitting model = DecayingSphereHitting.of(p.distanceUm(), p.radiusUm(),
            p.diffusionUm2PerS(), p.halfLifeS());
        assertTapsMatchQuadrature(model, p, model.decayRatePerS(), p.timeS(), 25);
    }

    @Test
    void tinyTapsKeepTheirRelativeAccuracy() {
        // a = 1 µm, D = 1 µm²/s: c = a²/(4D) = 0.25 s; x² = c/T = 575 puts F(T) near 1e-250
        RandomGeometry p = new RandomGeometry(2, 1, 1, 0.25 / 575, Double.POSITIVE_INFINITY);
        HittingModel model = OpenSphereHitting.of(2, 1, 1);
        double[] taps = model.taps(p.timeS(), 3);
        assertThat(taps[0]).isBetween(1e-260, 1e-240);
        assertTapsMatchQuadrature(model, p, 0, p.timeS(), 3);

        // T a thousand times shorter: at k = 1000 both F(kT) and F((k+1)T) are near 1e-250 and
        // close to each other (ratio ≈ 0.56), so the tap needs the density integral
        double shortSlot = 0.25 / (575.0 * 1000);
        double[] late = model.taps(shortSlot, 1000);
        assertThat(late[1000]).isBetween(1e-260, 1e-240);
        DoubleUnaryOperator density = ReferenceQuadrature.density(2, 1, 1, 0);
        for (int k : new int[] {0, 1, 500, 999, 1000}) {
            double expected = ReferenceQuadrature.integrate(density, 0.25, 0, k * shortSlot, (k + 1) * shortSlot);
            // Redner 2001 density integrated by Commons Math iterative Gauss–Legendre
            assertThat(late[k]).as("k = %d", k).isCloseTo(expected, within(RELATIVE_TOLERANCE * expected));
        }
    }

    @Test
    void lateTapsBelowEpsilonOfCumulative() {
        // a = 1e-9 µm: F ≈ r/d from the first nanosecond and each late tap is ~1e-17·F, far
        // below double epsilon relative to F, so the plain difference F((k+1)T) − F(kT) is noise
        double distance = 10;
        double radius = 10 - 1e-9;
        OpenSphereHitting model = OpenSphereHitting.of(distance, radius, 100);
        double[] taps = model.taps(1, 10_000);
        double gapOverSqrt4D = model.gapUm() / Math.sqrt(4 * 100);
        DoubleUnaryOperator density = ReferenceQuadrature.density(distance, radius, 100, 0);
        for (int k : new int[] {1, 2, 10, 100, 1000, 5000, 9999, 10_000}) {
            assertThat(taps[k] / model.cumulative(k)).as("k = %d", k).isLessThan(1e-10);
            double expected = ReferenceQuadrature.integrate(density, 0, 0, k, k + 1.0);
            // Redner 2001 density integrated by Commons Math iterative Gauss–Legendre
            assertThat(taps[k]).as("k = %d", k).isCloseTo(expected, within(RELATIVE_TOLERANCE * expected));
            // Redner 2001: p_k = (r/d)·[erf(x_k) − erf(x_{k+1})], by Commons Numbers ErfDifference
            double viaErf = radius / distance
                * ErfDifference.value(gapOverSqrt4D / Math.sqrt(k + 1.0), gapOverSqrt4D / Math.sqrt(k));
            assertThat(taps[k]).as("k = %d", k).isCloseTo(viaErf, within(RELATIVE_TOLERANCE * viaErf));
        }
        double sum = 0;
        for (double tap : taps) {
            sum += tap;
        }
        // docs/architecture.md §5.3: the taps telescope to F((L+1)T)
        assertThat(sum).isCloseTo(model.cumulative(10_001), within(1e-13));
        assertThat(taps[10_000]).isLessThan(taps[9_999]);
    }

    @Test
    void steeplyDecayingTailGivesTinyOrZeroTapsNeverNegative() {
        // half-life 3 ms against a 1 s slot (λT ≈ 230): slot 1 gets ~1e-100, later slots nothing
        DecayingSphereHitting model = DecayingSphereHitting.of(10, 5, 100, 3e-3);
        double[] taps = model.taps(1, 20);
        for (double tap : taps) {
            assertThat(tap).isGreaterThanOrEqualTo(0).isFinite();
        }
        // docs/architecture.md §5.3: p_0 = F(T)
        assertThat(taps[0]).isEqualTo(model.cumulative(1));
        DoubleUnaryOperator density = ReferenceQuadrature.density(10, 5, 100, model.decayRatePerS());
        double expected = ReferenceQuadrature.integrate(density, 25.0 / 400, model.decayRatePerS(), 1, 2);
        // docs/architecture.md §5.2 density f·e^{−λt} integrated by Commons Math iterative Gauss–Legendre
        assertThat(expected).isBetween(1e-120, 1e-80);
        assertThat(taps[1]).isCloseTo(expected, within(RELATIVE_TOLERANCE * expected));
        assertThat(taps[20]).isZero();
    }

    @Test
    void rejectsBadArguments() {
        HittingModel model = OpenSphereHitting.of(2, 1, 1);
        assertThatIllegalArgumentException().isThrownBy(() -> model.taps(0, 3)).withMessageContaining("symbolTimeS");
        assertThatIllegalArgumentException().isThrownBy(() -> model.taps(Double.NaN, 3))
            .withMessageContaining("symbolTimeS");
        assertThatIllegalArgumentException().isThrownBy(() -> model.taps(Double.POSITIVE_INFINITY, 3))
            .withMessageContaining("symbolTimeS");
        assertThatIllegalArgumentException().isThrownBy(() -> model.taps(1, -1)).withMessageContaining("memorySymbols");
        assertThatIllegalArgumentException().isThrownBy(() -> model.taps(1e305, 100_000))
            .withMessageContaining("memorySymbols");
    }

    private static void assertTapsMatchQuadrature(HittingModel model, RandomGeometry p, double decayRatePerS,
                                                  double symbolTimeS, int memory) {
        double[] taps = model.taps(symbolTimeS, memory);
        DoubleUnaryOperator density =
            ReferenceQuadrature.density(p.distanceUm(), p.radiusUm(), p.diffusionUm2PerS(), decayRatePerS);
        for (int k = 0; k <= memory; k++) {
            double expected = ReferenceQuadrature.integrate(density, p.scaleS(), decayRatePerS,
                k * symbolTimeS, (k + 1.0) * symbolTimeS);
            // docs/architecture.md §5.3 p_k = ∫ f over slot k, f from Redner 2001 (× e^{−λt}, docs/architecture.md §5.2),
            // reference = Commons Math iterative Gauss–Legendre
            if (expected >= 1e-250) {
                assertThat(taps[k]).as("k = %d", k).isCloseTo(expected, within(RELATIVE_TOLERANCE * expected));
            } else {
                assertThat(taps[k]).as("k = %d", k).isBetween(0.0, 1e-240);
            }
        }
    }
}
