package dev.nanoplan.tolerance;

import dev.nanoplan.engine.UnitResults;
import dev.nanoplan.engine.WorkUnits;
import dev.nanoplan.scenario.ScenarioException;
import dev.nanoplan.scenario.ScenarioReader;
import dev.nanoplan.scenario.ScenarioWriter;
import java.util.function.BooleanSupplier;

/**
 * A tolerance study's samples as work units for any engine: unit i is {@link ToleranceStudy#sample}(i),
 * a pure function of the nominal scenario (kept as its file text so it travels to executors), the
 * sampler, the seed and the thresholds. The study (nominal plan, link inputs) is rebuilt once per
 * executor JVM from those inputs on first use.
 *
 * <p>{@link #summary} adds the samples in index order up to the first unfinished one, the same
 * combination as {@link ToleranceRunner}, so the yields do not depend on the engine.
 */
public final class ToleranceSamples implements WorkUnits<ToleranceSample> {

    private static final long serialVersionUID = 1L;

    private final String scenarioJson;
    private final Sampler sampler;
    private final long seed;
    private final Thresholds thresholds;
    private final int samples;
    private transient volatile ToleranceStudy study;

    /**
     * @param study the study (used as is in this process)
     * @param samples N ≥ 0
     */
    public ToleranceSamples(ToleranceStudy study, int samples) {
        if (samples < 0) {
            throw new IllegalArgumentException("samples: must be >= 0, got " + samples);
        }
        this.scenarioJson = ScenarioWriter.toJson(study.nominal());
        this.sampler = study.sampler();
        this.seed = study.seed();
        this.thresholds = study.thresholds();
        this.samples = samples;
        this.study = study;
    }

    @Override
    public int count() {
        return samples;
    }

    @Override
    public ToleranceSample compute(int index, BooleanSupplier cancelled) {
        return study().sample(index);
    }

    /** The study, rebuilt from the scenario text after travelling to another JVM. */
    public ToleranceStudy study() {
        ToleranceStudy s = study;
        if (s == null) {
            synchronized (this) {
                if (study == null) {
                    try {
                        study = new ToleranceStudy(ScenarioReader.lenient().parse(scenarioJson).scenario(), sampler,
                                seed, thresholds);
                    } catch (ScenarioException e) {
                        throw new IllegalStateException("scenario: its own file text does not read back: "
                                + e.getMessage(), e);
                    }
                }
                s = study;
            }
        }
        return s;
    }

    /** The finished samples added in index order up to the first unfinished one. */
    public ToleranceSummary summary(UnitResults<ToleranceSample> results) {
        ToleranceSummary summary = new ToleranceSummary(study());
        for (int i = 0; i < results.size() && results.get(i) != null; i++) {
            summary.add(results.get(i));
        }
        return summary;
    }
}
