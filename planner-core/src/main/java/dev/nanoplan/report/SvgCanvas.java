package dev.nanoplan.report;

import java.util.Locale;

/** A {@link Canvas} that writes a standalone SVG document. */
public final class SvgCanvas implements Canvas {

    private final StringBuilder body = new StringBuilder();
    private final int widthPx;
    private final int heightPx;

    public SvgCanvas(int widthPx, int heightPx) {
        this.widthPx = widthPx;
        this.heightPx = heightPx;
    }

    private static String f(double v) {
        return String.format(Locale.ROOT, "%.2f", v);
    }

    static String escape(String s) {
        return s.replace("&", "&amp;").replace("<", "&lt;").replace(">", "&gt;").replace("\"", "&quot;");
    }

    @Override
    public void line(double x1, double y1, double x2, double y2, String colour, double width, boolean dashed) {
        body.append("<line x1=\"").append(f(x1)).append("\" y1=\"").append(f(y1)).append("\" x2=\"").append(f(x2))
                .append("\" y2=\"").append(f(y2)).append("\" stroke=\"").append(colour).append("\" stroke-width=\"")
                .append(f(width)).append('"');
        if (dashed) {
            body.append(" stroke-dasharray=\"6 4\"");
        }
        body.append("/>\n");
    }

    @Override
    public void polyline(double[] xs, double[] ys, String colour, double width) {
        body.append("<polyline fill=\"none\" stroke=\"").append(colour).append("\" stroke-width=\"").append(f(width))
                .append("\" points=\"");
        for (int i = 0; i < xs.length; i++) {
            body.append(f(xs[i])).append(',').append(f(ys[i])).append(' ');
        }
        body.append("\"/>\n");
    }

    @Override
    public void rect(double x, double y, double w, double h, String fill) {
        body.append("<rect x=\"").append(f(x)).append("\" y=\"").append(f(y)).append("\" width=\"").append(f(w))
                .append("\" height=\"").append(f(h)).append("\" fill=\"").append(fill).append("\"/>\n");
    }

    @Override
    public void text(double x, double y, String text, double size, String colour, String anchor) {
        body.append("<text x=\"").append(f(x)).append("\" y=\"").append(f(y)).append("\" font-size=\"").append(f(size))
                .append("\" fill=\"").append(colour).append("\" text-anchor=\"").append(anchor)
                .append("\" font-family=\"sans-serif\">").append(escape(text)).append("</text>\n");
    }

    /** The SVG element (usable inline in HTML). */
    public String toSvg() {
        return "<svg xmlns=\"http://www.w3.org/2000/svg\" width=\"" + widthPx + "\" height=\"" + heightPx
                + "\" viewBox=\"0 0 " + widthPx + " " + heightPx + "\">\n" + body + "</svg>\n";
    }
}
