package dev.nanoplan.detect;

import dev.nanoplan.count.CountPmf;
import dev.nanoplan.info.BlahutArimoto;
import java.util.Arrays;
import java.util.List;
import java.util.Objects;

/**
 * Joint choice of the M−1 count thresholds of an M-level detector and of the input
 * distribution, to maximise the mutual information of the induced M×M channel.
 *
 * <p><b>Threshold dynamic programme.</b> For a fixed input distribution π, the mutual
 * information of a quantiser whose cells are contiguous count intervals is a sum over cells
 * of g(m) = Σ_i π_i m_i ln(m_i / Σ_k π_k m_k), where m_i is the cell's mass under level i.
 * The best partition of the count axis into M contiguous cells is therefore found exactly by
 * dynamic programming over cut points (the idea of B. M. Kurkoski and H. Yagi, "Quantization of
 * binary-input discrete memoryless channels", IEEE Trans. Inf. Theory 60(8), 4544–4552, 2014,
 * used here for M-ary inputs with cells constrained to count intervals). With L candidate cut
 * points this costs O(L²) cell evaluations (each O(M) logarithms) plus O(M·L²) additions, and
 * O(L²) memory; for M = 2 it is O(L).
 *
 * <p><b>Exactness.</b> Thresholds range over the integers of the union window of the pmfs
 * (truncated masses placed just outside each window, as in {@link BinaryThresholdSearch});
 * thresholds outside it are equivalent to its ends. The DP is exact over <em>all</em> integer
 * thresholds when M = 2 or when the window has at most {@code maxCandidates} − 1 counts.
 * Otherwise it runs over a candidate set — the quantiles of the level mixture at
 * a quarter of {@code maxCandidates} levels (at least 16), plus the previous round's thresholds —
 * and then refines: a joint DP over the cut points between the neighbouring candidates of each
 * chosen cut (every integer when they are at most 64 apart; up to 4 passes, each zooming in), then
 * coordinate sweeps that move each cut to the best integer between its neighbours over the whole
 * window. The result is optimal in each cut separately over all integers and jointly over the
 * candidates searched, not proven global, flagged by {@link Quantization#exactOverAllCuts()} =
 * false. Cost: O(C²) cell evaluations for C = maxCandidates / 4 plus O(M·L) per sweep, instead of
 * O(maxCandidates²) per pass (the DP over 1,024 candidates and its refinements took about 2 s per
 * 3-level optimisation of a culture-tank link of 3,000–9,000 counts; now a tenth of that).
 *
 * <p><b>Alternation.</b> {@link #optimise(List)} alternates the DP (thresholds for the current
 * π) with Blahut–Arimoto on the induced M×M channel (π for the current thresholds; R. Blahut
 * 1972, S. Arimoto 1972). Each half-step cannot lower the mutual information, so the capacity
 * sequence is non-decreasing (checked; a decrease beyond 1e-12 bit throws
 * IllegalStateException); it stops when a round gains less than {@code toleranceBits}. This is
 * coordinate ascent and can stop at a local optimum, so it runs from two starts (uniform inputs,
 * and the capacity-achieving input of the unquantised count channel).
 *
 * <p><b>Global search with a certificate.</b> When M &gt; 2 and M²·K² ≤ 2^24 for K threshold
 * positions, the best of the two ascents seeds a branch and bound over every threshold set (see
 * {@code branchAndBound}): the result is then the maximum over all integer threshold sets of the
 * induced channel's capacity, up to {@link MultiLevelResult#certifiedGapBits()} (a proven bound,
 * 0 up to 1e-11 bit when the search completes within its work budget, otherwise the bound of what
 * was left; tested against exhaustive enumeration for 3 and 4 levels). Larger problems keep the
 * ascent result, with the gap NaN (not certified).
 */
public final class MultiLevelQuantizer {

    /** 1024 candidate cut points, {@link BlahutArimoto#DEFAULT}, tolerance 1e-12 bit, 100 rounds. */
    public static final MultiLevelQuantizer DEFAULT =
            new MultiLevelQuantizer(1024, BlahutArimoto.DEFAULT, 1e-12, 100);

