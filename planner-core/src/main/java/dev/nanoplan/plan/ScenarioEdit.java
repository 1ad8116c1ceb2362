package dev.nanoplan.plan;

import dev.nanoplan.geometry.Vec3;
import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.Role;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.Signalling;
import dev.nanoplan.scenario.Species;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Locale;
import java.util.Set;
import java.util.function.UnaryOperator;

/**
 * One change to a layout that advice proposes: a pure function {@code Scenario → Scenario} (the
 * argument is never modified) with value equality, so identical proposals from different routes
 * are recognised and re-planned once ({@link AdviceChecker}).
 *
 * <p>{@link #applyTo} throws {@link IllegalArgumentException} when the changed layout is not a
 * valid scenario (a moved node outside the volume or overlapping another one, an unknown id); the
 * message is the scenario's own validation message.
 */
public sealed interface ScenarioEdit {

    /** The changed layout. */
    Scenario applyTo(Scenario scenario);

    /** The change in the imperative, e.g. {@code "move relay-w within 41.2 µm of gw"}. */
    String describe();

    /**
     * Move a node's centre along the straight line towards another node until the two centres are
     * {@code distanceUm} apart: new position q + (p − q)·d/|p − q| for the node at p and the other
     * at q. Everything else stays.
     *
     * @param nodeId     the node moved
     * @param towardId   the node it moves towards (not moved)
     * @param distanceUm centre-to-centre distance after the move, µm, finite and > 0
     */
    record MoveToward(String nodeId, String towardId, double distanceUm) implements ScenarioEdit {

        public MoveToward {
            if (!(distanceUm > 0) || Double.isInfinite(distanceUm)) {
                throw new IllegalArgumentException("distanceUm: must be finite and > 0, got " + distanceUm);
            }
        }

        /** The moved node's new centre in {@code scenario}, µm. */
        public Vec3 newPositionUm(Scenario scenario) {
            Vec3 p = node(scenario, nodeId).positionUm();
            Vec3 q = node(scenario, towardId).positionUm();
            Vec3 away = p.minus(q);
            double r = away.norm();
            if (r == 0) {
                throw new IllegalArgumentException(nodeId + " and " + towardId + " share a centre");
            }
            double f = distanceUm / r;
            return q.plus(new Vec3(away.x() * f, away.y() * f, away.z() * f));
        }

        @Override
        public Scenario applyTo(Scenario scenario) {
            Vec3 to = newPositionUm(scenario);
            return withNodes(scenario, n -> n.id().equals(nodeId)
                    ? new Node(n.id(), n.role(), to, n.radiusUm(), n.species(), n.emitsSpecies(),
                            n.moleculesPerSymbol(), n.fixed(), n.receiver())
                    : n, scenario.species(), scenario.signalling());
        }

        @Override
        public String describe() {
            return String.format(Locale.ROOT, "move %s within %.1f µm of %s", nodeId, distanceUm, towardId);
        }
    }

    /**
     * Give a node its own species: a copy of the species it emits under a fresh name (added to the
     * scenario's species), which the node then emits; the {@code followers} (the receivers and
     * relays that must go on hearing it) absorb the new species instead of their own. Species no
     * node uses any more are dropped (a scenario lists only used species).
     *
     * @param nodeId     an emitting node (transmitter or relay)
     * @param newSpecies the fresh species name, not yet in the scenario
     * @param followers  ids of the nodes that absorb the new species from now on
     */
    record OwnSpecies(String nodeId, String newSpecies, List<String> followers) implements ScenarioEdit {

        public OwnSpecies {
            followers = List.copyOf(followers);
        }

        /** A fresh name for a copy of {@code base}: {@code base-node}, or with a counter if taken. */
        public static String freshName(Scenario scenario, String base, String nodeId) {
            Set<String> taken = scenario.speciesByName().keySet();
            String name = base + "-" + nodeId;
            for (int i = 2; taken.contains(name); i++) {
                name = base + "-" + nodeId + "-" + i;
            }
            return name;
        }

