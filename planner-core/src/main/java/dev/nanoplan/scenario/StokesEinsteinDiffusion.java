package dev.nanoplan.scenario;

/**
 * Stokes–Einstein relation D = k_B·T / (6π·η·R_h) for a sphere in a viscous fluid, in the units of
 * the scenario file.
 *
 * <p>Source: A. Einstein, "Über die von der molekularkinetischen Theorie der Wärme geforderte
 * Bewegung von in ruhenden Flüssigkeiten suspendierten Teilchen", Ann. Phys. 17 (1905) 549–560,
 * with Stokes' drag 6πηR. k_B = 1.380649e-23 J/K exactly (SI 2019 / CODATA 2018).
 *
 * <p>Package-private on purpose: the physics package has its own general implementation; this
 * copy only serves the file layer and can be replaced by it later. Accuracy: a few ulps
 * (four multiplications and one division).
 */
final class StokesEinsteinDiffusion {

    /** Boltzmann constant in J/K (exact since the 2019 SI redefinition). */
    static final double BOLTZMANN_J_PER_K = 1.380649e-23;

    private StokesEinsteinDiffusion() {
    }

    /**
     * Diffusion coefficient in µm²/s.
     *
     * @param temperatureK absolute temperature, > 0
     * @param viscosityMPaS dynamic viscosity in mPa·s (water at 37 °C ≈ 0.69), > 0
     * @param hydrodynamicRadiusNm hydrodynamic radius in nm, > 0
     * @return D in µm²/s
     * @throws IllegalArgumentException if an argument is not finite and positive
     */
    static double diffusionUm2PerS(double temperatureK, double viscosityMPaS, double hydrodynamicRadiusNm) {
        Checks.positive("temperatureK", temperatureK);
        Checks.positive("viscosityMPaS", viscosityMPaS);
        Checks.positive("hydrodynamicRadiusNm", hydrodynamicRadiusNm);
        double viscosityPaS = viscosityMPaS * 1e-3;
        double radiusM = hydrodynamicRadiusNm * 1e-9;
        double diffusionM2PerS = BOLTZMANN_J_PER_K * temperatureK / (6 * Math.PI * viscosityPaS * radiusM);
        return diffusionM2PerS * 1e12;
    }
}
