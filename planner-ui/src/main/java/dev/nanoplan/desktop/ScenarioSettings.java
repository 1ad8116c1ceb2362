package dev.nanoplan.desktop;

import dev.nanoplan.count.CountModelKind;
import dev.nanoplan.geometry.Vec3;
import dev.nanoplan.scenario.Flow;
import dev.nanoplan.scenario.Medium;
import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.ScenarioProblem;
import dev.nanoplan.scenario.ScenarioValidator;
import dev.nanoplan.scenario.Schedule;
import dev.nanoplan.scenario.Signalling;
import dev.nanoplan.scenario.Species;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.HashSet;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Set;
import java.util.TreeSet;
import javafx.beans.property.ObjectProperty;
import javafx.beans.property.SimpleObjectProperty;
import javafx.beans.property.SimpleStringProperty;
import javafx.beans.property.StringProperty;
import javafx.collections.FXCollections;
import javafx.collections.ObservableList;

/**
 * The scenario-wide settings as text the settings panel binds to: the medium (temperature,
 * viscosity, bulk flow, background arrivals), the signalling (symbol time, ISI memory, levels,
 * prior of a one, count model, slot schedule: all-active or round-robin) and the
 * species (name, diffusion coefficient or hydrodynamic radius, half-life; rows can be added,
 * renamed and removed). {@link #apply(Scenario, List)} parses the fields and builds the new layout;
 * a malformed or out-of-range value is refused with an {@link IllegalArgumentException} whose
 * one-line message names the field as the scenario file does ({@code signalling.symbol_time_s}), and
 * is kept in {@link #errors()} under that path for the view to show beside the field (the core
 * records' and {@link ScenarioValidator}'s own checks supply the range, name and cross-field
 * messages; {@link FieldErrors} turns their record names into file names).
 *
 * <p>Species: a {@link Scenario} may only declare species some node uses, so a species added here
 * and not yet used by any node is carried beside the layout as an <em>unused</em> species (shown
 * in the editor, offered to the node inspector, not written to files) and joins the layout when a
 * node starts to use it. Renaming a species renames it in every node ({@code species} and
 * {@code emits_species}), the only place a layout refers to species names. Removing a species
 * still used by nodes is refused naming them.
 *
 * <p>A species is given either by its diffusion coefficient or by its hydrodynamic radius, as in
 * the file. A species described by its radius keeps that description while its diffusion field is
 * left as shown (its coefficient then follows the temperature and viscosity through
 * Stokes–Einstein, as when the file is read); typing another diffusion coefficient replaces the
 * radius by that coefficient. A row with both a typed coefficient and a typed radius is refused.
 */
public final class ScenarioSettings {

    /** Flow profiles offered, by their file names ({@link Flow#profile()}). */
    public static final List<String> FLOW_PROFILES = List.of(new Flow.None().profile(),
            new Flow.Uniform(Vec3.ZERO).profile(), new Flow.Poiseuille(0).profile());

    /** What the schedules mean, for the schedule choice's tooltip. */
    public static final String SCHEDULE_HELP = Schedule.ALL_ACTIVE.id()
            + ": every emitter of a species sends in every symbol slot, all slots on one clock. "
            + Schedule.ROUND_ROBIN.id() + ": the K emitters of a species take turns in file order, one slot "
            + "each, so a link hears less crosstalk but carries one symbol per K slots (rate / K); "
            + "the ISI memory should then cover a few frames of K slots. " + Schedule.SLOTS.id()
            + ": each emitter sends in its own slot number (Inspector); emitters far apart may share a slot "
            + "(Assign slots finds a short frame).";

    /** The layout plus the species declared in the editor that no node uses yet. */
    public record Applied(Scenario scenario, List<Species> unusedSpecies) {
        public Applied {
            Objects.requireNonNull(scenario, "scenario");
            unusedSpecies = List.copyOf(unusedSpecies);
        }
    }

    /** File paths of the fields, the keys of {@link #errors()}. */
    public static final String TEMPERATURE = "medium.temperature_K";
    public static final String VISCOSITY = "medium.viscosity_mPa_s";
    public static final String BACKGROUND = "medium.background_molecules_per_s";
    /** Uniform flow velocity; the components are {@code [0]}, {@code [1]}, {@code [2]} after it. */
    public static final String VELOCITY = "medium.flow.velocity_um_per_s";
    public static final String MEAN_SPEED = "medium.flow.mean_speed_um_per_s";
    public static final String SYMBOL_TIME = "signalling.symbol_time_s";
    public static final String ISI_MEMORY = "signalling.isi_memory_symbols";
    public static final String LEVELS = "signalling.levels";
    public static final String PRIOR_ONE = "signalling.prior_one";

