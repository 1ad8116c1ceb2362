package dev.nanoplan.count;

/**
 * A probability mass function on the integer window [offset, offset + length): {@code pmf[i]}
 * = P(Y = offset + i). Mass left out of the window is recorded in {@link #massBelow()} and
 * {@link #massAbove()} (zero when nothing was truncated).
 */
public final class CountPmf {

    private final long offset;
    private final double[] pmf;
    private final double massBelow;
    private final double massAbove;

    public CountPmf(long offset, double[] pmf, double massBelow, double massAbove) {
        if (offset < 0) {
            throw new IllegalArgumentException("offset must be >= 0, got " + offset);
        }
        if (pmf.length == 0) {
            throw new IllegalArgumentException("pmf window must not be empty");
        }
        if (!(massBelow >= 0) || !(massAbove >= 0)) {
            throw new IllegalArgumentException("truncated masses must be >= 0");
        }
        this.offset = offset;
        this.pmf = pmf.clone();
        this.massBelow = massBelow;
        this.massAbove = massAbove;
    }

    /** First count of the window. */
    public long offset() {
        return offset;
    }

    /** Number of counts in the window. */
    public int length() {
        return pmf.length;
    }

    /** Last count of the window (inclusive). */
    public long last() {
        return offset + pmf.length - 1;
    }

    /** P(Y = y), 0 outside the window. */
    public double probability(long y) {
        long i = y - offset;
        return i < 0 || i >= pmf.length ? 0 : pmf[(int) i];
    }

    /** A copy of the window's masses. */
    public double[] masses() {
        return pmf.clone();
    }

    /** Mass at window index i (no copy). */
    public double massAt(int i) {
        return pmf[i];
    }

    public double massBelow() {
        return massBelow;
    }

    public double massAbove() {
        return massAbove;
    }

    /** Total mass dropped by truncation. */
    public double truncatedMass() {
        return massBelow + massAbove;
    }

    /** Mean over the window. */
    public double mean() {
        double s = 0;
        for (int i = 0; i < pmf.length; i++) {
            s += pmf[i] * (offset + i);
        }
        return s;
    }
}
