package dev.nanoplan.scenario;

import static org.assertj.core.api.Assertions.assertThat;
import static org.junit.jupiter.api.Assertions.assertThrows;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.stream.LongStream;
import java.util.stream.Stream;
import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.simple.RandomSource;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;

class ScenarioWriterTest {

    private final ScenarioReader reader = ScenarioReader.strict();

    static Stream<Path> bundled() {
        return TestFiles.bundledScenarios().stream();
    }

    @ParameterizedTest
    @MethodSource("bundled")
    void bundledScenarioRoundTrips(Path file, @TempDir Path dir) throws Exception {
        Scenario first = reader.read(file);
        Path copy = dir.resolve("copy.json");

        ScenarioWriter.write(first, copy);
        Scenario second = reader.read(copy);

        assertThat(second).isEqualTo(first);
        assertThat(ScenarioWriter.toJson(second)).isEqualTo(Files.readString(copy));
    }

    static LongStream seeds() {
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(20240611L);
        return LongStream.generate(rng::nextLong).limit(8);
    }

    @ParameterizedTest
    @MethodSource("seeds")
    void generatedScenarioRoundTripsThroughText(long seed) throws ScenarioException {
        Scenario s = SwarmGenerator.generate(3 + (int) Math.floorMod(seed, 200L), seed);

        Scenario back = reader.parse(ScenarioWriter.toJson(s)).scenario();

        assertThat(back).isEqualTo(s);
    }

    @Test
    void topLevelFieldsFollowTheDesignOrder() throws Exception {
        Scenario s = reader.read(TestFiles.scenariosDir().resolve("culture-tank.json"));
        JsonNode tree = new ObjectMapper().readTree(ScenarioWriter.toJson(s));

        List<String> names = new ArrayList<>();
        tree.fieldNames().forEachRemaining(names::add);
        // docs/architecture.md §4.1 field order.
        assertThat(names).containsExactly("format", "name", "volume", "medium", "species", "signalling", "nodes",
                "demands", "targets", "tolerances");
        List<String> nodeFields = new ArrayList<>();
        tree.get("nodes").get(1).fieldNames().forEachRemaining(nodeFields::add);
        assertThat(nodeFields).containsExactly("id", "role", "position_um", "radius_um", "species", "emits_species",
                "molecules_per_symbol");
    }

    @Test
    void writeReplacesAnExistingFileAndLeavesNoTemporaryFile(@TempDir Path dir) throws Exception {
        Path target = dir.resolve("layout.json");
        Files.writeString(target, "old content");
        Scenario s = SwarmGenerator.generate(20, 7);

        ScenarioWriter.write(s, target);

        assertThat(reader.read(target)).isEqualTo(s);
        try (Stream<Path> files = Files.list(dir)) {
            assertThat(files).containsExactly(target);
        }
    }

    @Test
    void failedWriteLeavesTheTargetUntouched(@TempDir Path dir) throws IOException {
        // the parent "folder" is a plain file: the temporary file cannot be created
        Path blocker = Files.writeString(dir.resolve("not-a-dir"), "x");
        Path target = blocker.resolve("layout.json");

        assertThrows(IOException.class, () -> ScenarioWriter.write(SwarmGenerator.generate(5, 1), target));

        assertThat(Files.isRegularFile(target)).isFalse();
        assertThat(Files.readString(blocker)).isEqualTo("x");
    }
}
