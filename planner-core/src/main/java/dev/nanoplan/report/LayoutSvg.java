package dev.nanoplan.report;

import dev.nanoplan.geometry.Vec3;
import dev.nanoplan.geometry.Volume;
import dev.nanoplan.plan.LinkReport;
import dev.nanoplan.plan.Plan;
import dev.nanoplan.plan.RouteReport;
import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.Role;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.Species;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.HashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;

/**
 * Draws a plan's layout as an inline SVG element: the top view (x right, y up) or the side view
 * (x right, z up), both to scale (one µm is the same number of pixels on both axes).
 *
 * <p>What is drawn, bottom to top: the volume outline (box: its rectangle; cylinder: the
 * rectangle 0..L × −R..R with its axis dash-dotted, the same in both views; open medium: the
 * dashed bounding box of the nodes), the links as lines coloured by capacity on the ramp of
 * {@link #capacityColour(double)} (weak first so strong ones stay visible), the route hops outlined in
 * {@link #ROUTE_COLOUR} and filled with their capacity colour, then the nodes (larger bodies first): transmitter = filled disc, receiver =
 * ring, relay = diamond (fill = emitted species, outline = absorbed species), each as large as its
 * radius to scale but at least {@link #MIN_NODE_PX} pixels. Node colours follow the species
 * ({@link #SPECIES_COLOURS}). Ids are written beside the nodes when there are at most
 * {@link #LABEL_LIMIT}. A legend strip at the bottom holds a scale bar in µm, the capacity colour
 * bar (0 → log2(levels) bits, i.e. 0 → 1 bit for binary signalling) and the symbol key.
 *
 * <p>Large layouts: only the route hops and the {@code maxLinks} strongest other links are drawn,
 * and the strip says so. Cost O(n + m log m) for n nodes and m links; output size O(n + maxLinks).
 */
public final class LayoutSvg {

    /** Which projection. */
    public enum View {
        /** Looking down the z axis: x to the right, y up. */
        TOP("Top view (x–y)", "y"),
        /** Looking along +y: x to the right, z up. */
        SIDE("Side view (x–z)", "z");

        private final String title;
        private final String vertical;

        View(String title, String vertical) {
            this.title = title;
            this.vertical = vertical;
        }

        /** Heading drawn above the view. */
        public String title() {
            return title;
        }

        double u(Vec3 p) {
            return p.x();
        }

        double v(Vec3 p) {
            return this == TOP ? p.y() : p.z();
        }

        /** Depth towards the viewer: larger is drawn later (on top). */
        double depth(Vec3 p) {
            return this == TOP ? p.z() : -p.y();
        }
    }

    /** Default width of one view in pixels. */
    public static final int DEFAULT_WIDTH_PX = 640;
    /** Default largest height of one view in pixels. */
    public static final int DEFAULT_MAX_HEIGHT_PX = 620;
    /** Default number of non-route links drawn. */
    public static final int DEFAULT_MAX_LINKS = 300;
    /** Left and right margin around the plot area, pixels. */
    public static final int MARGIN_PX = 40;
    /** Space above the plot area (title), pixels. */
    public static final int TOP_PX = 34;
    /** Space below the plot area (legend strip), pixels. */
    public static final int LEGEND_PX = 84;
    /** Smallest height of the plot area, pixels (very flat volumes get empty space instead). */
    public static final int MIN_PLOT_HEIGHT_PX = 120;
    /** Smallest drawn node radius, pixels. */
    public static final double MIN_NODE_PX = 3.5;
    /** Node ids are written when the layout has at most this many nodes. */
    public static final int LABEL_LIMIT = 40;
    /** Colour of route hops. */
    public static final String ROUTE_COLOUR = Palette.ROUTE;
    /** Node colours, by species in the scenario's order (repeating). */
    public static final List<String> SPECIES_COLOURS =
            List.of("#2d2a32", "#7b4fa0", "#b8660b", "#11806a", "#3a6fb0", "#8a8f99");


    private LayoutSvg() {
    }

