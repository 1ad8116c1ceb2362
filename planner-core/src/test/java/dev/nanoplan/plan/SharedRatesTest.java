package dev.nanoplan.plan;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.ScenarioReader;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.stream.LongStream;
import org.apache.commons.math3.optim.MaxIter;
import org.apache.commons.math3.optim.PointValuePair;
import org.apache.commons.math3.optim.linear.LinearConstraint;
import org.apache.commons.math3.optim.linear.LinearConstraintSet;
import org.apache.commons.math3.optim.linear.LinearObjectiveFunction;
import org.apache.commons.math3.optim.linear.NonNegativeConstraint;
import org.apache.commons.math3.optim.linear.Relationship;
import org.apache.commons.math3.optim.linear.SimplexSolver;
import org.apache.commons.math3.optim.nonlinear.scalar.GoalType;
import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.simple.RandomSource;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;

class SharedRatesTest {

    @Test
    void fiveDemandsThroughOneRelayGetTheHarmonicShareOfItsSlots() {
        // derived by hand: demands with alone-rates r = 1, 0.5, 0.25, 0.5, 1 bit/s all pass relay 0 and each its
        // own sensor (resources 1..5). Demand i takes x/r_i of the relay's slots, so Σ x/r_i = 10·x ≤ 1 gives
        // x = 1/Σ(1/r_i) = 0.1 bit/s each; a sensor's own slots only bound x ≤ r_i ≥ 0.25, never binding.
        double[] r = {1, 0.5, 0.25, 0.5, 1};
        double[][] w = new double[5][];
        int[][] uses = new int[5][];
        for (int i = 0; i < 5; i++) {
            uses[i] = new int[] {1 + i, 0};
            w[i] = new double[] {1 / r[i], 1 / r[i]};
        }
        double[] cap = new double[6];
        Arrays.fill(cap, 1);
        int[] limit = new int[5];
        double[] x = SharedRates.maxMinFair(w, uses, cap, limit);
        assertThat(x).containsExactly(new double[] {0.1, 0.1, 0.1, 0.1, 0.1}, within(1e-15));
        assertThat(limit).containsOnly(0);
    }

    @Test
    void aDemandAloneOnItsRouteGetsItsOwnRate() {
        // derived by hand: one demand of alone-rate 0.7 bit/s through two emitters: x/0.7 ≤ 1 at both, so x = 0.7
        int[] limit = new int[1];
        double[] x = SharedRates.maxMinFair(new double[][] {{1 / 0.7, 1 / 0.7}}, new int[][] {{0, 1}},
                new double[] {1, 1}, limit);
        assertThat(x[0]).isCloseTo(0.7, within(1e-15));
    }

    @Test
    void theSlowerEmitterFreezesItsDemandsFirst() {
        // derived by hand: demand A (r = 1) uses emitter X, B (r = 1) uses X and Y, C (r = 0.5) uses Y.
        // Growing together at t: X binds at t + t = 1 (t = 1/2), Y at t/1 + t/0.5 = 3t = 1 (t = 1/3): Y first,
        // B = C = 1/3. Then A alone on X: x_A + 1/3 = 1, x_A = 2/3. Bottlenecks (Bertsekas and Gallager, Data
        // Networks, 1992, §6.5.2): A's is X (saturated, A fastest there), B's and C's is Y (saturated, 1/3 = max).
        int[] limit = new int[3];
        double[] x = SharedRates.maxMinFair(new double[][] {{1}, {1, 1}, {2}}, new int[][] {{0}, {0, 1}, {1}},
                new double[] {1, 1}, limit);
        assertThat(x).containsExactly(new double[] {2.0 / 3, 1.0 / 3, 1.0 / 3}, within(1e-15));
        assertThat(limit).containsExactly(0, 1, 1);
    }

    @Test
    void aDemandWithoutRouteGetsNothing() {
        // from the definition: a flow through no resource has rate 0 (unreachable demand)
        int[] limit = new int[2];
        double[] x = SharedRates.maxMinFair(new double[][] {{}, {2}}, new int[][] {{}, {0}}, new double[] {1}, limit);
        assertThat(x).containsExactly(0, 0.5);
        assertThat(limit).containsExactly(-1, 0);
    }

