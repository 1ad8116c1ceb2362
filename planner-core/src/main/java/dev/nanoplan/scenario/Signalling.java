package dev.nanoplan.scenario;

import dev.nanoplan.count.CountModelKind;
import java.util.Map;
import java.util.TreeMap;

/**
 * How symbols are sent and detected; shared by every link of the scenario.
 *
 * <p>The per-node {@code slot} numbers of the file live here, keyed by node id, rather than on
 * {@link Node}: they belong to the schedule (a slot plan is replaced as a whole by the slot assignment)
 * and the node record stays the same for every schedule.
 *
 * @param symbolTimeS symbol time T in s, finite and > 0 (required in the file)
 * @param isiMemorySymbols number L of earlier symbols whose leftovers are counted, 0..{@value
 *     #MAX_ISI_MEMORY} (file default {@value #DEFAULT_ISI_MEMORY})
 * @param levels number of amplitude levels M, {@value #MIN_LEVELS}..{@value #MAX_LEVELS}
 *     (file default 2, on–off keying)
 * @param priorOne probability of sending a 1 (binary) in (0, 1) (file default 0.5)
 * @param countModel count model (file default {@code exact})
 * @param schedule who sends when (file default {@code all-active})
 * @param frameSlots the file's {@code frame_slots} (slots per frame of every species, {@code slots}
 *     schedule only), or 0 when not given
 * @param slots the file's {@code nodes[].slot} by node id ({@code slots} schedule only, else empty);
 *     every slot ≥ 0 and below {@code frameSlots} when that is given
 */
public record Signalling(double symbolTimeS, int isiMemorySymbols, int levels, double priorOne,
        CountModelKind countModel, Schedule schedule, int frameSlots, Map<String, Integer> slots) {

    /** Default ISI memory in symbols. */
    public static final int DEFAULT_ISI_MEMORY = 10;
    /** Largest accepted ISI memory in symbols. */
    public static final int MAX_ISI_MEMORY = 10_000;
    /** Fewest levels. */
    public static final int MIN_LEVELS = 2;
    /** Most levels. */
    public static final int MAX_LEVELS = 16;
    /** Largest accepted {@code frame_slots} and slot number + 1. */
    public static final int MAX_FRAME_SLOTS = 10_000;

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
        slots = Map.copyOf(Checks.required("slots", slots));
        if (frameSlots < 0 || frameSlots > MAX_FRAME_SLOTS) {
            throw new IllegalArgumentException("frameSlots must be in 0.." + MAX_FRAME_SLOTS + ", got " + frameSlots);
        }
        if (schedule != Schedule.SLOTS && (frameSlots != 0 || !slots.isEmpty())) {
            throw new IllegalArgumentException("frameSlots and slots are for the slots schedule only, not "
                    + schedule.id());
        }
        for (Map.Entry<String, Integer> e : new TreeMap<>(slots).entrySet()) {
            int s = e.getValue();
            if (s < 0 || s >= (frameSlots > 0 ? frameSlots : MAX_FRAME_SLOTS)) {
                throw new IllegalArgumentException("slot of " + e.getKey() + " must be in 0.."
                        + ((frameSlots > 0 ? frameSlots : MAX_FRAME_SLOTS) - 1) + ", got " + s);
            }
        }
    }

    /** A signalling without a slot plan (all-active or round-robin; slots with no slot yet). */
    public Signalling(double symbolTimeS, int isiMemorySymbols, int levels, double priorOne,
            CountModelKind countModel, Schedule schedule) {
        this(symbolTimeS, isiMemorySymbols, levels, priorOne, countModel, schedule, 0, Map.of());
    }

    /** Defaults for everything but the symbol time. */
    public static Signalling withSymbolTime(double symbolTimeS) {
        return new Signalling(symbolTimeS, DEFAULT_ISI_MEMORY, 2, 0.5, CountModelKind.EXACT, Schedule.ALL_ACTIVE);
    }

    /** The same signalling with the slot plan {@code slotsById} (schedule {@code slots}; frame 0 = largest slot + 1). */
    public Signalling withSlots(int frameSlotsOrZero, Map<String, Integer> slotsById) {
        return new Signalling(symbolTimeS, isiMemorySymbols, levels, priorOne, countModel, Schedule.SLOTS,
                frameSlotsOrZero, slotsById);
    }
}
