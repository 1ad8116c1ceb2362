package dev.nanoplan.desktop;

import dev.nanoplan.geometry.Vec3;
import dev.nanoplan.scenario.Demand;
import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.Role;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.Signalling;
import dev.nanoplan.scenario.Species;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;

/**
 * The desktop's layout edits as pure functions {@code Scenario → Scenario}: nothing here holds
 * state or touches JavaFX, so each edit is tested on plain records. Every result is built through
 * the {@link Scenario} constructor, which validates the whole layout; an edit the core refuses
 * throws its {@link IllegalArgumentException} unchanged (the view model shows the message).
 *
 * <p>{@code unused} is the list of species declared in the settings editor that no node uses
 * yet; they cannot be part of a valid scenario, so they are passed beside it. A node may take one
 * of them up, and a species no node uses any more leaves the layout (see {@link #unusedAfter}).
 */
final class LayoutEdits {

    /** Default radius of an added node, µm. */
    static final double NEW_NODE_RADIUS_UM = 2.0;
    /** Molecules per symbol of an added emitter. */
    static final long NEW_EMITTER_MOLECULES = 1000;
    /** Rings of candidate places tried around the wanted position before an add is refused. */
    static final int RINGS = 12;

    private LayoutEdits() {
    }

    /** The layout's species followed by the unused ones declared in the editor. */
    static List<Species> declared(Scenario s, List<Species> unused) {
        List<Species> all = new ArrayList<>(s.species());
        all.addAll(unused);
        return all;
    }

    /**
     * The same scenario with other nodes and demands; the constructor validates the result. Its
     * species are the declared ones (the layout's, then the unused ones) that the nodes use.
     */
    static Scenario with(Scenario s, List<Species> unused, List<Node> nodes, List<Demand> demands) {
        Set<String> used = new HashSet<>();
        nodes.forEach(n -> {
            used.add(n.species());
            used.add(n.emitsSpecies());
        });
        Set<String> seen = new HashSet<>();
        List<Species> species = declared(s, unused).stream()
                .filter(sp -> used.contains(sp.name()) && seen.add(sp.name())).toList();
        return new Scenario(s.name(), s.volume(), s.medium(), species, s.signalling(), nodes, demands,
                s.targets(), s.candidateSpecies(), s.tolerances());
    }

    /**
     * The unused species after an edit from {@code before} to {@code after}: every declared species
     * of {@code before} that {@code after} does not hold, in declaration order.
     */
    static List<Species> unusedAfter(Scenario before, List<Species> unused, Scenario after) {
        List<Species> out = new ArrayList<>();
        Set<String> inLayout = new HashSet<>(after.speciesByName().keySet());
        for (Species sp : declared(before, unused)) {
            if (inLayout.add(sp.name())) {
                out.add(sp);
            }
        }
        return out;
    }

    /** Replaces the node {@code id} by {@code node}, which may carry a new id: the demands follow it. */
    static Scenario replaceNode(Scenario s, List<Species> unused, String id, Node node) {
        List<Node> nodes = new ArrayList<>(s.nodes());
        nodes.set(indexOf(nodes, id), node);
        List<Demand> demands = s.demands().stream()
                .map(d -> new Demand(d.from().equals(id) ? node.id() : d.from(), d.to().equals(id) ? node.id() : d.to()))
                .toList();
        return with(s, unused, nodes, demands);
    }

    /**
     * The layout with emitter {@code id} in slot {@code slot} (schedule {@code slots}); the same layout
     * when {@code slot} is null or already the node's.
     */
    static Scenario withSlot(Scenario s, String id, Integer slot) {
        if (slot == null || slot.equals(s.signalling().slots().get(id))) {
            return s;
        }
        Map<String, Integer> slots = new LinkedHashMap<>(s.signalling().slots());
        slots.put(id, slot);
        return withSignalling(s, s.signalling().withSlots(s.signalling().frameSlots(), slots));
    }

    /** The layout with another signalling (e.g. a slot plan); everything else stays. */
    static Scenario withSignalling(Scenario s, Signalling signalling) {
        return new Scenario(s.name(), s.volume(), s.medium(), s.species(), signalling, s.nodes(), s.demands(),
                s.targets(), s.candidateSpecies(), s.tolerances());
    }

