package dev.nanoplan.network;

import dev.nanoplan.count.BinomialTerm;
import dev.nanoplan.count.CountLaw;
import dev.nanoplan.count.CountModel;
import dev.nanoplan.count.CountModelKind;
import dev.nanoplan.count.CountModels;
import dev.nanoplan.count.CountPmf;
import dev.nanoplan.count.CountTerm;
import dev.nanoplan.count.ExactCountModel;
import dev.nanoplan.count.LogTails;
import dev.nanoplan.count.MixtureTerm;
import dev.nanoplan.count.PoissonTerm;
import dev.nanoplan.detect.BinaryDetection;
import dev.nanoplan.detect.BinaryThresholdSearch;
import dev.nanoplan.detect.MultiLevelQuantizer;
import dev.nanoplan.detect.MultiLevelResult;
import dev.nanoplan.math.LogSpace;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.function.Function;
import java.util.function.Supplier;

/**
 * Evaluates one link: builds the law of the slot count given each sent level (docs/architecture.md §5.6),
 * turns it into pmfs with the chosen count model, and runs detection and capacity (docs/architecture.md §5.7).
 *
 * <p>The count given level i is Bin(n_i, p_0) + Σ_{k=1..L} [earlier symbol k: mixture over
 * levels j with the prior of Bin(n_j, p_k)] + interference terms (other emitters, supplied by the
 * caller) + Poisson(background per slot). Molecules act independently; earlier symbols are i.i.d.
 *
 * <p>Near-perfect binary links: when the window-based minimum error falls below
 * {@value #LOG_REFINE_BELOW}, the error probability and its threshold are recomputed exactly in
 * log space ({@link LogTails}), so {@code log10ErrorProbability} stays finite and correct far
 * below 1e-300.
 */
public final class LinkEvaluator {

    /** Below this window-based error the log-space path takes over. */
    static final double LOG_REFINE_BELOW = 1e-10;
    private static final double LN10 = Math.log(10);

    private LinkEvaluator() {
    }

    /** Evaluates an isolated link (no other emitters). */
    public static LinkEvaluation evaluate(LinkSpec spec) {
        return evaluate(spec, List.of());
    }

    /**
     * Evaluates a link whose receiver also counts the given independent interference terms (e.g.
     * other emitters' current symbols and leftovers).
     */
    public static LinkEvaluation evaluate(LinkSpec spec, List<CountTerm> interference) {
        return evaluate(spec, interference, null);
    }

    /**
     * As {@link #evaluate(LinkSpec, List)}, with the exact model's pmf of the interference sum
     * supplied by the caller (built once and shared by the links of one receiver). With the exact
     * count model the count pmfs are then the convolution of {@code interferencePmf} with the link's
     * own terms and background, which equals the per-link convolution of all terms up to
     * truncation (below 1e-14 in total) and FFT rounding; capacities agree within 1e-9 bit
     * ({@code SharedInterferenceTest}). The terms are still used for the means and for the
     * log-space error refinement. Ignored (may be null) for the other count models.
     *
     * @param interferencePmf exact pmf of the sum of {@code interference}, or null to build it here
     */
    public static LinkEvaluation evaluate(LinkSpec spec, List<CountTerm> interference, CountPmf interferencePmf) {
        return evaluate(spec, interference, interferencePmf, interference.size());
    }

    /**
     * As {@link #evaluate(LinkSpec, List, CountPmf)} with {@code interferencePmf} the exact pmf of
     * the sum of the first {@code covered} interference terms only; the others are convolved here
     * with the link's own terms (cheap when they are narrow, e.g. a moment-matched remainder).
     */
    public static LinkEvaluation evaluate(LinkSpec spec, List<CountTerm> interference, CountPmf interferencePmf,
            int covered) {
        return evaluate(spec, interference, interferencePmf, covered, true);
    }

