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
import java.util.concurrent.atomic.AtomicInteger;

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
        return simulate(simulator, scenario, err, showProgress, false);
    }

    /**
     * Simulates with a progress bar on {@code err} when {@code showProgress}, else with one progress line
     * per quarter of the molecules when {@code showLines} (for logs, where a redrawn bar is noise).
     */
    SimulatedChannel simulate(ParticleSimulator simulator, Scenario scenario, PrintWriter err, boolean showProgress,
            boolean showLines) {
        try (LocalEngine engine = new LocalEngine(simulator.settings().threads())) {
            return simulate(simulator, engine, scenario, err, showProgress, showLines);
        }
    }

    /** Simulates on {@code engine}, with a progress bar or quarter lines on {@code err} as above. */
    SimulatedChannel simulate(ParticleSimulator simulator, Engine engine, Scenario scenario, PrintWriter err,
            boolean showProgress, boolean showLines) {
        SimulateCommand.ProgressBar bar = showProgress ? new SimulateCommand.ProgressBar(err) : null;
        SimulationProgress lines = showLines ? quarterLines(err) : SimulationProgress.NONE;
        SimulatedChannel channel = simulator.simulate(scenario, engine, bar == null ? lines : bar, cancelled::get);
        if (bar != null) {
            bar.finish();
        }
        return channel;
    }

    /** "simulating: 25 % (5000 of 20000 molecules)" at each new quarter, from worker threads. */
    private static SimulationProgress quarterLines(PrintWriter err) {
        AtomicInteger printed = new AtomicInteger();
        return (done, total) -> {
            int quarter = (int) (4 * done / Math.max(1, total));
            int last = printed.get();
            if (quarter > last && printed.compareAndSet(last, quarter)) {
                synchronized (err) {
                    err.println("simulating: " + 25 * quarter + " % (" + done + " of " + total + " molecules)");
                    err.flush();
                }
            }
        };
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
