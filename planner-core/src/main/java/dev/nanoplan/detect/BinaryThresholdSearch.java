package dev.nanoplan.detect;

import dev.nanoplan.count.CountPmf;
import dev.nanoplan.info.BinaryCapacity;
import dev.nanoplan.info.BinaryChannel;
import dev.nanoplan.info.Entropy;
import java.util.Arrays;
import java.util.List;

/**
 * Exhaustive search of the integer threshold τ of a binary count detector (decide 1 iff
 * Y ≥ τ), for every τ at once.
 *
 * <p>For τ over the union of the two count windows, including the two trivial ends
 * (always 1, always 0), the crossovers ε₀(τ) = P(Y ≥ τ | 0) and ε₁(τ) = P(Y &lt; τ | 1) and
 * their complements come from prefix sums (lower tails) and suffix sums (upper tails), each
 * summed from its own end so tiny tails are not lost to 1 − x cancellation. Truncated masses
 * recorded in the pmfs are placed immediately outside their windows (see the package-private
 * {@code CountWindow}); if a threshold falls inside a truncated tail the error is at most that
 * truncated mass.
 *
 * <p>Per τ it evaluates the mutual information of the induced binary asymmetric channel at the
 * given prior and the error probability (1−q)ε₀ + qε₁ (both returned as curves), and the BAC
 * capacity (max over the prior, {@link BinaryChannel#capacity(double, double, double, double)},
 * Silverman 1955). The capacity is skipped where it provably cannot win: a binary-input channel
 * whose two rows are at total-variation distance Δ = |1 − ε₀ − ε₁| is a degraded binary erasure
 * channel with erasure probability 1 − Δ, so its capacity is at most Δ bits (data-processing
 * inequality, T. M. Cover and J. A. Thomas, <i>Elements of Information Theory</i>, 2nd ed.,
 * 2006, Theorem 2.8.1), and where the divergence bound max_x D(W_x ‖ r) (any output
 * distribution r bounds the capacity from above; Arimoto 1972) is below the best capacity so
 * far. Ties go to the smallest τ.
 *
 * <p>Complexity O(K) time and memory for a union window of K counts (a few logarithms per
 * threshold for the mutual information; the capacity only near the best thresholds).
 */
public final class BinaryThresholdSearch {

    private BinaryThresholdSearch() {
    }

    /**
     * @param given0 count pmf when a 0 is sent
     * @param given1 count pmf when a 1 is sent
     * @param priorOne P(X = 1) in [0, 1] for the mutual-information and error curves
     * @return best thresholds, their figures of merit and the curves
     * @throws IllegalArgumentException if a pmf is null or does not sum to 1 within 1e-6, or
     *     priorOne is outside [0, 1]
     */
    public static BinaryDetection search(CountPmf given0, CountPmf given1, double priorOne) {
        return search(given0, given1, priorOne, true);
    }

    /**
     * As {@link #search(CountPmf, CountPmf, double)} (same thresholds, same figures of merit, same
     * error curve), but the mutual information is evaluated only where it can reach the maximum:
     * at prior q a threshold whose rows are at total-variation distance Δ has mutual information
     * at most Δ·h(q) (degraded binary erasure channel, Cover and Thomas 2006, Theorem 2.8.1, see
     * the class comment), so once the mutual information at the largest Δ is known, only the
     * thresholds with Δ·h(q) + 1e-12 at least that value are evaluated (the margin covers
     * rounding). {@link BinaryDetection#miBitsByThreshold()} holds NaN at the thresholds not
     * evaluated. For callers that read only the best values (the network planner); the logarithms
     * over the whole union window are the cost this saves.
     */
    public static BinaryDetection searchBest(CountPmf given0, CountPmf given1, double priorOne) {
        return search(given0, given1, priorOne, false);
    }

