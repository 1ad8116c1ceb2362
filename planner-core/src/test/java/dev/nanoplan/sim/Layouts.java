package dev.nanoplan.sim;

import static org.assertj.core.api.Assertions.assertThat;

import dev.nanoplan.count.CountModelKind;
import dev.nanoplan.geometry.Vec3;
import dev.nanoplan.geometry.Volume;
import dev.nanoplan.scenario.Flow;
import dev.nanoplan.scenario.Medium;
import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.Schedule;
import dev.nanoplan.scenario.Signalling;
import dev.nanoplan.scenario.Species;
import dev.nanoplan.scenario.Targets;
import java.util.List;

/** Small layouts for the simulator tests. */
final class Layouts {

    private Layouts() {
    }

    static Signalling signalling(double symbolTimeS, int memory) {
        return new Signalling(symbolTimeS, memory, 2, 0.5, CountModelKind.EXACT, Schedule.ALL_ACTIVE);
    }

    /** One transmitter at the origin and one receiver of radius r at (d, 0, 0). */
    static Scenario pair(Volume volume, Flow flow, double distanceUm, double radiusUm, double diffusionUm2PerS,
            double halfLifeS, double symbolTimeS, int memory) {
        return new Scenario("pair", volume, new Medium(310.15, 0.69, flow, 0), 
                List.of(Species.ofDiffusion("A", diffusionUm2PerS, halfLifeS)), signalling(symbolTimeS, memory),
                List.of(Node.transmitter("tx", Vec3.ZERO, 0.5, "A", 1000),
                        Node.receiver("rx", new Vec3(distanceUm, 0, 0), radiusUm, "A")),
                List.of(), Targets.DEFAULT);
    }

    static Scenario openPair(double distanceUm, double radiusUm, double diffusionUm2PerS, double symbolTimeS,
            int memory) {
        return pair(new Volume.Open(), new Flow.None(), distanceUm, radiusUm, diffusionUm2PerS,
                Double.POSITIVE_INFINITY, symbolTimeS, memory);
    }

    /** Cumulative simulated fraction absorbed by (k+1)T, k = 0..L. */
    static double[] cumulative(SimulatedTaps t) {
        double[] p = t.taps();
        double[] c = new double[p.length];
        double s = 0;
        for (int k = 0; k < p.length; k++) {
            s += p[k];
            c[k] = s;
        }
        return c;
    }

    /**
     * Asserts that a simulated fraction of m molecules is within {@code zLimit} binomial standard errors,
     * √(p(1 − p)/m), of the exact probability p.
     */
    static void assertWithinStandardErrors(String what, double simulated, double exact, long m, double zLimit) {
        double se = Math.sqrt(exact * (1 - exact) / m);
        assertThat(Math.abs(simulated - exact)).as("%s: simulated %s vs %s", what, simulated, exact)
                .isLessThan(zLimit * se);
    }
}
