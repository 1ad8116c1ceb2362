package dev.nanoplan.cli;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import dev.nanoplan.physics.OpenSphereHitting;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class SimulateCommandTest {

    static CliRun run(String... args) {
        return CliRun.of(args);
    }

    static final String PAIR = """
            {"format": "nanoplan/1", "name": "pair",
             "volume": {"shape": "open"},
             "species": [{"name": "A", "diffusion_um2_per_s": 100.0}],
             "signalling": {"symbol_time_s": 0.1, "isi_memory_symbols": 2},
             "nodes": [
               {"id": "tx", "role": "transmitter", "position_um": [0, 0, 0], "radius_um": 1, "species": "A",
                "molecules_per_symbol": 1000},
               {"id": "rx", "role": "receiver", "position_um": [15, 0, 0], "radius_um": 5, "species": "A"}]}
            """;

    @Test
    void jsonCarriesTheContractKeys(@TempDir Path dir) throws Exception {
        Path f = Files.writeString(dir.resolve("pair.json"), PAIR);
        CliRun r = run("simulate", f.toString(), "--molecules-per-emitter", "5000", "--seed", "7", "--threads", "2",
                "--json");
        assertThat(r.status()).as(r.err()).isZero();
        JsonNode j = new ObjectMapper().readTree(r.out());
        assertThat(j.get("molecules_per_emitter").asLong()).isEqualTo(5000);
        assertThat(j.get("seed").asLong()).isEqualTo(7);
        assertThat(j.get("dt_s").asDouble()).isPositive();
        assertThat(j.get("caution").asText()).contains("not validated for clinical use");
        JsonNode link = j.get("links").get(0);
        for (String key : new String[] {"from", "to", "analytic_hit_probability", "simulated_hit_probability",
            "standard_error", "z_score", "relative_difference", "flagged", "simulated_taps",
            "simulated_taps_standard_error"}) {
            assertThat(link.has(key)).as(key).isTrue();
        }
        assertThat(link.get("simulated_taps").size()).isEqualTo(3);
        // Redner 2001, ch. 6: F(T) = (r/d) erfc((d − r)/√(4DT))
        assertThat(link.get("analytic_hit_probability").asDouble())
                .isEqualTo(OpenSphereHitting.of(15, 5, 100).cumulative(0.1));
        // stdout holds one JSON object and nothing else; no progress without a terminal
        assertThat(r.out().strip()).startsWith("{").endsWith("}");
        assertThat(r.err()).isEmpty();
    }

    @Test
    void textShowsTableAndCautionAndProgressGoesToStderr(@TempDir Path dir) throws Exception {
        Path f = Files.writeString(dir.resolve("pair.json"), PAIR);
        CliRun r = run("simulate", f.toString(), "--molecules-per-emitter", "3000", "--dt", "1e-3", "--progress");
        assertThat(r.status()).as(r.err()).isZero();
        assertThat(r.out()).contains("analytic").contains("simulated").contains("tx").contains("rx")
                .contains("not validated for clinical use");
        assertThat(r.err()).contains("molecules").contains("ETA");
    }

    @Test
    void badInputExitsWithStatusTwoAndOneLine(@TempDir Path dir) throws Exception {
        Path good = Files.writeString(dir.resolve("pair.json"), PAIR);
        Path bad = Files.writeString(dir.resolve("bad.json"), PAIR.replace("\"radius_um\": 5", "\"radius_um\": -5"));
        String[][] cases = {
            {"simulate", dir.resolve("missing.json").toString()},
            {"simulate", bad.toString()},
            {"simulate", good.toString(), "--molecules-per-emitter", "0"},
            {"simulate", good.toString(), "--dt", "-1"},
            {"simulate", good.toString(), "--dt", "0"}};
        for (String[] args : cases) {
            CliRun r = run(args);
            assertThat(r.status()).as(String.join(" ", args)).isEqualTo(2);
            assertThat(r.err().strip()).startsWith("nanoplan: ").doesNotContain("\n").doesNotContain("Exception");
            assertThat(r.out()).isEmpty();
        }
    }

    @Test
    void engineOptionsGiveOneLineErrorsWithStatusTwo(@TempDir Path dir) throws Exception {
        Path f = Files.writeString(dir.resolve("pair.json"), PAIR);
        // docs/architecture.md §4.2: bad usage is one line naming the option, exit status 2
        CliRun master = run("simulate", f.toString(), "--master", "local[2]");
        assertThat(master.status()).isEqualTo(2);
        assertThat(master.err().strip()).isEqualTo("nanoplan: --master: needs --engine spark");
        // planner-ui alone has no Spark classes: the user is told how to get them
        CliRun spark = run("simulate", f.toString(), "--engine", "spark");
        assertThat(spark.status()).isEqualTo(2);
        assertThat(spark.err().strip()).startsWith("nanoplan: --engine spark: the Spark engine is not on the class path")
                .doesNotContain("\n");
        CliRun unknown = run("simulate", f.toString(), "--engine", "grid");
        assertThat(unknown.err().strip()).isEqualTo("nanoplan: --engine: must be local or spark, got grid");
        assertThat(unknown.status()).isEqualTo(2);
    }
}
