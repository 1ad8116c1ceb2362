package dev.nanoplan.scenario;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import dev.nanoplan.geometry.Volume;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

class SwarmGeneratorTest {

    @ParameterizedTest
    @ValueSource(ints = {1_000, 10_000})
    void generatedLayoutValidates(int n) throws ScenarioException {
        Scenario s = SwarmGenerator.generate(n, 12345L);

        assertThat(s.nodes()).hasSize(n);
        assertThat(ScenarioValidator.check(s.volume(), s.medium().flow(), s.species(), s.nodes(), s.demands()))
                .isEmpty();
        assertThat(s.nodes()).extracting(Node::role).contains(Role.TRANSMITTER, Role.RECEIVER, Role.RELAY);
        // Through the file format as well: the reader accepts what the writer makes of it.
        assertThat(ScenarioReader.strict().parse(ScenarioWriter.toJson(s)).scenario()).isEqualTo(s);
    }

    @Test
    void noBodiesOverlapByBruteForce() {
        List<Node> nodes = SwarmGenerator.generate(1_000, 99L).nodes();
        int overlaps = overlaps(nodes);
        assertThat(overlaps).isZero();
    }

    @Test
    void densityStaysNearOneNodePerLatticeCell() {
        for (int n : new int[] {27, 1_000, 8_000}) {
            Volume.Box box = (Volume.Box) SwarmGenerator.generate(n, 3).volume();
            double volumeUm3 = box.sizeUm().x() * box.sizeUm().y() * box.sizeUm().z();
            double pitch = SwarmGenerator.PITCH_UM;
            // Perfect cubes: the box is exactly n cells of pitch^3.
            assertThat(volumeUm3 / n).isEqualTo(pitch * pitch * pitch);
        }
    }

    @Test
    void sameSeedSameLayoutOtherSeedOtherLayout() {
        assertThat(SwarmGenerator.generate(300, 5)).isEqualTo(SwarmGenerator.generate(300, 5));
        assertThat(SwarmGenerator.generate(300, 5).nodes()).isNotEqualTo(SwarmGenerator.generate(300, 6).nodes());
    }

    @Test
    void rejectsTooFewNodes() {
        assertThatThrownBy(() -> SwarmGenerator.generate(2, 1)).isInstanceOf(IllegalArgumentException.class)
                .hasMessageContaining("nodes");
    }

    @ParameterizedTest
    @ValueSource(ints = {3, 27, 100, 1_000})
    void designedLayoutValidatesAndHasEveryRole(int n) throws ScenarioException {
        Scenario s = SwarmGenerator.designed(n, 3L);

        assertThat(s.nodes()).hasSize(n);
        // source: the project's own validator (the checks of the scenario file format), and the reader
        assertThat(ScenarioValidator.check(s.volume(), s.medium().flow(), s.species(), s.nodes(), s.demands()))
                .isEmpty();
        assertThat(ScenarioReader.strict().parse(ScenarioWriter.toJson(s)).scenario()).isEqualTo(s);
        assertThat(s.nodes()).extracting(Node::role).contains(Role.TRANSMITTER, Role.RECEIVER, Role.RELAY);
        assertThat(SwarmGenerator.designed(n, 3L)).isEqualTo(s);
    }

    @Test
    void designedLayoutHasNoOverlapsByBruteForceAndOneDemandPerSensor() {
        List<Node> nodes = SwarmGenerator.designed(1_000, 99L).nodes();
        int overlaps = overlaps(nodes);
        // source: brute force over all pairs
        assertThat(overlaps).isZero();
        long sensors = nodes.stream().filter(x -> x.role() == Role.TRANSMITTER).count();
        assertThat(SwarmGenerator.designed(1_000, 99L).demands()).hasSize((int) sensors);
    }

    /** Pairs of bodies that overlap, by brute force over all pairs. */
    private static int overlaps(List<Node> nodes) {
        int overlaps = 0;
        for (int i = 0; i < nodes.size(); i++) {
            for (int j = 0; j < i; j++) {
                Node a = nodes.get(i);
                Node b = nodes.get(j);
                if (a.positionUm().distance(b.positionUm()) < a.radiusUm() + b.radiusUm()) {
                    overlaps++;
                }
            }
        }
        return overlaps;
    }
}
