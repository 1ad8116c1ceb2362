package dev.nanoplan.physics;

import dev.nanoplan.math.LogSpace;
import org.apache.commons.numbers.gamma.Erfcx;

/**
 * First passage to a perfectly absorbing sphere in an unbounded medium for a molecule that
 * also degrades by first-order kinetics with rate λ = ln 2 / half-life: a molecule counts only
 * if it is absorbed before it decays.
 *
 * <p>With r, d, D, a = d − r, x = a/√(4Dt), y = √(λt) and b = a√(λ/D) (= 2xy):
 * <pre>
 *   F_λ(t) = ∫₀ᵗ f(s)·e^{−λs} ds
 *          = (r/d)·½·[e^{−b}·erfc(x − y) + e^{b}·erfc(x + y)]
 *   f_λ(t) = f(t)·e^{−λt}            (f the open-medium density, {@link OpenSphereHitting})
 *   F_λ(∞) = (r/d)·e^{−b}
 * </pre>
 * (F_λ(∞) is the Laplace transform of the open-medium density f at λ, S. Redner, <i>A Guide
 * to First-Passage Processes</i>, Cambridge University Press, 2001, ch. 6; the finite-t form is
 * the closed-form integral of a·s^{-3/2}·e^{−a²/(4Ds) − λs} as stated in docs/architecture.md §5.2, and is
 * checked in the tests against numerical quadrature of f(s)·e^{−λs}.)
 *
 * <p>Numerics: the second term multiplies a huge e^{b} by a tiny erfc. Both terms are
 * evaluated as logarithms, ln e^{−b}erfc(x−y) = −b + ln erfc(x−y) and
 * ln e^{b}erfc(x+y) = b + ln erfc(x+y), with {@link LogSpace#logErfc} (which uses the scaled function
 * erfcx of Commons Numbers), and combined by log-sum-exp; nothing overflows and no NaN arises.
 * Once y − x ≥ 2 (F_λ within 0.5 % of its limit) F_λ is computed as F_λ(∞) minus the tail
 * (r/d)·½·e^{−b−(y−x)²}·[erfcx(y−x) − erfcx(y+x)], whose rounding noise is below 1 % of an
 * ulp of F_λ; this keeps F_λ non-decreasing and never above F_λ(∞) near saturation.
 * Accuracy: relative error of F_λ ~1e-16·max(1, x² + y², |ln F_λ|), i.e. ≤ ~1e-13 wherever
 * F_λ is a normal double. As the half-life grows the model tends continuously to the open one
 * (y, b → 0); a {@code null} or infinite half-life gives exactly the open model (every call
 * delegates to it). Edge cases as in {@link OpenSphereHitting}. Each evaluation is O(1).
 */
public final class DecayingSphereHitting implements HittingModel {

    private static final double LN2 = Math.log(2);
    /** From y − x ≥ this on, F_λ is computed as F_λ(∞) minus its tail (erfc(2) ≈ 0.005). */
    private static final double TAIL_FORM_LIMIT = 2;
    /** Beyond this λt, e^{−λt} is combined with the density in log space. */
    private static final double DIRECT_EXPONENT_LIMIT = 700;

    private final OpenSphereHitting open;
    private final double halfLifeS;
    private final double decayRatePerS;
    private final double sqrtDecayRate;
    /** b = a·√(λ/D). */
    private final double exponentB;
    private final double eventual;
    private final double logEventual;

    private DecayingSphereHitting(OpenSphereHitting open, double halfLifeS) {
        this.open = open;
        this.halfLifeS = halfLifeS;
        this.decayRatePerS = halfLifeS == Double.POSITIVE_INFINITY ? 0 : LN2 / halfLifeS;
        this.sqrtDecayRate = Math.sqrt(decayRatePerS);
        this.exponentB = open.gapUm() * Math.sqrt(decayRatePerS / open.diffusionUm2PerS());
        this.logEventual = open.logEventual() - exponentB;
        this.eventual = open.eventual() * Math.exp(-exponentB);
    }

    /**
     * @param distanceUm d, finite, &gt; radiusUm
     * @param radiusUm r, finite, &gt; 0
     * @param diffusionUm2PerS D, finite, &gt; 0
     * @param halfLifeS half-life in s, &gt; 0; {@code null} or +∞ for no decay
     * @return the model
     * @throws IllegalArgumentException naming the bad parameter
     */
    public static DecayingSphereHitting of(double distanceUm, double radiusUm, double diffusionUm2PerS,
                                           Double halfLifeS) {
        OpenSphereHitting open = OpenSphereHitting.of(distanceUm, radiusUm, diffusionUm2PerS);
        double halfLife = halfLifeS == null ? Double.POSITIVE_INFINITY : halfLifeS;
        if (!(halfLife > 0)) {
            throw new IllegalArgumentException("halfLifeS: must be > 0 (or null for no decay), got " + halfLifeS);
        }
        return new DecayingSphereHitting(open, halfLife);
    }

