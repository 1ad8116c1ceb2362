package dev.nanoplan.desktop;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import dev.nanoplan.count.CountModelKind;
import dev.nanoplan.geometry.Vec3;
import dev.nanoplan.geometry.Volume;
import dev.nanoplan.plan.LinkReport;
import dev.nanoplan.plan.NetworkPlanner;
import dev.nanoplan.plan.Plan;
import dev.nanoplan.plan.PlanOptions;
import dev.nanoplan.scenario.Demand;
import dev.nanoplan.scenario.Medium;
import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.Schedule;
import dev.nanoplan.scenario.Signalling;
import dev.nanoplan.scenario.Species;
import dev.nanoplan.scenario.Targets;
import dev.nanoplan.sim.ChannelCache;
import dev.nanoplan.sim.LinkComparison;
import dev.nanoplan.sim.ParticleSimulator;
import dev.nanoplan.sim.SimulationComparison;
import dev.nanoplan.sim.SimulationSettings;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.attribute.FileTime;
import java.util.List;
import java.util.concurrent.BlockingQueue;
import java.util.concurrent.CopyOnWriteArrayList;
import java.util.concurrent.CountDownLatch;
import java.util.concurrent.Executor;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.LinkedBlockingQueue;
import java.util.concurrent.ScheduledExecutorService;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicInteger;
import java.util.function.Function;
import javafx.beans.property.StringProperty;
import javafx.collections.ListChangeListener;
import org.apache.commons.numbers.gamma.Erfc;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.Timeout;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * The Simulation tab's view model without a window: runs on tiny open-medium layouts (a few
 * thousand molecule trajectories of a few hundred steps, well under a second each), compared with
 * planner-core called directly and with the closed form of the absorbing sphere.
 */
@Timeout(60)
class SimulationViewModelTest {

    static final double D_UM2_PER_S = 100;
    static final double T_S = 1;

    ScheduledExecutorService planning;
    ExecutorService bgThread;
    AtomicInteger started;
    PlannerViewModel planner;
    SimulationViewModel sim;

    @BeforeEach
    void setUp() {
        planning = PlannerViewModel.daemonScheduler();
        planner = new PlannerViewModel(new FakePlans(), Runnable::run, planning, 0,
                new RecentFiles(null));
        bgThread = Executors.newSingleThreadExecutor(r -> {
            Thread t = new Thread(r, "test-simulation");
            t.setDaemon(true);
            return t;
        });
        started = new AtomicInteger();
        Executor counting = task -> {
            started.incrementAndGet();
            bgThread.execute(task);
        };
        // one simulator thread: results do not depend on it (ParticleSimulator's seeding), and the
        // test machine's cores are shared
        sim = new SimulationViewModel(planner, Runnable::run, counting, 1);
    }

    @AfterEach
    void tearDown() {
        bgThread.shutdownNow();
        planning.shutdownNow();
    }

    /** Open medium: a transmitter at the origin, receivers rx1 (r = 5 µm) at 10 µm and rx2 (r = 4 µm) at 12 µm. */
    static Scenario threeNodes() {
        return scenario(List.of(Node.transmitter("tx", Vec3.ZERO, 0.5, "A", 1000),
                Node.receiver("rx1", new Vec3(10, 0, 0), 5, "A"),
                Node.receiver("rx2", new Vec3(0, 12, 0), 4, "A")), List.of(new Demand("tx", "rx1")));
    }

    /** Open medium: one transmitter at the origin, one receiver of radius 5 µm centred 10 µm away. */
    static Scenario pair() {
        return scenario(List.of(Node.transmitter("tx", Vec3.ZERO, 0.5, "A", 1000),
                Node.receiver("rx", new Vec3(10, 0, 0), 5, "A")), List.of(new Demand("tx", "rx")));
    }

    static Scenario scenario(List<Node> nodes, List<Demand> demands) {
        return new Scenario("tiny", new Volume.Open(), Medium.DEFAULT, List.of(Species.stable("A", D_UM2_PER_S)),
                new Signalling(T_S, 1, 2, 0.5, CountModelKind.EXACT, Schedule.ALL_ACTIVE), nodes, demands,
                Targets.DEFAULT);
    }

