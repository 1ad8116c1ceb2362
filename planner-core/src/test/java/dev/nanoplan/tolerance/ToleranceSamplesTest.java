package dev.nanoplan.tolerance;

import static org.assertj.core.api.Assertions.assertThat;

import dev.nanoplan.engine.LocalEngine;
import dev.nanoplan.engine.UnitResults;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.ScenarioReader;
import java.io.ByteArrayInputStream;
import java.io.ByteArrayOutputStream;
import java.io.ObjectInputStream;
import java.io.ObjectOutputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;

class ToleranceSamplesTest {

    private static Scenario cultureTank() throws Exception {
        Path dir = Path.of("").toAbsolutePath();
        while (!Files.isDirectory(dir.resolve("scenarios"))) {
            dir = dir.getParent();
        }
        return ScenarioReader.strict().read(dir.resolve("scenarios/culture-tank.json"));
    }

    @Test
    void samplesOnTheEngineGiveTheRunnersYields() throws Exception {
        ToleranceStudy study = new ToleranceStudy(cultureTank(), Sampler.SOBOL, 3, Thresholds.DESIGN);
        ToleranceSamples units = new ToleranceSamples(study, 24);
        UnitResults<ToleranceSample> got = new LocalEngine(2).run(units);
        // oracle: the same samples drawn one after another in index order on this thread, no engine
        ToleranceSummary sequential = new ToleranceSummary(study);
        for (int i = 0; i < 24; i++) {
            sequential.add(study.sample(i));
        }
        ToleranceResult expected = sequential.result(false);
        assertThat(units.summary(got).result(false)).isEqualTo(expected);
    }

    @Test
    void theRunnerOnAnEngineGivesTheRunnersOwnResultWithGuardBands() throws Exception {
        ToleranceStudy study = new ToleranceStudy(cultureTank(), Sampler.SOBOL, 4, Thresholds.DESIGN);
        // oracle: the runner on a single thread, 2 guard samples; the engine run uses 3 threads
        ToleranceResult expected = new ToleranceRunner(study, 1, 2).run(16, k -> { });
        try (LocalEngine engine = new LocalEngine(3)) {
            assertThat(new ToleranceRunner(study, 3, 2).run(engine, 16, k -> { })).isEqualTo(expected);
        }
    }

    @Test
    void aCopyThatTravelledToAnotherJvmDrawsTheSameSamples() throws Exception {
        ToleranceStudy study = new ToleranceStudy(cultureTank(), Sampler.RANDOM, 8, Thresholds.RECALIBRATED);
        ToleranceSamples units = new ToleranceSamples(study, 6);
        ByteArrayOutputStream buf = new ByteArrayOutputStream();
        try (ObjectOutputStream out = new ObjectOutputStream(buf)) {
            out.writeObject(units);
        }
        ToleranceSamples copy;
        try (ObjectInputStream in = new ObjectInputStream(new ByteArrayInputStream(buf.toByteArray()))) {
            copy = (ToleranceSamples) in.readObject();
        }
        // the copy rebuilds its study from the scenario file text: every sample equals the original's
        for (int i = 0; i < 6; i++) {
            assertThat(copy.compute(i, () -> false)).isEqualTo(study.sample(i));
        }
    }
}
