package dev.nanoplan.report;

import dev.nanoplan.detect.BinaryDetection;
import dev.nanoplan.detect.MultiLevelResult;
import dev.nanoplan.network.LinkCapacity;
import dev.nanoplan.network.LinkEvaluation;
import dev.nanoplan.network.LinkSpec;
import dev.nanoplan.plan.PlanOptions;
import java.util.Arrays;
import java.util.Locale;

/** The human-readable table and one-line verdict of {@code nanoplan link}. */
public final class LinkText {

    private LinkText() {
    }

    public static String render(LinkEvaluation e, double eventualHitProbability) {
        return render(e, eventualHitProbability, Double.NaN);
    }

    /**
     * @param maxErrorProbability an error target to check (NaN: none); the text then says whether the
     *                            operating point meets it and whether a detector that ignores the count
     *                            would meet it too
     */
    public static String render(LinkEvaluation e, double eventualHitProbability, double maxErrorProbability) {
        LinkSpec s = e.spec();
        StringBuilder b = new StringBuilder();
        row(b, "hit probability F(T)", Numbers.probability(s.tap(0)), "fraction of one release counted in its own slot");
        if (Double.isFinite(eventualHitProbability)) {
            row(b, "eventual hit F(∞)", Numbers.probability(eventualHitProbability), "fraction ever counted");
        }
        row(b, "taps p0..pL", tapsText(s.taps()), "per-slot hit probabilities (ISI memory " + s.isiMemory() + ")");
        row(b, "levels (molecules)", Arrays.toString(s.levelMolecules()), "count model " + s.countModel().id());
        row(b, "mean counts", "signal " + Numbers.quantity(e.signalMeanMolecules())
                + ", ISI " + Numbers.quantity(e.isiMeanMolecules()) + ", background "
                + Numbers.quantity(e.backgroundMeanMolecules()), "per slot");
        BinaryDetection d = e.binary();
        MultiLevelResult m = e.multiLevel();
        LinkCapacity c = e.capacity();
        if (d != null) {
            row(b, "threshold τ", Numbers.threshold(e.operatingThreshold()), "decide 1 iff count ≥ τ (best MI at prior "
                    + Numbers.probability(s.priorOne()) + ")");
            row(b, "mutual information", Numbers.bits(e.mutualInformationBits()), "bit/symbol at τ and the prior"
                    + " (operating point)");
            row(b, "error probability", Numbers.errorProbability(e.errorProbability(), e.log10OperatingErrorProbability()),
                    "at τ = " + Numbers.threshold(e.operatingThreshold()));
            row(b, "min error probability", errText(e), "at τ = " + Numbers.threshold(e.minErrorThreshold()));
            row(b, "capacity", Numbers.bits(c.bits()), "bit/symbol at prior one " + Numbers.probability(c.priorOne())
                    + " (τ = " + Numbers.threshold(c.threshold()) + "), earlier symbols at the same prior; +"
                    + Numbers.bits(Math.max(0, c.bits() - e.mutualInformationBits())) + " over the operating point");
        } else {
            row(b, "thresholds", Arrays.toString(e.operatingThresholds()), "best at uniform inputs (operating point)");
            row(b, "mutual information", Numbers.bits(e.mutualInformationBits()), "bit/symbol at uniform inputs"
                    + " (operating point)");
            row(b, "symbol error", Numbers.errorProbability(e.errorProbability(), e.log10OperatingErrorProbability()),
                    "at those thresholds, uniform inputs");
            row(b, "symbol error (MAP)", errText(e), "uniform inputs, best detector");
            row(b, "capacity", Numbers.bits(c.bits()), "bit/symbol (hard decisions), earlier symbols at the same input"
                    + " law; +" + Numbers.bits(Math.max(0, c.bits() - e.mutualInformationBits()))
                    + " over the operating point");
            row(b, "capacity thresholds", Arrays.toString(c.thresholds()), "decide level j in cell j");
            row(b, "input distribution", probs(c.inputDistribution()), "capacity-achieving");
            row(b, "soft capacity", Numbers.bits(m.softCapacityBits()), "bit/symbol, unquantised counts, uniform"
                    + " leftovers (upper bound there)");
        }
        row(b, "rate", Numbers.quantity(e.operatingRateBitsPerS()) + " bit/s", "operating point / symbol time "
                + Numbers.quantity(s.symbolTimeS()) + " s; " + Numbers.quantity(c.bits() / s.symbolTimeS())
                + " bit/s at capacity");
        if (!Double.isNaN(maxErrorProbability)) {
            row(b, "error target", Numbers.probability(maxErrorProbability),
                    e.errorProbability() <= maxErrorProbability ? "met at τ" : "not met at τ");
            if (e.countBlindMeets(maxErrorProbability)) {
                b.append("Warning: the error target ").append(Numbers.probability(maxErrorProbability))
                        .append(" is met by a detector that ignores the count (error ")
                        .append(Numbers.probability(e.countBlindErrorProbability()))
                        .append(" = always deciding the likelier level): it says nothing about this link;"
                                + " judge the link by its mutual information.").append(System.lineSeparator());
            }
        }
        b.append('\n').append(verdict(e)).append('\n');
        b.append("Note: ").append(Cautions.SHORT).append('\n');
        return b.toString();
    }

