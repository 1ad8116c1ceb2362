package dev.nanoplan.desktop;

import dev.nanoplan.plan.NetworkPlanner;
import dev.nanoplan.plan.Plan;
import dev.nanoplan.plan.PlanOptions;
import dev.nanoplan.scenario.Scenario;

/** {@link PlanService} backed by planner-core's {@link NetworkPlanner} with {@link PlanOptions#DEFAULT}. */
final class CorePlanService implements PlanService {

    static final CorePlanService INSTANCE = new CorePlanService();

    private CorePlanService() {
    }

    @Override
    public Plan plan(Scenario scenario) {
        return NetworkPlanner.plan(scenario, PlanOptions.DEFAULT);
    }
}
