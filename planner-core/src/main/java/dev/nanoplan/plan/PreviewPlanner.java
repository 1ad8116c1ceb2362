package dev.nanoplan.plan;

import dev.nanoplan.network.AnalyticChannel;
import dev.nanoplan.network.ChannelEntry;
import dev.nanoplan.network.ChannelMatrix;
import dev.nanoplan.network.LinkEdge;
import dev.nanoplan.network.LinkGraph;
import dev.nanoplan.scenario.Demand;
import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.Signalling;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.stream.IntStream;

/**
 * A fast, approximate plan of a layout, shown while the exact plan ({@link NetworkPlanner}) is
 * still running: the same {@link Plan} records, computed in milliseconds for a hundred nodes.
 *
 * <p><b>What is the same as the exact plan.</b> The channel (analytic closed forms, or the
 * {@link PlanOptions#channel()} given), the candidate links and the total-variation pre-skip, the
 * all-active crosstalk (every other emitter heard at the receiver), the link graph and its floor,
 * the widest routes ({@link WidestPathFinder}) and their decode-and-forward cascade capacity
 * ({@link dev.nanoplan.info.ChannelCascade}), the unreachable-demand reasons and the rate warnings.
 *
 * <p><b>What is approximate.</b> Each link's count given each level is replaced by the normal law
 * with the same mean and variance ({@link NormalLinkApproximation}: the textbook normal approximation
 * of a sum of independent binomials with continuity correction; W. Feller, <i>An Introduction to
 * Probability Theory and Its Applications</i>, vol. 1, 1968, ch. VII). The moments are exact and
 * cheap: an emitter sending level j with probability w_j contributes per slot k a mixture of
 * Bin(n_j, p_k) with mean p_k·A and variance p_k(1 − p_k)·A + p_k²·(B − A²), A = Σ w_j n_j,
 * B = Σ w_j n_j² (law of total variance), so each receiver sums its emitters once (O(m·L)) and a
 * link's crosstalk is that sum minus its own emitter (O(1)).
 *
 * <p><b>Strong on/off terms.</b> A neighbour whose current symbol lands with a large tap makes the
 * count bimodal; one normal law then underestimates the capacity badly (the exact capacity was seen
 * up to 6× above it, see {@link dev.nanoplan.network.GaussianScreen}). Per receiver the preview
 * ranks all per-slot terms by the variance of their level means, p_k²(B − A²), and per link keeps
 * the strongest few (at most {@link #strongTerms(int)}, 4 for binary signalling, 16 components; each
 * at least {@value #STRONG_FRACTION} of the link's shared variance; never the link's own current
 * symbol) as a mixture of normal components, the rest as one normal law. Where more terms than that
 * dominate the count (e.g. the culture-tank demo: a few relays and sensors, Lyapunov ratio of the
 * rest ≈ 2) the preview is still off by up to 0.3 bit ({@code PreviewPlannerTest} measures it);
 * elsewhere within 0.1 bit and typically 0.001 bit.
 *
 * <p><b>limited_by</b> is found as in the exact plan (remove ISI, crosstalk or background and see
 * which raises capacity most, SIGNAL when no removal closes 10 % of the gap), with the plain normal
 * law for the what-ifs compared with the plain normal baseline — as the exact plan's what-ifs use
 * the Gaussian count model — three closed-form evaluations per link. The reported threshold is the
 * capacity-achieving one (the exact plan reports the one maximising the mutual information at the
 * scenario's prior; they coincide at prior ½ up to rounding).
 *
 * <p><b>Skipped pairs.</b> As in the exact plan, a pair is skipped when 1 − (1 − p_0)^swing is below
 * the floor; then also when an upper bound on the approximate capacity (total variation and
 * Kullback–Leibler bounds, {@link NormalLinkApproximation#capacityUpperBoundBits(double, double,
 * double, double, NormalLinkApproximation.Mixture)}) is below it, which leaves out no link the full
 * evaluation would keep.
 *
 * <p><b>What is left out.</b> Molecule budgets (empty list) and the bottleneck advice (routes say
 * "advice follows with the exact plan"): both search over dozens of re-evaluations per hop. A direct
 * link below the floor shows as no direct link (the exact plan reports its evaluated capacity). The
 * first warning is always {@link #WARNING}, so any reader can tell a preview from an exact plan
 * ({@link #isPreview(Plan)}); the plan is meant for display only, never for the CLI's outputs.
 *
 * <p>Cost: the channel build plus O(Σ_receivers m·(L + 1)) for the moments and the strong terms plus,
 * per link that passes the bounds, one mixture evaluation and four plain ones
 * ({@link NormalLinkApproximation}, about 0.1 ms together), plus the routes. Receivers are evaluated
 * in parallel when there are more than {@value #PARALLEL_ABOVE}.
 */
public final class PreviewPlanner {

