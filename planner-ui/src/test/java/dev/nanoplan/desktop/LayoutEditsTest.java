package dev.nanoplan.desktop;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import dev.nanoplan.geometry.Vec3;
import dev.nanoplan.geometry.Volume;
import dev.nanoplan.scenario.Demand;
import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.Role;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.ScenarioReader;
import dev.nanoplan.scenario.Species;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Set;
import java.util.stream.Stream;
import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.simple.RandomSource;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * The layout edits as pure functions on the culture tank (scenarios/culture-tank.json: a
 * 400 × 400 × 200 µm box, species A and B, 17 nodes, 14 demands to gw), without JavaFX. Each
 * result is compared with the input record by record, or with an independent computation here.
 */
class LayoutEditsTest {

    static Scenario tank;
    static final Species C = Species.ofDiffusion("C", 120, 4);

    @BeforeAll
    static void read() throws Exception {
        tank = ScenarioReader.strict().read(Path.of("..", "scenarios", "culture-tank.json"));
    }

    /** The nodes of {@code s} by id, except {@code id}. */
    static List<Node> others(Scenario s, String id) {
        return s.nodes().stream().filter(n -> !n.id().equals(id)).toList();
    }

    @Test
    void aMoveChangesOnlyThatNodesPosition() {
        Scenario moved = LayoutEdits.moveNode(tank, List.of(), "s01", new Vec3(60, 60, 60));
        Node before = tank.nodesById().get("s01");
        Node after = moved.nodesById().get("s01");
        // the edit's contract, field by field: the same node with a new centre, all else the same
        assertThat(after).isEqualTo(new Node("s01", before.role(), new Vec3(60, 60, 60), before.radiusUm(),
                before.species(), before.emitsSpecies(), before.moleculesPerSymbol()));
        assertThat(others(moved, "s01")).isEqualTo(others(tank, "s01"));
        assertThat(moved.demands()).isEqualTo(tank.demands());
        assertThat(moved.species()).isEqualTo(tank.species());
        assertThat(moved.medium()).isEqualTo(tank.medium());
        assertThat(moved.signalling()).isEqualTo(tank.signalling());
    }

    @Test
    void aDeleteDropsTheNodeAndEveryDemandNamingIt() {
        Scenario out = LayoutEdits.deleteNode(tank, List.of(), "relay-w");
        assertThat(out.nodesById()).doesNotContainKey("relay-w");
        assertThat(out.nodes()).isEqualTo(others(tank, "relay-w"));
        // independent filter of the input's demands
        List<Demand> expected = tank.demands().stream()
                .filter(d -> !d.from().equals("relay-w") && !d.to().equals("relay-w")).toList();
        assertThat(out.demands()).isEqualTo(expected);
        assertThatThrownBy(() -> LayoutEdits.deleteNode(tank, List.of(), "nope")).isInstanceOf(
                IllegalArgumentException.class).hasMessage("no node 'nope'");
    }

    @Test
    void aRenameCarriesTheDemandsAlong() {
        Node s01 = tank.nodesById().get("s01");
        Node renamed = new Node("sensor-1", s01.role(), s01.positionUm(), s01.radiusUm(), s01.species(),
                s01.emitsSpecies(), s01.moleculesPerSymbol());
        Scenario out = LayoutEdits.replaceNode(tank, List.of(), "s01", renamed);
        assertThat(out.nodes().get(tank.nodes().indexOf(s01))).isEqualTo(renamed);
        // each demand of the input with s01 replaced by the new id, in the same order
        assertThat(out.demands()).isEqualTo(tank.demands().stream().map(d -> new Demand(
                d.from().equals("s01") ? "sensor-1" : d.from(), d.to().equals("s01") ? "sensor-1" : d.to())).toList());
    }

    @Test
    void addingThenRemovingADemandGivesTheLayoutBack() {
        Scenario added = LayoutEdits.addDemand(tank, List.of(), "relay-w", "gw");
        assertThat(added.demands()).hasSize(tank.demands().size() + 1).contains(new Demand("relay-w", "gw"));
        assertThat(LayoutEdits.removeDemand(added, List.of(), "relay-w", "gw")).isEqualTo(tank);
        // the Scenario constructor refuses a demand that names no node
        assertThatThrownBy(() -> LayoutEdits.addDemand(tank, List.of(), "ghost", "gw"))
                .isInstanceOf(IllegalArgumentException.class);
    }

