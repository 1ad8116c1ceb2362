package dev.nanoplan.scenario;

import static org.assertj.core.api.Assertions.assertThat;
import static org.junit.jupiter.api.Assertions.assertThrows;

import com.networknt.schema.InputFormat;
import com.networknt.schema.Schema;
import com.networknt.schema.SchemaRegistry;
import com.networknt.schema.SpecificationVersion;
import java.nio.file.Files;
import org.junit.jupiter.api.Test;

/**
 * The {@code round-robin} schedule in files: read, written back unchanged, accepted by the JSON
 * Schema (networknt, draft 2020-12); an unknown schedule is one line naming the field and the
 * accepted names.
 */
class RoundRobinScheduleFileTest {

    private static String cultureTankWith(String schedule) throws Exception {
        String text = Files.readString(TestFiles.scenariosDir().resolve("culture-tank.json"));
        String replaced = text.replace("\"schedule\": \"all-active\"", "\"schedule\": \"" + schedule + "\"");
        assertThat(replaced).isNotEqualTo(text);
        return replaced;
    }

    @Test
    void roundRobinIsReadAndWrittenBack() throws Exception {
        Scenario s = ScenarioReader.strict().parse(cultureTankWith("round-robin")).scenario();
        assertThat(s.signalling().schedule()).isEqualTo(Schedule.ROUND_ROBIN);

        String written = ScenarioWriter.toJson(s);
        assertThat(written).contains("\"schedule\" : \"round-robin\"");
        Scenario again = ScenarioReader.strict().parse(written).scenario();
        assertThat(again).isEqualTo(s);
    }

    @Test
    void schemaAcceptsRoundRobinAndRejectsOtherNames() throws Exception {
        String text = Files.readString(TestFiles.scenariosDir().resolve("nanoplan-1.schema.json"));
        Schema schema = SchemaRegistry.withDefaultDialect(SpecificationVersion.DRAFT_2020_12).getSchema(text);

        assertThat(schema.validate(cultureTankWith("round-robin"), InputFormat.JSON)).isEmpty();
        assertThat(schema.validate(cultureTankWith("token-ring"), InputFormat.JSON)).isNotEmpty();
    }

    @Test
    void unknownScheduleIsOneLineNamingTheFieldAndTheChoices() throws Exception {
        ScenarioException e = assertThrows(ScenarioException.class,
                () -> ScenarioReader.strict().parse(cultureTankWith("token-ring")));

        assertThat(e.problems()).hasSize(1);
        assertThat(e.getMessage().lines()).hasSize(1);
        assertThat(e.getMessage()).startsWith(
                "signalling.schedule: unknown schedule 'token-ring', expected all-active, round-robin or slots");
    }

    @Test
    void parseKnowsBothFileNames() {
        assertThat(Schedule.parse("all-active")).isEqualTo(Schedule.ALL_ACTIVE);
        assertThat(Schedule.parse("round-robin")).isEqualTo(Schedule.ROUND_ROBIN);
        assertThrows(IllegalArgumentException.class, () -> Schedule.parse("Round-Robin"));
    }
}
