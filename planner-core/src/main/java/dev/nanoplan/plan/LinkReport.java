package dev.nanoplan.plan;

import java.util.Arrays;
import java.util.Objects;

/**
 * One evaluated emitter → receiver link of a plan (the {@code links} entries of docs/architecture.md §4.3).
 *
 * <p><b>Operating point</b>: the emitter's current and earlier symbols share the file's prior q
 * ({@code signalling.prior_one}; levels &gt; 2: uniform), other emitters stay at theirs, and the
 * receiver decides with the threshold τ that maximises the mutual information there. The plan uses
 * this point everywhere: {@code threshold}, {@code errorProbability}, the crossovers (the detector
 * the relays use), {@code mutualInformationBits} and {@code rateBitsPerS}. The <b>consistent
 * capacity</b> ({@code capacityBits}, maximised over the emitter's own prior with its leftovers at
 * the same prior) is headroom only: what another prior would give.
 *
 * @param from                   emitter id (transmitter or relay)
 * @param to                     receiver id (receiver or relay)
 * @param species                the species carried
 * @param hitProbability         p_0 = F(T)
 * @param taps                   p_0..p_L
 * @param signalMean             mean molecules counted from this emitter's current "1" minus "0"
 * @param interferenceMean       mean molecules counted from all other emitters (crosstalk)
 * @param isiMean                mean leftovers of this emitter's earlier symbols
 * @param backgroundMean         mean background molecules per slot
 * @param threshold              operating τ (decide 1 iff count ≥ τ): maximises the mutual
 *                               information at the file's prior; levels &gt; 2: the first threshold
 * @param errorProbability       error at {@code threshold}: (1−q)ε₀ + qε₁ (levels &gt; 2: symbol
 *                               error at uniform inputs); may underflow to 0, see the log
 * @param log10ErrorProbability  log10 of the previous, always finite
 * @param minErrorThreshold      τ of the minimum error over thresholds (−1 for levels &gt; 2)
 * @param minErrorProbability    that minimum error (levels &gt; 2: the MAP symbol error); may be 0
 * @param mutualInformationBits  mutual information at the operating point, bits per symbol
 * @param rateBitsPerS           {@code mutualInformationBits} / symbol time
 * @param capacityBits           consistent capacity, bits per symbol, or null when the plan did not
 *                               compute it (only route hops, or the preview)
 * @param capacityPriorOne       the prior achieving {@code capacityBits} (binary), or null
 * @param crossoverZero          P(decide 1 | sent 0) at the operating threshold (levels &gt; 2: any
 *                               other level | lowest)
 * @param crossoverOne           P(decide 0 | sent 1) at the operating threshold (levels &gt; 2: any
 *                               other level | highest)
 * @param countBlind             the scenario's max_error_probability is met by a detector that
 *                               ignores the count (min(q, 1 − q) ≤ target, or 1 − 1/M ≤ target)
 * @param limitedBy              dominant impairment
 * @param topInterferer          id of the emitter contributing most interference, or null
 * @param topInterfererShare     its share of the interference mean, in [0, 1] (0 when none)
 * @param modelCaveat            null, "walls", "flow" or "walls+flow" when the open-medium closed
 *                               form may be wrong here; "simulated" when taps came from simulation
 * @param channel                where the taps came from: "analytic" (closed forms) or "simulated"
 *                               (particle simulation); null when not stamped by the plan
 * @param channelReason          why, in words (the closed forms' validity test or what was simulated),
 *                               or null
 */
