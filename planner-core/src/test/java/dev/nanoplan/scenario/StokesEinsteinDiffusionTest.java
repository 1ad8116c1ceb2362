package dev.nanoplan.scenario;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.data.Percentage.withPercentage;

import dev.nanoplan.physics.StokesEinstein;
import org.junit.jupiter.api.Test;

class StokesEinsteinDiffusionTest {

    @Test
    void nanometreSphereInWaterAt25C() {
        // From memory: a sphere of 1 nm hydrodynamic radius in water at 25 °C (eta = 0.890 mPa·s)
        // diffuses with D ≈ 2.45e-10 m²/s = 245 µm²/s (Stokes–Einstein, Einstein 1905).
        double d = StokesEinstein.diffusionUm2PerS(298.15, 0.890, 1.0);
        assertThat(d).isCloseTo(245.0, withPercentage(0.5));
    }

    @Test
    void valueEqualsTheDefiningFormulaInSiUnits() {
        // Definition D = kB·T/(6·pi·eta·R), kB = 1.380649e-23 J/K exactly (SI 2019); here in m²/s.
        double expectedM2PerS = 1.380649e-23 * 310.15 / (6 * Math.PI * 0.69e-3 * 3.5e-9);
        assertThat(StokesEinstein.diffusionUm2PerS(310.15, 0.69, 3.5) * 1e-12)
                .isCloseTo(expectedM2PerS, withPercentage(1e-12));
    }

    @Test
    void scalesWithTemperatureAndInverselyWithViscosityAndRadius() {
        double base = StokesEinstein.diffusionUm2PerS(300, 1.0, 2.0);
        // Stokes–Einstein: D proportional to T, inversely proportional to eta and R.
        assertThat(StokesEinstein.diffusionUm2PerS(600, 1.0, 2.0)).isCloseTo(2 * base, withPercentage(1e-12));
        assertThat(StokesEinstein.diffusionUm2PerS(300, 2.0, 2.0)).isCloseTo(base / 2, withPercentage(1e-12));
        assertThat(StokesEinstein.diffusionUm2PerS(300, 1.0, 4.0)).isCloseTo(base / 2, withPercentage(1e-12));
    }

    @Test
    void rejectsNonPositiveArguments() {
        assertThatThrownBy(() -> StokesEinstein.diffusionUm2PerS(0, 1, 1))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("temperatureK");
        assertThatThrownBy(() -> StokesEinstein.diffusionUm2PerS(300, -1, 1))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("viscosityMPaS");
        assertThatThrownBy(() -> StokesEinstein.diffusionUm2PerS(300, 1, Double.NaN))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("hydrodynamicRadiusNm");
    }
}