    private static final double LN2 = Math.log(2);
    private static final int MAX_CANDIDATES = 2048;

    private final int maxCandidates;
    private final BlahutArimoto blahutArimoto;
    private final double toleranceBits;
    private final int maxRounds;

    /**
     * @param maxCandidates candidate cut points for the DP when M &gt; 2, in [8, 2048]
     * @param blahutArimoto capacity solver for the induced and the unquantised channels
     * @param toleranceBits stop alternating when a round gains less than this, bits, &gt; 0
     * @param maxRounds maximum alternation rounds, &ge; 1
     */
    public MultiLevelQuantizer(int maxCandidates, BlahutArimoto blahutArimoto,
                               double toleranceBits, int maxRounds) {
        if (maxCandidates < 8 || maxCandidates > MAX_CANDIDATES) {
            throw new IllegalArgumentException(
                    "maxCandidates must be in [8, " + MAX_CANDIDATES + "], got " + maxCandidates);
        }
        if (blahutArimoto == null) {
            throw new IllegalArgumentException("blahutArimoto must not be null");
        }
        if (!(toleranceBits > 0) || Double.isInfinite(toleranceBits)) {
            throw new IllegalArgumentException(
                    "toleranceBits must be finite and > 0, got " + toleranceBits);
        }
        if (maxRounds < 1) {
            throw new IllegalArgumentException("maxRounds must be >= 1, got " + maxRounds);
        }
        this.maxCandidates = maxCandidates;
        this.blahutArimoto = blahutArimoto;
        this.toleranceBits = toleranceBits;
        this.maxRounds = maxRounds;
    }

    /**
     * Best thresholds for one input distribution.
     *
     * @param thresholds strictly increasing, length M−1 (decide j iff t_j ≤ Y &lt; t_{j+1})
     * @param mutualInformationBits mutual information of the induced channel at the given π
     * @param channel induced channel, channel[i][j] = P(decide j | level i)
     * @param exactOverAllCuts whether the DP covered every integer cut point
     */
    public record Quantization(long[] thresholds, double mutualInformationBits, double[][] channel,
                               boolean exactOverAllCuts) {

        public Quantization {
            if (thresholds == null || channel == null) {
                throw new IllegalArgumentException("thresholds and channel must not be null");
            }
            if (!(mutualInformationBits >= 0)) {
                throw new IllegalArgumentException(
                        "mutualInformationBits must be >= 0, got " + mutualInformationBits);
            }
            thresholds = thresholds.clone();
        }

        @Override
        public long[] thresholds() {
            return thresholds.clone();
        }

        @Override
        public boolean equals(Object o) {
            // every component, arrays by content
            return o instanceof Quantization other
                    && Arrays.equals(thresholds, other.thresholds)
                    && Double.compare(mutualInformationBits, other.mutualInformationBits) == 0
                    && Arrays.deepEquals(channel, other.channel)
                    && exactOverAllCuts == other.exactOverAllCuts;
        }

        @Override
        public int hashCode() {
            int h = Objects.hash(mutualInformationBits, exactOverAllCuts);
            h = 31 * h + Arrays.hashCode(thresholds);
            h = 31 * h + Arrays.deepHashCode(channel);
            return h;
        }

        @Override
        public String toString() {
            return "Quantization[thresholds=" + Arrays.toString(thresholds) + ", mutualInformationBits="
                    + mutualInformationBits + ", channel=" + Arrays.deepToString(channel) + ", exactOverAllCuts="
                    + exactOverAllCuts + "]";
        }
    }

