package dev.nanoplan.network;

import static org.assertj.core.api.Assertions.assertThat;

import dev.nanoplan.count.CountModelKind;
import dev.nanoplan.count.CountTerm;
import dev.nanoplan.physics.OpenSphereHitting;
import java.util.ArrayList;
import java.util.List;
import java.util.stream.LongStream;
import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.simple.RandomSource;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;

class GaussianScreenTest {

    static LongStream seeds() {
        return LongStream.range(0, 40);
    }

    @ParameterizedTest
    @MethodSource("seeds")
    void earlyExitDecisionEqualsTheEstimateTimesTheSafetyFactor(long seed) {
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(seed);
        double r = 5;
        double d = r + 1 + 60 * rng.nextDouble();
        int memory = rng.nextInt(4);
        double[] taps = OpenSphereHitting.of(d, r, 100).taps(0.5, memory);
        long n = 10 + rng.nextInt(20000);
        LinkSpec spec = LinkSpec.binary(taps, 0, n, 0.5, 20 * rng.nextDouble(), CountModelKind.EXACT, 0.5);
        List<Crosstalk.Interferer> others = new ArrayList<>();
        for (int i = rng.nextInt(4); i > 0; i--) {
            double di = r + 1 + 60 * rng.nextDouble();
            others.add(new Crosstalk.Interferer("i" + i, OpenSphereHitting.of(di, r, 100).taps(0.5, memory),
                    new long[] {0, 10 + rng.nextInt(20000)}, new double[] {0.5, 0.5}));
        }
        List<CountTerm> terms = Crosstalk.terms(others, 8);
        double estimate = GaussianScreen.estimateBits(spec, terms);
        for (double floor : new double[] {1e-4, 1e-3, 0.01, 0.1, 0.5, 0.99}) {
            // the planner's rule (NetworkPlanner): evaluate iff estimate × SAFETY_FACTOR ≥ floor
            assertThat(GaussianScreen.passes(spec, terms, floor))
                    .as("floor %s, estimate %s", floor, estimate)
                    .isEqualTo(estimate * GaussianScreen.SAFETY_FACTOR >= floor);
        }
    }
}
