package dev.nanoplan.desktop;

import static org.assertj.core.api.Assertions.assertThat;

import dev.nanoplan.count.CountModelKind;
import dev.nanoplan.design.Change;
import dev.nanoplan.design.DesignMove;
import dev.nanoplan.design.ImproveOptions;
import dev.nanoplan.design.Improvement;
import dev.nanoplan.design.LayoutImprover;
import dev.nanoplan.geometry.Vec3;
import dev.nanoplan.geometry.Volume;
import dev.nanoplan.scenario.Demand;
import dev.nanoplan.scenario.Medium;
import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.Schedule;
import dev.nanoplan.scenario.Signalling;
import dev.nanoplan.scenario.Species;
import dev.nanoplan.scenario.Targets;
import java.util.EnumSet;
import java.util.List;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.ScheduledExecutorService;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.Timeout;

/**
 * "Improve…" without a window, on two transmitter–receiver pairs that hear each other on one species
 * (a second species is a candidate): the proposal is the one planner-core's {@link LayoutImprover}
 * finds with the same options, Apply makes the ticked changes as one undoable edit (the oracle:
 * {@link Improvement#withOnly} and the layout before the search), Discard and an edit drop the ghosts.
 */
@Timeout(120)
class ImproveViewModelTest {

    ScheduledExecutorService planning;
    ExecutorService worker;
    PlannerViewModel planner;
    ImproveViewModel imp;

    /** Two pairs 30 µm apart, both on species A (crosstalk); B is a candidate species. */
    static Scenario twoPairs() {
        Species a = Species.ofDiffusion("A", 80, 1.0);
        Species b = Species.ofDiffusion("B", 80, 1.0);
        List<Node> nodes = List.of(
                Node.receiver("g1", new Vec3(0, 0, 0), 5, "A"),
                Node.receiver("g2", new Vec3(0, 30, 0), 5, "A"),
                Node.transmitter("t1", new Vec3(-14, 0, 0), 1, "A", 3000),
                Node.transmitter("t2", new Vec3(-14, 30, 0), 1, "A", 3000));
        return new Scenario("two pairs", new Volume.Open(), new Medium(310.15, 0.69, Medium.DEFAULT.flow(), 2.0),
                List.of(a), new Signalling(0.5, 4, 2, 0.5, CountModelKind.EXACT, Schedule.ALL_ACTIVE), nodes,
                List.of(new Demand("t1", "g1"), new Demand("t2", "g2")), new Targets(1e-3, 1.0, 3600), List.of(b));
    }

    @BeforeEach
    void setUp() {
        planning = PlannerViewModel.daemonScheduler();
        planner = new PlannerViewModel(new FakePlans(), Runnable::run, planning, 0, new RecentFiles(null));
        worker = Executors.newSingleThreadExecutor();
        imp = new ImproveViewModel(planner, Runnable::run, worker);
        planner.load(twoPairs(), null);
        imp.allowedProperty(DesignMove.BUDGETS).set(false);
        imp.allowedProperty(DesignMove.MOVE_RELAYS).set(false);
        imp.timeLimitSProperty().set("60");
    }

    @AfterEach
    void tearDown() {
        planning.shutdownNow();
        worker.shutdownNow();
    }

    private Improvement direct() {
        return LayoutImprover.improve(twoPairs(), ImproveOptions.defaults().withTimeLimit(60)
                .withAllowed(EnumSet.of(DesignMove.SPECIES, DesignMove.SLOTS)));
    }

    @Test
    void theProposalIsTheCoresAndApplyingItIsOneUndoableEdit() throws Exception {
        assertThat(imp.run()).isTrue();
        assertThat(imp.finished().get(100, TimeUnit.SECONDS)).isEqualTo(ImproveViewModel.Outcome.PROPOSAL);
        Improvement core = direct();
        assertThat(imp.changes()).extracting(ImproveViewModel.ChangeRow::change).containsExactlyElementsOf(core.changes());
        assertThat(imp.demands()).hasSize(2);
        assertThat(imp.demands().stream().filter(ImproveViewModel.DemandRow::meetsAfter).count())
                .isEqualTo(core.assessedAfter().objective().demandsMeetingTargets());
        assertThat(imp.apply()).isTrue();
        assertThat(planner.scenarioProperty().get()).isEqualTo(core.after());
        assertThat(imp.changes()).isEmpty();
        assertThat(planner.undo()).isTrue();
        assertThat(planner.scenarioProperty().get()).isEqualTo(twoPairs());
        assertThat(planner.document().undoStack().canUndoProperty().get()).isFalse();
    }

