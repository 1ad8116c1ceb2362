package dev.nanoplan.plan;

import dev.nanoplan.scenario.Scenario;

/**
 * Plans a layout end to end with the exact per-receiver evaluator ({@link ExactReceiverEvaluator}) in the
 * one plan skeleton ({@link PlanPipeline}): channel → every link under all-active crosstalk →
 * link graph → one widest route per demand with decode-and-forward cascade capacity →
 * molecule budgets → shared rates → bottleneck advice, each proposed change checked by re-planning
 * the layout with it ({@link AdviceChecker}).
 *
 * <p><b>Links.</b> Every emitter → receiver pair of the channel is a candidate. A pair is skipped
 * without evaluation when its capacity provably stays below the floor: the capacity of a binary
 * (or M-level) input channel is at most the total variation distance between the count laws of
 * the extreme levels, and that is at most P(Bin(n_max − n_min, p_0) ≠ 0) = 1 − (1 − p_0)^{n_max−n_min}
 * (the output is a degraded version of an erasure channel that reveals the input with that
 * probability; {@link TotalVariationBound}). The others are evaluated exactly ({@link dev.nanoplan.network.LinkEvaluator}) with
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
 * {@link Impairment#SIGNAL}-limited (too few molecules arrive) ({@link Impairment#limitedBy}).
 *
 * <p><b>Routes.</b> {@link RouteAssembler}: {@link WidestPathFinder} on the {@link LinkGraph}; relays decode and forward,
 * so the end-to-end figure is the mutual information, at the file's prior, of the cascade of the hops'
 * transition matrices at their operating thresholds ({@link dev.nanoplan.info.ChannelCascade}), never
 * above the weakest hop. Latency = hops × T, rate = end-to-end information / T.
 *
 * <p><b>Round-robin.</b> Under {@link dev.nanoplan.scenario.Schedule#ROUND_ROBIN} each link hears
 * its own and its neighbours' taps decimated to its emitter's slots ({@link SlotSchedule}); the
 * crosstalk then depends on the emitter decoded, so it is built per link (no shared receiver
 * crosstalk). A link's rate is capacity / (K·T) for a frame of K slots, a route's latency Σ K_h·T
 * over its hops and its rate the end-to-end capacity over the longest frame K_max·T.
 *
 * <p>Progress: the channel is 20 % of the work, links 65 %, routes 5 %, budgets 5 %, the advice check 5 %.
 */
public final class NetworkPlanner {

    private NetworkPlanner() {
    }

    /**
     * Plans the scenario.
     *
     * @throws IllegalArgumentException if {@code options.channel()} names nodes not in the scenario
     */
    public static Plan plan(Scenario scenario, PlanOptions options) {
        return PlanPipeline.plan(scenario, options, ExactReceiverEvaluator.INSTANCE);
    }

    /**
     * The plan with the verdicts of its advice check ({@link AdviceChecker}): {@link #plan} with what
     * each proposed change did when re-planned.
     *
     * @throws IllegalArgumentException as {@link #plan}
     */
    public static AdviceChecker.Result planChecked(Scenario scenario, PlanOptions options) {
        return PlanPipeline.planChecked(scenario, options, ExactReceiverEvaluator.INSTANCE);
    }
}
