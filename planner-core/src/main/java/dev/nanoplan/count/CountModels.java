package dev.nanoplan.count;

/** Factory for the count models a user can choose by {@link CountModelKind}. */
public final class CountModels {

    private CountModels() {
    }

    /**
     * The default model of each kind: {@link ExactCountModel#DEFAULT},
     * {@link PoissonCountModel#DEFAULT}, {@link GaussianCountModel#DEFAULT} (continuity
     * corrected); all with truncation mass 1e-15.
     */
    public static CountModel of(CountModelKind kind) {
        if (kind == null) {
            throw new IllegalArgumentException("kind must not be null");
        }
        return switch (kind) {
            case EXACT -> ExactCountModel.DEFAULT;
            case POISSON -> PoissonCountModel.DEFAULT;
            case GAUSSIAN -> GaussianCountModel.DEFAULT;
        };
    }
}
