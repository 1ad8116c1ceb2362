package dev.nanoplan.report;

import dev.nanoplan.geometry.Vec3;
import dev.nanoplan.geometry.Volume;
import dev.nanoplan.plan.BudgetReport;
import dev.nanoplan.plan.LinkReport;
import dev.nanoplan.plan.Plan;
import dev.nanoplan.plan.RouteReport;
import dev.nanoplan.plan.SharedRates;
import dev.nanoplan.scenario.Flow;
import dev.nanoplan.scenario.Medium;
import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.Role;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.Signalling;
import dev.nanoplan.scenario.Species;
import dev.nanoplan.scenario.Targets;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.EnumMap;
import java.util.List;
import java.util.Map;

/**
 * A plan as one self-contained HTML page: inline CSS and SVG, no scripts, no external resources,
 * so it can be mailed or archived as a single file.
 *
 * <p>Content, top to bottom: title, the cautions of docs/architecture.md §6 ({@link Cautions#FULL}) in a
 * highlighted box, the scenario summary (volume, medium, species, signalling, nodes, targets),
 * the top and side views ({@link LayoutSvg}), the routes table, the molecule budgets, the link
 * table (the {@value #MAX_LINK_ROWS} highest-capacity links, with a note when there are more),
 * warnings, and the model assumptions ({@link Cautions#ASSUMPTIONS}). Every user-provided string
 * (names, ids, warnings, advice) is HTML-escaped. Cost O(n + m log m) for n nodes, m links.
 */
public final class PlanHtml {

    /** Most rows of the link table. */
    public static final int MAX_LINK_ROWS = 200;

    private PlanHtml() {
    }

    /** The page. */
    public static String render(Plan plan) {
        return render(plan, Map.of());
    }

    /**
     * The page with ghosts in the layout views: each node id of {@code ghostsUm} also drawn at its
     * earlier centre (µm) with an arrow to where it is now ({@link LayoutSvg#render(Plan, LayoutSvg.View, Map)}).
     */
    public static String render(Plan plan, Map<String, Vec3> ghostsUm) {
        Scenario s = plan.scenario();
        StringBuilder h = new StringBuilder(64 * 1024);
        String title = "nanoplan — " + (s.name().isBlank() ? "unnamed scenario" : s.name());
        h.append("<!DOCTYPE html>\n<html lang=\"en\">\n<head>\n<meta charset=\"utf-8\">\n")
                .append("<meta name=\"viewport\" content=\"width=device-width, initial-scale=1\">\n")
                .append("<title>").append(esc(title)).append("</title>\n<style>\n").append(CSS).append("</style>\n")
                .append("</head>\n<body>\n<main>\n");
        h.append("<h1>").append(esc(title)).append("</h1>\n");
        h.append("<p class=\"sub\">Network plan · channel: ").append(esc(plan.channel())).append(" · ")
                .append(s.nodes().size()).append(" nodes · ").append(plan.links().size()).append(" links · ")
                .append(plan.routes().size()).append(" routes</p>\n");
        cautions(h);
        summary(h, s, plan);
        views(h, plan, ghostsUm);
        routes(h, plan);
        budgets(h, plan);
        links(h, plan);
        warnings(h, plan);
        h.append("<section><h2>Model assumptions</h2>\n<p>Every number above rests on these:</p>\n<ul>\n");
        for (String a : Cautions.ASSUMPTIONS) {
            h.append("<li>").append(esc(a)).append("</li>\n");
        }
        h.append("</ul>\n</section>\n");
        h.append("<footer>").append(esc(Cautions.SHORT)).append("</footer>\n");
        h.append("</main>\n</body>\n</html>\n");
        return h.toString();
    }

