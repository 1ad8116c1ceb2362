package dev.nanoplan.sim;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.offset;

import dev.nanoplan.geometry.Vec3;
import dev.nanoplan.geometry.Volume;
import dev.nanoplan.network.AnalyticChannel;
import dev.nanoplan.network.ChannelApplicability;
import dev.nanoplan.network.ChannelEntry;
import dev.nanoplan.network.ChannelMatrix;
import dev.nanoplan.scenario.Flow;
import dev.nanoplan.scenario.Medium;
import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.Species;
import dev.nanoplan.scenario.Targets;
import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * The closed forms' validity test ({@link ChannelApplicability}) against the particle simulator, an
 * independent computation of the same physics: where the test says a wall or a neighbour matters the
 * simulated catch differs from the closed form by more than its tolerance, where it says they do not the
 * two agree, and the shading bound is an upper bound.
 */
class ChannelApplicabilityValidationTest {

    private static final double CUTOFF = 1e-3;

    private static double simulatedCatch(Scenario s, long molecules, String to) {
        SimulatedChannel ch = ParticleSimulator.simulate(s, SimulationSettings.of(molecules, 11).withThreads(2));
        SimulatedTaps t = ch.taps("tx", to).orElseThrow();
        return t.absorbedTotal() / (double) t.moleculesSimulated();
    }

    @Test
    void pecletNumberIsSpeedTimesTheLongerLengthOverDiffusion() {
        Scenario s = Layouts.pair(new Volume.Open(), new Flow.Uniform(new Vec3(2, 0, 0)), 20, 2, 100,
                Double.POSITIVE_INFINITY, 0.5, 3);
        ChannelApplicability t = ChannelApplicability.of(s);
        Species a = s.species().get(0);
        // definition Pe = v L / D (H. Bruus, Theoretical Microfluidics, 2008); L = max(d, sqrt(4 D H)),
        // H = 4 x 0.5 s: sqrt(800) = 28.28 µm > 20 µm
        assertThat(t.peclet(20, a)).isCloseTo(2 * Math.sqrt(4 * 100 * 2.0) / 100, offset(1e-12));
        assertThat(t.peclet(50, a)).isCloseTo(2 * 50 / 100.0, offset(1e-12));
        ChannelMatrix m = AnalyticChannel.build(s, CUTOFF);
        assertThat(AnalyticChannel.covered(m.entries().get(0))).isFalse();
        assertThat(m.entries().get(0).channelReason()).contains("flow: Péclet number 0.566 > 0.1");
    }

    @Test
    void aNearWallFailsTheTestAndTheSimulationShowsTheExcess() {
        // emitter and receiver 3 µm from the bottom plane of a box: the mirror image is close
        Scenario s = boxPair(3);
        ChannelEntry e = AnalyticChannel.build(s, CUTOFF).entry("tx", "rx");
        assertThat(AnalyticChannel.covered(e)).as(e.channelReason()).isFalse();
        double closed = e.tapSum();
        double sim = simulatedCatch(s, 20_000, "rx");
        double se = Math.sqrt(sim * (1 - sim) / 20_000);
        // source: the particle simulator (reflecting wall); the excess is beyond 5 % and 3 standard errors
        assertThat(sim - closed).isGreaterThan(Math.max(0.05 * closed, 3 * se));
    }

    @Test
    void aFarWallPassesTheTestAndTheSimulationAgrees() {
        Scenario s = boxPair(60);
        ChannelEntry e = AnalyticChannel.build(s, CUTOFF).entry("tx", "rx");
        assertThat(AnalyticChannel.covered(e)).as(e.channelReason()).isTrue();
        double closed = e.tapSum();
        double sim = simulatedCatch(s, 20_000, "rx");
        double se = Math.sqrt(sim * (1 - sim) / 20_000);
        // source: the particle simulator; within the test's 5 % plus 3 standard errors
        assertThat(Math.abs(sim - closed)).isLessThanOrEqualTo(0.05 * closed + 3 * se);
    }

    @Test
    void theShadingBoundIsAnUpperBoundOnWhatTheShieldTakes() {
        List<Node> nodes = List.of(Node.transmitter("tx", Vec3.ZERO, 0.5, "A", 1000),
                Node.receiver("shield", new Vec3(5, 0, 0), 2, "A"),
                Node.receiver("rx", new Vec3(12, 0, 0), 3, "A"));
        Scenario s = new Scenario("shade", new Volume.Open(), Medium.DEFAULT, List.of(Species.stable("A", 100)),
                Layouts.signalling(0.2, 2), nodes, List.of(), Targets.DEFAULT);
        ChannelMatrix m = AnalyticChannel.build(s, CUTOFF);
        ChannelEntry e = m.entry("tx", "rx");
        assertThat(AnalyticChannel.covered(e)).isFalse();
        double closed = e.tapSum();
        // the bound of the class comment, recomputed by hand: F(tx -> shield, H) x r / (d - r_shield)
        double bound = m.entry("tx", "shield").tapSum() * 3 / (7 - 2.0);
        double sim = simulatedCatch(s, 20_000, "rx");
        double se = Math.sqrt(sim * (1 - sim) / 20_000);
        // source: the particle simulator; the shield takes less than the bound (3 standard errors of slack)
        assertThat(closed - sim).isLessThanOrEqualTo(bound + 3 * se);
        assertThat(closed - sim).isGreaterThan(0.05 * closed);
    }

    /** A pair 12 µm apart, both {@code heightUm} above the bottom of a 200 µm box. */
    private static Scenario boxPair(double heightUm) {
        List<Node> nodes = List.of(Node.transmitter("tx", new Vec3(94, 100, heightUm), 0.5, "A", 1000),
                Node.receiver("rx", new Vec3(106, 100, heightUm), 2.5, "A"));
        return new Scenario("wall", new Volume.Box(Vec3.ZERO, new Vec3(200, 200, 200)), Medium.DEFAULT,
                List.of(Species.stable("A", 100)), Layouts.signalling(0.2, 2), nodes, List.of(), Targets.DEFAULT);
    }
}
