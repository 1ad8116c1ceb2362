package dev.nanoplan.count;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.PriorityQueue;

/**
 * Exact count model: the pmf of a sum of independent terms is the convolution of the terms'
 * pmfs (e.g. W. Feller, <i>An Introduction to Probability Theory and Its Applications</i>,
 * Vol. I, 3rd ed., 1968, §XI.2).
 *
 * <p><b>Method.</b> With m terms and truncation budget δ:
 * <ol>
 *   <li>each term gets a window that drops less than δ/(4m) on each side (binomial and Poisson
 *       masses by the ratio recurrence from the mode, mixtures as weighted sums of their parts'
 *       windows, see {@code TermWindows}); point masses (0 trials, probability 0 or 1, mean 0)
 *       cost one cell;</li>
 *   <li>windows are merged two at a time, always the two narrowest (Huffman order, which
 *       minimises the summed length of intermediate results); one-cell windows only shift;
 *       narrow × anything is summed directly, wide × wide goes through a radix-2 FFT
 *       ({@code Convolution}); FFT round-off below 0 is clamped to 0;</li>
 *   <li>after each merge the result is trimmed from both ends by less than δ/(4·max(1, m−1))
 *       per side.</li>
 * </ol>
 * The total mass dropped is therefore below δ and is recorded: a dropped combination counts
 * towards {@link CountPmf#massBelow()} when some term was cut below its window (and towards
 * {@code massAbove} when cut above; the O(δ²) mixed cases are split evenly), so window mass +
 * massBelow + massAbove = 1 up to rounding (about 1e-15·m).
 *
 * <p><b>Accuracy.</b> Single binomial / Poisson terms: about 1e-13 relative on every cell of the
 * window against Commons Statistics (tested). After FFT merges, cells are accurate to about
 * 1e-16·(peak) absolute, so cells many orders below the peak carry round-off; use
 * {@link LogTails} for tail probabilities below about 1e-13.
 *
 * <p><b>Cost.</b> O(Σ window lengths) to build the windows plus, per merge, min(a·b,
 * c·M·log M) with M the FFT length. Measured ({@code CountBench}, 2 shared cores under
 * load average ≈ 6, so upper bounds): Bin(10⁶, 0.3) + Poisson(20) ≈ 0.5 ms; the same with 50 ISI
 * mixtures (p_k = 0.15·(k+1)^{-3/2}, result ≈ 1.3e5 cells) ≈ 32 ms thread CPU time (113 ms before
 * the FFT rewrite of 2026-12), dominated by the last few FFT merges of length 2^17.
 * Windows longer than 2^25 cells are refused with an {@link IllegalArgumentException}.
 */
public final class ExactCountModel implements CountModel {

    /** Default truncation budget. */
    public static final double DEFAULT_TRUNCATION_MASS = 1e-15;

    /** Exact model with {@link #DEFAULT_TRUNCATION_MASS}. */
    public static final ExactCountModel DEFAULT = new ExactCountModel(DEFAULT_TRUNCATION_MASS);

    private final double truncationMass;

    /**
     * @param truncationMass total probability the result may leave out of its window, in
     *     (0, 0.5]; values below about 1e-280 lose accuracy to subnormal numbers
     */
    public ExactCountModel(double truncationMass) {
        if (!(truncationMass > 0 && truncationMass <= 0.5)) {
            throw new IllegalArgumentException("truncationMass must be in (0, 0.5], got "
                    + truncationMass);
        }
        this.truncationMass = truncationMass;
    }

    /** Exact model with {@link #DEFAULT_TRUNCATION_MASS}. */
    public ExactCountModel() {
        this(DEFAULT_TRUNCATION_MASS);
    }

    public double truncationMass() {
        return truncationMass;
    }

    @Override
    public CountPmf pmf(CountLaw law) {
        return window(law).toPmf();
    }

