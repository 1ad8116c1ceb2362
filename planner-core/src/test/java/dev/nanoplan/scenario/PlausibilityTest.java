package dev.nanoplan.scenario;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.ByteArrayInputStream;
import java.nio.charset.StandardCharsets;
import java.util.List;
import org.junit.jupiter.api.Test;

/** Plausibility warnings: valid but physically absurd values, and receivers nobody sends to. */
class PlausibilityTest {

    private static final String BASE = """
            {"format": "nanoplan/1", "name": "p", "volume": {"shape": "open"},
             "medium": {"temperature_K": %s, "viscosity_mPa_s": 0.69},
             "species": [{"name": "A", "diffusion_um2_per_s": %s}, {"name": "B", "diffusion_um2_per_s": 80}],
             "signalling": {"symbol_time_s": 1.0},
             "nodes": [
               {"id": "s1", "role": "transmitter", "position_um": [0, 0, 0], "radius_um": 1, "species": "A",
                "molecules_per_symbol": 1000},
               {"id": "gw", "role": "receiver", "position_um": [20, 0, 0], "radius_um": 5, "species": "A"},
               {"id": "deaf", "role": "receiver", "position_um": [40, 0, 0], "radius_um": 5, "species": "B"}],
             "demands": [{"from": "s1", "to": "gw"}]}
            """;

    private static List<ScenarioProblem> warnings(String temperature, String diffusion) throws Exception {
        return new ScenarioReader(false).load(new ByteArrayInputStream(
                BASE.formatted(temperature, diffusion).getBytes(StandardCharsets.UTF_8))).warnings();
    }

    @Test
    void bodyTemperatureWaterDiffusionGiveNoRangeWarning() throws Exception {
        // 310.15 K = 37 °C; 80 µm²/s lies between proteins (~10) and small molecules (~1000) in water
        // (H. C. Berg, Random Walks in Biology, 1993, table 2.1)
        assertThat(warnings("310.15", "80")).extracting(ScenarioProblem::path)
                .doesNotContain("medium.temperature_K", "species[0].diffusion_um2_per_s");
    }

    @Test
    void absurdTemperatureAndDiffusionAreWarnedOnTheirFields() throws Exception {
        List<ScenarioProblem> w = warnings("1e300", "1e12");
        // 1e300 K is no liquid; 1e12 µm²/s = 1e4 m²/s is 10^8 times water's self-diffusion (2.3e-9 m²/s)
        assertThat(w).extracting(ScenarioProblem::path).contains("medium.temperature_K", "species[0].diffusion_um2_per_s");
        assertThat(w).filteredOn(p -> p.path().equals("medium.temperature_K")).first()
                .extracting(ScenarioProblem::message).asString().contains("far outside the physical range");
    }

    @Test
    void aReceiverWhoseSpeciesNobodySendsIsAWarning() throws Exception {
        // deaf senses B; the only emitter (s1) sends A: no molecule of B is ever released
        assertThat(warnings("310.15", "80")).extracting(ScenarioProblem::path).contains("nodes[2].species");
    }
}