    /**
     * As {@link #evaluate(LinkSpec, List, CountPmf, int)} with the same figures of merit, but the
     * binary mutual-information curve is evaluated only where it can reach its maximum
     * ({@link BinaryThresholdSearch#searchBest}; NaN elsewhere): for callers that read only the
     * best values, e.g. the network planner and its what-if searches.
     */
    public static LinkEvaluation evaluateBest(LinkSpec spec, List<CountTerm> interference, CountPmf interferencePmf,
            int covered) {
        return evaluate(spec, interference, interferencePmf, covered, false);
    }

    /**
     * As {@link #evaluateBest(LinkSpec, List, CountPmf, int)} with the exact pmf of the first
     * {@code covered} interference terms given as two independent parts, {@code interferencePmfA}
     * + {@code interferencePmfB} (e.g. a receiver's prefix and suffix crosstalk products): the
     * exact model convolves each level's own terms with both in one pass
     * ({@link ExactCountModel#pmfs(CountPmf, CountPmf, CountLaw, List)}), which equals convolving
     * the two first up to truncation (below 1e-15) and FFT rounding. With another count model the
     * pmfs are ignored (may be null).
     */
    public static LinkEvaluation evaluateBest(LinkSpec spec, List<CountTerm> interference, CountPmf interferencePmfA,
            CountPmf interferencePmfB, int covered) {
        return evaluate(spec, interference, interferencePmfA, interferencePmfB, covered, false);
    }

    private static LinkEvaluation evaluate(LinkSpec spec, List<CountTerm> interference, CountPmf interferencePmf,
            int covered, boolean curves) {
        return evaluate(spec, interference, interferencePmf, null, covered, curves);
    }

    private static LinkEvaluation evaluate(LinkSpec spec, List<CountTerm> interference, CountPmf interferencePmf,
            CountPmf interferencePmfB, int covered, boolean curves) {
        if (covered < 0 || covered > interference.size()) {
            throw new IllegalArgumentException("covered: must be in 0.." + interference.size() + ", got " + covered);
        }
        CountModel model = CountModels.of(spec.countModel());
        int m = spec.levels();
        List<CountLaw> laws = new ArrayList<>(m);
        for (int i = 0; i < m; i++) {
            laws.add(lawGivenLevel(spec, i, interference));
        }
        List<CountLaw> own = ownLaws(spec);
        // the count pmfs with the own leftovers at the given level weights (other emitters fixed)
        Function<double[], List<CountPmf>> pmfsAt = weights -> {
            if (interferencePmf != null && model instanceof ExactCountModel exact) {
                CountLaw rest = sharedLaw(spec, weights, interference.subList(covered, interference.size()));
                return interferencePmfB != null ? exact.pmfs(interferencePmf, interferencePmfB, rest, own)
                        : exact.pmfs(interferencePmf, rest, own);
            }
            return model.pmfs(sharedLaw(spec, weights, interference), own);
        };
        List<CountPmf> pmfs = pmfsAt.apply(isiWeights(spec));
        double truncated = 0;
        for (CountPmf p : pmfs) {
            truncated = Math.max(truncated, p.truncatedMass());
        }
        double isiMean = 0;
        double[] w = isiWeights(spec);
        for (int k = 1; k < spec.taps().length; k++) {
            for (int j = 0; j < m; j++) {
                isiMean += w[j] * spec.molecules(j) * spec.tap(k);
            }
        }
        double interferenceMean = 0;
        for (CountTerm t : interference) {
            interferenceMean += t.mean();
        }
        double signalMean = (spec.molecules(m - 1) - spec.molecules(0)) * spec.tap(0);
        boolean leftovers = hasLeftovers(spec);

        if (m == 2) {
            BinaryDetection d = curves ? BinaryThresholdSearch.search(pmfs.get(0), pmfs.get(1), spec.priorOne())
                    : BinaryThresholdSearch.searchBest(pmfs.get(0), pmfs.get(1), spec.priorOne());
            long minErrTau = d.minErrorThreshold();
            double log10Err = Math.log10(d.minErrorProbability());
            boolean exactModel = spec.countModel() == CountModelKind.EXACT;
            if (!(d.minErrorProbability() >= LOG_REFINE_BELOW) && exactModel) {
                long[] best = refineInLogSpace(laws.get(0), laws.get(1), spec.priorOne(), minErrTau);
                minErrTau = best[0];
                log10Err = Double.longBitsToDouble(best[1]) / LN10;
            }
            long opTau = operatingThreshold(d);
            double[] errCurve = d.errorByThreshold();
            double opErr = errCurve[(int) (opTau - d.firstThreshold())];
            double opLog10 = Math.log10(opErr);
            if (opTau == minErrTau) {
                opLog10 = log10Err;
                opErr = Math.pow(10, log10Err);
            } else if (!(opErr >= LOG_REFINE_BELOW) && exactModel) {
                opLog10 = lnErrorAt(laws.get(0), laws.get(1), spec.priorOne(), opTau) / LN10;
                opErr = Math.pow(10, opLog10);
            }
            Supplier<LinkCapacity> cap = LinkEvaluation.once(
                    () -> ConsistentCapacitySearch.binary(pmfsAt, d, spec.priorOne(), leftovers));
            return new LinkEvaluation(spec, List.copyOf(pmfs), d, null, minErrTau, Math.pow(10, log10Err), log10Err,
                    signalMean, isiMean, interferenceMean, spec.backgroundMoleculesPerSlot(), truncated,
                    new long[] {opTau}, opErr, opLog10, cap);
        }
        MultiLevelResult r = MultiLevelQuantizer.DEFAULT.optimise(pmfs);
        double symbolError = mapSymbolError(pmfs);
        long[] opThresholds = r.uniformThresholds();
        double opErr = symbolErrorAt(pmfs, opThresholds);
        Supplier<LinkCapacity> cap = LinkEvaluation.once(
                () -> ConsistentCapacitySearch.multiLevel(pmfsAt, r, leftovers));
        return new LinkEvaluation(spec, List.copyOf(pmfs), null, r, -1, symbolError, Math.log10(symbolError),
                signalMean, isiMean, interferenceMean, spec.backgroundMoleculesPerSlot(), truncated,
                opThresholds, opErr, Math.log10(opErr), cap);
    }

