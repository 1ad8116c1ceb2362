package dev.nanoplan.plan;

import dev.nanoplan.count.CountLaw;
import dev.nanoplan.count.CountPmf;
import dev.nanoplan.count.CountTerm;
import dev.nanoplan.count.ExactCountModel;
import dev.nanoplan.network.Crosstalk;
import java.util.List;

/**
 * The crosstalk at one receiver, shared by all of its links (all-active schedule, docs/architecture.md §5.6).
 *
 * <p>A link from the emitter of rank e (0 = strongest) hears every other emitter: the
 * {@code K = exactCount} strongest of them exactly and the rest as one moment-matched term
 * ({@link Crosstalk}). With T = the K + 1 strongest emitters, the exact set is T without e when e is in
 * T, and the K strongest otherwise. So the exact pmfs I_r of the emitters in T are built once, with
 * prefix convolutions P_j = I_0 ⊗ … ⊗ I_{j−1} and suffix convolutions S_j = I_j ⊗ … ⊗ I_K; the
 * pmf of a link's exactly treated crosstalk is then P_e ⊗ S_{e+1} (e in T) or P_K; its moment-matched
 * remainder is convolved with the link's own (narrow) terms: one wide convolution per link instead of about K·(L + 1) (the usual prefix/suffix-product trick for
 * "all but one" aggregates).
 *
 * <p><b>Accuracy.</b> Same law as convolving the link's terms one by one; the pmf differs only by
 * truncation (each I_r drops below 1e-15, each convolution below 5e-16; in total below 3e-14 for
 * K = 8) and FFT rounding (about 1e-16 of the peak per cell). Capacities agree with the per-link
 * path within 1e-9 bit ({@code SharedInterferenceTest}).
 *
 * <p><b>Cost.</b> 2K + 1 convolutions per receiver, built lazily; memory O(K·W) for a crosstalk
 * window of W counts, released by {@link #release()} (later calls rebuild what they need).
 * Thread-safe (synchronized).
 */
final class ReceiverCrosstalk {

    private static final CountPmf POINT = new CountPmf(0, new double[] {1.0}, 0, 0);
    private static final ExactCountModel MODEL = ExactCountModel.DEFAULT;

    private final Crosstalk.Prepared prepared;
    private final int exactCount;
    private final int top;
    private CountPmf[] single;
    private CountPmf[] prefix;
    private CountPmf[] suffix;

    ReceiverCrosstalk(Crosstalk.Prepared prepared, int exactCount) {
        this.prepared = prepared;
        this.exactCount = exactCount;
        this.top = Math.min(exactCount + 1, prepared.size());
    }

    Crosstalk.Prepared prepared() {
        return prepared;
    }

    /** The interference terms of the link from the emitter of rank {@code rank}. */
    List<CountTerm> termsWithout(int rank) {
        return prepared.termsWithout(rank, exactCount);
    }

    /**
     * Exact pmf of the exactly treated part of the crosstalk heard by the link from the emitter of
     * rank {@code rank}: the sum of all terms of {@link #termsWithout(int)} but the moment-matched
     * remainder (the last term, when {@link #hasRemainder(int)}).
     */
    synchronized CountPmf pmfWithout(int rank) {
        CountPmf base;
        if (rank >= 0 && rank < top) {
            base = prefix(rank);
            CountPmf after = suffix(rank + 1);
            base = base == POINT ? after : after == POINT ? base : MODEL.convolve(base, after);
        } else {
            base = prefix(Math.min(exactCount, top));
        }
        return base;
    }

    /**
     * {@link #pmfWithout(int)} as two independent parts whose sum it is, {P_e, S_{e+1}}, when the
     * emitter of rank {@code rank} is among the top K + 1 and both parts are non-trivial (then the
     * caller convolves the link's own terms with both in one pass instead of building their sum
     * first); otherwise the one-element array {pmfWithout(rank)}.
     */
    synchronized CountPmf[] partsWithout(int rank) {
        if (rank >= 0 && rank < top) {
            CountPmf before = prefix(rank);
            CountPmf after = suffix(rank + 1);
            if (before != POINT && after != POINT) {
                return new CountPmf[] {before, after};
            }
        }
        return new CountPmf[] {pmfWithout(rank)};
    }

    /** Whether {@link #termsWithout(int)} ends with a moment-matched remainder term. */
    boolean hasRemainder(int rank) {
        return prepared.remainderWithout(rank, exactCount) != null;
    }

    /** Drops the cached convolutions (they are rebuilt on demand). */
    synchronized void release() {
        single = null;
        prefix = null;
        suffix = null;
    }

    private CountPmf single(int r) {
        if (single == null) {
            single = new CountPmf[top];
        }
        if (single[r] == null) {
            single[r] = MODEL.pmf(new CountLaw(prepared.termsOfRank(r)));
        }
        return single[r];
    }

    /** I_0 ⊗ … ⊗ I_{j−1}. */
    private CountPmf prefix(int j) {
        if (prefix == null) {
            prefix = new CountPmf[top + 1];
            prefix[0] = POINT;
        }
        int have = j;
        while (prefix[have] == null) {
            have--;
        }
        for (int i = have; i < j; i++) {
            prefix[i + 1] = prefix[i] == POINT ? single(i) : MODEL.convolve(prefix[i], single(i));
        }
        return prefix[j];
    }

    /** I_j ⊗ … ⊗ I_{top−1}. */
    private CountPmf suffix(int j) {
        if (suffix == null) {
            suffix = new CountPmf[top + 1];
            suffix[top] = POINT;
        }
        int have = j;
        while (suffix[have] == null) {
            have++;
        }
        for (int i = have; i > j; i--) {
            suffix[i - 1] = suffix[i] == POINT ? single(i - 1) : MODEL.convolve(single(i - 1), suffix[i]);
        }
        return suffix[j];
    }
}
