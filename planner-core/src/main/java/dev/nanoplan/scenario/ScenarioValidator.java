package dev.nanoplan.scenario;

import dev.nanoplan.geometry.Vec3;
import dev.nanoplan.geometry.Volume;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.HashSet;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;

/**
 * Cross-field checks of a scenario: things no single record can check by itself.
 *
 * <ul>
 *   <li>duplicate species names and duplicate node ids;</li>
 *   <li>a node naming a species (absorbed or emitted) that is not declared;</li>
 *   <li>a declared species that no node uses;</li>
 *   <li>a node body (sphere of its radius) not entirely inside the volume;</li>
 *   <li>overlapping node bodies: centre distance &lt; r₁ + r₂ (touching is allowed);</li>
 *   <li>Poiseuille flow without a cylindrical volume;</li>
 *   <li>demands naming unknown nodes, a source that cannot send (must be a transmitter or relay)
 *       or a destination that cannot receive (must be a receiver or relay).</li>
 * </ul>
 *
 * <p>Problems carry field paths in file notation ({@code nodes[3].position_um}) and no file
 * position; the reader adds positions. Overlaps are found with a uniform hash grid of cell size
 * 2·r_max, so n nodes take O(n) expected time when the bodies are of similar size (a few huge
 * bodies among small ones make the cells coarse; the result stays exact). At most
 * {@value #MAX_OVERLAP_REPORTS} overlapping pairs are listed, then one summary problem.
 */
public final class ScenarioValidator {

    /** Most overlapping pairs reported one by one. */
    static final int MAX_OVERLAP_REPORTS = 50;

    private ScenarioValidator() {
    }

    /**
     * Cross-field problems of a set of parts; empty if they form a valid scenario.
     *
     * @param volume the volume
     * @param flow the medium's flow
     * @param species the declared species, in file order
     * @param nodes the nodes, in file order
     * @param demands the demands, in file order
     * @return problems with paths and without file positions
     */
    public static List<ScenarioProblem> check(Volume volume, Flow flow, List<Species> species, List<Node> nodes,
            List<Demand> demands) {
        List<NamedFact> speciesFacts = new ArrayList<>();
        for (int i = 0; i < species.size(); i++) {
            speciesFacts.add(new NamedFact(i, species.get(i).name()));
        }
        List<NodeFact> nodeFacts = new ArrayList<>();
        for (int i = 0; i < nodes.size(); i++) {
            Node n = nodes.get(i);
            nodeFacts.add(new NodeFact(i, n.id(), n.role(), n.positionUm(), n.radiusUm(), n.species(),
                    n.role() == Role.RELAY ? n.emitsSpecies() : null));
        }
        List<DemandFact> demandFacts = new ArrayList<>();
        for (int i = 0; i < demands.size(); i++) {
            demandFacts.add(new DemandFact(i, demands.get(i).from(), demands.get(i).to()));
        }
        return check(volume, flow == null ? null : flow.profile(), speciesFacts, true, nodeFacts, true, true, demandFacts);
    }

    /** A declared species name (null if it failed to parse). */
    record NamedFact(int index, String name) {
    }

    /** What is known about one node; null / NaN where that field failed to parse. */
    record NodeFact(int index, String id, Role role, Vec3 positionUm, double radiusUm, String species,
            String emitsSpecies) {
    }

    /** What is known about one demand; null where a field failed to parse. */
    record DemandFact(int index, String from, String to) {
    }

