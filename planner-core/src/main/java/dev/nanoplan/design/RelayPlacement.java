package dev.nanoplan.design;

import dev.nanoplan.geometry.Vec3;
import dev.nanoplan.geometry.Volume;
import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.Scenario;
import java.util.List;
import java.util.function.BooleanSupplier;
import java.util.function.Function;
import org.apache.commons.math3.exception.TooManyEvaluationsException;
import org.apache.commons.math3.optim.InitialGuess;
import org.apache.commons.math3.optim.MaxEval;
import org.apache.commons.math3.optim.SimpleBounds;
import org.apache.commons.math3.optim.nonlinear.scalar.GoalType;
import org.apache.commons.math3.optim.nonlinear.scalar.ObjectiveFunction;
import org.apache.commons.math3.optim.nonlinear.scalar.noderiv.CMAESOptimizer;
import org.apache.commons.math3.random.MersenneTwister;

/**
 * Places one relay: maximises the layout's objective over the relay's centre with the covariance
 * matrix adaptation evolution strategy (N. Hansen, "The CMA evolution strategy: a comparing review",
 * in <i>Towards a New Evolutionary Computation</i>, Springer 2006; Apache Commons Math
 * {@link CMAESOptimizer}), a derivative-free method that copes with the kinks of a min-of-hops rate and
 * with the steps of the demand count.
 *
 * <p><b>Function.</b> {@link Objective#scalar} of the layout re-planned by the evaluator's screen
 * ({@link LayoutEvaluator#screen}: the preview planner on all-active layouts, which the caller confirms
 * with the exact one) (rate scale: the rate target, or
 * 1 bit/s when it is 0). A centre that leaves the volume or makes the relay's body overlap another node
 * is infeasible and scores −1, below every layout. The search box is the volume's bounding box (for an
 * open volume the nodes' bounding box widened by 100 µm).
 *
 * <p><b>Starts.</b> Each start point runs one CMA-ES with initial step σ (µm) and at most
 * {@code evaluationsPerStart} re-plans; the best feasible point over all runs is kept. Seeded
 * ({@link MersenneTwister}), so a run is deterministic.
 *
 * <p>Cost: at most starts × {@code evaluationsPerStart} incremental re-plans.
 */
final class RelayPlacement {

    /** Margin of the search box around the nodes in an open volume, µm. */
    private static final double OPEN_MARGIN_UM = 100;

    /** The best centre found and its screening ({@link LayoutEvaluator#screen}). */
    record Placed(Vec3 positionUm, Scenario scenario, LayoutEvaluator.Screened screened) {
    }

    private final LayoutEvaluator evaluator;
    private final int evaluationsPerStart;
    private final long seed;
    private final BooleanSupplier stop;

    /**
     * @param evaluator           re-plans candidate layouts
     * @param evaluationsPerStart re-plans per start point, ≥ 10
     * @param seed                random seed of the evolution strategy
     * @param stop                true when the search must end now (time limit, cancel)
     */
    RelayPlacement(LayoutEvaluator evaluator, int evaluationsPerStart, long seed, BooleanSupplier stop) {
        if (evaluationsPerStart < 10) {
            throw new IllegalArgumentException("evaluationsPerStart: must be >= 10, got " + evaluationsPerStart);
        }
        this.evaluator = evaluator;
        this.evaluationsPerStart = evaluationsPerStart;
        this.seed = seed;
        this.stop = stop;
    }

    /** Thrown inside an objective function or a progress callback to end a run or step early. */
    static final class Stopped extends RuntimeException {
        private static final long serialVersionUID = 1L;

        Stopped() {
            super(null, null, false, false);
        }
    }

    /**
     * The best centre of node {@code relayId} in {@code base} over runs from {@code startsUm}, or null
     * when no feasible centre was assessed.
     *
     * @param sigmaUm initial step of each run, µm, &gt; 0
     */
    Placed place(Scenario base, String relayId, List<Vec3> startsUm, double sigmaUm) {
        return place(base, p -> LayoutEdits.node(base, relayId, n -> LayoutEdits.moved(n, p)), startsUm, sigmaUm);
    }

