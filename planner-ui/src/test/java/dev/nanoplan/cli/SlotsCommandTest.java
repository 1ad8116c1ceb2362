package dev.nanoplan.cli;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import dev.nanoplan.plan.NetworkPlanner;
import dev.nanoplan.plan.Plan;
import dev.nanoplan.plan.PlanOptions;
import dev.nanoplan.plan.SharedRates;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.ScenarioReader;
import dev.nanoplan.scenario.Schedule;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class SlotsCommandTest {

    /** Two transmitters close to one receiver: crosstalk-bound when they send together. */
    static final String TWO = """
            {"format": "nanoplan/1", "name": "two senders",
             "volume": {"shape": "open"},
             "species": [{"name": "A", "diffusion_um2_per_s": 80.0}],
             "signalling": {"symbol_time_s": 1.0, "isi_memory_symbols": 4},
             "nodes": [
               {"id": "s1", "role": "transmitter", "position_um": [12, 0, 0], "radius_um": 1,
                "species": "A", "molecules_per_symbol": 500},
               {"id": "s2", "role": "transmitter", "position_um": [-12, 0, 0], "radius_um": 1,
                "species": "A", "molecules_per_symbol": 500},
               {"id": "gw", "role": "receiver", "position_um": [0, 0, 0], "radius_um": 5, "species": "A"}],
             "demands": [{"from": "s1", "to": "gw"}, {"from": "s2", "to": "gw"}]}
            """;

    @Test
    void writesTheSlotPlanAndReportsWhatItsPlanGives(@TempDir Path dir) throws Exception {
        Path f = PlanCommandTest.write(dir, "two.json", TWO);
        Path out = dir.resolve("slotted.json");
        CliRun r = PlanCommandTest.run("slots", f.toString(), "--out", out.toString(), "--json");
        assertThat(r.status()).as(r.err()).isZero();
        JsonNode o = new ObjectMapper().readTree(r.out());
        assertThat(o.has("frame_slots")).isTrue();
        assertThat(o.get("slots").has("s1")).isTrue();
        assertThat(o.get("slots").has("s2")).isTrue();
        assertThat(o.get("conflict_edges").asInt()).isGreaterThanOrEqualTo(0);
        assertThat(o.get("demands")).hasSize(2);

        Scenario written = ScenarioReader.strict().load(out).scenario();
        assertThat(written.signalling().schedule()).isEqualTo(Schedule.SLOTS);
        Plan plan = NetworkPlanner.plan(written, PlanOptions.DEFAULT);
        List<SharedRates.Share> shares = SharedRates.of(plan);
        for (int i = 0; i < 2; i++) {
            JsonNode d = o.get("demands").get(i);
            // an independent plan of the written file gives the reported "after" numbers
            assertThat(d.get("shared_rate_after_bits_per_s").asDouble())
                    .isCloseTo(shares.get(i).rateBitsPerS(), within(1e-12));
            assertThat(d.get("capacity_after_bits").asDouble())
                    .isCloseTo(plan.routes().get(i).endToEndCapacityBits(), within(1e-12));
        }
    }

    @Test
    void badOptionsAreOneLineWithExitTwo(@TempDir Path dir) throws Exception {
        Path f = PlanCommandTest.write(dir, "two.json", TWO);
        CliRun r = PlanCommandTest.run("slots", f.toString(), "--out", dir.resolve("x.json").toString(),
                "--max-frame", "0");
        assertThat(r.status()).isEqualTo(2);
        assertThat(r.err().strip().lines().count()).isEqualTo(1);
        assertThat(r.err()).contains("--max-frame");
        assertThat(PlanCommandTest.run("slots", f.toString()).status()).isEqualTo(2);
    }
}