    /**
     * Thresholds maximising the mutual information at input distribution π (exact DP, see the
     * class comment for when it is over all integer cuts). Ties: the DP keeps the first
     * (smallest) cut found for each sub-problem.
     *
     * @param givenLevel count pmf of each level, M ≥ 2, each summing to 1 within 1e-6
     * @param inputDistribution π, length M, entries ≥ 0 summing to 1 within 1e-9
     * @return thresholds, mutual information and induced channel
     */
    public Quantization bestThresholds(List<CountPmf> givenLevel, double[] inputDistribution) {
        CountWindow w = window(givenLevel);
        double[] pi = checkDistribution(inputDistribution, givenLevel.size());
        Cut c = quantize(w, pi, null);
        return c.toQuantization(w);
    }

    /**
     * Alternates threshold DP and Blahut–Arimoto until the capacity stops improving.
     *
     * @param givenLevel count pmf of each level (level index = input symbol), M ≥ 2
     * @return thresholds, input distribution, capacity, the uniform-input optimum and the soft
     *     (unquantised) capacity
     */
    public MultiLevelResult optimise(List<CountPmf> givenLevel) {
        CountWindow w = window(givenLevel);
        int m = givenLevel.size();
        double[] uniform = new double[m];
        Arrays.fill(uniform, 1.0 / m);
        Cut uni = quantize(w, uniform, null);
        Ascent best = alternate(w, uni, uniform);
        boolean exact = best.exact;
        int rounds = best.rounds;
        BlahutArimoto.Result softBa = softCapacity(w);
        double soft = softBa.capacityBits();
        if (m > 2) {
            // second start: the input law of the unquantised count channel
            double[] start = softBa.inputDistribution();
            Ascent other = alternate(w, quantize(w, start, null), start);
            exact &= other.exact;
            rounds += other.rounds;
            if (other.capBits > best.capBits) {
                best = other;
            }
        }
        double gap = Double.NaN;
        if (m == 2) {
            gap = 0;
        } else if ((double) m * m * (w.size + 1) * (w.size + 1) <= GLOBAL_SEARCH_WORK) {
            Ascent global = branchAndBound(w, best);
            gap = global.gapBits;
            best = global;
            exact = true;
        }
        double maxBits = Math.log(m) / LN2;
        return new MultiLevelResult(best.cut.thresholds(w), best.pi, Math.min(best.capBits, maxBits),
                best.cut.channel(w), uni.thresholds(w), Math.min(uni.miNats / LN2, maxBits), Math.min(soft, maxBits),
                rounds, exact, gap);
    }

    /** Slack of the branch and bound of the 3-level search, bits. */
    static final double PAIR_SLACK_BITS = 1e-11;
    /** Blahut–Arimoto iterations per visited pair of the 3-level search. */
    static final int PAIR_ITERATIONS = 2000;
    /** Largest M²·positions² for which the global search runs (its bound tables cost that much). */
    static final double GLOBAL_SEARCH_WORK = 1 << 24;

    /** A result of coordinate ascent or of the global search. */
    private record Ascent(Cut cut, double[] pi, double capBits, int rounds, boolean exact, double gapBits) {
    }

    /** Alternates the threshold DP and Blahut–Arimoto from {@code start} (DP result at {@code pi}). */
    private Ascent alternate(CountWindow w, Cut start, double[] startPi) {
        boolean exact = start.exact;
        Cut cur = start;
        double[] pi = startPi;
        double cap = start.miNats / LN2;
        BlahutArimoto.Result ba = blahutArimoto.compute(start.channel(w));
        if (ba.capacityBits() > cap) {
            cap = ba.capacityBits();
            pi = ba.inputDistribution();
        }
        int rounds = 0;
        while (rounds < maxRounds) {
            double before = miNats(w, pi, cur.cuts);
            Cut next = quantize(w, pi, cur.cuts);
            exact &= next.exact;
            if (next.miNats < before - 1e-12 * LN2) {
                throw new IllegalStateException("threshold DP lowered the mutual information: "
                        + before + " -> " + next.miNats + " nats");
            }
            BlahutArimoto.Result r = blahutArimoto.compute(next.channel(w));
            double nextCap = next.miNats / LN2;
            double[] nextPi = pi;
            if (r.capacityBits() > nextCap) {
                nextCap = r.capacityBits();
                nextPi = r.inputDistribution();
            }
            rounds++;
            if (nextCap < cap - 1e-12) {
                throw new IllegalStateException(
                        "alternation lowered the capacity: " + cap + " -> " + nextCap + " bits");
            }
            double gain = nextCap - cap;
            if (nextCap >= cap) {
                cap = nextCap;
                pi = nextPi;
                cur = next;
            }
            if (gain < toleranceBits) {
                break;
            }
        }
        return new Ascent(cur, pi, cap, rounds, exact, Double.NaN);
    }

