package dev.nanoplan.network;

import dev.nanoplan.count.CountPmf;
import dev.nanoplan.detect.BinaryDetection;
import dev.nanoplan.detect.MultiLevelResult;
import java.util.List;

/**
 * The evaluated link.
 *
 * @param spec                     what was evaluated
 * @param givenLevel               pmf of the slot count given each sent level
 * @param binary                   detection results (two levels), else null
 * @param multiLevel               quantizer/capacity results (more than two levels), else null
 * @param minErrorThreshold        binary: τ of the minimum error (exact, log space when tiny); −1
 *                                 for more levels
 * @param minErrorProbability      binary: minimum of (1−q)ε₀ + qε₁; more levels: symbol error of the
 *                                 MAP detector at uniform inputs. May underflow to 0: see the log
 * @param log10ErrorProbability    log10 of the previous, finite even below 1e-300 (binary, exact
 *                                 count model)
 * @param signalMeanMolecules      (n_max − n_min)·p_0
 * @param isiMeanMolecules         mean leftovers of earlier own symbols
 * @param interferenceMeanMolecules mean count from other emitters
 * @param backgroundMeanMolecules  mean background count per slot
 * @param truncatedMass            largest probability mass dropped by truncation over the levels
 */
public record LinkEvaluation(LinkSpec spec, List<CountPmf> givenLevel, BinaryDetection binary,
        MultiLevelResult multiLevel, long minErrorThreshold, double minErrorProbability,
        double log10ErrorProbability, double signalMeanMolecules, double isiMeanMolecules,
        double interferenceMeanMolecules, double backgroundMeanMolecules, double truncatedMass) {

    /** Capacity in bits per symbol (max over thresholds and inputs). */
    public double capacityBits() {
        return binary != null ? binary.capacityBits() : multiLevel.capacityBits();
    }

    /** Capacity divided by the symbol time. */
    public double rateBitsPerS() {
        return capacityBits() / spec.symbolTimeS();
    }
}
