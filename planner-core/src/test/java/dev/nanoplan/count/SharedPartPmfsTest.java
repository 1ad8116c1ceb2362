package dev.nanoplan.count;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.ArrayList;
import java.util.List;
import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.simple.RandomSource;
import org.assertj.core.data.Offset;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

/** Computing the shared part once must give the same pmfs as convolving every full law. */
class SharedPartPmfsTest {

    @ParameterizedTest
    @ValueSource(longs = {1L, 2L, 3L, 4L, 5L, 6L})
    void sharedPartGivesTheSameDistributions(long seed) {
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(seed);
        double q = 0.2 + 0.6 * rng.nextDouble();
        List<CountTerm> shared = new ArrayList<>();
        for (int k = 1; k <= 1 + rng.nextInt(6); k++) {
            double p = 0.2 * rng.nextDouble() / k;
            long n = 50 + rng.nextInt(2000);
            shared.add(MixtureTerm.of(q, new BinomialTerm(0, p), new BinomialTerm(n, p)));
        }
        shared.add(new PoissonTerm(5 * rng.nextDouble()));
        List<CountLaw> own = List.of(CountLaw.of(new BinomialTerm(10, 0.3)), CountLaw.of(new BinomialTerm(900, 0.3)));
        List<CountPmf> fast = ExactCountModel.DEFAULT.pmfs(new CountLaw(shared), own);
        for (int i = 0; i < own.size(); i++) {
            List<CountTerm> all = new ArrayList<>(own.get(i).terms());
            all.addAll(shared);
            CountPmf full = ExactCountModel.DEFAULT.pmf(new CountLaw(all));
            CountPmf f = fast.get(i);
            // both are the exact convolution (sum of independent variables, definition); they may only
            // differ by the truncated mass (< 1e-15) and round-off
            for (long y = Math.min(full.offset(), f.offset()); y <= Math.max(full.last(), f.last()); y++) {
                assertThat(f.probability(y)).isCloseTo(full.probability(y),
                        Offset.offset(2e-15 + 1e-11 * full.probability(y)));
            }
            assertThat(f.truncatedMass()).isLessThan(1e-15);
        }
    }
}
