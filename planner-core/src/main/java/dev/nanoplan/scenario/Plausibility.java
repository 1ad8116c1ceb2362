package dev.nanoplan.scenario;

import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Locale;
import java.util.Set;

/**
 * Warnings (never errors) for values that are valid but far outside the physical range of molecular
 * communication in a liquid, and for receivers no emitter can talk to. Each range is stated with its
 * source; a value outside it is most likely a unit slip (K for °C, m²/s for µm²/s).
 *
 * <ul>
 * <li>{@code medium.temperature_K}: {@value #MIN_TEMPERATURE_K}..{@value #MAX_TEMPERATURE_K} K, liquid
 *     water at normal pressure (0–100 °C) with a margin for supercooled or pressurised media.</li>
 * <li>{@code medium.viscosity_mPa_s}: {@value #MIN_VISCOSITY_MPA_S}..{@value #MAX_VISCOSITY_MPA_S} mPa·s:
 *     water is 1.79 at 0 °C and 0.28 at 100 °C (CRC Handbook of Chemistry and Physics, "Viscosity of
 *     liquid water"); blood is about 3–4, glycerol–water mixtures reach hundreds; common practice beyond.</li>
 * <li>{@code species[i].diffusion_um2_per_s}: {@value #MIN_DIFFUSION_UM2_PER_S}..{@value
 *     #MAX_DIFFUSION_UM2_PER_S} µm²/s: small molecules in water diffuse at about 10⁻⁵ cm²/s = 1000 µm²/s,
 *     proteins at about 10⁻⁷ cm²/s = 10 µm²/s (H. C. Berg, <i>Random Walks in Biology</i>, 1993, table
 *     2.1); water's self-diffusion, 2300 µm²/s at 25 °C, is about the fastest in liquids.</li>
 * <li>{@code species[i].hydrodynamic_radius_nm}: {@value #MIN_HYDRODYNAMIC_RADIUS_NM}..{@value
 *     #MAX_HYDRODYNAMIC_RADIUS_NM} nm: from a small ion to a large vesicle (common practice).</li>
 * <li>{@code nodes[i].radius_um}: {@value #MIN_NODE_RADIUS_UM}..{@value #MAX_NODE_RADIUS_UM} µm: from
 *     a large protein complex to a millimetre bead (common practice for the machines planned here).</li>
 * <li>{@code nodes[i].position_um}: within {@value #MAX_EXTENT_UM} µm (1 m) of the origin (common practice).</li>
 * </ul>
 *
 * <p>A receiver (or relay) whose species no emitter sends hears nothing; that is a warning on its
 * {@code species} field rather than route advice. Cost O(nodes + species).
 */
public final class Plausibility {

    static final double MIN_TEMPERATURE_K = 250;
    static final double MAX_TEMPERATURE_K = 400;
    static final double MIN_VISCOSITY_MPA_S = 0.2;
    static final double MAX_VISCOSITY_MPA_S = 1000;
    static final double MIN_DIFFUSION_UM2_PER_S = 1e-3;
    static final double MAX_DIFFUSION_UM2_PER_S = 1e4;
    static final double MIN_HYDRODYNAMIC_RADIUS_NM = 0.05;
    static final double MAX_HYDRODYNAMIC_RADIUS_NM = 1e4;
    static final double MIN_NODE_RADIUS_UM = 1e-3;
    static final double MAX_NODE_RADIUS_UM = 1e3;
    static final double MAX_EXTENT_UM = 1e6;

    private Plausibility() {
    }

    /** The warnings for {@code s}, each on the file's field path; empty when everything is plausible. */
    public static List<ScenarioProblem> check(Scenario s) {
        List<ScenarioProblem> out = new ArrayList<>();
        range(out, "medium.temperature_K", s.medium().temperatureK(), MIN_TEMPERATURE_K, MAX_TEMPERATURE_K, "K",
                "liquid water at normal pressure");
        range(out, "medium.viscosity_mPa_s", s.medium().viscosityMPaS(), MIN_VISCOSITY_MPA_S, MAX_VISCOSITY_MPA_S,
                "mPa·s", "water is 0.28–1.79, blood about 3–4");
        for (int i = 0; i < s.species().size(); i++) {
            Species sp = s.species().get(i);
            if (sp.hydrodynamicRadiusNm().isPresent()) {
                range(out, "species[" + i + "].hydrodynamic_radius_nm", sp.hydrodynamicRadiusNm().getAsDouble(),
                        MIN_HYDRODYNAMIC_RADIUS_NM, MAX_HYDRODYNAMIC_RADIUS_NM, "nm", "small ion to large vesicle");
            } else {
                range(out, "species[" + i + "].diffusion_um2_per_s", sp.diffusionUm2PerS(), MIN_DIFFUSION_UM2_PER_S,
                        MAX_DIFFUSION_UM2_PER_S, "µm²/s", "proteins about 10, small molecules about 1000 in water");
            }
        }
        Set<String> sent = new HashSet<>();
        for (Node n : s.nodes()) {
            if (n.role().emits()) {
                sent.add(n.emitsSpecies());
            }
        }
        for (int i = 0; i < s.nodes().size(); i++) {
            Node n = s.nodes().get(i);
            range(out, "nodes[" + i + "].radius_um", n.radiusUm(), MIN_NODE_RADIUS_UM, MAX_NODE_RADIUS_UM, "µm",
                    "protein complex to millimetre bead");
            if (n.positionUm().norm() > MAX_EXTENT_UM) {
                out.add(ScenarioProblem.at("nodes[" + i + "].position_um", String.format(Locale.ROOT,
                        "node %s lies %.3g µm from the origin, beyond the plausible %.0g µm (1 m): check the unit "
                                + "(µm)", n.id(), n.positionUm().norm(), MAX_EXTENT_UM)));
            }
            if (n.role().absorbs() && !sent.contains(n.species())) {
                out.add(ScenarioProblem.at("nodes[" + i + "].species", "node " + n.id() + " senses species "
                        + n.species() + ", which no emitter sends: it can hear nothing"));
            }
        }
        return out;
    }

    private static void range(List<ScenarioProblem> out, String path, double v, double lo, double hi, String unit,
            String typical) {
        if (v < lo || v > hi) {
            out.add(ScenarioProblem.at(path, String.format(Locale.ROOT,
                    "%.4g %s is far outside the physical range %.3g..%.3g %s (%s): check the unit", v, unit, lo, hi,
                    unit, typical)));
        }
    }
}
