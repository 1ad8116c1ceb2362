package dev.nanoplan.plan;

/**
 * One proposed change for a route's weakest hop, before it is checked: the change as data, the
 * reason it was proposed and the hop it aims at.
 *
 * @param edit    the change to the layout
 * @param reason  why this change, true of the current plan (e.g. "it brings 44% of the crosstalk
 *                at gw"), or empty
 * @param hopFrom emitter of the hop the change aims at
 * @param hopTo   receiver of that hop
 */
public record Advice(ScenarioEdit edit, String reason, String hopFrom, String hopTo) {

    public Advice {
        if (edit == null || reason == null || hopFrom == null || hopTo == null) {
            throw new IllegalArgumentException("edit, reason, hopFrom and hopTo must not be null");
        }
    }

    /** The change with its reason, e.g. "give relay-e its own species (it brings 44% of …)". */
    public String text() {
        return reason.isEmpty() ? edit.describe() : edit.describe() + " (" + reason + ")";
    }
}
