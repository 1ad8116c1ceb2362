package dev.nanoplan.scenario;

/** Who sends in which symbol slot. */
public enum Schedule {
    /** Every emitter of a species sends in every symbol slot (file name {@code all-active}). */
    ALL_ACTIVE("all-active");

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
        throw new IllegalArgumentException("unknown schedule '" + name + "', expected all-active");
    }
}