    /**
     * Maps layout coordinates (µm) to pixels: {@code xPx = leftPx + (u − minUUm)·pxPerUm},
     * {@code yPx = bottomPx − (v − minVUm)·pxPerUm} (SVG y grows downwards, the drawing's upwards).
     *
     * @param minUUm   smallest horizontal coordinate of the drawn extent (x), µm
     * @param minVUm   smallest vertical coordinate of the drawn extent (y or z), µm
     * @param spanUUm  horizontal extent, µm, > 0
     * @param spanVUm  vertical extent, µm, > 0
     * @param pxPerUm  scale, pixels per µm
     * @param leftPx   pixel column of {@code minUUm}
     * @param bottomPx pixel row of {@code minVUm}
     * @param widthPx  width of the SVG
     * @param heightPx height of the SVG
     */
    public record Transform(double minUUm, double minVUm, double spanUUm, double spanVUm, double pxPerUm,
            double leftPx, double bottomPx, int widthPx, int heightPx) {

        /** Pixel column of horizontal coordinate {@code uUm}. */
        public double xPx(double uUm) {
            return leftPx + (uUm - minUUm) * pxPerUm;
        }

        /** Pixel row of vertical coordinate {@code vUm}. */
        public double yPx(double vUm) {
            return bottomPx - (vUm - minVUm) * pxPerUm;
        }
    }

    /**
     * The transform used for {@code view} of {@code scenario}. The extent (box, cylinder
     * 0..L × −R..R, or for an open medium the nodes' bounding box grown by the largest radius and
     * 10 % of the larger span) is fitted into the plot area, {@code widthPx − 2·MARGIN_PX} wide and
     * at most {@code maxHeightPx − TOP_PX − LEGEND_PX} high, keeping the aspect ratio, centred
     * horizontally. The SVG height is then {@code TOP_PX + plot height + LEGEND_PX}, where the plot
     * height is the drawn extent's height but at least {@link #MIN_PLOT_HEIGHT_PX}.
     *
     * @throws IllegalArgumentException if the sizes leave no plot area
     */
    public static Transform transform(Scenario scenario, View view, int widthPx, int maxHeightPx) {
        return transform(scenario, view, widthPx, maxHeightPx, false);
    }

    /**
     * As {@link #transform(Scenario, View, int, int)}, but with {@code zoomToNodes} a box or
     * cylinder whose nodes fill less than {@value #ZOOM_BELOW} of the view's area is replaced by the
     * nodes' padded extent (clipped to the volume), so crowded layouts in a large tank stay legible.
     */
    public static Transform transform(Scenario scenario, View view, int widthPx, int maxHeightPx,
            boolean zoomToNodes) {
        double plotW = widthPx - 2.0 * MARGIN_PX;
        double plotMaxH = maxHeightPx - (double) TOP_PX - LEGEND_PX;
        if (!(plotW > 0) || plotMaxH < MIN_PLOT_HEIGHT_PX) {
            throw new IllegalArgumentException("widthPx/maxHeightPx too small for a layout view: " + widthPx + " x "
                    + maxHeightPx);
        }
        double[] e = zoomToNodes ? zoomedExtent(scenario, view) : extent(scenario, view);
        double spanU = e[2] - e[0];
        double spanV = e[3] - e[1];
        double scale = Math.min(plotW / spanU, plotMaxH / spanV);
        double plotH = Math.max(MIN_PLOT_HEIGHT_PX, spanV * scale);
        double left = MARGIN_PX + (plotW - spanU * scale) / 2;
        double bottom = TOP_PX + plotH - (plotH - spanV * scale) / 2;
        int height = (int) Math.ceil(TOP_PX + plotH + LEGEND_PX);
        return new Transform(e[0], e[1], spanU, spanV, scale, left, bottom, widthPx, height);
    }

    /** {@link #render(Plan, View, int, int, int, boolean)} with the default sizes, zoomed to the nodes. */
    public static String render(Plan plan, View view) {
        return render(plan, view, DEFAULT_WIDTH_PX, DEFAULT_MAX_HEIGHT_PX, DEFAULT_MAX_LINKS, true);
    }

    /** The whole volume, not zoomed. */
    public static String render(Plan plan, View view, int widthPx, int maxHeightPx, int maxLinks) {
        return render(plan, view, widthPx, maxHeightPx, maxLinks, false);
    }

