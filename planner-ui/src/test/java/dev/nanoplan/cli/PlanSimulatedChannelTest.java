package dev.nanoplan.cli;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** {@code plan --channel simulated}: the plan on simulated taps, cached on disk. */
class PlanSimulatedChannelTest {

    private static final ObjectMapper MAPPER = new ObjectMapper();

    private static CliRun plan(Path scenario, Path cache, String... extra) {
        List<String> args = new ArrayList<>(List.of("plan", scenario.toString(), "--json", "--channel",
                "simulated", "--molecules-per-emitter", "2000", "--seed", "3", "--threads", "2", "--cache-dir",
                cache.toString()));
        args.addAll(List.of(extra));
        return PlanCommandTest.run(args.toArray(String[]::new));
    }

    @Test
    void secondPlanWithAnotherBudgetReadsTheCachedChannel(@TempDir Path dir) throws Exception {
        Path f = PlanCommandTest.write(dir, "small.json", PlanCommandTest.SMALL);
        Path cache = dir.resolve("cache");
        CliRun first = plan(f, cache);
        assertThat(first.status()).as(first.err()).isZero();
        assertThat(first.err()).contains("cache miss").contains("stored in");
        JsonNode a = MAPPER.readTree(first.out());
        JsonNode link = a.get("links").get(0);
        assertThat(link.get("from").asText()).isEqualTo("s1");
        assertThat(link.get("to").asText()).isEqualTo("gw");

        // the cached counts / M are the plan's taps
        Path file;
        try (Stream<Path> files = Files.list(cache)) {
            file = files.filter(p -> p.toString().endsWith(".json")).findFirst().orElseThrow();
        }
        JsonNode counts = MAPPER.readTree(file.toFile()).get("emitters").get(0).get("counts").get(0);
        JsonNode taps = link.get("taps");
        assertThat(taps.size()).isEqualTo(counts.size());
        for (int k = 0; k < taps.size(); k++) {
            assertThat(taps.get(k).asDouble()).isEqualTo(counts.get(k).asLong() / 2000.0);
        }
        assertThat(counts.get(0).asLong()).isPositive();

        // another budget and another name: no simulation, same taps
        Path g = PlanCommandTest.write(dir, "bigger.json", PlanCommandTest.SMALL
                .replace("\"molecules_per_symbol\": 2000", "\"molecules_per_symbol\": 9000")
                .replace("two nodes", "renamed"));
        CliRun second = plan(g, cache);
        assertThat(second.status()).as(second.err()).isZero();
        assertThat(second.err()).contains("cache hit").doesNotContain("cache miss");
        assertThat(MAPPER.readTree(second.out()).get("links").get(0).get("taps")).isEqualTo(taps);

        // a moved receiver is simulated again
        Path h = PlanCommandTest.write(dir, "moved.json", PlanCommandTest.SMALL.replace("[50, 50, 50]", "[55, 50, 50]"));
        assertThat(plan(h, cache).err()).contains("cache miss");
    }

    @Test
    void simulationOptionsNeedTheSimulatedChannelAndTheChannelWordIsChecked(@TempDir Path dir) throws Exception {
        Path f = PlanCommandTest.write(dir, "small.json", PlanCommandTest.SMALL);
        CliRun seedOnly = PlanCommandTest.run("plan", f.toString(), "--channel", "analytic", "--seed", "4");
        assertThat(seedOnly.status()).isEqualTo(2);
        assertThat(seedOnly.err()).contains("--channel auto or simulated");
        CliRun bad = PlanCommandTest.run("plan", f.toString(), "--channel", "measured");
        assertThat(bad.status()).isEqualTo(2);
        assertThat(bad.err()).contains("--channel: must be auto, analytic or simulated");
        CliRun badM = PlanCommandTest.run("plan", f.toString(), "--channel", "simulated",
                "--molecules-per-emitter", "0", "--cache-dir", dir.toString());
        assertThat(badM.status()).isEqualTo(2);
    }
}