    /**
     * Checks partial facts as far as they are known.
     *
     * @param volume null if unknown
     * @param flowProfile null if unknown
     * @param speciesComplete whether every declared species' name is known
     * @param nodesComplete whether every node's species names are known (needed to call a species
     *     unused)
     * @param idsComplete whether every node's id and role are known (needed to call a demand's node
     *     unknown or unfit)
     */
    static List<ScenarioProblem> check(Volume volume, String flowProfile, List<NamedFact> species,
            boolean speciesComplete, List<NodeFact> nodes, boolean nodesComplete, boolean idsComplete,
            List<DemandFact> demands) {
        List<ScenarioProblem> out = new ArrayList<>();

        if ("poiseuille".equals(flowProfile) && volume != null && !(volume instanceof Volume.Cylinder)) {
            out.add(ScenarioProblem.at("medium.flow.profile",
                    "poiseuille flow needs a cylinder volume, but the volume is '" + volume.shape() + "'"));
        }

        Map<String, Integer> speciesIndex = new HashMap<>();
        for (NamedFact s : species) {
            if (s.name() == null) {
                continue;
            }
            Integer first = speciesIndex.putIfAbsent(s.name(), s.index());
            if (first != null) {
                out.add(ScenarioProblem.at("species[" + s.index() + "].name",
                        "duplicate species name '" + s.name() + "' (first declared at species[" + first + "])"));
            }
        }

        Map<String, NodeFact> byId = new HashMap<>();
        Set<String> usedSpecies = new HashSet<>();
        for (NodeFact n : nodes) {
            String p = "nodes[" + n.index() + "]";
            if (n.id() != null) {
                NodeFact first = byId.putIfAbsent(n.id(), n);
                if (first != null) {
                    out.add(ScenarioProblem.at(p + ".id",
                            "duplicate id '" + n.id() + "' (first used at nodes[" + first.index() + "])"));
                }
            }
            checkSpeciesName(n.species(), p + ".species", speciesIndex, speciesComplete, usedSpecies, out);
            checkSpeciesName(n.emitsSpecies(), p + ".emits_species", speciesIndex, speciesComplete, usedSpecies,
                    out);
            if (volume != null && n.positionUm() != null && n.radiusUm() > 0
                    && !volume.containsBall(n.positionUm(), n.radiusUm())) {
                out.add(ScenarioProblem.at(p + ".position_um", "node body (centre " + fmt(n.positionUm())
                        + ", radius " + fmt(n.radiusUm()) + " um) is not entirely inside the " + describe(volume)));
            }
        }

        if (nodesComplete && speciesComplete) {
            for (NamedFact s : species) {
                if (s.name() != null && !usedSpecies.contains(s.name())
                        && speciesIndex.get(s.name()) == s.index()) {
                    out.add(ScenarioProblem.at("species[" + s.index() + "].name",
                            "species '" + s.name() + "' is not used by any node"));
                }
            }
        }

        findOverlaps(nodes, out);

        for (DemandFact d : idsComplete ? demands : List.<DemandFact>of()) {
            String p = "demands[" + d.index() + "]";
            if (d.from() != null) {
                NodeFact from = byId.get(d.from());
                if (from == null) {
                    out.add(ScenarioProblem.at(p + ".from", "unknown node id '" + d.from() + "'"));
                } else if (from.role() == Role.RECEIVER) {
                    out.add(ScenarioProblem.at(p + ".from", "node '" + d.from()
                            + "' is a receiver and cannot send; a demand source must be a transmitter or relay"));
                }
            }
            if (d.to() != null) {
                NodeFact to = byId.get(d.to());
                if (to == null) {
                    out.add(ScenarioProblem.at(p + ".to", "unknown node id '" + d.to() + "'"));
                } else if (to.role() == Role.TRANSMITTER) {
                    out.add(ScenarioProblem.at(p + ".to", "node '" + d.to()
                            + "' is a transmitter and cannot receive; a demand destination must be a receiver"
                            + " or relay"));
                }
            }
            if (d.from() != null && d.from().equals(d.to())) {
                out.add(ScenarioProblem.at(p + ".to", "a demand must go to another node, got '" + d.to() + "' twice"));
            }
        }
        return out;
    }

    private static void checkSpeciesName(String name, String path, Map<String, Integer> declared,
            boolean speciesComplete, Set<String> used, List<ScenarioProblem> out) {
        if (name == null) {
            return;
        }
        used.add(name);
        if (speciesComplete && !declared.containsKey(name)) {
            out.add(ScenarioProblem.at(path, "species '" + name + "' is not declared in species"));
        }
    }

