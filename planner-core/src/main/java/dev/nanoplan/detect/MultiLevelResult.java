package dev.nanoplan.detect;

import java.util.Arrays;
import java.util.Objects;

/**
 * Result of {@link MultiLevelQuantizer#optimise(java.util.List)}: M input levels detected with
 * M−1 count thresholds t_1 &lt; … &lt; t_{M−1} (decide level j iff t_j ≤ Y &lt; t_{j+1}, with
 * t_0 = −∞ and t_M = +∞).
 *
 * @param thresholds the capacity-achieving thresholds found, length M−1, strictly increasing
 * @param inputDistribution input distribution π achieving {@code capacityBits} on them, length M
 * @param capacityBits mutual information of the induced M×M channel at π, bits
 * @param channel induced channel, channel[i][j] = P(decide j | level i)
 * @param uniformThresholds best thresholds for uniform inputs
 * @param uniformMutualInformationBits mutual information at uniform inputs with those, bits
 * @param softCapacityBits Blahut–Arimoto capacity of the unquantised count channel (upper bound)
 * @param rounds alternation rounds (threshold DP + Blahut–Arimoto) performed after the first
 * @param exactOverAllCuts true when every threshold DP ran over all integer cut points of the
 *     window (otherwise over a candidate set, see {@link MultiLevelQuantizer})
 * @param certifiedGapBits proven bound on how far {@code capacityBits} may lie below the maximum over
 *     every threshold set (over the cut set searched when {@code exactOverAllCuts} is false) of the
 *     induced channel's capacity; 0 for two levels; NaN when the certificate was too costly
 */
public record MultiLevelResult(long[] thresholds, double[] inputDistribution, double capacityBits,
                               double[][] channel, long[] uniformThresholds,
                               double uniformMutualInformationBits, double softCapacityBits,
                               int rounds, boolean exactOverAllCuts, double certifiedGapBits) {

    public MultiLevelResult {
        if (thresholds == null || inputDistribution == null || uniformThresholds == null
                || channel == null) {
            throw new IllegalArgumentException("arrays must not be null");
        }
        int m = inputDistribution.length;
        if (m < 2 || thresholds.length != m - 1 || uniformThresholds.length != m - 1
                || channel.length != m) {
            throw new IllegalArgumentException("need M >= 2 levels, M - 1 thresholds and M "
                    + "channel rows; got " + m + ", " + thresholds.length + ", "
                    + uniformThresholds.length + ", " + channel.length);
        }
        checkIncreasing("thresholds", thresholds);
        checkIncreasing("uniformThresholds", uniformThresholds);
        double max = Math.log(m) / Math.log(2) + 1e-9;
        for (double v : new double[] {capacityBits, uniformMutualInformationBits, softCapacityBits}) {
            if (!(v >= 0 && v <= max)) {
                throw new IllegalArgumentException("information values must be in [0, log2 M], got " + v);
            }
        }
        if (!(certifiedGapBits >= 0) && !Double.isNaN(certifiedGapBits)) {
            throw new IllegalArgumentException("certifiedGapBits must be >= 0 or NaN, got " + certifiedGapBits);
        }
        if (rounds < 0) {
            throw new IllegalArgumentException("rounds must be >= 0, got " + rounds);
        }
        thresholds = thresholds.clone();
        inputDistribution = inputDistribution.clone();
        uniformThresholds = uniformThresholds.clone();
        double[][] c = new double[m][];
        for (int i = 0; i < m; i++) {
            c[i] = channel[i].clone();
        }
        channel = c;
    }

    @Override
    public long[] thresholds() {
        return thresholds.clone();
    }

    @Override
    public double[] inputDistribution() {
        return inputDistribution.clone();
    }

    @Override
    public long[] uniformThresholds() {
        return uniformThresholds.clone();
    }

    @Override
    public double[][] channel() {
        double[][] c = new double[channel.length][];
        for (int i = 0; i < c.length; i++) {
            c[i] = channel[i].clone();
        }
        return c;
    }

    @Override
    public boolean equals(Object o) {
        // every component, arrays by content
        return o instanceof MultiLevelResult other
                && Arrays.equals(thresholds, other.thresholds)
                && Arrays.equals(inputDistribution, other.inputDistribution)
                && Double.compare(capacityBits, other.capacityBits) == 0
                && Arrays.deepEquals(channel, other.channel)
                && Arrays.equals(uniformThresholds, other.uniformThresholds)
                && Double.compare(uniformMutualInformationBits, other.uniformMutualInformationBits) == 0
                && Double.compare(softCapacityBits, other.softCapacityBits) == 0
                && rounds == other.rounds
                && exactOverAllCuts == other.exactOverAllCuts
                && Double.compare(certifiedGapBits, other.certifiedGapBits) == 0;
    }

    @Override
    public int hashCode() {
        int h = Objects.hash(capacityBits, uniformMutualInformationBits, softCapacityBits, rounds, exactOverAllCuts,
                certifiedGapBits);
        h = 31 * h + Arrays.hashCode(thresholds);
        h = 31 * h + Arrays.hashCode(inputDistribution);
        h = 31 * h + Arrays.deepHashCode(channel);
        h = 31 * h + Arrays.hashCode(uniformThresholds);
        return h;
    }

    @Override
    public String toString() {
        return "MultiLevelResult[thresholds=" + Arrays.toString(thresholds) + ", inputDistribution="
                + Arrays.toString(inputDistribution) + ", capacityBits=" + capacityBits + ", channel="
                + Arrays.deepToString(channel) + ", uniformThresholds=" + Arrays.toString(uniformThresholds)
                + ", uniformMutualInformationBits=" + uniformMutualInformationBits + ", softCapacityBits="
                + softCapacityBits + ", rounds=" + rounds + ", exactOverAllCuts=" + exactOverAllCuts
                + ", certifiedGapBits=" + certifiedGapBits + "]";
    }

    private static void checkIncreasing(String name, long[] t) {
        for (int i = 1; i < t.length; i++) {
            if (t[i] <= t[i - 1]) {
                throw new IllegalArgumentException(name + " must be strictly increasing");
            }
        }
    }
}
