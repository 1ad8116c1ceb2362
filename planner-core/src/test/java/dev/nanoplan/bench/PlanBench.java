package dev.nanoplan.bench;

import dev.nanoplan.plan.NetworkPlanner;
import dev.nanoplan.plan.Plan;
import dev.nanoplan.plan.PlanOptions;
import dev.nanoplan.scenario.Scenario;
import java.util.concurrent.TimeUnit;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Param;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;

/**
 * Whole-plan timings on generated swarms ({@link BenchSwarms}, seed 1). JMH, e.g.
 * {@code java -Xmx2g -cp target/test-classes:target/classes:<deps> org.openjdk.jmh.Main PlanBench -f 1 -wi 1 -i 3};
 * the 10,000-node single shot: {@code java -Xmx2g -Xlog:gc -cp ... dev.nanoplan.bench.PlanBench 10000} (prints wall
 * time, process CPU time, the heap pools' peak usage and the load average; the machine is shared, so read wall
 * time together with the load).
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.SingleShotTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
public class PlanBench {

    @Param({"1000"})
    public int nodes;

    private Scenario scenario;

    @Setup
    public void setup() {
        scenario = BenchSwarms.swarm(nodes, 1);
    }

    @Benchmark
    public Plan plan() {
        return NetworkPlanner.plan(scenario, PlanOptions.DEFAULT);
    }

    /**
     * Single run: args[0] = nodes (default 10,000); prints wall time, links, routes and heap used.
     * Optional args[1] = number of earlier plans of the same swarm in the same JVM, each printed
     * with its wall and process CPU time (to tell JIT warm-up from the planner's own work; the
     * figures on the last line are those of the last plan).
     */
    public static void main(String[] args) {
        int n = args.length > 0 ? Integer.parseInt(args[0]) : 10_000;
        int warmups = args.length > 1 ? Integer.parseInt(args[1]) : 0;
        Scenario s = BenchSwarms.swarm(n, 1);
        com.sun.management.OperatingSystemMXBean os = java.lang.management.ManagementFactory
                .getPlatformMXBean(com.sun.management.OperatingSystemMXBean.class);
        for (int i = 0; i < warmups; i++) {
            long c0 = os.getProcessCpuTime();
            long w0 = System.nanoTime();
            NetworkPlanner.plan(s, PlanOptions.DEFAULT);
            System.out.printf("earlier plan %d: time=%.2f s processCpu=%.1f s%n", i + 1, (System.nanoTime() - w0) / 1e9,
                    (os.getProcessCpuTime() - c0) / 1e9);
        }
        long cpu0 = warmups > 0 ? os.getProcessCpuTime() : 0;
        long t0 = System.nanoTime();
        double[] last = {0};
        Plan p = NetworkPlanner.plan(s, PlanOptions.DEFAULT.withProgress(f -> {
            synchronized (last) {
                if (f >= last[0] + 0.1) {
                    last[0] = f;
                    System.err.printf("progress %.0f%% at %.1f s%n", 100 * f, (System.nanoTime() - t0) / 1e9);
                }
            }
        }));
        long t1 = System.nanoTime();
        Runtime rt = Runtime.getRuntime();
        long reachable = p.routes().stream().filter(r -> r.reachable()).count();
        // peak heap: sum over the heap pools of their peak usage since start (includes garbage not yet collected)
        long peak = 0;
        for (java.lang.management.MemoryPoolMXBean pool : java.lang.management.ManagementFactory.getMemoryPoolMXBeans()) {
            if (pool.getType() == java.lang.management.MemoryType.HEAP) {
                peak += pool.getPeakUsage().getUsed();
            }
        }
        double cpuS = (os.getProcessCpuTime() - cpu0) / 1e9;
        System.out.printf("nodes=%d time=%.2f s processCpu=%.1f s links=%d routes=%d reachable=%d budgets=%d heapUsed=%d MB"
                + " peakHeapPools=%d MB max=%d MB load=%.2f%n",
                n, (t1 - t0) / 1e9, cpuS, p.links().size(), p.routes().size(), reachable, p.budgets().size(),
                (rt.totalMemory() - rt.freeMemory()) >> 20, peak >> 20, rt.maxMemory() >> 20,
                java.lang.management.ManagementFactory.getOperatingSystemMXBean().getSystemLoadAverage());
    }
}