    /**
     * The count pmfs given each level, exactly those of {@link #evaluate(LinkSpec, List)}'s
     * {@link LinkEvaluation#givenLevel()}, without the threshold search, the log-space refinement or the
     * capacity: what a caller that judges the link at thresholds fixed elsewhere needs (tolerance guard
     * bands). Cost: one count-model window per level.
     */
    public static List<CountPmf> countPmfs(LinkSpec spec, List<CountTerm> interference) {
        return List.copyOf(CountModels.of(spec.countModel()).pmfs(sharedLaw(spec, isiWeights(spec), interference),
                ownLaws(spec)));
    }

    /** The own current-slot count given each level: Bin(N_i, p_0). */
    private static List<CountLaw> ownLaws(LinkSpec spec) {
        List<CountLaw> own = new ArrayList<>(spec.levels());
        for (int i = 0; i < spec.levels(); i++) {
            own.add(CountLaw.of(new BinomialTerm(spec.molecules(i), spec.tap(0))));
        }
        return own;
    }

    /** Whether the emitter's own earlier symbols leave anything in the current slot (some p_k > 0, k ≥ 1). */
    static boolean hasLeftovers(LinkSpec spec) {
        for (int k = 1; k < spec.taps().length; k++) {
            if (spec.tap(k) > 0) {
                return true;
            }
        }
        return false;
    }

    /**
     * The mutual-information maximiser at the prior; when the minimum-error threshold has the same
     * mutual information (equal in double precision, e.g. both saturated at h(q)), that one, so that
     * the reported threshold and error are the better pair of the tie.
     */
    private static long operatingThreshold(BinaryDetection d) {
        double[] mi = d.miBitsByThreshold();
        int at = (int) (d.minErrorThreshold() - d.firstThreshold());
        return mi[at] >= d.mutualInformationBits() ? d.minErrorThreshold() : d.miThreshold();
    }

    /** ln[(1−q)·P(Y ≥ τ | 0) + q·P(Y &lt; τ | 1)] from the exact log-space tails. */
    static double lnErrorAt(CountLaw law0, CountLaw law1, double q, long tau) {
        return lnError(tails(law0, law1, Math.log1p(-q), Math.log(q), tau, new Tails(law0, law1)));
    }