    /** Moves the node {@code id} to a new centre; everything else about it stays. */
    static Scenario moveNode(Scenario s, List<Species> unused, String id, Vec3 positionUm) {
        List<Node> nodes = new ArrayList<>(s.nodes());
        int i = indexOf(nodes, id);
        nodes.set(i, at(nodes.get(i), nodes.get(i).id(), positionUm));
        return with(s, unused, nodes, s.demands());
    }

    /** Deletes the node {@code id} and the demands that name it. */
    static Scenario deleteNode(Scenario s, List<Species> unused, String id) {
        List<Node> nodes = new ArrayList<>(s.nodes());
        nodes.remove(indexOf(nodes, id));
        List<Demand> demands = s.demands().stream().filter(d -> !d.from().equals(id) && !d.to().equals(id)).toList();
        return with(s, unused, nodes, demands);
    }

    /** Adds the demand from → to (the constructor refuses duplicates and unknown nodes). */
    static Scenario addDemand(Scenario s, List<Species> unused, String from, String to) {
        List<Demand> demands = new ArrayList<>(s.demands());
        demands.add(new Demand(from, to));
        return with(s, unused, s.nodes(), demands);
    }

    /** Removes the demand from → to (no change when there is none). */
    static Scenario removeDemand(Scenario s, List<Species> unused, String from, String to) {
        return with(s, unused, s.nodes(),
                s.demands().stream().filter(d -> !(d.from().equals(from) && d.to().equals(to))).toList());
    }

    /**
     * A new node of {@code role} (id "tx", "rx" or "relay", numbered when taken) at the volume's
     * centre, on the layout's first species, releasing {@value #NEW_EMITTER_MOLECULES} molecules
     * per symbol when it emits. Place it with {@link #addNear}.
     */
    static Node newNode(Scenario s, Role role) {
        String id = freshId(s, role == Role.TRANSMITTER ? "tx" : role == Role.RECEIVER ? "rx" : "relay");
        String sp = s.species().get(0).name();
        return new Node(id, role, LayoutGeometry.centre(s.volume(), s.nodes()), NEW_NODE_RADIUS_UM, sp, sp,
                role.emits() ? NEW_EMITTER_MOLECULES : 0);
    }

    /** A copy of node {@code n} under a fresh id "{@code n}-copy" (numbered when taken), at the same place. */
    static Node copyOf(Scenario s, Node n) {
        return at(n, freshId(s, n.id() + "-copy"), n.positionUm());
    }

    /**
     * Adds {@code proto} at the first place around {@code aroundUm} where the layout stays valid,
     * trying {@link LayoutGeometry#candidates rings} of growing radius (step = max(3 × radius, 5 µm)).
     *
     * @throws IllegalArgumentException "no free place found (last problem)" when none of
     *                                  {@value #RINGS} rings has one
     */
    static Scenario addNear(Scenario s, List<Species> unused, Node proto, Vec3 aroundUm) {
        double step = Math.max(3 * proto.radiusUm(), 5);
        String lastProblem = "";
        for (Vec3 p : LayoutGeometry.candidates(aroundUm, step, RINGS)) {
            List<Node> nodes = new ArrayList<>(s.nodes());
            nodes.add(at(proto, proto.id(), p));
            try {
                return with(s, unused, nodes, s.demands());
            } catch (IllegalArgumentException e) {
                lastProblem = e.getMessage();
            }
        }
        throw new IllegalArgumentException("no free place found (" + lastProblem + ")");
    }

    /** An id that no node of {@code s} has: {@code base}, else base2, base3, … */
    static String freshId(Scenario s, String base) {
        Set<String> ids = new HashSet<>();
        s.nodes().forEach(n -> ids.add(n.id()));
        if (!ids.contains(base)) {
            return base;
        }
        for (int i = 2;; i++) {
            if (!ids.contains(base + i)) {
                return base + i;
            }
        }
    }

    private static Node at(Node n, String id, Vec3 positionUm) {
        return new Node(id, n.role(), positionUm, n.radiusUm(), n.species(), n.emitsSpecies(), n.moleculesPerSymbol(),
                n.fixed(), n.receiver());
    }

    private static int indexOf(List<Node> nodes, String id) {
        for (int i = 0; i < nodes.size(); i++) {
            if (nodes.get(i).id().equals(id)) {
                return i;
            }
        }
        throw new IllegalArgumentException("no node '" + id + "'");
    }
}
