package dev.nanoplan.report;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.tolerance.GuardBand;
import dev.nanoplan.tolerance.ToleranceResult;
import dev.nanoplan.tolerance.ToleranceSummary;
import java.util.List;
import java.util.Locale;

/**
 * A tolerance study's result as JSON (the keys of issue 15), CSV (one file per link: the samples'
 * mutual information) and an HTML page in the look of the plan report (yield bars, capacity histograms
 * of the weak links, the driver chart).
 */
public final class ToleranceReport {

    private static final int HISTOGRAM_BINS = 20;

    private ToleranceReport() {
    }

    /** The JSON object. */
    public static ObjectNode json(ToleranceResult r) {
        ObjectNode o = new ObjectMapper().createObjectNode();
        o.put("samples", r.samples());
        o.put("seed", r.seed());
        o.put("sampler", r.sampler().id());
        o.put("thresholds", r.thresholds().id());
        o.put("redraws", r.redraws());
        o.put("partial", r.partial());
        o.put("layout_yield", r.layoutYield());
        interval(o.putArray("layout_yield_interval"), r.layoutInterval());
        o.put("drivers_method", r.driversMethod());
        ArrayNode links = o.putArray("links");
        for (ToleranceResult.LinkYield l : r.links()) {
            ObjectNode j = links.addObject();
            j.put("from", l.from());
            j.put("to", l.to());
            j.put("yield", l.yield());
            interval(j.putArray("yield_interval"), l.yieldInterval());
            j.put("capacity_p5_bits", l.capacityP5Bits());
            j.put("capacity_p50_bits", l.capacityP50Bits());
            j.put("capacity_p95_bits", l.capacityP95Bits());
            ArrayNode d = j.putArray("drivers");
            for (ToleranceResult.Driver dr : l.drivers()) {
                d.addObject().put("tolerance", dr.tolerance()).put("index", dr.index());
            }
            if (l.guardBandMoleculesPerSymbol() == null) {
                j.putNull("guard_band_molecules_per_symbol");
            } else {
                j.put("guard_band_molecules_per_symbol", l.guardBandMoleculesPerSymbol());
            }
        }
        ArrayNode demands = o.putArray("demands");
        for (ToleranceResult.DemandYield d : r.demands()) {
            ObjectNode j = demands.addObject();
            j.put("from", d.from());
            j.put("to", d.to());
            j.put("yield", d.yield());
            interval(j.putArray("yield_interval"), d.yieldInterval());
        }
        ArrayNode weak = o.putArray("weak_links");
        for (int l : r.weakLinks()) {
            weak.addObject().put("from", r.links().get(l).from()).put("to", r.links().get(l).to());
        }
        o.put("caution", Cautions.SHORT);
        return o;
    }

    private static void interval(ArrayNode a, List<Double> v) {
        a.add(v.get(0));
        a.add(v.get(1));
    }

    /** One link's samples: {@code sample,mutual_information_bits}. */
    public static String csv(ToleranceResult.LinkYield l) {
        StringBuilder b = new StringBuilder("sample,mutual_information_bits\n");
        for (int i = 0; i < l.bits().size(); i++) {
            b.append(i).append(',').append(l.bits().get(i)).append('\n');
        }
        return b.toString();
    }

