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
     * Drops whole cells from both ends while the mass dropped on that side stays below
     * {@code epsPerSide}; the dropped mass is added to {@link #below} / {@link #above}.
     */
    Window trim(double epsPerSide) {
        int lo = 0;
        int hi = p.length - 1;
        double cut = 0;
        while (lo < hi && cut + p[lo] < epsPerSide) {
            cut += p[lo++];
        }
        double newBelow = below + cut;
        cut = 0;
        while (hi > lo && cut + p[hi] < epsPerSide) {
            cut += p[hi--];
        }
        double newAbove = above + cut;
        if (lo == 0 && hi == p.length - 1) {
            return this;
        }
        double[] q = new double[hi - lo + 1];
        System.arraycopy(p, lo, q, 0, q.length);
        return new Window(offset + lo, q, newBelow, newAbove);
    }

    CountPmf toPmf() {
        return new CountPmf(offset, p, below, above);
    }
}
