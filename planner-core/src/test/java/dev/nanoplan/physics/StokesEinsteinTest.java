package dev.nanoplan.physics;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatIllegalArgumentException;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;

class StokesEinsteinTest {

    @Test
    void workedValueInSiUnits() {
        // body temperature 310.15 K, blood-plasma-like viscosity 1.2 mPa·s, R_h = 3.5 nm
        double kB = 1.380649e-23; // J/K, exact (SI 2019)
        double expectedM2PerS = kB * 310.15 / (6 * Math.PI * 1.2e-3 * 3.5e-9);
        // Einstein 1905 / Stokes drag: D = k_B·T/(6π·η·R_h), evaluated here in SI and converted to µm²/s
        assertThat(StokesEinstein.diffusionUm2PerS(310.15, 1.2, 3.5))
            .isCloseTo(expectedM2PerS * 1e12, within(1e-13 * expectedM2PerS * 1e12));
    }

    @Test
    void nanometreMoleculeInWaterHasTextbookOrderOfMagnitude() {
        // water at 298 K: η ≈ 0.89 mPa·s (from memory); a ~1 nm molecule diffuses at
        // D ≈ 200–250 µm²/s (from memory)
        assertThat(StokesEinstein.diffusionUm2PerS(298, 0.89, 1.0)).isBetween(200.0, 250.0);
    }

    @Test
    void scalesAsTemperatureOverViscosityTimesRadius() {
        double base = StokesEinstein.diffusionUm2PerS(300, 1, 2);
        // Einstein 1905: D ∝ T, ∝ 1/η, ∝ 1/R_h
        assertThat(StokesEinstein.diffusionUm2PerS(600, 1, 2)).isCloseTo(2 * base, within(1e-13 * base));
        assertThat(StokesEinstein.diffusionUm2PerS(300, 4, 2)).isCloseTo(base / 4, within(1e-13 * base));
        assertThat(StokesEinstein.diffusionUm2PerS(300, 1, 20)).isCloseTo(base / 10, within(1e-13 * base));
    }

    @Test
    void rejectsBadParametersNamingThem() {
        assertThatIllegalArgumentException().isThrownBy(() -> StokesEinstein.diffusionUm2PerS(0, 1, 1))
            .withMessageContaining("temperatureK");
        assertThatIllegalArgumentException().isThrownBy(() -> StokesEinstein.diffusionUm2PerS(300, -1, 1))
            .withMessageContaining("viscosityMPaS");
        assertThatIllegalArgumentException().isThrownBy(() -> StokesEinstein.diffusionUm2PerS(300, 1, Double.NaN))
            .withMessageContaining("hydrodynamicRadiusNm");
        assertThatIllegalArgumentException()
            .isThrownBy(() -> StokesEinstein.diffusionUm2PerS(Double.POSITIVE_INFINITY, 1, 1))
            .withMessageContaining("temperatureK");
    }
}
