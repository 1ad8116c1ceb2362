package dev.nanoplan.sim;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.ObjectMapper;
import dev.nanoplan.network.ChannelEntry;
import dev.nanoplan.network.ChannelMatrix;
import dev.nanoplan.plan.LinkReport;
import dev.nanoplan.plan.NetworkPlanner;
import dev.nanoplan.plan.Plan;
import dev.nanoplan.plan.PlanOptions;
import dev.nanoplan.plan.PreviewPlanner;
import dev.nanoplan.report.PlanJson;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.ScenarioReader;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Set;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The auto channel: nothing changes on layouts the closed forms cover, and the simulated part equals a
 * simulation of every emitter with the same seed and molecules.
 */
class AutoChannelTest {

    private static final ObjectMapper MAPPER = new ObjectMapper();
    private static final double CUTOFF = PlanOptions.DEFAULT.cutoffMolecules();

    static Scenario bundled(String name) throws Exception {
        Path dir = Path.of("").toAbsolutePath();
        while (!Files.isDirectory(dir.resolve("scenarios"))) {
            dir = dir.getParent();
        }
        return ScenarioReader.strict().read(dir.resolve("scenarios").resolve(name + ".json"));
    }

    private static AutoChannel.Result auto(Scenario s, long molecules) {
        return AutoChannel.obtain(s, CUTOFF, SimulationSettings.of(molecules, 5).withThreads(2), null,
                (sc, st) -> new ParticleSimulator(st).simulate(sc, SimulationProgress.NONE, () -> false),
                () -> false, dt -> { });
    }

    private static String json(Plan p) throws Exception {
        return MAPPER.writeValueAsString(PlanJson.of(p));
    }

    @Test
    void stillLayoutsTheClosedFormsCoverPlanByteForByteAsTheAnalyticChannel() throws Exception {
        // source: the analytic plan itself (auto must not change a covered layout, issue 12)
        for (Scenario s : List.of(bundled("relay-chain-direct"), bundled("culture-tank-round-robin"))) {
            AutoChannel.Result r = auto(s, 1000);
            assertThat(r.decision().analyticOnly()).as(s.name()).isTrue();
            assertThat(r.obtained()).isNull();
            assertThat(json(NetworkPlanner.plan(s, PlanOptions.DEFAULT.withChannel(r.channel()))))
                    .isEqualTo(json(NetworkPlanner.plan(s, PlanOptions.DEFAULT)));
            if (PreviewPlanner.supports(s)) {
                assertThat(json(PreviewPlanner.plan(s, PlanOptions.DEFAULT.withChannel(r.channel()))))
                        .isEqualTo(json(PreviewPlanner.plan(s, PlanOptions.DEFAULT)));
            }
        }
        // the culture tank's walls and neighbours pass the tests too: nothing to simulate
        assertThat(AutoChannel.decide(bundled("culture-tank"), CUTOFF).analyticOnly()).isTrue();
    }

    @Test
    void vesselSegmentUnderAutoEqualsTheSimulatedChannelWithTheSameSeedAndMolecules() throws Exception {
        Scenario s = bundled("vessel-segment");
        AutoChannel.Result r = auto(s, 2000);
        assertThat(r.decision().toSimulate().keySet()).containsExactly("s1", "s2", "s3", "s4", "s5");
        assertThat(r.decision().toSimulate().get("s1")).contains("flow: Péclet number");
        // source: an independent run of every emitter (what plan --channel simulated uses)
        ChannelMatrix all = SimulatedChannelMatrix.of(ParticleSimulator.simulate(s,
                SimulationSettings.of(2000, 5).withThreads(1)));
        assertThat(r.channel().size()).isEqualTo(all.size());
        for (ChannelEntry e : all.entries()) {
            assertThat(r.channel().taps(e.emitter(), e.receiver())).isEqualTo(e.taps());
            assertThat(r.channel().entry(e.emitter(), e.receiver()).source()).isEqualTo(ChannelMatrix.SIMULATED);
        }
        Plan a = NetworkPlanner.plan(s, PlanOptions.DEFAULT.withChannel(r.channel()));
        Plan b = NetworkPlanner.plan(s, PlanOptions.DEFAULT.withChannel(all));
        assertThat(a.links()).hasSameSizeAs(b.links());
        for (int i = 0; i < a.links().size(); i++) {
            LinkReport x = a.links().get(i);
            LinkReport y = b.links().get(i);
            assertThat(x.withChannel(null, null)).isEqualTo(y.withChannel(null, null));
            assertThat(x.channel()).isEqualTo("simulated");
            assertThat(x.channelReason()).contains("Péclet");
        }
        assertThat(a.routes()).isEqualTo(b.routes());
    }

    @Test
    void anEmitterSimulatedAloneGetsTheTapsOfARunOfAllEmitters() throws Exception {
        // relay chain: relay1 sits between src and dst and shades src -> dst by more than 5 %
        Scenario s = bundled("relay-chain-relayed");
        AutoChannel.Result r = auto(s, 3000);
        assertThat(r.decision().toSimulate().keySet()).containsExactly("src");
        // source: the full simulation with the same seed (streams are per emitter index)
        SimulatedChannel full = ParticleSimulator.simulate(s, SimulationSettings.of(3000, 5).withThreads(2));
        SimulatedChannel one = ParticleSimulator.simulate(s, SimulationSettings.of(3000, 5).withThreads(1)
                .withEmitters(Set.of("src")));
        assertThat(one.emitterIds()).containsExactly("src");
        assertThat(one.taps("src", "dst").orElseThrow()).isEqualTo(full.taps("src", "dst").orElseThrow());
        assertThat(one.taps("src", "relay1").orElseThrow()).isEqualTo(full.taps("src", "relay1").orElseThrow());
        // the other emitters keep their closed forms, with the test's verdict
        ChannelEntry kept = r.channel().entry("relay1", "relay2");
        assertThat(kept.source()).isEqualTo(ChannelMatrix.ANALYTIC);
        assertThat(kept.channelReason()).startsWith("closed form holds");
        assertThat(r.channel().entry("src", "dst").channelReason()).contains("other absorbers take up to");
    }

    @Test
    void aCachedSubsetRunIsReadBackWithItsEmitters(@TempDir Path dir) throws Exception {
        Scenario s = bundled("relay-chain-relayed");
        ChannelCache cache = new ChannelCache(dir);
        SimulationSettings settings = SimulationSettings.of(1000, 2).withThreads(1);
        AutoChannel.Result first = AutoChannel.obtain(s, CUTOFF, settings, cache,
                (sc, st) -> new ParticleSimulator(st).simulate(sc, SimulationProgress.NONE, () -> false),
                () -> false, dt -> { });
        assertThat(first.obtained().stored()).isTrue();
        AutoChannel.Result second = AutoChannel.obtain(s, CUTOFF, settings, cache, (sc, st) -> {
            throw new AssertionError("the cache holds this run");
        }, () -> false, dt -> { });
        assertThat(second.obtained().fromCache()).isTrue();
        assertThat(second.channel().entries()).isEqualTo(first.channel().entries());
    }
}