    SimulationViewModel.Outcome runToEnd() throws Exception {
        assertThat(sim.run()).as(sim.statusProperty().get()).isTrue();
        return sim.finished().get(40, TimeUnit.SECONDS);
    }

    @Test
    void runReachesFullProgressAndShowsOneRowPerComparedLink() throws Exception {
        Scenario s = threeNodes();
        planner.load(s, null);
        sim.moleculesPerEmitterProperty().set("5000");
        sim.seedProperty().set("7");
        List<Double> seen = new CopyOnWriteArrayList<>();
        sim.progressProperty().addListener((o, a, b) -> seen.add(b.doubleValue()));
        assertThat(sim.estimateProperty().get()).contains("steps per molecule").contains("5000 molecules");

        assertThat(runToEnd()).isEqualTo(SimulationViewModel.Outcome.COMPLETE);

        assertThat(started).hasValue(1);
        assertThat(sim.runningProperty().get()).isFalse();
        assertThat(sim.progressProperty().get()).isEqualTo(1.0);
        assertThat(seen).isSortedAccordingTo(Double::compare).last().isEqualTo(1.0);
        assertThat(sim.statusProperty().get()).startsWith("done: 2 link(s) compared");
        // reference outside the UI: the core's simulator and comparison called directly with the same
        // settings (results are a function of layout, M, seed and time step only)
        List<LinkComparison> direct = SimulationComparison.compare(s,
                ParticleSimulator.simulate(s, SimulationSettings.of(5000, 7).withThreads(2)));
        assertThat(sim.rows()).hasSize(direct.size());
        for (int i = 0; i < direct.size(); i++) {
            SimulationRow row = sim.rows().get(i);
            LinkComparison c = direct.get(i);
            assertThat(row.from() + "→" + row.to()).isEqualTo(c.from() + "→" + c.to());
            assertThat(row.simulatedHitProbability()).isEqualTo(c.simulatedHitProbability());
            assertThat(row.zScore()).isEqualTo(c.zScore());
            assertThat(row.flagged()).isEqualTo(c.flagged());
            assertThat(row.reason()).isEqualTo(c.reason());
        }
        // the analytic capacity is the core planner's, called directly
        LinkReport l = NetworkPlanner.plan(s, PlanOptions.DEFAULT).links().stream()
                .filter(x -> x.from().equals("tx") && x.to().equals("rx1")).findFirst().orElseThrow();
        assertThat(sim.rows().get(0).analyticCapacityBits()).isEqualTo(l.mutualInformationBits());
        assertThat(sim.rows().get(0).simulatedCapacityBits()).isBetween(0.0, 1.0);
        assertThat(sim.staleProperty().get()).isFalse();
    }

    @Test
    void stateChangesArriveOnTheUiExecutorAtMostOneProgressUpdateQueuedAtATime() throws Exception {
        // a slow "UI thread": this test thread drains a queue every 200 ms, as a busy FX thread would;
        // blocks finish every few tens of ms, so without coalescing several updates would pile up
        BlockingQueue<Runnable> ui = new LinkedBlockingQueue<>();
        SimulationViewModel queued = new SimulationViewModel(planner, ui::add, bgThread::execute, 1);
        planner.load(pair(), null);
        Thread uiThread = Thread.currentThread();
        List<Thread> changedOn = new CopyOnWriteArrayList<>();
        queued.progressProperty().addListener((o, a, b) -> changedOn.add(Thread.currentThread()));
        queued.rows().addListener((ListChangeListener<SimulationRow>) c ->
                changedOn.add(Thread.currentThread()));
        // 1e5 molecules = 25 blocks of 4096, each reporting progress from the simulator's worker
        queued.moleculesPerEmitterProperty().set("100000");
        assertThat(queued.run()).isTrue();
        int maxQueued = 0;
        long deadline = System.nanoTime() + TimeUnit.SECONDS.toNanos(40);
        while (!queued.finished().isDone() && System.nanoTime() < deadline) {
            Thread.sleep(200);
            maxQueued = Math.max(maxQueued, ui.size());
            for (Runnable r; (r = ui.poll()) != null;) {
                r.run();
            }
        }
        assertThat(queued.finished().get(1, TimeUnit.SECONDS)).isEqualTo(SimulationViewModel.Outcome.COMPLETE);
        assertThat(queued.progressProperty().get()).isEqualTo(1.0);
        assertThat(queued.rows()).hasSize(1);
        assertThat(changedOn).isNotEmpty().allMatch(t -> t == uiThread);
        // per drain at most: one progress update, the "planning" status and the result
        assertThat(maxQueued).isLessThanOrEqualTo(3);
    }

