package dev.nanoplan.sim;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.nanoplan.geometry.Vec3;
import dev.nanoplan.geometry.Volume;
import dev.nanoplan.io.AtomicFiles;
import dev.nanoplan.scenario.Flow;
import dev.nanoplan.scenario.Medium;
import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.ReceiverModel;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.Species;
import java.io.ByteArrayOutputStream;
import java.io.DataOutputStream;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.ArrayList;
import java.util.HexFormat;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;

/**
 * On-disk cache of simulated channels, so that re-planning a layout with other molecule budgets,
 * thresholds, targets or names costs no new simulation.
 *
 * <p>Key: SHA-256 (FIPS 180-4) of the scenario's <em>physical</em> content — volume, medium
 * temperature, viscosity and flow, every species' diffusion coefficient and half-life (in list
 * order), symbol time and ISI memory, every node's role, position, radius and sensed/emitted
 * species (in node order, species by their index in the species list) and, for a node whose
 * receiver model is not the default absorbing one, the model and its parameter (binding rate or
 * sampling offset; absorbing nodes add nothing, so the keys of all-absorbing layouts are those of
 * before receiver models existed) — plus the format version
 * {@value #FORMAT}, M, the seed and the Δt actually used (bit patterns of the doubles). Left out
 * on purpose, because the simulated single-release taps do not depend on them: names and ids,
 * molecules per symbol, the background rate, levels, prior, count model, demands and targets. A
 * cached channel is therefore stored by node <em>index</em> and given the current scenario's ids
 * when read back.
 *
 * <p>Files: {@code <dir>/<key>.json}, written atomically ({@link AtomicFiles}); only complete
 * runs are stored. A missing, unreadable or inconsistent file counts as a miss (it is then
 * overwritten). Default directory: {@code $NANOPLAN_CACHE_DIR}, else
 * {@code ~/.cache/nanoplan/channels}. Reading or writing costs O(emitters × receivers × (L+1)).
 */
public final class ChannelCache {

    /**
     * Version word of the cached file format and of the key; change it whenever the simulator's
     * model changes (old files then simply stop matching).
     */
    public static final String FORMAT = "nanoplan-channel/1";
    /** Environment variable overriding the default directory. */
    public static final String ENV_DIR = "NANOPLAN_CACHE_DIR";

    private static final ObjectMapper MAPPER = new ObjectMapper();

    private final Path directory;

    /** @param directory where the files live (created on first store) */
    public ChannelCache(Path directory) {
        if (directory == null) {
            throw new IllegalArgumentException("directory: required");
        }
        this.directory = directory;
    }

    /** The cache folder. */
    public Path directory() {
        return directory;
    }

    /**
     * The default folder: {@code env[NANOPLAN_CACHE_DIR]} when set and non-blank, else
     * {@code userHome/.cache/nanoplan/channels}.
     */
    public static Path defaultDirectory(Map<String, String> env, String userHome) {
        String d = env.get(ENV_DIR);
        if (d != null && !d.isBlank()) {
            return Path.of(d);
        }
        return Path.of(userHome, ".cache", "nanoplan", "channels");
    }

    /** Runs a simulation (the real {@link ParticleSimulator}, or a stand-in in tests). */
    @FunctionalInterface
    public interface Simulation {
        /** Simulates {@code scenario}. */
        SimulatedChannel run(Scenario scenario);
    }

    /**
     * Result of {@link #getOrSimulate}.
     *
     * @param channel the channel, with the current scenario's ids
     * @param hit true when read from the cache (no simulation ran)
     * @param file the cache file
     * @param stored true when a new complete run was written
     */
    public record Lookup(SimulatedChannel channel, boolean hit, Path file, boolean stored) {
    }

    /**
     * The cached channel for (scenario, settings) or, on a miss, {@code simulation.run(scenario)},
     * stored if complete ({@link SimulatedChannels#obtain} with a failed store thrown).
     *
     * @param settings M and seed of the key; Δt is resolved as {@link ParticleSimulator#timeStepS}
     * @throws IOException if a new result cannot be written
     */
    public Lookup getOrSimulate(Scenario scenario, SimulationSettings settings, Simulation simulation)
            throws IOException {
        SimulatedChannels.Obtained got = SimulatedChannels.obtain(scenario, settings, this, false, simulation,
                () -> false, dt -> { });
        got.throwStoreFailure();
        return new Lookup(got.channel(), got.fromCache(), got.file(), got.stored());
    }

    /** The file of a key. */
    public Path file(String key) {
        return directory.resolve(key + ".json");
    }

    /**
     * The cache key: lower-case hex SHA-256 of the physical content (see class comment).
     *
     * @param timeStepS Δt actually used, s
     */
    public static String key(Scenario scenario, long moleculesPerEmitter, long seed, double timeStepS) {
        return key(scenario, moleculesPerEmitter, seed, timeStepS, Set.of());
    }

