package dev.nanoplan.design;

import java.io.Serializable;
import java.util.List;

/**
 * One planned point of a sweep.
 *
 * @param values                      the swept fields' values, in the sweep's field order
 * @param demandsMeetingTargets       demands meeting the targets ({@link Assessment})
 * @param minSharedRateBitsPerS       smallest max-min fair shared rate over the demands, bit/s
 * @param minEndToEndCapacityBits     smallest end-to-end information per symbol over the demands, bits
 *                                    (0 when a demand has no route)
 * @param moleculesPerS               molecules released per second by all emitters ({@link Assessment})
 * @param maxLatencyS                 largest latency over the reachable demands, s; null when none is
 *                                    reachable
 */
public record SweepPoint(List<Double> values, int demandsMeetingTargets, double minSharedRateBitsPerS,
        double minEndToEndCapacityBits, double moleculesPerS, Double maxLatencyS) implements Serializable {

    public SweepPoint {
        values = List.copyOf(values);
    }

    /** The point's objective (demands ↑, smallest shared rate ↑, molecules/s ↓). */
    public Objective objective() {
        return new Objective(demandsMeetingTargets, minSharedRateBitsPerS, moleculesPerS);
    }
}
