package dev.nanoplan.plan;

import java.util.List;
import java.util.Map;

/**
 * The result of evaluating the links heard at one receiver.
 *
 * @param kept              the links at or above the capacity floor, in the order of the receiver's
 *                          channel entries
 * @param evaluatedCapacity capacity of every pair the evaluator evaluated (the kept ones, and for the
 *                          exact evaluator also those found below the floor): the routes' "direct"
 *                          capacity
 */
record ReceiverLinks(List<EvaluatedLink> kept, Map<LinkKey, Double> evaluatedCapacity) {

    static final ReceiverLinks NONE = new ReceiverLinks(List.of(), Map.of());

    ReceiverLinks {
        kept = List.copyOf(kept);
        evaluatedCapacity = Map.copyOf(evaluatedCapacity);
    }
}
