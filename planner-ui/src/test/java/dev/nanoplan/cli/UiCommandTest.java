package dev.nanoplan.cli;

import static org.assertj.core.api.Assertions.assertThat;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.Timeout;

/** Argument checks of {@code nanoplan ui}; none of these starts JavaFX. Exit statuses per docs/architecture.md §4.2. */
@Timeout(30)
class UiCommandTest {

    static CliRun run(String... args) {
        return CliRun.of(args);
    }

    @Test
    void missingFileIsBadInput() {
        CliRun r = run("ui", "no-such-file.json", "--snapshot", "x.png");
        assertThat(r.status()).isEqualTo(2);
        assertThat(r.err()).contains("no such file").doesNotContain("Exception");
    }

    @Test
    void snapshotNeedsAPngName() {
        CliRun r = run("ui", "../scenarios/culture-tank.json", "--snapshot", "x.jpg");
        assertThat(r.status()).isEqualTo(2);
        assertThat(r.err()).contains(".png");
    }

    @Test
    void snapshotNeedsAFile() {
        CliRun r = run("ui", "--snapshot", "x.png");
        assertThat(r.status()).isEqualTo(2);
        assertThat(r.err()).contains("FILE");
    }

    @Test
    void absurdSizeIsRefused() {
        CliRun r = run("ui", "../scenarios/culture-tank.json", "--snapshot", "x.png", "--width", "10");
        assertThat(r.status()).isEqualTo(2);
        assertThat(r.err()).contains("--width");
    }

    @Test
    void helpNamesTheSnapshotOption() {
        CliRun r = run("ui", "--help");
        assertThat(r.status()).isZero();
        assertThat(r.out()).contains("--snapshot").contains("--width").contains("--height");
    }
}
