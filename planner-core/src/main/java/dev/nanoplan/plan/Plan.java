package dev.nanoplan.plan;

import dev.nanoplan.scenario.Scenario;
import java.util.List;

/**
 * A complete plan of one scenario.
 *
 * @param scenario the planned layout
 * @param channel  "analytic" or "simulated"
 * @param links    every evaluated link above the capacity floor
 * @param routes   one per demand, in the scenario's order
 * @param budgets  one per emitting node
 * @param warnings human-readable notes (model caveats, skipped pairs, unreachable demands)
 */
public record Plan(Scenario scenario, String channel, List<LinkReport> links, List<RouteReport> routes,
        List<BudgetReport> budgets, List<String> warnings) {

    public Plan {
        links = List.copyOf(links);
        routes = List.copyOf(routes);
        budgets = List.copyOf(budgets);
        warnings = List.copyOf(warnings);
    }
}
