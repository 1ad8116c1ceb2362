package dev.nanoplan.plan;

import static org.assertj.core.api.Assertions.assertThat;

import dev.nanoplan.count.CountModelKind;
import dev.nanoplan.network.AnalyticChannel;
import dev.nanoplan.network.ChannelEntry;
import dev.nanoplan.network.ChannelMatrix;
import dev.nanoplan.network.Crosstalk;
import dev.nanoplan.network.LinkEvaluation;
import dev.nanoplan.network.LinkEvaluator;
import dev.nanoplan.network.LinkSpec;
import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.ScenarioReader;
import dev.nanoplan.scenario.Signalling;
import dev.nanoplan.scenario.SwarmGenerator;
import dev.nanoplan.scenario.Targets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.EnumSource;

/**
 * Molecule budgets are minimal: at the reported N every route hop of the node meets the target and at
 * N − 1 some hop misses it. The error is recomputed here independently of the planner's search: one
 * {@link LinkEvaluator#evaluate(LinkSpec, List)} per hop from the analytic channel, with the node's N
 * replaced and every other emitter at its file budget as crosstalk (the budgets' independent reading).
 */
class MoleculeBudgetsTest {

    /** These tests check the independent reading (JointMoleculeBudgetsTest checks the joint one). */
    private static final PlanOptions INDEPENDENT = PlanOptions.DEFAULT.withJointBudgets(false);

    /** A seeded swarm ({@link SwarmGenerator}) with the given count model, prior 0.3 and a 1 % error target. */
    private static Scenario swarm(CountModelKind model, long seed) {
        Scenario s = SwarmGenerator.generate(24, seed);
        Signalling g = s.signalling();
        return new Scenario(s.name(), s.volume(), s.medium(), s.species(),
                new Signalling(g.symbolTimeS(), 4, g.levels(), 0.3, model, g.schedule()), s.nodes(), s.demands(),
                new Targets(1e-2, 0, 3600));
    }

    /** Seeds 1 to 3 of each count model: some of their budgets are sized (a few demands route in each). */
    @ParameterizedTest
    @EnumSource(CountModelKind.class)
    void budgetMeetsTheErrorTargetAtNAndMissesItAtNMinusOne(CountModelKind model) {
        int checked = 0;
        for (long seed = 1; seed <= 3; seed++) {
            Scenario s = swarm(model, seed);
            checked += checkMinimal(s, NetworkPlanner.plan(s, INDEPENDENT), false);
        }
        assertThat(checked).as("budgets checked").isPositive();
    }

    @Test
    void cultureTankBudgetsAreMinimalAndNeverContradictTheLinkTable() throws Exception {
        Scenario s = bundled("culture-tank.json");
        Plan plan = NetworkPlanner.plan(s, INDEPENDENT);
        assertThat(checkMinimal(s, plan, false)).isPositive();
        double target = s.targets().maxErrorProbability();
        ChannelMatrix channel = AnalyticChannel.build(s, PlanOptions.DEFAULT.cutoffMolecules());
        for (BudgetReport b : plan.budgets()) {
            assertThat(b.method()).isEqualTo("independent");
            assertThat(b.reason()).doesNotContain("grows with the budget");
            long fileN = s.nodesById().get(b.node()).moleculesPerSymbol();
            Set<String> hops = sendsTo(plan).getOrDefault(b.node(), Set.of());
            boolean allMeet = !hops.isEmpty();
            for (String to : hops) {
                allMeet &= evaluate(s, channel, b.node(), to, fileN).minErrorProbability() <= target;
            }
            // a node whose hops all meet the target at the file N (as in the link table) is feasible within it
            if (allMeet) {
                assertThat(b.feasible()).as(b.node()).isTrue();
                assertThat(b.moleculesPerSymbolNeeded()).as(b.node()).isBetween(1L, fileN);
            }
            if (!b.feasible()) {
                // out of reach: the reason states the floor of the node's own budget with the others fixed
                assertThat(b.reason()).contains("own budget cannot reach").contains("at 2^20 molecules");
            }
        }
    }

    /**
     * Count-blind error target: with prior 1/2, deciding without counting errs with 1/2, so a target of
     * 0.5 is met at any N. The budgets are then sized for the rate target: each hop's mutual information
     * at the operating prior per symbol time meets 0.1 bit/s at N and misses it at N − 1, recomputed
     * independently; without a rate target they are not sized; above the input entropy they are out of reach.
     */
    @Test
    void countBlindTargetIsFlaggedAndBudgetsAreSizedForTheRate() throws Exception {
        Scenario file = bundled("relay-chain-relayed.json");
        Scenario s = withTargets(file, new Targets(0.5, 0.1, 3600));
        Plan plan = NetworkPlanner.plan(s, INDEPENDENT);
        assertThat(plan.warnings()).anyMatch(w -> w.contains("ignores the count")
                && w.contains("sized for targets.min_rate_bits_per_s"));
        assertThat(plan.budgets()).allMatch(BudgetReport::countBlindTarget);
        assertThat(checkMinimal(s, plan, true)).isEqualTo(plan.budgets().size());

        Scenario none = withTargets(file, new Targets(0.5, 0, 3600));
        Plan unsized = NetworkPlanner.plan(none, INDEPENDENT);
        assertThat(unsized.warnings()).anyMatch(w -> w.contains("budgets are not sized"));
        for (BudgetReport b : unsized.budgets()) {
            assertThat(b.countBlindTarget()).isTrue();
            assertThat(b.moleculesPerSymbolNeeded()).isEqualTo(-1);
            assertThat(b.reason()).startsWith("not sized");
        }
        // at prior 1/2 no N carries more than H(1/2) = 1 bit per symbol (Shannon, 1948: I(X;Y) ≤ H(X)), so 0.25 bit/s
        // over T = 5 s (1.25 bit per symbol) is out of reach for every node, whatever its N
        Plan tooFast = NetworkPlanner.plan(withTargets(file, new Targets(0.5, 0.25, 3600)), INDEPENDENT);
        assertThat(file.signalling().symbolTimeS()).isEqualTo(5.0);
        for (BudgetReport b : tooFast.budgets()) {
            assertThat(b.feasible()).isFalse();
            assertThat(b.reason()).contains("input entropy");
        }
        // below min(q, 1 − q) = 0.5 the target is not count-blind
        assertThat(MoleculeBudgets.countBlind(withTargets(file, new Targets(0.49, 0, 3600)))).isFalse();
    }

