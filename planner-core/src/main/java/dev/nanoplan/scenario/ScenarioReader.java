package dev.nanoplan.scenario;

import com.fasterxml.jackson.core.JsonLocation;
import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.JsonNode;
import dev.nanoplan.count.CountModelKind;
import dev.nanoplan.geometry.Vec3;
import dev.nanoplan.geometry.Volume;
import java.io.IOException;
import java.io.InputStream;
import java.io.InputStreamReader;
import java.io.Reader;
import java.io.StringReader;
import java.nio.charset.CharacterCodingException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.HashSet;
import java.util.Iterator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;

/**
 * Reads and validates a {@value Scenario#FORMAT} scenario file (docs/architecture.md §4.1).
 *
 * <p>All problems are collected before anything is thrown: malformed JSON (one problem at the
 * parser's line:column), unsupported format version, missing required fields, wrongly typed
 * values, NaN/Infinity literals, out-of-range numbers (non-positive radii, diffusion coefficients,
 * symbol time; levels outside 2..16; prior outside (0, 1); …), unknown fields, and the cross-field
 * checks of {@link ScenarioValidator} (duplicates, undeclared or unused species, nodes outside the
 * volume, overlapping bodies, bad demands, Poiseuille flow outside a cylinder). Each problem names
 * the field path ({@code nodes[3].radius_um}) and the line:column where the offending value (or,
 * for a missing field, its enclosing object) starts; problems are sorted by file position.
 *
 * <p>Unknown fields are errors unless the reader is {@linkplain #lenient() lenient}, in which case
 * they are returned as {@link Result#warnings()}. The only exception that leaves the {@code read}
 * and {@code load} methods is {@link ScenarioException} (I/O failures become a problem too).
 *
 * <p>Optional fields and their defaults: {@code name} "", {@code medium} (temperature_K 310.15,
 * viscosity_mPa_s 0.69, flow none, background_molecules_per_s 0), {@code species[].half_life_s}
 * null = stable, {@code signalling} (isi_memory_symbols 10, levels 2, prior_one 0.5, count_model
 * exact, schedule all-active), {@code nodes[].emits_species} (relays only, default = species),
 * {@code nodes[].molecules_per_symbol} (receivers only, default 0), {@code nodes[].fixed} (false),
 * {@code nodes[].receiver} (absorbing; reactive needs {@code binding_rate_um_per_s}, passive may give
 * {@code sampling_offset_s}, default the end of the slot), {@code demands} [],
 * {@code targets} (max_error_probability 1e-3, min_rate_bits_per_s 0, mission_duration_s 3600).
 * Required: format, volume, species (non-empty), signalling.symbol_time_s, nodes (non-empty); under
 * {@code signalling.schedule} {@code slots} every emitter's {@code slot} (an integer ≥ 0, below
 * {@code signalling.frame_slots} when that is given); {@code slot} and {@code frame_slots} under another
 * schedule, or {@code slot} on a receiver, are errors.
 *
 * <p>Cost: O(file size + n) expected for n nodes. Instances are immutable and thread-safe.
 */
public final class ScenarioReader {

    /** Result of a successful read. */
    public record Result(Scenario scenario, List<ScenarioProblem> warnings) {
        /** @throws IllegalArgumentException if the scenario is null */
        public Result {
            Checks.required("scenario", scenario);
            warnings = List.copyOf(warnings);
        }
    }

    private final boolean lenient;

    /** @param lenient whether unknown fields are warnings instead of errors */
    public ScenarioReader(boolean lenient) {
        this.lenient = lenient;
    }

    /** A reader that rejects unknown fields. */
    public static ScenarioReader strict() {
        return new ScenarioReader(false);
    }

    /** A reader that reports unknown fields as warnings. */
    public static ScenarioReader lenient() {
        return new ScenarioReader(true);
    }

    /** Whether unknown fields are warnings instead of errors. */
    public boolean isLenient() {
        return lenient;
    }

    /** Reads and validates a file (UTF-8), returning the scenario and any warnings. */
    public Result load(Path file) throws ScenarioException {
        try (Reader in = Files.newBufferedReader(file, StandardCharsets.UTF_8)) {
            return load(in);
        } catch (NoSuchFileException e) {
            throw single("no such file: " + file);
        } catch (IOException e) {
            throw single("cannot read " + file + ": " + e.getMessage());
        }
    }

    /** Reads and validates a UTF-8 stream (not closed). */
    public Result load(InputStream in) throws ScenarioException {
        return load(new InputStreamReader(in, StandardCharsets.UTF_8));
    }

