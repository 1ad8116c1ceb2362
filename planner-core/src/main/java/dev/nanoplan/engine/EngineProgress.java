package dev.nanoplan.engine;

/**
 * Receives an engine's progress, in the units' own measure of work ({@link WorkUnits#work}). May be
 * called from worker threads, possibly concurrently: implementations must be thread-safe and quick.
 */
@FunctionalInterface
public interface EngineProgress {

    /** Ignores progress. */
    EngineProgress NONE = (done, total) -> { };

    /**
     * @param workDone work of the finished units
     * @param workTotal work of all units
     */
    void update(long workDone, long workTotal);
}