    /** Output distribution r = πW of the cuts' channel. */
    private static double[] outputDistribution(CountWindow w, double[] pi, int[] cuts) {
        double[][] ch = new Cut(cuts, 0, true).channel(w);
        int m = pi.length;
        double[] r = new double[m];
        for (int i = 0; i < m; i++) {
            for (int j = 0; j < m; j++) {
                r[j] += pi[i] * ch[i][j];
            }
        }
        return r;
    }

    /**
     * Global maximum of the capacity of the induced channel over every threshold set, by branch and
     * bound over the cut positions (cut j after cut j − 1). Bound: for any output distribution r,
     * C(W) ≤ max_x D(W_x ‖ r) (S. Arimoto 1972, Theorem 1); with r the output distribution of the
     * best set found by ascent, D(W_x ‖ r) = Σ_cells m_xj ln(m_xj / r_j) is a sum over cells, so for
     * a prefix of cuts the best completion of each row x is an exact suffix dynamic programme
     * (computed once, O(M²·K²) for K positions), and max_x (prefix_x + best completion_x) bounds every
     * set below the prefix. Prefixes whose bound is within {@value #PAIR_SLACK_BITS} bit of the best
     * capacity found are pruned; at a full set Blahut–Arimoto runs, abandoned as soon as its own upper
     * bound (same theorem, current iterate) is within that slack, and stopped after
     * {@value #PAIR_ITERATIONS} iterations. After {@value #WORK_BUDGET} nodes and iterations together
     * the search stops. The
     * certified gap is the largest bound left unexplored or of a visited set, minus the result: 0 up
     * to the slack when the search finished and every Blahut–Arimoto run settled.
     */
    private Ascent branchAndBound(CountWindow w, Ascent start) {
        int m = start.pi.length;
        int n = w.size + 1;
        double[] lnR = logs(outputDistribution(w, start.pi, start.cut.cuts));
        double[][][] g = completions(w, lnR);
        BlahutArimoto pairSolver = new BlahutArimoto(blahutArimoto.toleranceBits(), PAIR_ITERATIONS);
        Search st = new Search();
        st.best = start.capBits * LN2;
        st.bestCut = start.cut;
        st.bestPi = start.pi;
        st.upper = start.capBits;
        st.left = Double.NEGATIVE_INFINITY;
        int[] cuts = new int[m - 1];
        double[] prefix = new double[m];
        descend(w, lnR, g, pairSolver, st, cuts, 0, 0, prefix);
        double bits = st.best / LN2;
        double gap = Math.max(0, Math.max(st.upper, st.left / LN2) - bits);
        return new Ascent(st.bestCut, st.bestPi, bits, start.rounds, true, gap);
    }

    /**
     * Work budget of the branch and bound: nodes visited plus Blahut–Arimoto iterations at full
     * threshold sets. When it runs out, the bounds of what is left go into the certified gap.
     */
    static final long WORK_BUDGET = 400_000;

    /** Mutable state of {@link #branchAndBound}. */
    private static final class Search {
        double best;
        Cut bestCut;
        double[] bestPi;
        double upper;
        double left;
        long work;
    }

