package dev.nanoplan.info;

/**
 * Capacity of a binary channel and the input distribution that achieves it.
 *
 * @param bits capacity in bits per channel use, in [0, 1]
 * @param priorOne capacity-achieving probability of sending a 1, in [0, 1]
 */
public record BinaryCapacity(double bits, double priorOne) {

    public BinaryCapacity {
        if (!(bits >= 0 && bits <= 1)) {
            throw new IllegalArgumentException("bits must be in [0, 1], got " + bits);
        }
        if (!(priorOne >= 0 && priorOne <= 1)) {
            throw new IllegalArgumentException("priorOne must be in [0, 1], got " + priorOne);
        }
    }
}
