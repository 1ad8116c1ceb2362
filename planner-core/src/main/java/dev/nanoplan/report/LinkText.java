package dev.nanoplan.report;

import dev.nanoplan.detect.BinaryDetection;
import dev.nanoplan.detect.MultiLevelResult;
import dev.nanoplan.network.LinkEvaluation;
import dev.nanoplan.network.LinkSpec;
import java.util.Arrays;
import java.util.Locale;

/** The human-readable table and one-line verdict of {@code nanoplan link}. */
public final class LinkText {

    private LinkText() {
    }

    public static String render(LinkEvaluation e, double eventualHitProbability) {
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
        if (d != null) {
            row(b, "threshold τ", Numbers.threshold(d.miThreshold()), "decide 1 iff count ≥ τ (best MI at prior "
                    + Numbers.probability(s.priorOne()) + ")");
            row(b, "mutual information", Numbers.bits(d.mutualInformationBits()), "bit/symbol at τ and the prior");
            row(b, "min error probability", errText(e), "at τ = " + Numbers.threshold(e.minErrorThreshold()));
            row(b, "capacity", Numbers.bits(d.capacityBits()), "bit/symbol (τ = " + Numbers.threshold(d.capacityThreshold())
                    + ", prior one " + Numbers.probability(d.capacityPriorOne()) + ")");
        } else {
            row(b, "thresholds", Arrays.toString(m.thresholds()), "capacity-achieving, decide level j in cell j");
            row(b, "input distribution", probs(m.inputDistribution()), "capacity-achieving");
            row(b, "MI at uniform inputs", Numbers.bits(m.uniformMutualInformationBits()), "best thresholds "
                    + Arrays.toString(m.uniformThresholds()));
            row(b, "symbol error (MAP)", errText(e), "uniform inputs");
            row(b, "capacity", Numbers.bits(m.capacityBits()), "bit/symbol (hard decisions)");
            row(b, "soft capacity", Numbers.bits(m.softCapacityBits()), "bit/symbol, unquantised counts (upper bound)");
        }
        row(b, "rate", Numbers.quantity(e.rateBitsPerS()) + " bit/s", "capacity / symbol time "
                + Numbers.quantity(s.symbolTimeS()) + " s");
        b.append('\n').append(verdict(e)).append('\n');
        b.append("Note: ").append(Cautions.SHORT).append('\n');
        return b.toString();
    }

    /** One line saying whether the link is usable, and why not. */
    public static String verdict(LinkEvaluation e) {
        double c = e.capacityBits();
        double max = Math.log(e.spec().levels()) / Math.log(2);
        String word;
        if (c >= 0.9 * max) {
            word = "Strong link";
        } else if (c >= 0.5 * max) {
            word = "Usable link";
        } else if (c >= 0.1 * max) {
            word = "Weak link";
        } else {
            word = "Unusable link";
        }
        String why = "";
        if (c < 0.9 * max) {
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
                Numbers.quantity(Math.rint(max)), Numbers.quantity(e.rateBitsPerS()), errText(e), why);
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
