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

    /** The JSON word: signal | isi | crosstalk | noise. */
    public String id() {
        return name().toLowerCase(Locale.ROOT);
    }
}
