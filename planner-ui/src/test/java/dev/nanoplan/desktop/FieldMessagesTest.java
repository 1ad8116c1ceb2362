package dev.nanoplan.desktop;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.ReceiverModel;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.ScenarioReader;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.regex.Pattern;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

/**
 * Refused values in the settings editor and the node inspector: each message names the field as the
 * scenario file does and sits beside that field. The names are checked against the published format,
 * {@code scenarios/nanoplan-1.schema.json} (JSON Schema of the nanoplan/1 file), not against the
 * editors' own constants.
 */
class FieldMessagesTest {

    static final Path TANK = Path.of("..", "scenarios", "culture-tank.json");
    static final Path SCHEMA = Path.of("..", "scenarios", "nanoplan-1.schema.json");
    static final Pattern INDEX = Pattern.compile("\\[\\d+]");

    static JsonNode schema;
    Scenario tank;
    ScenarioSettings settings;

    @BeforeAll
    static void readSchema() throws Exception {
        schema = new ObjectMapper().readTree(SCHEMA.toFile());
    }

    @BeforeEach
    void setUp() throws Exception {
        tank = ScenarioReader.strict().read(TANK);
        settings = new ScenarioSettings();
        settings.load(tank);
    }

    /** Whether the dotted file path ({@code nodes[3].position_um[0]}) names a property the schema declares. */
    static boolean declared(String path) {
        List<JsonNode> here = List.of(schema);
        for (String part : path.split("\\.")) {
            boolean indexed = part.contains("[");
            String name = INDEX.matcher(part).replaceAll("");
            List<JsonNode> next = new ArrayList<>();
            for (JsonNode n : here) {
                for (JsonNode b : branches(n)) {
                    JsonNode p = b.path("properties").path(name);
                    if (!p.isMissingNode()) {
                        next.add(indexed ? items(p) : p);
                    }
                }
            }
            if (next.isEmpty()) {
                return false;
            }
            here = next;
        }
        return true;
    }

    /** A schema node with its $ref followed and its allOf / oneOf / anyOf / if-then branches. */
    static List<JsonNode> branches(JsonNode n) {
        List<JsonNode> out = new ArrayList<>();
        JsonNode r = resolve(n);
        out.add(r);
        for (String k : List.of("allOf", "oneOf", "anyOf")) {
            r.path(k).forEach(b -> out.addAll(branches(b)));
        }
        for (String k : List.of("then", "else")) {
            if (r.has(k)) {
                out.addAll(branches(r.get(k)));
            }
        }
        return out;
    }

    static JsonNode items(JsonNode n) {
        JsonNode r = resolve(n);
        return r.has("items") ? r.get("items") : r;
    }

    static JsonNode resolve(JsonNode n) {
        while (n.has("$ref")) {
            String ref = n.get("$ref").asText();
            JsonNode t = schema;
            for (String p : ref.substring(2).split("/")) {
                t = t.path(p);
            }
            n = t;
        }
        return n;
    }

    @Test
    void theSchemaWalkRefusesAnInventedName() throws Exception {
        // not vacuous: the record component name the old messages used is not a file name
        assertThat(declared("signalling.symbolTimeS")).isFalse();
        assertThat(declared("signalling.symbol_time_s")).isTrue();
    }

    @Test
    void aNegativeSymbolTimeIsNamedAsInTheFileAndPlacedBesideItsField() throws Exception {
        settings.symbolTimeSProperty().set("-3");
        assertThatThrownBy(() -> settings.apply(tank, List.of()))
                .hasMessage("signalling.symbol_time_s must be finite and > 0, got -3.0");
        assertThat(settings.errors().message(ScenarioSettings.SYMBOL_TIME).get())
                .isEqualTo("signalling.symbol_time_s must be finite and > 0, got -3.0");
        assertThat(settings.errors().message(ScenarioSettings.LEVELS).get()).isEmpty();
        // editing the field takes its mark away
        settings.symbolTimeSProperty().set("-");
        assertThat(settings.errors().message(ScenarioSettings.SYMBOL_TIME).get()).isEmpty();
        assertThatThrownBy(() -> settings.apply(tank, List.of())).hasMessageContaining("signalling.symbol_time_s");
        // Revert (load) clears the marks
        settings.load(tank);
        assertThat(settings.errors().all()).isEmpty();
    }

