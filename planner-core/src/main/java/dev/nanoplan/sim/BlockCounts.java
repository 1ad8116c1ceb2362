package dev.nanoplan.sim;

import java.io.Serializable;
import java.util.Arrays;

/**
 * What one simulation block (one emitter × one block of molecules) produced.
 *
 * @param emitter the emitter's index among the scenario's emitters (file order)
 * @param molecules molecules released in the block
 * @param counts absorptions, {@code counts[receiver * slots + slot]} (copied)
 * @param moleculeSteps molecule-steps advanced
 */
public record BlockCounts(int emitter, int molecules, long[] counts, long moleculeSteps) implements Serializable {

    public BlockCounts {
        counts = counts.clone();
    }

    /** A copy of the counts. */
    @Override
    public long[] counts() {
        return counts.clone();
    }

    /** Adds this block's counts into {@code into} (same layout). */
    void addTo(long[] into) {
        for (int i = 0; i < counts.length; i++) {
            into[i] += counts[i];
        }
    }

    @Override
    public boolean equals(Object o) {
        // every component, the array by content
        return o instanceof BlockCounts b && emitter == b.emitter && molecules == b.molecules
                && moleculeSteps == b.moleculeSteps && Arrays.equals(counts, b.counts);
    }

    @Override
    public int hashCode() {
        return 31 * (31 * (31 * emitter + molecules) + Long.hashCode(moleculeSteps)) + Arrays.hashCode(counts);
    }
}
