package dev.nanoplan.physics;

/**
 * What a receiver counts, per symbol slot, of one release at the start of slot 0: the taps
 * p_0..p_L that feed the count laws. A {@link HittingModel} counts absorptions within each slot;
 * a {@link PassiveSphereObservation} counts the molecules inside at one instant per slot.
 */
public interface TapModel {

    /**
     * Per-slot probabilities that one release at the start of slot 0 is counted in slot k,
     * k = 0..memorySymbols.
     *
     * @param symbolTimeS T, &gt; 0
     * @param memorySymbols L ≥ 0; the result has L + 1 entries, each in [0, 1], never NaN
     */
    double[] taps(double symbolTimeS, int memorySymbols);
}
