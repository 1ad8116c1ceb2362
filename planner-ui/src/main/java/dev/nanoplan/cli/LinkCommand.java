package dev.nanoplan.cli;

import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.nanoplan.count.CountModelKind;
import dev.nanoplan.network.LinkEvaluation;
import dev.nanoplan.network.LinkEvaluator;
import dev.nanoplan.network.LinkSpec;
import dev.nanoplan.physics.DecayingSphereHitting;
import dev.nanoplan.physics.HittingModel;
import dev.nanoplan.physics.OpenSphereHitting;
import dev.nanoplan.physics.PassiveSphereObservation;
import dev.nanoplan.physics.ReactiveSphereHitting;
import dev.nanoplan.physics.TapModel;
import dev.nanoplan.scenario.ReceiverModel;
import dev.nanoplan.physics.StokesEinstein;
import dev.nanoplan.report.LinkJson;
import dev.nanoplan.report.LinkPlotFiles;
import dev.nanoplan.report.LinkText;
import dev.nanoplan.scenario.Medium;
import dev.nanoplan.scenario.Signalling;
import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Model.CommandSpec;

/** {@code nanoplan link}: one link, from geometry or from given taps. Parses, calls the core, prints. */
@Command(name = "link", mixinStandardHelpOptions = true, sortOptions = false,
        description = {"Evaluates one diffusion link: hit probability, taps, thresholds, error, capacity and rate.",
            "Give the geometry (--distance-um, --radius-um, --diffusion-um2-per-s, --symbol-time-s) or --taps."})
public final class LinkCommand implements Callable<Integer> {

    @Spec
    CommandSpec spec;

    @Option(names = "--distance-um", description = "Centre-to-centre distance emitter → receiver (µm), > radius.")
    Double distanceUm;

    @Option(names = "--radius-um", description = "Receiver radius (µm).")
    Double radiusUm;

    @Option(names = "--diffusion-um2-per-s", description = "Diffusion coefficient (µm²/s).")
    Double diffusionUm2PerS;

    @Option(names = "--hydrodynamic-radius-nm",
            description = "Instead of --diffusion-um2-per-s: molecule radius (nm); D by Stokes–Einstein.")
    Double hydrodynamicRadiusNm;

    @Option(names = "--temperature-k", defaultValue = "" + Medium.DEFAULT_TEMPERATURE_K, description = "Temperature for Stokes–Einstein (K), default ${DEFAULT-VALUE}.")
    double temperatureK;

    @Option(names = "--viscosity-mpa-s", defaultValue = "" + Medium.DEFAULT_VISCOSITY_MPA_S, description = "Viscosity for Stokes–Einstein (mPa·s), default ${DEFAULT-VALUE}.")
    double viscosityMPaS;

    @Option(names = "--symbol-time-s", description = "Symbol time T (s).")
    Double symbolTimeS;

    @Option(names = "--molecules", description = "Molecules released for a \"1\" (for the top level when --levels > 2).")
    Long molecules;

    @Option(names = "--molecules-zero", defaultValue = "0", description = "Molecules released for a \"0\", default ${DEFAULT-VALUE}.")
    long moleculesZero;

    @Option(names = "--isi-memory", defaultValue = "" + Signalling.DEFAULT_ISI_MEMORY,
            description = "Earlier symbols whose leftovers count (L), default ${DEFAULT-VALUE} as in scenario files.")
    int isiMemory;

    @Option(names = "--half-life-s", description = "Half-life of the molecule (s); none = stable.")
    Double halfLifeS;

    @Option(names = "--receiver", defaultValue = "absorbing",
            description = "absorbing | passive (counts the molecules inside at one instant per slot) | reactive"
                    + " (binds at --binding-rate-um-per-s), default ${DEFAULT-VALUE}.")
    String receiver;

    @Option(names = "--binding-rate-um-per-s", description = "Reactive receiver: binding rate κ (µm/s), > 0.")
    Double bindingRateUmPerS;

