package dev.nanoplan.design;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import dev.nanoplan.geometry.Vec3;
import dev.nanoplan.geometry.Volume;
import dev.nanoplan.count.CountModelKind;
import dev.nanoplan.plan.NetworkPlanner;
import dev.nanoplan.plan.PlanOptions;
import dev.nanoplan.scenario.Demand;
import dev.nanoplan.scenario.Medium;
import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.Schedule;
import dev.nanoplan.scenario.Signalling;
import dev.nanoplan.scenario.Species;
import dev.nanoplan.scenario.Targets;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * {@link Improvement#withOnly}: a chosen subset of a proposal's changes. The oracle is the layout written
 * out by hand with exactly those edits (each node built field by field), compared record for record.
 */
class ImprovementTest {

    private static Scenario pair() {
        Species a = Species.ofDiffusion("A", 80, 1.0);
        Species b = Species.ofDiffusion("B", 80, 1.0);
        List<Node> nodes = List.of(
                Node.receiver("g", new Vec3(0, 0, 0), 5, "A"),
                Node.transmitter("t", new Vec3(-20, 0, 0), 1, "A", 3000),
                Node.relay("r", new Vec3(-10, 5, 0), 2, "A", "A", 4000));
        return new Scenario("pair", new Volume.Open(), Medium.DEFAULT, List.of(a), new Signalling(0.5, 4, 2, 0.5,
                CountModelKind.EXACT, Schedule.ALL_ACTIVE), nodes, List.of(new Demand("t", "g")),
                new Targets(1e-3, 1.0, 3600), List.of(b));
    }

    /** The proposal: r moved and on twice the molecules, g and t on species B, a new relay. */
    private static Improvement proposal(Scenario before) {
        List<Node> nodes = new ArrayList<>();
        nodes.add(LayoutEdits.withSpecies(before.nodes().get(0), "B", "B"));
        nodes.add(LayoutEdits.withSpecies(before.nodes().get(1), "B", "B"));
        nodes.add(LayoutEdits.withMolecules(LayoutEdits.moved(before.nodes().get(2), new Vec3(-10, 0, 0)), 8000));
        nodes.add(Node.relay("relay-new-1", new Vec3(-5, 8, 0), 2, "B", "B", 4000));
        Scenario after = LayoutEdits.withNodes(before, nodes);
        Assessment a = Assessment.of(NetworkPlanner.plan(before, PlanOptions.DEFAULT));
        Assessment b = Assessment.of(NetworkPlanner.plan(after, PlanOptions.DEFAULT));
        return new Improvement(before, after, a, b, ChangeList.of(before, after), 2, 0.1, false);
    }

    @Test
    void everyChangeGivesTheProposalAndNoneGivesTheInput() {
        Scenario s = pair();
        Improvement p = proposal(s);
        assertThat(p.changes()).extracting(Change::field).containsExactlyInAnyOrder("species", "species",
                "position_um", "molecules_per_symbol", "node");
        assertThat(p.withOnly(p.changes())).isEqualTo(p.after());
        assertThat(p.withOnly(List.of())).isEqualTo(s);
    }

    @Test
    void aSubsetMakesExactlyThoseEdits() {
        Scenario s = pair();
        Improvement p = proposal(s);
        List<Change> chosen = p.changes().stream().filter(c -> c.node().equals("r")
                && c.field().equals("position_um")).toList();
        Scenario got = p.withOnly(chosen);
        // by hand: only r's centre changes; B stays a candidate because no node uses it
        Node r = s.nodes().get(2);
        Node movedR = new Node("r", r.role(), new Vec3(-10, 0, 0), r.radiusUm(), r.species(), r.emitsSpecies(),
                r.moleculesPerSymbol(), r.fixed(), r.receiver());
        assertThat(got.nodes()).containsExactly(s.nodes().get(0), s.nodes().get(1), movedR);
        assertThat(got.species()).extracting(Species::name).containsExactly("A");
        assertThat(got.candidateSpecies()).extracting(Species::name).containsExactly("B");
    }

    @Test
    void aChangeFromAnotherProposalIsRefused() {
        Improvement p = proposal(pair());
        Change foreign = new Change("t", "molecules_per_symbol", "3000", "1", "3,000 → 1 molecules per symbol");
        assertThatThrownBy(() -> p.withOnly(List.of(foreign))).isInstanceOf(IllegalArgumentException.class)
                .hasMessageContaining("not a change of this proposal");
    }

    /** A proposal that moves t and r from all-active (slot 0) to slots 1 and 2 of a 3-slot frame. */
    @Test
    void aChosenSlotChangeKeepsTheOtherEmittersInTheirFormerSlots() {
        Scenario s = pair();
        Scenario after = LayoutEdits.withSlots(s, 3, java.util.Map.of("t", 1, "r", 2));
        Assessment a = Assessment.of(NetworkPlanner.plan(s, PlanOptions.DEFAULT));
        Improvement p = new Improvement(s, after, a, a, ChangeList.of(s, after), 1, 0.1, false);
        assertThat(p.changes()).extracting(Change::field).containsExactly("slot", "slot");
        List<Change> onlyT = p.changes().stream().filter(c -> c.node().equals("t")).toList();
        Scenario got = p.withOnly(onlyT);
        // by hand: t in slot 1 of the 3-slot frame, r keeps the slot 0 it had under all-active
        assertThat(got.signalling().schedule()).isEqualTo(Schedule.SLOTS);
        assertThat(got.signalling().frameSlots()).isEqualTo(3);
        assertThat(got.signalling().slots()).containsEntry("t", 1).containsEntry("r", 0).hasSize(2);
        assertThat(got.nodes()).isEqualTo(s.nodes());
        assertThat(p.withOnly(p.changes())).isEqualTo(after);
    }
}
