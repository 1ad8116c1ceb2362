package dev.nanoplan.report;

import dev.nanoplan.geometry.Vec3;
import dev.nanoplan.geometry.Volume;
import dev.nanoplan.plan.BudgetReport;
import dev.nanoplan.plan.Impairment;
import dev.nanoplan.plan.LinkReport;
import dev.nanoplan.plan.Plan;
import dev.nanoplan.plan.RouteReport;
import dev.nanoplan.scenario.Demand;
import dev.nanoplan.scenario.Medium;
import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.Signalling;
import dev.nanoplan.scenario.Species;
import dev.nanoplan.scenario.Targets;
import java.util.ArrayList;
import java.util.List;

/**
 * Hand-made plans for report-layout tests. The numbers are invented demo values: these tests check
 * formatting and drawing, not physics.
 */
final class PlanFixtures {

    private PlanFixtures() {
    }

    /** A 400 × 400 × 200 µm box with two sensors, a relay, a gateway and a fourth node named {@code oddId}. */
    static Plan demo(String oddId) {
        List<Node> nodes = List.of(
                Node.transmitter("s1", new Vec3(100, 100, 100), 2, "A", 4000),
                Node.transmitter("s2", new Vec3(300, 120, 80), 2, "A", 6000),
                Node.relay("relay", new Vec3(200, 200, 100), 5, "A", "B", 8000),
                Node.receiver("gw", new Vec3(320, 300, 100), 10, "B"),
                Node.transmitter(oddId, new Vec3(60, 330, 120), 2, "B", 1000));
        Scenario s = new Scenario("Demo tank, \"quoted\" & <b>bold</b>",
                new Volume.Box(new Vec3(0, 0, 0), new Vec3(400, 400, 200)), Medium.DEFAULT,
                List.of(Species.stable("A", 80), Species.ofDiffusion("B", 300, 120)),
                Signalling.withSymbolTime(1.0), nodes,
                List.of(new Demand("s1", "gw"), new Demand("s2", "gw"), new Demand(oddId, "gw"),
                        new Demand(oddId, "relay")),
                new Targets(1e-3, 0.5, 3600));
        List<LinkReport> links = List.of(
                link("s1", "relay", "A", 0.82, 2e-5, Impairment.ISI, "s2", 0.9),
                link("s2", "relay", "A", 0.55, 3e-3, Impairment.CROSSTALK, "s1", 0.7),
                link("relay", "gw", "B", 0.97, 0.0, Impairment.SIGNAL, oddId, 0.4),
                link(oddId, "gw", "B", 0.12, 0.2, Impairment.NOISE, "relay", 0.6));
        List<RouteReport> routes = List.of(
                new RouteReport("s1", "gw", List.of("s1", "relay", "gw"), 0.82, "s1", "relay", 0.80, 0.80, 2.0,
                        null, Impairment.ISI, "lengthen the symbol time"),
                new RouteReport("s2", "gw", List.of("s2", "relay", "gw"), 0.55, "s2", "relay", 0.53, 0.53, 2.0,
                        null, Impairment.CROSSTALK, "move s2 closer to relay"),
                new RouteReport(oddId, "gw", List.of(oddId, "gw"), 0.12, oddId, "gw", 0.12, 0.12, 1.0, 0.12,
                        Impairment.NOISE, "add a relay, a \"<b>\" hint"),
                new RouteReport(oddId, "relay", List.of(), 0, null, null, 0, 0, 0, null, null,
                        "no path: relay senses A, " + oddId + " emits B"));
        List<BudgetReport> budgets = List.of(
                new BudgetReport("s1", 3100, 1550, 5.58e6, true, "route hop s1 → relay", "independent", false),
                new BudgetReport("relay", 9000, 9000, 3.24e7, true, "forwards s1, s2", "independent", false),
                new BudgetReport(oddId, -1, Double.NaN, Double.POSITIVE_INFINITY, false, "target out of reach", "independent",
                        false));
        return new Plan(s, "analytic", links, routes, budgets,
                List.of("walls ignored by the closed form", "node <" + oddId + "> is far"));
    }

    static LinkReport link(String from, String to, String species, double capacityBits, double error,
            Impairment limitedBy, String topInterferer, double share) {
        double[] taps = {0.03, 0.012, 0.004, 0.002};
        double log10 = error > 0 ? Math.log10(error) : -412.5;
        return new LinkReport(from, to, species, taps[0], taps, 120.0, 14.5, 9.25, 5.0, 61, error, log10,
                61, error, capacityBits, capacityBits / 1.0, capacityBits, 0.5, error, error, false, limitedBy,
                topInterferer, share, null);
    }

    /**
     * A grid of {@code side × side} alternating transmitters and receivers in a box, with links
     * from every transmitter to its right-hand neighbour receiver, capacities 0..1 by position,
     * and one route.
     */
    static Plan grid(int side) {
        List<Node> nodes = new ArrayList<>();
        for (int i = 0; i < side; i++) {
            for (int j = 0; j < side; j++) {
                String id = "n" + i + "_" + j;
                Vec3 p = new Vec3(10 + 20 * i, 10 + 20 * j, 50);
                nodes.add((i + j) % 2 == 0 ? Node.transmitter(id, p, 1, "A", 100) : Node.receiver(id, p, 1, "A"));
            }
        }
        List<LinkReport> links = new ArrayList<>();
        for (int i = 0; i + 1 < side; i++) {
            for (int j = 0; j < side; j++) {
                String from = "n" + i + "_" + j;
                String to = "n" + (i + 1) + "_" + j;
                if ((i + j) % 2 == 0) {
                    double cap = (i * side + j) / (double) (side * side);
                    links.add(link(from, to, "A", cap, 0.1, Impairment.SIGNAL, null, 0));
                }
            }
        }
        Scenario s = new Scenario("grid", new Volume.Box(new Vec3(0, 0, 0), new Vec3(20.0 * side, 20.0 * side, 100)),
                Medium.DEFAULT, List.of(Species.stable("A", 80)), Signalling.withSymbolTime(1.0), nodes,
                List.of(new Demand("n0_0", "n1_0")), Targets.DEFAULT);
        RouteReport r = new RouteReport("n0_0", "n1_0", List.of("n0_0", "n1_0"), 0, "n0_0", "n1_0", 0, 0, 1, 0.0,
                Impairment.SIGNAL, "move closer");
        return new Plan(s, "analytic", links, List.of(r), List.of(), List.of());
    }
}
