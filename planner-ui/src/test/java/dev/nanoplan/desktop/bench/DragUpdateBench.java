package dev.nanoplan.desktop.bench;

import dev.nanoplan.desktop.DesktopLauncher;
import dev.nanoplan.desktop.MainView;
import dev.nanoplan.desktop.PlanService;
import dev.nanoplan.desktop.PlannerViewModel;
import dev.nanoplan.desktop.RecentFiles;
import dev.nanoplan.geometry.Vec3;
import dev.nanoplan.plan.Plan;
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
 * (moveNode on the FX thread) until the preview plan has been applied and the 3D scene and tables
 * rebuilt, and until the exact plan has. The view model is configured as in the application
 * (preview at once on its own thread, exact plan after the 150 ms debounce, which is included in
 * the exact times; an optional third argument sets another debounce). Not a unit test; run under a
 * display:
 * {@code xvfb-run -a java -Dprism.forceGPU=true -cp <test classpath> dev.nanoplan.desktop.bench.DragUpdateBench [nodes] [repeats]}.
 */
public final class DragUpdateBench {

    private DragUpdateBench() {
    }

    public static void main(String[] args) throws Exception {
        int n = args.length > 0 ? Integer.parseInt(args[0]) : 100;
        int repeats = args.length > 1 ? Integer.parseInt(args[1]) : 20;
        long debounceMs = args.length > 2 ? Long.parseLong(args[2]) : PlannerViewModel.DEFAULT_DEBOUNCE_MS;
        Scenario s = SwarmGenerator.generate(n, 42);
        DesktopLauncher.startPlatform();
        PlannerViewModel vm = new PlannerViewModel(PlanService.core(), Platform::runLater,
                PlannerViewModel.daemonScheduler(), debounceMs, PlannerViewModel.daemonScheduler("bench-preview"),
                PlannerViewModel.DEFAULT_PREVIEW_DEBOUNCE_MS, new RecentFiles(null));
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
        vm.plans().planned().get(600, TimeUnit.SECONDS);
        Node mover = s.nodes().stream().filter(x -> x.role().emits() && !x.id().equals("gw")).skip(3).findFirst()
                .orElseThrow();
        // latency of one FX-thread turn with nothing planned: the floor of any "applied" time here
        long[] idle = new long[10];
        for (int i = 0; i < idle.length; i++) {
            Thread.sleep(100);
            long t0 = System.nanoTime();
            CompletableFuture<Long> turn = new CompletableFuture<>();
            Platform.runLater(() -> turn.complete(System.nanoTime()));
            idle[i] = turn.get(60, TimeUnit.SECONDS) - t0;
        }
        Arrays.sort(idle);
        long[] total = new long[repeats];
        long[] planOnly = new long[repeats];
        long[] previewTotal = new long[repeats];
        long[] previewOnly = new long[repeats];
        long[] previewApplied = new long[repeats];
        long[] exactApplied = new long[repeats];
        int previews = 0;
        long[] editSync = new long[repeats];
        for (int i = 0; i < repeats; i++) {
            double dx = (i % 2 == 0) ? 1.0 : -1.0;
            Vec3 p = vm.editor().nodeById(mover.id()).positionUm();
            Vec3 q = new Vec3(p.x() + dx, p.y(), p.z());
            CompletableFuture<Long> started = new CompletableFuture<>();
            final int idx = i;
            Platform.runLater(() -> {
                long t0 = System.nanoTime();
                if (!vm.editor().moveNode(mover.id(), q)) {
                    started.completeExceptionally(new IllegalStateException(vm.messageProperty().get()));
                } else {
                    editSync[idx] = System.nanoTime() - t0;
                    started.complete(t0);
                }
            });
            long t0 = started.get(60, TimeUnit.SECONDS);
            CompletableFuture<Plan> previewed = vm.plans().previewed();
            CompletableFuture<Plan> planned = vm.plans().planned();
            // stamped on the FX thread the moment the view model has applied the plan (tables and
            // scene graph updated); the runLater below adds the wait for the next FX turn (rendering)
            long[] appliedAt = new long[2];
            previewed.thenRun(() -> appliedAt[0] = System.nanoTime());
            planned.thenRun(() -> appliedAt[1] = System.nanoTime());
            CompletableFuture.anyOf(previewed, planned).get(600, TimeUnit.SECONDS);
            if (previewed.isDone()) {
                CompletableFuture<Long> shownPreview = new CompletableFuture<>();
                Platform.runLater(() -> shownPreview.complete(System.nanoTime()));
                previewTotal[previews] = shownPreview.get(60, TimeUnit.SECONDS) - t0;
                previewApplied[previews] = appliedAt[0] - t0;
                previewOnly[previews++] = vm.plans().lastPreviewNanos();
            }
            planned.get(600, TimeUnit.SECONDS);
            CompletableFuture<Long> applied = new CompletableFuture<>();
            Platform.runLater(() -> applied.complete(System.nanoTime()));
            total[i] = applied.get(60, TimeUnit.SECONDS) - t0;
            exactApplied[i] = appliedAt[1] - t0;
            planOnly[i] = vm.plans().lastPlanNanos();
        }
        Arrays.sort(total);
        Arrays.sort(planOnly);
        Arrays.sort(editSync);
        System.out.printf("nodes=%d links=%d repeats=%d exact debounce=%d ms%n", n, vm.tables().links().size(), repeats,
                debounceMs);
        if (previews > 0) {
            long[] pt = Arrays.copyOf(previewTotal, previews);
            long[] po = Arrays.copyOf(previewOnly, previews);
            long[] pa = Arrays.copyOf(previewApplied, previews);
            Arrays.sort(pt);
            Arrays.sort(po);
            Arrays.sort(pa);
            System.out.printf("drop -> preview applied (FX thread): median %.1f ms, max %.1f ms%n",
                    pa[previews / 2] / 1e6, pa[previews - 1] / 1e6);
            System.out.printf("drop -> preview applied and next FX turn: median %.1f ms, max %.1f ms (%d of %d)%n",
                    pt[previews / 2] / 1e6, pt[previews - 1] / 1e6, previews, repeats);
            System.out.printf("of which the preview (background): median %.1f ms%n", po[previews / 2] / 1e6);
        } else {
            System.out.println("no preview was applied before its exact plan");
        }
        Arrays.sort(exactApplied);
        System.out.printf("drop -> exact plan applied (FX thread): median %.1f ms, max %.1f ms%n",
                exactApplied[repeats / 2] / 1e6, exactApplied[repeats - 1] / 1e6);
        System.out.printf("drop -> exact plan applied and next FX turn: median %.1f ms, max %.1f ms%n",
                total[repeats / 2] / 1e6, total[repeats - 1] / 1e6);
        System.out.printf("of which planning (background): median %.1f ms%n", planOnly[repeats / 2] / 1e6);
        System.out.printf("of which the edit on the FX thread (validation, undo, scene rebuild): median %.1f ms%n",
                editSync[repeats / 2] / 1e6);
        System.out.printf("one FX-thread turn while idle (rendering included): median %.1f ms, max %.1f ms%n",
                idle[idle.length / 2] / 1e6, idle[idle.length - 1] / 1e6);
        System.out.printf("load average at the end: %.2f (2 cores)%n",
                java.lang.management.ManagementFactory.getOperatingSystemMXBean().getSystemLoadAverage());
        Platform.exit();
        System.exit(0);
    }
}
