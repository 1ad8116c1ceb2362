package dev.nanoplan.scenario;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import dev.nanoplan.geometry.Vec3;
import dev.nanoplan.geometry.Volume;
import java.util.ArrayList;
import java.util.List;
import java.util.stream.LongStream;
import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.simple.RandomSource;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;

class ScenarioValidatorTest {

    static LongStream seeds() {
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(777L);
        return LongStream.generate(rng::nextLong).limit(25);
    }

    /** The grid search finds exactly the overlapping pairs an all-pairs comparison finds. */
    @ParameterizedTest
    @MethodSource("seeds")
    void gridOverlapSearchMatchesBruteForce(long seed) {
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(seed);
        int n = 20 + rng.nextInt(60);
        double side = 40 + 200 * rng.nextDouble();
        List<Node> nodes = new ArrayList<>();
        for (int i = 0; i < n; i++) {
            // Radii spread over two orders of magnitude so cells are coarse for most nodes.
            double r = Math.exp(Math.log(0.2) + Math.log(50) * rng.nextDouble());
            Vec3 p = new Vec3(side * rng.nextDouble(), side * rng.nextDouble(), side * rng.nextDouble());
            nodes.add(Node.receiver("n" + i, p, r, "A"));
        }
        int expected = 0;
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < i; j++) {
                if (nodes.get(i).positionUm().distance(nodes.get(j).positionUm())
                        < nodes.get(i).radiusUm() + nodes.get(j).radiusUm()) {
                    expected++;
                }
            }
        }

        List<ScenarioProblem> problems = ScenarioValidator.check(new Volume.Open(), new Flow.None(),
                List.of(Species.stable("A", 100)), nodes, List.of());

        long overlaps = problems.stream().filter(p -> p.message().startsWith("body overlaps")).count();
        long more = problems.stream().filter(p -> p.path().equals("nodes"))
                .mapToLong(p -> Long.parseLong(p.message().split(" ")[0])).sum();
        assertThat(overlaps + more).isEqualTo(expected);
        assertThat(overlaps).isLessThanOrEqualTo(ScenarioValidator.MAX_OVERLAP_REPORTS);
    }

    @Test
    void scenarioConstructorRunsTheCrossChecks() {
        List<Node> nodes = List.of(Node.transmitter("t", Vec3.ZERO, 1, "A", 10),
                Node.receiver("r", new Vec3(20, 0, 0), 5, "A"));
        assertThatThrownBy(() -> new Scenario("x", new Volume.Open(), Medium.DEFAULT,
                List.of(Species.stable("A", 100), Species.stable("B", 100)), Signalling.withSymbolTime(1), nodes,
                List.of(new Demand("r", "t")), Targets.DEFAULT))
                .isInstanceOf(IllegalArgumentException.class)
                .hasMessageContaining("species[1].name")
                .hasMessageContaining("demands[0].from")
                .hasMessageContaining("demands[0].to");
    }

    @Test
    void poiseuilleNeedsACylinder() {
        List<Node> nodes = List.of(Node.transmitter("t", new Vec3(10, 0, 0), 1, "A", 10));
        List<Species> species = List.of(Species.stable("A", 100));
        assertThat(ScenarioValidator.check(new Volume.Cylinder(5, 100), new Flow.Poiseuille(100), species, nodes,
                List.of())).isEmpty();
        assertThat(ScenarioValidator.check(new Volume.Open(), new Flow.Poiseuille(100), species, nodes, List.of()))
                .extracting(ScenarioProblem::path).containsExactly("medium.flow.profile");
    }

    @Test
    void poiseuilleProfileHasTwiceTheMeanOnTheAxis() {
        Flow.Poiseuille f = new Flow.Poiseuille(100);
        // Hagen–Poiseuille: v(rho) = 2u(1 - rho²/R²) (White, Fluid Mechanics, 2011, §6.4).
        assertThat(f.axialSpeedUmPerS(0, 10)).isEqualTo(200.0);
        assertThat(f.axialSpeedUmPerS(5, 10)).isEqualTo(150.0);
        assertThat(f.axialSpeedUmPerS(10, 10)).isZero();
    }
}
