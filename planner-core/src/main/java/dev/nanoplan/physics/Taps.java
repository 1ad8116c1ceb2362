package dev.nanoplan.physics;

/**
 * Per-slot hit probabilities p_k = F((k+1)T) − F(kT), k = 0..L, of any {@link HittingModel},
 * without catastrophic cancellation. Shared by every model so they all compute taps alike.
 *
 * <p>Method, per slot [kT, (k+1)T]:
 * <ul>
 *   <li>if F(kT) ≤ F((k+1)T)/2 the two cumulative values do not cancel (the difference keeps
 *       the relative accuracy of F to within a factor 3), so p_k is their difference. This
 *       covers slot 0 and every early slot where both values are tiny (down to 1e-300);</li>
 *   <li>otherwise the difference would lose digits (for large k, or when F has saturated,
 *       p_k may be below double epsilon relative to F), so p_k = ∫ f(t) dt over the slot by
 *       adaptive Gauss–Legendre quadrature of the density ({@link AdaptiveGaussLegendre}). Because k ≥ 1 here, the density's
 *       essential singularity at t = 0 lies at least one slot away, so the rule converges
 *       geometrically (16 points on [T, 2T] already reach ~1e-16 for t^(-3/2)·e^(−c/t)).</li>
 * </ul>
 * Accuracy: relative error ≤ ~1e-12 per tap wherever the tap is a normal double (checked in
 * the tests against Commons Math's iterative Gauss–Legendre integrator to 1e-10 for taps from
 * 1e-250 up and k up to 10^4). Taps are never negative or NaN; a tap whose value is below the
 * double range is 0. Sum of taps = F((L+1)T) to ~1e-13 relative.
 *
 * <p>Cost: L + 1 evaluations of F, plus ≥ 48 density evaluations per slot that needs
 * quadrature.
 */
final class Taps {

    private Taps() {
    }

    /**
     * @param model the hitting law
     * @param symbolTimeS T in s, finite and &gt; 0, with (L+1)·T finite
     * @param memorySymbols L ≥ 0
     * @return p_0..p_L (length L + 1)
     */
    static double[] of(HittingModel model, double symbolTimeS, int memorySymbols) {
        check(symbolTimeS, memorySymbols);
        double[] taps = new double[memorySymbols + 1];
        double lower = 0;
        for (int k = 0; k <= memorySymbols; k++) {
            double startS = k * symbolTimeS;
            double endS = (k + 1.0) * symbolTimeS;
            double upper = model.cumulative(endS);
            double tap = lower <= 0.5 * upper ? upper - lower : integrateDensity(model, startS, endS);
            taps[k] = tap > 0 ? tap : 0;
            lower = upper;
        }
        return taps;
    }

    /** Checks T and L as {@link #of} documents. */
    static void check(double symbolTimeS, int memorySymbols) {
        if (!(symbolTimeS > 0 && symbolTimeS < Double.POSITIVE_INFINITY)) {
            throw new IllegalArgumentException("symbolTimeS: must be finite and > 0, got " + symbolTimeS);
        }
        if (memorySymbols < 0) {
            throw new IllegalArgumentException("memorySymbols: must be >= 0, got " + memorySymbols);
        }
        if (!Double.isFinite((memorySymbols + 1.0) * symbolTimeS)) {
            throw new IllegalArgumentException("memorySymbols: (memorySymbols + 1) * symbolTimeS overflows, got "
                + memorySymbols + " and " + symbolTimeS);
        }
    }

    private static double integrateDensity(HittingModel model, double lowS, double highS) {
        return AdaptiveGaussLegendre.integrate(model::density, lowS, highS);
    }
}
