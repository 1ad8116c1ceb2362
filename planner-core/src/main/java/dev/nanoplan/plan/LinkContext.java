package dev.nanoplan.plan;

import dev.nanoplan.count.CountModelKind;
import dev.nanoplan.count.CountPmf;
import dev.nanoplan.count.CountTerm;
import dev.nanoplan.network.AnalyticChannel;
import dev.nanoplan.network.ChannelEntry;
import dev.nanoplan.network.ChannelMatrix;
import dev.nanoplan.network.Crosstalk;
import dev.nanoplan.network.GaussianScreen;
import dev.nanoplan.network.IsiTail;
import dev.nanoplan.network.LinkEvaluation;
import dev.nanoplan.network.LinkEvaluator;
import dev.nanoplan.network.LinkSpec;
import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.Signalling;
import dev.nanoplan.scenario.Species;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;

/**
 * Everything needed to evaluate one emitter → receiver link, and to re-evaluate it with one
 * thing changed (the what-ifs behind {@code limited_by}, the advice and the budgets).
 *
 * <p>Under a round-robin schedule ({@link SlotSchedule}) {@link #entry} and the interferers carry
 * the taps the link hears in its emitter's slots, {@link #physical} the pair's channel taps, and
 * rates are per frame of {@link #frameSlots} slots.
 */
final class LinkContext {

    final Scenario scenario;
    final Node emitter;
    final Node receiver;
    final Species species;
    final ChannelEntry entry;
    final List<Crosstalk.Interferer> interferers;
    final int exactCount;
    final boolean analytic;
    /** The slot schedule; {@link SlotSchedule#ALL_ACTIVE} unless built with one. */
    final SlotSchedule slots;
    /** The pair as in the channel (equal to {@link #entry} under all-active). */
    final ChannelEntry physical;
    /** Slots per frame K of the link's species (1 under all-active): one symbol per K·T. */
    final int frameSlots;

    /** Crosstalk terms of the link as laid out ({@link Crosstalk#terms(List, int)} of the interferers). */
    final List<CountTerm> terms;
    /** The receiver's shared crosstalk, or null (then built per evaluation). */
    private volatile ReceiverCrosstalk shared;
    /** {@link #whatIfBaselineBits()} once computed, else NaN. */
    private volatile double baselineBits = Double.NaN;
    /** Rank of this link's emitter among the emitters heard at the receiver ({@link Crosstalk.Prepared}). */
    private final int rank;

    private LinkContext(Builder b) {
        this.scenario = b.scenario;
        this.emitter = b.emitter;
        this.receiver = b.receiver;
        this.species = b.species;
        this.entry = b.entry;
        this.interferers = b.interferers;
        this.exactCount = b.exactCount;
        this.terms = b.terms != null ? b.terms : Crosstalk.terms(b.interferers, b.exactCount);
        this.shared = b.shared;
        this.rank = b.rank;
        this.slots = b.slots;
        this.physical = b.physical != null ? b.physical : b.entry;
        this.frameSlots = b.slots.frameSlots(b.entry.species());
        this.analytic = b.entry.source().equals(ChannelMatrix.ANALYTIC);
    }

    /**
     * A builder of the context of the link {@code entry} from {@code emitter} to {@code receiver}
     * (of {@code species}) in {@code scenario}; by default no interferers, all-active, no shared
     * receiver crosstalk.
     */
    static Builder builder(Scenario scenario, Node emitter, Node receiver, Species species, ChannelEntry entry) {
        return new Builder(scenario, emitter, receiver, species, entry);
    }

    /** Builds a {@link LinkContext}; the setters return this builder. */
    static final class Builder {
        private final Scenario scenario;
        private final Node emitter;
        private final Node receiver;
        private final Species species;
        private final ChannelEntry entry;
        private List<Crosstalk.Interferer> interferers = List.of();
        private int exactCount;
        private List<CountTerm> terms;
        private ReceiverCrosstalk shared;
        private int rank = -1;
        private SlotSchedule slots = SlotSchedule.ALL_ACTIVE;
        private ChannelEntry physical;

        private Builder(Scenario scenario, Node emitter, Node receiver, Species species, ChannelEntry entry) {
            this.scenario = scenario;
            this.emitter = emitter;
            this.receiver = receiver;
            this.species = species;
            this.entry = entry;
        }

        /** Every other emitter heard, the strongest {@code exactCount} of them treated exactly ({@link Crosstalk}). */
        Builder interferers(List<Crosstalk.Interferer> others, int exactCount) {
            this.interferers = others;
            this.exactCount = exactCount;
            return this;
        }

        /** The crosstalk terms when already known; must equal {@code Crosstalk.terms(interferers, exactCount)}. */
        Builder terms(List<CountTerm> known) {
            this.terms = known;
            return this;
        }

