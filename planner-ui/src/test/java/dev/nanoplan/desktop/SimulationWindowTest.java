package dev.nanoplan.desktop;

import static org.assertj.core.api.Assertions.assertThat;

import dev.nanoplan.geometry.Vec3;
import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.Scenario;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.TimeUnit;
import javafx.geometry.Bounds;
import javafx.scene.Parent;
import javafx.scene.control.Button;
import javafx.scene.control.CheckBox;
import javafx.scene.control.Label;
import javafx.scene.control.ProgressBar;
import javafx.scene.control.Tab;
import javafx.scene.control.TabPane;
import javafx.scene.control.TableView;
import javafx.scene.control.TextField;
import javafx.scene.paint.Color;
import javafx.scene.paint.LinearGradient;
import javafx.scene.paint.Paint;
import javafx.scene.text.Text;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.Timeout;
import org.junit.jupiter.api.io.TempDir;
import org.testfx.util.WaitForAsyncUtils;

/**
 * Real window (under xvfb-run, like {@link MainWindowTest}): the Simulation tab runs a small
 * simulation of a bundled layout from its Run button and fills its table.
 */
@Timeout(value = 180, unit = TimeUnit.SECONDS)
class SimulationWindowTest extends FxWindowTestBase {

    @TempDir
    Path cacheDir;

    @Test
    void simulationTabRunsTheLayoutAndFillsTheTable() throws Exception {
        bg = PlannerViewModel.daemonScheduler();
        PlannerViewModel vm = onFx(() -> {
            Window w = showMainWindow(cacheDir);
            assertThat(w.vm().open(MainWindowTest.SCENARIOS.resolve("relay-chain-direct.json"))).isTrue();
            assertThat(w.view().showTab("Simulation")).isTrue();
            return w.vm();
        });
        vm.plans().planned().get(150, TimeUnit.SECONDS);
        WaitForAsyncUtils.waitForFxEvents();

        SimulationView sv = onFx(() -> {
            var tabs = ((Parent) stage.getScene().getRoot()).lookup(".tab-pane");
            Tab tab = ((TabPane) tabs).getSelectionModel().getSelectedItem();
            assertThat(tab.getText()).isEqualTo("Simulation");
            javafx.scene.Node content = tab.getContent();
            ProgressBar bar = (ProgressBar) content.lookup("#sim-progress");
            assertThat(bar.getProgress()).isZero();
            // 2000 molecules of the one transmitter: about 2e7 molecule-steps, a second or so
            ((TextField) content.lookup("#sim-molecules")).setText("2000");
            Button run = (Button) content.lookup("#sim-run");
            assertThat(run.isDisabled()).isFalse();
            run.fire();
            return (SimulationView) content.getUserData();
        });
        assertThat(sv.viewModel().finished().get(150, TimeUnit.SECONDS))
                .as(() -> sv.viewModel().statusProperty().get()).isEqualTo(SimulationViewModel.Outcome.COMPLETE);
        WaitForAsyncUtils.waitForFxEvents();

        onFx(() -> {
            javafx.scene.Node content = sv.node();
            assertThat(((ProgressBar) content.lookup("#sim-progress")).getProgress()).isEqualTo(1.0);
            @SuppressWarnings("unchecked")
            TableView<SimulationRow> table = (TableView<SimulationRow>) content.lookup("#sim-table");
            // one row per emitter → receiver pair of the same species: here src → dst only
            Scenario s = vm.scenarioProperty().get();
            long pairs = s.nodes().stream().filter(n -> n.role().emits()).mapToLong(e -> s.nodes().stream()
                    .filter(r -> r != e && r.role().absorbs() && r.species().equals(e.emitsSpecies())).count()).sum();
            assertThat(table.getItems()).hasSize((int) pairs);
            assertThat(table.getItems().get(0).from()).isEqualTo(firstEmitter(s).id());
            assertThat(((Label) content.lookup("#sim-status")).getText()).startsWith("done:");
            assertThat(content.lookup("#sim-stale").isVisible()).isFalse();
            return null;
        });

        // the same run again: read from the cache (the folder given to the window)
        onFx(() -> {
            assertThat(((CheckBox) sv.node().lookup("#sim-resimulate")).isSelected()).isFalse();
            ((Button) sv.node().lookup("#sim-run")).fire();
            return null;
        });
        assertThat(sv.viewModel().finished().get(150, TimeUnit.SECONDS)).isEqualTo(SimulationViewModel.Outcome.COMPLETE);
        WaitForAsyncUtils.waitForFxEvents();
        assertThat(onFx(() -> ((Label) sv.node().lookup("#sim-status")).getText())).contains("from cache");

        // an edit after the run shows the stale mark
        onFx(() -> vm.editor().moveNode("dst", new Vec3(150, 0, 0)));
        WaitForAsyncUtils.waitForFxEvents();
        assertThat(onFx(() -> sv.node().lookup("#sim-stale").isVisible())).isTrue();
    }

