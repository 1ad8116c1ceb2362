package dev.nanoplan.scenario;

import com.fasterxml.jackson.core.JsonFactory;
import com.fasterxml.jackson.core.JsonLocation;
import com.fasterxml.jackson.core.JsonParser;
import com.fasterxml.jackson.core.JsonToken;
import com.fasterxml.jackson.core.json.JsonReadFeature;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.JsonNodeFactory;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.io.IOException;
import java.io.Reader;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

/**
 * Builds a Jackson tree from a token stream while remembering where each value starts.
 *
 * <p>Jackson's tree nodes carry no location (and small values are shared singletons), so
 * positions are kept in a map keyed by field path in file notation: {@code ""} for the root,
 * {@code medium.flow}, {@code nodes[3].radius_um}. NaN and ±Infinity literals are accepted
 * ({@link JsonReadFeature#ALLOW_NON_NUMERIC_NUMBERS}) so the validator can name them; duplicate
 * keys are recorded as problems (the later value wins). Not thread-safe; one instance per read.
 */
final class LocatingTreeReader {

    private static final JsonFactory FACTORY = JsonFactory.builder()
            .enable(JsonReadFeature.ALLOW_NON_NUMERIC_NUMBERS)
            .build();

    private final JsonNodeFactory nodes = JsonNodeFactory.instance;
    private final Map<String, JsonLocation> locations = new HashMap<>();
    private final List<ScenarioProblem> problems = new ArrayList<>();

    /**
     * Reads one JSON document.
     *
     * @throws com.fasterxml.jackson.core.JsonProcessingException on malformed JSON (with location)
     * @throws IOException on read failure
     */
    JsonNode read(Reader in) throws IOException {
        try (JsonParser p = FACTORY.createParser(in)) {
            JsonToken first = p.nextToken();
            if (first == null) {
                problems.add(new ScenarioProblem("", "the file is empty, expected a JSON object", 1, 1));
                return null;
            }
            JsonNode root = value(p, "");
            if (p.nextToken() != null) {
                JsonLocation at = p.currentTokenLocation();
                problems.add(new ScenarioProblem("", "unexpected content after the end of the scenario object",
                        at.getLineNr(), at.getColumnNr()));
            }
            return root;
        }
    }

    /** Where the value at {@code path} starts, or where its nearest known parent starts; null if none. */
    JsonLocation locate(String path) {
        String p = path;
        while (true) {
            JsonLocation at = locations.get(p);
            if (at != null || p.isEmpty()) {
                return at;
            }
            int cut = Math.max(p.lastIndexOf('.'), p.lastIndexOf('['));
            p = cut < 0 ? "" : p.substring(0, cut);
        }
    }

    /** Problems found while building the tree (duplicate keys, trailing content). */
    List<ScenarioProblem> problems() {
        return problems;
    }

    private JsonNode value(JsonParser p, String path) throws IOException {
        locations.put(path, p.currentTokenLocation());
        JsonToken t = p.currentToken();
        switch (t) {
            case START_OBJECT: {
                ObjectNode o = nodes.objectNode();
                while (p.nextToken() == JsonToken.FIELD_NAME) {
                    String name = p.currentName();
                    String child = path.isEmpty() ? name : path + "." + name;
                    JsonLocation keyAt = p.currentTokenLocation();
                    p.nextToken();
                    JsonNode v = value(p, child);
                    if (o.has(name)) {
                        problems.add(new ScenarioProblem(child, "duplicate field (appears more than once)",
                                keyAt.getLineNr(), keyAt.getColumnNr()));
                    }
                    o.set(name, v);
                }
                return o;
            }
            case START_ARRAY: {
                ArrayNode a = nodes.arrayNode();
                int i = 0;
                while (p.nextToken() != JsonToken.END_ARRAY) {
                    a.add(value(p, path + "[" + i + "]"));
                    i++;
                }
                return a;
            }
            case VALUE_STRING:
                return nodes.textNode(p.getText());
            case VALUE_NUMBER_INT:
                return p.getNumberType() == JsonParser.NumberType.BIG_INTEGER
                        ? nodes.numberNode(p.getBigIntegerValue())
                        : nodes.numberNode(p.getLongValue());
            case VALUE_NUMBER_FLOAT:
                return nodes.numberNode(p.getDoubleValue());
            case VALUE_TRUE:
                return nodes.booleanNode(true);
            case VALUE_FALSE:
                return nodes.booleanNode(false);
            case VALUE_NULL:
                return nodes.nullNode();
            default:
                throw new IllegalStateException("unexpected JSON token " + t + " at " + path);
        }
    }
}
