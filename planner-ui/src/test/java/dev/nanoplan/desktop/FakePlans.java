package dev.nanoplan.desktop;

import dev.nanoplan.plan.BudgetReport;
import dev.nanoplan.plan.Impairment;
import dev.nanoplan.plan.LinkReport;
import dev.nanoplan.plan.Plan;
import dev.nanoplan.plan.RouteReport;
import dev.nanoplan.scenario.Demand;
import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.Scenario;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.CopyOnWriteArrayList;

/**
 * A hand-made planner for view-model tests: one link per demand whose "capacity" is a made-up
 * label 1/(1 + distance/100 µm) (no physics: it only has to change when a node moves), a direct
 * route per demand, and one budget per emitter. Records every scenario it is asked to plan.
 */
final class FakePlans implements PlanService {

    final List<Scenario> calls = new CopyOnWriteArrayList<>();

    @Override
    public Plan plan(Scenario s) {
        calls.add(s);
        var byId = s.nodesById();
        List<LinkReport> links = new ArrayList<>();
        List<RouteReport> routes = new ArrayList<>();
        for (Demand d : s.demands()) {
            Node a = byId.get(d.from());
            Node b = byId.get(d.to());
            double c = 1 / (1 + a.positionUm().distance(b.positionUm()) / 100);
            links.add(new LinkReport(d.from(), d.to(), b.species(), 0.1, new double[] {0.1}, 10, 0, 0, 0, 5, 0.01,
                    -2, 5, 0.01, c, c / s.signalling().symbolTimeS(), null, null, 0.01, 0.01, false, Impairment.SIGNAL,
                    null, 0, null));
            routes.add(new RouteReport(d.from(), d.to(), List.of(d.from(), d.to()), c, d.from(), d.to(), c,
                    c / s.signalling().symbolTimeS(), s.signalling().symbolTimeS(), c, Impairment.SIGNAL, "move closer"));
        }
        List<BudgetReport> budgets = s.nodes().stream().filter(n -> n.role().emits())
                .map(n -> new BudgetReport(n.id(), n.moleculesPerSymbol(), 1, 3600, true, "fake", "independent", false)).toList();
        return new Plan(s, "analytic", links, routes, budgets, List.of());
    }
}
