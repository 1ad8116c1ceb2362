package dev.nanoplan.spark;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import dev.nanoplan.design.SweepPath;
import dev.nanoplan.design.SweepPoint;
import dev.nanoplan.design.SweepPoints;
import dev.nanoplan.design.SweepResult;
import dev.nanoplan.engine.EngineUnavailableException;
import dev.nanoplan.engine.LocalEngine;
import dev.nanoplan.engine.UnitResults;
import dev.nanoplan.engine.WorkUnits;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.ScenarioReader;
import dev.nanoplan.sim.ParticleSimulator;
import dev.nanoplan.sim.SimulatedChannel;
import dev.nanoplan.sim.SimulationProgress;
import dev.nanoplan.sim.SimulationSettings;
import dev.nanoplan.tolerance.Sampler;
import dev.nanoplan.tolerance.Thresholds;
import dev.nanoplan.tolerance.ToleranceSample;
import dev.nanoplan.tolerance.ToleranceSamples;
import dev.nanoplan.tolerance.ToleranceStudy;
import java.io.IOException;
import java.net.ServerSocket;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.concurrent.atomic.AtomicLong;
import java.util.function.BooleanSupplier;
import org.apache.spark.SparkConf;
import org.apache.spark.api.java.JavaSparkContext;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

/** The Spark engine on {@code local[2]} against the local engine; one Spark context for the class. */
class SparkEngineTest {

    private static JavaSparkContext context;
    private static final List<String> NOTES = Collections.synchronizedList(new ArrayList<>());

    @BeforeAll
    static void startSpark() {
        context = new JavaSparkContext(new SparkConf().setMaster("local[2]").setAppName("nanoplan-test")
                .set("spark.ui.enabled", "false"));
    }

    @AfterAll
    static void stopSpark() {
        if (context != null) {
            context.stop();
        }
    }

    private static Scenario bundled(String name) throws Exception {
        Path dir = Path.of("").toAbsolutePath();
        while (!Files.isDirectory(dir.resolve("scenarios"))) {
            dir = dir.getParent();
        }
        return ScenarioReader.strict().read(dir.resolve("scenarios/" + name));
    }

    @Test
    void aSmallSimulationGivesTheLocalEnginesCountsExactly() throws Exception {
        Scenario s = bundled("relay-chain-relayed.json");
        // 9,000 molecules: 3 blocks per emitter, the last partial
        ParticleSimulator sim = new ParticleSimulator(SimulationSettings.of(9_000, 11).withThreads(2));
        SimulatedChannel local = sim.simulate(s, new LocalEngine(2), SimulationProgress.NONE, () -> false);
        AtomicLong lastDone = new AtomicLong();
        SimulatedChannel spark;
        try (SparkEngine engine = SparkEngine.over(context, NOTES::add)) {
            spark = sim.simulate(s, engine, (done, total) -> lastDone.set(done), () -> false);
        }
        // oracle: the local engine (a thread pool) on the same work units
        assertThat(spark).isEqualTo(local);
        assertThat(spark.complete()).isTrue();
        // progress reached every molecule of every emitter (molecules × emitters)
        assertThat(lastDone.get()).isEqualTo(9_000L * spark.emitterIds().size());
        assertThat(NOTES).anyMatch(n -> n.startsWith("spark: stage"));
    }

    @Test
    void aSmallToleranceStudyGivesTheLocalEnginesSamplesAndYields() throws Exception {
        ToleranceStudy study = new ToleranceStudy(bundled("culture-tank.json"), Sampler.SOBOL, 5, Thresholds.DESIGN);
        ToleranceSamples units = new ToleranceSamples(study, 32);
        UnitResults<ToleranceSample> local = new LocalEngine(2).run(units);
        UnitResults<ToleranceSample> spark;
        try (SparkEngine engine = SparkEngine.over(context, NOTES::add)) {
            spark = engine.run(units);
        }
        // oracle: the local engine on the same units, sample by sample, and the yields combined from them
        assertThat(spark.finished()).containsExactlyElementsOf(local.finished());
        assertThat(units.summary(spark).result(false)).isEqualTo(units.summary(local).result(false));
    }

    @Test
    void aSmallSweepGivesTheLocalEnginesPoints() throws Exception {
        Path dir = Path.of("").toAbsolutePath();
        while (!Files.isDirectory(dir.resolve("scenarios"))) {
            dir = dir.getParent();
        }
        SweepPoints units = new SweepPoints(Files.readString(dir.resolve("scenarios/relay-chain-relayed.json")),
                List.of(SweepPath.parse("signalling.symbol_time_s"), SweepPath.parse("nodes[relay1].molecules_per_symbol")),
                List.of(List.of(4.0, 6.0), List.of(10000.0, 30000.0)));
        UnitResults<SweepPoint> local = new LocalEngine(2).run(units);
        UnitResults<SweepPoint> spark;
        try (SparkEngine engine = SparkEngine.over(context, NOTES::add)) {
            spark = engine.run(units);
        }
        // oracle: the local engine on the same units, point by point, and the same Pareto marks
        assertThat(spark.complete()).isTrue();
        assertThat(spark.finished()).containsExactlyElementsOf(local.finished());
        List<String> fields = List.of("signalling.symbol_time_s", "nodes[relay1].molecules_per_symbol");
        assertThat(SweepResult.of(fields, spark.finished())).isEqualTo(SweepResult.of(fields, local.finished()));
    }

    @Test
    void resultsComeBackInUnitOrderAcrossPartitions() {
        // unit i returns i squared: the collected list must be 0, 1, 4, … whatever the partitions
        WorkUnits<Long> squares = new Squares(1000);
        UnitResults<Long> got;
        try (SparkEngine engine = SparkEngine.over(context, n -> { })) {
            got = engine.run(squares);
        }
        assertThat(got.complete()).isTrue();
        for (int i = 0; i < 1000; i++) {
            assertThat(got.get(i)).isEqualTo((long) i * i);
        }
    }

    @Test
    void aMasterThatDoesNotListenIsAOneLineError() throws IOException {
        int port;
        try (ServerSocket free = new ServerSocket(0)) {
            port = free.getLocalPort();
        }
        String url = "spark://127.0.0.1:" + port;
        assertThatThrownBy(() -> SparkEngine.checkReachable(url)).isInstanceOf(EngineUnavailableException.class)
                .hasMessageStartingWith("--master " + url + ": cannot reach the Spark master")
                .satisfies(e -> assertThat(e.getMessage()).doesNotContain("\n"));
    }

    /** Unit i → i². */
    record Squares(int count) implements WorkUnits<Long> {
        @Override
        public Long compute(int index, BooleanSupplier cancelled) {
            return (long) index * index;
        }
    }
}
