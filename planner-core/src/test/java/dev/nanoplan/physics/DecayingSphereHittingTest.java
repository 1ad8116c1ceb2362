package dev.nanoplan.physics;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatIllegalArgumentException;
import static org.assertj.core.api.Assertions.within;

import java.util.function.DoubleUnaryOperator;
import java.util.stream.Stream;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;

class DecayingSphereHittingTest {

    static Stream<RandomGeometry> randomPoints() {
        return RandomGeometry.draw(777L, 120);
    }

    @ParameterizedTest
    @MethodSource("randomPoints")
    void cumulativeEqualsIntegralOfDecayedDensity(RandomGeometry p) {
        DecayingSphereHitting model = DecayingSphereHitting.of(p.distanceUm(), p.radiusUm(),
            p.diffusionUm2PerS(), p.halfLifeS());
        double rate = model.decayRatePerS();
        DoubleUnaryOperator density =
            ReferenceQuadrature.density(p.distanceUm(), p.radiusUm(), p.diffusionUm2PerS(), rate);
        double expected = ReferenceQuadrature.integrate(density, p.scaleS(), rate, 0, p.timeS());
        // docs/architecture.md §5.2: F_λ(t) = ∫₀ᵗ f(s)e^{−λs} ds, f from Redner 2001; reference = Commons Math
        // iterative Gauss–Legendre
        assertThat(model.cumulative(p.timeS())).isCloseTo(expected, within(1e-9 * expected));
        assertThat(model.logCumulative(p.timeS())).isCloseTo(Math.log(expected), within(1e-9));
        // docs/architecture.md §5.2: f_λ(t) = f(t)e^{−λt}
        double f = density.applyAsDouble(p.timeS());
        assertThat(model.density(p.timeS())).isCloseTo(f, within(1e-13 * f));
    }

    @ParameterizedTest
    @MethodSource("randomPoints")
    void decayNeverAddsHitsAndRemovesAtMostTheDecayedFraction(RandomGeometry p) {
        DecayingSphereHitting model = DecayingSphereHitting.of(p.distanceUm(), p.radiusUm(),
            p.diffusionUm2PerS(), p.halfLifeS());
        double open = model.withoutDecay().cumulative(p.timeS());
        double decayed = model.cumulative(p.timeS());
        // from F_λ(t) = ∫₀ᵗ f(s)e^{−λs} ds with e^{−λt} ≤ e^{−λs} ≤ 1 on [0, t] (docs/architecture.md §5.2)
        assertThat(decayed).isLessThanOrEqualTo(open * (1 + 1e-13));
        assertThat(decayed).isGreaterThanOrEqualTo(open * Math.exp(-model.decayRatePerS() * p.timeS()) * (1 - 1e-13));
        assertThat(model.eventual()).isLessThanOrEqualTo(model.withoutDecay().eventual());
    }

    @Test
    void closedFormWhereBothArgumentsAreOneHalf() {
        // a = 1 µm, D = 1 µm²/s, t = 1 s, λ = 1/4 per s: x = a/√(4Dt) = 1/2, y = √(λt) = 1/2,
        // b = a√(λ/D) = 1/2; r/d = 1/2
        DecayingSphereHitting model = DecayingSphereHitting.of(2, 1, 1, 4 * Math.log(2));
        // computed by hand from docs/architecture.md §5.2: (r/d)·½·[e^{−1/2}·erfc(0) + e^{1/2}·erfc(1)] with
        // erfc(0) = 1 and erf(1) = 0.8427007929 (Abramowitz & Stegun 1964, Table 7.1)
        double expected = 0.5 * 0.5 * (Math.exp(-0.5) + Math.exp(0.5) * (1 - 0.8427007929));
        assertThat(model.cumulative(1)).isCloseTo(expected, within(1e-10));
        // docs/architecture.md §5.2: F_λ(∞) = (r/d)·e^{−b}
        assertThat(model.eventual()).isCloseTo(0.5 * Math.exp(-0.5), within(1e-15));
    }

