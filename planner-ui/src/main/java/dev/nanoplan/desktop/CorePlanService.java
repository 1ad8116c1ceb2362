package dev.nanoplan.desktop;

import dev.nanoplan.plan.NetworkPlanner;
import dev.nanoplan.plan.Plan;
import dev.nanoplan.plan.PlanOptions;
import dev.nanoplan.plan.PreviewPlanner;
import dev.nanoplan.scenario.Scenario;
import java.util.concurrent.CancellationException;

/**
 * {@link PlanService} backed by planner-core's {@link NetworkPlanner} with {@link PlanOptions#DEFAULT},
 * and {@link PreviewPlanner} for the preview.
 *
 * <p>Cancellation: the exact plan checks, at every progress report of the core (once per receiver),
 * whether the thread that asked for it has been interrupted (the view model cancels a superseded
 * plan with {@code Future.cancel(true)}), and if so stops with a {@link CancellationException}, so
 * a newer edit does not wait for a stale plan to finish.
 */
final class CorePlanService implements PlanService {

    static final CorePlanService INSTANCE = new CorePlanService();

    private CorePlanService() {
    }

    @Override
    public Plan plan(Scenario scenario) {
        Thread caller = Thread.currentThread();
        return NetworkPlanner.plan(scenario, PlanOptions.DEFAULT.withProgress(f -> {
            if (caller.isInterrupted()) {
                throw new CancellationException("superseded by a newer edit");
            }
        }));
    }

    @Override
    public Plan preview(Scenario scenario) {
        if (!PreviewPlanner.supports(scenario)) {
            return null;
        }
        return PreviewPlanner.plan(scenario, PlanOptions.DEFAULT);
    }
}
