package dev.nanoplan.plan;

import dev.nanoplan.network.AnalyticChannel;
import dev.nanoplan.network.ChannelEntry;
import dev.nanoplan.network.ChannelMatrix;
import dev.nanoplan.network.Crosstalk;
import dev.nanoplan.network.LinkEdge;
import dev.nanoplan.network.LinkEvaluation;
import dev.nanoplan.network.LinkGraph;
import dev.nanoplan.scenario.Demand;
import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.Signalling;
import dev.nanoplan.scenario.Species;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.ConcurrentHashMap;
import java.util.concurrent.atomic.AtomicInteger;
import java.util.function.DoubleConsumer;
import java.util.stream.IntStream;

/**
 * Plans a layout end to end (DESIGN.md §2): channel → every link under all-active crosstalk →
 * link graph → one widest route per demand with decode-and-forward cascade capacity →
 * bottleneck advice → molecule budgets.
 *
 * <p><b>Links.</b> Every emitter → receiver pair of the channel is a candidate. A pair is skipped
 * without evaluation when its capacity provably stays below the floor: the capacity of a binary
 * (or M-level) input channel is at most the total variation distance between the count laws of
 * the extreme levels, and that is at most P(Bin(n_max − n_min, p_0) ≠ 0) = 1 − (1 − p_0)^{n_max−n_min}
 * (the output is a degraded version of an erasure channel that reveals the input with that
 * probability). The others are evaluated exactly ({@link dev.nanoplan.network.LinkEvaluator}) with
 * every other emitter at the receiver as interference ({@link Crosstalk}: strongest
 * {@link PlanOptions#exactInterferers()} exactly, the rest moment-matched) plus background.
 * The crosstalk of one receiver is prepared once for all of its links ({@link ReceiverCrosstalk}:
 * sorted emitters, their terms and moments, and prefix/suffix convolutions of the exactly treated
 * emitters), so a link costs one wide convolution per level instead of one per crosstalk term; the
 * capacities equal the per-link convolution within 1e-9 bit ({@code SharedInterferenceTest}).
 * Receivers are evaluated in parallel.
 *
 * <p><b>limited_by.</b> The link is re-evaluated with ISI removed (taps after p_0 zero), crosstalk
 * removed, and background removed; the removal that raises capacity most names the impairment,
 * unless even that gain closes less than 10 % of the gap to log2 M bits, in which case the link is
 * {@link Impairment#SIGNAL}-limited (too few molecules arrive).
 *
 * <p><b>Routes.</b> {@link WidestPathFinder} on the {@link LinkGraph}; relays decode and forward,
 * so the end-to-end capacity is that of the cascade of the hops' transition matrices at their
 * capacity-achieving detectors ({@link dev.nanoplan.info.ChannelCascade}), never above the
 * weakest hop. Latency = hops × T, rate = end-to-end capacity / T.
 *
 * <p><b>Round-robin.</b> Under {@link dev.nanoplan.scenario.Schedule#ROUND_ROBIN} each link hears
 * its own and its neighbours' taps decimated to its emitter's slots ({@link SlotSchedule}); the
 * crosstalk then depends on the emitter decoded, so it is built per link (no shared receiver
 * crosstalk). A link's rate is capacity / (K·T) for a frame of K slots, a route's latency Σ K_h·T
 * over its hops and its rate the end-to-end capacity over the longest frame K_max·T.
 *
 * <p>Progress: the channel is 20 % of the work, links 65 %, routes and advice 5 %, budgets 10 %.
 */
public final class NetworkPlanner {

    /** Fraction of the gap to log2 M below which no removal "helps much" (then SIGNAL). */
    static final double HELPS_FRACTION = 0.1;

    private NetworkPlanner() {
    }

    /** A link evaluated in context. */
    record Evaluated(LinkReport report, LinkEdge edge, LinkContext context) {
    }

