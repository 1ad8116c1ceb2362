package dev.nanoplan.plan;

import dev.nanoplan.network.AnalyticChannel;
import dev.nanoplan.network.ChannelEntry;
import dev.nanoplan.network.ChannelMatrix;
import dev.nanoplan.network.LinkCapacity;
import dev.nanoplan.network.LinkEdge;
import dev.nanoplan.network.LinkGraph;
import dev.nanoplan.scenario.Demand;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.Signalling;
import dev.nanoplan.scenario.Species;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;
import java.util.concurrent.ConcurrentHashMap;
import java.util.concurrent.atomic.AtomicInteger;
import java.util.function.DoubleConsumer;
import java.util.stream.IntStream;

/**
 * The one plan skeleton (docs/architecture.md, data flow): channel → per-receiver link evaluation
 * ({@link ReceiverEvaluator}) → link graph → routes ({@link RouteAssembler}) → molecule budgets →
 * shared rates ({@link SharedRates}) → warnings. The exact plan and the preview differ only in the
 * evaluator.
 *
 * <p>The steps are separate so that {@link IncrementalPlanner} can keep the per-receiver results of
 * receivers whose inputs did not change and redo only {@link #assemble} for the rest.
 *
 * <p><b>Warnings</b>, in this order: the evaluator's leading ones, the channel's notes, round-robin
 * memory notes, the links' notes (model caveats, levels &gt; 2), per demand (unreachable, below the
 * rate target), then the shared-rate ones.
 *
 * <p><b>Advice</b> is proposed per route by the evaluator and checked by re-planning the layout with each
 * proposed change ({@link AdviceChecker}); those re-plans ({@link #whatIf}) re-evaluate only the
 * receivers the change reaches ({@link IncrementalPlanner#whatIf}) and skip budgets and advice.
 *
 * <p>Progress: the channel is 20 % of the work, links 65 %, routes 5 %, budgets 5 %, the advice
 * 5 % (proposals per route, then the checking re-plans).
 */
final class PlanPipeline {

    private PlanPipeline() {
    }

    /** Plans the scenario with the given evaluator. */
    static Plan plan(Scenario scenario, PlanOptions options, ReceiverEvaluator evaluator) {
        return planChecked(scenario, options, evaluator).plan();
    }

    /**
     * The channel of the plan: {@link PlanOptions#channel()} when given, else the analytic one.
     *
     * @throws IllegalArgumentException if the channel names nodes not in the scenario
     */
    static ChannelMatrix channel(PlanInputs in, DoubleConsumer progress) {
        PlanOptions options = in.options();
        ChannelMatrix channel = options.channel() != null ? options.channel()
                : AnalyticChannel.build(in.scenario(), options.cutoffMolecules(), progress);
        for (ChannelEntry e : channel.entries()) {
            if (!in.nodes().containsKey(e.emitter()) || !in.nodes().containsKey(e.receiver())) {
                throw new IllegalArgumentException("channel: pair " + e.emitter() + " -> " + e.receiver()
                        + " names a node that is not in the scenario");
            }
        }
        return channel;
    }

    /**
     * The channel of an edited layout ({@link IncrementalPlanner}) planned with the channel {@code given}
     * for the original: the analytic channel of the edit when none was given; {@code given} when it holds
     * no closed-form entry (simulated taps do not follow edits; the advice only changes molecules there);
     * else, for a mixed channel, the closed forms of the edit for every emitter that had closed-form taps
     * and {@code given}'s entries of the other emitters.
     */
    static ChannelMatrix editedChannel(PlanInputs next, ChannelMatrix given) {
        PlanOptions options = next.options();
        if (options.channel() == null) {
            return channel(next, f -> { });
        }
        if (given.entries().stream().noneMatch(e -> e.source().equals(ChannelMatrix.ANALYTIC))) {
            return given;
        }
        ChannelMatrix analytic = AnalyticChannel.build(next.scenario(), options.cutoffMolecules());
        Set<String> fixed = new HashSet<>();
        for (ChannelEntry e : given.entries()) {
            if (!e.source().equals(ChannelMatrix.ANALYTIC)) {
                fixed.add(e.emitter());
            }
        }
        List<ChannelEntry> entries = new ArrayList<>();
        for (ChannelEntry e : analytic.entries()) {
            if (!fixed.contains(e.emitter())) {
                entries.add(e);
            }
        }
        for (ChannelEntry e : given.entries()) {
            if (fixed.contains(e.emitter()) && next.nodes().containsKey(e.receiver())
                    && next.nodes().containsKey(e.emitter())) {
                entries.add(e);
            }
        }
        return ChannelMatrix.of(entries, given.notes());
    }

