package dev.nanoplan.scenario;

import dev.nanoplan.count.CountModelKind;

/**
 * How symbols are sent and detected; shared by every link of the scenario.
 *
 * @param symbolTimeS symbol time T in s, finite and > 0 (required in the file)
 * @param isiMemorySymbols number L of earlier symbols whose leftovers are counted, 0..{@value
 *     #MAX_ISI_MEMORY} (file default {@value #DEFAULT_ISI_MEMORY})
 * @param levels number of amplitude levels M, {@value #MIN_LEVELS}..{@value #MAX_LEVELS}
 *     (file default 2, on–off keying)
 * @param priorOne probability of sending a 1 (binary) in (0, 1) (file default 0.5)
 * @param countModel count model (file default {@code exact})
 * @param schedule who sends when (file default {@code all-active})
 */
public record Signalling(double symbolTimeS, int isiMemorySymbols, int levels, double priorOne,
        CountModelKind countModel, Schedule schedule) {

    /** Default ISI memory in symbols. */
    public static final int DEFAULT_ISI_MEMORY = 10;
    /** Largest accepted ISI memory in symbols. */
    public static final int MAX_ISI_MEMORY = 10_000;
    /** Fewest levels. */
    public static final int MIN_LEVELS = 2;
    /** Most levels. */
    public static final int MAX_LEVELS = 16;

    /** @throws IllegalArgumentException if a value is out of range */
    public Signalling {
        Checks.positive("symbolTimeS", symbolTimeS);
        if (isiMemorySymbols < 0 || isiMemorySymbols > MAX_ISI_MEMORY) {
            throw new IllegalArgumentException("isiMemorySymbols must be in 0.." + MAX_ISI_MEMORY
                    + ", got " + isiMemorySymbols);
        }
        if (levels < MIN_LEVELS || levels > MAX_LEVELS) {
            throw new IllegalArgumentException("levels must be in " + MIN_LEVELS + ".." + MAX_LEVELS
                    + ", got " + levels);
        }
        if (!(priorOne > 0 && priorOne < 1)) {
            throw new IllegalArgumentException("priorOne must be in (0, 1), got " + priorOne);
        }
        Checks.required("countModel", countModel);
        Checks.required("schedule", schedule);
    }

    /** Defaults for everything but the symbol time. */
    public static Signalling withSymbolTime(double symbolTimeS) {
        return new Signalling(symbolTimeS, DEFAULT_ISI_MEMORY, 2, 0.5, CountModelKind.EXACT, Schedule.ALL_ACTIVE);
    }
}
