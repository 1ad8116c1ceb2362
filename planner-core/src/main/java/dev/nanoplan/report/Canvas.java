package dev.nanoplan.report;

/**
 * The few drawing operations our plots need, so one plot description renders both to SVG
 * ({@link SvgCanvas}) and to a PNG ({@link RasterCanvas}). Coordinates are pixels, origin top
 * left; colours are CSS hex strings ({@code #rrggbb}).
 */
public interface Canvas {

    void line(double x1, double y1, double x2, double y2, String colour, double width, boolean dashed);

    void polyline(double[] xs, double[] ys, String colour, double width);

    void rect(double x, double y, double w, double h, String fill);

    /** Text with anchor "start", "middle" or "end"; baseline at y. */
    void text(double x, double y, String text, double size, String colour, String anchor);
}