    /** Chooses cut {@code j} (cells before it fixed, their divergence terms per row in {@code prefix}). */
    private void descend(CountWindow w, double[] lnR, double[][][] g, BlahutArimoto solver, Search st, int[] cuts,
            int j, int from, double[] prefix) {
        int m = lnR.length;
        int n = w.size + 1;
        double slack = PAIR_SLACK_BITS * LN2;
        double[] next = new double[m];
        for (int c = from; c < n - (m - 2 - j); c++) {
            int cellStart = j == 0 ? 0 : cuts[j - 1];
            double bound = Double.NEGATIVE_INFINITY;
            for (int x = 0; x < m; x++) {
                next[x] = prefix[x] + xlnx(w.cellMass(x, cellStart, c), lnR[j]);
                bound = Math.max(bound, next[x] + g[x][j + 1][c]);
            }
            if (bound <= st.best + slack) {
                continue;
            }
            if (++st.work > WORK_BUDGET) {
                st.left = Math.max(st.left, bound);
                continue;
            }
            cuts[j] = c;
            if (j == m - 2) {
                Cut cut = new Cut(cuts.clone(), 0, true);
                BlahutArimoto.Result r = solver.compute(cut.channel(w), (st.best + slack) / LN2);
                st.work += r.iterations();
                st.upper = Math.max(st.upper, r.upperBoundBits());
                if (r.capacityBits() * LN2 > st.best) {
                    st.best = r.capacityBits() * LN2;
                    st.bestCut = cut;
                    st.bestPi = r.inputDistribution();
                }
            } else {
                descend(w, lnR, g, solver, st, cuts, j + 1, c + 1, next.clone());
            }
        }
    }

    /**
     * g[x][j][a]: the largest Σ_{cells j..M−1} m_x ln(m_x / r_cell) over cuts with cell j starting
     * at position a (cells 1..M−2 non-empty, the last may be empty); −∞ where no completion fits.
     */
    private static double[][][] completions(CountWindow w, double[] lnR) {
        int m = lnR.length;
        int n = w.size + 1;
        double[][][] g = new double[m][m][n];
        for (int x = 0; x < m; x++) {
            double[][] t = g[x];
            for (int a = 0; a < n; a++) {
                t[m - 1][a] = xlnx(w.cellMass(x, a, w.size), lnR[m - 1]);
            }
            for (int j = m - 2; j >= 1; j--) {
                for (int a = 0; a < n; a++) {
                    double v = Double.NEGATIVE_INFINITY;
                    for (int b = a + 1; b < n; b++) {
                        if (t[j + 1][b] > Double.NEGATIVE_INFINITY) {
                            v = Math.max(v, xlnx(w.cellMass(x, a, b), lnR[j]) + t[j + 1][b]);
                        }
                    }
                    t[j][a] = v;
                }
            }
        }
        return g;
    }

    private static double[] logs(double[] r) {
        double[] l = new double[r.length];
        for (int j = 0; j < r.length; j++) {
            l[j] = Math.log(r[j] > 0 ? r[j] : Double.MIN_VALUE);
        }
        return l;
    }

    /** v·(ln v − lnR), 0 for v = 0. */
    private static double xlnx(double v, double lnR) {
        return v > 0 ? v * (Math.log(v) - lnR) : 0;
    }

    /** Blahut–Arimoto over every count of the window with non-zero mass under some level. */
    private BlahutArimoto.Result softCapacity(CountWindow w) {
        int m = w.mass.length;
        int cols = 0;
        for (int k = 0; k < w.size; k++) {
            if (columnUsed(w, k)) {
                cols++;
            }
        }
        double[][] ch = new double[m][cols];
        int c = 0;
        for (int k = 0; k < w.size; k++) {
            if (columnUsed(w, k)) {
                for (int i = 0; i < m; i++) {
                    ch[i][c] = w.mass[i][k];
                }
                c++;
            }
        }
        return blahutArimoto.compute(ch);
    }

    private static boolean columnUsed(CountWindow w, int k) {
        for (double[] row : w.mass) {
            if (row[k] > 0) {
                return true;
            }
        }
        return false;
    }

    /** Cut positions (τ = first + cut) with their mutual information in nats. */
    private static final class Cut {
        final int[] cuts;
        final double miNats;
        final boolean exact;

