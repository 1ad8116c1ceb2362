package dev.nanoplan.bench;

import dev.nanoplan.count.CountModelKind;
import dev.nanoplan.geometry.Vec3;
import dev.nanoplan.geometry.Volume;
import dev.nanoplan.scenario.Medium;
import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.Schedule;
import dev.nanoplan.scenario.Signalling;
import dev.nanoplan.scenario.Species;
import dev.nanoplan.scenario.Targets;
import dev.nanoplan.sim.ParticleSimulator;
import dev.nanoplan.sim.SimulatedChannel;
import dev.nanoplan.sim.SimulationSettings;
import java.util.ArrayList;
import java.util.List;
import java.util.OptionalDouble;
import java.util.concurrent.TimeUnit;
import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.sampling.distribution.ZigguratSampler;
import org.apache.commons.rng.simple.RandomSource;
import org.openjdk.jmh.annotations.AuxCounters;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Level;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.Threads;

/**
 * Particle simulator throughput in molecule-steps per second on two cores (two JMH threads, each
 * running a one-thread simulation of one block of {@value #MOLECULES} molecules per operation),
 * against the floor: drawing the three Gaussians of a step with the same generator and sampler
 * and nothing else. Read the {@code moleculeSteps} secondary result (a rate). Run e.g.
 * {@code java -cp target/test-classes:target/classes:<deps> org.openjdk.jmh.Main SimBench -f 1 -wi 2 -i 8 -r 2s}.
 *
 * <p>Figures measured and the targets met or missed are kept in the README's Speed table (the
 * machine is shared, so read them with the load average recorded there).
 */
@State(Scope.Thread)
@BenchmarkMode(Mode.Throughput)
@OutputTimeUnit(TimeUnit.SECONDS)
@Threads(2)
public class SimBench {

    static final int MOLECULES = ParticleSimulator.BLOCK_SIZE;
    static final double DT_S = 1e-3;
    static final double SYMBOL_TIME_S = 0.1;

    /** Molecule-steps done, reported by JMH as a rate. */
    @AuxCounters(AuxCounters.Type.OPERATIONS)
    @State(Scope.Thread)
    public static class Steps {
        public long moleculeSteps;

        @Setup(Level.Iteration)
        public void reset() {
            moleculeSteps = 0;
        }
    }

    private Scenario openOne;
    private Scenario boxFifty;
    private long seed;
    private UniformRandomProvider rng;
    private ZigguratSampler.NormalizedGaussian gauss;

    private static Signalling signalling() {
        return new Signalling(SYMBOL_TIME_S, 0, 2, 0.5, CountModelKind.EXACT, Schedule.ALL_ACTIVE);
    }

    @Setup
    public void setup() {
        openOne = new Scenario("open", new Volume.Open(), Medium.DEFAULT, List.of(Species.stable("A", 100)),
                signalling(), List.of(Node.transmitter("tx", Vec3.ZERO, 1, "A", 1),
                        Node.receiver("rx", new Vec3(15, 0, 0), 5, "A")), List.of(), Targets.DEFAULT);
        List<Node> nodes = new ArrayList<>();
        nodes.add(Node.transmitter("tx", new Vec3(100, 100, 100), 1, "A", 1));
        for (int i = 0; i < 5; i++) {
            for (int j = 0; j < 5; j++) {
                for (int k = 0; k < 2; k++) {
                    nodes.add(Node.receiver("r" + i + j + k, new Vec3(40 + 30 * i, 40 + 30 * j, 85 + 30 * k), 3, "A"));
                }
            }
        }
        boxFifty = new Scenario("box50", new Volume.Box(Vec3.ZERO, new Vec3(200, 200, 200)), Medium.DEFAULT,
                List.of(Species.stable("A", 100)), signalling(), nodes, List.of(), Targets.DEFAULT);
        rng = RandomSource.XO_RO_SHI_RO_128_PP.create(12345L);
        gauss = ZigguratSampler.NormalizedGaussian.of(rng);
    }

    private long run(Scenario s) {
        SimulatedChannel ch = ParticleSimulator.simulate(s,
                new SimulationSettings(MOLECULES, seed++, OptionalDouble.of(DT_S), 1));
        return ch.moleculeSteps();
    }

    @Benchmark
    public long openMediumOneReceiver(Steps steps) {
        long n = run(openOne);
        steps.moleculeSteps += n;
        return n;
    }

    @Benchmark
    public long boxFiftyReceivers(Steps steps) {
        long n = run(boxFifty);
        steps.moleculeSteps += n;
        return n;
    }

    /**
     * The floor: per molecule-step three Gaussians from the same generator and sampler added to
     * structure-of-arrays positions (the same loop shape as the simulator, minus walls, drift,
     * absorbers and bookkeeping).
     */
    @Benchmark
    public double floorThreeGaussiansPerStep(Steps steps) {
        int stepsPerRun = (int) Math.round(SYMBOL_TIME_S / DT_S);
        double sigma = Math.sqrt(2 * 100 * DT_S);
        java.util.Arrays.fill(fx, 0);
        java.util.Arrays.fill(fy, 0);
        java.util.Arrays.fill(fz, 0);
        for (int n = 0; n < stepsPerRun; n++) {
            for (int i = 0; i < MOLECULES; i++) {
                fx[i] += sigma * gauss.sample();
                fy[i] += sigma * gauss.sample();
                fz[i] += sigma * gauss.sample();
            }
        }
        steps.moleculeSteps += (long) stepsPerRun * MOLECULES;
        return fx[0] + fy[1] + fz[2];
    }

    private final double[] fx = new double[MOLECULES];
    private final double[] fy = new double[MOLECULES];
    private final double[] fz = new double[MOLECULES];
}
