package dev.nanoplan.physics;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatIllegalArgumentException;
import static org.assertj.core.api.Assertions.within;

import java.util.function.DoubleUnaryOperator;
import java.util.stream.Stream;

import org.apache.commons.math3.analysis.integration.IterativeLegendreGaussIntegrator;
import org.apache.commons.numbers.gamma.Erfcx;
import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.simple.RandomSource;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;

class ReactiveSphereHittingTest {

    private static final IterativeLegendreGaussIntegrator INTEGRATOR =
        new IterativeLegendreGaussIntegrator(16, 1e-13, 1e-300, 2, 60);

    /** Seeded geometries and binding rates with κr/D from 1e-3 to 1e3. */
    static Stream<double[]> geometries() {
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(1949L);
        return Stream.generate(() -> {
            double r = RandomGeometry.logUniform(rng, 0.5, 20);
            double d = r * (1 + RandomGeometry.logUniform(rng, 0.05, 30));
            double diff = RandomGeometry.logUniform(rng, 1, 2000);
            double kappa = diff / r * RandomGeometry.logUniform(rng, 1e-3, 1e3);
            double scaleS = (d - r) * (d - r) / diff; // a²/D, the diffusion time over the gap
            double laplaceS = RandomGeometry.logUniform(rng, 0.01, 100) / scaleS;
            return new double[] {d, r, diff, kappa, laplaceS, scaleS};
        }).limit(25);
    }

    /** ∫₀^∞ g over geometric pieces [c·2^j, c·2^{j+1}], j = −60..80, with Commons Math's Gauss–Legendre rule. */
    static double integrateToInfinity(DoubleUnaryOperator g, double scaleS) {
        double sum = 0;
        for (int j = -60; j < 80; j++) {
            double lo = scaleS * Math.pow(2, j);
            sum += INTEGRATOR.integrate(10_000_000, u -> g.applyAsDouble(lo + u), 0, lo);
        }
        return sum;
    }

    /** Laplace transform of the Collins–Kimball first-passage density (Redner 2001, ch. 6, radiation boundary). */
    static double laplace(double d, double r, double diff, double kappa, double s) {
        return r / d * kappa * r * Math.exp(-(d - r) * Math.sqrt(s / diff)) / (kappa * r + diff + r * Math.sqrt(s * diff));
    }

    @ParameterizedTest
    @MethodSource("geometries")
    void cumulativeAndDensityHaveThePublishedLaplaceTransform(double[] g) {
        ReactiveSphereHitting model = ReactiveSphereHitting.of(g[0], g[1], g[2], g[3], null);
        double s = g[4];
        double expected = laplace(g[0], g[1], g[2], g[3], s);
        // Laplace transform of the density f̂(s) and, since F(0) = 0, ∫ F(t)·s·e^{−st} dt = f̂(s) too
        // (Collins & Kimball 1949 boundary; Redner 2001 ch. 6), both by Commons Math quadrature
        assertThat(integrateToInfinity(t -> model.density(t) * Math.exp(-s * t), g[5]))
            .isCloseTo(expected, within(1e-9 * expected));
        assertThat(integrateToInfinity(t -> model.cumulative(t) * s * Math.exp(-s * t), g[5]))
            .isCloseTo(expected, within(1e-9 * expected));
    }

    @ParameterizedTest
    @MethodSource("geometries")
    void eventualCaptureIsTheCollinsKimballFraction(double[] g) {
        ReactiveSphereHitting model = ReactiveSphereHitting.of(g[0], g[1], g[2], g[3], null);
        double kr = g[3] * g[1];
        // Collins & Kimball 1949: capture probability (r/d)·κr/(κr + D)
        assertThat(model.eventual()).isCloseTo(g[1] / g[0] * kr / (kr + g[2]), within(1e-15));
        assertThat(model.cumulative(1e12 * g[5])).isCloseTo(model.eventual(), within(1e-5 * model.eventual()));
    }

    @Test
    void infiniteBindingRateGivesThePerfectAbsorber() {
        OpenSphereHitting absorbing = OpenSphereHitting.of(30, 5, 80);
        ReactiveSphereHitting fast = ReactiveSphereHitting.of(30, 5, 80, 1e12, null);
        for (double t : new double[] {0.01, 0.1, 1, 10, 1e3}) {
            double f = absorbing.cumulative(t);
            // κ → ∞ turns the Collins–Kimball condition into c = 0 at the surface (Redner 2001 ch. 6: F = (r/d)·erfc);
            // the remaining relative difference is of order D/(κr) ~ 1e-11 plus √(D t)/(κ r²)
            assertThat(fast.cumulative(t)).isCloseTo(f, within(1e-6 * f));
            assertThat(fast.density(t)).isCloseTo(absorbing.density(t), within(1e-6 * absorbing.density(t)));
        }
        double[] taps = fast.taps(0.3, 5);
        double[] reference = absorbing.taps(0.3, 5);
        for (int k = 0; k < taps.length; k++) {
            assertThat(taps[k]).isCloseTo(reference[k], within(1e-6 * reference[k]));
        }
    }

