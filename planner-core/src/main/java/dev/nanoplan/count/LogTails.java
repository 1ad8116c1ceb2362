package dev.nanoplan.count;

import dev.nanoplan.math.LogSpace;
import java.util.ArrayList;
import java.util.List;

/**
 * Natural logarithms of the tail probabilities of a {@link CountLaw}, finite far below the
 * smallest double (e.g. ln P = −1280 for P ≈ 1e-556).
 *
 * <p><b>Method: exponential tilting</b> (F. Esscher, Skand. Aktuarietidskr. 15 (1932) 175–195;
 * see also J. A. Bucklew, <i>Introduction to Rare Event Simulation</i>, Springer 2004, ch. 3).
 * For θ real, the tilted law P_θ(y) = P(y)·e^{θy}/M(θ), M(θ) = E e^{θY}, is again a sum of
 * independent terms of the same families: Bin(n, p) → Bin(n, pe^θ/(1−p+pe^θ)),
 * Poisson(λ) → Poisson(λe^θ), and a mixture's weights w_i → w_i·M_i(θ)/M(θ) with tilted parts.
 * Then, exactly,
 * <pre>  P(Y ≥ τ) = exp(ln M(θ) − θτ) · Σ_{y ≥ τ} e^{−θ(y−τ)} P_θ(y).</pre>
 * θ ≥ 0 is chosen (bisection on the increasing tilted mean) so that the tilted mean is τ; the
 * sum then runs over the body of P_θ, which {@link ExactCountModel} computes accurately in the
 * linear domain, and the weights are ≤ 1. The exponent is accumulated per term as
 * ln M_t(θ) − θ·μ_t(θ) (minus a relative entropy: −n·[p_θ ln(p_θ/p) + q_θ ln(q_θ/q)] for a
 * binomial, λ(e^θ(1−θ) − 1) for a Poisson, Σ w_i(θ)(c_i − ln(w_i(θ)/w_i)) for a mixture), which
 * avoids cancelling large ln M against large θτ. The lower tail P(Y &lt; τ) is the same with
 * θ ≤ 0 and tilted mean τ − 1. When τ lies on the other side of the mean, the complement is
 * computed this way and ln(1 − P) is taken with {@code log1p}.
 *
 * <p><b>Accuracy.</b> About 1e-12 relative in P (i.e. absolute in ln P) for n ≤ 1e6; the
 * tilted binomial probability is rounded to a double, which costs about n·1e-16 relative (so
 * about 1e-7 at n = 1e9). The truncation of the tilted pmf (1e-15) enters relatively.
 *
 * <p><b>Cost.</b> One exact pmf of the tilted law (see {@link ExactCountModel}) plus about
 * 60 evaluations of the tilted mean. Callers scanning many τ where P &gt; 1e-200 can sum
 * {@link ExactCountModel} masses directly instead.
 */
public final class LogTails {

    private static final ExactCountModel MODEL = ExactCountModel.DEFAULT;
    private static final double LN_HALF = Math.log(0.5);

    private LogTails() {
    }

    /**
     * ln P(Y ≥ τ): 0 when τ ≤ the smallest possible value, −∞ when τ exceeds the largest.
     */
    public static double logUpperTail(CountLaw law, long tau) {
        return new Reuse(law).logUpperTail(tau);
    }

    /**
     * ln P(Y &lt; τ): −∞ when τ ≤ the smallest possible value, 0 when τ exceeds the largest.
     */
    public static double logLowerTail(CountLaw law, long tau) {
        return new Reuse(law).logLowerTail(tau);
    }

    /**
     * Log tails of one law at many nearby thresholds. The identity of the class comment holds for
     * every τ with the same θ, so a tilted pmf solved for one threshold τ₀ also gives the tail at
     * another τ, accurately as long as τ lies in the bulk of the tilted law: a tilted pmf is
     * reused when its weighted tail sum Σ e^{−θ(y−τ)} P_θ(y) at τ is at least
     * {@value #REUSE_MIN_SUM} (at τ₀ itself it is about 1/2, so the round-off relative to the sum
     * grows at most about tenfold, to about 1e-11 relative in P), otherwise a new tilted pmf is
     * solved for τ. For a single threshold the result equals the static methods' (they call this
     * class). Not thread-safe.
     */
    public static final class Reuse {

        private final CountLaw law;
        private final long min;
        private final long max;
        private final double mean;
        private final List<TiltedTail> up = new ArrayList<>(4);
        private final List<TiltedTail> down = new ArrayList<>(4);

        public Reuse(CountLaw law) {
            this.law = law;
            this.min = minValue(law);
            this.max = law.maxValue();
            this.mean = law.mean();
        }