    static final String CSS = """
            :root { --ink:#1f2328; --muted:#5b6470; --rule:#d8dde3; --band:#f5f7f9; --warn:#fff4d6;
                    --warn-edge:#d39e00; --bad:#b3261e; --good:#1e6b3a; }
            * { box-sizing: border-box; }
            body { margin:0; font-family: system-ui, -apple-system, "Segoe UI", Roboto, sans-serif;
                   color:var(--ink); background:#fff; line-height:1.4; }
            main { max-width: 1380px; margin: 0 auto; padding: 20px 24px 40px; }
            h1 { font-size: 1.6rem; margin: 0 0 4px; }
            h2 { font-size: 1.2rem; margin: 28px 0 8px; border-bottom: 2px solid var(--rule); padding-bottom: 4px; }
            .sub { color: var(--muted); margin: 0 0 14px; }
            .caution { background: var(--warn); border: 1px solid var(--warn-edge); border-left: 6px solid var(--warn-edge);
                       padding: 10px 16px; border-radius: 4px; }
            .caution strong { display:block; margin-bottom: 4px; }
            .caution p { margin: 2px 0; }
            .grid { display: grid; grid-template-columns: repeat(auto-fit, minmax(300px, 1fr)); gap: 10px 24px; align-items: start; }
            .grid table { width: 100%; }
            table { border-collapse: collapse; font-size: 0.88rem; }
            th, td { padding: 4px 8px; border-bottom: 1px solid var(--rule); text-align: left; vertical-align: top; }
            th { background: var(--band); font-weight: 600; white-space: nowrap; }
            td.n { text-align: right; font-variant-numeric: tabular-nums; white-space: nowrap; }
            th.n { text-align: right; }
            tr:nth-child(even) td { background: #fbfcfd; }
            .kv th { width: 38%; background: none; font-weight: 600; color: var(--muted); }
            .views { display: flex; flex-wrap: wrap; gap: 16px; align-items: flex-start; }
            .views svg { border: 1px solid var(--rule); border-radius: 4px; max-width: 100%; height: auto; }
            .bad { color: var(--bad); font-weight: 600; }
            .ok { color: var(--good); }
            .note { color: var(--muted); font-size: 0.85rem; }
            tr.advice td { border-top: none; color: var(--muted); padding-bottom: 10px; }
            tr.route td { border-bottom: none; }
            table.routes th, table.routes td { min-width: 150px; }
            table.budgets th, table.budgets td { min-width: 150px; }
            table.budgets td:first-child { white-space: nowrap; }
            table.budgets th { white-space: normal; }
            table.budgets td:last-child { min-width: 360px; }
            table.links th { white-space: normal; min-width: 90px; }
            table.links td:nth-child(-n+3) { white-space: nowrap; }
            table.links td:nth-child(n+13) { min-width: 160px; }
            table.links td:last-child { min-width: 320px; }
            td .sub { color: var(--muted); font-size: 0.9em; }
            td.hops { white-space: nowrap; }
            .tablewrap { overflow-x: auto; }
            ul.warnings li { margin: 2px 0; }
            footer { margin-top: 32px; padding-top: 8px; border-top: 1px solid var(--rule); color: var(--muted);
                     font-size: 0.85rem; }
            """;

    private static void cautions(StringBuilder h) {
        h.append("<section class=\"caution\" role=\"note\" id=\"cautions\">\n<strong>Caution</strong>\n");
        for (String c : Cautions.FULL) {
            h.append("<p>").append(esc(c)).append("</p>\n");
        }
        h.append("</section>\n");
    }

