package dev.nanoplan.physics;

import java.util.function.DoubleUnaryOperator;
import org.apache.commons.numbers.gamma.Erfcx;

/**
 * First passage to a partially absorbing (reactive) sphere in an unbounded medium: a molecule
 * that reaches the surface binds with a finite rate, so some of them bounce off and may never
 * come back. The surface obeys the reactive (radiation) boundary condition of F. C. Collins and
 * G. E. Kimball, "Diffusion-controlled reaction rates", J. Colloid Sci. 4, 425–437, 1949:
 * D·∂c/∂ρ = κ·c at ρ = r, with κ the binding rate in µm/s (κ → ∞ is the perfect absorber of
 * {@link OpenSphereHitting}, κ → 0 a reflecting sphere).
 *
 * <p>With r, d, D, a = d − r, α = 1/r + κ/D (1/µm), x = a/√(4Dt), y = α·√(Dt) (so x·y = αa/2):
 * <pre>
 *   F(t)  = P∞·[erfc(x) − e^{αa + α²Dt}·erfc(x + y)] = P∞·e^{−x²}·[erfcx(x) − erfcx(x + y)]
 *   f(t)  = P∞·e^{−x²}·(y/t)·[1/√π − y·erfcx(x + y)]
 *   F(∞)  = P∞ = (r/d)·κr/(κr + D)
 *   f̂(s) = ∫₀^∞ f(t)e^{−st} dt = (r/d)·κr·e^{−a√(s/D)} / (κr + D + r√(sD))
 * </pre>
 * (the time-domain solution of the radiation boundary problem for a sphere, H. S. Carslaw and
 * J. C. Jaeger, <i>Conduction of Heat in Solids</i>, 2nd ed., Oxford, 1959, §13.3 (sphere with
 * surface heat transfer, point source outside); the Laplace form and P∞ as in S. Redner,
 * <i>A Guide to First-Passage Processes</i>, 2001, ch. 6, with the Collins–Kimball boundary. The
 * tests check F against quadrature of the Laplace form, and both limits in κ.)
 *
 * <p>First-order decay at rate λ: F_λ(t) = ∫₀ᵗ f(s)·e^{−λs} ds and F_λ(∞) = f̂(λ) in closed form;
 * F_λ(t) and the taps are integrated numerically ({@link AdaptiveGaussLegendre}) because the
 * reactive boundary adds a third error-function term to the closed form that cancels badly.
 *
 * <p>Numerics: never e^{αa + α²Dt} (it overflows) but the scaled erfcx of Commons Numbers. The
 * difference erfcx(x) − erfcx(x + y) is taken directly when y ≥ x (it keeps all but ~1 digit);
 * when y &lt; x (early times, or small κ) it is the integral (2/√π)·∫ₓ^{x+y} q(u) du of
 * q(u) = 1 − √π·u·erfcx(u) &gt; 0 by the 16-point rule, with q from the Laplace continued fraction
 * √π·erfcx(u) = 1/(u + ½/(u + 1/(u + (3/2)/(u + …)))) (80 terms, for u ≥ 2; 1e-16 relative) so
 * nothing cancels. The density is written with positive terms only:
 * 1/√π − y·erfcx(x + y) = [q(x + y) + √π·x·erfcx(x + y)]/√π. Accuracy: F and f to ~1e-14
 * relative without decay; ~1e-12 with decay (quadrature). Edge cases as in
 * {@link OpenSphereHitting}. Cost: O(1) per evaluation without decay, a few hundred density
 * evaluations with decay.
 */
public final class ReactiveSphereHitting implements HittingModel {

    private static final double SQRT_PI = Math.sqrt(Math.PI);
    private static final double INV_SQRT_PI = 1 / SQRT_PI;
    private static final int CONTINUED_FRACTION_TERMS = 80;
    private static final double CONTINUED_FRACTION_FROM = 2;

    private final OpenSphereHitting open;
    private final double bindingRateUmPerS;
    private final double decayRatePerS;
    /** α = 1/r + κ/D in 1/µm. */
    private final double alphaPerUm;
    /** F(∞) without decay. */
    private final double capture;
    private final double logCapture;
    private final double eventual;

    private ReactiveSphereHitting(OpenSphereHitting open, double bindingRateUmPerS, double decayRatePerS) {
        this.open = open;
        this.bindingRateUmPerS = bindingRateUmPerS;
        this.decayRatePerS = decayRatePerS;
        double r = open.radiusUm();
        double diff = open.diffusionUm2PerS();
        this.alphaPerUm = 1 / r + bindingRateUmPerS / diff;
        double kr = bindingRateUmPerS * r;
        this.capture = open.eventual() * (kr / (kr + diff));
        this.logCapture = open.logEventual() + Math.log(kr) - Math.log(kr + diff);
        this.eventual = decayRatePerS == 0 ? capture
            : open.eventual() * kr * Math.exp(-open.gapUm() * Math.sqrt(decayRatePerS / diff))
                / (kr + diff + r * Math.sqrt(decayRatePerS * diff));
    }

    /**
     * @param distanceUm d, finite, &gt; radiusUm
     * @param radiusUm r, finite, &gt; 0
     * @param diffusionUm2PerS D, finite, &gt; 0
     * @param bindingRateUmPerS κ in µm/s, finite and &gt; 0
     * @param halfLifeS half-life in s, &gt; 0; {@code null} or +∞ for no decay
     * @return the model
     * @throws IllegalArgumentException naming the bad parameter
     */
    public static ReactiveSphereHitting of(double distanceUm, double radiusUm, double diffusionUm2PerS,
            double bindingRateUmPerS, Double halfLifeS) {
        OpenSphereHitting open = OpenSphereHitting.of(distanceUm, radiusUm, diffusionUm2PerS);
        if (!(bindingRateUmPerS > 0 && bindingRateUmPerS < Double.POSITIVE_INFINITY)) {
            throw new IllegalArgumentException("bindingRateUmPerS: must be finite and > 0, got " + bindingRateUmPerS);
        }
        return new ReactiveSphereHitting(open, bindingRateUmPerS, DecayingSphereHitting.decayRatePerS(halfLifeS));
    }

