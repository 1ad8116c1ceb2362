package dev.nanoplan.count;

/**
 * Bin(trials, probability): each of {@code trials} molecules is counted independently with
 * {@code probability}. {@code trials = 0} or {@code probability = 0} is the point mass at 0.
 */
public record BinomialTerm(long trials, double probability) implements CountTerm {

    public BinomialTerm {
        if (trials < 0) {
            throw new IllegalArgumentException("trials must be >= 0, got " + trials);
        }
        if (!(probability >= 0 && probability <= 1)) {
            throw new IllegalArgumentException("probability must be in [0, 1], got " + probability);
        }
    }

    @Override
    public double mean() {
        return trials * probability;
    }

    @Override
    public double variance() {
        return trials * probability * (1 - probability);
    }

    @Override
    public long maxValue() {
        return probability == 0 ? 0 : trials;
    }
}