    /**
     * Plans the scenario.
     *
     * @throws IllegalArgumentException if {@code options.channel()} names nodes not in the scenario
     */
    public static Plan plan(Scenario scenario, PlanOptions options) {
        DoubleConsumer progress = options.progress();
        progress.accept(0);
        ChannelMatrix channel = options.channel() != null ? options.channel()
                : AnalyticChannel.build(scenario, options.cutoffMolecules(), f -> progress.accept(0.2 * f));
        Map<String, Node> nodes = scenario.nodesById();
        Map<String, Species> species = scenario.speciesByName();
        for (ChannelEntry e : channel.entries()) {
            if (!nodes.containsKey(e.emitter()) || !nodes.containsKey(e.receiver())) {
                throw new IllegalArgumentException("channel: pair " + e.emitter() + " -> " + e.receiver()
                        + " names a node that is not in the scenario");
            }
        }
        List<String> warnings = new ArrayList<>(channel.notes());
        Signalling sig = scenario.signalling();
        double[] weights = LinkContext.weights(sig);
        SlotSchedule slots = SlotSchedule.of(scenario);
        for (Species sp : slots.allActive() ? List.<Species>of() : scenario.species()) {
            int frame = slots.frameSlots(sp.name());
            if (frame > 1 && sig.isiMemorySymbols() < 2 * frame) {
                warnings.add(String.format(Locale.ROOT, "round-robin: species %s has a frame of %d slots but "
                        + "isi_memory_symbols is %d: leftovers older than that (a link's own earlier symbols come "
                        + "%d slots back) are not counted; let the memory cover a few frames unless %s decays within "
                        + "a few slots", sp.name(), frame, sig.isiMemorySymbols(), frame, sp.name()));
            }
        }

        List<String> receivers = channel.receivers();
        @SuppressWarnings("unchecked")
        List<Evaluated>[] perReceiver = new List[receivers.size()];
        Map<String, Double> evaluatedCapacity = new ConcurrentHashMap<>();
        AtomicInteger done = new AtomicInteger();
        int total = Math.max(1, receivers.size());
        IntStream.range(0, receivers.size()).parallel().forEach(ri -> {
            perReceiver[ri] = slots.allActive()
                    ? evaluateReceiver(scenario, nodes, species, channel.atReceiver(receivers.get(ri)),
                            weights, options, evaluatedCapacity)
                    : evaluateScheduled(scenario, nodes, species, channel.atReceiver(receivers.get(ri)),
                            weights, options, evaluatedCapacity, slots);
            progress.accept(0.2 + 0.65 * done.incrementAndGet() / total);
        });
        List<Evaluated> links = new ArrayList<>();
        for (List<Evaluated> l : perReceiver) {
            links.addAll(l);
        }
        Map<String, Evaluated> byPair = new HashMap<>();
        List<LinkEdge> edges = new ArrayList<>();
        List<LinkReport> linkReports = new ArrayList<>(links.size());
        for (Evaluated e : links) {
            byPair.put(key(e.report().from(), e.report().to()), e);
            edges.add(e.edge());
            linkReports.add(e.report());
        }
        addLinkWarnings(linkReports, sig, warnings);
        LinkGraph graph = LinkGraph.of(nodes.keySet(), edges, options.capacityFloorBits());

        List<RouteReport> routes = new ArrayList<>();
        List<List<Evaluated>> routeHops = new ArrayList<>();
        for (Demand d : scenario.demands()) {
            List<Evaluated> hops = new ArrayList<>();
            routes.add(route(d, graph, byPair, evaluatedCapacity, hops, nodes, options, warnings));
            routeHops.add(hops);
        }
        progress.accept(0.9);
        List<BudgetReport> budgets = MoleculeBudgets.compute(scenario, routeHops,
                f -> progress.accept(0.9 + 0.1 * f));
        progress.accept(1.0);
        warnings.addAll(MoleculeBudgets.warnings(scenario));
        Plan plan = new Plan(scenario, channel.source(), linkReports, routes, budgets, warnings);
        List<String> shared = SharedRates.warnings(plan);
        if (shared.isEmpty()) {
            return plan;
        }
        warnings.addAll(shared);
        return new Plan(scenario, channel.source(), linkReports, routes, budgets, warnings);
    }