        /** As {@link LogTails#logUpperTail(CountLaw, long)}. */
        public double logUpperTail(long tau) {
            if (tau <= min) {
                return 0;
            }
            if (tau > max) {
                return Double.NEGATIVE_INFINITY;
            }
            if (tau >= mean) {
                return tilted(tau, true);
            }
            double lower = tilted(tau, false);
            if (lower <= LN_HALF) {
                return Math.log1p(-Math.exp(lower));
            }
            return tilted(tau, true);
        }

        /** As {@link LogTails#logLowerTail(CountLaw, long)}. */
        public double logLowerTail(long tau) {
            if (tau <= min) {
                return Double.NEGATIVE_INFINITY;
            }
            if (tau > max) {
                return 0;
            }
            if (tau - 1 <= mean) {
                return tilted(tau, false);
            }
            double upper = tilted(tau, true);
            if (upper <= LN_HALF) {
                return Math.log1p(-Math.exp(upper));
            }
            return tilted(tau, false);
        }

        private double tilted(long tau, boolean upper) {
            List<TiltedTail> list = upper ? up : down;
            for (TiltedTail t : list) {
                double s = t.sum(tau);
                if (t.tau == tau || s >= REUSE_MIN_SUM) {
                    return t.exponent(tau) + Math.log(s);
                }
            }
            TiltedTail t = TiltedTail.of(law, tau, upper);
            list.add(t);
            return t.exponent(tau) + Math.log(t.sum(tau));
        }
    }

    /** Smallest weighted tail sum at which {@link Reuse} reads a tail from an existing tilted pmf. */
    public static final double REUSE_MIN_SUM = 0.05;

    /** Smallest possible value of the law (saturating). */
    static long minValue(CountLaw law) {
        long s = 0;
        for (CountTerm t : law.terms()) {
            long m = minValue(t);
            s = (s > Long.MAX_VALUE - m) ? Long.MAX_VALUE : s + m;
        }
        return s;
    }

    static long minValue(CountTerm t) {
        if (t instanceof BinomialTerm b) {
            return b.probability() == 1 ? b.trials() : 0;
        }
        if (t instanceof PoissonTerm) {
            return 0;
        }
        MixtureTerm m = (MixtureTerm) t;
        long min = Long.MAX_VALUE;
        for (int i = 0; i < m.parts().size(); i++) {
            if (m.weight(i) > 0) {
                min = Math.min(min, minValue(m.parts().get(i)));
            }
        }
        return min;
    }

    /**
     * The tilted law solved for the upper (θ ≥ 0) or lower (θ ≤ 0) tail at τ: ln of a tail at
     * any threshold t is {@link #exponent(long)} + ln {@link #sum(long)}.
     */
    private static final class TiltedTail {

        final long tau;
        final boolean upper;
        final double theta;
        /** Σ over terms of ln M_t(θ) − θ·μ_t(θ). */
        final double rates;
        /** Tilted mean Σ μ_t(θ). */
        final double meanTheta;
        final Window w;

        private TiltedTail(long tau, boolean upper, double theta, double rates, double meanTheta, Window w) {
            this.tau = tau;
            this.upper = upper;
            this.theta = theta;
            this.rates = rates;
            this.meanTheta = meanTheta;
            this.w = w;
        }

        static TiltedTail of(CountLaw law, long tau, boolean upper) {
            double target;
            if (upper) {
                target = Math.min(tau, law.maxValue() - 0.5);
            } else {
                target = Math.max(tau - 1, minValue(law) + 0.5);
            }
            double theta = solveTheta(law, target, upper);
            List<CountTerm> tilted = new ArrayList<>(law.terms().size());
            double exponent = 0;
            double meanTheta = 0;
            for (CountTerm t : law.terms()) {
                Tilt tl = tilt(t, theta);
                tilted.add(tl.term);
                exponent += tl.rate;
                meanTheta += tl.mean;
            }
            return new TiltedTail(tau, upper, theta, exponent, meanTheta, MODEL.window(new CountLaw(tilted)));
        }

        /** ln M(θ) − θ·t. */
        double exponent(long t) {
            return rates + theta * (meanTheta - t);
        }

        /** Σ_{y ≥ t} (upper) or Σ_{y &lt; t} (lower) of e^{−θ(y−t)}·P_θ(y). */
        double sum(long t) {
            double s = 0;
            long last = w.offset + w.length() - 1;
            if (upper) {
                long from = Math.max(t, w.offset);
                for (long y = from; y <= last; y++) {
                    s += Math.exp(-theta * (y - t)) * w.p[(int) (y - w.offset)];
                }
                if (t <= last + 1) {
                    s += w.above * Math.exp(-theta * (last + 1 - t));
                }
            } else {
                long to = Math.min(t - 1, last);
                for (long y = w.offset; y <= to; y++) {
                    s += Math.exp(-theta * (y - t)) * w.p[(int) (y - w.offset)];
                }
                if (t >= w.offset) {
                    s += w.below * Math.exp(-theta * (w.offset - 1 - t));
                }
            }
            return s;
        }
    }

