package dev.nanoplan.report;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.nanoplan.design.SweepPoint;
import dev.nanoplan.design.SweepResult;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Locale;
import java.util.function.ToDoubleFunction;

/**
 * A design sweep as JSON (keys of docs/architecture.md: {@code fields}, {@code points} with
 * {@code values}, {@code demands_meeting_targets}, {@code min_shared_rate_bits_per_s},
 * {@code min_end_to_end_capacity_bits}, {@code molecules_per_s}, {@code max_latency_s}, {@code pareto}),
 * CSV (one row per point) and an HTML page with inline SVG plots: each metric against each swept field
 * with the other fields at the best point, and the Pareto front.
 */
public final class SweepReport {

    private static final ObjectMapper MAPPER = new ObjectMapper();
    private static final int W = 520;
    private static final int H = 300;
    private static final int PAD = 56;

    private SweepReport() {
    }

    /** The sweep's JSON object. */
    public static ObjectNode json(SweepResult r) {
        ObjectNode root = MAPPER.createObjectNode();
        ArrayNode fields = root.putArray("fields");
        r.fields().forEach(fields::add);
        ArrayNode points = root.putArray("points");
        for (int i = 0; i < r.points().size(); i++) {
            SweepPoint p = r.points().get(i);
            ObjectNode o = points.addObject();
            ObjectNode values = o.putObject("values");
            for (int f = 0; f < r.fields().size(); f++) {
                values.put(r.fields().get(f), p.values().get(f));
            }
            o.put("demands_meeting_targets", p.demandsMeetingTargets());
            o.put("min_shared_rate_bits_per_s", p.minSharedRateBitsPerS());
            o.put("min_end_to_end_capacity_bits", p.minEndToEndCapacityBits());
            o.put("molecules_per_s", p.moleculesPerS());
            if (p.maxLatencyS() == null) {
                o.putNull("max_latency_s");
            } else {
                o.put("max_latency_s", p.maxLatencyS());
            }
            o.put("pareto", r.pareto().get(i));
        }
        return root;
    }

    /** One row per point in grid order: the fields' values, then the metrics and the Pareto mark. */
    public static String csv(SweepResult r) {
        StringBuilder b = new StringBuilder();
        for (String f : r.fields()) {
            b.append(f.contains(",") || f.contains("\"") ? "\"" + f.replace("\"", "\"\"") + "\"" : f).append(',');
        }
        b.append("demands_meeting_targets,min_shared_rate_bits_per_s,min_end_to_end_capacity_bits,molecules_per_s,"
                + "max_latency_s,pareto\n");
        for (int i = 0; i < r.points().size(); i++) {
            SweepPoint p = r.points().get(i);
            for (double v : p.values()) {
                b.append(full(v)).append(',');
            }
            b.append(p.demandsMeetingTargets()).append(',').append(full(p.minSharedRateBitsPerS())).append(',')
                    .append(full(p.minEndToEndCapacityBits())).append(',').append(full(p.moleculesPerS())).append(',')
                    .append(p.maxLatencyS() == null ? "" : full(p.maxLatencyS())).append(',')
                    .append(r.pareto().get(i)).append('\n');
        }
        return b.toString();
    }