    /** Grid cell coordinates. */
    private record Cell(long x, long y, long z) {
    }

    private static void findOverlaps(List<NodeFact> nodes, List<ScenarioProblem> out) {
        double maxRadius = 0;
        for (NodeFact n : nodes) {
            if (n.positionUm() != null && n.radiusUm() > 0 && Double.isFinite(n.radiusUm())) {
                maxRadius = Math.max(maxRadius, n.radiusUm());
            }
        }
        if (maxRadius == 0) {
            return;
        }
        double cellSize = 2 * maxRadius;
        Map<Cell, List<NodeFact>> grid = new HashMap<>();
        int reported = 0;
        long unreported = 0;
        for (NodeFact n : nodes) {
            if (n.positionUm() == null || !(n.radiusUm() > 0) || !Double.isFinite(n.radiusUm())) {
                continue;
            }
            Vec3 c = n.positionUm();
            long cx = cellIndex(c.x(), cellSize);
            long cy = cellIndex(c.y(), cellSize);
            long cz = cellIndex(c.z(), cellSize);
            // Two bodies overlap only if their centres are closer than 2·r_max = one cell: neighbours suffice.
            for (long dx = -1; dx <= 1; dx++) {
                for (long dy = -1; dy <= 1; dy++) {
                    for (long dz = -1; dz <= 1; dz++) {
                        List<NodeFact> bucket = grid.get(new Cell(cx + dx, cy + dy, cz + dz));
                        if (bucket == null) {
                            continue;
                        }
                        for (NodeFact other : bucket) {
                            double distance = c.distance(other.positionUm());
                            double sum = n.radiusUm() + other.radiusUm();
                            if (distance < sum) {
                                if (reported < MAX_OVERLAP_REPORTS) {
                                    reported++;
                                    out.add(ScenarioProblem.at("nodes[" + n.index() + "].position_um",
                                            "body overlaps node " + quote(other.id()) + " (nodes[" + other.index()
                                                    + "]): centre distance " + fmt(distance) + " um < "
                                                    + fmt(n.radiusUm()) + " + " + fmt(other.radiusUm()) + " um"));
                                } else {
                                    unreported++;
                                }
                            }
                        }
                    }
                }
            }
            grid.computeIfAbsent(new Cell(cx, cy, cz), k -> new ArrayList<>(2)).add(n);
        }
        if (unreported > 0) {
            out.add(ScenarioProblem.at("nodes", unreported + " more overlapping pairs not listed"));
        }
    }

    private static long cellIndex(double coordinate, double cellSize) {
        // Saturating conversion: positions far beyond ±9e18 cells share the extreme cell (still exact).
        return (long) Math.floor(coordinate / cellSize);
    }

    private static String quote(String id) {
        return id == null ? "(no id)" : "'" + id + "'";
    }

    private static String describe(Volume v) {
        if (v instanceof Volume.Box b) {
            return "box from " + fmt(b.minUm()) + " to " + fmt(b.maxUm()) + " um";
        }
        if (v instanceof Volume.Cylinder c) {
            return "cylinder of radius " + fmt(c.radiusUm()) + " um and length " + fmt(c.lengthUm())
                    + " um (axis x from 0, centred on y = z = 0)";
        }
        return v.shape() + " volume";
    }

    private static String fmt(Vec3 v) {
        return "[" + fmt(v.x()) + ", " + fmt(v.y()) + ", " + fmt(v.z()) + "]";
    }

    /** Short number text: integers without a decimal point, others to 6 significant digits. */
    static String fmt(double v) {
        if (v == Math.rint(v) && Math.abs(v) < 1e15) {
            return Long.toString((long) v);
        }
        String s = String.format(Locale.ROOT, "%.6g", v);
        if (s.contains("e") || s.contains("E")) {
            return s;
        }
        return s.contains(".") ? s.replaceAll("0+$", "").replaceAll("\\.$", "") : s;
    }
}
