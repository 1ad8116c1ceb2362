package dev.nanoplan.spark.bench;

import dev.nanoplan.engine.Engine;
import dev.nanoplan.engine.LocalEngine;
import dev.nanoplan.engine.UnitResults;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.ScenarioReader;
import dev.nanoplan.spark.SparkEngine;
import dev.nanoplan.tolerance.Sampler;
import dev.nanoplan.tolerance.Thresholds;
import dev.nanoplan.tolerance.ToleranceSample;
import dev.nanoplan.tolerance.ToleranceSamples;
import dev.nanoplan.tolerance.ToleranceStudy;
import java.io.PrintStream;
import java.nio.file.Path;
import java.util.Locale;

/**
 * Throughput of the same tolerance study on the local engine and on Spark {@code local[2]} (a bench
 * main, not a test): {@code java -cp … dev.nanoplan.spark.bench.EngineThroughputBench SCENARIO N}.
 * Prints samples per second of each and whether the samples are identical.
 */
public final class EngineThroughputBench {

    private EngineThroughputBench() {
    }

    public static void main(String[] args) throws Exception {
        PrintStream out = System.out;
        Scenario s = ScenarioReader.strict().read(Path.of(args[0]));
        int n = Integer.parseInt(args[1]);
        ToleranceStudy study = new ToleranceStudy(s, Sampler.SOBOL, 1, Thresholds.DESIGN);
        ToleranceSamples units = new ToleranceSamples(study, n);
        UnitResults<ToleranceSample> local;
        long t0 = System.nanoTime();
        try (Engine e = new LocalEngine(2)) {
            local = e.run(units);
        }
        double localS = (System.nanoTime() - t0) / 1e9;
        UnitResults<ToleranceSample> spark;
        long t1 = System.nanoTime();
        try (Engine e = SparkEngine.start("local[2]", line -> { })) {
            long t2 = System.nanoTime();
            spark = e.run(units);
            double jobS = (System.nanoTime() - t2) / 1e9;
            out.printf(Locale.ROOT, "spark local[2] job only: %.1f s, %.1f samples/s%n", jobS, n / jobS);
        }
        double sparkS = (System.nanoTime() - t1) / 1e9;
        out.printf(Locale.ROOT, "local (2 threads): %d samples in %.1f s, %.1f samples/s, %.2f ms/sample-core%n", n,
                localS, n / localS, 2000 * localS / n);
        out.printf(Locale.ROOT, "spark local[2] incl. start/stop: %.1f s, %.1f samples/s, overhead %.1f %%%n", sparkS,
                n / sparkS, 100 * (sparkS / localS - 1));
        out.println("identical samples: " + spark.finished().equals(local.finished()));
    }
}
