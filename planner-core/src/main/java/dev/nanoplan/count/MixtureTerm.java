package dev.nanoplan.count;

import java.util.Arrays;
import java.util.List;

/**
 * A finite mixture: with probability {@code weights[i]} the term is distributed as
 * {@code parts.get(i)}. Models one earlier (or neighbouring) symbol whose value is random with
 * the prior, e.g. (1 − q)·Bin(N₀, p_k) + q·Bin(N₁, p_k).
 */
public record MixtureTerm(double[] weights, List<CountTerm> parts) implements CountTerm {

    public MixtureTerm {
        parts = List.copyOf(parts);
        weights = weights.clone();
        if (weights.length != parts.size() || weights.length == 0) {
            throw new IllegalArgumentException("mixture needs one weight per part, got "
                    + weights.length + " weights and " + parts.size() + " parts");
        }
        double sum = 0;
        for (double w : weights) {
            if (!(w >= 0 && w <= 1)) {
                throw new IllegalArgumentException("mixture weight must be in [0, 1], got " + w);
            }
            sum += w;
        }
        if (Math.abs(sum - 1) > 1e-9) {
            throw new IllegalArgumentException("mixture weights must sum to 1, got " + sum);
        }
    }

    /** Two-part mixture (1 − q)·zero + q·one. */
    public static MixtureTerm of(double q, CountTerm zero, CountTerm one) {
        return new MixtureTerm(new double[] {1 - q, q}, List.of(zero, one));
    }

    @Override
    public double[] weights() {
        return weights.clone();
    }

    /** Weight i without copying. */
    public double weight(int i) {
        return weights[i];
    }

    @Override
    public double mean() {
        double m = 0;
        for (int i = 0; i < weights.length; i++) {
            m += weights[i] * parts.get(i).mean();
        }
        return m;
    }

    @Override
    public double variance() {
        // law of total variance
        double m = mean();
        double v = 0;
        for (int i = 0; i < weights.length; i++) {
            CountTerm p = parts.get(i);
            double dm = p.mean() - m;
            v += weights[i] * (p.variance() + dm * dm);
        }
        return v;
    }

    @Override
    public long maxValue() {
        long max = 0;
        for (int i = 0; i < weights.length; i++) {
            if (weights[i] > 0) {
                max = Math.max(max, parts.get(i).maxValue());
            }
        }
        return max;
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof MixtureTerm m && Arrays.equals(weights, m.weights) && parts.equals(m.parts);
    }

    @Override
    public int hashCode() {
        return 31 * Arrays.hashCode(weights) + parts.hashCode();
    }

    @Override
    public String toString() {
        return "MixtureTerm" + Arrays.toString(weights) + parts;
    }
}
