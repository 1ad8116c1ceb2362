package dev.nanoplan.plan;

import dev.nanoplan.info.Entropy;
import dev.nanoplan.network.ChannelEntry;
import dev.nanoplan.network.ChannelMatrix;
import dev.nanoplan.network.LinkEdge;
import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.Signalling;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.function.DoubleConsumer;
import java.util.function.Function;

/**
 * The per-receiver evaluator of the preview ({@link PreviewPlanner}, where the model is described):
 * each link's count given each level is the normal law with the same mean and variance, with the
 * strongest on/off terms kept apart as a mixture ({@link NormalLinkApproximation}); limited_by from
 * plain normal what-ifs. No advice ({@link PreviewPlanner#ADVICE}) and no budgets. Only pairs kept
 * above the floor report a capacity (a direct link below the floor shows as none). Receivers are
 * evaluated in parallel when there are more than {@value #PARALLEL_ABOVE}.
 */
final class NormalReceiverEvaluator implements ReceiverEvaluator {

    static final NormalReceiverEvaluator INSTANCE = new NormalReceiverEvaluator();
    static final int PARALLEL_ABOVE = 200;

    private NormalReceiverEvaluator() {
    }

    @Override
    public List<String> leadingWarnings(double largestDeviationBits) {
        return List.of(PreviewPlanner.warning(largestDeviationBits));
    }

    @Override
    public String advice(PlanInputs in, EvaluatedLink weakest) {
        return PreviewPlanner.ADVICE;
    }

    @Override
    public BottleneckAdvisor.Proposal propose(PlanInputs in, EvaluatedLink weakest,
            Function<String, List<String>> followers) {
        return null;
    }

    @Override
    public List<BudgetReport> budgets(PlanInputs in, List<List<EvaluatedLink>> routeHops, DoubleConsumer progress) {
        return List.of();
    }

    @Override
    public boolean parallel(int receivers) {
        return receivers > PARALLEL_ABOVE;
    }

    /** Moments of one emitter at one receiver: whole memory and leftovers of earlier symbols. */
    private record Moments(double mean, double variance, double isiMean, double isiVariance) {
    }

    /**
     * One per-slot term of an emitter at a receiver: the mixture over its levels of Bin(n_j, p_k).
     *
     * @param emitter    index of the emitter among the receiver's entries
     * @param tap        k
     * @param spreadVar  variance of the term's level means, p_k²·(B − A²): what makes it on/off
     */
    private record Term(int emitter, int tap, double spreadVar) {
    }

    private static Moments moments(double[] taps, long[] levels, double[] w) {
        double a = 0;
        double b = 0;
        for (int j = 0; j < levels.length; j++) {
            a += w[j] * levels[j];
            b += w[j] * (double) levels[j] * levels[j];
        }
        double spread = Math.max(0, b - a * a);
        double mean = 0;
        double var = 0;
        double isiMean = 0;
        double isiVar = 0;
        for (int k = 0; k < taps.length; k++) {
            double p = taps[k];
            double mk = p * a;
            double vk = p * (1 - p) * a + p * p * spread;
            mean += mk;
            var += vk;
            if (k > 0) {
                isiMean += mk;
                isiVar += vk;
            }
        }
        return new Moments(mean, var, isiMean, isiVar);
    }

    /** How many strong terms a mixture of M-level terms may hold within {@link NormalLinkApproximation#MAX_COMPONENTS}. */
    static int strongTerms(int levels) {
        int k = 0;
        long n = levels;
        while (n <= NormalLinkApproximation.MAX_COMPONENTS) {
            k++;
            n *= levels;
        }
        return k;
    }

