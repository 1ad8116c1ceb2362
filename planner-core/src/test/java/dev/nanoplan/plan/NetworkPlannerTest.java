package dev.nanoplan.plan;

import static org.assertj.core.api.Assertions.assertThat;

import dev.nanoplan.geometry.Vec3;
import dev.nanoplan.geometry.Volume;
import dev.nanoplan.report.PlanText;
import dev.nanoplan.scenario.Demand;
import dev.nanoplan.scenario.Medium;
import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.ScenarioReader;
import dev.nanoplan.scenario.Signalling;
import dev.nanoplan.scenario.Species;
import dev.nanoplan.scenario.Targets;
import dev.nanoplan.scenario.Flow;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.stream.LongStream;
import java.util.stream.Stream;
import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.simple.RandomSource;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;

class NetworkPlannerTest {

    static Stream<Path> bundled() throws Exception {
        Path dir = Path.of("").toAbsolutePath();
        while (!Files.isDirectory(dir.resolve("scenarios"))) {
            dir = dir.getParent();
        }
        return Files.list(dir.resolve("scenarios")).filter(p -> p.toString().endsWith(".json")
                && !p.getFileName().toString().contains("schema")).sorted().toList().stream();
    }

    @ParameterizedTest
    @MethodSource("bundled")
    void bundledScenariosPlanAndEveryDemandGetsARouteOrAReason(Path file) throws Exception {
        Scenario s = ScenarioReader.strict().read(file);
        Plan p = NetworkPlanner.plan(s, PlanOptions.DEFAULT);
        assertThat(p.routes()).hasSize(s.demands().size());
        for (RouteReport r : p.routes()) {
            if (r.reachable()) {
                // data-processing inequality (Cover & Thomas 2006, Thm 2.8.1): cascade <= weakest hop
                assertThat(r.endToEndCapacityBits()).isLessThanOrEqualTo(r.bottleneckCapacityBits() + 1e-12);
                assertThat(r.advice()).isNotBlank();
            } else {
                assertThat(r.advice()).startsWith("no route");
            }
        }
        assertThat(PlanText.render(p)).contains(dev.nanoplan.report.Cautions.SHORT);
    }

    static Stream<Long> seeds() {
        return LongStream.range(1, 7).boxed();
    }

    private static Scenario layout(List<Node> nodes, double backgroundPerS, int memory) {
        return new Scenario("t", new Volume.Open(), new Medium(310.15, 0.69, new Flow.None(), backgroundPerS),
                List.of(Species.stable("A", 100)),
                new Signalling(1.0, memory, 2, 0.5, dev.nanoplan.count.CountModelKind.EXACT,
                        dev.nanoplan.scenario.Schedule.ALL_ACTIVE),
                nodes, List.of(new Demand("t0", "rx")), Targets.DEFAULT);
    }

    /** The link's information as the plan reports it: the operating point (mutual information at the prior). */
    private static double capacity(Plan p, String from, String to) {
        return p.links().stream().filter(l -> l.from().equals(from) && l.to().equals(to))
                .mapToDouble(LinkReport::mutualInformationBits).findFirst().orElse(0);
    }

    @ParameterizedTest
    @MethodSource("seeds")
    void addingAnInterfererNeverRaisesAnyLinksCapacity(long seed) {
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(seed);
        List<Node> nodes = new ArrayList<>();
        nodes.add(Node.receiver("rx", Vec3.ZERO, 5, "A"));
        nodes.add(Node.transmitter("t0", new Vec3(15 + 10 * rng.nextDouble(), 0, 0), 1, "A", 500));
        nodes.add(Node.transmitter("t1", new Vec3(0, 20 + 10 * rng.nextDouble(), 0), 1, "A", 400));
        Scenario before = layout(nodes, 0.5, 2);
        List<Node> more = new ArrayList<>(nodes);
        more.add(Node.transmitter("t2", new Vec3(0, 0, 18 + 10 * rng.nextDouble()), 1, "A",
                100 + rng.nextInt(400)));
        Scenario after = layout(more, 0.5, 2);
        PlanOptions o = PlanOptions.withFloor(0);
        Plan a = NetworkPlanner.plan(before, o);
        Plan b = NetworkPlanner.plan(after, o);
        // common practice (data processing): an added independent noise term cannot help detection
        for (String tx : List.of("t0", "t1")) {
            assertThat(capacity(b, tx, "rx")).isLessThanOrEqualTo(capacity(a, tx, "rx") + 1e-9);
        }
    }

    @ParameterizedTest
    @MethodSource("seeds")
    void movingTheReceiverCloserNeverLowersItsOwnLinkWithoutIsi(long seed) {
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(seed + 100);
        double far = 20 + 20 * rng.nextDouble();
        double near = 7 + (far - 7) * rng.nextDouble();
        PlanOptions o = PlanOptions.withFloor(0);
        double[] c = new double[2];
        double[] d = {far, near};
        for (int i = 0; i < 2; i++) {
            List<Node> nodes = List.of(Node.receiver("rx", new Vec3(d[i], 0, 0), 5, "A"),
                    Node.transmitter("t0", Vec3.ZERO, 1, "A", 300));
            c[i] = capacity(NetworkPlanner.plan(layout(nodes, 1.0, 0), o), "t0", "rx");
        }
        // Redner 2001: F(T) = (r/d) erfc((d-r)/sqrt(4DT)) decreases with d, and a binomial count with
        // more success probability is stochastically larger (common practice)
        assertThat(c[1]).isGreaterThanOrEqualTo(c[0] - 1e-9);
    }
}
