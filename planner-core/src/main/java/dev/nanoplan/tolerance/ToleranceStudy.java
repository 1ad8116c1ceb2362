package dev.nanoplan.tolerance;

import dev.nanoplan.count.CountPmf;
import dev.nanoplan.count.CountTerm;
import dev.nanoplan.info.ChannelCascade;
import dev.nanoplan.network.AnalyticChannel;
import dev.nanoplan.network.ChannelEntry;
import dev.nanoplan.network.ChannelMatrix;
import dev.nanoplan.network.Crosstalk;
import dev.nanoplan.network.LinkEvaluation;
import dev.nanoplan.network.LinkEvaluator;
import dev.nanoplan.network.LinkSpec;
import dev.nanoplan.plan.IncrementalPlanner;
import dev.nanoplan.plan.LinkReport;
import dev.nanoplan.plan.Plan;
import dev.nanoplan.plan.PlanOptions;
import dev.nanoplan.plan.RouteReport;
import dev.nanoplan.plan.SharedRates;
import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.Schedule;
import dev.nanoplan.scenario.Signalling;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;

/**
 * A tolerance study of one layout: the nominal plan fixes the links, the routes and (under
 * {@link Thresholds#DESIGN}) the thresholds; {@link #sample(int)} plans perturbed layout {@code index}
 * ({@link Perturbation}) with the analytic channel and the scenario's count model. A sample is a pure
 * function of (scenario, sampler, seed, thresholds, index): the work unit that any engine may run in
 * any order; {@link ToleranceSummary} combines them in index order.
 *
 * <p><b>Per link</b> (the nominal plan's links): the link is evaluated as the plan evaluates it
 * ({@link LinkEvaluator} with every other emitter heard at the receiver as crosstalk, the strongest
 * {@link PlanOptions#exactInterferers()} exactly, the rest moment-matched, plus background). Under
 * {@code design} its error is (1 − q)·P(Y ≥ τ* | 0) + q·P(Y &lt; τ* | 1) at the nominal minimum-error
 * threshold τ* (levels &gt; 2: the symbol error at the nominal operating thresholds), its mutual
 * information and transition matrix those at the nominal operating threshold(s); under
 * {@code recalibrated} the sample's own minimum error and operating point. A link meets its target when
 * its error ≤ {@code targets.max_error_probability}; a link whose pair fell out of the channel counts
 * as error 1 and 0 bit.
 *
 * <p><b>Per demand</b>: the nominal route's hops (routing is fixed at fabrication); the demand meets
 * when the route exists, every hop meets the error target, and the demand's max-min fair shared rate
 * ({@link SharedRates}, from the cascade of the hops' matrices, {@link ChannelCascade}) is at least
 * {@code targets.min_rate_bits_per_s}.
 *
 * <p><b>Shared work</b>: a link whose inputs (its own taps and molecules, every interferer's taps and
 * molecules, the species and medium) a sample leaves at their nominal values is not re-evaluated; the
 * nominal evaluation is reused. Under {@code design} thresholds a link is judged at thresholds fixed by
 * the nominal plan, so only its count pmfs are computed ({@link LinkEvaluator#countPmfs}), not the
 * threshold search and log-space refinement of a full evaluation. Covers the all-active schedule only (under other schedules a link hears
 * decimated taps, which the plan's package keeps to itself). Thread-safe.
 */
public final class ToleranceStudy {

    private final Scenario nominal;
    private final Sampler sampler;
    private final long seed;
    private final Thresholds thresholds;
    private final PlanOptions options;
    private final Perturbation perturbation;
    private final Plan nominalPlan;
    private final List<LinkReport> links;
    private final List<RouteReport> routes;
    private final int[][] routeLinks;
    private final ChannelMatrix nominalChannel;
    private final LinkInputs[] nominalInputs;
    private final LinkEvaluation[] nominalEvaluations;

    /**
     * Perturbed layout {@code index} with its analytic channel: what every guard-band step of every weak
     * link reads, built once ({@link #layout(int)}).
     */
    public record SampleLayout(int index, Scenario scenario, ChannelMatrix channel) {
    }

    /**
     * Plans the nominal layout once.
     *
     * @throws IllegalArgumentException if the schedule is not all-active, or as {@link Perturbation}
     */
    public ToleranceStudy(Scenario nominal, Sampler sampler, long seed, Thresholds thresholds) {
        if (nominal.signalling().schedule() != Schedule.ALL_ACTIVE) {
            throw new IllegalArgumentException("signalling.schedule: tolerance studies cover all-active only, got "
                    + nominal.signalling().schedule().id());
        }
        this.nominal = nominal;
        this.sampler = sampler;
        this.seed = seed;
        this.thresholds = thresholds;
        this.options = PlanOptions.DEFAULT;
        this.perturbation = new Perturbation(nominal, sampler, seed);
        // links and routes as the full plan gives them; its budgets and advice are not read here
        this.nominalPlan = IncrementalPlanner.exactWithoutBudgets(nominal, options).plan();
        this.links = nominalPlan.links();
        this.routes = nominalPlan.routes();
        this.routeLinks = new int[routes.size()][];
        for (int d = 0; d < routes.size(); d++) {
            List<String> hops = routes.get(d).hops();
            int[] idx = new int[Math.max(0, hops.size() - 1)];
            for (int h = 0; h + 1 < hops.size(); h++) {
                idx[h] = linkIndex(hops.get(h), hops.get(h + 1));
            }
            routeLinks[d] = idx;
        }
        ChannelMatrix channel = AnalyticChannel.build(nominal, options.cutoffMolecules());
        this.nominalChannel = channel;
        this.nominalInputs = new LinkInputs[links.size()];
        this.nominalEvaluations = new LinkEvaluation[links.size()];
        for (int l = 0; l < links.size(); l++) {
            nominalInputs[l] = inputs(nominal, channel, l, -1);
            nominalEvaluations[l] = nominalInputs[l] == null ? null : nominalInputs[l].evaluate();
        }
    }

