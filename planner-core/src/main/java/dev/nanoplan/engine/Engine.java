package dev.nanoplan.engine;

import java.io.Serializable;
import java.util.function.BooleanSupplier;

/**
 * Runs a batch of {@link WorkUnits} and returns their results in unit order. Because each unit is a
 * pure function of the batch's inputs and its index, every engine gives the same results whatever
 * its partitioning, its number of threads or executors and the order in which units finish.
 *
 * <p>Implementations: {@link LocalEngine} (a thread pool in this process, the default) and, in the
 * planner-spark module, an engine that runs the units as a Spark job.
 */
public interface Engine extends AutoCloseable {

    /** Short name for messages ("local", "spark"). */
    String name();

    /**
     * Runs the batch.
     *
     * @param units the work
     * @param progress told as units finish (possibly from other threads)
     * @param cancelled once true, no new unit starts and running ones may give up; the result then
     *     holds the units that finished
     * @return one entry per unit in unit order
     * @throws RuntimeException what a unit threw (the first, for the local engine)
     */
    <R extends Serializable> UnitResults<R> run(WorkUnits<R> units, EngineProgress progress,
            BooleanSupplier cancelled);

    /** Runs the batch without progress or cancellation. */
    default <R extends Serializable> UnitResults<R> run(WorkUnits<R> units) {
        return run(units, EngineProgress.NONE, () -> false);
    }

    /** Releases the engine's resources (threads, a Spark context); a no-op by default. */
    @Override
    default void close() {
    }
}
