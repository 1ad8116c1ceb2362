package dev.nanoplan.design;

import dev.nanoplan.plan.IncrementalPlanner;
import dev.nanoplan.plan.Plan;
import dev.nanoplan.plan.PlanOptions;
import dev.nanoplan.scenario.Scenario;

/**
 * Assesses candidate layouts of a search with incremental re-plans ({@link IncrementalPlanner#whatIf}):
 * a candidate that differs from the current layout in one relay's position or one link group's species
 * re-evaluates only the receivers within the cutoff of what changed, then re-routes; the plan has no
 * budgets or advice (the objective reads neither). {@link #accept} moves the current layout.
 *
 * <p>Not thread-safe; each re-plan evaluates its receivers in parallel as the full plan does, with
 * results independent of the thread count.
 */
final class LayoutEvaluator {

    private final IncrementalPlanner planner;
    private Assessment current;
    private int evaluations;

    LayoutEvaluator(Scenario start, PlanOptions options) {
        this.planner = IncrementalPlanner.exactWithoutBudgets(start, options);
        this.current = Assessment.of(planner.plan());
        this.evaluations = 1;
    }

    /** The accepted layout. */
    Scenario scenario() {
        return planner.scenario();
    }

    /** The plan (without budgets or advice) of {@link #scenario()}. */
    Plan plan() {
        return planner.plan();
    }

    /** The assessment of {@link #scenario()}. */
    Assessment current() {
        return current;
    }

    /** Layouts assessed so far (the first plan included). */
    int evaluations() {
        return evaluations;
    }

    /** The assessment of {@code candidate}, which stays a candidate. */
    Assessment assess(Scenario candidate) {
        evaluations++;
        Plan p = planner.whatIf(candidate);
        return Assessment.of(p);
    }

    /** Makes {@code accepted} the current layout and returns its assessment. */
    Assessment accept(Scenario accepted) {
        current = Assessment.of(planner.advance(accepted));
        return current;
    }
}
