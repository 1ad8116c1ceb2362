package dev.nanoplan.desktop;

import dev.nanoplan.count.CountPmf;
import dev.nanoplan.network.LinkEvaluation;
import dev.nanoplan.network.LinkEvaluator;
import dev.nanoplan.network.LinkSpec;
import dev.nanoplan.plan.LinkReport;
import dev.nanoplan.plan.SlotSchedule;
import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.Scenario;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Objects;

/**
 * Chart data of one link, obtained from planner-core's {@link LinkEvaluator} for the link's taps
 * as an isolated link (the plan's crosstalk is not included, so counts and error can be lower than
 * the plan's). The UI only reshapes the core's numbers into points.
 *
 * @param link             the plan's link
 * @param taps             p_0..p_L
 * @param countCurves      per level: (count, probability) points, at most {@value #MAX_POINTS}
 * @param threshold        detection threshold τ of the isolated link (MI-optimal at the prior), −1 if
 *                         more than two levels
 * @param miByThreshold    (τ, bits) points; empty for more than two levels
 * @param errorByMolecules (molecules per "1", log10 minimum error) points
 * @param targetLog10Error log10 of the scenario's error target
 */
public record LinkDetails(LinkReport link, double[] taps, List<List<double[]>> countCurves, long threshold,
        List<double[]> miByThreshold, List<double[]> errorByMolecules, double targetLog10Error) {

    /** Most points per curve. */
    public static final int MAX_POINTS = 400;

    /** Multiples of the node's molecules per symbol on the budget curve. */
    static final double[] MOLECULE_FACTORS = {0.125, 0.25, 0.5, 1, 2, 4, 8};

    /** Computes the chart data (tens of milliseconds to seconds: call off the FX thread). */
    public static LinkDetails compute(Scenario s, LinkReport l) {
        Node emitter = s.nodesById().get(l.from());
        long n = Math.max(1, emitter == null ? 1 : emitter.moleculesPerSymbol());
        double t = s.signalling().symbolTimeS();
        double bg = s.medium().backgroundMoleculesPerS() * t;
        int levels = s.signalling().levels();
        // the own leftovers the receiver counts: every K-th lag under round-robin (K = 1 under all-active)
        double[] own = SlotSchedule.ownTaps(l.taps(),
                SlotSchedule.of(s).frameSlots(l.species()));
        LinkEvaluation ev = LinkEvaluator.evaluate(spec(own, levels, n, s, bg));
        List<List<double[]>> curves = new ArrayList<>();
        for (CountPmf p : ev.givenLevel()) {
            curves.add(points(p));
        }
        List<double[]> mi = new ArrayList<>();
        long tau = -1;
        if (ev.binary() != null) {
            tau = ev.binary().miThreshold();
            double[] m = ev.binary().miBitsByThreshold();
            int step = Math.max(1, m.length / MAX_POINTS);
            for (int i = 0; i < m.length; i += step) {
                mi.add(new double[] {ev.binary().firstThreshold() + i, m[i]});
            }
        }
        List<double[]> err = new ArrayList<>();
        for (double f : MOLECULE_FACTORS) {
            long m = Math.max(levels - 1, Math.round(n * f));
            LinkEvaluation e = f == 1 ? ev : LinkEvaluator.evaluate(spec(own, levels, m, s, bg));
            if (Double.isFinite(e.log10ErrorProbability())) {
                err.add(new double[] {m, e.log10ErrorProbability()});
            }
        }
        return new LinkDetails(l, l.taps(), curves, tau, mi, err, Math.log10(s.targets().maxErrorProbability()));
    }

    private static LinkSpec spec(double[] taps, int levels, long n, Scenario s, double bg) {
        long[] lm = levels == 2 ? new long[] {0, n} : LinkSpec.evenLevels(levels, n);
        return new LinkSpec(taps, lm, s.signalling().priorOne(), bg, s.signalling().countModel(),
                s.signalling().symbolTimeS());
    }

    private static List<double[]> points(CountPmf p) {
        List<double[]> pts = new ArrayList<>();
        int len = p.length();
        int step = Math.max(1, (len + MAX_POINTS - 1) / MAX_POINTS);
        for (int i = 0; i < len; i += step) {
            double mass = 0;
            for (int j = i; j < Math.min(len, i + step); j++) {
                mass += p.massAt(j);
            }
            pts.add(new double[] {p.offset() + i, mass / step});
        }
        return pts;
    }

    @Override
    public boolean equals(Object o) {
        // every component, arrays (also those inside the point lists) by content
        return o instanceof LinkDetails other
                && Objects.equals(link, other.link)
                && Arrays.equals(taps, other.taps)
                && Arrays.deepEquals(nested(countCurves), nested(other.countCurves))
                && threshold == other.threshold
                && Arrays.deepEquals(miByThreshold.toArray(), other.miByThreshold.toArray())
                && Arrays.deepEquals(errorByMolecules.toArray(), other.errorByMolecules.toArray())
                && Double.compare(targetLog10Error, other.targetLog10Error) == 0;
    }

    @Override
    public int hashCode() {
        int h = Objects.hash(link, threshold, targetLog10Error);
        h = 31 * h + Arrays.hashCode(taps);
        h = 31 * h + Arrays.deepHashCode(nested(countCurves));
        h = 31 * h + Arrays.deepHashCode(miByThreshold.toArray());
        h = 31 * h + Arrays.deepHashCode(errorByMolecules.toArray());
        return h;
    }

    /** The curves as nested arrays, so that {@link Arrays#deepEquals} reaches the points. */
    private static Object[][] nested(List<List<double[]>> curves) {
        return curves.stream().map(List::toArray).toArray(Object[][]::new);
    }
}