    /**
     * One view as an {@code <svg>} element.
     *
     * @param maxLinks    how many links besides the route hops to draw at most (the strongest), ≥ 0
     * @param zoomToNodes see {@link #transform(Scenario, View, int, int, boolean)}
     */
    public static String render(Plan plan, View view, int widthPx, int maxHeightPx, int maxLinks,
            boolean zoomToNodes) {
        return render(plan, view, widthPx, maxHeightPx, maxLinks, zoomToNodes, Map.of());
    }

    /**
     * The default view with ghosts: for each node id in {@code ghostsUm}, its earlier centre (µm) drawn
     * as a dashed grey ring with a grey arrow to where the node is now (what {@code nanoplan improve}
     * moved).
     */
    public static String render(Plan plan, View view, Map<String, Vec3> ghostsUm) {
        return render(plan, view, DEFAULT_WIDTH_PX, DEFAULT_MAX_HEIGHT_PX, DEFAULT_MAX_LINKS, true, ghostsUm);
    }

    private static String render(Plan plan, View view, int widthPx, int maxHeightPx, int maxLinks,
            boolean zoomToNodes, Map<String, Vec3> ghostsUm) {
        if (maxLinks < 0) {
            throw new IllegalArgumentException("maxLinks must be >= 0, got " + maxLinks);
        }
        Scenario s = plan.scenario();
        Transform t = transform(s, view, widthPx, maxHeightPx, zoomToNodes);
        String gradientId = "np-ramp-" + view.name().toLowerCase(Locale.ROOT);
        StringBuilder sb = new StringBuilder(4096);
        sb.append("<svg xmlns=\"http://www.w3.org/2000/svg\" class=\"layout\" width=\"").append(t.widthPx())
                .append("\" height=\"").append(t.heightPx()).append("\" viewBox=\"0 0 ").append(t.widthPx())
                .append(' ').append(t.heightPx()).append("\" font-family=\"sans-serif\">\n");
        sb.append("<title>").append(esc(view.title() + " of " + s.name())).append("</title>\n");
        sb.append("<rect x=\"0\" y=\"0\" width=\"").append(t.widthPx()).append("\" height=\"").append(t.heightPx())
                .append("\" fill=\"#ffffff\"/>\n");
        text(sb, MARGIN_PX, 22, view.title(), 15, "#222", "start", "bold");

        outline(sb, s, view, t);

        Map<String, Node> byId = s.nodesById();
        double fullScaleBits = Math.log(s.signalling().levels()) / Math.log(2);
        Set<String> routeHops = routeHops(plan);
        List<LinkReport> others = new ArrayList<>();
        for (LinkReport l : plan.links()) {
            if (!routeHops.contains(key(l.from(), l.to()))) {
                others.add(l);
            }
        }
        others.sort(Comparator.comparingDouble(LayoutSvg::capacityOrZero).reversed());
        int drawn = Math.min(maxLinks, others.size());
        List<LinkReport> draw = new ArrayList<>(others.subList(0, drawn));
        draw.sort(Comparator.comparingDouble(LayoutSvg::capacityOrZero));
        sb.append("<g class=\"links\" stroke-linecap=\"round\">\n");
        for (LinkReport l : draw) {
            Node a = byId.get(l.from());
            Node b = byId.get(l.to());
            if (a == null || b == null) {
                continue;
            }
            double frac = capacityOrZero(l) / fullScaleBits;
            line(sb, t, view, a.positionUm(), b.positionUm(), capacityColour(frac), 1.4, 0.9);
        }
        sb.append("</g>\n");

        // route hops: an outline in the route colour, filled with the hop's capacity colour, so that routes
        // and capacities read together even when every link is a hop
        Map<String, LinkReport> byKey = new HashMap<>();
        plan.links().forEach(l -> byKey.put(key(l.from(), l.to()), l));
        sb.append("<g class=\"routes\" stroke-linecap=\"round\">\n");
        for (String hop : routeHops) {
            String[] ends = hop.split("\u0000", 2);
            Node a = byId.get(ends[0]);
            Node b = byId.get(ends[1]);
            if (a != null && b != null) {
                line(sb, t, view, a.positionUm(), b.positionUm(), ROUTE_COLOUR, 6.0, 0.95);
            }
        }
        for (String hop : routeHops) {
            String[] ends = hop.split("\u0000", 2);
            Node a = byId.get(ends[0]);
            Node b = byId.get(ends[1]);
            LinkReport l = byKey.get(hop);
            if (a != null && b != null) {
                double frac = l == null ? 0 : capacityOrZero(l) / fullScaleBits;
                line(sb, t, view, a.positionUm(), b.positionUm(), capacityColour(frac), 3.0, 1.0);
            }
        }
        sb.append("</g>\n");

        ghosts(sb, byId, ghostsUm, view, t);
        nodes(sb, s, view, t);
        legend(sb, s, t, gradientId, fullScaleBits, plan.links().size(), drawn, routeHops.size());
        sb.append("</svg>\n");
        return sb.toString();
    }