        /**
         * The receiver's shared crosstalk, whose emitters are the interferers plus this link's emitter
         * of rank {@code emitterRank} ({@link Crosstalk.Prepared#rankOf}).
         */
        Builder shared(ReceiverCrosstalk receiverCrosstalk, int emitterRank) {
            this.shared = receiverCrosstalk;
            this.rank = emitterRank;
            return this;
        }

        /**
         * A slot schedule other than all-active: the entry and the interferers then hold the taps heard in
         * the emitter's slots ({@link SlotSchedule#own}, {@link SlotSchedule#interferer}), {@code channelEntry}
         * the pair's channel taps.
         */
        Builder schedule(SlotSchedule schedule, ChannelEntry channelEntry) {
            this.slots = schedule;
            this.physical = channelEntry;
            return this;
        }

        LinkContext build() {
            return new LinkContext(this);
        }
    }

    Signalling signalling() {
        return scenario.signalling();
    }

    double symbolTimeS() {
        return scenario.signalling().symbolTimeS();
    }

    /** Prior weights of the levels: binary prior, uniform for more levels. */
    static double[] weights(Signalling s) {
        return LinkSpec.symbolWeights(s.levels(), s.priorOne());
    }

    /** Levels of a node sending {@code top} molecules for its highest level. */
    long[] levels(long top) {
        return levelsOf(signalling(), top);
    }

    /**
     * Molecules of each level of a node sending {@code top} for its highest level: evenly spaced from 0
     * ({@link LinkSpec#evenLevels}), with at least one molecule between levels.
     */
    static long[] levelsOf(Signalling s, long top) {
        return LinkSpec.evenLevels(s.levels(), Math.max(top, s.levels() - 1));
    }

    LinkSpec spec(double[] taps, long top, double symbolTimeS, double backgroundPerS) {
        return spec(taps, top, symbolTimeS, backgroundPerS, signalling().countModel());
    }

    LinkSpec spec(double[] taps, long top, double symbolTimeS, double backgroundPerS, CountModelKind model) {
        Signalling s = signalling();
        // background is counted over one slot; a symbol (and so the rate) takes a frame of K slots
        return new LinkSpec(taps, levels(top), s.priorOne(), backgroundPerS * symbolTimeS, model,
                symbolTimeS * frameSlots);
    }

    /**
     * The count model of the what-if searches (limited_by, advice, budget search): the moment-matched
     * Gaussian when the scenario asks for the exact model, because a search evaluates a link dozens of
     * times and exact convolution of dense crosstalk costs up to a second each. Reported links are
     * always evaluated with the scenario's model, and a budget found this way is confirmed with it
     * ({@link MoleculeBudgets}).
     */
    CountModelKind whatIfModel() {
        CountModelKind k = signalling().countModel();
        return k == CountModelKind.EXACT ? CountModelKind.GAUSSIAN : k;
    }

    /** Evaluation with the what-if model. */
    LinkEvaluation whatIf(double[] taps, long top, double symbolTimeS, double backgroundPerS,
            List<Crosstalk.Interferer> others) {
        List<CountTerm> t = others == interferers ? terms : Crosstalk.terms(others, exactCount);
        LinkSpec spec = spec(taps, top, symbolTimeS, backgroundPerS, whatIfModel());
        return others == interferers ? evaluateShared(spec) : LinkEvaluator.evaluateBest(spec, t, null, t.size());
    }

    /**
     * Forgets the receiver's shared crosstalk (it holds every emitter's terms, O(m·L) objects per
     * receiver); later exact evaluations convolve this link's own {@link #terms} instead. Called once
     * the receiver's links are evaluated, so that a large plan keeps O(K·L) terms per kept link.
     */
    void detachShared() {
        shared = null;
    }

    /** With the exact model, the receiver's shared crosstalk pmf for this link ({@link ReceiverCrosstalk}). */
    private LinkEvaluation evaluateShared(LinkSpec spec) {
        ReceiverCrosstalk rc = shared;
        if (rc == null || spec.countModel() != CountModelKind.EXACT) {
            return LinkEvaluator.evaluateBest(spec, terms, null, terms.size());
        }
        int covered = terms.size() - (rc.hasRemainder(rank) ? 1 : 0);
        CountPmf[] parts = rc.partsWithout(rank);
        return parts.length == 2 ? LinkEvaluator.evaluateBest(spec, terms, parts[0], parts[1], covered)
                : LinkEvaluator.evaluateBest(spec, terms, parts[0], covered);
    }

    /** The link as laid out. */
    LinkEvaluation evaluate() {
        return evaluate(entry.taps(), emitter.moleculesPerSymbol(), symbolTimeS(),
                scenario.medium().backgroundMoleculesPerS(), interferers);
    }

