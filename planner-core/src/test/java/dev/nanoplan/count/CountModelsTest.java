package dev.nanoplan.count;

import static org.assertj.core.api.Assertions.assertThat;

import org.junit.jupiter.api.Test;

class CountModelsTest {

    @Test
    void factoryReturnsTheModelOfEachKind() {
        assertThat(CountModels.of(CountModelKind.parse("exact"))).isSameAs(ExactCountModel.DEFAULT);
        assertThat(CountModels.of(CountModelKind.parse("Poisson"))).isInstanceOf(PoissonCountModel.class);
        assertThat(CountModels.of(CountModelKind.GAUSSIAN)).isInstanceOf(GaussianCountModel.class);
        assertThat(((GaussianCountModel) CountModels.of(CountModelKind.GAUSSIAN)).variant())
                .isEqualTo(GaussianCountModel.Variant.CONTINUITY_CORRECTED);
    }
}
