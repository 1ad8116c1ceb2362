package dev.nanoplan.plan;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.stream.IntStream;

/**
 * Joint power control: the smallest "powers" P_i of n emitters with which every constraint (hop) h of
 * emitter e_h meets its target, when each emitter's power raises the others' interference.
 *
 * <p><b>Model.</b> Each hop h gives (a) its row of the normalised crosstalk-gain matrix F: in the limit of
 * large powers the hop meets its target iff P_{e_h} ≥ Σ_j F_hj P_j (J. Zander, "Performance of optimum
 * transmitter power control in cellular radio systems", IEEE Trans. Veh. Technol. 41(1), 1992, eq. (3)
 * to (7), with F_ij = γ_i G_ij / G_ii), and (b) the ratio need/achieved at the current powers (for a
 * signal-to-interference constraint γ_i / SINR_i).
 *
 * <p><b>Feasibility</b> (Zander 1992): powers meeting every constraint exist iff the spectral radius of F is
 * below 1. An emitter with several hops must meet all of them: the map T(P)_i = max_{h: e_h = i} (F_h P) is
 * monotone and homogeneous, and its spectral radius (one matrix per choice of row, the largest of their
 * Perron roots) is found by the shifted power iteration P ← T(P) + P with the Collatz–Wielandt upper bound
 * max_i T(P)_i / P_i (R. A. Horn and C. R. Johnson, "Matrix Analysis", 2nd ed., 2013, Theorem 8.1.26),
 * which is what is reported (conservative: a layout is never called feasible above its radius). With one
 * hop per emitter this is the Perron root of F; measured within 1e-6 relative of Commons Math's
 * EigenDecomposition on random matrices, except for nilpotent F (conflicts without a cycle, radius 0),
 * where the bound closes in like 1/k and stops near 1e-4, harmless for the test against 1.
 *
 * <p><b>Fixed point</b> (G. J. Foschini and Z. Miljanic, "A simple distributed autonomous power control
 * algorithm and its convergence", IEEE Trans. Veh. Technol. 42(4), 1993): P_i ← P_i · max_h need/achieved,
 * all emitters at once, until no power moves by more than a given tolerance; for a feasible linear problem
 * it converges geometrically (rate ρ(F)) to the minimal fixed point (I − F)^{-1} u. Powers are clamped to
 * [floor, cap]; an emitter still short at the cap is out of reach.
 *
 * <p>Cost: O(iterations · non-zero gains) for the radius (at most {@value #MAX_RADIUS_ITERATIONS} iterations)
 * plus {@code iterations × hops} ratio evaluations for the fixed point (at most {@value #MAX_ITERATIONS}
 * iterations; the hops of one iteration are evaluated in parallel).
 */
final class JointBudgets {

    static final int MAX_ITERATIONS = 5000;
    static final int MAX_RADIUS_ITERATIONS = 20000;
    /** Smallest entry of the unit-sum iterate of the radius (far above underflow, far below any Perron share that matters). */
    private static final double X_FLOOR = 1e-250;

    /** One constraint of one emitter. */
    interface Hop {
        /** Index of the emitter, in [0, n). */
        int emitter();

        /** The row F_h of the normalised gain matrix (length n, the emitter's own entry 0; +∞ when no power meets it). */
        double[] gains();

        /** need / achieved at the powers {@code p}: ≤ 1 when the hop meets its target. */
        double ratio(double[] p);
    }

    /**
     * The outcome.
     *
     * @param feasible       whether the fixed point was reached within [floor, cap]
     * @param spectralRadius the Collatz–Wielandt bound on the spectral radius of F (+∞ when a hop cannot be met at
     *                       any power)
     * @param power          the powers (the fixed point when feasible, else the last iterate)
     * @param iterations     fixed-point iterations used (0 when the radius already rules the problem out)
     * @param conflict       emitters with the largest share of the Perron vector (the ones in conflict), by index
     */
    record Result(boolean feasible, double spectralRadius, double[] power, int iterations, List<Integer> conflict) {
    }

    private JointBudgets() {
    }

