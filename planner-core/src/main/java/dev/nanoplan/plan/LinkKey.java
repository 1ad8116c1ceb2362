package dev.nanoplan.plan;

/**
 * An ordered emitter → receiver pair, the key of a plan's links (direction matters: {@code a → b}
 * and {@code b → a} are different links).
 *
 * @param from emitter id
 * @param to   receiver id
 */
public record LinkKey(String from, String to) {

    public LinkKey {
        if (from == null || to == null) {
            throw new IllegalArgumentException("from/to: must not be null");
        }
    }

    /** The key of a reported link. */
    static LinkKey of(LinkReport link) {
        return new LinkKey(link.from(), link.to());
    }
}
