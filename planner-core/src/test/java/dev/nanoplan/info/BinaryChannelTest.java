package dev.nanoplan.info;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.util.stream.Stream;
import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.simple.RandomSource;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

class BinaryChannelTest {

    private static final BlahutArimoto PRECISE = new BlahutArimoto(1e-14, 2_000_000);

    static Stream<Double> crossovers() {
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(21L);
        return Stream.concat(Stream.of(1e-300, 1e-12, 0.5 - 1e-9, 0.999),
                Stream.generate(rng::nextDouble).limit(30));
    }

    static Stream<Arguments> crossoverPairs() {
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(22L);
        return Stream.generate(() -> {
            // spread over many decades, both sides of e0 + e1 = 1
            double e0 = rng.nextBoolean() ? rng.nextDouble() : Math.pow(10, -12 * rng.nextDouble());
            double e1 = rng.nextBoolean() ? rng.nextDouble() : Math.pow(10, -12 * rng.nextDouble());
            return Arguments.of(e0, e1);
        }).limit(40);
    }

    private static double h(double p) {
        return p == 0 || p == 1 ? 0 : -(p * Math.log(p) + (1 - p) * Math.log(1 - p)) / Math.log(2);
    }

    @ParameterizedTest
    @MethodSource("crossovers")
    void bscCapacity(double p) {
        BinaryCapacity c = BinaryChannel.capacity(p, p);
        // Cover & Thomas, Elements of Information Theory, 2nd ed., 2006, eq. (7.15) (from memory): C = 1 - h(p)
        assertThat(c.bits()).isCloseTo(1 - Entropy.binaryBits(p), within(1e-13));
        // Cover & Thomas 2006, §7.1.4 (from memory): the uniform input achieves the BSC capacity
        if (Math.abs(p - 0.5) > 1e-3) {
            assertThat(c.priorOne()).isCloseTo(0.5, within(1e-9));
        }
    }

    @ParameterizedTest
    @MethodSource("crossovers")
    void zChannelCapacity(double p) {
        // Z channel: input 0 is received without error (e0 = 0), input 1 becomes 0 with prob. p.
        double expected = Math.log1p((1 - p) * Math.pow(p, p / (1 - p))) / Math.log(2);
        BinaryCapacity c = BinaryChannel.capacity(0, p);
        // Cover & Thomas 2006, Problem 7.8 (from memory): C = log2(1 + (1-p) p^{p/(1-p)})
        assertThat(c.bits()).isCloseTo(expected, within(1e-13));
        // Mirror image (e0 = p, e1 = 0): relabelling inputs and outputs leaves C unchanged and
        // maps the optimal prior q to 1 - q (Cover & Thomas 2006, §7.1, symmetry of the definition)
        BinaryCapacity mirrored = BinaryChannel.capacity(p, 0);
        assertThat(mirrored.bits()).isCloseTo(expected, within(1e-13));
        assertThat(mirrored.priorOne()).isCloseTo(1 - c.priorOne(), within(1e-9));
    }

    @Test
    void zChannelHalfHasKnownPrior() {
        BinaryCapacity c = BinaryChannel.capacity(0, 0.5);
        // Cover & Thomas 2006, Problem 7.8 solution (from memory): C = log2(5) - 2, P(X=1) = 2/5
        assertThat(c.bits()).isCloseTo(Math.log(5) / Math.log(2) - 2, within(1e-15));
        assertThat(c.priorOne()).isCloseTo(0.4, within(1e-14));
    }

    @ParameterizedTest
    @MethodSource("crossoverPairs")
    void closedFormMatchesBlahutArimoto(double e0, double e1) {
        BinaryCapacity c = BinaryChannel.capacity(e0, e1);
        BlahutArimoto.Result ba = PRECISE.compute(new double[][] {{1 - e0, e0}, {e1, 1 - e1}});
        // Blahut 1972 / Arimoto 1972: iterative capacity with certified gap
        assertThat(c.bits()).isCloseTo(ba.capacityBits(), within(1e-12 + ba.gapBits()));
        assertThat(c.bits()).isLessThanOrEqualTo(ba.upperBoundBits() + 1e-15);
        if (c.bits() > 1e-6) {
            assertThat(c.priorOne()).isCloseTo(ba.inputDistribution()[1], within(1e-5));
        }
        assertThat(c.bits()).isBetween(0.0, 1.0);
    }

    @ParameterizedTest
    @MethodSource("crossoverPairs")
    void closedFormMatchesSilvermanExpression(double e0, double e1) {
        double delta = 1 - e0 - e1;
        if (Math.abs(delta) < 1e-2) {
            return; // the plain expression below cancels badly there; covered by the BA test
        }
        double silverman = Math.log(1 + Math.pow(2, (h(e0) - h(e1)) / delta)) / Math.log(2)
                - ((1 - e1) * h(e0) - e0 * h(e1)) / delta;
        // Silverman, "On binary channels and their cascades", IRE Trans. IT-1, 1955 (closed form)
        assertThat(BinaryChannel.capacity(e0, e1).bits()).isCloseTo(silverman, within(1e-11));
    }

