package dev.nanoplan.report;

import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.Objects;

/**
 * Draws the picture of one link: left, the count distribution given each sent level with the
 * chosen thresholds; right, mutual information versus the (first) threshold.
 */
public final class LinkPlot {

    /** Colours of the levels, in order (our own palette). */
    static final String[] LEVEL_COLOURS = {"#1b6ca8", "#d1495b", "#edae49", "#00798c", "#66a182", "#8d6a9f",
        "#c05746", "#3c6e71"};
    private static final String INK = "#30343f";
    private static final String GRID = "#e4e6eb";

    /** A curve sampled at consecutive integers x = firstX, firstX + 1, … */
    public record Series(String label, long firstX, double[] y) {
        public Series {
            y = y.clone();
        }

        @Override
        public boolean equals(Object o) {
            // every component, arrays by content
            return o instanceof Series other
                    && Objects.equals(label, other.label)
                    && firstX == other.firstX
                    && Arrays.equals(y, other.y);
        }

        @Override
        public int hashCode() {
            int h = Objects.hash(label, firstX);
            h = 31 * h + Arrays.hashCode(y);
            return h;
        }
    }

    private LinkPlot() {
    }

    /**
     * Draws onto {@code c}, which must be {@code width × height} pixels.
     *
     * @param levels     the count pmf given each level
     * @param thresholds decision thresholds to mark (count values)
     * @param mi         mutual information (bits) versus threshold
     * @param chosen     the threshold marked on the right panel
     * @param title      a line of text at the top
     * @param miAxisLabel what the right panel's horizontal axis is
     */
    public static void draw(Canvas c, int width, int height, List<Series> levels, long[] thresholds, Series mi,
            long chosen, String title, String miAxisLabel) {
        c.rect(0, 0, width, height, "#ffffff");
        c.text(16, 24, title, 14, INK, "start");
        double top = 50;
        double bottom = height - 48;
        double gap = 60;
        double leftW = (width - 3 * gap) * 0.55;
        double rightW = (width - 3 * gap) - leftW;
        Box left = new Box(gap, top, leftW, bottom - top);
        Box right = new Box(2 * gap + leftW, top, rightW, bottom - top);

        // left panel: distributions
        long xmin = Long.MAX_VALUE;
        long xmax = Long.MIN_VALUE;
        double ymax = 0;
        for (Series s : levels) {
            int[] span = visibleSpan(s.y());
            xmin = Math.min(xmin, s.firstX() + span[0]);
            xmax = Math.max(xmax, s.firstX() + span[1]);
            for (double v : s.y()) {
                ymax = Math.max(ymax, v);
            }
        }
        for (long t : thresholds) {
            xmin = Math.min(xmin, t);
            xmax = Math.max(xmax, t);
        }
        if (xmax <= xmin) {
            xmax = xmin + 1;
        }
        ymax = ymax > 0 ? ymax * 1.08 : 1;
        axes(c, left, xmin, xmax, 0, ymax, "molecules counted in the slot", "probability");
        for (int i = 0; i < levels.size(); i++) {
            Series s = levels.get(i);
            String col = LEVEL_COLOURS[i % LEVEL_COLOURS.length];
            plotSeries(c, left, s, xmin, xmax, 0, ymax, col);
            c.rect(left.x + left.w - 150, left.y + 8 + 18 * i, 12, 12, col);
            c.text(left.x + left.w - 132, left.y + 19 + 18 * i, s.label(), 12, INK, "start");
        }
        for (long t : thresholds) {
            double x = left.px(t - 0.5, xmin, xmax);
            c.line(x, left.y, x, left.y + left.h, INK, 1.5, true);
        }
        if (thresholds.length > 0) {
            c.text(left.px(thresholds[0] - 0.5, xmin, xmax) + 4, left.y + 14,
                    thresholds.length == 1 ? "τ = " + thresholds[0] : "thresholds", 12, INK, "start");
        }

        // right panel: MI versus threshold
        double mimax = 0;
        for (double v : mi.y()) {
            mimax = Math.max(mimax, v);
        }
        mimax = mimax > 0 ? mimax * 1.08 : 1;
        long mx0 = mi.firstX();
        long mx1 = mi.firstX() + Math.max(1, mi.y().length - 1);
        axes(c, right, mx0, mx1, 0, mimax, miAxisLabel, "mutual information (bits)");
        plotSeries(c, right, mi, mx0, mx1, 0, mimax, LEVEL_COLOURS[3]);
        double cx = right.px(chosen, mx0, mx1);
        c.line(cx, right.y, cx, right.y + right.h, INK, 1.5, true);
        c.text(cx + 4, right.y + 14, "τ = " + chosen, 12, INK, "start");
    }