    /** Reads and validates JSON text. */
    public Result parse(String json) throws ScenarioException {
        return load(new StringReader(json));
    }

    /** Reads and validates a file, dropping warnings. */
    public Scenario read(Path file) throws ScenarioException {
        return load(file).scenario();
    }

    /** Reads and validates a UTF-8 stream (not closed), dropping warnings. */
    public Scenario read(InputStream in) throws ScenarioException {
        return load(in).scenario();
    }

    private Result load(Reader in) throws ScenarioException {
        LocatingTreeReader tree = new LocatingTreeReader();
        JsonNode root;
        try {
            root = tree.read(in);
        } catch (JsonProcessingException e) {
            JsonLocation at = e.getLocation();
            String msg = e.getOriginalMessage().replace('\n', ' ');
            throw new ScenarioException(List.of(at == null ? ScenarioProblem.at("", "invalid JSON: " + msg)
                    : new ScenarioProblem("", "invalid JSON: " + msg, at.getLineNr(), at.getColumnNr())));
        } catch (CharacterCodingException e) {
            throw single("not a UTF-8 text file (binary data?); a scenario is JSON text");
        } catch (IOException e) {
            throw single("cannot read scenario: " + e.getMessage());
        }
        if (root == null) {
            throw new ScenarioException(tree.problems());
        }
        Session s = new Session(tree, lenient);
        Scenario scenario;
        try {
            scenario = s.scenario(root);
        } catch (RuntimeException e) {
            // Safety net: every check above should have caught what a record constructor rejects.
            s.errors.add(ScenarioProblem.at("", "invalid scenario: " + e.getMessage()));
            scenario = null;
        }
        s.errors.addAll(tree.problems());
        if (!s.errors.isEmpty() || scenario == null) {
            throw new ScenarioException(s.located(s.errors));
        }
        s.warnings.addAll(Plausibility.check(scenario));
        return new Result(scenario, s.located(s.warnings));
    }

    private static ScenarioException single(String message) {
        return new ScenarioException(List.of(ScenarioProblem.at("", message)));
    }

    /** One read: the collected problems and the typed accessors that add to them. */
    private static final class Session {
        final LocatingTreeReader tree;
        final boolean lenient;
        final List<ScenarioProblem> errors = new ArrayList<>();
        final List<ScenarioProblem> warnings = new ArrayList<>();

        Session(LocatingTreeReader tree, boolean lenient) {
            this.tree = tree;
            this.lenient = lenient;
        }

        List<ScenarioProblem> located(List<ScenarioProblem> problems) {
            List<ScenarioProblem> out = new ArrayList<>(problems.size());
            for (ScenarioProblem p : problems) {
                if (p.hasLocation()) {
                    out.add(p);
                } else {
                    JsonLocation at = tree.locate(p.path());
                    out.add(at == null ? p : p.locatedAt(at.getLineNr(), at.getColumnNr()));
                }
            }
            out.sort(Comparator.comparingInt((ScenarioProblem p) -> p.hasLocation() ? p.line() : Integer.MAX_VALUE)
                    .thenComparingInt(ScenarioProblem::column));
            return out;
        }

        void error(String path, String message) {
            errors.add(ScenarioProblem.at(path, message));
        }

        Obj root(JsonNode node) {
            if (node == null || !node.isObject()) {
                error("", "a scenario must be a JSON object, got " + describe(node));
                return null;
            }
            return new Obj(this, node, "");
        }