    /**
     * The Collatz–Wielandt upper bound on the spectral radius of T (see the class comment), with the
     * emitters carrying at least 1 % of the largest Perron-vector entry.
     */
    static Result radius(int n, List<Hop> hops) {
        // sparse rows: far emitters of a large swarm have gain exactly 0 at most receivers
        int[][] cols = new int[hops.size()][];
        double[][] vals = new double[hops.size()][];
        int[] owner = new int[hops.size()];
        for (int h = 0; h < cols.length; h++) {
            double[] g = hops.get(h).gains();
            owner[h] = hops.get(h).emitter();
            int nz = 0;
            for (double v : g) {
                if (v == Double.POSITIVE_INFINITY) {
                    return new Result(false, Double.POSITIVE_INFINITY, new double[n], 0,
                            List.of(hops.get(h).emitter()));
                }
                if (v > 0) {
                    nz++;
                }
            }
            cols[h] = new int[nz];
            vals[h] = new double[nz];
            for (int j = 0, k = 0; j < g.length; j++) {
                if (g[j] > 0) {
                    cols[h][k] = j;
                    vals[h][k++] = g[j];
                }
            }
        }
        double[] x = new double[n];
        Arrays.fill(x, 1.0 / Math.max(1, n));
        double bound = Double.POSITIVE_INFINITY;
        double[] t = new double[n];
        for (int it = 0; it < MAX_RADIUS_ITERATIONS; it++) {
            apply(cols, vals, owner, x, t);
            double upper = 0;
            double sum = 0;
            for (int i = 0; i < n; i++) {
                // t_i = 0 (no gain from anyone) contributes a ratio of 0, whatever x_i
                upper = t[i] > 0 ? Math.max(upper, t[i] / x[i]) : upper;
                x[i] = t[i] + x[i];
                sum += x[i];
            }
            for (int i = 0; i < n; i++) {
                // the Collatz–Wielandt bound holds for every positive x: entries that the growth of the others
                // pushes towards underflow are held at X_FLOOR (of a unit sum) so that no ratio reads 0/0
                x[i] = Math.max(X_FLOOR, x[i] / sum);
            }
            boolean settled = Math.abs(bound - upper) <= 1e-12 * Math.max(1, upper);
            bound = upper;
            if (settled) {
                break;
            }
        }
        double max = Arrays.stream(x).max().orElse(0);
        List<Integer> conflict = new ArrayList<>();
        for (int i = 0; i < n; i++) {
            if (bound > 0 && x[i] >= 0.01 * max) {
                conflict.add(i);
            }
        }
        return new Result(false, bound, x, 0, List.copyOf(conflict));
    }

    /** t = T(x), row by sparse row (t is overwritten). */
    private static void apply(int[][] cols, double[][] vals, int[] owner, double[] x, double[] t) {
        Arrays.fill(t, 0);
        for (int h = 0; h < cols.length; h++) {
            double s = 0;
            int[] c = cols[h];
            double[] v = vals[h];
            for (int k = 0; k < c.length; k++) {
                s += v[k] * x[c[k]];
            }
            t[owner[h]] = Math.max(t[owner[h]], s);
        }
    }

    /**
     * Zander's test, then the Foschini–Miljanic iteration from {@code start} (clamped to [floor, cap]) until
     * no power moves by more than {@code tolerance} relatively.
     *
     * @throws IllegalArgumentException if a bound is not positive or floor &gt; cap
     */
    static Result solve(int n, List<Hop> hops, double[] start, double floor, double cap, double tolerance) {
        return solve(n, hops, start, floor, cap, tolerance, MAX_ITERATIONS);
    }

    /** As above, with at most {@code maxIterations} fixed-point iterations. */
    static Result solve(int n, List<Hop> hops, double[] start, double floor, double cap, double tolerance,
            int maxIterations) {
        if (!(floor > 0 && cap >= floor) || start.length != n) {
            throw new IllegalArgumentException("floor, cap: need 0 < floor <= cap and one start per emitter, got "
                    + floor + ", " + cap + ", " + start.length);
        }
        Result r = radius(n, hops);
        if (!(r.spectralRadius() < 1)) {
            return r;
        }
        double[] p = new double[n];
        for (int i = 0; i < n; i++) {
            p[i] = Math.min(cap, Math.max(floor, start[i]));
        }
        int it = 0;
        boolean moved = true;
        while (moved && it < maxIterations) {
            it++;
            double[] factor = new double[n];
            // the hops' ratios are independent evaluations at the same powers: in parallel (p is only read)
            double[] ratios = IntStream.range(0, hops.size()).parallel().mapToDouble(h -> hops.get(h).ratio(p))
                    .toArray();
            for (int h = 0; h < ratios.length; h++) {
                // a ratio that is not a number reads as "far from met" rather than poisoning every power
                int e = hops.get(h).emitter();
                factor[e] = Math.max(factor[e], Double.isNaN(ratios[h]) ? 1e6 : ratios[h]);
            }
            moved = false;
            for (int i = 0; i < n; i++) {
                double next = Math.min(cap, Math.max(floor, p[i] * factor[i]));
                moved |= Math.abs(next - p[i]) > tolerance * p[i];
                p[i] = next;
            }
        }
        boolean feasible = true;
        List<Integer> missing = new ArrayList<>();
        for (Hop h : hops) {
            // short only at the cap: below it the iteration still had room (a tolerance-sized gap is left to the caller)
            if (p[h.emitter()] >= cap && h.ratio(p) > 1 && !missing.contains(h.emitter())) {
                feasible = false;
                missing.add(h.emitter());
            }
        }
        return new Result(feasible, r.spectralRadius(), p, it, feasible ? r.conflict() : List.copyOf(missing));
    }
}