    /** The HTML page: plots per swept field at the best point, the Pareto front and the table. */
    public static String html(String scenarioName, SweepResult r) {
        StringBuilder b = new StringBuilder();
        String title = "Sweep: " + scenarioName;
        b.append("<!DOCTYPE html>\n<html lang=\"en\"><head><meta charset=\"utf-8\"><title>")
                .append(PlanHtml.esc(title)).append("</title>\n<style>\n").append(PlanHtml.CSS)
                .append("</style></head><body>\n<h1>").append(PlanHtml.esc(title)).append("</h1>\n");
        int best = r.best();
        if (best < 0) {
            return b.append("<p>No points.</p></body></html>\n").toString();
        }
        SweepPoint bp = r.points().get(best);
        b.append("<p>").append(r.points().size()).append(" points. Best point (most demands meeting targets, then "
                + "largest smallest shared rate, then fewest molecules/s): ");
        for (int f = 0; f < r.fields().size(); f++) {
            b.append(f > 0 ? ", " : "").append("<code>").append(PlanHtml.esc(r.fields().get(f))).append("</code> = ")
                    .append(num(bp.values().get(f)));
        }
        b.append(".</p>\n");
        List<Metric> metrics = List.of(
                new Metric("demands meeting targets", p -> p.demandsMeetingTargets()),
                new Metric("smallest shared rate, bit/s", SweepPoint::minSharedRateBitsPerS),
                new Metric("smallest end-to-end information, bits", SweepPoint::minEndToEndCapacityBits),
                new Metric("molecules/s", SweepPoint::moleculesPerS));
        for (int f = 0; f < r.fields().size(); f++) {
            List<SweepPoint> line = new ArrayList<>();
            for (SweepPoint p : r.points()) {
                boolean others = true;
                for (int g = 0; g < r.fields().size(); g++) {
                    others &= g == f || p.values().get(g).equals(bp.values().get(g));
                }
                if (others) {
                    line.add(p);
                }
            }
            int ff = f;
            line.sort(Comparator.comparingDouble(p -> p.values().get(ff)));
            b.append("<h2>Against <code>").append(PlanHtml.esc(r.fields().get(f)))
                    .append("</code> (other fields at the best point)</h2>\n<div>\n");
            double[] xs = line.stream().mapToDouble(p -> p.values().get(ff)).toArray();
            for (Metric m : metrics) {
                double[] ys = line.stream().mapToDouble(m.get()).toArray();
                b.append(svg(xs, ys, null, r.fields().get(f), m.label(), true));
            }
            b.append("</div>\n");
        }
        b.append("<h2>Pareto front</h2>\n<p>Red: points no other point beats in all of demands meeting targets (more), "
                + "smallest shared rate (higher) and molecules/s (fewer).</p>\n");
        double[] xs = r.points().stream().mapToDouble(SweepPoint::moleculesPerS).toArray();
        double[] ys = r.points().stream().mapToDouble(SweepPoint::minSharedRateBitsPerS).toArray();
        b.append(svg(xs, ys, r.pareto(), "molecules/s", "smallest shared rate, bit/s", false));
        b.append("<h2>Points</h2>\n<table><tr>");
        for (String f : r.fields()) {
            b.append("<th>").append(PlanHtml.esc(f)).append("</th>");
        }
        b.append("<th>demands meeting targets</th><th>smallest shared rate, bit/s</th><th>smallest end-to-end, bits"
                + "</th><th>molecules/s</th><th>max latency, s</th><th>Pareto</th></tr>\n");
        for (int i = 0; i < r.points().size(); i++) {
            SweepPoint p = r.points().get(i);
            b.append("<tr>");
            for (double v : p.values()) {
                b.append("<td>").append(num(v)).append("</td>");
            }
            b.append("<td>").append(p.demandsMeetingTargets()).append("</td><td>").append(num(p.minSharedRateBitsPerS()))
                    .append("</td><td>").append(num(p.minEndToEndCapacityBits())).append("</td><td>")
                    .append(num(p.moleculesPerS())).append("</td><td>")
                    .append(p.maxLatencyS() == null ? "–" : num(p.maxLatencyS())).append("</td><td>")
                    .append(r.pareto().get(i) ? "yes" : "").append("</td></tr>\n");
        }
        b.append("</table>\n<p>").append(PlanHtml.esc(Cautions.SHORT)).append("</p>\n</body></html>\n");
        return b.toString();
    }

    private record Metric(String label, ToDoubleFunction<SweepPoint> get) {
    }