    /**
     * Computes the shared part's distribution once and convolves it with each level's own
     * part: for a link with long ISI memory this halves (binary) or divides by M the work. The
     * dropped mass stays below {@link #truncationMass()}: a third each for the shared window,
     * the own window and the final trim.
     */
    @Override
    public List<CountPmf> pmfs(CountLaw shared, List<CountLaw> own) {
        double third = truncationMass / 3;
        ExactCountModel part = new ExactCountModel(third);
        Window s = part.window(shared);
        List<CountPmf> out = new ArrayList<>(own.size());
        for (CountLaw o : own) {
            Window w = part.window(o);
            out.add(merge(w, s).trimMore(third / 2).toPmf());
        }
        return out;
    }

    /**
     * Law of the sum of two independent counts given as pmfs (FFT or direct convolution, see the
     * class comment), trimmed from each end by less than {@link #truncationMass()}/4 more; the
     * dropped masses of both inputs are carried over. Lets a caller build a pmf once and reuse it in
     * many sums (e.g. the crosstalk shared by every link at one receiver).
     */
    public CountPmf convolve(CountPmf a, CountPmf b) {
        return merge(windowOf(a), windowOf(b)).trimMore(truncationMass / 4).toPmf();
    }

    /**
     * As {@link #pmfs(CountLaw, List)}, with one more independent summand in the shared part that
     * is already a pmf ({@code given}, e.g. the crosstalk at a receiver built once by
     * {@link #convolve}). The result differs from putting {@code given}'s terms into
     * {@code shared} only by truncation and rounding: the dropped mass of {@code given} is carried
     * over, and this call drops less than {@link #truncationMass()} more.
     */
    public List<CountPmf> pmfs(CountPmf given, CountLaw shared, List<CountLaw> own) {
        double third = truncationMass / 3;
        ExactCountModel part = new ExactCountModel(third);
        // the given pmf is usually the widest part: merge it last, once per level
        Window s = part.window(shared);
        Window g = windowOf(given);
        List<CountPmf> out = new ArrayList<>(own.size());
        if (s.length() >= FUSE_MIN_CELLS && g.length() >= FUSE_MIN_CELLS) {
            // both wide: each level's own window convolved with s and g in one pass
            // (Convolution.convolveEach), instead of own ⊗ s and then (own ⊗ s) ⊗ g
            Window[] w = new Window[own.size()];
            double[][] cells = new double[own.size()][];
            for (int i = 0; i < w.length; i++) {
                w[i] = part.window(own.get(i));
                cells[i] = w[i].p;
            }
            double[][] sums = Convolution.convolveEach(s.p, g.p, cells);
            Window sg = accounted(s, g, null);
            for (int i = 0; i < w.length; i++) {
                out.add(accounted(w[i], sg, sums[i]).trimMore(third / 4).toPmf());
            }
            return out;
        }
        for (CountLaw o : own) {
            Window w = merge(part.window(o), s).trimMore(third / 4);
            out.add(merge(w, g).trimMore(third / 4).toPmf());
        }
        return out;
    }

    private static Window windowOf(CountPmf p) {
        return new Window(p.offset(), p.masses(), p.massBelow(), p.massAbove());
    }

