package dev.nanoplan.plan;

import dev.nanoplan.info.Entropy;
import dev.nanoplan.network.ChannelEntry;
import dev.nanoplan.network.ChannelMatrix;
import dev.nanoplan.network.Crosstalk;
import dev.nanoplan.network.LinkEdge;
import dev.nanoplan.network.LinkEvaluation;
import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.Signalling;
import dev.nanoplan.scenario.Species;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.function.DoubleConsumer;
import java.util.function.Function;

/**
 * The exact per-receiver evaluator of {@link NetworkPlanner}: every emitter → receiver pair of the
 * receiver's channel entries that passes the {@link TotalVariationBound} pre-skip and the Gaussian
 * screen is evaluated with the scenario's count model ({@link dev.nanoplan.network.LinkEvaluator}), with
 * every other emitter at the receiver as interference ({@link Crosstalk}: the strongest
 * {@link PlanOptions#exactInterferers()} exactly, the rest moment-matched) plus background.
 *
 * <p><b>All-active.</b> The crosstalk of one receiver is prepared once for all of its links
 * ({@link ReceiverCrosstalk}), so a link costs one wide convolution per level instead of one per
 * crosstalk term; the capacities equal the per-link convolution within 1e-9 bit
 * ({@code SharedInterferenceTest}).
 *
 * <p><b>Round-robin.</b> Each link hears its own and its neighbours' taps decimated to its emitter's
 * slots ({@link SlotSchedule}); the crosstalk then depends on the emitter decoded, so it is built per
 * link (no shared receiver crosstalk).
 *
 * <p><b>limited_by.</b> The link is re-evaluated with ISI removed (taps after p_0 zero), crosstalk
 * removed, and background removed, with the what-if model ({@link LinkContext#whatIfModel()});
 * {@link Impairment#limitedBy} names the impairment.
 *
 * <p>Advice: proposed by {@link BottleneckAdvisor}, checked by {@link AdviceChecker}; budgets: {@link MoleculeBudgets}. Receivers are evaluated in
 * parallel.
 */
final class ExactReceiverEvaluator implements ReceiverEvaluator {

    static final ExactReceiverEvaluator INSTANCE = new ExactReceiverEvaluator();

    private ExactReceiverEvaluator() {
    }

    @Override
    public ReceiverLinks evaluate(PlanInputs in, List<ChannelEntry> entries) {
        return in.slots().allActive() ? evaluateShared(in, entries) : evaluateScheduled(in, entries);
    }

    @Override
    public List<String> leadingWarnings(double largestDeviationBits) {
        return List.of();
    }

    /** None before the check: the route's line is the checked one ({@link #propose}). */
    @Override
    public String advice(PlanInputs in, EvaluatedLink weakest) {
        return null;
    }

    @Override
    public BottleneckAdvisor.Proposal propose(PlanInputs in, EvaluatedLink weakest,
            Function<String, List<String>> followers) {
        return BottleneckAdvisor.propose(in.scenario(), weakest.context(), weakest.report(), adviceTargetBits(in),
                followers);
    }

    /**
     * The operating mutual information the advice aims for: binary, the option's fraction of the
     * input entropy H(q), the most any link carries at the file's prior (I(X;Y) ≤ H(X), Shannon
     * 1948), so 0.9 bit at q = 0.5 and 0.26 bit at q = 0.05; more levels, the option in bits
     * (uniform inputs carry up to log2 M ≥ 1.58 bit).
     */
    static double adviceTargetBits(PlanInputs in) {
        Signalling sig = in.scenario().signalling();
        double target = in.options().adviceTargetBits();
        return sig.levels() == 2 ? target * Entropy.binaryBits(sig.priorOne()) : target;
    }

    @Override
    public List<BudgetReport> budgets(PlanInputs in, List<List<EvaluatedLink>> routeHops, DoubleConsumer progress) {
        return MoleculeBudgets.compute(in.scenario(), routeHops, progress, in.options().jointBudgets());
    }

