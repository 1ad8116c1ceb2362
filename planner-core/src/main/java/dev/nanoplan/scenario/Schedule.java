package dev.nanoplan.scenario;

/**
 * Who sends in which symbol slot. All slots are synchronous (docs/architecture.md §4.1); the schedule decides
 * which emitters of a species release in a slot ({@code dev.nanoplan.plan.SlotSchedule} turns it into
 * the taps each link hears and its rate).
 */
public enum Schedule {
    /** Every emitter of a species sends in every symbol slot (file name {@code all-active}). */
    ALL_ACTIVE("all-active"),
    /**
     * Time division within each species (file name {@code round-robin}): the K emitters of a
     * species, numbered k = 0..K−1 in file order, take turns; emitter k sends in the slots
     * s ≡ k (mod K) and releases nothing in the others. One symbol per frame of K slots.
     */
    ROUND_ROBIN("round-robin"),
    /**
     * Slot plan with spatial reuse (file name {@code slots}): every emitter carries its own slot number
     * ({@link Signalling#slots()}); the frame of a species is its largest slot + 1, or
     * {@link Signalling#frameSlots()} when given. Emitters of a species that share a slot send together.
     */
    SLOTS("slots");

    /** The file names of every schedule, for messages. */
    public static final String EXPECTED = "all-active, round-robin or slots";

    private final String id;

    Schedule(String id) {
        this.id = id;
    }

    /** The name used in files. */
    public String id() {
        return id;
    }

    /**
     * Parses a file name such as {@code all-active}.
     *
     * @throws IllegalArgumentException if the name is unknown
     */
    public static Schedule parse(String name) {
        for (Schedule s : values()) {
            if (s.id.equals(name)) {
                return s;
            }
        }
        throw new IllegalArgumentException("unknown schedule '" + name + "', expected " + EXPECTED);
    }
}
