package dev.nanoplan.detect;

import dev.nanoplan.count.CountPmf;
import java.util.Arrays;
import java.util.List;

/**
 * Several count pmfs laid on one dense window of counts, with prefix and suffix sums.
 *
 * <p>Convention for truncated mass: a pmf's {@link CountPmf#massBelow()} is placed at count
 * {@code offset − 1} (at {@code offset} when the offset is 0) and its
 * {@link CountPmf#massAbove()} at {@code last + 1}, i.e. immediately outside the stored
 * window, where the bulk of a unimodal tail lies. Error probabilities computed from the window
 * are therefore exact whenever the threshold is not inside a truncated tail, and otherwise off
 * by at most that pmf's truncated mass. Each pmf is renormalised by its total (window plus
 * truncated mass), which must be within 1e-6 of 1.
 *
 * <p>Index k of the window is count {@code first + k}; threshold position t ∈ [0, size]
 * means τ = first + t, prefix[t] = P(Y &lt; τ), suffix[t] = P(Y ≥ τ), both summed from their
 * own end so that small tails keep full relative precision.
 */
final class CountWindow {

    /** Largest dense window accepted (counts). */
    static final int MAX_SPAN = 1 << 26;

    final long first;
    final int size;
    final double[][] mass;
    final double[][] prefix;
    final double[][] suffix;

    /**
     * @param from per level, the first index that may hold mass
     * @param to   per level, one past the last index that may hold mass
     */
    private CountWindow(long first, double[][] mass, int[] from, int[] to) {
        this.first = first;
        this.mass = mass;
        this.size = mass[0].length;
        int levels = mass.length;
        prefix = new double[levels][size + 1];
        suffix = new double[levels][size + 1];
        for (int i = 0; i < levels; i++) {
            double[] m = mass[i];
            double[] p = prefix[i];
            double[] s = suffix[i];
            // sums run over the level's own cells only; outside them they are constant (adding
            // the zero masses there would not change a bit), which matters when the union
            // window is much wider than one level's window
            // the prefix (forward) and suffix (backward) sums are two independent chains of
            // additions: one loop runs both, so the processor overlaps their latencies; each chain
            // adds the same terms in the same order as a loop of its own (same bits)
            int lo = from[i];
            int hi = to[i];
            double up = p[lo];
            double down = s[hi];
            for (int j = 0, n = hi - lo; j < n; j++) {
                int k = lo + j;
                up += m[k];
                p[k + 1] = up;
                int r = hi - 1 - j;
                down += m[r];
                s[r] = down;
            }
            Arrays.fill(p, hi + 1, size + 1, p[hi]);
            Arrays.fill(s, 0, lo, s[lo]);
        }
    }

    static CountWindow of(List<CountPmf> pmfs) {
        if (pmfs == null || pmfs.isEmpty()) {
            throw new IllegalArgumentException("at least one count pmf is required");
        }
        long lo = Long.MAX_VALUE;
        long hi = Long.MIN_VALUE;
        for (int i = 0; i < pmfs.size(); i++) {
            CountPmf p = pmfs.get(i);
            if (p == null) {
                throw new IllegalArgumentException("count pmf " + i + " must not be null");
            }
            lo = Math.min(lo, lowest(p));
            hi = Math.max(hi, highest(p));
        }
        if (hi - lo + 1 > MAX_SPAN) {
            throw new IllegalArgumentException("the union of the count windows spans "
                    + (hi - lo + 1) + " counts, more than " + MAX_SPAN);
        }
        int size = (int) (hi - lo + 1);
        double[][] mass = new double[pmfs.size()][size];
        int[] from = new int[pmfs.size()];
        int[] to = new int[pmfs.size()];
        for (int i = 0; i < pmfs.size(); i++) {
            CountPmf p = pmfs.get(i);
            double[] m = mass[i];
            int base = (int) (p.offset() - lo);
            double total = p.massBelow() + p.massAbove();
            for (int k = 0; k < p.length(); k++) {
                double v = p.massAt(k);
                if (!(v >= 0) || v == Double.POSITIVE_INFINITY) {
                    throw new IllegalArgumentException(
                            "count pmf " + i + " has a mass that is not finite and >= 0: " + v);
                }
                m[base + k] = v;
                total += v;
            }
            from[i] = (int) (lowest(p) - lo);
            to[i] = (int) (highest(p) - lo) + 1;
            m[from[i]] += p.massBelow();
            m[to[i] - 1] += p.massAbove();
            if (!(Math.abs(total - 1) <= 1e-6)) {
                throw new IllegalArgumentException("count pmf " + i
                        + " (window plus truncated mass) must sum to 1, sums to " + total);
            }
            if (total != 1) {
                double inv = 1 / total;
                for (int k = from[i]; k < to[i]; k++) {
                    m[k] *= inv;
                }
            }
        }
        return new CountWindow(lo, mass, from, to);
    }

    private static long lowest(CountPmf p) {
        return p.massBelow() > 0 && p.offset() > 0 ? p.offset() - 1 : p.offset();
    }

    private static long highest(CountPmf p) {
        return p.massAbove() > 0 ? p.last() + 1 : p.last();
    }

    /** P(from ≤ index &lt; to) for a level, from whichever of prefix/suffix is smaller there. */
    double cellMass(int level, int from, int to) {
        double[] p = prefix[level];
        double v = p[to] <= 0.5 ? p[to] - p[from] : suffix[level][from] - suffix[level][to];
        return v > 0 ? v : 0;
    }
}