    @Override
    public ReceiverLinks evaluate(PlanInputs in, List<ChannelEntry> entries) {
        Scenario scenario = in.scenario();
        Map<String, Node> nodes = in.nodes();
        PlanOptions options = in.options();
        List<EvaluatedLink> out = new ArrayList<>();
        Map<LinkKey, Double> evaluatedCapacity = new HashMap<>();
        Signalling sig = scenario.signalling();
        double[] w = in.weights();
        double background = scenario.medium().backgroundMoleculesPerS() * sig.symbolTimeS();
        int n = entries.size();
        int m = sig.levels();
        int strongMax = strongTerms(m);
        Moments[] mom = new Moments[n];
        long[][] levels = new long[n][];
        double[][] taps = new double[n][];
        double totalMean = 0;
        double totalVar = 0;
        int top1 = -1;
        int top2 = -1;
        // the strongest on/off terms at this receiver, strongest first (one more than a link may use,
        // since a link's own current symbol is its signal, not a term)
        List<Term> strongest = new ArrayList<>(MAX_TERMS + 2);
        double band = 0;
        for (int i = 0; i < n; i++) {
            ChannelEntry e = entries.get(i);
            levels[i] = LinkContext.levelsOf(sig, nodes.get(e.emitter()).moleculesPerSymbol());
            taps[i] = e.taps();
            mom[i] = moments(taps[i], levels[i], w);
            totalMean += mom[i].mean();
            totalVar += mom[i].variance();
            if (top1 < 0 || mom[i].mean() > mom[top1].mean()) {
                top2 = top1;
                top1 = i;
            } else if (top2 < 0 || mom[i].mean() > mom[top2].mean()) {
                top2 = i;
            }
            double spread = spreadOf(levels[i], w);
            for (int k = 0; k < taps[i].length; k++) {
                double sv = taps[i][k] * taps[i][k] * spread;
                if (sv > 0 && (strongest.size() <= MAX_TERMS || sv > strongest.get(MAX_TERMS).spreadVar())) {
                    int at = strongest.size();
                    while (at > 0 && strongest.get(at - 1).spreadVar() < sv) {
                        at--;
                    }
                    strongest.add(at, new Term(i, k, sv));
                    if (strongest.size() > MAX_TERMS + 1) {
                        strongest.remove(strongest.size() - 1);
                    }
                }
            }
        }
        double q = sig.priorOne();
        // the most the operating point can carry: the input entropy H(q) (binary), log2 M (uniform levels)
        double maxBits = m == 2 ? Entropy.binaryBits(q) : Math.log(m) / Math.log(2);
        for (int i = 0; i < n; i++) {
            ChannelEntry e = entries.get(i);
            long[] lv = levels[i];
            double p0 = e.tap(0);
            long swing = lv[m - 1] - lv[0];
            if (TotalVariationBound.skips(p0, swing, options.capacityFloorBits())) {
                continue;
            }
            Moments own = mom[i];
            double xtMean = Math.max(0, totalMean - own.mean());
            double xtVar = Math.max(0, totalVar - own.variance());
            double sharedVar = own.isiVariance() + xtVar + background;
            // base (normal) parts and strong terms, split into own leftovers (ISI) and crosstalk
            double isiMean = own.isiMean();
            double isiVar = own.isiVariance();
            double xtBaseMean = xtMean;
            double xtBaseVar = xtVar;
            List<double[][]> isiTerms = new ArrayList<>();
            List<double[][]> xtTerms = new ArrayList<>();
            for (Term t : strongest) {
                if ((t.emitter() == i && t.tap() == 0) || isiTerms.size() + xtTerms.size() == MAX_TERMS
                        || t.spreadVar() < STRONG_FRACTION * sharedVar) {
                    continue;
                }
                double[][] c = components(levels[t.emitter()], taps[t.emitter()][t.tap()], w);
                if (t.emitter() == i) {
                    isiTerms.add(c);
                    isiMean -= c[3][0];
                    isiVar -= c[3][1];
                } else {
                    xtTerms.add(c);
                    xtBaseMean -= c[3][0];
                    xtBaseVar -= c[3][1];
                }
            }
            isiMean = Math.max(0, isiMean);
            isiVar = Math.max(0, isiVar);
            xtBaseMean = Math.max(0, xtBaseMean);
            xtBaseVar = Math.max(0, xtBaseVar);
            NormalLinkApproximation.Mixture all = mixture(isiTerms, xtTerms);
            double baseMean = isiMean + xtBaseMean + background;
            double baseVar = isiVar + xtBaseVar + background;
            if (m == 2 && NormalLinkApproximation.capacityUpperBoundBits(lv[0] * p0 + baseMean,
                    lv[0] * p0 * (1 - p0) + baseVar, lv[1] * p0 + baseMean,
                    lv[1] * p0 * (1 - p0) + baseVar, all) < options.capacityFloorBits()) {
                continue;
            }
            NormalLinkApproximation.Result r = NormalLinkApproximation.evaluate(levelMeans(lv, p0, baseMean),
                    levelVariances(lv, p0, baseVar), all, q);
            // the operating point: mutual information at the file's prior (the leftovers' moments are
            // at that same prior), as the exact plan
            double c = r.mutualInformationBits();
            if (c < options.capacityFloorBits()) {
                continue;
            }
            band = PreviewDeviation.bandBits(m);
            // the what-ifs use the plain normal law (no mixture) and compare with its own baseline, as
            // the exact plan's what-ifs use the Gaussian count model: a search, not the reported value
            NormalLinkApproximation.Mixture none = NormalLinkApproximation.Mixture.NONE;
            double cw = capacity(lv, p0, own.isiMean() + xtMean + background, sharedVar, none, q);
            double gIsi = own.isiMean() > 0 ? capacity(lv, p0, xtMean + background, xtVar + background, none, q) - cw
                    : 0;
            double gXt = n > 1 ? capacity(lv, p0, own.isiMean() + background, own.isiVariance() + background, none, q)
                    - cw : 0;
            double gNoise = background > 0 ? capacity(lv, p0, own.isiMean() + xtMean, own.isiVariance() + xtVar, none,
                    q) - cw : 0;
            Impairment limited = Impairment.limitedBy(gIsi, gXt, gNoise, maxBits - c);
            int top = top1 == i ? top2 : top1;
            String topId = top >= 0 && mom[top].mean() > 0 ? entries.get(top).emitter() : null;
            double share = topId != null && xtMean > 0 ? Math.min(1, mom[top].mean() / xtMean) : 0;
            String caveat = e.source().equals(ChannelMatrix.SIMULATED) ? "simulated" : e.modelCaveat();
            boolean countBlind = (m == 2 ? Math.min(q, 1 - q) : 1 - 1.0 / m)
                    <= in.scenario().targets().maxErrorProbability();
            LinkReport report = new LinkReport(e.emitter(), e.receiver(), e.species(), p0, taps[i], swing * p0, xtMean,
                    own.isiMean(), background, r.operatingThreshold(), r.errorProbability(),
                    r.log10OperatingErrorProbability(), r.minErrorThreshold(), r.minErrorProbability(),
                    c, c / sig.symbolTimeS(), null, null, r.operatingCrossoverZero(), r.operatingCrossoverOne(),
                    countBlind, limited, topId, share, caveat);
            out.add(new EvaluatedLink(report, new LinkEdge(e.emitter(), e.receiver(), c, r.operatingChannel()), 1,
                    null, null));
            evaluatedCapacity.put(new LinkKey(e.emitter(), e.receiver()), c);
        }
        return new ReceiverLinks(out, evaluatedCapacity, band);
    }

