package dev.nanoplan.plan;

import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.Species;
import java.util.Map;

/**
 * What every step of a plan reads: the scenario, the options and the lookups derived from them once.
 *
 * @param scenario the planned layout
 * @param options  floor, cutoff, exact interferers, advice target, progress, channel
 * @param nodes    the scenario's nodes by id
 * @param species  the scenario's species by name
 * @param slots    the slot schedule ({@link SlotSchedule#of(Scenario)})
 * @param weights  prior weights of the levels ({@link LinkContext#weights})
 */
record PlanInputs(Scenario scenario, PlanOptions options, Map<String, Node> nodes, Map<String, Species> species,
        SlotSchedule slots, double[] weights) {

    static PlanInputs of(Scenario scenario, PlanOptions options) {
        return new PlanInputs(scenario, options, scenario.nodesById(), scenario.speciesByName(),
                SlotSchedule.of(scenario), LinkContext.weights(scenario.signalling()));
    }
}
