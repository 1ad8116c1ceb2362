package dev.nanoplan.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class ValidateCommandTest {

    @Test
    void validFileSaysOkWithCounts(@TempDir Path dir) throws Exception {
        Path f = PlanCommandTest.write(dir, "small.json", PlanCommandTest.SMALL);
        CliRun r = PlanCommandTest.run("validate", f.toString());
        assertThat(r.status()).as(r.err()).isZero();
        assertThat(r.out()).isEqualTo("ok: two nodes: 2 nodes, 1 demands" + System.lineSeparator());
        assertThat(r.err()).isEmpty();
    }

    @Test
    void problemsGoToStderrWithExitTwo(@TempDir Path dir) throws Exception {
        Path f = PlanCommandTest.write(dir, "bad.json", PlanCommandTest.SMALL
                .replace("\"radius_um\": 5", "\"radius_um\": -2")
                .replace("{\"from\": \"s1\", \"to\": \"gw\"}", "{\"from\": \"s1\", \"to\": \"ghost\"}"));
        CliRun r = PlanCommandTest.run("validate", f.toString());
        assertThat(r.status()).isEqualTo(2);
        assertThat(r.out()).isEmpty();
        assertThat(r.err()).contains(f + ": nodes[1].radius_um");
        assertThat(r.err().lines().allMatch(l -> l.startsWith(f.toString()))).isTrue();
    }

    @Test
    void lenientTurnsUnknownFieldsIntoWarnings(@TempDir Path dir) throws Exception {
        Path f = PlanCommandTest.write(dir, "extra.json",
                PlanCommandTest.SMALL.replace("\"name\": \"two nodes\",", "\"name\": \"two nodes\", \"colour\": 3,"));
        assertThat(PlanCommandTest.run("validate", f.toString()).status()).isEqualTo(2);
        CliRun r = PlanCommandTest.run("validate", f.toString(), "--lenient");
        assertThat(r.status()).as(r.err()).isZero();
        assertThat(r.out()).startsWith("ok: two nodes: 2 nodes, 1 demands").contains("warning").contains("colour");
    }

    @Test
    void missingFileAndBadUsage(@TempDir Path dir) {
        CliRun r = PlanCommandTest.run("validate", dir.resolve("absent.json").toString());
        assertThat(r.status()).isEqualTo(2);
        assertThat(r.err().strip().lines().count()).isEqualTo(1);
        assertThat(PlanCommandTest.run("validate", "--bogus").status()).isEqualTo(2);
        assertThat(PlanCommandTest.run("validate").status()).isEqualTo(2);
    }
}
