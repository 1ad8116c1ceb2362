package dev.nanoplan.tolerance;

import dev.nanoplan.engine.Engine;
import dev.nanoplan.engine.EngineProgress;
import dev.nanoplan.engine.LocalEngine;
import dev.nanoplan.engine.UnitResults;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.atomic.AtomicBoolean;
import java.util.function.IntConsumer;

/**
 * Runs a tolerance study: samples 0..n−1 as work units ({@link ToleranceSamples}) on an engine (by
 * default the local thread pool, {@link LocalEngine}), combined in index order, so the result does not
 * depend on the engine or the thread count.
 * {@link #cancel()} (e.g. from Ctrl-C) stops handing out indices; the result then covers the samples
 * 0..m−1 that all finished and is marked partial. Guard bands of the weak links follow, one work unit per
 * weak link ({@link GuardBands}) on the same engine, over the first {@code min(m, guardSamples)} samples
 * (skipped after a cancel; a cancel during them leaves the unfinished ones null).
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
        try (LocalEngine engine = new LocalEngine(threads)) {
            return run(engine, n, progress);
        }
    }

    /**
     * Runs {@code n} samples as work units ({@link ToleranceSamples}) on {@code engine}: the same result as
     * {@link #run(int, IntConsumer)} whatever the engine (samples are added in index order), guard bands
     * computed here afterwards.
     *
     * @param progress called with the number of finished samples
     * @throws IllegalStateException if no sample finished
     * @throws IllegalArgumentException as {@link ToleranceStudy#sample}
     */
    public ToleranceResult run(Engine engine, int n, IntConsumer progress) {
        return run(engine, n, progress, EngineProgress.NONE);
    }

    /**
     * As {@link #run(Engine, int, IntConsumer)}, with the guard bands' progress (weak links done of all)
     * told to {@code guardProgress}.
     */
    public ToleranceResult run(Engine engine, int n, IntConsumer progress, EngineProgress guardProgress) {
        ToleranceSamples units = new ToleranceSamples(study, n);
        UnitResults<ToleranceSample> results = engine.run(units, (done, total) -> progress.accept((int) done),
                cancelled::get);
        ToleranceSummary summary = units.summary(results);
        ToleranceResult r = summary.result(summary.size() < n);
        if (guardSamples == 0 || cancelled.get()) {
            return r;
        }
        return withGuardBands(engine, units, r, Math.min(guardSamples, summary.size()), guardProgress);
    }

    private ToleranceResult withGuardBands(Engine engine, ToleranceSamples samples, ToleranceResult r, int count,
            EngineProgress progress) {
        int[] weak = r.weakLinks().stream().mapToInt(Integer::intValue).toArray();
        UnitResults<GuardBands.Band> bands = engine.run(new GuardBands(samples, weak, count), progress,
                cancelled::get);
        List<ToleranceResult.LinkYield> links = new ArrayList<>(r.links());
        for (int k = 0; k < weak.length; k++) {
            if (bands.get(k) != null) {
                links.set(weak[k], links.get(weak[k]).withGuardBand(bands.get(k).moleculesPerSymbol()));
            }
        }
        return new ToleranceResult(r.samples(), r.seed(), r.sampler(), r.thresholds(), r.redraws(), r.partial(),
                r.layoutYield(), r.layoutInterval(), links, r.demands(), r.weakLinks(), r.driversMethod());
    }
}
