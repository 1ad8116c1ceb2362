package dev.nanoplan.sim;

/**
 * Receives progress of a simulation. Called from worker threads after each finished block,
 * possibly concurrently: implementations must be thread-safe and quick.
 */
@FunctionalInterface
public interface SimulationProgress {

    /** Ignores progress. */
    SimulationProgress NONE = (done, total) -> { };

    /**
     * @param moleculesDone molecules whose whole trajectory is finished, over all emitters
     * @param moleculesTotal molecules to simulate over all emitters
     */
    void update(long moleculesDone, long moleculesTotal);
}
