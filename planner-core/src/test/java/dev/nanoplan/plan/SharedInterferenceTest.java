package dev.nanoplan.plan;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import dev.nanoplan.count.CountModelKind;
import dev.nanoplan.count.CountTerm;
import dev.nanoplan.network.Crosstalk;
import dev.nanoplan.network.LinkEvaluation;
import dev.nanoplan.network.LinkEvaluator;
import dev.nanoplan.network.LinkSpec;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.stream.LongStream;
import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.simple.RandomSource;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * The shared crosstalk of a receiver ({@link ReceiverCrosstalk}, {@link Crosstalk.Prepared}) against the
 * per-link path ({@link Crosstalk#terms(List, int)} and a full convolution per link) on random small
 * receivers: same terms bit for bit, same capacity within 1e-9 bit, also when the exactly treated
 * crosstalk is passed as its prefix and suffix parts ({@link ReceiverCrosstalk#partsWithout(int)}).
 */
class SharedInterferenceTest {

    static LongStream seeds() {
        return LongStream.range(1, 13);
    }

    /** A random emitter at the receiver: decaying taps, binary or 4-level, 10^2..10^4 molecules. */
    private static Crosstalk.Interferer emitter(UniformRandomProvider rng, int id, int memory, double[] w) {
        double[] taps = new double[memory + 1];
        double p0 = Math.pow(10, -4 + 2.7 * rng.nextDouble());
        for (int k = 0; k <= memory; k++) {
            taps[k] = p0 * Math.pow(k + 1, -1.5) * (0.5 + rng.nextDouble());
        }
        long top = Math.round(Math.pow(10, 2 + 2 * rng.nextDouble()));
        return new Crosstalk.Interferer("e" + id, taps, LinkSpec.evenLevels(w.length, top), w);
    }

    @ParameterizedTest
    @MethodSource("seeds")
    void sharedPathMatchesPerLinkPath(long seed) {
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(seed);
        int memory = 1 + rng.nextInt(4);
        int levels = rng.nextInt(4) == 0 ? 4 : 2;
        double prior = levels == 2 ? 0.2 + 0.6 * rng.nextDouble() : 0.5;
        double[] w = new double[levels];
        if (levels == 2) {
            w[0] = 1 - prior;
            w[1] = prior;
        } else {
            Arrays.fill(w, 1.0 / levels);
        }
        int count = 2 + rng.nextInt(14);
        int exact = new int[] {0, 1, 3, 8}[rng.nextInt(4)];
        double background = rng.nextBoolean() ? 0 : 5 * rng.nextDouble();
        List<Crosstalk.Interferer> all = new ArrayList<>();
        for (int i = 0; i < count; i++) {
            all.add(emitter(rng, i, memory, w));
        }
        Crosstalk.Prepared prepared = new Crosstalk.Prepared(all);
        ReceiverCrosstalk shared = new ReceiverCrosstalk(prepared, exact);
        for (int i = 0; i < count; i++) {
            List<Crosstalk.Interferer> others = new ArrayList<>(all);
            Crosstalk.Interferer own = others.remove(i);
            int rank = prepared.rankOf(i);
            List<CountTerm> reference = Crosstalk.terms(others, exact);
            // the prepared terms are the per-link terms, parameter for parameter
            assertThat(shared.termsWithout(rank)).isEqualTo(reference);
            LinkSpec spec = new LinkSpec(own.taps(), own.levelMolecules(), levels == 2 ? prior : 0.5, background,
                    CountModelKind.EXACT, 1.0);
            LinkEvaluation perLink = LinkEvaluator.evaluate(spec, reference);
            int covered = reference.size() - (shared.hasRemainder(rank) ? 1 : 0);
            LinkEvaluation viaShared = LinkEvaluator.evaluate(spec, reference, shared.pmfWithout(rank), covered);
            // W. Feller, An Introduction to Probability Theory and Its Applications, Vol. I, 3rd ed., 1968,
            // §XI.2: the law of a sum of independent counts does not depend on the order of convolution
            assertThat(viaShared.capacityBits()).as("seed %d link %d", seed, i)
                    .isCloseTo(perLink.capacityBits(), within(1e-9));
            assertThat(viaShared.minErrorProbability()).as("seed %d link %d", seed, i)
                    .isCloseTo(perLink.minErrorProbability(), within(1e-9 + 1e-6 * perLink.minErrorProbability()));
            // the same crosstalk as two parts (prefix and suffix products), convolved with the levels in one pass
            dev.nanoplan.count.CountPmf[] parts = shared.partsWithout(rank);
            LinkEvaluation viaParts = parts.length == 2
                    ? LinkEvaluator.evaluateBest(spec, reference, parts[0], parts[1], covered)
                    : LinkEvaluator.evaluateBest(spec, reference, parts[0], covered);
            // Feller 1968 §XI.2 as above: convolution is associative
            assertThat(viaParts.capacityBits()).as("seed %d link %d, parts", seed, i)
                    .isCloseTo(perLink.capacityBits(), within(1e-9));
            assertThat(viaParts.minErrorProbability()).as("seed %d link %d, parts", seed, i)
                    .isCloseTo(perLink.minErrorProbability(), within(1e-9 + 1e-6 * perLink.minErrorProbability()));
            if (i % 3 == 0) {
                shared.release();
            }
        }
    }
}
