package dev.nanoplan.desktop;

import static org.assertj.core.api.Assertions.assertThat;

import dev.nanoplan.geometry.Vec3;
import dev.nanoplan.plan.Plan;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.ScenarioReader;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.CopyOnWriteArrayList;
import java.util.concurrent.CountDownLatch;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ScheduledExecutorService;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.Timeout;

/**
 * The background planner without a window: a cancelled or superseded plan never reaches the
 * tables, even when its computation finishes; failures are reported once. Plans come from
 * {@link FakePlans}, held at a gate the test opens.
 */
@Timeout(60)
class PlanSchedulerTest {

    /** Exact plans wait (ignoring interrupts, as a computation past its last check does) until the gate opens. */
    static final class GatedPlans implements PlanService {
        final FakePlans fake = new FakePlans();
        final CountDownLatch started = new CountDownLatch(1);
        final CountDownLatch gate = new CountDownLatch(1);
        volatile RuntimeException failure;

        @Override
        public Plan plan(Scenario s) {
            started.countDown();
            boolean interrupted = false;
            while (true) {
                try {
                    gate.await();
                    break;
                } catch (InterruptedException e) {
                    interrupted = true;
                }
            }
            if (interrupted) {
                Thread.currentThread().interrupt();
            }
            if (failure != null) {
                throw failure;
            }
            return fake.plan(s);
        }
    }

    final List<String> sunk = new CopyOnWriteArrayList<>();
    GatedPlans service;
    ScheduledExecutorService exact;
    ScheduledExecutorService preview;
    PlanScheduler scheduler;
    Scenario tank;

    @BeforeEach
    void setUp() throws Exception {
        service = new GatedPlans();
        exact = PlanScheduler.daemonScheduler("test-exact");
        preview = PlanScheduler.daemonScheduler("test-preview");
        scheduler = new PlanScheduler(service, Runnable::run, exact, 0, preview, 0, new PlanScheduler.Sink() {
            @Override
            public void apply(Plan plan, boolean isPreview) {
                sunk.add((isPreview ? "preview " : "exact ") + plan.scenario().nodesById().get("s01").positionUm().x());
            }

            @Override
            public void failed(Throwable error) {
                sunk.add("failed: " + error.getMessage());
            }
        });
        tank = ScenarioReader.strict().read(Path.of("..", "scenarios", "culture-tank.json"));
    }

    @AfterEach
    void tearDown() {
        exact.shutdownNow();
        preview.shutdownNow();
    }

    /** Waits until every task queued so far on the exact thread has run. */
    void drain() throws Exception {
        exact.submit(() -> { }).get(30, TimeUnit.SECONDS);
    }

    Scenario withS01At(double x) {
        return LayoutEdits.moveNode(tank, List.of(), "s01", new Vec3(x, 200, 100));
    }

    @Test
    void aCancelledPlanThatFinishesAnywayIsDropped() throws Exception {
        scheduler.schedule(tank);
        assertThat(service.started.await(30, TimeUnit.SECONDS)).isTrue();
        assertThat(scheduler.busyProperty().get()).isTrue();
        scheduler.cancel();
        assertThat(scheduler.busyProperty().get()).isFalse();
        service.gate.countDown();
        drain();
        assertThat(sunk).isEmpty();
        assertThat(scheduler.planned()).isNotDone();
        assertThat(scheduler.lastPlanNanos()).isEqualTo(-1);
    }

    @Test
    void aNewerRequestSupersedesTheRunningOne() throws Exception {
        scheduler.schedule(withS01At(100));
        assertThat(service.started.await(30, TimeUnit.SECONDS)).isTrue();
        scheduler.schedule(withS01At(120));
        service.gate.countDown();
        Plan p = scheduler.planned().get(30, TimeUnit.SECONDS);
        drain();
        // only the latest layout's plan is applied, and the future completes with it
        assertThat(p.scenario()).isEqualTo(withS01At(120));
        assertThat(sunk).containsExactly("exact 120.0");
        assertThat(scheduler.busyProperty().get()).isFalse();
        assertThat(scheduler.lastPlanNanos()).isNotNegative();
    }

    @Test
    void aFailureIsReportedOnceAndCompletesTheFutureExceptionally() throws Exception {
        service.failure = new IllegalStateException("no channel");
        scheduler.schedule(tank);
        service.gate.countDown();
        try {
            scheduler.planned().get(30, TimeUnit.SECONDS);
        } catch (ExecutionException expected) {
            assertThat(expected.getCause()).hasMessage("no channel");
        }
        assertThat(scheduler.planned()).isCompletedExceptionally();
        assertThat(sunk).containsExactly("failed: no channel");
        assertThat(scheduler.busyProperty().get()).isFalse();
    }

    @Test
    void aServiceWithoutPreviewNeverCompletesThePreviewFuture() throws Exception {
        service.gate.countDown();
        scheduler.schedule(tank);
        scheduler.planned().get(30, TimeUnit.SECONDS);
        preview.submit(() -> { }).get(30, TimeUnit.SECONDS);
        // PlanService.preview defaults to null: nothing to show before the exact plan
        assertThat(scheduler.previewed()).isNotDone();
        assertThat(sunk).containsExactly("exact 136.0");
    }
}
