package dev.nanoplan.plan;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import dev.nanoplan.count.CountModelKind;
import dev.nanoplan.count.CountTerm;
import dev.nanoplan.geometry.Vec3;
import dev.nanoplan.geometry.Volume;
import dev.nanoplan.network.AnalyticChannel;
import dev.nanoplan.network.ChannelEntry;
import dev.nanoplan.network.ChannelMatrix;
import dev.nanoplan.network.Crosstalk;
import dev.nanoplan.network.LinkEvaluator;
import dev.nanoplan.network.LinkSpec;
import dev.nanoplan.report.PlanText;
import dev.nanoplan.scenario.Demand;
import dev.nanoplan.scenario.Flow;
import dev.nanoplan.scenario.Medium;
import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.Schedule;
import dev.nanoplan.scenario.Signalling;
import dev.nanoplan.scenario.Species;
import dev.nanoplan.scenario.Targets;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * The planner under the round-robin schedule against link evaluations built by hand from the
 * model of {@link SlotSchedule}: own taps p_0, p_K, …; interferer j at lags (k − j) mod K + mK.
 */
class RoundRobinPlannerTest {

    private static final double T_S = 1.0;
    private static final double BACKGROUND_PER_S = 0.5;
    private static final PlanOptions ALL_LINKS = PlanOptions.withFloor(0);

    private static Scenario layout(List<Node> nodes, Species species, int memory, Schedule schedule) {
        List<Demand> demands = new ArrayList<>();
        for (Node n : nodes) {
            if (n.role().emits()) {
                demands.add(new Demand(n.id(), "rx"));
            }
        }
        return new Scenario("rr", new Volume.Open(), new Medium(310.15, 0.69, new Flow.None(), BACKGROUND_PER_S),
                List.of(species), new Signalling(T_S, memory, 2, 0.5, CountModelKind.EXACT, schedule), nodes,
                demands, Targets.DEFAULT);
    }

    /** Receiver of radius 5 µm at the origin, transmitters at the given positions, in this order. */
    static List<Node> nodes(long molecules, Vec3... tx) {
        List<Node> nodes = new ArrayList<>();
        nodes.add(Node.receiver("rx", Vec3.ZERO, 5, "A"));
        for (int i = 0; i < tx.length; i++) {
            nodes.add(Node.transmitter("t" + i, tx[i], 1, "A", molecules));
        }
        return nodes;
    }

    private static LinkReport link(Plan p, String from) {
        return p.links().stream().filter(l -> l.from().equals(from) && l.to().equals("rx")).findFirst()
                .orElseThrow();
    }

    private static RouteReport route(Plan p, String from) {
        return p.routes().stream().filter(r -> r.from().equals(from)).findFirst().orElseThrow();
    }

    private static LinkSpec spec(double[] taps, long molecules, double symbolTimeS) {
        return LinkSpec.binary(taps, 0, molecules, 0.5, BACKGROUND_PER_S * T_S, CountModelKind.EXACT, symbolTimeS);
    }

    /**
     * Three emitters around one receiver with a species whose half-life (0.01 s) is short against
     * T = 1 s: after one slot a fraction 2^−100 of the molecules survives (first-order decay,
     * docs/architecture.md §5.2), so the neighbours, which round-robin moves to earlier slots, leave nothing.
     * Each link is then the lone link; all-active keeps the neighbours' current symbols.
     */
    @Test
    void fastDecayingNeighboursInOtherSlotsLeaveTheLoneLink() {
        Species fast = Species.ofDiffusion("A", 100, 0.01);
        List<Node> nodes = nodes(2000, new Vec3(10, 0, 0), new Vec3(0, 10, 0), new Vec3(0, 0, 10));
        int memory = 4;
        Plan rr = NetworkPlanner.plan(layout(nodes, fast, memory, Schedule.ROUND_ROBIN), ALL_LINKS);
        Plan aa = NetworkPlanner.plan(layout(nodes, fast, memory, Schedule.ALL_ACTIVE), ALL_LINKS);
        double[] taps = AnalyticChannel.model(10, 5, fast).taps(T_S, memory);
        // plans report the operating point (mutual information at the file's prior), so compare that
        double lone = LinkEvaluator.evaluate(spec(taps, 2000, T_S)).mutualInformationBits();
        for (String tx : List.of("t0", "t1", "t2")) {
            LinkReport l = link(rr, tx);
            // docs/architecture.md §5.2 with half-life 0.01 s: leftovers after one slot are 2^-100 of a release,
            // so time division leaves the lone link (LinkEvaluator without crosstalk)
            assertThat(l.mutualInformationBits()).isCloseTo(lone, within(1e-9));
            // one symbol per frame of K = 3 slots
            assertThat(l.rateBitsPerS()).isCloseTo(l.mutualInformationBits() / (3 * T_S), within(1e-12));
            // common practice: all-active adds the neighbours' current symbols, which cannot help
            assertThat(link(aa, tx).mutualInformationBits()).isLessThan(l.mutualInformationBits() - 0.01);
            // reports keep the physical taps p_0..p_L of the channel
            assertThat(l.taps()).containsExactly(taps);
        }
    }