    @Test
    void simulatedHitProbabilityOfAnOpenMediumLinkMatchesTheClosedFormWithinItsStandardError() throws Exception {
        planner.load(pair(), null);
        sim.moleculesPerEmitterProperty().set("20000");
        assertThat(runToEnd()).isEqualTo(SimulationViewModel.Outcome.COMPLETE);
        SimulationRow row = sim.rows().get(0);
        double d = 10;
        double r = 5;
        // S. Redner, A Guide to First-Passage Processes, 2001 (absorbing sphere, 3D): fraction absorbed
        // by t is F(t) = (r/d)·erfc((d − r)/√(4Dt)); p0 = F(T); erfc from Commons Numbers
        double closedForm = r / d * Erfc.value((d - r) / Math.sqrt(4 * D_UM2_PER_S * T_S));
        assertThat(row.analyticHitProbability()).isCloseTo(closedForm, within(1e-12));
        // binomial sampling: p̂0 lies within 4 of its standard errors of F(T) except with chance
        // 6e-5 (normal approximation, common practice); the seed is fixed, so this run is reproducible
        assertThat(row.standardError()).isGreaterThan(0);
        assertThat(Math.abs(row.simulatedHitProbability() - closedForm)).isLessThan(4 * row.standardError());
        assertThat(row.flagged()).isFalse();
    }

    @Test
    void cancelLeavesNoResultAndSaysCancelled() throws Exception {
        planner.load(threeNodes(), null);
        sim.moleculesPerEmitterProperty().set("2000");
        assertThat(runToEnd()).isEqualTo(SimulationViewModel.Outcome.COMPLETE);
        assertThat(sim.rows()).isNotEmpty();

        // a run far too long to finish within the test: 5e7 molecules per emitter
        sim.moleculesPerEmitterProperty().set("50000000");
        assertThat(sim.run()).isTrue();
        assertThat(sim.rows()).as("the previous result is cleared when a run starts").isEmpty();
        long deadline = System.nanoTime() + TimeUnit.SECONDS.toNanos(30);
        while (sim.progressProperty().get() == 0 && System.nanoTime() < deadline) {
            Thread.sleep(5);
        }
        assertThat(sim.progressProperty().get()).isStrictlyBetween(0.0, 1.0);
        assertThat(sim.run()).as("a second run while one is running").isFalse();
        assertThat(sim.statusProperty().get()).contains("already running");
        sim.cancel();
        assertThat(sim.finished().get(30, TimeUnit.SECONDS)).isEqualTo(SimulationViewModel.Outcome.CANCELLED);

        assertThat(sim.rows()).isEmpty();
        assertThat(sim.statusProperty().get()).startsWith("cancelled after").endsWith("no result shown");
        assertThat(sim.runningProperty().get()).isFalse();
        assertThat(sim.progressProperty().get()).isZero();
        assertThat(sim.staleProperty().get()).isFalse();
        assertThat(started).hasValue(2);
    }

