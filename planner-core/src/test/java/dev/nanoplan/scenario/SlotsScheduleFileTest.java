package dev.nanoplan.scenario;

import static org.assertj.core.api.Assertions.assertThat;
import static org.junit.jupiter.api.Assertions.assertThrows;

import com.networknt.schema.InputFormat;
import com.networknt.schema.Schema;
import com.networknt.schema.SchemaRegistry;
import com.networknt.schema.SpecificationVersion;
import dev.nanoplan.geometry.Vec3;
import java.nio.file.Files;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * The {@code slots} schedule in files: every emitter's {@code slot} and the optional
 * {@code signalling.frame_slots} are read, written back unchanged and accepted by the JSON Schema
 * (networknt, draft 2020-12); each bad value is one line naming the field.
 */
class SlotsScheduleFileTest {

    /** A transmitter, a relay and a receiver; {@code signalling} and the two emitters' extra fields given. */
    private static String file(String signallingExtra, String txExtra, String relayExtra, String rxExtra) {
        return """
                {"format": "nanoplan/1", "volume": {"shape": "open"},
                 "species": [{"name": "A", "diffusion_um2_per_s": 100}],
                 "signalling": {"symbol_time_s": 1.0%s},
                 "nodes": [
                   {"id": "tx", "role": "transmitter", "position_um": [0, 0, 0], "radius_um": 1,
                    "species": "A", "molecules_per_symbol": 100%s},
                   {"id": "relay", "role": "relay", "position_um": [30, 0, 0], "radius_um": 3,
                    "species": "A", "molecules_per_symbol": 100%s},
                   {"id": "rx", "role": "receiver", "position_um": [60, 0, 0], "radius_um": 3, "species": "A"%s}],
                 "demands": [{"from": "tx", "to": "rx"}]}
                """.formatted(signallingExtra, txExtra, relayExtra, rxExtra);
    }

    private static final String SLOTS = ", \"schedule\": \"slots\"";

    @Test
    void slotsAreReadAndWrittenBack() throws Exception {
        Scenario s = ScenarioReader.strict().parse(file(SLOTS + ", \"frame_slots\": 4", ", \"slot\": 3",
                ", \"slot\": 0", "")).scenario();
        assertThat(s.signalling().schedule()).isEqualTo(Schedule.SLOTS);
        assertThat(s.signalling().frameSlots()).isEqualTo(4);
        assertThat(s.signalling().slots()).isEqualTo(Map.of("tx", 3, "relay", 0));

        String written = ScenarioWriter.toJson(s);
        assertThat(written).contains("\"frame_slots\" : 4").contains("\"slot\" : 3");
        assertThat(ScenarioReader.strict().parse(written).scenario()).isEqualTo(s);
    }

    @Test
    void schemaAcceptsSlotsAndRefusesASlotOnAReceiver() throws Exception {
        String text = Files.readString(TestFiles.scenariosDir().resolve("nanoplan-1.schema.json"));
        Schema schema = SchemaRegistry.withDefaultDialect(SpecificationVersion.DRAFT_2020_12).getSchema(text);
        assertThat(schema.validate(file(SLOTS + ", \"frame_slots\": 2", ", \"slot\": 1", ", \"slot\": 0", ""),
                InputFormat.JSON)).isEmpty();
        assertThat(schema.validate(file(SLOTS, ", \"slot\": 1", ", \"slot\": 0", ", \"slot\": 0"),
                InputFormat.JSON)).isNotEmpty();
        assertThat(schema.validate(file(SLOTS, ", \"slot\": -1", ", \"slot\": 0", ""), InputFormat.JSON))
                .isNotEmpty();
    }

    @ParameterizedTest(name = "{0}")
    @CsvSource(delimiter = '|', value = {
        "missing slot | , \"schedule\": \"slots\" | | , \"slot\": 0 | | nodes[0].slot: missing required field",
        "negative slot | , \"schedule\": \"slots\" | , \"slot\": -1 | , \"slot\": 0 | | nodes[0].slot: must be >= 0",
        "fractional slot | , \"schedule\": \"slots\" | , \"slot\": 1.5 | , \"slot\": 0 | | nodes[0].slot: must be a whole number",
        "slot beyond the frame | , \"schedule\": \"slots\", \"frame_slots\": 2 | , \"slot\": 2 | , \"slot\": 0 | "
                + "| nodes[0].slot: must be below signalling.frame_slots 2",
        "slot under round-robin | , \"schedule\": \"round-robin\" | , \"slot\": 0 | | | nodes[0].slot: only with signalling.schedule slots",
        "slot on a receiver | , \"schedule\": \"slots\" | , \"slot\": 0 | , \"slot\": 0 | , \"slot\": 0 | nodes[2].slot: only emitters",
        "frame under all-active | , \"frame_slots\": 2 | | | | signalling.frame_slots: only with schedule slots",
    })
    void badSlotIsOneLineNamingTheField(String name, String sig, String tx, String relay, String rx,
            String expected) {
        ScenarioException e = assertThrows(ScenarioException.class, () -> ScenarioReader.strict()
                .parse(file(sig, blank(tx), blank(relay), blank(rx))));
        // docs/architecture.md §4.1: bad input is one line naming the field path
        assertThat(e.getMessage().lines()).hasSize(1);
        assertThat(e.getMessage()).startsWith(expected);
    }

    private static String blank(String s) {
        return s == null ? "" : s;
    }

    @Test
    void aNewEmitterBuiltInCodeTakesAFreshSlot() throws Exception {
        Scenario s = ScenarioReader.strict().parse(file(SLOTS, ", \"slot\": 0", ", \"slot\": 0", "")).scenario();
        List<Node> nodes = new ArrayList<>(s.nodes());
        nodes.add(Node.transmitter("tx2", new Vec3(0, 40, 0), 1, "A", 50));
        Scenario more = new Scenario(s.name(), s.volume(), s.medium(), s.species(), s.signalling(), nodes,
                s.demands(), s.targets());
        // SlotPlan: without frame_slots a new emitter takes its species' largest slot + 1
        assertThat(more.signalling().slots()).isEqualTo(Map.of("tx", 0, "relay", 0, "tx2", 1));
    }
}
