package dev.nanoplan.physics;

import java.util.List;

class DecayingSphereHittingContractTest extends HittingModelContractTest {

    @Override
    List<HittingModel> models() {
        return List.of(
            DecayingSphereHitting.of(10, 5, 100, 0.5),
            DecayingSphereHitting.of(10, 5, 100, null),
            DecayingSphereHitting.of(200, 1, 1, 1e4),
            DecayingSphereHitting.of(10, 10 - 1e-9, 100, 1e-3),
            DecayingSphereHitting.of(1e3, 1, 100, 1e-2), // F(∞) = e^{-838}/1000 underflows
            DecayingSphereHitting.of(1e3, 1, 100, 0.0192), // F(∞) ≈ e^{-600}/1000
            DecayingSphereHitting.of(20, 5, 50, 1e12));
    }
}
