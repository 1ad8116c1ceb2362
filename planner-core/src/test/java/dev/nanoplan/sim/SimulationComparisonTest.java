package dev.nanoplan.sim;

import static org.assertj.core.api.Assertions.assertThat;

import dev.nanoplan.geometry.Vec3;
import dev.nanoplan.geometry.Volume;
import dev.nanoplan.physics.OpenSphereHitting;
import dev.nanoplan.scenario.Flow;
import dev.nanoplan.scenario.Medium;
import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.Species;
import dev.nanoplan.scenario.Targets;
import java.util.List;
import org.assertj.core.data.Offset;
import org.junit.jupiter.api.Test;

class SimulationComparisonTest {

    @Test
    void openMediumLinkIsNotFlaggedAndMatchesTheClosedForm() {
        Scenario s = Layouts.openPair(15, 5, 100, 0.1, 2);
        SimulatedChannel ch = ParticleSimulator.simulate(s, SimulationSettings.of(20_000, 8));
        List<LinkComparison> links = SimulationComparison.compare(s, ch);
        assertThat(links).hasSize(1);
        LinkComparison c = links.get(0);
        // Redner 2001, ch. 6: F(T) = (r/d) erfc((d − r)/√(4DT))
        assertThat(c.analyticHitProbability()).isEqualTo(OpenSphereHitting.of(15, 5, 100).cumulative(0.1));
        assertThat(c.flagged()).isFalse();
        assertThat(Math.abs(c.zScore())).isLessThan(4);
        assertThat(c.zScore() * Math.sqrt(c.analyticHitProbability() * (1 - c.analyticHitProbability()) / 20_000))
                .isCloseTo(c.simulatedHitProbability() - c.analyticHitProbability(),
                        Offset.offset(1e-12));
        assertThat(c.simulatedTaps()).hasSize(3);
        assertThat(c.reason()).contains("agrees");
    }

    @Test
    void tightBoxRaisesTheLinkAndIsFlaggedAsWalls() {
        // a 30 µm cube around a far pair: the eventual open-medium catch r/d = 1/4 becomes 1 in a closed box,
        // so by T = 1 s (well past the box mixing time L²/(π²D) ≈ 0.9 s) walls must raise F(T) a lot
        Scenario s = Layouts.pair(new Volume.Box(new Vec3(-10, -15, -15), new Vec3(20, 15, 15)), new Flow.None(),
                12, 3, 100, Double.POSITIVE_INFINITY, 1.0, 0);
        SimulatedChannel ch = new ParticleSimulator(SimulationSettings.of(8_000, 9).withTimeStepS(2e-3))
                .simulate(s, SimulationProgress.NONE, () -> false);
        LinkComparison c = SimulationComparison.compare(s, ch).get(0);
        assertThat(c.simulatedHitProbability()).isGreaterThan(c.analyticHitProbability());
        assertThat(c.flagged()).isTrue();
        assertThat(c.reason()).startsWith("walls raise this link by ");
    }

    @Test
    void shadingReceiverLowersTheLink() {
        // a second receiver of the same species between emitter and target absorbs much of what would arrive
        // (40,000 molecules: the shaded link keeps well over SimulationPrecision.MIN_HITS hits)
        List<Node> nodes = List.of(Node.transmitter("tx", Vec3.ZERO, 0.5, "A", 100),
                Node.receiver("shield", new Vec3(5, 0, 0), 3, "A"),
                Node.receiver("rx", new Vec3(12, 0, 0), 3, "A"));
        Scenario s = new Scenario("shade", new Volume.Open(), Medium.DEFAULT, List.of(Species.stable("A", 100)),
                Layouts.signalling(0.2, 0), nodes, List.of(), Targets.DEFAULT);
        SimulatedChannel ch = new ParticleSimulator(SimulationSettings.of(40_000, 10).withTimeStepS(2e-3))
                .simulate(s, SimulationProgress.NONE, () -> false);
        LinkComparison c = SimulationComparison.compare(s, ch).stream().filter(l -> l.to().equals("rx")).findFirst()
                .orElseThrow();
        assertThat(c.flagged()).isTrue();
        assertThat(c.relativeDifference()).isNegative();
        assertThat(c.reason()).startsWith("shading by 1 other receiver lowers this link by ");
    }

    @Test
    void emitterWithNothingSimulatedIsReportedAsNotSimulated() {
        Scenario s = Layouts.openPair(15, 5, 100, 0.1, 1);
        SimulatedTaps none = new SimulatedTaps("tx", "rx", true, 0, new long[2]);
        SimulatedChannel ch = new SimulatedChannel(List.of("tx"), List.of("rx"), 0.1, 1, 1e-3, 1, 1000, false,
                List.of(new EmitterRun("tx", "A", 0, 0, 0, List.of(none))));
        LinkComparison c = SimulationComparison.compare(s, ch).get(0);
        assertThat(c.simulatedHitProbability()).isNaN();
        assertThat(c.flagged()).isFalse();
        assertThat(c.simulatedTaps()).isEmpty();
        assertThat(c.reason()).startsWith("not simulated");
    }
}
