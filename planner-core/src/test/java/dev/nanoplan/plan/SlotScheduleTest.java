package dev.nanoplan.plan;

import static org.assertj.core.api.Assertions.assertThat;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.util.stream.LongStream;
import java.util.stream.Stream;
import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.simple.RandomSource;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * Tap decimation of the round-robin schedule. Hand-derived cases use K = 3 and the taps
 * p_0..p_7 = 0.30, 0.10, 0.05, 0.04, 0.03, 0.02, 0.01, 0.005 (L = 7).
 */
class SlotScheduleTest {

    private static final double[] TAPS = {0.30, 0.10, 0.05, 0.04, 0.03, 0.02, 0.01, 0.005};

    @Test
    void ownTapsAreEveryKthLag() {
        // by hand: emitter k sends again K = 3 slots later, so its own leftovers come at lags 0, 3, 6 <= 7
        assertThat(SlotSchedule.ownTaps(TAPS, 3)).containsExactly(0.30, 0.04, 0.01);
        // by hand: K = 1 is all-active, every lag is an own earlier symbol
        assertThat(SlotSchedule.ownTaps(TAPS, 1)).containsExactly(TAPS);
        // by hand: K = 8 > L, only the current symbol
        assertThat(SlotSchedule.ownTaps(TAPS, 8)).containsExactly(0.30);
    }

    @Test
    void interfererTapsStartAtTheSlotDistance() {
        // by hand: decoding k = 0, emitter j = 1 sent (0 - 1) mod 3 = 2 slots earlier: lags 2, 5
        assertThat(SlotSchedule.interfererTaps(TAPS, 3, 0, 1)).containsExactly(0.05, 0.02);
        // by hand: j = 2 sent (0 - 2) mod 3 = 1 slot earlier: lags 1, 4, 7
        assertThat(SlotSchedule.interfererTaps(TAPS, 3, 0, 2)).containsExactly(0.10, 0.03, 0.005);
        // by hand: decoding k = 2, j = 0 sent 2 slots earlier: lags 2, 5
        assertThat(SlotSchedule.interfererTaps(TAPS, 3, 2, 0)).containsExactly(0.05, 0.02);
        // by hand: decoding k = 1, j = 0 sent 1 slot earlier: lags 1, 4, 7
        assertThat(SlotSchedule.interfererTaps(TAPS, 3, 1, 0)).containsExactly(0.10, 0.03, 0.005);
        // by hand (slot model of issue 13): another emitter in the same slot sends together, lags 0, 3, 6, 9
        assertThat(SlotSchedule.firstLag(3, 1, 1)).isEqualTo(0);
    }

    @Test
    void interfererBeyondTheMemoryIsSilent() {
        // by hand: L = 1, j = 1 first lands 2 slots before k = 0's slot, beyond L
        assertThat(SlotSchedule.interfererTaps(new double[] {0.3, 0.1}, 3, 0, 1)).isEmpty();
        // by hand: L = 1, j = 2 lands 1 slot before: lag 1 only
        assertThat(SlotSchedule.interfererTaps(new double[] {0.3, 0.1}, 3, 0, 2)).containsExactly(0.1);
    }

    @Test
    void badArgumentsAreRejectedWithTheirNames() {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> SlotSchedule.interfererTaps(TAPS, 3, 3, 0));
        assertThat(e.getMessage()).startsWith("k, j: must be in 0..2");
        assertThat(assertThrows(IllegalArgumentException.class, () -> SlotSchedule.ownTaps(TAPS, 0))
                .getMessage()).startsWith("frameSlots");
        assertThat(assertThrows(IllegalArgumentException.class, () -> SlotSchedule.ownTaps(new double[0], 2))
                .getMessage()).startsWith("taps");
    }

    static Stream<Long> seeds() {
        return LongStream.range(1, 21).boxed();
    }

    /**
     * Every lag 0..L of the slot decoded for emitter k carries the release of exactly one emitter:
     * the one whose index is k − lag (mod K), the definition of time-division multiple access
     * (common practice). So the decimated tap vectors of all K emitters, own included, partition the
     * taps: same multiset of values, each lag once.
     */
    @ParameterizedTest
    @MethodSource("seeds")
    void eachLagIsHeardFromExactlyOneEmitter(long seed) {
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(seed);
        int frame = 1 + rng.nextInt(7);
        int memory = rng.nextInt(20);
        int k = rng.nextInt(frame);
        // distinct taps encode their lag: tap l = (l + 1) / 1000
        double[] taps = new double[memory + 1];
        for (int l = 0; l <= memory; l++) {
            taps[l] = (l + 1) / 1000.0;
        }
        int[] heardFrom = new int[memory + 1];
        java.util.Arrays.fill(heardFrom, -1);
        for (int j = 0; j < frame; j++) {
            double[] got = j == k ? SlotSchedule.ownTaps(taps, frame) : SlotSchedule.interfererTaps(taps, frame, k, j);
            for (double t : got) {
                int lag = (int) Math.round(t * 1000) - 1;
                assertThat(heardFrom[lag]).as("lag %d heard twice", lag).isEqualTo(-1);
                heardFrom[lag] = j;
            }
        }
        for (int l = 0; l <= memory; l++) {
            // common practice (TDMA): the slot l earlier belonged to emitter (k - l) mod K
            assertThat(heardFrom[l]).isEqualTo(Math.floorMod(k - l, frame));
        }
    }
}
