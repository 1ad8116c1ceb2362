package dev.nanoplan.design;

import java.util.Arrays;
import java.util.EnumSet;
import java.util.Set;
import java.util.stream.Collectors;

/** The parts of a layout a search may change ({@code improve --allow}). */
public enum DesignMove {
    /** The species of each link group (a receiver and the emitters whose route hops end at it). */
    SPECIES("species"),
    /** The slot plan: each emitter's slot within its species' frame (schedule {@code slots}). */
    SLOTS("slots"),
    /** Molecules per symbol of each emitting node. */
    BUDGETS("budgets"),
    /** Relay centres (continuous, inside the volume, no overlaps). */
    MOVE_RELAYS("move-relays"),
    /** New relays {@code relay-new-1}, … for demands that miss their targets. */
    ADD_RELAYS("add-relays");

    private final String id;

    DesignMove(String id) {
        this.id = id;
    }

    /** The command-line name. */
    public String id() {
        return id;
    }

    /** Every move but {@link #ADD_RELAYS}: the default of {@code --allow}. */
    public static Set<DesignMove> defaults() {
        return EnumSet.complementOf(EnumSet.of(ADD_RELAYS));
    }

    /**
     * The move named {@code id}.
     *
     * @throws IllegalArgumentException naming the allowed ids
     */
    public static DesignMove parse(String id) {
        for (DesignMove m : values()) {
            if (m.id.equals(id)) {
                return m;
            }
        }
        throw new IllegalArgumentException("unknown move '" + id + "', expected one of "
                + Arrays.stream(values()).map(DesignMove::id).collect(Collectors.joining(", ")));
    }
}
