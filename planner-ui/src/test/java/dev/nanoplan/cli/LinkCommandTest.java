package dev.nanoplan.cli;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import org.assertj.core.data.Offset;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

class LinkCommandTest {

    static CliRun run(String... args) {
        return CliRun.of(args);
    }

    static final String[] EXAMPLE = {"link", "--distance-um", "15", "--radius-um", "5", "--diffusion-um2-per-s", "100",
        "--symbol-time-s", "0.5", "--molecules", "500", "--isi-memory", "5", "--json"};

    @Test
    void jsonCarriesTheContractKeys() throws Exception {
        CliRun r = run(EXAMPLE);
        assertThat(r.status()).as(r.err()).isZero();
        JsonNode j = new ObjectMapper().readTree(r.out());
        for (String key : new String[] {"hit_probability", "eventual_hit_probability", "taps", "threshold",
            "mutual_information_bits", "capacity_bits", "capacity_prior_one", "capacity_threshold",
            "min_error_probability", "min_error_threshold", "rate_bits_per_s", "log10_error_probability",
            "error_probability", "operating_rate_bits_per_s", "log10_error_probability_at_threshold"}) {
            assertThat(j.has(key)).as(key).isTrue();
        }
        assertThat(j.get("taps").size()).isEqualTo(6);
        // F(∞) = r/d for an absorbing sphere in an open medium (Redner 2001, first passage to a sphere)
        assertThat(j.get("eventual_hit_probability").asDouble()).isCloseTo(5.0 / 15.0, Offset.offset(1e-15));
        double c = j.get("capacity_bits").asDouble();
        assertThat(c).isBetween(0.0, 1.0);
        assertThat(j.get("mutual_information_bits").asDouble()).isLessThanOrEqualTo(c + 1e-12);
        assertThat(j.get("rate_bits_per_s").asDouble()).isCloseTo(c / 0.5, Offset.offset(1e-12));
        // the minimum over thresholds is at most the error at the operating threshold (definition of a minimum)
        assertThat(j.get("error_probability").asDouble())
                .isGreaterThanOrEqualTo(j.get("min_error_probability").asDouble());
        assertThat(Math.pow(10, j.get("log10_error_probability_at_threshold").asDouble()))
                .isCloseTo(j.get("error_probability").asDouble(), Offset.offset(1e-12));
        assertThat(r.err()).isEmpty();
    }

    @Test
    void multiLevelReportsThresholdsAndInputs() throws Exception {
        for (int levels : new int[] {3, 4}) {
            String[] args = Arrays.copyOf(EXAMPLE, EXAMPLE.length + 2);
            args[EXAMPLE.length] = "--levels";
            args[EXAMPLE.length + 1] = Integer.toString(levels);
            CliRun r = run(args);
            assertThat(r.status()).as(r.err()).isZero();
            JsonNode j = new ObjectMapper().readTree(r.out());
            assertThat(j.get("thresholds").size()).isEqualTo(levels - 1);
            assertThat(j.get("input_distribution").size()).isEqualTo(levels);
            double cap = j.get("capacity_bits").asDouble();
            assertThat(cap).isLessThanOrEqualTo(Math.log(levels) / Math.log(2) + 1e-12);
            // hard decisions at uniform inputs carry at most what the unquantised counts carry there
            // (data-processing inequality, Cover and Thomas 2006, Theorem 2.8.1)
            assertThat(j.get("soft_capacity_bits").asDouble())
                    .isGreaterThanOrEqualTo(j.get("mutual_information_bits").asDouble() - 1e-9);
            assertThat(cap).isGreaterThanOrEqualTo(j.get("mutual_information_bits").asDouble());
        }
    }

    @Test
    void maxErrorFlagsATargetThatACountBlindDetectorMeets() throws Exception {
        String[] args = Arrays.copyOf(EXAMPLE, EXAMPLE.length + 4);
        System.arraycopy(new String[] {"--prior-one", "0.05", "--max-error", "0.06"}, 0, args, EXAMPLE.length, 4);
        JsonNode j = new ObjectMapper().readTree(run(args).out());
        // always deciding "0" errs with probability prior_one = 0.05 <= 0.06 (definition)
        assertThat(j.get("count_blind_meets_error_target").asBoolean()).isTrue();
        assertThat(j.get("count_blind_error_probability").asDouble()).isEqualTo(0.05);
        CliRun text = run(Arrays.stream(args).filter(a -> !a.equals("--json")).toArray(String[]::new));
        assertThat(text.out()).contains("ignores the count");
        args[args.length - 1] = "0.04";
        j = new ObjectMapper().readTree(run(args).out());
        assertThat(j.get("count_blind_meets_error_target").asBoolean()).isFalse();
    }