        @Override
        public Scenario applyTo(Scenario scenario) {
            Node n = node(scenario, nodeId);
            if (!n.role().emits()) {
                throw new IllegalArgumentException(nodeId + " is a " + n.role().id() + " and emits nothing");
            }
            if (scenario.speciesByName().containsKey(newSpecies)) {
                throw new IllegalArgumentException("species " + newSpecies + " already exists");
            }
            for (String f : followers) {
                node(scenario, f);
            }
            Species old = scenario.speciesByName().get(n.emitsSpecies());
            List<Species> species = new ArrayList<>(scenario.species());
            species.add(new Species(newSpecies, old.diffusionUm2PerS(), old.hydrodynamicRadiusNm(), old.halfLifeS()));
            return withNodes(scenario, m -> {
                String absorbs = followers.contains(m.id()) ? newSpecies : m.species();
                String emits = m.id().equals(nodeId) ? newSpecies : m.emitsSpecies();
                if (m.role() != Role.RELAY && !absorbs.equals(emits)) {
                    // transmitters and receivers emit and absorb one species: the changed one
                    absorbs = newSpecies;
                    emits = newSpecies;
                }
                return new Node(m.id(), m.role(), m.positionUm(), m.radiusUm(), absorbs, emits,
                        m.moleculesPerSymbol(), m.fixed(), m.receiver());
            }, species, scenario.signalling());
        }

        @Override
        public String describe() {
            String follow = followers.isEmpty() ? "" : " (" + String.join(", ", followers)
                    + (followers.size() == 1 ? " follows" : " follow") + " it)";
            return "give " + nodeId + " its own species" + follow;
        }
    }

    /**
     * Set the scenario's symbol time T; ISI memory L (in symbols) stays.
     *
     * @param symbolTimeS new T in s, finite and > 0
     */
    record SymbolTime(double symbolTimeS) implements ScenarioEdit {

        public SymbolTime {
            if (!(symbolTimeS > 0) || Double.isInfinite(symbolTimeS)) {
                throw new IllegalArgumentException("symbolTimeS: must be finite and > 0, got " + symbolTimeS);
            }
        }

        @Override
        public Scenario applyTo(Scenario scenario) {
            Signalling s = scenario.signalling();
            return withNodes(scenario, n -> n, scenario.species(), new Signalling(symbolTimeS, s.isiMemorySymbols(),
                    s.levels(), s.priorOne(), s.countModel(), s.schedule(), s.frameSlots(), s.slots()));
        }

        @Override
        public String describe() {
            return String.format(Locale.ROOT, "lengthen the symbol time to %.3g s", symbolTimeS);
        }
    }

    /**
     * Set one emitting node's molecules per symbol.
     *
     * @param nodeId             a transmitter or relay
     * @param moleculesPerSymbol new value, ≥ 1
     */
    record Molecules(String nodeId, long moleculesPerSymbol) implements ScenarioEdit {

        public Molecules {
            if (moleculesPerSymbol < 1) {
                throw new IllegalArgumentException("moleculesPerSymbol: must be >= 1, got " + moleculesPerSymbol);
            }
        }

        @Override
        public Scenario applyTo(Scenario scenario) {
            node(scenario, nodeId);
            return withNodes(scenario, n -> n.id().equals(nodeId)
                    ? new Node(n.id(), n.role(), n.positionUm(), n.radiusUm(), n.species(), n.emitsSpecies(),
                            moleculesPerSymbol, n.fixed(), n.receiver())
                    : n, scenario.species(), scenario.signalling());
        }

        @Override
        public String describe() {
            return String.format(Locale.ROOT, "release %d molecules per symbol at %s", moleculesPerSymbol, nodeId);
        }
    }

    private static Node node(Scenario scenario, String id) {
        Node n = scenario.nodesById().get(id);
        if (n == null) {
            throw new IllegalArgumentException("no node " + id + " in the scenario");
        }
        return n;
    }

    /** The scenario with each node mapped, the given species (unused ones dropped) and signalling. */
    private static Scenario withNodes(Scenario s, UnaryOperator<Node> map, List<Species> species,
            Signalling signalling) {
        List<Node> nodes = s.nodes().stream().map(map).toList();
        Set<String> used = new HashSet<>();
        for (Node n : nodes) {
            used.add(n.species());
            used.add(n.emitsSpecies());
        }
        List<Species> kept = species.stream().filter(sp -> used.contains(sp.name())).toList();
        return new Scenario(s.name(), s.volume(), s.medium(), kept, signalling, nodes, s.demands(), s.targets(),
                s.candidateSpecies(), s.tolerances());
    }
}
