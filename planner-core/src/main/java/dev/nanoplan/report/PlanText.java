package dev.nanoplan.report;

import dev.nanoplan.network.AnalyticChannel;
import dev.nanoplan.network.ChannelApplicability;
import dev.nanoplan.network.ChannelMatrix;
import dev.nanoplan.plan.BudgetReport;
import dev.nanoplan.plan.LinkReport;
import dev.nanoplan.plan.Plan;
import dev.nanoplan.plan.RouteReport;
import dev.nanoplan.plan.SharedRates;
import dev.nanoplan.plan.SlotSchedule;
import dev.nanoplan.scenario.Schedule;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Locale;

/** Plain-text summary of a {@link Plan}: links, routes with bottleneck and advice, budgets, warnings. */
public final class PlanText {

    /** Links listed at the top (strongest) and bottom (weakest) of the table. */
    public static final int TOP_LINKS = 10;

    private PlanText() {
    }

    /** Renders the plan; ends with the caution line {@link Cautions#SHORT}. */
    public static String render(Plan plan) {
        StringBuilder sb = new StringBuilder();
        sb.append("Plan: ").append(plan.scenario().name()).append(" (channel ").append(plan.channel()).append(")\n");
        SlotSchedule slots = SlotSchedule.of(plan.scenario());
        if (!slots.allActive()) {
            sb.append("Schedule: ").append(slots.schedule().id()).append(slots.schedule() == Schedule.SLOTS
                    ? " (emitters of a species send in their slots, those sharing a slot together;"
                    : " (emitters of a species take turns;");
            plan.scenario().species().forEach(sp -> sb.append(' ').append(sp.name()).append(": frame of ")
                    .append(slots.frameSlots(sp.name())).append(slots.frameSlots(sp.name()) == 1 ? " slot," : " slots,"));
            sb.setLength(sb.length() - 1);
            sb.append(" — rates per frame, latencies one frame per hop)\n");
        }
        sb.append(plural(plan.links().size(), "link")).append(" above the floor, ")
                .append(plural(plan.routes().size(), "demand")).append("\n\n");
        List<LinkReport> sorted = new ArrayList<>(plan.links());
        sorted.sort(Comparator.comparingDouble(LinkReport::mutualInformationBits).reversed());
        int top = Math.min(TOP_LINKS, sorted.size());
        int bottomFrom = Math.max(top, sorted.size() - TOP_LINKS);
        int hidden = bottomFrom - top;
        if (sorted.size() <= top) {
            sb.append("Links (all ").append(sorted.size()).append(", strongest first)\n");
        } else {
            sb.append("Links (strongest ").append(top).append(", then weakest ").append(sorted.size() - bottomFrom)
                    .append(" of ").append(sorted.size()).append(hidden > 0 ? "; " + hidden + " in between not shown)"
                            : ")").append('\n');
        }
        sb.append("(tau, Pe and bit/sym at the operating point: the file's prior, the information-maximising "
                + "threshold; cap = consistent capacity at its best prior, route hops only)\n");
        sb.append(String.format(Locale.ROOT, "%-12s %-12s %-4s %10s %10s %10s %6s %10s %9s %7s %-9s %s%n", "from",
                "to", "sp", "signal", "interf.", "isi", "tau", "Pe", "bit/sym", "cap", "limit", "top interferer"));
        for (int i = 0; i < sorted.size(); i++) {
            if (i == top && hidden > 0) {
                sb.append(String.format(Locale.ROOT, "  ... %s not shown (all are in plan --json and links.csv of "
                        + "--out) ...%n", plural(hidden, "link")));
                i = bottomFrom;
            }
            LinkReport l = sorted.get(i);
            sb.append(String.format(Locale.ROOT, "%-12s %-12s %-4s %10s %10s %10s %6s %10s %9s %7s %-9s %s%s%n",
                    l.from(), l.to(), l.species(), Numbers.quantity(l.signalMean()),
                    Numbers.quantity(l.interferenceMean()), Numbers.quantity(l.isiMean()),
                    Numbers.threshold(l.threshold()), Numbers.errorProbability(l.errorProbability(),
                            l.log10ErrorProbability()), Numbers.bits(l.mutualInformationBits()),
                    l.capacityBits() == null ? "-" : String.format(Locale.ROOT, "%.3f", l.capacityBits()),
                    l.limitedBy().id(),
                    l.topInterferer() == null ? "-" : String.format(Locale.ROOT, "%s (%.0f%%)", l.topInterferer(),
                            100 * l.topInterfererShare()),
                    l.modelCaveat() == null ? "" : "  [" + l.modelCaveat() + "]"));
        }
        channels(plan, sb);
        sb.append("\nRoutes\n");
        List<SharedRates.Share> shares = SharedRates.of(plan);
        for (int i = 0; i < plan.routes().size(); i++) {
            RouteReport r = plan.routes().get(i);
            SharedRates.Share sh = shares.get(i);
            if (!r.reachable()) {
                sb.append(String.format(Locale.ROOT, "  %s -> %s: unreachable. %s%n", r.from(), r.to(), r.advice()));
                continue;
            }
            sb.append(String.format(Locale.ROOT,
                    "  %s -> %s via %s: %s bit/symbol end to end (%s bit/s), latency %s s, bottleneck %s -> %s"
                            + " %s bit (%s)%s%n      advice: %s%n",
                    r.from(), r.to(), String.join(" > ", r.hops()), Numbers.bits(r.endToEndCapacityBits()),
                    Numbers.quantity(r.rateBitsPerS()), Numbers.quantity(r.latencyS()), r.bottleneckFrom(),
                    r.bottleneckTo(), Numbers.bits(r.bottleneckCapacityBits()), r.bottleneckLimitedBy().id(),
                    r.directCapacityBits() == null ? ", no direct link"
                            : ", direct " + Numbers.bits(r.directCapacityBits()) + " bit",
                    r.advice()));
            if (sh.limitedAt() != null && sh.sharedWith() > 1) {
                sb.append(String.format(Locale.ROOT, "      shared: %s bit/s (%s's slots carry %d demands)%n",
                        Numbers.quantity(sh.rateBitsPerS()), sh.limitedAt(), sh.sharedWith()));
            }
        }
        boolean joint = plan.budgets().stream().anyMatch(b -> "joint".equals(b.method()));
        sb.append(joint
                ? "\nBudgets (method joint: the route emitters sized together, power-control fixed point; "
                        + "conflicting groups named in the reason)\n"
                : "\nBudgets (method independent: each node alone, every other emitter at its file budget)\n");
        sb.append(String.format(Locale.ROOT, "%-12s %14s %14s %16s %-8s %s%n", "node", "N needed", "molecules/s",
                "per mission", "feasible", "reason"));
        for (BudgetReport b : plan.budgets()) {
            boolean known = b.moleculesPerSymbolNeeded() >= 0;
            sb.append(String.format(Locale.ROOT, "%-12s %14s %14s %16s %-8s %s%n", b.node(),
                    known ? Numbers.count(b.moleculesPerSymbolNeeded()) : Numbers.MISSING,
                    known ? Numbers.molecules(b.moleculesPerS()) : Numbers.MISSING,
                    known ? Numbers.molecules(b.moleculesPerMission()) : Numbers.MISSING,
                    b.feasible() ? "yes" : "NO", b.reason()));
        }
        if (!plan.warnings().isEmpty()) {
            sb.append("\nWarnings\n");
            plan.warnings().forEach(w -> sb.append("  - ").append(w).append('\n'));
        }
        sb.append('\n').append(Cautions.SHORT).append('\n');
        return sb.toString();
    }

