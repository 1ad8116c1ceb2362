package dev.nanoplan.physics;

import java.util.List;

class OpenSphereHittingContractTest extends HittingModelContractTest {

    @Override
    List<HittingModel> models() {
        return List.of(
            OpenSphereHitting.of(10, 5, 100),
            OpenSphereHitting.of(200, 1, 1),
            OpenSphereHitting.of(10, 10 - 1e-9, 100),
            OpenSphereHitting.of(1e4, 0.01, 1e4),
            OpenSphereHitting.of(2, 1e-3, 0.01));
    }
}
