package dev.nanoplan.plan;

import dev.nanoplan.scenario.Scenario;
import java.util.List;

/** TEMP placeholder (drop at merge): a plan with no links and every demand unreachable. */
public final class NetworkPlanner {

    private NetworkPlanner() {
    }

    /** TEMP. */
    public static Plan plan(Scenario scenario, PlanOptions options) {
        List<RouteReport> routes = scenario.demands().stream()
                .map(d -> new RouteReport(d.from(), d.to(), List.of(), 0, null, null, 0, 0, 0, null, null,
                        "placeholder planner"))
                .toList();
        return new Plan(scenario, "analytic", List.of(), routes, List.of(), List.of("placeholder planner"));
    }
}
