package dev.nanoplan.desktop;

import dev.nanoplan.scenario.Medium;
import dev.nanoplan.scenario.Species;
import java.util.List;
import javafx.beans.property.ReadOnlyStringProperty;
import javafx.beans.property.ReadOnlyStringWrapper;
import javafx.beans.property.SimpleStringProperty;
import javafx.beans.property.StringProperty;

/**
 * The editable fields of one species in the {@link ScenarioSettings} editor, with the nodes of the
 * loaded layout that use it. The text last shown for the diffusion coefficient and the radius is
 * kept, so the editor can tell a retyped value from the shown one.
 */
public final class SpeciesRow {

    final String originalName;
    final StringProperty name = new SimpleStringProperty("");
    final StringProperty diffusionUm2PerS = new SimpleStringProperty("");
    final StringProperty hydrodynamicRadiusNm = new SimpleStringProperty("");
    final StringProperty halfLifeS = new SimpleStringProperty("");
    final ReadOnlyStringWrapper usage = new ReadOnlyStringWrapper("");
    List<String> usedBy = List.of();
    String shownDiffusion = "";
    String shownRadius = "";

    SpeciesRow(String originalName) {
        this.originalName = originalName;
        name.set(originalName == null ? "" : originalName);
    }

    /** The name the species has in the layout, or null for a row added in the editor. */
    public String originalName() {
        return originalName;
    }

    /** The name as typed now. */
    public String name() {
        return name.get();
    }

    /** The name; changing it renames the species in every node on Apply. */
    public StringProperty nameProperty() {
        return name;
    }

    public StringProperty diffusionUm2PerSProperty() {
        return diffusionUm2PerS;
    }

    /** Hydrodynamic radius in nm (D then follows from Stokes–Einstein); blank if D is given. */
    public StringProperty hydrodynamicRadiusNmProperty() {
        return hydrodynamicRadiusNm;
    }

    /** Half-life in seconds; blank means stable (no decay). */
    public StringProperty halfLifeSProperty() {
        return halfLifeS;
    }

    /** Which nodes use the species, in words ("3 nodes", "not used yet"). */
    public ReadOnlyStringProperty usageProperty() {
        return usage.getReadOnlyProperty();
    }

    /** Ids of the nodes of the loaded layout that use the species (absorb or emit it). */
    public List<String> usedBy() {
        return usedBy;
    }

    /** A species of the layout that no row edits, derived again in {@code medium} (its D follows a radius). */
    static Species rederived(Species old, Medium medium) {
        return old.hydrodynamicRadiusNm().isPresent()
                ? Species.ofHydrodynamicRadius(old.name(), old.hydrodynamicRadiusNm().getAsDouble(), old.halfLifeS(),
                        medium)
                : old;
    }

    /**
     * The species this row describes in {@code medium}: by its radius (Stokes–Einstein) when the radius
     * is given and no other D was typed, else by its diffusion coefficient.
     *
     * @throws IllegalArgumentException naming the field that is missing, malformed or out of range
     */
    Species toSpecies(Medium medium, String at) {
        String name = this.name.get();
        String halfText = SettingsText.trim(halfLifeS.get());
        String half = at + ".half_life_s";
        String diffusion = at + ".diffusion_um2_per_s";
        String radius = at + ".hydrodynamic_radius_nm";
        double halfLifeS = halfText.isEmpty() ? Double.POSITIVE_INFINITY : parse(half, halfText);
        String dText = SettingsText.trim(diffusionUm2PerS.get());
        String rText = SettingsText.trim(hydrodynamicRadiusNm.get());
        boolean dTyped = !dText.isEmpty() && !dText.equals(shownDiffusion);
        boolean rTyped = !rText.isEmpty() && !rText.equals(shownRadius);
        if (dTyped && rTyped) {
            throw new FieldErrors.FieldException(radius, at + ": give either diffusion_um2_per_s or "
                    + "hydrodynamic_radius_nm, not both");
        }
        try {
            if (!dTyped && !rText.isEmpty()) {
                double r = parse(radius, rText);
                if (!(r > 0)) {
                    throw new FieldErrors.FieldException(radius, radius + " must be > 0, got " + rText);
                }
                return Species.ofHydrodynamicRadius(name, r, halfLifeS, medium);
            }
            if (dText.isEmpty()) {
                throw new FieldErrors.FieldException(diffusion, diffusion
                        + " is missing (give diffusion_um2_per_s or hydrodynamic_radius_nm)");
            }
            double d = parse(diffusion, dText);
            if (!(d > 0)) {
                throw new FieldErrors.FieldException(diffusion, diffusion + " must be > 0, got " + dText);
            }
            return Species.ofDiffusion(name, d, halfLifeS);
        } catch (IllegalArgumentException e) {
            throw FieldErrors.translate(at, at + ".name", e);
        }
    }

    private static double parse(String path, String text) {
        FieldErrors one = new FieldErrors();
        double v = one.number(path, text);
        one.throwFirst();
        return v;
    }
}
