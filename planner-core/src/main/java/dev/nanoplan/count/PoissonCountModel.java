package dev.nanoplan.count;

/**
 * Poisson approximation: the count is taken as Poisson with the law's mean, ignoring the
 * binomial and mixture structure (the usual "rare hits" shortcut; Le Cam's inequality bounds
 * its total-variation error by Σ p_i² for sums of Bernoulli variables — L. Le Cam, Pacific J.
 * Math. 10 (1960) 1181–1197).
 *
 * <p>The window drops less than truncationMass/2 on each side; masses by the exact Poisson
 * ratio recurrence from the mode (see {@code TermWindows}), about 1e-13 relative against
 * Commons Statistics {@code PoissonDistribution}. Mean 0 gives the point mass at 0. Cost O(√mean).
 */
public final class PoissonCountModel implements CountModel {

    /** Poisson model with truncation 1e-15. */
    public static final PoissonCountModel DEFAULT =
            new PoissonCountModel(ExactCountModel.DEFAULT_TRUNCATION_MASS);

    private final double truncationMass;

    /** @param truncationMass total probability left out of the window, in (0, 0.5] */
    public PoissonCountModel(double truncationMass) {
        if (!(truncationMass > 0 && truncationMass <= 0.5)) {
            throw new IllegalArgumentException("truncationMass must be in (0, 0.5], got "
                    + truncationMass);
        }
        this.truncationMass = truncationMass;
    }

    public double truncationMass() {
        return truncationMass;
    }

    @Override
    public CountPmf pmf(CountLaw law) {
        return TermWindows.poisson(law.mean(), truncationMass / 2).toPmf();
    }
}
