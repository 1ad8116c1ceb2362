package dev.nanoplan.detect;

import java.util.Arrays;
import java.util.Objects;

/**
 * Result of a binary threshold search: decide 1 iff count Y ≥ τ.
 *
 * <p>Curves: index i of {@link #miBitsByThreshold()} and {@link #errorByThreshold()} is
 * threshold τ = {@link #firstThreshold()} + i. The first threshold decides 1 for every count
 * (ε₀ = 1, ε₁ = 0) and the last decides 0 for every count (ε₀ = 0, ε₁ = 1).
 *
 * @param miThreshold τ maximising the mutual information at the given prior (smallest on ties)
 * @param mutualInformationBits that mutual information, bits
 * @param minErrorThreshold τ minimising (1−q)ε₀ + qε₁ (smallest on ties)
 * @param minErrorProbability that error probability
 * @param capacityThreshold τ maximising the binary-asymmetric-channel capacity (smallest on ties)
 * @param capacityBits capacity at that τ, bits
 * @param capacityPriorOne capacity-achieving P(X = 1) at that τ
 * @param e0AtCapacity ε₀ = P(Y ≥ τ | 0) at the capacity threshold
 * @param e1AtCapacity ε₁ = P(Y &lt; τ | 1) at the capacity threshold
 * @param firstThreshold τ of curve index 0
 * @param miBitsByThreshold mutual information at the given prior per τ, bits
 * @param errorByThreshold error probability at the given prior per τ
 */
public record BinaryDetection(long miThreshold, double mutualInformationBits,
                              long minErrorThreshold, double minErrorProbability,
                              long capacityThreshold, double capacityBits, double capacityPriorOne,
                              double e0AtCapacity, double e1AtCapacity, long firstThreshold,
                              double[] miBitsByThreshold, double[] errorByThreshold) {

    public BinaryDetection {
        if (miBitsByThreshold == null || errorByThreshold == null
                || miBitsByThreshold.length == 0
                || miBitsByThreshold.length != errorByThreshold.length) {
            throw new IllegalArgumentException("curves must be non-empty and of equal length");
        }
        long lastThreshold = firstThreshold + miBitsByThreshold.length - 1;
        checkThreshold("miThreshold", miThreshold, firstThreshold, lastThreshold);
        checkThreshold("minErrorThreshold", minErrorThreshold, firstThreshold, lastThreshold);
        checkThreshold("capacityThreshold", capacityThreshold, firstThreshold, lastThreshold);
        checkUnit("mutualInformationBits", mutualInformationBits);
        checkUnit("minErrorProbability", minErrorProbability);
        checkUnit("capacityBits", capacityBits);
        checkUnit("capacityPriorOne", capacityPriorOne);
        checkUnit("e0AtCapacity", e0AtCapacity);
        checkUnit("e1AtCapacity", e1AtCapacity);
        miBitsByThreshold = miBitsByThreshold.clone();
        errorByThreshold = errorByThreshold.clone();
    }

    /** Last threshold of the curves. */
    public long lastThreshold() {
        return firstThreshold + miBitsByThreshold.length - 1;
    }

    @Override
    public double[] miBitsByThreshold() {
        return miBitsByThreshold.clone();
    }

    @Override
    public double[] errorByThreshold() {
        return errorByThreshold.clone();
    }

    @Override
    public boolean equals(Object o) {
        // every component, arrays by content
        return o instanceof BinaryDetection other
                && miThreshold == other.miThreshold
                && Double.compare(mutualInformationBits, other.mutualInformationBits) == 0
                && minErrorThreshold == other.minErrorThreshold
                && Double.compare(minErrorProbability, other.minErrorProbability) == 0
                && capacityThreshold == other.capacityThreshold
                && Double.compare(capacityBits, other.capacityBits) == 0
                && Double.compare(capacityPriorOne, other.capacityPriorOne) == 0
                && Double.compare(e0AtCapacity, other.e0AtCapacity) == 0
                && Double.compare(e1AtCapacity, other.e1AtCapacity) == 0
                && firstThreshold == other.firstThreshold
                && Arrays.equals(miBitsByThreshold, other.miBitsByThreshold)
                && Arrays.equals(errorByThreshold, other.errorByThreshold);
    }

    @Override
    public int hashCode() {
        int h = Objects.hash(miThreshold, mutualInformationBits, minErrorThreshold, minErrorProbability,
                capacityThreshold, capacityBits, capacityPriorOne, e0AtCapacity, e1AtCapacity, firstThreshold);
        h = 31 * h + Arrays.hashCode(miBitsByThreshold);
        h = 31 * h + Arrays.hashCode(errorByThreshold);
        return h;
    }

    @Override
    public String toString() {
        return "BinaryDetection[miThreshold=" + miThreshold + ", mutualInformationBits=" + mutualInformationBits
                + ", minErrorThreshold=" + minErrorThreshold + ", minErrorProbability=" + minErrorProbability
                + ", capacityThreshold=" + capacityThreshold + ", capacityBits=" + capacityBits
                + ", capacityPriorOne=" + capacityPriorOne + ", e0AtCapacity=" + e0AtCapacity + ", e1AtCapacity="
                + e1AtCapacity + ", firstThreshold=" + firstThreshold + ", miBitsByThreshold="
                + Arrays.toString(miBitsByThreshold) + ", errorByThreshold=" + Arrays.toString(errorByThreshold)
                + "]";
    }

    private static void checkThreshold(String name, long t, long first, long last) {
        if (t < first || t > last) {
            throw new IllegalArgumentException(
                    name + " must be in [" + first + ", " + last + "], got " + t);
        }
    }

    private static void checkUnit(String name, double v) {
        if (!(v >= 0 && v <= 1)) {
            throw new IllegalArgumentException(name + " must be in [0, 1], got " + v);
        }
    }
}
