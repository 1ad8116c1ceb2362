package dev.nanoplan.desktop;

import static org.assertj.core.api.Assertions.assertThat;

import dev.nanoplan.plan.NetworkPlanner;
import dev.nanoplan.plan.Plan;
import dev.nanoplan.plan.PlanOptions;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.ScenarioReader;
import dev.nanoplan.scenario.SwarmGenerator;
import dev.nanoplan.sim.AutoChannel;
import dev.nanoplan.sim.ParticleSimulator;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.CancellationException;
import java.util.concurrent.CompletableFuture;
import java.util.concurrent.CopyOnWriteArrayList;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.Timeout;
import org.junit.jupiter.api.io.TempDir;

class CorePlanServiceTest {

    @Test
    void leavesOneCoreForTheUserInterface() {
        int cores = Runtime.getRuntime().availableProcessors();
        assertThat(CorePlanService.planThreads()).isEqualTo(Math.max(1, cores - 1));
    }

    @Test
    void planInItsOwnPoolEqualsTheCorePlannerOnTheAutoChannel(@TempDir Path cache) {
        // a walled swarm: the closed forms do not cover some emitters, which are simulated
        Scenario s = SwarmGenerator.generate(30, 3);
        CorePlanService service = new CorePlanService(2000, cache);
        List<String> progress = new CopyOnWriteArrayList<>();
        Plan viaService = service.plan(s, progress::add);
        // source: the core's auto channel run directly (no cache), the command line's `plan --channel auto`
        AutoChannel.Result auto = AutoChannel.obtain(s, PlanOptions.DEFAULT.cutoffMolecules(),
                service.settings().withThreads(1), null, ParticleSimulator::simulate, () -> false, dt -> { });
        assertThat(auto.decision().analyticOnly()).isFalse();
        Plan direct = NetworkPlanner.plan(s, PlanOptions.DEFAULT.withChannel(auto.channel()));
        assertThat(viaService.links()).isEqualTo(direct.links());
        assertThat(viaService.routes()).isEqualTo(direct.routes());
        assertThat(viaService.links()).anyMatch(l -> "simulated".equals(l.channel()));
        // the status line saw the simulation run to its end
        assertThat(progress).anyMatch(t -> t.startsWith("simulating the channel of ") && t.endsWith(": 100 %"));
        assertThat(progress).last().asString().contains("simulated, cached");
        // a second plan of the same layout reads the cache
        List<String> again = new CopyOnWriteArrayList<>();
        assertThat(service.plan(s, again::add).links()).isEqualTo(viaService.links());
        assertThat(again).noneMatch(t -> t.startsWith("simulating")).last().asString().contains("from cache");
    }

    @Test
    void anOpenStillLayoutPlansOnTheClosedFormsWithoutSimulating(@TempDir Path cache) throws Exception {
        Scenario tank = ScenarioReader.strict().read(Path.of("..", "scenarios", "culture-tank.json"));
        List<String> progress = new CopyOnWriteArrayList<>();
        Plan p = new CorePlanService(2000, cache).plan(tank, progress::add);
        // source: docs/architecture.md §5.12, auto equals the analytic plan where the closed forms hold
        assertThat(p.links()).isEqualTo(NetworkPlanner.plan(tank, PlanOptions.DEFAULT).links());
        assertThat(progress).isEmpty();
    }

    @Test
    @Timeout(value = 120, unit = TimeUnit.SECONDS)
    void anInterruptedCallerStopsThePlanAndItsSimulation(@TempDir Path cache) throws Exception {
        // walled: most emitters are simulated, so the interrupt lands in the analytic screen or the simulation
        Scenario s = SwarmGenerator.generate(400, 5);
        CorePlanService service = new CorePlanService(20_000, cache);
        CompletableFuture<Throwable> outcome = new CompletableFuture<>();
        Thread caller = new Thread(() -> {
            try {
                service.plan(s);
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
        assertThat(new CorePlanService(500, cache).plan(SwarmGenerator.generate(20, 1)).links()).isNotNull();
        // a stopped simulation is never cached (only the small layout's complete run is)
        try (var files = Files.list(cache)) {
            assertThat(files.count()).isLessThanOrEqualTo(1);
        }
    }
}
