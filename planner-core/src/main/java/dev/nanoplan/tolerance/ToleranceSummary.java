package dev.nanoplan.tolerance;

import dev.nanoplan.geometry.Vec3;
import dev.nanoplan.plan.LinkReport;
import dev.nanoplan.plan.RouteReport;
import dev.nanoplan.scenario.Node;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.Comparator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.apache.commons.math3.stat.descriptive.rank.Percentile;

/**
 * Combines a study's samples, fed in index order, into yields, percentiles, drivers and weak links.
 *
 * <p><b>Yields</b>: the fraction of samples meeting the target, with the Wilson 95 % interval
 * ({@link WilsonInterval}). <b>Percentiles</b> of each link's mutual information: Commons Math
 * {@code Percentile} (its default estimator).
 *
 * <p><b>Drivers</b> of a link: the share of the variance of its log10 error explained by each
 * tolerance. The tolerance's scalar input is its draw z, except for a position, whose three axes are
 * projected on the direction from the node to the link's other end (for the link's own nodes) or to its
 * receiver (for interferers): the component that changes the distance. With at least
 * {@value #SOBOL_MIN_SAMPLES} samples the first-order Sobol' index S_i = V[E(Y | X_i)] / V(Y) (the
 * definition in A. Saltelli et al., Comput. Phys. Commun. 181, 2010) is estimated from the given samples
 * by partitioning X_i into √N classes of equal count and taking the variance of the class means over
 * the total variance (biased up by about (classes − 1)/N; not the pick-freeze design, which would need
 * N·(k + 2) plans); with fewer samples the standardised regression coefficient squared, which for
 * independent inputs is the squared Pearson correlation of X_i and Y (A. Saltelli et al., Global
 * Sensitivity Analysis: The Primer, Wiley 2008, ch. 1). Not thread-safe; the result is identical for
 * identical samples in the same order whatever produced them.
 */
public final class ToleranceSummary {

    /** Yield below which a link is weak, and that its guard band aims for. */
    public static final double WEAK_YIELD = 0.95;
    /** Fewest samples for the first-order Sobol' estimate (else SRC). */
    public static final int SOBOL_MIN_SAMPLES = 256;
    /** Drivers reported per link. */
    public static final int DRIVERS = 3;

    private final ToleranceStudy study;
    private final List<ToleranceSample> samples = new ArrayList<>();

    public ToleranceSummary(ToleranceStudy study) {
        this.study = study;
    }

    /**
     * Adds the next sample.
     *
     * @throws IllegalArgumentException if it is not the sample after the previous one
     */
    public void add(ToleranceSample s) {
        int expected = samples.isEmpty() ? 0 : samples.get(samples.size() - 1).index() + 1;
        if (s.index() != expected) {
            throw new IllegalArgumentException("samples must be added in index order: expected " + expected + ", got "
                    + s.index());
        }
        samples.add(s);
    }

    /** Samples added so far. */
    public int size() {
        return samples.size();
    }

    /**
     * The summary of the samples added (no guard bands; see {@link GuardBand}).
     *
     * @throws IllegalStateException if no sample was added
     */
    public ToleranceResult result(boolean partial) {
        int n = samples.size();
        if (n == 0) {
            throw new IllegalStateException("no sample finished");
        }
        double target = study.nominal().targets().maxErrorProbability();
        List<LinkReport> links = study.links();
        List<ToleranceResult.LinkYield> linkYields = new ArrayList<>();
        boolean sobol = n >= SOBOL_MIN_SAMPLES;
        for (int l = 0; l < links.size(); l++) {
            int ok = 0;
            double[] bits = new double[n];
            double[] y = new double[n];
            for (int i = 0; i < n; i++) {
                ToleranceSample s = samples.get(i);
                ok += s.linkError()[l] <= target ? 1 : 0;
                bits[i] = s.linkBits()[l];
                y[i] = Math.log10(Math.max(s.linkError()[l], 1e-300));
            }
            Percentile pct = new Percentile();
            pct.setData(bits);
            List<Double> bitList = new ArrayList<>(n);
            for (double b : bits) {
                bitList.add(b);
            }
            linkYields.add(new ToleranceResult.LinkYield(links.get(l).from(), links.get(l).to(), ok / (double) n,
                    list(WilsonInterval.of95(ok, n)), pct.evaluate(5), pct.evaluate(50), pct.evaluate(95),
                    drivers(links.get(l), y, sobol), null, bitList));
        }
        List<RouteReport> routes = study.demands();
        List<ToleranceResult.DemandYield> demands = new ArrayList<>();
        int layoutOk = 0;
        long redraws = 0;
        int[] demandOk = new int[routes.size()];
        for (ToleranceSample s : samples) {
            boolean all = true;
            for (int d = 0; d < routes.size(); d++) {
                demandOk[d] += s.demandMeets()[d] ? 1 : 0;
                all &= s.demandMeets()[d];
            }
            layoutOk += all ? 1 : 0;
            redraws += s.redraws();
        }
        for (int d = 0; d < routes.size(); d++) {
            demands.add(new ToleranceResult.DemandYield(routes.get(d).from(), routes.get(d).to(),
                    demandOk[d] / (double) n, list(WilsonInterval.of95(demandOk[d], n))));
        }
        List<Integer> weak = new ArrayList<>();
        for (int l = 0; l < linkYields.size(); l++) {
            if (linkYields.get(l).yield() < WEAK_YIELD) {
                weak.add(l);
            }
        }
        // likeliest failure first; equal yields: the larger nominal error first, then the plan's order
        weak.sort(Comparator.comparingDouble((Integer l) -> linkYields.get(l).yield())
                .thenComparing(l -> -links.get(l).minErrorProbability()));
        return new ToleranceResult(n, study.seed(), study.sampler(), study.thresholds(), redraws, partial,
                layoutOk / (double) n, list(WilsonInterval.of95(layoutOk, n)), linkYields, demands, weak,
                sobol ? "sobol_first_order" : "src");
    }

