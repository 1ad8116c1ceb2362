package dev.nanoplan.physics;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatIllegalArgumentException;
import static org.assertj.core.api.Assertions.within;

import java.util.stream.Stream;

import org.apache.commons.math3.analysis.integration.IterativeLegendreGaussIntegrator;
import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.simple.RandomSource;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvFileSource;
import org.junit.jupiter.params.provider.MethodSource;

class PassiveSphereObservationTest {

    private static final IterativeLegendreGaussIntegrator INTEGRATOR =
        new IterativeLegendreGaussIntegrator(16, 1e-12, 1e-300, 2, 60);

    /** Seeded geometries with the sampling time around the peak (x = (d − r)/√(4Dt) in [0.05, 4]). */
    static Stream<double[]> moderateGeometries() {
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(20261204L);
        return Stream.generate(() -> {
            double r = RandomGeometry.logUniform(rng, 0.5, 20);
            double d = r * (1 + RandomGeometry.logUniform(rng, 0.05, 30));
            double diff = RandomGeometry.logUniform(rng, 1, 2000);
            double x = RandomGeometry.logUniform(rng, 0.05, 4);
            double t = (d - r) * (d - r) / (4 * diff * x * x);
            return new double[] {d, r, diff, t};
        }).limit(25);
    }

    /**
     * The free-space Green's function G(ℓ) = (4πDt)^{-3/2}·exp(−ℓ²/(4Dt)) (J. Crank, The Mathematics of
     * Diffusion, 2nd ed., 1975, eq. 3.5a) integrated over the ball in spherical coordinates centred on the
     * release point: the sphere of radius ℓ ∈ [d − r, d + r] around the source meets the ball in a cap of
     * area 2πℓ²·(1 − cos ψ), cos ψ = (ℓ² + d² − r²)/(2ℓd) (law of cosines), so
     * P = ∫ G(ℓ)·2πℓ²·(1 − cos ψ) dℓ, by Commons Math's iterative Gauss–Legendre rule on pieces no wider
     * than a quarter of the Gaussian's scale near ℓ = d − r.
     */
    static double greensFunctionOverBall(double d, double r, double diff, double t) {
        double fourDt = 4 * diff * t;
        double norm = Math.pow(Math.PI * fourDt, -1.5);
        double a = d - r;
        double b = d + r;
        double piece = Math.min(Math.sqrt(fourDt), fourDt / (2 * a)) / 4;
        double sum = 0;
        for (double lo = a; lo < b; lo += piece) {
            double hi = Math.min(b, lo + piece);
            double start = lo;
            sum += INTEGRATOR.integrate(10_000_000, u -> {
                double l = start + u;
                double cosPsi = Math.min(1, (l * l + d * d - r * r) / (2 * l * d));
                return norm * Math.exp(-l * l / fourDt) * 2 * Math.PI * l * l * (1 - cosPsi);
            }, 0, hi - lo);
            if (sum > 0 && Math.exp(-(hi * hi - a * a) / fourDt) < 1e-20) {
                break; // the rest is below 1e-20 of the first piece
            }
        }
        return sum;
    }

    @ParameterizedTest
    @MethodSource("moderateGeometries")
    void insideProbabilityEqualsTheGreensFunctionIntegratedOverTheBall(double[] g) {
        PassiveSphereObservation model = PassiveSphereObservation.of(g[0], g[1], g[2], null, null);
        double expected = greensFunctionOverBall(g[0], g[1], g[2], g[3]);
        // Crank 1975 eq. 3.5a integrated over the ball by Commons Math quadrature (independent of the closed form)
        assertThat(model.insideProbability(g[3])).isCloseTo(expected, within(1e-9 * expected));
    }

    @ParameterizedTest
    @CsvFileSource(resources = "/dev/nanoplan/physics/passive-sphere-mpmath.csv", numLinesToSkip = 2)
    void matchesFiftyDigitReferenceFromEarlyToLateTimes(double d, double r, double diff, double t, double expected) {
        PassiveSphereObservation model = PassiveSphereObservation.of(d, r, diff, null, null);
        // mpmath 1.3.0 at 50 digits (passive_sphere_reference.py beside the data), including the early and late
        // times where the closed form's two halves cancel
        assertThat(model.insideProbability(t)).isCloseTo(expected, within(1e-11 * expected));
    }

    @Test
    void lateTimesGiveTheBallVolumeTimesThePeakDensity() {
        PassiveSphereObservation model = PassiveSphereObservation.of(30, 5, 80, null, null);
        double t = 1e6;
        double volume = 4.0 / 3 * Math.PI * 125;
        // for 4Dt ≫ d² the Gaussian is flat over the ball: P → V·(4πDt)^{-3/2}, relative error ~ d²/(4Dt)
        double expected = volume * Math.pow(4 * Math.PI * 80 * t, -1.5);
        assertThat(model.insideProbability(t)).isCloseTo(expected, within(1e-5 * expected));
    }

    @Test
    void decayMultipliesBySurvival() {
        PassiveSphereObservation stable = PassiveSphereObservation.of(20, 5, 80, null, null);
        PassiveSphereObservation decaying = PassiveSphereObservation.of(20, 5, 80, 0.5, null);
        for (double t : new double[] {0.05, 0.3, 2, 20}) {
            // first-order decay: the molecule still exists at t with probability e^{−λt}, λ = ln 2 / half-life
            assertThat(decaying.insideProbability(t))
                .isCloseTo(stable.insideProbability(t) * Math.exp(-Math.log(2) / 0.5 * t),
                    within(1e-14 * stable.insideProbability(t)));
        }
    }

    @Test
    void tapsSampleOncePerSlotAtTheOffsetDefaultingToTheEndOfTheSlot() {
        PassiveSphereObservation atEnd = PassiveSphereObservation.of(20, 5, 80, null, null);
        PassiveSphereObservation early = PassiveSphereObservation.of(20, 5, 80, null, 0.1);
        double[] end = atEnd.taps(0.3, 3);
        double[] mid = early.taps(0.3, 3);
        for (int k = 0; k <= 3; k++) {
            // definition of the passive observer's tap: P at k·T + offset (offset = T by default)
            assertThat(end[k]).isEqualTo(atEnd.insideProbability((k + 1) * 0.3));
            assertThat(mid[k]).isEqualTo(atEnd.insideProbability(k * 0.3 + 0.1));
        }
    }

    @Test
    void rejectsAnOffsetBeyondTheSlotAndBadParameters() {
        assertThatIllegalArgumentException().isThrownBy(() -> PassiveSphereObservation.of(20, 5, 80, null, 0.5)
            .taps(0.3, 2)).withMessageContaining("samplingOffsetS");
        assertThatIllegalArgumentException().isThrownBy(() -> PassiveSphereObservation.of(20, 5, 80, null, 0.0))
            .withMessageContaining("samplingOffsetS");
        assertThatIllegalArgumentException().isThrownBy(() -> PassiveSphereObservation.of(4, 5, 80, null, null))
            .withMessageContaining("distanceUm");
    }

    @Test
    void edgeTimes() {
        PassiveSphereObservation model = PassiveSphereObservation.of(20, 5, 80, null, null);
        assertThat(model.insideProbability(0)).isZero();
        assertThat(model.insideProbability(-1)).isZero();
        assertThat(model.insideProbability(Double.POSITIVE_INFINITY)).isZero();
        assertThat(model.insideProbability(Double.MIN_VALUE)).isZero();
        assertThat(model.insideProbability(Double.NaN)).isNaN();
    }
}
