package dev.nanoplan.count;

/**
 * Internal, mutable-free working form of a truncated pmf: {@code p[i]} = P(Y = offset + i),
 * with the dropped masses {@code below} and {@code above}. Arrays are shared, never copied;
 * only code in this package creates them.
 */
final class Window {

    final long offset;
    final double[] p;
    final double below;
    final double above;

    Window(long offset, double[] p, double below, double above) {
        this.offset = offset;
        this.p = p;
        this.below = below;
        this.above = above;
    }

    static Window point(long value) {
        return new Window(value, new double[] {1.0}, 0, 0);
    }

    int length() {
        return p.length;
    }

    /**
     * Drops whole cells from both ends while the mass dropped on that side, including what
     * was already dropped there, stays below {@code epsPerSide}.
     */
    Window trim(double epsPerSide) {
        return trimTo(epsPerSide, epsPerSide);
    }

    /** Drops further cells while the dropped mass grows by less than {@code extraPerSide}. */
    Window trimMore(double extraPerSide) {
        return trimTo(below + extraPerSide, above + extraPerSide);
    }

    private Window trimTo(double limitBelow, double limitAbove) {
        int lo = 0;
        int hi = p.length - 1;
        double newBelow = below;
        while (lo < hi && newBelow + p[lo] < limitBelow) {
            newBelow += p[lo++];
        }
        double newAbove = above;
        while (hi > lo && newAbove + p[hi] < limitAbove) {
            newAbove += p[hi--];
        }
        if (lo == 0 && hi == p.length - 1) {
            return this;
        }
        double[] q = new double[hi - lo + 1];
        System.arraycopy(p, lo, q, 0, q.length);
        return new Window(offset + lo, q, newBelow, newAbove);
    }

    /** Σ a[i] with Neumaier's compensated summation (error about 2⁻⁵³, independent of length). */
    static double sum(double[] a) {
        double s = 0;
        double c = 0;
        for (double v : a) {
            double t = s + v;
            c += Math.abs(s) >= Math.abs(v) ? (s - t) + v : (v - t) + s;
            s = t;
        }
        return s + c;
    }

    CountPmf toPmf() {
        return new CountPmf(offset, p, below, above);
    }
}
