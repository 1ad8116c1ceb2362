package dev.nanoplan.desktop;

import dev.nanoplan.plan.LinkReport;
import dev.nanoplan.plan.RouteReport;
import dev.nanoplan.plan.SharedRates;
import java.util.function.BiFunction;

/**
 * The text under the routes table: for the selected route its hops with their capacities, the
 * bottleneck hop and what limits it, the planner's advice, and, when the route's emitter
 * time-shares its stream with other demands, the shared rate. Plain text from the plan's numbers;
 * numbers go through {@link Formats}.
 */
final class RouteSummary {

    /** Shown while no route is selected. */
    static final String NONE_SELECTED = "Select a route to see its per-hop information and what limits it.";

    private RouteSummary() {
    }

    /**
     * @param r     the selected route, or null
     * @param links the plan's link from → to, or null when the plan has none
     * @param share the route's shared rate ({@link SharedRates}), or null when unknown
     */
    static String of(RouteReport r, BiFunction<String, String, LinkReport> links, SharedRates.Share share) {
        if (r == null) {
            return NONE_SELECTED;
        }
        if (!r.reachable()) {
            return r.from() + " → " + r.to() + ": no route. " + (r.advice() == null ? "" : r.advice());
        }
        StringBuilder sb = new StringBuilder();
        sb.append(r.from()).append(" → ").append(r.to()).append(": ");
        for (int i = 0; i + 1 < r.hops().size(); i++) {
            LinkReport l = links.apply(r.hops().get(i), r.hops().get(i + 1));
            sb.append(i == 0 ? "" : ", ").append(r.hops().get(i)).append("→").append(r.hops().get(i + 1))
                    .append(" ").append(l == null ? "?" : Formats.sig(l.mutualInformationBits())).append(" bit");
        }
        sb.append("\nBottleneck ").append(r.bottleneckFrom()).append(" → ").append(r.bottleneckTo())
                .append(r.bottleneckLimitedBy() == null ? "" : " (limited by " + r.bottleneckLimitedBy().id() + ")")
                .append(". ").append(r.advice() == null ? "" : r.advice());
        if (share != null && share.limitedAt() != null && share.sharedWith() > 1) {
            sb.append("\nShared: ").append(Formats.sig(share.rateBitsPerS())).append(" bit/s, because ")
                    .append(share.limitedAt()).append("'s slots carry ").append(share.sharedWith())
                    .append(" demands (max-min fair time-sharing).");
        }
        return sb.toString();
    }
}