    /**
     * Symbol error at uniform inputs of the interval detector with the given thresholds (decide j
     * iff t_j ≤ Y &lt; t_{j+1}): (1/M)·Σ_i P(Y outside cell i | i), summed over the cells outside
     * (no 1 − x cancellation); truncated mass counts on its own side.
     */
    static double symbolErrorAt(List<CountPmf> pmfs, long[] thresholds) {
        int m = pmfs.size();
        double err = 0;
        for (int i = 0; i < m; i++) {
            CountPmf p = pmfs.get(i);
            long lo = i == 0 ? Long.MIN_VALUE : thresholds[i - 1];
            long hi = i == m - 1 ? Long.MAX_VALUE : thresholds[i];
            double out = 0;
            if (i > 0) {
                out += p.massBelow();
            }
            if (i < m - 1) {
                out += p.massAbove();
            }
            for (long y = p.offset(); y <= p.last(); y++) {
                if (y < lo || y >= hi) {
                    out += p.probability(y);
                }
            }
            err += out;
        }
        return Math.min(1, err / m);
    }

    /** Weights of earlier symbols' levels: the binary prior, or uniform for more levels. */
    static double[] isiWeights(LinkSpec spec) {
        return LinkSpec.symbolWeights(spec.levels(), spec.priorOne());
    }

    /** The law of the slot count given that level i is sent now. */
    public static CountLaw lawGivenLevel(LinkSpec spec, int level, List<CountTerm> interference) {
        List<CountTerm> terms = new ArrayList<>();
        terms.add(new BinomialTerm(spec.molecules(level), spec.tap(0)));
        terms.addAll(sharedLaw(spec, interference).terms());
        return new CountLaw(terms);
    }

    /** What every level's count shares: own leftovers, interference and background. */
    static CountLaw sharedLaw(LinkSpec spec, List<CountTerm> interference) {
        return sharedLaw(spec, isiWeights(spec), interference);
    }

    /** As {@link #sharedLaw(LinkSpec, List)} with the own earlier symbols' levels at weights {@code w}. */
    static CountLaw sharedLaw(LinkSpec spec, double[] w, List<CountTerm> interference) {
        List<CountTerm> terms = new ArrayList<>();
        for (int k = 1; k < spec.taps().length; k++) {
            double p = spec.tap(k);
            if (p == 0) {
                continue;
            }
            List<CountTerm> parts = new ArrayList<>(spec.levels());
            for (int j = 0; j < spec.levels(); j++) {
                parts.add(new BinomialTerm(spec.molecules(j), p));
            }
            terms.add(new MixtureTerm(w, parts));
        }
        terms.addAll(interference);
        if (spec.backgroundMoleculesPerSlot() > 0) {
            terms.add(new PoissonTerm(spec.backgroundMoleculesPerSlot()));
        }
        return new CountLaw(terms);
    }

