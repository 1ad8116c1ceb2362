package dev.nanoplan.plan;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.nanoplan.count.CountModelKind;
import dev.nanoplan.geometry.Vec3;
import dev.nanoplan.geometry.Volume;
import dev.nanoplan.network.ChannelEntry;
import dev.nanoplan.network.ChannelMatrix;
import dev.nanoplan.report.PlanJson;
import dev.nanoplan.scenario.Demand;
import dev.nanoplan.scenario.Flow;
import dev.nanoplan.scenario.Medium;
import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.Schedule;
import dev.nanoplan.scenario.Signalling;
import dev.nanoplan.scenario.SlotPlan;
import dev.nanoplan.scenario.Species;
import dev.nanoplan.scenario.Targets;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import org.apache.commons.statistics.distribution.BinomialDistribution;
import org.apache.commons.statistics.distribution.PoissonDistribution;
import org.junit.jupiter.api.Test;

/**
 * The planner under the {@code slots} schedule: its two special cases (all-active, round-robin) give the
 * same plan numbers, and one link agrees with a count law built by brute-force enumeration of the
 * emitters' symbol histories.
 */
class SlotsPlannerTest {

    private static final double T_S = 1.0;
    private static final double BACKGROUND_PER_S = 0.5;
    private static final PlanOptions ALL_LINKS = PlanOptions.withFloor(0);

    private static Scenario layout(List<Node> nodes, int memory, Signalling sig) {
        List<Demand> demands = new ArrayList<>();
        for (Node n : nodes) {
            if (n.role().emits()) {
                demands.add(new Demand(n.id(), "rx"));
            }
        }
        return new Scenario("slots", new Volume.Open(), new Medium(310.15, 0.69, new Flow.None(), BACKGROUND_PER_S),
                List.of(Species.stable("A", 100)), sig, nodes, demands, Targets.DEFAULT);
    }

    private static Signalling signalling(int memory, Schedule schedule) {
        return new Signalling(T_S, memory, 2, 0.5, CountModelKind.EXACT, schedule);
    }

    /** The plan JSON without the schedule's name (the one field that must differ). */
    private static ObjectNode json(Plan p) {
        ObjectNode o = PlanJson.of(p);
        o.remove("schedule");
        return o;
    }

    @Test
    void everyEmitterInSlotZeroIsTheAllActivePlan() {
        List<Node> nodes = RoundRobinPlannerTest.nodes(300, new Vec3(12, 0, 0), new Vec3(-14, 0, 0), new Vec3(0, 16, 0));
        Map<String, Integer> zero = Map.of("t0", 0, "t1", 0, "t2", 0);
        Plan aa = NetworkPlanner.plan(layout(nodes, 4, signalling(4, Schedule.ALL_ACTIVE)), ALL_LINKS);
        Plan slots = NetworkPlanner.plan(layout(nodes, 4, signalling(4, Schedule.SLOTS).withSlots(0, zero)),
                ALL_LINKS);
        // issue 13 model: all-active is the slot plan with K = 1 (every emitter in slot 0)
        assertThat(json(slots)).isEqualTo(json(aa));
        assertThat(PlanJson.of(slots).get("frame_slots").asInt()).isEqualTo(1);
    }

    @Test
    void oneSlotPerEmitterInFileOrderIsTheRoundRobinPlan() {
        List<Node> nodes = RoundRobinPlannerTest.nodes(300, new Vec3(12, 0, 0), new Vec3(-14, 0, 0), new Vec3(0, 16, 0));
        Plan rr = NetworkPlanner.plan(layout(nodes, 6, signalling(6, Schedule.ROUND_ROBIN)), ALL_LINKS);
        Plan slots = NetworkPlanner.plan(layout(nodes, 6,
                signalling(6, Schedule.SLOTS).withSlots(0, SlotPlan.fileOrder(nodes))), ALL_LINKS);
        // issue 13 model: round-robin is the slot plan giving each emitter of a species its own slot in file order
        assertThat(json(slots)).isEqualTo(json(rr));
        assertThat(PlanJson.of(rr).get("slots").toString()).isEqualTo("{\"t0\":0,\"t1\":1,\"t2\":2}");
        assertThat(PlanJson.of(rr).get("frame_slots").asInt()).isEqualTo(3);
    }

    @Test
    void aReplanAfterASlotMoveIsTheFullPlan() {
        List<Node> nodes = RoundRobinPlannerTest.nodes(300, new Vec3(12, 0, 0), new Vec3(-14, 0, 0), new Vec3(0, 16, 0));
        Scenario first = layout(nodes, 6, signalling(6, Schedule.SLOTS).withSlots(0, Map.of("t0", 0, "t1", 1, "t2", 1)));
        Scenario moved = layout(nodes, 6, signalling(6, Schedule.SLOTS).withSlots(0, Map.of("t0", 0, "t1", 1, "t2", 0)));
        IncrementalPlanner planner = IncrementalPlanner.exact(first, ALL_LINKS);
        // the incremental planner's contract: a re-plan equals the full plan of the edited scenario
        assertThat(PlanJson.of(planner.replan(moved))).isEqualTo(PlanJson.of(NetworkPlanner.plan(moved, ALL_LINKS)));
    }