    /** The plan-wide notes about its links: closed forms used near walls or in flow, and levels > 2. */
    static void addLinkWarnings(List<LinkReport> links, Signalling sig, List<String> warnings) {
        long caveats = links.stream()
                .filter(l -> l.modelCaveat() != null && !l.modelCaveat().equals("simulated")).count();
        if (caveats > 0) {
            warnings.add(caveats + " link(s) rest on open-medium closed forms near walls or in flow "
                    + "(model_caveat); check them with the particle simulation");
        }
        if (sig.levels() > 2) {
            warnings.add("levels > 2: crossovers are the probabilities of deciding any other level for the lowest "
                    + "and highest level; earlier symbols are taken as uniform over the levels");
        }
    }

    /**
     * The impairment whose removal raises capacity most (gains in bits), or SIGNAL when even the best
     * gain closes less than {@link #HELPS_FRACTION} of the gap to log2 M ({@code gapBits}).
     */
    static Impairment limitedBy(double gainNoIsiBits, double gainNoCrosstalkBits, double gainNoNoiseBits,
            double gapBits) {
        Impairment limited = Impairment.SIGNAL;
        double best = HELPS_FRACTION * gapBits;
        if (gainNoIsiBits > best) {
            limited = Impairment.ISI;
            best = gainNoIsiBits;
        }
        if (gainNoCrosstalkBits > best) {
            limited = Impairment.CROSSTALK;
            best = gainNoCrosstalkBits;
        }
        if (gainNoNoiseBits > best) {
            limited = Impairment.NOISE;
        }
        return limited;
    }

    static String key(String from, String to) {
        return from + '\u0000' + to;
    }

    private static List<Evaluated> evaluateReceiver(Scenario scenario, Map<String, Node> nodes,
            Map<String, Species> species, List<ChannelEntry> entries, double[] weights, PlanOptions options,
            Map<String, Double> evaluatedCapacity) {
        List<Evaluated> out = new ArrayList<>();
        if (entries.isEmpty()) {
            return out;
        }
        Node rx = nodes.get(entries.get(0).receiver());
        Species sp = species.get(rx.species());
        List<Crosstalk.Interferer> all = new ArrayList<>(entries.size());
        for (ChannelEntry e : entries) {
            Node tx = nodes.get(e.emitter());
            all.add(new Crosstalk.Interferer(tx.id(), e.taps(), levelsOf(scenario.signalling(),
                    tx.moleculesPerSymbol()), weights));
        }
        ReceiverCrosstalk shared = new ReceiverCrosstalk(new Crosstalk.Prepared(all), options.exactInterferers());
        for (int i = 0; i < entries.size(); i++) {
            ChannelEntry e = entries.get(i);
            Node tx = nodes.get(e.emitter());
            long[] lv = all.get(i).levelMolecules();
            long swing = lv[lv.length - 1] - lv[0];
            // capacity <= total variation <= 1 - (1 - p0)^swing
            double tvBound = -Math.expm1(swing * Math.log1p(-Math.min(e.tap(0), 1 - 1e-300)));
            if (e.tap(0) >= 1) {
                tvBound = 1;
            }
            if (tvBound < options.capacityFloorBits() || tvBound == 0) {
                continue;
            }
            List<Crosstalk.Interferer> others = new ArrayList<>(all);
            others.remove(i);
            int rank = shared.prepared().rankOf(i);
            LinkContext ctx = new LinkContext(scenario, tx, rx, sp, e, others, options.exactInterferers(),
                    shared.termsWithout(rank), shared, rank);
            if (!ctx.passesScreen(options.capacityFloorBits())) {
                continue;
            }
            LinkEvaluation ev = ctx.evaluate();
            evaluatedCapacity.put(key(tx.id(), rx.id()), ev.capacityBits());
            if (ev.capacityBits() < options.capacityFloorBits()) {
                continue;
            }
            out.add(report(ctx, ev, others));
        }
        shared.release();
        for (Evaluated e : out) {
            e.context().detachShared();
        }
        return out;
    }