    /**
     * The key of a run of some emitters only: {@link #key(Scenario, long, long, double)} plus their
     * indices among the scenario's emitters; a set naming every emitter (or none) gives the key of a
     * run of all, so such runs share one file.
     */
    public static String key(Scenario scenario, long moleculesPerEmitter, long seed, double timeStepS,
            Set<String> emitterIds) {
        ByteArrayOutputStream bytes = new ByteArrayOutputStream();
        try (DataOutputStream out = new DataOutputStream(bytes)) {
            out.writeUTF(FORMAT);
            writeVolume(out, scenario.volume());
            Medium m = scenario.medium();
            out.writeDouble(m.temperatureK());
            out.writeDouble(m.viscosityMPaS());
            writeFlow(out, m.flow());
            List<String> speciesNames = new ArrayList<>();
            out.writeInt(scenario.species().size());
            for (Species s : scenario.species()) {
                speciesNames.add(s.name());
                out.writeDouble(s.diffusionUm2PerS());
                out.writeDouble(s.halfLifeS());
            }
            out.writeDouble(scenario.signalling().symbolTimeS());
            out.writeInt(scenario.signalling().isiMemorySymbols());
            out.writeInt(scenario.nodes().size());
            for (Node n : scenario.nodes()) {
                out.writeUTF(n.role().id());
                writeVec(out, n.positionUm());
                out.writeDouble(n.radiusUm());
                out.writeInt(speciesNames.indexOf(n.species()));
                out.writeInt(speciesNames.indexOf(n.emitsSpecies()));
                writeReceiver(out, n.receiver());
            }
            out.writeLong(moleculesPerEmitter);
            out.writeLong(seed);
            out.writeDouble(timeStepS);
            List<Integer> subset = subset(scenario, emitterIds);
            if (subset != null) {
                out.writeUTF("emitters");
                out.writeInt(subset.size());
                for (int i : subset) {
                    out.writeInt(i);
                }
            }
        } catch (IOException e) {
            throw new UncheckedIOException(e); // cannot happen with an in-memory stream
        }
        try {
            return HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256").digest(bytes.toByteArray()));
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException("SHA-256 is required of every Java platform", e);
        }
    }

    /**
     * Indices among the scenario's emitters of the emitters {@code ids} names, or null when it names all
     * of them or none (a run of every emitter).
     */
    static List<Integer> subset(Scenario scenario, Set<String> ids) {
        if (ids.isEmpty()) {
            return null;
        }
        List<Integer> out = new ArrayList<>();
        int i = 0;
        for (Node n : scenario.nodes()) {
            if (n.role().emits()) {
                if (ids.contains(n.id())) {
                    out.add(i);
                }
                i++;
            }
        }
        return out.size() == i ? null : out;
    }

    /** A non-absorbing receiver model and its parameter; nothing for the default absorbing one. */
    private static void writeReceiver(DataOutputStream out, ReceiverModel rm) throws IOException {
        if (rm.isAbsorbing()) {
            return;
        }
        out.writeUTF("receiver:" + rm.kind().id());
        Double parameter = rm.kind() == ReceiverModel.Kind.REACTIVE ? rm.bindingRateUmPerS() : rm.samplingOffsetS();
        out.writeBoolean(parameter != null);
        if (parameter != null) {
            out.writeDouble(parameter);
        }
    }

    private static void writeVolume(DataOutputStream out, Volume v) throws IOException {
        if (v instanceof Volume.Box b) {
            out.writeUTF("box");
            writeVec(out, b.minUm());
            writeVec(out, b.maxUm());
        } else if (v instanceof Volume.Cylinder c) {
            out.writeUTF("cylinder");
            out.writeDouble(c.radiusUm());
            out.writeDouble(c.lengthUm());
        } else {
            out.writeUTF("open");
        }
    }

    private static void writeFlow(DataOutputStream out, Flow f) throws IOException {
        if (f instanceof Flow.Uniform u) {
            out.writeUTF("uniform");
            writeVec(out, u.velocityUmPerS());
        } else if (f instanceof Flow.Poiseuille p) {
            out.writeUTF("poiseuille");
            out.writeDouble(p.meanSpeedUmPerS());
        } else {
            out.writeUTF("none");
        }
    }

    private static void writeVec(DataOutputStream out, Vec3 v) throws IOException {
        out.writeDouble(v.x());
        out.writeDouble(v.y());
        out.writeDouble(v.z());
    }

