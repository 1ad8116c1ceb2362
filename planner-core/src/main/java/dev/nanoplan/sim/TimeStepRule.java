package dev.nanoplan.sim;

import dev.nanoplan.geometry.Volume;
import dev.nanoplan.scenario.Flow;
import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.ReceiverModel;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.Species;
import java.util.Map;

/**
 * Chooses the simulation time step Δt from the geometry.
 *
 * <p>Automatic rule (common practice for Brownian dynamics with absorbing spheres, cf. S. S.
 * Andrews, D. Bray, Phys. Biol. 1, 2004, who relate the step length to the smallest feature):
 * the root-mean-square 3-D step plus the largest drift step, √(6DΔt) + v_max·Δt, must be at most
 * {@value #STEP_FRACTION} of the smallest receiver radius and of the smallest emitter–receiver
 * surface gap (D the largest diffusion coefficient among emitted species, v_max the largest flow
 * speed: |v| for uniform flow, 2u on a Poiseuille axis), Δt ≤ T/{@value #MIN_STEPS_PER_SYMBOL}, and in a cylinder
 * the per-axis step √(2DΔt) ≤ {@value #CURVED_WALL_FRACTION} R (where the radial mirroring of the
 * curved wall is measured to bias the near-wall density by about 1 %, see {@link Motion}). Whatever Δt is
 * requested, it is then shortened to T/n with n = ⌈T/Δt⌉ so that slot boundaries fall on step
 * boundaries. With a reactive receiver, also κ√(πΔt/D) ≤ {@value #MAX_ADSORPTION_PROBABILITY} (the
 * adsorption probability per crossing; see {@link #MAX_ADSORPTION_PROBABILITY}). Cost O(emitters × receivers).
 *
 * <p>Why {@value #STEP_FRACTION} and not the textbook 0.1: the Brownian-bridge crossing correction
 * ({@link Absorbers}) removes most of the fixed-step under-count, so steps of 0.4 r are accurate
 * enough and 16 times cheaper than 0.1 r. Measured (seeded runs of 10⁶ molecules, open medium,
 * one sphere, cumulative F at T..4T against the closed form of S. Redner, <i>A Guide to
 * First-Passage Processes</i>, 2001): d = 3 µm, r = 1 µm, D = 100 µm²/s, √(6DΔt) = 0.40 r:
 * +0.3 % relative (standard error 0.2–0.4 %); d = 8 µm, r = 1.5 µm, D = 200 µm²/s,
 * √(6DΔt) = 0.46 r: within −2.4 % ± 1.6 % at T and ±0.4 % ± 0.5 % at 2T..4T. Halving the
 * automatic Δt changes F by less than 4 combined standard errors (tested for r = 1 µm). The drift
 * term matters in flow: in {@code scenarios/vessel-segment.json} (r = 8 µm, 2u = 400 µm/s) a
 * diffusion-only bound allowed Δt = T/50 = 0.01 s, whose catch over the memory was 2.9 % below the
 * Δt = 7e-4 s run (about 4 standard errors), while Δt = 0.005 and 0.0025 s agreed with it within
 * 0.6 %; with the drift term Δt = 3.5e-3 s. The remaining error of the curved cylinder wall's
 * mirroring is O(Δt) (see {@link Motion}).
 */
public final class TimeStepRule {

    /** √(6DΔt) ≤ this × the smallest radius and gap. */
    public static final double STEP_FRACTION = 0.4;
    /** Per-axis step √(2DΔt) ≤ this × the cylinder radius. */
    public static final double CURVED_WALL_FRACTION = 0.1;
    /**
     * Largest adsorption probability per crossing of a reactive sphere, κ√(πΔt/D) ({@link Absorbers}).
     * Measured (d = 8 µm, r = 5 µm, D = 100 µm²/s, κ = 50 µm/s, 10⁵ molecules, cumulative catch at
     * T..4T, T = 0.1 s, against the Collins–Kimball closed form {@code ReactiveSphereHitting}): P = 0.089
     * (Δt = 1e-4 s) over-counts by 3.7 % (5 standard errors), P = 0.044 (Δt = 2.5e-5 s) by 0.8 %
     * (1.7 standard errors). The cost grows as κ²: Δt ≤ D·(0.05/κ)²/π.
     */
    public static final double MAX_ADSORPTION_PROBABILITY = 0.05;
    /** At least this many steps per symbol time. */
    public static final int MIN_STEPS_PER_SYMBOL = 50;

