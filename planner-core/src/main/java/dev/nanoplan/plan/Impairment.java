package dev.nanoplan.plan;

import java.util.Locale;

/** What limits a link most: the part whose removal would raise its capacity the most. */
public enum Impairment {
    /** Too few molecules arrive (distance, small receiver, decay). */
    SIGNAL,
    /** Leftovers of the link's own earlier symbols. */
    ISI,
    /** Molecules of other emitters of the same species. */
    CROSSTALK,
    /** Background molecules. */
    NOISE;

    /** Fraction of the gap to log2 M below which no removal "helps much" (then SIGNAL). */
    static final double HELPS_FRACTION = 0.1;

    /**
     * The impairment whose removal raises capacity most (gains in bits), or SIGNAL when even the best
     * gain closes less than {@link #HELPS_FRACTION} of the gap to log2 M ({@code gapBits}); ties go to
     * the first of ISI, CROSSTALK, NOISE.
     */
    static Impairment limitedBy(double gainNoIsiBits, double gainNoCrosstalkBits, double gainNoNoiseBits,
            double gapBits) {
        Impairment limited = SIGNAL;
        double best = HELPS_FRACTION * gapBits;
        if (gainNoIsiBits > best) {
            limited = ISI;
            best = gainNoIsiBits;
        }
        if (gainNoCrosstalkBits > best) {
            limited = CROSSTALK;
            best = gainNoCrosstalkBits;
        }
        if (gainNoNoiseBits > best) {
            limited = NOISE;
        }
        return limited;
    }

    /** The JSON word: signal | isi | crosstalk | noise. */
    public String id() {
        return name().toLowerCase(Locale.ROOT);
    }
}
