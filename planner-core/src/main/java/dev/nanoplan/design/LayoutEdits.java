package dev.nanoplan.design;

import dev.nanoplan.geometry.Vec3;
import dev.nanoplan.plan.SlotSchedule;
import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.Role;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.Species;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.function.UnaryOperator;

/**
 * The layout changes the search makes, as pure functions {@code Scenario → Scenario} that keep every
 * node's {@code fixed} flag and the candidate species. A species enters {@code species} when some node
 * uses it and goes back to {@code candidate_species} when none does any more (a scenario lists only used
 * species), so a search can bring it back.
 *
 * <p>Each method throws {@link IllegalArgumentException} when the changed layout is not a valid scenario
 * (outside the volume, overlapping bodies): the scenario's own validation message.
 */
final class LayoutEdits {

    private LayoutEdits() {
    }

    /** {@code s} with each node mapped by {@code map}, species re-sorted into used and candidates. */
    static Scenario mapNodes(Scenario s, UnaryOperator<Node> map) {
        List<Node> nodes = new ArrayList<>(s.nodes().size());
        for (Node n : s.nodes()) {
            nodes.add(map.apply(n));
        }
        return withNodes(s, nodes);
    }

    /** {@code s} with the given nodes (same or more ids), species re-sorted into used and candidates. */
    static Scenario withNodes(Scenario s, List<Node> nodes) {
        Set<String> used = new HashSet<>();
        for (Node n : nodes) {
            used.add(n.species());
            used.add(n.emitsSpecies());
        }
        Map<String, Species> all = new LinkedHashMap<>();
        s.species().forEach(sp -> all.put(sp.name(), sp));
        s.candidateSpecies().forEach(sp -> all.putIfAbsent(sp.name(), sp));
        List<Species> species = new ArrayList<>();
        List<Species> candidates = new ArrayList<>();
        for (Species sp : all.values()) {
            (used.contains(sp.name()) ? species : candidates).add(sp);
        }
        return new Scenario(s.name(), s.volume(), s.medium(), species, s.signalling(), nodes, s.demands(),
                s.targets(), candidates, s.tolerances());
    }

    /** Every species the search may give a node: the scenario's, then its candidates. */
    static List<String> speciesChoices(Scenario s) {
        List<String> out = new ArrayList<>();
        s.species().forEach(sp -> out.add(sp.name()));
        s.candidateSpecies().forEach(sp -> out.add(sp.name()));
        return out;
    }

    static Node moved(Node n, Vec3 to) {
        return new Node(n.id(), n.role(), to, n.radiusUm(), n.species(), n.emitsSpecies(), n.moleculesPerSymbol(),
                n.fixed(), n.receiver());
    }

    static Node withMolecules(Node n, long molecules) {
        return new Node(n.id(), n.role(), n.positionUm(), n.radiusUm(), n.species(), n.emitsSpecies(), molecules,
                n.fixed(), n.receiver());
    }

    /** The node absorbing {@code absorbs} (receivers and relays) and emitting {@code emits} (relays). */
    static Node withSpecies(Node n, String absorbs, String emits) {
        if (n.role() != Role.RELAY) {
            String one = n.role() == Role.RECEIVER ? absorbs : emits;
            return new Node(n.id(), n.role(), n.positionUm(), n.radiusUm(), one, one, n.moleculesPerSymbol(),
                    n.fixed(), n.receiver());
        }
        return new Node(n.id(), n.role(), n.positionUm(), n.radiusUm(), absorbs, emits, n.moleculesPerSymbol(),
                n.fixed(), n.receiver());
    }

    /** {@code s} with node {@code id} replaced by {@code map} of it. */
    static Scenario node(Scenario s, String id, UnaryOperator<Node> map) {
        return mapNodes(s, n -> n.id().equals(id) ? map.apply(n) : n);
    }

    /**
     * A link group on one species: receiver {@code receiverId} absorbs {@code species} and each of the
     * {@code emitterIds} emits it.
     */
    static Scenario groupSpecies(Scenario s, String receiverId, Set<String> emitterIds, String species) {
        return mapNodes(s, n -> {
            boolean r = n.id().equals(receiverId);
            boolean e = emitterIds.contains(n.id());
            if (!r && !e) {
                return n;
            }
            return withSpecies(n, r ? species : n.species(), e ? species : n.emitsSpecies());
        });
    }

    /**
     * Every emitter's slot under {@code s}'s schedule, in file order: 0 under all-active, the file order of
     * its species under round-robin, the file's slot under slots.
     */
    static Map<String, Integer> slotsOf(Scenario s) {
        SlotSchedule schedule = SlotSchedule.of(s);
        Map<String, Integer> out = new LinkedHashMap<>();
        for (Node n : s.nodes()) {
            if (n.role().emits()) {
                out.put(n.id(), schedule.slotOf(n.id()));
            }
        }
        return out;
    }

    /**
     * {@code s} under the slots schedule with the given slots (every emitter's) and {@code frameSlots} slots
     * per frame of every species, or 0 for each species' largest slot + 1.
     */
    static Scenario withSlots(Scenario s, int frameSlots, Map<String, Integer> slots) {
        return new Scenario(s.name(), s.volume(), s.medium(), s.species(), s.signalling().withSlots(frameSlots, slots),
                s.nodes(), s.demands(), s.targets(), s.candidateSpecies(), s.tolerances());
    }
}