    /** Most on/off terms a link keeps apart (the mixture is reduced to {@link NormalLinkApproximation#MAX_COMPONENTS} as they are added). */
    static final int MAX_TERMS = 24;

    /** A term is kept apart as a mixture when its spread variance is at least this share of the link's shared variance. */
    static final double STRONG_FRACTION = 0.001;

    private static double spreadOf(long[] levels, double[] w) {
        double a = 0;
        double b = 0;
        for (int j = 0; j < levels.length; j++) {
            a += w[j] * levels[j];
            b += w[j] * (double) levels[j] * levels[j];
        }
        return Math.max(0, b - a * a);
    }

    /**
     * Components of the term Σ_j w_j·Bin(n_j, p): {weights, means n_j·p, variances n_j·p(1 − p),
     * {term mean, term variance}}.
     */
    private static double[][] components(long[] levels, double p, double[] w) {
        int m = levels.length;
        double[] mean = new double[m];
        double[] var = new double[m];
        double a = 0;
        double b = 0;
        for (int j = 0; j < m; j++) {
            mean[j] = levels[j] * p;
            var[j] = levels[j] * p * (1 - p);
            a += w[j] * mean[j];
            b += w[j] * (var[j] + mean[j] * mean[j]);
        }
        return new double[][] {w, mean, var, {a, Math.max(0, b - a * a)}};
    }

    private static NormalLinkApproximation.Mixture mixture(List<double[][]> first, List<double[][]> second) {
        NormalLinkApproximation.Mixture mix = NormalLinkApproximation.Mixture.NONE;
        for (double[][] c : first) {
            mix = mix.plusReduced(c[0], c[1], c[2], NormalLinkApproximation.MAX_COMPONENTS);
        }
        for (double[][] c : second) {
            mix = mix.plusReduced(c[0], c[1], c[2], NormalLinkApproximation.MAX_COMPONENTS);
        }
        return mix;
    }

    private static double[] levelMeans(long[] levels, double p0, double sharedMean) {
        double[] means = new double[levels.length];
        for (int j = 0; j < levels.length; j++) {
            means[j] = levels[j] * p0 + sharedMean;
        }
        return means;
    }

    private static double[] levelVariances(long[] levels, double p0, double sharedVar) {
        double[] vars = new double[levels.length];
        for (int j = 0; j < levels.length; j++) {
            vars[j] = levels[j] * p0 * (1 - p0) + sharedVar;
        }
        return vars;
    }

    /**
     * Operating mutual information of a link whose count given level j is Bin(n_j, p0) + N(shared) +
     * the mixture (binary: at the prior, maximised over τ).
     */
    private static double capacity(long[] levels, double p0, double sharedMean, double sharedVar,
            NormalLinkApproximation.Mixture mix, double priorOne) {
        return NormalLinkApproximation.mutualInformationBits(levelMeans(levels, p0, sharedMean),
                levelVariances(levels, p0, sharedVar), mix, priorOne);
    }
}
