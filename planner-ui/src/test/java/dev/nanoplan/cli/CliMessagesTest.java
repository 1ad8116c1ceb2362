package dev.nanoplan.cli;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.Locale;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import picocli.CommandLine;

/**
 * The command line's messages in the user's words: the option and the expected form, one line, exit 2,
 * nothing computed or printed on stdout first. Expected texts are the ones the help and the scenario
 * format define (docs/architecture.md §4.2: bad input → one line, exit 2).
 */
class CliMessagesTest {

    private static final String[] LINK = {"link", "--distance-um", "10", "--radius-um", "2",
        "--diffusion-um2-per-s", "80", "--symbol-time-s", "0.3"};

    private static String[] link(String... more) {
        String[] a = new String[LINK.length + more.length];
        System.arraycopy(LINK, 0, a, 0, LINK.length);
        System.arraycopy(more, 0, a, LINK.length, more.length);
        return a;
    }

    @Test
    void aWholeNumberWrittenInScientificNotationIsAccepted() {
        CliRun sci = CliRun.of(link("--molecules", "1e3", "--json"));
        CliRun plain = CliRun.of(link("--molecules", "1000", "--json"));
        assertThat(sci.status()).isZero();
        // 1e3 is the number 1000 (IEEE/decimal notation), so the result is byte-identical
        assertThat(sci.out()).isEqualTo(plain.out());
    }

    @Test
    void aFractionForAWholeNumberNamesTheOptionAndTheForm() {
        CliRun r = CliRun.of(link("--molecules", "1.5"));
        assertThat(r.status()).isEqualTo(2);
        assertThat(r.err()).contains("--molecules: whole number, e.g. 1000000, got '1.5'").doesNotContain("long");
        assertThat(r.out()).isEmpty();
    }

    @Test
    void aWordForANumberNamesTheOptionAndTheForm() {
        CliRun r = CliRun.of(link("--molecules", "1000", "--prior-one", "half"));
        assertThat(r.status()).isEqualTo(2);
        assertThat(r.err()).contains("--prior-one: number, e.g. 0.3 or 1e-3, got 'half'");
    }

    @Test
    void theCapacityFloorIsCheckedInTheOptionsWords(@TempDir Path dir) throws Exception {
        Path f = PlanCommandTest.write(dir, "s.json", PlanCommandTest.SMALL);
        CliRun r = CliRun.of("plan", f.toString(), "--capacity-floor-bits", "2");
        assertThat(r.status()).isEqualTo(2);
        assertThat(r.err()).contains("--capacity-floor-bits: must be in [0, 1)").doesNotContain("capacityFloorBits");
    }

    @Test
    void aBinaryFileIsOneLineNamingTheFile(@TempDir Path dir) throws Exception {
        Path f = dir.resolve("image.json");
        // bytes 0xFF 0xFE ... are never valid UTF-8 (RFC 3629 §1: 0xFE and 0xFF never appear)
        Files.write(f, new byte[] {'{', (byte) 0xFF, (byte) 0xFE, 0, 1, 2, '}'});
        CliRun r = CliRun.of("plan", f.toString());
        assertThat(r.status()).isEqualTo(2);
        assertThat(r.err().strip().lines()).hasSize(1);
        assertThat(r.err()).contains(f.toString()).contains("not a UTF-8 text file");
    }

    @Test
    void aMissingOutParentIsRefusedBeforeAnyWorkAndNotCreated(@TempDir Path dir) throws Exception {
        Path f = PlanCommandTest.write(dir, "s.json", PlanCommandTest.SMALL);
        Path out = dir.resolve("missing").resolve("report");
        CliRun r = CliRun.of("plan", f.toString(), "--out", out.toString());
        assertThat(r.status()).isEqualTo(2);
        assertThat(r.out()).isEmpty();
        assertThat(r.err().strip()).isEqualTo("nanoplan: --out: folder " + out.getParent() + " does not exist "
                + "(create it first)");
        assertThat(out.getParent()).doesNotExist();
    }

    @Test
    void anOutPathThatIsAFileIsRefused(@TempDir Path dir) throws Exception {
        Path f = PlanCommandTest.write(dir, "s.json", PlanCommandTest.SMALL);
        CliRun r = CliRun.of("plan", f.toString(), "--out", f.toString());
        assertThat(r.status()).isEqualTo(2);
        assertThat(r.out()).isEmpty();
        assertThat(r.err()).contains("--out: not a folder: " + f);
    }

