package dev.nanoplan.desktop;

import dev.nanoplan.sim.LinkComparison;

/**
 * One row of the Simulation tab: an emitter → receiver link, closed form versus particle
 * simulation. Every number comes from planner-core ({@link LinkComparison} and two plans); this
 * record only carries them to the table.
 *
 * @param from emitter id
 * @param to receiver id
 * @param analyticHitProbability open-medium closed-form p0 = F(T)
 * @param simulatedHitProbability simulated p̂0 (fraction absorbed within the first symbol time)
 * @param standardError binomial standard error of p̂0
 * @param zScore (p̂0 − F(T)) in standard errors expected under the closed form; NaN when undefined
 * @param relativeDifference (p̂0 − F(T)) / F(T); NaN when F(T) = 0
 * @param flagged whether the core's comparison flags the difference as clear and relevant
 * @param reason the core's one-line explanation
 * @param analyticCapacityBits capacity of the link in the analytic plan, bits per symbol; NaN when
 *     the plan leaves the link out (below the capacity floor)
 * @param simulatedCapacityBits capacity of the link in the plan on simulated taps; NaN likewise
 */
public record SimulationRow(String from, String to, double analyticHitProbability, double simulatedHitProbability,
        double standardError, double zScore, double relativeDifference, boolean flagged, String reason,
        double analyticCapacityBits, double simulatedCapacityBits) {

    /** @throws IllegalArgumentException if an id or the reason is missing */
    public SimulationRow {
        if (from == null || to == null) {
            throw new IllegalArgumentException("from, to: required");
        }
        if (reason == null) {
            throw new IllegalArgumentException("reason: required");
        }
    }

    /** The row of a core comparison with the two plans' capacities (NaN when a plan has no such link). */
    static SimulationRow of(LinkComparison c, double analyticCapacityBits, double simulatedCapacityBits) {
        return new SimulationRow(c.from(), c.to(), c.analyticHitProbability(), c.simulatedHitProbability(),
                c.standardError(), c.zScore(), c.relativeDifference(), c.flagged(), c.reason(), analyticCapacityBits,
                simulatedCapacityBits);
    }
}
