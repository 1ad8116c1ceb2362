package dev.nanoplan.info;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.util.stream.Stream;
import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.simple.RandomSource;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;

class EntropyTest {

    static Stream<Double> randomProbabilities() {
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(11L);
        return Stream.generate(rng::nextDouble).limit(40);
    }

    @ParameterizedTest
    @MethodSource("randomProbabilities")
    void binaryEntropyMatchesDefinition(double p) {
        double expected = -(p * Math.log(p) + (1 - p) * Math.log(1 - p)) / Math.log(2);
        // Cover & Thomas, Elements of Information Theory, 2nd ed., 2006, eq. (2.5): definition
        assertThat(Entropy.binaryBits(p)).isCloseTo(expected, within(1e-14));
        // Cover & Thomas 2006, Example 2.1.1: h is symmetric about 1/2
        assertThat(Entropy.binaryBits(1 - p)).isCloseTo(Entropy.binaryBits(p), within(1e-14));
    }

    @Test
    void binaryEntropyExtremes() {
        // Cover & Thomas 2006, Example 2.1.1: h(0) = h(1) = 0, h(1/2) = 1 bit
        assertThat(Entropy.binaryBits(0)).isEqualTo(0.0);
        assertThat(Entropy.binaryBits(1)).isEqualTo(0.0);
        assertThat(Entropy.binaryBits(0.5)).isEqualTo(1.0);
        // Series of the definition: h(p) = p log2(1/p) + p/ln 2 + O(p^2) for small p
        double p = 1e-300;
        double series = p * (-Math.log(p)) / Math.log(2) + p / Math.log(2);
        assertThat(Entropy.binaryBits(p)).isCloseTo(series, within(series * 1e-14));
        assertThat(Entropy.binaryBits(Double.MIN_VALUE)).isGreaterThan(0).isFinite();
        assertThatThrownBy(() -> Entropy.binaryBits(-0.1)).isInstanceOf(IllegalArgumentException.class);
        assertThatThrownBy(() -> Entropy.binaryBits(Double.NaN)).isInstanceOf(IllegalArgumentException.class);
    }

    @Test
    void entropyOfDistributions() {
        // Cover & Thomas 2006, Example 2.1.2: (1/2, 1/4, 1/8, 1/8) has entropy 7/4 bits
        assertThat(Entropy.bits(new double[] {0.5, 0.25, 0.125, 0.125})).isCloseTo(1.75, within(1e-15));
        // Cover & Thomas 2006, Theorem 2.6.4: uniform on n symbols has entropy log2 n
        double[] uniform = new double[26];
        java.util.Arrays.fill(uniform, 1.0 / 26);
        assertThat(Entropy.bits(uniform)).isCloseTo(Math.log(26) / Math.log(2), within(1e-13));
        // Convention 0 log 0 = 0 (Cover & Thomas 2006, §2.1)
        assertThat(Entropy.bits(new double[] {0, 1, 0})).isEqualTo(0.0);
        assertThatThrownBy(() -> Entropy.bits(new double[] {0.5, 0.4}))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("sum");
        assertThatThrownBy(() -> Entropy.bits(new double[0])).isInstanceOf(IllegalArgumentException.class);
    }
}