    /**
     * The bundled culture tank sends five sensors through relay-w and five through relay-e to one
     * gateway: with symbol forwarding, when a relay's slots are the only bottleneck every demand through
     * it gets 1/Σ(1/r_i) of the route rates r_i (the worked example above, derived by hand); s11..s14
     * send directly, alone on their emitters, and keep their route rates.
     */
    @Test
    void cultureTankRelaysAreTimeShared() throws Exception {
        Path dir = Path.of("").toAbsolutePath();
        while (!Files.isDirectory(dir.resolve("scenarios"))) {
            dir = dir.getParent();
        }
        Scenario s = ScenarioReader.strict().read(dir.resolve("scenarios/culture-tank.json"));
        Plan plan = NetworkPlanner.plan(s, PlanOptions.DEFAULT);
        List<SharedRates.Share> shares = SharedRates.of(plan);
        assertThat(shares).hasSize(plan.routes().size());
        Map<String, Double> inverseSum = new HashMap<>();
        for (RouteReport r : plan.routes()) {
            if (r.hops().size() == 3) {
                inverseSum.merge(r.hops().get(1), 1 / r.rateBitsPerS(), Double::sum);
            }
        }
        assertThat(inverseSum).containsOnlyKeys("relay-w", "relay-e");
        for (int i = 0; i < shares.size(); i++) {
            RouteReport r = plan.routes().get(i);
            SharedRates.Share sh = shares.get(i);
            if (r.hops().size() == 3) {
                String relay = r.hops().get(1);
                // the worked example's formula 1/Σ(1/r_i) over the relay's five demands
                assertThat(sh.rateBitsPerS()).as(r.from()).isCloseTo(1 / inverseSum.get(relay), within(1e-12));
                assertThat(sh.limitedAt()).isEqualTo(relay);
                assertThat(sh.sharedWith()).isEqualTo(5);
            } else {
                // alone on its emitter: its own route rate
                assertThat(sh.rateBitsPerS()).as(r.from()).isCloseTo(r.rateBitsPerS(), within(1e-12));
                assertThat(sh.limitedAt()).isNull();
            }
        }
        // the file asks 0.1 bit/s per demand: every demand that meets it alone but not shared is named in one
        // warning per relay
        double target = s.targets().minRateBitsPerS();
        for (int i = 0; i < shares.size(); i++) {
            SharedRates.Share sh = shares.get(i);
            RouteReport r = plan.routes().get(i);
            boolean starved = sh.limitedAt() != null && sh.rateBitsPerS() < target && r.rateBitsPerS() >= target;
            String demand = r.from() + " -> " + r.to();
            assertThat(plan.warnings().stream().anyMatch(w -> w.startsWith(sh.limitedAt() + "'s slots carry")
                    && (w.contains(demand + ",") || w.contains(demand + " get")))).as(demand).isEqualTo(starved);
        }
    }

    static LongStream seeds() {
        return LongStream.range(0, 200);
    }

    /** A random instance: flows through random subsets of resources with positive weights. */
    record Instance(double[][] weight, int[][] uses, double[] capacity) {

        static Instance random(long seed) {
            UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(seed);
            int flows = 1 + rng.nextInt(8);
            int resources = 1 + rng.nextInt(6);
            double[] cap = new double[resources];
            for (int e = 0; e < resources; e++) {
                cap[e] = 0.1 + 10 * rng.nextDouble();
            }
            double[][] w = new double[flows][];
            int[][] uses = new int[flows][];
            for (int f = 0; f < flows; f++) {
                int k = rng.nextInt(6) == 0 ? 0 : 1 + rng.nextInt(resources);
                int[] order = new int[resources];
                for (int e = 0; e < resources; e++) {
                    order[e] = e;
                }
                for (int e = resources - 1; e > 0; e--) {
                    int j = rng.nextInt(e + 1);
                    int t = order[e];
                    order[e] = order[j];
                    order[j] = t;
                }
                uses[f] = Arrays.copyOf(order, k);
                w[f] = new double[k];
                for (int h = 0; h < k; h++) {
                    w[f][h] = 0.1 + 10 * rng.nextDouble();
                }
            }
            return new Instance(w, uses, cap);
        }

        double[] load(double[] x) {
            double[] load = new double[capacity.length];
            for (int f = 0; f < uses.length; f++) {
                for (int h = 0; h < uses[f].length; h++) {
                    load[uses[f][h]] += weight[f][h] * x[f];
                }
            }
            return load;
        }
    }

