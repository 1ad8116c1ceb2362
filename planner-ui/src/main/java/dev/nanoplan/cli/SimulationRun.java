package dev.nanoplan.cli;

import dev.nanoplan.engine.Engine;
import dev.nanoplan.engine.LocalEngine;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.sim.ParticleSimulator;
import dev.nanoplan.sim.SimulatedChannel;
import dev.nanoplan.sim.SimulationProgress;
import java.io.PrintWriter;
import java.util.concurrent.CountDownLatch;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicBoolean;

/**
 * Runs a particle simulation for a subcommand: progress bar on stderr (when asked or on a
 * terminal), and Ctrl-C stops it cleanly (the shutdown hook waits up to 30 s for the caller to
 * report what finished, signalled by {@link #close()}).
 */
final class SimulationRun implements AutoCloseable {

    private final AtomicBoolean cancelled = new AtomicBoolean();
    private final CountDownLatch reported = new CountDownLatch(1);
    private final Thread hook;

    SimulationRun() {
        hook = new Thread(() -> {
            cancelled.set(true);
            try {
                reported.await(30, TimeUnit.SECONDS);
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
            }
        }, "nanoplan-simulate-stop");
        Runtime.getRuntime().addShutdownHook(hook);
    }

    /** Simulates with a progress bar on {@code err} when {@code showProgress}. */
    SimulatedChannel simulate(ParticleSimulator simulator, Scenario scenario, PrintWriter err, boolean showProgress) {
        try (LocalEngine engine = new LocalEngine(simulator.settings().threads())) {
            return simulate(simulator, engine, scenario, err, showProgress);
        }
    }

    /** Simulates on {@code engine} with a progress bar on {@code err} when {@code showProgress}. */
    SimulatedChannel simulate(ParticleSimulator simulator, Engine engine, Scenario scenario, PrintWriter err,
            boolean showProgress) {
        SimulateCommand.ProgressBar bar = showProgress ? new SimulateCommand.ProgressBar(err) : null;
        SimulatedChannel channel = simulator.simulate(scenario, engine, bar == null ? SimulationProgress.NONE : bar,
                cancelled::get);
        if (bar != null) {
            bar.finish();
        }
        return channel;
    }

    @Override
    public void close() {
        reported.countDown();
        try {
            Runtime.getRuntime().removeShutdownHook(hook);
        } catch (IllegalStateException shuttingDown) {
            // the JVM is already stopping: the hook is running and waits for the report above
        }
    }
}
