package dev.nanoplan.tolerance;

/**
 * The guard band of a weak link: the smallest release per symbol of its emitter (nominal, the samples'
 * relative spread of it kept) at which the link meets its error target in at least
 * {@link ToleranceSummary#WEAK_YIELD} of the first {@code samples} perturbed layouts. Under design
 * thresholds the nominal layout at that release sets the thresholds. Found by bisection on log2 of the
 * release between the nominal value and {@value #MAX_FACTOR}× it, to within {@value #RESOLUTION}
 * relative (then rounded up to a whole molecule); null when even {@value #MAX_FACTOR}× does not reach
 * the yield (the link is not limited by its own release). Cost: at most 8 × {@code samples} link
 * evaluations per link.
 */
public final class GuardBand {

    /** Largest multiple of the nominal release searched. */
    public static final double MAX_FACTOR = 64;
    /** Relative resolution of the search. */
    public static final double RESOLUTION = 0.05;

    private GuardBand() {
    }

    /** The guard band of link {@code l} of {@code study} over samples 0..samples−1, or null. */
    public static Long of(ToleranceStudy study, int l, int samples) {
        long nominal = study.nominal().nodesById().get(study.links().get(l).from()).moleculesPerSymbol();
        if (!reaches(study, l, samples, Math.round(nominal * MAX_FACTOR))) {
            return null;
        }
        double lo = 0;
        double hi = Math.log(MAX_FACTOR) / Math.log(2);
        if (reaches(study, l, samples, nominal)) {
            return nominal;
        }
        while (Math.pow(2, hi - lo) > 1 + RESOLUTION) {
            double mid = (lo + hi) / 2;
            if (reaches(study, l, samples, Math.round(nominal * Math.pow(2, mid)))) {
                hi = mid;
            } else {
                lo = mid;
            }
        }
        return (long) Math.ceil(nominal * Math.pow(2, hi));
    }

    private static boolean reaches(ToleranceStudy study, int l, int samples, long molecules) {
        double target = study.nominal().targets().maxErrorProbability();
        long[] design = study.designThresholdsWithMolecules(l, molecules);
        int ok = 0;
        for (int i = 0; i < samples; i++) {
            ok += study.errorWithMolecules(l, i, molecules, design) <= target ? 1 : 0;
            if (samples - (i + 1 - ok) < ToleranceSummary.WEAK_YIELD * samples) {
                return false; // too many failures already
            }
        }
        return ok >= ToleranceSummary.WEAK_YIELD * samples;
    }
}