    /** The capacity colour of the desktop and the report ({@link Palette#capacity}); NaN gives the colour of 0. */
    public static String capacityColour(double fraction) {
        return Palette.capacity(Double.isNaN(fraction) ? 0 : fraction);
    }

    /** The nodes' colour: the species' place in the scenario, cycling through {@link #SPECIES_COLOURS}. */
    static Map<String, String> speciesColours(Scenario s) {
        Map<String, String> m = new HashMap<>();
        int i = 0;
        for (Species sp : s.species()) {
            m.put(sp.name(), SPECIES_COLOURS.get(i++ % SPECIES_COLOURS.size()));
        }
        return m;
    }

    private static double capacityOrZero(LinkReport l) {
        return Double.isFinite(l.mutualInformationBits()) ? l.mutualInformationBits() : 0.0;
    }

    private static String key(String from, String to) {
        return from + "\u0000" + to;
    }

    private static Set<String> routeHops(Plan plan) {
        Set<String> hops = new LinkedHashSet<>();
        for (RouteReport r : plan.routes()) {
            List<String> h = r.hops();
            for (int i = 0; i + 1 < h.size(); i++) {
                hops.add(key(h.get(i), h.get(i + 1)));
            }
        }
        return hops;
    }

    private static void ghosts(StringBuilder sb, Map<String, Node> byId, Map<String, Vec3> ghostsUm, View view,
            Transform t) {
        if (ghostsUm.isEmpty()) {
            return;
        }
        sb.append("<g class=\"ghosts\" fill=\"none\" stroke=\"#8a8f99\">\n");
        for (Map.Entry<String, Vec3> g : ghostsUm.entrySet()) {
            Node now = byId.get(g.getKey());
            if (now == null) {
                continue;
            }
            double x0 = t.xPx(view.u(g.getValue()));
            double y0 = t.yPx(view.v(g.getValue()));
            double x1 = t.xPx(view.u(now.positionUm()));
            double y1 = t.yPx(view.v(now.positionUm()));
            double r = Math.max(MIN_NODE_PX, now.radiusUm() * t.pxPerUm());
            sb.append(String.format(Locale.ROOT, "<circle cx=\"%.1f\" cy=\"%.1f\" r=\"%.1f\" stroke-dasharray=\"3 2\">"
                    + "<title>%s before</title></circle>%n", x0, y0, r, esc(g.getKey())));
            double len = Math.hypot(x1 - x0, y1 - y0);
            if (len > 2 * r) {
                double ux = (x1 - x0) / len;
                double uy = (y1 - y0) / len;
                double ex = x1 - ux * r;
                double ey = y1 - uy * r;
                sb.append(String.format(Locale.ROOT, "<line x1=\"%.1f\" y1=\"%.1f\" x2=\"%.1f\" y2=\"%.1f\" "
                        + "stroke-width=\"1.2\"/>%n", x0 + ux * r, y0 + uy * r, ex, ey));
                sb.append(String.format(Locale.ROOT, "<polyline points=\"%.1f,%.1f %.1f,%.1f %.1f,%.1f\" "
                        + "stroke-width=\"1.2\"/>%n", ex - 6 * ux + 4 * uy, ey - 6 * uy - 4 * ux, ex, ey,
                        ex - 6 * ux - 4 * uy, ey - 6 * uy + 4 * ux));
            }
        }
        sb.append("</g>\n");
    }

