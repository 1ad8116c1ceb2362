package dev.nanoplan.plan;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.ObjectMapper;
import dev.nanoplan.report.PlanJson;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.ScenarioReader;
import dev.nanoplan.scenario.SwarmGenerator;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.stream.Stream;
import org.junit.jupiter.api.Named;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * Byte-identity safety net of the planners: plans every bundled scenario ({@code scenarios/*.json},
 * analytic channel, default options) and a few seeded generated swarms, exact ({@link NetworkPlanner})
 * and, where supported, preview ({@link PreviewPlanner}), renders each with {@link PlanJson} and
 * compares the text byte for byte with the golden file under {@code src/test/resources/golden/}.
 *
 * <p>Source of the expected values: the planner's own output at the time the golden was written (a
 * regression net for refactoring, not a correctness check; the numbers themselves are checked by the
 * other planner tests against published formulas and brute force). When a change of the numbers is
 * intended, regenerate the goldens in one command and review the diff:
 * <pre>
 * mvn -B -o -pl planner-core test -Dtest=PlanGoldenTest -Dnanoplan.golden.update=true
 * </pre>
 * The property makes the test write {@code planner-core/src/test/resources/golden/*.json} instead of
 * comparing (it still fails nothing); commit the rewritten files with the change that explains them.
 */
class PlanGoldenTest {

    /** System property that rewrites the goldens instead of comparing. */
    static final String UPDATE = "nanoplan.golden.update";

    private static final ObjectMapper MAPPER = new ObjectMapper();

    /** The planned layouts by golden base name: every bundled scenario (file name), then seeded swarms. */
    static Map<String, Scenario> layouts() throws Exception {
        Map<String, Scenario> out = new LinkedHashMap<>();
        for (Path p : bundled()) {
            out.put(p.getFileName().toString().replace(".json", ""), ScenarioReader.strict().read(p));
        }
        out.put("swarm-60-seed-3", SwarmGenerator.generate(60, 3));
        out.put("swarm-100-seed-42", SwarmGenerator.generate(100, 42));
        out.put("swarm-160-seed-7", SwarmGenerator.generate(160, 7));
        return out;
    }

    static Stream<Arguments> cases() throws Exception {
        List<Arguments> out = new ArrayList<>();
        for (Map.Entry<String, Scenario> e : layouts().entrySet()) {
            String base = e.getKey();
            Scenario s = e.getValue();
            out.add(Arguments.of(Named.of(base + " exact", s), base + ".exact.json", false));
            if (PreviewPlanner.supports(s)) {
                out.add(Arguments.of(Named.of(base + " preview", s), base + ".preview.json", true));
            }
        }
        return out.stream();
    }

    @ParameterizedTest
    @MethodSource("cases")
    void planJsonIsByteIdenticalToTheGolden(Scenario s, String golden, boolean preview) throws IOException {
        Plan plan = preview ? PreviewPlanner.plan(s, PlanOptions.DEFAULT) : NetworkPlanner.plan(s, PlanOptions.DEFAULT);
        String json = render(plan);
        Path file = goldenDir().resolve(golden);
        if (Boolean.getBoolean(UPDATE)) {
            Files.createDirectories(file.getParent());
            Files.writeString(file, json, StandardCharsets.UTF_8);
            return;
        }
        assertThat(file).as("golden %s (regenerate with -D%s=true)", golden, UPDATE).isRegularFile();
        // source: the planner's own output when the golden was written (see the class comment)
        assertThat(json).as("plan JSON of %s against %s", s.name(), golden)
                .isEqualTo(Files.readString(file, StandardCharsets.UTF_8));
    }

    /** The plan JSON as written by {@link PlanJson}, pretty-printed, with a final newline. */
    static String render(Plan plan) throws IOException {
        return MAPPER.writerWithDefaultPrettyPrinter().writeValueAsString(PlanJson.of(plan)) + "\n";
    }

    private static List<Path> bundled() throws IOException {
        Path dir = repoRoot().resolve("scenarios");
        try (Stream<Path> files = Files.list(dir)) {
            return files.filter(p -> p.toString().endsWith(".json") && !p.toString().endsWith(".schema.json"))
                    .sorted().toList();
        }
    }

    private static Path repoRoot() {
        Path dir = Path.of("").toAbsolutePath();
        while (dir != null && !Files.isRegularFile(dir.resolve("scenarios/nanoplan-1.schema.json"))) {
            dir = dir.getParent();
        }
        if (dir == null) {
            throw new IllegalStateException("scenarios/ not found above " + Path.of("").toAbsolutePath());
        }
        return dir;
    }

    /** The module's golden folder (the source tree, so that an update lands in the repository). */
    private static Path goldenDir() {
        return repoRoot().resolve("planner-core/src/test/resources/golden");
    }
}
