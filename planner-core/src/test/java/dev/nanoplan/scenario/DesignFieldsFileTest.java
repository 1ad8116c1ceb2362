package dev.nanoplan.scenario;

import static org.assertj.core.api.Assertions.assertThat;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.io.ByteArrayInputStream;
import java.nio.charset.StandardCharsets;
import org.junit.jupiter.api.Test;

/** The design fields of the file: {@code nodes[].fixed} and {@code candidate_species}. */
class DesignFieldsFileTest {

    private static final String FILE = """
            {"format": "nanoplan/1", "name": "two nodes",
             "volume": {"shape": "box", "min_um": [0, 0, 0], "max_um": [100, 100, 100]},
             "species": [{"name": "A", "diffusion_um2_per_s": 80.0}],
             "candidate_species": [{"name": "C", "diffusion_um2_per_s": 120.0, "half_life_s": 1.5}],
             "signalling": {"symbol_time_s": 1.0},
             "nodes": [
               {"id": "s1", "role": "transmitter", "position_um": [40, 50, 50], "radius_um": 1,
                "species": "A", "molecules_per_symbol": 20},
               {"id": "gw", "role": "receiver", "position_um": [50, 50, 50], "radius_um": 5, "species": "A",
                "fixed": true}],
             "demands": [{"from": "s1", "to": "gw"}]}
            """;

    private static Scenario read(String text) throws ScenarioException {
        return ScenarioReader.strict().read(new ByteArrayInputStream(text.getBytes(StandardCharsets.UTF_8)));
    }

    @Test
    void fixedAndCandidatesAreReadAndWrittenBack() throws Exception {
        Scenario s = read(FILE);
        // source: the file above (gw fixed, s1 not; one candidate C with its own diffusion and half-life)
        assertThat(s.nodesById().get("gw").fixed()).isTrue();
        assertThat(s.nodesById().get("s1").fixed()).isFalse();
        assertThat(s.candidateSpecies()).extracting(Species::name).containsExactly("C");
        assertThat(s.candidateSpecies().get(0).diffusionUm2PerS()).isEqualTo(120.0);
        // source: the reader applied to the writer's text (round trip gives an equal scenario)
        assertThat(read(ScenarioWriter.toJson(s))).isEqualTo(s);
        assertThat(ScenarioWriter.toJson(s)).contains("\"fixed\" : true").contains("candidate_species");
    }

    @Test
    void badDesignFieldsNameTheField() {
        ScenarioException notBool = assertThrows(ScenarioException.class,
                () -> read(FILE.replace("\"fixed\": true", "\"fixed\": \"yes\"")));
        assertThat(notBool.problems().toString()).contains("nodes[1].fixed");
        ScenarioException taken = assertThrows(ScenarioException.class,
                () -> read(FILE.replace("{\"name\": \"C\"", "{\"name\": \"A\"")));
        assertThat(taken.problems().toString()).contains("candidate_species[0].name");
    }
}
