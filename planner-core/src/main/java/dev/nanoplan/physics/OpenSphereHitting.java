package dev.nanoplan.physics;

import dev.nanoplan.math.LogSpace;
import org.apache.commons.numbers.gamma.Erfc;

/**
 * First passage of a Brownian molecule to a perfectly absorbing sphere in an unbounded medium
 * (no walls, no flow, no decay), released at a point at distance d from the sphere centre.
 *
 * <p>With radius r, diffusion coefficient D, gap a = d − r and x(t) = a / √(4Dt):
 * <pre>
 *   F(t) = (r/d)·erfc(x(t))                          fraction absorbed by t
 *   f(t) = (r/d)·a / √(4πDt³) · exp(−a²/(4Dt))       its density, 1/s
 *   F(∞) = r/d                                       the rest escapes to infinity
 * </pre>
 * (S. Redner, <i>A Guide to First-Passage Processes</i>, Cambridge University Press, 2001,
 * ch. 6, first passage to a sphere in three dimensions; the eventual capture probability r/d
 * also in H. C. Berg, <i>Random Walks in Biology</i>, Princeton University Press, expanded ed.
 * 1993.)
 *
 * <p>Units: distances in µm, D in µm²/s, times in s. Accuracy: F and f to a few ulp times
 * max(1, x²) relative (Commons Numbers {@link Erfc} is accurate to a few ulp; the rounding of
 * x² in exp(−x²) dominates for large x); {@link #logCumulative} via {@link LogSpace#logErfc} stays
 * finite where F underflows (x &gt; ~26.5, i.e. t &lt; a²/(2800·D)). Edge cases: t ≤ 0 → F = f = 0;
 * t = +∞ → F = r/d, f = 0; NaN → NaN; a gap as small as one ulp of d is accepted (F rises to
 * r/d almost at once). Each evaluation is O(1).
 */
public final class OpenSphereHitting implements HittingModel {

    private static final double HALF_LOG_PI = 0.5 * Math.log(Math.PI);
    private static final double INV_SQRT_PI = 1 / Math.sqrt(Math.PI);
    /** Beyond this x², exp(−x²) is evaluated together with the prefactor in log space. */
    private static final double DIRECT_EXPONENT_LIMIT = 700;

    private final double distanceUm;
    private final double radiusUm;
    private final double diffusionUm2PerS;
    private final double gapUm;
    private final double eventual;
    private final double logEventual;
    /** a / √(4D) in √s: x(t) = this / √t. */
    private final double gapOverSqrt4D;

    private OpenSphereHitting(double distanceUm, double radiusUm, double diffusionUm2PerS) {
        this.distanceUm = distanceUm;
        this.radiusUm = radiusUm;
        this.diffusionUm2PerS = diffusionUm2PerS;
        this.gapUm = distanceUm - radiusUm;
        this.eventual = radiusUm / distanceUm;
        this.logEventual = Math.log(radiusUm) - Math.log(distanceUm);
        this.gapOverSqrt4D = gapUm / Math.sqrt(4 * diffusionUm2PerS);
    }

    /**
     * @param distanceUm d, centre of the receiver to the release point, finite, &gt; radiusUm
     * @param radiusUm r, finite, &gt; 0
     * @param diffusionUm2PerS D, finite, &gt; 0
     * @return the model
     * @throws IllegalArgumentException naming the bad parameter
     */
    public static OpenSphereHitting of(double distanceUm, double radiusUm, double diffusionUm2PerS) {
        if (!(radiusUm > 0 && radiusUm < Double.POSITIVE_INFINITY)) {
            throw new IllegalArgumentException("radiusUm: must be finite and > 0, got " + radiusUm);
        }
        if (!(distanceUm > radiusUm && distanceUm < Double.POSITIVE_INFINITY)) {
            throw new IllegalArgumentException("distanceUm: must be finite and > radiusUm (" + radiusUm
                + "), got " + distanceUm);
        }
        if (!(diffusionUm2PerS > 0 && diffusionUm2PerS < Double.POSITIVE_INFINITY)) {
            throw new IllegalArgumentException("diffusionUm2PerS: must be finite and > 0, got "
                + diffusionUm2PerS);
        }
        return new OpenSphereHitting(distanceUm, radiusUm, diffusionUm2PerS);
    }

    /** @return d in µm */
    public double distanceUm() {
        return distanceUm;
    }

    /** @return r in µm */
    public double radiusUm() {
        return radiusUm;
    }

    /** @return D in µm²/s */
    public double diffusionUm2PerS() {
        return diffusionUm2PerS;
    }

    /** @return a = d − r in µm */
    public double gapUm() {
        return gapUm;
    }

    /** x(t) = a / √(4Dt), dimensionless; t &gt; 0. */
    double argument(double timeS) {
        return gapOverSqrt4D / Math.sqrt(timeS);
    }

    /** ln(r/d). */
    double logEventual() {
        return logEventual;
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
        return eventual * Erfc.value(argument(timeS));
    }

    /**
     * {@inheritDoc}
     *
     * <p>ln(r/d) + ln erfc(x(t)); absolute error ~1e-16·max(1, x²). Where ln F is below the
     * double range (x² overflows, only for t below ~1e-300 s with ordinary geometry) the result
     * is −{@link Double#MAX_VALUE}, the nearest finite double.
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
            return logEventual;
        }
        return Math.max(logEventual + LogSpace.logErfc(argument(timeS)), -Double.MAX_VALUE);
    }

    @Override
    public double density(double timeS) {
        if (Double.isNaN(timeS)) {
            return Double.NaN;
        }
        if (timeS <= 0 || timeS == Double.POSITIVE_INFINITY) {
            return 0;
        }
        // f = (r/d) · x / (√π · t) · exp(−x²)
        double x = argument(timeS);
        double x2 = x * x;
        if (x2 < DIRECT_EXPONENT_LIMIT) {
            return eventual * INV_SQRT_PI * (x / timeS) * Math.exp(-x2);
        }
        return Math.exp(logEventual - HALF_LOG_PI + Math.log(x) - Math.log(timeS) - x2);
    }

    @Override
    public double eventual() {
        return eventual;
    }

    /** {@inheritDoc} See {@link Taps} for the method and its accuracy. */
    @Override
    public double[] taps(double symbolTimeS, int memorySymbols) {
        return Taps.of(this, symbolTimeS, memorySymbols);
    }

    @Override
    public String toString() {
        return "OpenSphereHitting[distanceUm=" + distanceUm + ", radiusUm=" + radiusUm
            + ", diffusionUm2PerS=" + diffusionUm2PerS + "]";
    }
}
