package dev.nanoplan.scenario;

/**
 * The fluid: temperature, viscosity, bulk flow and background noise.
 *
 * @param temperatureK absolute temperature in K, finite and > 0 (file default 310.15 K = 37 °C)
 * @param viscosityMPaS dynamic viscosity in mPa·s, finite and > 0 (file default 0.69 mPa·s,
 *     water at 37 °C)
 * @param flow bulk flow (file default {@link Flow.None})
 * @param backgroundMoleculesPerS mean rate of background molecules counted by each receiver,
 *     a Poisson process, in 1/s, finite and ≥ 0 (file default 0)
 */
public record Medium(double temperatureK, double viscosityMPaS, Flow flow, double backgroundMoleculesPerS) {

    /** Default temperature, 37 °C, in K. */
    public static final double DEFAULT_TEMPERATURE_K = 310.15;
    /** Default viscosity, water at 37 °C, in mPa·s. */
    public static final double DEFAULT_VISCOSITY_MPA_S = 0.69;
    /** Default medium: 310.15 K, 0.69 mPa·s, no flow, no background. */
    public static final Medium DEFAULT =
            new Medium(DEFAULT_TEMPERATURE_K, DEFAULT_VISCOSITY_MPA_S, new Flow.None(), 0.0);

    /** @throws IllegalArgumentException if a value is out of range or the flow is null */
    public Medium {
        Checks.positive("temperatureK", temperatureK);
        Checks.positive("viscosityMPaS", viscosityMPaS);
        Checks.required("flow", flow);
        Checks.nonNegative("backgroundMoleculesPerS", backgroundMoleculesPerS);
    }

    /** Viscosity in SI units, Pa·s. */
    public double viscosityPaS() {
        return viscosityMPaS * 1e-3;
    }
}
