package dev.nanoplan.desktop;

import static org.assertj.core.api.Assertions.assertThat;

import dev.nanoplan.count.CountModelKind;
import dev.nanoplan.geometry.Vec3;
import dev.nanoplan.plan.Plan;
import dev.nanoplan.plan.RouteReport;
import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.Role;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.ScenarioReader;
import dev.nanoplan.scenario.Species;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ScheduledExecutorService;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.Timeout;
import org.junit.jupiter.api.io.TempDir;

/** The view model without a window: edits, validation, undo/redo, background planning, files. */
@Timeout(30)
class PlannerViewModelTest {

    static final Path TANK = Path.of("..", "scenarios", "culture-tank.json");

    FakePlans fake;
    ScheduledExecutorService bg;
    PlannerViewModel vm;

    @BeforeEach
    void setUp() {
        fake = new FakePlans();
        bg = PlannerViewModel.daemonScheduler();
        vm = new PlannerViewModel(fake, Runnable::run, bg, 0, new RecentFiles(null));
    }

    @AfterEach
    void tearDown() {
        bg.shutdownNow();
    }

    Plan awaitPlan() throws Exception {
        return vm.plans().planned().get(10, TimeUnit.SECONDS);
    }

    Scenario opened() throws Exception {
        assertThat(vm.open(TANK)).isTrue();
        awaitPlan();
        return vm.scenarioProperty().get();
    }

    @Test
    void openingPlansTheFileThroughTheService() throws Exception {
        Scenario s = opened();
        // the file read by planner-core's own reader is what the view model holds and plans
        assertThat(s).isEqualTo(ScenarioReader.strict().read(TANK));
        assertThat(fake.calls).containsExactly(s);
        assertThat(vm.tables().links()).hasSize(s.demands().size());
        assertThat(vm.plans().busyProperty().get()).isFalse();
        assertThat(vm.document().dirtyProperty().get()).isFalse();
    }

    @Test
    void routesOnTheirOwnEmitterKeepTheirRateWhenShared() throws Exception {
        opened();
        // the fake plans one direct route per demand from its own source: no emitter carries two demands, so
        // max-min fair sharing (Bertsekas and Gallager, Data Networks, 1992, §6.5.2) leaves every route its rate
        for (RouteReport r : vm.tables().routes()) {
            var sh = vm.tables().sharedRate(r);
            assertThat(sh.rateBitsPerS()).isEqualTo(r.rateBitsPerS());
            assertThat(sh.limitedAt()).isNull();
        }
        assertThat(vm.tables().sharedRate(new RouteReport("x", "y", List.of(), 0, null, null, 0, 0, 0, null, null, ""))).isNull();
    }

    @Test
    void movingANodeKeepsUnappliedTypingInTheSettingsEditor() throws Exception {
        opened();
        vm.settings().temperatureKProperty().set("300");
        assertThat(vm.editor().moveNode("s01", new Vec3(60, 60, 60))).isTrue();
        awaitPlan();
        // a move does not touch medium, signalling or species, so the editor is not reloaded
        assertThat(vm.settings().temperatureKProperty().get()).isEqualTo("300");
        // applying it changes the medium: the editor shows the layout's (parsed) value again
        assertThat(vm.applySettings()).isTrue();
        awaitPlan();
        assertThat(vm.scenarioProperty().get().medium().temperatureK()).isEqualTo(300.0);
        assertThat(vm.undo()).isTrue();
        awaitPlan();
        assertThat(vm.settings().temperatureKProperty().get()).isNotEqualTo("300");
    }

    @Test
    void movingANodeReplansAndChangesItsLinks() throws Exception {
        opened();
        double before = vm.tables().findLink("s01", "gw").mutualInformationBits();
        assertThat(vm.editor().moveNode("s01", new Vec3(60, 60, 60))).isTrue();
        Plan p = awaitPlan();
        Node moved = p.scenario().nodesById().get("s01");
        assertThat(moved.positionUm()).isEqualTo(new Vec3(60, 60, 60));
        assertThat(fake.calls).hasSize(2);
        assertThat(vm.tables().planProperty().get()).isSameAs(p);
        // farther from the gateway, the fake's capacity label 1/(1 + d/100) must drop
        assertThat(vm.tables().findLink("s01", "gw").mutualInformationBits()).isLessThan(before);
        assertThat(vm.document().dirtyProperty().get()).isTrue();
    }

