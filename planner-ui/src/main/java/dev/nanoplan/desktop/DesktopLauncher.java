package dev.nanoplan.desktop;

import dev.nanoplan.plan.RouteReport;
import java.nio.file.Path;
import java.util.Comparator;
import java.util.concurrent.CompletableFuture;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.TimeoutException;
import javafx.animation.PauseTransition;
import javafx.application.Application;
import javafx.application.Platform;
import javafx.scene.Scene;
import javafx.stage.Stage;
import javafx.util.Duration;

/**
 * Starts the desktop planner from a plain class path (the main class must not extend
 * {@link Application}), either interactively or to render one snapshot.
 */
public final class DesktopLauncher {

    /** Longest wait for planning a layout in snapshot mode. */
    static final long PLAN_TIMEOUT_S = 300;

    private DesktopLauncher() {
    }

    /** Opens the window (blocks until it is closed). {@code file} may be null. */
    public static void launch(Path file) {
        if (file == null) {
            Application.launch(NanoplanApp.class);
        } else {
            Application.launch(NanoplanApp.class, file.toString());
        }
    }

    /** What a snapshot run produced. */
    public record SnapshotResult(int nodes, int links, int linkShapes, int spheres) {
    }

    /**
     * Renders the main window for {@code scenario} with its plan computed and writes it as PNG.
     * Starts the JavaFX platform if needed and leaves it running (call {@link Platform#exit()}
     * when done, or let the JVM end).
     *
     * @throws Exception with a one-line message when the display, file, planner or writing fails
     */
    public static SnapshotResult snapshot(Path scenario, Path png, int width, int height) throws Exception {
        return snapshot(scenario, png, width, height, null);
    }

    /**
     * As {@link #snapshot(Path, Path, int, int)}, showing the panel tab {@code tab} (e.g. "Routes",
     * "Link charts"; null keeps the link table). The weakest route is selected, and its bottleneck
     * link too, so the charts show that link.
     */
    public static SnapshotResult snapshot(Path scenario, Path png, int width, int height, String tab)
            throws Exception {
        startPlatform();
        CompletableFuture<PlannerViewModel> vmF = new CompletableFuture<>();
        CompletableFuture<MainView> viewF = new CompletableFuture<>();
        Platform.runLater(() -> {
            try {
                PlannerViewModel vm = new PlannerViewModel(PlanService.core(), Platform::runLater,
                        PlannerViewModel.daemonScheduler(), 0, new RecentFiles(null));
                if (!vm.open(scenario)) {
                    throw new IllegalArgumentException(vm.messageProperty().get());
                }
                Stage stage = new Stage();
                AppActions actions = new AppActions(stage, vm);
                MainView view = new MainView(vm, actions);
                stage.setScene(new Scene(view.root(), width, height));
                stage.titleProperty().bind(vm.document().titleProperty());
                stage.show();
                vmF.complete(vm);
                viewF.complete(view);
            } catch (Throwable t) {
                vmF.completeExceptionally(t);
            }
        });
        PlannerViewModel vm = unwrap(vmF, 60);
        MainView view = viewF.get();
        unwrap(vm.plans().planned(), PLAN_TIMEOUT_S);
        CompletableFuture<SnapshotResult> done = new CompletableFuture<>();
        Platform.runLater(() -> {
            // emphasise the weakest reachable route, so its bottleneck shows in the picture
            vm.tables().routes().stream().filter(RouteReport::reachable)
                    .min(Comparator.comparingDouble(RouteReport::endToEndCapacityBits))
                    .ifPresent(r -> {
                        view.routeTable().getSelectionModel().select(r);
                        vm.tables().selectedRouteProperty().set(r);
                        if (tab != null) {
                            vm.tables().selectLink(r.bottleneckFrom(), r.bottleneckTo());
                        }
                    });
            if (tab != null && !view.showTab(tab)) {
                done.completeExceptionally(new IllegalArgumentException("--tab: no panel '" + tab + "'"));
                return;
            }
            view.sceneView().fit();
            settleThenSnapshot(view, done, () -> {
                try {
                    Scene scene = view.root().getScene();
                    Snapshots.writePng(scene.snapshot(null), png);
                    SceneView sv = view.sceneView();
                    done.complete(new SnapshotResult(vm.scenarioProperty().get().nodes().size(), vm.tables().links().size(),
                            sv.linkShapes().size(), sv.spheres().size()));
                } catch (Throwable t) {
                    done.completeExceptionally(t);
                } finally {
                    ((Stage) view.root().getScene().getWindow()).close();
                }
            });
        });
        return unwrap(done, 60);
    }

    /** Waits for pulses to lay out and render (and for link charts to finish, up to 60 s), then runs {@code r}. */
    private static void settleThenSnapshot(MainView view, CompletableFuture<?> done, Runnable r) {
        long deadline = System.nanoTime() + 60_000_000_000L;
        PauseTransition settle = new PauseTransition(Duration.millis(600));
        settle.setOnFinished(e -> {
            if (view.charts().computingProperty().get() && System.nanoTime() < deadline) {
                settle.playFromStart();
            } else {
                r.run();
            }
        });
        settle.play();
    }

    /** Starts the FX platform once; fails with a clear message when there is no display. */
    public static void startPlatform() throws Exception {
        CompletableFuture<Void> up = new CompletableFuture<>();
        try {
            Platform.startup(() -> up.complete(null));
        } catch (IllegalStateException already) {
            up.complete(null);
        } catch (RuntimeException | Error e) {
            throw new IllegalStateException("cannot start JavaFX (no display? run under xvfb-run): " + e.getMessage(), e);
        }
        Platform.setImplicitExit(false);
        unwrap(up, 30);
    }

    private static <T> T unwrap(CompletableFuture<T> f, long seconds) throws Exception {
        try {
            return f.get(seconds, TimeUnit.SECONDS);
        } catch (ExecutionException e) {
            Throwable c = e.getCause();
            if (c instanceof Exception ex) {
                throw ex;
            }
            throw new IllegalStateException(c);
        } catch (TimeoutException e) {
            throw new IllegalStateException("timed out after " + seconds + " s", e);
        }
    }
}