    /** The unperturbed layout. */
    public Scenario nominal() {
        return nominal;
    }

    /** The sampler. */
    public Sampler sampler() {
        return sampler;
    }

    /** The seed. */
    public long seed() {
        return seed;
    }

    /** The thresholds rule. */
    public Thresholds thresholds() {
        return thresholds;
    }

    /** The nominal plan (links and routes; without budgets or advice). */
    public Plan nominalPlan() {
        return nominalPlan;
    }

    /** The links studied: the nominal plan's, in its order. */
    public List<LinkReport> links() {
        return links;
    }

    /** The demands' nominal routes, in the scenario's order. */
    public List<RouteReport> demands() {
        return routes;
    }

    /** The varied inputs. */
    public List<ToleranceFactor> factors() {
        return perturbation.factors();
    }

    /** The draws behind the samples. */
    public Perturbation perturbation() {
        return perturbation;
    }

    /** Index of link {@code from → to} among {@link #links()}, or −1. */
    public int linkIndex(String from, String to) {
        for (int l = 0; l < links.size(); l++) {
            if (links.get(l).from().equals(from) && links.get(l).to().equals(to)) {
                return l;
            }
        }
        return -1;
    }

    /** Plans perturbed layout {@code index} (≥ 0). */
    public ToleranceSample sample(int index) {
        Perturbation.Draw draw = perturbation.draw(index);
        Scenario s = draw.scenario();
        ChannelMatrix channel = AnalyticChannel.build(s, options.cutoffMolecules());
        int n = links.size();
        double[] error = new double[n];
        double[] bits = new double[n];
        double[][][] matrix = new double[n][][];
        for (int l = 0; l < n; l++) {
            LinkInputs in = inputs(s, channel, l, -1);
            if (in == null) {
                error[l] = 1;
                continue;
            }
            boolean nominalInputsKept = in.equals(nominalInputs[l]);
            if (thresholds == Thresholds.DESIGN) {
                // at the nominal thresholds only the pmfs count: no threshold search or log-space refinement
                List<CountPmf> pmfs = nominalInputsKept ? nominalEvaluations[l].givenLevel() : in.pmfs();
                error[l] = errorAt(pmfs, designThresholds(nominalEvaluations[l]));
                matrix[l] = LinkEvaluation.channelAt(pmfs, nominalEvaluations[l].operatingThresholds());
                bits[l] = ChannelCascade.mutualInformationBits(weights(), matrix[l]);
                continue;
            }
            LinkEvaluation ev = nominalInputsKept ? nominalEvaluations[l] : in.evaluate();
            error[l] = ev.minErrorProbability();
            matrix[l] = LinkEvaluation.channelAt(ev.givenLevel(), ev.operatingThresholds());
            bits[l] = ev.mutualInformationBits();
        }
        return new ToleranceSample(index, draw.redraws(), draw.z(), error, bits, demandsMeet(s, error, matrix));
    }

    /**
     * The thresholds a nominal layout whose emitter of link {@code l} releases {@code molecules} per symbol
     * would be designed with (null under {@link Thresholds#RECALIBRATED}): what the guard band fixes per
     * step.
     */
    public long[] designThresholdsWithMolecules(int l, long molecules) {
        if (thresholds == Thresholds.RECALIBRATED) {
            return null;
        }
        LinkInputs nom = inputs(nominal, nominalChannel, l, molecules);
        return designThresholds(nom.evaluate());
    }

    /** Perturbed layout {@code index} (≥ 0) and its analytic channel. */
    public SampleLayout layout(int index) {
        Scenario s = perturbation.draw(index).scenario();
        return new SampleLayout(index, s, AnalyticChannel.build(s, options.cutoffMolecules()));
    }

    /**
     * The error probability of link {@code l} in perturbed layout {@code layout} when its emitter's nominal
     * release is {@code molecules} per symbol (the sample's relative spread of the release kept), at the
     * thresholds {@code design} of {@link #designThresholdsWithMolecules} (recalibrated: null). The
     * layout's channel does not depend on {@code molecules} (taps are per molecule; the release enters
     * only the link's levels), so one layout serves every step of a guard-band search.
     */
    public double errorWithMolecules(int l, SampleLayout layout, long molecules, long[] design) {
        LinkInputs in = inputs(layout.scenario(), layout.channel(), l, molecules);
        if (in == null) {
            return 1;
        }
        if (design == null) {
            return in.evaluate().minErrorProbability();
        }
        // at fixed thresholds only the pmfs count: no threshold search or log-space refinement
        return errorAt(in.pmfs(), design);
    }