    @Test
    void inspectorEditChangesRoleRadiusAndMolecules() throws Exception {
        opened();
        vm.editor().selectedNodeIdProperty().set("s03");
        // s03 sits at x = 150 µm in scenarios/culture-tank.json (beside relay-w)
        assertThat(vm.editor().inspector().xUmProperty().get()).isEqualTo("150");
        vm.editor().inspector().radiusUmProperty().set("3.5");
        vm.editor().inspector().moleculesPerSymbolProperty().set("12345");
        assertThat(vm.editor().applyInspector()).isTrue();
        awaitPlan();
        Node n = vm.editor().nodeById("s03");
        assertThat(n.radiusUm()).isEqualTo(3.5);
        assertThat(n.moleculesPerSymbol()).isEqualTo(12345);
        assertThat(fake.calls.get(fake.calls.size() - 1).nodesById().get("s03").radiusUm()).isEqualTo(3.5);
    }

    @Test
    void undoAndRedoRoundTrip() throws Exception {
        Scenario original = opened();
        assertThat(vm.editor().moveNode("s01", new Vec3(150, 240, 85))).isTrue();
        Scenario afterMove = vm.scenarioProperty().get();
        vm.editor().selectedNodeIdProperty().set("s02");
        vm.editor().inspector().radiusUmProperty().set("2.5");
        assertThat(vm.editor().applyInspector()).isTrue();
        Scenario afterRadius = vm.scenarioProperty().get();
        assertThat(vm.editor().deleteNode("s05")).isTrue();
        Scenario afterDelete = vm.scenarioProperty().get();
        assertThat(afterDelete.demands()).noneMatch(d -> d.from().equals("s05"));

        assertThat(vm.undo()).isTrue();
        assertThat(vm.scenarioProperty().get()).isEqualTo(afterRadius);
        assertThat(vm.undo()).isTrue();
        assertThat(vm.scenarioProperty().get()).isEqualTo(afterMove);
        assertThat(vm.undo()).isTrue();
        assertThat(vm.scenarioProperty().get()).isEqualTo(original);
        assertThat(vm.undo()).isFalse();
        assertThat(awaitPlan().scenario()).isEqualTo(original);

        assertThat(vm.redo()).isTrue();
        assertThat(vm.redo()).isTrue();
        assertThat(vm.redo()).isTrue();
        assertThat(vm.scenarioProperty().get()).isEqualTo(afterDelete);
        assertThat(vm.redo()).isFalse();
        assertThat(awaitPlan().scenario()).isEqualTo(afterDelete);
    }

    @Test
    void aNewEditClearsRedo() throws Exception {
        opened();
        vm.editor().moveNode("s01", new Vec3(150, 240, 85));
        vm.undo();
        assertThat(vm.document().undoStack().canRedoProperty().get()).isTrue();
        vm.editor().moveNode("s02", new Vec3(90, 240, 115));
        assertThat(vm.document().undoStack().canRedoProperty().get()).isFalse();
    }

    @Test
    void negativeRadiusIsRefusedAndChangesNothing() throws Exception {
        Scenario s = opened();
        int calls = fake.calls.size();
        vm.editor().selectedNodeIdProperty().set("s01");
        vm.editor().inspector().radiusUmProperty().set("-2");
        assertThat(vm.editor().applyInspector()).isFalse();
        assertThat(vm.messageProperty().get()).contains("refused").contains("radius");
        assertThat(vm.scenarioProperty().get()).isSameAs(s);
        assertThat(vm.document().undoStack().canUndoProperty().get()).isFalse();
        assertThat(vm.document().dirtyProperty().get()).isFalse();
        assertThat(fake.calls).hasSize(calls);
    }

    @Test
    void nodeOutsideTheVolumeIsRefusedAndChangesNothing() throws Exception {
        Scenario s = opened();
        // the tank's box is [0,400]×[0,400]×[0,200] µm (scenarios/culture-tank.json)
        assertThat(vm.editor().moveNode("s01", new Vec3(150, 240, 250))).isFalse();
        assertThat(vm.messageProperty().get()).contains("refused").contains("s01");
        assertThat(vm.scenarioProperty().get()).isSameAs(s);
        assertThat(vm.document().undoStack().canUndoProperty().get()).isFalse();
    }

