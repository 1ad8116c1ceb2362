package dev.nanoplan.network;

import dev.nanoplan.count.BinomialTerm;
import dev.nanoplan.count.CountTerm;
import dev.nanoplan.count.MixtureTerm;
import dev.nanoplan.count.PoissonTerm;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.Comparator;
import java.util.List;
import java.util.Objects;

/**
 * Crosstalk at one receiver under the all-active schedule (docs/architecture.md §5.6): every other emitter of
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

        @Override
        public boolean equals(Object o) {
            // every component, arrays by content
            return o instanceof Interferer other
                    && Objects.equals(id, other.id)
                    && Arrays.equals(taps, other.taps)
                    && Arrays.equals(levelMolecules, other.levelMolecules)
                    && Arrays.equals(weights, other.weights);
        }

        @Override
        public int hashCode() {
            int h = Objects.hash(id);
            h = 31 * h + Arrays.hashCode(taps);
            h = 31 * h + Arrays.hashCode(levelMolecules);
            h = 31 * h + Arrays.hashCode(weights);
            return h;
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

    /**
     * Every emitter heard at one receiver, prepared once so that the crosstalk of each of its links
     * (all emitters but the link's own) costs O(m) additions instead of a sort and O(m·L) new terms.
     *
     * <p>{@link #termsWithout(int, int)} returns a list equal term by term, and bitwise in every
     * parameter, to {@link Crosstalk#terms(List, int)} applied to the emitters without the excluded
     * one: the order (mean per slot, ties by id) and the summation order of the remainder's moments
     * are the same. Built in O(m log m + m·L); thread-safe once built (immutable).
     */
    public static final class Prepared {

        private final List<Interferer> sorted;
        private final int[] rankOfInput;
        private final List<List<CountTerm>> termsOf;
        private final double[][] termMean;
        private final double[][] termVar;

        /** @param emitters every emitter heard at the receiver (ids distinct) */
        public Prepared(List<Interferer> emitters) {
            List<Integer> idx = new ArrayList<>(emitters.size());
            for (int i = 0; i < emitters.size(); i++) {
                idx.add(i);
            }
            double[] mean = new double[emitters.size()];
            for (int i = 0; i < mean.length; i++) {
                mean[i] = emitters.get(i).meanPerSlot();
            }
            Comparator<Integer> byMean = Comparator.comparingDouble((Integer i) -> mean[i]).reversed();
            idx.sort(byMean.thenComparing(i -> emitters.get(i).id()));
            List<Interferer> s = new ArrayList<>(emitters.size());
            rankOfInput = new int[emitters.size()];
            termsOf = new ArrayList<>(emitters.size());
            termMean = new double[emitters.size()][];
            termVar = new double[emitters.size()][];
            for (int r = 0; r < idx.size(); r++) {
                Interferer in = emitters.get(idx.get(r));
                s.add(in);
                rankOfInput[idx.get(r)] = r;
                List<CountTerm> t = in.terms();
                termsOf.add(t);
                termMean[r] = new double[t.size()];
                termVar[r] = new double[t.size()];
                for (int k = 0; k < t.size(); k++) {
                    termMean[r][k] = t.get(k).mean();
                    termVar[r][k] = t.get(k).variance();
                }
            }
            sorted = List.copyOf(s);
        }

        /** Number of emitters. */
        public int size() {
            return sorted.size();
        }

        /** Emitters strongest first (mean per slot, ties by id). */
        public List<Interferer> strongestFirst() {
            return sorted;
        }

        /** Rank (0 = strongest) of the emitter at {@code inputIndex} in the list given to the constructor. */
        public int rankOf(int inputIndex) {
            return rankOfInput[inputIndex];
        }

        /** The terms of the emitter of rank {@code rank} ({@link Interferer#terms()}), shared, unmodifiable. */
        public List<CountTerm> termsOfRank(int rank) {
            return termsOf.get(rank);
        }

        /** Ranks of the {@code exactCount} strongest emitters other than {@code excludedRank}. */
        public int[] exactRanks(int excludedRank, int exactCount) {
            int n = Math.min(exactCount, sorted.size() - (excludedRank >= 0 && excludedRank < sorted.size() ? 1 : 0));
            int[] out = new int[Math.max(0, n)];
            int j = 0;
            for (int r = 0; r < sorted.size() && j < out.length; r++) {
                if (r != excludedRank) {
                    out[j++] = r;
                }
            }
            return out;
        }

        /**
         * The moment-matched remainder ({@link Crosstalk#momentMatched(List)}) of every emitter other
         * than {@code excludedRank} and the {@code exactCount} strongest of the others; null when
         * there is none or it is silent.
         */
        public CountTerm remainderWithout(int excludedRank, int exactCount) {
            int others = sorted.size() - (excludedRank >= 0 && excludedRank < sorted.size() ? 1 : 0);
            if (others <= exactCount) {
                return null;
            }
            double mean = 0;
            double var = 0;
            int seen = 0;
            for (int r = 0; r < sorted.size(); r++) {
                if (r == excludedRank) {
                    continue;
                }
                if (seen++ < exactCount) {
                    continue;
                }
                double[] m = termMean[r];
                double[] v = termVar[r];
                for (int k = 0; k < m.length; k++) {
                    mean += m[k];
                    var += v[k];
                }
            }
            return momentMatched(mean, var);
        }

        /**
         * Same as {@link Crosstalk#terms(List, int)} for every emitter but the one of rank
         * {@code excludedRank} (−1: none excluded). O(m + exactCount·L).
         */
        public List<CountTerm> termsWithout(int excludedRank, int exactCount) {
            if (exactCount < 0) {
                throw new IllegalArgumentException("exactCount: must be >= 0, got " + exactCount);
            }
            List<CountTerm> out = new ArrayList<>();
            int others = sorted.size() - (excludedRank >= 0 && excludedRank < sorted.size() ? 1 : 0);
            if (others <= exactCount) {
                // Crosstalk.terms keeps the caller's order here, not the sorted one
                for (int i = 0; i < rankOfInput.length; i++) {
                    if (rankOfInput[i] != excludedRank) {
                        out.addAll(termsOf.get(rankOfInput[i]));
                    }
                }
                return out;
            }
            for (int r : exactRanks(excludedRank, exactCount)) {
                out.addAll(termsOf.get(r));
            }
            CountTerm rest = remainderWithout(excludedRank, exactCount);
            if (rest != null) {
                out.add(rest);
            }
            return out;
        }
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
        double[] mv = meanAndVariance(rest);
        return momentMatched(mv[0], mv[1]);
    }

    /** Total mean and variance of the interferers' terms. */
    private static double[] meanAndVariance(List<Interferer> rest) {
        double mean = 0;
        double var = 0;
        for (Interferer i : rest) {
            for (CountTerm t : i.terms()) {
                mean += t.mean();
                var += t.variance();
            }
        }
        return new double[] {mean, var};
    }

    /** The moment-matched term for a total mean and variance (see {@link #momentMatched(List)}). */
    static CountTerm momentMatched(double mean, double var) {
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
        double[] mv = meanAndVariance(rest);
        return Math.max(0, mv[1] - mv[0]);
    }
}