    @Test
    void editingTheLayoutAfterARunMarksTheResultStaleAndUndoClearsIt() throws Exception {
        planner.load(threeNodes(), null);
        sim.moleculesPerEmitterProperty().set("2000");
        assertThat(runToEnd()).isEqualTo(SimulationViewModel.Outcome.COMPLETE);
        assertThat(sim.staleProperty().get()).isFalse();

        assertThat(planner.editor().moveNode("rx2", new Vec3(0, 20, 0))).isTrue();
        assertThat(sim.staleProperty().get()).isTrue();
        assertThat(sim.rows()).as("stale rows stay visible, marked").hasSize(2);

        assertThat(planner.undo()).isTrue();
        assertThat(sim.staleProperty().get()).isFalse();
    }

    @ParameterizedTest(name = "{0} = ''{1}''")
    @CsvSource(delimiter = '|', value = {
        "molecules per emitter | abc",
        "molecules per emitter | 0",
        "molecules per emitter | -5",
        "molecules per emitter | 2000000000",
        "molecules per emitter | ''",
        "seed | 1.5",
        "time step s | -0.1",
        "time step s | fast",
        "time step s | 1e-15",
    })
    void invalidSettingsAreRefusedWithTheFieldNamedAndNothingStarts(String field, String value) {
        planner.load(threeNodes(), null);
        Function<SimulationViewModel, StringProperty> property = switch (field) {
            case SimulationViewModel.MOLECULES_FIELD -> SimulationViewModel::moleculesPerEmitterProperty;
            case SimulationViewModel.SEED_FIELD -> SimulationViewModel::seedProperty;
            default -> SimulationViewModel::timeStepSProperty;
        };
        property.apply(sim).set(value);

        assertThat(sim.run()).isFalse();

        String status = sim.statusProperty().get();
        assertThat(status).startsWith("not started: " + field + ":").doesNotContain("\n");
        assertThat(sim.estimateProperty().get()).startsWith(field + ":");
        assertThat(started).hasValue(0);
        assertThat(sim.runningProperty().get()).isFalse();
        assertThat(sim.rows()).isEmpty();
    }

    @Test
    void withoutALayoutNothingStarts() {
        assertThat(sim.run()).isFalse();
        assertThat(sim.statusProperty().get()).contains("open a layout");
        assertThat(started).hasValue(0);
    }

    // ------------------------------------------------------------ closing, replacing the layout

    /** Starts a run far too long to finish within a test (5e7 molecules) and waits for its first progress. */
    void startLongRun() throws Exception {
        sim.moleculesPerEmitterProperty().set("50000000");
        assertThat(sim.run()).isTrue();
        long deadline = System.nanoTime() + TimeUnit.SECONDS.toNanos(30);
        while (sim.progressProperty().get() == 0 && System.nanoTime() < deadline) {
            Thread.sleep(5);
        }
        assertThat(sim.progressProperty().get()).isStrictlyBetween(0.0, 1.0);
    }

    @Test
    void disposingCancelsTheRunInProgressAndRefusesNewRuns() throws Exception {
        planner.load(threeNodes(), null);
        startLongRun();

        sim.dispose();

        assertThat(sim.finished().get(30, TimeUnit.SECONDS)).isEqualTo(SimulationViewModel.Outcome.CANCELLED);
        assertThat(sim.rows()).isEmpty();
        assertThat(sim.runningProperty().get()).isFalse();
        assertThat(sim.statusProperty().get()).startsWith("cancelled after");
        sim.dispose();
        sim.moleculesPerEmitterProperty().set("2000");
        assertThat(sim.run()).as("no run after the window closed").isFalse();
        assertThat(sim.statusProperty().get()).contains("closing");
        assertThat(started).hasValue(1);
    }

    @Test
    void anotherLayoutCancelsTheRunInProgressAndClearsTheOldRows() throws Exception {
        planner.load(threeNodes(), null);
        sim.moleculesPerEmitterProperty().set("2000");
        assertThat(runToEnd()).isEqualTo(SimulationViewModel.Outcome.COMPLETE);
        planner.load(pair(), null);
        sim.layoutReplaced();
        assertThat(sim.rows()).as("rows of the old layout are dropped").isEmpty();
        assertThat(sim.staleProperty().get()).isFalse();

        startLongRun();
        planner.load(threeNodes(), null);
        sim.layoutReplaced();

        assertThat(sim.finished().get(30, TimeUnit.SECONDS)).isEqualTo(SimulationViewModel.Outcome.CANCELLED);
        assertThat(sim.rows()).isEmpty();
        assertThat(sim.runningProperty().get()).isFalse();
        sim.moleculesPerEmitterProperty().set("2000");
        assertThat(runToEnd()).as("the next run starts normally").isEqualTo(SimulationViewModel.Outcome.COMPLETE);
    }