    @Test
    void overlappingAndMalformedEditsAreRefused() throws Exception {
        Scenario s = opened();
        // gw sits at (200, 200, 100) with radius 10 µm: a node centred there overlaps it
        assertThat(vm.editor().moveNode("s01", new Vec3(200, 200, 100))).isFalse();
        vm.editor().selectedNodeIdProperty().set("s01");
        vm.editor().inspector().xUmProperty().set("abc");
        assertThat(vm.editor().applyInspector()).isFalse();
        // the message names the field as the scenario file does (x is position_um[0] of the file's nodes[i])
        String x = "nodes[" + s.nodes().indexOf(s.nodesById().get("s01")) + "].position_um[0]";
        assertThat(vm.messageProperty().get()).contains(x).contains("abc");
        assertThat(vm.editor().inspector().errors().message(NodeInspector.X).get())
                .isEqualTo(x + " is not a number: 'abc'");
        assertThat(vm.scenarioProperty().get()).isSameAs(s);
    }

    @Test
    void addDuplicateAndDeleteKeepTheLayoutValid() throws Exception {
        Scenario s = opened();
        assertThat(vm.editor().addNode(Role.RECEIVER)).isTrue();
        String added = vm.editor().selectedNodeIdProperty().get();
        assertThat(vm.editor().nodeById(added).role()).isEqualTo(Role.RECEIVER);
        assertThat(vm.editor().duplicateNode("s01")).isTrue();
        String copy = vm.editor().selectedNodeIdProperty().get();
        assertThat(copy).isNotEqualTo("s01");
        assertThat(vm.scenarioProperty().get().nodes()).hasSize(s.nodes().size() + 2);
        assertThat(vm.editor().deleteNode(copy)).isTrue();
        assertThat(vm.editor().nodeById(copy)).isNull();
        assertThat(vm.editor().selectedNodeIdProperty().get()).isNull();
        // every intermediate layout passed planner-core's validation: re-check the last one
        Scenario last = vm.scenarioProperty().get();
        assertThat(new Scenario(last.name(), last.volume(), last.medium(), last.species(), last.signalling(),
                last.nodes(), last.demands(), last.targets(), last.candidateSpecies(), last.tolerances()))
                .isEqualTo(last);
    }

    @Test
    void rapidEditsArePlannedOnceWhenDebounced() throws Exception {
        bg.shutdownNow();
        bg = PlannerViewModel.daemonScheduler();
        vm = new PlannerViewModel(fake, Runnable::run, bg, 300, new RecentFiles(null));
        vm.open(TANK);
        for (int i = 0; i < 5; i++) {
            vm.editor().moveNode("s01", new Vec3(150 + i, 230, 85));
        }
        Plan p = awaitPlan();
        assertThat(p.scenario().nodesById().get("s01").positionUm()).isEqualTo(new Vec3(154, 230, 85));
        // the five edits and the open fall inside one debounce window: one planning run
        assertThat(fake.calls).hasSize(1);
    }

    @Test
    void aFailingPlannerLeavesAMessageAndNotBusy() throws Exception {
        vm = new PlannerViewModel(s -> {
            throw new IllegalStateException("boom");
        }, Runnable::run, bg, 0, new RecentFiles(null));
        vm.open(TANK);
        try {
            awaitPlan();
        } catch (ExecutionException expected) {
            assertThat(expected.getCause()).hasMessage("boom");
        }
        assertThat(vm.plans().busyProperty().get()).isFalse();
        assertThat(vm.messageProperty().get()).contains("boom");
    }

    @Test
    void exportsTheHtmlReportOfThePlan(@TempDir Path dir) throws Exception {
        opened();
        Path out = dir.resolve("report.html");
        assertThat(vm.exportHtml(out)).isTrue();
        String html = Files.readString(out);
        assertThat(html).contains("<svg").contains("not validated for clinical use");
        assertThat(vm.messageProperty().get()).contains("report.html");
    }

    @Test
    void saveAsWritesAFileThatReadsBackEqual(@TempDir Path dir) throws Exception {
        opened();
        vm.editor().moveNode("s01", new Vec3(150, 240, 85));
        Path out = dir.resolve("edited.json");
        assertThat(vm.saveAs(out)).isTrue();
        assertThat(vm.document().dirtyProperty().get()).isFalse();
        assertThat(ScenarioReader.strict().read(out)).isEqualTo(vm.scenarioProperty().get());
        assertThat(vm.document().recentFiles()).first().isEqualTo(out.toAbsolutePath().normalize());
        assertThat(Files.list(dir)).hasSize(1);
    }

