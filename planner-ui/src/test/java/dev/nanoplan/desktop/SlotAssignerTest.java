package dev.nanoplan.desktop;

import static org.assertj.core.api.Assertions.assertThat;

import dev.nanoplan.geometry.Vec3;
import dev.nanoplan.plan.PlanOptions;
import dev.nanoplan.plan.SlotAssignment;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.ScenarioReader;
import dev.nanoplan.scenario.Schedule;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.CountDownLatch;
import java.util.concurrent.CopyOnWriteArrayList;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.Timeout;

/**
 * "Assign slots" without a window: the slot plan is applied as one undoable edit, progress is told,
 * Cancel and a layout edited meanwhile leave the layout alone, and the status bar's frame text.
 */
@Timeout(60)
class SlotAssignerTest {

    static final Path TANK = Path.of("..", "scenarios", "culture-tank.json");
    static final Path SLOTS = Path.of("..", "scenarios", "culture-tank-slots.json");
    static final Path RELAYED = Path.of("..", "scenarios", "relay-chain-relayed.json");

    ScenarioDocument doc;
    Scenario tank;
    Scenario slotted;

    @BeforeEach
    void setUp() throws Exception {
        doc = new ScenarioDocument(new RecentFiles(null), s -> { });
        tank = ScenarioReader.strict().read(TANK);
        slotted = ScenarioReader.strict().read(SLOTS);
    }

    /** A result carrying the bundled slot plan of the culture tank. */
    SlotAssignment.Result bundledPlan(Scenario s) {
        Scenario out = LayoutEdits.withSignalling(s, slotted.signalling());
        return new SlotAssignment.Result(out, SlotAssigner.frameText(out).isEmpty() ? 0 : 3,
                slotted.signalling().slots(), 5, List.of(), 7);
    }

    @Test
    void theSlotPlanIsAppliedAsOneUndoableEditWithProgress() throws Exception {
        List<Double> told = new CopyOnWriteArrayList<>();
        SlotAssigner a = new SlotAssigner(doc, Runnable::run, SlotAssigner.daemonThreads(), (s, p) -> {
            p.accept(0.5);
            p.accept(1);
            return bundledPlan(s);
        });
        a.progressProperty().addListener((o, x, y) -> told.add(y.doubleValue()));
        doc.load(tank, null);
        assertThat(a.frameProperty().get()).isEmpty();
        assertThat(a.assign()).isTrue();
        assertThat(a.finished().get(10, TimeUnit.SECONDS)).isTrue();
        assertThat(told).contains(0.5);
        assertThat(doc.scenario().signalling()).isEqualTo(slotted.signalling());
        // only the signalling changed
        assertThat(doc.scenario().nodes()).isEqualTo(tank.nodes());
        assertThat(doc.scenario().demands()).isEqualTo(tank.demands());
        assertThat(a.frameProperty().get()).startsWith("frame ");
        assertThat(a.runningProperty().get()).isFalse();
        assertThat(doc.undo()).isTrue();
        assertThat(doc.scenario()).isEqualTo(tank);
        assertThat(doc.undoStack().canUndoProperty().get()).isFalse();
        assertThat(doc.dirtyProperty().get()).isFalse();
    }

    @Test
    void cancelStopsTheRunAndLeavesTheLayoutAlone() throws Exception {
        CountDownLatch started = new CountDownLatch(1);
        SlotAssigner a = new SlotAssigner(doc, Runnable::run, SlotAssigner.daemonThreads(), (s, p) -> {
            started.countDown();
            while (true) {
                p.accept(0.1);
                Thread.onSpinWait();
            }
        });
        doc.load(tank, null);
        assertThat(a.assign()).isTrue();
        assertThat(started.await(10, TimeUnit.SECONDS)).isTrue();
        a.cancel();
        assertThat(a.finished().get(10, TimeUnit.SECONDS)).isFalse();
        assertThat(doc.scenario()).isSameAs(tank);
        assertThat(doc.messageProperty().get()).contains("cancelled");
        assertThat(a.runningProperty().get()).isFalse();
    }

    @Test
    void aResultForALayoutEditedMeanwhileIsDropped() throws Exception {
        CountDownLatch release = new CountDownLatch(1);
        SlotAssigner a = new SlotAssigner(doc, Runnable::run, SlotAssigner.daemonThreads(), (s, p) -> {
            try {
                release.await();
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
            }
            return bundledPlan(s);
        });
        doc.load(tank, null);
        assertThat(a.assign()).isTrue();
        assertThat(a.assign()).isFalse();
        assertThat(doc.edit("move s01", s -> LayoutEdits.moveNode(s, List.of(), "s01", new Vec3(60, 60, 60)))).isTrue();
        Scenario edited = doc.scenario();
        release.countDown();
        assertThat(a.finished().get(10, TimeUnit.SECONDS)).isFalse();
        assertThat(doc.scenario()).isSameAs(edited);
        assertThat(doc.messageProperty().get()).contains("layout changed");
    }

    @Test
    void theCoreAssignmentIsAppliedAsTheSlotsCommandComputesIt() throws Exception {
        Scenario relayed = ScenarioReader.strict().read(RELAYED);
        SlotAssigner a = new SlotAssigner(doc, Runnable::run, SlotAssigner.daemonThreads(), SlotAssigner.core());
        doc.load(relayed, null);
        assertThat(a.assign()).isTrue();
        a.finished().get(50, TimeUnit.SECONDS);
        // the same call as `nanoplan slots` (SlotsCommand: SlotAssignment with PlanOptions.DEFAULT, no cap, 60 plans)
        SlotAssignment.Result cli = new SlotAssignment(PlanOptions.DEFAULT, 0, 60).assign(relayed);
        assertThat(doc.scenario().signalling().schedule()).isEqualTo(Schedule.SLOTS);
        assertThat(doc.scenario().signalling().slots()).isEqualTo(cli.scenario().signalling().slots());
        assertThat(a.frameProperty().get()).startsWith("frame " + cli.frameSlots() + " slot");
    }

    @Test
    void theFrameTextNamesEachSpeciesFrameWhenTheyDiffer() throws Exception {
        assertThat(SlotAssigner.frameText(tank)).isEmpty();
        String t = SlotAssigner.frameText(slotted);
        assertThat(t).matches("frame \\d+ slots?( \\(.*\\))?");
        List<String> parts = new ArrayList<>(List.of(t.split(" ")));
        assertThat(Integer.parseInt(parts.get(1))).isEqualTo(dev.nanoplan.plan.SlotSchedule.of(slotted).longestFrame());
    }
}
