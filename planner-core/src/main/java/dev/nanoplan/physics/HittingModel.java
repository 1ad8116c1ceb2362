package dev.nanoplan.physics;

/**
 * Law of the time at which one released molecule is absorbed by a receiver.
 *
 * <p>All times are in seconds. {@link #cumulative(double)} is the fraction of released molecules
 * absorbed by time t (it may stay below one: molecules can escape or decay), {@link
 * #density(double)} its derivative, {@link #eventual()} the limit for t → ∞.
 */
public interface HittingModel extends TapModel {

    /** F(t): fraction absorbed by {@code timeS} (0 for t ≤ 0). */
    double cumulative(double timeS);

    /** ln F(t), finite even where F(t) underflows a double (−∞ only at t ≤ 0). */
    double logCumulative(double timeS);

    /** f(t) = dF/dt in 1/s (0 for t ≤ 0). */
    double density(double timeS);

    /** F(∞). */
    double eventual();

    /**
     * {@inheritDoc}
     *
     * <p>For a hitting model: per-slot hit probabilities of a release at the start of slot 0:
     * p_k = F((k+1)T) − F(kT), k = 0..memorySymbols, computed without catastrophic cancellation.
     *
     * @param symbolTimeS T, > 0
     * @param memorySymbols L ≥ 0; the result has L + 1 entries
     */
    @Override
    double[] taps(double symbolTimeS, int memorySymbols);
}
