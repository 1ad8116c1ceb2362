package dev.nanoplan.desktop;

import static org.assertj.core.api.Assertions.assertThat;

import dev.nanoplan.geometry.Vec3;
import dev.nanoplan.plan.Plan;
import dev.nanoplan.scenario.Flow;
import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.ScenarioProblem;
import dev.nanoplan.scenario.ScenarioReader;
import dev.nanoplan.scenario.ScenarioValidator;
import dev.nanoplan.scenario.Schedule;
import dev.nanoplan.scenario.Species;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.ScheduledExecutorService;
import java.util.concurrent.TimeUnit;
import java.util.stream.Stream;
import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.simple.RandomSource;
import org.assertj.core.data.Percentage;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.Timeout;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * The settings editor through the view model, without a window: adding, renaming and removing
 * species, the bulk flow, the slot schedule; each Apply is one undo step and replans.
 */
@Timeout(30)
class ScenarioSettingsTest {

    static final Path TANK = Path.of("..", "scenarios", "culture-tank.json");
    static final Path VESSEL = Path.of("..", "scenarios", "vessel-segment.json");

    /** Boltzmann constant in J/K, exact since the 2019 SI redefinition (CODATA 2018). */
    static final double K_B = 1.380649e-23;

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

    Scenario opened(Path file) throws Exception {
        assertThat(vm.open(file)).isTrue();
        awaitPlan();
        return vm.scenarioProperty().get();
    }

    Scenario current() {
        return vm.scenarioProperty().get();
    }

    // ---------------------------------------------------------------- add

    @Test
    void addedSpeciesIsOfferedAndJoinsTheLayoutWhenANodeUsesIt() throws Exception {
        Scenario original = opened(TANK);
        SpeciesRow row = vm.settings().addSpecies();
        // culture-tank.json declares A and B, so the first free letter is offered
        assertThat(row.name()).isEqualTo("C");
        row.diffusionUm2PerSProperty().set("120");
        row.halfLifeSProperty().set("4");
        assertThat(vm.applySettings()).isTrue();
        // no node uses C yet: a valid layout cannot declare it, so it waits beside the layout
        assertThat(current()).isEqualTo(original);
        assertThat(vm.document().unusedSpecies()).containsExactly(Species.ofDiffusion("C", 120, 4));
        assertThat(vm.speciesNames()).containsExactly("A", "B", "C");
        assertThat(vm.settings().species("C").usageProperty().get()).isEqualTo("not used yet");
        assertThat(vm.document().undoStack().canUndoProperty().get()).isTrue();

        int calls = fake.calls.size();
        vm.editor().selectedNodeIdProperty().set("s11");
        vm.editor().inspector().speciesProperty().set("C");
        assertThat(vm.editor().applyInspector()).isTrue();
        Plan p = awaitPlan();
        // the edit is planned (a debounced plan of the settings change may still land before it on a
        // loaded machine, so the count is checked from below and the edit as the last call)
        assertThat(fake.calls).hasSizeGreaterThan(calls);
        assertThat(fake.calls.get(fake.calls.size() - 1).nodesById().get("s11").species()).isEqualTo("C");
        assertThat(p.scenario().speciesByName()).containsKeys("A", "B", "C");
        assertThat(p.scenario().speciesByName().get("C").diffusionUm2PerS()).isEqualTo(120.0);
        assertThat(p.scenario().nodesById().get("s11").species()).isEqualTo("C");
        assertThat(vm.document().unusedSpecies()).isEmpty();

        // undo: C is unused again, then gone
        assertThat(vm.undo()).isTrue();
        assertThat(current()).isEqualTo(original);
        assertThat(vm.document().unusedSpecies()).extracting(Species::name).containsExactly("C");
        assertThat(vm.undo()).isTrue();
        assertThat(vm.document().unusedSpecies()).isEmpty();
        assertThat(vm.settings().species()).extracting(SpeciesRow::name).containsExactly("A", "B");
        assertThat(vm.redo()).isTrue();
        assertThat(vm.redo()).isTrue();
        assertThat(awaitPlan().scenario().nodesById().get("s11").species()).isEqualTo("C");
    }