    LinkEvaluation evaluate(double[] taps, long top, double symbolTimeS, double backgroundPerS,
            List<Crosstalk.Interferer> others) {
        List<CountTerm> t = others == interferers ? terms : Crosstalk.terms(others, exactCount);
        LinkSpec spec = spec(taps, top, symbolTimeS, backgroundPerS);
        return others == interferers ? evaluateShared(spec) : LinkEvaluator.evaluateBest(spec, t, null, t.size());
    }

    /** Whether the Gaussian screen lets the link as laid out through to exact evaluation. */
    boolean passesScreen(double floorBits) {
        return GaussianScreen.passes(spec(entry.taps(), emitter.moleculesPerSymbol(),
                symbolTimeS(), scenario.medium().backgroundMoleculesPerS()), terms, floorBits);
    }

    /**
     * Operating mutual information of the link as laid out, with the what-if model; computed once (the limited_by
     * what-ifs and the molecule advice both start from it; the evaluation is deterministic, so the
     * cached value is the one a new evaluation would give).
     */
    double whatIfBaselineBits() {
        double c = baselineBits;
        if (Double.isNaN(c)) {
            c = whatIf(entry.taps(), emitter.moleculesPerSymbol(), symbolTimeS(),
                    scenario.medium().backgroundMoleculesPerS(), interferers).mutualInformationBits();
            baselineBits = c;
        }
        return c;
    }

    /** {@code withMolecules(top).mutualInformationBits()}, from {@link #whatIfBaselineBits()} when {@code top} is as laid out. */
    double withMoleculesBits(long top) {
        return top == emitter.moleculesPerSymbol() ? whatIfBaselineBits() : withMolecules(top).mutualInformationBits();
    }

    /** Operating mutual information without ISI (earlier symbols leave nothing). */
    double capacityWithoutIsi() {
        return whatIf(new double[] {entry.tap(0)}, emitter.moleculesPerSymbol(), symbolTimeS(),
                scenario.medium().backgroundMoleculesPerS(), interferers).mutualInformationBits();
    }

    /** Operating mutual information without crosstalk. */
    double capacityWithoutCrosstalk() {
        return whatIf(entry.taps(), emitter.moleculesPerSymbol(), symbolTimeS(),
                scenario.medium().backgroundMoleculesPerS(), List.of()).mutualInformationBits();
    }

    /** Operating mutual information without background. */
    double capacityWithoutNoise() {
        return whatIf(entry.taps(), emitter.moleculesPerSymbol(), symbolTimeS(), 0, interferers).mutualInformationBits();
    }

    /** The link as laid out but with {@code top} molecules, evaluated with the scenario's model. */
    LinkEvaluation withMoleculesExact(long top) {
        return evaluate(entry.taps(), top, symbolTimeS(), scenario.medium().backgroundMoleculesPerS(), interferers);
    }

    /** Capacity with the emitter sending {@code top} molecules, the rest unchanged (what-if model). */
    LinkEvaluation withMolecules(long top) {
        return whatIf(entry.taps(), top, symbolTimeS(), scenario.medium().backgroundMoleculesPerS(), interferers);
    }

    /** Analytic only: the link with the emitter moved to centre distance {@code distanceUm}. */
    LinkEvaluation atDistance(double distanceUm) {
        double[] taps = slots.own(entry.species(), IsiTail.truncate(AnalyticChannel.tapModel(distanceUm, receiver,
                species).taps(symbolTimeS(), signalling().isiMemorySymbols()), emitter.moleculesPerSymbol()));
        return whatIf(taps, emitter.moleculesPerSymbol(), symbolTimeS(), scenario.medium().backgroundMoleculesPerS(),
                interferers);
    }

    /** Analytic only: the link and its interferers with symbol time {@code t} (same memory L). */
    LinkEvaluation withSymbolTime(double t, Map<String, Node> nodes) {
        int memory = signalling().isiMemorySymbols();
        double[] taps = slots.own(entry.species(),
                IsiTail.truncate(AnalyticChannel.tapModel(distance(), receiver, species).taps(t, memory),
                        emitter.moleculesPerSymbol()));
        List<Crosstalk.Interferer> others = new ArrayList<>(interferers.size());
        for (Crosstalk.Interferer i : interferers) {
            Node n = nodes.get(i.id());
            double d = n.positionUm().distance(receiver.positionUm());
            double[] it = slots.interferer(entry.species(), emitter.id(), i.id(),
                    IsiTail.truncate(AnalyticChannel.tapModel(d, receiver, species).taps(t, memory),
                            n.moleculesPerSymbol()));
            others.add(new Crosstalk.Interferer(i.id(), it, i.levelMolecules(), i.weights()));
        }
        return whatIf(taps, emitter.moleculesPerSymbol(), t, scenario.medium().backgroundMoleculesPerS(), others);
    }

    double distance() {
        return emitter.positionUm().distance(receiver.positionUm());
    }
}