    @Override
    public boolean parallel(int receivers) {
        return true;
    }

    /** All-active: the receiver's crosstalk is prepared once and shared by its links ({@link ReceiverCrosstalk}). */
    private static ReceiverLinks evaluateShared(PlanInputs in, List<ChannelEntry> entries) {
        Scenario scenario = in.scenario();
        Map<String, Node> nodes = in.nodes();
        double[] weights = in.weights();
        PlanOptions options = in.options();
        List<EvaluatedLink> out = new ArrayList<>();
        Map<LinkKey, Double> evaluatedCapacity = new HashMap<>();
        Node rx = nodes.get(entries.get(0).receiver());
        Species sp = in.species().get(rx.species());
        List<Crosstalk.Interferer> all = new ArrayList<>(entries.size());
        for (ChannelEntry e : entries) {
            Node tx = nodes.get(e.emitter());
            all.add(new Crosstalk.Interferer(tx.id(), e.taps(), LinkContext.levelsOf(scenario.signalling(),
                    tx.moleculesPerSymbol()), weights));
        }
        ReceiverCrosstalk shared = new ReceiverCrosstalk(new Crosstalk.Prepared(all), options.exactInterferers());
        for (int i = 0; i < entries.size(); i++) {
            ChannelEntry e = entries.get(i);
            Node tx = nodes.get(e.emitter());
            long[] lv = all.get(i).levelMolecules();
            if (TotalVariationBound.skips(e.tap(0), lv[lv.length - 1] - lv[0], options.capacityFloorBits())) {
                continue;
            }
            List<Crosstalk.Interferer> others = new ArrayList<>(all);
            others.remove(i);
            int rank = shared.prepared().rankOf(i);
            LinkContext ctx = LinkContext.builder(scenario, tx, rx, sp, e)
                    .interferers(others, options.exactInterferers()).terms(shared.termsWithout(rank))
                    .shared(shared, rank).build();
            if (!ctx.passesScreen(options.capacityFloorBits())) {
                continue;
            }
            LinkEvaluation ev = ctx.evaluate();
            evaluatedCapacity.put(new LinkKey(tx.id(), rx.id()), ev.mutualInformationBits());
            if (ev.mutualInformationBits() < options.capacityFloorBits()) {
                continue;
            }
            out.add(report(ctx, ev, others, scenario.targets().maxErrorProbability()));
        }
        shared.release();
        for (EvaluatedLink e : out) {
            e.context().detachShared();
        }
        return new ReceiverLinks(out, evaluatedCapacity);
    }

