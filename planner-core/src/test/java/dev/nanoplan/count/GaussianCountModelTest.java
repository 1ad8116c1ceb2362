package dev.nanoplan.count;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.data.Offset.offset;

import java.util.stream.DoubleStream;
import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.simple.RandomSource;
import org.apache.commons.statistics.distribution.NormalDistribution;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.EnumSource;
import org.junit.jupiter.params.provider.MethodSource;

class GaussianCountModelTest {

    static DoubleStream randomP() {
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(31415L);
        return DoubleStream.generate(() -> 0.05 + 0.9 * rng.nextDouble()).limit(5);
    }

    /** max over y of |P_a(Y ≤ y) − P_b(Y ≤ y)| (Kolmogorov distance). */
    static double kolmogorov(CountPmf a, CountPmf b) {
        long lo = Math.min(a.offset(), b.offset());
        long hi = Math.max(a.last(), b.last());
        double fa = a.massBelow();
        double fb = b.massBelow();
        double gap = Math.abs(fa - fb);
        for (long y = lo; y <= hi; y++) {
            fa += a.probability(y);
            fb += b.probability(y);
            gap = Math.max(gap, Math.abs(fa - fb));
        }
        return gap;
    }

    @ParameterizedTest
    @MethodSource("randomP")
    void gapToExactShrinksAsTrialsGrow(double p) {
        double previous = Double.POSITIVE_INFINITY;
        for (int n : new int[] {100, 1000, 10000, 100000}) {
            CountLaw law = CountLaw.of(new BinomialTerm(n, p), new PoissonTerm(1));
            double gap = kolmogorov(GaussianCountModel.DEFAULT.pmf(law), ExactCountModel.DEFAULT.pmf(law));
            // Berry–Esseen theorem (Berry 1941, Esseen 1942; from memory): distance to the normal
            // law is O(1/σ), so it must strictly decrease as n grows tenfold
            assertThat(gap).as("n = %d", n).isLessThan(previous);
            previous = gap;
        }
    }

    @Test
    void continuityCorrectedCellsAreNormalMassesOfUnitCells() {
        CountLaw law = CountLaw.of(new BinomialTerm(400, 0.25), new PoissonTerm(3));
        CountPmf pmf = GaussianCountModel.DEFAULT.pmf(law);
        double mu = law.mean();
        double sigma = Math.sqrt(law.variance());
        NormalDistribution normal = NormalDistribution.of(mu, sigma);
        for (long y = pmf.offset(); y <= pmf.last(); y++) {
            double ref = normal.probability(y - 0.5, y + 0.5);
            // Commons Statistics 1.2 NormalDistribution.probability(x0, x1)
            assertThat(pmf.probability(y)).isCloseTo(ref, offset(1e-14 * ref + 1e-17));
        }
        // normalisation axiom: window + recorded tails = 1
        assertThat(Window.sum(pmf.masses()) + pmf.truncatedMass()).isCloseTo(1.0, offset(1e-14));
    }

    @Test
    void densityVariantSamplesTheNormalDensity() {
        CountLaw law = CountLaw.of(new BinomialTerm(400, 0.25));
        CountPmf pmf = new GaussianCountModel(GaussianCountModel.Variant.DENSITY).pmf(law);
        NormalDistribution normal = NormalDistribution.of(law.mean(), Math.sqrt(law.variance()));
        for (long y = pmf.offset(); y <= pmf.last(); y++) {
            // Commons Statistics 1.2 NormalDistribution.density
            assertThat(pmf.probability(y)).isCloseTo(normal.density(y), offset(1e-14 * normal.density(y) + 1e-300));
        }
        // Poisson summation formula (from memory): Σ_y φ((y−μ)/σ)/σ = 1 up to ~2·exp(−2π²σ²)
        assertThat(Window.sum(pmf.masses()) + pmf.truncatedMass()).isCloseTo(1.0, offset(1e-13));
    }

    @Test
    void massBelowZeroIsFolded() {
        CountLaw law = CountLaw.of(new PoissonTerm(2));
        CountPmf pmf = GaussianCountModel.DEFAULT.pmf(law);
        assertThat(pmf.offset()).isZero();
        // Commons Statistics 1.2 NormalDistribution: mass below −½ under N(2, 2)
        double ref = NormalDistribution.of(2, Math.sqrt(2)).cumulativeProbability(-0.5);
        assertThat(pmf.massBelow()).isCloseTo(ref, offset(1e-15 * ref));
    }

    @ParameterizedTest
    @EnumSource(GaussianCountModel.Variant.class)
    void zeroVarianceIsAPointMass(GaussianCountModel.Variant variant) {
        CountPmf pmf = new GaussianCountModel(variant).pmf(CountLaw.of(new BinomialTerm(9, 1), new PoissonTerm(0)));
        assertThat(pmf.length()).isEqualTo(1);
        assertThat(pmf.offset()).isEqualTo(9);
        assertThat(pmf.probability(9)).isEqualTo(1.0);
    }

    @Test
    void hugeCountsStayFinite() {
        CountPmf pmf = GaussianCountModel.DEFAULT.pmf(CountLaw.of(new BinomialTerm(1_000_000_000L, 0.5)));
        assertThat(pmf.masses()).doesNotContain(Double.NaN);
        // normal mean (definition of the moment-matched model) = np
        assertThat(pmf.mean()).isCloseTo(5e8, offset(1e-3));
    }

    @Test
    void rejectsBadArguments() {
        assertThatThrownBy(() -> new GaussianCountModel(null, 1e-15)).isInstanceOf(IllegalArgumentException.class);
        assertThatThrownBy(() -> new GaussianCountModel(GaussianCountModel.Variant.DENSITY, 2))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("truncationMass");
    }
}
