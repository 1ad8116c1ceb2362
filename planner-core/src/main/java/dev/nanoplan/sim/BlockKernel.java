package dev.nanoplan.sim;

import java.util.function.BooleanSupplier;
import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.sampling.distribution.ZigguratSampler;

/**
 * The time-step loop over one block: decay, move, reflect, absorb, and at sampling instants count
 * the molecules inside the passive observers. Kept in one small method so the JIT compiles the hot
 * loop as a whole.
 *
 * <p>Random numbers per molecule-step, in this order: three standard normals (x, y, z
 * displacement; Commons RNG {@link ZigguratSampler.NormalizedGaussian}), then one uniform per
 * perfectly absorbing sphere within reach whose bridge probability is above e^{-40}, and one per
 * reactive sphere the step ends in ({@link Absorbers}). Passive observers draw nothing. The
 * sequence, and so the result, depends only on the block's generator.
 */
final class BlockKernel {

    /** Cancellation is polled every this many steps. */
    static final int CANCEL_POLL_STEPS = 256;

    private BlockKernel() {
    }

    /**
     * Advances the block from step {@code fromStep} to {@code toStep} (exclusive). Step n covers
     * [nΔt, (n+1)Δt); an absorption in step n is counted in slot n / stepsPerSlot, in
     * {@code counts[receiver * slots + slot]}; a passive observer's sample at step boundary s
     * ({@link Observers}) is added there too, after step s − 1.
     *
     * @return false if cancelled before the end (the block's counts are then incomplete)
     */
    static boolean advance(Motion m, Absorbers a, MoleculeBlock b, int fromStep, int toStep, int stepsPerSlot,
            long[] counts, int slots, UniformRandomProvider rng, ZigguratSampler.NormalizedGaussian g,
            BooleanSupplier cancelled) {
        return advance(m, a, Observers.none(), b, fromStep, toStep, stepsPerSlot, counts, slots, rng, g, cancelled);
    }

    /** As above, with passive observers {@code obs}. */
    static boolean advance(Motion m, Absorbers a, Observers obs, MoleculeBlock b, int fromStep, int toStep,
            int stepsPerSlot, long[] counts, int slots, UniformRandomProvider rng,
            ZigguratSampler.NormalizedGaussian g, BooleanSupplier cancelled) {
        final double[] x = b.x;
        final double[] y = b.y;
        final double[] z = b.z;
        final int[] death = b.deathStep;
        final double sigma = m.sigmaUm;
        final int walls = m.walls;
        final boolean drift = m.drift != Motion.NO_DRIFT;
        final double dy0 = m.driftY();
        final double dz0 = m.driftZ();
        final boolean absorbing = a.count > 0;
        final double[] reflected = new double[3];
        int event = 0;
        while (event < obs.events && obs.step[event] <= fromStep) {
            event++;
        }
        long moved = 0;
        for (int n = fromStep; n < toStep; n++) {
            if (b.active == 0) {
                break;
            }
            if ((n - fromStep) % CANCEL_POLL_STEPS == CANCEL_POLL_STEPS - 1 && cancelled.getAsBoolean()) {
                b.moleculeSteps += moved;
                return false;
            }
            int slot = n / stepsPerSlot;
            int i = 0;
            while (i < b.active) {
                if (death[i] <= n) {
                    b.remove(i);
                    continue;
                }
                double x0 = x[i];
                double y0 = y[i];
                double z0 = z[i];
                double x1 = x0 + sigma * g.sample();
                double y1 = y0 + sigma * g.sample();
                double z1 = z0 + sigma * g.sample();
                if (drift) {
                    x1 += m.driftX(y0, z0);
                    y1 += dy0;
                    z1 += dz0;
                }
                if (walls == Motion.BOX) {
                    x1 = m.wallX(x1);
                    y1 = m.wallY(y1);
                    z1 = m.wallZ(z1);
                } else if (walls == Motion.CYLINDER) {
                    x1 = m.wallX(x1);
                    double s = m.radialScale(y1 * y1 + z1 * z1);
                    y1 *= s;
                    z1 *= s;
                }
                moved++;
                if (absorbing) {
                    int hit = a.absorb(x0, y0, z0, x1, y1, z1, rng, reflected);
                    if (hit >= 0) {
                        counts[hit * slots + slot]++;
                        b.remove(i);
                        continue;
                    }
                    if (hit == Absorbers.REFLECTED) {
                        x1 = reflected[0];
                        y1 = reflected[1];
                        z1 = reflected[2];
                    }
                }
                x[i] = x1;
                y[i] = y1;
                z[i] = z1;
                i++;
            }
            while (event < obs.events && obs.step[event] == n + 1) {
                counts[obs.countIndex[event]] += obs.inside(event, x, y, z, death, b.active);
                event++;
            }
        }
        b.moleculeSteps += moved;
        return true;
    }
}
