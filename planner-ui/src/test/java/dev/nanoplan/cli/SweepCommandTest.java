package dev.nanoplan.cli;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/** {@code nanoplan sweep}: the JSON keys and files, and one-line errors for bad PATH or SPEC. */
class SweepCommandTest {

    private static String bundled(String name) {
        Path dir = Path.of("").toAbsolutePath();
        while (!Files.isDirectory(dir.resolve("scenarios"))) {
            dir = dir.getParent();
        }
        return dir.resolve("scenarios/" + name).toString();
    }

    @Test
    void jsonAndOutGiveTheGridInOrder(@TempDir Path dir) throws Exception {
        CliRun r = CliRun.of("sweep", bundled("relay-chain-relayed.json"), "--vary", "signalling.symbol_time_s=4,6",
                "--vary", "nodes[relay1].position_um[0]=55:55:1", "--threads", "2", "--json", "--out", dir.toString());
        assertThat(r.status()).as(r.err()).isZero();
        JsonNode j = new ObjectMapper().readTree(r.out());
        // keys and order as the issue lists them; grid order: first --vary slowest
        assertThat(j.get("fields").toString()).isEqualTo("[\"signalling.symbol_time_s\",\"nodes[relay1].position_um[0]\"]");
        assertThat(j.get("points")).hasSize(2);
        assertThat(j.get("points").get(1).get("values").get("signalling.symbol_time_s").asDouble()).isEqualTo(6.0);
        assertThat(Files.readString(dir.resolve("sweep.json"))).isNotBlank();
        assertThat(Files.readAllLines(dir.resolve("sweep.csv"))).hasSize(3);
        assertThat(Files.readString(dir.resolve("sweep.html"))).contains("<svg");
    }

    @ParameterizedTest
    @CsvSource(delimiter = ';', value = {
        "signalling.symbol_time=1,2; --vary signalling.symbol_time: no such field",
        "nodes[x].radius_um=1; --vary nodes[x].radius_um: no such field",
        "signalling.symbol_time_s=1:2:0; --vary 1:2:0: step must be > 0",
        "signalling.symbol_time_s=a,b; --vary a,b: not a number",
        "signalling..x=1; --vary signalling..x: not a field path",
        "signalling.symbol_time_s; --vary signalling.symbol_time_s: expected PATH=SPEC",
        "signalling.symbol_time_s=-1; --vary signalling.symbol_time_s=-1.0: "})
    void badPathOrSpecIsOneLineExitTwo(String vary, String start) {
        CliRun r = CliRun.of("sweep", bundled("relay-chain-relayed.json"), "--vary", vary);
        assertThat(r.status()).isEqualTo(2);
        assertThat(r.out()).isEmpty();
        assertThat(r.err().strip()).doesNotContain("\n").contains(start.strip()).doesNotContain("Exception");
    }
}
