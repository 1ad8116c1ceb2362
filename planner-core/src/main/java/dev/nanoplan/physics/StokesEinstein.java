package dev.nanoplan.physics;

/**
 * Stokes–Einstein relation: diffusion coefficient of a sphere of hydrodynamic radius R_h in a
 * fluid of dynamic viscosity η at absolute temperature T,
 * D = k_B·T / (6π·η·R_h)
 * (A. Einstein, "Über die von der molekularkinetischen Theorie der Wärme geforderte Bewegung von
 * in ruhenden Flüssigkeiten suspendierten Teilchen", Annalen der Physik 17, 549–560, 1905; the
 * drag 6πηR_h is Stokes' law for a sphere with no-slip surface).
 *
 * <p>Units: temperature in kelvin, viscosity in mPa·s (water at 25 °C ≈ 0.89), radius in nm;
 * result in µm²/s. k_B = 1.380649e-23 J/K is exact in the SI since 2019. Relative error: a few
 * ulp (four multiplications and one division). Assumes a rigid sphere much larger than the
 * solvent molecules; for small molecules it is an order-of-magnitude estimate.
 */
public final class StokesEinstein {

    /** Boltzmann constant k_B in J/K (exact, SI 2019 redefinition). */
    public static final double BOLTZMANN_J_PER_K = 1.380649e-23;

    /** 1 m²/s in µm²/s. */
    private static final double UM2_PER_M2 = 1e12;
    /** 1 mPa·s in Pa·s. */
    private static final double PA_S_PER_MPA_S = 1e-3;
    /** 1 nm in m. */
    private static final double M_PER_NM = 1e-9;

    private StokesEinstein() {
    }

    /**
     * D = k_B·T / (6π·η·R_h).
     *
     * @param temperatureK T in K, finite and &gt; 0
     * @param viscosityMPaS η in mPa·s, finite and &gt; 0
     * @param hydrodynamicRadiusNm R_h in nm, finite and &gt; 0
     * @return D in µm²/s
     * @throws IllegalArgumentException naming the first bad parameter
     */
    public static double diffusionUm2PerS(double temperatureK, double viscosityMPaS,
                                          double hydrodynamicRadiusNm) {
        requirePositiveFinite("temperatureK", temperatureK);
        requirePositiveFinite("viscosityMPaS", viscosityMPaS);
        requirePositiveFinite("hydrodynamicRadiusNm", hydrodynamicRadiusNm);
        double dragPerVelocity = 6 * Math.PI * (viscosityMPaS * PA_S_PER_MPA_S)
            * (hydrodynamicRadiusNm * M_PER_NM);
        return BOLTZMANN_J_PER_K * temperatureK / dragPerVelocity * UM2_PER_M2;
    }

    private static void requirePositiveFinite(String name, double value) {
        if (!(value > 0 && value < Double.POSITIVE_INFINITY)) {
            throw new IllegalArgumentException(name + ": must be finite and > 0, got " + value);
        }
    }
}
