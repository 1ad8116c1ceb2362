package dev.nanoplan.plan;

import dev.nanoplan.network.ChannelEntry;
import dev.nanoplan.network.ChannelMatrix;
import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.Signalling;
import dev.nanoplan.scenario.Species;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Set;
import java.util.function.DoubleConsumer;

/**
 * Plans a layout, then re-plans it after edits by re-evaluating only the receivers whose links can
 * have changed. The plan after {@link #replan(Scenario)} is the plan {@link NetworkPlanner#plan} (or
 * {@link PreviewPlanner#plan}) would give for the edited scenario, byte for byte in its JSON
 * ({@code IncrementalPlannerTest}).
 *
 * <p><b>What is re-evaluated.</b> The expensive step of a plan is the per-receiver link evaluation
 * ({@link ReceiverEvaluator}); it is a deterministic function of the scenario's signalling and medium,
 * the slot schedule, the options, and per receiver: its node, its species, its channel entries (taps,
 * source and model caveat of every emitter heard) and the nodes of those emitters. A re-plan rebuilds
 * the channel of the edited scenario (analytic closed forms, a small part of the cost; or the
 * {@link PlanOptions#channel()} given, unchanged) and re-evaluates receiver r when any of these holds:
 * <ul>
 *   <li>the signalling (but for its slot plan), the medium or the volume changed (then every receiver);</li>
 *   <li>the frame of r's species changed, or an emitter heard at r changed its slot;</li>
 *   <li>r is new, or its node changed (position, radius, molecules, role, species), or its species
 *       changed (diffusion, half-life);</li>
 *   <li>the list of channel entries at r changed (an emitter entered or left r's cutoff, or its taps
 *       or caveat changed), or the node of an emitter heard at r changed (e.g. its molecules).</li>
 * </ul>
 * Every other receiver keeps its evaluated links, which are exactly what a new evaluation would give
 * (same inputs, deterministic evaluator). Since a channel entry exists only within the cutoff
 * ({@link PlanOptions#cutoffMolecules()}), an edit of one node re-evaluates the node itself and the
 * receivers within the cutoff of its old or new position; an edit of one species re-evaluates that
 * species' receivers; a change of the schedule (or symbol time, memory, prior, levels, count model)
 * all of them. The rest of the plan — link graph, routes, advice, budgets, shared rates, warnings —
 * is rebuilt from all receivers' links ({@link PlanPipeline#assemble}); for the exact plan the budgets'
 * searches are then most of a re-plan's cost.
 *
 * <p>A kept link's {@link LinkContext} still refers to the scenario it was evaluated in; it reads only
 * the signalling and the medium from it, which are equal by the rules above.
 *
 * <p>Not thread-safe: one caller re-plans at a time (each re-plan evaluates its receivers in
 * parallel as the full plan does).
 */
public final class IncrementalPlanner {

    private final PlanOptions options;
    private final ReceiverEvaluator evaluator;
    private PlanInputs inputs;
    private ChannelMatrix channel;
    private Map<String, ReceiverLinks> links;
    private Plan plan;
    private int reevaluated;

    private IncrementalPlanner(Scenario scenario, PlanOptions options, ReceiverEvaluator evaluator) {
        this(scenario, options, evaluator, true);
    }

    private IncrementalPlanner(Scenario scenario, PlanOptions options, ReceiverEvaluator evaluator, boolean full) {
        this.options = options;
        this.evaluator = evaluator;
        this.inputs = PlanInputs.of(scenario, options);
        this.channel = PlanPipeline.channel(inputs, f -> { });
        this.links = PlanPipeline.evaluate(inputs, channel, channel.receivers(), evaluator, f -> { });
        this.reevaluated = links.size();
        this.plan = full ? PlanPipeline.assemble(inputs, channel, links, evaluator)
                : PlanPipeline.whatIf(inputs, channel, links, evaluator);
    }

    /**
     * The exact planner of {@code scenario} whose first plan, like every {@link #whatIf} and
     * {@link #advance} plan, has no budgets or advice (what a layout search starts from).
     *
     * @throws IllegalArgumentException as {@link NetworkPlanner#plan}
     */
    public static IncrementalPlanner exactWithoutBudgets(Scenario scenario, PlanOptions options) {
        return new IncrementalPlanner(scenario, options, ExactReceiverEvaluator.INSTANCE, false);
    }

