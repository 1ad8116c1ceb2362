package dev.nanoplan.desktop;

import static org.assertj.core.api.Assertions.assertThat;

import dev.nanoplan.count.CountModelKind;
import dev.nanoplan.design.DesignMove;
import dev.nanoplan.geometry.Vec3;
import dev.nanoplan.geometry.Volume;
import dev.nanoplan.scenario.Demand;
import dev.nanoplan.scenario.Medium;
import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.Schedule;
import dev.nanoplan.scenario.Signalling;
import dev.nanoplan.scenario.Species;
import dev.nanoplan.scenario.Targets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.TimeoutException;
import javafx.scene.Group;
import javafx.scene.Parent;
import javafx.scene.chart.BarChart;
import javafx.scene.control.Button;
import javafx.scene.control.CheckBox;
import javafx.scene.control.Label;
import javafx.scene.control.TableView;
import javafx.scene.control.TextField;
import javafx.scene.control.ToolBar;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.Assumptions;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.Timeout;
import org.testfx.util.WaitForAsyncUtils;

/**
 * Real window (under xvfb-run, like {@link MainWindowTest}): the Tolerance tab runs a small study from
 * its buttons, fills its tables and histogram and outlines the weak links in the 3D view; "Improve…"
 * runs a search, lists the proposal and applies it as one undoable edit. With
 * {@code -Dnanoplan.screenshots=DIR} a third test renders both tabs on the culture tank into DIR.
 */
@Timeout(value = 300, unit = TimeUnit.SECONDS)
class DesignTabsWindowTest extends FxWindowTestBase {

    /** The window of the running test, whose background runs are cancelled after it. */
    private MainView shown;

    @AfterEach
    void cancelRuns() throws Exception {
        if (shown != null) {
            onFx(() -> {
                shown.tolerance().cancel();
                shown.improve().cancel();
                return null;
            });
        }
    }

    private static Parent content(MainView view) {
        return (Parent) view.tabs().getSelectionModel().getSelectedItem().getContent();
    }

    @Test
    void toleranceTabRunsAStudyAndOutlinesTheWeakLinks() throws Exception {
        bg = PlannerViewModel.daemonScheduler();
        Window win = onFx(() -> {
            Window w = showMainWindow(null);
            shown = w.view();
            // one link (src → dst) that misses its target: one weak link, whose guard band is quickly "not reached"
            assertThat(w.vm().open(MainWindowTest.SCENARIOS.resolve("relay-chain-direct.json"))).isTrue();
            assertThat(w.view().showTab("Tolerance")).isTrue();
            Parent c = content(w.view());
            // the layout has no tolerances: said so, and the demo defaults fill the fields
            assertThat(c.lookup("#tol-none").isVisible()).isTrue();
            ((Button) c.lookup("#tol-demo")).fire();
            assertThat(((TextField) c.lookup("#tol-position_sd_um")).getText()).isEqualTo("2");
            ((TextField) c.lookup("#tol-samples")).setText("16");
            ((Button) c.lookup("#tol-run")).fire();
            assertThat(c.lookup("#tol-run").isDisabled()).isTrue();
            return w;
        });
        MainView view = win.view();
        assertThat(view.tolerance().finished().get(200, TimeUnit.SECONDS))
                .as(() -> view.tolerance().statusProperty().get()).isEqualTo(ToleranceViewModel.Outcome.COMPLETE);
        WaitForAsyncUtils.waitForFxEvents();
        onFx(() -> {
            Parent c = content(view);
            @SuppressWarnings("unchecked")
            TableView<ToleranceRow> links = (TableView<ToleranceRow>) c.lookup("#tol-links");
            assertThat(links.getItems()).hasSize(view.tolerance().result().links().size()).isNotEmpty();
            assertThat(((TableView<?>) c.lookup("#tol-demands")).getItems()).hasSize(1);
            assertThat(((Label) c.lookup("#tol-status")).getText()).startsWith("done: 16 samples");
            BarChart<?, ?> chart = (BarChart<?, ?>) c.lookup("#tol-histogram");
            assertThat(chart.getData().get(0).getData()).isNotEmpty();
            Group weak = (Group) view.sceneView().overlay().getChildren().get(0);
            assertThat(weak.getChildren()).hasSize(view.tolerance().weakLinks().size()).isNotEmpty();
            assertThat(weak.lookup("#weak-src→dst")).isNotNull();
            return null;
        });
        // an edit clears the outlines and shows the stale mark
        onFx(() -> win.vm().editor().moveNode("dst", win.vm().scenarioProperty().get().nodesById().get("dst")
                .positionUm().plus(new Vec3(1, 0, 0))));
        WaitForAsyncUtils.waitForFxEvents();
        onFx(() -> {
            assertThat(((Group) view.sceneView().overlay().getChildren().get(0)).getChildren()).isEmpty();
            assertThat(content(view).lookup("#tol-stale").isVisible()).isTrue();
            return null;
        });
    }