    /**
     * λ = ln 2 / half-life, checked as {@link #of} checks it; shared by the receiver models.
     *
     * @param halfLifeS &gt; 0, or {@code null} / +∞ for no decay
     * @return λ in 1/s, 0 for no decay
     */
    static double decayRatePerS(Double halfLifeS) {
        double halfLife = halfLifeS == null ? Double.POSITIVE_INFINITY : halfLifeS;
        if (!(halfLife > 0)) {
            throw new IllegalArgumentException("halfLifeS: must be > 0 (or null for no decay), got " + halfLifeS);
        }
        return halfLife == Double.POSITIVE_INFINITY ? 0 : LN2 / halfLife;
    }

    /** @return the same geometry without decay */
    public OpenSphereHitting withoutDecay() {
        return open;
    }

    /** @return half-life in s, +∞ for no decay */
    public double halfLifeS() {
        return halfLifeS;
    }

    /** @return λ = ln 2 / half-life in 1/s (0 for no decay) */
    public double decayRatePerS() {
        return decayRatePerS;
    }

    private boolean noDecay() {
        return decayRatePerS == 0;
    }

    @Override
    public double cumulative(double timeS) {
        if (noDecay()) {
            return open.cumulative(timeS);
        }
        if (Double.isNaN(timeS)) {
            return Double.NaN;
        }
        if (timeS <= 0) {
            return 0;
        }
        if (timeS == Double.POSITIVE_INFINITY) {
            return eventual;
        }
        double x = open.argument(timeS);
        double y = sqrtDecayRate * Math.sqrt(timeS);
        double u = y - x;
        if (u >= TAIL_FORM_LIMIT) {
            return Math.max(0, eventual - eventual * tailFraction(u, y + x));
        }
        double first = Math.exp(-exponentB + LogSpace.logErfc(x - y));
        double second = Math.exp(exponentB + LogSpace.logErfc(x + y));
        return Math.min(eventual, open.eventual() * 0.5 * (first + second));
    }

    /**
     * {@inheritDoc}
     *
     * <p>Absolute error ~1e-16·max(1, x² + y²); −{@link Double#MAX_VALUE} where ln F_λ is below
     * the double range.
     */
    @Override
    public double logCumulative(double timeS) {
        if (noDecay()) {
            return open.logCumulative(timeS);
        }
        if (Double.isNaN(timeS)) {
            return Double.NaN;
        }
        if (timeS <= 0) {
            return Double.NEGATIVE_INFINITY;
        }
        if (timeS == Double.POSITIVE_INFINITY) {
            return logEventual;
        }
        return Math.max(logCumulativeFinite(timeS), -Double.MAX_VALUE);
    }

    /** ln F_λ(t) for finite t &gt; 0 (may be −∞ if below the double range). */
    private double logCumulativeFinite(double timeS) {
        double x = open.argument(timeS);
        double y = sqrtDecayRate * Math.sqrt(timeS);
        if (y - x >= TAIL_FORM_LIMIT) {
            return logEventual + Math.log1p(-tailFraction(y - x, y + x));
        }
        double logFirst = -exponentB + LogSpace.logErfc(x - y);
        double logSecond = exponentB + LogSpace.logErfc(x + y);
        return open.logEventual() - LN2 + LogSpace.logSumExp(logFirst, logSecond);
    }

    /**
     * 1 − F_λ(t)/F_λ(∞) = ½·e^{−u²}·[erfcx(u) − erfcx(v)] with u = y − x ≥ 2, v = y + x
     * (from erfc(−u) = 2 − erfc(u) and e^{2b}·erfc(v) = e^{v² − u²}·erfc(v)); in [0, 0.003).
     * The subtraction of the two erfcx values may lose digits, but only of this small fraction.
     */
    private static double tailFraction(double u, double v) {
        double fraction = 0.5 * Math.exp(-u * u) * (Erfcx.value(u) - Erfcx.value(v));
        return fraction > 0 ? fraction : 0;
    }

    @Override
    public double density(double timeS) {
        if (noDecay()) {
            return open.density(timeS);
        }
        double openDensity = open.density(timeS);
        if (!(openDensity > 0)) {
            return openDensity; // 0 or NaN
        }
        double decayExponent = decayRatePerS * timeS;
        if (decayExponent < DIRECT_EXPONENT_LIMIT) {
            return openDensity * Math.exp(-decayExponent);
        }
        return Math.exp(Math.log(openDensity) - decayExponent);
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
        return "DecayingSphereHitting[distanceUm=" + open.distanceUm() + ", radiusUm=" + open.radiusUm()
            + ", diffusionUm2PerS=" + open.diffusionUm2PerS() + ", halfLifeS=" + halfLifeS + "]";
    }
}
