package dev.nanoplan.desktop;

import dev.nanoplan.report.Palette;
import dev.nanoplan.scenario.Role;
import javafx.scene.paint.Color;
import javafx.scene.paint.CycleMethod;
import javafx.scene.paint.LinearGradient;
import javafx.scene.paint.Stop;

/**
 * The core's {@link Palette} as JavaFX colours: node colours by role and the capacity scale, the
 * same as the HTML report's. Values outside [0, max] are clamped; NaN is drawn grey.
 */
public final class CapacityColours {

    static final Color UNKNOWN = Color.web(Palette.UNKNOWN);
    /** Gradient stops of the legend. */
    private static final int LEGEND_STOPS = 9;

    private CapacityColours() {
    }

    /** Colour of a link carrying {@code capacityBits} when a symbol can carry at most {@code maxBits}. */
    public static Color of(double capacityBits, double maxBits) {
        if (!(maxBits > 0) || Double.isNaN(capacityBits)) {
            return UNKNOWN;
        }
        return Color.web(Palette.capacity(capacityBits / maxBits));
    }

    /** The scale as a left-to-right gradient, for the legend. */
    public static LinearGradient legendGradient() {
        Stop[] stops = new Stop[LEGEND_STOPS];
        for (int i = 0; i < LEGEND_STOPS; i++) {
            double f = i / (double) (LEGEND_STOPS - 1);
            stops[i] = new Stop(f, Color.web(Palette.capacity(f)));
        }
        return new LinearGradient(0, 0, 1, 0, true, CycleMethod.NO_CYCLE, stops);
    }

    /** Fill colour of a node of the given role. */
    public static Color role(Role role) {
        return Color.web(Palette.role(role));
    }
}
