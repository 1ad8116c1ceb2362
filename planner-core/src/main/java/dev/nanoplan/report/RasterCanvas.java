package dev.nanoplan.report;

import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Font;
import java.awt.Graphics2D;
import java.awt.RenderingHints;
import java.awt.geom.Line2D;
import java.awt.geom.Path2D;
import java.awt.geom.Rectangle2D;
import java.awt.image.BufferedImage;
import java.io.IOException;
import java.io.OutputStream;
import javax.imageio.ImageIO;

/** A {@link Canvas} that paints into an image with Java 2D (works headless) and writes PNG. */
public final class RasterCanvas implements Canvas {

    private final BufferedImage image;
    private final Graphics2D g;

    public RasterCanvas(int widthPx, int heightPx) {
        image = new BufferedImage(widthPx, heightPx, BufferedImage.TYPE_INT_RGB);
        g = image.createGraphics();
        g.setRenderingHint(RenderingHints.KEY_ANTIALIASING, RenderingHints.VALUE_ANTIALIAS_ON);
        g.setRenderingHint(RenderingHints.KEY_TEXT_ANTIALIASING, RenderingHints.VALUE_TEXT_ANTIALIAS_ON);
        g.setColor(Color.WHITE);
        g.fillRect(0, 0, widthPx, heightPx);
    }

    private static Color colour(String hex) {
        return Color.decode(hex);
    }

    @Override
    public void line(double x1, double y1, double x2, double y2, String c, double width, boolean dashed) {
        g.setColor(colour(c));
        g.setStroke(dashed
                ? new BasicStroke((float) width, BasicStroke.CAP_BUTT, BasicStroke.JOIN_MITER, 10f, new float[] {6f, 4f}, 0f)
                : new BasicStroke((float) width));
        g.draw(new Line2D.Double(x1, y1, x2, y2));
    }

    @Override
    public void polyline(double[] xs, double[] ys, String c, double width) {
        if (xs.length == 0) {
            return;
        }
        Path2D.Double p = new Path2D.Double();
        p.moveTo(xs[0], ys[0]);
        for (int i = 1; i < xs.length; i++) {
            p.lineTo(xs[i], ys[i]);
        }
        g.setColor(colour(c));
        g.setStroke(new BasicStroke((float) width, BasicStroke.CAP_ROUND, BasicStroke.JOIN_ROUND));
        g.draw(p);
    }

    @Override
    public void rect(double x, double y, double w, double h, String fill) {
        g.setColor(colour(fill));
        g.fill(new Rectangle2D.Double(x, y, w, h));
    }

    @Override
    public void text(double x, double y, String text, double size, String c, String anchor) {
        g.setColor(colour(c));
        g.setFont(new Font(Font.SANS_SERIF, Font.PLAIN, (int) Math.round(size)));
        double w = g.getFontMetrics().stringWidth(text);
        double x0 = switch (anchor) {
            case "middle" -> x - w / 2;
            case "end" -> x - w;
            default -> x;
        };
        g.drawString(text, (float) x0, (float) y);
    }

    /** Writes the image as PNG. */
    public void writePng(OutputStream out) throws IOException {
        g.dispose();
        ImageIO.write(image, "png", out);
    }
}