    /**
     * Reads the channel stored under {@code key}, with {@code scenario}'s ids; empty when absent,
     * unreadable or inconsistent with the scenario's shape.
     */
    public Optional<SimulatedChannel> load(Scenario scenario, String key) {
        JsonNode root;
        try {
            root = MAPPER.readTree(Files.readAllBytes(file(key)));
        } catch (NoSuchFileException e) {
            return Optional.empty();
        } catch (IOException | RuntimeException e) {
            return Optional.empty();
        }
        try {
            return Optional.ofNullable(decode(scenario, key, root));
        } catch (RuntimeException e) {
            return Optional.empty();
        }
    }

    private static SimulatedChannel decode(Scenario scenario, String key, JsonNode root) {
        if (!FORMAT.equals(root.path("format").asText()) || !key.equals(root.path("key").asText())) {
            return null;
        }
        List<Node> all = scenario.nodes().stream().filter(n -> n.role().emits()).toList();
        List<Node> emitters = all;
        JsonNode indices = root.path("emitter_indices");
        if (indices.isArray()) {
            emitters = new ArrayList<>();
            for (JsonNode i : indices) {
                if (!i.canConvertToInt() || i.asInt() < 0 || i.asInt() >= all.size()) {
                    return null;
                }
                emitters.add(all.get(i.asInt()));
            }
        }
        List<Node> receivers = scenario.nodes().stream().filter(n -> n.role().absorbs()).toList();
        int slots = scenario.signalling().isiMemorySymbols() + 1;
        JsonNode runs = root.path("emitters");
        if (!runs.isArray() || runs.size() != emitters.size()) {
            return null;
        }
        List<EmitterRun> out = new ArrayList<>();
        for (int e = 0; e < emitters.size(); e++) {
            Node en = emitters.get(e);
            JsonNode run = runs.get(e);
            long m = run.path("molecules_simulated").asLong(-1);
            JsonNode counts = run.path("counts");
            if (m < 0 || !counts.isArray() || counts.size() != receivers.size()) {
                return null;
            }
            List<SimulatedTaps> taps = new ArrayList<>();
            for (int r = 0; r < receivers.size(); r++) {
                JsonNode c = counts.get(r);
                if (!c.isArray() || c.size() != slots) {
                    return null;
                }
                long[] perSlot = new long[slots];
                for (int k = 0; k < slots; k++) {
                    if (!c.get(k).canConvertToLong()) {
                        return null;
                    }
                    perSlot[k] = c.get(k).asLong();
                }
                taps.add(new SimulatedTaps(en.id(), receivers.get(r).id(), ParticleSimulator.senses(en, receivers.get(r)),
                        m, perSlot));
            }
            out.add(new EmitterRun(en.id(), en.emitsSpecies(), m, run.path("never_absorbed").asLong(),
                    run.path("molecule_steps").asLong(), taps));
        }
        return new SimulatedChannel(emitters.stream().map(Node::id).toList(),
                receivers.stream().map(Node::id).toList(), scenario.signalling().symbolTimeS(), slots - 1,
                root.path("dt_s").asDouble(), root.path("seed").asLong(), root.path("molecules_per_emitter").asLong(),
                true, out);
    }

    /**
     * Writes {@code channel} under {@code key} atomically, by emitter and receiver index.
     *
     * @throws IOException if the folder or file cannot be written
     */
    public void store(String key, SimulatedChannel channel) throws IOException {
        store(key, channel, null);
    }

    /**
     * As {@link #store(String, SimulatedChannel)}; with the scenario, a run of some of its emitters
     * also records their indices (so it can be read back).
     */
    public void store(String key, SimulatedChannel channel, Scenario scenario) throws IOException {
        ObjectNode root = MAPPER.createObjectNode();
        root.put("format", FORMAT);
        root.put("key", key);
        root.put("seed", channel.seed());
        root.put("molecules_per_emitter", channel.moleculesRequestedPerEmitter());
        root.put("dt_s", channel.timeStepS());
        root.put("symbol_time_s", channel.symbolTimeS());
        root.put("isi_memory_symbols", channel.isiMemorySymbols());
        if (scenario != null) {
            List<Integer> subset = subset(scenario, Set.copyOf(channel.emitterIds()));
            if (subset != null) {
                ArrayNode indices = root.putArray("emitter_indices");
                subset.forEach(indices::add);
            }
        }
        ArrayNode runs = root.putArray("emitters");
        for (EmitterRun run : channel.emitters()) {
            ObjectNode o = runs.addObject();
            o.put("emitter_when_stored", run.emitterId());
            o.put("molecules_simulated", run.moleculesSimulated());
            o.put("never_absorbed", run.neverAbsorbed());
            o.put("molecule_steps", run.moleculeSteps());
            ArrayNode counts = o.putArray("counts");
            for (SimulatedTaps t : run.receivers()) {
                ArrayNode c = counts.addArray();
                for (long v : t.absorbedPerSlot()) {
                    c.add(v);
                }
            }
        }
        AtomicFiles.write(file(key), MAPPER.writeValueAsBytes(root));
    }
}
