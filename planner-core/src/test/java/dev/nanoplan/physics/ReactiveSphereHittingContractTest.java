package dev.nanoplan.physics;

import java.util.List;

class ReactiveSphereHittingContractTest extends HittingModelContractTest {

    @Override
    List<HittingModel> models() {
        return List.of(
            ReactiveSphereHitting.of(10, 5, 100, 20, null),
            ReactiveSphereHitting.of(200, 1, 1, 1e-4, null),
            ReactiveSphereHitting.of(10, 10 - 1e-9, 100, 1e6, null),
            ReactiveSphereHitting.of(1e3, 1, 100, 1e3, null));
        // With decay F_λ is a quadrature over [0, t] for each t, non-decreasing only to ~1e-15 relative, which
        // the exact-monotonicity contract cannot allow: ReactiveSphereHittingTest checks it with that tolerance.
    }
}