    @Test
    void theTimeStepPromptIsReadableAndItsHintBesideTheField() throws Exception {
        bg = PlannerViewModel.daemonScheduler();
        SimulationView sv = onFx(() -> {
            MainView view = showMainWindow(cacheDir).view();
            assertThat(view.showTab("Simulation")).isTrue();
            return (SimulationView) view.tabs().getSelectionModel().getSelectedItem().getContent().getUserData();
        });
        WaitForAsyncUtils.waitForFxEvents();
        onFx(() -> {
            TextField dt = (TextField) sv.node().lookup("#sim-dt");
            assertThat(dt.getText()).isEmpty();
            Text prompt = texts(dt).stream().filter(t -> "auto".equals(t.getText())).findFirst().orElseThrow();
            assertThat(prompt.isVisible()).isTrue();
            Color fill = (Color) prompt.getFill();
            Color field = innerBackground(dt);
            // W3C, Web Content Accessibility Guidelines 2.1, 2018, success criterion 1.4.3 (contrast
            // (minimum)): text needs a contrast ratio of at least 4.5:1 with its background
            assertThat(contrast(fill, field)).as("prompt %s on %s", fill, field).isGreaterThanOrEqualTo(4.5);
            Bounds field1 = dt.localToScene(dt.getBoundsInLocal());
            javafx.scene.Node hint = sv.node().lookup("#sim-dt-hint");
            Bounds hintB = hint.localToScene(hint.getBoundsInLocal());
            assertThat(hintB.getMinX()).as("the hint starts right of the field").isGreaterThanOrEqualTo(field1.getMaxX());
            return null;
        });
    }

    static List<Text> texts(Parent p) {
        List<Text> out = new ArrayList<>();
        for (javafx.scene.Node n : p.getChildrenUnmodifiable()) {
            if (n instanceof Text t) {
                out.add(t);
            } else if (n instanceof Parent q) {
                out.addAll(texts(q));
            }
        }
        return out;
    }

    /** The colour the text of a text field is drawn on: its last background fill (the end of a gradient). */
    static Color innerBackground(TextField f) {
        var fills = f.getBackground().getFills();
        Paint p = fills.get(fills.size() - 1).getFill();
        if (p instanceof LinearGradient g) {
            return g.getStops().get(g.getStops().size() - 1).getColor();
        }
        return (Color) p;
    }

    /**
     * Contrast ratio (L1 + 0.05) / (L2 + 0.05) of relative luminances, W3C WCAG 2.1 (2018), definitions
     * of "contrast ratio" and "relative luminance" (sRGB channels linearised, weights 0.2126, 0.7152, 0.0722).
     */
    static double contrast(Color a, Color b) {
        double la = luminance(a);
        double lb = luminance(b);
        return (Math.max(la, lb) + 0.05) / (Math.min(la, lb) + 0.05);
    }

    static double luminance(Color c) {
        return 0.2126 * linear(c.getRed()) + 0.7152 * linear(c.getGreen()) + 0.0722 * linear(c.getBlue());
    }

    static double linear(double v) {
        return v <= 0.04045 ? v / 12.92 : Math.pow((v + 0.055) / 1.055, 2.4);
    }

    static Node firstEmitter(Scenario s) {
        return s.nodes().stream().filter(n -> n.role().emits()).findFirst().orElseThrow();
    }
}
