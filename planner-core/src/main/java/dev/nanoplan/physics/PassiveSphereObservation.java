package dev.nanoplan.physics;

import org.apache.commons.numbers.gamma.Erfcx;

/**
 * A passive (transparent) spherical observer in an unbounded medium: it neither absorbs nor
 * disturbs the molecules and counts those inside it at one sampling instant per slot. Tap k is
 * the probability that a molecule released at t = 0 at distance d from the centre is inside the
 * sphere at t_k = k·T + offset (offset in (0, T], by default T: the end of the slot).
 *
 * <p>With radius r, diffusion coefficient D, a = d − r, b = d + r and s = √(4Dt), the free-space
 * Green's function G(x, t) = (4πDt)^{-3/2}·exp(−|x − x₀|²/(4Dt)) integrated over the ball gives
 * <pre>
 *   P(t) = ½·[erf((r − d)/s) + erf((r + d)/s)] + s/(2d√π)·[e^{−b²/s²} − e^{−a²/s²}]
 *        = ½·e^{−a²/s²}·[erfcx(a/s) − c] − ½·e^{−b²/s²}·[erfcx(b/s) − c],   c = s/(d√π)
 * </pre>
 * (the integral over directions reduces the ball integral to
 * P(t) = 1/(d·s·√π)·∫₀ʳ ρ·[e^{−(d−ρ)²/s²} − e^{−(d+ρ)²/s²}] dρ, which integrates in closed form;
 * the same expression is used by A. Noel, K. C. Cheung and R. Schober, "Improving receiver
 * performance of diffusive molecular communication with enzymes", IEEE Trans. NanoBiosci. 13(1),
 * 2014). With first-order decay at rate λ = ln 2 / half-life a molecule is still there with
 * probability e^{−λt}, so P_λ(t) = P(t)·e^{−λt}.
 *
 * <p>Numerics: the erfcx form never overflows, but the two halves cancel for very early times
 * (a/s ≳ 10, P below ~1e-40 for usual geometry) and for very late ones (s ≫ d, where P ≈ volume
 * × peak density). Where the closed form keeps fewer than 13 digits (its value is below 1e-3 of
 * the larger half) P is computed instead from the radial integral above written with positive
 * terms only, ρ·e^{−(d−ρ)²/s²}·(−expm1(−4ρd/s²)), by {@link AdaptiveGaussLegendre}. Accuracy:
 * relative error ≤ ~1e-12 wherever P is a normal double (checked in the tests against Commons
 * Math quadrature of the Green's function over the ball in spherical coordinates); values below
 * the double range are 0. Each evaluation is O(1) (closed form) or a few hundred exponentials
 * (quadrature).
 */
public final class PassiveSphereObservation implements TapModel {

    private static final double INV_SQRT_PI = 1 / Math.sqrt(Math.PI);
    /** The closed form is used while its value is at least this fraction of its larger half. */
    private static final double CANCELLATION_LIMIT = 1e-3;

    private final double distanceUm;
    private final double radiusUm;
    private final double diffusionUm2PerS;
    private final double decayRatePerS;
    private final Double samplingOffsetS;

    private PassiveSphereObservation(double distanceUm, double radiusUm, double diffusionUm2PerS,
            double decayRatePerS, Double samplingOffsetS) {
        this.distanceUm = distanceUm;
        this.radiusUm = radiusUm;
        this.diffusionUm2PerS = diffusionUm2PerS;
        this.decayRatePerS = decayRatePerS;
        this.samplingOffsetS = samplingOffsetS;
    }

