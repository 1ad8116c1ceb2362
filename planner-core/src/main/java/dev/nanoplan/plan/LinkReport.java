package dev.nanoplan.plan;

import java.util.Arrays;
import java.util.Objects;

/**
 * One evaluated emitter → receiver link of a plan (the {@code links} entries of docs/architecture.md §4.3).
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
 * @param threshold              τ maximising mutual information at the scenario's prior
 * @param errorProbability       minimum error probability (may underflow to 0; see the log)
 * @param log10ErrorProbability  log10 of the previous, always finite
 * @param capacityBits           bits per symbol (max over τ and prior)
 * @param rateBitsPerS           capacity / symbol time
 * @param crossoverZero          P(decide 1 | sent 0) at the capacity threshold
 * @param crossoverOne           P(decide 0 | sent 1) at the capacity threshold
 * @param limitedBy              dominant impairment
 * @param topInterferer          id of the emitter contributing most interference, or null
 * @param topInterfererShare     its share of the interference mean, in [0, 1] (0 when none)
 * @param modelCaveat            null, "walls", "flow" or "walls+flow" when the open-medium closed
 *                               form may be wrong here; "simulated" when taps came from simulation
 */
public record LinkReport(String from, String to, String species, double hitProbability, double[] taps,
        double signalMean, double interferenceMean, double isiMean, double backgroundMean, long threshold,
        double errorProbability, double log10ErrorProbability, double capacityBits, double rateBitsPerS,
        double crossoverZero, double crossoverOne, Impairment limitedBy, String topInterferer,
        double topInterfererShare, String modelCaveat) {

    public LinkReport {
        taps = taps.clone();
    }

    @Override
    public double[] taps() {
        return taps.clone();
    }

    /** Binary transition matrix at the capacity threshold: [[1−e0, e0], [e1, 1−e1]]. */
    public double[][] transitionMatrix() {
        return new double[][] {{1 - crossoverZero, crossoverZero}, {crossoverOne, 1 - crossoverOne}};
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
                && Double.compare(capacityBits, other.capacityBits) == 0
                && Double.compare(rateBitsPerS, other.rateBitsPerS) == 0
                && Double.compare(crossoverZero, other.crossoverZero) == 0
                && Double.compare(crossoverOne, other.crossoverOne) == 0
                && Objects.equals(limitedBy, other.limitedBy)
                && Objects.equals(topInterferer, other.topInterferer)
                && Double.compare(topInterfererShare, other.topInterfererShare) == 0
                && Objects.equals(modelCaveat, other.modelCaveat);
    }

    @Override
    public int hashCode() {
        int h = Objects.hash(from, to, species, hitProbability, signalMean, interferenceMean, isiMean, backgroundMean,
                threshold, errorProbability, log10ErrorProbability, capacityBits, rateBitsPerS, crossoverZero,
                crossoverOne, limitedBy, topInterferer, topInterfererShare, modelCaveat);
        h = 31 * h + Arrays.hashCode(taps);
        return h;
    }
}
