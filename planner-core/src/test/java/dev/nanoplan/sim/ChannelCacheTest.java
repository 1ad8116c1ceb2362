package dev.nanoplan.sim;

import static org.assertj.core.api.Assertions.assertThat;

import dev.nanoplan.geometry.Vec3;
import dev.nanoplan.geometry.Volume;
import dev.nanoplan.scenario.Demand;
import dev.nanoplan.scenario.Flow;
import dev.nanoplan.scenario.Medium;
import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.Species;
import dev.nanoplan.scenario.Targets;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import java.util.concurrent.atomic.AtomicInteger;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class ChannelCacheTest {

    private static Scenario layout(String name, long molecules, double rxX, double rxRadius, String txId,
            Targets targets, double backgroundPerS) {
        return new Scenario(name, new Volume.Open(), new Medium(310.15, 0.69, new Flow.None(),
                backgroundPerS), List.of(Species.stable("A", 100)), Layouts.signalling(0.05, 2),
                List.of(Node.transmitter(txId, Vec3.ZERO, 1, "A", molecules),
                        Node.receiver("rx", new Vec3(rxX, 0, 0), rxRadius, "A")),
                List.of(new Demand(txId, "rx")), targets);
    }

    private static Scenario base() {
        return layout("base", 1000, 10, 3, "tx", Targets.DEFAULT, 0);
    }

    private static String key(Scenario s) {
        return ChannelCache.key(s, 10_000, 7, 1e-4);
    }

    @Test
    void keyIgnoresBudgetsTargetsNamesAndBackgroundButNotGeometry() {
        String k = key(base());
        assertThat(k).hasSize(64).matches("[0-9a-f]+");
        assertThat(key(layout("other name", 1_000_000, 10, 3, "sensor", new Targets(1e-6, 5, 60), 3.0)))
                .isEqualTo(k);
        assertThat(key(layout("base", 1000, 10.5, 3, "tx", Targets.DEFAULT, 0))).isNotEqualTo(k);
        assertThat(key(layout("base", 1000, 10, 3.5, "tx", Targets.DEFAULT, 0))).isNotEqualTo(k);
        assertThat(ChannelCache.key(base(), 10_001, 7, 1e-4)).isNotEqualTo(k);
        assertThat(ChannelCache.key(base(), 10_000, 8, 1e-4)).isNotEqualTo(k);
        assertThat(ChannelCache.key(base(), 10_000, 7, 2e-4)).isNotEqualTo(k);
    }

    @Test
    void secondLookupIsServedFromDiskWithoutSimulating(@TempDir Path dir) throws Exception {
        ChannelCache cache = new ChannelCache(dir.resolve("channels"));
        SimulationSettings settings = SimulationSettings.of(3_000, 9);
        AtomicInteger runs = new AtomicInteger();
        ChannelCache.Simulation sim = s -> {
            runs.incrementAndGet();
            return ParticleSimulator.simulate(s, settings);
        };
        ChannelCache.Lookup first = cache.getOrSimulate(base(), settings, sim);
        assertThat(first.hit()).isFalse();
        assertThat(first.stored()).isTrue();
        assertThat(Files.isRegularFile(first.file())).isTrue();
        // another budget, other targets and renamed transmitter: same physics, so a hit
        Scenario replanned = layout("renamed", 50_000, 10, 3, "sensor", new Targets(1e-5, 1, 10), 1.0);
        ChannelCache.Lookup second = cache.getOrSimulate(replanned, settings, sim);
        assertThat(second.hit()).isTrue();
        assertThat(runs.get()).isEqualTo(1);
        assertThat(second.channel().emitterIds()).containsExactly("sensor");
        assertThat(second.channel().taps("sensor", "rx").orElseThrow().absorbedPerSlot())
                .containsExactly(first.channel().taps("tx", "rx").orElseThrow().absorbedPerSlot());
        assertThat(second.channel().timeStepS()).isEqualTo(first.channel().timeStepS());
        assertThat(second.channel().emitters().get(0).neverAbsorbed())
                .isEqualTo(first.channel().emitters().get(0).neverAbsorbed());
        // a moved receiver is a miss
        cache.getOrSimulate(layout("base", 1000, 12, 3, "tx", Targets.DEFAULT, 0), settings, sim);
        assertThat(runs.get()).isEqualTo(2);
    }

    @Test
    void aDamagedFileIsAMissAndAnIncompleteRunIsNotStored(@TempDir Path dir) throws Exception {
        ChannelCache cache = new ChannelCache(dir);
        SimulationSettings settings = SimulationSettings.of(2_000, 3);
        double dt = new ParticleSimulator(settings).timeStepS(base());
        Path file = cache.file(ChannelCache.key(base(), 2_000, 3, dt));
        Files.writeString(file, "{\"format\":\"nanoplan-channel/1\",\"emitters\":[", StandardCharsets.UTF_8);
        AtomicInteger runs = new AtomicInteger();
        ChannelCache.Lookup cancelled = cache.getOrSimulate(base(), settings, s -> {
            runs.incrementAndGet();
            return new ParticleSimulator(settings).simulate(s, SimulationProgress.NONE, () -> true);
        });
        assertThat(cancelled.hit()).isFalse();
        assertThat(cancelled.stored()).isFalse();
        assertThat(runs.get()).isEqualTo(1);
        assertThat(cache.load(base(), ChannelCache.key(base(), 2_000, 3, dt))).isEmpty();
    }

    @Test
    void obtainReSimulatesOnRequestAndReplacesTheStoredChannel(@TempDir Path dir) {
        ChannelCache cache = new ChannelCache(dir);
        SimulationSettings settings = SimulationSettings.of(2_000, 5);
        AtomicInteger runs = new AtomicInteger();
        AtomicInteger misses = new AtomicInteger();
        ChannelCache.Simulation sim = s -> {
            runs.incrementAndGet();
            return ParticleSimulator.simulate(s, settings);
        };
        SimulatedChannels.Obtained first = SimulatedChannels.obtain(base(), settings, cache, false, sim, () -> false,
                dt -> misses.incrementAndGet());
        assertThat(first.source()).isEqualTo("simulated, cached");
        SimulatedChannels.Obtained again = SimulatedChannels.obtain(base(), settings, cache, false, sim, () -> false,
                dt -> misses.incrementAndGet());
        assertThat(again.fromCache()).isTrue();
        assertThat(again.source()).isEqualTo("from cache");
        SimulatedChannels.Obtained forced = SimulatedChannels.obtain(base(), settings, cache, true, sim, () -> false,
                dt -> misses.incrementAndGet());
        assertThat(forced.fromCache()).isFalse();
        assertThat(forced.stored()).isTrue();
        assertThat(forced.source()).isEqualTo("re-simulated, cache updated");
        assertThat(runs.get()).isEqualTo(2);
        assertThat(misses.get()).isEqualTo(2);
        assertThat(forced.file()).isEqualTo(first.file());
    }

    @Test
    void obtainWithoutACacheOnlySimulatesAndAFailedStoreIsReportedNotThrown(@TempDir Path dir) throws Exception {
        SimulationSettings settings = SimulationSettings.of(2_000, 5);
        ChannelCache.Simulation sim = s -> ParticleSimulator.simulate(s, settings);
        SimulatedChannels.Obtained none = SimulatedChannels.obtain(base(), settings, null, false, sim, () -> false,
                dt -> { });
        assertThat(none.file()).isNull();
        assertThat(none.stored()).isFalse();
        assertThat(none.source()).isEqualTo("simulated");
        // the cache folder is a regular file, so the store fails
        Path notADir = Files.writeString(dir.resolve("file"), "x", StandardCharsets.UTF_8);
        SimulatedChannels.Obtained failed = SimulatedChannels.obtain(base(), settings, new ChannelCache(notADir), false,
                sim, () -> false, dt -> { });
        assertThat(failed.channel().complete()).isTrue();
        assertThat(failed.storeFailure()).isNotNull();
        assertThat(failed.source()).startsWith("simulated (not cached: ");
        // a run that completed after the caller gave up is not stored
        ChannelCache cache = new ChannelCache(dir.resolve("channels"));
        SimulatedChannels.Obtained late = SimulatedChannels.obtain(base(), settings, cache, false, sim, () -> true,
                dt -> { });
        assertThat(late.stored()).isFalse();
        assertThat(Files.exists(late.file())).isFalse();
    }

    @Test
    void defaultDirectoryFollowsTheEnvironment() {
        assertThat(ChannelCache.defaultDirectory(Map.of(ChannelCache.ENV_DIR, "/tmp/c"), "/home/u"))
                .isEqualTo(Path.of("/tmp/c"));
        assertThat(ChannelCache.defaultDirectory(Map.of(), "/home/u"))
                .isEqualTo(Path.of("/home/u", ".cache", "nanoplan", "channels"));
    }
}