    private final FieldErrors errors = new FieldErrors();
    private final StringProperty temperatureK = new SimpleStringProperty("");
    private final StringProperty viscosityMPaS = new SimpleStringProperty("");
    private final StringProperty backgroundMoleculesPerS = new SimpleStringProperty("");
    private final ObjectProperty<String> flowProfile = new SimpleObjectProperty<>(FLOW_PROFILES.get(0));
    private final StringProperty flowVxUmPerS = new SimpleStringProperty("");
    private final StringProperty flowVyUmPerS = new SimpleStringProperty("");
    private final StringProperty flowVzUmPerS = new SimpleStringProperty("");
    private final StringProperty flowMeanSpeedUmPerS = new SimpleStringProperty("");
    private final StringProperty symbolTimeS = new SimpleStringProperty("");
    private final StringProperty isiMemorySymbols = new SimpleStringProperty("");
    private final StringProperty levels = new SimpleStringProperty("");
    private final StringProperty priorOne = new SimpleStringProperty("");
    private final ObjectProperty<CountModelKind> countModel = new SimpleObjectProperty<>(CountModelKind.EXACT);
    private final ObjectProperty<Schedule> schedule = new SimpleObjectProperty<>(Schedule.ALL_ACTIVE);
    private final ObservableList<SpeciesRow> species = FXCollections.observableArrayList();
    private final Set<String> removed = new LinkedHashSet<>();
    private Map<String, List<String>> users = Map.of();

    /** An empty editor; a field's message goes as soon as the field is edited. */
    public ScenarioSettings() {
        errors.clearOnEdit(temperatureK, TEMPERATURE);
        errors.clearOnEdit(viscosityMPaS, VISCOSITY);
        errors.clearOnEdit(backgroundMoleculesPerS, BACKGROUND);
        errors.clearOnEdit(flowVxUmPerS, VELOCITY + "[0]");
        errors.clearOnEdit(flowVyUmPerS, VELOCITY + "[1]");
        errors.clearOnEdit(flowVzUmPerS, VELOCITY + "[2]");
        errors.clearOnEdit(flowMeanSpeedUmPerS, MEAN_SPEED);
        errors.clearOnEdit(flowProfile, "medium.flow.profile");
        errors.clearOnEdit(symbolTimeS, SYMBOL_TIME);
        errors.clearOnEdit(isiMemorySymbols, ISI_MEMORY);
        errors.clearOnEdit(levels, LEVELS);
        errors.clearOnEdit(priorOne, PRIOR_ONE);
    }

    /** Shows a layout's settings (or clears the fields when {@code s} is null). */
    public void load(Scenario s) {
        load(s, List.of());
    }

    /**
     * Shows a layout's settings and, after its species, the species declared in the editor that
     * no node uses yet.
     */
    public void load(Scenario s, List<Species> unused) {
        removed.clear();
        errors.clear();
        if (s == null) {
            for (StringProperty p : new StringProperty[] {temperatureK, viscosityMPaS, backgroundMoleculesPerS,
                flowVxUmPerS, flowVyUmPerS, flowVzUmPerS, flowMeanSpeedUmPerS, symbolTimeS, isiMemorySymbols,
                levels, priorOne}) {
                p.set("");
            }
            schedule.set(Schedule.ALL_ACTIVE);
            users = Map.of();
            species.clear();
            return;
        }
        Medium m = s.medium();
        temperatureK.set(fmt(m.temperatureK()));
        viscosityMPaS.set(fmt(m.viscosityMPaS()));
        backgroundMoleculesPerS.set(fmt(m.backgroundMoleculesPerS()));
        Flow f = m.flow();
        flowProfile.set(f.profile());
        Vec3 v = f instanceof Flow.Uniform u ? u.velocityUmPerS() : Vec3.ZERO;
        flowVxUmPerS.set(fmt(v.x()));
        flowVyUmPerS.set(fmt(v.y()));
        flowVzUmPerS.set(fmt(v.z()));
        flowMeanSpeedUmPerS.set(fmt(f instanceof Flow.Poiseuille p ? p.meanSpeedUmPerS() : 0.0));
        Signalling g = s.signalling();
        symbolTimeS.set(fmt(g.symbolTimeS()));
        isiMemorySymbols.set(Integer.toString(g.isiMemorySymbols()));
        levels.set(Integer.toString(g.levels()));
        priorOne.set(fmt(g.priorOne()));
        countModel.set(g.countModel());
        schedule.set(g.schedule());
        users = usersBySpecies(s.nodes());
        List<SpeciesRow> rows = new ArrayList<>();
        List<Species> all = new ArrayList<>(s.species());
        all.addAll(unused);
        for (Species sp : all) {
            SpeciesRow r = new SpeciesRow(sp.name());
            // a radius-given species' D is derived (Stokes–Einstein): shown to 4 digits, it is only used if retyped
            r.shownDiffusion = sp.hydrodynamicRadiusNm().isPresent()
                    ? Formats.fourDigits(sp.diffusionUm2PerS())
                    : fmt(sp.diffusionUm2PerS());
            r.shownRadius = sp.hydrodynamicRadiusNm().isPresent() ? fmt(sp.hydrodynamicRadiusNm().getAsDouble()) : "";
            r.diffusionUm2PerS.set(r.shownDiffusion);
            r.hydrodynamicRadiusNm.set(r.shownRadius);
            r.halfLifeS.set(sp.isStable() ? "" : fmt(sp.halfLifeS()));
            setUsage(r, users.getOrDefault(sp.name(), List.of()));
            rows.add(r);
        }
        species.setAll(rows);
    }