    // ------------------------------------------------------------ simulated-channel cache

    SimulationViewModel cached(Path dir) {
        return new SimulationViewModel(planner, Runnable::run, task -> {
            started.incrementAndGet();
            bgThread.execute(task);
        }, 1, new ChannelCache(dir), false);
    }

    static SimulationViewModel.Outcome runToEnd(SimulationViewModel vm) throws Exception {
        assertThat(vm.run()).as(vm.statusProperty().get()).isTrue();
        return vm.finished().get(40, TimeUnit.SECONDS);
    }

    static long files(Path dir) throws Exception {
        try (var s = Files.list(dir)) {
            return s.count();
        }
    }

    @Test
    void aSecondRunOfTheSameLayoutAndSettingsReadsTheCacheAndAChangedSeedOrLayoutMissesIt(@TempDir Path dir)
            throws Exception {
        SimulationViewModel vm = cached(dir);
        Scenario s = threeNodes();
        planner.load(s, null);
        // 9000 molecules = 3 blocks of ParticleSimulator.BLOCK_SIZE, so a simulation reports progress between 0 and 1
        vm.moleculesPerEmitterProperty().set("9000");
        vm.seedProperty().set("11");
        assertThat(runToEnd(vm)).isEqualTo(SimulationViewModel.Outcome.COMPLETE);
        assertThat(vm.statusProperty().get()).contains("simulated, cached").doesNotContain("from cache");
        List<SimulationRow> first = List.copyOf(vm.rows());
        assertThat(files(dir)).isEqualTo(1);
        Path file = Files.list(dir).findFirst().orElseThrow();
        FileTime written = Files.getLastModifiedTime(file);

        // same layout, same settings: read from the cache, no simulation block runs (no progress
        // between 0 and 1), nothing rewritten, the same rows
        List<Double> seen = new CopyOnWriteArrayList<>();
        vm.progressProperty().addListener((o, a, b) -> seen.add(b.doubleValue()));
        assertThat(runToEnd(vm)).isEqualTo(SimulationViewModel.Outcome.COMPLETE);
        assertThat(vm.statusProperty().get()).contains("from cache");
        assertThat(vm.rows()).containsExactlyElementsOf(first);
        assertThat(seen).allMatch(p -> p == 0.0 || p == 1.0);
        assertThat(Files.getLastModifiedTime(file)).isEqualTo(written);
        assertThat(files(dir)).isEqualTo(1);
        // the command line finds the same entry: nanoplan plan --channel simulated goes through
        // getOrSimulate with the same M, seed and automatic time step
        ChannelCache.Lookup cli = new ChannelCache(dir).getOrSimulate(s, SimulationSettings.of(9000, 11), x -> {
            throw new AssertionError("the command line would have simulated again");
        });
        assertThat(cli.hit()).isTrue();
        assertThat(cli.file()).isEqualTo(file);

        // another seed: a miss, a new simulation, a second file
        vm.seedProperty().set("12");
        seen.clear();
        assertThat(runToEnd(vm)).isEqualTo(SimulationViewModel.Outcome.COMPLETE);
        assertThat(vm.statusProperty().get()).contains("simulated, cached").doesNotContain("from cache");
        assertThat(seen).anyMatch(p -> p > 0 && p < 1);
        assertThat(files(dir)).isEqualTo(2);

        // the seed back but a node moved: a miss too
        vm.seedProperty().set("11");
        assertThat(planner.editor().moveNode("rx2", new Vec3(0, 14, 0))).isTrue();
        assertThat(runToEnd(vm)).isEqualTo(SimulationViewModel.Outcome.COMPLETE);
        assertThat(vm.statusProperty().get()).doesNotContain("from cache");
        assertThat(files(dir)).isEqualTo(3);

        // back to the first layout, hit again; with Re-simulate ticked it simulates anyway, rewrites
        // the entry, and (same seed) gets the same rows
        assertThat(planner.undo()).isTrue();
        assertThat(runToEnd(vm)).isEqualTo(SimulationViewModel.Outcome.COMPLETE);
        assertThat(vm.statusProperty().get()).contains("from cache");
        vm.ignoreCacheProperty().set(true);
        seen.clear();
        assertThat(runToEnd(vm)).isEqualTo(SimulationViewModel.Outcome.COMPLETE);
        assertThat(vm.statusProperty().get()).contains("re-simulated").doesNotContain("from cache");
        assertThat(seen).anyMatch(p -> p > 0 && p < 1);
        assertThat(vm.rows()).containsExactlyElementsOf(first);
        assertThat(files(dir)).isEqualTo(3);
    }

