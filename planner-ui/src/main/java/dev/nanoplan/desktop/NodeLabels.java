package dev.nanoplan.desktop;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import javafx.beans.property.BooleanProperty;
import javafx.beans.property.SimpleBooleanProperty;
import javafx.geometry.Point2D;
import javafx.geometry.Point3D;
import javafx.scene.PerspectiveCamera;
import javafx.scene.control.Label;
import javafx.scene.layout.Pane;
import javafx.scene.shape.Sphere;
import javafx.scene.text.Text;

/**
 * The node id labels of the 3D view: a mouse-transparent 2D layer over the sub-scene with one label
 * per node, put beside the node's projected centre, decluttered by {@link LabelDeclutter} (a label
 * that would overlap an earlier one is hidden), and switched on and off as a whole.
 */
final class NodeLabels {

    /** Gap between a node's centre and its label, in pixels. */
    private static final double OFFSET_PX = 6;

    private final Pane layer = new Pane();
    private final Map<String, Label> labels = new LinkedHashMap<>();
    private final BooleanProperty shown = new SimpleBooleanProperty(true);
    private final PerspectiveCamera camera;

    NodeLabels(PerspectiveCamera camera) {
        this.camera = camera;
        layer.setMouseTransparent(true);
        layer.setPickOnBounds(false);
    }

    /** The label layer, to be stacked over the sub-scene with the same size. */
    Pane layer() {
        return layer;
    }

    BooleanProperty shownProperty() {
        return shown;
    }

    /** The labels now visible, by node id. */
    Map<String, Label> visible() {
        Map<String, Label> out = new LinkedHashMap<>();
        labels.forEach((id, l) -> {
            if (l.isVisible()) {
                out.put(id, l);
            }
        });
        return out;
    }

    /** One (hidden) label per node id, in layout order. */
    void rebuild(List<String> ids) {
        labels.clear();
        layer.getChildren().clear();
        for (String id : ids) {
            Label label = new Label(id);
            label.getStyleClass().add("node-label");
            label.setId("label-" + id);
            label.setVisible(false);
            labels.put(id, label);
            layer.getChildren().add(label);
        }
    }

    /** Puts each label beside its sphere on screen; hides those that would overlap an earlier one. */
    void place(Map<String, Sphere> spheres) {
        List<String> ids = new ArrayList<>(labels.keySet());
        List<LabelDeclutter.Box> boxes = new ArrayList<>();
        for (String id : ids) {
            Label l = labels.get(id);
            Sphere sp = spheres.get(id);
            l.setVisible(false);
            Point2D at = shown.get() && sp != null && layer.getScene() != null ? screen(sp) : null;
            if (at == null) {
                boxes.add(null);
                continue;
            }
            Text t = new Text(id);
            double w = t.getLayoutBounds().getWidth() + 6;
            double h = t.getLayoutBounds().getHeight() + 2;
            double x = at.getX() + OFFSET_PX;
            double y = at.getY() - h - 2;
            l.relocate(x, y);
            boxes.add(new LabelDeclutter.Box(x, y, w, h));
        }
        for (int i : LabelDeclutter.keep(boxes)) {
            labels.get(ids.get(i)).setVisible(true);
        }
    }

    /** Where a sphere's centre falls in the layer, or null when it is off screen or behind the camera. */
    private Point2D screen(Sphere sp) {
        Point3D c = new Point3D(sp.getTranslateX(), sp.getTranslateY(), sp.getTranslateZ());
        Point3D inCamera = camera.sceneToLocal(c);
        if (inCamera == null || inCamera.getZ() <= 0) {
            return null;
        }
        Point3D inScene = sp.localToScene(Point3D.ZERO, true);
        Point2D p = inScene == null ? null : layer.sceneToLocal(inScene.getX(), inScene.getY());
        if (p == null || p.getX() < 0 || p.getY() < 0 || p.getX() > layer.getWidth() || p.getY() > layer.getHeight()) {
            return null;
        }
        return p;
    }
}
