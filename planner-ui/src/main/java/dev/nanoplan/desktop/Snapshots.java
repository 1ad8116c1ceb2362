package dev.nanoplan.desktop;

import dev.nanoplan.io.AtomicFiles;
import java.awt.image.BufferedImage;
import java.io.IOException;
import java.nio.file.Path;
import javafx.scene.image.Image;
import javafx.scene.image.PixelFormat;
import javafx.scene.image.PixelReader;
import javax.imageio.ImageIO;

/** Writes JavaFX images as PNG files (atomically: temp file + rename). */
public final class Snapshots {

    private Snapshots() {
    }

    /** Copies the image's pixels (ARGB) into an AWT image. O(width × height). */
    public static BufferedImage toBuffered(Image img) {
        int w = (int) img.getWidth();
        int h = (int) img.getHeight();
        BufferedImage out = new BufferedImage(w, h, BufferedImage.TYPE_INT_ARGB);
        PixelReader r = img.getPixelReader();
        int[] row = new int[w];
        for (int y = 0; y < h; y++) {
            r.getPixels(0, y, w, 1, PixelFormat.getIntArgbInstance(), row, 0, w);
            out.setRGB(0, y, w, 1, row, 0, w);
        }
        return out;
    }

    /** Writes {@code img} to {@code file} as PNG. */
    public static void writePng(Image img, Path file) throws IOException {
        BufferedImage buffered = toBuffered(img);
        AtomicFiles.write(file, out -> {
            if (!ImageIO.write(buffered, "png", out)) {
                throw new IOException("no PNG writer available");
            }
        });
    }
}