    private TimeStepRule() {
    }

    /** The automatic Δt in s for the scenario (before alignment to T), &gt; 0. */
    public static double automaticTimeStepS(Scenario scenario) {
        double symbolTimeS = scenario.signalling().symbolTimeS();
        Map<String, Species> species = scenario.speciesByName();
        double maxD = 0;
        double minLength = Double.POSITIVE_INFINITY;
        double dt = symbolTimeS / MIN_STEPS_PER_SYMBOL;
        for (Node e : scenario.nodes()) {
            if (!e.role().emits()) {
                continue;
            }
            double diff = species.get(e.emitsSpecies()).diffusionUm2PerS();
            maxD = Math.max(maxD, diff);
            for (Node r : scenario.nodes()) {
                if (ParticleSimulator.senses(e, r)) {
                    minLength = Math.min(minLength, r.radiusUm());
                    minLength = Math.min(minLength, e.positionUm().distance(r.positionUm()) - r.radiusUm());
                    if (r.receiver().kind() == ReceiverModel.Kind.REACTIVE) {
                        double p = MAX_ADSORPTION_PROBABILITY / r.receiver().bindingRateUmPerS();
                        dt = Math.min(dt, diff * p * p / Math.PI);
                    }
                }
            }
        }
        if (maxD > 0 && minLength < Double.POSITIVE_INFINITY && minLength > 0) {
            dt = Math.min(dt, stepBound(STEP_FRACTION * minLength, maxD, maxDriftSpeedUmPerS(scenario.medium().flow())));
        }
        if (maxD > 0 && scenario.volume() instanceof Volume.Cylinder c) {
            double step = CURVED_WALL_FRACTION * c.radiusUm();
            dt = Math.min(dt, step * step / (2 * maxD));
        }
        return dt;
    }

    /**
     * Whether a requested Δt breaks the accuracy bound of the class comment: it is above
     * {@link #automaticTimeStepS} (the largest step that keeps √(6DΔt) + v·Δt ≤ {@value #STEP_FRACTION}
     * × the smallest receiver radius and gap, Δt ≤ T/{@value #MIN_STEPS_PER_SYMBOL} and, in a cylinder,
     * √(2DΔt) ≤ {@value #CURVED_WALL_FRACTION} R) by more than rounding (1e-9 relative).
     */
    public static boolean breaksBound(Scenario scenario, double requestedS) {
        return requestedS > automaticTimeStepS(scenario) * (1 + 1e-9);
    }

    /** The bound of {@link #breaksBound} in words, for messages. */
    public static final String BOUND_TEXT = "sqrt(6 D dt) + v dt <= " + STEP_FRACTION + " x the smallest receiver "
            + "radius and gap, dt <= T/" + MIN_STEPS_PER_SYMBOL + ", and in a cylinder sqrt(2 D dt) <= "
            + CURVED_WALL_FRACTION + " R, and with a reactive receiver kappa sqrt(pi dt / D) <= "
            + MAX_ADSORPTION_PROBABILITY;

    /**
     * The largest Δt with √(6DΔt) + vΔt ≤ length: with s = √Δt, v s² + √(6D) s − length = 0, whose
     * positive root is s = 2·length / (√(6D) + √(6D + 4 v length)) (the cancellation-free form);
     * for v = 0 this is length²/(6D).
     */
    static double stepBound(double lengthUm, double diffusionUm2PerS, double speedUmPerS) {
        double b = Math.sqrt(6 * diffusionUm2PerS);
        double s = 2 * lengthUm / (b + Math.sqrt(b * b + 4 * speedUmPerS * lengthUm));
        return s * s;
    }

    /** Largest drift speed in µm/s: |v| for uniform flow, 2u on the axis for Poiseuille flow, 0 else. */
    static double maxDriftSpeedUmPerS(Flow flow) {
        if (flow instanceof Flow.Uniform u) {
            return u.velocityUmPerS().norm();
        }
        if (flow instanceof Flow.Poiseuille p) {
            return 2 * Math.abs(p.meanSpeedUmPerS());
        }
        return 0;
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