    @Test
    void aPlotInAMissingFolderIsRefusedAndTheFolderNotCreated(@TempDir Path dir) {
        Path plot = dir.resolve("no").resolve("such").resolve("x.png");
        CliRun r = CliRun.of(link("--molecules", "1000", "--plot", plot.toString()));
        assertThat(r.status()).isEqualTo(2);
        assertThat(r.out()).isEmpty();
        assertThat(r.err()).contains("--plot: folder " + plot.getParent() + " does not exist");
        assertThat(dir.resolve("no")).doesNotExist();
    }

    @Test
    void uiWithoutADisplayIsOneLineWithExitTwo() {
        CommandLine cl = NanoplanCommand.commandLine();
        StringWriter err = new StringWriter();
        cl.setErr(new PrintWriter(err));
        CommandLine sub = cl.getSubcommands().get("ui");
        assertThat(sub).isNotNull();
        // the environment field of the registered instance is the one used
        ((UiCommand) sub.getCommand()).environment = Map.of();
        int status = cl.execute("ui");
        String os = System.getProperty("os.name").toLowerCase(Locale.ROOT);
        if (!os.contains("win") && !os.contains("mac")) {
            assertThat(status).isEqualTo(2);
            assertThat(err.toString()).contains("no display").doesNotContain("internal error");
        }
    }

    @Test
    void uiTabListsEveryPanel() {
        CliRun r = CliRun.of("ui", "--help");
        // the desktop's panels (MainView): Links … Settings
        assertThat(r.out().replaceAll("\\s+", " ")).contains("Simulation").contains("Settings");
        CliRun bad = CliRun.of("ui", "--tab", "Nope");
        assertThat(bad.status()).isEqualTo(2);
        assertThat(bad.err()).contains(String.join(", ", UiCommand.TABS));
    }

    @Test
    void linkDefaultsToTheScenarioFilesIsiMemory() {
        CliRun r = CliRun.of(link("--molecules", "1000", "--json"));
        // scenario files default isi_memory_symbols to 10 (Signalling.DEFAULT_ISI_MEMORY): taps p_0..p_10
        assertThat(r.out()).contains("\"taps\"");
        int taps = r.out().substring(r.out().indexOf("\"taps\":[")).split("]")[0].split(",").length;
        assertThat(taps).isEqualTo(11);
    }

    @Test
    void theVerdictFollowsOneRuleOnBitsPerSymbolForEveryNumberOfLevels() throws Exception {
        ObjectMapper m = new ObjectMapper();
        for (String[] extra : new String[][] {{"--molecules", "300"}, {"--molecules", "3000", "--levels", "4"},
            {"--molecules", "40"}, {"--molecules", "30000", "--levels", "4"}}) {
            double bits = m.readTree(CliRun.of(link(append(extra, "--json"))).out()).get("mutual_information_bits")
                    .asDouble();
            String text = CliRun.of(link(extra)).out();
            // the README's rule: Strong >= 0.9, Usable >= 0.5, Weak >= 0.01 bit/symbol, whatever the levels
            String word = bits >= 0.9 ? "Strong link" : bits >= 0.5 ? "Usable link" : bits >= 0.01 ? "Weak link"
                    : "Unusable link";
            assertThat(text).as(String.join(" ", extra) + " at " + bits + " bit").contains("\n" + word + ":");
        }
    }

    private static String[] append(String[] a, String more) {
        String[] out = Arrays.copyOf(a, a.length + 1);
        out[a.length] = more;
        return out;
    }

    @Test
    void helpIsNotBrokenInsideAWord() {
        for (String cmd : new String[] {"link", "plan", "compare", "simulate", "ui", "validate"}) {
            String help = CliRun.of(cmd, "--help").out();
            // a line ending in a letter followed by a line starting with a lower-case letter, both inside
            // one description, would be a word split in two; picocli only breaks at spaces then
            assertThat(help).as(cmd).doesNotContain("~/.\n").doesNotContainPattern("[A-Za-z]-\\n\\s+[a-z]");
        }
    }
}