    /**
     * Checks every sized budget of the plan (N meets on every hop the node sends on, N − 1 misses on
     * one); returns how many were checked.
     */
    private static int checkMinimal(Scenario s, Plan plan, boolean rate) {
        ChannelMatrix channel = AnalyticChannel.build(s, PlanOptions.DEFAULT.cutoffMolecules());
        Map<String, Set<String>> sends = sendsTo(plan);
        int checked = 0;
        for (BudgetReport b : plan.budgets()) {
            Set<String> hops = sends.get(b.node());
            if (hops == null || !b.feasible() || b.moleculesPerSymbolNeeded() <= 0) {
                continue;
            }
            long n = b.moleculesPerSymbolNeeded();
            boolean missBelow = false;
            for (String to : hops) {
                assertThat(meets(s, channel, b.node(), to, n, rate)).as("%s -> %s at N = %d", b.node(), to, n)
                        .isTrue();
                missBelow |= n == s.signalling().levels() - 1 || !meets(s, channel, b.node(), to, n - 1, rate);
            }
            assertThat(missBelow).as("%s misses at N - 1 = %d (%s)", b.node(), n - 1, b.reason()).isTrue();
            checked++;
        }
        return checked;
    }

    private static boolean meets(Scenario s, ChannelMatrix channel, String from, String to, long n, boolean rate) {
        LinkEvaluation e = evaluate(s, channel, from, to, n);
        if (rate) {
            // operating point: mutual information at the file's prior, per symbol time
            return e.binary().mutualInformationBits() / s.signalling().symbolTimeS() >= s.targets().minRateBitsPerS();
        }
        return e.minErrorProbability() <= s.targets().maxErrorProbability();
    }

    /** The link from → to with {@code from} sending {@code n} molecules, everyone else at the file budget. */
    private static LinkEvaluation evaluate(Scenario s, ChannelMatrix channel, String from, String to, long n) {
        Signalling g = s.signalling();
        double[] w = LinkSpec.symbolWeights(g.levels(), g.priorOne());
        Map<String, Node> nodes = s.nodesById();
        ChannelEntry own = null;
        List<Crosstalk.Interferer> others = new ArrayList<>();
        for (ChannelEntry e : channel.atReceiver(to)) {
            if (e.emitter().equals(from)) {
                own = e;
            } else {
                long top = Math.max(nodes.get(e.emitter()).moleculesPerSymbol(), g.levels() - 1);
                others.add(new Crosstalk.Interferer(e.emitter(), e.taps(), LinkSpec.evenLevels(g.levels(), top), w));
            }
        }
        assertThat(own).as("channel entry %s -> %s", from, to).isNotNull();
        LinkSpec spec = new LinkSpec(own.taps(), LinkSpec.evenLevels(g.levels(), Math.max(n, g.levels() - 1)),
                g.priorOne(), s.medium().backgroundMoleculesPerS() * g.symbolTimeS(), g.countModel(), g.symbolTimeS());
        return LinkEvaluator.evaluate(spec, Crosstalk.terms(others, PlanOptions.DEFAULT.exactInterferers()));
    }

    /** Per emitting node, the receivers it sends to on the plan's routes. */
    private static Map<String, Set<String>> sendsTo(Plan plan) {
        Map<String, Set<String>> out = new LinkedHashMap<>();
        for (RouteReport r : plan.routes()) {
            for (int h = 0; h + 1 < r.hops().size(); h++) {
                out.computeIfAbsent(r.hops().get(h), k -> new LinkedHashSet<>()).add(r.hops().get(h + 1));
            }
        }
        return out;
    }

    private static Scenario withTargets(Scenario s, Targets t) {
        return new Scenario(s.name(), s.volume(), s.medium(), s.species(), s.signalling(), s.nodes(), s.demands(), t);
    }

    private static Scenario bundled(String name) throws Exception {
        Path dir = Path.of("").toAbsolutePath();
        while (!Files.isDirectory(dir.resolve("scenarios"))) {
            dir = dir.getParent();
        }
        return ScenarioReader.strict().read(dir.resolve("scenarios").resolve(name));
    }
}
