package dev.nanoplan.cli;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;

class CompareCommandTest {

    private static final Path ROOT = Path.of("..").toAbsolutePath().normalize();

    @Test
    void comparesTheRelayPairPerDemand() throws Exception {
        CliRun r = LinkCommandTest.run("compare", ROOT.resolve("scenarios/relay-chain-direct.json").toString(),
                ROOT.resolve("scenarios/relay-chain-relayed.json").toString(), "--json");
        assertThat(r.status()).as(r.err()).isZero();
        JsonNode j = new ObjectMapper().readTree(r.out());
        assertThat(j.get("demands").size()).isGreaterThanOrEqualTo(1);
        JsonNode d = j.get("demands").get(0);
        assertThat(d.get("a").has("capacity_bits")).isTrue();
        assertThat(d.get("b").has("molecules_per_bit")).isTrue();
        assertThat(j.get("caution").asText()).contains("not validated for clinical use");
    }

    @Test
    void missingFileIsBadInput() {
        CliRun r = LinkCommandTest.run("compare", "no-such-a.json", "no-such-b.json");
        assertThat(r.status()).isEqualTo(2);
        assertThat(r.err()).contains("no-such-a.json").doesNotContain("Exception");
    }
}