    /** A small inline SVG plot: a line through the points, or a scatter with marked points in red. */
    private static String svg(double[] xs, double[] ys, List<Boolean> marks, String xLabel, String yLabel,
            boolean line) {
        double x0 = min(xs);
        double x1 = max(xs);
        double y0 = Math.min(0, min(ys));
        double y1 = max(ys);
        if (x1 <= x0) {
            x1 = x0 + 1;
            x0 = x0 - 1;
        }
        if (y1 <= y0) {
            y1 = y0 + 1;
        }
        StringBuilder s = new StringBuilder();
        s.append(String.format(Locale.ROOT, "<svg xmlns=\"http://www.w3.org/2000/svg\" width=\"%d\" height=\"%d\" "
                + "viewBox=\"0 0 %d %d\" role=\"img\" aria-label=\"%s against %s\">", W, H, W, H,
                PlanHtml.esc(yLabel), PlanHtml.esc(xLabel)));
        s.append(String.format(Locale.ROOT, "<rect x=\"%d\" y=\"%d\" width=\"%d\" height=\"%d\" fill=\"none\" "
                + "stroke=\"#888\"/>", PAD, 10, W - PAD - 10, H - PAD - 10));
        s.append(text(PAD, H - PAD + 16, "start", num(x0))).append(text(W - 10, H - PAD + 16, "end", num(x1)))
                .append(text(PAD - 4, H - PAD, "end", num(y0))).append(text(PAD - 4, 20, "end", num(y1)))
                .append(text((W + PAD) / 2, H - 12, "middle", xLabel));
        s.append(String.format(Locale.ROOT, "<text x=\"14\" y=\"%d\" font-size=\"12\" text-anchor=\"middle\" "
                + "transform=\"rotate(-90 14 %d)\">%s</text>", (H - PAD) / 2, (H - PAD) / 2, PlanHtml.esc(yLabel)));
        StringBuilder path = new StringBuilder();
        for (int i = 0; i < xs.length; i++) {
            double px = PAD + (xs[i] - x0) / (x1 - x0) * (W - PAD - 10);
            double py = H - PAD - (ys[i] - y0) / (y1 - y0) * (H - PAD - 10);
            path.append(i == 0 ? "M" : "L").append(String.format(Locale.ROOT, "%.1f %.1f ", px, py));
            boolean marked = marks != null && marks.get(i);
            s.append(String.format(Locale.ROOT, "<circle cx=\"%.1f\" cy=\"%.1f\" r=\"%d\" fill=\"%s\"/>", px, py,
                    marked ? 5 : 3, marked ? "#c0392b" : "#555"));
        }
        if (line && xs.length > 1) {
            s.append("<path d=\"").append(path.toString().trim()).append("\" fill=\"none\" stroke=\"#1f6fb2\"/>");
        }
        return s.append("</svg>\n").toString();
    }

    private static String text(int x, int y, String anchor, String t) {
        return String.format(Locale.ROOT, "<text x=\"%d\" y=\"%d\" font-size=\"12\" text-anchor=\"%s\">%s</text>", x,
                y, anchor, PlanHtml.esc(t));
    }

    private static double min(double[] v) {
        double m = Double.POSITIVE_INFINITY;
        for (double d : v) {
            m = Math.min(m, d);
        }
        return Double.isInfinite(m) ? 0 : m;
    }

    private static double max(double[] v) {
        double m = Double.NEGATIVE_INFINITY;
        for (double d : v) {
            m = Math.max(m, d);
        }
        return Double.isInfinite(m) ? 1 : m;
    }

    /** Shortest text that reads back to the same double (CSV keeps every digit). */
    private static String full(double v) {
        return Double.toString(v);
    }

    private static String num(double v) {
        return String.format(Locale.ROOT, "%.6g", v).replaceAll("(\\.\\d*?)0+(e|$)", "$1$2").replace(".e", "e")
                .replaceAll("\\.$", "");
    }
}
