package dev.nanoplan.desktop;

import dev.nanoplan.geometry.Vec3;
import dev.nanoplan.scenario.Node;
import javafx.geometry.Point3D;
import javafx.scene.SubScene;
import javafx.scene.input.KeyCode;
import javafx.scene.input.KeyEvent;
import javafx.scene.input.MouseButton;
import javafx.scene.input.MouseEvent;
import javafx.scene.input.ScrollEvent;
import javafx.scene.shape.Shape3D;
import javafx.scene.shape.Sphere;

/**
 * Mouse and keyboard of the 3D view: drag to orbit, right- or ctrl-drag to pan, wheel to zoom,
 * arrows to orbit (shift: pan), +/− zoom, F fit, 0–3 presets; a click on empty space clears the
 * selection; shift-drag moves a node in the chosen plane and drops it as one move edit.
 */
final class SceneControls {

    private final SceneView view;
    private final PlannerViewModel vm;
    private final OrbitCamera orbit;
    private final SubScene subScene;
    private double pressX;
    private double pressY;
    private String draggedNode;
    private Point3D dragStart;
    private boolean dragMoved;
    /** Until the user moves the camera, a resized view fits the layout again. */
    private boolean userMovedCamera;

    SceneControls(SceneView view, PlannerViewModel vm, OrbitCamera orbit, SubScene subScene) {
        this.view = view;
        this.vm = vm;
        this.orbit = orbit;
        this.subScene = subScene;
        install();
    }

    /** Whether the user has orbited, panned or zoomed since the view opened. */
    boolean userMovedCamera() {
        return userMovedCamera;
    }

    private void install() {
        subScene.addEventHandler(MouseEvent.MOUSE_PRESSED, e -> {
            pressX = e.getSceneX();
            pressY = e.getSceneY();
            subScene.requestFocus();
        });
        subScene.addEventHandler(MouseEvent.MOUSE_DRAGGED, e -> {
            if (draggedNode != null) {
                return;
            }
            double dx = e.getSceneX() - pressX;
            double dy = e.getSceneY() - pressY;
            pressX = e.getSceneX();
            pressY = e.getSceneY();
            userMovedCamera = true;
            if (e.getButton() == MouseButton.PRIMARY && !e.isControlDown()) {
                orbit.orbit(dx * 0.4, -dy * 0.4);
            } else {
                orbit.pan(dx, dy, subScene.getHeight());
            }
        });
        subScene.addEventHandler(MouseEvent.MOUSE_CLICKED, e -> {
            if (e.isStillSincePress() && !(e.getPickResult().getIntersectedNode() instanceof Shape3D)) {
                vm.editor().selectedNodeIdProperty().set(null);
                vm.tables().selectedLinkProperty().set(null);
            }
        });
        subScene.addEventHandler(ScrollEvent.SCROLL, e -> {
            userMovedCamera = true;
            orbit.zoom(Math.exp(-e.getDeltaY() * 0.002));
        });
        subScene.addEventHandler(KeyEvent.KEY_PRESSED, this::onKey);
    }

    private void onKey(KeyEvent e) {
        KeyCode k = e.getCode();
        double step = 5;
        userMovedCamera = true;
        if (e.isShiftDown() && k.isArrowKey()) {
            double px = 20;
            switch (k) {
                case LEFT -> orbit.pan(px, 0, subScene.getHeight());
                case RIGHT -> orbit.pan(-px, 0, subScene.getHeight());
                case UP -> orbit.pan(0, px, subScene.getHeight());
                default -> orbit.pan(0, -px, subScene.getHeight());
            }
        } else {
            switch (k) {
                case LEFT -> orbit.orbit(-step, 0);
                case RIGHT -> orbit.orbit(step, 0);
                case UP -> orbit.orbit(0, step);
                case DOWN -> orbit.orbit(0, -step);
                case PLUS, EQUALS, ADD -> orbit.zoom(0.85);
                case MINUS, SUBTRACT -> orbit.zoom(1 / 0.85);
                case F -> view.fit();
                case DIGIT0, NUMPAD0 -> view.preset(SceneView.Preset.PERSPECTIVE);
                case DIGIT1, NUMPAD1 -> view.preset(SceneView.Preset.FRONT);
                case DIGIT2, NUMPAD2 -> view.preset(SceneView.Preset.SIDE);
                case DIGIT3, NUMPAD3 -> view.preset(SceneView.Preset.TOP);
                case V -> view.preset(SceneView.Preset.VOLUME);
                default -> {
                    return;
                }
            }
        }
        e.consume();
    }

    void onNodePressed(MouseEvent e, Node n) {
        vm.editor().selectedNodeIdProperty().set(n.id());
        if (e.isShiftDown() && e.getButton() == MouseButton.PRIMARY) {
            draggedNode = n.id();
            // the sphere may have been moved since it was built (moveSpheres): start from the layout's position
            Node now = vm.editor().nodeById(n.id());
            dragStart = Shapes3D.fx((now == null ? n : now).positionUm());
            dragMoved = false;
            pressX = e.getSceneX();
            pressY = e.getSceneY();
        }
        subScene.requestFocus();
    }

    void onNodeDragged(MouseEvent e, Node n, Sphere sp) {
        if (!n.id().equals(draggedNode)) {
            return;
        }
        double s = orbit.worldPerPixel(subScene.getHeight());
        double dx = (e.getSceneX() - pressX) * s;
        double dy = (e.getSceneY() - pressY) * s;
        Point3D d = orbit.right().multiply(dx).add(orbit.up().multiply(dy));
        Vec3 dl = Shapes3D.layout(d);
        Vec3 moved = switch (view.dragPlaneProperty().get()) {
            case XY -> new Vec3(dl.x(), dl.y(), 0);
            case XZ -> new Vec3(dl.x(), 0, dl.z());
            case YZ -> new Vec3(0, dl.y(), dl.z());
        };
        Point3D p = dragStart.add(Shapes3D.fx(moved));
        sp.setTranslateX(p.getX());
        sp.setTranslateY(p.getY());
        sp.setTranslateZ(p.getZ());
        dragMoved = true;
        e.consume();
    }

    void onNodeReleased(MouseEvent e, Node n, Sphere sp) {
        if (!n.id().equals(draggedNode)) {
            return;
        }
        draggedNode = null;
        if (dragMoved) {
            Vec3 target = Shapes3D.layout(new Point3D(sp.getTranslateX(), sp.getTranslateY(), sp.getTranslateZ()));
            if (!vm.editor().moveNode(n.id(), round(target))) {
                view.rebuild();
            }
        }
        e.consume();
    }

    private static Vec3 round(Vec3 v) {
        return new Vec3(Math.round(v.x() * 10) / 10.0, Math.round(v.y() * 10) / 10.0, Math.round(v.z() * 10) / 10.0);
    }
}