        Scenario scenario(JsonNode rootNode) {
            Obj root = root(rootNode);
            if (root == null) {
                return null;
            }
            String format = root.string("format", null);
            if (format != null && !format.equals(Scenario.FORMAT)) {
                error("format", "unsupported format '" + format + "', expected '" + Scenario.FORMAT + "'");
            }
            String name = root.optionalString("name", "");
            Volume volume = volume(root.object("volume", true));
            Medium medium = medium(root.object("medium", false));
            Medium mediumForSpecies = medium == null ? Medium.DEFAULT : medium;

            List<Species> species = new ArrayList<>();
            List<ScenarioValidator.NamedFact> speciesFacts = new ArrayList<>();
            boolean speciesComplete = true;
            List<JsonNode> speciesNodes = root.array("species", true);
            if (speciesNodes != null && speciesNodes.isEmpty()) {
                error("species", "must list at least one species");
            }
            for (int i = 0; speciesNodes != null && i < speciesNodes.size(); i++) {
                Obj o = element(speciesNodes.get(i), "species[" + i + "]");
                String sName = o == null ? null : o.nonEmptyString("name");
                speciesComplete &= sName != null;
                speciesFacts.add(new ScenarioValidator.NamedFact(i, sName));
                Species sp = o == null ? null : species(o, sName, mediumForSpecies);
                if (sp != null) {
                    species.add(sp);
                }
            }
            speciesComplete &= speciesNodes != null;

            List<Species> candidates = new ArrayList<>();
            List<JsonNode> candidateNodes = root.array("candidate_species", false);
            for (int i = 0; candidateNodes != null && i < candidateNodes.size(); i++) {
                String at = "candidate_species[" + i + "]";
                Obj o = element(candidateNodes.get(i), at);
                String cName = o == null ? null : o.nonEmptyString("name");
                Species sp = o == null || cName == null ? null : species(o, cName, mediumForSpecies);
                if (sp == null) {
                    continue;
                }
                boolean taken = candidates.stream().anyMatch(c -> c.name().equals(cName))
                        || speciesFacts.stream().anyMatch(f -> cName.equals(f.name()));
                if (taken) {
                    error(at + ".name", "'" + cName + "' is already a species or a candidate");
                } else {
                    candidates.add(sp);
                }
            }

            Signalling signalling = signalling(root.object("signalling", true));

            List<Node> nodes = new ArrayList<>();
            List<ScenarioValidator.NodeFact> nodeFacts = new ArrayList<>();
            boolean nodesComplete = true;
            boolean idsComplete = true;
            List<JsonNode> nodeNodes = root.array("nodes", true);
            if (nodeNodes != null && nodeNodes.isEmpty()) {
                error("nodes", "must list at least one node");
            }
            for (int i = 0; nodeNodes != null && i < nodeNodes.size(); i++) {
                Obj o = element(nodeNodes.get(i), "nodes[" + i + "]");
                if (o == null) {
                    nodesComplete = false;
                    idsComplete = false;
                    continue;
                }
                NodeParts parts = node(o, i);
                idsComplete &= parts.fact().id() != null && parts.fact().role() != null;
                nodeFacts.add(parts.fact());
                nodesComplete &= parts.fact().species() != null
                        && (parts.fact().role() != Role.RELAY || parts.fact().emitsSpecies() != null);
                if (parts.node() != null) {
                    nodes.add(parts.node());
                }
            }
            nodesComplete &= nodeNodes != null;
            idsComplete &= nodeNodes != null;

            List<ScenarioValidator.DemandFact> demandFacts = new ArrayList<>();
            List<Demand> demands = new ArrayList<>();
            List<JsonNode> demandNodes = root.array("demands", false);
            for (int i = 0; demandNodes != null && i < demandNodes.size(); i++) {
                Obj o = element(demandNodes.get(i), "demands[" + i + "]");
                if (o == null) {
                    continue;
                }
                String from = o.nonEmptyString("from");
                String to = o.nonEmptyString("to");
                o.finish();
                demandFacts.add(new ScenarioValidator.DemandFact(i, from, to));
                if (from != null && to != null && !from.equals(to)) {
                    demands.add(new Demand(from, to));
                }
            }
            Targets targets = targets(root.object("targets", false));
            Tolerances tolerances = tolerances(root.object("tolerances", false), nodeFacts);
            root.finish();

            Flow flow = medium == null ? null : medium.flow();
            String flowProfile = flow == null ? flowProfileSeen : flow.profile();
            errors.addAll(ScenarioValidator.check(volume, flowProfile, speciesFacts, speciesComplete, nodeFacts,
                    nodesComplete, idsComplete, demandFacts));
            if (!errors.isEmpty() || volume == null || signalling == null) {
                return null;
            }
            if (signalling.schedule() == Schedule.SLOTS) {
                signalling = signalling.withSlots(frameSlotsSeen, slotsSeen);
            }
            return new Scenario(name, volume, medium == null ? Medium.DEFAULT : medium, species, signalling, nodes,
                    demands, targets == null ? Targets.DEFAULT : targets, candidates,
                    tolerances == null ? Tolerances.NONE : tolerances);
        }