    @Test
    void improveRunsFromTheToolBarAndAppliesTheProposalAsOneUndoableEdit() throws Exception {
        bg = PlannerViewModel.daemonScheduler();
        Scenario start = ImproveViewModelTest.twoPairs();
        Window win = onFx(() -> {
            Window w = showMainWindow(null);
            shown = w.view();
            w.vm().load(start, null);
            ToolBar bar = (ToolBar) stage.getScene().getRoot().lookup(".tool-bar");
            bar.getItems().stream().filter(n -> n instanceof Button b && b.getText().equals("Improve…"))
                    .map(Button.class::cast).findFirst().orElseThrow().fire();
            assertThat(w.view().tabs().getSelectionModel().getSelectedItem().getText()).isEqualTo("Improve");
            Parent c = content(w.view());
            ((CheckBox) c.lookup("#imp-allow-" + DesignMove.BUDGETS.id())).setSelected(false);
            ((CheckBox) c.lookup("#imp-allow-" + DesignMove.MOVE_RELAYS.id())).setSelected(false);
            assertThat(c.lookup("#imp-apply").isDisabled()).isTrue();
            ((Button) c.lookup("#imp-run")).fire();
            return w;
        });
        MainView view = win.view();
        assertThat(view.improve().finished().get(200, TimeUnit.SECONDS))
                .as(() -> view.improve().statusProperty().get()).isEqualTo(ImproveViewModel.Outcome.PROPOSAL);
        WaitForAsyncUtils.waitForFxEvents();
        Scenario after = onFx(() -> {
            Parent c = content(view);
            assertThat(((TableView<?>) c.lookup("#imp-changes")).getItems()).isNotEmpty();
            assertThat(((TableView<?>) c.lookup("#imp-demands")).getItems()).hasSize(2);
            assertThat(((Label) c.lookup("#imp-status")).getText()).startsWith("proposal:");
            Scenario proposed = view.improve().proposal().after();
            ((Button) c.lookup("#imp-apply")).fire();
            return proposed;
        });
        WaitForAsyncUtils.waitForFxEvents();
        onFx(() -> {
            PlannerViewModel vm = win.vm();
            assertThat(vm.scenarioProperty().get()).isEqualTo(after);
            assertThat(vm.undo()).isTrue();
            assertThat(vm.scenarioProperty().get()).isEqualTo(start);
            return null;
        });
    }

    /** A sensor, a gateway 32 µm away and a relay off the line between them: moving it helps. */
    static Scenario offLineRelay() {
        Species a = Species.ofDiffusion("A", 80, 1.0);
        Species b = Species.ofDiffusion("B", 80, 1.0);
        List<Node> nodes = List.of(
                Node.transmitter("src", new Vec3(-16, 0, 0), 1, "A", 4000),
                Node.relay("relay", new Vec3(-4, 9, 0), 2, "A", "B", 4000),
                Node.receiver("gw", new Vec3(16, 0, 0), 5, "B"));
        return new Scenario("off-line relay", new Volume.Open(), new Medium(310.15, 0.69, Medium.DEFAULT.flow(), 2.0),
                List.of(a, b), new Signalling(0.5, 4, 2, 0.5, CountModelKind.EXACT, Schedule.ALL_ACTIVE), nodes,
                List.of(new Demand("src", "gw")), new Targets(1e-3, 1.0, 3600), List.of());
    }

