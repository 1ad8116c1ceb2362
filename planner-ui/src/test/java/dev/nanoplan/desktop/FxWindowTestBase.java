package dev.nanoplan.desktop;

import java.nio.file.Path;
import java.util.concurrent.Callable;
import java.util.concurrent.CompletableFuture;
import java.util.concurrent.ScheduledExecutorService;
import java.util.concurrent.TimeUnit;
import javafx.application.Platform;
import javafx.scene.Scene;
import javafx.stage.Stage;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.Assumptions;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.BeforeEach;

/**
 * What the real-window tests share: JavaFX started once (skipped without a display unless on CI,
 * where it runs under xvfb-run), the window and the planner's background threads closed after
 * each test, and {@link #onFx} to run a check on the FX thread.
 */
abstract class FxWindowTestBase {

    ScheduledExecutorService bg;
    Stage stage;

    /** Why the window tests cannot run here, or null when they can. */
    static final String NO_DISPLAY = displayAvailable() ? null
            : "no display: window test skipped; run them with xvfb-run -a mvn -B verify (as .ci/run does)";

    static boolean displayAvailable() {
        String display = System.getenv("DISPLAY");
        boolean ci = "true".equalsIgnoreCase(System.getenv("CI"));
        return ci || (display != null && !display.isBlank());
    }

    @BeforeAll
    static void startFx() throws Exception {
        if (NO_DISPLAY == null) {
            DesktopLauncher.startPlatform();
        }
    }

    /**
     * Without a display every window test is reported as skipped with {@link #NO_DISPLAY} (an
     * assumption per test, so the count of skipped tests shows in the build summary).
     */
    @BeforeEach
    void needsDisplay() {
        Assumptions.assumeTrue(NO_DISPLAY == null, NO_DISPLAY);
    }

    @AfterEach
    void close() throws Exception {
        if (stage != null) {
            onFx(() -> {
                stage.close();
                return null;
            });
        }
        if (bg != null) {
            bg.shutdownNow();
        }
    }

    /** The planner's view model and the main window's view. */
    record Window(PlannerViewModel vm, MainView view) {
    }

    /**
     * Opens an empty main window (1200 × 760) on the core planner; call on the FX thread after
     * setting {@link #bg}. {@code simulationCacheDir} null = the application's default.
     */
    Window showMainWindow(Path simulationCacheDir) {
        PlannerViewModel vm = new PlannerViewModel(PlanService.core(), Platform::runLater, bg, 0,
                new RecentFiles(null));
        MainView view = simulationCacheDir == null ? new MainView(vm, null) : new MainView(vm, null, simulationCacheDir);
        stage = new Stage();
        stage.setScene(new Scene(view.root(), 1200, 760));
        stage.show();
        return new Window(vm, view);
    }

    /** Runs {@code c} on the FX thread and returns its result (60 s at most). */
    static <T> T onFx(Callable<T> c) throws Exception {
        CompletableFuture<T> f = new CompletableFuture<>();
        Platform.runLater(() -> {
            try {
                f.complete(c.call());
            } catch (Throwable t) {
                f.completeExceptionally(t);
            }
        });
        return f.get(60, TimeUnit.SECONDS);
    }
}
