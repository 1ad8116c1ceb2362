package dev.nanoplan.scenario;

import java.util.Locale;

/** What a node does. */
public enum Role {
    /** A point source at its position; releases its species. */
    TRANSMITTER,
    /** An absorbing sphere for its species, transparent to all others; counts what it absorbs. */
    RECEIVER,
    /** Absorbs its species and re-emits its emitted species from its centre (decode and forward). */
    RELAY;

    /** The lower-case name used in files. */
    public String id() {
        return name().toLowerCase(Locale.ROOT);
    }

    /** Whether nodes of this role release molecules. */
    public boolean emits() {
        return this != RECEIVER;
    }

    /** Whether nodes of this role absorb and count molecules. */
    public boolean absorbs() {
        return this != TRANSMITTER;
    }

    /**
     * Parses {@code transmitter | receiver | relay} (exact lower case, as written in files).
     *
     * @throws IllegalArgumentException if the name is unknown
     */
    public static Role parse(String name) {
        for (Role r : values()) {
            if (r.id().equals(name)) {
                return r;
            }
        }
        throw new IllegalArgumentException("unknown role '" + name + "', expected transmitter, receiver or relay");
    }
}
