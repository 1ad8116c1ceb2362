package dev.nanoplan.report;

import dev.nanoplan.count.CountPmf;
import dev.nanoplan.detect.BinaryDetection;
import dev.nanoplan.detect.FirstThresholdSweep;
import dev.nanoplan.detect.MultiLevelResult;
import dev.nanoplan.io.AtomicFiles;
import dev.nanoplan.network.LinkEvaluation;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/** Writes the plot of one link as SVG or PNG (chosen by the file name's ending). */
public final class LinkPlotFiles {

    static final int WIDTH = 1100;
    static final int HEIGHT = 460;

    private LinkPlotFiles() {
    }

    /** True when the file name ends in .svg or .png. */
    public static boolean supported(Path file) {
        String n = file.getFileName().toString().toLowerCase(Locale.ROOT);
        return n.endsWith(".svg") || n.endsWith(".png");
    }

    /** Draws the link onto any canvas. */
    public static void draw(LinkEvaluation e, Canvas c) {
        List<LinkPlot.Series> levels = new ArrayList<>();
        long[] lm = e.spec().levelMolecules();
        for (int i = 0; i < e.givenLevel().size(); i++) {
            CountPmf p = e.givenLevel().get(i);
            String label = lm.length == 2 ? "sent " + i + " (" + lm[i] + " molecules)" : "level " + i + " (" + lm[i] + ")";
            levels.add(new LinkPlot.Series(label, p.offset(), p.masses()));
        }
        BinaryDetection b = e.binary();
        MultiLevelResult m = e.multiLevel();
        long[] thresholds;
        LinkPlot.Series mi;
        long chosen;
        String title;
        if (b != null) {
            thresholds = new long[] {e.operatingThreshold()};
            mi = new LinkPlot.Series("MI", b.firstThreshold(), b.miBitsByThreshold());
            chosen = e.operatingThreshold();
            title = String.format(Locale.ROOT, "Link: capacity %.4f bit/symbol, MI %.4f bit at τ = %d (prior %.2f)",
                    e.capacity().bits(), e.mutualInformationBits(), e.operatingThreshold(), e.spec().priorOne());
        } else {
            thresholds = m.thresholds();
            FirstThresholdSweep.Curve curve = FirstThresholdSweep.sweep(e.givenLevel(), thresholds, m.inputDistribution());
            mi = new LinkPlot.Series("MI", curve.firstThreshold(), curve.miBits());
            chosen = thresholds[0];
            title = String.format(Locale.ROOT, "Link, %d levels: capacity %.4f bit/symbol", lm.length,
                    e.capacity().bits());
        }
        String axis = b != null ? "threshold τ (decide 1 iff count ≥ τ)"
                : "first threshold (the others fixed at their best)";
        LinkPlot.draw(c, WIDTH, HEIGHT, levels, thresholds, mi, chosen, title, axis);
    }

    /** Writes {@code file} as SVG or PNG. */
    public static void write(LinkEvaluation e, Path file) throws IOException {
        if (!supported(file)) {
            throw new IllegalArgumentException("plot file must end in .svg or .png: " + file);
        }
        String n = file.getFileName().toString().toLowerCase(Locale.ROOT);
        if (n.endsWith(".svg")) {
            SvgCanvas c = new SvgCanvas(WIDTH, HEIGHT);
            draw(e, c);
            AtomicFiles.write(file, c.toSvg().getBytes(StandardCharsets.UTF_8));
        } else {
            RasterCanvas c = new RasterCanvas(WIDTH, HEIGHT);
            draw(e, c);
            ByteArrayOutputStream buf = new ByteArrayOutputStream();
            c.writePng(buf);
            AtomicFiles.write(file, buf.toByteArray());
        }
    }
}
