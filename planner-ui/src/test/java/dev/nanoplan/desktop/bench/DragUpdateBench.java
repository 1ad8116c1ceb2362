package dev.nanoplan.desktop.bench;

import dev.nanoplan.desktop.DesktopLauncher;
import dev.nanoplan.desktop.MainView;
import dev.nanoplan.desktop.PlanService;
import dev.nanoplan.desktop.PlannerViewModel;
import dev.nanoplan.desktop.RecentFiles;
import dev.nanoplan.geometry.Vec3;
import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.SwarmGenerator;
import java.util.Arrays;
import java.util.concurrent.CompletableFuture;
import java.util.concurrent.TimeUnit;
import javafx.application.Platform;
import javafx.scene.Scene;
import javafx.stage.Stage;

/**
 * Measures the update after a drag on a generated layout (default 100 nodes): from the drop
 * (moveNode on the FX thread) until the new plan has been applied and the 3D scene and tables
 * rebuilt, with no debounce (the application adds its 150 ms debounce on top). Not a unit test;
 * run under a display:
 * {@code xvfb-run -a java -Dprism.forceGPU=true -cp <test classpath> dev.nanoplan.desktop.bench.DragUpdateBench [nodes] [repeats]}.
 */
public final class DragUpdateBench {

    private DragUpdateBench() {
    }

    public static void main(String[] args) throws Exception {
        int n = args.length > 0 ? Integer.parseInt(args[0]) : 100;
        int repeats = args.length > 1 ? Integer.parseInt(args[1]) : 20;
        Scenario s = SwarmGenerator.generate(n, 42);
        DesktopLauncher.startPlatform();
        PlannerViewModel vm = new PlannerViewModel(PlanService.core(), Platform::runLater,
                PlannerViewModel.daemonScheduler(), 0, new RecentFiles(null));
        CompletableFuture<Void> shown = new CompletableFuture<>();
        Platform.runLater(() -> {
            MainView view = new MainView(vm, null);
            Stage stage = new Stage();
            stage.setScene(new Scene(view.root(), 1400, 860));
            stage.show();
            vm.load(s, null);
            shown.complete(null);
        });
        shown.get(60, TimeUnit.SECONDS);
        vm.planned().get(600, TimeUnit.SECONDS);
        Node mover = s.nodes().stream().filter(x -> x.role().emits() && !x.id().equals("gw")).skip(3).findFirst()
                .orElseThrow();
        long[] total = new long[repeats];
        long[] planOnly = new long[repeats];
        long[] editSync = new long[repeats];
        for (int i = 0; i < repeats; i++) {
            double dx = (i % 2 == 0) ? 1.0 : -1.0;
            Vec3 p = vm.nodeById(mover.id()).positionUm();
            Vec3 q = new Vec3(p.x() + dx, p.y(), p.z());
            CompletableFuture<Long> started = new CompletableFuture<>();
            final int idx = i;
            Platform.runLater(() -> {
                long t0 = System.nanoTime();
                if (!vm.moveNode(mover.id(), q)) {
                    started.completeExceptionally(new IllegalStateException(vm.messageProperty().get()));
                } else {
                    editSync[idx] = System.nanoTime() - t0;
                    started.complete(t0);
                }
            });
            long t0 = started.get(60, TimeUnit.SECONDS);
            vm.planned().get(600, TimeUnit.SECONDS);
            CompletableFuture<Long> applied = new CompletableFuture<>();
            Platform.runLater(() -> applied.complete(System.nanoTime()));
            total[i] = applied.get(60, TimeUnit.SECONDS) - t0;
            planOnly[i] = vm.lastPlanNanos();
        }
        Arrays.sort(total);
        Arrays.sort(planOnly);
        Arrays.sort(editSync);
        System.out.printf("nodes=%d links=%d repeats=%d%n", n, vm.links().size(), repeats);
        System.out.printf("drop -> plan applied and scene rebuilt: median %.1f ms, max %.1f ms%n",
                total[repeats / 2] / 1e6, total[repeats - 1] / 1e6);
        System.out.printf("of which planning (background): median %.1f ms%n", planOnly[repeats / 2] / 1e6);
        System.out.printf("of which the edit on the FX thread (validation, undo, scene rebuild): median %.1f ms%n",
                editSync[repeats / 2] / 1e6);
        Platform.exit();
        System.exit(0);
    }
}