    /** The HTML page. */
    public static String html(Scenario s, ToleranceResult r) {
        StringBuilder h = new StringBuilder(32 * 1024);
        String title = "nanoplan tolerances — " + (s.name().isBlank() ? "unnamed scenario" : s.name());
        h.append("<!DOCTYPE html>\n<html lang=\"en\">\n<head>\n<meta charset=\"utf-8\">\n<title>")
                .append(PlanHtml.esc(title)).append("</title>\n<style>\n").append(PlanHtml.CSS)
                .append(".bar { fill: #1e6b3a; } .barbg { fill: #f5f7f9; } .hist { fill: #5b6470; }\n")
                .append("</style>\n</head>\n<body>\n<main>\n<h1>").append(PlanHtml.esc(title)).append("</h1>\n");
        h.append(String.format(Locale.ROOT, "<p class=\"sub\">%d samples%s · sampler %s · seed %d · thresholds %s · "
                + "%d redraws · drivers by %s</p>\n", r.samples(), r.partial() ? " (partial: stopped early)" : "",
                r.sampler().id(), r.seed(), r.thresholds().id(), r.redraws(),
                r.driversMethod().equals("src") ? "standardised regression coefficients (squared)"
                        : "first-order Sobol' indices"));
        h.append("<div class=\"caution\"><strong>Model estimates</strong><p>The tolerances are the user's "
                + "assumptions and the yields are model estimates from the analytic channel.</p><p>")
                .append(PlanHtml.esc(Cautions.SHORT)).append("</p></div>\n");
        h.append(String.format(Locale.ROOT, "<h2>Layout</h2>\n<p>Layout yield (every demand meets both targets): "
                + "<strong>%s</strong> (Wilson 95 %% interval %s – %s)</p>\n", pct(r.layoutYield()),
                pct(r.layoutInterval().get(0)), pct(r.layoutInterval().get(1))));
        h.append("<h2>Demands</h2>\n");
        for (ToleranceResult.DemandYield d : r.demands()) {
            bar(h, d.from() + " → " + d.to(), d.yield(), d.yieldInterval());
        }
        h.append("<h2>Links</h2>\n");
        for (ToleranceResult.LinkYield l : r.links()) {
            bar(h, l.from() + " → " + l.to(), l.yield(), l.yieldInterval());
        }
        h.append("<h2>Weak links (yield below ").append(pct(ToleranceSummary.WEAK_YIELD))
                .append("), likeliest failure first</h2>\n<div class=\"tablewrap\"><table>\n<tr><th>link</th>"
                        + "<th class=\"n\">yield</th><th class=\"n\">P5 / P50 / P95 bit</th><th>drivers (share of the "
                        + "variance of log10 error)</th><th class=\"n\">guard band, molecules/symbol</th>"
                        + "<th>mutual information over the samples</th></tr>\n");
        for (int i : r.weakLinks()) {
            ToleranceResult.LinkYield l = r.links().get(i);
            h.append("<tr><td>").append(PlanHtml.esc(l.from() + " → " + l.to())).append("</td><td class=\"n\">")
                    .append(pct(l.yield())).append("</td><td class=\"n\">")
                    .append(String.format(Locale.ROOT, "%.3f / %.3f / %.3f", l.capacityP5Bits(), l.capacityP50Bits(),
                            l.capacityP95Bits())).append("</td><td>");
            driverChart(h, l.drivers());
            h.append("</td><td class=\"n\">").append(l.guardBandMoleculesPerSymbol() == null
                    ? "not reached by " + (int) GuardBand.MAX_FACTOR + "× nominal" : l.guardBandMoleculesPerSymbol())
                    .append("</td><td>");
            histogram(h, l.bits());
            h.append("</td></tr>\n");
        }
        h.append("</table></div>\n<footer>").append(PlanHtml.esc(Cautions.SHORT)).append("</footer>\n")
                .append("</main>\n</body>\n</html>\n");
        return h.toString();
    }

    private static String pct(double v) {
        return String.format(Locale.ROOT, "%.1f %%", 100 * v);
    }

    private static void bar(StringBuilder h, String label, double yield, List<Double> ci) {
        int w = 300;
        h.append(String.format(Locale.ROOT, "<div><svg width=\"%d\" height=\"16\" role=\"img\"><rect class=\"barbg\" "
                + "width=\"%d\" height=\"14\"/><rect class=\"bar\" width=\"%.1f\" height=\"14\"/>"
                + "<line x1=\"%.1f\" x2=\"%.1f\" y1=\"7\" y2=\"7\" stroke=\"#1f2328\"/></svg> %s: %s "
                + "<span class=\"note\">(%s – %s)</span></div>\n", w, w, w * yield, w * ci.get(0), w * ci.get(1),
                PlanHtml.esc(label), pct(yield), pct(ci.get(0)), pct(ci.get(1))));
    }

    private static void driverChart(StringBuilder h, List<ToleranceResult.Driver> drivers) {
        for (ToleranceResult.Driver d : drivers) {
            h.append(String.format(Locale.ROOT, "<div><svg width=\"120\" height=\"12\"><rect class=\"barbg\" "
                    + "width=\"120\" height=\"10\"/><rect class=\"hist\" width=\"%.1f\" height=\"10\"/></svg> %s %.2f"
                    + "</div>", 120 * Math.min(1, d.index()), PlanHtml.esc(d.tolerance()), d.index()));
        }
    }

    private static void histogram(StringBuilder h, List<Double> bits) {
        double lo = bits.stream().mapToDouble(Double::doubleValue).min().orElse(0);
        double hi = bits.stream().mapToDouble(Double::doubleValue).max().orElse(0);
        int[] count = new int[HISTOGRAM_BINS];
        for (double b : bits) {
            int k = hi > lo ? (int) Math.min(HISTOGRAM_BINS - 1, (b - lo) / (hi - lo) * HISTOGRAM_BINS) : 0;
            count[k]++;
        }
        int max = 1;
        for (int c : count) {
            max = Math.max(max, c);
        }
        h.append("<svg width=\"200\" height=\"44\" role=\"img\">");
        for (int k = 0; k < HISTOGRAM_BINS; k++) {
            double hk = 40.0 * count[k] / max;
            h.append(String.format(Locale.ROOT, "<rect class=\"hist\" x=\"%d\" y=\"%.1f\" width=\"9\" height=\"%.1f\"/>",
                    k * 10, 40 - hk, hk));
        }
        h.append(String.format(Locale.ROOT, "</svg><div class=\"note\">%.3f – %.3f bit</div>", lo, hi));
    }
}