        Cut(int[] cuts, double miNats, boolean exact) {
            this.cuts = cuts;
            this.miNats = miNats;
            this.exact = exact;
        }

        long[] thresholds(CountWindow w) {
            long[] t = new long[cuts.length];
            for (int j = 0; j < cuts.length; j++) {
                t[j] = w.first + cuts[j];
            }
            return t;
        }

        double[][] channel(CountWindow w) {
            int m = w.mass.length;
            double[][] ch = new double[m][m];
            for (int i = 0; i < m; i++) {
                for (int j = 0; j < m; j++) {
                    int from = j == 0 ? 0 : cuts[j - 1];
                    int to = j == m - 1 ? w.size : cuts[j];
                    ch[i][j] = w.cellMass(i, from, to);
                }
            }
            return ch;
        }

        Quantization toQuantization(CountWindow w) {
            return new Quantization(thresholds(w), Math.max(0, miNats / LN2), channel(w), exact);
        }
    }

    private Cut quantize(CountWindow w, double[] pi, int[] include) {
        int m = pi.length;
        int positions = w.size + 1;
        if (positions < m - 1) {
            throw new IllegalArgumentException("the count window has " + positions
                    + " threshold positions, fewer than the " + (m - 1) + " thresholds needed");
        }
        if (m == 2 || positions <= maxCandidates) {
            int[] all = new int[positions];
            for (int t = 0; t < positions; t++) {
                all[t] = t;
            }
            return dp(w, pi, all, true);
        }
        int[] cand = coarseCandidates(w, pi, include);
        Cut best = dp(w, pi, cand, false);
        for (int pass = 0; pass < 4; pass++) {
            int[] local = neighbourhoods(cand, best.cuts, w.size);
            int[] refined = union(cand, local);
            if (refined.length == cand.length) {
                break;
            }
            cand = refined;
            // the joint DP runs over the chosen cuts' neighbourhoods only (they contain the
            // current cuts, so it cannot lose): the candidates far from every cut were already
            // weighed by the coarse DP
            Cut c = dp(w, pi, local, false);
            if (c.miNats >= best.miNats) {
                best = c;
            }
        }
        return sweep(w, pi, best);
    }

    /**
     * Quantile candidates of the first DP on a wide window: a quarter of {@code maxCandidates}, at
     * least 16 (the refinement passes and the sweep then work at every integer near the chosen cuts).
     */
    private int coarse() {
        return Math.max(16, maxCandidates / 4);
    }

    /** Cut points per chosen cut in one refinement pass. */
    static final int LOCAL_POINTS = 64;

    /** Largest number of coordinate sweeps of {@link #sweep}. */
    static final int MAX_SWEEPS = 20;

    /**
     * Coordinate ascent over every integer cut point: each cut in turn moves to the best integer
     * between its neighbours (the others fixed; only its two cells change, O(M) logarithms per
     * position), until a sweep moves nothing or after {@value #MAX_SWEEPS} sweeps. Never lowers the
     * mutual information; the result is optimal in each cut separately over all integers.
     */
    private static Cut sweep(CountWindow w, double[] pi, Cut start) {
        int[] cuts = start.cuts.clone();
        int k = cuts.length;
        double[] mbuf = new double[pi.length];
        boolean moved = true;
        for (int s = 0; s < MAX_SWEEPS && moved; s++) {
            moved = false;
            for (int j = 0; j < k; j++) {
                int left = j == 0 ? 0 : cuts[j - 1];
                int right = j == k - 1 ? w.size : cuts[j + 1];
                int lo = j == 0 ? 0 : left + 1;
                int hi = j == k - 1 ? w.size : right - 1;
                int arg = cuts[j];
                double bestVal = g(w, pi, left, arg, mbuf) + g(w, pi, arg, right, mbuf);
                for (int t = lo; t <= hi; t++) {
                    double v = g(w, pi, left, t, mbuf) + g(w, pi, t, right, mbuf);
                    if (v > bestVal) {
                        bestVal = v;
                        arg = t;
                    }
                }
                if (arg != cuts[j]) {
                    cuts[j] = arg;
                    moved = true;
                }
            }
        }
        return new Cut(cuts, miNats(w, pi, cuts), start.exact);
    }

