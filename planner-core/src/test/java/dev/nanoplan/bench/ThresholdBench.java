package dev.nanoplan.bench;

import dev.nanoplan.count.CountPmf;
import dev.nanoplan.detect.BinaryDetection;
import dev.nanoplan.detect.BinaryThresholdSearch;
import dev.nanoplan.info.BinaryCapacity;
import dev.nanoplan.info.BinaryChannel;
import java.util.concurrent.TimeUnit;
import org.apache.commons.statistics.distribution.BinomialDistribution;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Param;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.Warmup;

/**
 * Binary threshold search at N = 1e5 molecules: {@link BinaryThresholdSearch} (prefix/suffix
 * sums, O(window)) against the naive exhaustive search that calls the library CDF and survival
 * function (Commons Statistics 1.2 {@link BinomialDistribution}) for every threshold and then
 * evaluates the same figures (mutual information at the prior, error probability and BAC
 * capacity) per threshold.
 *
 * <p>Windows: {@code full} = the whole support [0, N]; {@code trimmed} = counts where either
 * pmf exceeds 1e-300 around the two means (what a count model would keep).
 *
 * <p>Run: {@code java -cp <test-classes:classes:deps> org.openjdk.jmh.Main ThresholdBench}.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Warmup(iterations = 2, time = 1)
@Measurement(iterations = 3, time = 1)
@Fork(1)
public class ThresholdBench {

    private static final int N = 100_000;

    @Param({"full", "trimmed"})
    public String window;

    private BinomialDistribution d0;
    private BinomialDistribution d1;
    private CountPmf pmf0;
    private CountPmf pmf1;
    private long first;
    private long last;

    @Setup
    public void setUp() {
        d0 = BinomialDistribution.of(N, 0.010);
        d1 = BinomialDistribution.of(N, 0.0112);
        int lo = 0;
        int hi = N;
        if (window.equals("trimmed")) {
            lo = d0.inverseCumulativeProbability(1e-300);
            hi = d1.inverseSurvivalProbability(1e-300);
        }
        pmf0 = window(d0, lo, hi);
        pmf1 = window(d1, lo, hi);
        first = lo;
        last = hi + 1;
    }

    private static CountPmf window(BinomialDistribution d, int lo, int hi) {
        double[] m = new double[hi - lo + 1];
        for (int k = lo; k <= hi; k++) {
            m[k - lo] = d.probability(k);
        }
        return new CountPmf(lo, m, lo > 0 ? d.cumulativeProbability(lo - 1) : 0, d.survivalProbability(hi));
    }

    @Benchmark
    public BinaryDetection fastSearch() {
        return BinaryThresholdSearch.search(pmf0, pmf1, 0.5);
    }

    @Benchmark
    public double exhaustiveLibraryCdf() {
        double q = 0.5;
        double bestMi = -1;
        double bestErr = 2;
        double bestCap = -1;
        long tMi = 0;
        long tErr = 0;
        long tCap = 0;
        for (long t = first; t <= last; t++) {
            int k = (int) (t - 1);
            double e0 = d0.survivalProbability(k);
            double c0 = d0.cumulativeProbability(k);
            double e1 = d1.cumulativeProbability(k);
            double c1 = d1.survivalProbability(k);
            double mi = BinaryChannel.mutualInformationBits(q, e0, c0, e1, c1);
            double err = (1 - q) * e0 + q * e1;
            BinaryCapacity c = BinaryChannel.capacity(e0, c0, e1, c1);
            if (mi > bestMi) {
                bestMi = mi;
                tMi = t;
            }
            if (err < bestErr) {
                bestErr = err;
                tErr = t;
            }
            if (c.bits() > bestCap) {
                bestCap = c.bits();
                tCap = t;
            }
        }
        return bestMi + bestErr + bestCap + tMi + tErr + tCap;
    }
}
