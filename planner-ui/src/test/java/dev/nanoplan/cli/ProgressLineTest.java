package dev.nanoplan.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.util.concurrent.atomic.AtomicLong;
import org.junit.jupiter.api.Test;

/** Progress with time left, on a fake clock (no timing in the test). */
class ProgressLineTest {

    @Test
    void shortWorkPrintsNothingAndLongWorkStatesTheTimeLeft() {
        AtomicLong now = new AtomicLong(0);
        StringWriter out = new StringWriter();
        try (ProgressLine p = new ProgressLine(new PrintWriter(out), "planning x", false, now::get)) {
            now.set(1500);
            p.accept(0.1);
            assertThat(out.toString()).isEmpty();
            now.set(4000);
            p.accept(0.5);
            // linear extrapolation: 4 s for half the work leaves 4 s × (1 − 0.5) / 0.5 = 4 s
            assertThat(out.toString()).isEqualTo("planning x:  50% (4 s elapsed, about 4 s left)" + System.lineSeparator());
            now.set(5000);
            p.accept(0.6);
            // not a terminal: at most one line every 5 s
            assertThat(out.toString().lines()).hasSize(1);
            now.set(190_000);
            p.accept(0.95);
            // 190 s × 0.05 / 0.95 = 10 s; 190 s = 3 min 10 s
            assertThat(out.toString()).contains("planning x:  95% (3 min 10 s elapsed, about 10 s left)");
        }
    }
}
