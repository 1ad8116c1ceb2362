package dev.nanoplan.cli;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.core.JsonParser;
import com.fasterxml.jackson.core.JsonToken;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class PlanCommandTest {

    static CliRun run(String... args) {
        return CliRun.of(args);
    }

    /** A small valid layout (invented demo values): one sensor, one gateway, one demand. */
    static final String SMALL = """
            {"format": "nanoplan/1", "name": "two nodes",
             "volume": {"shape": "box", "min_um": [0, 0, 0], "max_um": [100, 100, 100]},
             "species": [{"name": "A", "diffusion_um2_per_s": 80.0}],
             "signalling": {"symbol_time_s": 1.0, "isi_memory_symbols": 3},
             "nodes": [
               {"id": "s1", "role": "transmitter", "position_um": [30, 50, 50], "radius_um": 1,
                "species": "A", "molecules_per_symbol": 2000},
               {"id": "gw", "role": "receiver", "position_um": [50, 50, 50], "radius_um": 5, "species": "A"}],
             "demands": [{"from": "s1", "to": "gw"}]}
            """;

    static Path write(Path dir, String name, String text) throws Exception {
        Path f = dir.resolve(name);
        Files.writeString(f, text);
        return f;
    }

    @Test
    void jsonModePrintsExactlyOneObject(@TempDir Path dir) throws Exception {
        Path f = write(dir, "small.json", SMALL);
        CliRun r = run("plan", f.toString(), "--json");
        assertThat(r.status()).as(r.err()).isZero();
        ObjectMapper m = new ObjectMapper();
        try (JsonParser p = m.getFactory().createParser(r.out())) {
            JsonNode root = m.readTree(p);
            assertThat(root.isObject()).isTrue();
            // nothing after the one object (docs/architecture.md §4.2: --json prints one JSON object and nothing else)
            assertThat(p.nextToken()).isNull();
            for (String key : new String[] {"links", "routes", "budgets", "warnings", "caution", "scenario"}) {
                assertThat(root.has(key)).as(key).isTrue();
            }
            assertThat(root.get("scenario").asText()).isEqualTo("two nodes");
            assertThat(root.get("routes").size()).isEqualTo(1);
        }
        assertThat(r.out().strip().lines().count()).isEqualTo(1);
    }

    @Test
    void outWritesTheThreeFiles(@TempDir Path dir) throws Exception {
        Path f = write(dir, "small.json", SMALL);
        Path out = dir.resolve("report-dir");
        CliRun r = run("plan", f.toString(), "--out", out.toString(), "--capacity-floor-bits", "0.01");
        assertThat(r.status()).as(r.err()).isZero();
        assertThat(r.out()).contains("wrote ").contains("report.html");
        JsonNode j = new ObjectMapper().readTree(out.resolve("plan.json").toFile());
        assertThat(j.get("routes").get(0).get("from").asText()).isEqualTo("s1");
        assertThat(Files.readString(out.resolve("links.csv"))).startsWith("from,to,species,");
        assertThat(Files.readString(out.resolve("report.html"))).startsWith("<!DOCTYPE html>").contains("<svg ");
        try (var files = Files.list(out)) {
            // atomic writes leave no temporary files behind
            assertThat(files.map(p -> p.getFileName().toString()).sorted().toList())
                    .containsExactly("links.csv", "plan.json", "report.html");
        }
    }

    @Test
    void jsonWithOutKeepsStdoutClean(@TempDir Path dir) throws Exception {
        Path f = write(dir, "small.json", SMALL);
        CliRun r = run("plan", f.toString(), "--json", "--out", dir.resolve("o").toString());
        assertThat(r.status()).as(r.err()).isZero();
        assertThat(r.err()).contains("wrote ");
        assertThat(new ObjectMapper().readTree(r.out()).isObject()).isTrue();
        assertThat(r.out()).doesNotContain("wrote ");
    }

    @Test
    void aMultiLevelPlanSaysWhatItCostsBeforePlanning(@TempDir Path dir) throws Exception {
        Path f = write(dir, "three.json", SMALL.replace("\"isi_memory_symbols\": 3}",
                "\"isi_memory_symbols\": 3, \"levels\": 3}"));
        CliRun r = run("plan", f.toString());
        assertThat(r.status()).as(r.err()).isZero();
        // the note comes first on stderr, before any progress line (common practice: say the cost up front)
        assertThat(r.err()).startsWith("note: levels 3: ").contains("culture tank").contains("progress and time left");
        CliRun binary = run("plan", write(dir, "two.json", SMALL).toString());
        assertThat(binary.err()).doesNotContain("note: levels");
    }

    @Test
    void missingFileIsBadInputOnOneLine(@TempDir Path dir) {
        CliRun r = run("plan", dir.resolve("nope.json").toString());
        assertThat(r.status()).isEqualTo(2);
        assertThat(r.err().strip().lines().count()).isEqualTo(1);
        assertThat(r.err()).contains("no such file").contains("nope.json");
        assertThat(r.out()).isEmpty();
    }

    @Test
    void malformedScenarioListsProblemsPrefixedWithTheFile(@TempDir Path dir) throws Exception {
        Path f = write(dir, "bad.json", SMALL.replace("\"radius_um\": 5", "\"radius_um\": -2"));
        CliRun r = run("plan", f.toString(), "--json");
        assertThat(r.status()).isEqualTo(2);
        assertThat(r.out()).isEmpty();
        assertThat(r.err()).contains(f + ": nodes[1].radius_um");
        assertThat(r.err()).doesNotContain("Exception").doesNotContain("\tat ");

        Path broken = write(dir, "broken.json", "{\"format\": \"nanoplan/1\", ");
        CliRun b = run("plan", broken.toString());
        assertThat(b.status()).isEqualTo(2);
        assertThat(b.err()).startsWith(broken + ": ");
    }

    @Test
    void unknownFieldsNeedLenient(@TempDir Path dir) throws Exception {
        Path f = write(dir, "extra.json", SMALL.replace("\"name\": \"two nodes\",", "\"name\": \"two nodes\", \"colour\": 3,"));
        assertThat(run("plan", f.toString(), "--json").status()).isEqualTo(2);
        CliRun r = run("plan", f.toString(), "--json", "--lenient");
        assertThat(r.status()).as(r.err()).isZero();
        assertThat(r.err()).contains("warning").contains("colour");
    }

    @Test
    void usageErrorsExitTwo(@TempDir Path dir) throws Exception {
        Path f = write(dir, "small.json", SMALL);
        assertThat(run("plan", f.toString(), "--no-such-option").status()).isEqualTo(2);
        assertThat(run("plan").status()).isEqualTo(2);
        CliRun neg = run("plan", f.toString(), "--capacity-floor-bits", "-1");
        assertThat(neg.status()).isEqualTo(2);
        assertThat(neg.err()).contains("--capacity-floor-bits");
        Path file = write(dir, "plain-file", "x");
        assertThat(run("plan", f.toString(), "--out", file.toString()).status()).isEqualTo(2);
    }

    @Test
    void textModePrintsTheSummary(@TempDir Path dir) throws Exception {
        Path f = write(dir, "small.json", SMALL);
        CliRun r = run("plan", f.toString());
        assertThat(r.status()).as(r.err()).isZero();
        assertThat(r.out()).contains("two nodes");
        assertThat(r.out().startsWith("{")).isFalse();
    }

    @Test
    void outputIsValidJsonTokenStream(@TempDir Path dir) throws Exception {
        Path f = write(dir, "small.json", SMALL);
        CliRun r = run("plan", f.toString(), "--json");
        try (JsonParser p = new ObjectMapper().getFactory().createParser(r.out())) {
            assertThat(p.nextToken()).isEqualTo(JsonToken.START_OBJECT);
        }
    }
}
