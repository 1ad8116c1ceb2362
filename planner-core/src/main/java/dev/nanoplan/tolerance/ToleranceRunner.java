package dev.nanoplan.tolerance;

import dev.nanoplan.engine.Engine;
import dev.nanoplan.engine.UnitResults;

import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.atomic.AtomicBoolean;
import java.util.concurrent.atomic.AtomicInteger;
import java.util.function.IntConsumer;

/**
 * The local engine of a tolerance study: runs samples 0..n−1 on a pool of threads, each thread taking
 * the next index, and combines them in index order, so the result does not depend on the thread count.
 * {@link #cancel()} (e.g. from Ctrl-C) stops handing out indices; the result then covers the samples
 * 0..m−1 that all finished and is marked partial. Guard bands of the weak links follow, over the first
 * {@code min(m, guardSamples)} samples (skipped after a cancel).
 */
public final class ToleranceRunner {

    private final ToleranceStudy study;
    private final int threads;
    private final int guardSamples;
    private final AtomicBoolean cancelled = new AtomicBoolean();

    /**
     * @param threads      worker threads, ≥ 1
     * @param guardSamples samples per guard-band step, ≥ 0 (0: no guard bands)
     */
    public ToleranceRunner(ToleranceStudy study, int threads, int guardSamples) {
        if (threads < 1 || guardSamples < 0) {
            throw new IllegalArgumentException("threads must be >= 1 and guardSamples >= 0");
        }
        this.study = study;
        this.threads = threads;
        this.guardSamples = guardSamples;
    }

    /** Stops the run after the samples in progress; the result is then partial. */
    public void cancel() {
        cancelled.set(true);
    }

    /** Whether {@link #cancel()} was called. */
    public boolean isCancelled() {
        return cancelled.get();
    }

    /**
     * Runs {@code n} samples.
     *
     * @param progress called with the number of finished samples (from worker threads)
     * @throws IllegalStateException if no sample finished
     * @throws IllegalArgumentException as {@link ToleranceStudy#sample}
     */
    public ToleranceResult run(int n, IntConsumer progress) {
        ToleranceSample[] done = new ToleranceSample[n];
        AtomicInteger next = new AtomicInteger();
        AtomicInteger finished = new AtomicInteger();
        ExecutorService pool = Executors.newFixedThreadPool(threads, r -> {
            Thread t = new Thread(r, "tolerance-sample");
            t.setDaemon(true);
            return t;
        });
        try {
            List<Future<?>> jobs = new ArrayList<>();
            for (int t = 0; t < threads; t++) {
                jobs.add(pool.submit(() -> {
                    int i;
                    while (!cancelled.get() && (i = next.getAndIncrement()) < n) {
                        done[i] = study.sample(i);
                        progress.accept(finished.incrementAndGet());
                    }
                }));
            }
            for (Future<?> f : jobs) {
                f.get();
            }
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            cancelled.set(true);
        } catch (ExecutionException e) {
            if (e.getCause() instanceof RuntimeException re) {
                throw re;
            }
            throw new IllegalStateException(e.getCause());
        } finally {
            pool.shutdownNow();
        }
        ToleranceSummary summary = new ToleranceSummary(study);
        for (int i = 0; i < n && done[i] != null; i++) {
            summary.add(done[i]);
        }
        boolean partial = summary.size() < n;
        ToleranceResult r = summary.result(partial);
        if (guardSamples == 0 || cancelled.get()) {
            return r;
        }
        return withGuardBands(r, Math.min(guardSamples, summary.size()));
    }

    /**
     * Runs {@code n} samples as work units ({@link ToleranceSamples}) on {@code engine}: the same result as
     * {@link #run(int, IntConsumer)} whatever the engine (samples are added in index order), guard bands
     * computed here afterwards.
     *
     * @param progress called with the number of finished samples
     * @throws IllegalArgumentException as {@link ToleranceStudy#sample}
     */
    public ToleranceResult run(Engine engine, int n, IntConsumer progress) {
        ToleranceSamples units = new ToleranceSamples(study, n);
        UnitResults<ToleranceSample> results = engine.run(units, (done, total) -> progress.accept((int) done),
                cancelled::get);
        ToleranceSummary summary = units.summary(results);
        if (summary.size() == 0 && n > 0) {
            throw new IllegalStateException("no sample finished");
        }
        ToleranceResult r = summary.result(summary.size() < n);
        if (guardSamples == 0 || cancelled.get()) {
            return r;
        }
        return withGuardBands(r, Math.min(guardSamples, summary.size()));
    }

    private ToleranceResult withGuardBands(ToleranceResult r, int samples) {
        List<ToleranceResult.LinkYield> links = new ArrayList<>(r.links());
        for (int l : r.weakLinks()) {
            if (cancelled.get()) {
                break;
            }
            links.set(l, links.get(l).withGuardBand(GuardBand.of(study, l, samples)));
        }
        return new ToleranceResult(r.samples(), r.seed(), r.sampler(), r.thresholds(), r.redraws(), r.partial(),
                r.layoutYield(), r.layoutInterval(), links, r.demands(), r.weakLinks(), r.driversMethod());
    }
}