    @Test
    void aCancelledRunIsNotCached(@TempDir Path dir) throws Exception {
        sim = cached(dir);
        planner.load(pair(), null);
        startLongRun();
        sim.cancel();
        assertThat(sim.finished().get(30, TimeUnit.SECONDS)).isEqualTo(SimulationViewModel.Outcome.CANCELLED);
        assertThat(files(dir)).isZero();
    }

    // ------------------------------------------------------------ reusing the planner's plan

    @Test
    void thePlannersExactPlanOfTheSameLayoutIsReused() throws Exception {
        SimulationViewModel vm = new SimulationViewModel(planner, Runnable::run, bgThread::execute, 1, null, true);
        planner.load(pair(), null);
        Plan plannersPlan = planner.plans().planned().get(10, TimeUnit.SECONDS);
        vm.moleculesPerEmitterProperty().set("2000");

        assertThat(runToEnd(vm)).isEqualTo(SimulationViewModel.Outcome.COMPLETE);

        assertThat(vm.lastAnalyticReused()).isTrue();
        // the planner here is the hand-made FakePlans, whose capacity label differs from the core's:
        // the analytic column shows the planner's plan, not a new one
        assertThat(vm.rows().get(0).analyticCapacityBits()).isEqualTo(plannersPlan.links().get(0).mutualInformationBits());
    }

    @Test
    void aPlanOfAnotherLayoutIsNotReused() throws Exception {
        CountDownLatch release = new CountDownLatch(1);
        FakePlans fake = new FakePlans();
        Scenario first = pair();
        PlannerViewModel blocking = new PlannerViewModel(sc -> {
            if (!sc.equals(first)) {
                try {
                    release.await(30, TimeUnit.SECONDS);
                } catch (InterruptedException e) {
                    Thread.currentThread().interrupt();
                }
            }
            return fake.plan(sc);
        }, Runnable::run, planning, 0, new RecentFiles(null));
        try {
            SimulationViewModel vm = new SimulationViewModel(blocking, Runnable::run, bgThread::execute, 1, null, true);
            blocking.load(first, null);
            blocking.plans().planned().get(10, TimeUnit.SECONDS);
            // the edited layout's plan is still running: the planner holds no plan of it
            assertThat(blocking.editor().moveNode("rx", new Vec3(12, 0, 0))).isTrue();
            Scenario edited = blocking.scenarioProperty().get();
            vm.moleculesPerEmitterProperty().set("2000");

            assertThat(runToEnd(vm)).isEqualTo(SimulationViewModel.Outcome.COMPLETE);

            assertThat(vm.lastAnalyticReused()).isFalse();
            // re-planned with the core, called directly as the reference
            LinkReport l = NetworkPlanner.plan(edited, PlanOptions.DEFAULT).links().get(0);
            assertThat(vm.rows().get(0).analyticCapacityBits()).isEqualTo(l.mutualInformationBits());
        } finally {
            release.countDown();
        }
    }
}
