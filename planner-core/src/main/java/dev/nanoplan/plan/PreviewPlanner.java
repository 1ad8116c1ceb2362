package dev.nanoplan.plan;

import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.Schedule;

/**
 * A fast, approximate plan of a layout, shown while the exact plan ({@link NetworkPlanner}) is
 * still running: the same {@link Plan} records, computed in milliseconds for a hundred nodes.
 *
 * <p><b>What is the same as the exact plan.</b> Everything but the per-receiver evaluator
 * ({@link NormalReceiverEvaluator} instead of {@link ExactReceiverEvaluator} in {@link PlanPipeline}): the channel (analytic closed forms, or the
 * {@link PlanOptions#channel()} given), the candidate links and the total-variation pre-skip, the
 * all-active crosstalk (every other emitter heard at the receiver), the link graph and its floor,
 * the widest routes ({@link WidestPathFinder}) and their decode-and-forward cascade capacity
 * ({@link dev.nanoplan.info.ChannelCascade}), the unreachable-demand reasons, the rate warnings and the
 * shared-rate warnings ({@link SharedRates}).
 *
 * <p><b>What is approximate.</b> Each link's count given each level is replaced by the normal law
 * with the same mean and variance ({@link NormalLinkApproximation}: the textbook normal approximation
 * of a sum of independent binomials with continuity correction; W. Feller, <i>An Introduction to
 * Probability Theory and Its Applications</i>, vol. 1, 1968, ch. VII). The moments are exact and
 * cheap: an emitter sending level j with probability w_j contributes per slot k a mixture of
 * Bin(n_j, p_k) with mean p_k·A and variance p_k(1 − p_k)·A + p_k²·(B − A²), A = Σ w_j n_j,
 * B = Σ w_j n_j² (law of total variance), so each receiver sums its emitters once (O(m·L)) and a
 * link's crosstalk is that sum minus its own emitter (O(1)).
 *
 * <p><b>Strong on/off terms.</b> A neighbour whose current symbol lands with a large tap makes the
 * count bimodal; one normal law then underestimates the capacity badly (the exact capacity was seen
 * up to 6× above it, see {@link dev.nanoplan.network.GaussianScreen}). Per receiver the preview
 * ranks all per-slot terms by the variance of their level means, p_k²(B − A²), and per link keeps
 * the strongest few (at most {@link NormalReceiverEvaluator#strongTerms(int)}, 4 for binary signalling, 16 components;
 * each at least {@value NormalReceiverEvaluator#STRONG_FRACTION} of the link's shared variance; never the link's own current
 * symbol) as a mixture of normal components, the rest as one normal law. Where more terms than that
 * dominate the count (e.g. the culture-tank demo: a few relays and sensors, Lyapunov ratio of the
 * rest ≈ 2) the preview is still off by up to 0.3 bit ({@code PreviewPlannerTest} measures it);
 * elsewhere within 0.1 bit and typically 0.001 bit.
 *
 * <p><b>limited_by</b> is found as in the exact plan (remove ISI, crosstalk or background and see
 * which raises capacity most, SIGNAL when no removal closes 10 % of the gap), with the plain normal
 * law for the what-ifs compared with the plain normal baseline — as the exact plan's what-ifs use
 * the Gaussian count model — three closed-form evaluations per link. The reported threshold is the
 * capacity-achieving one (the exact plan reports the one maximising the mutual information at the
 * scenario's prior; they coincide at prior ½ up to rounding).
 *
 * <p><b>Skipped pairs.</b> As in the exact plan, a pair is skipped when 1 − (1 − p_0)^swing is below
 * the floor; then also when an upper bound on the approximate capacity (total variation and
 * Kullback–Leibler bounds, {@link NormalLinkApproximation#capacityUpperBoundBits(double, double,
 * double, double, NormalLinkApproximation.Mixture)}) is below it, which leaves out no link the full
 * evaluation would keep.
 *
 * <p><b>What is left out.</b> Molecule budgets (empty list) and the bottleneck advice (routes say
 * "advice follows with the exact plan"): both search over dozens of re-evaluations per hop. A direct
 * link below the floor shows as no direct link (the exact plan reports its evaluated capacity). The
 * first warning is always {@link #WARNING}, so any reader can tell a preview from an exact plan
 * ({@link #isPreview(Plan)}); the plan is meant for display only, never for the CLI's outputs.
 *
 * <p>Cost: the channel build plus O(Σ_receivers m·(L + 1)) for the moments and the strong terms plus,
 * per link that passes the bounds, one mixture evaluation and four plain ones
 * ({@link NormalLinkApproximation}, about 0.1 ms together), plus the routes. Receivers are evaluated
 * in parallel when there are more than {@value NormalReceiverEvaluator#PARALLEL_ABOVE}. Progress is
 * reported as for the exact plan (no budgets: it jumps from 0.9 to 1).
 */
public final class PreviewPlanner {

    /** First warning of every preview plan (followed by the stated deviation, {@link #warning}). */
    public static final String WARNING = "preview: normal approximation of the counts; no budgets or advice yet "
            + "- the exact plan follows";
    /** Advice of a reachable route in a preview. */
    public static final String ADVICE = "preview: advice follows with the exact plan";

    private PreviewPlanner() {
    }

    /** Whether the plan came from {@link #plan} (its first warning starts with {@link #WARNING}). */
    public static boolean isPreview(Plan plan) {
        return !plan.warnings().isEmpty() && plan.warnings().get(0).startsWith(WARNING);
    }

    /**
     * The first warning of a preview whose links may differ from the exact plan by up to
     * {@code largestDeviationBits} in operating mutual information ({@link PreviewDeviation}).
     */
    static String warning(double largestDeviationBits) {
        return WARNING + WITHIN + largestDeviationBits + " bit of the exact plan (operating mutual information)";
    }

    private static final String WITHIN = "; each link within ";

    /**
     * The stated largest deviation of a preview plan, bits (0 when the preview states none, or for an
     * exact plan): parsed back from its first warning.
     */
    public static double deviationBits(Plan plan) {
        if (!isPreview(plan)) {
            return 0;
        }
        String w = plan.warnings().get(0);
        int at = w.indexOf(WITHIN);
        if (at < 0) {
            return 0;
        }
        String rest = w.substring(at + WITHIN.length());
        return Double.parseDouble(rest.substring(0, rest.indexOf(' ')));
    }

    /**
     * Whether the preview models this layout: all-active signalling only (a round-robin schedule
     * decimates every link's taps per slot, which the preview does not do; callers show no preview).
     */
    public static boolean supports(Scenario scenario) {
        return scenario.signalling().schedule() == Schedule.ALL_ACTIVE;
    }

    /**
     * Plans the scenario approximately (floor, cutoff and channel of {@code options}; the progress
     * callback as for the exact plan).
     *
     * @throws IllegalArgumentException if {@code options.channel()} names nodes not in the scenario, or the
     *     schedule is not all-active ({@link #supports})
     */
    public static Plan plan(Scenario scenario, PlanOptions options) {
        if (!supports(scenario)) {
            throw new IllegalArgumentException("signalling.schedule: the preview covers all-active only, got "
                    + scenario.signalling().schedule().id());
        }
        return PlanPipeline.plan(scenario, options, NormalReceiverEvaluator.INSTANCE);
    }
}
