package dev.nanoplan.desktop;

import static org.assertj.core.api.Assertions.assertThat;

import dev.nanoplan.geometry.Vec3;
import dev.nanoplan.plan.Plan;
import dev.nanoplan.plan.PreviewPlanner;
import dev.nanoplan.scenario.Scenario;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.CancellationException;
import java.util.concurrent.CopyOnWriteArrayList;
import java.util.concurrent.CountDownLatch;
import java.util.concurrent.ScheduledExecutorService;
import java.util.concurrent.Semaphore;
import java.util.concurrent.TimeUnit;
import java.util.function.BooleanSupplier;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.Timeout;

/** The progressive update: preview first, then the exact plan; a newer edit supersedes both. */
@Timeout(60)
class PlannerViewModelPreviewTest {

    static final Path TANK = Path.of("..", "scenarios", "culture-tank.json");

    /**
     * Exact plans from {@link FakePlans}, held back until the test releases one permit each
     * (interruptible, as a cancelled core plan is); previews are the same fake plan with the
     * preview warning first. Records the order of calls.
     */
    static final class GatedPlans implements PlanService {
        final FakePlans fake = new FakePlans();
        final Semaphore exactPermits = new Semaphore(0);
        final List<String> calls = new CopyOnWriteArrayList<>();

        @Override
        public Plan plan(Scenario s) {
            calls.add("exact " + s.nodesById().get("s01").positionUm().x());
            try {
                exactPermits.acquire();
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
                throw new CancellationException("cancelled");
            }
            return fake.plan(s);
        }

        @Override
        public Plan preview(Scenario s) {
            calls.add("preview " + s.nodesById().get("s01").positionUm().x());
            Plan p = fake.plan(s);
            return new Plan(s, p.channel(), p.links(), p.routes(), List.of(), List.of(PreviewPlanner.WARNING));
        }
    }

    GatedPlans service;
    ScheduledExecutorService exactThread;
    ScheduledExecutorService previewThread;
    PlannerViewModel vm;
    final List<Plan> applied = new CopyOnWriteArrayList<>();

    @BeforeEach
    void setUp() {
        service = new GatedPlans();
        exactThread = PlannerViewModel.daemonScheduler();
        previewThread = PlannerViewModel.daemonScheduler("test-preview");
        // exact plans debounced by 50 ms, previews at once, results applied on the calling thread
        vm = new PlannerViewModel(service, Runnable::run, exactThread, 50, previewThread, 0, new RecentFiles(null));
        vm.tables().planProperty().addListener((o, a, b) -> applied.add(b));
    }

    @AfterEach
    void tearDown() {
        exactThread.shutdownNow();
        previewThread.shutdownNow();
    }

    @Test
    void thePreviewIsShownFirstAndTheExactPlanReplacesIt() throws Exception {
        assertThat(vm.open(TANK)).isTrue();
        Plan preview = vm.plans().previewed().get(10, TimeUnit.SECONDS);
        assertThat(PreviewPlanner.isPreview(preview)).isTrue();
        assertThat(vm.tables().planProperty().get()).isSameAs(preview);
        assertThat(vm.tables().previewShownProperty().get()).isTrue();
        assertThat(vm.plans().busyProperty().get()).isTrue();
        assertThat(vm.plans().planned()).isNotDone();

        service.exactPermits.release();
        Plan exact = vm.plans().planned().get(10, TimeUnit.SECONDS);
        assertThat(PreviewPlanner.isPreview(exact)).isFalse();
        assertThat(vm.tables().planProperty().get()).isSameAs(exact);
        assertThat(vm.tables().previewShownProperty().get()).isFalse();
        assertThat(vm.plans().busyProperty().get()).isFalse();
        assertThat(applied).containsExactly(preview, exact);
        // the preview has no budgets: the table only ever shows exact budgets
        assertThat(vm.tables().budgets()).isEqualTo(exact.budgets());
    }

    @Test
    void keepingADesignDuringAPreviewKeepsItsExactPlan() throws Exception {
        assertThat(vm.open(TANK)).isTrue();
        Plan preview = vm.plans().previewed().get(10, TimeUnit.SECONDS);
        vm.keepForComparison();
        assertThat(vm.tables().baselineProperty().get()).isNull();
        service.exactPermits.release();
        Plan exact = vm.plans().planned().get(10, TimeUnit.SECONDS);
        // the keeping runs as the exact plan's future completes, beside this thread's wake-up: wait for it
        waitFor(() -> vm.messageProperty().get().startsWith("kept"));
        assertThat(vm.tables().baselineProperty().get()).isSameAs(exact).isNotSameAs(preview);
        assertThat(vm.messageProperty().get()).isEqualTo("kept the current design for comparison");
    }