    private static void summary(StringBuilder h, Scenario s, Plan plan) {
        h.append("<section><h2>Scenario</h2>\n<div class=\"grid\">\n");
        // volume and medium
        h.append("<table class=\"kv\">\n");
        kv(h, "Volume", volume(s.volume()));
        Medium m = s.medium();
        kv(h, "Temperature", Numbers.quantity(m.temperatureK()) + " K");
        kv(h, "Viscosity", Numbers.quantity(m.viscosityMPaS()) + " mPa·s");
        kv(h, "Flow", flow(m.flow()));
        kv(h, "Background", Numbers.quantity(m.backgroundMoleculesPerS()) + " molecules/s per receiver");
        kv(h, "Channel", plan.channel());
        h.append("</table>\n");
        // signalling and targets
        Signalling g = s.signalling();
        Targets t = s.targets();
        h.append("<table class=\"kv\">\n");
        kv(h, "Symbol time", Numbers.quantity(g.symbolTimeS()) + " s");
        kv(h, "ISI memory", g.isiMemorySymbols() + " symbols");
        kv(h, "Levels", g.levels() + (g.levels() == 2 ? " (on–off keying)" : ""));
        kv(h, "P(send 1)", Numbers.probability(g.priorOne()));
        kv(h, "Count model", g.countModel().id());
        kv(h, "Schedule", g.schedule().id());
        kv(h, "Targets", "error ≤ " + Numbers.probability(t.maxErrorProbability()) + ", rate ≥ "
                + Numbers.quantity(t.minRateBitsPerS()) + " bit/s, mission " + Numbers.quantity(t.missionDurationS())
                + " s");
        h.append("</table>\n");
        // species and nodes
        h.append("<table>\n<tr><th>Species</th><th class=\"n\">D (µm²/s)</th><th class=\"n\">half-life</th>"
                + "<th class=\"n\">nodes</th></tr>\n");
        for (Species sp : s.species()) {
            long users = s.nodes().stream()
                    .filter(n -> n.species().equals(sp.name()) || n.emitsSpecies().equals(sp.name())).count();
            h.append("<tr><td>").append(esc(sp.name())).append("</td>");
            cell(h, Numbers.quantity(sp.diffusionUm2PerS()) + (sp.hydrodynamicRadiusNm().isPresent()
                    ? " (R<sub>h</sub> " + esc(Numbers.quantity(sp.hydrodynamicRadiusNm().getAsDouble())) + " nm)" : ""), true);
            numCell(h, sp.isStable() ? "stable" : Numbers.quantity(sp.halfLifeS()) + " s");
            numCell(h, Long.toString(users));
            h.append("</tr>\n");
        }
        Map<Role, Integer> roles = new EnumMap<>(Role.class);
        for (Node n : s.nodes()) {
            roles.merge(n.role(), 1, Integer::sum);
        }
        h.append("<tr><td colspan=\"4\" class=\"note\">");
        List<String> parts = new ArrayList<>();
        for (Role r : Role.values()) {
            parts.add(roles.getOrDefault(r, 0) + " " + r.id() + (roles.getOrDefault(r, 0) == 1 ? "" : "s"));
        }
        h.append(esc(String.join(", ", parts))).append("; ").append(s.demands().size()).append(" demands</td></tr>\n");
        h.append("</table>\n</div>\n</section>\n");
    }

    private static String volume(Volume v) {
        if (v instanceof Volume.Box b) {
            Vec3 size = b.sizeUm();
            return "box " + Numbers.quantity(size.x()) + " × " + Numbers.quantity(size.y()) + " × " + Numbers.quantity(size.z()) + " µm, from "
                    + vec(b.minUm()) + " to " + vec(b.maxUm());
        }
        if (v instanceof Volume.Cylinder c) {
            return "cylinder, radius " + Numbers.quantity(c.radiusUm()) + " µm, length " + Numbers.quantity(c.lengthUm()) + " µm along x";
        }
        return "open medium (no walls)";
    }

    private static String flow(Flow f) {
        if (f instanceof Flow.Uniform u) {
            return "uniform, velocity " + vec(u.velocityUmPerS()) + " µm/s";
        }
        if (f instanceof Flow.Poiseuille p) {
            return "Poiseuille, mean speed " + Numbers.quantity(p.meanSpeedUmPerS()) + " µm/s along x";
        }
        return "none (still)";
    }

    private static String vec(Vec3 v) {
        return "(" + Numbers.quantity(v.x()) + ", " + Numbers.quantity(v.y()) + ", " + Numbers.quantity(v.z()) + ")";
    }

