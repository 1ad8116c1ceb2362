package dev.nanoplan.scenario;

/**
 * A requested data flow from a node that can send (transmitter or relay) to a node that can
 * receive (receiver or relay).
 *
 * @param from id of the source node, non-empty
 * @param to id of the destination node, non-empty and different from {@code from}
 */
public record Demand(String from, String to) {

    /** @throws IllegalArgumentException if an id is empty or both are equal */
    public Demand {
        Checks.nonBlank("from", from);
        Checks.nonBlank("to", to);
        if (from.equals(to)) {
            throw new IllegalArgumentException("demand from and to must differ, got '" + from + "' twice");
        }
    }
}