    /** Zoom when the nodes' extent covers less than this fraction of the volume's view area. */
    public static final double ZOOM_BELOW = 0.5;

    static double[] zoomedExtent(Scenario s, View view) {
        double[] whole = extent(s, view);
        if (s.volume() instanceof Volume.Open) {
            return whole;
        }
        double[] n = nodeExtent(s, view);
        double[] z = {Math.max(n[0], whole[0]), Math.max(n[1], whole[1]), Math.min(n[2], whole[2]),
            Math.min(n[3], whole[3])};
        double area = (z[2] - z[0]) * (z[3] - z[1]);
        double wholeArea = (whole[2] - whole[0]) * (whole[3] - whole[1]);
        return area < ZOOM_BELOW * wholeArea ? z : whole;
    }

    private static boolean zoomed(Scenario s, Transform t, View view) {
        double[] whole = extent(s, view);
        return t.minUUm() > whole[0] + 1e-9 || t.minVUm() > whole[1] + 1e-9
                || t.minUUm() + t.spanUUm() < whole[2] - 1e-9 || t.minVUm() + t.spanVUm() < whole[3] - 1e-9;
    }

    /** {minU, minV, maxU, maxV} of what is drawn, µm, with positive spans. */
    static double[] extent(Scenario s, View view) {
        Volume vol = s.volume();
        if (vol instanceof Volume.Box b) {
            return new double[] {view.u(b.minUm()), view.v(b.minUm()), view.u(b.maxUm()), view.v(b.maxUm())};
        }
        if (vol instanceof Volume.Cylinder c) {
            return new double[] {0, -c.radiusUm(), c.lengthUm(), c.radiusUm()};
        }
        return nodeExtent(s, view);
    }

    /** The nodes' bounding box grown by the largest radius and 10 % of the larger span (at least 1 µm). */
    static double[] nodeExtent(Scenario s, View view) {
        double minU = Double.POSITIVE_INFINITY;
        double minV = Double.POSITIVE_INFINITY;
        double maxU = Double.NEGATIVE_INFINITY;
        double maxV = Double.NEGATIVE_INFINITY;
        double maxR = 0;
        for (Node n : s.nodes()) {
            minU = Math.min(minU, view.u(n.positionUm()));
            maxU = Math.max(maxU, view.u(n.positionUm()));
            minV = Math.min(minV, view.v(n.positionUm()));
            maxV = Math.max(maxV, view.v(n.positionUm()));
            maxR = Math.max(maxR, n.radiusUm());
        }
        double pad = maxR + Math.max(1.0, 0.1 * Math.max(maxU - minU, maxV - minV));
        return new double[] {minU - pad, minV - pad, maxU + pad, maxV + pad};
    }