    /**
     * The links of one receiver under a slot schedule other than all-active: per link, its own taps
     * and every other emitter's taps decimated to the link emitter's slots ({@link SlotSchedule}),
     * silent interferers dropped, crosstalk convolved per link.
     */
    private static List<Evaluated> evaluateScheduled(Scenario scenario, Map<String, Node> nodes,
            Map<String, Species> species, List<ChannelEntry> entries, double[] weights, PlanOptions options,
            Map<String, Double> evaluatedCapacity, SlotSchedule slots) {
        List<Evaluated> out = new ArrayList<>();
        for (int i = 0; i < entries.size(); i++) {
            ChannelEntry e = entries.get(i);
            Node tx = nodes.get(e.emitter());
            Node rx = nodes.get(e.receiver());
            long[] lv = levelsOf(scenario.signalling(), tx.moleculesPerSymbol());
            long swing = lv[lv.length - 1] - lv[0];
            // capacity <= total variation <= 1 - (1 - p0)^swing (p0 is kept by every schedule)
            double tvBound = e.tap(0) >= 1 ? 1 : -Math.expm1(swing * Math.log1p(-e.tap(0)));
            if (tvBound < options.capacityFloorBits() || tvBound == 0) {
                continue;
            }
            List<Crosstalk.Interferer> others = new ArrayList<>(entries.size());
            for (int j = 0; j < entries.size(); j++) {
                ChannelEntry o = entries.get(j);
                double[] heard = j == i ? null : slots.interferer(e.species(), e.emitter(), o.emitter(), o.taps());
                if (heard != null && heard.length > 0) {
                    others.add(new Crosstalk.Interferer(o.emitter(), heard,
                            levelsOf(scenario.signalling(), nodes.get(o.emitter()).moleculesPerSymbol()), weights));
                }
            }
            ChannelEntry heard = new ChannelEntry(e.emitter(), e.receiver(), e.species(),
                    slots.own(e.species(), e.taps()), e.source(), e.modelCaveat());
            LinkContext ctx = new LinkContext(scenario, tx, rx, species.get(rx.species()), heard, others,
                    options.exactInterferers(), Crosstalk.terms(others, options.exactInterferers()), null, -1, slots, e);
            if (!ctx.passesScreen(options.capacityFloorBits())) {
                continue;
            }
            LinkEvaluation ev = ctx.evaluate();
            evaluatedCapacity.put(key(tx.id(), rx.id()), ev.capacityBits());
            if (ev.capacityBits() >= options.capacityFloorBits()) {
                out.add(report(ctx, ev, others));
            }
        }
        return out;
    }

    static long[] levelsOf(Signalling s, long top) {
        return dev.nanoplan.network.LinkSpec.evenLevels(s.levels(), Math.max(top, s.levels() - 1));
    }

    private static Evaluated report(LinkContext ctx, LinkEvaluation ev, List<Crosstalk.Interferer> others) {
        double c = ev.capacityBits();
        int m = ctx.signalling().levels();
        double maxBits = Math.log(m) / Math.log(2);
        // the what-ifs run on the what-if model: compare them with the same model's baseline
        double cw = ctx.whatIfModel() == ctx.signalling().countModel() ? c : ctx.whatIfBaselineBits();
        double gIsi = ev.isiMeanMolecules() > 0 ? ctx.capacityWithoutIsi() - cw : 0;
        double gXt = others.isEmpty() ? 0 : ctx.capacityWithoutCrosstalk() - cw;
        double gNoise = ev.backgroundMeanMolecules() > 0 ? ctx.capacityWithoutNoise() - cw : 0;
        Impairment limited = limitedBy(gIsi, gXt, gNoise, maxBits - c);
        String top = null;
        double topMean = 0;
        double sum = 0;
        for (Crosstalk.Interferer i : others) {
            double mean = i.meanPerSlot();
            sum += mean;
            if (mean > topMean) {
                topMean = mean;
                top = i.id();
            }
        }
        double share = sum > 0 ? topMean / sum : 0;
        double[][] matrix;
        long threshold;
        double e0;
        double e1;
        if (ev.binary() != null) {
            e0 = ev.binary().e0AtCapacity();
            e1 = ev.binary().e1AtCapacity();
            matrix = new double[][] {{1 - e0, e0}, {e1, 1 - e1}};
            threshold = ev.binary().miThreshold();
        } else {
            matrix = ev.multiLevel().channel();
            e0 = 1 - matrix[0][0];
            e1 = 1 - matrix[m - 1][m - 1];
            threshold = ev.multiLevel().thresholds()[0];
        }
        ChannelEntry entry = ctx.physical;
        String caveat = entry.source().equals(ChannelMatrix.SIMULATED) ? "simulated" : entry.modelCaveat();
        double p0 = entry.tap(0);
        LinkReport r = new LinkReport(entry.emitter(), entry.receiver(), entry.species(), p0, entry.taps(),
                ev.signalMeanMolecules(), sum, ev.isiMeanMolecules(), ev.backgroundMeanMolecules(), threshold,
                ev.minErrorProbability(), ev.log10ErrorProbability(), c, ev.rateBitsPerS(), clamp(e0), clamp(e1),
                limited, top, share, caveat);
        return new Evaluated(r, new LinkEdge(entry.emitter(), entry.receiver(), c, matrix), ctx);
    }