    private static void views(StringBuilder h, Plan plan, Map<String, Vec3> ghostsUm) {
        h.append("<section><h2>Layout</h2>\n<p class=\"note\">Drawn to scale. Lines are links, coloured by "
                + "capacity; the hops of the chosen routes are outlined in red. Node size follows the body radius "
                + "(small bodies are enlarged to stay visible).</p>\n<div class=\"views\">\n");
        if (!ghostsUm.isEmpty()) {
            h.append("<p class=\"note\">Dashed grey rings: where moved nodes were before; arrows point to where "
                    + "they are now.</p>\n");
        }
        h.append(LayoutSvg.render(plan, LayoutSvg.View.TOP, ghostsUm));
        h.append(LayoutSvg.render(plan, LayoutSvg.View.SIDE, ghostsUm));
        h.append("</div>\n</section>\n");
    }

    private static void routes(StringBuilder h, Plan plan) {
        h.append("<section><h2>Routes</h2>\n");
        if (plan.routes().isEmpty()) {
            h.append("<p class=\"note\">The scenario has no demands.</p>\n</section>\n");
            return;
        }
        double target = plan.scenario().targets().minRateBitsPerS();
        // seven columns, each at least 150 px at a 1,300 px page; the advice gets its own full-width row
        h.append("<div class=\"tablewrap\"><table class=\"routes\">\n<tr><th>Demand</th><th>Route (hops)</th>"
                + "<th>Bottleneck hop</th><th class=\"n\">End-to-end (bit/symbol)</th>"
                + "<th class=\"n\">Rate alone / shared (bit/s)</th><th class=\"n\">Latency (s)</th>"
                + "<th class=\"n\">Direct link (bit/symbol)</th></tr>\n");
        List<SharedRates.Share> shares = SharedRates.of(plan);
        for (int i = 0; i < plan.routes().size(); i++) {
            RouteReport r = plan.routes().get(i);
            SharedRates.Share sh = shares.get(i);
            h.append("<tr class=\"route\"><td class=\"hops\">").append(esc(r.from() + " → " + r.to())).append("</td>");
            if (!r.reachable()) {
                h.append("<td class=\"bad\">unreachable</td>");
                missingCell(h, "no route: see the advice below");
                missingCell(h, "no route");
                missingCell(h, "no route");
                missingCell(h, "no route");
            } else {
                h.append("<td class=\"hops\">").append(esc(String.join(" → ", r.hops()))).append("</td><td>")
                        .append(esc(r.bottleneckFrom() + " → " + r.bottleneckTo())).append("<br><span class=\"sub\">")
                        .append(esc(Numbers.bits(r.bottleneckCapacityBits()) + " bit/symbol, "
                                + r.bottleneckLimitedBy().id())).append("</span></td>");
                numCell(h, Numbers.bits(r.endToEndCapacityBits()));
                boolean slow = r.rateBitsPerS() < target;
                boolean slowShared = sh.rateBitsPerS() < target;
                h.append("<td class=\"n\"><span").append(slow ? " class=\"bad\"" : "").append(">")
                        .append(esc(Numbers.quantity(r.rateBitsPerS()))).append("</span> / <span")
                        .append(slowShared ? " class=\"bad\"" : "");
                if (sh.limitedAt() != null && sh.sharedWith() > 1) {
                    h.append(" title=\"").append(esc(sh.limitedAt() + "'s slots carry " + sh.sharedWith() + " demands"))
                            .append("\"");
                }
                h.append(">").append(esc(Numbers.quantity(sh.rateBitsPerS()))).append("</span></td>");
                numCell(h, Numbers.quantity(r.latencyS()));
            }
            if (r.directCapacityBits() == null) {
                missingCell(h, "no direct link above the capacity floor");
            } else {
                numCell(h, Numbers.bits(r.directCapacityBits()));
            }
            h.append("</tr>\n<tr class=\"advice\"><td colspan=\"7\"><strong>Advice:</strong> ")
                    .append(esc(r.advice() == null ? "none" : r.advice())).append("</td></tr>\n");
        }
        h.append("</table></div>\n");
        h.append("<p class=\"note\">Shared rate: when several demands' routes pass through one emitter, its one "
                + "symbol stream is time-shared among them (max-min fair): the rate column gives what a demand gets "
                + "alone, then its shared rate. — marks a value that does not exist (hover for why).</p>\n");
        if (target > 0) {
            h.append("<p class=\"note\">Rates below the target of ").append(esc(Numbers.quantity(target)))
                    .append(" bit/s are marked in red.</p>\n");
        }
        h.append("</section>\n");
    }