    /**
     * Which channel the links rest on: one line when every link has closed-form taps that pass the
     * validity test, else one line per simulated link or closed-form link outside its validity.
     */
    private static void channels(Plan plan, StringBuilder sb) {
        List<LinkReport> special = new ArrayList<>();
        for (LinkReport l : plan.links()) {
            if (l.channel() != null && (!l.channel().equals(ChannelMatrix.ANALYTIC)
                    || (l.channelReason() != null && l.channelReason().startsWith(AnalyticChannel.NOT_COVERED)))) {
                special.add(l);
            }
        }
        if (special.isEmpty()) {
            sb.append(String.format(Locale.ROOT, "%nChannel: closed forms for all %d links (open-medium validity "
                    + "test passed: Peclet number <= %s, walls and other absorbers change each catch by <= %.0f %%)%n",
                    plan.links().size(), ChannelApplicability.MAX_PECLET,
                    100 * ChannelApplicability.MAX_RELATIVE_EFFECT));
            return;
        }
        sb.append(String.format(Locale.ROOT, "%nChannel: %d of %d links simulated or outside the closed forms' "
                + "validity%n", special.size(), plan.links().size()));
        for (LinkReport l : special) {
            sb.append(String.format(Locale.ROOT, "  %s -> %s: %s (%s)%n", l.from(), l.to(), l.channel(),
                    l.channelReason() == null ? "no reason given" : l.channelReason()));
        }
    }

    /** "1 link", "26 links". */
    static String plural(int n, String word) {
        return n + " " + word + (n == 1 ? "" : "s");
    }
}
