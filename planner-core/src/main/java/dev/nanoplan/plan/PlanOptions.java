package dev.nanoplan.plan;

import dev.nanoplan.network.ChannelMatrix;
import dev.nanoplan.network.Crosstalk;
import java.util.function.DoubleConsumer;

/**
 * Settings of {@link NetworkPlanner#plan}.
 *
 * @param capacityFloorBits     links below this capacity (bits per symbol) are left out of the
 *                              plan and the link graph; in [0, 1); default 0.01
 * @param cutoffMolecules       spatial cutoff: an emitter → receiver pair whose mean count over the
 *                              whole ISI memory, N·F((L+1)T) = N·Σ_k p_k (≤ N·r/d), is below this
 *                              many molecules is treated as silent (neither link nor interferer);
 *                              default 1e-3 molecules, which bounds the mean count per slot the
 *                              receiver ignores from that emitter (all-active schedule); ≥ 0
 * @param exactInterferers      per receiver, the strongest interferers treated exactly; the rest
 *                              enter as one moment-matched term ({@link Crosstalk}); ≥ 0, default 8
 * @param adviceTargetBits      operating mutual information the bottleneck advice aims for ("move
 *                              within X µm to reach this"), in (0, 1); default 0.9; for binary
 *                              signalling a fraction of the input entropy H(q) (the most a link
 *                              carries at the file's prior; 0.9 bit at q = 0.5), else bits
 * @param progress              receives the fraction of the work done, in [0, 1], possibly from
 *                              worker threads; never null (default ignores it)
 * @param channel               taps to use instead of the analytic ones (e.g. simulated), or null
 *                              for the analytic channel
 * @param jointBudgets          molecule budgets of all route emitters found together (power control,
 *                              {@code JointMoleculeBudgets}; default) or each alone, the others at their
 *                              file budgets ({@code MoleculeBudgets})
 */
public record PlanOptions(double capacityFloorBits, double cutoffMolecules, int exactInterferers,
        double adviceTargetBits, DoubleConsumer progress, ChannelMatrix channel, boolean jointBudgets) {

    /** Default floor, bits per symbol. */
    public static final double DEFAULT_FLOOR_BITS = 0.01;
    /** Default spatial cutoff, molecules over the memory. */
    public static final double DEFAULT_CUTOFF_MOLECULES = 1e-3;
    /** Default advice target, bits per symbol. */
    public static final double DEFAULT_ADVICE_TARGET_BITS = 0.9;

    /** Floor 0.01 bit, cutoff 1e-3 molecules, 8 exact interferers, advice target 0.9 bit, analytic, joint budgets. */
    public static final PlanOptions DEFAULT = new PlanOptions(DEFAULT_FLOOR_BITS, DEFAULT_CUTOFF_MOLECULES,
            Crosstalk.DEFAULT_EXACT_COUNT, DEFAULT_ADVICE_TARGET_BITS, f -> { }, null, true);

    public PlanOptions {
        if (!(capacityFloorBits >= 0 && capacityFloorBits < 1)) {
            throw new IllegalArgumentException("capacityFloorBits: must be in [0, 1), got " + capacityFloorBits);
        }
        if (!(cutoffMolecules >= 0) || Double.isInfinite(cutoffMolecules)) {
            throw new IllegalArgumentException("cutoffMolecules: must be finite and >= 0, got " + cutoffMolecules);
        }
        if (exactInterferers < 0) {
            throw new IllegalArgumentException("exactInterferers: must be >= 0, got " + exactInterferers);
        }
        if (!(adviceTargetBits > 0 && adviceTargetBits < 1)) {
            throw new IllegalArgumentException("adviceTargetBits: must be in (0, 1), got " + adviceTargetBits);
        }
        if (progress == null) {
            throw new IllegalArgumentException("progress: must not be null (use f -> { })");
        }
    }

    /** The defaults with another capacity floor. */
    public static PlanOptions withFloor(double capacityFloorBits) {
        return DEFAULT.floor(capacityFloorBits);
    }

    /** A copy with another floor. */
    public PlanOptions floor(double bits) {
        return new PlanOptions(bits, cutoffMolecules, exactInterferers, adviceTargetBits, progress, channel,
                jointBudgets);
    }

    /** A copy with another progress callback. */
    public PlanOptions withProgress(DoubleConsumer callback) {
        return new PlanOptions(capacityFloorBits, cutoffMolecules, exactInterferers, adviceTargetBits, callback,
                channel, jointBudgets);
    }

    /** A copy using the given channel (e.g. simulated taps) instead of the analytic one. */
    public PlanOptions withChannel(ChannelMatrix given) {
        return new PlanOptions(capacityFloorBits, cutoffMolecules, exactInterferers, adviceTargetBits, progress,
                given, jointBudgets);
    }

    /** A copy with another spatial cutoff. */
    public PlanOptions withCutoff(double molecules) {
        return new PlanOptions(capacityFloorBits, molecules, exactInterferers, adviceTargetBits, progress, channel,
                jointBudgets);
    }

    /** A copy with another number of exactly treated interferers. */
    public PlanOptions withExactInterferers(int count) {
        return new PlanOptions(capacityFloorBits, cutoffMolecules, count, adviceTargetBits, progress, channel,
                jointBudgets);
    }

    /** A copy with joint ({@code true}) or independent molecule budgets. */
    public PlanOptions withJointBudgets(boolean joint) {
        return new PlanOptions(capacityFloorBits, cutoffMolecules, exactInterferers, adviceTargetBits, progress,
                channel, joint);
    }
}
