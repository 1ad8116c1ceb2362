package dev.nanoplan.plan;

import java.util.Arrays;

/**
 * One evaluated emitter → receiver link of a plan (the {@code links} entries of DESIGN.md §4.3).
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
        return o instanceof LinkReport l && from.equals(l.from) && to.equals(l.to) && species.equals(l.species)
                && Arrays.equals(taps, l.taps) && capacityBits == l.capacityBits && threshold == l.threshold;
    }

    @Override
    public int hashCode() {
        return (from.hashCode() * 31 + to.hashCode()) * 31 + species.hashCode();
    }
}
