package dev.nanoplan.cli;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import dev.nanoplan.physics.PassiveSphereObservation;
import java.util.Arrays;
import org.assertj.core.data.Offset;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/** {@code nanoplan link --receiver}, {@code --binding-rate-um-per-s} and {@code --sampling-offset-s}. */
class LinkReceiverOptionsTest {

    private static final String[] BASE = {"link", "--distance-um", "15", "--radius-um", "5", "--diffusion-um2-per-s",
        "100", "--symbol-time-s", "0.5", "--molecules", "500", "--isi-memory", "5", "--json"};

    private static double[] taps(String... extra) throws Exception {
        String[] args = Arrays.copyOf(BASE, BASE.length + extra.length);
        System.arraycopy(extra, 0, args, BASE.length, extra.length);
        CliRun r = CliRun.of(args);
        assertThat(r.status()).as(r.err()).isZero();
        JsonNode t = new ObjectMapper().readTree(r.out()).get("taps");
        double[] out = new double[t.size()];
        for (int k = 0; k < out.length; k++) {
            out[k] = t.get(k).asDouble();
        }
        return out;
    }

    @Test
    void passiveTapsAreTheObserversInsideProbabilities() throws Exception {
        // source: PassiveSphereObservation, the Green's function integrated over the ball (Noel, Cheung, Schober 2014)
        assertThat(taps("--receiver", "passive", "--sampling-offset-s", "0.2"))
                .containsExactly(PassiveSphereObservation.of(15, 5, 100, null, 0.2).taps(0.5, 5));
    }

    @Test
    void reactiveWithHugeRateIsTheAbsorber() throws Exception {
        double[] absorbing = taps();
        // source: Collins and Kimball 1949, κ → ∞ is the perfect absorber (relative gap D/(κr) = 2e-11 here)
        assertThat(taps("--receiver", "reactive", "--binding-rate-um-per-s", "1e12"))
                .containsExactly(absorbing, Offset.offset(1e-9 * absorbing[0]));
    }

    @ParameterizedTest(name = "{0}")
    @CsvSource(delimiter = '|', value = {
        "--receiver sticky|--receiver",
        "--receiver reactive|--binding-rate-um-per-s",
        "--receiver reactive --binding-rate-um-per-s 0|--binding-rate-um-per-s",
        "--receiver passive --sampling-offset-s 0.6|--sampling-offset-s",
        "--sampling-offset-s 0.2|--sampling-offset-s",
        "--binding-rate-um-per-s 3|--binding-rate-um-per-s",
    })
    void badValuesGiveOneLineNamingTheOption(String extra, String option) {
        String[] more = extra.split(" ");
        String[] args = Arrays.copyOf(BASE, BASE.length + more.length);
        System.arraycopy(more, 0, args, BASE.length, more.length);
        CliRun r = CliRun.of(args);
        // source: the project's bad-input rule (exit 2, one line naming the option, no stack trace)
        assertThat(r.status()).isEqualTo(2);
        assertThat(r.err().strip()).contains(option).doesNotContain("\n").doesNotContain("Exception");
    }
}
