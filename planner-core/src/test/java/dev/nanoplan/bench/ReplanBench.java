package dev.nanoplan.bench;

import dev.nanoplan.geometry.Vec3;
import dev.nanoplan.plan.IncrementalPlanner;
import dev.nanoplan.plan.NetworkPlanner;
import dev.nanoplan.plan.Plan;
import dev.nanoplan.plan.PlanOptions;
import dev.nanoplan.plan.PreviewPlanner;
import dev.nanoplan.plan.RouteReport;
import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.Role;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.ScenarioReader;
import dev.nanoplan.scenario.SwarmGenerator;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.simple.RandomSource;

/**
 * Re-plans per second after a one-node edit ({@link IncrementalPlanner}) against the full plan, run by
 * hand (not in CI):
 * {@code java -Xmx2g -cp planner-core/target/test-classes:<shaded jar or classes + deps>
 * dev.nanoplan.bench.ReplanBench LAYOUT MODE [FULL_RUNS] [EDITS]} with LAYOUT a scenario file or
 * {@code designed:N} ({@link SwarmGenerator#designed}, seed 1), MODE {@code exact} or {@code preview},
 * FULL_RUNS full plans (default 3) and EDITS re-plans (default 20); a fifth argument {@code compare}
 * also plans every edited layout in full (the fair comparison: edited layouts may cost more than the
 * original). Each edit moves one random
 * transmitter by up to 5 µm per axis (seeded; redrawn when the moved body would overlap or leave the
 * volume). Prints the full-plan wall times, then the re-plans' mean wall time, re-plans per second and
 * the mean number of receivers re-evaluated, and the demands that route. The machine is shared: read
 * the times with the load average printed beside them.
 */
public final class ReplanBench {

    private ReplanBench() {
    }

    public static void main(String[] args) throws Exception {
        Scenario s = args[0].startsWith("designed:") ? SwarmGenerator.designed(Integer.parseInt(args[0].substring(9)), 1)
                : ScenarioReader.strict().read(Path.of(args[0]));
        boolean exact = args[1].equals("exact");
        int fullRuns = args.length > 2 ? Integer.parseInt(args[2]) : 3;
        int edits = args.length > 3 ? Integer.parseInt(args[3]) : 20;
        Plan full = null;
        for (int i = 0; i < fullRuns; i++) {
            long t0 = System.nanoTime();
            full = exact ? NetworkPlanner.plan(s, PlanOptions.DEFAULT) : PreviewPlanner.plan(s, PlanOptions.DEFAULT);
            System.out.printf("full plan %d: %.3f s%n", i + 1, (System.nanoTime() - t0) / 1e9);
        }
        long t0 = System.nanoTime();
        IncrementalPlanner planner = exact ? IncrementalPlanner.exact(s, PlanOptions.DEFAULT)
                : IncrementalPlanner.preview(s, PlanOptions.DEFAULT);
        int receivers = planner.lastReevaluatedReceivers();
        System.out.printf("incremental planner, first plan: %.3f s, %d receivers%n", (System.nanoTime() - t0) / 1e9,
                receivers);
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(7);
        List<Node> movable = new ArrayList<>();
        for (Node n : s.nodes()) {
            if (n.role() == Role.TRANSMITTER) {
                movable.add(n);
            }
        }
        boolean compare = args.length > 4 && args[4].equals("compare");
        long total = 0;
        long fullTotal = 0;
        long reevaluated = 0;
        Plan last = planner.plan();
        for (int i = 0; i < edits; i++) {
            Scenario edited = moved(planner.scenario(), movable.get(rng.nextInt(movable.size())).id(), rng);
            long e0 = System.nanoTime();
            last = planner.replan(edited);
            total += System.nanoTime() - e0;
            reevaluated += planner.lastReevaluatedReceivers();
            if (compare) {
                long f0 = System.nanoTime();
                Plan again = exact ? NetworkPlanner.plan(edited, PlanOptions.DEFAULT)
                        : PreviewPlanner.plan(edited, PlanOptions.DEFAULT);
                fullTotal += System.nanoTime() - f0;
                full = again;
            }
        }
        double mean = total / 1e9 / Math.max(1, edits);
        long routed = last.routes().stream().filter(RouteReport::reachable).count();
        System.out.printf("%s %s: nodes=%d demands=%d routed(last full)=%d routed(last)=%d; re-plan mean %.4f s = %.2f re-plans/s,"
                + " %.1f of %d receivers re-evaluated per edit; load=%.2f%n", args[0], args[1], s.nodes().size(),
                s.demands().size(), full == null ? -1 : full.routes().stream().filter(RouteReport::reachable).count(),
                routed, mean, 1 / mean, reevaluated / (double) Math.max(1, edits), receivers,
                java.lang.management.ManagementFactory.getOperatingSystemMXBean().getSystemLoadAverage());
        if (compare) {
            System.out.printf("full plans of the same edited layouts: mean %.4f s = %.2f plans/s%n",
                    fullTotal / 1e9 / Math.max(1, edits), edits / (fullTotal / 1e9));
        }
    }

    /** {@code s} with node {@code id} moved by up to 5 µm per axis (redrawn while invalid). */
    private static Scenario moved(Scenario s, String id, UniformRandomProvider rng) {
        Node n = s.nodesById().get(id);
        for (int attempt = 0; attempt < 100; attempt++) {
            Vec3 step = new Vec3(10 * rng.nextDouble() - 5, 10 * rng.nextDouble() - 5, 10 * rng.nextDouble() - 5);
            List<Node> nodes = new ArrayList<>(s.nodes());
            nodes.replaceAll(m -> m.id().equals(id) ? new Node(id, n.role(), n.positionUm().plus(step), n.radiusUm(),
                    n.species(), n.emitsSpecies(), n.moleculesPerSymbol()) : m);
            try {
                return new Scenario(s.name(), s.volume(), s.medium(), s.species(), s.signalling(), nodes, s.demands(),
                        s.targets());
            } catch (IllegalArgumentException invalid) {
                // draw another step
            }
        }
        return s;
    }
}
