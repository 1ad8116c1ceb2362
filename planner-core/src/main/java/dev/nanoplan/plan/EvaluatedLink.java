package dev.nanoplan.plan;

import dev.nanoplan.network.LinkEdge;

/**
 * A link as one per-receiver evaluator ({@link ReceiverEvaluator}) produced it.
 *
 * @param report     the reported link
 * @param edge       its edge in the link graph (capacity and transition matrix)
 * @param frameSlots slots per frame K of its emitter's species (1 under all-active): one symbol per K·T
 * @param context    what the what-ifs (advice, budgets) need to re-evaluate it; null when the
 *                   evaluator does none (the preview)
 */
record EvaluatedLink(LinkReport report, LinkEdge edge, int frameSlots, LinkContext context) {

    /** The link's key. */
    LinkKey key() {
        return LinkKey.of(report);
    }
}