    /** The evaluator's result at each of {@code receivers} (receivers of {@code channel}). */
    static Map<String, ReceiverLinks> evaluate(PlanInputs in, ChannelMatrix channel, List<String> receivers,
            ReceiverEvaluator evaluator, DoubleConsumer progress) {
        ReceiverLinks[] per = new ReceiverLinks[receivers.size()];
        AtomicInteger done = new AtomicInteger();
        int total = Math.max(1, receivers.size());
        IntStream range = IntStream.range(0, receivers.size());
        if (evaluator.parallel(receivers.size())) {
            range = range.parallel();
        }
        range.forEach(ri -> {
            List<ChannelEntry> entries = channel.atReceiver(receivers.get(ri));
            per[ri] = entries.isEmpty() ? ReceiverLinks.NONE : evaluator.evaluate(in, entries);
            progress.accept(done.incrementAndGet() / (double) total);
        });
        Map<String, ReceiverLinks> out = new HashMap<>(receivers.size() * 2);
        for (int i = 0; i < per.length; i++) {
            out.put(receivers.get(i), per[i]);
        }
        return out;
    }

    /**
     * The plan from the channel and the evaluated links of every receiver of the channel (taken in
     * the channel's receiver order): link graph, routes, budgets, shared rates, warnings and the
     * checked advice.
     */
    static Plan assemble(PlanInputs in, ChannelMatrix channel, Map<String, ReceiverLinks> byReceiver,
            ReceiverEvaluator evaluator) {
        return assembleChecked(in, channel, byReceiver, evaluator).plan();
    }

    /**
     * The plan {@link #assemble} gives but with the routes' advice unchecked (null for the exact evaluator):
     * links, routes, budgets (with the progress of {@code in}'s options), shared rates and warnings.
     */
    static Plan budgeted(PlanInputs in, ChannelMatrix channel, Map<String, ReceiverLinks> byReceiver,
            ReceiverEvaluator evaluator) {
        return assemble(in, channel, byReceiver, evaluator, true, new ArrayList<>());
    }

    /** {@link #assemble}, with the verdicts of the advice check. */
    static AdviceChecker.Result assembleChecked(PlanInputs in, ChannelMatrix channel,
            Map<String, ReceiverLinks> byReceiver, ReceiverEvaluator evaluator) {
        List<List<EvaluatedLink>> routeHops = new ArrayList<>();
        Plan plan = assemble(in, channel, byReceiver, evaluator, true, routeHops);
        return checkAdvice(in, channel, byReceiver, evaluator, plan, routeHops);
    }

    /**
     * A plan to judge a change by: links and routes as {@link #assemble} gives them, without budgets
     * and with the routes' advice unchecked (null for the exact evaluator).
     */
    static Plan whatIf(PlanInputs in, ChannelMatrix channel, Map<String, ReceiverLinks> byReceiver,
            ReceiverEvaluator evaluator) {
        return assemble(in, channel, byReceiver, evaluator, false, new ArrayList<>());
    }

    /** The full plan of {@code scenario} with the verdicts of its advice check. */
    static AdviceChecker.Result planChecked(Scenario scenario, PlanOptions options, ReceiverEvaluator evaluator) {
        DoubleConsumer progress = options.progress();
        progress.accept(0);
        PlanInputs in = PlanInputs.of(scenario, options);
        ChannelMatrix channel = channel(in, f -> progress.accept(0.2 * f));
        Map<String, ReceiverLinks> links = evaluate(in, channel, channel.receivers(), evaluator,
                f -> progress.accept(0.2 + 0.65 * f));
        return assembleChecked(in, channel, links, evaluator);
    }