    private static BinaryDetection search(CountPmf given0, CountPmf given1, double priorOne, boolean curve) {
        if (!(priorOne >= 0 && priorOne <= 1)) {
            throw new IllegalArgumentException("priorOne must be in [0, 1], got " + priorOne);
        }
        CountWindow w = CountWindow.of(List.of(given0, given1));
        int n = w.size + 1;
        double[] p0 = w.prefix[0];
        double[] s0 = w.suffix[0];
        double[] p1 = w.prefix[1];
        double[] s1 = w.suffix[1];
        double q = priorOne;
        double[] mi = curve ? runCompressedMutualInformation(q, s0, p0, p1, s1) : null;
        double[] err = new double[n];
        int bestMi = 0;
        int bestErr = 0;
        int bestDelta = 0;
        double maxDelta = -1;
        for (int t = 0; t < n; t++) {
            double e0 = s0[t];
            double c0 = p0[t];
            double e1 = p1[t];
            double c1 = s1[t];
            err[t] = Math.min(1, (1 - q) * e0 + q * e1);
            if (curve && mi[t] > mi[bestMi]) {
                bestMi = t;
            }
            if (err[t] < err[bestErr]) {
                bestErr = t;
            }
            double delta = delta(e0, c0, e1, c1);
            if (delta > maxDelta) {
                maxDelta = delta;
                bestDelta = t;
            }
        }
        if (!curve) {
            mi = boundedMutualInformation(q, s0, p0, p1, s1, bestDelta);
            bestMi = -1;
            for (int t = 0; t < n; t++) {
                if (!Double.isNaN(mi[t]) && (bestMi < 0 || mi[t] > mi[bestMi])) {
                    bestMi = t;
                }
            }
        }
        int bestCap = bestDelta;
        BinaryCapacity cap = BinaryChannel.capacity(s0[bestCap], p0[bestCap], p1[bestCap], s1[bestCap]);
        for (int t = 0; t < n; t++) {
            // thresholds in a gap between the windows see the very same channel: same capacity,
            // and ties keep the smallest τ, so only the first of a run needs evaluating
            if (t > 0 && s0[t] == s0[t - 1] && p0[t] == p0[t - 1] && p1[t] == p1[t - 1] && s1[t] == s1[t - 1]) {
                continue;
            }
            if (t == bestDelta || delta(s0[t], p0[t], p1[t], s1[t]) < cap.bits() - 1e-15
                    || divergenceBoundBits(cap.priorOne(), s0[t], p0[t], p1[t], s1[t])
                            < cap.bits() - 1e-12) {
                continue;
            }
            BinaryCapacity c = BinaryChannel.capacity(s0[t], p0[t], p1[t], s1[t]);
            if (c.bits() > cap.bits() || (c.bits() == cap.bits() && t < bestCap)) {
                cap = c;
                bestCap = t;
            }
        }
        return new BinaryDetection(w.first + bestMi, mi[bestMi], w.first + bestErr, err[bestErr],
                w.first + bestCap, cap.bits(), cap.priorOne(), Math.min(1, s0[bestCap]),
                Math.min(1, p1[bestCap]), w.first, mi, err);
    }

    /**
     * The mutual-information curve, evaluated once per run of thresholds that see the same
     * channel (a gap between the two windows is one run) and copied along the run: the logs are
     * the cost of the search, and a wide gap would otherwise dominate it.
     */
    private static double[] runCompressedMutualInformation(double q, double[] s0, double[] p0, double[] p1,
            double[] s1) {
        int n = s0.length;
        int[] runOf = new int[n];
        int runs = 0;
        for (int t = 0; t < n; t++) {
            if (t == 0 || s0[t] != s0[t - 1] || p0[t] != p0[t - 1] || p1[t] != p1[t - 1] || s1[t] != s1[t - 1]) {
                runs++;
            }
            runOf[t] = runs - 1;
        }
        if (runs == n) {
            return BinaryChannel.mutualInformationBits(q, s0, p0, p1, s1);
        }
        double[] a = new double[runs];
        double[] b = new double[runs];
        double[] c = new double[runs];
        double[] d = new double[runs];
        for (int t = 0; t < n; t++) {
            int r = runOf[t];
            a[r] = s0[t];
            b[r] = p0[t];
            c[r] = p1[t];
            d[r] = s1[t];
        }
        double[] compressed = BinaryChannel.mutualInformationBits(q, a, b, c, d);
        double[] mi = new double[n];
        for (int t = 0; t < n; t++) {
            mi[t] = compressed[runOf[t]];
        }
        return mi;
    }

