package dev.nanoplan.tolerance;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import dev.nanoplan.plan.LinkReport;
import dev.nanoplan.plan.NetworkPlanner;
import dev.nanoplan.plan.Plan;
import dev.nanoplan.plan.PlanOptions;
import dev.nanoplan.plan.RouteReport;
import dev.nanoplan.plan.SharedRates;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.ScenarioReader;
import dev.nanoplan.scenario.Tolerances;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.EnumSource;

class ZeroTolerancesTest {

    @ParameterizedTest
    @EnumSource(Thresholds.class)
    void withoutTolerancesEveryYieldIsZeroOrOneAndAgreesWithTheNominalPlan(Thresholds thresholds) throws Exception {
        Scenario read = ScenarioReader.strict().read(Path.of("../scenarios/relay-chain-relayed.json"));
        Scenario s = new Scenario(read.name(), read.volume(), read.medium(), read.species(), read.signalling(),
                read.nodes(), read.demands(), read.targets(), Tolerances.NONE);
        ToleranceResult r = new ToleranceRunner(new ToleranceStudy(s, Sampler.SOBOL, 3, thresholds), 2, 0)
                .run(8, k -> { });
        // the nominal plan, independently planned (NetworkPlanner): its minimum error against the target
        Plan plan = NetworkPlanner.plan(s, PlanOptions.DEFAULT);
        double target = s.targets().maxErrorProbability();
        assertThat(r.links()).hasSize(plan.links().size());
        for (int l = 0; l < plan.links().size(); l++) {
            LinkReport link = plan.links().get(l);
            assertThat(r.links().get(l).yield()).as(link.from() + " -> " + link.to())
                    .isEqualTo(link.minErrorProbability() <= target ? 1.0 : 0.0);
            assertThat(r.links().get(l).capacityP50Bits()).isCloseTo(link.mutualInformationBits(),
                    within(1e-9));
        }
        List<SharedRates.Share> shares = SharedRates.of(plan);
        for (int d = 0; d < plan.routes().size(); d++) {
            RouteReport route = plan.routes().get(d);
            boolean hopsMeet = route.reachable();
            for (int h = 0; h + 1 < route.hops().size(); h++) {
                String from = route.hops().get(h);
                String to = route.hops().get(h + 1);
                hopsMeet &= plan.links().stream().filter(x -> x.from().equals(from) && x.to().equals(to))
                        .allMatch(x -> x.minErrorProbability() <= target);
            }
            boolean meets = hopsMeet && shares.get(d).rateBitsPerS() >= s.targets().minRateBitsPerS();
            assertThat(r.demands().get(d).yield()).isEqualTo(meets ? 1.0 : 0.0);
        }
        assertThat(r.redraws()).isZero();
    }
}
