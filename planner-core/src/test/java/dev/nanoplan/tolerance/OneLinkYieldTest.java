package dev.nanoplan.tolerance;

import static org.assertj.core.api.Assertions.assertThat;

import dev.nanoplan.plan.NetworkPlanner;
import dev.nanoplan.plan.PlanOptions;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.ScenarioReader;
import java.util.Locale;
import org.apache.commons.math3.analysis.integration.IterativeLegendreGaussIntegrator;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

/**
 * One link, position tolerance on the transmitter only, no ISI, crosstalk or background: the distance
 * to the receiver is |d0·e + σZ| with Z standard normal in 3D, a scaled noncentral chi distribution
 * with 3 degrees of freedom, so the yield is P(distance ≤ d*), d* the distance at which the link just
 * meets its error target.
 */
class OneLinkYieldTest {

    private static final double D0_UM = 20;
    private static final double SIGMA_UM = 3;
    private static double targetError;
    private static double dStarUm;
    private static double expectedYield;

    @BeforeAll
    static void reference() throws Exception {
        // the target: the link's minimum error at 21 µm, planned on its own (the nominal planner)
        targetError = minError(21.0);
        // d*: bisection on the planner's minimum error, which falls as the receiver gets nearer
        double lo = 15;
        double hi = 27;
        for (int i = 0; i < 40; i++) {
            double mid = (lo + hi) / 2;
            if (minError(mid) <= targetError) {
                lo = mid;
            } else {
                hi = mid;
            }
        }
        dStarUm = lo;
        // P(R ≤ d*) for R = |μ + σZ|, |μ| = d0: density r/(d0·σ·√(2π))·[e^{−(r−d0)²/2σ²} − e^{−(r+d0)²/2σ²}]
        // (the noncentral chi density with 3 degrees of freedom, scaled by σ; e.g. M. Abramowitz, I. A. Stegun,
        // Handbook of Mathematical Functions, 1964, 26.4.25 for the noncentral chi-square), by Gauss–Legendre
        // quadrature (Commons Math)
        expectedYield = new IterativeLegendreGaussIntegrator(16, 1e-12, 1e-12).integrate(10_000,
                r -> r / (D0_UM * SIGMA_UM * Math.sqrt(2 * Math.PI))
                        * (Math.exp(-(r - D0_UM) * (r - D0_UM) / (2 * SIGMA_UM * SIGMA_UM))
                                - Math.exp(-(r + D0_UM) * (r + D0_UM) / (2 * SIGMA_UM * SIGMA_UM))), 0, dStarUm);
    }

    static Scenario scenario(double distanceUm, double sigmaUm) throws Exception {
        String json = String.format(Locale.ROOT, """
                {"format": "nanoplan/1", "volume": {"shape": "open"},
                 "species": [{"name": "A", "diffusion_um2_per_s": 100}],
                 "signalling": {"symbol_time_s": 1, "isi_memory_symbols": 0, "count_model": "exact"},
                 "nodes": [
                   {"id": "tx", "role": "transmitter", "position_um": [0, 0, 0], "radius_um": 1, "species": "A",
                    "molecules_per_symbol": 200},
                   {"id": "rx", "role": "receiver", "position_um": [%s, 0, 0], "radius_um": 5, "species": "A"}],
                 "demands": [{"from": "tx", "to": "rx"}],
                 "targets": {"max_error_probability": %s, "min_rate_bits_per_s": 0},
                 "tolerances": {"position_sd_um": %s, "nodes": {"rx": {"position_sd_um": 0}}}}
                """, distanceUm, targetError > 0 ? targetError : 0.1, sigmaUm);
        return ScenarioReader.strict().parse(json).scenario();
    }

    private static double minError(double distanceUm) throws Exception {
        return NetworkPlanner.plan(scenario(distanceUm, 0), PlanOptions.DEFAULT).links().get(0).minErrorProbability();
    }

    static double simulatedYield(Sampler sampler, long seed, int n) throws Exception {
        ToleranceStudy study = new ToleranceStudy(scenario(D0_UM, SIGMA_UM), sampler, seed, Thresholds.RECALIBRATED);
        return new ToleranceRunner(study, 1, 0).run(n, k -> { }).links().get(0).yield();
    }

    @Test
    void yieldEqualsTheNoncentralChiProbabilityWithinThreeStandardErrors() throws Exception {
        int n = 1000;
        double y = simulatedYield(Sampler.RANDOM, 7, n);
        double se = Math.sqrt(expectedYield * (1 - expectedYield) / n);
        // a non-trivial case: neither almost sure nor almost impossible
        assertThat(expectedYield).isBetween(0.2, 0.8);
        // the quadrature of the noncentral chi law above, within 3 standard errors of a binomial proportion
        assertThat(y).isBetween(expectedYield - 3 * se, expectedYield + 3 * se);
    }

    @Test
    void sobolPointsGiveASmallerErrorThanRandomPointsAtEqualSamples() throws Exception {
        int n = 256;
        double sobol = 0;
        double random = 0;
        for (long seed = 1; seed <= 6; seed++) {
            sobol += Math.pow(simulatedYield(Sampler.SOBOL, seed, n) - expectedYield, 2);
            random += Math.pow(simulatedYield(Sampler.RANDOM, seed, n) - expectedYield, 2);
        }
        // mean squared error over seeds against the quadrature above: quasi-Monte Carlo converges faster than
        // Monte Carlo's 1/N (H. Niederreiter, Random Number Generation and Quasi-Monte Carlo Methods, SIAM 1992)
        assertThat(sobol).isLessThan(random);
    }
}