    /**
     * Proposes changes for each reachable route's weakest hop ({@link ReceiverEvaluator#propose}) and
     * checks them ({@link AdviceChecker}), re-planning each change incrementally from this plan's links
     * ({@link IncrementalPlanner#whatIf}).
     */
    private static AdviceChecker.Result checkAdvice(PlanInputs in, ChannelMatrix channel,
            Map<String, ReceiverLinks> byReceiver, ReceiverEvaluator evaluator, Plan plan,
            List<List<EvaluatedLink>> routeHops) {
        DoubleConsumer progress = in.options().progress();
        Map<String, List<String>> followers = new HashMap<>();
        for (RouteReport r : plan.routes()) {
            for (int i = 0; i + 1 < r.hops().size(); i++) {
                List<String> f = followers.computeIfAbsent(r.hops().get(i), k -> new ArrayList<>());
                if (!f.contains(r.hops().get(i + 1))) {
                    f.add(r.hops().get(i + 1));
                }
            }
        }
        List<BottleneckAdvisor.Proposal> proposals = new ArrayList<>();
        for (int i = 0; i < plan.routes().size(); i++) {
            RouteReport r = plan.routes().get(i);
            EvaluatedLink weakest = routeHops.get(i).stream().filter(e -> e.report().from().equals(r.bottleneckFrom())
                    && e.report().to().equals(r.bottleneckTo())).findFirst().orElse(null);
            proposals.add(weakest == null ? null
                    : evaluator.propose(in, weakest, id -> followers.getOrDefault(id, List.of())));
            // proposing searches each bottleneck (slow with many levels): the first half of the advice share
            progress.accept(0.95 + 0.025 * (i + 1) / plan.routes().size());
        }
        if (proposals.stream().allMatch(p -> p == null)) {
            progress.accept(1.0);
            return new AdviceChecker.Result(plan, proposals.stream().map(p -> (AdviceChecker.RouteAdvice) null)
                    .toList(), 0, 0);
        }
        int bound = Math.max(1, AdviceChecker.maxReplans(in.scenario().nodes().size()));
        AtomicInteger replans = new AtomicInteger();
        AdviceChecker.Result checked = AdviceChecker.check(plan, proposals, s -> {
            Plan p = IncrementalPlanner.whatIf(in, channel, byReceiver, evaluator, s);
            progress.accept(0.975 + 0.025 * Math.min(1.0, replans.incrementAndGet() / (double) bound));
            return p;
        });
        progress.accept(1.0);
        return checked;
    }

    /**
     * The plan's links, routes (their hops to {@code routeHopsOut}), budgets when {@code complete},
     * shared rates and warnings.
     */
    private static Plan assemble(PlanInputs in, ChannelMatrix channel, Map<String, ReceiverLinks> byReceiver,
            ReceiverEvaluator evaluator, boolean complete, List<List<EvaluatedLink>> routeHopsOut) {
        Scenario scenario = in.scenario();
        PlanOptions options = in.options();
        DoubleConsumer progress = complete ? options.progress() : f -> { };
        Signalling sig = scenario.signalling();
        double deviation = 0;
        for (ReceiverLinks links : byReceiver.values()) {
            deviation = Math.max(deviation, links.deviationBits());
        }
        List<String> warnings = new ArrayList<>(evaluator.leadingWarnings(deviation));
        warnings.addAll(channel.notes());
        addScheduleWarnings(in, warnings);

        Map<LinkKey, EvaluatedLink> byPair = new HashMap<>();
        Map<LinkKey, Double> evaluatedCapacity = new HashMap<>();
        List<LinkEdge> edges = new ArrayList<>();
        List<LinkReport> linkReports = new ArrayList<>();
        for (String r : channel.receivers()) {
            ReceiverLinks links = byReceiver.get(r);
            evaluatedCapacity.putAll(links.evaluatedCapacity());
            for (EvaluatedLink e : links.kept()) {
                byPair.put(e.key(), e);
                edges.add(e.edge());
                // stamped here, not by the evaluator: the reason may change without the link's inputs
                ChannelEntry entry = channel.entry(e.report().from(), e.report().to());
                linkReports.add(e.report().withChannel(entry.source(), entry.channelReason()));
            }
        }
        addLinkWarnings(linkReports, sig, warnings);
        LinkGraph graph = LinkGraph.of(in.nodes().keySet(), edges, options.capacityFloorBits());

        RouteAssembler assembler = new RouteAssembler(in, graph, byPair, evaluatedCapacity, evaluator);
        List<RouteReport> routes = new ArrayList<>();
        List<List<EvaluatedLink>> routeHops = routeHopsOut;
        for (Demand d : scenario.demands()) {
            List<EvaluatedLink> hops = new ArrayList<>();
            routes.add(assembler.route(d, hops, warnings));
            routeHops.add(hops);
        }
        linkReports = withCapacities(linkReports, byPair, routeHops, evaluator);
        progress.accept(0.9);
        List<BudgetReport> budgets = complete ? evaluator.budgets(in, routeHops, f -> progress.accept(0.9 + 0.05 * f))
                : List.of();
        progress.accept(0.95);
        warnings.addAll(MoleculeBudgets.warnings(scenario));
        Plan plan = new Plan(scenario, channel.source(), linkReports, routes, budgets, warnings);
        List<String> shared = SharedRates.warnings(plan);
        if (shared.isEmpty()) {
            return plan;
        }
        warnings.addAll(shared);
        return new Plan(scenario, channel.source(), linkReports, routes, budgets, warnings);
    }

