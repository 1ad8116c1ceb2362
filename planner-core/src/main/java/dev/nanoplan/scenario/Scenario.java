package dev.nanoplan.scenario;

import dev.nanoplan.geometry.Volume;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.stream.Collectors;

/**
 * A validated layout: the content of a {@value #FORMAT} scenario file.
 *
 * <p>Every instance satisfies all checks of {@link ScenarioValidator} (the compact constructor
 * runs them), so consumers need not re-check ids, species references, volume containment or
 * overlaps. Values keep the file's units, named in every accessor (µm, s, µm²/s, K, mPa·s).
 * Construction costs O(n) expected time for n nodes.
 *
 * @param name free text (file default empty)
 * @param volume the fluid region
 * @param medium the fluid (file default {@link Medium#DEFAULT})
 * @param species declared species, at least one, unique names, each used by some node
 * @param signalling symbol timing and detection settings; under the {@code slots} schedule its slot plan is
 *     fitted to the nodes ({@link SlotPlan#reconcile})
 * @param nodes the machines, at least one, unique ids
 * @param demands requested data flows (file default none)
 * @param targets what the layout should achieve (file default {@link Targets#DEFAULT})
 * @param candidateSpecies species a design aid may bring in (file {@code candidate_species}, default none):
 *     not used by any node, names distinct from {@code species}
 * @param tolerances fabrication spread (file default {@link Tolerances#NONE}); overrides of ids that
 *     are not nodes of this layout are dropped
 */
public record Scenario(String name, Volume volume, Medium medium, List<Species> species, Signalling signalling,
        List<Node> nodes, List<Demand> demands, Targets targets, List<Species> candidateSpecies,
        Tolerances tolerances) {

    /** The only supported value of the file's {@code format} field. */
    public static final String FORMAT = "nanoplan/1";

    /** @throws IllegalArgumentException listing every cross-field problem if the parts do not fit */
    public Scenario {
        Checks.required("name", name);
        Checks.required("volume", volume);
        Checks.required("medium", medium);
        Checks.required("signalling", signalling);
        Checks.required("targets", targets);
        Checks.required("tolerances", tolerances);
        species = List.copyOf(Checks.required("species", species));
        nodes = List.copyOf(Checks.required("nodes", nodes));
        demands = List.copyOf(Checks.required("demands", demands));
        candidateSpecies = List.copyOf(Checks.required("candidateSpecies", candidateSpecies));
        if (species.isEmpty()) {
            throw new IllegalArgumentException("species must not be empty");
        }
        if (nodes.isEmpty()) {
            throw new IllegalArgumentException("nodes must not be empty");
        }
        signalling = SlotPlan.reconcile(signalling, nodes);
        List<ScenarioProblem> problems = ScenarioValidator.check(volume, medium.flow(), species, nodes, demands);
        if (!problems.isEmpty()) {
            throw new IllegalArgumentException("invalid scenario:\n"
                    + problems.stream().map(ScenarioProblem::toString).collect(Collectors.joining("\n")));
        }
        for (Species c : candidateSpecies) {
            if (species.stream().anyMatch(sp -> sp.name().equals(c.name()))
                    || candidateSpecies.stream().filter(o -> o.name().equals(c.name())).count() > 1) {
                throw new IllegalArgumentException("candidate_species: name " + c.name()
                        + " is already a species or a candidate");
            }
        }
        tolerances = tolerances.restrictedTo(nodes.stream().map(Node::id).collect(Collectors.toSet()));
    }

    /** A scenario without candidate species and without tolerances. */
    public Scenario(String name, Volume volume, Medium medium, List<Species> species, Signalling signalling,
            List<Node> nodes, List<Demand> demands, Targets targets) {
        this(name, volume, medium, species, signalling, nodes, demands, targets, List.of(), Tolerances.NONE);
    }

    /** A scenario without tolerances ({@link Tolerances#NONE}). */
    public Scenario(String name, Volume volume, Medium medium, List<Species> species, Signalling signalling,
            List<Node> nodes, List<Demand> demands, Targets targets, List<Species> candidateSpecies) {
        this(name, volume, medium, species, signalling, nodes, demands, targets, candidateSpecies, Tolerances.NONE);
    }

    /** A scenario without candidate species. */
    public Scenario(String name, Volume volume, Medium medium, List<Species> species, Signalling signalling,
            List<Node> nodes, List<Demand> demands, Targets targets, Tolerances tolerances) {
        this(name, volume, medium, species, signalling, nodes, demands, targets, List.of(), tolerances);
    }

    /** Nodes by id, in file order. O(n) per call: cache the result. */
    public Map<String, Node> nodesById() {
        Map<String, Node> m = new LinkedHashMap<>();
        nodes.forEach(n -> m.put(n.id(), n));
        return m;
    }

    /** Species by name, in file order. */
    public Map<String, Species> speciesByName() {
        Map<String, Species> m = new LinkedHashMap<>();
        species.forEach(s -> m.put(s.name(), s));
        return m;
    }
}
