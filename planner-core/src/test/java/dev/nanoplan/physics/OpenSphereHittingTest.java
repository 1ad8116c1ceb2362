package dev.nanoplan.physics;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatIllegalArgumentException;
import static org.assertj.core.api.Assertions.within;

import dev.nanoplan.math.ErfReferenceTest;
import java.util.function.DoubleUnaryOperator;
import java.util.stream.Stream;

import org.apache.commons.numbers.gamma.Erfc;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;

class OpenSphereHittingTest {

    static Stream<RandomGeometry> randomPoints() {
        return RandomGeometry.draw(20240501L, 120);
    }

    @ParameterizedTest
    @MethodSource("randomPoints")
    void cumulativeEqualsIntegralOfDensity(RandomGeometry p) {
        OpenSphereHitting model = OpenSphereHitting.of(p.distanceUm(), p.radiusUm(), p.diffusionUm2PerS());
        DoubleUnaryOperator density =
            ReferenceQuadrature.density(p.distanceUm(), p.radiusUm(), p.diffusionUm2PerS(), 0);
        double expected = ReferenceQuadrature.integrate(density, p.scaleS(), 0, 0, p.timeS());
        // Redner 2001 (docs/architecture.md §5.1): F(t) = ∫₀ᵗ f; reference = Commons Math iterative Gauss–Legendre
        assertThat(model.cumulative(p.timeS())).isCloseTo(expected, within(1e-9 * expected));
        // the density formula of Redner 2001 written out in the test
        assertThat(model.density(p.timeS()))
            .isCloseTo(density.applyAsDouble(p.timeS()), within(1e-13 * density.applyAsDouble(p.timeS())));
        // the log form, where F is representable
        assertThat(model.logCumulative(p.timeS())).isCloseTo(Math.log(expected), within(1e-9));
    }

    @Test
    void closedFormAtArgumentOne() {
        // a = 1 µm, D = 0.25 µm²/s, t = 1 s: x = a/√(4Dt) = 1; r/d = 1/2
        OpenSphereHitting model = OpenSphereHitting.of(2, 1, 0.25);
        // computed by hand from Redner 2001 F(t) = (r/d)·erfc(x) with erf(1) = 0.8427007929
        // (Abramowitz & Stegun 1964, Table 7.1)
        assertThat(model.cumulative(1)).isCloseTo(0.5 * (1 - 0.8427007929), within(1e-10));
        // Redner 2001: f(t) = (r/d)·a/√(4πDt³)·exp(−a²/(4Dt)) = ½·e^{-1}/√π here
        assertThat(model.density(1)).isCloseTo(0.5 * Math.exp(-1) / Math.sqrt(Math.PI), within(1e-16));
    }

    @Test
    void closedFormAtArgumentOneHalf() {
        // a = 1 µm, D = 1 µm²/s, t = 1 s: x = 1/2; r/d = 4/5
        OpenSphereHitting model = OpenSphereHitting.of(5, 4, 1);
        // computed by hand from Redner 2001 with erf(0.5) = 0.5204998778 (A&S 1964, Table 7.1)
        assertThat(model.cumulative(1)).isCloseTo(0.8 * (1 - 0.5204998778), within(1e-10));
    }

    @Test
    void eventualIsRadiusOverDistance() {
        OpenSphereHitting model = OpenSphereHitting.of(7, 3, 50);
        // Redner 2001 / Berg 1993: eventual capture probability r/d
        assertThat(model.eventual()).isEqualTo(3.0 / 7.0);
        double x = 4 / Math.sqrt(4 * 50 * 1e20);
        // the approach is slow, ∝ t^{-1/2}: r/d − F(t) = (r/d)·erf(x) ≈ (r/d)·2x/√π
        // (Abramowitz & Stegun 1964, eq. 7.1.5, first term; next term is x² smaller)
        assertThat(3.0 / 7.0 - model.cumulative(1e20))
            .isCloseTo(3.0 / 7.0 * 2 * x / Math.sqrt(Math.PI), within(1e-6 * x));
    }

    @Test
    void logCumulativeFollowsAsymptoticsWhereCumulativeUnderflows() {
        OpenSphereHitting model = OpenSphereHitting.of(11, 1, 1);
        double time = 100.0 / (4 * 900); // x = 10/√(4·t) = 30
        assertThat(model.cumulative(time)).isZero();
        double expected = Math.log(1.0 / 11) - 900 - Math.log(30 * Math.sqrt(Math.PI))
            + Math.log(ErfReferenceTest.asymptoticBracket(30));
        // Redner 2001 with ln erfc from Abramowitz & Stegun 1964, eq. 7.1.23
        assertThat(model.logCumulative(time)).isCloseTo(expected, within(1e-12));
        assertThat(model.logCumulative(Double.MIN_VALUE)).isEqualTo(-Double.MAX_VALUE);
    }

    @Test
    void tinyGapRisesToEventualWithoutNan() {
        OpenSphereHitting model = OpenSphereHitting.of(10, 10 - 1e-9, 100);
        double gap = model.gapUm();
        double time = 1e-6;
        // Redner 2001 with the library erfc of the known argument
        double expected = (10 - 1e-9) / 10 * Erfc.value(gap / Math.sqrt(4 * 100 * time));
        assertThat(model.cumulative(time)).isCloseTo(expected, within(1e-15));
        assertThat(model.cumulative(time)).isCloseTo(model.eventual(), within(1e-6));
        assertThat(model.density(time)).isFinite().isPositive();
    }

    @Test
    void rejectsBadParametersNamingThem() {
        assertThatIllegalArgumentException().isThrownBy(() -> OpenSphereHitting.of(1, 2, 1))
            .withMessageContaining("distanceUm");
        assertThatIllegalArgumentException().isThrownBy(() -> OpenSphereHitting.of(2, 2, 1))
            .withMessageContaining("distanceUm");
        assertThatIllegalArgumentException().isThrownBy(() -> OpenSphereHitting.of(2, 0, 1))
            .withMessageContaining("radiusUm");
        assertThatIllegalArgumentException().isThrownBy(() -> OpenSphereHitting.of(2, Double.NaN, 1))
            .withMessageContaining("radiusUm");
        assertThatIllegalArgumentException().isThrownBy(() -> OpenSphereHitting.of(Double.POSITIVE_INFINITY, 1, 1))
            .withMessageContaining("distanceUm");
        assertThatIllegalArgumentException().isThrownBy(() -> OpenSphereHitting.of(2, 1, 0))
            .withMessageContaining("diffusionUm2PerS");
        assertThatIllegalArgumentException().isThrownBy(() -> OpenSphereHitting.of(2, 1, Double.POSITIVE_INFINITY))
            .withMessageContaining("diffusionUm2PerS");
    }
}
