package dev.nanoplan.design;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.ArrayList;
import java.util.List;
import java.util.stream.LongStream;
import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.simple.RandomSource;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;

/** Pareto marks against the definition of Pareto dominance, checked by brute force. */
class SweepResultTest {

    static LongStream seeds() {
        return LongStream.rangeClosed(1, 20);
    }

    /**
     * Random points on coarse grids (so that ties are frequent); oracle: Pareto optimality by its
     * definition (Deb 2001, §2.4: no other point is at least as good in every objective and better in one),
     * written out here objective by objective, plus the front's defining property that every point off
     * the front is dominated by some point on it.
     */
    @ParameterizedTest
    @MethodSource("seeds")
    void marksAreExactlyTheNonDominatedPoints(long seed) {
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(seed);
        int n = 1 + rng.nextInt(40);
        List<SweepPoint> pts = new ArrayList<>();
        for (int i = 0; i < n; i++) {
            pts.add(point(rng.nextInt(4), rng.nextInt(5) * 0.25, 100 * (1 + rng.nextInt(5))));
        }
        List<Boolean> marks = SweepResult.paretoMarks(pts);
        for (int i = 0; i < n; i++) {
            SweepPoint p = pts.get(i);
            boolean beaten = false;
            for (SweepPoint q : pts) {
                int d = Integer.compare(q.demandsMeetingTargets(), p.demandsMeetingTargets());
                int r = Double.compare(q.minSharedRateBitsPerS(), p.minSharedRateBitsPerS());
                int m = Double.compare(p.moleculesPerS(), q.moleculesPerS()); // fewer molecules is better
                if (d >= 0 && r >= 0 && m >= 0 && (d > 0 || r > 0 || m > 0)) {
                    beaten = true;
                }
            }
            assertThat(marks.get(i)).as("point %d of seed %d", i, seed).isEqualTo(!beaten);
            if (beaten) {
                boolean byFront = false;
                for (int j = 0; j < n; j++) {
                    byFront |= marks.get(j) && SweepResult.dominates(pts.get(j), p);
                }
                assertThat(byFront).isTrue();
            }
        }
        assertThat(marks).contains(true);
    }

    @Test
    void aHandWorkedFront() {
        // worked by hand: b beats a (more demands, same rest); c trades rate for molecules; d equals c (both stay)
        List<SweepPoint> pts = List.of(point(1, 0.5, 100), point(2, 0.5, 100), point(2, 0.2, 50), point(2, 0.2, 50),
                point(0, 0.1, 500));
        assertThat(SweepResult.paretoMarks(pts)).containsExactly(false, true, true, true, false);
        assertThat(SweepResult.of(List.of("x"), pts).best()).isEqualTo(1);
    }

    private static SweepPoint point(int demands, double rate, double molecules) {
        return new SweepPoint(List.of(0.0), demands, rate, rate, molecules, 1.0);
    }
}
