package dev.nanoplan.plan;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import dev.nanoplan.info.Entropy;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.ScenarioReader;
import dev.nanoplan.scenario.Signalling;
import dev.nanoplan.scenario.SwarmGenerator;
import java.nio.file.Path;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.stream.Stream;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * Plans report and use one operating point (docs/architecture.md §5, "Plans use the operating
 * point"): each check recomputes the plan's figures independently from the link's own crossovers.
 */
class OperatingPointPlanTest {

    static Stream<Scenario> layouts() throws Exception {
        return Stream.of(ScenarioReader.strict().read(Path.of("..", "scenarios", "culture-tank.json")),
                SwarmGenerator.generate(60, 3));
    }

    /** h((1−q)e0 + q(1−e1)) − (1−q)h(e0) − q·h(e1): Cover and Thomas 2006, eq. 2.43, by hand. */
    private static double bacBits(double q, double e0, double e1) {
        return Entropy.binaryBits((1 - q) * e0 + q * (1 - e1)) - (1 - q) * Entropy.binaryBits(e0)
                - q * Entropy.binaryBits(e1);
    }

    @ParameterizedTest
    @MethodSource("layouts")
    void linkFiguresAreOnePairAtTheOperatingThreshold(Scenario s) {
        Plan plan = NetworkPlanner.plan(s, PlanOptions.DEFAULT);
        Signalling sig = s.signalling();
        double q = sig.priorOne();
        assertThat(plan.links()).isNotEmpty();
        for (LinkReport l : plan.links()) {
            String at = l.from() + "->" + l.to();
            // the error at τ is the error of the crossovers at τ: (1 − q)ε₀ + qε₁ (definition)
            assertThat(l.errorProbability()).as(at)
                    .isCloseTo((1 - q) * l.crossoverZero() + q * l.crossoverOne(), within(1e-9));
            // the information is that of the same crossovers at the file's prior (Cover and Thomas eq. 2.43)
            assertThat(l.mutualInformationBits()).as(at)
                    .isCloseTo(bacBits(q, l.crossoverZero(), l.crossoverOne()), within(1e-9));
            // the minimum over τ is never above the error at the operating τ (it is a minimum)
            assertThat(l.minErrorProbability()).as(at).isLessThanOrEqualTo(l.errorProbability() + 1e-15);
            // at a fixed prior no detector carries more than the input entropy H(q) (Shannon 1948, I ≤ H(X))
            assertThat(l.mutualInformationBits()).as(at).isLessThanOrEqualTo(Entropy.binaryBits(q) + 1e-12);
            assertThat(l.rateBitsPerS()).as(at).isCloseTo(l.mutualInformationBits() / sig.symbolTimeS(),
                    within(1e-12));
            assertThat(l.countBlind()).as(at)
                    .isEqualTo(Math.min(q, 1 - q) <= s.targets().maxErrorProbability());
            if (l.capacityBits() != null) {
                // capacity ≥ the information at any one prior, the file's included (it is a maximum over priors)
                assertThat(l.capacityBits()).as(at).isGreaterThanOrEqualTo(l.mutualInformationBits() - 1e-9);
            }
        }
    }

    @ParameterizedTest
    @MethodSource("layouts")
    void routesCarryTheCascadeInformationAtTheFilePrior(Scenario s) {
        Plan plan = NetworkPlanner.plan(s, PlanOptions.DEFAULT);
        double q = s.signalling().priorOne();
        Map<String, LinkReport> links = new HashMap<>();
        plan.links().forEach(l -> links.put(l.from() + ">" + l.to(), l));
        int routed = 0;
        for (RouteReport r : plan.routes()) {
            if (!r.reachable()) {
                continue;
            }
            routed++;
            List<String> v = r.hops();
            // independent: multiply the hops' binary crossovers by hand (Silverman 1955)
            double e0 = 0;
            double e1 = 0;
            double weakest = Double.POSITIVE_INFINITY;
            for (int i = 0; i + 1 < v.size(); i++) {
                LinkReport l = links.get(v.get(i) + ">" + v.get(i + 1));
                double n0 = e0 * (1 - l.crossoverOne()) + (1 - e0) * l.crossoverZero();
                double n1 = e1 * (1 - l.crossoverZero()) + (1 - e1) * l.crossoverOne();
                e0 = n0;
                e1 = n1;
                weakest = Math.min(weakest, l.mutualInformationBits());
                // every route hop has its capacity (headroom) filled in
                assertThat(l.capacityBits()).isNotNull();
            }
            double expected = Math.min(bacBits(q, e0, e1), weakest);
            assertThat(r.endToEndCapacityBits()).as("%s->%s", r.from(), r.to()).isCloseTo(expected, within(1e-9));
            assertThat(r.bottleneckCapacityBits()).isCloseTo(weakest, within(1e-15));
            assertThat(r.endToEndCapacityBits()).isLessThanOrEqualTo(r.bottleneckCapacityBits() + 1e-12);
        }
        assertThat(routed).isPositive();
    }
}
