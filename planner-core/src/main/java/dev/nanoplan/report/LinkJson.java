package dev.nanoplan.report;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.nanoplan.detect.BinaryDetection;
import dev.nanoplan.detect.MultiLevelResult;
import dev.nanoplan.network.LinkCapacity;
import dev.nanoplan.network.LinkEvaluation;
import dev.nanoplan.network.LinkSpec;

/**
 * The {@code link --json} object (stable snake_case keys; more may be added). The operating point is
 * {@code threshold}, {@code mutual_information_bits}, {@code error_probability} (at that threshold) and
 * {@code log10_error_probability_at_threshold}, at the file's prior with the emitter's own leftovers
 * at the same prior (more levels: uniform inputs, {@code uniform_input_thresholds}); the capacity
 * keys are the consistent capacity ({@link LinkEvaluation#capacity()}), {@code rate_bits_per_s} =
 * {@code capacity_bits} / T and {@code operating_rate_bits_per_s} = mutual information / T;
 * {@code min_error_probability} / {@code min_error_threshold} / {@code log10_error_probability} are the
 * minimum-error point at the prior.
 */
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
        LinkCapacity c = e.capacity();
        if (b != null) {
            o.put("threshold", e.operatingThreshold());
            o.put("mutual_information_bits", e.mutualInformationBits());
            o.put("error_probability", e.errorProbability());
            o.put("capacity_bits", c.bits());
            o.put("capacity_prior_one", c.priorOne());
            o.put("capacity_threshold", c.threshold());
            o.put("min_error_probability", e.minErrorProbability());
            o.put("min_error_threshold", e.minErrorThreshold());
        } else {
            o.putNull("threshold");
            o.put("mutual_information_bits", e.mutualInformationBits());
            o.put("error_probability", e.errorProbability());
            o.put("capacity_bits", c.bits());
            o.putNull("capacity_prior_one");
            o.putNull("capacity_threshold");
            o.put("min_error_probability", e.minErrorProbability());
            o.putNull("min_error_threshold");
            ArrayNode th = o.putArray("thresholds");
            for (long t : c.thresholds()) {
                th.add(t);
            }
            ArrayNode in = o.putArray("input_distribution");
            for (double p : c.inputDistribution()) {
                in.add(p);
            }
            ArrayNode uth = o.putArray("uniform_input_thresholds");
            for (long t : e.operatingThresholds()) {
                uth.add(t);
            }
            o.put("soft_capacity_bits", m.softCapacityBits());
            putNullable(o, "quantizer_certified_gap_bits", m.certifiedGapBits());
        }
        o.put("rate_bits_per_s", c.bits() / s.symbolTimeS());
        o.put("operating_rate_bits_per_s", e.operatingRateBitsPerS());
        o.put("log10_error_probability", e.log10ErrorProbability());
        o.put("log10_error_probability_at_threshold", e.log10OperatingErrorProbability());
        o.put("count_blind_error_probability", e.countBlindErrorProbability());
        o.put("capacity_search_converged", c.converged());
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