    /**
     * Adds an empty species row with a fresh name ("C", "D", ..., then "S1", "S2", ...); the user
     * fills in a diffusion coefficient or a hydrodynamic radius, and Apply declares it.
     */
    public SpeciesRow addSpecies() {
        Set<String> taken = new HashSet<>();
        species.forEach(r -> taken.add(r.name()));
        taken.addAll(removed);
        String fresh = null;
        for (char c = 'A'; c <= 'Z' && fresh == null; c++) {
            fresh = taken.contains(String.valueOf(c)) ? null : String.valueOf(c);
        }
        for (int i = 1; fresh == null; i++) {
            fresh = taken.contains("S" + i) ? null : "S" + i;
        }
        SpeciesRow r = new SpeciesRow(null);
        r.name.set(fresh);
        setUsage(r, List.of());
        species.add(r);
        return r;
    }

    /**
     * Removes a species row; the species leaves the layout on Apply.
     *
     * @throws IllegalArgumentException (one line, naming the nodes) if nodes of the loaded layout
     *     still use the species; nothing changes then
     */
    public void removeSpecies(SpeciesRow row) {
        if (!species.contains(row)) {
            throw new IllegalArgumentException("no species row '" + row.name() + "' in the editor");
        }
        if (row.originalName != null) {
            refuseIfUsed(row.originalName, users.getOrDefault(row.originalName, List.of()));
            removed.add(row.originalName);
        }
        species.remove(row);
    }

    /**
     * The layout {@code s} (with the editor's {@code unused} species beside it) changed as the
     * fields describe. Nodes follow renamed species; volume, demands and targets are kept; the
     * {@link Scenario} constructor validates the result.
     *
     * @throws IllegalArgumentException with a one-line message naming the field when a value does
     *     not parse, is out of range, a name is blank or taken, or a removed species is still used
     */
    public Applied apply(Scenario s, List<Species> unused) {
        errors.clear();
        try {
            return applyFields(s, unused);
        } catch (FieldErrors.FieldException e) {
            throw errors.record(e);
        }
    }

