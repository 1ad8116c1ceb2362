package dev.nanoplan.cli;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.ScenarioReader;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** {@code nanoplan improve}: JSON keys, the written file, the report with ghosts, bad input. */
class ImproveCommandTest {

    /** One sensor 10 µm from a fixed gateway that misses the 1 % error target with 8 molecules per symbol. */
    private static final String WEAK = PlanCommandTest.SMALL
            .replace("\"molecules_per_symbol\": 2000", "\"molecules_per_symbol\": 8")
            .replace("[30, 50, 50]", "[40, 50, 50]")
            .replace("\"species\": \"A\"}],", "\"species\": \"A\", \"fixed\": true}],")
            .replace("\"demands\": [{\"from\": \"s1\", \"to\": \"gw\"}]}", "\"demands\": [{\"from\": \"s1\", \"to\": \"gw\"}],"
                    + " \"targets\": {\"max_error_probability\": 0.01, \"min_rate_bits_per_s\": 0.1}}");

    @Test
    void jsonHasTheKeysOfTheIssueAndTheWrittenFileValidates(@TempDir Path dir) throws Exception {
        Path f = PlanCommandTest.write(dir, "weak.json", WEAK);
        Path out = dir.resolve("better.json");
        CliRun r = PlanCommandTest.run("improve", f.toString(), "--out", out.toString(), "--json",
                "--time-limit-s", "60", "--report", dir.resolve("rep").toString());
        assertThat(r.status()).as(r.err()).isZero();
        JsonNode root = new ObjectMapper().readTree(r.out());
        List<String> keys = new ArrayList<>();
        root.fieldNames().forEachRemaining(keys::add);
        // source: the key list of issue 14 (improve --json)
        assertThat(keys).contains("objective_before", "objective_after", "changes", "demands", "evaluations",
                "seconds", "seed");
        assertThat(root.get("objective_after").has("demands_meeting_targets")).isTrue();
        assertThat(root.get("objective_after").has("min_shared_rate_bits_per_s")).isTrue();
        assertThat(root.get("objective_after").has("molecules_per_s")).isTrue();
        assertThat(root.get("demands").get(0).has("shared_rate_after_bits_per_s")).isTrue();
        assertThat(root.get("objective_after").get("demands_meeting_targets").asInt())
                .isGreaterThan(root.get("objective_before").get("demands_meeting_targets").asInt());
        JsonNode change = root.get("changes").get(0);
        assertThat(change.get("node").asText()).isEqualTo("s1");
        assertThat(change.get("field").asText()).isEqualTo("molecules_per_symbol");
        // source: the strict file reader (the output is a valid nanoplan/1 scenario; the gateway stays fixed)
        Scenario back = ScenarioReader.strict().read(out);
        assertThat(back.nodesById().get("gw").fixed()).isTrue();
        assertThat(Files.readString(dir.resolve("rep").resolve("report.html"))).contains("<svg");
    }

    @Test
    void badOptionsAreOneLineWithExitTwo(@TempDir Path dir) throws Exception {
        Path f = PlanCommandTest.write(dir, "weak.json", WEAK);
        String out = dir.resolve("o.json").toString();
        for (String[] args : new String[][] {
            {"improve", f.toString(), "--out", out, "--allow", "teleport"},
            {"improve", f.toString(), "--out", out, "--time-limit-s", "0"},
            {"improve", f.toString(), "--out", out, "--max-new-relays", "-1"},
            {"improve", f.toString(), "--out", dir.toString()}}) {
            CliRun r = PlanCommandTest.run(args);
            assertThat(r.status()).as(String.join(" ", args)).isEqualTo(2);
            assertThat(r.err().strip().lines().count()).as(r.err()).isEqualTo(1);
            assertThat(r.err()).doesNotContain("Exception");
        }
        assertThat(PlanCommandTest.run("improve", f.toString(), "--out", out, "--allow", "teleport").err())
                .contains("--allow");
    }
}
