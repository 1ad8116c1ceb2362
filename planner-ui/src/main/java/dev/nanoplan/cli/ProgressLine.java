package dev.nanoplan.cli;

import java.io.PrintWriter;
import java.util.Locale;
import java.util.function.DoubleConsumer;
import java.util.function.LongSupplier;

/**
 * Progress of long work on stderr, with the time left: silent for the first {@value #QUIET_MS} ms (short
 * plans print nothing), then one line redrawn in place on a terminal, or a new line every
 * {@value #PIPE_EVERY_MS} ms when stderr is a file or pipe. The time left is the elapsed time scaled by
 * the fraction still to do (a linear extrapolation: the planner's fractions are close to proportional to
 * work, so this is an estimate, stated as "about"). Thread-safe: the planner reports from worker threads.
 */
final class ProgressLine implements DoubleConsumer, AutoCloseable {

    /** Work shorter than this prints no progress. */
    static final long QUIET_MS = 2000;
    /** Interval between lines when stderr is not a terminal. */
    static final long PIPE_EVERY_MS = 5000;
    private static final long TERMINAL_EVERY_MS = 250;

    private final PrintWriter err;
    private final String label;
    private final boolean terminal;
    private final LongSupplier clockMs;
    private final long startMs;
    private long lastMs = Long.MIN_VALUE / 2;
    private boolean shown;
    private double last;
    private Thread heartbeat;

    ProgressLine(PrintWriter err, String label, boolean terminal, LongSupplier clockMs) {
        this.err = err;
        this.label = label;
        this.terminal = terminal;
        this.clockMs = clockMs;
        this.startMs = clockMs.getAsLong();
    }

    /** On the real clock, redrawn in place when a console is attached. */
    static ProgressLine of(PrintWriter err, String label) {
        ProgressLine p = new ProgressLine(err, label, System.console() != null, System::currentTimeMillis);
        // a heartbeat redraws the line while one step of the work is long, so that the elapsed time shows
        Thread t = new Thread(() -> {
            try {
                while (!Thread.currentThread().isInterrupted()) {
                    Thread.sleep(1000);
                    p.accept(p.last());
                }
            } catch (InterruptedException stop) {
                Thread.currentThread().interrupt();
            }
        }, "nanoplan-progress");
        t.setDaemon(true);
        p.heartbeat = t;
        t.start();
        return p;
    }

    private synchronized double last() {
        return last;
    }

    @Override
    public synchronized void accept(double fraction) {
        last = Math.max(last, fraction);
        fraction = last;
        long now = clockMs.getAsLong();
        long elapsed = now - startMs;
        if (elapsed < QUIET_MS || now - lastMs < (terminal ? TERMINAL_EVERY_MS : PIPE_EVERY_MS)) {
            return;
        }
        lastMs = now;
        double f = Math.max(0, Math.min(1, fraction));
        String left = f > 0.01 ? "about " + seconds(elapsed * (1 - f) / f) + " left" : "estimating the time left";
        String line = String.format(Locale.ROOT, "%s: %3.0f%% (%s elapsed, %s)", label, 100 * f, seconds(elapsed), left);
        if (terminal) {
            err.print("\r" + line + "   ");
            shown = true;
        } else {
            err.println(line);
        }
        err.flush();
        shown = true;
    }

    /** Ends the in-place line (if one was drawn) so that later output starts on a fresh line. */
    @Override
    public void close() {
        if (heartbeat != null) {
            heartbeat.interrupt();
        }
        finish();
    }

    private synchronized void finish() {
        if (shown && terminal) {
            err.println();
            err.flush();
        }
    }

    /** "42 s", "3 min 20 s". */
    static String seconds(double ms) {
        long s = Math.round(ms / 1000);
        return s < 60 ? s + " s" : (s / 60) + " min " + (s % 60) + " s";
    }
}
