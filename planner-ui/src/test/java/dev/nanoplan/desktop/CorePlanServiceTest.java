package dev.nanoplan.desktop;

import static org.assertj.core.api.Assertions.assertThat;

import dev.nanoplan.plan.NetworkPlanner;
import dev.nanoplan.plan.Plan;
import dev.nanoplan.plan.PlanOptions;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.SwarmGenerator;
import java.util.concurrent.CancellationException;
import java.util.concurrent.CompletableFuture;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.Timeout;

class CorePlanServiceTest {

    @Test
    void leavesOneCoreForTheUserInterface() {
        int cores = Runtime.getRuntime().availableProcessors();
        assertThat(CorePlanService.planThreads()).isEqualTo(Math.max(1, cores - 1));
    }

    @Test
    void planInItsOwnPoolEqualsTheCorePlanner() {
        Scenario s = SwarmGenerator.generate(30, 3);
        Plan viaService = CorePlanService.INSTANCE.plan(s);
        Plan direct = NetworkPlanner.plan(s, PlanOptions.DEFAULT);
        assertThat(viaService.links()).isEqualTo(direct.links());
        assertThat(viaService.routes()).isEqualTo(direct.routes());
    }

    @Test
    @Timeout(value = 120, unit = TimeUnit.SECONDS)
    void anInterruptedCallerStopsThePlan() throws Exception {
        Scenario s = SwarmGenerator.generate(400, 5);
        CompletableFuture<Throwable> outcome = new CompletableFuture<>();
        Thread caller = new Thread(() -> {
            try {
                CorePlanService.INSTANCE.plan(s);
                outcome.complete(null);
            } catch (Throwable t) {
                outcome.complete(t);
            }
        });
        caller.start();
        Thread.sleep(200);
        caller.interrupt();
        assertThat(outcome.get(100, TimeUnit.SECONDS)).isInstanceOf(CancellationException.class);
        // the pool is free again: a small plan still completes
        assertThat(CorePlanService.INSTANCE.plan(SwarmGenerator.generate(20, 1)).links()).isNotNull();
    }
}
