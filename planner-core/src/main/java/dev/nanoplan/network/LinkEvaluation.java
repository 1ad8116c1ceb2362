package dev.nanoplan.network;

import dev.nanoplan.count.CountPmf;
import dev.nanoplan.detect.BinaryDetection;
import dev.nanoplan.detect.MultiLevelResult;
import java.util.List;
import java.util.function.Supplier;

/**
 * The evaluated link.
 *
 * <p><b>Operating point</b> (what the link delivers at the file's input law): binary, the prior
 * {@code prior_one} for the current and the earlier own symbols, the threshold τ that maximises the
 * mutual information there ({@link #operatingThreshold()}), that mutual information
 * ({@link #mutualInformationBits()}) and the error at that same τ ({@link #errorProbability()});
 * more levels, uniform inputs (current and earlier symbols) with their best thresholds.
 * <b>Consistent capacity</b> ({@link #capacity()}): the maximum over the emitter's own input law,
 * its earlier symbols' leftovers included, computed on first call (it costs tens of count-pmf
 * builds with ISI; see {@link ConsistentCapacitySearch}).
 *
 * @param spec                     what was evaluated
 * @param givenLevel               pmf of the slot count given each sent level
 * @param binary                   detection results (two levels), else null
 * @param multiLevel               quantizer/capacity results (more than two levels), else null
 * @param minErrorThreshold        binary: τ of the minimum error (exact, log space when tiny); −1
 *                                 for more levels
 * @param minErrorProbability      binary: minimum of (1−q)ε₀ + qε₁; more levels: symbol error of the
 *                                 MAP detector at uniform inputs. May underflow to 0: see the log
 * @param log10ErrorProbability    log10 of the previous, finite even below 1e-300 (binary, exact
 *                                 count model)
 * @param signalMeanMolecules      (n_max − n_min)·p_0
 * @param isiMeanMolecules         mean leftovers of earlier own symbols
 * @param interferenceMeanMolecules mean count from other emitters
 * @param backgroundMeanMolecules  mean background count per slot
 * @param truncatedMass            largest probability mass dropped by truncation over the levels
 * @param operatingThresholds      the thresholds of the operating point (binary: one τ, the
 *                                 mutual-information maximiser at the prior; among thresholds of equal
 *                                 mutual information the one of least error)
 * @param errorProbability         error at the operating thresholds: binary (1−q)ε₀(τ) + qε₁(τ);
 *                                 more levels the symbol error at uniform inputs. May underflow to 0
 * @param log10OperatingErrorProbability log10 of the previous, finite even below 1e-300 (binary,
 *                                 exact count model, by the log-space tails)
 * @param capacitySupplier         computes the consistent capacity once, on first call
 */
