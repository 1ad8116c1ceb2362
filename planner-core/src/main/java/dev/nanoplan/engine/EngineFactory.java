package dev.nanoplan.engine;

import java.util.function.Consumer;

/**
 * Opens an engine by name; implementations outside the core (the Spark engine of planner-spark) are
 * found with {@link java.util.ServiceLoader}, so a shell needs them on its class path only when asked
 * for.
 */
public interface EngineFactory {

    /** The name users pass ({@code --engine NAME}). */
    String name();

    /**
     * Opens an engine.
     *
     * @param master where to run (for Spark: {@code local[*]}, {@code spark://HOST:PORT}, {@code yarn},
     *     {@code k8s://…}), or null for the engine's default
     * @param status receives one-line progress notes (stages, tasks), for stderr
     * @throws EngineUnavailableException when the engine cannot start (a master that cannot be reached)
     */
    Engine open(String master, Consumer<String> status);
}