    private List<ToleranceResult.Driver> drivers(LinkReport link, double[] y, boolean sobol) {
        Map<String, double[]> inputs = new LinkedHashMap<>();
        Map<String, Node> nodes = study.nominal().nodesById();
        List<ToleranceFactor> factors = study.factors();
        int n = y.length;
        for (int j = 0; j < factors.size(); j++) {
            ToleranceFactor f = factors.get(j);
            double weight = 1;
            if (f.kind() == ToleranceFactor.Kind.POSITION) {
                Vec3 at = nodes.get(f.subject()).positionUm();
                String other = f.subject().equals(link.to()) ? link.from() : link.to();
                Vec3 d = nodes.get(other).positionUm().minus(at);
                double norm = d.norm();
                weight = norm > 0 ? d.toArray()[f.axis()] / norm : 0;
            }
            double[] x = inputs.computeIfAbsent(f.tolerance(), k -> new double[n]);
            for (int i = 0; i < n; i++) {
                x[i] += weight * samples.get(i).z()[j];
            }
        }
        List<ToleranceResult.Driver> out = new ArrayList<>();
        for (Map.Entry<String, double[]> e : inputs.entrySet()) {
            double s = sobol ? firstOrder(e.getValue(), y) : squaredCorrelation(e.getValue(), y);
            if (s > 0) {
                out.add(new ToleranceResult.Driver(e.getKey(), s));
            }
        }
        out.sort(Comparator.comparingDouble(ToleranceResult.Driver::index).reversed());
        return out.subList(0, Math.min(DRIVERS, out.size()));
    }

    /** V[E(Y | X)] / V(Y) by √N equal-count classes of X; 0 when Y does not vary. */
    static double firstOrder(double[] x, double[] y) {
        int n = x.length;
        double mean = Arrays.stream(y).average().orElse(0);
        double total = 0;
        for (double v : y) {
            total += (v - mean) * (v - mean);
        }
        if (!(total > 0)) {
            return 0;
        }
        Integer[] order = new Integer[n];
        for (int i = 0; i < n; i++) {
            order[i] = i;
        }
        Arrays.sort(order, Comparator.comparingDouble(i -> x[i]));
        int classes = Math.max(1, (int) Math.sqrt(n));
        double between = 0;
        for (int c = 0; c < classes; c++) {
            int lo = (int) ((long) c * n / classes);
            int hi = (int) ((long) (c + 1) * n / classes);
            double m = 0;
            for (int k = lo; k < hi; k++) {
                m += y[order[k]];
            }
            m /= Math.max(1, hi - lo);
            between += (hi - lo) * (m - mean) * (m - mean);
        }
        return Math.min(1, between / total);
    }

    /** Squared Pearson correlation; 0 when either does not vary. */
    static double squaredCorrelation(double[] x, double[] y) {
        int n = x.length;
        double mx = Arrays.stream(x).average().orElse(0);
        double my = Arrays.stream(y).average().orElse(0);
        double sxy = 0;
        double sxx = 0;
        double syy = 0;
        for (int i = 0; i < n; i++) {
            sxy += (x[i] - mx) * (y[i] - my);
            sxx += (x[i] - mx) * (x[i] - mx);
            syy += (y[i] - my) * (y[i] - my);
        }
        return sxx > 0 && syy > 0 ? sxy * sxy / (sxx * syy) : 0;
    }

    private static List<Double> list(double[] v) {
        return List.of(v[0], v[1]);
    }
}