    @Test
    void onlyTheTickedChangesAreApplied() throws Exception {
        assertThat(imp.run()).isTrue();
        assertThat(imp.finished().get(100, TimeUnit.SECONDS)).isEqualTo(ImproveViewModel.Outcome.PROPOSAL);
        assertThat(imp.changes()).hasSizeGreaterThan(1);
        Improvement p = imp.proposal();
        imp.changes().forEach(r -> r.tickedProperty().set(false));
        assertThat(imp.apply()).isFalse();
        assertThat(imp.statusProperty().get()).startsWith("nothing ticked");
        Change first = imp.changes().get(0).change();
        imp.changes().get(0).tickedProperty().set(true);
        assertThat(imp.apply()).isTrue();
        assertThat(planner.scenarioProperty().get()).isEqualTo(p.withOnly(List.of(first)));
        assertThat(planner.document().undoStack().undoLabelProperty().get()).isEqualTo("apply 1 of "
                + p.changes().size() + " proposed changes");
    }

    @Test
    void ghostsFollowTheTicksAndDiscardOrAnEditDropsThem() throws Exception {
        imp.allowedProperty(DesignMove.SPECIES).set(false);
        imp.allowedProperty(DesignMove.ADD_RELAYS).set(true);
        imp.allowedProperty(DesignMove.MOVE_RELAYS).set(true);
        imp.allowedProperty(DesignMove.BUDGETS).set(true);
        assertThat(imp.run()).isTrue();
        ImproveViewModel.Outcome o = imp.finished().get(100, TimeUnit.SECONDS);
        assertThat(o).isIn(ImproveViewModel.Outcome.PROPOSAL, ImproveViewModel.Outcome.NOTHING_BETTER);
        long moves = imp.changes().stream().filter(r -> r.change().field().equals("position_um")
                || r.change().field().equals("node")).count();
        assertThat(imp.ghosts()).hasSize((int) moves);
        imp.changes().forEach(r -> r.tickedProperty().set(false));
        assertThat(imp.ghosts()).isEmpty();
        imp.discard();
        assertThat(imp.changes()).isEmpty();
        assertThat(imp.hasProposalProperty().get()).isFalse();
    }

    @Test
    void anEditDropsTheProposalAndBadSettingsAreRefusedNamingTheField() throws Exception {
        assertThat(imp.run()).isTrue();
        assertThat(imp.finished().get(100, TimeUnit.SECONDS)).isEqualTo(ImproveViewModel.Outcome.PROPOSAL);
        planner.editor().moveNode("t1", new Vec3(-15, 0, 0));
        assertThat(imp.hasProposalProperty().get()).isFalse();
        assertThat(imp.statusProperty().get()).startsWith("proposal dropped");

        imp.timeLimitSProperty().set("0");
        assertThat(imp.run()).isFalse();
        assertThat(imp.statusProperty().get()).startsWith("not started: " + ImproveViewModel.TIME_LIMIT);
        for (DesignMove m : DesignMove.values()) {
            imp.allowedProperty(m).set(false);
        }
        imp.timeLimitSProperty().set("10");
        assertThat(imp.run()).isFalse();
        assertThat(imp.statusProperty().get()).startsWith("not started: allowed");
    }

    @Test
    void cancelEndsTheSearchLongBeforeItsTimeLimitWithTheBestSoFar() throws Exception {
        imp.allowedProperty(DesignMove.BUDGETS).set(true);
        imp.timeLimitSProperty().set("3600");
        imp.progressTextProperty().addListener((o, a, b) -> imp.cancel());
        long start = System.nanoTime();
        assertThat(imp.run()).isTrue();
        ImproveViewModel.Outcome o = imp.finished().get(100, TimeUnit.SECONDS);
        assertThat((System.nanoTime() - start) / 1e9).isLessThan(100);
        assertThat(o).isIn(ImproveViewModel.Outcome.PROPOSAL, ImproveViewModel.Outcome.CANCELLED);
        if (o == ImproveViewModel.Outcome.PROPOSAL) {
            assertThat(imp.proposal().stoppedEarly()).isTrue();
            assertThat(imp.proposal().assessedAfter().objective().compareTo(
                    imp.proposal().assessedBefore().objective())).isPositive();
        }
    }
}
