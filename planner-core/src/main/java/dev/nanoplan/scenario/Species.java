package dev.nanoplan.scenario;

import dev.nanoplan.physics.StokesEinstein;
import java.util.OptionalDouble;

/**
 * A kind of signalling molecule.
 *
 * <p>In the file a species gives either {@code diffusion_um2_per_s} directly or
 * {@code hydrodynamic_radius_nm}, from which D follows by the Stokes–Einstein relation
 * D = k_B·T/(6πηR_h) at the medium's temperature and viscosity (A. Einstein, Ann. Phys. 17, 1905).
 * The resolved D is always available from {@link #diffusionUm2PerS()}; the radius is kept so the
 * file can be written back the way it was given.
 *
 * @param name unique, non-empty name
 * @param diffusionUm2PerS diffusion coefficient D in µm²/s, finite and > 0
 * @param hydrodynamicRadiusNm the radius D was derived from, or empty if D was given directly
 * @param halfLifeS half-life of first-order degradation in s, > 0; {@code +∞} means stable (the
 *     file's {@code null} or absent value)
 */
public record Species(String name, double diffusionUm2PerS, OptionalDouble hydrodynamicRadiusNm, double halfLifeS) {

    /** @throws IllegalArgumentException if a value is out of range */
    public Species {
        Checks.nonBlank("name", name);
        Checks.positive("diffusionUm2PerS", diffusionUm2PerS);
        Checks.required("hydrodynamicRadiusNm", hydrodynamicRadiusNm);
        if (hydrodynamicRadiusNm.isPresent()) {
            Checks.positive("hydrodynamicRadiusNm", hydrodynamicRadiusNm.getAsDouble());
        }
        if (!(halfLifeS > 0)) {
            throw new IllegalArgumentException("halfLifeS must be > 0 (+Infinity = stable), got " + halfLifeS);
        }
    }

    /** A species with a given diffusion coefficient. */
    public static Species ofDiffusion(String name, double diffusionUm2PerS, double halfLifeS) {
        return new Species(name, diffusionUm2PerS, OptionalDouble.empty(), halfLifeS);
    }

    /** A stable species with a given diffusion coefficient. */
    public static Species stable(String name, double diffusionUm2PerS) {
        return ofDiffusion(name, diffusionUm2PerS, Double.POSITIVE_INFINITY);
    }

    /**
     * A species whose D follows from its hydrodynamic radius by Stokes–Einstein in {@code medium}.
     *
     * @param hydrodynamicRadiusNm R_h in nm, > 0
     */
    public static Species ofHydrodynamicRadius(String name, double hydrodynamicRadiusNm, double halfLifeS,
            Medium medium) {
        double d = StokesEinstein.diffusionUm2PerS(
                medium.temperatureK(), medium.viscosityMPaS(), hydrodynamicRadiusNm);
        return new Species(name, d, OptionalDouble.of(hydrodynamicRadiusNm), halfLifeS);
    }

    /** Whether the species never degrades (infinite half-life). */
    public boolean isStable() {
        return halfLifeS == Double.POSITIVE_INFINITY;
    }

    /** First-order degradation rate λ = ln 2 / half-life in 1/s; 0 for a stable species. */
    public double decayRatePerS() {
        return isStable() ? 0.0 : Math.log(2) / halfLifeS;
    }
}
