package dev.nanoplan.bench;

import dev.nanoplan.plan.LinkReport;
import dev.nanoplan.plan.NetworkPlanner;
import dev.nanoplan.plan.Plan;
import dev.nanoplan.plan.PlanOptions;
import dev.nanoplan.plan.PreviewPlanner;
import dev.nanoplan.scenario.Scenario;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.concurrent.TimeUnit;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Param;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.Warmup;

/**
 * The preview planner alone on generated swarms ({@link BenchSwarms}, seed 42). JMH:
 * {@code java -cp target/test-classes:target/classes:<deps> org.openjdk.jmh.Main PreviewBench};
 * or {@code java -cp ... dev.nanoplan.bench.PreviewBench [nodes...]} for a plain timing loop (median of
 * 200 runs after 200 warm-up runs up to 200 nodes, else 20 and 20; wall time, so read it with the load) plus, with {@code --compare}, the link capacities of the preview against the
 * exact plan (max, median and 95th percentile of the absolute difference in bits, over the links both
 * plans report, and the links only one of them reports).
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Fork(1)
@Warmup(iterations = 3, time = 1)
@Measurement(iterations = 5, time = 1)
public class PreviewBench {

    @Param({"100", "1000"})
    public int nodes;

    private Scenario scenario;

    @Setup
    public void setup() {
        scenario = BenchSwarms.swarm(nodes, 42);
    }

    @Benchmark
    public Plan preview() {
        return PreviewPlanner.plan(scenario, PlanOptions.DEFAULT);
    }

    public static void main(String[] args) {
        boolean compare = Arrays.asList(args).contains("--compare");
        List<Integer> sizes = new ArrayList<>();
        for (String a : args) {
            if (!a.startsWith("--")) {
                sizes.add(Integer.parseInt(a));
            }
        }
        if (sizes.isEmpty()) {
            sizes = List.of(100, 1000);
        }
        for (int n : sizes) {
            Scenario s = BenchSwarms.swarm(n, 42);
            Plan p = null;
            int reps = n <= 200 ? 200 : 20;
            for (int i = 0; i < reps; i++) {
                p = PreviewPlanner.plan(s, PlanOptions.DEFAULT);
            }
            long[] t = new long[reps];
            for (int i = 0; i < t.length; i++) {
                long t0 = System.nanoTime();
                p = PreviewPlanner.plan(s, PlanOptions.DEFAULT);
                t[i] = System.nanoTime() - t0;
            }
            Arrays.sort(t);
            System.out.printf("preview nodes=%d links=%d routes reachable=%d median %.2f ms min %.2f ms max %.2f ms"
                    + " (load %.2f)%n", n, p.links().size(), p.routes().stream().filter(r -> r.reachable()).count(),
                    t[t.length / 2] / 1e6, t[0] / 1e6, t[t.length - 1] / 1e6,
                    java.lang.management.ManagementFactory.getOperatingSystemMXBean().getSystemLoadAverage());
            if (compare) {
                long t0 = System.nanoTime();
                Plan exact = NetworkPlanner.plan(s, PlanOptions.DEFAULT);
                System.out.printf("exact nodes=%d links=%d in %.0f ms%n", n, exact.links().size(),
                        (System.nanoTime() - t0) / 1e6);
                System.out.println(differences(p, exact));
            }
        }
    }

    /** One line: links compared, max / median / p95 absolute capacity difference, links only in one plan. */
    public static String differences(Plan preview, Plan exact) {
        Map<String, LinkReport> byPair = new HashMap<>();
        preview.links().forEach(l -> byPair.put(l.from() + "->" + l.to(), l));
        List<Double> d = new ArrayList<>();
        int onlyExact = 0;
        double worst = 0;
        String worstLink = "";
        for (LinkReport e : exact.links()) {
            LinkReport q = byPair.remove(e.from() + "->" + e.to());
            if (q == null) {
                onlyExact++;
                continue;
            }
            double diff = Math.abs(q.capacityBits() - e.capacityBits());
            d.add(diff);
            if (diff > worst) {
                worst = diff;
                worstLink = String.format("%s->%s exact %.3f preview %.3f", e.from(), e.to(), e.capacityBits(),
                        q.capacityBits());
            }
        }
        double[] a = d.stream().mapToDouble(Double::doubleValue).sorted().toArray();
        int sameRoutes = 0;
        for (int i = 0; i < exact.routes().size(); i++) {
            if (exact.routes().get(i).hops().equals(preview.routes().get(i).hops())) {
                sameRoutes++;
            }
        }
        return String.format("compared=%d max=%.4f bit median=%.5f bit p95=%.4f bit onlyExact=%d onlyPreview=%d "
                + "sameRoutes=%d/%d worst: %s", a.length, a.length == 0 ? 0 : a[a.length - 1],
                a.length == 0 ? 0 : a[a.length / 2], a.length == 0 ? 0 : a[(int) (0.95 * (a.length - 1))], onlyExact,
                byPair.size(), sameRoutes, exact.routes().size(), worstLink);
    }
}
