package dev.nanoplan.sim;

import java.util.Arrays;
import java.util.Objects;

/**
 * Analytic versus simulated hit probability F(T) of one emitter → receiver link.
 *
 * @param from emitter id
 * @param to receiver id
 * @param analyticHitProbability closed-form F(T) for an open medium (with decay if the species
 *     decays), ignoring walls, flow and other receivers
 * @param simulatedHitProbability p̂_0, simulated fraction absorbed within T; NaN (and empty
 *     simulated taps) when none of the emitter's molecules finished (cancelled run)
 * @param standardError binomial s.e. of p̂_0, √(p̂_0(1 − p̂_0)/M)
 * @param zScore (p̂_0 − F(T)) / √(F(T)(1 − F(T))/M), the deviation in units of the s.e. expected
 *     if the closed form held; NaN when that s.e. is 0 (F(T) = 0 or 1, or M = 0)
 * @param relativeDifference (p̂_0 − F(T)) / F(T); NaN when F(T) = 0
 * @param flagged |z| &gt; {@value SimulationComparison#Z_LIMIT} and |relative difference| &gt;
 *     {@value SimulationComparison#RELATIVE_LIMIT}
 * @param reason a short explanation, e.g. "walls raise this link by 18 %"
 * @param simulatedTaps p̂_0..p̂_L
 * @param simulatedTapsStandardError their binomial standard errors
 * @param analyticTaps closed-form taps p_0..p_L
 * @param insufficient fewer than {@link SimulationPrecision#MIN_HITS} hits in the first symbol (or none):
 *     the estimate is too rough to flag, {@code reason} says "insufficient molecules"
 * @param minMoleculesPerEmitter when insufficient, the molecules per emitter for
 *     {@link SimulationPrecision#MIN_HITS} expected hits ({@link SimulationPrecision#minimumMolecules}); else 0
 */
public record LinkComparison(String from, String to, double analyticHitProbability, double simulatedHitProbability,
        double standardError, double zScore, double relativeDifference, boolean flagged, String reason,
        double[] simulatedTaps, double[] simulatedTapsStandardError, double[] analyticTaps, boolean insufficient,
        long minMoleculesPerEmitter) {

    /** Copies the arrays. */
    public LinkComparison {
        simulatedTaps = simulatedTaps.clone();
        simulatedTapsStandardError = simulatedTapsStandardError.clone();
        analyticTaps = analyticTaps.clone();
    }

    @Override
    public double[] simulatedTaps() {
        return simulatedTaps.clone();
    }

    @Override
    public double[] simulatedTapsStandardError() {
        return simulatedTapsStandardError.clone();
    }

    @Override
    public double[] analyticTaps() {
        return analyticTaps.clone();
    }

    @Override
    public boolean equals(Object o) {
        // every component, arrays by content
        return o instanceof LinkComparison other
                && Objects.equals(from, other.from)
                && Objects.equals(to, other.to)
                && Double.compare(analyticHitProbability, other.analyticHitProbability) == 0
                && Double.compare(simulatedHitProbability, other.simulatedHitProbability) == 0
                && Double.compare(standardError, other.standardError) == 0
                && Double.compare(zScore, other.zScore) == 0
                && Double.compare(relativeDifference, other.relativeDifference) == 0
                && flagged == other.flagged
                && Objects.equals(reason, other.reason)
                && Arrays.equals(simulatedTaps, other.simulatedTaps)
                && Arrays.equals(simulatedTapsStandardError, other.simulatedTapsStandardError)
                && Arrays.equals(analyticTaps, other.analyticTaps)
                && insufficient == other.insufficient
                && minMoleculesPerEmitter == other.minMoleculesPerEmitter;
    }

    @Override
    public int hashCode() {
        int h = Objects.hash(from, to, analyticHitProbability, simulatedHitProbability, standardError, zScore,
                relativeDifference, flagged, reason, insufficient, minMoleculesPerEmitter);
        h = 31 * h + Arrays.hashCode(simulatedTaps);
        h = 31 * h + Arrays.hashCode(simulatedTapsStandardError);
        h = 31 * h + Arrays.hashCode(analyticTaps);
        return h;
    }
}
