package dev.nanoplan.count;

/**
 * One independent, non-negative integer-valued summand of a slot count.
 *
 * <p>A slot count is a sum of independent terms ({@link CountLaw}): the current symbol's
 * molecules ({@link BinomialTerm}), each earlier symbol's leftovers (a {@link MixtureTerm} over
 * the symbol values sent, i.i.d. with the prior), each neighbour's molecules, and background
 * ({@link PoissonTerm}).
 */
public sealed interface CountTerm permits BinomialTerm, PoissonTerm, MixtureTerm {

    /** Expected value. */
    double mean();

    /** Variance. */
    double variance();

    /** Largest possible value, or {@link Long#MAX_VALUE} when unbounded. */
    long maxValue();
}