    /**
     * @param distanceUm d, centre of the observer to the release point, finite, &gt; radiusUm
     * @param radiusUm r, finite, &gt; 0
     * @param diffusionUm2PerS D, finite, &gt; 0
     * @param halfLifeS half-life in s, &gt; 0; {@code null} or +∞ for no decay
     * @param samplingOffsetS the sampling instant after each slot starts, finite and &gt; 0;
     *     {@code null} for the end of the slot
     * @return the model
     * @throws IllegalArgumentException naming the bad parameter
     */
    public static PassiveSphereObservation of(double distanceUm, double radiusUm, double diffusionUm2PerS,
            Double halfLifeS, Double samplingOffsetS) {
        OpenSphereHitting.of(distanceUm, radiusUm, diffusionUm2PerS); // the same geometry checks
        double lambda = DecayingSphereHitting.decayRatePerS(halfLifeS);
        if (samplingOffsetS != null && !(samplingOffsetS > 0 && samplingOffsetS < Double.POSITIVE_INFINITY)) {
            throw new IllegalArgumentException("samplingOffsetS: must be finite and > 0, got " + samplingOffsetS);
        }
        return new PassiveSphereObservation(distanceUm, radiusUm, diffusionUm2PerS, lambda, samplingOffsetS);
    }

    /** @return the sampling offset in s, or {@code null} for the end of the slot */
    public Double samplingOffsetS() {
        return samplingOffsetS;
    }

    /**
     * P_λ(t): probability that the molecule is inside the sphere (and not decayed) at t.
     *
     * @param timeS t in s
     * @return in [0, 1]; 0 for t ≤ 0 or t = +∞; NaN for NaN
     */
    public double insideProbability(double timeS) {
        if (Double.isNaN(timeS)) {
            return Double.NaN;
        }
        if (timeS <= 0 || timeS == Double.POSITIVE_INFINITY) {
            return 0;
        }
        double p = withoutDecay(timeS);
        return decayRatePerS == 0 ? p : p * Math.exp(-decayRatePerS * timeS);
    }

    private double withoutDecay(double timeS) {
        double s = Math.sqrt(4 * diffusionUm2PerS * timeS);
        double xa = (distanceUm - radiusUm) / s;
        double xb = (distanceUm + radiusUm) / s;
        double c = s * INV_SQRT_PI / distanceUm;
        double near = 0.5 * Math.exp(-xa * xa) * (Erfcx.value(xa) - c);
        double far = 0.5 * Math.exp(-xb * xb) * (Erfcx.value(xb) - c);
        double p = near - far;
        if (p >= CANCELLATION_LIMIT * Math.max(Math.abs(near), Math.abs(far))) {
            return Math.min(p, 1);
        }
        double inv = 1 / (s * s);
        double d = distanceUm;
        double integral = AdaptiveGaussLegendre.integrate(rho -> {
            double gap = d - rho;
            return rho * Math.exp(-gap * gap * inv) * -Math.expm1(-4 * rho * d * inv);
        }, 0, radiusUm);
        double q = integral * INV_SQRT_PI / (d * s);
        return q > 0 ? Math.min(q, 1) : 0;
    }

    /**
     * {@inheritDoc}
     *
     * <p>p_k = P_λ(k·T + offset). Unlike absorption taps, a molecule may be counted in several
     * slots, so the taps need not sum to at most 1.
     *
     * @throws IllegalArgumentException if T is not finite and &gt; 0, L &lt; 0, or the offset
     *     exceeds T
     */
    @Override
    public double[] taps(double symbolTimeS, int memorySymbols) {
        if (!(symbolTimeS > 0 && symbolTimeS < Double.POSITIVE_INFINITY)) {
            throw new IllegalArgumentException("symbolTimeS: must be finite and > 0, got " + symbolTimeS);
        }
        if (memorySymbols < 0) {
            throw new IllegalArgumentException("memorySymbols: must be >= 0, got " + memorySymbols);
        }
        double offset = samplingOffsetS == null ? symbolTimeS : samplingOffsetS;
        if (offset > symbolTimeS) {
            throw new IllegalArgumentException("samplingOffsetS: must be <= the symbol time " + symbolTimeS
                + " s, got " + offset);
        }
        double[] taps = new double[memorySymbols + 1];
        for (int k = 0; k <= memorySymbols; k++) {
            taps[k] = insideProbability(k * symbolTimeS + offset);
        }
        return taps;
    }

    @Override
    public String toString() {
        return "PassiveSphereObservation[distanceUm=" + distanceUm + ", radiusUm=" + radiusUm
            + ", diffusionUm2PerS=" + diffusionUm2PerS + ", decayRatePerS=" + decayRatePerS
            + ", samplingOffsetS=" + samplingOffsetS + "]";
    }
}