    @Test
    void longHalfLifeTendsSmoothlyToOpenModel() {
        OpenSphereHitting open = OpenSphereHitting.of(30, 5, 80);
        double[] times = {0.05, 1, 100, 1e5};
        double[] previous = {Double.POSITIVE_INFINITY, Double.POSITIVE_INFINITY, Double.POSITIVE_INFINITY,
            Double.POSITIVE_INFINITY};
        for (double halfLife = 1e-2; halfLife < 1e300; halfLife *= 10) {
            DecayingSphereHitting model = DecayingSphereHitting.of(30, 5, 80, halfLife);
            for (int i = 0; i < times.length; i++) {
                double reference = open.cumulative(times[i]);
                double relative = (reference - model.cumulative(times[i])) / reference;
                double x = 25 / Math.sqrt(4 * 80 * times[i]);
                double slack = 2e-16 * (4 + x * x); // rounding, as stated in the Javadoc
                // bound from e^{−λt} ≤ e^{−λs} ≤ 1 (docs/architecture.md §5.2): 0 ≤ 1 − F_λ/F ≤ 1 − e^{−λt}
                assertThat(relative).isBetween(-slack, -Math.expm1(-model.decayRatePerS() * times[i]) + slack);
                // shrinking monotonically with the half-life: no jump on the way to the open model
                assertThat(relative).isLessThanOrEqualTo(previous[i] + slack);
                previous[i] = relative;
            }
        }
        for (int i = 0; i < times.length; i++) {
            assertThat(Math.abs(previous[i])).isLessThan(1e-14);
        }
    }

    @Test
    void missingOrInfiniteHalfLifeIsTheOpenModel() {
        OpenSphereHitting open = OpenSphereHitting.of(12, 3, 40);
        for (Double halfLife : new Double[] {null, Double.POSITIVE_INFINITY}) {
            DecayingSphereHitting model = DecayingSphereHitting.of(12, 3, 40, halfLife);
            assertThat(model.decayRatePerS()).isZero();
            for (double t : new double[] {1e-3, 0.1, 1, 1e3}) {
                assertThat(model.cumulative(t)).isEqualTo(open.cumulative(t));
                assertThat(model.density(t)).isEqualTo(open.density(t));
                assertThat(model.logCumulative(t)).isEqualTo(open.logCumulative(t));
            }
            assertThat(model.eventual()).isEqualTo(open.eventual());
            assertThat(model.taps(0.5, 10)).containsExactly(open.taps(0.5, 10));
        }
    }

    @Test
    void hugeExponentsGiveNoNan() {
        // b = a√(λ/D) ≈ 2630: e^{b} overflows, e^{−b} underflows; F stays 0 and ln F finite
        DecayingSphereHitting model = DecayingSphereHitting.of(1000, 1, 1, 1e-1);
        for (double t = 1e-6; t < 1e12; t *= 3) {
            assertThat(model.cumulative(t)).isNotNaN().isGreaterThanOrEqualTo(0);
            assertThat(model.logCumulative(t)).isFinite();
            assertThat(model.density(t)).isNotNaN().isGreaterThanOrEqualTo(0);
        }
        // docs/architecture.md §5.2: ln F_λ(∞) = ln(r/d) − a√(λ/D)
        assertThat(model.logCumulative(Double.POSITIVE_INFINITY))
            .isCloseTo(Math.log(1e-3) - 999 * Math.sqrt(Math.log(2) / 0.1), within(1e-10));
    }

    @Test
    void rejectsBadHalfLife() {
        assertThatIllegalArgumentException().isThrownBy(() -> DecayingSphereHitting.of(2, 1, 1, 0.0))
            .withMessageContaining("halfLifeS");
        assertThatIllegalArgumentException().isThrownBy(() -> DecayingSphereHitting.of(2, 1, 1, -3.0))
            .withMessageContaining("halfLifeS");
        assertThatIllegalArgumentException().isThrownBy(() -> DecayingSphereHitting.of(2, 1, 1, Double.NaN))
            .withMessageContaining("halfLifeS");
        assertThatIllegalArgumentException().isThrownBy(() -> DecayingSphereHitting.of(1, 1, 1, 1.0))
            .withMessageContaining("distanceUm");
    }
}