    @Test
    void aSpeciesMovesBetweenTheLayoutAndTheUnusedOnes() {
        Node s01 = tank.nodesById().get("s01");
        Node onC = new Node("s01", s01.role(), s01.positionUm(), s01.radiusUm(), "C", "C", s01.moleculesPerSymbol());
        Scenario withC = LayoutEdits.replaceNode(tank, List.of(C), "s01", onC);
        // the layout declares exactly the species its nodes use (independent set of the nodes' species)
        assertThat(names(withC.species())).isEqualTo(usedBy(withC.nodes()));
        assertThat(withC.speciesByName()).containsEntry("C", C);
        assertThat(LayoutEdits.unusedAfter(tank, List.of(C), withC)).isEmpty();
        Scenario back = LayoutEdits.replaceNode(withC, List.of(), "s01", s01);
        assertThat(back).isEqualTo(tank);
        assertThat(LayoutEdits.unusedAfter(withC, List.of(), back)).containsExactly(C);
    }

    static Set<String> names(List<Species> species) {
        Set<String> out = new HashSet<>();
        species.forEach(s -> out.add(s.name()));
        return out;
    }

    static Set<String> usedBy(List<Node> nodes) {
        Set<String> out = new HashSet<>();
        nodes.forEach(n -> {
            out.add(n.species());
            out.add(n.emitsSpecies());
        });
        return out;
    }

    @Test
    void newNodesGetFreshIdsAndStartAtTheVolumesCentre() {
        Node tx = LayoutEdits.newNode(tank, Role.TRANSMITTER);
        assertThat(tx.id()).isEqualTo("tx");
        // the box runs from 0 to (400, 400, 200) µm: its centre is the midpoint
        assertThat(tx.positionUm()).isEqualTo(new Vec3(200, 200, 100));
        assertThat(tx.moleculesPerSymbol()).isEqualTo(LayoutEdits.NEW_EMITTER_MOLECULES);
        assertThat(LayoutEdits.newNode(tank, Role.RECEIVER).moleculesPerSymbol()).isZero();
        assertThat(LayoutEdits.copyOf(tank, tank.nodesById().get("gw")).id()).isEqualTo("gw-copy");
        Scenario once = LayoutEdits.addNear(tank, List.of(), LayoutEdits.copyOf(tank, tank.nodesById().get("gw")),
                tank.nodesById().get("gw").positionUm());
        assertThat(LayoutEdits.copyOf(once, once.nodesById().get("gw")).id()).isEqualTo("gw-copy2");
    }

    /** Seeded wanted places: anywhere in the box, or on an existing node (taken, so a farther ring is used). */
    static Stream<Arguments> seededPlaces() throws Exception {
        read();
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(20261204L);
        List<Node> nodes = tank.nodes();
        return Stream.generate(() -> {
            Vec3 p = rng.nextBoolean() ? new Vec3(rng.nextDouble(20, 380), rng.nextDouble(20, 380),
                    rng.nextDouble(20, 180)) : nodes.get(rng.nextInt(nodes.size())).positionUm();
            return Arguments.of(p, rng.nextDouble(1, 4));
        }).limit(30);
    }

