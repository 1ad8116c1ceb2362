package dev.nanoplan.engine;

import java.io.Serializable;
import java.util.function.BooleanSupplier;

/**
 * A batch of independent work units (sweep points, tolerance samples, simulation blocks): unit i is a
 * pure function of this object's serialisable inputs (scenario JSON, settings, seed) and of i alone, so
 * any {@link Engine} (a thread pool, a Spark cluster) may compute the units in any order, on any
 * machine, and the caller combines the results in unit order to get the same answer every time.
 *
 * <p>Implementations are serialised once per job (Spark broadcasts them); caches built from the inputs
 * belong in transient fields rebuilt lazily on first use, and must be safe for concurrent
 * {@link #compute} calls.
 *
 * @param <R> the result of one unit (serialisable, so it can come back from an executor)
 */
public interface WorkUnits<R extends Serializable> extends Serializable {

    /** Number of units, ≥ 0. */
    int count();

    /**
     * Computes unit {@code index}.
     *
     * @param index 0 ≤ index &lt; {@link #count()}
     * @param cancelled polled during long units; once true the unit may give up
     * @return the unit's result, or null when it gave up because of {@code cancelled}
     */
    R compute(int index, BooleanSupplier cancelled);

    /** The unit's share of the work, for progress (molecules of a block, 1 for a sample); ≥ 0. */
    default long work(int index) {
        return 1;
    }
}