    private static void outline(StringBuilder sb, Scenario s, View view, Transform t) {
        double x0 = t.xPx(t.minUUm());
        double x1 = t.xPx(t.minUUm() + t.spanUUm());
        double y0 = t.yPx(t.minVUm() + t.spanVUm());
        double y1 = t.yPx(t.minVUm());
        Volume vol = s.volume();
        String what;
        boolean zoomed = zoomed(s, t, view);
        double[] w = extent(s, view);
        double vx0 = t.xPx(w[0]);
        double vx1 = t.xPx(w[2]);
        double vy0 = t.yPx(w[3]);
        double vy1 = t.yPx(w[1]);
        if (zoomed) {
            String clip = "np-clip-" + view.name().toLowerCase(Locale.ROOT);
            sb.append("<defs><clipPath id=\"").append(clip).append("\">").append(rect(x0, y0, x1 - x0, y1 - y0, 0,
                    "#000", "none", 0, null).strip()).append("</clipPath></defs>\n");
            sb.append("<g clip-path=\"url(#").append(clip).append(")\">\n");
            sb.append(rect(x0, y0, x1 - x0, y1 - y0, 0, "none", "#c5ccd4", 1, "2 3"));
        }
        if (vol instanceof Volume.Box b) {
            sb.append(rect(vx0, vy0, vx1 - vx0, vy1 - vy0, 0, "#f7f9fb", "#55606e", 1.5, null));
            Vec3 size = b.sizeUm();
            what = zoomed ? "zoomed to the nodes; box " + num(size.x()) + " × " + num(size.y()) + " × "
                    + num(size.z()) + " µm" : "box";
        } else if (vol instanceof Volume.Cylinder c) {
            double r = Math.min((vy1 - vy0) / 2, 14);
            sb.append(rect(vx0, vy0, vx1 - vx0, vy1 - vy0, r, "#f4f8fb", "#55606e", 1.5, null));
            double ya = t.yPx(0);
            sb.append("<line x1=\"").append(f(x0)).append("\" y1=\"").append(f(ya)).append("\" x2=\"").append(f(x1))
                    .append("\" y2=\"").append(f(ya))
                    .append("\" stroke=\"#9aa5b1\" stroke-width=\"1\" stroke-dasharray=\"10 3 2 3\"/>\n");
            what = zoomed ? "zoomed to the nodes; cylinder R " + num(c.radiusUm()) + " µm, L " + num(c.lengthUm())
                    + " µm" : "cylinder, axis x";
        } else {
            sb.append(rect(x0, y0, x1 - x0, y1 - y0, 0, "none", "#9aa5b1", 1.2, "6 4"));
            what = "open medium: node extent";
        }
        if (zoomed) {
            sb.append("</g>\n");
            sb.append(rect(x0, y0, x1 - x0, y1 - y0, 0, "none", "#9aa5b1", 1, "2 3"));
        }
        text(sb, x1, y0 - 6, what, 11, "#55606e", "end", null);
        // corner coordinates and axis names
        text(sb, x0, y1 + 14, "(" + num(t.minUUm()) + ", " + num(t.minVUm()) + ") µm", 10, "#7a8491", "start",
                null);
        text(sb, x1, y1 + 14, "x →", 11, "#55606e", "end", null);
        text(sb, x0 - 4, y0 + 4, view.vertical + " ↑", 11, "#55606e", "end", null);
    }

    private static void nodes(StringBuilder sb, Scenario s, View view, Transform t) {
        Map<String, String> colours = speciesColours(s);
        List<Node> order = new ArrayList<>(s.nodes());
        // larger bodies first, then far to near: a small node in front of or behind a large body is drawn
        // on top of it, so no node is ever hidden
        order.sort(Comparator.comparingDouble((Node n) -> -n.radiusUm()).thenComparingDouble(n -> view.depth(n.positionUm())));
        boolean many = order.size() > 1000;
        double minPx = many ? 1.5 : MIN_NODE_PX;
        boolean labels = order.size() <= LABEL_LIMIT;
        sb.append("<g class=\"nodes\">\n");
        for (Node n : order) {
            double x = t.xPx(view.u(n.positionUm()));
            double y = t.yPx(view.v(n.positionUm()));
            double r = Math.max(minPx, n.radiusUm() * t.pxPerUm());
            String c = colours.getOrDefault(n.species(), SPECIES_COLOURS.get(0));
            sb.append(symbol(n.role(), x, y, r, c, colours.getOrDefault(n.emitsSpecies(), c), !many));
            if (labels) {
                label(sb, x + r + 3, y - r - 1, n.id());
            }
        }
        sb.append("</g>\n");
    }

    /** The role's symbol centred at (x, y) with radius r pixels. */
    static String symbol(Role role, double x, double y, double r, String colour, String emitColour, boolean outline) {
        String title = "";
        return switch (role) {
            case TRANSMITTER -> "<circle cx=\"" + f(x) + "\" cy=\"" + f(y) + "\" r=\"" + f(r) + "\" fill=\"" + colour
                    + "\"" + (outline ? " stroke=\"#ffffff\" stroke-width=\"1\"" : "") + "/>\n" + title;
            case RECEIVER -> "<circle cx=\"" + f(x) + "\" cy=\"" + f(y) + "\" r=\"" + f(Math.max(r - 1, 1))
                    + "\" fill=\"#ffffff\" stroke=\"" + colour + "\" stroke-width=\"" + f(Math.max(2, r * 0.3))
                    + "\"/>\n";
            case RELAY -> {
                double d = r * 1.35;
                yield "<polygon points=\"" + f(x) + "," + f(y - d) + " " + f(x + d) + "," + f(y) + " " + f(x) + ","
                        + f(y + d) + " " + f(x - d) + "," + f(y) + "\" fill=\"" + emitColour + "\" stroke=\"" + colour
                        + "\" stroke-width=\"2\"/>\n";
            }
        };
    }

