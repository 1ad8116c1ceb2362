package dev.nanoplan.desktop;

import java.util.ArrayList;
import java.util.List;

/**
 * Which node labels the 3D view shows: labels are tried in order and a label is skipped when its
 * rectangle would overlap a label already kept (greedy, first come first kept), so crowded places
 * show the first node's id and never a pile of unreadable text. Plain arithmetic; no JavaFX.
 * Cost O(n · kept) for n labels.
 */
final class LabelDeclutter {

    /** A label's screen rectangle in pixels: left, top, width and height (≥ 0). */
    record Box(double xPx, double yPx, double widthPx, double heightPx) {

        /** Whether the two rectangles share interior area (touching edges do not overlap). */
        boolean overlaps(Box o) {
            return xPx < o.xPx + o.widthPx && o.xPx < xPx + widthPx
                    && yPx < o.yPx + o.heightPx && o.yPx < yPx + heightPx;
        }
    }

    private LabelDeclutter() {
    }

    /**
     * The indices of the labels to show, ascending: label i is kept unless it overlaps a label kept
     * before it; null entries (a node behind the camera, or not yet on screen) are skipped.
     */
    static List<Integer> keep(List<Box> labels) {
        List<Integer> kept = new ArrayList<>();
        List<Box> shown = new ArrayList<>();
        for (int i = 0; i < labels.size(); i++) {
            Box b = labels.get(i);
            if (b == null || shown.stream().anyMatch(b::overlaps)) {
                continue;
            }
            kept.add(i);
            shown.add(b);
        }
        return kept;
    }
}