    @Test
    void aMovedRelayShowsAsAGhostWithAnArrowUntilDiscarded() throws Exception {
        bg = PlannerViewModel.daemonScheduler();
        Window win = onFx(() -> {
            Window w = showMainWindow(null);
            shown = w.view();
            w.vm().load(offLineRelay(), null);
            w.view().showTab("Improve");
            for (DesignMove m : DesignMove.values()) {
                w.view().improve().allowedProperty(m).set(m == DesignMove.MOVE_RELAYS);
            }
            w.view().improve().timeLimitSProperty().set("60");
            assertThat(w.view().improve().run()).isTrue();
            return w;
        });
        MainView view = win.view();
        assertThat(view.improve().finished().get(200, TimeUnit.SECONDS))
                .as(() -> view.improve().statusProperty().get()).isEqualTo(ImproveViewModel.Outcome.PROPOSAL);
        WaitForAsyncUtils.waitForFxEvents();
        onFx(() -> {
            Group ghosts = (Group) view.sceneView().overlay().getChildren().get(1);
            assertThat(ghosts.lookup("#ghost-relay")).isNotNull();
            assertThat(ghosts.lookup("#arrow-relay")).isNotNull();
            // the ghost sits at the relay's proposed centre (layout (x, y, z) → JavaFX (x, −z, y)); the
            // solid sphere stays at the old one until Apply
            Vec3 proposed = view.improve().proposal().after().nodesById().get("relay").positionUm();
            assertThat(ghosts.lookup("#ghost-relay").getTranslateX()).isEqualTo(proposed.x());
            assertThat(ghosts.lookup("#ghost-relay").getTranslateZ()).isEqualTo(proposed.y());
            assertThat(view.sceneView().spheres().get("relay").getTranslateX()).isEqualTo(-4.0);
            return null;
        });
        String dir = System.getProperty("nanoplan.screenshots");
        if (dir != null && !dir.isBlank()) {
            Path out = Files.createDirectories(Path.of(dir));
            Thread.sleep(800);
            onFx(() -> {
                Snapshots.writePng(stage.getScene().snapshot(null), out.resolve("improve-ghost.png"));
                return null;
            });
        }
        onFx(() -> {
            ((Button) content(view).lookup("#imp-discard")).fire();
            assertThat(((Group) view.sceneView().overlay().getChildren().get(1)).getChildren()).isEmpty();
            return null;
        });
    }

    @Test
    @Timeout(value = 900, unit = TimeUnit.SECONDS)
    void screenshotsOfBothTabsOnTheCultureTank() throws Exception {
        String dir = System.getProperty("nanoplan.screenshots");
        Assumptions.assumeTrue(dir != null && !dir.isBlank(), "set -Dnanoplan.screenshots=DIR to render them");
        Path out = Files.createDirectories(Path.of(dir));
        bg = PlannerViewModel.daemonScheduler();
        Window win = onFx(() -> {
            Window w = showMainWindow(null);
            shown = w.view();
            stage.setWidth(1500);
            stage.setHeight(950);
            assertThat(w.vm().open(MainWindowTest.SCENARIOS.resolve("culture-tank.json"))).isTrue();
            w.view().showTab("Tolerance");
            w.view().tolerance().samplesProperty().set(System.getProperty("nanoplan.screenshots.samples", "128"));
            assertThat(w.view().tolerance().run()).isTrue();
            return w;
        });
        MainView view = win.view();
        win.vm().plans().planned().get(200, TimeUnit.SECONDS);
        assertThat(view.tolerance().finished().get(280, TimeUnit.SECONDS)).isEqualTo(ToleranceViewModel.Outcome.COMPLETE);
        WaitForAsyncUtils.waitForFxEvents();
        Thread.sleep(800);
        onFx(() -> {
            view.sceneView().fit();
            assertThat(((Group) view.sceneView().overlay().getChildren().get(0)).getChildren()).isNotEmpty();
            return null;
        });
        Thread.sleep(800);
        onFx(() -> {
            Snapshots.writePng(stage.getScene().snapshot(null), out.resolve("tolerance-tab.png"));
            view.showTab("Improve");
            view.improve().timeLimitSProperty().set("60");
            view.improve().allowedProperty(DesignMove.ADD_RELAYS).set(true);
            assertThat(view.improve().run()).isTrue();
            return null;
        });
        try {
            view.improve().finished().get(120, TimeUnit.SECONDS);
        } catch (TimeoutException slow) {
            onFx(() -> {
                view.improve().cancel(); // Cancel proposes the best layout so far
                return null;
            });
            view.improve().finished().get(300, TimeUnit.SECONDS);
        }
        WaitForAsyncUtils.waitForFxEvents();
        Thread.sleep(800);
        onFx(() -> {
            assertThat(((Group) view.sceneView().overlay().getChildren().get(1)).getChildren())
                    .hasSizeGreaterThanOrEqualTo(view.improve().ghosts().size());
            Snapshots.writePng(stage.getScene().snapshot(null), out.resolve("improve-tab.png"));
            return null;
        });
    }
}