    /** θ with tilted mean = target, restricted to θ ≥ 0 (upper) or θ ≤ 0 (lower). */
    static double solveTheta(CountLaw law, double target, boolean upper) {
        double f0 = tiltedMean(law, 0) - target;
        if (upper ? f0 >= 0 : f0 <= 0) {
            return 0;
        }
        double sign = upper ? 1 : -1;
        double lo = 0;
        double hi = 1;
        while (sign * (tiltedMean(law, sign * hi) - target) < 0) {
            lo = hi;
            hi *= 2;
            if (hi > 1e6) {
                break;
            }
        }
        for (int i = 0; i < 200 && hi - lo > 1e-14 * hi; i++) {
            double mid = 0.5 * (lo + hi);
            if (sign * (tiltedMean(law, sign * mid) - target) < 0) {
                lo = mid;
            } else {
                hi = mid;
            }
        }
        return sign * 0.5 * (lo + hi);
    }

    static double tiltedMean(CountLaw law, double theta) {
        double m = 0;
        for (CountTerm t : law.terms()) {
            m += tilt(t, theta).mean;
        }
        return m;
    }

    /**
     * A tilted term with its cumulant ln M(θ) ({@code logMgf}), tilted mean, and
     * {@code rate} = ln M(θ) − θ·mean.
     */
    record Tilt(CountTerm term, double logMgf, double mean, double rate) {
    }

    static Tilt tilt(CountTerm term, double theta) {
        if (term instanceof BinomialTerm b) {
            return tiltBinomial(b, theta);
        }
        if (term instanceof PoissonTerm t) {
            double lambda = t.mean();
            if (lambda == 0 || theta == 0) {
                return new Tilt(t, 0, lambda, 0);
            }
            double em1 = Math.expm1(theta);
            double mean = lambda * Math.exp(theta);
            double rate = lambda * em1 - theta * mean;
            return new Tilt(new PoissonTerm(mean), lambda * em1, mean, rate);
        }
        return tiltMixture((MixtureTerm) term, theta);
    }

    private static Tilt tiltBinomial(BinomialTerm b, double theta) {
        long n = b.trials();
        double p = b.probability();
        if (n == 0 || p == 0) {
            return new Tilt(b, 0, 0, 0);
        }
        if (p == 1) {
            return new Tilt(b, n * theta, n, 0);
        }
        if (theta == 0) {
            return new Tilt(b, 0, b.mean(), 0);
        }
        double q = 1 - p;
        // L = ln(q + p e^θ); a = ln(pθ/p) = θ − L; c = ln(qθ/q) = −L
        double lnA;
        double logM;
        if (theta > 1) {
            double t = Math.log(p + q * Math.exp(-theta));
            logM = theta + t;
            lnA = -t;
        } else {
            logM = Math.log1p(p * Math.expm1(theta));
            lnA = theta - logM;
        }
        double lnC = -logM;
        double pt = Math.min(1, p * Math.exp(lnA));
        double qt = Math.min(1, q * Math.exp(lnC));
        double rate = -n * (pt * lnA + qt * lnC);
        return new Tilt(new BinomialTerm(n, pt), n * logM, n * pt, rate);
    }

    private static Tilt tiltMixture(MixtureTerm m, double theta) {
        int k = m.parts().size();
        Tilt[] parts = new Tilt[k];
        double[] logW = new double[k];
        for (int i = 0; i < k; i++) {
            double w = m.weight(i);
            if (w > 0) {
                parts[i] = tilt(m.parts().get(i), theta);
                logW[i] = Math.log(w) + parts[i].logMgf;
            } else {
                logW[i] = Double.NEGATIVE_INFINITY;
            }
        }
        double logM = LogSpace.logSumExp(logW);
        double[] wt = new double[k];
        List<CountTerm> tp = new ArrayList<>(k);
        double mean = 0;
        double rate = 0;
        double wsum = 0;
        for (int i = 0; i < k; i++) {
            if (parts[i] == null) {
                tp.add(m.parts().get(i));
                continue;
            }
            double lw = logW[i] - logM;
            wt[i] = Math.exp(lw);
            wsum += wt[i];
            tp.add(parts[i].term);
            if (wt[i] > 0) {
                mean += wt[i] * parts[i].mean;
                rate += wt[i] * (parts[i].rate + Math.log(m.weight(i)) - lw);
            }
        }
        for (int i = 0; i < k; i++) {
            wt[i] /= wsum;
        }
        return new Tilt(new MixtureTerm(wt, tp), logM, mean, rate);
    }
}
