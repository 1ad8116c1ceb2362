package dev.nanoplan.scenario;

import com.fasterxml.jackson.core.JsonEncoding;
import com.fasterxml.jackson.core.JsonFactory;
import com.fasterxml.jackson.core.JsonGenerator;
import com.fasterxml.jackson.core.util.DefaultIndenter;
import com.fasterxml.jackson.core.util.DefaultPrettyPrinter;
import dev.nanoplan.geometry.Vec3;
import dev.nanoplan.geometry.Volume;
import dev.nanoplan.io.AtomicFiles;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.OutputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.util.List;

/**
 * Writes a {@link Scenario} in the {@value Scenario#FORMAT} file format, pretty-printed with the
 * fields in the order of docs/architecture.md §4.1 and every default written out, so that reading the output
 * gives back an equal scenario (numbers use the shortest decimal that reads back to the same
 * double, {@link Double#toString(double)}).
 *
 * <p>{@link #write(Scenario, Path)} is atomic: the text goes to a temporary file in the target's
 * directory, is forced to disk, and is then moved over the target with
 * {@link StandardCopyOption#ATOMIC_MOVE}; a crash leaves either the old file or the new one, never
 * half a scenario. If the file system cannot move atomically the move falls back to a plain
 * replace (still never a partially written target, but no longer crash-proof). Stateless and
 * thread-safe.
 */
public final class ScenarioWriter {

    private static final JsonFactory FACTORY = new JsonFactory();

    private ScenarioWriter() {
    }

    /**
     * Writes atomically to {@code file}, replacing it if present.
     *
     * @throws IOException if the temporary file cannot be written or moved (the target is untouched)
     */
    public static void write(Scenario scenario, Path file) throws IOException {
        AtomicFiles.write(file, out -> write(scenario, out));
    }

    /** The file text (UTF-8 JSON, ending with a newline). */
    public static String toJson(Scenario scenario) {
        ByteArrayOutputStream buf = new ByteArrayOutputStream();
        try {
            write(scenario, buf);
        } catch (IOException e) {
            throw new IllegalStateException("writing to memory cannot fail", e);
        }
        return buf.toString(StandardCharsets.UTF_8);
    }

    /** Writes the file text to {@code out} as UTF-8 (the stream is flushed, not closed). */
    public static void write(Scenario s, OutputStream out) throws IOException {
        DefaultPrettyPrinter pp = new DefaultPrettyPrinter()
                .withObjectIndenter(new DefaultIndenter("  ", "\n"))
                .withArrayIndenter(new DefaultIndenter("  ", "\n"));
        try (JsonGenerator g = FACTORY.createGenerator(out, JsonEncoding.UTF8)) {
            g.configure(JsonGenerator.Feature.AUTO_CLOSE_TARGET, false);
            g.setPrettyPrinter(pp);
            g.writeStartObject();
            g.writeStringField("format", Scenario.FORMAT);
            g.writeStringField("name", s.name());
            volume(g, s.volume());
            medium(g, s.medium());
            species(g, "species", s.species());
            if (!s.candidateSpecies().isEmpty()) {
                species(g, "candidate_species", s.candidateSpecies());
            }
            Signalling sig = s.signalling();
            g.writeObjectFieldStart("signalling");
            g.writeNumberField("symbol_time_s", sig.symbolTimeS());
            g.writeNumberField("isi_memory_symbols", sig.isiMemorySymbols());
            g.writeNumberField("levels", sig.levels());
            g.writeNumberField("prior_one", sig.priorOne());
            g.writeStringField("count_model", sig.countModel().id());
            g.writeStringField("schedule", sig.schedule().id());
            if (sig.frameSlots() > 0) {
                g.writeNumberField("frame_slots", sig.frameSlots());
            }
            g.writeEndObject();
            g.writeArrayFieldStart("nodes");
            for (Node n : s.nodes()) {
                g.writeStartObject();
                g.writeStringField("id", n.id());
                g.writeStringField("role", n.role().id());
                g.writeFieldName("position_um");
                vector(g, n.positionUm());
                g.writeNumberField("radius_um", n.radiusUm());
                g.writeStringField("species", n.species());
                if (n.role() == Role.RELAY) {
                    g.writeStringField("emits_species", n.emitsSpecies());
                }
                if (n.role().emits() || n.moleculesPerSymbol() != 0) {
                    g.writeNumberField("molecules_per_symbol", n.moleculesPerSymbol());
                }
                Integer slot = sig.slots().get(n.id());
                if (slot != null) {
                    g.writeNumberField("slot", slot);
                }
                if (n.fixed()) {
                    g.writeBooleanField("fixed", true);
                }
                ReceiverModel rm = n.receiver();
                if (!rm.isAbsorbing()) { // absorbing is the default: existing files stay byte-identical
                    g.writeStringField("receiver", rm.kind().id());
                    if (rm.bindingRateUmPerS() != null) {
                        g.writeNumberField("binding_rate_um_per_s", rm.bindingRateUmPerS());
                    }
                    if (rm.samplingOffsetS() != null) {
                        g.writeNumberField("sampling_offset_s", rm.samplingOffsetS());
                    }
                }
                g.writeEndObject();
            }
            g.writeEndArray();
            g.writeArrayFieldStart("demands");
            for (Demand d : s.demands()) {
                g.writeStartObject();
                g.writeStringField("from", d.from());
                g.writeStringField("to", d.to());
                g.writeEndObject();
            }
            g.writeEndArray();
            Targets t = s.targets();
            g.writeObjectFieldStart("targets");
            g.writeNumberField("max_error_probability", t.maxErrorProbability());
            g.writeNumberField("min_rate_bits_per_s", t.minRateBitsPerS());
            g.writeNumberField("mission_duration_s", t.missionDurationS());
            g.writeEndObject();
            tolerances(g, s.tolerances());
            g.writeEndObject();
            g.writeRaw('\n');
        }
        out.flush();
    }