    /**
     * The mutual-information curve at the thresholds that can reach its maximum, NaN elsewhere
     * (see {@link #searchBest}); values are those of {@link #runCompressedMutualInformation}
     * (the same batch evaluation, at the first threshold of each run of equal channels).
     */
    private static double[] boundedMutualInformation(double q, double[] s0, double[] p0, double[] p1, double[] s1,
            int bestDelta) {
        int n = s0.length;
        double[] mi = new double[n];
        Arrays.fill(mi, Double.NaN);
        double atBest = BinaryChannel.mutualInformationBits(q, new double[] {s0[bestDelta]},
                new double[] {p0[bestDelta]}, new double[] {p1[bestDelta]}, new double[] {s1[bestDelta]})[0];
        double hq = Entropy.binaryBits(q);
        int[] at = new int[n];
        int count = 0;
        for (int t = 0; t < n; t++) {
            if (t > 0 && s0[t] == s0[t - 1] && p0[t] == p0[t - 1] && p1[t] == p1[t - 1] && s1[t] == s1[t - 1]) {
                continue;
            }
            if (delta(s0[t], p0[t], p1[t], s1[t]) * hq + 1e-12 >= atBest) {
                at[count++] = t;
            }
        }
        double[] a = new double[count];
        double[] b = new double[count];
        double[] c = new double[count];
        double[] d = new double[count];
        for (int i = 0; i < count; i++) {
            a[i] = s0[at[i]];
            b[i] = p0[at[i]];
            c[i] = p1[at[i]];
            d[i] = s1[at[i]];
        }
        double[] v = BinaryChannel.mutualInformationBits(q, a, b, c, d);
        for (int i = 0; i < count; i++) {
            mi[at[i]] = v[i];
        }
        return mi;
    }

    /**
     * Upper bound max_x D(W_x ‖ r) on the capacity of the binary channel (bits), with r the
     * output distribution at prior q; valid for every r (S. Arimoto, IEEE Trans. Inf. Theory
     * IT-18(1), 1972, Theorem 1). Four logarithms, against about fifteen for the capacity.
     */
    private static double divergenceBoundBits(double q, double e0, double c0, double e1, double c1) {
        double s0 = e0 + c0;
        double s1 = e1 + c1;
        e0 /= s0;
        c0 /= s0;
        e1 /= s1;
        c1 /= s1;
        double r1 = (1 - q) * e0 + q * c1;
        double r0 = (1 - q) * c0 + q * e1;
        double d0 = xlog(c0, r0) + xlog(e0, r1);
        double d1 = xlog(e1, r0) + xlog(c1, r1);
        return Math.max(d0, d1) / Math.log(2);
    }

    /** w·ln(w/r), 0 for w = 0; +∞ when r = 0 &lt; w (the bound is then void). */
    private static double xlog(double w, double r) {
        if (w == 0) {
            return 0;
        }
        if (r == 0) {
            return Double.POSITIVE_INFINITY;
        }
        double ratio = w / r;
        return w * (ratio < Double.POSITIVE_INFINITY ? Math.log(ratio) : Math.log(w) - Math.log(r));
    }

    /** |1 − ε₀ − ε₁| from the pair with the smaller operands (c0 − e1 = c1 − e0). */
    private static double delta(double e0, double c0, double e1, double c1) {
        return Math.abs(c0 + e1 <= c1 + e0 ? c0 - e1 : c1 - e0);
    }
}
