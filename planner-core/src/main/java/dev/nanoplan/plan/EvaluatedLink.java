package dev.nanoplan.plan;

import dev.nanoplan.network.LinkCapacity;
import dev.nanoplan.network.LinkEdge;
import java.util.function.Supplier;

/**
 * A link as one per-receiver evaluator ({@link ReceiverEvaluator}) produced it.
 *
 * @param report     the reported link (its consistent capacity not yet filled in)
 * @param edge       its edge in the link graph (operating mutual information and the transition
 *                   matrix at the operating thresholds)
 * @param frameSlots slots per frame K of its emitter's species (1 under all-active): one symbol per K·T
 * @param context    what the what-ifs (advice, budgets) need to re-evaluate it; null when the
 *                   evaluator does none (the preview)
 * @param capacity   the link's consistent capacity, computed on first call and kept; null when the
 *                   evaluator has none (the preview)
 */
record EvaluatedLink(LinkReport report, LinkEdge edge, int frameSlots, LinkContext context,
        Supplier<LinkCapacity> capacity) {

    /** The link's key. */
    LinkKey key() {
        return LinkKey.of(report);
    }
}