    @Option(names = "--sampling-offset-s",
            description = "Passive receiver: sampling instant after each slot starts (s), in (0, T]; default T.")
    Double samplingOffsetS;

    @Option(names = "--background-per-s", defaultValue = "0", description = "Background molecules counted per second (Poisson), default ${DEFAULT-VALUE}.")
    double backgroundPerS;

    @Option(names = "--prior-one", defaultValue = "0.5", description = "Probability of sending a 1, default ${DEFAULT-VALUE}.")
    double priorOne;

    @Option(names = "--levels", defaultValue = "2", description = "Number of release levels (2..16), default ${DEFAULT-VALUE}.")
    int levels;

    @Option(names = "--level-molecules", split = ",", description = "Molecules of each level n0,n1,... (levels > 2).")
    long[] levelMolecules;

    @Option(names = "--count-model", defaultValue = "exact", description = "exact | poisson | gaussian, default ${DEFAULT-VALUE}.")
    String countModel;

    @Option(names = "--taps", split = ",", description = "Per-slot hit probabilities p0,p1,... instead of geometry.")
    double[] taps;

    @Option(names = "--max-error", description = "Error target to check at the threshold; also says whether a"
            + " detector that ignores the count meets it (then the target says nothing about the link).")
    Double maxError;

    @Option(names = "--json", description = "Print one JSON object on stdout.")
    boolean json;

    @Option(names = "--plot", description = "Write a plot (.svg or .png): count distributions with threshold, MI vs threshold.")
    Path plot;

    @Override
    public Integer call() throws IOException {
        if (plot != null && !LinkPlotFiles.supported(plot)) {
            throw new BadInputException("--plot: file name must end in .svg or .png, got " + plot);
        }
        if (plot != null) {
            OutputPaths.file("--plot", plot);
        }
        CountModelKind model;
        try {
            model = CountModelKind.parse(countModel);
        } catch (IllegalArgumentException e) {
            throw new BadInputException("--count-model: " + e.getMessage());
        }
        requireProbabilityOpen("--prior-one", priorOne);
        if (levels < 2 || levels > LinkSpec.MAX_LEVELS) {
            throw new BadInputException("--levels: must be between 2 and " + LinkSpec.MAX_LEVELS + ", got " + levels);
        }
        requireNonNegative("--background-per-s", backgroundPerS);
        if (maxError != null && !(maxError > 0 && maxError < 1)) {
            throw new BadInputException("--max-error: must be strictly between 0 and 1, got " + maxError);
        }
        if (moleculesZero < 0) {
            throw new BadInputException("--molecules-zero: must be >= 0, got " + moleculesZero);
        }
        if (isiMemory < 0 || isiMemory > Signalling.MAX_ISI_MEMORY) {
            throw new BadInputException("--isi-memory: must be in 0.." + Signalling.MAX_ISI_MEMORY + " symbols, got "
                    + isiMemory);
        }
        if (symbolTimeS == null) {
            throw new BadInputException("--symbol-time-s: missing (the symbol time is needed for rates and taps)");
        }
        requirePositive("--symbol-time-s", symbolTimeS);

        double[] channelTaps;
        double eventual = Double.NaN;
        if (taps != null) {
            if (distanceUm != null || radiusUm != null || diffusionUm2PerS != null || hydrodynamicRadiusNm != null) {
                throw new BadInputException("--taps: give either --taps or the geometry options, not both");
            }
            for (int k = 0; k < taps.length; k++) {
                if (!(taps[k] >= 0 && taps[k] <= 1)) {
                    throw new BadInputException("--taps: entry " + k + " must be a probability in [0, 1], got " + taps[k]);
                }
            }
            if (!receiverModel().isAbsorbing()) {
                throw new BadInputException("--receiver: give the receiver model with the geometry options, not with --taps");
            }
            channelTaps = taps.clone();
        } else {
            TapModel tm = tapModel();
            channelTaps = tm.taps(symbolTimeS, isiMemory);
            if (tm instanceof HittingModel hm) {
                eventual = hm.eventual();
            }
        }

        long[] lm = levelMolecules();
        LinkSpec linkSpec;
        try {
            linkSpec = new LinkSpec(channelTaps, lm, priorOne, backgroundPerS * symbolTimeS, model, symbolTimeS);
        } catch (IllegalArgumentException e) {
            throw new BadInputException(e.getMessage());
        }
        LinkEvaluation ev = LinkEvaluator.evaluate(linkSpec);
        if (plot != null) {
            LinkPlotFiles.write(ev, plot);
        }
        PrintWriter out = spec.commandLine().getOut();
        if (json) {
            ObjectNode o = LinkJson.of(ev, eventual);
            if (maxError != null) {
                o.put("max_error_probability", maxError);
                o.put("meets_error_target", ev.errorProbability() <= maxError);
                o.put("count_blind_meets_error_target", ev.countBlindMeets(maxError));
            }
            out.println(o.toString());
        } else {
            out.print(LinkText.render(ev, eventual, maxError == null ? Double.NaN : maxError));
            if (plot != null) {
                out.println("plot written to " + plot);
            }
        }
        out.flush();
        return 0;
    }

