package dev.nanoplan.sim;

import static org.assertj.core.api.Assertions.assertThat;

import dev.nanoplan.geometry.Vec3;
import dev.nanoplan.geometry.Volume;
import dev.nanoplan.network.ChannelEntry;
import dev.nanoplan.network.ChannelMatrix;
import dev.nanoplan.physics.OpenSphereHitting;
import dev.nanoplan.physics.PassiveSphereObservation;
import dev.nanoplan.physics.ReactiveSphereHitting;
import dev.nanoplan.plan.PlanOptions;
import dev.nanoplan.scenario.Flow;
import dev.nanoplan.scenario.Medium;
import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.ReceiverModel;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.Species;
import dev.nanoplan.scenario.Targets;
import java.util.ArrayList;
import java.util.List;
import java.util.OptionalDouble;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * The simulator's passive observers and reactive (Collins–Kimball) spheres against their closed forms,
 * and their limits. Statistical checks use a 4 standard-error limit per check (two-sided chance of a
 * false failure 6.3e-5 each, normal approximation of the binomial; about 40 checks, so about 3e-3 for
 * the class), fixed seeds.
 */
class ReceiverModelSimulationTest {

    private static final double Z_LIMIT = 4;

    /** {@link Layouts#pair} with the receiver's model replaced. */
    private static Scenario pair(double d, double r, double diff, double halfLifeS, double symbolTimeS, int memory,
            ReceiverModel model) {
        Scenario s = Layouts.pair(new Volume.Open(), new Flow.None(), d, r, diff, halfLifeS, symbolTimeS, memory);
        List<Node> nodes = new ArrayList<>(s.nodes());
        nodes.set(1, nodes.get(1).withReceiver(model));
        return new Scenario(s.name(), s.volume(), s.medium(), s.species(), s.signalling(), nodes, s.demands(),
                s.targets());
    }

    private static SimulatedTaps run(Scenario s, int molecules, long seed, double dtS) {
        return ParticleSimulator.simulate(s, new SimulationSettings(molecules, seed, OptionalDouble.of(dtS), 2))
                .taps("tx", "rx").orElseThrow();
    }

    @ParameterizedTest(name = "d={0} r={1} D={2} half-life={3} offset={4}")
    @CsvSource({
        // end of the slot (default)
        "8, 5, 100, Infinity, , 41",
        // mid-slot sampling, farther
        "15, 5, 100, Infinity, 0.05, 42",
        // decay, early sampling, a smaller observer
        "10, 3, 80, 0.15, 0.02, 43"})
    void passiveCountsMatchTheGreensFunctionOverTheBall(double d, double r, double diff, double halfLifeS,
            Double offsetS, long seed) {
        double symbolTimeS = 0.1;
        int memory = 3;
        Scenario s = pair(d, r, diff, halfLifeS, symbolTimeS, memory, ReceiverModel.passive(offsetS));
        int m = 40_000;
        SimulatedTaps t = run(s, m, seed, 1e-3);
        PassiveSphereObservation exact = PassiveSphereObservation.of(d, r, diff, halfLifeS, offsetS);
        double[] simulated = t.taps();
        for (int k = 0; k <= memory; k++) {
            double time = k * symbolTimeS + (offsetS == null ? symbolTimeS : offsetS);
            // H. S. Carslaw, J. C. Jaeger, Conduction of Heat in Solids (1959) / J. Crank, The Mathematics of
            // Diffusion (1975): the free-space point-source solution integrated over the ball, times e^{−λt}
            Layouts.assertWithinStandardErrors("t = " + time + " s", simulated[k], exact.insideProbability(time), m,
                    Z_LIMIT);
        }
        // a passive observer removes nothing: every molecule is still counted as never absorbed
        assertThat(ParticleSimulator.simulate(s, new SimulationSettings(4096, seed, OptionalDouble.of(1e-3), 1))
                .emitters().get(0).neverAbsorbed()).isEqualTo(4096);
    }

