package dev.nanoplan.design;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import dev.nanoplan.engine.WorkUnits;
import dev.nanoplan.plan.IncrementalPlanner;
import dev.nanoplan.plan.Plan;
import dev.nanoplan.plan.PlanOptions;
import dev.nanoplan.plan.RouteReport;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.ScenarioException;
import dev.nanoplan.scenario.ScenarioReader;
import java.util.ArrayList;
import java.util.List;
import java.util.function.BooleanSupplier;

/**
 * The grid of a design sweep as work units for any engine: unit i is the grid point whose field
 * indices are i's mixed-radix digits, the first field slowest. Each unit edits the scenario's JSON tree
 * ({@link SweepPath#set}), reads it back through the strict {@link ScenarioReader} (so every point is
 * validated like a file), plans it without budgets or advice (the figures below do not read them) and
 * returns its {@link SweepPoint}. A pure function of the scenario text, the fields and their values.
 */
public final class SweepPoints implements WorkUnits<SweepPoint> {

    private static final long serialVersionUID = 1L;
    private static final ObjectMapper JSON = new ObjectMapper();

    private final String scenarioJson;
    private final ArrayList<SweepPath> fields;
    private final ArrayList<ArrayList<Double>> values;
    private final int count;

    /**
     * @param scenarioJson the scenario file's text
     * @param fields       swept fields, first slowest
     * @param values       each field's values (≥ 1 each)
     * @throws IllegalArgumentException naming the field (or field=value) when a path is not in the file or
     *     a grid value makes the scenario invalid
     */
    public SweepPoints(String scenarioJson, List<SweepPath> fields, List<List<Double>> values) {
        if (fields.size() != values.size() || fields.isEmpty()) {
            throw new IllegalArgumentException("--vary: give at least one PATH=SPEC");
        }
        this.scenarioJson = scenarioJson;
        this.fields = new ArrayList<>(fields);
        this.values = new ArrayList<>();
        long n = 1;
        for (List<Double> v : values) {
            if (v.isEmpty()) {
                throw new IllegalArgumentException("--vary: a field without values");
            }
            this.values.add(new ArrayList<>(v));
            n *= v.size();
            if (n > 1_000_000) {
                throw new IllegalArgumentException("--vary: the grid has more than 1,000,000 points");
            }
        }
        this.count = (int) n;
        // every field exists, and every value of a field gives a valid scenario with the others nominal
        for (int f = 0; f < fields.size(); f++) {
            for (double v : values.get(f)) {
                JsonNode tree = tree();
                fields.get(f).set(tree, v);
                try {
                    read(tree);
                } catch (ScenarioException e) {
                    throw new IllegalArgumentException(fields.get(f) + "=" + v + ": " + e.getMessage(), e);
                }
            }
        }
    }

    @Override
    public int count() {
        return count;
    }

    /** The swept fields, first slowest. */
    public List<SweepPath> fields() {
        return List.copyOf(fields);
    }

    /** Unit {@code index}'s value of each field, in field order. */
    public List<Double> valuesAt(int index) {
        Double[] out = new Double[fields.size()];
        int rest = index;
        for (int f = fields.size() - 1; f >= 0; f--) {
            List<Double> v = values.get(f);
            out[f] = v.get(rest % v.size());
            rest /= v.size();
        }
        return List.of(out);
    }

    @Override
    public SweepPoint compute(int index, BooleanSupplier cancelled) {
        List<Double> at = valuesAt(index);
        JsonNode tree = tree();
        for (int f = 0; f < fields.size(); f++) {
            fields.get(f).set(tree, at.get(f));
        }
        Scenario s;
        try {
            s = read(tree);
        } catch (ScenarioException e) {
            throw new IllegalArgumentException("sweep point " + at + ": " + e.getMessage(), e);
        }
        Plan plan = IncrementalPlanner.exactWithoutBudgets(s, PlanOptions.DEFAULT).plan();
        Objective o = Assessment.of(plan).objective();
        double minE2e = Double.POSITIVE_INFINITY;
        Double maxLatency = null;
        for (RouteReport r : plan.routes()) {
            minE2e = Math.min(minE2e, r.reachable() ? r.endToEndCapacityBits() : 0);
            if (r.reachable()) {
                maxLatency = maxLatency == null ? r.latencyS() : Math.max(maxLatency, r.latencyS());
            }
        }
        return new SweepPoint(at, o.demandsMeetingTargets(), o.minSharedRateBitsPerS(),
                Double.isInfinite(minE2e) ? 0 : minE2e, o.moleculesPerS(), maxLatency);
    }

    private JsonNode tree() {
        try {
            return JSON.readTree(scenarioJson);
        } catch (JsonProcessingException e) {
            throw new IllegalArgumentException("scenario: not JSON: " + e.getOriginalMessage(), e);
        }
    }

    private static Scenario read(JsonNode tree) throws ScenarioException {
        return ScenarioReader.strict().parse(tree.toString()).scenario();
    }
}