    @Test
    void vanishingBindingRateGivesNoHits() {
        double previous = Double.POSITIVE_INFINITY;
        for (double kappa = 1; kappa >= 1e-12; kappa /= 100) {
            ReactiveSphereHitting slow = ReactiveSphereHitting.of(30, 5, 80, kappa, null);
            double f = slow.cumulative(10);
            // κ → 0: a reflecting sphere, capture at most (r/d)·κr/D (Collins & Kimball 1949), shrinking with κ
            assertThat(f).isLessThanOrEqualTo(5.0 / 30 * kappa * 5 / 80).isLessThan(previous);
            previous = f;
        }
        assertThat(previous).isLessThan(1e-14);
    }

    @Test
    void decayGivesTheLaplaceTransformAtTheDecayRateAsEventualCapture() {
        double halfLife = 2;
        double lambda = Math.log(2) / halfLife;
        ReactiveSphereHitting model = ReactiveSphereHitting.of(30, 5, 80, 40, halfLife);
        ReactiveSphereHitting stable = ReactiveSphereHitting.of(30, 5, 80, 40, null);
        // a molecule counts only if it binds before it decays: F_λ(∞) = f̂(λ) (Redner 2001 ch. 6)
        assertThat(model.eventual()).isCloseTo(laplace(30, 5, 80, 40, lambda), within(1e-15));
        for (double t : new double[] {0.1, 1, 5, 50}) {
            double expected = INTEGRATOR.integrate(10_000_000, s -> stable.density(s) * Math.exp(-lambda * s), 0, t);
            // F_λ(t) = ∫₀ᵗ f(s)e^{−λs} ds (docs/architecture.md §5.2), reference by Commons Math quadrature
            assertThat(model.cumulative(t)).isCloseTo(expected, within(1e-9 * expected));
        }
        double[] taps = model.taps(0.5, 4);
        for (int k = 0; k < taps.length; k++) {
            double expected = model.cumulative((k + 1) * 0.5) - model.cumulative(k * 0.5);
            // taps are the slot increments of F_λ (docs/architecture.md §5.3)
            assertThat(taps[k]).isCloseTo(expected, within(1e-9 * expected));
        }
    }

    @Test
    void decayedCumulativeRisesToItsLimitWithinQuadratureNoise() {
        ReactiveSphereHitting model = ReactiveSphereHitting.of(30, 5, 80, 40, 2.0);
        double previous = 0;
        for (double t = 1e-3; t < 1e4; t *= 1.3) {
            double value = model.cumulative(t);
            // a distribution function: non-decreasing (up to the stated 1e-13 quadrature tolerance) and ≤ F_λ(∞)
            assertThat(value).isGreaterThanOrEqualTo(previous * (1 - 1e-13)).isLessThanOrEqualTo(model.eventual());
            if (value >= Double.MIN_NORMAL) {
                assertThat(model.logCumulative(t)).isCloseTo(Math.log(value), within(1e-12));
            }
            previous = value;
        }
        assertThat(previous).isCloseTo(model.eventual(), within(1e-9 * model.eventual()));
    }

    @Test
    void cancellationFreeDifferenceAgreesWithTheDirectOneWhereThatIsAccurate() {
        for (double x : new double[] {0.5, 2, 5, 20}) {
            double y = 0.9 * x;
            double direct = Erfcx.value(x) - Erfcx.value(x + y);
            // where y is close to x the direct difference keeps ~15 digits (Commons Numbers Erfcx, a few ulp)
            assertThat(ReactiveSphereHitting.scaledDifference(x, y)).isCloseTo(direct, within(1e-13 * direct));
        }
    }

    @Test
    void rejectsBadBindingRates() {
        assertThatIllegalArgumentException().isThrownBy(() -> ReactiveSphereHitting.of(30, 5, 80, 0, null))
            .withMessageContaining("bindingRateUmPerS");
        assertThatIllegalArgumentException()
            .isThrownBy(() -> ReactiveSphereHitting.of(30, 5, 80, Double.POSITIVE_INFINITY, null))
            .withMessageContaining("bindingRateUmPerS");
    }
}