    /**
     * K = 3, L = 4: t0 and t1 share slot 0, t2 sends in slot 1. Decoding t0 hears its own symbols at lags
     * 0 and 3, t1's at lags 0 and 3 (same slot), t2's at lag 2 ((0 − 1) mod 3). The count law is built by
     * enumerating the 2^4 histories of the four unknown symbols (t0 at lag 3, t1 at lags 0 and 3, t2 at
     * lag 2), each a sum of independent binomials (Commons Statistics) plus Poisson background, and the
     * operating point is the threshold with the largest mutual information at prior 1/2.
     */
    @Test
    void oneLinkMatchesTheEnumeratedDecimatedCountLaw() {
        double[] t0 = {0.020, 0.008, 0.004, 0.003, 0.002};
        double[] t1 = {0.015, 0.007, 0.004, 0.002, 0.0015};
        double[] t2 = {0.010, 0.006, 0.003, 0.002, 0.001};
        int n = 400;
        List<Node> nodes = RoundRobinPlannerTest.nodes(n, new Vec3(12, 0, 0), new Vec3(-14, 0, 0), new Vec3(0, 16, 0));
        ChannelMatrix given = ChannelMatrix.of(List.of(
                new ChannelEntry("t0", "rx", "A", t0, ChannelMatrix.SIMULATED, null),
                new ChannelEntry("t1", "rx", "A", t1, ChannelMatrix.SIMULATED, null),
                new ChannelEntry("t2", "rx", "A", t2, ChannelMatrix.SIMULATED, null)));
        Signalling sig = signalling(4, Schedule.SLOTS).withSlots(3, Map.of("t0", 0, "t1", 0, "t2", 1));
        Plan plan = NetworkPlanner.plan(layout(nodes, 4, sig), ALL_LINKS.withChannel(given));
        LinkReport link = plan.links().stream().filter(l -> l.from().equals("t0")).findFirst().orElseThrow();

        double[][] given0 = new double[2][];
        for (int x0 = 0; x0 < 2; x0++) {
            double[] pmf = new double[1];
            pmf[0] = 1;
            double[] mixture = null;
            for (int h = 0; h < 16; h++) {
                // bits of h: t0 at lag 3, t1 at lag 0, t1 at lag 3, t2 at lag 2
                double[] law = binomial(x0 * n, t0[0]);
                law = convolve(law, binomial(((h) & 1) * n, t0[3]));
                law = convolve(law, binomial(((h >> 1) & 1) * n, t1[0]));
                law = convolve(law, binomial(((h >> 2) & 1) * n, t1[3]));
                law = convolve(law, binomial(((h >> 3) & 1) * n, t2[2]));
                law = convolve(law, poisson(BACKGROUND_PER_S * T_S, 40));
                mixture = mixture == null ? scaled(law, 1 / 16.0) : add(mixture, scaled(law, 1 / 16.0));
            }
            given0[x0] = mixture;
        }
        double best = -1;
        int bestTau = -1;
        for (int tau = 0; tau <= given0[1].length; tau++) {
            double e0 = tail(given0[0], tau);
            double e1 = 1 - tail(given0[1], tau);
            double mi = binaryMutualInformation(0.5, e0, e1);
            if (mi > best + 1e-15) {
                best = mi;
                bestTau = tau;
            }
        }
        // brute force over symbol histories (binomial thinning of each release, Poisson background)
        assertThat(link.mutualInformationBits()).isCloseTo(best, within(1e-9));
        assertThat(link.threshold()).isEqualTo(bestTau);
        // rate: one symbol per frame of K = 3 slots
        assertThat(link.rateBitsPerS()).isCloseTo(link.mutualInformationBits() / (3 * T_S), within(1e-12));
    }

    private static double[] binomial(int trials, double p) {
        BinomialDistribution b = BinomialDistribution.of(trials, p);
        double[] out = new double[trials + 1];
        for (int k = 0; k <= trials; k++) {
            out[k] = b.probability(k);
        }
        return out;
    }

    private static double[] poisson(double mean, int max) {
        PoissonDistribution d = PoissonDistribution.of(mean);
        double[] out = new double[max + 1];
        for (int k = 0; k <= max; k++) {
            out[k] = d.probability(k);
        }
        return out;
    }

    private static double[] convolve(double[] a, double[] b) {
        double[] out = new double[a.length + b.length - 1];
        for (int i = 0; i < a.length; i++) {
            for (int j = 0; j < b.length; j++) {
                out[i + j] += a[i] * b[j];
            }
        }
        return out;
    }

    private static double[] scaled(double[] a, double f) {
        double[] out = a.clone();
        for (int i = 0; i < out.length; i++) {
            out[i] *= f;
        }
        return out;
    }

    private static double[] add(double[] a, double[] b) {
        double[] out = new double[Math.max(a.length, b.length)];
        for (int i = 0; i < out.length; i++) {
            out[i] = (i < a.length ? a[i] : 0) + (i < b.length ? b[i] : 0);
        }
        return out;
    }

    private static double tail(double[] pmf, int tau) {
        double s = 0;
        for (int k = Math.max(0, tau); k < pmf.length; k++) {
            s += pmf[k];
        }
        return s;
    }

    /** I(X;Y) of a binary channel with crossovers e0 = P(1|0), e1 = P(0|1) at prior q (Shannon 1948). */
    private static double binaryMutualInformation(double q, double e0, double e1) {
        double py1 = (1 - q) * e0 + q * (1 - e1);
        return h(py1) - ((1 - q) * h(e0) + q * h(e1));
    }

    private static double h(double p) {
        return p <= 0 || p >= 1 ? 0 : -(p * Math.log(p) + (1 - p) * Math.log(1 - p)) / Math.log(2);
    }
}