    /** With no memory (L = 0) every neighbour's first lag (≥ 1) is beyond L: exactly the lone link. */
    @Test
    void neighboursBeyondTheMemoryContributeNothing() {
        Species stable = Species.stable("A", 100);
        List<Node> nodes = nodes(500, new Vec3(12, 0, 0), new Vec3(-12, 0, 0), new Vec3(0, 12, 0));
        Plan rr = NetworkPlanner.plan(layout(nodes, stable, 0, Schedule.ROUND_ROBIN), ALL_LINKS);
        double[] taps = AnalyticChannel.model(12, 5, stable).taps(T_S, 0);
        double lone = LinkEvaluator.evaluate(spec(taps, 500, 3 * T_S)).mutualInformationBits();
        // by the model (SlotSchedule): lags (k - j) mod K >= 1 > L = 0 are not counted
        assertThat(link(rr, "t1").mutualInformationBits()).isCloseTo(lone, within(1e-9));
        assertThat(link(rr, "t1").interferenceMean()).isZero();
    }

    /**
     * Two equal emitters 12 µm either side of the receiver (stable species, L = 4): all-active
     * crosstalk limits the link; round-robin (K = 2) hears t1 only at lags 1 and 3 and its own
     * leftovers at lags 2 and 4, and halves the symbol rate.
     */
    @Test
    void twoEmitterCrosstalkTradedForRate() {
        Species stable = Species.stable("A", 100);
        int memory = 4;
        long n = 300;
        List<Node> nodes = nodes(n, new Vec3(12, 0, 0), new Vec3(-12, 0, 0));
        Plan aa = NetworkPlanner.plan(layout(nodes, stable, memory, Schedule.ALL_ACTIVE), ALL_LINKS);
        Plan rr = NetworkPlanner.plan(layout(nodes, stable, memory, Schedule.ROUND_ROBIN), ALL_LINKS);
        LinkReport a = link(aa, "t0");
        LinkReport r = link(rr, "t0");
        assertThat(a.limitedBy()).isEqualTo(Impairment.CROSSTALK);

        double[] p = AnalyticChannel.model(12, 5, stable).taps(T_S, memory);
        long[] levels = {0, n};
        double[] w = {0.5, 0.5};
        // by hand, K = 2, k = 0, j = 1: own lags 0, 2, 4; t1 at lags (0 - 1) mod 2 = 1 and 3
        List<CountTerm> fromT1 = Crosstalk.exactTerms(
                List.of(new Crosstalk.Interferer("t1", new double[] {p[1], p[3]}, levels, w)));
        double expected = LinkEvaluator.evaluate(spec(new double[] {p[0], p[2], p[4]}, n, 2 * T_S), fromT1)
                .mutualInformationBits();
        // docs/architecture.md §5.6 count model with the round-robin lags derived by hand above
        assertThat(r.mutualInformationBits()).isCloseTo(expected, within(1e-9));
        // common practice (time division): fewer interfering releases per decoded slot, more bits per symbol
        assertThat(r.mutualInformationBits()).isGreaterThan(a.mutualInformationBits());
        // one symbol per frame of K = 2 slots against one per slot
        assertThat(r.rateBitsPerS()).isCloseTo(r.mutualInformationBits() / (2 * T_S), within(1e-12));
        assertThat(a.rateBitsPerS()).isCloseTo(a.mutualInformationBits() / T_S, within(1e-12));
        // the rate rises only if the capacity more than doubles
        assertThat(r.rateBitsPerS() > a.rateBitsPerS()).isEqualTo(r.mutualInformationBits() > 2 * a.mutualInformationBits());

        RouteReport route = route(rr, "t0");
        // one hop of one frame of K = 2 slots
        assertThat(route.latencyS()).isCloseTo(2 * T_S, within(1e-12));
        assertThat(route.rateBitsPerS()).isCloseTo(route.endToEndCapacityBits() / (2 * T_S), within(1e-12));
        assertThat(PlanText.render(rr)).contains("Schedule: round-robin").contains("A: frame of 2 slots");
        assertThat(dev.nanoplan.report.PlanJson.of(rr).get("schedule").asText()).isEqualTo("round-robin");
        assertThat(PlanComparison.of(aa, rr).toText()).contains("B: rr [schedule round-robin]")
                .doesNotContain("A: rr [");
        // L = 4 covers two frames of K = 2: no warning about the memory
        assertThat(rr.warnings()).noneMatch(msg -> msg.startsWith("round-robin"));
        Plan shortMemory = NetworkPlanner.plan(layout(nodes, stable, 2, Schedule.ROUND_ROBIN), ALL_LINKS);
        assertThat(shortMemory.warnings()).anyMatch(msg -> msg.startsWith("round-robin: species A has a frame of 2 slots"));
    }