    /**
     * The links of one receiver under a slot schedule other than all-active: per link, its own taps
     * and every other emitter's taps decimated to the link emitter's slots ({@link SlotSchedule}),
     * silent interferers dropped, crosstalk convolved per link.
     */
    private static ReceiverLinks evaluateScheduled(PlanInputs in, List<ChannelEntry> entries) {
        Scenario scenario = in.scenario();
        Map<String, Node> nodes = in.nodes();
        double[] weights = in.weights();
        PlanOptions options = in.options();
        SlotSchedule slots = in.slots();
        List<EvaluatedLink> out = new ArrayList<>();
        Map<LinkKey, Double> evaluatedCapacity = new HashMap<>();
        for (int i = 0; i < entries.size(); i++) {
            ChannelEntry e = entries.get(i);
            Node tx = nodes.get(e.emitter());
            Node rx = nodes.get(e.receiver());
            long[] lv = LinkContext.levelsOf(scenario.signalling(), tx.moleculesPerSymbol());
            // p0 is kept by every schedule
            if (TotalVariationBound.skips(e.tap(0), lv[lv.length - 1] - lv[0], options.capacityFloorBits())) {
                continue;
            }
            List<Crosstalk.Interferer> others = new ArrayList<>(entries.size());
            for (int j = 0; j < entries.size(); j++) {
                ChannelEntry o = entries.get(j);
                double[] heard = j == i ? null : slots.interferer(e.species(), e.emitter(), o.emitter(), o.taps());
                if (heard != null && heard.length > 0) {
                    others.add(new Crosstalk.Interferer(o.emitter(), heard,
                            LinkContext.levelsOf(scenario.signalling(), nodes.get(o.emitter()).moleculesPerSymbol()), weights));
                }
            }
            ChannelEntry heard = new ChannelEntry(e.emitter(), e.receiver(), e.species(),
                    slots.own(e.species(), e.taps()), e.source(), e.modelCaveat());
            LinkContext ctx = LinkContext.builder(scenario, tx, rx, in.species().get(rx.species()), heard)
                    .interferers(others, options.exactInterferers()).schedule(slots, e).build();
            if (!ctx.passesScreen(options.capacityFloorBits())) {
                continue;
            }
            LinkEvaluation ev = ctx.evaluate();
            evaluatedCapacity.put(new LinkKey(tx.id(), rx.id()), ev.mutualInformationBits());
            if (ev.mutualInformationBits() >= options.capacityFloorBits()) {
                out.add(report(ctx, ev, others, scenario.targets().maxErrorProbability()));
            }
        }
        return new ReceiverLinks(out, evaluatedCapacity);
    }

    private static EvaluatedLink report(LinkContext ctx, LinkEvaluation ev, List<Crosstalk.Interferer> others,
            double maxErrorProbability) {
        double c = ev.mutualInformationBits();
        int m = ctx.signalling().levels();
        // the most the operating point can carry: the input entropy H(q) (binary), log2 M (uniform levels)
        double maxBits = m == 2 ? Entropy.binaryBits(ctx.signalling().priorOne()) : Math.log(m) / Math.log(2);
        // the what-ifs run on the what-if model: compare them with the same model's baseline
        double cw = ctx.whatIfModel() == ctx.signalling().countModel() ? c : ctx.whatIfBaselineBits();
        double gIsi = ev.isiMeanMolecules() > 0 ? ctx.capacityWithoutIsi() - cw : 0;
        double gXt = others.isEmpty() ? 0 : ctx.capacityWithoutCrosstalk() - cw;
        double gNoise = ev.backgroundMeanMolecules() > 0 ? ctx.capacityWithoutNoise() - cw : 0;
        Impairment limited = Impairment.limitedBy(gIsi, gXt, gNoise, maxBits - c);
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
        // the operating detector: the one the relays use, so the graph edge carries its matrix
        double[][] matrix = ev.operatingChannel();
        double e0 = 1 - matrix[0][0];
        double e1 = 1 - matrix[m - 1][m - 1];
        if (m == 2) {
            e0 = matrix[0][1];
            e1 = matrix[1][0];
        }
        ChannelEntry entry = ctx.physical;
        String caveat = entry.source().equals(ChannelMatrix.SIMULATED) ? "simulated" : entry.modelCaveat();
        double p0 = entry.tap(0);
        LinkReport r = new LinkReport(entry.emitter(), entry.receiver(), entry.species(), p0, entry.taps(),
                ev.signalMeanMolecules(), sum, ev.isiMeanMolecules(), ev.backgroundMeanMolecules(),
                ev.operatingThreshold(), ev.errorProbability(), ev.log10OperatingErrorProbability(),
                ev.minErrorThreshold(), ev.minErrorProbability(), c, ev.operatingRateBitsPerS(), null, null,
                clamp(e0), clamp(e1), ev.countBlindMeets(maxErrorProbability), limited, top, share, caveat);
        return new EvaluatedLink(r, new LinkEdge(entry.emitter(), entry.receiver(), c, matrix), ctx.frameSlots, ctx,
                ev::capacity);
    }

    private static double clamp(double v) {
        return Math.max(0, Math.min(1, v));
    }
}
