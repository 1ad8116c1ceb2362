package dev.nanoplan.network;

import static org.assertj.core.api.Assertions.assertThat;

import dev.nanoplan.count.CountModelKind;
import dev.nanoplan.physics.DecayingSphereHitting;
import dev.nanoplan.physics.OpenSphereHitting;
import java.util.Arrays;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.params.provider.ValueSource;

class IsiTailTest {

    @ParameterizedTest
    @ValueSource(ints = {5, 10, 20, 30})
    void droppingOldLeftoversMovesTheErrorProbabilityByNoMoreThanTheStatedBound(int cut) {
        // a stable species (slow tail, so the dropped part is visible) and 40 lags, 20 molecules
        double[] taps = OpenSphereHitting.of(8, 2, 50).taps(0.5, 40);
        long n = 20;
        LinkEvaluation full = LinkEvaluator.evaluate(LinkSpec.binary(taps, 0, n, 0.5, 0.2, CountModelKind.EXACT, 1));
        double[] kept = Arrays.copyOf(taps, cut);
        LinkEvaluation cutOff = LinkEvaluator.evaluate(LinkSpec.binary(kept, 0, n, 0.5, 0.2, CountModelKind.EXACT, 1));
        double bound = IsiTail.droppedBound(taps, cut, n);
        // union bound P(any dropped molecule counted) <= E[dropped count] <= n·Σ p_k, and the coupling
        // inequality (Levin, Peres and Wilmer, Markov Chains and Mixing Times, 2009, Prop. 4.7): the
        // error of the best threshold moves by at most the total-variation distance
        assertThat(Math.abs(full.minErrorProbability() - cutOff.minErrorProbability())).isLessThanOrEqualTo(bound);
        assertThat(bound).isLessThan(1); // the check says something
    }

    @ParameterizedTest
    @CsvSource({"1000, 30000", "10000, 4000", "200, 100"})
    void aDecayingSpeciesKeepsAFewDozenLagsWithinTheBound(int memory, long n) {
        double[] taps = DecayingSphereHitting.of(60, 10, 50, 1.0).taps(1.0, memory);
        int len = IsiTail.kept(taps, n);
        // the rule of IsiTail: at least 65 taps, and the dropped tail at the margin within BOUND
        assertThat(len).isBetween(Math.min(taps.length, IsiTail.ALWAYS_KEPT + 1), 200);
        assertThat(IsiTail.droppedBound(taps, len, n * IsiTail.MOLECULE_MARGIN)).isLessThanOrEqualTo(IsiTail.BOUND);
        if (len > IsiTail.ALWAYS_KEPT + 1) {
            // one lag fewer would exceed the bound (the cut is the first that fits)
            assertThat(IsiTail.droppedBound(taps, len - 1, n * IsiTail.MOLECULE_MARGIN)).isGreaterThan(IsiTail.BOUND);
        }
    }

    @ParameterizedTest
    @CsvSource({"6", "10", "64"})
    void shortMemoriesAreNeverCut(int memory) {
        double[] taps = DecayingSphereHitting.of(300, 1, 50, 0.05).taps(1.0, memory);
        assertThat(IsiTail.truncate(taps, 1)).isSameAs(taps);
    }
}