    @Test
    void textOutputEndsWithVerdictAndCaution() {
        String[] args = Arrays.copyOf(EXAMPLE, EXAMPLE.length - 1);
        CliRun r = run(args);
        assertThat(r.status()).isZero();
        assertThat(r.out()).contains("capacity").contains("link:").contains("not validated for clinical use");
    }

    @Test
    void takesTapsInsteadOfGeometry() throws Exception {
        CliRun r = run("link", "--taps", "0.2,0.05,0.01", "--symbol-time-s", "1", "--molecules", "100", "--json");
        assertThat(r.status()).as(r.err()).isZero();
        JsonNode j = new ObjectMapper().readTree(r.out());
        assertThat(j.get("hit_probability").asDouble()).isEqualTo(0.2);
        assertThat(j.get("eventual_hit_probability").isNull()).isTrue();
    }

    @Test
    void writesPlots(@TempDir Path dir) throws Exception {
        for (String name : new String[] {"p.svg", "p.png"}) {
            Path f = dir.resolve(name);
            String[] args = Arrays.copyOf(EXAMPLE, EXAMPLE.length + 2);
            args[EXAMPLE.length] = "--plot";
            args[EXAMPLE.length + 1] = f.toString();
            CliRun r = run(args);
            assertThat(r.status()).as(r.err()).isZero();
            assertThat(Files.size(f)).isGreaterThan(1000);
        }
    }

    @ParameterizedTest
    @CsvSource(delimiter = '|', value = {
        "--distance-um 4 --radius-um 5 --diffusion-um2-per-s 100 --symbol-time-s 1 --molecules 10 | --distance-um",
        "--distance-um 10 --radius-um -1 --diffusion-um2-per-s 100 --symbol-time-s 1 --molecules 10 | --radius-um",
        "--distance-um 10 --radius-um 1 --diffusion-um2-per-s NaN --symbol-time-s 1 --molecules 10 | --diffusion-um2-per-s",
        "--distance-um 10 --radius-um 1 --diffusion-um2-per-s 100 --symbol-time-s 0 --molecules 10 | --symbol-time-s",
        "--distance-um 10 --radius-um 1 --diffusion-um2-per-s 100 --symbol-time-s Infinity --molecules 10 | --symbol-time-s",
        "--distance-um 10 --radius-um 1 --diffusion-um2-per-s 100 --symbol-time-s 1 --molecules 10 --prior-one 1 | --prior-one",
        "--distance-um 10 --radius-um 1 --diffusion-um2-per-s 100 --symbol-time-s 1 --molecules 10 --levels 1 | --levels",
        "--distance-um 10 --radius-um 1 --diffusion-um2-per-s 100 --symbol-time-s 1 --molecules 10 --count-model fancy | --count-model",
        "--distance-um 10 --radius-um 1 --diffusion-um2-per-s 100 --symbol-time-s 1 --molecules 0 | --molecules",
        "--distance-um 10 --radius-um 1 --diffusion-um2-per-s 100 --symbol-time-s 1 --molecules ten | --molecules",
        "--taps 0.5,1.5 --symbol-time-s 1 --molecules 10 | --taps",
        "--distance-um 10 --radius-um 1 --symbol-time-s 1 --molecules 10 | --diffusion-um2-per-s",
        "--distance-um 10 --radius-um 1 --diffusion-um2-per-s 100 --symbol-time-s 1 --molecules 10 --half-life-s -3 | --half-life-s",
        "--distance-um 10 --radius-um 1 --diffusion-um2-per-s 100 --symbol-time-s 1 --molecules 10 --plot x.gif | --plot",
        "--distance-um 10 --radius-um 1 --diffusion-um2-per-s 100 --symbol-time-s 1 --molecules 10 --max-error 1.5 | --max-error",
    })
    void badInputIsOneLineNamingTheOption(String args, String option) {
        String[] a = ("link " + args).trim().split("\\s+");
        CliRun r = run(a);
        assertThat(r.status()).isEqualTo(2);
        assertThat(r.out()).isEmpty();
        assertThat(r.err()).contains(option).doesNotContain("Exception").doesNotContain("\tat ");
        assertThat(r.err().lines().filter(l -> !l.startsWith("(see:")).count()).isEqualTo(1);
    }
}