    private static void budgets(StringBuilder h, Plan plan) {
        h.append("<section><h2>Molecule budgets</h2>\n");
        if (plan.budgets().isEmpty()) {
            h.append("<p class=\"note\">No emitting node sends on a route.</p>\n</section>\n");
            return;
        }
        h.append("<div class=\"tablewrap\"><table class=\"budgets\">\n<tr><th>Node</th><th class=\"n\">Needed (molecules/symbol)</th>"
                + "<th class=\"n\">Release (molecules/s)</th><th class=\"n\">Per mission (molecules)</th>"
                + "<th>Feasible</th><th>Reason</th></tr>\n");
        for (BudgetReport b : plan.budgets()) {
            h.append("<tr><td>").append(esc(b.node())).append("</td>");
            if (b.moleculesPerSymbolNeeded() < 0) {
                String why = b.feasible() ? "not sized: see the reason" : "out of reach: see the reason";
                missingCell(h, why);
                missingCell(h, why);
                missingCell(h, why);
            } else {
                numCell(h, Numbers.count(b.moleculesPerSymbolNeeded()));
                numCell(h, Numbers.molecules(b.moleculesPerS()));
                if (Double.isFinite(b.moleculesPerMission())) {
                    numCell(h, Numbers.molecules(b.moleculesPerMission()));
                } else {
                    missingCell(h, "beyond the range of a double: the mission is too long to total");
                }
            }
            h.append(b.feasible() ? "<td class=\"ok\">yes</td>" : "<td class=\"bad\">no</td>");
            h.append("<td>").append(esc(b.reason() == null ? "" : b.reason())).append("</td></tr>\n");
        }
        h.append("</table></div>\n</section>\n");
    }

