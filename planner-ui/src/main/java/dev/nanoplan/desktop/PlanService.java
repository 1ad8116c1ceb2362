package dev.nanoplan.desktop;

import dev.nanoplan.plan.Plan;
import dev.nanoplan.scenario.Scenario;

/**
 * What the desktop planner needs from planner-core to turn a layout into a plan. The production
 * implementation is {@link #core()}; tests pass hand-made plans.
 */
@FunctionalInterface
public interface PlanService {

    /**
     * Plans a validated scenario. Called on a background thread, never on the FX thread.
     *
     * @throws RuntimeException when the core fails; the view model shows the message
     */
    Plan plan(Scenario scenario);

    /** The real planner of planner-core with its default options. */
    static PlanService core() {
        return CorePlanService.INSTANCE;
    }
}