    Window window(CountLaw law) {
        List<CountTerm> terms = law.terms();
        int m = terms.size();
        if (m == 0) {
            return Window.point(0);
        }
        double termEps = truncationMass / (4.0 * m);
        double mergeEps = truncationMass / (4.0 * Math.max(1, m - 1));
        long shift = 0;
        double scale = 1;
        double below = 0;
        double above = 0;
        List<Window> wide = new ArrayList<>(m);
        for (CountTerm t : terms) {
            Window w = TermWindows.of(t, termEps);
            if (w.length() == 1) {
                // point mass or one-cell window: shift and scale, keep dropped-mass accounting
                double wa = scale;
                double wb = w.p[0];
                double nb = wa * w.below + below * wb + below * w.below + 0.5 * (below * w.above + above * w.below);
                double na = wa * w.above + above * wb + above * w.above + 0.5 * (below * w.above + above * w.below);
                below = nb;
                above = na;
                scale *= wb;
                shift += w.offset;
            } else {
                wide.add(w);
            }
        }
        Window acc;
        if (wide.isEmpty()) {
            acc = new Window(0, new double[] {1.0}, 0, 0);
        } else {
            PriorityQueue<Window> queue = new PriorityQueue<>(Comparator.comparingInt(Window::length));
            queue.addAll(wide);
            while (queue.size() > 1) {
                Window a = queue.poll();
                Window b = queue.poll();
                queue.add(merge(a, b).trimMore(mergeEps));
            }
            acc = queue.poll();
        }
        // fold in the one-cell terms
        double[] p = acc.p;
        if (scale != 1) {
            p = p.clone();
            for (int i = 0; i < p.length; i++) {
                p[i] *= scale;
            }
        }
        double wa = 1 - acc.below - acc.above;
        double nb = wa * below + acc.below * scale + acc.below * below + 0.5 * (acc.below * above + acc.above * below);
        double na = wa * above + acc.above * scale + acc.above * above + 0.5 * (acc.below * above + acc.above * below);
        return new Window(acc.offset + shift, p, nb, na);
    }

    /**
     * As {@link #pmfs(CountPmf, CountLaw, List)} with the given part split into two independent
     * summands {@code givenA} + {@code givenB} (e.g. the prefix and suffix products of a receiver's
     * crosstalk): each level's window is convolved with both in one pass
     * ({@code Convolution.convolveEach}: binary levels cost three transforms instead of the four and
     * a half of convolving the two first). Same law; the result differs from
     * {@code pmfs(convolve(givenA, givenB), shared, own)} only by truncation (this call drops less
     * than {@link #truncationMass()}, the intermediate sum is not trimmed) and FFT rounding.
     */
    public List<CountPmf> pmfs(CountPmf givenA, CountPmf givenB, CountLaw shared, List<CountLaw> own) {
        Window a = windowOf(givenA);
        Window b = windowOf(givenB);
        if (a.length() < FUSE_MIN_CELLS || b.length() < FUSE_MIN_CELLS) {
            return pmfs(convolve(givenA, givenB), shared, own);
        }
        double third = truncationMass / 3;
        ExactCountModel part = new ExactCountModel(third);
        Window s = part.window(shared);
        Window[] w = new Window[own.size()];
        double[][] cells = new double[own.size()][];
        for (int i = 0; i < w.length; i++) {
            w[i] = merge(part.window(own.get(i)), s).trimMore(third / 4);
            cells[i] = w[i].p;
        }
        double[][] sums = Convolution.convolveEach(a.p, b.p, cells);
        Window ab = accounted(a, b, null);
        List<CountPmf> out = new ArrayList<>(own.size());
        for (int i = 0; i < w.length; i++) {
            out.add(accounted(w[i], ab, sums[i]).trimMore(third / 4).toPmf());
        }
        return out;
    }

    /** Below this many cells in either given part, {@link #pmfs(CountPmf, CountPmf, CountLaw, List)} convolves them first. */
    static final int FUSE_MIN_CELLS = 32;

    /** Law of the sum of two independent windowed variables, with dropped-mass accounting. */
    static Window merge(Window a, Window b) {
        return accounted(a, b, Convolution.convolve(a.p, b.p));
    }

    /** The window of a + b with cells {@code p} (their convolution), dropped masses carried over. */
    private static Window accounted(Window a, Window b, double[] p) {
        double wa = 1 - a.below - a.above;
        double wb = 1 - b.below - b.above;
        double mixed = 0.5 * (a.below * b.above + a.above * b.below);
        double below = a.below * wb + wa * b.below + a.below * b.below + mixed;
        double above = a.above * wb + wa * b.above + a.above * b.above + mixed;
        return new Window(a.offset + b.offset, p, below, above);
    }
}