    private static void links(StringBuilder h, Plan plan) {
        h.append("<section><h2>Links</h2>\n");
        List<LinkReport> sorted = new ArrayList<>(plan.links());
        sorted.sort(Comparator.comparingDouble((LinkReport l) -> Double.isFinite(l.mutualInformationBits())
                ? l.mutualInformationBits() : -1).reversed());
        int shown = Math.min(MAX_LINK_ROWS, sorted.size());
        if (sorted.isEmpty()) {
            h.append("<p class=\"note\">No link carries information above the capacity floor.</p>\n</section>\n");
            return;
        }
        h.append("<p class=\"note\">").append(shown < sorted.size()
                ? "The " + shown + " most informative links of " + sorted.size() + " (all of them are in plan.json "
                        + "and links.csv)."
                : sorted.size() + " links, most informative first.").append(" Threshold, error, information and "
                        + "rate are at the operating point (the file's prior, the information-maximising threshold); "
                        + "capacity is the headroom at the emitter's best prior, computed for route hops.</p>\n");
        h.append("<div class=\"tablewrap\"><table class=\"links\">\n<tr><th>From</th><th>To</th><th>Species</th>"
                + "<th class=\"n\">Hit prob. p<sub>0</sub> (fraction)</th><th class=\"n\">Signal (molecules)</th>"
                + "<th class=\"n\">ISI (molecules)</th><th class=\"n\">Crosstalk (molecules)</th>"
                + "<th class=\"n\">Threshold (molecules)</th><th class=\"n\">Error prob. (per symbol)</th>"
                + "<th class=\"n\">Information (bit/symbol)</th><th class=\"n\">Rate (bit/s)</th>"
                + "<th class=\"n\">Capacity (bit/symbol)</th>"
                + "<th>Limited by</th><th>Top interferer</th><th>Caveat</th><th>Channel</th></tr>\n");
        for (LinkReport l : sorted.subList(0, shown)) {
            h.append("<tr><td>").append(esc(l.from())).append("</td><td>").append(esc(l.to())).append("</td><td>")
                    .append(esc(l.species())).append("</td>");
            numCell(h, Numbers.probability(l.hitProbability()));
            numCell(h, Numbers.quantity(l.signalMean()));
            numCell(h, Numbers.quantity(l.isiMean()));
            numCell(h, Numbers.quantity(l.interferenceMean()));
            numCell(h, Long.toString(l.threshold()));
            numCell(h, Numbers.errorProbability(l.errorProbability(), l.log10ErrorProbability()));
            numCell(h, Numbers.bits(l.mutualInformationBits()));
            numCell(h, Numbers.quantity(l.rateBitsPerS()));
            numCell(h, l.capacityBits() == null ? Numbers.MISSING : Numbers.bits(l.capacityBits()));
            h.append("<td>").append(l.limitedBy() == null ? "" : esc(l.limitedBy().id())).append("</td><td>");
            if (l.topInterferer() != null) {
                h.append(esc(l.topInterferer())).append(" (")
                        .append(Math.round(100 * l.topInterfererShare())).append(" %)");
            }
            h.append("</td><td>").append(l.modelCaveat() == null ? "" : esc(l.modelCaveat())).append("</td><td>")
                    .append(l.channel() == null ? "" : esc(l.channel()))
                    .append(l.channelReason() == null ? "" : ": " + esc(l.channelReason())).append("</td></tr>\n");
        }
        h.append("</table></div>\n</section>\n");
    }

    private static void warnings(StringBuilder h, Plan plan) {
        h.append("<section><h2>Warnings</h2>\n");
        if (plan.warnings().isEmpty()) {
            h.append("<p class=\"note\">None.</p>\n");
        } else {
            h.append("<ul class=\"warnings\">\n");
            for (String w : plan.warnings()) {
                h.append("<li>").append(esc(w)).append("</li>\n");
            }
            h.append("</ul>\n");
        }
        h.append("</section>\n");
    }

    private static void kv(StringBuilder h, String key, String value) {
        h.append("<tr><th>").append(esc(key)).append("</th><td>").append(esc(value)).append("</td></tr>\n");
    }

    private static void numCell(StringBuilder h, String escapedLater) {
        cell(h, esc(escapedLater), true);
    }

    /** A value that does not exist: a dash, with the reason as a tooltip (never a sentinel number). */
    private static void missingCell(StringBuilder h, String why) {
        h.append("<td class=\"n na\" title=\"").append(esc(why)).append("\">—</td>");
    }

    private static void cell(StringBuilder h, String html, boolean numeric) {
        h.append(numeric ? "<td class=\"n\">" : "<td>").append(html).append("</td>");
    }

    /**
     * Escapes text for HTML element content and double- or single-quoted attributes:
     * {@code & < > " '}.
     */
    public static String esc(String s) {
        if (s == null) {
            return "";
        }
        StringBuilder b = new StringBuilder(s.length() + 16);
        for (int i = 0; i < s.length(); i++) {
            char c = s.charAt(i);
            switch (c) {
                case '&' -> b.append("&amp;");
                case '<' -> b.append("&lt;");
                case '>' -> b.append("&gt;");
                case '"' -> b.append("&quot;");
                case '\'' -> b.append("&#39;");
                default -> b.append(c);
            }
        }
        return b.toString();
    }
}