        /** The optional {@code tolerances} section: every value a finite number >= 0; overrides name nodes. */
        Tolerances tolerances(Obj o, List<ScenarioValidator.NodeFact> nodeFacts) {
            if (o == null) {
                return Tolerances.NONE;
            }
            Tolerances.NodeSpread defaults = spread(o, Tolerances.NodeSpread.EXACT);
            Double d = o.number("diffusion_percent", 0.0, Bound.NON_NEGATIVE);
            Double t = o.number("temperature_K", 0.0, Bound.NON_NEGATIVE);
            Obj byNode = o.object("nodes", false);
            Map<String, Tolerances.NodeSpread> nodes = new LinkedHashMap<>();
            boolean ok = defaults != null && d != null && t != null;
            if (byNode != null) {
                Set<String> ids = new HashSet<>();
                nodeFacts.forEach(f -> ids.add(f.id()));
                for (Iterator<String> it = byNode.node.fieldNames(); it.hasNext(); ) {
                    String id = it.next();
                    Obj n = byNode.object(id, true);
                    if (!ids.contains(id)) {
                        byNode.problem(id, "no node has this id");
                        ok = false;
                    }
                    Tolerances.NodeSpread sp = n == null ? null : spread(n, defaults == null ? Tolerances.NodeSpread.EXACT : defaults);
                    if (n != null) {
                        n.finish();
                    }
                    ok &= sp != null;
                    if (sp != null) {
                        nodes.put(id, sp);
                    }
                }
            }
            o.finish();
            return ok ? new Tolerances(defaults, d, t, nodes) : null;
        }

        /** position_sd_um, radius_percent, molecules_percent of {@code o}, absent ones from {@code base}. */
        Tolerances.NodeSpread spread(Obj o, Tolerances.NodeSpread base) {
            Double p = o.number("position_sd_um", base.positionSdUm(), Bound.NON_NEGATIVE);
            Double r = o.number("radius_percent", base.radiusPercent(), Bound.NON_NEGATIVE);
            Double m = o.number("molecules_percent", base.moleculesPercent(), Bound.NON_NEGATIVE);
            return p == null || r == null || m == null ? null : new Tolerances.NodeSpread(p, r, m);
        }

        /** The flow profile name if it parsed even though the medium as a whole did not. */
        String flowProfileSeen;
        /** The schedule if it parsed (null otherwise); nodes read their {@code slot} under {@code slots}. */
        Schedule scheduleSeen;
        /** {@code signalling.frame_slots}, 0 when absent or not accepted. */
        int frameSlotsSeen;
        /** {@code signalling.symbol_time_s} if it parsed (null otherwise); bounds a passive sampling offset. */
        Double symbolTimeSeen;
        /** {@code nodes[].slot} by node id, under the {@code slots} schedule. */
        final Map<String, Integer> slotsSeen = new LinkedHashMap<>();

        Obj element(JsonNode node, String path) {
            if (!node.isObject()) {
                error(path, "must be an object, got " + describe(node));
                return null;
            }
            return new Obj(this, node, path);
        }

        Volume volume(Obj o) {
            if (o == null) {
                return null;
            }
            String shape = o.string("shape", null);
            Volume v = null;
            if (shape != null) {
                switch (shape) {
                    case "open":
                        v = new Volume.Open();
                        break;
                    case "box": {
                        Vec3 min = o.vector("min_um", true);
                        Vec3 max = o.vector("max_um", true);
                        if (min != null && max != null) {
                            if (max.x() > min.x() && max.y() > min.y() && max.z() > min.z()) {
                                v = new Volume.Box(min, max);
                            } else {
                                o.problem("max_um", "must exceed min_um on every axis, got min "
                                        + vec(min) + " and max " + vec(max));
                            }
                        }
                        break;
                    }
                    case "cylinder": {
                        Double r = o.number("radius_um", null, Bound.POSITIVE);
                        Double l = o.number("length_um", null, Bound.POSITIVE);
                        if (r != null && l != null) {
                            v = new Volume.Cylinder(r, l);
                        }
                        break;
                    }
                    default:
                        o.problem("shape", "unknown shape '" + shape + "', expected open, box or cylinder");
                        return null; // the other fields cannot be judged without a known shape
                }
            }
            o.finish();
            return v;
        }

        Medium medium(Obj o) {
            if (o == null) {
                return Medium.DEFAULT;
            }
            Double t = o.number("temperature_K", Medium.DEFAULT_TEMPERATURE_K, Bound.POSITIVE);
            Double eta = o.number("viscosity_mPa_s", Medium.DEFAULT_VISCOSITY_MPA_S, Bound.POSITIVE);
            Flow flow = flow(o.object("flow", false));
            Double bg = o.number("background_molecules_per_s", 0.0, Bound.NON_NEGATIVE);
            o.finish();
            if (t == null || eta == null || flow == null || bg == null) {
                return null;
            }
            return new Medium(t, eta, flow, bg);
        }

