package dev.nanoplan.network;

import java.util.Arrays;

/**
 * Capacity of a link with one consistent input law: the emitter's current symbol and its own
 * earlier symbols (whose leftovers reach the receiver) are i.i.d. with the same prior (binary) or
 * the same input distribution (more levels); other emitters stay at their own operating priors.
 * Computed by {@link ConsistentCapacitySearch}.
 *
 * @param bits               mutual information at {@code inputDistribution} with the ISI at that same
 *                           distribution and the best thresholds for it, bits per symbol; an achievable
 *                           value (never above the true maximum) and never below the operating point's
 *                           mutual information
 * @param inputDistribution  the input law reached, one probability per level (binary: {1 − q, q})
 * @param thresholds         the decision thresholds at that law (binary: one τ, decide 1 iff Y ≥ τ)
 * @param evaluations        count-pmf builds the search used (0 when the closed form applied)
 * @param closedForm         true when the own symbols leave no leftovers (L = 0 or all ISI taps 0): the
 *                           count laws do not depend on the prior and the binary value is the exact
 *                           closed form of the binary asymmetric channel (Silverman 1955)
 * @param converged          binary: the bracketing search met its tolerance; levels &gt; 2: the
 *                           fixed-point iteration of the input distribution met its tolerance
 */
public record LinkCapacity(double bits, double[] inputDistribution, long[] thresholds, int evaluations,
        boolean closedForm, boolean converged) {

    public LinkCapacity {
        if (!(bits >= 0) || Double.isInfinite(bits)) {
            throw new IllegalArgumentException("bits: must be finite and >= 0, got " + bits);
        }
        if (inputDistribution == null || inputDistribution.length < 2 || thresholds == null
                || thresholds.length != inputDistribution.length - 1) {
            throw new IllegalArgumentException("need M >= 2 input probabilities and M - 1 thresholds");
        }
        inputDistribution = inputDistribution.clone();
        thresholds = thresholds.clone();
    }

    /** Binary links: the capacity-achieving P(send 1). */
    public double priorOne() {
        return inputDistribution[inputDistribution.length - 1];
    }

    /** Binary links: the threshold at the capacity-achieving prior; more levels: the first threshold. */
    public long threshold() {
        return thresholds[0];
    }

    @Override
    public double[] inputDistribution() {
        return inputDistribution.clone();
    }

    @Override
    public long[] thresholds() {
        return thresholds.clone();
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof LinkCapacity c && bits == c.bits && Arrays.equals(inputDistribution, c.inputDistribution)
                && Arrays.equals(thresholds, c.thresholds) && evaluations == c.evaluations
                && closedForm == c.closedForm && converged == c.converged;
    }

    @Override
    public int hashCode() {
        return Double.hashCode(bits) * 31 + Arrays.hashCode(thresholds);
    }

    @Override
    public String toString() {
        return "LinkCapacity[bits=" + bits + ", input=" + Arrays.toString(inputDistribution) + ", thresholds="
                + Arrays.toString(thresholds) + ", evaluations=" + evaluations + ", closedForm=" + closedForm
                + ", converged=" + converged + "]";
    }
}