    private static int[] union(int[] a, int[] b) {
        int[] c = Arrays.copyOf(a, a.length + b.length);
        System.arraycopy(b, 0, c, a.length, b.length);
        return sortedUnique(c, c.length);
    }

    /** Quantiles of the mixture with weights (π_i + 1/M)/2, plus both ends and {@code include}. */
    private int[] coarseCandidates(CountWindow w, double[] pi, int[] include) {
        int m = pi.length;
        int n = w.size + 1;
        double[] mix = new double[n];
        for (int i = 0; i < m; i++) {
            double weight = 0.5 * (pi[i] + 1.0 / m);
            double[] p = w.prefix[i];
            for (int t = 0; t < n; t++) {
                mix[t] += weight * p[t];
            }
        }
        int slots = coarse() - 2 - (include == null ? 0 : include.length);
        int[] c = new int[Math.max(0, slots) + 2 + (include == null ? 0 : include.length)];
        int k = 0;
        c[k++] = 0;
        c[k++] = w.size;
        for (int s = 1; s <= slots; s++) {
            double u = (double) s / (slots + 1);
            int pos = Arrays.binarySearch(mix, u);
            if (pos < 0) {
                pos = -pos - 1;
            }
            c[k++] = Math.min(w.size, pos);
        }
        if (include != null) {
            for (int t : include) {
                c[k++] = t;
            }
        }
        return sortedUnique(c, k);
    }

    /**
     * Both ends of the window, and for each chosen cut the cut points between its neighbouring
     * candidates: every integer when they are at most {@value #LOCAL_POINTS} (or
     * {@code maxCandidates / (M − 1)} if fewer) apart, else that many evenly spaced.
     */
    private int[] neighbourhoods(int[] cand, int[] cuts, int size) {
        int per = Math.max(2, Math.min(LOCAL_POINTS, maxCandidates / cuts.length));
        int[] extra = new int[2 + cuts.length * (per + 1)];
        int k = 0;
        extra[k++] = 0;
        extra[k++] = size;
        for (int cut : cuts) {
            int idx = Arrays.binarySearch(cand, cut);
            int lo = cand[Math.max(0, idx - 1)];
            int hi = cand[Math.min(cand.length - 1, idx + 1)];
            int span = hi - lo;
            if (span <= per) {
                for (int t = lo; t <= hi; t++) {
                    extra[k++] = t;
                }
            } else {
                for (int s = 0; s <= per; s++) {
                    extra[k++] = lo + (int) ((long) span * s / per);
                }
            }
        }
        int[] r = sortedUnique(extra, k);
        return r;
    }

    private static int[] sortedUnique(int[] a, int n) {
        int[] s = Arrays.copyOf(a, n);
        Arrays.sort(s);
        int u = 0;
        for (int i = 0; i < n; i++) {
            if (u == 0 || s[i] != s[u - 1]) {
                s[u++] = s[i];
            }
        }
        return Arrays.copyOf(s, u);
    }

