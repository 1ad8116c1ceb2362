package dev.nanoplan.design;

import dev.nanoplan.plan.IncrementalPlanner;
import dev.nanoplan.plan.Plan;
import dev.nanoplan.plan.PlanOptions;
import dev.nanoplan.plan.PreviewPlanner;
import dev.nanoplan.scenario.Scenario;
import java.util.function.DoubleConsumer;

/**
 * Assesses candidate layouts of a search with incremental re-plans ({@link IncrementalPlanner#whatIf}):
 * a candidate that differs from the current layout in one relay's position or one link group's species
 * re-evaluates only the receivers within the cutoff of what changed, then re-routes; the plan has no
 * budgets or advice (the objective reads neither). {@link #accept} moves the current layout.
 *
 * <p><b>Two planners.</b> {@link #screen} re-plans with the preview planner ({@link PreviewPlanner}: the
 * normal approximation of the counts, milliseconds per re-plan) while the layout is all-active, and with
 * the exact planner otherwise; {@link #assess} always with the exact planner (the scenario's count model).
 * A search screens many candidates and confirms with {@link #assess} only those the screen calls better
 * than the current layout, so the objective it keeps ({@link #current()}) is always the exact one and a
 * layout is never accepted on the preview's word.
 *
 * <p>Not thread-safe; each re-plan evaluates its receivers in parallel as the full plan does, with
 * results independent of the thread count.
 */
final class LayoutEvaluator {

    private final PlanOptions options;
    private final IncrementalPlanner planner;
    /** The preview planner at the current layout, or null when the layout is not all-active. */
    private IncrementalPlanner preview;
    private Assessment current;
    private Assessment currentScreen;
    private int evaluations;
    private int exactEvaluations;

    LayoutEvaluator(Scenario start, PlanOptions options) {
        this.options = options;
        this.planner = IncrementalPlanner.exactWithoutBudgets(start, options);
        this.current = Assessment.of(planner.plan());
        this.evaluations = 1;
        this.exactEvaluations = 1;
        resetPreview(start);
    }

    private void resetPreview(Scenario s) {
        if (PreviewPlanner.supports(s)) {
            preview = IncrementalPlanner.preview(s, options.withProgress(f -> { }));
            currentScreen = Assessment.of(preview.plan());
            evaluations++;
        } else {
            preview = null;
            currentScreen = current;
        }
    }

    /** The accepted layout. */
    Scenario scenario() {
        return planner.scenario();
    }

    /** The exact plan (without budgets or advice) of {@link #scenario()}. */
    Plan plan() {
        return planner.plan();
    }

    /** The exact assessment of {@link #scenario()}. */
    Assessment current() {
        return current;
    }

    /** The screening assessment of {@link #scenario()} (preview or exact, as {@link #screen}). */
    Assessment currentScreen() {
        return currentScreen;
    }

    /** Layouts assessed so far (the first plans included), preview and exact. */
    int evaluations() {
        return evaluations;
    }

    /** Layouts assessed with the exact planner so far. */
    int exactEvaluations() {
        return exactEvaluations;
    }

    /**
     * A screened candidate.
     *
     * @param assessment the preview assessment, or the exact one when {@code exact}
     * @param exact      whether the screen was the exact planner (then no confirmation is needed)
     * @param promising  whether the screen calls the candidate strictly better than the current layout,
     *                   each judged by the same planner
     */
    record Screened(Assessment assessment, boolean exact, boolean promising) {
    }

    /**
     * Screens {@code candidate}: with the preview planner when the current layout and the candidate are
     * all-active (compared with {@link #currentScreen()}), else with the exact one (compared with
     * {@link #current()}); the candidate stays a candidate.
     *
     * @throws IllegalArgumentException as the planner, for a layout it cannot plan
     */
    Screened screen(Scenario candidate) {
        if (preview == null || !PreviewPlanner.supports(candidate)) {
            return exactly(candidate);
        }
        evaluations++;
        Assessment a = Assessment.of(preview.whatIf(candidate));
        return new Screened(a, false, a.objective().betterThan(currentScreen.objective()));
    }

    /** {@code candidate} screened with the exact planner whatever the layout. */
    Screened exactly(Scenario candidate) {
        Assessment a = assess(candidate);
        return new Screened(a, true, a.objective().betterThan(current.objective()));
    }

    /**
     * The exact assessment of {@code candidate}, which stays a candidate.
     *
     * @throws IllegalArgumentException as the planner, for a layout it cannot plan
     */
    Assessment assess(Scenario candidate) {
        evaluations++;
        exactEvaluations++;
        Plan p = planner.whatIf(candidate);
        return Assessment.of(p);
    }

    /**
     * The exact plan of {@link #scenario()} with joint molecule budgets ({@link IncrementalPlanner#withBudgets}),
     * no advice; {@code progress} may throw to end it early.
     */
    Plan withJointBudgets(DoubleConsumer progress) {
        return planner.withBudgets(true, progress);
    }

    /** Makes {@code accepted} the current layout and returns its exact assessment. */
    Assessment accept(Scenario accepted) {
        current = Assessment.of(planner.advance(accepted));
        if (preview != null && PreviewPlanner.supports(accepted)) {
            currentScreen = Assessment.of(preview.advance(accepted));
        } else {
            resetPreview(accepted);
        }
        return current;
    }
}
