package dev.nanoplan.sim;

import static org.assertj.core.api.Assertions.assertThat;

import dev.nanoplan.engine.LocalEngine;
import dev.nanoplan.engine.UnitResults;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.ScenarioReader;
import java.io.ByteArrayInputStream;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.ObjectInputStream;
import java.io.ObjectOutputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.OptionalDouble;
import org.junit.jupiter.api.Test;

class SimulationBlocksTest {

    private static final double DT_S = 2e-3;

    private static SimulationBlocks blocks(long molecules, long seed) {
        Scenario s = ParticleSimulatorTest.boxWithNineReceivers();
        return new SimulationBlocks(s, molecules, seed, DT_S, java.util.Set.of());
    }

    @Test
    void unitsAreBlocksOfEveryEmitterWithAPartialLastBlock() {
        SimulationBlocks b = blocks(10_000, 1);
        // ceil(10000 / 4096) = 3 blocks for the one emitter: 4096, 4096, 1808 molecules
        assertThat(b.count()).isEqualTo(3);
        assertThat(b.work(0)).isEqualTo(4096);
        assertThat(b.work(2)).isEqualTo(10_000 - 2 * 4096);
    }

    @Test
    void unitsComputedInAnyOrderOnFreshCopiesGiveTheSameChannel() throws Exception {
        SimulationBlocks b = blocks(10_000, 42);
        SimulatedChannel sequential = b.combine(new LocalEngine(1).run(b));
        // reverse order, each unit on a deserialised copy (as an executor of another machine would)
        List<BlockCounts> reversed = new ArrayList<>(Collections.nCopies(b.count(), (BlockCounts) null));
        for (int i = b.count() - 1; i >= 0; i--) {
            reversed.set(i, copy(b).compute(i, () -> false));
        }
        SimulatedChannel shuffled = b.combine(new UnitResults<>(reversed));
        assertThat(shuffled).isEqualTo(sequential);
        assertThat(b.combine(new LocalEngine(3).run(copy(b)))).isEqualTo(sequential);
    }

    @Test
    void aBlockDoesNotDependOnWhichBlocksItsThreadComputedBefore() {
        SimulationBlocks b = blocks(10_000, 9);
        BlockCounts direct = copy(b).compute(2, () -> false);
        SimulationBlocks warm = copy(b);
        warm.compute(0, () -> false);
        warm.compute(1, () -> false);
        assertThat(warm.compute(2, () -> false)).isEqualTo(direct);
    }

    @Test
    void theBundledRelayChainGivesTheCountsOfTheSimulatorBeforeItRanOnEngines() throws Exception {
        Path dir = Path.of("").toAbsolutePath();
        while (!Files.isDirectory(dir.resolve("scenarios"))) {
            dir = dir.getParent();
        }
        Scenario s = ScenarioReader.strict().read(dir.resolve("scenarios/relay-chain-relayed.json"));
        SimulationSettings settings = SimulationSettings.of(5_000, 7).withThreads(1);
        ParticleSimulator sim = new ParticleSimulator(settings);
        SimulatedChannel c = sim.simulate(s, new LocalEngine(2), SimulationProgress.NONE, () -> false);
        // counts printed by `nanoplan simulate scenarios/relay-chain-relayed.json --molecules-per-emitter 5000
        // --seed 7 --json` of commit 670aaad (the thread-pool simulator before work units), taps × 5000
        assertThat(c.taps("src", "relay1").orElseThrow().absorbedPerSlot()).startsWith(134, 7, 0);
        assertThat(c.taps("relay1", "relay2").orElseThrow().absorbedPerSlot()).startsWith(42, 2, 0);
        assertThat(c.taps("relay2", "relay1").orElseThrow().absorbedPerSlot()).startsWith(55, 6, 0);
        assertThat(c.taps("relay2", "dst").orElseThrow().absorbedPerSlot()).startsWith(144, 2, 0);
    }

    @Test
    void theEngineRunMatchesTheSimulatorWithItsOwnThreads() {
        SimulationSettings settings = new SimulationSettings(9_000, 5, OptionalDouble.of(DT_S), 2);
        Scenario s = ParticleSimulatorTest.boxWithNineReceivers();
        SimulatedChannel viaSimulator = ParticleSimulator.simulate(s, settings);
        ParticleSimulator sim = new ParticleSimulator(settings.withThreads(1));
        SimulatedChannel viaEngine = sim.simulate(s, new LocalEngine(3), SimulationProgress.NONE, () -> false);
        assertThat(viaEngine).isEqualTo(viaSimulator);
        assertThat(viaEngine.complete()).isTrue();
    }

    @SuppressWarnings("unchecked")
    static <T> T copy(T o) {
        try {
            ByteArrayOutputStream buf = new ByteArrayOutputStream();
            try (ObjectOutputStream out = new ObjectOutputStream(buf)) {
                out.writeObject(o);
            }
            try (ObjectInputStream in = new ObjectInputStream(new ByteArrayInputStream(buf.toByteArray()))) {
                return (T) in.readObject();
            }
        } catch (IOException | ClassNotFoundException e) {
            throw new AssertionError(e);
        }
    }
}
