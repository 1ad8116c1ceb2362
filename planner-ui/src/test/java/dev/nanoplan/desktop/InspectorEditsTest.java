package dev.nanoplan.desktop;

import static org.assertj.core.api.Assertions.assertThat;

import dev.nanoplan.plan.SlotSchedule;
import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.ReceiverModel;
import dev.nanoplan.scenario.Role;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.ScenarioReader;
import dev.nanoplan.scenario.ScenarioWriter;
import dev.nanoplan.scenario.Schedule;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.ScheduledExecutorService;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.Timeout;
import org.junit.jupiter.api.io.TempDir;

/**
 * The node inspector keeps every field of the file's node through an edit, edits the receiver model,
 * {@code fixed} and (under the slots schedule) the slot; each refused value is named as in the file.
 * Round trips go through the core's own writer and reader ({@code ScenarioWriter}, {@code ScenarioReader}).
 */
@Timeout(30)
class InspectorEditsTest {

    static final Path TANK = Path.of("..", "scenarios", "culture-tank.json");
    static final Path SLOTS = Path.of("..", "scenarios", "culture-tank-slots.json");

    ScheduledExecutorService bg;
    PlannerViewModel vm;

    @BeforeEach
    void setUp() throws Exception {
        bg = PlannerViewModel.daemonScheduler();
        vm = new PlannerViewModel(new FakePlans(), Runnable::run, bg, 0, new RecentFiles(null));
    }

    @AfterEach
    void tearDown() throws Exception {
        bg.shutdownNow();
    }

    NodeInspector select(String id) {
        vm.editor().selectedNodeIdProperty().set(id);
        return vm.editor().inspector();
    }

    @Test
    void applyingUnchangedFieldsKeepsFixedAndTheReceiverModel() throws Exception {
        Scenario tank = ScenarioReader.strict().read(TANK);
        List<Node> nodes = tank.nodes().stream().map(n -> n.id().equals("gw")
                ? new Node(n.id(), n.role(), n.positionUm(), n.radiusUm(), n.species(), n.emitsSpecies(),
                        n.moleculesPerSymbol(), true, ReceiverModel.passive(0.4))
                : n).toList();
        Scenario s = LayoutEdits.with(tank, List.of(), nodes, tank.demands());
        vm.load(s, null);
        NodeInspector in = select("gw");
        assertThat(in.fixedProperty().get()).isTrue();
        assertThat(in.receiverProperty().get()).isEqualTo(ReceiverModel.Kind.PASSIVE);
        assertThat(in.samplingOffsetSProperty().get()).isEqualTo("0.4");
        // the inspector's node equals the layout's, field by field (the record's equals)
        assertThat(in.toNode()).isEqualTo(s.nodesById().get("gw"));
        in.radiusUmProperty().set("11");
        assertThat(vm.editor().applyInspector()).isTrue();
        Node after = vm.scenarioProperty().get().nodesById().get("gw");
        assertThat(after.radiusUm()).isEqualTo(11);
        assertThat(after.fixed()).isTrue();
        assertThat(after.receiver()).isEqualTo(ReceiverModel.passive(0.4));
    }

    @Test
    void theReceiverModelAndFixedAreEditedAndSurviveSavingAndReading(@TempDir Path dir) throws Exception {
        vm.load(ScenarioReader.strict().read(TANK), null);
        NodeInspector in = select("gw");
        in.receiverProperty().set(ReceiverModel.Kind.REACTIVE);
        in.bindingRateUmPerSProperty().set("25");
        in.fixedProperty().set(true);
        assertThat(vm.editor().applyInspector()).isTrue();
        Path file = dir.resolve("r.json");
        ScenarioWriter.write(vm.scenarioProperty().get(), file);
        Node read = ScenarioReader.strict().read(file).nodesById().get("gw");
        assertThat(read.receiver()).isEqualTo(ReceiverModel.reactive(25));
        assertThat(read.fixed()).isTrue();

        in.receiverProperty().set(ReceiverModel.Kind.PASSIVE);
        in.samplingOffsetSProperty().set("");
        assertThat(vm.editor().applyInspector()).isTrue();
        // blank offset = the end of the slot (file: no sampling_offset_s); the binding rate is dropped
        assertThat(vm.scenarioProperty().get().nodesById().get("gw").receiver()).isEqualTo(ReceiverModel.passive(null));
        assertThat(vm.undo()).isTrue();
        assertThat(vm.scenarioProperty().get().nodesById().get("gw").receiver()).isEqualTo(ReceiverModel.reactive(25));
    }

    @Test
    void aTransmitterHasNoReceiverModelWhateverTheChoiceShows() throws Exception {
        vm.load(ScenarioReader.strict().read(TANK), null);
        String tx = vm.scenarioProperty().get().nodes().stream().filter(n -> n.role() == Role.TRANSMITTER)
                .findFirst().orElseThrow().id();
        NodeInspector in = select(tx);
        in.receiverProperty().set(ReceiverModel.Kind.PASSIVE);
        assertThat(in.toNode().receiver()).isEqualTo(ReceiverModel.ABSORBING);
    }

