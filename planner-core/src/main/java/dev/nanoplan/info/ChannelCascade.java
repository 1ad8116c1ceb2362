package dev.nanoplan.info;

/**
 * Cascade (serial connection) of discrete memoryless channels: the output of hop i is the
 * input of hop i+1, as with decode-and-forward relays that pass hard decisions on. The
 * end-to-end transition matrix is the matrix product W = W₁·W₂·…·W_k (R. A. Silverman,
 * "On binary channels and their cascades", IRE Trans. Inf. Theory IT-1(3), 1955); by the
 * data-processing inequality its capacity never exceeds that of any hop (T. M. Cover and
 * J. A. Thomas, <i>Elements of Information Theory</i>, 2nd ed., 2006, Theorem 2.8.1).
 *
 * <p>Complexity: O(Σ_i |X_1|·|X_i|·|X_{i+1}|) for the product (left to right, so the running
 * product keeps |X_1| rows); the capacity then costs Blahut–Arimoto iterations on it.
 */
public final class ChannelCascade {

    private ChannelCascade() {
    }

    /**
     * End-to-end transition matrix of the hops in order.
     *
     * @param hops at least one transition matrix; hop i's row length (outputs) must equal hop
     *     i+1's row count (inputs); every matrix rectangular with non-negative finite entries
     * @return a new matrix with hops[0].length rows and hops[k−1][0].length columns
     * @throws IllegalArgumentException on no hops, ragged or mismatched matrices
     */
    public static double[][] compose(double[][]... hops) {
        if (hops == null || hops.length == 0) {
            throw new IllegalArgumentException("hops must contain at least one matrix");
        }
        for (int i = 0; i < hops.length; i++) {
            checkRectangular(i, hops[i]);
        }
        double[][] acc = new double[hops[0].length][];
        for (int x = 0; x < acc.length; x++) {
            acc[x] = hops[0][x].clone();
        }
        for (int i = 1; i < hops.length; i++) {
            double[][] h = hops[i];
            if (h.length != acc[0].length) {
                throw new IllegalArgumentException("hop " + i + " has " + h.length
                        + " inputs but hop " + (i - 1) + " has " + acc[0].length + " outputs");
            }
            int ny = h[0].length;
            double[][] next = new double[acc.length][ny];
            for (int x = 0; x < acc.length; x++) {
                double[] out = next[x];
                for (int z = 0; z < h.length; z++) {
                    double a = acc[x][z];
                    if (a == 0) {
                        continue;
                    }
                    double[] row = h[z];
                    for (int y = 0; y < ny; y++) {
                        out[y] += a * row[y];
                    }
                }
            }
            acc = next;
        }
        return acc;
    }

    /** Capacity in bits of the cascade, by {@link BlahutArimoto#DEFAULT}. */
    public static double capacityBits(double[][]... hops) {
        return BlahutArimoto.DEFAULT.compute(compose(hops)).capacityBits();
    }

    /**
     * Mutual information I(X;Y) in bits of the cascade at the input law {@code input}: for two
     * inputs and two outputs the binary asymmetric channel form ({@link BinaryChannel}), otherwise
     * H(Y) − Σ_x p(x)·H(Y | X = x) (Cover and Thomas 2006, eq. 2.43). By the data-processing
     * inequality it never exceeds any hop's mutual information at the law that hop sees.
     *
     * @param input the law of the first hop's input, one probability per row of hops[0]
     */
    public static double mutualInformationBits(double[] input, double[][]... hops) {
        double[][] w = compose(hops);
        if (input.length != w.length) {
            throw new IllegalArgumentException("input: need " + w.length + " probabilities, got " + input.length);
        }
        if (w.length == 2 && w[0].length == 2) {
            return BinaryChannel.mutualInformationBits(input[1], w[0][1], w[0][0], w[1][0], w[1][1]);
        }
        int ny = w[0].length;
        double[] out = new double[ny];
        double conditional = 0;
        for (int x = 0; x < w.length; x++) {
            double rowSum = 0;
            for (double v : w[x]) {
                rowSum += v;
            }
            double[] row = new double[ny];
            for (int y = 0; y < ny; y++) {
                row[y] = w[x][y] / rowSum;
                out[y] += input[x] * row[y];
            }
            conditional += input[x] * Entropy.bits(row);
        }
        double outSum = 0;
        for (double v : out) {
            outSum += v;
        }
        for (int y = 0; y < ny; y++) {
            out[y] /= outSum;
        }
        return Math.max(0, Entropy.bits(out) - conditional);
    }

    private static void checkRectangular(int i, double[][] m) {
        if (m == null || m.length == 0 || m[0] == null || m[0].length == 0) {
            throw new IllegalArgumentException("hop " + i + " must be a non-empty matrix");
        }
        for (int x = 0; x < m.length; x++) {
            if (m[x] == null || m[x].length != m[0].length) {
                throw new IllegalArgumentException("hop " + i + " row " + x + " must have "
                        + m[0].length + " entries");
            }
            for (double v : m[x]) {
                if (!(v >= 0) || v == Double.POSITIVE_INFINITY) {
                    throw new IllegalArgumentException("hop " + i + " has an entry that is not "
                            + "finite and >= 0: " + v);
                }
            }
        }
    }
}
