package dev.nanoplan.plan;

import dev.nanoplan.network.ChannelEntry;
import java.util.List;
import java.util.function.DoubleConsumer;
import java.util.function.Function;

/**
 * The one step in which plans differ: how the links heard at one receiver are evaluated, and what
 * follows from those evaluations (advice, budgets). The rest of a plan — channel, link graph, routes,
 * shared rates, warnings — is {@link PlanPipeline}, the same for every evaluator.
 *
 * <p>{@link ExactReceiverEvaluator}: the scenario's count model, crosstalk by convolution, budgets by
 * re-evaluation, advice proposed by re-evaluating the weakest hop and checked by re-planning
 * ({@link NetworkPlanner}). {@link NormalReceiverEvaluator}: the normal
 * approximation of the counts, no advice or budgets ({@link PreviewPlanner}).
 *
 * <p>Contract: {@link #evaluate} is a deterministic function of the inputs it reads — the scenario's
 * signalling and background, the slot schedule, the receiver's node and species, its channel entries
 * and the nodes of the emitters in them, and the options — so that {@link IncrementalPlanner} may keep
 * a receiver's result while none of those changed. It may be called from several threads at once.
 */
interface ReceiverEvaluator {

    /**
     * The links heard at one receiver.
     *
     * @param entries the channel entries at the receiver ({@code channel.atReceiver}), non-empty, in
     *                channel order
     */
    ReceiverLinks evaluate(PlanInputs in, List<ChannelEntry> entries);

    /**
     * Warnings a plan starts with (before the channel's notes).
     *
     * @param largestDeviationBits the largest {@link ReceiverLinks#deviationBits()} of the plan's receivers
     */
    List<String> leadingWarnings(double largestDeviationBits);

    /**
     * The advice of a reachable route whose weakest hop is {@code weakest}, as the route is assembled;
     * null when the evaluator proposes changes instead ({@link #propose}), whose checked line replaces it.
     */
    String advice(PlanInputs in, EvaluatedLink weakest);

    /**
     * The changes proposed for a reachable route's weakest hop, to be checked by re-planning the layout
     * with each ({@link AdviceChecker}); null when the evaluator proposes none (its {@link #advice} stands).
     *
     * @param followers the ids of the nodes that decode a given emitter on the plan's routes
     */
    BottleneckAdvisor.Proposal propose(PlanInputs in, EvaluatedLink weakest, Function<String, List<String>> followers);

    /** The molecule budgets, given the hops of every demand's route (empty for an unreachable demand). */
    List<BudgetReport> budgets(PlanInputs in, List<List<EvaluatedLink>> routeHops, DoubleConsumer progress);

    /** Whether to evaluate this many receivers in parallel. */
    boolean parallel(int receivers);
}
