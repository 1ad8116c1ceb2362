package dev.nanoplan.engine;

import java.io.Serializable;
import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.atomic.AtomicBoolean;
import java.util.concurrent.atomic.AtomicInteger;
import java.util.concurrent.atomic.AtomicLong;
import java.util.function.BooleanSupplier;

/**
 * The default engine: a fixed pool of threads in this process takes the units in index order (each
 * thread the next unit not yet taken), so every thread sees increasing indices. Results land in their
 * unit's slot, so the combined result does not depend on the number of threads.
 *
 * <p>Cost: the units' own cost divided by the threads, plus one task hand-off per unit. A unit that
 * throws stops the batch: no new unit starts and the first exception is rethrown.
 */
public final class LocalEngine implements Engine {

    private final int threads;

    /** @param threads worker threads, ≥ 1 */
    public LocalEngine(int threads) {
        if (threads < 1) {
            throw new IllegalArgumentException("threads: must be >= 1, got " + threads);
        }
        this.threads = threads;
    }

    /** One thread per available processor. */
    public static LocalEngine ofProcessors() {
        return new LocalEngine(Runtime.getRuntime().availableProcessors());
    }

    /** The number of worker threads. */
    public int threads() {
        return threads;
    }

    @Override
    public String name() {
        return "local";
    }

    @Override
    public <R extends Serializable> UnitResults<R> run(WorkUnits<R> units, EngineProgress progress,
            BooleanSupplier cancelled) {
        int n = units.count();
        List<R> results = new ArrayList<>(Collections.nCopies(n, (R) null));
        long total = 0;
        for (int i = 0; i < n; i++) {
            total += units.work(i);
        }
        long workTotal = total;
        AtomicInteger next = new AtomicInteger();
        AtomicLong done = new AtomicLong();
        AtomicBoolean stop = new AtomicBoolean();
        BooleanSupplier halt = () -> stop.get() || cancelled.getAsBoolean();
        int workers = Math.max(1, Math.min(threads, n));
        ExecutorService pool = Executors.newFixedThreadPool(workers, r -> {
            Thread t = new Thread(r, "nanoplan-engine");
            t.setDaemon(true);
            return t;
        });
        try {
            List<Future<?>> futures = new ArrayList<>();
            for (int w = 0; w < workers; w++) {
                futures.add(pool.submit(() -> {
                    int i;
                    while (!halt.getAsBoolean() && (i = next.getAndIncrement()) < n) {
                        R r;
                        try {
                            r = units.compute(i, halt);
                        } catch (RuntimeException | Error e) {
                            stop.set(true);
                            throw e;
                        }
                        if (r == null) {
                            stop.set(true);
                            return;
                        }
                        synchronized (results) {
                            results.set(i, r);
                        }
                        progress.update(done.addAndGet(units.work(i)), workTotal);
                    }
                }));
            }
            for (Future<?> f : futures) {
                try {
                    f.get();
                } catch (ExecutionException e) {
                    Throwable c = e.getCause();
                    if (c instanceof RuntimeException re) {
                        throw re;
                    }
                    if (c instanceof Error err) {
                        throw err;
                    }
                    throw new IllegalStateException("work unit failed", c);
                } catch (InterruptedException e) {
                    Thread.currentThread().interrupt();
                    stop.set(true);
                    break;
                }
            }
        } finally {
            pool.shutdownNow();
        }
        synchronized (results) {
            return new UnitResults<>(results);
        }
    }
}
