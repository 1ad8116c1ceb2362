package dev.nanoplan.bench;

import dev.nanoplan.plan.AdviceChecker;
import dev.nanoplan.plan.IncrementalPlanner;
import dev.nanoplan.plan.NetworkPlanner;
import dev.nanoplan.plan.PlanOptions;
import dev.nanoplan.plan.RouteReport;
import dev.nanoplan.plan.ScenarioEdit;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.ScenarioReader;
import dev.nanoplan.scenario.SwarmGenerator;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Set;

/**
 * What one re-plan of the advice check costs: the plan with its checked advice, then each distinct
 * change the check re-planned, re-planned again incrementally ({@link IncrementalPlanner#whatIf}) and in
 * full (the same what-if from a planner whose symbol time differs by one part in 10^6, so that every
 * receiver is re-evaluated). Single shots on a shared machine: read them with the load printed.
 * {@code java -cp target/test-classes:target/classes:<deps> dev.nanoplan.bench.AdviceCheckBench
 * [scenario.json | nodes]...} (default: scenarios/culture-tank.json; a number: a generated swarm of that many
 * nodes, {@link SwarmGenerator#generate}, seed 1).
 */
public final class AdviceCheckBench {

    private AdviceCheckBench() {
    }

    public static void main(String[] args) throws Exception {
        for (String a : args.length == 0 ? new String[] {"scenarios/culture-tank.json"} : args) {
            Scenario s = a.matches("[0-9]+") ? SwarmGenerator.generate(Integer.parseInt(a), 1)
                    : ScenarioReader.strict().read(Path.of(a));
            run(a, s);
        }
    }

    private static void run(String name, Scenario s) {
        if (s.nodes().size() < 100) {
            NetworkPlanner.planChecked(s, PlanOptions.DEFAULT); // warm-up (a large plan warms itself)
        }
        long t0 = System.nanoTime();
        AdviceChecker.Result r = NetworkPlanner.planChecked(s, PlanOptions.DEFAULT);
        double planS = (System.nanoTime() - t0) / 1e9;
        Set<ScenarioEdit> edits = new LinkedHashSet<>();
        for (AdviceChecker.RouteAdvice ra : r.routes()) {
            if (ra != null) {
                ra.given().forEach(v -> edits.add(v.advice().edit()));
                if (ra.bestRejected() != null) {
                    edits.add(ra.bestRejected().advice().edit());
                }
            }
        }
        List<Scenario> edited = new ArrayList<>();
        for (ScenarioEdit e : edits) {
            try {
                edited.add(e.applyTo(s));
            } catch (IllegalArgumentException invalid) {
                // an invalid change is judged without a re-plan
            }
        }
        if (edited.isEmpty()) {
            // no checked change (e.g. beyond the bound): time moves of the first routes' emitters instead
            for (RouteReport route : r.plan().routes()) {
                if (route.reachable() && edited.size() < 8) {
                    String from = route.hops().get(0);
                    String to = route.hops().get(1);
                    double d = s.nodesById().get(from).positionUm().minus(s.nodesById().get(to).positionUm()).norm();
                    edited.add(new ScenarioEdit.MoveToward(from, to, 0.9 * d).applyTo(s));
                }
            }
        }
        IncrementalPlanner inc = IncrementalPlanner.exact(s, PlanOptions.DEFAULT);
        IncrementalPlanner full = IncrementalPlanner.exact(
                new ScenarioEdit.SymbolTime(s.signalling().symbolTimeS() * (1 + 1e-6)).applyTo(s), PlanOptions.DEFAULT);
        double incS = 0;
        double fullS = 0;
        for (Scenario e : edited) {
            long a = System.nanoTime();
            inc.whatIf(e);
            long b = System.nanoTime();
            full.whatIf(e);
            long c = System.nanoTime();
            incS += (b - a) / 1e9;
            fullS += (c - b) / 1e9;
        }
        int n = Math.max(1, edited.size());
        System.out.printf("%s: nodes=%d plan+check=%.2f s replans=%d skipped=%d; %d what-ifs: incremental %.1f ms each, "
                + "full %.1f ms each; load=%.2f%n", name, s.nodes().size(), planS, r.replans(), r.skipped(),
                edited.size(), 1e3 * incS / n, 1e3 * fullS / n,
                java.lang.management.ManagementFactory.getOperatingSystemMXBean().getSystemLoadAverage());
    }
}