    @Test
    void aDesignEditedBeforeItsExactPlanIsNotKept() throws Exception {
        assertThat(vm.open(TANK)).isTrue();
        vm.plans().previewed().get(10, TimeUnit.SECONDS);
        vm.keepForComparison();
        assertThat(vm.editor().moveNode("s01", new Vec3(60, 60, 60))).isTrue();
        vm.plans().previewed().get(10, TimeUnit.SECONDS);
        service.exactPermits.release(2);
        Plan exact = vm.plans().planned().get(10, TimeUnit.SECONDS);
        assertThat(exact.scenario().nodesById().get("s01").positionUm()).isEqualTo(new Vec3(60, 60, 60));
        waitFor(() -> vm.messageProperty().get().contains("nothing kept"));
        assertThat(vm.tables().baselineProperty().get()).isNull();
    }

    /** Polls (10 s at most) for a state another thread sets; fails when it never comes. */
    static void waitFor(BooleanSupplier condition) throws InterruptedException {
        long end = System.nanoTime() + TimeUnit.SECONDS.toNanos(10);
        while (!condition.getAsBoolean()) {
            assertThat(System.nanoTime()).as("waited 10 s for the view model").isLessThan(end);
            Thread.sleep(5);
        }
    }

    @Test
    void aNewerEditSupersedesBothThePreviewAndTheExactPlanOfTheOlderLayout() throws Exception {
        assertThat(vm.open(TANK)).isTrue();
        service.exactPermits.release();
        vm.plans().planned().get(10, TimeUnit.SECONDS);
        applied.clear();

        assertThat(vm.editor().moveNode("s01", new Vec3(60, 60, 60))).isTrue();
        Plan firstPreview = vm.plans().previewed().get(10, TimeUnit.SECONDS);
        awaitCall("exact 60.0");
        // the exact plan of the first move is running (blocked) when the second move comes
        assertThat(vm.editor().moveNode("s01", new Vec3(70, 60, 60))).isTrue();
        Plan secondPreview = vm.plans().previewed().get(10, TimeUnit.SECONDS);
        assertThat(vm.tables().previewShownProperty().get()).isTrue();
        service.exactPermits.release();
        Plan exact = vm.plans().planned().get(10, TimeUnit.SECONDS);

        assertThat(exact.scenario().nodesById().get("s01").positionUm()).isEqualTo(new Vec3(70, 60, 60));
        // the first move's exact plan was interrupted and never applied
        assertThat(applied).containsExactly(firstPreview, secondPreview, exact);
        assertThat(vm.tables().previewShownProperty().get()).isFalse();
        assertThat(service.exactPermits.availablePermits()).isZero();
    }

    @Test
    void aPreviewThatComesAfterTheExactPlanIsDropped() throws Exception {
        CountDownLatch previewGate = new CountDownLatch(1);
        PlanService slowPreview = new PlanService() {
            final FakePlans fake = new FakePlans();

            @Override
            public Plan plan(Scenario s) {
                return fake.plan(s);
            }

            @Override
            public Plan preview(Scenario s) {
                try {
                    previewGate.await();
                } catch (InterruptedException e) {
                    Thread.currentThread().interrupt();
                }
                return fake.plan(s);
            }
        };
        PlannerViewModel late = new PlannerViewModel(slowPreview, Runnable::run, exactThread, 0, previewThread, 0,
                new RecentFiles(null));
        assertThat(late.open(TANK)).isTrue();
        Plan exact = late.plans().planned().get(10, TimeUnit.SECONDS);
        previewGate.countDown();
        // let the preview thread finish its (dropped) result
        previewThread.submit(() -> { }).get(10, TimeUnit.SECONDS);
        assertThat(late.tables().planProperty().get()).isSameAs(exact);
        assertThat(late.tables().previewShownProperty().get()).isFalse();
        assertThat(late.plans().previewed()).isNotDone();
    }

    @Test
    void theRealServicesPublishTheCorePreviewThenTheExactPlan() throws Exception {
        PlannerViewModel real = new PlannerViewModel(PlanService.core(), Runnable::run, exactThread, 0, previewThread,
                0, new RecentFiles(null));
        List<Plan> seen = new CopyOnWriteArrayList<>();
        real.tables().planProperty().addListener((o, a, b) -> seen.add(b));
        assertThat(real.open(TANK)).isTrue();
        Plan exact = real.plans().planned().get(50, TimeUnit.SECONDS);
        assertThat(PreviewPlanner.isPreview(exact)).isFalse();
        assertThat(real.tables().planProperty().get()).isSameAs(exact);
        assertThat(seen).last().isSameAs(exact);
        // the preview (milliseconds) normally wins the race against the exact plan (seconds); if the
        // machine starved it, it was dropped, never shown after the exact plan
        assertThat(seen).hasSizeBetween(1, 2);
        if (seen.size() == 2) {
            assertThat(PreviewPlanner.isPreview(seen.get(0))).isTrue();
            assertThat(seen.get(0).links()).isNotEmpty();
        }
    }

    private void awaitCall(String call) throws InterruptedException {
        long end = System.nanoTime() + TimeUnit.SECONDS.toNanos(10);
        while (!service.calls.contains(call) && System.nanoTime() < end) {
            Thread.sleep(5);
        }
        assertThat(service.calls).contains(call);
    }
}
