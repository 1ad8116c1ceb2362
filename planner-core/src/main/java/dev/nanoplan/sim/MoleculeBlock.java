package dev.nanoplan.sim;

import java.util.Arrays;
import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.sampling.distribution.ZigguratSampler;

/**
 * State of a block of molecules in structure-of-arrays form: positions x, y, z (µm) and the step
 * at which each decays, for the first {@link #active} entries. No object per molecule:
 * {@value #STATE_BYTES_PER_MOLECULE} bytes of state each (three doubles and one int), so 10⁷
 * molecules in flight would take 280 MB; the simulator keeps only one block per thread in flight.
 * Removing a molecule moves the last active one into its place (O(1)). Not thread-safe: one block
 * per thread.
 */
final class MoleculeBlock {

    /** Bytes of state per molecule: x, y, z as doubles and the decay step as an int. */
    static final int STATE_BYTES_PER_MOLECULE = 3 * Double.BYTES + Integer.BYTES;

    final double[] x;
    final double[] y;
    final double[] z;
    /** Molecule i is removed (decayed) at the start of step {@code deathStep[i]}. */
    final int[] deathStep;
    /** Number of molecules still moving, the first {@code active} entries. */
    int active;
    /** Molecule-steps advanced so far (for throughput measurements). */
    long moleculeSteps;

    MoleculeBlock(int capacity) {
        x = new double[capacity];
        y = new double[capacity];
        z = new double[capacity];
        deathStep = new int[capacity];
    }

    int capacity() {
        return x.length;
    }

    /**
     * Places {@code n} molecules at (px, py, pz) at t = 0 and draws each one's lifetime once,
     * τ ~ Exp(λ), turned into the step nearest to τ/Δt (midpoint rule: a molecule decays within
     * step k when τ ∈ [(k − ½)Δt, (k + ½)Δt)). λ = 0: never decays.
     *
     * @param decayRatePerS λ ≥ 0
     * @param timeStepS Δt &gt; 0
     */
    void release(double px, double py, double pz, int n, double decayRatePerS, double timeStepS,
            UniformRandomProvider rng) {
        if (n > capacity()) {
            throw new IllegalArgumentException("n: at most " + capacity() + " molecules per block, got " + n);
        }
        Arrays.fill(x, 0, n, px);
        Arrays.fill(y, 0, n, py);
        Arrays.fill(z, 0, n, pz);
        if (decayRatePerS > 0) {
            ZigguratSampler.Exponential exp = ZigguratSampler.Exponential.of(rng);
            double scale = 1 / (decayRatePerS * timeStepS);
            for (int i = 0; i < n; i++) {
                double steps = Math.rint(exp.sample() * scale);
                deathStep[i] = steps >= Integer.MAX_VALUE ? Integer.MAX_VALUE : (int) steps;
            }
        } else {
            Arrays.fill(deathStep, 0, n, Integer.MAX_VALUE);
        }
        active = n;
        moleculeSteps = 0;
    }

    /** Removes molecule i by moving the last active molecule into its slot. */
    void remove(int i) {
        int last = --active;
        x[i] = x[last];
        y[i] = y[last];
        z[i] = z[last];
        deathStep[i] = deathStep[last];
    }
}