public record LinkEvaluation(LinkSpec spec, List<CountPmf> givenLevel, BinaryDetection binary,
        MultiLevelResult multiLevel, long minErrorThreshold, double minErrorProbability,
        double log10ErrorProbability, double signalMeanMolecules, double isiMeanMolecules,
        double interferenceMeanMolecules, double backgroundMeanMolecules, double truncatedMass,
        long[] operatingThresholds, double errorProbability, double log10OperatingErrorProbability,
        Supplier<LinkCapacity> capacitySupplier) {

    public LinkEvaluation {
        operatingThresholds = operatingThresholds.clone();
    }

    @Override
    public long[] operatingThresholds() {
        return operatingThresholds.clone();
    }

    /** Binary: the operating threshold τ (decide 1 iff Y ≥ τ); more levels: the first threshold. */
    public long operatingThreshold() {
        return operatingThresholds[0];
    }

    /**
     * Mutual information at the operating point, bits per symbol: binary at the file's prior (own
     * leftovers at the same prior) and {@link #operatingThreshold()}; more levels at uniform inputs
     * with their best thresholds.
     */
    public double mutualInformationBits() {
        return binary != null ? binary.mutualInformationBits() : multiLevel.uniformMutualInformationBits();
    }

    /**
     * Transition matrix of the operating detector: channel[i][j] = P(decide j | level i sent) with
     * decide j iff t_j ≤ Y &lt; t_{j+1} at {@link #operatingThresholds()} (binary: [[1−ε₀, ε₀], [ε₁, 1−ε₁]]),
     * from the slot-count pmfs at the file's input law; each entry is a direct sum over its cell (no
     * 1 − x cancellation), truncated mass counted on its own side, rows renormalised. This is the
     * detector a relay uses, so route cascades multiply these matrices.
     */
    public double[][] operatingChannel() {
        return channelAt(givenLevel, operatingThresholds);
    }

    /**
     * Transition matrix of the detector with thresholds {@code t} over the slot-count pmfs
     * {@code givenLevel}: channel[i][j] = P(decide j | level i) with decide j iff t_j ≤ Y &lt; t_{j+1};
     * each entry a direct sum over its cell, truncated mass on its own side, rows renormalised.
     */
    public static double[][] channelAt(List<CountPmf> givenLevel, long[] t) {
        int m = givenLevel.size();
        double[][] w = new double[m][m];
        for (int i = 0; i < m; i++) {
            CountPmf p = givenLevel.get(i);
            w[i][0] += p.massBelow();
            w[i][m - 1] += p.massAbove();
            int cell = 0;
            for (long y = p.offset(); y <= p.last(); y++) {
                while (cell < m - 1 && y >= t[cell]) {
                    cell++;
                }
                w[i][cell] += p.probability(y);
            }
            double sum = 0;
            for (double v : w[i]) {
                sum += v;
            }
            for (int j = 0; j < m; j++) {
                w[i][j] = sum > 0 ? w[i][j] / sum : (i == j ? 1 : 0);
            }
        }
        return w;
    }

    /** {@link #mutualInformationBits()} divided by the symbol time. */
    public double operatingRateBitsPerS() {
        return mutualInformationBits() / spec.symbolTimeS();
    }

    /**
     * The consistent capacity: maximum over the emitter's own input law, with its earlier symbols'
     * leftovers at that same law (computed on first call, then kept).
     */
    public LinkCapacity capacity() {
        return capacitySupplier.get();
    }

    /**
     * Former figure, kept for the planner: the capacity over the prior of the current symbol only,
     * with the earlier own symbols at the file's prior (binary), or the quantizer capacity of the
     * uniform-leftover pmfs (more levels). It is not an input law an emitter can use when there is
     * ISI; see {@link #capacity()} for the consistent one and {@link #mutualInformationBits()} for
     * the operating point.
     */
    public double capacityBits() {
        return binary != null ? binary.capacityBits() : multiLevel.capacityBits();
    }

    /** {@link #capacityBits()} divided by the symbol time (former figure, see there). */
    public double rateBitsPerS() {
        return capacityBits() / spec.symbolTimeS();
    }

    /**
     * Error of a detector that ignores the count and always decides the likelier level:
     * min(q, 1 − q) for binary links, 1 − 1/M for M uniform levels.
     */
    public double countBlindErrorProbability() {
        int m = spec.levels();
        return m == 2 ? Math.min(spec.priorOne(), 1 - spec.priorOne()) : 1 - 1.0 / m;
    }

    /**
     * Whether an error target is met without looking at the count at all
     * ({@link #countBlindErrorProbability()} ≤ target): such a target says nothing about the link,
     * and a planner should flag it and size budgets by the information target instead.
     */
    public boolean countBlindMeets(double maxErrorProbability) {
        return countBlindErrorProbability() <= maxErrorProbability;
    }

    /** Memoising supplier: computes once, thread-safe. */
    static Supplier<LinkCapacity> once(Supplier<LinkCapacity> compute) {
        return new Supplier<>() {
            private volatile LinkCapacity value;

            @Override
            public synchronized LinkCapacity get() {
                if (value == null) {
                    value = compute.get();
                }
                return value;
            }
        };
    }
}