    /** First warning of every preview plan. */
    public static final String WARNING = "preview: normal approximation of the counts; no budgets or advice yet "
            + "- the exact plan follows";
    /** Advice of a reachable route in a preview. */
    public static final String ADVICE = "preview: advice follows with the exact plan";
    static final int PARALLEL_ABOVE = 200;

    private PreviewPlanner() {
    }

    /** Whether the plan came from {@link #plan} (its first warning is {@link #WARNING}). */
    public static boolean isPreview(Plan plan) {
        return !plan.warnings().isEmpty() && plan.warnings().get(0).equals(WARNING);
    }

    /** A link of the preview with its edge. */
    private record Link(LinkReport report, LinkEdge edge) {
    }

    /**
     * Whether the preview models this layout: all-active signalling only (a round-robin schedule
     * decimates every link's taps per slot, which the preview does not do; callers show no preview).
     */
    public static boolean supports(Scenario scenario) {
        return scenario.signalling().schedule() == dev.nanoplan.scenario.Schedule.ALL_ACTIVE;
    }

    /**
     * Plans the scenario approximately (floor, cutoff and channel of {@code options}; the progress
     * callback is told 0 and 1 only).
     *
     * @throws IllegalArgumentException if {@code options.channel()} names nodes not in the scenario, or the
     *     schedule is not all-active ({@link #supports})
     */
    public static Plan plan(Scenario scenario, PlanOptions options) {
        if (!supports(scenario)) {
            throw new IllegalArgumentException("signalling.schedule: the preview covers all-active only, got "
                    + scenario.signalling().schedule().id());
        }
        options.progress().accept(0);
        ChannelMatrix channel = options.channel() != null ? options.channel()
                : AnalyticChannel.build(scenario, options.cutoffMolecules());
        Map<String, Node> nodes = scenario.nodesById();
        for (ChannelEntry e : channel.entries()) {
            if (!nodes.containsKey(e.emitter()) || !nodes.containsKey(e.receiver())) {
                throw new IllegalArgumentException("channel: pair " + e.emitter() + " -> " + e.receiver()
                        + " names a node that is not in the scenario");
            }
        }
        List<String> warnings = new ArrayList<>();
        warnings.add(WARNING);
        warnings.addAll(channel.notes());
        Signalling sig = scenario.signalling();
        List<String> receivers = channel.receivers();
        @SuppressWarnings("unchecked")
        List<Link>[] per = new List[receivers.size()];
        IntStream range = IntStream.range(0, receivers.size());
        if (receivers.size() > PARALLEL_ABOVE) {
            range = range.parallel();
        }
        range.forEach(ri -> per[ri] = receiver(scenario, nodes, channel.atReceiver(receivers.get(ri)), options));
        List<LinkReport> reports = new ArrayList<>();
        List<LinkEdge> edges = new ArrayList<>();
        Map<String, Link> byPair = new HashMap<>();
        for (List<Link> l : per) {
            for (Link k : l) {
                reports.add(k.report());
                edges.add(k.edge());
                byPair.put(NetworkPlanner.key(k.report().from(), k.report().to()), k);
            }
        }
        NetworkPlanner.addLinkWarnings(reports, sig, warnings);
        LinkGraph graph = LinkGraph.of(nodes.keySet(), edges, options.capacityFloorBits());
        List<RouteReport> routes = new ArrayList<>();
        for (Demand d : scenario.demands()) {
            routes.add(route(d, graph, byPair, nodes, sig, scenario.targets().minRateBitsPerS(), warnings));
        }
        options.progress().accept(1);
        return new Plan(scenario, channel.source(), reports, routes, List.of(), warnings);
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

    private static List<Link> receiver(Scenario scenario, Map<String, Node> nodes, List<ChannelEntry> entries,
            PlanOptions options) {
        List<Link> out = new ArrayList<>();
        if (entries.isEmpty()) {
            return out;
        }
        Signalling sig = scenario.signalling();
        double[] w = LinkContext.weights(sig);
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
        List<Term> strongest = new ArrayList<>(strongMax + 2);
        for (int i = 0; i < n; i++) {
            ChannelEntry e = entries.get(i);
            levels[i] = NetworkPlanner.levelsOf(sig, nodes.get(e.emitter()).moleculesPerSymbol());
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
                if (sv > 0 && (strongest.size() <= strongMax || sv > strongest.get(strongMax).spreadVar())) {
                    int at = strongest.size();
                    while (at > 0 && strongest.get(at - 1).spreadVar() < sv) {
                        at--;
                    }
                    strongest.add(at, new Term(i, k, sv));
                    if (strongest.size() > strongMax + 1) {
                        strongest.remove(strongest.size() - 1);
                    }
                }
            }
        }
        double maxBits = Math.log(m) / Math.log(2);
        double q = sig.priorOne();
        for (int i = 0; i < n; i++) {
            ChannelEntry e = entries.get(i);
            long[] lv = levels[i];
            double p0 = e.tap(0);
            long swing = lv[m - 1] - lv[0];
            // capacity <= total variation <= 1 - (1 - p0)^swing (as in the exact plan)
            double tvBound = p0 >= 1 ? 1 : -Math.expm1(swing * Math.log1p(-p0));
            if (tvBound < options.capacityFloorBits() || tvBound == 0) {
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
                if ((t.emitter() == i && t.tap() == 0) || isiTerms.size() + xtTerms.size() == strongMax
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
            double c = r.capacityBits();
            if (c < options.capacityFloorBits()) {
                continue;
            }
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
            Impairment limited = NetworkPlanner.limitedBy(gIsi, gXt, gNoise, maxBits - c);
            int top = top1 == i ? top2 : top1;
            String topId = top >= 0 && mom[top].mean() > 0 ? entries.get(top).emitter() : null;
            double share = topId != null && xtMean > 0 ? Math.min(1, mom[top].mean() / xtMean) : 0;
            String caveat = e.source().equals(ChannelMatrix.SIMULATED) ? "simulated" : e.modelCaveat();
            LinkReport report = new LinkReport(e.emitter(), e.receiver(), e.species(), p0, taps[i], swing * p0, xtMean,
                    own.isiMean(), background, r.threshold(), r.minErrorProbability(), r.log10ErrorProbability(), c,
                    c / sig.symbolTimeS(), r.crossoverZero(), r.crossoverOne(), limited, topId, share, caveat);
            out.add(new Link(report, new LinkEdge(e.emitter(), e.receiver(), c, r.channel())));
        }
        return out;
    }

    /** A term is kept apart as a mixture when its spread variance is at least this share of the link's shared variance. */
    static final double STRONG_FRACTION = 0.01;

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
            mix = mix.plus(c[0], c[1], c[2]);
        }
        for (double[][] c : second) {
            mix = mix.plus(c[0], c[1], c[2]);
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

    /** Capacity of a link whose count given level j is Bin(n_j, p0) + N(shared) + the mixture. */
    private static double capacity(long[] levels, double p0, double sharedMean, double sharedVar,
            NormalLinkApproximation.Mixture mix, double priorOne) {
        return NormalLinkApproximation.capacityBits(levelMeans(levels, p0, sharedMean),
                levelVariances(levels, p0, sharedVar), mix, priorOne);
    }

    private static RouteReport route(Demand d, LinkGraph graph, Map<String, Link> byPair, Map<String, Node> nodes,
            Signalling sig, double minRate, List<String> warnings) {
        Node src = nodes.get(d.from());
        Node dst = nodes.get(d.to());
        Link directLink = byPair.get(NetworkPlanner.key(d.from(), d.to()));
        Double direct = directLink == null ? null : directLink.report().capacityBits();
        WidestPathFinder.Result<String> path = WidestPathFinder.find(graph.graph(), d.from(), d.to());
        if (!path.reachable()) {
            String why;
            String floor = NetworkPlanner.fmt(graph.floorBits());
            if (!src.role().emits()) {
                why = d.from() + " is a " + src.role().id() + " and cannot send";
            } else if (!dst.role().absorbs()) {
                why = d.to() + " is a " + dst.role().id() + " and cannot receive";
            } else if (graph.graph().outDegreeOf(d.from()) == 0) {
                why = d.from() + " has no link above " + floor + " bit to any node";
            } else if (graph.graph().inDegreeOf(d.to()) == 0) {
                why = d.to() + " hears no emitter above " + floor + " bit";
            } else {
                why = "no chain of links above " + floor + " bit joins them";
            }
            String advice = "no route: " + why + "; add a relay between them or move " + d.from() + " closer to "
                    + d.to();
            warnings.add("demand " + d.from() + " -> " + d.to() + ": " + advice);
            return new RouteReport(d.from(), d.to(), List.of(), 0, null, null, 0, 0, 0, direct, null, advice);
        }
        List<String> v = path.vertices();
        double[][][] matrices = new double[v.size() - 1][][];
        LinkReport weakest = null;
        for (int i = 0; i + 1 < v.size(); i++) {
            Link l = byPair.get(NetworkPlanner.key(v.get(i), v.get(i + 1)));
            matrices[i] = l.edge().channel();
            if (weakest == null || l.report().capacityBits() < weakest.capacityBits()) {
                weakest = l.report();
            }
        }
        double t = sig.symbolTimeS();
        double endToEnd = matrices.length == 1 ? weakest.capacityBits()
                : Math.min(dev.nanoplan.info.ChannelCascade.capacityBits(matrices), weakest.capacityBits());
        double rate = endToEnd / t;
        if (rate < minRate) {
            warnings.add(String.format(Locale.ROOT, "demand %s -> %s: %.3g bit/s is below the target %.3g bit/s",
                    d.from(), d.to(), rate, minRate));
        }
        return new RouteReport(d.from(), d.to(), v, weakest.capacityBits(), weakest.from(), weakest.to(), endToEnd,
                rate, (v.size() - 1) * t, direct, weakest.limitedBy(), ADVICE);
    }
}
