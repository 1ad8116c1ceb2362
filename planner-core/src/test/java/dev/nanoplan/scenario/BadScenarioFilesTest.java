package dev.nanoplan.scenario;

import static org.assertj.core.api.Assertions.assertThat;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvFileSource;

/**
 * Every malformed file listed in {@code bad/index.csv} is rejected with a {@link ScenarioException}
 * (no other exception) that names the expected field path and gives file positions.
 */
class BadScenarioFilesTest {

    private final ScenarioReader reader = ScenarioReader.strict();

    @ParameterizedTest(name = "{0}: {3}")
    @CsvFileSource(resources = "bad/index.csv", numLinesToSkip = 1)
    void rejectedNamingThePath(String file, String expectedPath, String schemaRejects, String what) {
        String path = expectedPath == null ? "" : expectedPath;
        Path p = TestFiles.resource("bad/" + file);

        ScenarioException e = assertThrows(ScenarioException.class, () -> reader.read(p));

        assertThat(e.problems()).extracting(ScenarioProblem::path).contains(path);
        assertThat(e.getMessage().lines()).anyMatch(line -> path.isEmpty() || line.startsWith(path + ": "));
        // Every value (or its enclosing object) exists in the file, so every problem has a position.
        assertThat(e.problems()).allMatch(ScenarioProblem::hasLocation, "has line:column");
    }

    @Test
    void indexListsEveryBadFileAndAtLeastThirty() throws IOException {
        Path dir = TestFiles.resource("bad/index.csv").getParent();
        String index = Files.readString(dir.resolve("index.csv"));
        long files;
        try (Stream<Path> s = Files.list(dir)) {
            files = s.filter(f -> f.toString().endsWith(".json"))
                    .peek(f -> assertThat(index).contains(f.getFileName().toString() + ","))
                    .count();
        }
        assertThat(files).isGreaterThanOrEqualTo(30);
    }

    @Test
    void lenientReaderStillRejectsEverythingButUnknownFields() {
        ScenarioReader lenient = ScenarioReader.lenient();
        assertThrows(ScenarioException.class, () -> lenient.read(TestFiles.resource("bad/levels-1.json")));
        assertThrows(ScenarioException.class, () -> lenient.read(TestFiles.resource("bad/nodes-overlap.json")));
    }
}
