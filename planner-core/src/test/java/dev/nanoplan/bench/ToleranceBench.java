package dev.nanoplan.bench;

import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.ScenarioReader;
import dev.nanoplan.tolerance.Sampler;
import dev.nanoplan.tolerance.Thresholds;
import dev.nanoplan.tolerance.ToleranceResult;
import dev.nanoplan.tolerance.ToleranceRunner;
import dev.nanoplan.tolerance.ToleranceStudy;
import java.nio.file.Path;

/**
 * Wall time of a tolerance study (issue 15: the culture tank at 1,000 samples within 60 s on 2 cores):
 * the nominal plan, the samples on 2 threads, then the guard bands of the weak links. A single shot on
 * a shared machine: read it with the load printed.
 * {@code java -cp target/test-classes:target/classes:<deps> dev.nanoplan.bench.ToleranceBench
 * [scenario.json [samples [guardSamples]]]} (default: scenarios/culture-tank.json, 1000, 32).
 */
public final class ToleranceBench {

    private ToleranceBench() {
    }

    public static void main(String[] args) throws Exception {
        String file = args.length > 0 ? args[0] : "scenarios/culture-tank.json";
        int n = args.length > 1 ? Integer.parseInt(args[1]) : 1000;
        int guard = args.length > 2 ? Integer.parseInt(args[2]) : 32;
        Scenario s = ScenarioReader.strict().read(Path.of(file));
        long t0 = System.nanoTime();
        ToleranceStudy study = new ToleranceStudy(s, Sampler.SOBOL, 1, Thresholds.DESIGN);
        long t1 = System.nanoTime();
        ToleranceResult r = new ToleranceRunner(study, 2, 0).run(n, k -> { });
        long t2 = System.nanoTime();
        ToleranceResult g = guard == 0 ? r : new ToleranceRunner(study, 2, guard).run(Math.min(n, guard), k -> { });
        long t3 = System.nanoTime();
        System.out.printf("%s: nominal plan %.2f s, %d samples %.2f s (%.1f ms/sample), guard bands of %d weak links"
                + " on %d samples %.2f s; layout yield %.3f; load %s%n", file, (t1 - t0) / 1e9, n, (t2 - t1) / 1e9,
                (t2 - t1) / 1e6 / n, g.weakLinks().size(), guard, (t3 - t2) / 1e9, r.layoutYield(),
                java.lang.management.ManagementFactory.getOperatingSystemMXBean().getSystemLoadAverage());
        for (ToleranceResult.LinkYield l : g.links()) {
            System.out.println("  " + l.from() + " -> " + l.to() + " yield " + l.yield() + " guard "
                    + l.guardBandMoleculesPerSymbol() + " drivers " + l.drivers());
        }
    }
}
