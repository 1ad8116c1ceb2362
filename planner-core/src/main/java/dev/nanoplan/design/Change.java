package dev.nanoplan.design;

import java.util.Locale;

/**
 * One change a search made to a layout (the {@code changes} entries of {@code improve --json}).
 *
 * @param node   the node changed
 * @param field  the scenario field: {@code position_um}, {@code species}, {@code emits_species},
 *               {@code slot}, {@code molecules_per_symbol}, or {@code node} for a node added
 * @param from   the value before, as the file writes it (null for an added node)
 * @param to     the value after
 * @param reason plain words, e.g. {@code "moved 12.3 µm towards gw"}
 */
public record Change(String node, String field, String from, String to, String reason) {

    /** The change as one line, e.g. {@code "relay-w: moved 12.3 µm towards gw"}. */
    public String describe() {
        return String.format(Locale.ROOT, "%s: %s", node, reason);
    }
}