    @Test
    void aPassiveObserverIsTransparentToAnAbsorbingReceiver() {
        Scenario base = Layouts.openPair(20, 4, 100, 0.1, 2);
        List<Node> nodes = new ArrayList<>(base.nodes());
        // an observer on the line between the two, where an absorber would shade the receiver
        nodes.add(Node.receiver("obs", new Vec3(10, 0, 0), 3, "A").withReceiver(ReceiverModel.passive(null)));
        Scenario with = new Scenario("with observer", base.volume(), base.medium(), base.species(),
                base.signalling(), nodes, List.of(), Targets.DEFAULT);
        SimulatedTaps alone = run(base, 20_000, 5, 1e-3);
        SimulatedTaps beside = run(with, 20_000, 5, 1e-3);
        // source: the passive model's definition (it neither absorbs nor moves molecules, and draws no random
        // number), so the absorber sees the same molecules, step for step
        assertThat(beside.absorbedPerSlot()).isEqualTo(alone.absorbedPerSlot());
        SimulatedChannel ch = ParticleSimulator.simulate(with, new SimulationSettings(20_000, 5,
                OptionalDouble.of(1e-3), 2));
        assertThat(ch.taps("tx", "obs").orElseThrow().absorbedTotal()).isPositive();
    }

    @ParameterizedTest(name = "kappa={0}")
    @CsvSource({"30, 51", "5, 52"})
    void reactiveCatchMatchesTheCollinsKimballClosedForm(double kappaUmPerS, long seed) {
        // d = 8 µm, r = 5 µm, D = 100 µm²/s, T = 0.1 s, L = 3; the automatic Δt keeps P = κ√(πΔt/D) ≤ 0.05:
        // Δt = 8.8e-5 s at κ = 30 µm/s (√(6DΔt) = 0.23 µm = 0.05 r); at κ = 5 µm/s the usual T/50 = 2e-3 s
        // (P = 0.04, √(6DΔt) = 1.1 µm = 0.22 r)
        Scenario s = pair(8, 5, 100, Double.POSITIVE_INFINITY, 0.1, 3, ReceiverModel.reactive(kappaUmPerS));
        int m = 40_000;
        SimulationSettings settings = SimulationSettings.of(m, seed);
        double dt = new ParticleSimulator(settings).timeStepS(s);
        assertThat(Absorbers.adsorptionProbability(kappaUmPerS, dt, 100)).isLessThanOrEqualTo(0.05);
        double[] simulated = Layouts.cumulative(ParticleSimulator.simulate(s, settings).taps("tx", "rx").orElseThrow());
        ReactiveSphereHitting exact = ReactiveSphereHitting.of(8, 5, 100, kappaUmPerS, null);
        for (int k = 0; k < simulated.length; k++) {
            double t = (k + 1) * 0.1;
            // H. S. Carslaw, J. C. Jaeger, Conduction of Heat in Solids (1959), the sphere with the radiation
            // (Collins–Kimball) boundary condition: F(t) = P∞·e^{−x²}[erfcx(x) − erfcx(x + y)]
            Layouts.assertWithinStandardErrors("t = " + t + " s", simulated[k], exact.cumulative(t), m, Z_LIMIT);
        }
    }

    @Test
    void aVeryFastBindingRateGivesTheAbsorbingSphereExactly() {
        Scenario absorbing = Layouts.openPair(15, 5, 100, 0.1, 3);
        Scenario fast = pair(15, 5, 100, Double.POSITIVE_INFINITY, 0.1, 3, ReceiverModel.reactive(1e12));
        double dt = 1e-3;
        assertThat(Absorbers.adsorptionProbability(1e12, dt, 100)).isEqualTo(1);
        // source: Collins and Kimball (1949), κ → ∞ is the perfect absorber (Smoluchowski); at P = 1 the
        // simulator uses the absorbing scheme, so the counts are those of the absorbing receiver
        assertThat(run(fast, 20_000, 61, dt).absorbedPerSlot()).isEqualTo(run(absorbing, 20_000, 61, dt)
                .absorbedPerSlot());
        double[] simulated = Layouts.cumulative(run(fast, 20_000, 61, dt));
        OpenSphereHitting exact = OpenSphereHitting.of(15, 5, 100);
        // S. Redner, A Guide to First-Passage Processes (2001), ch. 6: F(t) = (r/d) erfc((d − r)/√(4Dt))
        Layouts.assertWithinStandardErrors("t = 0.4 s", simulated[3], exact.cumulative(0.4), 20_000, Z_LIMIT);
    }