    private long[] levelMolecules() {
        if (levelMolecules != null) {
            if (levelMolecules.length != levels && levels != 2) {
                throw new BadInputException("--level-molecules: expected " + levels + " values (one per level), got "
                        + levelMolecules.length);
            }
            if (levelMolecules.length < 2 || levelMolecules.length > LinkSpec.MAX_LEVELS) {
                throw new BadInputException("--level-molecules: must give 2.." + LinkSpec.MAX_LEVELS + " values, got "
                        + levelMolecules.length);
            }
            for (int i = 0; i < levelMolecules.length; i++) {
                if (levelMolecules[i] < 0) {
                    throw new BadInputException("--level-molecules: entry " + i + " must be >= 0, got " + levelMolecules[i]);
                }
                if (i > 0 && levelMolecules[i] <= levelMolecules[i - 1]) {
                    throw new BadInputException("--level-molecules: values must be strictly increasing");
                }
            }
            levels = levelMolecules.length;
            return levelMolecules.clone();
        }
        if (molecules == null) {
            throw new BadInputException("--molecules: missing (molecules released for a \"1\")");
        }
        if (molecules <= 0) {
            throw new BadInputException("--molecules: must be > 0, got " + molecules);
        }
        if (levels == 2) {
            if (moleculesZero >= molecules) {
                throw new BadInputException("--molecules-zero: must be below --molecules (" + molecules + "), got "
                        + moleculesZero);
            }
            return new long[] {moleculesZero, molecules};
        }
        if (molecules < levels - 1) {
            throw new BadInputException("--molecules: " + levels + " distinct levels need at least " + (levels - 1)
                    + " molecules, got " + molecules);
        }
        return LinkSpec.evenLevels(levels, molecules);
    }

    /** The {@code --receiver} model with its rate or offset, checked against each other and T. */
    private ReceiverModel receiverModel() {
        ReceiverModel.Kind kind;
        try {
            kind = ReceiverModel.Kind.parse(receiver);
        } catch (IllegalArgumentException e) {
            throw new BadInputException("--receiver: " + e.getMessage());
        }
        if (bindingRateUmPerS != null && kind != ReceiverModel.Kind.REACTIVE) {
            throw new BadInputException("--binding-rate-um-per-s: only with --receiver reactive, got --receiver " + receiver);
        }
        if (samplingOffsetS != null && kind != ReceiverModel.Kind.PASSIVE) {
            throw new BadInputException("--sampling-offset-s: only with --receiver passive, got --receiver " + receiver);
        }
        if (kind == ReceiverModel.Kind.REACTIVE) {
            if (bindingRateUmPerS == null) {
                throw new BadInputException("--binding-rate-um-per-s: missing (--receiver reactive needs it)");
            }
            requirePositive("--binding-rate-um-per-s", bindingRateUmPerS);
            return ReceiverModel.reactive(bindingRateUmPerS);
        }
        if (kind == ReceiverModel.Kind.PASSIVE) {
            if (samplingOffsetS != null) {
                requirePositive("--sampling-offset-s", samplingOffsetS);
                if (samplingOffsetS > symbolTimeS) {
                    throw new BadInputException("--sampling-offset-s: must be <= --symbol-time-s " + symbolTimeS
                            + ", got " + samplingOffsetS);
                }
            }
            return ReceiverModel.passive(samplingOffsetS);
        }
        return ReceiverModel.ABSORBING;
    }