    /** Bits per symbol at or above which a link is "Usable" (below it, "Weak"). */
    public static final double USABLE_BITS = 0.5;

    /**
     * One line saying whether the link is usable, and why not. One rule for every number of levels, on
     * the bits per symbol at the operating point, the figure the plan routes on: "Strong" from the
     * planner's advice target ({@link PlanOptions#DEFAULT_ADVICE_TARGET_BITS} bit), "Usable" from
     * {@value #USABLE_BITS} bit, "Weak" from the plan's capacity floor
     * ({@link PlanOptions#DEFAULT_FLOOR_BITS} bit), "Unusable" below it (a plan leaves such a link out).
     * A 4-level link at 0.88 bit is thus "Usable", like a binary one at 0.88 bit.
     */
    public static String verdict(LinkEvaluation e) {
        double c = e.mutualInformationBits();
        double max = Math.log(e.spec().levels()) / Math.log(2);
        String word;
        if (c >= PlanOptions.DEFAULT_ADVICE_TARGET_BITS) {
            word = "Strong link";
        } else if (c >= USABLE_BITS) {
            word = "Usable link";
        } else if (c >= PlanOptions.DEFAULT_FLOOR_BITS) {
            word = "Weak link";
        } else {
            word = "Unusable link";
        }
        String why = "";
        if (c < Math.min(PlanOptions.DEFAULT_ADVICE_TARGET_BITS, 0.9 * max)) {
            double sig = Math.max(e.signalMeanMolecules(), 1e-300);
            double isi = e.isiMeanMolecules() / sig;
            double bg = e.backgroundMeanMolecules() / sig;
            double xt = e.interferenceMeanMolecules() / sig;
            if (isi >= 0.25 && isi >= bg && isi >= xt) {
                why = String.format(Locale.ROOT, "; leftovers of earlier symbols are %.0f%% of the signal: lengthen the"
                        + " symbol time", 100 * isi);
            } else if (xt >= 0.25 && xt >= bg) {
                why = String.format(Locale.ROOT, "; crosstalk is %.0f%% of the signal: separate the emitters or give"
                        + " them their own species", 100 * xt);
            } else if (bg >= 0.25) {
                why = String.format(Locale.ROOT, "; background is %.0f%% of the signal: release more molecules", 100 * bg);
            } else {
                why = "; too few molecules arrive: release more or move the receiver closer";
            }
        }
        return String.format(Locale.ROOT, "%s: %s of %s bit/symbol, %s bit/s, error %s%s.", word, Numbers.bits(c),
                Numbers.quantity(Math.rint(max)), Numbers.quantity(e.operatingRateBitsPerS()),
                Numbers.errorProbability(e.errorProbability(), e.log10OperatingErrorProbability()), why);
    }

    static String errText(LinkEvaluation e) {
        return Numbers.errorProbability(e.minErrorProbability(), e.log10ErrorProbability());
    }

    private static String tapsText(double[] t) {
        StringBuilder b = new StringBuilder();
        int n = Math.min(t.length, 6);
        for (int i = 0; i < n; i++) {
            b.append(i == 0 ? "" : ", ").append(Numbers.probability(t[i]));
        }
        if (t.length > n) {
            b.append(", … (").append(t.length).append(" taps)");
        }
        return b.toString();
    }

    private static String probs(double[] p) {
        StringBuilder b = new StringBuilder("[");
        for (int i = 0; i < p.length; i++) {
            b.append(i == 0 ? "" : ", ").append(Numbers.probability(p[i]));
        }
        return b.append(']').toString();
    }

    private static void row(StringBuilder b, String name, String value, String note) {
        b.append(String.format(Locale.ROOT, "%-22s %-34s %s%n", name, value, note));
    }
}
