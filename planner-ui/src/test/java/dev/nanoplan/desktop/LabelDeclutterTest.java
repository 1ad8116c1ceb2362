package dev.nanoplan.desktop;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.simple.RandomSource;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

/**
 * The id-label rule of the 3D view: a label is skipped when it would overlap a label kept before
 * it. Checked on worked examples and, over seeded random labels, against the rule's definition with
 * an independent overlap test (intersection area > 0).
 */
class LabelDeclutterTest {

    @Test
    void labelsOnTopOfEachOtherShowOnlyTheFirst() {
        LabelDeclutter.Box a = new LabelDeclutter.Box(10, 10, 30, 12);
        // worked example: three labels at the same place, then one far away
        assertThat(LabelDeclutter.keep(List.of(a, a, a, new LabelDeclutter.Box(200, 10, 30, 12))))
                .containsExactly(0, 3);
    }

    @Test
    void labelsThatOnlyTouchAreBothShownAndHiddenOnesDoNotBlockOthers() {
        // worked example: b touches a's right edge (no shared area) and is kept; c overlaps a and is
        // skipped; d overlaps only c, which is not shown, so d is kept
        LabelDeclutter.Box a = new LabelDeclutter.Box(0, 0, 20, 10);
        LabelDeclutter.Box b = new LabelDeclutter.Box(20, 0, 20, 10);
        LabelDeclutter.Box c = new LabelDeclutter.Box(5, 5, 20, 10);
        LabelDeclutter.Box d = new LabelDeclutter.Box(10, 14, 20, 10);
        assertThat(LabelDeclutter.keep(Arrays.asList(a, null, b, c, d))).containsExactly(0, 2, 4);
    }

    @ParameterizedTest(name = "seed {0}")
    @ValueSource(longs = {1, 2, 3, 42, 2026})
    void keptLabelsNeverOverlapAndEverySkippedLabelOverlapsAnEarlierKeptOne(long seed) {
        UniformRandomProvider rng = RandomSource.SPLIT_MIX_64.create(seed);
        List<LabelDeclutter.Box> boxes = new ArrayList<>();
        for (int i = 0; i < 60; i++) {
            boxes.add(rng.nextInt(10) == 0 ? null
                    : new LabelDeclutter.Box(rng.nextDouble() * 400, rng.nextDouble() * 300,
                            10 + rng.nextDouble() * 40, 8 + rng.nextDouble() * 8));
        }
        List<Integer> kept = LabelDeclutter.keep(boxes);
        for (int i = 0; i < boxes.size(); i++) {
            LabelDeclutter.Box b = boxes.get(i);
            if (b == null) {
                assertThat(kept).doesNotContain(i);
                continue;
            }
            final int index = i;
            boolean blocked = kept.stream().filter(k -> k < index).anyMatch(k -> area(boxes.get(k), b) > 0);
            // the rule's definition: kept exactly when no earlier kept label shares area with it
            assertThat(kept.contains(i)).as("label %d", i).isEqualTo(!blocked);
        }
        for (int i : kept) {
            for (int j : kept) {
                // no two shown labels share area (independent test: intersection area)
                assertThat(i == j || area(boxes.get(i), boxes.get(j)) == 0).isTrue();
            }
        }
    }

    private static double area(LabelDeclutter.Box a, LabelDeclutter.Box b) {
        double w = Math.min(a.xPx() + a.widthPx(), b.xPx() + b.widthPx()) - Math.max(a.xPx(), b.xPx());
        double h = Math.min(a.yPx() + a.heightPx(), b.yPx() + b.heightPx()) - Math.max(a.yPx(), b.yPx());
        return Math.max(0, w) * Math.max(0, h);
    }
}