    /**
     * The exact planner ({@link NetworkPlanner}) of {@code scenario}, planned once.
     *
     * @throws IllegalArgumentException as {@link NetworkPlanner#plan}
     */
    public static IncrementalPlanner exact(Scenario scenario, PlanOptions options) {
        return new IncrementalPlanner(scenario, options, ExactReceiverEvaluator.INSTANCE);
    }

    /**
     * The preview planner ({@link PreviewPlanner}) of {@code scenario}, planned once.
     *
     * @throws IllegalArgumentException as {@link PreviewPlanner#plan} (e.g. a round-robin schedule)
     */
    public static IncrementalPlanner preview(Scenario scenario, PlanOptions options) {
        checkPreview(scenario);
        return new IncrementalPlanner(scenario, options, NormalReceiverEvaluator.INSTANCE);
    }

    private static void checkPreview(Scenario scenario) {
        if (!PreviewPlanner.supports(scenario)) {
            throw new IllegalArgumentException("signalling.schedule: the preview covers all-active only, got "
                    + scenario.signalling().schedule().id());
        }
    }

    /** The plan of the last scenario planned. */
    public Plan plan() {
        return plan;
    }

    /** The scenario of {@link #plan()}. */
    public Scenario scenario() {
        return inputs.scenario();
    }

    /** How many receivers the last plan or re-plan evaluated (the rest were kept). */
    public int lastReevaluatedReceivers() {
        return reevaluated;
    }

    /**
     * Plans {@code edited} (any valid scenario; cheapest when it differs from {@link #scenario()} in a
     * few nodes or one species), re-evaluating only the receivers named in the class comment, and
     * remembers it for the next re-plan.
     *
     * @throws IllegalArgumentException as the full planner (the previous plan is then kept)
     */
    public Plan replan(Scenario edited) {
        return moveTo(edited, true);
    }

    /** Re-plans {@code edited} (with budgets and advice when {@code full}) and remembers it. */
    private Plan moveTo(Scenario edited, boolean full) {
        if (evaluator == NormalReceiverEvaluator.INSTANCE) {
            checkPreview(edited);
        }
        PlanInputs next = PlanInputs.of(edited, options);
        ChannelMatrix nextChannel = PlanPipeline.channel(next, f -> { });
        Relinked r = relink(inputs, channel, links, next, nextChannel, evaluator);
        Plan nextPlan = full ? PlanPipeline.assemble(next, nextChannel, r.links(), evaluator)
                : PlanPipeline.whatIf(next, nextChannel, r.links(), evaluator);
        inputs = next;
        channel = nextChannel;
        links = r.links();
        plan = nextPlan;
        reevaluated = r.reevaluated();
        return nextPlan;
    }

    /**
     * The plan {@code edited} would have, without budgets or advice, re-evaluating only the receivers of
     * the class comment; this planner stays at {@link #scenario()} (what the advice check re-plans each
     * proposed change with).
     *
     * @throws IllegalArgumentException as the full planner
     */
    public Plan whatIf(Scenario edited) {
        if (evaluator == NormalReceiverEvaluator.INSTANCE) {
            checkPreview(edited);
        }
        return whatIf(inputs, channel, links, evaluator, edited);
    }

    /**
     * Moves this planner to {@code edited} like {@link #replan} but plans it as {@link #whatIf} does
     * (without budgets or advice): what a search that accepts a move calls, so that the next what-if
     * re-plans start from the accepted layout.
     *
     * @throws IllegalArgumentException as the full planner (the previous state is then kept)
     */
    public Plan advance(Scenario edited) {
        return moveTo(edited, false);
    }

    /**
     * The plan of {@link #scenario()} with its molecule budgets (joint or independent) but without the advice,
     * from the links already evaluated: what a layout search sizes budgets with. {@code progress} is told the
     * budgets' progress (and may throw to end the work early).
     */
    public Plan withBudgets(boolean joint, DoubleConsumer progress) {
        PlanInputs in = PlanInputs.of(inputs.scenario(), options.withJointBudgets(joint).withProgress(progress));
        return PlanPipeline.budgeted(in, channel, links, evaluator);
    }

    /**
     * The plan of {@code edited} without budgets or advice ({@link PlanPipeline#whatIf}), re-evaluating
     * only the receivers of the class comment against the plan state ({@code before}, {@code channel},
     * {@code links}), which is left as it was: what the advice check re-plans each proposed change with.
     *
     * @param links the evaluated links of every receiver of {@code channel}
     */
    static Plan whatIf(PlanInputs before, ChannelMatrix channel, Map<String, ReceiverLinks> links,
            ReceiverEvaluator evaluator, Scenario edited) {
        PlanInputs next = PlanInputs.of(edited, before.options());
        ChannelMatrix nextChannel = PlanPipeline.editedChannel(next, channel);
        return PlanPipeline.whatIf(next, nextChannel,
                relink(before, channel, links, next, nextChannel, evaluator).links(), evaluator);
    }

