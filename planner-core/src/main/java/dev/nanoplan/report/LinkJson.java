package dev.nanoplan.report;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.nanoplan.detect.BinaryDetection;
import dev.nanoplan.detect.MultiLevelResult;
import dev.nanoplan.network.LinkEvaluation;
import dev.nanoplan.network.LinkSpec;

/** The {@code link --json} object of docs/architecture.md §4.3 (stable snake_case keys; more may be added). */
public final class LinkJson {

    static final ObjectMapper MAPPER = new ObjectMapper();

    private LinkJson() {
    }

    /**
     * @param e                       the evaluated link
     * @param eventualHitProbability  F(∞) of the geometry, or NaN when the taps were given (→ null)
     */
    public static ObjectNode of(LinkEvaluation e, double eventualHitProbability) {
        LinkSpec s = e.spec();
        ObjectNode o = MAPPER.createObjectNode();
        o.put("hit_probability", s.tap(0));
        putNullable(o, "eventual_hit_probability", eventualHitProbability);
        ArrayNode taps = o.putArray("taps");
        for (double t : s.taps()) {
            taps.add(t);
        }
        BinaryDetection b = e.binary();
        MultiLevelResult m = e.multiLevel();
        if (b != null) {
            o.put("threshold", b.miThreshold());
            o.put("mutual_information_bits", b.mutualInformationBits());
            o.put("capacity_bits", b.capacityBits());
            o.put("capacity_prior_one", b.capacityPriorOne());
            o.put("capacity_threshold", b.capacityThreshold());
            o.put("min_error_probability", e.minErrorProbability());
            o.put("min_error_threshold", e.minErrorThreshold());
        } else {
            o.putNull("threshold");
            o.put("mutual_information_bits", m.uniformMutualInformationBits());
            o.put("capacity_bits", m.capacityBits());
            o.putNull("capacity_prior_one");
            o.putNull("capacity_threshold");
            o.put("min_error_probability", e.minErrorProbability());
            o.putNull("min_error_threshold");
            ArrayNode th = o.putArray("thresholds");
            for (long t : m.thresholds()) {
                th.add(t);
            }
            ArrayNode in = o.putArray("input_distribution");
            for (double p : m.inputDistribution()) {
                in.add(p);
            }
            ArrayNode uth = o.putArray("uniform_input_thresholds");
            for (long t : m.uniformThresholds()) {
                uth.add(t);
            }
            o.put("soft_capacity_bits", m.softCapacityBits());
        }
        o.put("rate_bits_per_s", e.rateBitsPerS());
        o.put("log10_error_probability", e.log10ErrorProbability());
        o.put("prior_one", s.priorOne());
        o.put("levels", s.levels());
        ArrayNode lm = o.putArray("level_molecules");
        for (long n : s.levelMolecules()) {
            lm.add(n);
        }
        o.put("symbol_time_s", s.symbolTimeS());
        o.put("isi_memory_symbols", s.isiMemory());
        o.put("count_model", s.countModel().id());
        o.put("signal_mean", e.signalMeanMolecules());
        o.put("isi_mean", e.isiMeanMolecules());
        o.put("background_mean", e.backgroundMeanMolecules());
        o.put("truncated_mass", e.truncatedMass());
        o.put("caution", Cautions.SHORT);
        return o;
    }

    private static void putNullable(ObjectNode o, String key, double v) {
        if (Double.isFinite(v)) {
            o.put(key, v);
        } else {
            o.putNull(key);
        }
    }
}
