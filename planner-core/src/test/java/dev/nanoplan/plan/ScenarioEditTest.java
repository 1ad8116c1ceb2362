package dev.nanoplan.plan;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import dev.nanoplan.count.CountModelKind;
import dev.nanoplan.geometry.Vec3;
import dev.nanoplan.geometry.Volume;
import dev.nanoplan.scenario.Demand;
import dev.nanoplan.scenario.Flow;
import dev.nanoplan.scenario.Medium;
import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.Schedule;
import dev.nanoplan.scenario.Signalling;
import dev.nanoplan.scenario.Species;
import dev.nanoplan.scenario.Targets;
import java.util.List;
import org.junit.jupiter.api.Test;

class ScenarioEditTest {

    /** s1 → relay → gw with an interfering s2; box 0..200 µm on each axis. */
    private static Scenario layout() {
        return new Scenario("edit", new Volume.Box(new Vec3(0, 0, 0), new Vec3(200, 200, 200)),
                new Medium(310.15, 0.69, new Flow.None(), 0.0),
                List.of(Species.ofDiffusion("A", 100, 30.0), Species.stable("B", 250)),
                new Signalling(1.0, 5, 2, 0.5, CountModelKind.EXACT, Schedule.ALL_ACTIVE),
                List.of(Node.transmitter("s1", new Vec3(40, 40, 100), 1, "A", 500),
                        Node.transmitter("s2", new Vec3(160, 100, 100), 1, "A", 400),
                        Node.relay("relay", new Vec3(100, 100, 100), 4, "A", "B", 800),
                        Node.receiver("gw", new Vec3(100, 160, 100), 6, "B")),
                List.of(new Demand("s1", "gw"), new Demand("s2", "gw")), Targets.DEFAULT);
    }

    @Test
    void movingTowardANodeLandsOnTheJoiningLineAtTheGivenDistance() {
        Scenario s = layout();
        // by hand: s1 − relay = (−60, −60, 0), |·| = 60√2; at 30√2 µm the new centre is relay + (−30, −30, 0)
        ScenarioEdit.MoveToward move = new ScenarioEdit.MoveToward("s1", "relay", 30 * Math.sqrt(2));
        Vec3 p = move.applyTo(s).nodesById().get("s1").positionUm();
        assertThat(p.x()).isCloseTo(70, within(1e-12));
        assertThat(p.y()).isCloseTo(70, within(1e-12));
        assertThat(p.z()).isCloseTo(100, within(1e-12));
        // by hand: relay − gw = (0, −60, 0); at 25 µm from gw the relay sits at (100, 135, 100)
        Vec3 r = new ScenarioEdit.MoveToward("relay", "gw", 25).applyTo(s).nodesById().get("relay").positionUm();
        assertThat(r.distance(new Vec3(100, 135, 100))).isLessThan(1e-12);
        // the argument is not changed (pure function)
        assertThat(s.nodesById().get("s1").positionUm()).isEqualTo(new Vec3(40, 40, 100));
        assertThat(move.describe()).isEqualTo("move s1 within 42.4 µm of relay");
    }

    @Test
    void aMoveIntoAnotherBodyIsNotAValidLayout() {
        // relay radius 4 µm + gw radius 6 µm: centres 8 µm apart overlap (by hand, 8 < 10)
        assertThatThrownBy(() -> new ScenarioEdit.MoveToward("relay", "gw", 8).applyTo(layout()))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("overlap");
    }

    @Test
    void aMoveBeyondTheBoxIsNotAValidLayout() {
        // by hand: s2 − s1 = (120, 60, 0), |·| = √18000; at 300 µm from s1 the new x is
        // 40 + 300·120/√18000 ≈ 308 µm > 200 µm, outside the box
        assertThatThrownBy(() -> new ScenarioEdit.MoveToward("s2", "s1", 300).applyTo(layout()))
                .isInstanceOf(IllegalArgumentException.class);
    }

    @Test
    void ownSpeciesCopiesTheEmittedSpeciesAndMovesTheFollowersToIt() {
        Scenario s = layout();
        String name = ScenarioEdit.OwnSpecies.freshName(s, "B", "relay");
        assertThat(name).isEqualTo("B-relay");
        Scenario t = new ScenarioEdit.OwnSpecies("relay", name, List.of("gw")).applyTo(s);
        Node relay = t.nodesById().get("relay");
        Node gw = t.nodesById().get("gw");
        assertThat(relay.species()).isEqualTo("A");
        assertThat(relay.emitsSpecies()).isEqualTo("B-relay");
        assertThat(gw.species()).isEqualTo("B-relay");
        Species copy = t.speciesByName().get("B-relay");
        assertThat(copy.diffusionUm2PerS()).isEqualTo(250);
        assertThat(copy.isStable()).isTrue();
        // B is used by no node any more, so it is dropped (a scenario lists only used species)
        assertThat(t.speciesByName()).containsOnlyKeys("A", "B-relay");
        assertThat(s.speciesByName()).containsOnlyKeys("A", "B");
    }

    @Test
    void ownSpeciesForATransmitterChangesWhatItReleasesAndKeepsOldSpeciesInUse() {
        Scenario s = layout();
        Scenario t = new ScenarioEdit.OwnSpecies("s2", "A-s2", List.of()).applyTo(s);
        Node s2 = t.nodesById().get("s2");
        assertThat(s2.species()).isEqualTo("A-s2");
        assertThat(s2.emitsSpecies()).isEqualTo("A-s2");
        assertThat(t.speciesByName().get("A-s2").halfLifeS()).isEqualTo(30.0);
        assertThat(t.speciesByName()).containsKeys("A", "B", "A-s2");
        assertThat(t.nodesById().get("relay").species()).isEqualTo("A");
        assertThat(ScenarioEdit.OwnSpecies.freshName(t, "A", "s2")).isEqualTo("A-s2-2");
    }

    @Test
    void symbolTimeAndMoleculesChangeOneValueEach() {
        Scenario s = layout();
        Scenario t = new ScenarioEdit.SymbolTime(2.5).applyTo(s);
        assertThat(t.signalling().symbolTimeS()).isEqualTo(2.5);
        assertThat(t.signalling().isiMemorySymbols()).isEqualTo(5);
        assertThat(t.nodes()).isEqualTo(s.nodes());
        Scenario u = new ScenarioEdit.Molecules("s1", 1234).applyTo(s);
        assertThat(u.nodesById().get("s1").moleculesPerSymbol()).isEqualTo(1234);
        assertThat(u.nodesById().get("s2")).isEqualTo(s.nodesById().get("s2"));
        assertThat(u.signalling()).isEqualTo(s.signalling());
    }

    @Test
    void equalEditsAreEqualSoTheyAreRePlannedOnce() {
        assertThat(new ScenarioEdit.MoveToward("a", "b", 41.2)).isEqualTo(new ScenarioEdit.MoveToward("a", "b", 41.2));
        assertThat(new ScenarioEdit.OwnSpecies("a", "A-a", List.of("gw")))
                .isEqualTo(new ScenarioEdit.OwnSpecies("a", "A-a", List.of("gw")));
        assertThat(new ScenarioEdit.SymbolTime(2)).isNotEqualTo(new ScenarioEdit.SymbolTime(3));
    }
}