    @Test
    void aBadSamplingOffsetIsRefusedBesideItsFieldAndChangesNothing() throws Exception {
        vm.load(ScenarioReader.strict().read(TANK), null);
        Scenario before = vm.scenarioProperty().get();
        NodeInspector in = select("gw");
        in.receiverProperty().set(ReceiverModel.Kind.PASSIVE);
        in.samplingOffsetSProperty().set("-0.1");
        assertThat(vm.editor().applyInspector()).isFalse();
        int index = before.nodes().indexOf(before.nodesById().get("gw"));
        assertThat(in.errors().message(NodeInspector.SAMPLING_OFFSET).get())
                .isEqualTo("nodes[" + index + "].sampling_offset_s must be finite and > 0, got -0.1");
        assertThat(vm.messageProperty().get()).contains("nodes[" + index + "].sampling_offset_s");
        assertThat(vm.scenarioProperty().get()).isSameAs(before);
    }

    @Test
    void anOverlapFoundByTheLayoutCheckIsMarkedBesideThePosition() throws Exception {
        vm.load(ScenarioReader.strict().read(TANK), null);
        NodeInspector in = select("s01");
        // gw sits at (200, 200, 100) with radius 10 µm (scenarios/culture-tank.json)
        in.xUmProperty().set("200");
        in.yUmProperty().set("200");
        in.zUmProperty().set("100");
        assertThat(vm.editor().applyInspector()).isFalse();
        assertThat(in.errors().all()).isNotEmpty();
        assertThat(in.errors().all().values().iterator().next()).contains("nodes[");
    }

    @Test
    void underTheSlotsScheduleTheSlotIsShownEditedAndCheckedAgainstTheFrame() throws Exception {
        Scenario slotted = ScenarioReader.strict().read(SLOTS);
        assertThat(slotted.signalling().schedule()).isEqualTo(Schedule.SLOTS);
        vm.load(slotted, null);
        Node emitter = slotted.nodes().stream().filter(n -> n.role().emits()).findFirst().orElseThrow();
        NodeInspector in = select(emitter.id());
        assertThat(in.slotsScheduleProperty().get()).isTrue();
        assertThat(in.slotProperty().get()).isEqualTo(slotted.signalling().slots().get(emitter.id()).toString());
        int frame = slotted.signalling().frameSlots() > 0 ? slotted.signalling().frameSlots() : Integer.MAX_VALUE;
        int k = SlotSchedule.of(slotted).frameSlots(emitter.emitsSpecies());
        int other = (slotted.signalling().slots().get(emitter.id()) + 1) % Math.min(frame, Math.max(2, k));
        in.slotProperty().set(Integer.toString(other));
        assertThat(vm.editor().applyInspector()).isTrue();
        assertThat(vm.scenarioProperty().get().signalling().slots().get(emitter.id())).isEqualTo(other);
        in.slotProperty().set("-1");
        assertThat(vm.editor().applyInspector()).isFalse();
        int index = slotted.nodes().indexOf(emitter);
        assertThat(in.errors().message(NodeInspector.SLOT).get()).startsWith("nodes[" + index + "].slot must be in 0..");
        in.slotProperty().set("two");
        assertThat(vm.editor().applyInspector()).isFalse();
        assertThat(in.errors().message(NodeInspector.SLOT).get()).isEqualTo("nodes[" + index + "].slot is not a whole number: 'two'");
        assertThat(vm.undo()).isTrue();
        assertThat(vm.scenarioProperty().get()).isEqualTo(slotted);
    }

    @Test
    void aSlotAtOrBeyondAFixedFrameIsRefused() throws Exception {
        Scenario slotted = ScenarioReader.strict().read(SLOTS);
        Scenario fixedFrame = LayoutEdits.withSignalling(slotted,
                slotted.signalling().withSlots(4, slotted.signalling().slots().entrySet().stream()
                        .collect(java.util.stream.Collectors.toMap(e -> e.getKey(), e -> Math.min(3, e.getValue())))));
        vm.load(fixedFrame, null);
        Node emitter = fixedFrame.nodes().stream().filter(n -> n.role().emits()).findFirst().orElseThrow();
        NodeInspector in = select(emitter.id());
        assertThat(in.slotHintProperty().get()).isEqualTo("0..3 (frame_slots 4)");
        in.slotProperty().set("4");
        assertThat(vm.editor().applyInspector()).isFalse();
        int index = fixedFrame.nodes().indexOf(emitter);
        assertThat(in.errors().message(NodeInspector.SLOT).get())
                .isEqualTo("nodes[" + index + "].slot must be in 0..3 (frame_slots 4), got 4");
    }
}
