package dev.nanoplan.bench;

import com.sun.management.OperatingSystemMXBean;
import dev.nanoplan.plan.NetworkPlanner;
import dev.nanoplan.plan.PlanOptions;
import dev.nanoplan.plan.SlotAssignment;
import dev.nanoplan.scenario.Scenario;
import java.lang.management.ManagementFactory;
import java.util.function.Supplier;

/**
 * Issue 13's speed targets on a generated swarm ({@link BenchSwarms}, seed 1): {@code slots} (target ≤ 2 min
 * on 2 cores for 1,000 nodes) and the plan with joint against independent budgets (target: joint adds
 * ≤ 30 % to the plan time). Single shots on a shared machine: each line prints wall and process CPU time and
 * the load average. The independent plan runs twice (first to warm the JIT) and the joint plan is compared
 * with the second.
 * {@code java -Xmx2g -cp target/test-classes:target/classes:<deps> dev.nanoplan.bench.SlotsBench [nodes
 * [slots|budgets|both]]} (default 1000 both).
 */
public final class SlotsBench {

    private SlotsBench() {
    }

    public static void main(String[] args) {
        int n = args.length > 0 ? Integer.parseInt(args[0]) : 1000;
        String what = args.length > 1 ? args[1] : "both";
        Scenario s = BenchSwarms.swarm(n, 1);
        if (!what.equals("slots")) {
            timed(n, "plan, independent budgets (JIT warm-up)",
                    () -> NetworkPlanner.plan(s, PlanOptions.DEFAULT.withJointBudgets(false)).budgets().size());
            double independent = timed(n, "plan, independent budgets",
                    () -> NetworkPlanner.plan(s, PlanOptions.DEFAULT.withJointBudgets(false)).budgets().size());
            double joint = timed(n, "plan, joint budgets",
                    () -> NetworkPlanner.plan(s, PlanOptions.DEFAULT.withJointBudgets(true)).budgets().size());
            System.out.printf("joint / independent plan time: %.2f%n", joint / independent);
        }
        if (!what.equals("budgets")) {
            timed(n, "slots (60 what-if plans at most)", () -> {
                SlotAssignment.Result r = new SlotAssignment(PlanOptions.DEFAULT, 0, 60).assign(s);
                System.out.printf("  frame %d, %d conflict edges, %d what-if plans%n", r.frameSlots(),
                        r.conflictEdges(), r.evaluations());
                return r.evaluations();
            });
        }
    }

    private static double timed(int nodes, String label, Supplier<Integer> work) {
        OperatingSystemMXBean os = ManagementFactory.getPlatformMXBean(OperatingSystemMXBean.class);
        long c0 = os.getProcessCpuTime();
        long w0 = System.nanoTime();
        int size = work.get();
        double wall = (System.nanoTime() - w0) / 1e9;
        System.out.printf("%s (%d nodes): %.1f s wall, %.1f s process CPU, load %.1f (result size %d)%n", label,
                nodes, wall, (os.getProcessCpuTime() - c0) / 1e9,
                os.getSystemLoadAverage(), size);
        return wall;
    }
}
