package dev.nanoplan.desktop;

import dev.nanoplan.count.CountModelKind;
import dev.nanoplan.scenario.Medium;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.Signalling;
import dev.nanoplan.scenario.Species;
import java.util.ArrayList;
import java.util.List;
import javafx.beans.property.ObjectProperty;
import javafx.beans.property.SimpleObjectProperty;
import javafx.beans.property.SimpleStringProperty;
import javafx.beans.property.StringProperty;
import javafx.collections.FXCollections;
import javafx.collections.ObservableList;

/**
 * The scenario-wide settings as text the settings panel binds to: the medium (temperature,
 * viscosity, background arrivals), the signalling (symbol time, ISI memory, levels, prior of a
 * one, count model) and, per species, the diffusion coefficient and half-life (blank = stable).
 * {@link #applyTo(Scenario)} parses the fields and builds the new layout; a malformed or
 * out-of-range value is refused with an {@link IllegalArgumentException} whose message names the
 * field (the core records' own checks supply the range messages).
 *
 * <p>A species described by its hydrodynamic radius keeps that description while its diffusion
 * field is left as shown (its coefficient then follows the new temperature and viscosity through
 * Stokes–Einstein, as when the file is read); typing another diffusion coefficient replaces the
 * radius by that coefficient.
 */
public final class ScenarioSettings {

    /** The editable fields of one species; the name is fixed (nodes refer to it). */
    public static final class SpeciesRow {
        private final String name;
        private final StringProperty diffusionUm2PerS = new SimpleStringProperty("");
        private final StringProperty halfLifeS = new SimpleStringProperty("");
        private String shownDiffusion = "";

        SpeciesRow(String name) {
            this.name = name;
        }

        public String name() {
            return name;
        }

        public StringProperty diffusionUm2PerSProperty() {
            return diffusionUm2PerS;
        }

        /** Half-life in seconds; blank means stable (no decay). */
        public StringProperty halfLifeSProperty() {
            return halfLifeS;
        }
    }

    private final StringProperty temperatureK = new SimpleStringProperty("");
    private final StringProperty viscosityMPaS = new SimpleStringProperty("");
    private final StringProperty backgroundMoleculesPerS = new SimpleStringProperty("");
    private final StringProperty symbolTimeS = new SimpleStringProperty("");
    private final StringProperty isiMemorySymbols = new SimpleStringProperty("");
    private final StringProperty levels = new SimpleStringProperty("");
    private final StringProperty priorOne = new SimpleStringProperty("");
    private final ObjectProperty<CountModelKind> countModel = new SimpleObjectProperty<>(CountModelKind.EXACT);
    private final ObservableList<SpeciesRow> species = FXCollections.observableArrayList();

    /** Shows a layout's settings (or clears the fields when {@code s} is null). */
    public void load(Scenario s) {
        if (s == null) {
            for (StringProperty p : new StringProperty[] {temperatureK, viscosityMPaS, backgroundMoleculesPerS,
                symbolTimeS, isiMemorySymbols, levels, priorOne}) {
                p.set("");
            }
            species.clear();
            return;
        }
        Medium m = s.medium();
        temperatureK.set(fmt(m.temperatureK()));
        viscosityMPaS.set(fmt(m.viscosityMPaS()));
        backgroundMoleculesPerS.set(fmt(m.backgroundMoleculesPerS()));
        Signalling g = s.signalling();
        symbolTimeS.set(fmt(g.symbolTimeS()));
        isiMemorySymbols.set(Integer.toString(g.isiMemorySymbols()));
        levels.set(Integer.toString(g.levels()));
        priorOne.set(fmt(g.priorOne()));
        countModel.set(g.countModel());
        List<SpeciesRow> rows = new ArrayList<>();
        for (Species sp : s.species()) {
            SpeciesRow r = new SpeciesRow(sp.name());
            r.shownDiffusion = fmt(sp.diffusionUm2PerS());
            r.diffusionUm2PerS.set(r.shownDiffusion);
            r.halfLifeS.set(sp.isStable() ? "" : fmt(sp.halfLifeS()));
            rows.add(r);
        }
        species.setAll(rows);
    }

