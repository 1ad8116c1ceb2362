package dev.nanoplan.sim;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import dev.nanoplan.geometry.Vec3;
import dev.nanoplan.geometry.Volume;
import dev.nanoplan.network.ChannelEntry;
import dev.nanoplan.network.ChannelMatrix;
import dev.nanoplan.physics.OpenSphereHitting;
import dev.nanoplan.scenario.Medium;
import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.Species;
import dev.nanoplan.scenario.Targets;
import java.util.List;
import org.assertj.core.data.Offset;
import org.junit.jupiter.api.Test;

class SimulatedChannelMatrixTest {

    @Test
    void oneEntryPerSensingPairWithTheSimulatedTaps() {
        List<Node> nodes = List.of(
                Node.transmitter("tx", Vec3.ZERO, 1, "A", 100),
                Node.receiver("b", new Vec3(4, 0, 0), 2, "B"),
                Node.relay("relay", new Vec3(-6, 0, 0), 2, "A", "A", 100),
                Node.receiver("a", new Vec3(0, 8, 0), 3, "A"));
        Scenario s = new Scenario("transparency", new Volume.Open(), Medium.DEFAULT,
                List.of(Species.stable("A", 100), Species.stable("B", 100)), Layouts.signalling(0.05, 1), nodes,
                List.of(), Targets.DEFAULT);
        SimulatedChannel ch = ParticleSimulator.simulate(s, SimulationSettings.of(4_000, 5));
        ChannelMatrix m = SimulatedChannelMatrix.of(ch);
        // tx -> relay, tx -> a, relay -> a; not tx -> b (other species) nor relay -> relay (own releases)
        assertThat(m.entries()).extracting(e -> e.emitter() + ">" + e.receiver())
                .containsExactly("tx>relay", "tx>a", "relay>a");
        assertThat(m.entry("tx", "b")).isNull();
        assertThat(m.source()).isEqualTo(ChannelMatrix.SIMULATED);
        for (ChannelEntry e : m.entries()) {
            assertThat(e.species()).isEqualTo("A");
            assertThat(e.modelCaveat()).isNull();
            SimulatedTaps t = ch.taps(e.emitter(), e.receiver()).orElseThrow();
            assertThat(e.taps()).containsExactly(t.taps());
            assertThat(e.tapSum()).isEqualTo((double) t.absorbedTotal() / 4_000, Offset.offset(1e-12));
        }
        assertThat(m.notes()).anyMatch(n -> n.contains("4000 molecules per emitter") && n.contains("seed 5"));
    }

    @Test
    void tapsOfAnOpenPairMatchTheFirstPassageClosedForm() {
        double d = 15;
        double r = 5;
        double diff = 100;
        double symbolTimeS = 0.1;
        int memory = 2;
        int mol = 20_000;
        ChannelMatrix m = SimulatedChannelMatrix.of(ParticleSimulator.simulate(
                Layouts.openPair(d, r, diff, symbolTimeS, memory), SimulationSettings.of(mol, 41)));
        OpenSphereHitting exact = OpenSphereHitting.of(d, r, diff);
        double[] taps = m.taps("tx", "rx");
        assertThat(taps).hasSize(memory + 1);
        for (int k = 0; k <= memory; k++) {
            double p = exact.cumulative((k + 1) * symbolTimeS) - exact.cumulative(k * symbolTimeS);
            double se = Math.sqrt(p * (1 - p) / mol);
            // S. Redner, A Guide to First-Passage Processes (2001), ch. 6: p_k = F((k+1)T) − F(kT),
            // F(t) = (r/d) erfc((d − r)/√(4Dt)); 4 binomial s.e. (false failure ~6e-5 per check)
            assertThat(Math.abs(taps[k] - p)).as("tap %d: %s vs %s", k, taps[k], p).isLessThan(4 * se);
        }
    }

    @Test
    void aPairThatCaughtNothingKeepsZeroTaps() {
        // d = 200 µm, r = 1 µm, D = 10 µm²/s, T = 0.01 s: F(2T) = (1/200) erfc(199/√0.8) ≈ 0 (Redner 2001)
        Scenario s = Layouts.openPair(200, 1, 10, 0.01, 1);
        SimulatedChannel ch = ParticleSimulator.simulate(s, SimulationSettings.of(500, 6).withTimeStepS(0.001));
        ChannelMatrix m = SimulatedChannelMatrix.of(ch);
        assertThat(m.size()).isEqualTo(1);
        assertThat(m.taps("tx", "rx")).containsExactly(0, 0);
        assertThat(m.notes()).anyMatch(n -> n.contains("1 pair(s) caught no molecule"));
    }

    @Test
    void anEmitterWithoutSimulatedMoleculesIsRejected() {
        Scenario s = Layouts.openPair(15, 5, 100, 0.1, 1);
        SimulatedChannel ch = new ParticleSimulator(SimulationSettings.of(5_000, 1))
                .simulate(s, SimulationProgress.NONE, () -> true);
        assertThat(ch.complete()).isFalse();
        assertThatThrownBy(() -> SimulatedChannelMatrix.of(ch)).isInstanceOf(IllegalArgumentException.class)
                .hasMessageContaining("tx");
    }
}
