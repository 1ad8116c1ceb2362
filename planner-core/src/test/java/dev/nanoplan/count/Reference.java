package dev.nanoplan.count;

import java.util.Arrays;
import org.apache.commons.statistics.distribution.BinomialDistribution;
import org.apache.commons.statistics.distribution.PoissonDistribution;

/**
 * Independent reference computations for tests: pmfs from Commons Statistics, direct
 * convolution by the definition P(X+Z = y) = Σ_x P(X = x) P(Z = y − x), and the same in the
 * log domain with log-sum-exp.
 */
final class Reference {

    private Reference() {
    }

    /** pmf of the term on [0, ymax] from Commons Statistics (mixtures as weighted sums). */
    static double[] pmf(CountTerm t, int ymax) {
        double[] out = new double[ymax + 1];
        if (t instanceof BinomialTerm b) {
            BinomialDistribution d = BinomialDistribution.of((int) b.trials(), b.probability());
            for (int y = 0; y <= ymax; y++) {
                out[y] = d.probability(y);
            }
        } else if (t instanceof PoissonTerm p) {
            if (p.mean() == 0) {
                out[0] = 1;
            } else {
                PoissonDistribution d = PoissonDistribution.of(p.mean());
                for (int y = 0; y <= ymax; y++) {
                    out[y] = d.probability(y);
                }
            }
        } else {
            MixtureTerm m = (MixtureTerm) t;
            for (int i = 0; i < m.parts().size(); i++) {
                double[] part = pmf(m.parts().get(i), ymax);
                for (int y = 0; y <= ymax; y++) {
                    out[y] += m.weight(i) * part[y];
                }
            }
        }
        return out;
    }

    /** Convolution truncated to [0, ymax]; exact on that range because all terms are ≥ 0. */
    static double[] convolve(double[] a, double[] b) {
        int ymax = a.length - 1;
        double[] out = new double[ymax + 1];
        for (int i = 0; i <= ymax; i++) {
            for (int j = 0; i + j <= ymax; j++) {
                out[i + j] += a[i] * b[j];
            }
        }
        return out;
    }

    /** ln pmf of the term on [0, ymax] from Commons Statistics logProbability. */
    static double[] logPmf(CountTerm t, int ymax) {
        double[] out = new double[ymax + 1];
        if (t instanceof BinomialTerm b) {
            BinomialDistribution d = BinomialDistribution.of((int) b.trials(), b.probability());
            for (int y = 0; y <= ymax; y++) {
                out[y] = d.logProbability(y);
            }
        } else if (t instanceof PoissonTerm p) {
            PoissonDistribution d = PoissonDistribution.of(p.mean());
            for (int y = 0; y <= ymax; y++) {
                out[y] = d.logProbability(y);
            }
        } else {
            MixtureTerm m = (MixtureTerm) t;
            Arrays.fill(out, Double.NEGATIVE_INFINITY);
            for (int i = 0; i < m.parts().size(); i++) {
                double[] part = logPmf(m.parts().get(i), ymax);
                double lw = Math.log(m.weight(i));
                for (int y = 0; y <= ymax; y++) {
                    out[y] = logAdd(out[y], lw + part[y]);
                }
            }
        }
        return out;
    }

    /** Log-domain convolution truncated to [0, ymax]. */
    static double[] logConvolve(double[] a, double[] b) {
        int ymax = a.length - 1;
        double[] out = new double[ymax + 1];
        Arrays.fill(out, Double.NEGATIVE_INFINITY);
        for (int i = 0; i <= ymax; i++) {
            for (int j = 0; i + j <= ymax; j++) {
                out[i + j] = logAdd(out[i + j], a[i] + b[j]);
            }
        }
        return out;
    }

    static double logAdd(double x, double y) {
        if (x == Double.NEGATIVE_INFINITY) {
            return y;
        }
        if (y == Double.NEGATIVE_INFINITY) {
            return x;
        }
        double m = Math.max(x, y);
        return m + Math.log1p(Math.exp(-Math.abs(x - y)));
    }

    /** ln Σ exp(a[from..to]). */
    static double logSum(double[] a, int from, int to) {
        double s = Double.NEGATIVE_INFINITY;
        for (int i = from; i <= to; i++) {
            s = logAdd(s, a[i]);
        }
        return s;
    }
}