    @Test
    void everyMalformedFieldIsMarkedAtOnceUnderItsFileName() throws Exception {
        settings.temperatureKProperty().set("warm");
        settings.levelsProperty().set("2.5");
        settings.priorOneProperty().set("");
        settings.flowProfileProperty().set("uniform");
        settings.flowVyUmPerSProperty().set("fast");
        assertThatThrownBy(() -> settings.apply(tank, List.of())).hasMessageContaining("medium.temperature_K");
        Map<String, String> all = settings.errors().all();
        assertThat(all).containsOnlyKeys(ScenarioSettings.TEMPERATURE, ScenarioSettings.LEVELS,
                ScenarioSettings.PRIOR_ONE, ScenarioSettings.VELOCITY + "[1]");
        all.forEach((path, message) -> {
            assertThat(message).startsWith(path).doesNotContain("\n");
            // the published format (scenarios/nanoplan-1.schema.json) declares each named field
            assertThat(declared(path)).as(path).isTrue();
        });
    }

    @ParameterizedTest
    @ValueSource(strings = {"temperatureK:-1:medium.temperature_K", "viscosityMPaS:0:medium.viscosity_mPa_s",
        "backgroundMoleculesPerS:-2:medium.background_molecules_per_s", "isiMemorySymbols:-1:signalling.isi_memory_symbols",
        "levels:40:signalling.levels", "priorOne:1.5:signalling.prior_one", "symbolTimeS:0:signalling.symbol_time_s"})
    void aCoreRangeCheckIsReportedUnderTheFileName(String spec) {
        String[] p = spec.split(":");
        Map<String, javafx.beans.property.StringProperty> fields = Map.of("temperatureK", settings.temperatureKProperty(),
                "viscosityMPaS", settings.viscosityMPaSProperty(), "backgroundMoleculesPerS",
                settings.backgroundMoleculesPerSProperty(), "isiMemorySymbols", settings.isiMemorySymbolsProperty(),
                "levels", settings.levelsProperty(), "priorOne", settings.priorOneProperty(), "symbolTimeS",
                settings.symbolTimeSProperty());
        fields.get(p[0]).set(p[1]);
        assertThatThrownBy(() -> settings.apply(tank, List.of())).hasMessageStartingWith(p[2] + " ");
        if (!p[2].endsWith("." + p[0])) {
            // the record component name (symbolTimeS) no longer shows
            assertThatThrownBy(() -> settings.apply(tank, List.of())).hasMessageNotContaining(p[0]);
        }
        assertThat(settings.errors().all()).containsOnlyKeys(p[2]);
        // scenarios/nanoplan-1.schema.json declares the field named
        assertThat(declared(p[2])).isTrue();
    }

    @Test
    void aSpeciesRowErrorNamesTheRowAndField() throws Exception {
        settings.species("A").halfLifeSProperty().set("0");
        assertThatThrownBy(() -> settings.apply(tank, List.of())).hasMessageContaining("species[0].half_life_s");
        assertThat(settings.errors().all()).containsOnlyKeys("species[0].half_life_s");
        assertThat(settings.errors().messageUnder("species[0].").get()).contains("species[0].half_life_s");
        // scenarios/nanoplan-1.schema.json declares species[].half_life_s
        assertThat(declared("species[0].half_life_s")).isTrue();
    }

    @Test
    void inspectorMessagesNameTheNodeByItsIndexInTheFile() throws Exception {
        NodeInspector in = new NodeInspector();
        Node gw = tank.nodesById().get("gw");
        int index = tank.nodes().indexOf(gw);
        in.load(tank, gw);
        in.radiusUmProperty().set("-2");
        in.zUmProperty().set("deep");
        assertThatThrownBy(in::toEdit).hasMessage("nodes[" + index + "].position_um[2] is not a number: 'deep'");
        assertThat(in.errors().all()).containsOnlyKeys(NodeInspector.Z);
        in.zUmProperty().set("100");
        assertThatThrownBy(in::toEdit).hasMessage("nodes[" + index + "].radius_um must be finite and > 0, got -2.0");
        assertThat(in.errors().message(NodeInspector.RADIUS).get()).startsWith("nodes[" + index + "].radius_um");
        in.radiusUmProperty().set("10");
        in.receiverProperty().set(ReceiverModel.Kind.REACTIVE);
        in.bindingRateUmPerSProperty().set("-1");
        assertThatThrownBy(in::toEdit).hasMessageStartingWith("nodes[" + index + "].binding_rate_um_per_s must be");
        assertThat(in.errors().all()).containsOnlyKeys(NodeInspector.BINDING_RATE);
        for (String key : List.of(NodeInspector.X, NodeInspector.RADIUS, NodeInspector.RECEIVER,
                NodeInspector.BINDING_RATE, NodeInspector.SAMPLING_OFFSET, NodeInspector.SLOT, NodeInspector.FIXED,
                NodeInspector.MOLECULES, NodeInspector.EMITS)) {
            // scenarios/nanoplan-1.schema.json declares every node field the inspector names
            assertThat(declared(in.path(key))).as(key).isTrue();
        }
    }
}