    @ParameterizedTest
    @MethodSource("crossoverPairs")
    void mutualInformationMatchesDefinitionAndBounds(double e0, double e1) {
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(Double.doubleToLongBits(e0));
        double q = rng.nextDouble();
        double r1 = (1 - q) * e0 + q * (1 - e1);
        double definition = h(r1) - (1 - q) * h(e0) - q * h(e1);
        double mi = BinaryChannel.mutualInformationBits(q, e0, e1);
        // Cover & Thomas 2006, eq. (2.39): I(X;Y) = H(Y) - H(Y|X)
        assertThat(mi).isCloseTo(definition, within(1e-12));
        // Cover & Thomas 2006, eq. (2.90) and Theorem 2.6.4: 0 <= I <= H(X) <= 1 bit
        assertThat(mi).isBetween(0.0, Math.min(1.0, h(q) + 1e-15));
        // capacity is the maximum over the prior (Cover & Thomas 2006, eq. 7.1)
        assertThat(mi).isLessThanOrEqualTo(BinaryChannel.capacity(e0, e1).bits() + 1e-15);
    }

    @Test
    void extremes() {
        BinaryCapacity tiny = BinaryChannel.capacity(1e-300, 1e-300);
        // Cover & Thomas 2006, §7.1.1 (noiseless binary channel, C = 1 bit) as the limit
        assertThat(tiny.bits()).isLessThanOrEqualTo(1.0).isGreaterThan(1 - 1e-12);
        assertThat(BinaryChannel.capacity(0, 0).bits()).isEqualTo(1.0);
        assertThat(BinaryChannel.capacity(1, 1).bits()).isEqualTo(1.0);
        // Cover & Thomas 2006, eq. (7.15) at p = 1/2: useless channel, C = 0
        assertThat(BinaryChannel.capacity(0.5, 0.5).bits()).isEqualTo(0.0);
        assertThat(BinaryChannel.capacity(0.3, 0.7).bits()).isEqualTo(0.0);
        assertThat(BinaryChannel.mutualInformationBits(0.5, 1e-300, 1e-300)).isEqualTo(1.0);
        assertThat(BinaryChannel.mutualInformationBits(0, 0.1, 0.2)).isEqualTo(0.0);
        // Complements: e0 = 1 - 1e-30 is not representable, its complement is.
        BinaryCapacity swapped = BinaryChannel.capacity(1, 1e-30, 1, 1e-30);
        assertThat(swapped.bits()).isGreaterThan(1 - 1e-12).isLessThanOrEqualTo(1.0);
        assertThat(BinaryChannel.mutualInformationBits(0.5, 1, 1e-30, 1, 1e-30))
                .isGreaterThan(1 - 1e-12).isLessThanOrEqualTo(1.0);
        assertThatThrownBy(() -> BinaryChannel.capacity(0.5, Double.NaN))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("e1");
        assertThatThrownBy(() -> BinaryChannel.mutualInformationBits(0.5, 0.2, 0.2, 0.1, 0.9))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("complement");
    }

    @ParameterizedTest
    @MethodSource("crossovers")
    void nearlyUselessChannelsStayAccurate(double e0) {
        // e0 + e1 = 1 - delta with delta tiny: capacity must be tiny, non-negative and agree
        // with Blahut-Arimoto (Blahut 1972) on the complement-exact matrix.
        double delta = 1e-7;
        double e1 = 1 - e0 - delta;
        if (!(e1 >= 0 && e1 <= 1)) {
            return;
        }
        double c1 = e0 + delta;
        BinaryCapacity c = BinaryChannel.capacity(e0, 1 - e0, e1, c1);
        BlahutArimoto.Result ba = PRECISE.compute(new double[][] {{1 - e0, e0}, {e1, c1}});
        assertThat(c.bits()).isGreaterThanOrEqualTo(0.0)
                .isCloseTo(ba.capacityBits(), within(1e-13 + ba.gapBits()));
    }

    @Test
    void batchMutualInformationMatchesDefinition() {
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(23L);
        int n = 200;
        double[] e0 = new double[n];
        double[] c0 = new double[n];
        double[] e1 = new double[n];
        double[] c1 = new double[n];
        for (int i = 0; i < n; i++) {
            // include nearly useless channels (e0 + e1 within 1e-25 of 1) and tiny tails
            e0[i] = i % 3 == 0 ? Math.pow(10, -30 * rng.nextDouble()) : rng.nextDouble();
            c0[i] = 1 - e0[i];
            e1[i] = i % 4 == 0 ? c0[i] : rng.nextDouble();
            c1[i] = i % 4 == 0 ? e0[i] : 1 - e1[i];
        }
        double q = 0.37;
        double[] batch = BinaryChannel.mutualInformationBits(q, e0, c0, e1, c1);
        for (int i = 0; i < n; i++) {
            double r1 = (1 - q) * e0[i] + q * c1[i];
            double definition = h(r1) - (1 - q) * h(e0[i]) - q * h(e1[i]);
            // Cover & Thomas 2006, eq. (2.39): I(X;Y) = H(Y) - H(Y|X)
            assertThat(batch[i]).isCloseTo(definition, within(1e-12));
            // same as the scalar method up to its rounding (a few 1e-16) and the negligible cut-off
            assertThat(batch[i]).isCloseTo(BinaryChannel.mutualInformationBits(q, e0[i], c0[i], e1[i], c1[i]),
                    within(1e-15 + BinaryChannel.NEGLIGIBLE_BITS));
            if (i % 4 == 0) {
                // identical rows: I = 0 (Cover & Thomas 2006, eq. 2.90 equality condition), up to rounding
                assertThat(batch[i]).isLessThan(1e-15);
            }
        }
        assertThatThrownBy(() -> BinaryChannel.mutualInformationBits(q, e0, c0, e1, new double[1]))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("lengths");
    }
}
