package dev.nanoplan.scenario;

import static org.assertj.core.api.Assertions.assertThat;
import static org.junit.jupiter.api.Assertions.assertThrows;

import com.networknt.schema.InputFormat;
import com.networknt.schema.Schema;
import com.networknt.schema.SchemaRegistry;
import com.networknt.schema.SpecificationVersion;
import java.io.ByteArrayInputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/** The receiver-model fields of the file: {@code receiver}, {@code binding_rate_um_per_s}, {@code sampling_offset_s}. */
class ReceiverModelFileTest {

    private static final String FILE = """
            {"format": "nanoplan/1", "name": "three nodes",
             "volume": {"shape": "open"},
             "species": [{"name": "A", "diffusion_um2_per_s": 80.0}],
             "signalling": {"symbol_time_s": 0.5},
             "nodes": [
               {"id": "s1", "role": "transmitter", "position_um": [0, 0, 0], "radius_um": 1,
                "species": "A", "molecules_per_symbol": 200},
               {"id": "gw", "role": "receiver", "position_um": [20, 0, 0], "radius_um": 5, "species": "A",
                "receiver": "reactive", "binding_rate_um_per_s": 12.5},
               {"id": "ob", "role": "receiver", "position_um": [0, 20, 0], "radius_um": 5, "species": "A",
                "receiver": "passive", "sampling_offset_s": 0.2}],
             "demands": [{"from": "s1", "to": "gw"}]}
            """;

    private static Scenario read(String text) throws ScenarioException {
        return ScenarioReader.strict().read(new ByteArrayInputStream(text.getBytes(StandardCharsets.UTF_8)));
    }

    @Test
    void modelsAreReadAndWrittenBack() throws Exception {
        Scenario s = read(FILE);
        // source: the file above
        assertThat(s.nodesById().get("gw").receiver()).isEqualTo(ReceiverModel.reactive(12.5));
        assertThat(s.nodesById().get("ob").receiver()).isEqualTo(ReceiverModel.passive(0.2));
        assertThat(s.nodesById().get("s1").receiver()).isEqualTo(ReceiverModel.ABSORBING);
        // source: the model's meaning (a transparent observer removes nothing; a reactive sphere does)
        assertThat(s.nodesById().get("ob").absorbs()).isFalse();
        assertThat(s.nodesById().get("gw").absorbs()).isTrue();
        // source: the reader applied to the writer's text (round trip gives an equal scenario)
        String json = ScenarioWriter.toJson(s);
        assertThat(read(json)).isEqualTo(s);
        assertThat(json).contains("\"receiver\" : \"passive\"").contains("\"binding_rate_um_per_s\" : 12.5");
    }

    @Test
    void passiveWithoutOffsetSamplesAtTheSlotEndAndAbsorbingIsNotWritten() throws Exception {
        Scenario s = read(FILE.replace(", \"sampling_offset_s\": 0.2", "")
                .replace("\"receiver\": \"reactive\", \"binding_rate_um_per_s\": 12.5", "\"receiver\": \"absorbing\""));
        // source: the field's documented default (null offset = the end of the slot)
        assertThat(s.nodesById().get("ob").receiver()).isEqualTo(ReceiverModel.passive(null));
        // source: the writer's rule (the default is not written, so existing files stay byte-identical)
        String json = ScenarioWriter.toJson(s);
        assertThat(json).doesNotContain("absorbing").doesNotContain("sampling_offset_s");
        assertThat(read(json)).isEqualTo(s);
    }

    @Test
    void writerOutputPassesTheSchema() throws Exception {
        // source: the networknt JSON Schema validator (draft 2020-12) on scenarios/nanoplan-1.schema.json
        Schema schema = SchemaRegistry.withDefaultDialect(SpecificationVersion.DRAFT_2020_12)
                .getSchema(Files.readString(TestFiles.scenariosDir().resolve("nanoplan-1.schema.json")));
        assertThat(schema.validate(ScenarioWriter.toJson(read(FILE)), InputFormat.JSON)).isEmpty();
        String noRate = FILE.replace(", \"binding_rate_um_per_s\": 12.5", "");
        assertThat(schema.validate(noRate, InputFormat.JSON)).isNotEmpty();
    }

    @ParameterizedTest(name = "{0}")
    @CsvSource(delimiter = '|', value = {
        "\"receiver\": \"reactive\", \"binding_rate_um_per_s\": 12.5|\"receiver\": \"reactive\"|nodes[1].binding_rate_um_per_s",
        "\"binding_rate_um_per_s\": 12.5|\"binding_rate_um_per_s\": 0|nodes[1].binding_rate_um_per_s",
        "\"binding_rate_um_per_s\": 12.5|\"binding_rate_um_per_s\": -3|nodes[1].binding_rate_um_per_s",
        "\"sampling_offset_s\": 0.2|\"sampling_offset_s\": 0.6|nodes[2].sampling_offset_s",
        "\"sampling_offset_s\": 0.2|\"sampling_offset_s\": 0|nodes[2].sampling_offset_s",
        "\"receiver\": \"passive\"|\"receiver\": \"sticky\"|nodes[2].receiver",
        "\"receiver\": \"passive\", \"sampling_offset_s\": 0.2|\"receiver\": \"reactive\", \"binding_rate_um_per_s\": 1, "
                + "\"sampling_offset_s\": 0.2|nodes[2].sampling_offset_s",
        "\"molecules_per_symbol\": 200|\"molecules_per_symbol\": 200, \"receiver\": \"passive\"|nodes[0].receiver",
    })
    void badValuesNameTheField(String from, String to, String path) {
        // source: the field rules (reactive needs a rate > 0; 0 < offset <= symbol_time_s 0.5; three names; emitters
        // have no receiver model)
        ScenarioException e = assertThrows(ScenarioException.class, () -> read(FILE.replace(from, to)));
        assertThat(e.problems().toString()).contains(path);
    }
}
