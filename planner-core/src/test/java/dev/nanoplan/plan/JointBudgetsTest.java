package dev.nanoplan.plan;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.ArrayList;
import java.util.List;
import java.util.stream.LongStream;
import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.EigenDecomposition;
import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.simple.RandomSource;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;

class JointBudgetsTest {

    /** SINR constraint of emitter i: need/achieved = (u_i + Σ_j F_ij P_j) / P_i (Zander 1992, eq. (3)). */
    private static List<JointBudgets.Hop> linear(double[][] f, double[] u) {
        List<JointBudgets.Hop> hops = new ArrayList<>();
        for (int i = 0; i < f.length; i++) {
            int e = i;
            hops.add(new JointBudgets.Hop() {
                @Override
                public int emitter() {
                    return e;
                }

                @Override
                public double[] gains() {
                    return f[e].clone();
                }

                @Override
                public double ratio(double[] p) {
                    double s = u[e];
                    for (int j = 0; j < p.length; j++) {
                        s += f[e][j] * p[j];
                    }
                    return s / p[e];
                }
            });
        }
        return hops;
    }

    @Test
    void twoLinksConvergeToTheMinimalFixedPointWorkedByHand() {
        double[][] f = {{0, 0.25}, {0.5, 0}};
        JointBudgets.Result r = JointBudgets.solve(2, linear(f, new double[] {1, 2}), new double[] {1, 1}, 1e-6, 1e9, 1e-12);
        assertThat(r.feasible()).isTrue();
        // by hand: P1 = 1 + P2/4, P2 = 2 + P1/2 → P1 = 12/7, P2 = 20/7 (Foschini and Miljanic 1993: the limit is (I − F)^-1 u)
        assertThat(r.power()[0]).isCloseTo(12.0 / 7, within(1e-7));
        assertThat(r.power()[1]).isCloseTo(20.0 / 7, within(1e-7));
        // by hand: the eigenvalues of [[0, a], [b, 0]] are ±sqrt(ab) = ±sqrt(1/8)
        assertThat(r.spectralRadius()).isCloseTo(Math.sqrt(0.125), within(1e-9));
    }

    @Test
    void threeLinksInACycleConvergeToTheMinimalFixedPointWorkedByHand() {
        double[][] f = {{0, 0.5, 0}, {0, 0, 0.5}, {0.5, 0, 0}};
        // started above the fixed point: the iteration comes down to the same (unique) point
        JointBudgets.Result r = JointBudgets.solve(3, linear(f, new double[] {1, 2, 4}), new double[] {50, 50, 50},
                1e-6, 1e9, 1e-12);
        assertThat(r.feasible()).isTrue();
        // by hand: P1 = 1 + P2/2, P2 = 2 + P3/2, P3 = 4 + P1/2 → P1 = 3 + P1/8 = 24/7, P2 = 34/7, P3 = 40/7
        assertThat(r.power()).containsExactly(new double[] {24.0 / 7, 34.0 / 7, 40.0 / 7}, within(1e-7));
        // by hand: a 3-cycle with weights 1/2 has eigenvalues the cube roots of 1/8, radius 1/2 (periodic: needs the shift)
        assertThat(r.spectralRadius()).isCloseTo(0.5, within(1e-9));
    }

    @Test
    void aRadiusAboveOneIsReportedInfeasibleWithBothLinksInConflict() {
        double[][] f = {{0, 2}, {0.8, 0}};
        JointBudgets.Result r = JointBudgets.solve(2, linear(f, new double[] {1, 1}), new double[] {1, 1}, 1e-6, 1e9, 1e-12);
        assertThat(r.feasible()).isFalse();
        // by hand: sqrt(2 · 0.8) = 1.2649 > 1 (Zander 1992: no powers meet both)
        assertThat(r.spectralRadius()).isCloseTo(Math.sqrt(1.6), within(1e-9));
        assertThat(r.conflict()).containsExactly(0, 1);
    }

    @Test
    void aRadiusBelowOneButACapTooLowIsOutOfReach() {
        double[][] f = {{0, 0.25}, {0.5, 0}};
        JointBudgets.Result r = JointBudgets.solve(2, linear(f, new double[] {1, 2}), new double[] {1, 1}, 1e-6, 2.0, 1e-12);
        // by hand: the fixed point needs P1 = 12/7 ≤ 2 but P2 = 20/7 > 2
        assertThat(r.feasible()).isFalse();
        assertThat(r.conflict()).containsExactly(1);
    }

    static LongStream seeds() {
        return LongStream.rangeClosed(1, 12);
    }

    @ParameterizedTest
    @MethodSource("seeds")
    void theRadiusIsThePerronRootOfCommonsMathsEigenDecomposition(long seed) {
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(seed);
        int n = 2 + rng.nextInt(7);
        double[][] f = new double[n][n];
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                f[i][j] = i == j || rng.nextDouble() < 0.3 ? 0 : rng.nextDouble();
            }
        }
        double expected = 0;
        EigenDecomposition eig = new EigenDecomposition(new Array2DRowRealMatrix(f));
        for (int k = 0; k < n; k++) {
            expected = Math.max(expected, Math.hypot(eig.getRealEigenvalue(k), eig.getImagEigenvalue(k)));
        }
        // Commons Math EigenDecomposition: the largest |λ| of a non-negative matrix is its Perron root; the
        // Collatz–Wielandt bound is never below it and closes in slowly (like 1/k) only for nilpotent F
        assertThat(JointBudgets.radius(n, linear(f, new double[n])).spectralRadius())
                .isBetween(expected - 1e-9, expected + 1e-4 + 1e-6 * expected);
    }

    @Test
    void aSlowlySettlingRadiusWithAnUnfedEmitterStaysFinite() {
        // Emitters 0 and 1 conflict with gains 200 and 50: the Perron root of [[0, 200], [50, 0]] is
        // sqrt(200 · 50) = 100 (worked by hand). Emitter 2 hears no one and no one hears it: its share of the
        // iterate shrinks by about 1/101 per step, and the shifted iteration settles only at the rate
        // 99/101 per step, long after that share has fallen below the smallest double. The bound must still
        // come out as 100, not 0/0 (a NaN radius used to send the joint budgets round the same problem for
        // ever).
        double[][] f = {{0, 200, 0}, {50, 0, 0}, {0, 0, 0}};
        JointBudgets.Result r = JointBudgets.radius(3, linear(f, new double[3]));
        assertThat(r.spectralRadius()).isCloseTo(100, within(1e-6));
        assertThat(r.conflict()).containsExactly(0, 1);
    }
}
