package dev.nanoplan.bench;

import com.sun.management.OperatingSystemMXBean;
import dev.nanoplan.plan.NetworkPlanner;
import dev.nanoplan.plan.PlanOptions;
import dev.nanoplan.plan.SlotAssignment;
import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.Scenario;
import java.lang.management.ManagementFactory;
import java.util.LinkedHashMap;
import java.util.Map;
import java.util.function.Supplier;

/**
 * Issue 13's speed targets on a generated swarm ({@link BenchSwarms}, seed 1): {@code slots} (target ≤ 2 min
 * on 2 cores for 1,000 nodes) and the plan with joint against independent budgets (target: joint adds
 * ≤ 30 % to the plan time). Single shots on a shared machine: each line prints wall and process CPU time and
 * the load average. The independent plan runs twice (first to warm the JIT) and the joint plan is compared
 * with the second.
 * {@code java -Xmx2g -cp target/test-classes:target/classes:<deps> dev.nanoplan.bench.SlotsBench [nodes
 * [slots|budgets|reuse|both]]} (default 1000 both; {@code reuse}: the budgets under {@link #reuse}).
 */
public final class SlotsBench {

    private SlotsBench() {
    }

    public static void main(String[] args) {
        int n = args.length > 0 ? Integer.parseInt(args[0]) : 1000;
        String what = args.length > 1 ? args[1] : "both";
        Scenario s = what.equals("reuse") ? reuse(BenchSwarms.swarm(n, 1)) : BenchSwarms.swarm(n, 1);
        if (what.equals("reuse")) {
            // result size = feasible budgets; the first plan warms the JIT
            timed(n, "plan, independent budgets (reuse slots, JIT warm-up)", () -> feasible(s, false));
            double independent = timed(n, "plan, independent budgets (reuse slots)", () -> feasible(s, false));
            double joint = timed(n, "plan, joint budgets (reuse slots)", () -> feasible(s, true));
            System.out.printf("joint / independent plan time: %.2f%n", joint / independent);
            return;
        }
        if (!what.equals("slots")) {
            timed(n, "plan, independent budgets (JIT warm-up)",
                    () -> NetworkPlanner.plan(s, PlanOptions.DEFAULT.withJointBudgets(false)).budgets().size());
            double independent = timed(n, "plan, independent budgets",
                    () -> NetworkPlanner.plan(s, PlanOptions.DEFAULT.withJointBudgets(false)).budgets().size());
            double joint = timed(n, "plan, joint budgets",
                    () -> NetworkPlanner.plan(s, PlanOptions.DEFAULT.withJointBudgets(true)).budgets().size());
            System.out.printf("joint / independent plan time: %.2f%n", joint / independent);
        }
        if (what.equals("slots") || what.equals("both")) {
            timed(n, "slots (60 what-if plans at most)", () -> {
                SlotAssignment.Result r = new SlotAssignment(PlanOptions.DEFAULT, 0, 60).assign(s);
                System.out.printf("  frame %d, %d conflict edges, %d what-if plans%n", r.frameSlots(),
                        r.conflictEdges(), r.evaluations());
                return r.evaluations();
            });
        }
    }

    /**
     * The swarm under {@code schedule: slots} with a hand-made reuse plan (invented for this bench): in every
     * cell the five A sensors of a relay take slots 0–4, the two B sensors slots 0 and 1 and the four relays
     * slots 2–5, so that neighbours of a cell never share a slot while distant cells reuse them. Most joint
     * budgets are feasible here, unlike all-active, so the joint plan does its whole exact stage.
     */
    static Scenario reuse(Scenario s) {
        Map<String, Integer> slots = new LinkedHashMap<>();
        for (Node node : s.nodes()) {
            if (!node.role().emits()) {
                continue;
            }
            String[] part = node.id().substring(1).split("_");
            int last = Integer.parseInt(part[part.length - 1]);
            slots.put(node.id(), node.id().startsWith("r") ? 2 + last : last);
        }
        return new Scenario(s.name() + ", reuse slots", s.volume(), s.medium(), s.species(),
                s.signalling().withSlots(0, slots), s.nodes(), s.demands(), s.targets(), s.candidateSpecies(),
                s.tolerances());
    }

    private static int feasible(Scenario s, boolean joint) {
        return (int) NetworkPlanner.plan(s, PlanOptions.DEFAULT.withJointBudgets(joint)).budgets().stream()
                .filter(b -> b.feasible() && b.moleculesPerSymbolNeeded() > 0).count();
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
