package dev.nanoplan.scenario;

import static org.assertj.core.api.Assertions.assertThat;
import static org.junit.jupiter.api.Assertions.assertThrows;

import dev.nanoplan.count.CountModelKind;
import dev.nanoplan.geometry.Vec3;
import dev.nanoplan.geometry.Volume;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import org.assertj.core.data.Offset;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class ScenarioReaderTest {

    private final ScenarioReader reader = ScenarioReader.strict();

    @Test
    void cultureTankHasTheDescribedLayout() throws ScenarioException {
        Scenario s = reader.read(TestFiles.scenariosDir().resolve("culture-tank.json"));

        assertThat(s.volume()).isInstanceOf(Volume.Box.class);
        assertThat(s.species()).extracting(Species::name).containsExactly("A", "B");
        long sensors = s.nodes().stream().filter(n -> n.role() == Role.TRANSMITTER).count();
        assertThat(sensors).isGreaterThanOrEqualTo(12);
        assertThat(s.nodes().stream().filter(n -> n.role() == Role.RELAY).count()).isGreaterThanOrEqualTo(2);
        assertThat(s.demands()).hasSize((int) sensors).allMatch(d -> d.to().equals("gw"));
        // Species B is given by its hydrodynamic radius; the diffusion coefficient is derived.
        Species b = s.speciesByName().get("B");
        assertThat(b.hydrodynamicRadiusNm()).hasValue(0.8);
        assertThat(b.diffusionUm2PerS()).isBetween(50.0, 500.0);
    }

    @Test
    void relayChainPairSharesEndpoints() throws ScenarioException {
        Scenario direct = reader.read(TestFiles.scenariosDir().resolve("relay-chain-direct.json"));
        Scenario relayed = reader.read(TestFiles.scenariosDir().resolve("relay-chain-relayed.json"));

        Map<String, Node> d = direct.nodesById();
        Map<String, Node> r = relayed.nodesById();
        assertThat(r.get("src")).isEqualTo(d.get("src"));
        assertThat(r.get("dst")).isEqualTo(d.get("dst"));
        assertThat(direct.demands()).isEqualTo(relayed.demands());
        assertThat(r.values().stream().filter(n -> n.role() == Role.RELAY).count()).isGreaterThanOrEqualTo(1);
        assertThat(d.get("src").positionUm().distance(d.get("dst").positionUm())).isGreaterThanOrEqualTo(100.0);
    }

    @Test
    void vesselSegmentIsACylinderWithPoiseuilleFlow() throws ScenarioException {
        Scenario s = reader.read(TestFiles.scenariosDir().resolve("vessel-segment.json"));

        assertThat(s.volume()).isInstanceOf(Volume.Cylinder.class);
        assertThat(s.medium().flow()).isInstanceOf(Flow.Poiseuille.class);
        Node gw = s.nodesById().get("gw");
        // The gateway sits downstream (+x) of every sensor.
        assertThat(s.nodes()).filteredOn(n -> n.role() == Role.TRANSMITTER)
                .allMatch(n -> n.positionUm().x() < gw.positionUm().x());
    }

    @Test
    void omittedOptionalFieldsTakeTheDocumentedDefaults() throws ScenarioException {
        String json = """
                {"format": "nanoplan/1",
                 "volume": {"shape": "open"},
                 "species": [{"name": "A", "diffusion_um2_per_s": 100}],
                 "signalling": {"symbol_time_s": 0.5},
                 "nodes": [
                   {"id": "t", "role": "transmitter", "position_um": [0, 0, 0], "radius_um": 1,
                    "species": "A", "molecules_per_symbol": 2e3},
                   {"id": "r", "role": "relay", "position_um": [20, 0, 0], "radius_um": 3, "species": "A",
                    "molecules_per_symbol": 100},
                   {"id": "g", "role": "receiver", "position_um": [40, 0, 0], "radius_um": 5, "species": "A"}]}
                """;
        Scenario s = reader.parse(json).scenario();

        assertThat(s.name()).isEmpty();
        assertThat(s.medium()).isEqualTo(new Medium(310.15, 0.69, new Flow.None(), 0.0));
        assertThat(s.signalling()).isEqualTo(new Signalling(0.5, 10, 2, 0.5, CountModelKind.EXACT,
                Schedule.ALL_ACTIVE));
        assertThat(s.species().get(0).isStable()).isTrue();
        assertThat(s.species().get(0).decayRatePerS()).isZero();
        assertThat(s.nodes().get(0).moleculesPerSymbol()).isEqualTo(2000);
        assertThat(s.nodes().get(1).emitsSpecies()).isEqualTo("A");
        assertThat(s.nodes().get(2).moleculesPerSymbol()).isZero();
        assertThat(s.demands()).isEmpty();
        assertThat(s.targets()).isEqualTo(Targets.DEFAULT);
    }

    @Test
    void halfLifeGivesTheDecayRate() throws ScenarioException {
        Scenario s = reader.read(TestFiles.scenariosDir().resolve("vessel-segment.json"));
        Species sp = s.species().get(0);
        // First-order decay: lambda = ln 2 / half-life (definition of half-life).
        assertThat(sp.decayRatePerS()).isCloseTo(Math.log(2) / sp.halfLifeS(), Offset.offset(1e-15));
    }

    @Test
    void fileWithThreeErrorsReportsAllThree() {
        ScenarioException e = assertThrows(ScenarioException.class,
                () -> reader.read(TestFiles.resource("three-errors.json")));

        assertThat(e.problems()).extracting(ScenarioProblem::path)
                .containsExactly("signalling.levels", "nodes[1].radius_um", "demands[0].to");
        assertThat(e.getMessage().lines()).hasSize(3);
    }

    @Test
    void problemCarriesTheLineAndColumnOfTheValue() {
        String json = "{\"format\": \"nanoplan/1\",\n"
                + "\"volume\": {\"shape\": \"open\"},\n"
                + "\"species\": [{\"name\": \"A\", \"diffusion_um2_per_s\": 80}],\n"
                + "\"signalling\": {\"symbol_time_s\": 0.3},\n"
                + "\"nodes\": [\n"
                + "  {\"id\": \"t\", \"role\": \"transmitter\", \"position_um\": [0,0,0], \"radius_um\": 1,"
                + " \"species\": \"A\", \"molecules_per_symbol\": 10},\n"
                + "  {\"id\": \"r\", \"role\": \"receiver\", \"position_um\": [9,0,0], \"radius_um\": -2,"
                + " \"species\": \"A\"}]}\n";
        List<String> lines = json.lines().toList();
        int expectedLine = 7;
        int expectedColumn = lines.get(expectedLine - 1).indexOf("-2") + 1;

        ScenarioException e = assertThrows(ScenarioException.class, () -> reader.parse(json));

        assertThat(e.problems()).hasSize(1);
        assertThat(e.getMessage()).isEqualTo("nodes[1].radius_um: must be > 0, got -2 (line " + expectedLine
                + ", column " + expectedColumn + ")");
    }

    @Test
    void missingFieldIsLocatedAtItsEnclosingObject() {
        String json = "{\"format\": \"nanoplan/1\", \"volume\": {\"shape\": \"open\"},\n"
                + "\"species\": [{\"name\": \"A\", \"diffusion_um2_per_s\": 80}],\n"
                + "\"signalling\": {\"levels\": 2},\n"
                + "\"nodes\": [{\"id\": \"t\", \"role\": \"transmitter\", \"position_um\": [0,0,0], \"radius_um\": 1,"
                + " \"species\": \"A\", \"molecules_per_symbol\": 10}]}";
        ScenarioException e = assertThrows(ScenarioException.class, () -> reader.parse(json));

        ScenarioProblem p = e.problems().get(0);
        assertThat(p.path()).isEqualTo("signalling.symbol_time_s");
        assertThat(p.message()).isEqualTo("missing required field");
        assertThat(p.line()).isEqualTo(3);
        assertThat(p.column()).isEqualTo("\"signalling\": ".length() + 1);
    }

    @Test
    void truncatedJsonGivesOneProblemAtTheEnd() {
        String json = "{\"format\": \"nanoplan/1\",\n\"volume\": {\"shape\": ";
        ScenarioException e = assertThrows(ScenarioException.class, () -> reader.parse(json));

        assertThat(e.problems()).hasSize(1);
        assertThat(e.problems().get(0).message()).startsWith("invalid JSON");
        assertThat(e.problems().get(0).line()).isEqualTo(2);
    }

    @Test
    void nanLiteralIsNamed() {
        ScenarioException e = assertThrows(ScenarioException.class,
                () -> reader.read(TestFiles.resource("bad/nan-symbol-time.json")));
        assertThat(e.getMessage()).contains("signalling.symbol_time_s: must be a finite number, got NaN");
    }

    @Test
    void unknownFieldIsAWarningOnlyWhenLenient() throws ScenarioException {
        Path file = TestFiles.resource("bad/unknown-field-node.json");
        ScenarioException e = assertThrows(ScenarioException.class, () -> reader.read(file));
        assertThat(e.getMessage()).startsWith("nodes[0].colour: unknown field (line ");

        ScenarioReader.Result r = ScenarioReader.lenient().load(file);
        assertThat(r.warnings()).extracting(ScenarioProblem::path).containsExactly("nodes[0].colour");
        assertThat(r.warnings().get(0).hasLocation()).isTrue();
        assertThat(r.scenario().nodes()).hasSize(3);
    }

    @Test
    void missingFileIsAScenarioException(@TempDir Path dir) {
        ScenarioException e = assertThrows(ScenarioException.class, () -> reader.read(dir.resolve("none.json")));
        assertThat(e.getMessage()).startsWith("no such file: ");
    }

    @Test
    void manyErrorsAreAllReported() {
        String json = """
                {"format": "nanoplan/9", "volume": {"shape": "box", "min_um": [0,0,0], "max_um": [10,10,10]},
                 "species": [{"name": "A", "diffusion_um2_per_s": -1}, {"name": "B", "diffusion_um2_per_s": 5}],
                 "signalling": {"symbol_time_s": 0, "prior_one": 1.5},
                 "nodes": [
                   {"id": "a", "role": "transmitter", "position_um": [5,5,5], "radius_um": 2, "species": "A",
                    "molecules_per_symbol": 1},
                   {"id": "a", "role": "receiver", "position_um": [6,5,5], "radius_um": 2, "species": "A"}]}
                """;
        ScenarioException e = assertThrows(ScenarioException.class, () -> reader.parse(json));

        assertThat(e.problems()).extracting(ScenarioProblem::path).contains("format",
                "species[0].diffusion_um2_per_s", "species[1].name", "signalling.symbol_time_s",
                "signalling.prior_one", "nodes[1].id", "nodes[1].position_um");
    }

    @Test
    void nodeTouchingTheWallOrAnotherNodeIsAccepted() throws ScenarioException {
        String json = """
                {"format": "nanoplan/1", "volume": {"shape": "cylinder", "radius_um": 10, "length_um": 100},
                 "species": [{"name": "A", "diffusion_um2_per_s": 100}],
                 "signalling": {"symbol_time_s": 1},
                 "nodes": [
                   {"id": "t", "role": "transmitter", "position_um": [2,0,8], "radius_um": 2, "species": "A",
                    "molecules_per_symbol": 10},
                   {"id": "r", "role": "receiver", "position_um": [6,0,8], "radius_um": 2, "species": "A"}]}
                """;
        Scenario s = reader.parse(json).scenario();
        assertThat(s.nodes().get(1).positionUm()).isEqualTo(new Vec3(6, 0, 8));
    }
}