    @Test
    void badFileKeepsTheCurrentLayout(@TempDir Path dir) throws Exception {
        Scenario s = opened();
        Path bad = dir.resolve("bad.json");
        Files.writeString(bad, "{\"format\": \"nanoplan/9\"}");
        assertThat(vm.open(bad)).isFalse();
        assertThat(vm.messageProperty().get()).contains("cannot open");
        assertThat(vm.scenarioProperty().get()).isSameAs(s);
    }

    @Test
    void comparisonShowsKeptAndCurrentNumbers() throws Exception {
        opened();
        vm.keepForComparison();
        double kept = vm.tables().findLink("s01", "gw").mutualInformationBits();
        vm.editor().moveNode("s01", new Vec3(60, 60, 60));
        awaitPlan();
        DemandComparison row = vm.tables().comparison().stream().filter(r -> r.from().equals("s01")).findFirst().orElseThrow();
        assertThat(row.baselineCapacity()).isEqualTo(kept);
        assertThat(row.capacity()).isEqualTo(vm.tables().findLink("s01", "gw").mutualInformationBits());
        // s01 releases 4000 molecules for a "1" at prior_one 0.05 (culture-tank.json): 200 per symbol on average
        assertThat(row.molPerBit()).isCloseTo(4000 * 0.05 / row.capacity(), org.assertj.core.data.Offset.offset(1e-9));
    }

    // ---------------------------------------------------------------- settings (medium, signalling, species)

    @Test
    void symbolTimeEditReplansAndUndoRestoresIt() throws Exception {
        Scenario original = opened();
        // culture-tank.json sets symbol_time_s = 1.0
        assertThat(vm.settings().symbolTimeSProperty().get()).isEqualTo("1");
        vm.settings().symbolTimeSProperty().set("0.25");
        assertThat(vm.applySettings()).isTrue();
        Plan p = awaitPlan();
        assertThat(p.scenario().signalling().symbolTimeS()).isEqualTo(0.25);
        assertThat(fake.calls.get(fake.calls.size() - 1).signalling().symbolTimeS()).isEqualTo(0.25);
        assertThat(p.scenario().nodes()).isEqualTo(original.nodes());
        assertThat(vm.document().dirtyProperty().get()).isTrue();

        assertThat(vm.undo()).isTrue();
        assertThat(vm.scenarioProperty().get()).isEqualTo(original);
        assertThat(awaitPlan().scenario().signalling().symbolTimeS()).isEqualTo(1.0);
        // the editor shows the restored value again
        assertThat(vm.settings().symbolTimeSProperty().get()).isEqualTo("1");
        assertThat(vm.redo()).isTrue();
        assertThat(awaitPlan().scenario().signalling().symbolTimeS()).isEqualTo(0.25);
    }

    @Test
    void negativeDiffusionIsRefusedNamingTheFieldAndChangesNothing() throws Exception {
        Scenario s = opened();
        int calls = fake.calls.size();
        vm.settings().species("A").diffusionUm2PerSProperty().set("-5");
        assertThat(vm.applySettings()).isFalse();
        assertThat(vm.messageProperty().get()).contains("refused").contains("species A").contains("diffusion");
        assertThat(vm.scenarioProperty().get()).isSameAs(s);
        assertThat(vm.document().undoStack().canUndoProperty().get()).isFalse();
        assertThat(vm.document().dirtyProperty().get()).isFalse();
        assertThat(fake.calls).hasSize(calls);
    }

    @Test
    void priorOutsideTheUnitIntervalIsRefusedNamingTheField() throws Exception {
        Scenario s = opened();
        int calls = fake.calls.size();
        vm.settings().priorOneProperty().set("1.5");
        assertThat(vm.applySettings()).isFalse();
        assertThat(vm.messageProperty().get()).contains("refused").contains("prior");
        assertThat(vm.scenarioProperty().get()).isSameAs(s);
        assertThat(vm.document().undoStack().canUndoProperty().get()).isFalse();
        assertThat(fake.calls).hasSize(calls);
    }