    /**
     * Bertsekas and Gallager, Data Networks, 2nd ed., 1992, §6.5.2: a feasible allocation is max-min
     * fair iff every flow has a bottleneck — a saturated resource on its path where no other flow is
     * faster (the proof carries over to positive weights in the resource constraints).
     */
    @ParameterizedTest
    @MethodSource("seeds")
    void everyFlowHasABottleneck(long seed) {
        Instance in = Instance.random(seed);
        int flows = in.uses().length;
        int[] limit = new int[flows];
        double[] x = SharedRates.maxMinFair(in.weight(), in.uses(), in.capacity(), limit);
        double[] load = in.load(x);
        for (int e = 0; e < load.length; e++) {
            assertThat(load[e]).isLessThanOrEqualTo(in.capacity()[e] * (1 + 1e-9));
        }
        for (int f = 0; f < flows; f++) {
            if (in.uses()[f].length == 0) {
                assertThat(x[f]).isZero();
                continue;
            }
            boolean bottleneck = false;
            for (int e : in.uses()[f]) {
                if (load[e] < in.capacity()[e] * (1 - 1e-9)) {
                    continue;
                }
                boolean fastest = true;
                for (int g = 0; g < flows; g++) {
                    for (int y : in.uses()[g]) {
                        if (y == e && x[g] > x[f] * (1 + 1e-9)) {
                            fastest = false;
                        }
                    }
                }
                bottleneck |= fastest;
            }
            assertThat(bottleneck).as("flow %d (rate %s) has a bottleneck", f, x[f]).isTrue();
            assertThat(limit[f]).isGreaterThanOrEqualTo(0);
        }
    }

    /**
     * Independent computation of the max-min fair allocation by linear programming (Commons Math3
     * SimplexSolver): maximise the smallest free rate t; every free flow that cannot exceed t while the
     * others keep at least t is fixed at t; repeat (the lexicographic max-min LP, Bertsekas and
     * Gallager 1992, §6.5.2).
     */
    @ParameterizedTest
    @MethodSource("seeds")
    void progressiveFillingEqualsTheLexicographicLinearProgram(long seed) {
        Instance in = Instance.random(seed);
        int flows = in.uses().length;
        double[] x = SharedRates.maxMinFair(in.weight(), in.uses(), in.capacity(), new int[flows]);
        double[] lp = lexicographicMaxMin(in);
        assertThat(x).containsExactly(lp, within(1e-7));
    }

    private static double[] lexicographicMaxMin(Instance in) {
        int flows = in.uses().length;
        double[] value = new double[flows];
        boolean[] fixed = new boolean[flows];
        for (int f = 0; f < flows; f++) {
            fixed[f] = in.uses()[f].length == 0;
        }
        while (true) {
            boolean anyFree = false;
            for (boolean b : fixed) {
                anyFree |= !b;
            }
            if (!anyFree) {
                return value;
            }
            // variables x_0..x_{F-1}, t
            List<LinearConstraint> base = resourceAndFixedConstraints(in, fixed, value, flows + 1);
            List<LinearConstraint> withT = new ArrayList<>(base);
            for (int f = 0; f < flows; f++) {
                if (!fixed[f]) {
                    double[] c = new double[flows + 1];
                    c[f] = 1;
                    c[flows] = -1;
                    withT.add(new LinearConstraint(c, Relationship.GEQ, 0));
                }
            }
            double[] obj = new double[flows + 1];
            obj[flows] = 1;
            double t = solve(obj, withT).getValue();
            boolean progressed = false;
            for (int g = 0; g < flows; g++) {
                if (fixed[g]) {
                    continue;
                }
                List<LinearConstraint> floor = new ArrayList<>(base);
                for (int f = 0; f < flows; f++) {
                    if (!fixed[f]) {
                        double[] c = new double[flows + 1];
                        c[f] = 1;
                        floor.add(new LinearConstraint(c, Relationship.GEQ, t * (1 - 1e-10)));
                    }
                }
                double[] og = new double[flows + 1];
                og[g] = 1;
                if (solve(og, floor).getValue() <= t * (1 + 1e-8) + 1e-12) {
                    fixed[g] = true;
                    value[g] = t;
                    progressed = true;
                }
            }
            assertThat(progressed).as("the LP fixes a flow every round").isTrue();
        }
    }

    private static List<LinearConstraint> resourceAndFixedConstraints(Instance in, boolean[] fixed, double[] value,
            int vars) {
        List<LinearConstraint> out = new ArrayList<>();
        for (int e = 0; e < in.capacity().length; e++) {
            double[] c = new double[vars];
            for (int f = 0; f < in.uses().length; f++) {
                for (int h = 0; h < in.uses()[f].length; h++) {
                    if (in.uses()[f][h] == e) {
                        c[f] = in.weight()[f][h];
                    }
                }
            }
            out.add(new LinearConstraint(c, Relationship.LEQ, in.capacity()[e]));
        }
        for (int f = 0; f < in.uses().length; f++) {
            if (fixed[f]) {
                double[] c = new double[vars];
                c[f] = 1;
                out.add(new LinearConstraint(c, Relationship.EQ, value[f]));
            }
        }
        return out;
    }

    private static PointValuePair solve(double[] objective, List<LinearConstraint> constraints) {
        return new SimplexSolver().optimize(new MaxIter(10_000), new LinearObjectiveFunction(objective, 0),
                new LinearConstraintSet(constraints), GoalType.MAXIMIZE, new NonNegativeConstraint(true));
    }
}