    @Test
    void aSpeciesNoNodeUsesAnyMoreStaysDeclaredAsUnused() throws Exception {
        Scenario original = opened(Path.of("..", "scenarios", "relay-chain-direct.json"));
        SpeciesRow row = vm.settings().addSpecies();
        row.nameProperty().set("X");
        row.diffusionUm2PerSProperty().set("300");
        assertThat(vm.applySettings()).isTrue();
        for (String id : List.of("src", "dst")) {
            vm.editor().selectedNodeIdProperty().set(id);
            vm.editor().inspector().speciesProperty().set("X");
            assertThat(vm.editor().applyInspector()).as(vm.messageProperty().get()).isTrue();
        }
        // relay-chain-direct.json has only src and dst, both on A before
        assertThat(current().speciesByName()).containsOnlyKeys("X");
        assertThat(vm.document().unusedSpecies()).containsExactly(original.species().get(0));
        assertThat(vm.settings().species("A").usageProperty().get()).isEqualTo("not used yet");
        // now A can be removed
        assertThat(vm.removeSpecies(vm.settings().species("A"))).isTrue();
        assertThat(vm.applySettings()).isTrue();
        assertThat(vm.document().unusedSpecies()).isEmpty();
        assertThat(vm.speciesNames()).containsExactly("X");
    }

    /** Random radii, temperatures and viscosities from a fixed seed. */
    static Stream<Arguments> radii() {
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(20261202L);
        List<Arguments> out = new ArrayList<>();
        for (int i = 0; i < 12; i++) {
            double radiusNm = Math.exp(Math.log(0.1) + rng.nextDouble() * Math.log(1000)); // 0.1 .. 100 nm
            out.add(Arguments.of(radiusNm, 273.15 + 60 * rng.nextDouble(), 0.3 + 2 * rng.nextDouble()));
        }
        return out.stream();
    }

    @ParameterizedTest
    @MethodSource("radii")
    void speciesGivenByRadiusGetsTheStokesEinsteinDiffusion(double radiusNm, double temperatureK,
            double viscosityMPaS) throws Exception {
        opened(TANK);
        vm.settings().temperatureKProperty().set(Double.toString(temperatureK));
        vm.settings().viscosityMPaSProperty().set(Double.toString(viscosityMPaS));
        SpeciesRow row = vm.settings().addSpecies();
        row.nameProperty().set("protein");
        row.hydrodynamicRadiusNmProperty().set(Double.toString(radiusNm));
        assertThat(vm.applySettings()).as(vm.messageProperty().get()).isTrue();
        Species sp = vm.document().unusedSpecies().get(0);
        assertThat(sp.hydrodynamicRadiusNm()).hasValue(radiusNm);
        assertThat(sp.isStable()).isTrue();
        // A. Einstein, Ann. Phys. 17 (1905) 549 / Stokes drag: D = k_B T / (6 π η r); k_B = 1.380649e-23 J/K
        // (CODATA 2018, exact); η in Pa·s, r in m, D converted from m²/s to µm²/s
        double expected = K_B * temperatureK / (6 * Math.PI * viscosityMPaS * 1e-3 * radiusNm * 1e-9) * 1e12;
        assertThat(sp.diffusionUm2PerS()).isCloseTo(expected, Percentage.withPercentage(1e-9));
    }

    @Test
    void aRowGivingBothDiffusionAndRadiusOrNeitherIsRefused() throws Exception {
        Scenario s = opened(TANK);
        SpeciesRow row = vm.settings().addSpecies();
        assertThat(vm.applySettings()).isFalse();
        assertThat(vm.messageProperty().get()).contains("new species row 3")
                .contains("species[2].diffusion_um2_per_s is missing").contains("hydrodynamic_radius_nm");
        row.diffusionUm2PerSProperty().set("100");
        row.hydrodynamicRadiusNmProperty().set("1");
        assertThat(vm.applySettings()).isFalse();
        assertThat(vm.messageProperty().get()).contains("not both");
        assertThat(current()).isSameAs(s);
        assertThat(vm.document().unusedSpecies()).isEmpty();
        assertThat(vm.document().undoStack().canUndoProperty().get()).isFalse();
    }

