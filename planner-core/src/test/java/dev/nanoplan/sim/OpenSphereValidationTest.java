package dev.nanoplan.sim;

import static org.assertj.core.api.Assertions.assertThat;

import dev.nanoplan.geometry.Volume;
import dev.nanoplan.physics.DecayingSphereHitting;
import dev.nanoplan.physics.OpenSphereHitting;
import dev.nanoplan.scenario.Flow;
import dev.nanoplan.scenario.Scenario;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * The simulator against the closed forms for one absorbing sphere in an open medium. Each case
 * checks the cumulative fraction absorbed at L + 1 times; with a 4 s.e. limit per check and
 * ~20 checks, the chance of a false failure of a correct simulator is about 20 × 6.3e-5 ≈ 1e-3
 * (normal approximation of the binomial), fixed seeds.
 */
class OpenSphereValidationTest {

    private static final double Z_LIMIT = 4;

    @ParameterizedTest(name = "d={0} r={1} D={2} T={3}")
    @CsvSource({
        // small receiver, r = 1 µm
        "3, 1, 100, 0.01, 3, 11",
        // typical link
        "15, 5, 100, 0.1, 3, 12",
        // close pair, gap equal to the radius
        "4, 2, 50, 0.02, 3, 13",
        // far small receiver
        "8, 1.5, 200, 0.02, 3, 14"})
    void hitFractionsMatchFirstPassageToASphere(double d, double r, double diff, double symbolTimeS, int memory,
            long seed) {
        Scenario s = Layouts.openPair(d, r, diff, symbolTimeS, memory);
        int m = 40_000;
        SimulatedChannel ch = ParticleSimulator.simulate(s, SimulationSettings.of(m, seed));
        double[] simulated = Layouts.cumulative(ch.taps("tx", "rx").orElseThrow());
        OpenSphereHitting exact = OpenSphereHitting.of(d, r, diff);
        for (int k = 0; k <= memory; k++) {
            double t = (k + 1) * symbolTimeS;
            double f = exact.cumulative(t);
            double se = Math.sqrt(f * (1 - f) / m);
            // S. Redner, A Guide to First-Passage Processes (2001), ch. 6: F(t) = (r/d) erfc((d − r)/√(4Dt))
            assertThat(Math.abs(simulated[k] - f)).as("t = %s s: simulated %s vs %s", t, simulated[k], f)
                    .isLessThan(Z_LIMIT * se);
        }
    }

    @ParameterizedTest(name = "half-life={0}")
    @CsvSource({"0.05, 21", "0.2, 22"})
    void decayingMoleculesMatchTheDecayClosedForm(double halfLifeS, long seed) {
        double d = 15;
        double r = 5;
        double diff = 100;
        double symbolTimeS = 0.1;
        int memory = 3;
        Scenario s = Layouts.pair(new Volume.Open(), new Flow.None(),
                d, r, diff, halfLifeS, symbolTimeS, memory);
        int m = 40_000;
        SimulatedChannel ch = ParticleSimulator.simulate(s, SimulationSettings.of(m, seed));
        double[] simulated = Layouts.cumulative(ch.taps("tx", "rx").orElseThrow());
        DecayingSphereHitting exact = DecayingSphereHitting.of(d, r, diff, halfLifeS);
        double noDecay = OpenSphereHitting.of(d, r, diff).cumulative((memory + 1) * symbolTimeS);
        for (int k = 0; k <= memory; k++) {
            double f = exact.cumulative((k + 1) * symbolTimeS);
            double se = Math.sqrt(f * (1 - f) / m);
            // Redner 2001 ch. 6 with first-order decay: F_λ(t) = ∫₀ᵗ f(s) e^{−λs} ds (docs/architecture.md §5.2 closed form)
            assertThat(Math.abs(simulated[k] - f)).as("slot %d: simulated %s vs %s", k, simulated[k], f)
                    .isLessThan(Z_LIMIT * se);
        }
        // decay must visibly lower the catch (guards against decay being ignored)
        assertThat(simulated[memory]).isLessThan(noDecay - 10 * Math.sqrt(noDecay / m));
    }
}
