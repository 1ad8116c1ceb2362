package dev.nanoplan.design;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.DoubleNode;
import com.fasterxml.jackson.databind.node.IntNode;
import com.fasterxml.jackson.databind.node.LongNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.io.Serializable;
import java.util.ArrayList;
import java.util.List;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * A numeric field of a scenario file named by a path such as {@code signalling.symbol_time_s},
 * {@code nodes[relay-w].molecules_per_symbol}, {@code nodes[relay-w].position_um[0]} or
 * {@code species[A].diffusion_um2_per_s}: dot-separated field names, each optionally followed by
 * bracketed selectors; a selector is an array index (digits) or the {@code id} (nodes) or {@code name}
 * (species) of an array element. The field must already be in the file and hold a number (or null),
 * so a sweep changes values, never the file's shape.
 *
 * @param text the path as the user wrote it
 */
public record SweepPath(String text) implements Serializable {

    private static final Pattern SEGMENT = Pattern.compile("([A-Za-z_][A-Za-z0-9_]*)((?:\\[[^\\[\\]]+\\])*)");
    private static final Pattern SELECTOR = Pattern.compile("\\[([^\\[\\]]+)\\]");

    /**
     * Parses a path (syntax only; {@link #set} checks it against a file).
     *
     * @throws IllegalArgumentException naming the path when its syntax is wrong
     */
    public static SweepPath parse(String text) {
        if (text == null || text.isBlank()) {
            throw new IllegalArgumentException("PATH: empty");
        }
        for (String seg : text.split("\\.", -1)) {
            if (!SEGMENT.matcher(seg).matches()) {
                throw new IllegalArgumentException(text + ": not a field path (expected name, name[key] or "
                        + "name[key][i] parts joined by dots), at \"" + seg + "\"");
            }
        }
        return new SweepPath(text);
    }

    /** The path's steps: field names (String) and selectors (Integer index or String key). */
    private List<Object> steps() {
        List<Object> out = new ArrayList<>();
        for (String seg : text.split("\\.", -1)) {
            Matcher m = SEGMENT.matcher(seg);
            if (!m.matches()) {
                throw new IllegalArgumentException(text + ": not a field path");
            }
            out.add(m.group(1));
            Matcher s = SELECTOR.matcher(m.group(2));
            while (s.find()) {
                String key = s.group(1);
                out.add(key.chars().allMatch(Character::isDigit) ? (Object) Integer.valueOf(key) : new Key(key));
            }
        }
        return out;
    }

    private record Key(String value) {
    }

    /**
     * Sets the field to {@code value} in the scenario tree {@code root} (edited in place).
     *
     * @throws IllegalArgumentException naming the path when the field is not in the file or not a number
     */
    public void set(JsonNode root, double value) {
        List<Object> steps = steps();
        JsonNode parent = null;
        JsonNode node = root;
        for (int i = 0; i < steps.size(); i++) {
            Object step = steps.get(i);
            parent = node;
            node = child(node, step);
            if (node == null) {
                throw new IllegalArgumentException(text + ": no such field in the scenario (at "
                        + describe(step) + ")");
            }
        }
        if (!(node.isNumber() || node.isNull())) {
            throw new IllegalArgumentException(text + ": not a number in the scenario");
        }
        Object last = steps.get(steps.size() - 1);
        // a whole number stays a whole number where the file has one (counts such as molecules_per_symbol)
        JsonNode v = node.isIntegralNumber() && value == Math.rint(value) && Math.abs(value) < 1e15
                ? (Math.abs(value) <= Integer.MAX_VALUE ? IntNode.valueOf((int) value) : LongNode.valueOf((long) value))
                : DoubleNode.valueOf(value);
        if (last instanceof Integer idx) {
            ((ArrayNode) parent).set(idx.intValue(), v);
        } else if (last instanceof String field) {
            ((ObjectNode) parent).set(field, v);
        } else {
            throw new IllegalArgumentException(text + ": selects an element, not a number");
        }
    }

    private static JsonNode child(JsonNode node, Object step) {
        if (step instanceof String field) {
            return node.isObject() ? node.get(field) : null;
        }
        if (!node.isArray()) {
            return null;
        }
        if (step instanceof Integer idx) {
            return idx < node.size() ? node.get(idx) : null;
        }
        String key = ((Key) step).value();
        for (JsonNode e : node) {
            if (key.equals(e.path("id").asText(null)) || key.equals(e.path("name").asText(null))) {
                return e;
            }
        }
        return null;
    }

    private static String describe(Object step) {
        return step instanceof Key k ? "[" + k.value() + "]" : step instanceof Integer i ? "[" + i + "]"
                : (String) step;
    }

    @Override
    public String toString() {
        return text;
    }
}
