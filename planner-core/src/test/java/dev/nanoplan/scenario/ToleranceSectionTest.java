package dev.nanoplan.scenario;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import org.junit.jupiter.api.Test;

class ToleranceSectionTest {

    private static String file(String tolerances) {
        return """
                {"format": "nanoplan/1", "volume": {"shape": "open"},
                 "species": [{"name": "A", "diffusion_um2_per_s": 100}],
                 "signalling": {"symbol_time_s": 1},
                 "nodes": [
                   {"id": "tx", "role": "transmitter", "position_um": [0, 0, 0], "radius_um": 1, "species": "A",
                    "molecules_per_symbol": 200},
                   {"id": "rx", "role": "receiver", "position_um": [20, 0, 0], "radius_um": 5, "species": "A"}],
                 "tolerances": %s}
                """.formatted(tolerances);
    }

    @Test
    void overridesTakeTheSectionValuesForFieldsTheyOmit() throws Exception {
        Scenario s = ScenarioReader.strict().parse(file("""
                {"position_sd_um": 2, "radius_percent": 5, "molecules_percent": 10, "diffusion_percent": 3,
                 "temperature_K": 0.5, "nodes": {"rx": {"position_sd_um": 0.5}}}""")).scenario();
        // the rule (issue 15, deliver 1): per-node overrides, the rest from the section
        assertThat(s.tolerances().of("rx")).isEqualTo(new Tolerances.NodeSpread(0.5, 5, 10));
        assertThat(s.tolerances().of("tx")).isEqualTo(new Tolerances.NodeSpread(2, 5, 10));
        assertThat(s.tolerances().diffusionPercent()).isEqualTo(3);
        assertThat(ScenarioReader.strict().parse(ScenarioWriter.toJson(s)).scenario()).isEqualTo(s);
    }

    @Test
    void negativeValuesAndUnknownNodesAreNamedByTheirPath() {
        assertThatThrownBy(() -> ScenarioReader.strict().parse(file(
                "{\"radius_percent\": -1, \"nodes\": {\"zz\": {}}}")))
                .isInstanceOf(ScenarioException.class)
                .hasMessageContaining("tolerances.radius_percent: must be >= 0, got -1")
                .hasMessageContaining("tolerances.nodes.zz: no node has this id");
    }

    @Test
    void aFileWithoutTheSectionHasNoTolerances() throws Exception {
        Scenario s = ScenarioReader.strict().parse(file("{}")).scenario();
        assertThat(s.tolerances().none()).isTrue();
    }
}
