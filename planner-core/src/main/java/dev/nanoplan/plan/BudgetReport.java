package dev.nanoplan.plan;

/**
 * Molecule budget of one emitting node (the {@code budgets} entries of the plan; see
 * {@link MoleculeBudgets} for how it is found).
 *
 * @param node                     node id
 * @param moleculesPerSymbolNeeded smallest molecules per top level meeting the target on every
 *                                 route hop this node sends on, or −1 when there is none (out of
 *                                 reach) or when the budget cannot be sized
 * @param moleculesPerS            release rate at the needed budget and the traffic it sends and
 *                                 forwards (−1 when there is no budget)
 * @param moleculesPerMission      moleculesPerS × mission duration (−1 when there is no budget)
 * @param feasible                 whether the target can be met
 * @param reason                   short words: why infeasible, or what sets the budget
 * @param method                   the reading of the budget: {@value MoleculeBudgets#INDEPENDENT}
 *                                 = this node alone changes its budget, every other emitter stays at
 *                                 its file budget
 * @param countBlindTarget         true when {@code targets.max_error_probability} is met by a detector
 *                                 that ignores the count (target ≥ 1 − the largest level prior), so the
 *                                 budget is sized for {@code targets.min_rate_bits_per_s} instead, or
 *                                 not at all
 */
public record BudgetReport(String node, long moleculesPerSymbolNeeded, double moleculesPerS,
        double moleculesPerMission, boolean feasible, String reason, String method, boolean countBlindTarget) {
}
