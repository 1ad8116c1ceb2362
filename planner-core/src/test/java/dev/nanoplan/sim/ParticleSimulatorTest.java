package dev.nanoplan.sim;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import dev.nanoplan.geometry.Vec3;
import dev.nanoplan.geometry.Volume;
import dev.nanoplan.scenario.Flow;
import dev.nanoplan.scenario.Medium;
import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.Species;
import dev.nanoplan.scenario.Targets;
import java.util.ArrayList;
import java.util.List;
import java.util.OptionalDouble;
import java.util.concurrent.atomic.AtomicInteger;
import java.util.concurrent.atomic.AtomicLong;
import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.simple.RandomSource;
import org.assertj.core.data.Offset;
import org.junit.jupiter.api.Test;

class ParticleSimulatorTest {

    /** A box with one transmitter and a 3×3 grid of receivers (more than the direct-scan limit). */
    static Scenario boxWithNineReceivers() {
        List<Node> nodes = new ArrayList<>();
        nodes.add(Node.transmitter("tx", new Vec3(30, 30, 30), 1, "A", 1000));
        for (int i = 0; i < 3; i++) {
            for (int j = 0; j < 3; j++) {
                if (i == 1 && j == 1) {
                    continue;
                }
                nodes.add(Node.receiver("r" + i + j, new Vec3(15 + 15 * i, 15 + 15 * j, 30), 3, "A"));
            }
        }
        nodes.add(Node.receiver("top", new Vec3(30, 30, 45), 3, "A"));
        return new Scenario("nine", new Volume.Box(Vec3.ZERO, new Vec3(60, 60, 60)), Medium.DEFAULT,
                List.of(Species.stable("A", 100)), Layouts.signalling(0.2, 2), nodes, List.of(), Targets.DEFAULT);
    }

    @Test
    void sameSeedGivesIdenticalCountsWithOneOrTwoThreads() {
        Scenario s = boxWithNineReceivers();
        // 2.5 blocks: the last block is partial
        SimulationSettings one = new SimulationSettings(10_000, 42, OptionalDouble.of(2e-3), 1);
        SimulatedChannel a = ParticleSimulator.simulate(s, one);
        SimulatedChannel b = ParticleSimulator.simulate(s, one.withThreads(2));
        SimulatedChannel c = ParticleSimulator.simulate(s, new SimulationSettings(10_000, 43,
                OptionalDouble.of(2e-3), 2));
        long differences = 0;
        for (String rx : a.receiverIds()) {
            long[] ca = a.taps("tx", rx).orElseThrow().absorbedPerSlot();
            assertThat(b.taps("tx", rx).orElseThrow().absorbedPerSlot()).isEqualTo(ca);
            long[] cc = c.taps("tx", rx).orElseThrow().absorbedPerSlot();
            for (int k = 0; k < ca.length; k++) {
                differences += Math.abs(ca[k] - cc[k]);
            }
        }
        assertThat(b.emitters().get(0).moleculeSteps()).isEqualTo(a.emitters().get(0).moleculeSteps());
        // another seed gives other counts (the check above can fail)
        assertThat(differences).isPositive();
        assertThat(a.emitters().get(0).moleculesSimulated()).isEqualTo(10_000);
        long absorbed = a.emitters().get(0).receivers().stream().mapToLong(SimulatedTaps::absorbedTotal).sum();
        assertThat(absorbed + a.emitters().get(0).neverAbsorbed()).isEqualTo(10_000);
    }

    @Test
    void halvingTheAutomaticTimeStepChangesHitProbabilityByLessThanFourCombinedStandardErrors() {
        Scenario s = Layouts.openPair(15, 5, 100, 0.1, 1);
        int m = 40_000;
        SimulationSettings auto = SimulationSettings.of(m, 31);
        double dt = new ParticleSimulator(auto).timeStepS(s);
        SimulatedTaps a = ParticleSimulator.simulate(s, auto).taps("tx", "rx").orElseThrow();
        SimulatedTaps b = ParticleSimulator.simulate(s, new SimulationSettings(m, 32,
                OptionalDouble.of(dt / 2), 2)).taps("tx", "rx").orElseThrow();
        double[] ca = Layouts.cumulative(a);
        double[] cb = Layouts.cumulative(b);
        for (int k = 0; k < ca.length; k++) {
            double se = Math.sqrt(ca[k] * (1 - ca[k]) / m + cb[k] * (1 - cb[k]) / m);
            // stated tolerance: |F_Δt − F_Δt/2| < 4 combined s.e. (independent seeds; false failure ~6e-5 per check)
            assertThat(Math.abs(ca[k] - cb[k])).isLessThan(4 * se);
        }
    }