    // ---------------------------------------------------------------- names

    @Test
    void namesAreCheckedWithTheCoresOwnRulesAndMessages() throws Exception {
        Scenario s = opened(TANK);
        vm.settings().species("B").nameProperty().set("A");
        assertThat(vm.applySettings()).isFalse();
        // the message is the core validator's own for the same duplicate in a file
        ScenarioProblem expected = ScenarioValidator.check(s.volume(), s.medium().flow(),
                List.of(s.species().get(0), Species.stable("A", 1)), s.nodes(), s.demands()).stream()
                .filter(p -> p.path().equals("species[1].name")).findFirst().orElseThrow();
        assertThat(vm.messageProperty().get()).contains(expected.toString());

        vm.settings().load(s);
        vm.settings().species("B").nameProperty().set("  ");
        assertThat(vm.applySettings()).isFalse();
        String coreMessage = catchMessage(() -> Species.stable("  ", 1));
        assertThat(vm.messageProperty().get()).contains("species B").contains(coreMessage);

        vm.settings().load(s);
        SpeciesRow added = vm.settings().addSpecies();
        added.nameProperty().set("B");
        added.diffusionUm2PerSProperty().set("10");
        assertThat(vm.applySettings()).isFalse();
        assertThat(vm.messageProperty().get()).contains("species[2].name").contains("duplicate species name 'B'");
        assertThat(current()).isSameAs(s);
        assertThat(vm.document().undoStack().canUndoProperty().get()).isFalse();
    }

    static String catchMessage(Runnable r) {
        try {
            r.run();
        } catch (IllegalArgumentException e) {
            return e.getMessage();
        }
        throw new AssertionError("expected a refusal");
    }

    // ---------------------------------------------------------------- rename

    @Test
    void renameFollowsEveryNodeAndUndoRestoresTheOldNames() throws Exception {
        Scenario original = opened(TANK);
        vm.settings().species("A").nameProperty().set("glucose");
        vm.settings().symbolTimeSProperty().set("0.5");
        assertThat(vm.applySettings()).isTrue();
        Scenario renamed = awaitPlan().scenario();
        assertThat(renamed.speciesByName()).containsOnlyKeys("glucose", "B");
        Species g = renamed.speciesByName().get("glucose");
        Species a = original.speciesByName().get("A");
        assertThat(g.diffusionUm2PerS()).isEqualTo(a.diffusionUm2PerS());
        assertThat(g.halfLifeS()).isEqualTo(a.halfLifeS());
        for (int i = 0; i < original.nodes().size(); i++) {
            Node before = original.nodes().get(i);
            Node after = renamed.nodes().get(i);
            assertThat(after.species()).isEqualTo(before.species().equals("A") ? "glucose" : before.species());
            assertThat(after.emitsSpecies())
                    .isEqualTo(before.emitsSpecies().equals("A") ? "glucose" : before.emitsSpecies());
            assertThat(after.positionUm()).isEqualTo(before.positionUm());
        }
        assertThat(renamed.demands()).isEqualTo(original.demands());
        assertThat(fake.calls.get(fake.calls.size() - 1)).isEqualTo(renamed);

        // one undo step takes back the rename and the symbol time together
        assertThat(vm.undo()).isTrue();
        assertThat(current()).isEqualTo(original);
        assertThat(vm.settings().species()).extracting(SpeciesRow::name).containsExactly("A", "B");
        assertThat(vm.document().undoStack().canUndoProperty().get()).isFalse();
    }

