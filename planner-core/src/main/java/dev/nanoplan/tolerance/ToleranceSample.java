package dev.nanoplan.tolerance;

import java.io.Serializable;
import java.util.Arrays;

/**
 * The outcome of one perturbed layout: a work unit's serialisable result. Arrays follow the study's
 * link and demand order ({@link ToleranceStudy#links()}, {@link ToleranceStudy#demands()}).
 *
 * @param index       sample index
 * @param redraws     draws rejected before this layout (overlap or outside the volume)
 * @param z           standard-normal draw of each factor ({@link ToleranceStudy#factors()})
 * @param linkError   error probability of each link under the study's thresholds (1 when the link
 *                    fell out of the channel)
 * @param linkBits    mutual information of each link at its operating threshold, bits per symbol
 * @param demandMeets whether each demand meets both targets
 */
public record ToleranceSample(int index, int redraws, double[] z, double[] linkError, double[] linkBits,
        boolean[] demandMeets) implements Serializable {

    public ToleranceSample {
        z = z.clone();
        linkError = linkError.clone();
        linkBits = linkBits.clone();
        demandMeets = demandMeets.clone();
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof ToleranceSample s && index == s.index && redraws == s.redraws && Arrays.equals(z, s.z)
                && Arrays.equals(linkError, s.linkError) && Arrays.equals(linkBits, s.linkBits)
                && Arrays.equals(demandMeets, s.demandMeets);
    }

    @Override
    public int hashCode() {
        return Arrays.deepHashCode(new Object[] {index, redraws, z, linkError, linkBits, demandMeets});
    }
}
