package dev.nanoplan.plan;

/**
 * Molecule budget of one emitting node (the {@code budgets} entries of docs/architecture.md §4.3).
 *
 * @param node                     node id
 * @param moleculesPerSymbolNeeded smallest molecules per "1" meeting the error target on every
 *                                 route hop this node sends on, or −1 when unreachable
 * @param moleculesPerS            release rate at the needed budget and the traffic it sends and
 *                                 forwards
 * @param moleculesPerMission      moleculesPerS × mission duration
 * @param feasible                 whether the target can be met
 * @param reason                   short words: why infeasible, or what sets the budget
 */
public record BudgetReport(String node, long moleculesPerSymbolNeeded, double moleculesPerS,
        double moleculesPerMission, boolean feasible, String reason) {
}
