package dev.nanoplan.desktop;

import dev.nanoplan.scenario.Role;
import javafx.scene.paint.Color;
import javafx.scene.paint.CycleMethod;
import javafx.scene.paint.LinearGradient;
import javafx.scene.paint.Stop;

/**
 * nanoplan's palette: node colours by role and a continuous colour scale for link capacity.
 *
 * <p>The capacity scale runs from ember (no capacity) through amber (half) to mint (the most a
 * symbol can carry, log2 of the number of levels); values outside [0, max] are clamped, NaN is
 * drawn grey. Colours interpolate linearly in RGB between the stops.
 */
public final class CapacityColours {

    /** Stops of the scale at fractions 0, 0.5 and 1 of the maximum capacity. */
    static final Color LOW = Color.web("#e0474c");
    static final Color MID = Color.web("#f2c14e");
    static final Color HIGH = Color.web("#4fe3b5");
    static final Color UNKNOWN = Color.web("#8a8f98");

    private CapacityColours() {
    }

    /** Colour of a link carrying {@code capacityBits} when a symbol can carry at most {@code maxBits}. */
    public static Color of(double capacityBits, double maxBits) {
        if (!(maxBits > 0) || Double.isNaN(capacityBits)) {
            return UNKNOWN;
        }
        double f = Math.max(0, Math.min(1, capacityBits / maxBits));
        return f < 0.5 ? LOW.interpolate(MID, f * 2) : MID.interpolate(HIGH, (f - 0.5) * 2);
    }

    /** The scale as a left-to-right gradient, for the legend. */
    public static LinearGradient legendGradient() {
        return new LinearGradient(0, 0, 1, 0, true, CycleMethod.NO_CYCLE,
                new Stop(0, LOW), new Stop(0.5, MID), new Stop(1, HIGH));
    }

    /** Fill colour of a node of the given role. */
    public static Color role(Role role) {
        return switch (role) {
            case TRANSMITTER -> Color.web("#5aa9f0");
            case RECEIVER -> Color.web("#f58fd0");
            case RELAY -> Color.web("#b48cff");
        };
    }
}