        Flow flow(Obj o) {
            if (o == null) {
                return new Flow.None();
            }
            String profile = o.string("profile", null);
            flowProfileSeen = profile;
            Flow f = null;
            if (profile != null) {
                switch (profile) {
                    case "none":
                        f = new Flow.None();
                        break;
                    case "uniform": {
                        Vec3 v = o.vector("velocity_um_per_s", true);
                        f = v == null ? null : new Flow.Uniform(v);
                        break;
                    }
                    case "poiseuille": {
                        Double u = o.number("mean_speed_um_per_s", null, Bound.NON_NEGATIVE);
                        f = u == null ? null : new Flow.Poiseuille(u);
                        break;
                    }
                    default:
                        o.problem("profile", "unknown flow profile '" + profile
                                + "', expected none, uniform or poiseuille");
                        return null; // the other fields cannot be judged without a known profile
                }
            }
            o.finish();
            return f;
        }

        Species species(Obj o, String name, Medium medium) {
            boolean hasD = o.has("diffusion_um2_per_s");
            boolean hasR = o.has("hydrodynamic_radius_nm");
            Double d = hasD ? o.number("diffusion_um2_per_s", null, Bound.POSITIVE) : null;
            Double r = hasR ? o.number("hydrodynamic_radius_nm", null, Bound.POSITIVE) : null;
            if (!hasD && !hasR) {
                o.problem("diffusion_um2_per_s",
                        "missing required field (give diffusion_um2_per_s or hydrodynamic_radius_nm)");
            } else if (hasD && hasR) {
                o.problem("hydrodynamic_radius_nm",
                        "give either diffusion_um2_per_s or hydrodynamic_radius_nm, not both");
            }
            double halfLife = Double.POSITIVE_INFINITY;
            boolean halfLifeOk = true;
            if (o.has("half_life_s") && !o.get("half_life_s").isNull()) {
                Double h = o.number("half_life_s", null, Bound.POSITIVE);
                halfLifeOk = h != null;
                halfLife = h == null ? halfLife : h;
            } else {
                o.consume("half_life_s");
            }
            o.finish();
            if (name == null || !halfLifeOk || hasD == hasR) {
                return null;
            }
            if (hasD) {
                return d == null ? null : Species.ofDiffusion(name, d, halfLife);
            }
            return r == null ? null : Species.ofHydrodynamicRadius(name, r, halfLife, medium);
        }

        Signalling signalling(Obj o) {
            if (o == null) {
                return null;
            }
            Double t = o.number("symbol_time_s", null, Bound.POSITIVE);
            symbolTimeSeen = t;
            Long isi = o.integer("isi_memory_symbols", (long) Signalling.DEFAULT_ISI_MEMORY, 0,
                    Signalling.MAX_ISI_MEMORY);
            Long levels = o.integer("levels", 2L, Signalling.MIN_LEVELS, Signalling.MAX_LEVELS);
            Double prior = o.number("prior_one", 0.5, Bound.OPEN_UNIT);
            String cm = o.optionalString("count_model", CountModelKind.EXACT.id());
            CountModelKind kind = null;
            if (cm != null) {
                for (CountModelKind k : CountModelKind.values()) {
                    kind = k.id().equals(cm) ? CountModelKind.parse(cm) : kind;
                }
                if (kind == null) {
                    o.problem("count_model", "unknown count model '" + cm + "', expected exact, poisson or gaussian");
                }
            }
            String sched = o.optionalString("schedule", Schedule.ALL_ACTIVE.id());
            Schedule schedule = null;
            if (sched != null) {
                try {
                    schedule = Schedule.parse(sched);
                } catch (IllegalArgumentException e) {
                    o.problem("schedule", "unknown schedule '" + sched + "', expected " + Schedule.EXPECTED);
                }
            }
            scheduleSeen = schedule;
            frameSlotsSeen = 0;
            if (o.has("frame_slots")) {
                Long frame = o.integer("frame_slots", null, 1, Signalling.MAX_FRAME_SLOTS);
                if (schedule != null && schedule != Schedule.SLOTS) {
                    o.problem("frame_slots", "only with schedule slots; this schedule is " + schedule.id());
                } else if (frame != null) {
                    frameSlotsSeen = frame.intValue();
                }
            }
            o.finish();
            if (t == null || isi == null || levels == null || prior == null || kind == null || schedule == null) {
                return null;
            }
            return new Signalling(t, isi.intValue(), levels.intValue(), prior, kind, schedule);
        }

