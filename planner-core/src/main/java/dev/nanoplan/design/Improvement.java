package dev.nanoplan.design;

import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.Role;
import dev.nanoplan.scenario.Scenario;
import java.util.ArrayList;
import java.util.Collection;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * What a layout search found.
 *
 * @param before       the input layout
 * @param after        the best layout found (the input when nothing better was found)
 * @param assessedBefore the input's objective and demands
 * @param assessedAfter  the result's (never worse than the input's on the objective)
 * @param changes      from {@code before} to {@code after}, in plain words
 * @param evaluations  layouts re-planned
 * @param seconds      wall-clock time of the search
 * @param stoppedEarly true when the time limit or a cancel ended the search before it converged
 */
public record Improvement(Scenario before, Scenario after, Assessment assessedBefore, Assessment assessedAfter,
        List<Change> changes, int evaluations, double seconds, boolean stoppedEarly) {

    public Improvement {
        changes = List.copyOf(changes);
    }

    /**
     * The input layout with only {@code chosen} of {@link #changes()} made (the desktop's ticked
     * changes): each chosen change copies its field of its node from {@link #after()}; an added node is
     * added as {@code after} has it. Every change chosen gives {@code after}'s nodes; none gives
     * {@code before}. Species enter or leave {@code species} as {@link LayoutEdits#withNodes} sorts them.
     *
     * @throws IllegalArgumentException if a chosen change is not one of {@link #changes()}, or the
     *     partial layout is not a valid scenario (e.g. a relay's absorbed species changed without the
     *     sender's): the scenario's own validation message
     */
    public Scenario withOnly(Collection<Change> chosen) {
        for (Change c : chosen) {
            if (!changes.contains(c)) {
                throw new IllegalArgumentException("not a change of this proposal: " + c.describe());
            }
        }
        Map<String, Node> now = after.nodesById();
        List<Node> nodes = new ArrayList<>();
        for (Node n : before.nodes()) {
            Node m = n;
            Node target = now.get(n.id());
            for (Change c : chosen) {
                if (target != null && c.node().equals(n.id())) {
                    m = copyField(m, target, c.field());
                }
            }
            nodes.add(m);
        }
        for (Change c : chosen) {
            if ("node".equals(c.field())) {
                nodes.add(now.get(c.node()));
            }
        }
        Scenario partial = LayoutEdits.withNodes(before, nodes);
        return withChosenSlots(partial, chosen);
    }

    /**
     * The slot plan with only the chosen {@code slot} changes: emitters whose slot change is chosen
     * take {@link #after()}'s slot, every other emitter keeps the slot it had in {@link #before()}
     * (all-active: slot 0; round-robin: its file-order slot). No slot change chosen: the layout's
     * own schedule stays.
     */
    private Scenario withChosenSlots(Scenario partial, Collection<Change> chosen) {
        Map<String, Integer> slots = new LinkedHashMap<>(LayoutEdits.slotsOf(before));
        boolean any = false;
        for (Change c : chosen) {
            if ("slot".equals(c.field())) {
                slots.put(c.node(), after.signalling().slots().get(c.node()));
                any = true;
            }
        }
        if (!any) {
            return partial;
        }
        Map<String, Integer> emitters = new LinkedHashMap<>();
        for (Node n : partial.nodes()) {
            if (n.role().emits()) {
                emitters.put(n.id(), slots.getOrDefault(n.id(), after.signalling().slots().getOrDefault(n.id(), 0)));
            }
        }
        int frame = after.signalling().frameSlots();
        boolean fits = frame == 0 || emitters.values().stream().allMatch(v -> v < frame);
        return LayoutEdits.withSlots(partial, fits ? frame : 0, emitters);
    }

    private static Node copyField(Node n, Node from, String field) {
        return switch (field) {
            case "position_um" -> LayoutEdits.moved(n, from.positionUm());
            case "molecules_per_symbol" -> LayoutEdits.withMolecules(n, from.moleculesPerSymbol());
            case "species" -> n.role() == Role.RELAY ? LayoutEdits.withSpecies(n, from.species(), n.emitsSpecies())
                    : LayoutEdits.withSpecies(n, from.species(), from.emitsSpecies());
            case "emits_species" -> LayoutEdits.withSpecies(n, n.species(), from.emitsSpecies());
            default -> n;
        };
    }
}
