package dev.nanoplan.desktop;

import static org.assertj.core.api.Assertions.assertThat;

import dev.nanoplan.plan.LinkReport;
import dev.nanoplan.plan.Plan;
import java.awt.image.BufferedImage;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.TimeUnit;
import javafx.event.EventType;
import javafx.scene.Node;
import javafx.scene.Parent;
import javafx.scene.SnapshotParameters;
import javafx.scene.control.Button;
import javafx.scene.control.TextField;
import javafx.scene.input.MouseButton;
import javafx.scene.input.MouseEvent;
import javafx.scene.shape.Cylinder;
import javafx.scene.shape.Sphere;
import javax.imageio.ImageIO;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.Timeout;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.testfx.util.WaitForAsyncUtils;

/**
 * Real-window tests: need a display (CI runs them under xvfb-run; outside CI they are skipped when
 * DISPLAY is unset). Every test has a timeout because JavaFX can hang without a display.
 */
@Timeout(value = 180, unit = TimeUnit.SECONDS)
class MainWindowTest extends FxWindowTestBase {

    static final Path SCENARIOS = Path.of("..", "scenarios");

    Window open(String name) throws Exception {
        bg = PlannerViewModel.daemonScheduler();
        Window w = onFx(() -> {
            Window shown = showMainWindow(null);
            assertThat(shown.vm().open(SCENARIOS.resolve(name + ".json"))).isTrue();
            return shown;
        });
        w.vm().plans().planned().get(150, TimeUnit.SECONDS);
        WaitForAsyncUtils.waitForFxEvents();
        return w;
    }

    static <T extends Node> List<T> all(Parent root, Class<T> type, String idPrefix) {
        List<T> out = new ArrayList<>();
        for (Node n : root.getChildrenUnmodifiable()) {
            if (type.isInstance(n) && n.getId() != null && n.getId().startsWith(idPrefix)) {
                out.add(type.cast(n));
            }
            if (n instanceof Parent p) {
                out.addAll(all(p, type, idPrefix));
            }
        }
        return out;
    }

    @ParameterizedTest
    @ValueSource(strings = {"culture-tank", "vessel-segment", "relay-chain-direct", "relay-chain-relayed"})
    void eachBundledScenarioShowsOneSpherePerNodeAndOneShapePerLink(String name) throws Exception {
        Window w = open(name);
        onFx(() -> {
            Plan p = w.vm().tables().planProperty().get();
            SceneView sv = w.view().sceneView();
            // the sub-scene sits in the window's scene graph (a detached SubScene renders blank)
            assertThat(sv.subScene().getScene()).isSameAs(stage.getScene());
            assertThat(all(sv.world(), Sphere.class, "node-")).hasSize(p.scenario().nodes().size());
            assertThat(all(sv.world(), Cylinder.class, "link-")).hasSize(p.links().size());
            assertThat(w.view().linkTable().getItems()).hasSize(p.links().size());
            return null;
        });
    }

    @Test
    void tableSelectionHighlightsTheLinkIn3dAndBack() throws Exception {
        Window w = open("culture-tank");
        onFx(() -> {
            var table = w.view().linkTable();
            assertThat(table.getItems()).hasSizeGreaterThanOrEqualTo(2);
            LinkReport first = table.getItems().get(0);
            LinkReport second = table.getItems().get(1);
            double plain = w.view().sceneView().linkShapes().get(key(second)).getRadius();
            table.getSelectionModel().clearAndSelect(0);
            assertThat(w.vm().tables().selectedLinkProperty().get()).isEqualTo(first);
            assertThat(w.view().sceneView().linkShapes().get(key(first)).getRadius()).isGreaterThan(plain);
            // and back: a click on the second link's cylinder selects its table row
            Cylinder c = w.view().sceneView().linkShapes().get(key(second));
            c.fireEvent(new MouseEvent(MouseEvent.MOUSE_CLICKED, 0, 0, 0, 0, MouseButton.PRIMARY, 1, false, false,
                    false, false, false, false, false, false, false, true, null));
            assertThat(table.getSelectionModel().getSelectedItem()).isEqualTo(second);
            return null;
        });
    }

