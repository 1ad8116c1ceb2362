package dev.nanoplan.scenario;

import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.Map;
import java.util.Set;

/**
 * Fabrication spread of a layout: the file's optional {@code "tolerances"} section
 * (docs/architecture.md §4.1). Every value is a standard deviation of a normal draw, truncated at
 * ±4 standard deviations by the tolerance study; all are finite and ≥ 0, and 0 means "exact".
 *
 * @param defaults    the spread of every node without an override
 * @param diffusionPercent relative standard deviation of each species' diffusion coefficient, in %
 * @param temperatureK standard deviation of the medium's temperature, in K (species given by their
 *                    hydrodynamic radius follow through Stokes–Einstein)
 * @param nodes       per-node overrides by node id, file order; an override gives a node's full spread
 *                    (fields absent in the file take the defaults when read)
 */
public record Tolerances(NodeSpread defaults, double diffusionPercent, double temperatureK,
        Map<String, NodeSpread> nodes) {

    /** No spread at all (the file without a {@code tolerances} section). */
    public static final Tolerances NONE = new Tolerances(NodeSpread.EXACT, 0, 0, Map.of());

    /**
     * The spread of one node.
     *
     * @param positionSdUm     standard deviation of the independent normal offset on each axis, µm
     * @param radiusPercent    relative standard deviation of the radius, %
     * @param moleculesPercent relative standard deviation of the mean release per symbol for the whole
     *                         mission, %
     */
    public record NodeSpread(double positionSdUm, double radiusPercent, double moleculesPercent) {

        /** No spread. */
        public static final NodeSpread EXACT = new NodeSpread(0, 0, 0);

        /** @throws IllegalArgumentException if a value is negative or not finite */
        public NodeSpread {
            Checks.nonNegative("positionSdUm", positionSdUm);
            Checks.nonNegative("radiusPercent", radiusPercent);
            Checks.nonNegative("moleculesPercent", moleculesPercent);
        }

        /** Whether every value is 0. */
        public boolean exact() {
            return positionSdUm == 0 && radiusPercent == 0 && moleculesPercent == 0;
        }
    }

    /** @throws IllegalArgumentException if a value is negative or not finite */
    public Tolerances {
        Checks.required("defaults", defaults);
        Checks.nonNegative("diffusionPercent", diffusionPercent);
        Checks.nonNegative("temperatureK", temperatureK);
        nodes = Collections.unmodifiableMap(new LinkedHashMap<>(Checks.required("nodes", nodes)));
    }

    /** The spread of node {@code id}: its override, else the defaults. */
    public NodeSpread of(String id) {
        return nodes.getOrDefault(id, defaults);
    }

    /** Whether nothing varies. */
    public boolean none() {
        return diffusionPercent == 0 && temperatureK == 0 && defaults.exact()
                && nodes.values().stream().allMatch(NodeSpread::exact);
    }

    /** These tolerances without overrides of nodes not in {@code ids} (a layout edit removed them). */
    public Tolerances restrictedTo(Set<String> ids) {
        if (ids.containsAll(nodes.keySet())) {
            return this;
        }
        Map<String, NodeSpread> kept = new LinkedHashMap<>();
        nodes.forEach((id, s) -> {
            if (ids.contains(id)) {
                kept.put(id, s);
            }
        });
        return new Tolerances(defaults, diffusionPercent, temperatureK, kept);
    }
}
