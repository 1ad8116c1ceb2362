package dev.nanoplan.network;

/**
 * An evaluated link as a graph edge.
 *
 * @param from         emitter id
 * @param to           receiver id
 * @param capacityBits capacity in bits per symbol, in [0, log2 M]
 * @param channel      transition matrix at the capacity-achieving detector, channel[i][j] =
 *                     P(decide j | sent i); binary: [[1−ε₀, ε₀], [ε₁, 1−ε₁]]
 */
public record LinkEdge(String from, String to, double capacityBits, double[][] channel) {

    public LinkEdge {
        if (from == null || to == null) {
            throw new IllegalArgumentException("from/to: must not be null");
        }
        if (!(capacityBits >= 0) || Double.isInfinite(capacityBits)) {
            throw new IllegalArgumentException("capacityBits: must be finite and >= 0, got " + capacityBits);
        }
        double[][] copy = new double[channel.length][];
        for (int i = 0; i < channel.length; i++) {
            copy[i] = channel[i].clone();
        }
        channel = copy;
    }

    @Override
    public double[][] channel() {
        double[][] copy = new double[channel.length][];
        for (int i = 0; i < channel.length; i++) {
            copy[i] = channel[i].clone();
        }
        return copy;
    }

    // identity semantics: JGraphT needs distinct edge objects; two links between the same pair
    // cannot occur in one plan
    @Override
    public boolean equals(Object o) {
        return this == o;
    }

    @Override
    public int hashCode() {
        return System.identityHashCode(this);
    }

    @Override
    public String toString() {
        return from + "->" + to + " (" + capacityBits + " bit)";
    }
}
