package dev.nanoplan.network;

import dev.nanoplan.count.BinomialTerm;
import dev.nanoplan.count.CountTerm;
import dev.nanoplan.count.MixtureTerm;
import dev.nanoplan.count.PoissonTerm;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;

/**
 * Crosstalk at one receiver under the all-active schedule (DESIGN.md §5.6): every other emitter of
 * the receiver's species sends an i.i.d. symbol in every slot, so it adds, for each slot k = 0..L,
 * one independent mixture term Σ_j w_j·Bin(n_j, p_k) (w = prior weights of its levels).
 *
 * <p><b>Scale.</b> The {@code exactCount} strongest interferers (largest mean per slot) enter
 * exactly; the weak remainder is replaced by one moment-matched term with the same total mean μ
 * and, when possible, the same variance v: Bin(n, μ/n) with n = round(μ²/(μ − v)) when v &lt; μ
 * (a sum of many rare binomials is under-dispersed), else Poisson(μ) (variance μ ≤ v; the
 * difference is stated by {@link #remainderVarianceDeficit}). The replacement is the classic
 * Poisson/binomial approximation of a sum of many small independent counts (Le Cam's inequality:
 * L. Le Cam, "An approximation theorem for the Poisson binomial distribution", Pacific J. Math. 10,
 * 1960: total variation ≤ Σ p_i²), so its error vanishes as the remainder gets weaker.
 */
public final class Crosstalk {

    /** Default number of interferers treated exactly. */
    public static final int DEFAULT_EXACT_COUNT = 8;

    private Crosstalk() {
    }

    /**
     * One interfering emitter at a receiver.
     *
     * @param id             emitter id
     * @param taps           its taps to the receiver
     * @param levelMolecules molecules of each of its levels
     * @param weights        probability of each level (the prior)
     */
    public record Interferer(String id, double[] taps, long[] levelMolecules, double[] weights) {
        public Interferer {
            taps = taps.clone();
            levelMolecules = levelMolecules.clone();
            weights = weights.clone();
            if (levelMolecules.length != weights.length) {
                throw new IllegalArgumentException("weights: one per level needed, got " + weights.length
                        + " for " + levelMolecules.length + " levels");
            }
        }

        /** Mean count per slot: Σ_k p_k · Σ_j w_j n_j. */
        public double meanPerSlot() {
            double level = 0;
            for (int j = 0; j < weights.length; j++) {
                level += weights[j] * levelMolecules[j];
            }
            double s = 0;
            for (double p : taps) {
                s += p;
            }
            return s * level;
        }

        /** The same emitter with every level multiplied by {@code factor} (rounded). */
        public Interferer scaled(double factor) {
            long[] n = new long[levelMolecules.length];
            for (int j = 0; j < n.length; j++) {
                n[j] = Math.round(levelMolecules[j] * factor);
            }
            return new Interferer(id, taps, n, weights);
        }

        /** The L + 1 per-slot mixture terms of this emitter. */
        public List<CountTerm> terms() {
            List<CountTerm> out = new ArrayList<>(taps.length);
            for (double p : taps) {
                if (p == 0) {
                    continue;
                }
                List<CountTerm> parts = new ArrayList<>(levelMolecules.length);
                for (long n : levelMolecules) {
                    parts.add(new BinomialTerm(n, p));
                }
                out.add(new MixtureTerm(weights, parts));
            }
            return out;
        }
    }

    /** All interferers exactly (the reference the split is tested against). */
    public static List<CountTerm> exactTerms(List<Interferer> interferers) {
        List<CountTerm> out = new ArrayList<>();
        for (Interferer i : interferers) {
            out.addAll(i.terms());
        }
        return out;
    }

    /**
     * The {@code exactCount} strongest interferers exactly plus one moment-matched term for the
     * rest (none when the rest is empty or silent). O(m log m + exactCount·L).
     */
    public static List<CountTerm> terms(List<Interferer> interferers, int exactCount) {
        if (exactCount < 0) {
            throw new IllegalArgumentException("exactCount: must be >= 0, got " + exactCount);
        }
        if (interferers.size() <= exactCount) {
            return exactTerms(interferers);
        }
        List<Interferer> sorted = strongestFirst(interferers);
        List<CountTerm> out = exactTerms(sorted.subList(0, exactCount));
        CountTerm rest = momentMatched(sorted.subList(exactCount, sorted.size()));
        if (rest != null) {
            out.add(rest);
        }
        return out;
    }

    /** Interferers sorted by mean per slot, largest first (ties by id). */
    public static List<Interferer> strongestFirst(List<Interferer> interferers) {
        List<Interferer> sorted = new ArrayList<>(interferers);
        sorted.sort(Comparator.comparingDouble(Interferer::meanPerSlot).reversed().thenComparing(Interferer::id));
        return sorted;
    }

    /**
     * One term with the same mean as the sum of the given interferers' terms and, when they are
     * under-dispersed, the same variance; null when their mean is 0.
     */
    public static CountTerm momentMatched(List<Interferer> rest) {
        double mean = 0;
        double var = 0;
        for (Interferer i : rest) {
            for (CountTerm t : i.terms()) {
                mean += t.mean();
                var += t.variance();
            }
        }
        if (!(mean > 0)) {
            return null;
        }
        if (var < mean) {
            double n = mean * mean / (mean - var);
            if (n < 1e15) {
                long trials = Math.max(1, Math.round(n));
                double p = Math.min(1.0, mean / trials);
                return new BinomialTerm(trials, p);
            }
        }
        return new PoissonTerm(mean);
    }

    /**
     * Variance the moment-matched term misses: max(0, v − μ) (0 whenever the binomial form
     * applies).
     */
    public static double remainderVarianceDeficit(List<Interferer> rest) {
        double mean = 0;
        double var = 0;
        for (Interferer i : rest) {
            for (CountTerm t : i.terms()) {
                mean += t.mean();
                var += t.variance();
            }
        }
        return Math.max(0, var - mean);
    }
}