    /**
     * Exact DP over strictly increasing cuts taken from {@code cand} (sorted, containing 0 and
     * size). Cell j is [cut_{j}, cut_{j+1}) with cut_0 = 0 and cut_M = size.
     */
    private static Cut dp(CountWindow w, double[] pi, int[] cand, boolean exact) {
        int m = pi.length;
        int l = cand.length;
        int last = w.size;
        double[] mbuf = new double[m];
        if (m == 2) {
            int best = -1;
            double bestVal = Double.NEGATIVE_INFINITY;
            for (int a = 0; a < l; a++) {
                double v = g(w, pi, 0, cand[a], mbuf) + g(w, pi, cand[a], last, mbuf);
                if (v > bestVal) {
                    bestVal = v;
                    best = a;
                }
            }
            return new Cut(new int[] {cand[best]}, Math.max(0, bestVal), exact);
        }
        // gt[b][a - b] = g(cell [cand[b], cand[a])) for b <= a (upper triangle, row-packed).
        double[][] gt = new double[l][];
        for (int b = 0; b < l; b++) {
            gt[b] = new double[l - b];
            for (int a = b + 1; a < l; a++) {
                gt[b][a - b] = g(w, pi, cand[b], cand[a], mbuf);
            }
        }
        // Cells begin at position cand[0] = 0 and end at cand[l-1] = size.
        int k = m - 1; // number of thresholds
        double[][] f = new double[k + 1][l];
        int[][] back = new int[k + 1][l];
        for (int a = 0; a < l; a++) {
            f[1][a] = gt[0][a];
        }
        for (int j = 2; j <= k; j++) {
            Arrays.fill(f[j], Double.NEGATIVE_INFINITY);
            for (int a = j - 1; a < l; a++) {
                double best = Double.NEGATIVE_INFINITY;
                int arg = -1;
                for (int b = j - 2; b < a; b++) {
                    double v = f[j - 1][b] + gt[b][a - b];
                    if (v > best) {
                        best = v;
                        arg = b;
                    }
                }
                f[j][a] = best;
                back[j][a] = arg;
            }
        }
        double bestVal = Double.NEGATIVE_INFINITY;
        int arg = -1;
        for (int a = k - 1; a < l; a++) {
            double v = f[k][a] + gt[a][l - 1 - a];
            if (v > bestVal) {
                bestVal = v;
                arg = a;
            }
        }
        int[] cuts = new int[k];
        for (int j = k; j >= 1; j--) {
            cuts[j - 1] = cand[arg];
            arg = back[j][arg];
        }
        return new Cut(cuts, Math.max(0, bestVal), exact);
    }

    /** g(cell) = Σ_i π_i m_i ln(m_i / Σ_k π_k m_k), nats. */
    private static double g(CountWindow w, double[] pi, int from, int to, double[] mbuf) {
        if (from >= to) {
            return 0;
        }
        int m = pi.length;
        double s = 0;
        for (int i = 0; i < m; i++) {
            mbuf[i] = w.cellMass(i, from, to);
            s += pi[i] * mbuf[i];
        }
        if (s == 0) {
            return 0;
        }
        double v = 0;
        for (int i = 0; i < m; i++) {
            double x = mbuf[i];
            if (x > 0 && pi[i] > 0) {
                v += pi[i] * x * Math.log(x / s);
            }
        }
        return v;
    }

    /** Mutual information (nats) of given cuts at π. */
    static double miNats(CountWindow w, double[] pi, int[] cuts) {
        double[] mbuf = new double[pi.length];
        double v = 0;
        int from = 0;
        for (int j = 0; j <= cuts.length; j++) {
            int to = j == cuts.length ? w.size : cuts[j];
            v += g(w, pi, from, to, mbuf);
            from = to;
        }
        return Math.max(0, v);
    }

    private static CountWindow window(List<CountPmf> givenLevel) {
        if (givenLevel == null || givenLevel.size() < 2) {
            throw new IllegalArgumentException("givenLevel must hold at least 2 count pmfs");
        }
        return CountWindow.of(givenLevel);
    }

    private static double[] checkDistribution(double[] pi, int m) {
        if (pi == null || pi.length != m) {
            throw new IllegalArgumentException("inputDistribution must have " + m + " entries");
        }
        double s = 0;
        for (int i = 0; i < m; i++) {
            if (!(pi[i] >= 0 && pi[i] <= 1)) {
                throw new IllegalArgumentException(
                        "inputDistribution[" + i + "] must be in [0, 1], got " + pi[i]);
            }
            s += pi[i];
        }
        if (Math.abs(s - 1) > 1e-9) {
            throw new IllegalArgumentException("inputDistribution must sum to 1, sums to " + s);
        }
        return pi.clone();
    }
}