    @Test
    void halvingTheAutomaticStepForASmallReceiverChangesHitFractionsByLessThanFourCombinedStandardErrors() {
        // r = 1 µm, d = 3 µm, D = 100 µm²/s, T = 0.02 s: the automatic step is set by the radius
        // rule, √(6DΔt) = STEP_FRACTION × 1 µm (T/50 = 4e-4 s is longer)
        Scenario s = Layouts.openPair(3, 1, 100, 0.02, 2);
        int m = 40_000;
        SimulationSettings auto = SimulationSettings.of(m, 33);
        double dt = new ParticleSimulator(auto).timeStepS(s);
        assertThat(Math.sqrt(6 * 100 * dt)).isCloseTo(TimeStepRule.STEP_FRACTION, Offset.offset(0.01));
        SimulatedTaps a = ParticleSimulator.simulate(s, auto).taps("tx", "rx").orElseThrow();
        SimulatedTaps b = ParticleSimulator.simulate(s, new SimulationSettings(m, 34,
                OptionalDouble.of(dt / 2), 2)).taps("tx", "rx").orElseThrow();
        double[] ca = Layouts.cumulative(a);
        double[] cb = Layouts.cumulative(b);
        for (int k = 0; k < ca.length; k++) {
            double se = Math.sqrt(ca[k] * (1 - ca[k]) / m + cb[k] * (1 - cb[k]) / m);
            // stated tolerance: |F_Δt − F_Δt/2| < 4 combined s.e. (independent seeds; false failure ~6e-5 per check)
            assertThat(Math.abs(ca[k] - cb[k])).as("slot %d", k).isLessThan(4 * se);
        }
    }

    @Test
    void otherSpeciesAndARelaysOwnReleasesPassThrough() {
        List<Node> nodes = List.of(
                Node.transmitter("tx", Vec3.ZERO, 1, "A", 100),
                Node.receiver("b", new Vec3(4, 0, 0), 2, "B"),
                Node.relay("relay", new Vec3(-6, 0, 0), 2, "A", "A", 100),
                Node.receiver("a", new Vec3(0, 8, 0), 3, "A"));
        Scenario s = new Scenario("transparency", new Volume.Open(), Medium.DEFAULT,
                List.of(Species.stable("A", 100), Species.stable("B", 100)), Layouts.signalling(0.05, 1), nodes,
                List.of(), Targets.DEFAULT);
        SimulatedChannel ch = ParticleSimulator.simulate(s, SimulationSettings.of(8_000, 3));
        assertThat(ch.emitterIds()).containsExactly("tx", "relay");
        assertThat(ch.receiverIds()).containsExactly("b", "relay", "a");
        SimulatedTaps toB = ch.taps("tx", "b").orElseThrow();
        assertThat(toB.senses()).isFalse();
        assertThat(toB.absorbedTotal()).isZero();
        SimulatedTaps self = ch.taps("relay", "relay").orElseThrow();
        assertThat(self.senses()).isFalse();
        assertThat(self.absorbedTotal()).isZero();
        assertThat(ch.taps("tx", "relay").orElseThrow().absorbedTotal()).isPositive();
        assertThat(ch.taps("relay", "a").orElseThrow().absorbedTotal()).isPositive();
        // the relay's releases start inside its own body yet reach the other receiver as from a point source
        assertThat(ch.taps("tx", "a").orElseThrow().senses()).isTrue();
    }

    @Test
    void gridFindsTheSameAbsorberAsADirectScan() {
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(99L);
        int n = 60;
        double[][] c = new double[n][];
        double[] r = new double[n];
        int[] idx = new int[n];
        for (int i = 0; i < n; i++) {
            c[i] = new double[] {i * 9.0 % 50, (i * 17.0) % 40, (i * 5.0) % 30};
            r[i] = 1 + (i % 3);
            idx[i] = i;
        }
        double sigma = 0.5;
        double ddt = sigma * sigma / 2;
        Absorbers grid = new Absorbers(c, r, idx, sigma, ddt);
        int hits = 0;
        for (int k = 0; k < 50_000; k++) {
            double x0 = rng.nextDouble() * 60 - 5;
            double y0 = rng.nextDouble() * 50 - 5;
            double z0 = rng.nextDouble() * 40 - 5;
            double x1 = x0 + rng.nextDouble() - 0.5;
            double y1 = y0 + rng.nextDouble() - 0.5;
            double z1 = z0 + rng.nextDouble() - 0.5;
            long seed = rng.nextLong();
            int g = grid.absorb(x0, y0, z0, x1, y1, z1, RandomSource.XO_RO_SHI_RO_128_PP.create(seed));
            int d = directScan(c, r, x0, y0, z0, x1, y1, z1, ddt, RandomSource.XO_RO_SHI_RO_128_PP.create(seed),
                    Absorbers.REACH_SIGMAS * sigma);
            assertThat(g).isEqualTo(d);
            if (g >= 0) {
                hits++;
            }
        }
        assertThat(hits).isGreaterThan(200);
    }

