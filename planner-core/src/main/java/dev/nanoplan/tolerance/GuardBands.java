package dev.nanoplan.tolerance;

import dev.nanoplan.engine.WorkUnits;
import dev.nanoplan.tolerance.ToleranceStudy.SampleLayout;
import java.io.Serializable;
import java.util.AbstractList;
import java.util.List;
import java.util.concurrent.atomic.AtomicReferenceArray;
import java.util.function.BooleanSupplier;

/**
 * The guard bands of a study's weak links as work units for any engine: unit k is
 * {@link GuardBand#of}(study, links[k], the first {@code samples} perturbed layouts), a pure function of
 * the study's inputs (carried by {@link ToleranceSamples}), the link and the sample count, so the result
 * does not depend on the thread count or the order in which units run.
 *
 * <p>The perturbed layouts and their analytic channels are built once per JVM, on first use, and shared
 * by every unit and every bisection step (before, each step of each link rebuilt them).
 */
public final class GuardBands implements WorkUnits<GuardBands.Band> {

    private static final long serialVersionUID = 1L;

    /** One link's guard band: molecules per symbol, or null when not reached. */
    public record Band(Long moleculesPerSymbol) implements Serializable {
    }

    private final ToleranceSamples study;
    private final int[] links;
    private final int samples;
    private transient volatile AtomicReferenceArray<SampleLayout> layouts;

    /**
     * @param study   the study's samples (its inputs travel with them)
     * @param links   indices of the links (weak links), each in 0..links − 1 of the study
     * @param samples perturbed layouts per guard-band step, ≥ 1
     */
    public GuardBands(ToleranceSamples study, int[] links, int samples) {
        if (samples < 1) {
            throw new IllegalArgumentException("samples: must be >= 1, got " + samples);
        }
        this.study = study;
        this.links = links.clone();
        this.samples = samples;
    }

    @Override
    public int count() {
        return links.length;
    }

    @Override
    public Band compute(int index, BooleanSupplier cancelled) {
        Long band = GuardBand.of(study.study(), links[index], layouts(), cancelled);
        return cancelled.getAsBoolean() ? null : new Band(band);
    }

    /** The first {@code samples} layouts, each built on first read (by whichever thread reads it first). */
    private List<SampleLayout> layouts() {
        AtomicReferenceArray<SampleLayout> built = layouts;
        if (built == null) {
            synchronized (this) {
                if (layouts == null) {
                    layouts = new AtomicReferenceArray<>(samples);
                }
                built = layouts;
            }
        }
        AtomicReferenceArray<SampleLayout> cache = built;
        ToleranceStudy s = study.study();
        return new AbstractList<>() {
            @Override
            public SampleLayout get(int i) {
                SampleLayout l = cache.get(i);
                if (l == null) {
                    // a pure function of i: two threads building it at once store equal layouts
                    cache.compareAndSet(i, null, s.layout(i));
                    l = cache.get(i);
                }
                return l;
            }

            @Override
            public int size() {
                return samples;
            }
        };
    }
}
