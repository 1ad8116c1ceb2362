package dev.nanoplan.bench;

import dev.nanoplan.design.ImproveOptions;
import dev.nanoplan.design.Improvement;
import dev.nanoplan.design.LayoutImprover;
import dev.nanoplan.geometry.Vec3;
import dev.nanoplan.plan.IncrementalPlanner;
import dev.nanoplan.plan.PlanOptions;
import dev.nanoplan.plan.PreviewPlanner;
import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.Role;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.ScenarioReader;
import dev.nanoplan.scenario.SwarmGenerator;
import java.lang.management.ManagementFactory;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.simple.RandomSource;

/**
 * What-if re-plans per second of the layout search (one relay moved by up to 5 µm per axis, or one
 * transmitter when there is no relay; {@link IncrementalPlanner#whatIf}, exact model, no budgets), then
 * one whole {@code improve} run with its time, run by hand (not in CI):
 * {@code java -cp planner-core/target/test-classes:<classes + deps> dev.nanoplan.bench.ImproveBench LAYOUT
 * [EDITS] [TIME_LIMIT_S]} with LAYOUT a scenario file or {@code generated:N} ({@link SwarmGenerator#designed}).
 * The machine is shared: read the times with the load average printed beside them.
 */
public final class ImproveBench {

    private ImproveBench() {
    }

    /** Up to {@code edits} layouts, each {@code s} with one relay (or transmitter) moved by up to 5 µm per axis. */
    private static List<Scenario> movedLayouts(Scenario s, int edits) {
        List<Node> movable = new ArrayList<>();
        for (Node n : s.nodes()) {
            if (n.role() == Role.RELAY) {
                movable.add(n);
            }
        }
        if (movable.isEmpty()) {
            s.nodes().stream().filter(n -> n.role() == Role.TRANSMITTER).forEach(movable::add);
        }
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(7);
        List<Scenario> out = new ArrayList<>();
        for (int i = 0; i < edits; i++) {
            Node n = movable.get(rng.nextInt(movable.size()));
            Vec3 step = new Vec3(10 * rng.nextDouble() - 5, 10 * rng.nextDouble() - 5, 10 * rng.nextDouble() - 5);
            List<Node> nodes = new ArrayList<>(s.nodes());
            nodes.replaceAll(m -> m.id().equals(n.id()) ? new Node(m.id(), m.role(), m.positionUm().plus(step),
                    m.radiusUm(), m.species(), m.emitsSpecies(), m.moleculesPerSymbol(), m.fixed()) : m);
            try {
                out.add(new Scenario(s.name(), s.volume(), s.medium(), s.species(), s.signalling(), nodes,
                        s.demands(), s.targets(), s.candidateSpecies()));
            } catch (IllegalArgumentException invalid) {
                // outside the volume or overlapping: skipped
            }
        }
        return out;
    }

    /** Times {@link IncrementalPlanner#whatIf} of every layout and prints re-plans per second. */
    private static void rate(String label, Scenario s, IncrementalPlanner planner, List<Scenario> layouts) {
        planner.whatIf(layouts.get(0));
        long total = 0;
        for (Scenario edited : layouts) {
            long e0 = System.nanoTime();
            planner.whatIf(edited);
            total += System.nanoTime() - e0;
        }
        int done = layouts.size();
        double load = ManagementFactory.getOperatingSystemMXBean().getSystemLoadAverage();
        System.out.printf("%s: %d nodes, %d what-if re-plans, mean %.4f s = %.1f re-plans/s; load=%.2f%n", label,
                s.nodes().size(), done, total / 1e9 / Math.max(1, done), done / (total / 1e9), load);
    }

    public static void main(String[] args) throws Exception {
        Scenario s = args[0].startsWith("generated:") ? SwarmGenerator.designed(Integer.parseInt(args[0].substring(10)), 1)
                : ScenarioReader.strict().read(Path.of(args[0]));
        int edits = args.length > 1 ? Integer.parseInt(args[1]) : 50;
        double limit = args.length > 2 ? Double.parseDouble(args[2]) : 60;
        long t0 = System.nanoTime();
        IncrementalPlanner planner = IncrementalPlanner.exactWithoutBudgets(s, PlanOptions.DEFAULT);
        System.out.printf("first plan (no budgets): %.3f s%n", (System.nanoTime() - t0) / 1e9);
        List<Scenario> moved = movedLayouts(s, edits);
        rate(args[0] + " exact", s, planner, moved);
        if (PreviewPlanner.supports(s)) {
            rate(args[0] + " preview (the search's screen)", s, IncrementalPlanner.preview(s, PlanOptions.DEFAULT),
                    moved);
        }
        if (limit <= 0) {
            return;
        }
        Improvement r = LayoutImprover.improve(s, ImproveOptions.defaults().withTimeLimit(limit)
                .withProgress(p -> System.err.printf("  %6.1f s  %5d evaluations  %s  (%s)%n", p.elapsedS(),
                        p.evaluations(), p.best().describe(), p.step())));
        System.out.printf("improve: %.1f s, %d evaluations (%.1f/s), stopped early %s; before: %s; after: %s;"
                + " load=%.2f%n", r.seconds(), r.evaluations(), r.evaluations() / r.seconds(), r.stoppedEarly(),
                r.assessedBefore().objective().describe(), r.assessedAfter().objective().describe(),
                ManagementFactory.getOperatingSystemMXBean().getSystemLoadAverage());
    }
}