    @Test
    void draggingANodeChangesTheLinkTable() throws Exception {
        Window w = open("culture-tank");
        List<LinkReport> before = onFx(() -> List.copyOf(w.view().linkTable().getItems()));
        var beforePos = w.vm().editor().nodeById("s09").positionUm();
        double[] translateBefore = onFx(() -> {
            Sphere s = w.view().sceneView().spheres().get("s09");
            return new double[] {s.getTranslateX(), s.getTranslateY(), s.getTranslateZ()};
        });
        // pressing selects the node (a halo appears) and keeps the sphere under the mouse; the drop moves it in place
        Sphere sphereBefore = onFx(() -> w.view().sceneView().spheres().get("s09"));
        onFx(() -> {
            sphereBefore.fireEvent(mouse(MouseEvent.MOUSE_PRESSED, 300, 300));
            assertThat(w.view().sceneView().spheres().get("s09")).isSameAs(sphereBefore);
            return null;
        });
        onFx(() -> {
            sphereBefore.fireEvent(mouse(MouseEvent.MOUSE_DRAGGED, 330, 300));
            sphereBefore.fireEvent(mouse(MouseEvent.MOUSE_RELEASED, 330, 300));
            return null;
        });
        assertThat(w.vm().editor().nodeById("s09").positionUm()).isNotEqualTo(beforePos);
        w.vm().plans().planned().get(150, TimeUnit.SECONDS);
        WaitForAsyncUtils.waitForFxEvents();
        List<LinkReport> after = onFx(() -> List.copyOf(w.view().linkTable().getItems()));
        assertThat(after).isNotEqualTo(before);
        // a move keeps the scene: the same sphere stands at the new place (no rebuild of the 100-node scene)
        assertThat(onFx(() -> w.view().sceneView().spheres().get("s09"))).isSameAs(sphereBefore);
        double[] translateAfter = onFx(() -> new double[] {sphereBefore.getTranslateX(), sphereBefore.getTranslateY(),
            sphereBefore.getTranslateZ()});
        assertThat(translateAfter).isNotEqualTo(translateBefore);
        assertThat(onFx(() -> w.view().sceneView().spheres().size())).isEqualTo(w.vm().scenarioProperty().get()
                .nodes().size());
    }

    @Test
    void snapshotIsNotBlankAndShowsTheVolume(@TempDir Path dir) throws Exception {
        Path png = dir.resolve("tank.png");
        DesktopLauncher.SnapshotResult r = DesktopLauncher.snapshot(SCENARIOS.resolve("culture-tank.json"), png, 1000,
                700);
        assertThat(r.spheres()).isEqualTo(r.nodes());
        BufferedImage img = ImageIO.read(png.toFile());
        assertThat(img.getWidth()).isEqualTo(1000);
        assertThat(img.getHeight()).isEqualTo(700);
        // not blank: the luminance varies across the picture
        assertThat(luminanceStdDev(img)).isGreaterThan(10);

        // shows the volume: the 3D view with the outline differs from the same view without it
        Window w = open("culture-tank");
        int changed = onFx(() -> {
            SceneView sv = w.view().sceneView();
            BufferedImage with = Snapshots.toBuffered(sv.subScene().snapshot(new SnapshotParameters(), null));
            sv.volumeGroup().setVisible(false);
            BufferedImage without = Snapshots.toBuffered(sv.subScene().snapshot(new SnapshotParameters(), null));
            sv.volumeGroup().setVisible(true);
            int n = 0;
            for (int y = 0; y < with.getHeight(); y++) {
                for (int x = 0; x < with.getWidth(); x++) {
                    if (with.getRGB(x, y) != without.getRGB(x, y)) {
                        n++;
                    }
                }
            }
            return n;
        });
        // twelve box edges a few pixels wide span well over a thousand pixels
        assertThat(changed).isGreaterThan(1000);
    }