    @Test
    void budgetsReleaseOnceAFrame() {
        Species stable = Species.stable("A", 100);
        List<Node> nodes = nodes(300, new Vec3(12, 0, 0), new Vec3(-12, 0, 0), new Vec3(0, 12, 0));
        Plan rr = NetworkPlanner.plan(layout(nodes, stable, 4, Schedule.ROUND_ROBIN), ALL_LINKS);
        assertThat(rr.budgets()).hasSize(3);
        for (BudgetReport b : rr.budgets()) {
            long top = b.moleculesPerSymbolNeeded() > 0 ? b.moleculesPerSymbolNeeded() : 300;
            if (b.feasible()) {
                // binary on-off keying at prior 1/2: mean release N/2 per symbol, one symbol per K·T, K = 3
                assertThat(b.moleculesPerS()).isCloseTo(0.5 * top / (3 * T_S), within(1e-9 * top));
            }
        }
    }

    /**
     * A given (e.g. simulated) channel is decimated the same way: three emitters with taps set by
     * hand, K = 3, L = 7, decoding t0 (k = 0).
     */
    @Test
    void givenChannelIsDecimatedLikeTheAnalyticOne() {
        double[] t0 = {0.020, 0.008, 0.004, 0.003, 0.002, 0.0015, 0.001, 0.0008};
        double[] t1 = {0.015, 0.007, 0.004, 0.002, 0.0015, 0.001, 0.0008, 0.0005};
        double[] t2 = {0.010, 0.006, 0.003, 0.002, 0.001, 0.0008, 0.0005, 0.0004};
        List<Node> nodes = nodes(400, new Vec3(12, 0, 0), new Vec3(-14, 0, 0), new Vec3(0, 16, 0));
        ChannelMatrix given = ChannelMatrix.of(List.of(
                new ChannelEntry("t0", "rx", "A", t0, ChannelMatrix.SIMULATED, null),
                new ChannelEntry("t1", "rx", "A", t1, ChannelMatrix.SIMULATED, null),
                new ChannelEntry("t2", "rx", "A", t2, ChannelMatrix.SIMULATED, null)));
        Plan rr = NetworkPlanner.plan(layout(nodes, Species.stable("A", 100), 7, Schedule.ROUND_ROBIN),
                ALL_LINKS.withChannel(given));
        long[] levels = {0, 400};
        double[] w = {0.5, 0.5};
        // by hand, K = 3, k = 0: own lags 0, 3, 6; t1 (j = 1) at lags 2, 5; t2 (j = 2) at lags 1, 4, 7
        List<CountTerm> others = Crosstalk.exactTerms(List.of(
                new Crosstalk.Interferer("t1", new double[] {t1[2], t1[5]}, levels, w),
                new Crosstalk.Interferer("t2", new double[] {t2[1], t2[4], t2[7]}, levels, w)));
        double expected = LinkEvaluator.evaluate(spec(new double[] {t0[0], t0[3], t0[6]}, 400, 3 * T_S), others)
                .mutualInformationBits();
        // docs/architecture.md §5.6 count model with the round-robin lags derived by hand above
        assertThat(link(rr, "t0").mutualInformationBits()).isCloseTo(expected, within(1e-9));
        assertThat(link(rr, "t0").modelCaveat()).isEqualTo("simulated");
    }
}