        record NodeParts(ScenarioValidator.NodeFact fact, Node node) {
        }

        NodeParts node(Obj o, int index) {
            String id = o.nonEmptyString("id");
            String roleText = o.string("role", null);
            Role role = null;
            if (roleText != null) {
                try {
                    role = Role.parse(roleText);
                } catch (IllegalArgumentException e) {
                    o.problem("role", "unknown role '" + roleText + "', expected transmitter, receiver or relay");
                }
            }
            Vec3 position = o.vector("position_um", true);
            Double radius = o.number("radius_um", null, Bound.POSITIVE);
            String species = o.nonEmptyString("species");
            String emits = null;
            boolean emitsOk = true;
            if (o.has("emits_species")) {
                emits = o.nonEmptyString("emits_species");
                emitsOk = emits != null;
                if (role != null && role != Role.RELAY) {
                    o.problem("emits_species", "only relays may set emits_species; this node is a " + role.id());
                    emitsOk = false;
                }
            }
            Long molecules = null;
            if (role == Role.RECEIVER) {
                molecules = o.integer("molecules_per_symbol", 0L, 0, Long.MAX_VALUE);
            } else if (role != null) {
                molecules = o.integer("molecules_per_symbol", null, 1, Long.MAX_VALUE);
            } else {
                o.consume("molecules_per_symbol");
            }
            boolean fixed = o.flag("fixed");
            slot(o, id, role);
            ReceiverModel receiver = receiver(o, role);
            o.finish();
            String emitted = role == Role.RELAY ? (emits == null ? species : emits) : null;
            ScenarioValidator.NodeFact fact = new ScenarioValidator.NodeFact(index, id, role, position,
                    radius == null ? Double.NaN : radius, species, emitted);
            Node node = null;
            if (id != null && role != null && position != null && radius != null && species != null && emitsOk
                    && molecules != null && receiver != null) {
                node = new Node(id, role, position, radius, species, role == Role.RELAY ? emitted : species,
                        molecules, fixed, receiver);
            }
            return new NodeParts(fact, node);
        }

        /**
         * A node's {@code receiver} model with {@code binding_rate_um_per_s} (reactive only, &gt; 0) and
         * {@code sampling_offset_s} (passive only, in (0, symbol_time_s]); null after a problem.
         */
        ReceiverModel receiver(Obj o, Role role) {
            String text = o.string("receiver", ReceiverModel.Kind.ABSORBING.id());
            ReceiverModel.Kind kind = null;
            if (text != null) {
                try {
                    kind = ReceiverModel.Kind.parse(text);
                } catch (IllegalArgumentException e) {
                    o.problem("receiver", "unknown receiver '" + text + "', expected " + ReceiverModel.EXPECTED);
                }
            }
            if (kind != null && kind != ReceiverModel.Kind.ABSORBING && role == Role.TRANSMITTER) {
                o.problem("receiver", "only receivers and relays have a receiver model; this node is a transmitter");
                kind = null;
            }
            Double rate = null;
            if (o.has("binding_rate_um_per_s")) {
                rate = o.number("binding_rate_um_per_s", null, Bound.POSITIVE);
                if (kind != null && kind != ReceiverModel.Kind.REACTIVE) {
                    o.problem("binding_rate_um_per_s", "only with receiver reactive; this receiver is " + kind.id());
                    kind = null;
                }
            } else if (kind == ReceiverModel.Kind.REACTIVE) {
                o.problem("binding_rate_um_per_s", "missing required field (receiver is reactive)");
                kind = null;
            }
            Double offset = null;
            if (o.has("sampling_offset_s")) {
                offset = o.number("sampling_offset_s", null, Bound.POSITIVE);
                if (kind != null && kind != ReceiverModel.Kind.PASSIVE) {
                    o.problem("sampling_offset_s", "only with receiver passive; this receiver is " + kind.id());
                    kind = null;
                } else if (offset != null && symbolTimeSeen != null && offset > symbolTimeSeen) {
                    o.problem("sampling_offset_s", "must be <= signalling.symbol_time_s " + symbolTimeSeen
                            + ", got " + offset);
                    offset = null;
                }
                if (offset == null) {
                    kind = null;
                }
            }
            if (kind == null || (kind == ReceiverModel.Kind.REACTIVE && rate == null)) {
                return null;
            }
            return new ReceiverModel(kind, kind == ReceiverModel.Kind.REACTIVE ? rate : null,
                    kind == ReceiverModel.Kind.PASSIVE ? offset : null);
        }