    /**
     * The links with their consistent capacity (headroom: what another prior of the emitter would
     * give) filled in for the route hops; other links keep null. The capacity costs tens of count-pmf
     * builds per link with ISI, which a plan of a thousand nodes cannot afford for every link; the
     * hops are what a designer acts on.
     */
    private static List<LinkReport> withCapacities(List<LinkReport> links, Map<LinkKey, EvaluatedLink> byPair,
            List<List<EvaluatedLink>> routeHops, ReceiverEvaluator evaluator) {
        Map<LinkKey, EvaluatedLink> hops = new LinkedHashMap<>();
        for (List<EvaluatedLink> route : routeHops) {
            for (EvaluatedLink e : route) {
                if (e.capacity() != null) {
                    hops.putIfAbsent(e.key(), e);
                }
            }
        }
        if (hops.isEmpty()) {
            return links;
        }
        List<EvaluatedLink> todo = new ArrayList<>(hops.values());
        Map<LinkKey, LinkCapacity> capacities = new ConcurrentHashMap<>();
        IntStream range = IntStream.range(0, todo.size());
        if (evaluator.parallel(todo.size())) {
            range = range.parallel();
        }
        range.forEach(i -> capacities.put(todo.get(i).key(), todo.get(i).capacity().get()));
        List<LinkReport> out = new ArrayList<>(links.size());
        for (LinkReport l : links) {
            LinkCapacity c = capacities.get(LinkKey.of(l));
            out.add(c == null ? l : l.withCapacity(c.bits(), c.inputDistribution().length == 2 ? c.priorOne() : null));
        }
        return out;
    }

    /** Round-robin and slots: a note per species whose frame is longer than half the ISI memory. */
    private static void addScheduleWarnings(PlanInputs in, List<String> warnings) {
        SlotSchedule slots = in.slots();
        Signalling sig = in.scenario().signalling();
        for (Species sp : slots.allActive() ? List.<Species>of() : in.scenario().species()) {
            int frame = slots.frameSlots(sp.name());
            if (frame > 1 && sig.isiMemorySymbols() < 2 * frame) {
                warnings.add(String.format(Locale.ROOT, "%s: species %s has a frame of %d slots but "
                        + "isi_memory_symbols is %d: leftovers older than that (a link's own earlier symbols come "
                        + "%d slots back) are not counted; let the memory cover a few frames unless %s decays within "
                        + "a few slots", slots.schedule().id(), sp.name(), frame, sig.isiMemorySymbols(), frame, sp.name()));
            }
        }
    }

    /** The plan-wide notes about its links: closed forms used near walls or in flow, and levels > 2. */
    private static void addLinkWarnings(List<LinkReport> links, Signalling sig, List<String> warnings) {
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
}