    private static void species(JsonGenerator g, String field, List<Species> list) throws IOException {
        g.writeArrayFieldStart(field);
        for (Species sp : list) {
            g.writeStartObject();
            g.writeStringField("name", sp.name());
            if (sp.hydrodynamicRadiusNm().isPresent()) {
                g.writeNumberField("hydrodynamic_radius_nm", sp.hydrodynamicRadiusNm().getAsDouble());
            } else {
                g.writeNumberField("diffusion_um2_per_s", sp.diffusionUm2PerS());
            }
            if (sp.isStable()) {
                g.writeNullField("half_life_s");
            } else {
                g.writeNumberField("half_life_s", sp.halfLifeS());
            }
            g.writeEndObject();
        }
        g.writeEndArray();
    }

    /** The {@code tolerances} section, left out when nothing varies and no node has an override. */
    private static void tolerances(JsonGenerator g, Tolerances t) throws IOException {
        if (t.equals(Tolerances.NONE)) {
            return;
        }
        g.writeObjectFieldStart("tolerances");
        spread(g, t.defaults());
        g.writeNumberField("diffusion_percent", t.diffusionPercent());
        g.writeNumberField("temperature_K", t.temperatureK());
        if (!t.nodes().isEmpty()) {
            g.writeObjectFieldStart("nodes");
            for (var e : t.nodes().entrySet()) {
                g.writeObjectFieldStart(e.getKey());
                spread(g, e.getValue());
                g.writeEndObject();
            }
            g.writeEndObject();
        }
        g.writeEndObject();
    }

    private static void spread(JsonGenerator g, Tolerances.NodeSpread s) throws IOException {
        g.writeNumberField("position_sd_um", s.positionSdUm());
        g.writeNumberField("radius_percent", s.radiusPercent());
        g.writeNumberField("molecules_percent", s.moleculesPercent());
    }

    private static void volume(JsonGenerator g, Volume v) throws IOException {
        g.writeObjectFieldStart("volume");
        g.writeStringField("shape", v.shape());
        if (v instanceof Volume.Box b) {
            g.writeFieldName("min_um");
            vector(g, b.minUm());
            g.writeFieldName("max_um");
            vector(g, b.maxUm());
        } else if (v instanceof Volume.Cylinder c) {
            g.writeNumberField("radius_um", c.radiusUm());
            g.writeNumberField("length_um", c.lengthUm());
        }
        g.writeEndObject();
    }

    private static void medium(JsonGenerator g, Medium m) throws IOException {
        g.writeObjectFieldStart("medium");
        g.writeNumberField("temperature_K", m.temperatureK());
        g.writeNumberField("viscosity_mPa_s", m.viscosityMPaS());
        g.writeObjectFieldStart("flow");
        g.writeStringField("profile", m.flow().profile());
        if (m.flow() instanceof Flow.Uniform u) {
            g.writeFieldName("velocity_um_per_s");
            vector(g, u.velocityUmPerS());
        } else if (m.flow() instanceof Flow.Poiseuille p) {
            g.writeNumberField("mean_speed_um_per_s", p.meanSpeedUmPerS());
        }
        g.writeEndObject();
        g.writeNumberField("background_molecules_per_s", m.backgroundMoleculesPerS());
        g.writeEndObject();
    }

    /** A vector on one line, {@code [x, y, z]}, so node lists stay readable. */
    private static void vector(JsonGenerator g, Vec3 v) throws IOException {
        g.writeRawValue("[" + number(v.x()) + ", " + number(v.y()) + ", " + number(v.z()) + "]");
    }

    private static String number(double v) {
        return Double.toString(v);
    }
}
