package dev.nanoplan.cli;

import dev.nanoplan.engine.Engine;
import dev.nanoplan.engine.EngineFactory;
import dev.nanoplan.engine.LocalEngine;
import java.io.PrintWriter;
import java.util.ServiceLoader;
import picocli.CommandLine.Option;

/**
 * {@code --engine local|spark [--master URL]}, shared by the commands whose work runs as work units.
 * The local engine is a thread pool here; other engines are found on the class path (the launcher adds
 * the Spark classes only when {@code --engine spark} is given).
 */
final class EngineOptions {

    @Option(names = "--engine", paramLabel = "NAME", defaultValue = "local",
            description = "Where the work units run: local (threads, default) or spark.")
    String engine;

    @Option(names = "--master", paramLabel = "URL",
            description = "With --engine spark: local[*], local[N], spark://HOST:PORT, yarn or k8s://...; "
                    + "default: spark-submit's master, else local[*].")
    String master;

    /**
     * Opens the chosen engine; stage and task notes go to {@code err}.
     *
     * @param threads threads of the local engine
     * @throws BadInputException for an unknown engine, or --master without a cluster engine
     */
    Engine open(int threads, PrintWriter err) {
        if ("local".equals(engine)) {
            if (master != null) {
                throw new BadInputException("--master: needs --engine spark");
            }
            return new LocalEngine(threads);
        }
        for (EngineFactory f : ServiceLoader.load(EngineFactory.class)) {
            if (f.name().equals(engine)) {
                return f.open(master, line -> {
                    err.println(line);
                    err.flush();
                });
            }
        }
        if ("spark".equals(engine)) {
            throw new BadInputException("--engine spark: the Spark engine is not on the class path; run through "
                    + "./nanoplan (which adds it for --engine spark) or spark-submit planner-spark/target/nanoplan-spark.jar");
        }
        throw new BadInputException("--engine: must be local or spark, got " + engine);
    }
}