    private Applied applyFields(Scenario s, List<Species> unused) {
        // every number is parsed first, so all malformed fields are marked at once
        double temperature = errors.number(TEMPERATURE, temperatureK.get());
        double viscosity = errors.number(VISCOSITY, viscosityMPaS.get());
        double background = errors.number(BACKGROUND, backgroundMoleculesPerS.get());
        Flow flow = flow();
        double symbolTime = errors.number(SYMBOL_TIME, symbolTimeS.get());
        long isi = errors.whole(ISI_MEMORY, isiMemorySymbols.get());
        long lv = errors.whole(LEVELS, levels.get());
        double prior = errors.number(PRIOR_ONE, priorOne.get());
        errors.throwFirst();
        Medium medium;
        try {
            medium = new Medium(temperature, viscosity, flow, background);
        } catch (IllegalArgumentException e) {
            throw FieldErrors.translate("medium", "medium", e);
        }
        Signalling signalling;
        try {
            signalling = new Signalling(symbolTime, clampToInt(isi), clampToInt(lv), prior, countModel.get(),
                    schedule.get());
            if (schedule.get() == Schedule.SLOTS) {
                // keep the slot plan; a new slots schedule starts from file order (round-robin)
                signalling = signalling.withSlots(s.signalling().frameSlots(), s.signalling().slots());
            }
        } catch (IllegalArgumentException e) {
            throw FieldErrors.translate("signalling", "signalling", e);
        }

        Map<String, Species> old = new HashMap<>();
        s.species().forEach(sp -> old.put(sp.name(), sp));
        unused.forEach(sp -> old.put(sp.name(), sp));
        List<Species> declared = new ArrayList<>();
        Map<String, String> renamed = new HashMap<>();
        for (int i = 0; i < species.size(); i++) {
            SpeciesRow row = species.get(i);
            String at = "species[" + i + "]";
            String label = row.originalName != null ? "species " + row.originalName : "new species row " + (i + 1);
            try {
                declared.add(row.toSpecies(medium, at));
            } catch (IllegalArgumentException e) {
                FieldErrors.FieldException f = FieldErrors.translate(at, at, e);
                throw new FieldErrors.FieldException(f.field(), label + ": " + f.getMessage());
            }
            if (row.originalName != null && !row.originalName.equals(row.name())) {
                renamed.put(row.originalName, row.name());
            }
        }
        // species the editor did not show (it was loaded from another layout) are kept
        for (Species sp : concat(s.species(), unused)) {
            if (rowFor(sp.name()) == null && !removed.contains(sp.name())) {
                declared.add(SpeciesRow.rederived(sp, medium));
            }
        }

        List<Node> nodes = new ArrayList<>();
        for (Node n : s.nodes()) {
            String sp = renamed.getOrDefault(n.species(), n.species());
            String em = renamed.getOrDefault(n.emitsSpecies(), n.emitsSpecies());
            nodes.add(sp.equals(n.species()) && em.equals(n.emitsSpecies()) ? n
                    : new Node(n.id(), n.role(), n.positionUm(), n.radiusUm(), sp, em, n.moleculesPerSymbol(),
                            n.fixed(), n.receiver()));
        }
        Map<String, List<String>> nowUsing = usersBySpecies(nodes);
        for (String gone : removed) {
            if (!renamed.containsKey(gone)) {
                refuseIfUsed(gone, nowUsing.getOrDefault(gone, List.of()));
            }
        }
        checkNames(s, medium, declared, nodes, nowUsing.keySet());

        List<Species> inLayout = new ArrayList<>();
        List<Species> notUsed = new ArrayList<>();
        for (Species sp : declared) {
            (nowUsing.containsKey(sp.name()) ? inLayout : notUsed).add(sp);
        }
        try {
            return new Applied(new Scenario(s.name(), s.volume(), medium, inLayout, signalling, nodes, s.demands(),
                    s.targets(), s.candidateSpecies(), s.tolerances()), notUsed);
        } catch (IllegalArgumentException e) {
            throw FieldErrors.fromProblems(e);
        }
    }

    /**
     * Duplicate names, with the core's own check and message (the paths count the editor's rows
     * from 0 in the order shown, as the file's {@code species[i]}); the "not used by any node"
     * problem is expected for unused species and skipped.
     */
    private static void checkNames(Scenario s, Medium medium, List<Species> declared, List<Node> nodes,
            Set<String> used) {
        Set<String> seen = new HashSet<>();
        Set<String> skip = new HashSet<>();
        for (int i = 0; i < declared.size(); i++) {
            String name = declared.get(i).name();
            if (seen.add(name) && !used.contains(name)) {
                skip.add("species[" + i + "].name");
            }
        }
        for (ScenarioProblem p : ScenarioValidator.check(s.volume(), medium.flow(), declared, nodes, s.demands())) {
            if (p.path().startsWith("species[") && !skip.contains(p.path())) {
                throw new FieldErrors.FieldException(p.path(), p.toString());
            }
        }
    }