    private static double clamp(double v) {
        return Math.max(0, Math.min(1, v));
    }

    private static RouteReport route(Demand d, LinkGraph graph, Map<String, Evaluated> byPair,
            Map<String, Double> evaluatedCapacity, List<Evaluated> hopsOut, Map<String, Node> nodes,
            PlanOptions options, List<String> warnings) {
        Node src = nodes.get(d.from());
        Node dst = nodes.get(d.to());
        Double direct = evaluatedCapacity.get(key(d.from(), d.to()));
        WidestPathFinder.Result<String> path = WidestPathFinder.find(graph.graph(), d.from(), d.to());
        if (!path.reachable()) {
            String why;
            if (!src.role().emits()) {
                why = d.from() + " is a " + src.role().id() + " and cannot send";
            } else if (!dst.role().absorbs()) {
                why = d.to() + " is a " + dst.role().id() + " and cannot receive";
            } else if (graph.graph().outDegreeOf(d.from()) == 0) {
                why = d.from() + " has no link above " + fmt(graph.floorBits()) + " bit to any node";
            } else if (graph.graph().inDegreeOf(d.to()) == 0) {
                why = d.to() + " hears no emitter above " + fmt(graph.floorBits()) + " bit";
            } else {
                why = "no chain of links above " + fmt(graph.floorBits()) + " bit joins them";
            }
            String advice = "no route: " + why + "; add a relay between them or move " + d.from() + " closer to "
                    + d.to();
            warnings.add("demand " + d.from() + " -> " + d.to() + ": " + advice);
            return new RouteReport(d.from(), d.to(), List.of(), 0, null, null, 0, 0, 0, direct, null, advice);
        }
        List<String> v = path.vertices();
        List<double[][]> matrices = new ArrayList<>();
        Evaluated weakest = null;
        int frameSlotsSum = 0;
        int frameSlotsMax = 1;
        for (int i = 0; i + 1 < v.size(); i++) {
            Evaluated e = byPair.get(key(v.get(i), v.get(i + 1)));
            hopsOut.add(e);
            frameSlotsSum += e.context().frameSlots;
            frameSlotsMax = Math.max(frameSlotsMax, e.context().frameSlots);
            matrices.add(e.edge().channel());
            if (weakest == null || e.report().capacityBits() < weakest.report().capacityBits()) {
                weakest = e;
            }
        }
        double symbolT = weakest.context().symbolTimeS();
        double endToEnd = matrices.size() == 1 ? weakest.report().capacityBits()
                : Math.min(dev.nanoplan.info.ChannelCascade.capacityBits(matrices.toArray(new double[0][][])),
                        weakest.report().capacityBits());
        String advice = BottleneckAdvisor.advise(weakest.context(), weakest.report(), options.adviceTargetBits(),
                nodes);
        // one symbol per frame; all-active: frames of one slot, so rate = C/T and latency = hops × T
        double rate = endToEnd / (frameSlotsMax * symbolT);
        double minRate = weakest.context().scenario.targets().minRateBitsPerS();
        if (rate < minRate) {
            warnings.add(String.format(Locale.ROOT, "demand %s -> %s: %.3g bit/s is below the target %.3g bit/s",
                    d.from(), d.to(), rate, minRate));
        }
        return new RouteReport(d.from(), d.to(), v, weakest.report().capacityBits(), weakest.report().from(),
                weakest.report().to(), endToEnd, rate, frameSlotsSum * symbolT, direct,
                weakest.report().limitedBy(), advice);
    }

    static String fmt(double v) {
        return String.format(Locale.ROOT, "%.3g", v);
    }
}
