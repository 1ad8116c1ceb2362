package dev.nanoplan.network;

import dev.nanoplan.count.CountModelKind;
import java.util.Arrays;

/**
 * Everything needed to evaluate one link once its channel is known.
 *
 * @param taps                         p_0..p_L: probability that a molecule released at the start
 *                                     of slot 0 is counted in slot k (L = ISI memory)
 * @param levelMolecules               molecules released for each input level, strictly increasing
 *                                     (binary: {n₀, n₁}); 2..16 levels
 * @param priorOne                     binary: P(send 1), in (0, 1); earlier symbols are i.i.d. with
 *                                     it. For more than two levels earlier symbols are taken as
 *                                     uniform over the levels.
 * @param backgroundMoleculesPerSlot   mean background count per slot (β·T), Poisson
 * @param countModel                   how the slot count's law becomes a pmf
 * @param symbolTimeS                  T in seconds (for rates)
 */
public record LinkSpec(double[] taps, long[] levelMolecules, double priorOne, double backgroundMoleculesPerSlot,
        CountModelKind countModel, double symbolTimeS) {

    /** Largest number of levels supported. */
    public static final int MAX_LEVELS = 16;

    public LinkSpec {
        taps = taps.clone();
        levelMolecules = levelMolecules.clone();
        if (taps.length == 0) {
            throw new IllegalArgumentException("taps: at least one tap is needed");
        }
        double sum = 0;
        for (int k = 0; k < taps.length; k++) {
            if (!(taps[k] >= 0 && taps[k] <= 1)) {
                throw new IllegalArgumentException("taps[" + k + "]: must be a probability in [0, 1], got " + taps[k]);
            }
            sum += taps[k];
        }
        if (sum > 1 + 1e-9) {
            throw new IllegalArgumentException("taps: must sum to at most 1 (a molecule is counted once), got " + sum);
        }
        if (levelMolecules.length < 2 || levelMolecules.length > MAX_LEVELS) {
            throw new IllegalArgumentException("levels: must be between 2 and " + MAX_LEVELS + ", got "
                    + levelMolecules.length);
        }
        for (int i = 0; i < levelMolecules.length; i++) {
            if (levelMolecules[i] < 0) {
                throw new IllegalArgumentException("level molecules[" + i + "]: must be >= 0, got " + levelMolecules[i]);
            }
            if (i > 0 && levelMolecules[i] <= levelMolecules[i - 1]) {
                throw new IllegalArgumentException("level molecules: must be strictly increasing, got "
                        + Arrays.toString(levelMolecules));
            }
        }
        if (!(priorOne > 0 && priorOne < 1)) {
            throw new IllegalArgumentException("prior one: must be strictly between 0 and 1, got " + priorOne);
        }
        if (!(backgroundMoleculesPerSlot >= 0) || Double.isInfinite(backgroundMoleculesPerSlot)) {
            throw new IllegalArgumentException("background: must be finite and >= 0, got " + backgroundMoleculesPerSlot);
        }
        if (countModel == null) {
            throw new IllegalArgumentException("count model: missing");
        }
        if (!(symbolTimeS > 0) || Double.isInfinite(symbolTimeS)) {
            throw new IllegalArgumentException("symbol time: must be finite and > 0, got " + symbolTimeS);
        }
    }

    /** Binary link: n₀ molecules for "0", n₁ for "1". */
    public static LinkSpec binary(double[] taps, long moleculesZero, long moleculesOne, double priorOne,
            double backgroundMoleculesPerSlot, CountModelKind model, double symbolTimeS) {
        return new LinkSpec(taps, new long[] {moleculesZero, moleculesOne}, priorOne, backgroundMoleculesPerSlot,
                model, symbolTimeS);
    }

    /**
     * Probabilities of the levels for symbols the link does not decide on (earlier symbols,
     * neighbours): the binary prior {1 − q, q}, or uniform over more than two levels.
     */
    public static double[] symbolWeights(int levels, double priorOne) {
        double[] w = new double[levels];
        if (levels == 2) {
            w[0] = 1 - priorOne;
            w[1] = priorOne;
        } else {
            Arrays.fill(w, 1.0 / levels);
        }
        return w;
    }

    /** Levels evenly spaced from 0 to {@code maxMolecules}: n_i = round(N·i/(M−1)). */
    public static long[] evenLevels(int levels, long maxMolecules) {
        if (levels < 2) {
            throw new IllegalArgumentException("levels: must be >= 2, got " + levels);
        }
        long[] n = new long[levels];
        for (int i = 0; i < levels; i++) {
            n[i] = Math.round((double) maxMolecules * i / (levels - 1));
        }
        return n;
    }

    @Override
    public double[] taps() {
        return taps.clone();
    }

    @Override
    public long[] levelMolecules() {
        return levelMolecules.clone();
    }

    public int levels() {
        return levelMolecules.length;
    }

    public int isiMemory() {
        return taps.length - 1;
    }

    /** Tap k without copying. */
    public double tap(int k) {
        return taps[k];
    }

    /** Molecules of level i without copying. */
    public long molecules(int i) {
        return levelMolecules[i];
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof LinkSpec s && Arrays.equals(taps, s.taps) && Arrays.equals(levelMolecules, s.levelMolecules)
                && priorOne == s.priorOne && backgroundMoleculesPerSlot == s.backgroundMoleculesPerSlot
                && countModel == s.countModel && symbolTimeS == s.symbolTimeS;
    }

    @Override
    public int hashCode() {
        return Arrays.hashCode(taps) * 31 + Arrays.hashCode(levelMolecules);
    }

    @Override
    public String toString() {
        return "LinkSpec[taps=" + Arrays.toString(taps) + ", levels=" + Arrays.toString(levelMolecules) + ", prior="
                + priorOne + ", background=" + backgroundMoleculesPerSlot + ", model=" + countModel + ", T="
                + symbolTimeS + "]";
    }
}