    @Test
    void swappingTwoNamesSwapsThemInEveryNode() throws Exception {
        Scenario original = opened(TANK);
        vm.settings().species("A").nameProperty().set("B");
        vm.settings().species("B").nameProperty().set("A");
        assertThat(vm.applySettings()).as(vm.messageProperty().get()).isTrue();
        Scenario swapped = current();
        for (int i = 0; i < original.nodes().size(); i++) {
            Node before = original.nodes().get(i);
            Node after = swapped.nodes().get(i);
            assertThat(after.species()).isEqualTo(before.species().equals("A") ? "B" : "A");
            // the relays of culture-tank.json absorb A and emit B: both references swap
            assertThat(after.emitsSpecies()).isEqualTo(before.emitsSpecies().equals("A") ? "B" : "A");
        }
        // the species keep their properties under the new names
        assertThat(swapped.speciesByName().get("B").diffusionUm2PerS())
                .isEqualTo(original.speciesByName().get("A").diffusionUm2PerS());
    }

    // ---------------------------------------------------------------- remove

    @Test
    void removingAUsedSpeciesIsRefusedNamingItsNodes() throws Exception {
        Scenario s = opened(TANK);
        SpeciesRow b = vm.settings().species("B");
        assertThat(vm.removeSpecies(b)).isFalse();
        String msg = vm.messageProperty().get();
        // culture-tank.json: gw absorbs B, the relays emit it, s11..s14 release it
        assertThat(msg).contains("species B").contains("gw").contains("relay-w").doesNotContain("\n");
        assertThat(vm.settings().species()).contains(b);
        assertThat(vm.applySettings()).isFalse();
        assertThat(current()).isSameAs(s);
        assertThat(vm.document().undoStack().canUndoProperty().get()).isFalse();
    }

    @Test
    void removingAnUnusedSpeciesIsOneUndoStep() throws Exception {
        Scenario s = opened(TANK);
        SpeciesRow c = vm.settings().addSpecies();
        c.diffusionUm2PerSProperty().set("90");
        assertThat(vm.applySettings()).isTrue();
        assertThat(vm.removeSpecies(vm.settings().species("C"))).isTrue();
        assertThat(vm.applySettings()).isTrue();
        assertThat(vm.document().unusedSpecies()).isEmpty();
        assertThat(current()).isEqualTo(s);
        assertThat(vm.undo()).isTrue();
        assertThat(vm.document().unusedSpecies()).extracting(Species::name).containsExactly("C");
    }

    // ---------------------------------------------------------------- flow and schedule

    @Test
    void uniformFlowRoundTripsThroughSaveLoadAndUndo(@TempDir Path dir) throws Exception {
        Scenario original = opened(TANK);
        assertThat(vm.settings().flowProfileProperty().get()).isEqualTo("none");
        vm.settings().flowProfileProperty().set("uniform");
        vm.settings().flowVxUmPerSProperty().set("12.5");
        vm.settings().flowVyUmPerSProperty().set("-3");
        vm.settings().flowVzUmPerSProperty().set("0");
        assertThat(vm.applySettings()).isTrue();
        Scenario withFlow = awaitPlan().scenario();
        assertThat(withFlow.medium().flow()).isEqualTo(new Flow.Uniform(new Vec3(12.5, -3, 0)));
        assertThat(withFlow.nodes()).isEqualTo(original.nodes());

        Path file = dir.resolve("flow.json");
        assertThat(vm.saveAs(file)).isTrue();
        // planner-core's own reader gets back exactly what the editor produced
        assertThat(ScenarioReader.strict().read(file)).isEqualTo(withFlow);

        assertThat(vm.undo()).isTrue();
        assertThat(current().medium().flow()).isEqualTo(new Flow.None());
        assertThat(vm.settings().flowProfileProperty().get()).isEqualTo("none");
        assertThat(vm.redo()).isTrue();
        assertThat(vm.settings().flowVxUmPerSProperty().get()).isEqualTo("12.5");
    }