    /**
     * The best centre for the layout {@code at} gives for a relay centre (throwing
     * {@link IllegalArgumentException} when invalid) over runs from {@code startsUm}, or null when no
     * feasible centre was assessed; {@code base} gives the search box and the rate target.
     */
    Placed place(Scenario base, Function<Vec3, Scenario> at, List<Vec3> startsUm, double sigmaUm) {
        double[][] box = box(base);
        double rateScale = base.targets().minRateBitsPerS() > 0 ? base.targets().minRateBitsPerS() : 1.0;
        Placed[] best = new Placed[1];
        double[] bestValue = {Double.NEGATIVE_INFINITY};
        for (int k = 0; k < startsUm.size() && !stop.getAsBoolean(); k++) {
            double[] x0 = clamp(startsUm.get(k).toArray(), box);
            CMAESOptimizer cmaes = new CMAESOptimizer(evaluationsPerStart, Double.POSITIVE_INFINITY, true, 0, 0,
                    new MersenneTwister(seed + k), false, null);
            ObjectiveFunction f = new ObjectiveFunction(x -> {
                if (stop.getAsBoolean()) {
                    throw new Stopped();
                }
                Vec3 p = Vec3.of(x);
                Scenario s;
                try {
                    s = at.apply(p);
                } catch (IllegalArgumentException invalid) {
                    return -1;
                }
                LayoutEvaluator.Screened a;
                try {
                    a = evaluator.screen(s);
                } catch (IllegalArgumentException unplannable) {
                    return -1;
                }
                double v = a.assessment().objective().scalar(rateScale);
                if (v > bestValue[0] || (v == bestValue[0]
                        && a.assessment().objective().betterThan(best[0].screened().assessment().objective()))) {
                    bestValue[0] = v;
                    best[0] = new Placed(p, s, a);
                }
                return v;
            });
            double sigma = Math.max(1e-3, sigmaUm);
            try {
                cmaes.optimize(new MaxEval(evaluationsPerStart), f, GoalType.MAXIMIZE, new InitialGuess(x0),
                        new SimpleBounds(box[0], box[1]), new CMAESOptimizer.Sigma(new double[] {sigma, sigma, sigma}),
                        new CMAESOptimizer.PopulationSize(6));
            } catch (TooManyEvaluationsException | Stopped ended) {
                // the best point seen is kept
            }
        }
        return best[0];
    }

    /** {lower, upper} corners of the search box, µm. */
    static double[][] box(Scenario s) {
        Volume v = s.volume();
        if (v instanceof Volume.Box b) {
            return new double[][] {b.minUm().toArray(), b.maxUm().toArray()};
        }
        if (v instanceof Volume.Cylinder c) {
            return new double[][] {{0, -c.radiusUm(), -c.radiusUm()}, {c.lengthUm(), c.radiusUm(), c.radiusUm()}};
        }
        double[] lo = {Double.POSITIVE_INFINITY, Double.POSITIVE_INFINITY, Double.POSITIVE_INFINITY};
        double[] hi = {Double.NEGATIVE_INFINITY, Double.NEGATIVE_INFINITY, Double.NEGATIVE_INFINITY};
        for (Node n : s.nodes()) {
            double[] p = n.positionUm().toArray();
            for (int i = 0; i < 3; i++) {
                lo[i] = Math.min(lo[i], p[i] - OPEN_MARGIN_UM);
                hi[i] = Math.max(hi[i], p[i] + OPEN_MARGIN_UM);
            }
        }
        return new double[][] {lo, hi};
    }

    private static double[] clamp(double[] x, double[][] box) {
        double[] out = x.clone();
        for (int i = 0; i < 3; i++) {
            out[i] = Math.min(box[1][i], Math.max(box[0][i], out[i]));
        }
        return out;
    }
}