    @Test
    void malformedSettingsAreRefusedNamingTheField() throws Exception {
        Scenario s = opened();
        vm.settings().temperatureKProperty().set("warm");
        assertThat(vm.applySettings()).isFalse();
        assertThat(vm.messageProperty().get()).contains("medium.temperature_K").contains("warm");
        vm.settings().load(s);
        vm.settings().levelsProperty().set("2.5");
        assertThat(vm.applySettings()).isFalse();
        assertThat(vm.messageProperty().get()).contains("levels");
        vm.settings().load(s);
        vm.settings().species("A").halfLifeSProperty().set("0");
        assertThat(vm.applySettings()).isFalse();
        assertThat(vm.messageProperty().get()).contains("species A").contains("species[0].half_life_s");
        assertThat(vm.scenarioProperty().get()).isSameAs(s);
    }

    @Test
    void countModelRoundTripsThroughUndoAndRedo() throws Exception {
        Scenario original = opened();
        assertThat(original.signalling().countModel()).isEqualTo(CountModelKind.EXACT);
        for (CountModelKind k : new CountModelKind[] {CountModelKind.POISSON, CountModelKind.GAUSSIAN}) {
            vm.settings().countModelProperty().set(k);
            assertThat(vm.applySettings()).isTrue();
            assertThat(awaitPlan().scenario().signalling().countModel()).isEqualTo(k);
        }
        assertThat(vm.undo()).isTrue();
        assertThat(vm.settings().countModelProperty().get()).isEqualTo(CountModelKind.POISSON);
        assertThat(vm.undo()).isTrue();
        assertThat(vm.settings().countModelProperty().get()).isEqualTo(CountModelKind.EXACT);
        assertThat(vm.scenarioProperty().get()).isEqualTo(original);
        assertThat(vm.redo()).isTrue();
        assertThat(vm.redo()).isTrue();
        assertThat(awaitPlan().scenario().signalling().countModel()).isEqualTo(CountModelKind.GAUSSIAN);
    }

    @Test
    void unchangedSettingsAreNotAnEdit() throws Exception {
        Scenario s = opened();
        assertThat(vm.applySettings()).isFalse();
        assertThat(vm.scenarioProperty().get()).isSameAs(s);
        assertThat(vm.document().undoStack().canUndoProperty().get()).isFalse();
    }

    @Test
    void blankHalfLifeMakesASpeciesStable() throws Exception {
        opened();
        // species A has half_life_s = 1.0 in culture-tank.json
        assertThat(vm.settings().species("A").halfLifeSProperty().get()).isEqualTo("1");
        vm.settings().species("A").halfLifeSProperty().set(" ");
        vm.settings().species("A").diffusionUm2PerSProperty().set("80");
        assertThat(vm.applySettings()).isTrue();
        Species a = awaitPlan().scenario().speciesByName().get("A");
        assertThat(a.isStable()).isTrue();
        assertThat(a.diffusionUm2PerS()).isEqualTo(80.0);
    }

    @Test
    void radiusSpeciesFollowsTemperatureThroughStokesEinstein() throws Exception {
        Scenario s = opened();
        Species before = s.speciesByName().get("B");
        // species B is given by hydrodynamic_radius_nm = 0.8 in culture-tank.json
        assertThat(before.hydrodynamicRadiusNm()).hasValue(0.8);
        vm.settings().temperatureKProperty().set("300");
        assertThat(vm.applySettings()).isTrue();
        Species after = awaitPlan().scenario().speciesByName().get("B");
        assertThat(after.hydrodynamicRadiusNm()).hasValue(0.8);
        // Einstein (1905) / Stokes: D = k_B T / (6 π η r), so at fixed η and r, D scales with T
        assertThat(after.diffusionUm2PerS() / before.diffusionUm2PerS())
                .isCloseTo(300 / 310.15, org.assertj.core.data.Offset.offset(1e-12));
        // D = 1.380649e-23 J/K (CODATA 2018, exact) * 300 K / (6 π * 0.69e-3 Pa s * 0.8e-9 m), in µm²/s
        double expected = 1.380649e-23 * 300 / (6 * Math.PI * 0.69e-3 * 0.8e-9) * 1e12;
        assertThat(after.diffusionUm2PerS()).isCloseTo(expected, org.assertj.core.data.Percentage.withPercentage(1e-6));
        // typing a coefficient replaces the radius description
        vm.settings().species("B").diffusionUm2PerSProperty().set("300");
        assertThat(vm.applySettings()).isTrue();
        Species typed = awaitPlan().scenario().speciesByName().get("B");
        assertThat(typed.hydrodynamicRadiusNm()).isEmpty();
        assertThat(typed.diffusionUm2PerS()).isEqualTo(300.0);
    }
}