    /** The taps' model: the absorbing sphere of the geometry options, or the {@code --receiver} model. */
    private TapModel tapModel() {
        HittingModel absorbing = hittingModel();
        ReceiverModel rm = receiverModel();
        double d = diffusion();
        double halfLife = halfLifeS == null ? Double.POSITIVE_INFINITY : halfLifeS;
        return switch (rm.kind()) {
            case ABSORBING -> absorbing;
            case REACTIVE -> ReactiveSphereHitting.of(distanceUm, radiusUm, d, rm.bindingRateUmPerS(), halfLife);
            case PASSIVE -> PassiveSphereObservation.of(distanceUm, radiusUm, d, halfLife, rm.samplingOffsetS());
        };
    }

    private HittingModel hittingModel() {
        if (distanceUm == null) {
            throw new BadInputException("--distance-um: missing (or give --taps)");
        }
        if (radiusUm == null) {
            throw new BadInputException("--radius-um: missing (or give --taps)");
        }
        requirePositive("--distance-um", distanceUm);
        requirePositive("--radius-um", radiusUm);
        if (distanceUm <= radiusUm) {
            throw new BadInputException("--distance-um: must exceed --radius-um (" + radiusUm
                    + " µm): the emitter must lie outside the receiver, got " + distanceUm);
        }
        double d = diffusion();
        if (halfLifeS != null) {
            requirePositive("--half-life-s", halfLifeS);
            return DecayingSphereHitting.of(distanceUm, radiusUm, d, halfLifeS);
        }
        return OpenSphereHitting.of(distanceUm, radiusUm, d);
    }

    /** D in µm²/s from --diffusion-um2-per-s or Stokes–Einstein. */
    private double diffusion() {
        double d;
        if (diffusionUm2PerS != null) {
            if (hydrodynamicRadiusNm != null) {
                throw new BadInputException("--hydrodynamic-radius-nm: give either it or --diffusion-um2-per-s, not both");
            }
            requirePositive("--diffusion-um2-per-s", diffusionUm2PerS);
            d = diffusionUm2PerS;
        } else if (hydrodynamicRadiusNm != null) {
            requirePositive("--hydrodynamic-radius-nm", hydrodynamicRadiusNm);
            requirePositive("--temperature-k", temperatureK);
            requirePositive("--viscosity-mpa-s", viscosityMPaS);
            d = StokesEinstein.diffusionUm2PerS(temperatureK, viscosityMPaS, hydrodynamicRadiusNm);
        } else {
            throw new BadInputException("--diffusion-um2-per-s: missing (or give --hydrodynamic-radius-nm, or --taps)");
        }
        return d;
    }

    static void requirePositive(String option, double v) {
        if (!Double.isFinite(v) || v <= 0) {
            throw new BadInputException(option + ": must be a finite number > 0, got " + v);
        }
    }

    static void requireNonNegative(String option, double v) {
        if (!Double.isFinite(v) || v < 0) {
            throw new BadInputException(option + ": must be a finite number >= 0, got " + v);
        }
    }

    static void requireProbabilityOpen(String option, double v) {
        if (!(v > 0 && v < 1)) {
            throw new BadInputException(option + ": must be strictly between 0 and 1, got " + v);
        }
    }
}