    static MouseEvent mouse(EventType<MouseEvent> type, double x, double y) {
        return new MouseEvent(type, x, y, x, y, MouseButton.PRIMARY, 1, true, false, false, false,
                type != MouseEvent.MOUSE_RELEASED, false, false, false, false, false, null);
    }

    static String key(LinkReport l) {
        return l.from() + "→" + l.to();
    }

    static double luminanceStdDev(BufferedImage img) {
        double sum = 0;
        double sum2 = 0;
        long n = 0;
        for (int y = 0; y < img.getHeight(); y++) {
            for (int x = 0; x < img.getWidth(); x++) {
                int rgb = img.getRGB(x, y);
                double l = 0.299 * ((rgb >> 16) & 255) + 0.587 * ((rgb >> 8) & 255) + 0.114 * (rgb & 255);
                sum += l;
                sum2 += l * l;
                n++;
            }
        }
        double mean = sum / n;
        return Math.sqrt(Math.max(0, sum2 / n - mean * mean));
    }

    @Test
    void settingsTabAppliesASymbolTimeThroughItsButton() throws Exception {
        Window w = open("culture-tank");
        onFx(() -> {
            assertThat(w.view().showTab("Settings")).isTrue();
            // the Apply button of the settings tab is bound to the view model's settings editor
            w.vm().settings().symbolTimeSProperty().set("0.5");
            Button apply = (Button) w.view().tabs().getSelectionModel()
                    .getSelectedItem().getContent().lookup("#apply-settings");
            assertThat(apply).isNotNull();
            assertThat(apply.isDisabled()).isFalse();
            apply.fire();
            return null;
        });
        Plan p = w.vm().plans().planned().get(150, TimeUnit.SECONDS);
        assertThat(p.scenario().signalling().symbolTimeS()).isEqualTo(0.5);
        assertThat(onFx(() -> w.vm().document().undoStack().canUndoProperty().get())).isTrue();
    }

    @Test
    void settingsTabAddsASpeciesThroughItsButtons() throws Exception {
        Window w = open("culture-tank");
        onFx(() -> {
            assertThat(w.view().showTab("Settings")).isTrue();
            Parent pane = (Parent) w.view().tabs().getSelectionModel().getSelectedItem().getContent();
            ((Button) pane.lookup("#add-species")).fire();
            return null;
        });
        WaitForAsyncUtils.waitForFxEvents();
        onFx(() -> {
            Parent pane = (Parent) w.view().tabs().getSelectionModel().getSelectedItem().getContent();
            // culture-tank.json declares A and B: the added row is the third
            TextField name = (TextField) pane.lookup("#species-name-2");
            TextField d = (TextField) pane.lookup("#species-d-2");
            assertThat(name).isNotNull();
            name.setText("lactate");
            d.setText("95");
            ((Button) pane.lookup("#apply-settings")).fire();
            return null;
        });
        WaitForAsyncUtils.waitForFxEvents();
        onFx(() -> {
            assertThat(w.vm().messageProperty().get()).isEqualTo("edit settings");
            Parent pane = (Parent) w.view().tabs().getSelectionModel().getSelectedItem().getContent();
            // the species list, rebuilt from the view model after Apply, shows the new species
            List<String> names = new ArrayList<>();
            for (Node n : ((Parent) pane.lookup("#species-grid")).getChildrenUnmodifiable()) {
                if (n instanceof TextField f && f.getId() != null
                        && f.getId().startsWith("species-name-")) {
                    names.add(f.getText());
                }
            }
            assertThat(names).containsExactly("A", "B", "lactate");
            assertThat(w.vm().speciesNames()).contains("lactate");
            assertThat(w.vm().document().undoStack().canUndoProperty().get()).isTrue();
            return null;
        });
    }
}