        /** A node's {@code slot}: required of emitters under {@code slots}, refused otherwise. */
        void slot(Obj o, String id, Role role) {
            if (scheduleSeen == null) {
                o.consume("slot");
                return;
            }
            if (scheduleSeen != Schedule.SLOTS) {
                if (o.has("slot")) {
                    o.problem("slot", "only with signalling.schedule slots; the schedule is " + scheduleSeen.id());
                    o.consume("slot");
                }
                return;
            }
            if (role != null && !role.emits()) {
                if (o.has("slot")) {
                    o.problem("slot", "only emitters (transmitters and relays) have a slot; this node is a " + role.id());
                    o.consume("slot");
                }
                return;
            }
            long max = (frameSlotsSeen > 0 ? frameSlotsSeen : Signalling.MAX_FRAME_SLOTS) - 1L;
            if (o.has("slot")) {
                Long slot = o.integer("slot", null, 0, Long.MAX_VALUE);
                if (slot != null && slot > max) {
                    o.problem("slot", (frameSlotsSeen > 0 ? "must be below signalling.frame_slots " + frameSlotsSeen
                            : "must be below " + Signalling.MAX_FRAME_SLOTS) + ", got " + slot);
                } else if (slot != null && id != null) {
                    slotsSeen.put(id, slot.intValue());
                }
            } else if (role != null) {
                o.problem("slot", "missing required field (signalling.schedule is slots)");
            }
        }

        Targets targets(Obj o) {
            if (o == null) {
                return Targets.DEFAULT;
            }
            Double e = o.number("max_error_probability", Targets.DEFAULT.maxErrorProbability(), Bound.OPEN_UNIT);
            Double r = o.number("min_rate_bits_per_s", Targets.DEFAULT.minRateBitsPerS(), Bound.NON_NEGATIVE);
            Double m = o.number("mission_duration_s", Targets.DEFAULT.missionDurationS(), Bound.POSITIVE);
            o.finish();
            return e == null || r == null || m == null ? null : new Targets(e, r, m);
        }
    }

    /** Range a number must lie in. */
    private enum Bound {
        ANY(""),
        POSITIVE("must be > 0"),
        NON_NEGATIVE("must be >= 0"),
        OPEN_UNIT("must be in (0, 1)");

        final String rule;

        Bound(String rule) {
            this.rule = rule;
        }

        boolean accepts(double v) {
            switch (this) {
                case POSITIVE:
                    return v > 0;
                case NON_NEGATIVE:
                    return v >= 0;
                case OPEN_UNIT:
                    return v > 0 && v < 1;
                default:
                    return true;
            }
        }
    }

    /** Typed access to one JSON object; records which fields were used to find unknown ones. */
    private static final class Obj {
        private final Session s;
        private final JsonNode node;
        private final String path;
        private final Set<String> used = new HashSet<>();

        Obj(Session s, JsonNode node, String path) {
            this.s = s;
            this.node = node;
            this.path = path;
        }

        String child(String name) {
            return path.isEmpty() ? name : path + "." + name;
        }

        void problem(String name, String message) {
            s.error(child(name), message);
        }

        boolean has(String name) {
            return node.has(name);
        }

        JsonNode get(String name) {
            return node.get(name);
        }

        void consume(String name) {
            used.add(name);
        }

        /** The field's value, or null if absent (a problem if required). */
        private JsonNode field(String name, boolean required) {
            used.add(name);
            JsonNode v = node.get(name);
            if (v == null && required) {
                problem(name, "missing required field");
            }
            return v;
        }

        /** A string; {@code fallback} if absent and fallback != null, else a problem. */
        String string(String name, String fallback) {
            JsonNode v = field(name, fallback == null);
            if (v == null) {
                return fallback;
            }
            if (!v.isTextual()) {
                problem(name, "must be a string, got " + describe(v));
                return null;
            }
            return v.textValue();
        }

        /** An optional boolean, false if absent. */
        boolean flag(String name) {
            JsonNode v = field(name, false);
            if (v == null) {
                return false;
            }
            if (!v.isBoolean()) {
                problem(name, "must be true or false, got " + describe(v));
                return false;
            }
            return v.booleanValue();
        }

        String optionalString(String name, String fallback) {
            return string(name, fallback);
        }

        String nonEmptyString(String name) {
            String v = string(name, null);
            if (v != null && v.isBlank()) {
                problem(name, "must not be empty");
                return null;
            }
            return v;
        }