    /** Brute force over all spheres, in index order, same bridge rule. */
    private static int directScan(double[][] c, double[] r, double x0, double y0, double z0, double x1, double y1,
            double z1, double ddt, UniformRandomProvider rng, double margin) {
        for (int i = 0; i < r.length; i++) {
            double e = Math.sqrt(sq(x1 - c[i][0]) + sq(y1 - c[i][1]) + sq(z1 - c[i][2]));
            if (e >= r[i] + margin) {
                continue;
            }
            if (e <= r[i]) {
                return i;
            }
            double d1 = Math.sqrt(sq(x0 - c[i][0]) + sq(y0 - c[i][1]) + sq(z0 - c[i][2])) - r[i];
            if (d1 <= 0) {
                return i;
            }
            double ex = d1 * (e - r[i]) / ddt;
            if (ex < 40 && rng.nextDouble() < Math.exp(-ex)) {
                return i;
            }
        }
        return -1;
    }

    private static double sq(double v) {
        return v * v;
    }

    @Test
    void cancellationKeepsOnlyFinishedBlocksAndProgressCounts() {
        Scenario s = Layouts.openPair(15, 5, 100, 0.1, 1);
        AtomicInteger calls = new AtomicInteger();
        AtomicLong last = new AtomicLong();
        SimulatedChannel ch = new ParticleSimulator(new SimulationSettings(100_000, 5,
                OptionalDouble.of(2e-3), 2)).simulate(s, (done, total) -> {
                    calls.incrementAndGet();
                    last.accumulateAndGet(done, Math::max);
                    assertThat(total).isEqualTo(100_000);
                }, () -> calls.get() >= 3);
        assertThat(ch.complete()).isFalse();
        long simulated = ch.emitters().get(0).moleculesSimulated();
        assertThat(simulated).isGreaterThanOrEqualTo(3L * ParticleSimulator.BLOCK_SIZE).isLessThan(100_000);
        assertThat(simulated % ParticleSimulator.BLOCK_SIZE).isZero();
        assertThat(last.get()).isEqualTo(simulated);
    }

    @Test
    void rejectsBadSettings() {
        assertThatThrownBy(() -> SimulationSettings.of(0, 1)).hasMessageContaining("moleculesPerEmitter");
        assertThatThrownBy(() -> SimulationSettings.of(10, 1).withTimeStepS(-1)).hasMessageContaining("timeStepS");
        assertThatThrownBy(() -> SimulationSettings.of(10, 1).withThreads(0)).hasMessageContaining("threads");
    }

    @Test
    void automaticStepFollowsTheGeometryRuleAndAlignsWithTheSymbolTime() {
        Scenario s = Layouts.openPair(3, 1, 100, 0.01, 0);
        double auto = TimeStepRule.automaticTimeStepS(s);
        // T/50 = 2e-4 s is below the geometric bound (0.4 µm)²/(6D) = 2.67e-4 s
        assertThat(auto).isCloseTo(0.01 / 50, Offset.offset(1e-15));
        Scenario longer = Layouts.openPair(3, 1, 100, 0.05, 0);
        // √(6DΔt) = 0.4 × min(r, d − r) = 0.4 µm
        assertThat(Math.sqrt(6 * 100 * TimeStepRule.automaticTimeStepS(longer)))
                .isCloseTo(0.4, Offset.offset(1e-12));
        Scenario drifting = Layouts.pair(new Volume.Open(), new Flow.Uniform(new Vec3(300, 0, 400)),
                10, 2, 100, Double.POSITIVE_INFINITY, 1, 0);
        double dtDrift = TimeStepRule.automaticTimeStepS(drifting);
        // diffusive rms step plus drift step |v|Δt (|v| = 500 µm/s) = 0.4 × min(r, d − r) = 0.8 µm
        assertThat(Math.sqrt(6 * 100 * dtDrift) + 500 * dtDrift).isCloseTo(0.8, Offset.offset(1e-12));
        Scenario vessel = new Scenario("vessel", new Volume.Cylinder(5, 400), Medium.DEFAULT,
                List.of(Species.stable("A", 100)), Layouts.signalling(1, 0),
                List.of(Node.transmitter("tx", new Vec3(50, 0, 0), 0.5, "A", 1000),
                        Node.receiver("rx", new Vec3(150, 0, 0), 3, "A")), List.of(), Targets.DEFAULT);
        // per-axis step √(2DΔt) = 0.1 R = 0.5 µm in a cylinder of radius 5 µm
        assertThat(Math.sqrt(2 * 100 * TimeStepRule.automaticTimeStepS(vessel)))
                .isCloseTo(0.5, Offset.offset(1e-12));
        double used = new ParticleSimulator(SimulationSettings.of(1, 1)).timeStepS(s);
        assertThat(used).isLessThanOrEqualTo(auto);
        double ratio = 0.01 / used;
        assertThat(Math.abs(ratio - Math.rint(ratio))).isLessThan(1e-6);
    }
}
