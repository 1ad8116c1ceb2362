package dev.nanoplan.plan;

import static org.assertj.core.api.Assertions.assertThat;

import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.SwarmGenerator;
import org.junit.jupiter.api.Test;

/** The designed benchmark swarms route most of their demands (they time a connected design). */
class DesignedSwarmRoutesTest {

    @Test
    void mostDemandsOfADesignedSwarmRoute() {
        // the preview (the exact plan routed 814 of 814 demands of designed(1000, 1) as well, by hand)
        Scenario s = SwarmGenerator.designed(300, 1);
        Plan p = PreviewPlanner.plan(s, PlanOptions.DEFAULT);
        long routed = p.routes().stream().filter(RouteReport::reachable).count();
        // source: the design goal of the generator (every sensor within ~20 µm of a relay, relays within
        // ~50 µm of the gateway); at least 90 % of the demands, counted by the plan
        assertThat(routed).isGreaterThanOrEqualTo((long) Math.ceil(0.9 * s.demands().size()));
    }
}
