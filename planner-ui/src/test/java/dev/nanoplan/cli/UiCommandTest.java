package dev.nanoplan.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.PrintWriter;
import java.io.StringWriter;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.Timeout;

/** Argument checks of {@code nanoplan ui}; none of these starts JavaFX. Exit statuses per DESIGN.md §4.2. */
@Timeout(30)
class UiCommandTest {

    record Run(int status, String out, String err) {
    }

    static Run run(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int status = NanoplanCommand.execute(new PrintWriter(out), new PrintWriter(err), args);
        return new Run(status, out.toString(), err.toString());
    }

    @Test
    void missingFileIsBadInput() {
        Run r = run("ui", "no-such-file.json", "--snapshot", "x.png");
        assertThat(r.status()).isEqualTo(2);
        assertThat(r.err()).contains("no such file").doesNotContain("Exception");
    }

    @Test
    void snapshotNeedsAPngName() {
        Run r = run("ui", "../scenarios/culture-tank.json", "--snapshot", "x.jpg");
        assertThat(r.status()).isEqualTo(2);
        assertThat(r.err()).contains(".png");
    }

    @Test
    void snapshotNeedsAFile() {
        Run r = run("ui", "--snapshot", "x.png");
        assertThat(r.status()).isEqualTo(2);
        assertThat(r.err()).contains("FILE");
    }

    @Test
    void absurdSizeIsRefused() {
        Run r = run("ui", "../scenarios/culture-tank.json", "--snapshot", "x.png", "--width", "10");
        assertThat(r.status()).isEqualTo(2);
        assertThat(r.err()).contains("--width");
    }

    @Test
    void helpNamesTheSnapshotOption() {
        Run r = run("ui", "--help");
        assertThat(r.status()).isZero();
        assertThat(r.out()).contains("--snapshot").contains("--width").contains("--height");
    }
}
