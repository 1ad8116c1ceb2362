package dev.nanoplan.sim;

import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.Species;
import java.util.Map;

/**
 * Chooses the simulation time step Δt from the geometry.
 *
 * <p>Automatic rule (common practice for Brownian dynamics with absorbing spheres, cf. S. S.
 * Andrews, D. Bray, Phys. Biol. 1, 2004, who relate the step length to the smallest feature):
 * the root-mean-square 3-D step √(6DΔt) must be at most {@value #STEP_FRACTION} of the smallest
 * receiver radius and of the smallest emitter–receiver surface gap (D the largest diffusion
 * coefficient among emitted species), and Δt ≤ T/{@value #MIN_STEPS_PER_SYMBOL}. Whatever Δt is
 * requested, it is then shortened to T/n with n = ⌈T/Δt⌉ so that slot boundaries fall on step
 * boundaries. Cost O(emitters × receivers).
 */
public final class TimeStepRule {

    /** √(6DΔt) ≤ this × the smallest radius and gap. */
    public static final double STEP_FRACTION = 0.1;
    /** At least this many steps per symbol time. */
    public static final int MIN_STEPS_PER_SYMBOL = 100;

    private TimeStepRule() {
    }

    /** The automatic Δt in s for the scenario (before alignment to T), &gt; 0. */
    public static double automaticTimeStepS(Scenario scenario) {
        double symbolTimeS = scenario.signalling().symbolTimeS();
        Map<String, Species> species = scenario.speciesByName();
        double maxD = 0;
        double minLength = Double.POSITIVE_INFINITY;
        for (Node e : scenario.nodes()) {
            if (!e.role().emits()) {
                continue;
            }
            maxD = Math.max(maxD, species.get(e.emitsSpecies()).diffusionUm2PerS());
            for (Node r : scenario.nodes()) {
                if (ParticleSimulator.senses(e, r)) {
                    minLength = Math.min(minLength, r.radiusUm());
                    minLength = Math.min(minLength, e.positionUm().distance(r.positionUm()) - r.radiusUm());
                }
            }
        }
        double dt = symbolTimeS / MIN_STEPS_PER_SYMBOL;
        if (maxD > 0 && minLength < Double.POSITIVE_INFINITY && minLength > 0) {
            double step = STEP_FRACTION * minLength;
            dt = Math.min(dt, step * step / (6 * maxD));
        }
        return dt;
    }

    /**
     * Steps per symbol time n = ⌈T/Δt⌉ (ratios within 1e-9 of an integer are rounded to it).
     *
     * @throws IllegalArgumentException if n exceeds {@link Integer#MAX_VALUE}
     */
    public static int stepsPerSymbol(double symbolTimeS, double timeStepS) {
        double ratio = symbolTimeS / timeStepS;
        double n = Math.abs(ratio - Math.rint(ratio)) <= 1e-9 * ratio ? Math.rint(ratio) : Math.ceil(ratio);
        if (!(n <= Integer.MAX_VALUE)) {
            throw new IllegalArgumentException("timeStepS: " + timeStepS + " s gives more than " + Integer.MAX_VALUE
                    + " steps per symbol time " + symbolTimeS + " s");
        }
        return Math.max(1, (int) n);
    }
}
