package dev.nanoplan.engine;

import java.io.Serializable;
import java.util.ArrayList;
import java.util.Collections;
import java.util.List;

/**
 * The results of a batch in unit order: entry i is unit i's result, or null when the unit did not
 * finish (the run was cancelled).
 *
 * @param <R> the result of one unit
 */
public final class UnitResults<R extends Serializable> {

    private final List<R> results;

    /** @param results entry i for unit i, null where unfinished (copied; nulls allowed) */
    public UnitResults(List<R> results) {
        this.results = Collections.unmodifiableList(new ArrayList<>(results));
    }

    /** Number of units. */
    public int size() {
        return results.size();
    }

    /** Unit i's result, or null when it did not finish. */
    public R get(int i) {
        return results.get(i);
    }

    /** True when every unit finished. */
    public boolean complete() {
        return results.stream().allMatch(r -> r != null);
    }

    /** Finished results in unit order (unfinished units left out). */
    public List<R> finished() {
        return results.stream().filter(r -> r != null).toList();
    }
}
