package dev.nanoplan.cli;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The simulator guards of issue 12: a --dt above the accuracy bound the README states is refused (or
 * forced with a warning on every output), and links with too few hits are "insufficient molecules",
 * never flagged with a cause or a factor from noise.
 */
class SimulatorGuardsTest {

    private static final ObjectMapper MAPPER = new ObjectMapper();

    @Test
    void aStepOfOneSymbolIsRefusedWithTheLargestAllowedStep(@TempDir Path dir) throws Exception {
        Path f = Files.writeString(dir.resolve("pair.json"), SimulateCommandTest.PAIR);
        CliRun r = SimulateCommandTest.run("simulate", f.toString(), "--dt", "10");
        assertThat(r.status()).isEqualTo(2);
        // one line naming the option and the largest allowed step (the README's bound, TimeStepRule)
        assertThat(r.err().strip()).doesNotContain("\n").startsWith("nanoplan: --dt:")
                .contains("largest allowed step is").doesNotContain("Exception");
        CliRun plan = PlanCommandTest.run("plan", f.toString(), "--channel", "simulated", "--dt", "10",
                "--cache-dir", dir.resolve("cache").toString());
        assertThat(plan.status()).isEqualTo(2);
        assertThat(plan.err()).contains("--dt:").contains("largest allowed step is");
    }

    @Test
    void aForcedStepWarnsOnEveryOutput(@TempDir Path dir) throws Exception {
        Path f = Files.writeString(dir.resolve("pair.json"), SimulateCommandTest.PAIR);
        CliRun text = SimulateCommandTest.run("simulate", f.toString(), "--dt", "0.05", "--force-dt",
                "--molecules-per-emitter", "500");
        assertThat(text.status()).as(text.err()).isZero();
        assertThat(text.out()).startsWith("warning: --force-dt");
        CliRun json = SimulateCommandTest.run("simulate", f.toString(), "--dt", "0.05", "--force-dt",
                "--molecules-per-emitter", "500", "--json");
        assertThat(MAPPER.readTree(json.out()).get("warnings").get(0).asText()).startsWith("--force-dt");
        CliRun plan = PlanCommandTest.run("plan", f.toString(), "--channel", "simulated", "--dt", "0.05",
                "--force-dt", "--molecules-per-emitter", "500", "--json", "--cache-dir",
                dir.resolve("cache").toString());
        assertThat(plan.status()).as(plan.err()).isZero();
        JsonNode warnings = MAPPER.readTree(plan.out()).get("warnings");
        assertThat(warnings.get(0).asText()).startsWith("--force-dt");
    }

    @Test
    void oneMoleculePerEmitterIsInsufficientNotAFactor(@TempDir Path dir) throws Exception {
        Path f = Files.writeString(dir.resolve("pair.json"), SimulateCommandTest.PAIR);
        CliRun r = SimulateCommandTest.run("simulate", f.toString(), "--molecules-per-emitter", "1", "--json");
        assertThat(r.status()).as(r.err()).isZero();
        JsonNode link = MAPPER.readTree(r.out()).get("links").get(0);
        assertThat(link.get("flagged").asBoolean()).isFalse();
        assertThat(link.get("insufficient_molecules").asBoolean()).isTrue();
        assertThat(link.get("reason").asText()).startsWith("insufficient molecules").doesNotContain("factor");
        // 30 expected hits need M >= 30 / p (SimulationPrecision; p the closed form or 3/M, whichever is smaller)
        double p = Math.min(link.get("analytic_hit_probability").asDouble(), 3.0);
        if (link.get("simulated_hit_probability").asDouble() > 0) {
            p = link.get("simulated_hit_probability").asDouble();
        }
        assertThat(link.get("min_molecules_per_emitter").asLong()).isEqualTo((long) Math.ceil(30 / p));
        CliRun text = SimulateCommandTest.run("simulate", f.toString(), "--molecules-per-emitter", "1");
        assertThat(text.out()).contains("insufficient molecules").doesNotContain("FLAG");
    }
}
