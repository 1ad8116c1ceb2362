package dev.nanoplan.count;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.data.Offset.offset;

import org.apache.commons.statistics.distribution.PoissonDistribution;
import org.junit.jupiter.api.Test;

class PoissonCountModelTest {

    @Test
    void isPoissonWithTheLawsMean() {
        CountLaw law = CountLaw.of(new BinomialTerm(1000, 0.05),
                MixtureTerm.of(0.5, new BinomialTerm(0, 0.01), new BinomialTerm(1000, 0.01)), new PoissonTerm(4));
        CountPmf pmf = PoissonCountModel.DEFAULT.pmf(law);
        PoissonDistribution d = PoissonDistribution.of(law.mean());
        for (long y = pmf.offset(); y <= pmf.last(); y++) {
            double ref = d.probability((int) y);
            // Commons Statistics 1.2 PoissonDistribution.probability
            assertThat(pmf.probability(y)).isCloseTo(ref, offset(1e-12 * ref));
        }
        // normalisation axiom
        assertThat(Window.sum(pmf.masses()) + pmf.truncatedMass()).isCloseTo(1.0, offset(1e-14));
        assertThat(pmf.truncatedMass()).isLessThan(1e-15);
    }

    @Test
    void zeroMeanIsThePointMassAtZero() {
        CountPmf pmf = PoissonCountModel.DEFAULT.pmf(CountLaw.of(new PoissonTerm(0), new BinomialTerm(5, 0)));
        assertThat(pmf.length()).isEqualTo(1);
        assertThat(pmf.probability(0)).isEqualTo(1.0);
    }
}