        /** A finite number within {@code bound}; {@code fallback} if absent and fallback != null. */
        Double number(String name, Double fallback, Bound bound) {
            JsonNode v = field(name, fallback == null);
            if (v == null) {
                return fallback;
            }
            return checkNumber(child(name), v, bound);
        }

        Double checkNumber(String at, JsonNode v, Bound bound) {
            if (!v.isNumber()) {
                s.error(at, "must be a number, got " + describe(v));
                return null;
            }
            double d = v.doubleValue();
            if (!Double.isFinite(d)) {
                s.error(at, "must be a finite number, got " + v.asText());
                return null;
            }
            if (!bound.accepts(d)) {
                s.error(at, bound.rule + ", got " + v.asText());
                return null;
            }
            return d;
        }

        /** A whole number in [min, max]; {@code fallback} if absent and fallback != null. */
        Long integer(String name, Long fallback, long min, long max) {
            JsonNode v = field(name, fallback == null);
            if (v == null) {
                return fallback;
            }
            if (!v.isNumber()) {
                problem(name, "must be a whole number, got " + describe(v));
                return null;
            }
            double d = v.doubleValue();
            if (!Double.isFinite(d)) {
                problem(name, "must be a finite number, got " + v.asText());
                return null;
            }
            if (!v.canConvertToExactIntegral() || !v.canConvertToLong()) {
                problem(name, "must be a whole number" + (v.canConvertToExactIntegral() ? " below 2^63" : "")
                        + ", got " + v.asText());
                return null;
            }
            long l = v.longValue();
            if (l < min || l > max) {
                problem(name, (max == Long.MAX_VALUE ? "must be >= " + min : "must be in " + min + ".." + max)
                        + ", got " + v.asText());
                return null;
            }
            return l;
        }

        /** An array of exactly three finite numbers; null (and a problem) otherwise. */
        Vec3 vector(String name, boolean required) {
            JsonNode v = field(name, required);
            if (v == null) {
                return null;
            }
            if (!v.isArray() || v.size() != 3) {
                problem(name, "must be an array of 3 numbers [x, y, z], got " + describe(v));
                return null;
            }
            double[] xyz = new double[3];
            boolean ok = true;
            for (int i = 0; i < 3; i++) {
                Double c = checkNumber(child(name) + "[" + i + "]", v.get(i), Bound.ANY);
                ok &= c != null;
                xyz[i] = c == null ? 0 : c;
            }
            return ok ? Vec3.of(xyz) : null;
        }

        Obj object(String name, boolean required) {
            JsonNode v = field(name, required);
            if (v == null) {
                return null;
            }
            if (!v.isObject()) {
                problem(name, "must be an object, got " + describe(v));
                return null;
            }
            return new Obj(s, v, child(name));
        }

        List<JsonNode> array(String name, boolean required) {
            JsonNode v = field(name, required);
            if (v == null) {
                return required ? null : List.of();
            }
            if (!v.isArray()) {
                problem(name, "must be an array, got " + describe(v));
                return null;
            }
            List<JsonNode> out = new ArrayList<>(v.size());
            v.forEach(out::add);
            return out;
        }

        /** Reports fields that no accessor asked for. */
        void finish() {
            Iterator<String> names = node.fieldNames();
            while (names.hasNext()) {
                String n = names.next();
                if (!used.contains(n)) {
                    ScenarioProblem p = ScenarioProblem.at(child(n), "unknown field");
                    (s.lenient ? s.warnings : s.errors).add(p);
                }
            }
        }
    }

    private static String vec(Vec3 v) {
        return "[" + ScenarioValidator.fmt(v.x()) + ", " + ScenarioValidator.fmt(v.y()) + ", "
                + ScenarioValidator.fmt(v.z()) + "]";
    }

    /** Short description of a JSON value for messages: its type and, for scalars, its text. */
    static String describe(JsonNode v) {
        if (v == null || v.isMissingNode()) {
            return "nothing";
        }
        if (v.isNull()) {
            return "null";
        }
        if (v.isTextual()) {
            String t = v.textValue();
            return "string \"" + (t.length() > 40 ? t.substring(0, 40) + "..." : t) + "\"";
        }
        if (v.isNumber()) {
            return "number " + v.asText();
        }
        if (v.isBoolean()) {
            return "boolean " + v.asText();
        }
        if (v.isArray()) {
            return "an array of " + v.size() + (v.size() == 1 ? " element" : " elements");
        }
        return v.getNodeType().name().toLowerCase(Locale.ROOT);
    }
}