    /**
     * Exact minimum of ln[(1−q)·P(Y ≥ τ | 0) + q·P(Y < τ | 1)] over τ, in log space. The two
     * tails are monotone in τ, so the crossing is found by bisection and the minimum by a local
     * scan around it.
     *
     * @return {τ, Double.doubleToLongBits(ln error)}
     */
    static long[] refineInLogSpace(CountLaw law0, CountLaw law1, double q, long start) {
        double lnQ0 = Math.log1p(-q);
        double lnQ1 = Math.log(q);
        long lo = (long) Math.floor(law0.mean()) + 1;
        long hi = (long) Math.ceil(law1.mean());
        // past the largest possible "0" count ε₀ is already 0 and ε₁ only grows: τ* ≤ max₀ + 1
        long cap = law0.maxValue() == Long.MAX_VALUE ? Long.MAX_VALUE : law0.maxValue() + 1;
        hi = Math.min(hi, cap);
        if (hi < lo) {
            hi = lo;
        }
        // Bracket the crossing of the decreasing and increasing log tails, then bisect. The
        // window-based threshold {@code start} is usually next to the crossing, so the bracket is
        // first searched by doubling steps from it (each tail costs an exact tilted pmf); the
        // difference a − b is monotone, so this finds the same crossing as bisecting [lo, hi].
        Tails memo = new Tails(law0, law1);
        if (start > lo && start < hi) {
            boolean above = tails(law0, law1, lnQ0, lnQ1, start, memo)[2] > 0;
            long step = 1;
            long edge = start;
            while (true) {
                long next = above ? Math.min(hi, edge + step) : Math.max(lo, edge - step);
                if (next == (above ? hi : lo)) {
                    break;
                }
                if ((tails(law0, law1, lnQ0, lnQ1, next, memo)[2] > 0) != above) {
                    if (above) {
                        hi = next;
                    } else {
                        lo = next;
                    }
                    break;
                }
                edge = next;
                step *= 2;
            }
            if (above) {
                lo = edge;
            } else {
                hi = edge;
            }
        }
        while (hi - lo > 1) {
            long mid = lo + (hi - lo) / 2;
            if (tails(law0, law1, lnQ0, lnQ1, mid, memo)[2] > 0) {
                lo = mid;
            } else {
                hi = mid;
            }
        }
        long bestTau = start;
        double best = lnError(tails(law0, law1, lnQ0, lnQ1, start, memo));
        for (long t = Math.max(0, lo - 8); t <= Math.min(hi + 8, cap); t++) {
            double e = lnError(tails(law0, law1, lnQ0, lnQ1, t, memo));
            if (e < best) {
                best = e;
                bestTau = t;
            }
        }
        return new long[] {bestTau, Double.doubleToLongBits(best)};
    }

    /**
     * {a, b, a − b} with a = ln q₀ + ln P(Y ≥ τ | 0), b = ln q₁ + ln P(Y &lt; τ | 1), memoised per τ.
     * The tails of nearby thresholds are read from the same tilted pmfs ({@link LogTails.Reuse}):
     * the scan around the crossing then costs a few exact tilted pmfs instead of two per threshold.
     */
    private static double[] tails(CountLaw law0, CountLaw law1, double lnQ0, double lnQ1, long tau, Tails memo) {
        return memo.computeIfAbsent(tau, t -> {
            double a = lnQ0 + memo.upper0.logUpperTail(t);
            double b = lnQ1 + memo.lower1.logLowerTail(t);
            return new double[] {a, b, a > b ? 1 : -1};
        });
    }

    /** Memo of {@link #tails} with the reusable tilted pmfs of both laws. */
    private static final class Tails extends HashMap<Long, double[]> {
        private static final long serialVersionUID = 1L;
        final transient LogTails.Reuse upper0;
        final transient LogTails.Reuse lower1;

        Tails(CountLaw law0, CountLaw law1) {
            upper0 = new LogTails.Reuse(law0);
            lower1 = new LogTails.Reuse(law1);
        }
    }

    /** ln(e^a + e^b) of the two weighted log tails: −∞ when both are −∞ (the tails are never +∞). */
    private static double lnError(double[] ab) {
        return LogSpace.logSumExp(ab[0], ab[1]);
    }

    /** Symbol error of the maximum a-posteriori detector at uniform inputs: 1 − Σ_y max_i P_i(y)/M. */
    static double mapSymbolError(List<CountPmf> pmfs) {
        long lo = Long.MAX_VALUE;
        long hi = Long.MIN_VALUE;
        for (CountPmf p : pmfs) {
            lo = Math.min(lo, p.offset());
            hi = Math.max(hi, p.last());
        }
        int m = pmfs.size();
        // error = Σ_y (Σ_i P_i(y) − max_i P_i(y)) / M, summed without 1 − x cancellation
        double err = 0;
        for (long y = lo; y <= hi; y++) {
            double sum = 0;
            double max = 0;
            for (CountPmf p : pmfs) {
                double v = p.probability(y);
                sum += v;
                max = Math.max(max, v);
            }
            err += sum - max;
        }
        for (CountPmf p : pmfs) {
            err += p.truncatedMass();
        }
        return Math.min(1, err / m);
    }
}