    @Test
    void poiseuilleFlowRoundTripsInACylinderAndIsRefusedInABox(@TempDir Path dir) throws Exception {
        Scenario vessel = opened(VESSEL);
        // vessel-segment.json: poiseuille, mean_speed_um_per_s = 200
        assertThat(vm.settings().flowProfileProperty().get()).isEqualTo("poiseuille");
        assertThat(vm.settings().flowMeanSpeedUmPerSProperty().get()).isEqualTo("200");
        vm.settings().flowMeanSpeedUmPerSProperty().set("350");
        assertThat(vm.applySettings()).isTrue();
        Path file = dir.resolve("vessel.json");
        assertThat(vm.saveAs(file)).isTrue();
        assertThat(ScenarioReader.strict().read(file).medium().flow()).isEqualTo(new Flow.Poiseuille(350));
        assertThat(vm.undo()).isTrue();
        assertThat(current()).isEqualTo(vessel);

        Scenario tank = opened(TANK);
        vm.settings().flowProfileProperty().set("poiseuille");
        vm.settings().flowMeanSpeedUmPerSProperty().set("100");
        assertThat(vm.applySettings()).isFalse();
        // the core's validator refuses it at the field medium.flow.profile
        assertThat(vm.messageProperty().get()).contains("medium.flow.profile").contains("cylinder")
                .doesNotContain("\n");
        assertThat(current()).isSameAs(tank);
    }

    @Test
    void invalidFlowNumbersAreRefusedNamingTheField() throws Exception {
        Scenario s = opened(VESSEL);
        vm.settings().flowMeanSpeedUmPerSProperty().set("-3");
        assertThat(vm.applySettings()).isFalse();
        assertThat(vm.messageProperty().get()).contains("refused")
                .contains("medium.flow.mean_speed_um_per_s must be finite and >= 0, got -3.0");
        vm.settings().load(s);
        vm.settings().flowProfileProperty().set("uniform");
        vm.settings().flowVyUmPerSProperty().set("fast");
        assertThat(vm.applySettings()).isFalse();
        assertThat(vm.messageProperty().get()).contains("medium.flow.velocity_um_per_s[1]").contains("fast");
        vm.settings().flowVyUmPerSProperty().set("Infinity");
        assertThat(vm.applySettings()).isFalse();
        assertThat(vm.messageProperty().get()).contains("medium.flow.velocity_um_per_s[1]").contains("finite");
        assertThat(current()).isSameAs(s);
        assertThat(vm.document().undoStack().canUndoProperty().get()).isFalse();
    }

    @Test
    void scheduleIsAChoiceThatReplansSavesAndUndoes(@TempDir Path dir) throws Exception {
        Scenario tank = opened(TANK);
        // culture-tank.json: "schedule": "all-active"
        assertThat(vm.settings().scheduleProperty().get()).isEqualTo(Schedule.ALL_ACTIVE);
        assertThat(ScenarioSettings.SCHEDULE_HELP).contains("every emitter").contains("every symbol slot")
                .contains("round-robin").contains("take turns");

        vm.settings().scheduleProperty().set(Schedule.ROUND_ROBIN);
        assertThat(vm.applySettings()).isTrue();
        // the layout handed to the planner has the new schedule, nothing else changed
        Plan p = awaitPlan();
        assertThat(p.scenario().signalling().schedule()).isEqualTo(Schedule.ROUND_ROBIN);
        assertThat(p.scenario().nodes()).isEqualTo(tank.nodes());

        Path file = dir.resolve("rr.json");
        assertThat(vm.saveAs(file)).isTrue();
        assertThat(ScenarioReader.strict().read(file).signalling().schedule())
                .isEqualTo(Schedule.ROUND_ROBIN);
        assertThat(vm.undo()).isTrue();
        assertThat(current().signalling()).isEqualTo(tank.signalling());
        assertThat(vm.settings().scheduleProperty().get()).isEqualTo(Schedule.ALL_ACTIVE);
    }
}
