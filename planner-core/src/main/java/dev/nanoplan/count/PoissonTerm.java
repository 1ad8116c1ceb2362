package dev.nanoplan.count;

/** Poisson(mean): background molecules counted in one slot. {@code mean = 0} is the point mass at 0. */
public record PoissonTerm(double mean) implements CountTerm {

    public PoissonTerm {
        if (!(mean >= 0) || Double.isInfinite(mean)) {
            throw new IllegalArgumentException("Poisson mean must be finite and >= 0, got " + mean);
        }
    }

    @Override
    public double variance() {
        return mean;
    }

    @Override
    public long maxValue() {
        return mean == 0 ? 0 : Long.MAX_VALUE;
    }
}
