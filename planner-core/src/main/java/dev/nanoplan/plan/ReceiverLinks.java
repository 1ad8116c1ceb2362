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
 * @param deviationBits     the most the kept links' mutual information may differ from the exact plan's,
 *                          bits, as the evaluator states it (0 for the exact evaluator; the preview's band,
 *                          {@link PreviewDeviation})
 */
record ReceiverLinks(List<EvaluatedLink> kept, Map<LinkKey, Double> evaluatedCapacity, double deviationBits) {

    static final ReceiverLinks NONE = new ReceiverLinks(List.of(), Map.of());

    /** Links of an evaluator that states no deviation (the exact one). */
    ReceiverLinks(List<EvaluatedLink> kept, Map<LinkKey, Double> evaluatedCapacity) {
        this(kept, evaluatedCapacity, 0);
    }

    ReceiverLinks {
        kept = List.copyOf(kept);
        evaluatedCapacity = Map.copyOf(evaluatedCapacity);
    }
}