    @Test
    void aVanishingBindingRateGivesNoHits() {
        Scenario slow = pair(15, 5, 100, Double.POSITIVE_INFINITY, 0.1, 3, ReceiverModel.reactive(1e-9));
        SimulatedChannel ch = ParticleSimulator.simulate(slow, new SimulationSettings(8192, 71,
                OptionalDouble.of(1e-3), 2));
        // source: Collins and Kimball (1949), κ → 0 is a reflecting sphere: P∞ = (r/d)·κr/(κr + D) → 0
        // (here 1.7e-12, so no hit among 8192 molecules but with probability ~1e-8)
        assertThat(ch.taps("tx", "rx").orElseThrow().absorbedTotal()).isZero();
        assertThat(ch.emitters().get(0).neverAbsorbed()).isEqualTo(8192);
    }

    @Test
    void theCacheKeyNamesNonAbsorbingModelsAndKeepsAbsorbingKeys() {
        Scenario absorbing = Layouts.openPair(15, 5, 100, 0.1, 3);
        String k = ChannelCache.key(absorbing, 1000, 1, 1e-3);
        Scenario again = pair(15, 5, 100, Double.POSITIVE_INFINITY, 0.1, 3, ReceiverModel.ABSORBING);
        assertThat(ChannelCache.key(again, 1000, 1, 1e-3)).isEqualTo(k);
        List<String> keys = new ArrayList<>(List.of(k));
        for (ReceiverModel rm : List.of(ReceiverModel.passive(null), ReceiverModel.passive(0.05),
                ReceiverModel.passive(0.06), ReceiverModel.reactive(20), ReceiverModel.reactive(21))) {
            keys.add(ChannelCache.key(pair(15, 5, 100, Double.POSITIVE_INFINITY, 0.1, 3, rm), 1000, 1, 1e-3));
        }
        // common practice for a content-addressed cache: other physics, another key
        assertThat(keys).doesNotHaveDuplicates();
    }

    @Test
    void anAbsorbingLayoutKeepsTheKeyOfExistingCacheFiles() throws Exception {
        Scenario vessel = AutoChannelTest.bundled("vessel-segment");
        SimulationSettings settings = SimulationSettings.of(20_000, 1);
        double dt = new ParticleSimulator(settings).timeStepS(vessel);
        // source: the key that the release before receiver models (commit 16970fa) wrote for
        // `plan scenarios/vessel-segment.json` (20000 molecules per emitter, seed 1); cache files in users'
        // folders stay valid
        assertThat(ChannelCache.key(vessel, 20_000, 1, dt))
                .isEqualTo("9420baa8b190e4d57bd80598be01d1462ad881907c9f25edfb0d2be8328166b5");
    }

    @Test
    void theAutoChannelSimulatesAWalledPassiveReceiverInsteadOfRefusing() {
        // a receiver close to a reflecting wall: the images add far more than 5 % (ChannelApplicability)
        List<Node> nodes = List.of(Node.transmitter("tx", new Vec3(10, 10, 5), 0.5, "A", 10_000),
                Node.receiver("rx", new Vec3(22, 10, 5), 3, "A").withReceiver(ReceiverModel.passive(null)));
        Scenario s = new Scenario("walled observer", new Volume.Box(Vec3.ZERO, new Vec3(40, 20, 10)),
                Medium.DEFAULT, List.of(Species.stable("A", 100)), Layouts.signalling(0.1, 2), nodes, List.of(),
                Targets.DEFAULT);
        AutoChannel.Decision decision = AutoChannel.decide(s, PlanOptions.DEFAULT.cutoffMolecules());
        assertThat(decision.toSimulate()).containsKey("tx");
        SimulationSettings settings = new SimulationSettings(4096, 3, OptionalDouble.of(1e-3), 2);
        AutoChannel.Result r = AutoChannel.obtain(s, PlanOptions.DEFAULT.cutoffMolecules(), settings, null,
                ParticleSimulator::simulate, () -> false, dt -> { });
        ChannelEntry e = r.channel().entry("tx", "rx");
        assertThat(e.source()).isEqualTo(ChannelMatrix.SIMULATED);
        // source: method of images (Carslaw and Jaeger 1959): reflecting walls only add molecules, so the walled
        // observer sees at least the free-space fraction at the first sampling instant, within 4 s.e.
        double free = PassiveSphereObservation.of(12, 3, 100, null, null).insideProbability(0.1);
        assertThat(e.taps()[0]).isGreaterThan(free - Z_LIMIT * Math.sqrt(free * (1 - free) / 4096));
    }
}
