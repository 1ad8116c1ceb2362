package dev.nanoplan.cli;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class ToleranceCommandTest {

    private static final String ONE_LINK = """
            {"format": "nanoplan/1", "volume": {"shape": "open"},
             "species": [{"name": "A", "diffusion_um2_per_s": 100}],
             "signalling": {"symbol_time_s": 1, "isi_memory_symbols": 0},
             "nodes": [
               {"id": "tx", "role": "transmitter", "position_um": [0, 0, 0], "radius_um": 1, "species": "A",
                "molecules_per_symbol": 200},
               {"id": "rx", "role": "receiver", "position_um": [20, 0, 0], "radius_um": 5, "species": "A"}],
             "demands": [{"from": "tx", "to": "rx"}],
             "targets": {"max_error_probability": 0.05, "min_rate_bits_per_s": 0},
             "tolerances": {"position_sd_um": 3}}
            """;

    @Test
    void jsonHasTheKeysOfTheIssueAndOutWritesThePages(@TempDir Path dir) throws Exception {
        Path f = dir.resolve("one.json");
        Files.writeString(f, ONE_LINK);
        CliRun r = CliRun.of("tolerance", f.toString(), "--samples", "40", "--guard-samples", "8", "--threads", "2",
                "--json", "--out", dir.resolve("out").toString());
        assertThat(r.status()).as(r.err()).isZero();
        JsonNode o = new ObjectMapper().readTree(r.out());
        // issue 15, deliver 2: the --json keys
        for (String k : new String[] {"samples", "seed", "sampler", "thresholds", "redraws", "layout_yield",
            "layout_yield_interval", "links", "demands", "weak_links"}) {
            assertThat(o.has(k)).as(k).isTrue();
        }
        for (String k : new String[] {"from", "to", "yield", "yield_interval", "capacity_p5_bits", "capacity_p50_bits",
            "capacity_p95_bits", "drivers", "guard_band_molecules_per_symbol"}) {
            assertThat(o.get("links").get(0).has(k)).as(k).isTrue();
        }
        assertThat(o.get("samples").asInt()).isEqualTo(40);
        assertThat(Files.exists(dir.resolve("out/tolerance.json"))).isTrue();
        assertThat(Files.exists(dir.resolve("out/link-tx-rx.csv"))).isTrue();
        assertThat(Files.readString(dir.resolve("out/tolerance.html"))).contains("tx → rx");
    }

    @Test
    void theSameSeedGivesTheSameResultWhateverTheThreadCount(@TempDir Path dir) throws Exception {
        Path f = dir.resolve("one.json");
        Files.writeString(f, ONE_LINK);
        CliRun one = CliRun.of("tolerance", f.toString(), "--samples", "30", "--guard-samples", "0", "--threads", "1",
                "--json");
        CliRun two = CliRun.of("tolerance", f.toString(), "--samples", "30", "--guard-samples", "0", "--threads", "2",
                "--json");
        assertThat(one.out()).isEqualTo(two.out());
    }

    @Test
    void anUnknownSamplerIsOneLineNamingTheOption(@TempDir Path dir) throws Exception {
        Path f = dir.resolve("one.json");
        Files.writeString(f, ONE_LINK);
        CliRun r = CliRun.of("tolerance", f.toString(), "--sampler", "halton");
        assertThat(r.status()).isEqualTo(2);
        assertThat(r.err().strip()).startsWith("nanoplan: --sampler:").doesNotContain("\n").doesNotContain("Exception");
    }
}
