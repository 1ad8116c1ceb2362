package dev.nanoplan.plan;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.ScenarioReader;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.CancellationException;
import org.junit.jupiter.api.Test;

/**
 * The progress told by {@link SlotAssignment#assign(Scenario, java.util.function.DoubleConsumer)}: the
 * usual contract of a progress callback (common practice: fractions in [0, 1], never going back, 1 at
 * the end), the same slot plan as without a callback, and a throw from the callback stopping the work.
 */
class SlotAssignmentProgressTest {

    static final Path RELAYED = Path.of("..", "scenarios", "relay-chain-relayed.json");

    @Test
    void progressRisesToOneAndLeavesTheResultAsWithoutIt() throws Exception {
        Scenario s = ScenarioReader.strict().read(RELAYED);
        SlotAssignment assignment = new SlotAssignment(PlanOptions.DEFAULT, 0, 60);
        List<Double> told = new ArrayList<>();
        SlotAssignment.Result with = assignment.assign(s, f -> {
            synchronized (told) {
                told.add(f);
            }
        });
        assertThat(told).isNotEmpty();
        assertThat(told).allSatisfy(f -> assertThat(f).isBetween(0.0, 1.0));
        assertThat(told.get(told.size() - 1)).isEqualTo(1.0);
        // the what-if steps come after the first plan's fifth, in order
        List<Double> after = told.stream().filter(f -> f > 0.2).toList();
        assertThat(after).isSorted();
        SlotAssignment.Result without = assignment.assign(s);
        assertThat(with.slots()).isEqualTo(without.slots());
        assertThat(with.frameSlots()).isEqualTo(without.frameSlots());
    }

    @Test
    void aThrowFromTheCallbackStopsTheAssignment() throws Exception {
        Scenario s = ScenarioReader.strict().read(RELAYED);
        assertThatThrownBy(() -> new SlotAssignment(PlanOptions.DEFAULT, 0, 60).assign(s, f -> {
            throw new CancellationException("stop");
        })).isInstanceOf(CancellationException.class);
    }
}
