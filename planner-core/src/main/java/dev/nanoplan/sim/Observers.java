package dev.nanoplan.sim;

import java.util.Arrays;

/**
 * The passive (transparent) observers one emitter's molecules can be seen by, with their sampling
 * instants: observer j counts the molecules inside its sphere at t = k·T + offset_j for slots
 * k = 0..L (offset_j the receiver's {@code sampling_offset_s}, by default T: the end of the slot),
 * which is step boundary round(t/Δt) (at least step 1). Observers neither absorb nor move molecules.
 *
 * <p>Events are sorted by step so the kernel walks them with one cursor; each event costs one pass
 * over the block's molecules (O(active)), and there are (L+1) events per observer. Immutable, shared
 * between threads.
 */
final class Observers {

    /** Number of sampling events. */
    final int events;
    /** Per event, in step order: the step boundary (time = step·Δt) of the sample. */
    final int[] step;
    /** Per event: where its count goes in a block's counts, receiver × slots + slot. */
    final int[] countIndex;
    /** Per event: the observer's centre and squared radius. */
    private final double[] sphere;
    /** The last sampling step (0 without observers). */
    final int lastStep;

    /**
     * @param centres x,y,z of each observer's centre, µm
     * @param radii radii, µm
     * @param receiverIndex each observer's index in the simulation's receiver list
     * @param offsetSteps each observer's sampling offset in steps after a slot starts (≥ 1)
     * @param stepsPerSlot steps per symbol time
     * @param slots L + 1
     */
    Observers(double[][] centres, double[] radii, int[] receiverIndex, int[] offsetSteps, int stepsPerSlot,
            int slots) {
        int n = radii.length;
        events = n * slots;
        long[] order = new long[events];
        int[] stepOf = new int[events];
        int[] indexOf = new int[events];
        double[] sphereOf = new double[4 * events];
        int e = 0;
        for (int j = 0; j < n; j++) {
            for (int k = 0; k < slots; k++) {
                long s = (long) k * stepsPerSlot + offsetSteps[j];
                if (s > Integer.MAX_VALUE) {
                    throw new IllegalArgumentException("samplingOffsetS: the sampling instant of slot " + k
                            + " needs more than " + Integer.MAX_VALUE + " steps");
                }
                stepOf[e] = (int) s;
                indexOf[e] = receiverIndex[j] * slots + k;
                sphereOf[4 * e] = centres[j][0];
                sphereOf[4 * e + 1] = centres[j][1];
                sphereOf[4 * e + 2] = centres[j][2];
                sphereOf[4 * e + 3] = radii[j] * radii[j];
                order[e] = (s << 20) | e; // events < 2^20 (slots ≤ a few hundred, observers few)
                e++;
            }
        }
        Arrays.sort(order);
        step = new int[events];
        countIndex = new int[events];
        sphere = new double[4 * events];
        int last = 0;
        for (int i = 0; i < events; i++) {
            int src = (int) (order[i] & ((1 << 20) - 1));
            step[i] = stepOf[src];
            countIndex[i] = indexOf[src];
            System.arraycopy(sphereOf, 4 * src, sphere, 4 * i, 4);
            last = Math.max(last, step[i]);
        }
        lastStep = last;
    }

    /** No observers. */
    static Observers none() {
        return new Observers(new double[0][], new double[0], new int[0], new int[0], 1, 1);
    }

    /**
     * The sampling offset in steps: round(offset/Δt), at least 1; the end of the slot ({@code stepsPerSlot})
     * when {@code samplingOffsetS} is null.
     */
    static int offsetSteps(Double samplingOffsetS, double timeStepS, int stepsPerSlot) {
        if (samplingOffsetS == null) {
            return stepsPerSlot;
        }
        double s = Math.rint(samplingOffsetS / timeStepS);
        if (s > Integer.MAX_VALUE) {
            throw new IllegalArgumentException("samplingOffsetS: " + samplingOffsetS + " s is more than "
                    + Integer.MAX_VALUE + " time steps");
        }
        return Math.max(1, (int) s);
    }

    /**
     * Molecules of the block's first {@code active} entries inside the sphere of event {@code e} at its
     * step boundary; a molecule whose decay step is at or before that boundary is gone (it is removed at
     * the start of its decay step, {@link MoleculeBlock}).
     */
    long inside(int e, double[] x, double[] y, double[] z, int[] death, int active) {
        int s = step[e];
        int o = 4 * e;
        double cx = sphere[o];
        double cy = sphere[o + 1];
        double cz = sphere[o + 2];
        double r2 = sphere[o + 3];
        long c = 0;
        for (int i = 0; i < active; i++) {
            double dx = x[i] - cx;
            double dy = y[i] - cy;
            double dz = z[i] - cz;
            if (dx * dx + dy * dy + dz * dz <= r2 && death[i] > s) {
                c++;
            }
        }
        return c;
    }
}
