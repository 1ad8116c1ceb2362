package dev.nanoplan.sim;

import java.util.List;

/**
 * What one emitter's simulated molecules did.
 *
 * @param emitterId the releasing node
 * @param species the species it releases
 * @param moleculesSimulated M, molecules whose trajectories finished (fewer than requested if
 *     cancelled)
 * @param neverAbsorbed molecules absorbed by no receiver by (L+1)T (still moving, or decayed)
 * @param moleculeSteps molecule-steps computed (for throughput figures)
 * @param receivers one entry per receiver of the scenario, in receiver order
 */
public record EmitterRun(String emitterId, String species, long moleculesSimulated, long neverAbsorbed,
        long moleculeSteps, List<SimulatedTaps> receivers) {

    /** @throws IllegalArgumentException if counts are inconsistent */
    public EmitterRun {
        receivers = List.copyOf(receivers);
        if (neverAbsorbed < 0 || neverAbsorbed > moleculesSimulated) {
            throw new IllegalArgumentException("neverAbsorbed: must be in 0.." + moleculesSimulated + ", got "
                    + neverAbsorbed);
        }
    }

    /** Fraction of the simulated molecules absorbed by no receiver within (L+1)T; 0 if none simulated. */
    public double neverAbsorbedFraction() {
        return moleculesSimulated == 0 ? 0 : (double) neverAbsorbed / moleculesSimulated;
    }
}