public record LinkReport(String from, String to, String species, double hitProbability, double[] taps,
        double signalMean, double interferenceMean, double isiMean, double backgroundMean, long threshold,
        double errorProbability, double log10ErrorProbability, long minErrorThreshold, double minErrorProbability,
        double mutualInformationBits, double rateBitsPerS, Double capacityBits, Double capacityPriorOne,
        double crossoverZero, double crossoverOne, boolean countBlind, Impairment limitedBy, String topInterferer,
        double topInterfererShare, String modelCaveat, String channel, String channelReason) {

    public LinkReport {
        taps = taps.clone();
    }

    /** A report whose channel and reason the plan stamps later ({@link #withChannel}). */
    public LinkReport(String from, String to, String species, double hitProbability, double[] taps,
            double signalMean, double interferenceMean, double isiMean, double backgroundMean, long threshold,
            double errorProbability, double log10ErrorProbability, long minErrorThreshold, double minErrorProbability,
            double mutualInformationBits, double rateBitsPerS, Double capacityBits, Double capacityPriorOne,
            double crossoverZero, double crossoverOne, boolean countBlind, Impairment limitedBy, String topInterferer,
            double topInterfererShare, String modelCaveat) {
        this(from, to, species, hitProbability, taps, signalMean, interferenceMean, isiMean, backgroundMean,
                threshold, errorProbability, log10ErrorProbability, minErrorThreshold, minErrorProbability,
                mutualInformationBits, rateBitsPerS, capacityBits, capacityPriorOne, crossoverZero, crossoverOne,
                countBlind, limitedBy, topInterferer, topInterfererShare, modelCaveat, null, null);
    }

    /** This link with the channel its taps came from and why. */
    public LinkReport withChannel(String source, String reason) {
        return new LinkReport(from, to, species, hitProbability, taps, signalMean, interferenceMean, isiMean,
                backgroundMean, threshold, errorProbability, log10ErrorProbability, minErrorThreshold,
                minErrorProbability, mutualInformationBits, rateBitsPerS, capacityBits, capacityPriorOne,
                crossoverZero, crossoverOne, countBlind, limitedBy, topInterferer, topInterfererShare, modelCaveat,
                source, reason);
    }

    @Override
    public double[] taps() {
        return taps.clone();
    }

    /** Binary transition matrix at the operating threshold: [[1−e0, e0], [e1, 1−e1]]. */
    public double[][] transitionMatrix() {
        return new double[][] {{1 - crossoverZero, crossoverZero}, {crossoverOne, 1 - crossoverOne}};
    }

    /** This link with its consistent capacity (bits per symbol) and capacity-achieving prior filled in. */
    public LinkReport withCapacity(double bits, Double priorOne) {
        return new LinkReport(from, to, species, hitProbability, taps, signalMean, interferenceMean, isiMean,
                backgroundMean, threshold, errorProbability, log10ErrorProbability, minErrorThreshold,
                minErrorProbability, mutualInformationBits, rateBitsPerS, bits, priorOne, crossoverZero,
                crossoverOne, countBlind, limitedBy, topInterferer, topInterfererShare, modelCaveat, channel,
                channelReason);
    }

    @Override
    public boolean equals(Object o) {
        // every component, arrays by content
        return o instanceof LinkReport other
                && Objects.equals(from, other.from)
                && Objects.equals(to, other.to)
                && Objects.equals(species, other.species)
                && Double.compare(hitProbability, other.hitProbability) == 0
                && Arrays.equals(taps, other.taps)
                && Double.compare(signalMean, other.signalMean) == 0
                && Double.compare(interferenceMean, other.interferenceMean) == 0
                && Double.compare(isiMean, other.isiMean) == 0
                && Double.compare(backgroundMean, other.backgroundMean) == 0
                && threshold == other.threshold
                && Double.compare(errorProbability, other.errorProbability) == 0
                && Double.compare(log10ErrorProbability, other.log10ErrorProbability) == 0
                && minErrorThreshold == other.minErrorThreshold
                && Double.compare(minErrorProbability, other.minErrorProbability) == 0
                && Double.compare(mutualInformationBits, other.mutualInformationBits) == 0
                && Double.compare(rateBitsPerS, other.rateBitsPerS) == 0
                && Objects.equals(capacityBits, other.capacityBits)
                && Objects.equals(capacityPriorOne, other.capacityPriorOne)
                && Double.compare(crossoverZero, other.crossoverZero) == 0
                && Double.compare(crossoverOne, other.crossoverOne) == 0
                && countBlind == other.countBlind
                && Objects.equals(limitedBy, other.limitedBy)
                && Objects.equals(topInterferer, other.topInterferer)
                && Double.compare(topInterfererShare, other.topInterfererShare) == 0
                && Objects.equals(modelCaveat, other.modelCaveat)
                && Objects.equals(channel, other.channel)
                && Objects.equals(channelReason, other.channelReason);
    }

    @Override
    public int hashCode() {
        int h = Objects.hash(from, to, species, hitProbability, signalMean, interferenceMean, isiMean, backgroundMean,
                threshold, errorProbability, log10ErrorProbability, minErrorThreshold, minErrorProbability,
                mutualInformationBits, rateBitsPerS, capacityBits, capacityPriorOne, crossoverZero, crossoverOne,
                countBlind, limitedBy, topInterferer, topInterfererShare, modelCaveat, channel, channelReason);
        h = 31 * h + Arrays.hashCode(taps);
        return h;
    }
}
