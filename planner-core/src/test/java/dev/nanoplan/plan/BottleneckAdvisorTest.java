package dev.nanoplan.plan;

import static org.assertj.core.api.Assertions.assertThat;

import dev.nanoplan.scenario.Species;
import org.junit.jupiter.api.Test;

class BottleneckAdvisorTest {

    @Test
    void stableSpeciesIsAdvisedToDegrade() {
        assertThat(BottleneckAdvisor.isiRemedy(Species.ofDiffusion("amp", 400, Double.POSITIVE_INFINITY)))
                .isEqualTo("use a degrading species or move the nodes closer");
    }

    @Test
    void degradingSpeciesIsNotAdvisedWhatItAlreadyHas() {
        String advice = BottleneckAdvisor.isiRemedy(Species.ofDiffusion("cue", 400, 2.5));
        assertThat(advice).contains("degrades faster than cue").contains("half-life 2.50 s")
                .doesNotContain("use a degrading species");
    }
}