    private static long[] designThresholds(LinkEvaluation design) {
        return design.minErrorThreshold() >= 0 ? new long[] {design.minErrorThreshold()} : design.operatingThresholds();
    }

    /** Σ_i w_i·P(decide ≠ i | i) at thresholds t (binary: (1 − q)ε₀ + qε₁). */
    private double errorAt(List<CountPmf> givenLevel, long[] t) {
        double[][] w = LinkEvaluation.channelAt(givenLevel, t);
        double[] weights = weights();
        double e = 0;
        for (int i = 0; i < w.length; i++) {
            e += weights[i] * (1 - w[i][i]);
        }
        return Math.max(0, Math.min(1, e));
    }

    private double[] weights() {
        Signalling sig = nominal.signalling();
        return LinkSpec.symbolWeights(sig.levels(), sig.priorOne());
    }

    private boolean[] demandsMeet(Scenario s, double[] error, double[][][] matrix) {
        double target = s.targets().maxErrorProbability();
        double symbolTimeS = s.signalling().symbolTimeS();
        List<RouteReport> sampled = new ArrayList<>(routes.size());
        boolean[] ok = new boolean[routes.size()];
        for (int d = 0; d < routes.size(); d++) {
            RouteReport r = routes.get(d);
            boolean hopsOk = r.reachable();
            double[][][] hops = new double[routeLinks[d].length][][];
            for (int h = 0; h < hops.length && hopsOk; h++) {
                int l = routeLinks[d][h];
                hopsOk = l >= 0 && matrix[l] != null && error[l] <= target;
                hops[h] = hopsOk ? matrix[l] : null;
            }
            double rate = hopsOk ? ChannelCascade.mutualInformationBits(weights(), hops) / symbolTimeS : 0;
            ok[d] = hopsOk;
            sampled.add(new RouteReport(r.from(), r.to(), hopsOk ? r.hops() : List.of(), 0, null, null, 0, rate,
                    0, null, null, null));
        }
        List<SharedRates.Share> shares = SharedRates.of(new Plan(s, ChannelMatrix.ANALYTIC, List.of(), sampled,
                List.of(), List.of()));
        for (int d = 0; d < ok.length; d++) {
            ok[d] &= shares.get(d).rateBitsPerS() >= s.targets().minRateBitsPerS() * (1 - 1e-12);
        }
        return ok;
    }

    /**
     * The inputs of link l in layout s, or null when the pair is not in the channel; {@code molecules} ≥ 0
     * replaces the emitter's nominal release (scaled by the layout's relative spread of it).
     */
    private LinkInputs inputs(Scenario s, ChannelMatrix channel, int l, long molecules) {
        LinkReport link = links.get(l);
        List<ChannelEntry> entries = channel.atReceiver(link.to());
        Map<String, Node> nodes = s.nodesById();
        Signalling sig = s.signalling();
        double[] w = weights();
        ChannelEntry own = null;
        List<Crosstalk.Interferer> others = new ArrayList<>(entries.size());
        for (ChannelEntry e : entries) {
            if (e.emitter().equals(link.from())) {
                own = e;
            } else {
                others.add(new Crosstalk.Interferer(e.emitter(), e.taps(),
                        levelsOf(sig, nodes.get(e.emitter()).moleculesPerSymbol()), w));
            }
        }
        if (own == null) {
            return null;
        }
        long top = nodes.get(link.from()).moleculesPerSymbol();
        if (molecules >= 0) {
            long nominalTop = nominal.nodesById().get(link.from()).moleculesPerSymbol();
            top = Math.max(1, Math.round(molecules * (top / (double) nominalTop)));
        }
        LinkSpec spec = new LinkSpec(own.taps(), levelsOf(sig, top), sig.priorOne(),
                s.medium().backgroundMoleculesPerS() * sig.symbolTimeS(), sig.countModel(), sig.symbolTimeS());
        return new LinkInputs(spec, others, options.exactInterferers());
    }

    /** As the plan: n levels evenly spaced from 0 to the top release (at least levels − 1). */
    private static long[] levelsOf(Signalling s, long top) {
        return LinkSpec.evenLevels(s.levels(), Math.max(top, s.levels() - 1));
    }

    /** Everything a link's evaluation depends on; equal inputs give equal evaluations. */
    private record LinkInputs(LinkSpec spec, List<Crosstalk.Interferer> others, int exactCount) {
        LinkEvaluation evaluate() {
            List<CountTerm> terms = Crosstalk.terms(others, exactCount);
            return LinkEvaluator.evaluateBest(spec, terms, null, terms.size());
        }

        /** The pmfs of {@link #evaluate()} alone ({@link LinkEvaluator#countPmfs}). */
        List<CountPmf> pmfs() {
            return LinkEvaluator.countPmfs(spec, Crosstalk.terms(others, exactCount));
        }
    }
}
