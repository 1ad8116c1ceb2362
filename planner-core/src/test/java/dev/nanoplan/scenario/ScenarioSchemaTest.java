package dev.nanoplan.scenario;

import static org.assertj.core.api.Assertions.assertThat;
import static org.junit.jupiter.api.Assertions.assertThrows;

import com.networknt.schema.Error;
import com.networknt.schema.InputFormat;
import com.networknt.schema.Schema;
import com.networknt.schema.SchemaRegistry;
import com.networknt.schema.SpecificationVersion;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvFileSource;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * The JSON Schema {@code scenarios/nanoplan-1.schema.json} and the reader agree: both accept every
 * bundled scenario and the writer's output, and both reject the malformed files the schema can
 * express (column {@code schema_rejects} of {@code bad/index.csv}). Validation by the networknt
 * implementation of JSON Schema draft 2020-12.
 */
class ScenarioSchemaTest {

    private static Schema schema;

    @BeforeAll
    static void loadSchema() throws IOException {
        String text = Files.readString(TestFiles.scenariosDir().resolve("nanoplan-1.schema.json"));
        schema = SchemaRegistry.withDefaultDialect(SpecificationVersion.DRAFT_2020_12).getSchema(text);
    }

    static Stream<Path> bundled() {
        return TestFiles.bundledScenarios().stream();
    }

    @Test
    void thereAreBundledScenarios() {
        assertThat(TestFiles.bundledScenarios()).extracting(p -> p.getFileName().toString())
                .contains("culture-tank.json", "relay-chain-direct.json", "relay-chain-relayed.json",
                        "vessel-segment.json");
    }

    @ParameterizedTest
    @MethodSource("bundled")
    void bundledScenarioPassesReaderAndSchema(Path file) throws Exception {
        ScenarioReader.strict().read(file);

        List<Error> errors = schema.validate(Files.readString(file), InputFormat.JSON);

        assertThat(errors).isEmpty();
    }

    @Test
    void writerOutputPassesTheSchema() {
        String json = ScenarioWriter.toJson(SwarmGenerator.generate(200, 42));

        assertThat(schema.validate(json, InputFormat.JSON)).isEmpty();
    }

    @ParameterizedTest(name = "{0}")
    @CsvFileSource(resources = "bad/index.csv", numLinesToSkip = 1)
    void malformedFileRejectedByBothWhereTheSchemaCanTell(String file, String expectedPath, String schemaRejects)
            throws IOException {
        Path p = TestFiles.resource("bad/" + file);
        assertThrows(ScenarioException.class, () -> ScenarioReader.strict().read(p));
        if ("yes".equals(schemaRejects)) {
            assertThat(schema.validate(Files.readString(p), InputFormat.JSON)).isNotEmpty();
        }
    }
}
