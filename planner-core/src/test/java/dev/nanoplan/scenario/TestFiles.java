package dev.nanoplan.scenario;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.net.URISyntaxException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.stream.Collectors;
import java.util.stream.Stream;

/** Locates the repo-root {@code scenarios/} folder and the test resources of this package. */
final class TestFiles {

    private TestFiles() {
    }

    /** The repo-root folder holding the bundled scenarios and the JSON Schema. */
    static Path scenariosDir() {
        Path dir = Path.of("").toAbsolutePath();
        while (dir != null) {
            Path candidate = dir.resolve("scenarios");
            if (Files.isRegularFile(candidate.resolve("nanoplan-1.schema.json"))) {
                return candidate;
            }
            dir = dir.getParent();
        }
        throw new IllegalStateException("scenarios/ folder not found above " + Path.of("").toAbsolutePath());
    }

    /** Every bundled scenario file (all *.json in scenarios/ except the schema). */
    static List<Path> bundledScenarios() {
        try (Stream<Path> files = Files.list(scenariosDir())) {
            return files.filter(p -> p.toString().endsWith(".json") && !p.toString().endsWith(".schema.json"))
                    .sorted()
                    .collect(Collectors.toList());
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    /** A test resource of this package, e.g. {@code bad/levels-1.json}. */
    static Path resource(String name) {
        try {
            return Path.of(TestFiles.class.getResource(name).toURI());
        } catch (URISyntaxException e) {
            throw new IllegalStateException(e);
        }
    }
}
