package dev.nanoplan.desktop;

import dev.nanoplan.plan.Plan;
import dev.nanoplan.scenario.Scenario;
import java.util.function.Consumer;

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

    /**
     * As {@link #plan(Scenario)}, telling {@code progress} in a short line what runs (e.g. a simulation's
     * share done); called on the background thread, possibly from other worker threads.
     */
    default Plan plan(Scenario scenario, Consumer<String> progress) {
        return plan(scenario);
    }

    /**
     * A fast approximate plan shown while {@link #plan} runs, or null when the service has none
     * (the default). Called on a background thread; must take milliseconds, not seconds. The view
     * model shows it as a preview until the plan of the same layout replaces it.
     *
     * @throws RuntimeException when the core fails; the preview is then skipped
     */
    default Plan preview(Scenario scenario) {
        return null;
    }

    /** The real planner of planner-core with its default options and the auto channel. */
    static PlanService core() {
        return CorePlanService.INSTANCE;
    }
}