    /** The links of every receiver of a re-plan, and how many receivers were re-evaluated. */
    private record Relinked(Map<String, ReceiverLinks> links, int reevaluated) {
    }

    /** Keeps each receiver's links unless one of the rules of the class comment re-evaluates it. */
    private static Relinked relink(PlanInputs inputs, ChannelMatrix channel, Map<String, ReceiverLinks> links,
            PlanInputs next, ChannelMatrix nextChannel, ReceiverEvaluator evaluator) {
        Scenario before = inputs.scenario();
        Scenario edited = next.scenario();
        boolean all = !withoutSlots(before.signalling()).equals(withoutSlots(edited.signalling()))
                || !before.medium().equals(edited.medium()) || !before.volume().equals(edited.volume());
        Set<String> changedNodes = changedNodes(inputs.nodes(), next.nodes());
        Set<String> reframed = new HashSet<>();
        if (!all && !inputs.slots().equals(next.slots())) {
            // a new slot moves the emitter against every emitter heard with it: redo the receivers hearing it,
            // and every receiver of a species whose frame changed
            for (Node n : next.nodes().values()) {
                if (n.role().emits() && inputs.nodes().containsKey(n.id()) && inputs.nodes().get(n.id()).role().emits()
                        && inputs.slots().slotOf(n.id()) != next.slots().slotOf(n.id())) {
                    changedNodes.add(n.id());
                }
            }
            for (Species sp : edited.species()) {
                if (inputs.slots().frameSlots(sp.name()) != next.slots().frameSlots(sp.name())) {
                    reframed.add(sp.name());
                }
            }
        }
        Map<String, ReceiverLinks> kept = new HashMap<>();
        List<String> redo = new ArrayList<>();
        for (String r : nextChannel.receivers()) {
            ReceiverLinks old = links.get(r);
            if (!all && old != null && !changedNodes.contains(r) && !reframed.contains(next.nodes().get(r).species())
                    && Objects.equals(inputs.species().get(next.nodes().get(r).species()),
                            next.species().get(next.nodes().get(r).species()))
                    && sameEntries(channel.atReceiver(r), nextChannel.atReceiver(r), changedNodes)) {
                kept.put(r, old);
            } else {
                redo.add(r);
            }
        }
        kept.putAll(PlanPipeline.evaluate(next, nextChannel, redo, evaluator, f -> { }));
        return new Relinked(kept, redo.size());
    }

    /** The signalling without its slot plan (a slot change re-evaluates only the receivers it touches). */
    private static Signalling withoutSlots(Signalling s) {
        return new Signalling(s.symbolTimeS(), s.isiMemorySymbols(), s.levels(), s.priorOne(), s.countModel(),
                s.schedule());
    }

    /** Ids of nodes added, removed or changed in any field. */
    private static Set<String> changedNodes(Map<String, Node> before, Map<String, Node> after) {
        Set<String> out = new HashSet<>();
        for (Map.Entry<String, Node> e : after.entrySet()) {
            if (!e.getValue().equals(before.get(e.getKey()))) {
                out.add(e.getKey());
            }
        }
        for (String id : before.keySet()) {
            if (!after.containsKey(id)) {
                out.add(id);
            }
        }
        return out;
    }

    /**
     * Whether a receiver hears the same entries in the same order (emitter, species, taps, source and
     * model caveat; {@link ChannelEntry#equals} leaves out the caveat) from unchanged emitters.
     */
    private static boolean sameEntries(List<ChannelEntry> before, List<ChannelEntry> after, Set<String> changed) {
        if (before.size() != after.size()) {
            return false;
        }
        for (int i = 0; i < after.size(); i++) {
            ChannelEntry a = before.get(i);
            ChannelEntry b = after.get(i);
            // the reason is left out: the plan stamps it on the links, the evaluation does not read it
            if (changed.contains(b.emitter()) || !a.withReason(a.source(), null).equals(b.withReason(b.source(), null))
                    || !Objects.equals(a.modelCaveat(), b.modelCaveat())) {
                return false;
            }
        }
        return true;
    }
}