    private static void legend(StringBuilder sb, Scenario s, Transform t, String gradientId, double fullScaleBits,
            int totalLinks, int drawnOthers, int routeHops) {
        int h = t.heightPx();
        double rowA = h - LEGEND_PX + 36;
        double rowB = h - 14;
        // scale bar
        double targetUm = (t.widthPx() - 2.0 * MARGIN_PX) / 5 / t.pxPerUm();
        double barUm = niceLength(targetUm);
        double barPx = barUm * t.pxPerUm();
        double x0 = MARGIN_PX;
        sb.append("<g class=\"scale-bar\">\n");
        sb.append("<line x1=\"").append(f(x0)).append("\" y1=\"").append(f(rowA)).append("\" x2=\"")
                .append(f(x0 + barPx)).append("\" y2=\"").append(f(rowA))
                .append("\" stroke=\"#222\" stroke-width=\"2\"/>\n");
        for (double xe : new double[] {x0, x0 + barPx}) {
            sb.append("<line x1=\"").append(f(xe)).append("\" y1=\"").append(f(rowA - 5)).append("\" x2=\"")
                    .append(f(xe)).append("\" y2=\"").append(f(rowA + 5)).append("\" stroke=\"#222\" stroke-width=\"2\"/>\n");
        }
        text(sb, x0 + barPx / 2, rowA - 8, num(barUm) + " µm", 11, "#222", "middle", null);
        sb.append("</g>\n");
        // colour bar
        double cbX = Math.max(x0 + barPx + 40, t.widthPx() / 2.0 - 110);
        double cbW = 180;
        sb.append("<defs><linearGradient id=\"").append(gradientId).append("\" x1=\"0\" x2=\"1\" y1=\"0\" y2=\"0\">");
        for (int i = 0; i <= 10; i++) {
            sb.append("<stop offset=\"").append(f(i / 10.0)).append("\" stop-color=\"")
                    .append(capacityColour(i / 10.0)).append("\"/>");
        }
        sb.append("</linearGradient></defs>\n");
        sb.append("<g class=\"colour-bar\">\n");
        sb.append(rect(cbX, rowA - 6, cbW, 10, 0, "url(#" + gradientId + ")", "#888", 0.6, null));
        text(sb, cbX, rowA + 17, "0", 10, "#222", "middle", null);
        text(sb, cbX + cbW, rowA + 17, num(fullScaleBits) + " bit", 10, "#222", "middle", null);
        text(sb, cbX + cbW / 2, rowA - 11, "link capacity (bits/symbol)", 11, "#222", "middle", null);
        sb.append("</g>\n");
        // route key
        double rx = cbX + cbW + 30;
        sb.append("<line x1=\"").append(f(rx)).append("\" y1=\"").append(f(rowA)).append("\" x2=\"").append(f(rx + 26))
                .append("\" y2=\"").append(f(rowA)).append("\" stroke=\"").append(ROUTE_COLOUR)
                .append("\" stroke-width=\"3.2\" stroke-linecap=\"round\"/>\n");
        text(sb, rx + 32, rowA + 4, "route hop (outline)", 11, "#222", "start", null);
        // symbols and species
        Map<String, String> colours = speciesColours(s);
        String first = SPECIES_COLOURS.get(0);
        double x = x0 + 6;
        sb.append(symbol(Role.TRANSMITTER, x, rowB - 4, 5, first, first, true));
        text(sb, x + 10, rowB, "transmitter", 11, "#222", "start", null);
        x += 92;
        sb.append(symbol(Role.RECEIVER, x, rowB - 4, 6, first, first, true));
        text(sb, x + 10, rowB, "receiver", 11, "#222", "start", null);
        x += 76;
        sb.append(symbol(Role.RELAY, x, rowB - 4, 5, first, SPECIES_COLOURS.get(1 % SPECIES_COLOURS.size()), true));
        text(sb, x + 10, rowB, "relay (fill: emits)", 11, "#222", "start", null);
        x += 128;
        text(sb, x, rowB, "species:", 11, "#222", "start", null);
        x += 50;
        int shown = 0;
        for (Species sp : s.species()) {
            if (shown++ == 6 || x > t.widthPx() - 40) {
                text(sb, x, rowB, "…", 11, "#222", "start", null);
                break;
            }
            sb.append(rect(x, rowB - 9, 10, 10, 0, colours.get(sp.name()), "none", 0, null));
            String name = sp.name().length() > 12 ? sp.name().substring(0, 11) + "…" : sp.name();
            text(sb, x + 13, rowB, name, 11, "#222", "start", null);
            x += 22 + 6.5 * name.length();
        }
        // truncation note
        int hidden = totalLinks - drawnOthers - Math.min(routeHops, totalLinks);
        if (hidden > 0) {
            text(sb, t.widthPx() - MARGIN_PX, 22, "showing route hops + the " + drawnOthers + " strongest of "
                    + totalLinks + " links", 11, "#8a4b00", "end", null);
        }
    }

