package dev.nanoplan.physics;

import java.util.TreeSet;
import java.util.function.DoubleUnaryOperator;

import org.apache.commons.math3.analysis.integration.IterativeLegendreGaussIntegrator;

/**
 * Test-side reference: the published densities written out literally and integrated with
 * Commons Math 3.6.1 {@link IterativeLegendreGaussIntegrator}, independently of the production
 * code's closed forms and of its own quadrature.
 *
 * <p>To keep the library integrator accurate the interval is cut where the integrand changes
 * scale: at s = c/(c/hi + j), j = 1..60, with c = a²/(4D) (unit steps of the exponent a²/(4Ds)),
 * at hi/2^j down to the last of those (the power-law tail), and at lo + j/λ (the decay factor); each piece is integrated
 * in a shifted variable u ↦ g(lo + u) so the nodes do not lose digits to a large offset. The
 * part of [0, hi] below the last cut carries less than e^{-60} of the integral and is dropped.
 * Each piece is converged to 1e-13 relative or 1e-290 absolute (pieces that have underflowed
 * to subnormal noise cannot reach a relative target); tests compare values ≥ 1e-250 only.
 */
final class ReferenceQuadrature {

    private static final IterativeLegendreGaussIntegrator INTEGRATOR =
        new IterativeLegendreGaussIntegrator(8, 1e-13, 1e-290, 2, 40);

    /** Fail fast rather than grind: no piece needs anywhere near this many points. */
    private static final int MAX_EVALUATIONS = 2_000_000;

    private ReferenceQuadrature() {
    }

    /**
     * First-passage density to an absorbing sphere in an open medium, written out from
     * S. Redner, A Guide to First-Passage Processes, 2001 (docs/architecture.md §5.1), times e^{−λt}
     * (docs/architecture.md §5.2): f(t) = (r/d)·a/√(4πDt³)·exp(−a²/(4Dt))·exp(−λt).
     */
    static DoubleUnaryOperator density(double distanceUm, double radiusUm, double diffusionUm2PerS,
                                       double decayRatePerS) {
        double gap = distanceUm - radiusUm;
        return t -> t <= 0 ? 0
            : radiusUm / distanceUm * gap / Math.sqrt(4 * Math.PI * diffusionUm2PerS * t * t * t)
                * Math.exp(-gap * gap / (4 * diffusionUm2PerS * t)) * Math.exp(-decayRatePerS * t);
    }

    /**
     * ∫ f over [lo, hi] for the density above.
     *
     * @param scaleS c = a²/(4D) in s
     * @param decayRatePerS λ (0 for none)
     */
    static double integrate(DoubleUnaryOperator density, double scaleS, double decayRatePerS,
                            double lo, double hi) {
        TreeSet<Double> cuts = new TreeSet<>();
        cuts.add(hi);
        double u0 = scaleS / hi;
        for (int j = 1; j <= 60; j++) {
            cuts.add(scaleS / (u0 + j));
            if (decayRatePerS > 0) {
                cuts.add(lo + j / decayRatePerS);
            }
        }
        double floor = scaleS / (u0 + 60);
        for (double s = hi / 2; s > floor && s > lo; s /= 2) {
            cuts.add(s);
        }
        double sum = 0;
        double left = lo;
        for (double cut : cuts.tailSet(lo, false)) {
            if (cut > hi) {
                break;
            }
            if (lo == 0 && left == 0) {
                left = cut; // drop [0, first cut]: below e^{-60} of the total
                continue;
            }
            double start = left;
            sum += INTEGRATOR.integrate(MAX_EVALUATIONS, u -> density.applyAsDouble(start + u), 0, cut - start);
            left = cut;
        }
        return sum;
    }
}
