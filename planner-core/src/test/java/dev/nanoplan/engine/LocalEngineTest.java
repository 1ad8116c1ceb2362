package dev.nanoplan.engine;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.atomic.AtomicInteger;
import java.util.concurrent.atomic.AtomicLong;
import java.util.function.BooleanSupplier;
import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.simple.RandomSource;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.junit.jupiter.api.Test;

class LocalEngineTest {

    /** Unit i: the sum of 1,000 draws of a generator seeded with (seed, i); a pure function of i. */
    record SeededSums(long seed, int count) implements WorkUnits<Double> {
        @Override
        public Double compute(int index, BooleanSupplier cancelled) {
            UniformRandomProvider rng = RandomSource.SPLIT_MIX_64.create(seed * 1_000_003L + index);
            double s = 0;
            for (int k = 0; k < 1000; k++) {
                s += rng.nextDouble();
            }
            return s;
        }

        @Override
        public long work(int index) {
            return index + 1;
        }
    }

    @ParameterizedTest
    @ValueSource(ints = {1, 2, 3, 8})
    void resultsComeBackInUnitOrderWhateverTheThreadCount(int threads) {
        SeededSums units = new SeededSums(17, 37);
        // the oracle: the same pure function called in a plain loop on this thread
        List<Double> expected = new ArrayList<>();
        for (int i = 0; i < units.count(); i++) {
            expected.add(units.compute(i, () -> false));
        }
        AtomicLong lastDone = new AtomicLong();
        AtomicLong total = new AtomicLong();
        UnitResults<Double> got = new LocalEngine(threads).run(units, (done, all) -> {
            lastDone.accumulateAndGet(done, Math::max);
            total.set(all);
        }, () -> false);
        assertThat(got.complete()).isTrue();
        assertThat(got.finished()).containsExactlyElementsOf(expected);
        // progress counts the units' work: 1 + 2 + … + 37 (arithmetic series)
        assertThat(total.get()).isEqualTo(37L * 38 / 2);
        assertThat(lastDone.get()).isEqualTo(37L * 38 / 2);
    }

    @Test
    void aCancelledRunHoldsOnlyTheUnitsThatFinishedInTheirSlots() {
        SeededSums units = new SeededSums(5, 50);
        AtomicInteger finished = new AtomicInteger();
        UnitResults<Double> got = new LocalEngine(1).run(units, (d, t) -> finished.incrementAndGet(),
                () -> finished.get() >= 10);
        assertThat(got.complete()).isFalse();
        assertThat(got.size()).isEqualTo(50);
        // one thread takes units in index order, so exactly units 0..9 finished
        assertThat(got.finished()).hasSize(10);
        for (int i = 0; i < 10; i++) {
            assertThat(got.get(i)).isEqualTo(units.compute(i, () -> false));
        }
        assertThat(got.get(10)).isNull();
    }

    @Test
    void aFailingUnitStopsTheBatchAndItsExceptionReachesTheCaller() {
        WorkUnits<Integer> failing = new WorkUnits<>() {
            @Override
            public int count() {
                return 20;
            }

            @Override
            public Integer compute(int index, BooleanSupplier cancelled) {
                if (index == 7) {
                    throw new IllegalArgumentException("unit 7: bad input");
                }
                return index;
            }
        };
        assertThatThrownBy(() -> new LocalEngine(2).run(failing)).isInstanceOf(IllegalArgumentException.class)
                .hasMessage("unit 7: bad input");
    }

    @Test
    void anEmptyBatchGivesAnEmptyCompleteResult() {
        UnitResults<Double> got = new LocalEngine(2).run(new SeededSums(1, 0));
        assertThat(got.size()).isZero();
        assertThat(got.complete()).isTrue();
    }

    @Test
    void threadsMustBePositive() {
        assertThatThrownBy(() -> new LocalEngine(0)).hasMessageContaining("threads");
    }
}