    /** The largest of 1, 2, 5 × 10^k not above {@code targetUm} (at least the smallest such). */
    static double niceLength(double targetUm) {
        double p = Math.pow(10, Math.floor(Math.log10(targetUm)));
        for (double m : new double[] {5, 2, 1}) {
            if (m * p <= targetUm) {
                return m * p;
            }
        }
        return p;
    }

    private static void line(StringBuilder sb, Transform t, View view, Vec3 a, Vec3 b, String colour, double width,
            double opacity) {
        sb.append("<line x1=\"").append(f(t.xPx(view.u(a)))).append("\" y1=\"").append(f(t.yPx(view.v(a))))
                .append("\" x2=\"").append(f(t.xPx(view.u(b)))).append("\" y2=\"").append(f(t.yPx(view.v(b))))
                .append("\" stroke=\"").append(colour).append("\" stroke-width=\"").append(f(width))
                .append("\" stroke-opacity=\"").append(f(opacity)).append("\"/>\n");
    }

    private static String rect(double x, double y, double w, double h, double rx, String fill, String stroke,
            double strokeWidth, String dash) {
        return "<rect x=\"" + f(x) + "\" y=\"" + f(y) + "\" width=\"" + f(w) + "\" height=\"" + f(h) + "\""
                + (rx > 0 ? " rx=\"" + f(rx) + "\"" : "") + " fill=\"" + fill + "\" stroke=\"" + stroke
                + "\" stroke-width=\"" + f(strokeWidth) + "\"" + (dash == null ? "" : " stroke-dasharray=\"" + dash + "\"")
                + "/>\n";
    }

    /** A node id with a white halo so it stays legible over lines. */
    private static void label(StringBuilder sb, double x, double y, String id) {
        sb.append("<text x=\"").append(f(x)).append("\" y=\"").append(f(y)).append("\" font-size=\"10.5\" fill=\"#222\" "
                + "stroke=\"#ffffff\" stroke-width=\"3\" stroke-opacity=\"0.85\" paint-order=\"stroke\" "
                + "stroke-linejoin=\"round\">").append(esc(id)).append("</text>\n");
    }

    private static void text(StringBuilder sb, double x, double y, String s, double size, String colour,
            String anchor, String weight) {
        sb.append("<text x=\"").append(f(x)).append("\" y=\"").append(f(y)).append("\" font-size=\"").append(f(size))
                .append("\" fill=\"").append(colour).append("\" text-anchor=\"").append(anchor).append('"');
        if (weight != null) {
            sb.append(" font-weight=\"").append(weight).append('"');
        }
        sb.append('>').append(esc(s)).append("</text>\n");
    }

    private static String esc(String s) {
        return SvgCanvas.escape(s);
    }

    static String f(double v) {
        return String.format(Locale.ROOT, "%.2f", v);
    }

    /** Short number: integers without decimals, otherwise 3 significant digits. */
    static String num(double v) {
        if (v == Math.rint(v) && Math.abs(v) < 1e9) {
            return Long.toString((long) v);
        }
        return String.format(Locale.ROOT, "%.3g", v);
    }
}