    /** @return κ in µm/s */
    public double bindingRateUmPerS() {
        return bindingRateUmPerS;
    }

    @Override
    public double cumulative(double timeS) {
        if (Double.isNaN(timeS)) {
            return Double.NaN;
        }
        if (timeS <= 0) {
            return 0;
        }
        if (timeS == Double.POSITIVE_INFINITY) {
            return eventual;
        }
        if (decayRatePerS > 0) {
            return Math.min(eventual, AdaptiveGaussLegendre.integrate(decayedDensity(), 0, timeS));
        }
        return Math.min(capture, Math.exp(logCumulativeNoDecay(timeS)));
    }

    /**
     * {@inheritDoc}
     *
     * <p>With decay, where F_λ(t) is below the normal range, ln F(t) − λt is returned, which is
     * within λt of ln F_λ(t) (F·e^{−λt} ≤ F_λ ≤ F).
     */
    @Override
    public double logCumulative(double timeS) {
        if (Double.isNaN(timeS)) {
            return Double.NaN;
        }
        if (timeS <= 0) {
            return Double.NEGATIVE_INFINITY;
        }
        if (timeS == Double.POSITIVE_INFINITY) {
            return Math.log(eventual);
        }
        if (decayRatePerS > 0) {
            double f = cumulative(timeS);
            if (f >= Double.MIN_NORMAL) {
                return Math.log(f);
            }
            return Math.max(logCumulativeNoDecay(timeS) - decayRatePerS * timeS, -Double.MAX_VALUE);
        }
        return Math.max(logCumulativeNoDecay(timeS), -Double.MAX_VALUE);
    }

    /** ln P∞ − x² + ln[erfcx(x) − erfcx(x + y)]. */
    private double logCumulativeNoDecay(double timeS) {
        double x = open.argument(timeS);
        double y = alphaPerUm * Math.sqrt(open.diffusionUm2PerS() * timeS);
        return logCapture - x * x + Math.log(scaledDifference(x, y));
    }

    /** erfcx(x) − erfcx(x + y) for x, y ≥ 0, without cancellation. */
    static double scaledDifference(double x, double y) {
        if (y >= x) {
            return Erfcx.value(x) - Erfcx.value(x + y);
        }
        return 2 * INV_SQRT_PI * AdaptiveGaussLegendre.gauss(ReactiveSphereHitting::q, x, x + y);
    }

    /** q(u) = 1 − √π·u·erfcx(u), in (0, 1] for u ≥ 0. */
    static double q(double u) {
        if (u < CONTINUED_FRACTION_FROM) {
            return 1 - SQRT_PI * u * Erfcx.value(u);
        }
        double t = 0;
        for (int n = CONTINUED_FRACTION_TERMS; n > 0; n--) {
            t = 0.5 * n / (u + t);
        }
        return t / (u + t);
    }

    @Override
    public double density(double timeS) {
        if (Double.isNaN(timeS)) {
            return Double.NaN;
        }
        if (timeS <= 0 || timeS == Double.POSITIVE_INFINITY) {
            return 0;
        }
        double f = densityNoDecay(timeS);
        return decayRatePerS == 0 || f == 0 ? f : f * Math.exp(-decayRatePerS * timeS);
    }

    private double densityNoDecay(double timeS) {
        double x = open.argument(timeS);
        double y = alphaPerUm * Math.sqrt(open.diffusionUm2PerS() * timeS);
        double z = x + y;
        double bracket = q(z) + SQRT_PI * x * Erfcx.value(z);
        double logF = logCapture - x * x + Math.log(y / timeS * INV_SQRT_PI * bracket);
        return Math.exp(logF);
    }

    private DoubleUnaryOperator decayedDensity() {
        return t -> t <= 0 ? 0 : densityNoDecay(t) * Math.exp(-decayRatePerS * t);
    }

    @Override
    public double eventual() {
        return eventual;
    }

    /**
     * {@inheritDoc} Without decay see {@link Taps}; with decay each slot is the integral of
     * f(t)·e^{−λt} over the slot ({@link AdaptiveGaussLegendre}).
     */
    @Override
    public double[] taps(double symbolTimeS, int memorySymbols) {
        if (decayRatePerS == 0) {
            return Taps.of(this, symbolTimeS, memorySymbols);
        }
        Taps.check(symbolTimeS, memorySymbols);
        double[] taps = new double[memorySymbols + 1];
        DoubleUnaryOperator f = decayedDensity();
        for (int k = 0; k <= memorySymbols; k++) {
            double tap = AdaptiveGaussLegendre.integrate(f, k * symbolTimeS, (k + 1.0) * symbolTimeS);
            taps[k] = tap > 0 ? tap : 0;
        }
        return taps;
    }

    @Override
    public String toString() {
        return "ReactiveSphereHitting[distanceUm=" + open.distanceUm() + ", radiusUm=" + open.radiusUm()
            + ", diffusionUm2PerS=" + open.diffusionUm2PerS() + ", bindingRateUmPerS=" + bindingRateUmPerS
            + ", decayRatePerS=" + decayRatePerS + "]";
    }
}
