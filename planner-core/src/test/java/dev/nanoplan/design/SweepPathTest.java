package dev.nanoplan.design;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

/** Field paths edit exactly the named field of a scenario tree; SPECs give the documented values. */
class SweepPathTest {

    private static final ObjectMapper JSON = new ObjectMapper();
    private static final String TREE = """
            {"signalling": {"symbol_time_s": 1.0},
             "species": [{"name": "A", "diffusion_um2_per_s": 50.0}, {"name": "B", "diffusion_um2_per_s": 80.0}],
             "nodes": [{"id": "gw", "position_um": [1.0, 2.0, 3.0], "molecules_per_symbol": 5},
                       {"id": "relay-w", "position_um": [4.0, 5.0, 6.0], "molecules_per_symbol": 20000}]}
            """;

    private static JsonNode tree() throws Exception {
        return JSON.readTree(TREE);
    }

    @Test
    void eachPathFormEditsOnlyItsField() throws Exception {
        // oracle: the same tree edited by hand with Jackson's own accessors (expected trees written out)
        JsonNode t = tree();
        SweepPath.parse("signalling.symbol_time_s").set(t, 0.75);
        SweepPath.parse("nodes[relay-w].molecules_per_symbol").set(t, 60000);
        SweepPath.parse("nodes[relay-w].position_um[0]").set(t, 9.5);
        SweepPath.parse("species[B].diffusion_um2_per_s").set(t, 120);
        SweepPath.parse("nodes[0].position_um[2]").set(t, 7.0);
        JsonNode expected = JSON.readTree("""
                {"signalling": {"symbol_time_s": 0.75},
                 "species": [{"name": "A", "diffusion_um2_per_s": 50.0}, {"name": "B", "diffusion_um2_per_s": 120.0}],
                 "nodes": [{"id": "gw", "position_um": [1.0, 2.0, 7.0], "molecules_per_symbol": 5},
                           {"id": "relay-w", "position_um": [9.5, 5.0, 6.0], "molecules_per_symbol": 60000}]}
                """);
        assertThat(t).isEqualTo(expected);
        // a count stays a whole number in the file (the reader's integer fields accept it)
        assertThat(t.at("/nodes/1/molecules_per_symbol").isIntegralNumber()).isTrue();
    }

    @ParameterizedTest
    @ValueSource(strings = {"", "signalling..symbol_time_s", "nodes[].x", "nodes[a]b", "1abc", "a.b["})
    void badSyntaxIsRefusedNamingThePath(String path) {
        assertThatThrownBy(() -> SweepPath.parse(path)).isInstanceOf(IllegalArgumentException.class)
                .satisfies(e -> assertThat(e.getMessage()).startsWith(path.isEmpty() ? "PATH" : path));
    }

    @ParameterizedTest
    @ValueSource(strings = {"signalling.symbol_time", "nodes[relay-x].molecules_per_symbol", "nodes[relay-w].position_um[3]",
        "species[C].diffusion_um2_per_s", "nodes[relay-w].id", "nodes[relay-w]", "signalling"})
    void aFieldNotInTheFileOrNotANumberIsRefusedNamingThePath(String path) throws Exception {
        JsonNode t = tree();
        assertThatThrownBy(() -> SweepPath.parse(path).set(t, 1.0)).isInstanceOf(IllegalArgumentException.class)
                .hasMessageStartingWith(path + ":");
        assertThat(t).isEqualTo(tree());
    }

    @Test
    void rangesAndListsGiveTheirValues() {
        // expected values written out by hand from start + i·step, stop included
        assertThat(SweepSpec.parse("0.5:2:0.25")).containsExactly(0.5, 0.75, 1.0, 1.25, 1.5, 1.75, 2.0);
        assertThat(SweepSpec.parse("10000,30000,60000")).containsExactly(10000.0, 30000.0, 60000.0);
        assertThat(SweepSpec.parse("3")).containsExactly(3.0);
        assertThat(SweepSpec.parse("0:1:0.4")).containsExactly(0.0, 0.4, 0.8);
        // 0.1 steps to 0.3: 0.1 + 2·0.1 is 0.30000000000000004 in binary, still counted as reaching stop
        assertThat(SweepSpec.parse("0.1:0.3:0.1")).hasSize(3);
        assertThat(SweepSpec.parse("1:1:5")).isEqualTo(List.of(1.0));
    }

    @ParameterizedTest
    @ValueSource(strings = {"", "a,b", "1,,2", "1:2", "1:2:0", "2:1:0.5", "1:2:-1", "NaN", "1:Infinity:1", "0:1e9:1"})
    void badSpecsAreRefusedNamingTheSpec(String spec) {
        assertThatThrownBy(() -> SweepSpec.parse(spec)).isInstanceOf(IllegalArgumentException.class)
                .satisfies(e -> assertThat(e.getMessage()).startsWith(spec.isEmpty() ? "SPEC" : spec));
    }
}