    /** Index range where the series is above 1e-6 of its peak (what is visible). */
    private static int[] visibleSpan(double[] y) {
        double peak = 0;
        for (double v : y) {
            peak = Math.max(peak, v);
        }
        int a = 0;
        int b = y.length - 1;
        while (a < b && y[a] < 1e-6 * peak) {
            a++;
        }
        while (b > a && y[b] < 1e-6 * peak) {
            b--;
        }
        return new int[] {a, b};
    }

    private static void plotSeries(Canvas c, Box b, Series s, double x0, double x1, double y0, double y1, String col) {
        int n = s.y().length;
        int from = 0;
        int to = n - 1;
        while (from < to && s.firstX() + from < x0) {
            from++;
        }
        while (to > from && s.firstX() + to > x1) {
            to--;
        }
        int m = to - from + 1;
        int stride = Math.max(1, m / 2000);
        int pts = (m + stride - 1) / stride;
        double[] xs = new double[pts];
        double[] ys = new double[pts];
        for (int i = 0; i < pts; i++) {
            int k = from + i * stride;
            xs[i] = b.px(s.firstX() + k, x0, x1);
            ys[i] = b.py(s.y()[k], y0, y1);
        }
        c.polyline(xs, ys, col, 2);
    }

    private static void axes(Canvas c, Box b, double x0, double x1, double y0, double y1, String xl, String yl) {
        for (int i = 0; i <= 4; i++) {
            double fy = y0 + (y1 - y0) * i / 4;
            double py = b.py(fy, y0, y1);
            c.line(b.x, py, b.x + b.w, py, GRID, 1, false);
            c.text(b.x - 6, py + 4, num(fy), 11, INK, "end");
            double fx = x0 + (x1 - x0) * i / 4;
            double px = b.px(fx, x0, x1);
            c.text(px, b.y + b.h + 16, num(fx), 11, INK, "middle");
        }
        c.line(b.x, b.y + b.h, b.x + b.w, b.y + b.h, INK, 1, false);
        c.line(b.x, b.y, b.x, b.y + b.h, INK, 1, false);
        c.text(b.x + b.w / 2, b.y + b.h + 34, xl, 12, INK, "middle");
        c.text(b.x, b.y - 8, yl, 12, INK, "start");
    }

    static String num(double v) {
        if (Math.abs(v) >= 10 && Math.abs(v) < 1e5) {
            return String.format(Locale.ROOT, "%.0f", v);
        }
        double a = Math.abs(v);
        if (a == 0) {
            return "0";
        }
        if (a >= 1e5 || a < 1e-3) {
            return String.format(Locale.ROOT, "%.1e", v);
        }
        if (a >= 100 || Math.rint(v) == v) {
            return String.format(Locale.ROOT, "%.0f", v);
        }
        return String.format(Locale.ROOT, "%.3g", v);
    }

    private record Box(double x, double y, double w, double h) {
        double px(double v, double v0, double v1) {
            return x + (v - v0) / (v1 - v0) * w;
        }

        double py(double v, double v0, double v1) {
            return y + h - (v - v0) / (v1 - v0) * h;
        }
    }
}
