package dev.nanoplan.tolerance;

import dev.nanoplan.tolerance.ToleranceStudy.SampleLayout;
import java.util.List;
import java.util.function.BooleanSupplier;

/**
 * The guard band of a weak link: the smallest release per symbol of its emitter (nominal, the samples'
 * relative spread of it kept) at which the link meets its error target in at least
 * {@link ToleranceSummary#WEAK_YIELD} of the given perturbed layouts (the first {@code --guard-samples}). Under design
 * thresholds the nominal layout at that release sets the thresholds. Found by bisection on log2 of the
 * release between the nominal value and {@value #MAX_FACTOR}× it, to within {@value #RESOLUTION}
 * relative (then rounded up to a whole molecule); null when even {@value #MAX_FACTOR}× does not reach
 * the yield (the link is not limited by its own release). Cost: at most 9 × {@code layouts.size()} link
 * evaluations per link (a step stops at the first failure that rules out the yield); the layouts and
 * their channels are built once by the caller and shared by all steps and links ({@link GuardBands}).
 */
public final class GuardBand {

    /** Largest multiple of the nominal release searched. */
    public static final double MAX_FACTOR = 64;
    /** Relative resolution of the search. */
    public static final double RESOLUTION = 0.05;

    private GuardBand() {
    }

    /** The guard band of link {@code l} of {@code study} over {@code layouts}, or null. */
    public static Long of(ToleranceStudy study, int l, List<SampleLayout> layouts) {
        return of(study, l, layouts, () -> false);
    }

    /**
     * As {@link #of(ToleranceStudy, int, List)}; once {@code cancelled} is true the search stops between
     * steps and the answer is null.
     */
    static Long of(ToleranceStudy study, int l, List<SampleLayout> layouts, BooleanSupplier cancelled) {
        long nominal = study.nominal().nodesById().get(study.links().get(l).from()).moleculesPerSymbol();
        if (!reaches(study, l, layouts, Math.round(nominal * MAX_FACTOR))) {
            return null;
        }
        double lo = 0;
        double hi = Math.log(MAX_FACTOR) / Math.log(2);
        if (reaches(study, l, layouts, nominal)) {
            return nominal;
        }
        while (Math.pow(2, hi - lo) > 1 + RESOLUTION) {
            if (cancelled.getAsBoolean()) {
                return null;
            }
            double mid = (lo + hi) / 2;
            if (reaches(study, l, layouts, Math.round(nominal * Math.pow(2, mid)))) {
                hi = mid;
            } else {
                lo = mid;
            }
        }
        return (long) Math.ceil(nominal * Math.pow(2, hi));
    }

    private static boolean reaches(ToleranceStudy study, int l, List<SampleLayout> layouts, long molecules) {
        double target = study.nominal().targets().maxErrorProbability();
        long[] design = study.designThresholdsWithMolecules(l, molecules);
        int samples = layouts.size();
        int ok = 0;
        for (int i = 0; i < samples; i++) {
            ok += study.errorWithMolecules(l, layouts.get(i), molecules, design) <= target ? 1 : 0;
            if (samples - (i + 1 - ok) < ToleranceSummary.WEAK_YIELD * samples) {
                return false; // too many failures already
            }
        }
        return ok >= ToleranceSummary.WEAK_YIELD * samples;
    }
}