    /**
     * The layout {@code s} with the settings the fields describe; nodes, demands, volume and
     * targets are kept, and the {@link Scenario} constructor validates the result.
     *
     * @throws IllegalArgumentException naming the field when a value does not parse or is out of range
     */
    public Scenario applyTo(Scenario s) {
        Medium medium;
        try {
            medium = new Medium(parse("temperature K", temperatureK.get()),
                    parse("viscosity mPa·s", viscosityMPaS.get()), s.medium().flow(),
                    parse("background molecules/s", backgroundMoleculesPerS.get()));
        } catch (IllegalArgumentException e) {
            throw prefixed("medium", e);
        }
        Signalling signalling;
        try {
            signalling = new Signalling(parse("symbol time s", symbolTimeS.get()),
                    parseInt("ISI memory symbols", isiMemorySymbols.get()), parseInt("levels", levels.get()),
                    parse("prior one", priorOne.get()), countModel.get(), s.signalling().schedule());
        } catch (IllegalArgumentException e) {
            throw prefixed("signalling", e);
        }
        List<Species> list = new ArrayList<>();
        for (Species old : s.species()) {
            SpeciesRow row = rowFor(old.name());
            if (row == null) {
                list.add(old);
                continue;
            }
            try {
                list.add(species(old, row, medium));
            } catch (IllegalArgumentException e) {
                throw prefixed("species " + old.name(), e);
            }
        }
        return new Scenario(s.name(), s.volume(), medium, list, signalling, s.nodes(), s.demands(), s.targets());
    }

    private static Species species(Species old, SpeciesRow row, Medium medium) {
        String halfText = row.halfLifeS.get() == null ? "" : row.halfLifeS.get().trim();
        double halfLifeS = halfText.isEmpty() ? Double.POSITIVE_INFINITY : parse("half-life s", halfText);
        String dText = row.diffusionUm2PerS.get() == null ? "" : row.diffusionUm2PerS.get().trim();
        if (old.hydrodynamicRadiusNm().isPresent() && dText.equals(row.shownDiffusion)) {
            return Species.ofHydrodynamicRadius(old.name(), old.hydrodynamicRadiusNm().getAsDouble(), halfLifeS,
                    medium);
        }
        double d = parse("diffusion µm²/s", dText);
        if (!(d > 0)) {
            throw new IllegalArgumentException("diffusion µm²/s must be > 0, got " + dText);
        }
        return Species.ofDiffusion(old.name(), d, halfLifeS);
    }

    private SpeciesRow rowFor(String name) {
        for (SpeciesRow r : species) {
            if (r.name.equals(name)) {
                return r;
            }
        }
        return null;
    }

    private static IllegalArgumentException prefixed(String where, IllegalArgumentException e) {
        return new IllegalArgumentException(where + ": " + e.getMessage(), e);
    }

    private static String fmt(double v) {
        return NodeInspector.fmt(v);
    }

    private static double parse(String field, String text) {
        String t = text == null ? "" : text.trim();
        try {
            double v = Double.parseDouble(t);
            if (!Double.isFinite(v)) {
                throw new IllegalArgumentException(field + ": must be a finite number, got " + t);
            }
            return v;
        } catch (NumberFormatException e) {
            throw new IllegalArgumentException(field + ": not a number: '" + t + "'");
        }
    }

    private static int parseInt(String field, String text) {
        String t = text == null ? "" : text.trim();
        try {
            return Integer.parseInt(t);
        } catch (NumberFormatException e) {
            throw new IllegalArgumentException(field + ": not a whole number: '" + t + "'");
        }
    }

    public StringProperty temperatureKProperty() {
        return temperatureK;
    }

    public StringProperty viscosityMPaSProperty() {
        return viscosityMPaS;
    }

    public StringProperty backgroundMoleculesPerSProperty() {
        return backgroundMoleculesPerS;
    }

    public StringProperty symbolTimeSProperty() {
        return symbolTimeS;
    }

    public StringProperty isiMemorySymbolsProperty() {
        return isiMemorySymbols;
    }

    public StringProperty levelsProperty() {
        return levels;
    }

    public StringProperty priorOneProperty() {
        return priorOne;
    }

    public ObjectProperty<CountModelKind> countModelProperty() {
        return countModel;
    }

    /** One row per species of the loaded layout, in the layout's order. */
    public ObservableList<SpeciesRow> species() {
        return species;
    }

    /** The row of the species with this name, or null. */
    public SpeciesRow species(String name) {
        return rowFor(name);
    }
}