    @ParameterizedTest
    @MethodSource("seededPlaces")
    void anAddedNodeLandsOnTheFirstFreeRingAroundTheWantedPlace(Vec3 around, double radiusUm) {
        Node proto = new Node("new", Role.RELAY, around, radiusUm, "A", "A", 500);
        Scenario out = LayoutEdits.addNear(tank, List.of(), proto, around);
        Node placed = out.nodesById().get("new");
        assertThat(out.nodes().subList(0, tank.nodes().size())).isEqualTo(tank.nodes());
        // the candidates lie on rings r × step along unit directions (step = max(3 × radius, 5 µm)), so the
        // distance to the wanted place is a whole number of steps (geometry of the 3 × 3 × 3 grid directions)
        double step = Math.max(3 * radiusUm, 5);
        double rings = placed.positionUm().distance(around) / step;
        assertThat(rings).isCloseTo(Math.rint(rings), within(1e-9));
        if (tank.nodes().stream().anyMatch(n -> n.positionUm().equals(around))) {
            assertThat(Math.rint(rings)).isGreaterThanOrEqualTo(1);
        }
        // no point strictly nearer than the chosen ring is free (brute force over every nearer candidate)
        int ring = (int) Math.rint(rings);
        // (candidates(…, ring) lists rings 0 … ring − 1; at ring 0 there is nothing nearer to check)
        for (Vec3 p : ring == 0 ? List.<Vec3>of() : LayoutGeometry.candidates(around, step, ring)) {
            List<Node> nodes = new ArrayList<>(tank.nodes());
            nodes.add(new Node("new", Role.RELAY, p, radiusUm, "A", "A", 500));
            assertThatThrownBy(() -> new Scenario(tank.name(), tank.volume(), tank.medium(), tank.species(),
                    tank.signalling(), nodes, tank.demands(), tank.targets()))
                    .isInstanceOf(IllegalArgumentException.class);
        }
    }

    @Test
    void anAddWithNoFreePlaceIsRefusedWithTheLastProblem() {
        // a node larger than the whole box fits nowhere
        Node huge = new Node("big", Role.RELAY, new Vec3(200, 200, 100), 500, "A", "A", 1);
        assertThatThrownBy(() -> LayoutEdits.addNear(tank, List.of(), huge, huge.positionUm()))
                .isInstanceOf(IllegalArgumentException.class).hasMessageStartingWith("no free place found (");
    }

    @Test
    void candidatesAreRingsOfTwentySixUnitDirections() {
        List<Vec3> c = LayoutGeometry.candidates(new Vec3(1, 2, 3), 5, 4);
        // the wanted place, then 26 neighbour directions of a 3 × 3 × 3 grid per ring
        assertThat(c).hasSize(1 + 26 * 3);
        assertThat(c.get(0)).isEqualTo(new Vec3(1, 2, 3));
        for (int i = 1; i < c.size(); i++) {
            int ring = 1 + (i - 1) / 26;
            assertThat(c.get(i).distance(new Vec3(1, 2, 3))).isCloseTo(5.0 * ring, within(1e-12));
        }
        assertThat(new HashSet<>(c)).hasSize(c.size());
    }

    @Test
    void theFrameOfTheTankIsItsBox() {
        LayoutGeometry.Frame f = LayoutGeometry.frame(tank.volume(), tank.nodes());
        // every node lies inside the box: centre = box midpoint, extent = half the diagonal
        // sqrt(400² + 400² + 200²) / 2 = 600 / 2 = 300 µm
        assertThat(f.centreUm()).isEqualTo(new Vec3(200, 200, 100));
        assertThat(f.extentUm()).isCloseTo(300, within(1e-12));
    }

    @Test
    void openMediaAndCylindersAreFramedAndCentredAsDocumented() {
        List<Node> two = List.of(new Node("a", Role.TRANSMITTER, new Vec3(0, 0, 0), 1, "A", "A", 1),
                new Node("b", Role.RECEIVER, new Vec3(10, 0, 0), 1, "A", "A", 0));
        // open medium: the mean of the node centres; frame = the nodes' spheres, x from −1 to 11, y and z ±1
        assertThat(LayoutGeometry.centre(new Volume.Open(), two)).isEqualTo(new Vec3(5, 0, 0));
        LayoutGeometry.Frame f = LayoutGeometry.frame(new Volume.Open(), two);
        assertThat(f.centreUm()).isEqualTo(new Vec3(5, 0, 0));
        assertThat(f.extentUm()).isCloseTo(Math.sqrt(12 * 12 + 2 * 2 + 2 * 2) / 2, within(1e-12));
        // cylinder along +x from 0 to its length, centred on the axis
        assertThat(LayoutGeometry.centre(new Volume.Cylinder(20, 300), two)).isEqualTo(new Vec3(150, 0, 0));
    }
}
