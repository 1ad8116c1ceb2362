package dev.nanoplan.spark;

import dev.nanoplan.engine.Engine;
import dev.nanoplan.engine.EngineFactory;
import java.util.function.Consumer;

/** {@code --engine spark}: found by the command line through {@link java.util.ServiceLoader}. */
public final class SparkEngineFactory implements EngineFactory {

    @Override
    public String name() {
        return "spark";
    }

    @Override
    public Engine open(String master, Consumer<String> status) {
        return SparkEngine.start(master, status);
    }
}
