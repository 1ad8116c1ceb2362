package dev.nanoplan.design;

import java.util.ArrayList;
import java.util.List;

/**
 * A finished sweep: its fields, its points in grid order (first field slowest) and which points are on
 * the Pareto front over (demands meeting targets ↑, smallest shared rate ↑, molecules per second ↓).
 * A point is on the front when no other point is at least as good in all three and better in one
 * (Pareto dominance; e.g. Deb, Multi-Objective Optimization Using Evolutionary Algorithms, 2001, §2.4).
 *
 * @param fields the swept paths, first slowest
 * @param points the points in grid order
 * @param pareto entry i true when point i is on the front
 */
public record SweepResult(List<String> fields, List<SweepPoint> points, List<Boolean> pareto) {

    public SweepResult {
        fields = List.copyOf(fields);
        points = List.copyOf(points);
        pareto = List.copyOf(pareto);
    }

    /** The result of {@code points}, with the front marked. */
    public static SweepResult of(List<String> fields, List<SweepPoint> points) {
        return new SweepResult(fields, points, paretoMarks(points));
    }

    /** Entry i true when no point dominates point i (class comment). */
    public static List<Boolean> paretoMarks(List<SweepPoint> points) {
        List<Boolean> out = new ArrayList<>();
        for (SweepPoint p : points) {
            boolean dominated = false;
            for (SweepPoint q : points) {
                if (dominates(q, p)) {
                    dominated = true;
                    break;
                }
            }
            out.add(!dominated);
        }
        return out;
    }

    /** True when {@code a} is at least as good as {@code b} in every objective and better in one. */
    public static boolean dominates(SweepPoint a, SweepPoint b) {
        boolean noWorse = a.demandsMeetingTargets() >= b.demandsMeetingTargets()
                && a.minSharedRateBitsPerS() >= b.minSharedRateBitsPerS() && a.moleculesPerS() <= b.moleculesPerS();
        boolean better = a.demandsMeetingTargets() > b.demandsMeetingTargets()
                || a.minSharedRateBitsPerS() > b.minSharedRateBitsPerS() || a.moleculesPerS() < b.moleculesPerS();
        return noWorse && better;
    }

    /** Index of the best point by {@link Objective}'s order (the first of equals); -1 when empty. */
    public int best() {
        int best = -1;
        for (int i = 0; i < points.size(); i++) {
            if (best < 0 || points.get(i).objective().compareTo(points.get(best).objective()) > 0) {
                best = i;
            }
        }
        return best;
    }
}