    /** The flow the fields describe (NaN components when malformed: recorded in {@link #errors()}). */
    private Flow flow() {
        String profile = flowProfile.get();
        if (FLOW_PROFILES.get(1).equals(profile)) {
            double x = errors.number(VELOCITY + "[0]", flowVxUmPerS.get());
            double y = errors.number(VELOCITY + "[1]", flowVyUmPerS.get());
            double z = errors.number(VELOCITY + "[2]", flowVzUmPerS.get());
            // a malformed component is recorded; the caller refuses before the flow is used
            return Double.isNaN(x + y + z) ? new Flow.None() : new Flow.Uniform(new Vec3(x, y, z));
        }
        if (FLOW_PROFILES.get(2).equals(profile)) {
            double u = errors.number(MEAN_SPEED, flowMeanSpeedUmPerS.get());
            try {
                return new Flow.Poiseuille(Double.isNaN(u) ? 0 : u);
            } catch (IllegalArgumentException e) {
                throw FieldErrors.translate("medium.flow", MEAN_SPEED, e);
            }
        }
        if (FLOW_PROFILES.get(0).equals(profile)) {
            return new Flow.None();
        }
        throw new FieldErrors.FieldException("medium.flow.profile", "medium.flow.profile: unknown profile '" + profile
                + "', expected one of " + FLOW_PROFILES);
    }

    private static int clampToInt(long v) {
        return (int) Math.max(Integer.MIN_VALUE, Math.min(Integer.MAX_VALUE, v));
    }

    private static void refuseIfUsed(String name, List<String> nodeIds) {
        if (!nodeIds.isEmpty()) {
            int shown = Math.min(6, nodeIds.size());
            String list = String.join(", ", nodeIds.subList(0, shown))
                    + (nodeIds.size() > shown ? " and " + (nodeIds.size() - shown) + " more" : "");
            throw new IllegalArgumentException("species " + name + " is still used by node"
                    + (nodeIds.size() == 1 ? " " : "s ") + list + "; give them another species first");
        }
    }

    /** Node ids per species name they absorb or emit, ids in layout order. */
    private static Map<String, List<String>> usersBySpecies(List<Node> nodes) {
        Map<String, List<String>> m = new HashMap<>();
        for (Node n : nodes) {
            for (String sp : new TreeSet<>(List.of(n.species(), n.emitsSpecies()))) {
                m.computeIfAbsent(sp, k -> new ArrayList<>()).add(n.id());
            }
        }
        return m;
    }

    private static void setUsage(SpeciesRow r, List<String> ids) {
        r.usedBy = List.copyOf(ids);
        r.usage.set(ids.isEmpty() ? "not used yet" : ids.size() == 1 ? "node " + ids.get(0) : ids.size() + " nodes");
    }

    private static <T> List<T> concat(List<T> a, List<T> b) {
        List<T> out = new ArrayList<>(a);
        out.addAll(b);
        return out;
    }

    private SpeciesRow rowFor(String name) {
        for (SpeciesRow r : species) {
            if (name.equals(r.originalName)) {
                return r;
            }
        }
        return null;
    }

    private static String fmt(double v) {
        return Formats.field(v);
    }

    /** The message beside each refused field after {@link #apply}, keyed by the field's file path. */
    public FieldErrors errors() {
        return errors;
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

    /** The flow profile, one of {@link #FLOW_PROFILES}. */
    public ObjectProperty<String> flowProfileProperty() {
        return flowProfile;
    }

    /** Uniform flow: x component of the velocity in µm/s. */
    public StringProperty flowVxUmPerSProperty() {
        return flowVxUmPerS;
    }

    /** Uniform flow: y component of the velocity in µm/s. */
    public StringProperty flowVyUmPerSProperty() {
        return flowVyUmPerS;
    }

    /** Uniform flow: z component of the velocity in µm/s. */
    public StringProperty flowVzUmPerSProperty() {
        return flowVzUmPerS;
    }

    /** Poiseuille flow: mean speed over the cylinder's cross-section in µm/s (2× on the axis). */
    public StringProperty flowMeanSpeedUmPerSProperty() {
        return flowMeanSpeedUmPerS;
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

    /** The slot schedule (see {@link #SCHEDULE_HELP}). */
    public ObjectProperty<Schedule> scheduleProperty() {
        return schedule;
    }

    /** One row per species: the layout's in its order, then the unused ones, then added rows. */
    public ObservableList<SpeciesRow> species() {
        return species;
    }

    /** The row of the species with this layout name (or, for added rows, this typed name), or null. */
    public SpeciesRow species(String name) {
        SpeciesRow r = rowFor(name);
        if (r != null) {
            return r;
        }
        for (SpeciesRow row : species) {
            if (name.equals(row.name())) {
                return row;
            }
        }
        return null;
    }
}
