package dev.nanoplan.desktop;

import dev.nanoplan.geometry.Vec3;
import dev.nanoplan.geometry.Volume;
import dev.nanoplan.plan.LinkReport;
import dev.nanoplan.plan.Plan;
import dev.nanoplan.plan.RouteReport;
import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.Scenario;
import java.util.HashMap;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.Map;
import java.util.Set;
import javafx.beans.property.ObjectProperty;
import javafx.beans.property.SimpleObjectProperty;
import javafx.geometry.Point3D;
import javafx.scene.AmbientLight;
import javafx.scene.Group;
import javafx.scene.PointLight;
import javafx.scene.SceneAntialiasing;
import javafx.scene.SubScene;
import javafx.scene.input.KeyCode;
import javafx.scene.input.KeyEvent;
import javafx.scene.input.MouseButton;
import javafx.scene.input.MouseEvent;
import javafx.scene.input.ScrollEvent;
import javafx.scene.layout.Pane;
import javafx.scene.paint.Color;
import javafx.scene.paint.PhongMaterial;
import javafx.scene.shape.Cylinder;
import javafx.scene.shape.DrawMode;
import javafx.scene.shape.Shape3D;
import javafx.scene.shape.Sphere;
import javafx.scene.transform.Rotate;

/**
 * The 3D view of a layout: volume outline, nodes as spheres (radius to scale, with a minimum size
 * so small machines stay visible; colour by role), links as thin cylinders coloured by capacity,
 * and the selected route drawn thicker on top with its bottleneck hop emphasised.
 *
 * <p>Layout coordinates (x, y, z) in µm map to JavaFX coordinates (x, −z, y), so the layout's z
 * axis points up on screen. Mouse: drag to orbit, right/middle drag or Ctrl+drag to pan, wheel to
 * zoom, click to select, Shift+drag a node to move it in the chosen plane. Keys: arrows orbit,
 * Shift+arrows pan, +/− zoom, F fit, 1 front, 2 side, 3 top, 0 perspective.
 */
public final class SceneView {

    /** Preset directions. */
    public enum Preset { PERSPECTIVE, FRONT, SIDE, TOP }

    /** Plane a dragged node moves in (layout axes). */
    public enum DragPlane { XY, XZ, YZ }

    private static final Color BACKGROUND = Color.web("#141a22");
    private static final Color OUTLINE = Color.web("#7d93ad");
    private static final Color BOTTLENECK = Color.web("#ff5ea8");

    private final PlannerViewModel vm;
    private final OrbitCamera orbit = new OrbitCamera();
    private final Group world = new Group();
    private final Group volumeGroup = new Group();
    private final Group linkGroup = new Group();
    private final Group routeGroup = new Group();
    private final Group nodeGroup = new Group();
    private final SubScene subScene;
    private final Pane host = new Pane();
    private final Map<String, Sphere> spheres = new LinkedHashMap<>();
    private final Map<String, Cylinder> linkShapes = new LinkedHashMap<>();
    private final Map<Integer, PhongMaterial> materials = new HashMap<>();
    private final ObjectProperty<DragPlane> dragPlane = new SimpleObjectProperty<>(DragPlane.XY);
    private double extent = 100;
    private Point3D centre = Point3D.ZERO;
    private double pressX;
    private double pressY;
    private String draggedNode;
    private Point3D dragStart;
    private boolean dragMoved;
    /** Until the user moves the camera, a resized view fits the layout again. */
    private boolean userMovedCamera;

    public SceneView(PlannerViewModel vm) {
        this.vm = vm;
        AmbientLight ambient = new AmbientLight(Color.gray(0.5));
        PointLight key = new PointLight(Color.gray(0.75));
        key.getTransforms().add(new javafx.scene.transform.Translate(-2e4, -3e4, -2e4));
        world.getChildren().addAll(volumeGroup, linkGroup, routeGroup, nodeGroup, ambient, key);
        subScene = new SubScene(world, 800, 600, true, SceneAntialiasing.BALANCED);
        subScene.setFill(BACKGROUND);
        subScene.setCamera(orbit.camera());
        subScene.setFocusTraversable(true);
        subScene.widthProperty().bind(host.widthProperty());
        subScene.heightProperty().bind(host.heightProperty());
        host.getChildren().add(subScene);
        host.setMinSize(200, 150);
        host.getStyleClass().add("scene-host");
        host.widthProperty().addListener((o, a, b) -> refitIfUntouched());
        host.heightProperty().addListener((o, a, b) -> refitIfUntouched());
        installControls();
        vm.scenarioProperty().addListener((o, a, b) -> {
            boolean first = a == null || a.volume() != b.volume();
            if (first || !moveSpheres(a, b)) {
                rebuildNodesAndVolume();
            }
            rebuildLinks();
            if (first) {
                preset(Preset.PERSPECTIVE);
            }
        });
        // a new plan is drawn after the UI event that applied it (which may also re-select the link
        // and route: then that selection's immediate rebuild draws it and the deferred one is skipped)
        vm.tables().planProperty().addListener((o, a, b) -> requestLinks());
        vm.tables().selectedLinkProperty().addListener((o, a, b) -> rebuildLinks());
        vm.tables().selectedRouteProperty().addListener((o, a, b) -> rebuildLinks());
        vm.tables().showRoutesOnlyProperty().addListener((o, a, b) -> rebuildLinks());
        vm.editor().selectedNodeIdProperty().addListener((o, a, b) -> updateHalo());
        if (vm.scenarioProperty().get() != null) {
            rebuildNodesAndVolume();
            rebuildLinks();
            preset(Preset.PERSPECTIVE);
        }
    }

    /** The resizable pane holding the 3D sub-scene. */
    public Pane node() {
        return host;
    }

    public SubScene subScene() {
        return subScene;
    }

    public Group world() {
        return world;
    }

    /** The volume outline (for tests). */
    Group volumeGroup() {
        return volumeGroup;
    }

    public OrbitCamera camera() {
        return orbit;
    }

    public ObjectProperty<DragPlane> dragPlaneProperty() {
        return dragPlane;
    }

    /** One sphere per node of the layout, by node id (read-only view for tests). */
    public Map<String, Sphere> spheres() {
        return java.util.Collections.unmodifiableMap(spheres);
    }

    /** One cylinder per drawn link, by "from→to" (read-only view for tests). */
    public Map<String, Cylinder> linkShapes() {
        return java.util.Collections.unmodifiableMap(linkShapes);
    }

    private void refitIfUntouched() {
        if (!userMovedCamera) {
            fit();
        }
    }

    /** Looks at the whole layout from the current direction. */
    public void fit() {
        orbit.fit(centre, extent, subScene.getWidth() / Math.max(1, subScene.getHeight()));
    }

    /** Turns the camera to a preset direction and fits. */
    public void preset(Preset p) {
        switch (p) {
            case FRONT -> orbit.orient(0, 0);
            case SIDE -> orbit.orient(-90, 0);
            case TOP -> orbit.orient(0, -90);
            default -> orbit.orient(-30, -28);
        }
        fit();
    }

    static Point3D fx(Vec3 v) {
        return new Point3D(v.x(), -v.z(), v.y());
    }

    static Vec3 layout(Point3D p) {
        return new Vec3(p.getX(), p.getZ(), -p.getY());
    }

    // ------------------------------------------------------------------ building

    /**
     * The cheap update after a move: when the new layout has the same nodes (ids, order, roles, radii)
     * in the same volume and the view's frame (centre and extent) does not change, the existing
     * spheres are moved instead of rebuilding the scene, which keeps a drag's redraw small.
     *
     * @return false when a rebuild is needed
     */
    private boolean moveSpheres(Scenario before, Scenario after) {
        if (after == null || before == null || !before.volume().equals(after.volume())
                || before.nodes().size() != after.nodes().size() || spheres.size() != after.nodes().size()) {
            return false;
        }
        for (int i = 0; i < after.nodes().size(); i++) {
            Node x = before.nodes().get(i);
            Node y = after.nodes().get(i);
            if (!x.id().equals(y.id()) || x.role() != y.role() || x.radiusUm() != y.radiusUm()) {
                return false;
            }
        }
        Point3D oldCentre = centre;
        double oldExtent = extent;
        measure(after);
        if (!centre.equals(oldCentre) || extent != oldExtent) {
            return false; // rebuildNodesAndVolume measures again
        }
        for (Node n : after.nodes()) {
            Sphere sp = spheres.get(n.id());
            Point3D p = fx(n.positionUm());
            sp.setTranslateX(p.getX());
            sp.setTranslateY(p.getY());
            sp.setTranslateZ(p.getZ());
        }
        return true;
    }

    private void rebuildNodesAndVolume() {
        Scenario s = vm.scenarioProperty().get();
        volumeGroup.getChildren().clear();
        nodeGroup.getChildren().clear();
        spheres.clear();
        if (s == null) {
            return;
        }
        measure(s);
        double line = extent * 0.0025;
        PhongMaterial outline = new PhongMaterial(OUTLINE);
        if (s.volume() instanceof Volume.Box b) {
            Vec3 lo = b.minUm();
            Vec3 hi = b.maxUm();
            double[] xs = {lo.x(), hi.x()};
            double[] ys = {lo.y(), hi.y()};
            double[] zs = {lo.z(), hi.z()};
            for (double y : ys) {
                for (double z : zs) {
                    volumeGroup.getChildren().add(segment(new Vec3(lo.x(), y, z), new Vec3(hi.x(), y, z), line, outline));
                }
            }
            for (double x : xs) {
                for (double z : zs) {
                    volumeGroup.getChildren().add(segment(new Vec3(x, lo.y(), z), new Vec3(x, hi.y(), z), line, outline));
                }
            }
            for (double x : xs) {
                for (double y : ys) {
                    volumeGroup.getChildren().add(segment(new Vec3(x, y, lo.z()), new Vec3(x, y, hi.z()), line, outline));
                }
            }
        } else if (s.volume() instanceof Volume.Cylinder c) {
            int n = 64;
            double r = c.radiusUm();
            for (double x : new double[] {0, c.lengthUm() / 2, c.lengthUm()}) {
                for (int i = 0; i < n; i++) {
                    double a0 = 2 * Math.PI * i / n;
                    double a1 = 2 * Math.PI * (i + 1) / n;
                    volumeGroup.getChildren().add(segment(new Vec3(x, r * Math.cos(a0), r * Math.sin(a0)),
                            new Vec3(x, r * Math.cos(a1), r * Math.sin(a1)), x == c.lengthUm() / 2 ? line / 2 : line,
                            outline));
                }
            }
            for (int i = 0; i < 8; i++) {
                double a = 2 * Math.PI * i / 8;
                volumeGroup.getChildren().add(segment(new Vec3(0, r * Math.cos(a), r * Math.sin(a)),
                        new Vec3(c.lengthUm(), r * Math.cos(a), r * Math.sin(a)), line / 2, outline));
            }
        } else {
            // open medium: three axes through the layout's centre, a tenth of the extent long
            Vec3 o = layout(centre);
            double l = extent * 0.5;
            volumeGroup.getChildren().addAll(
                    segment(o, new Vec3(o.x() + l, o.y(), o.z()), line, new PhongMaterial(Color.web("#c0504d"))),
                    segment(o, new Vec3(o.x(), o.y() + l, o.z()), line, new PhongMaterial(Color.web("#4f9d5d"))),
                    segment(o, new Vec3(o.x(), o.y(), o.z() + l), line, new PhongMaterial(Color.web("#4f7dc0"))));
        }
        double minR = extent * 0.007;
        for (Node n : s.nodes()) {
            Sphere sp = new Sphere(Math.max(n.radiusUm(), minR), 24);
            Color c = CapacityColours.role(n.role());
            PhongMaterial m = new PhongMaterial(c);
            m.setSpecularColor(Color.gray(0.35));
            sp.setMaterial(m);
            Point3D p = fx(n.positionUm());
            sp.setTranslateX(p.getX());
            sp.setTranslateY(p.getY());
            sp.setTranslateZ(p.getZ());
            sp.setUserData(n.id());
            sp.setId("node-" + n.id());
            sp.setOnMousePressed(e -> onNodePressed(e, n));
            sp.setOnMouseDragged(e -> onNodeDragged(e, n, sp));
            sp.setOnMouseReleased(e -> onNodeReleased(e, n, sp));
            spheres.put(n.id(), sp);
            nodeGroup.getChildren().add(sp);
        }
        halo = null;
        updateHalo();
    }

    /** The wire sphere around the selected node, following it when it is dragged. */
    private Sphere halo;

    /**
     * Puts the selection halo around the selected node's sphere (or removes it); the node spheres
     * stay, so a press that selects a node keeps the sphere under the mouse for the drag.
     */
    private void updateHalo() {
        if (halo != null) {
            nodeGroup.getChildren().remove(halo);
            halo = null;
        }
        Sphere sp = spheres.get(vm.editor().selectedNodeIdProperty().get());
        if (sp == null) {
            return;
        }
        halo = new Sphere(sp.getRadius() * 1.8, 16);
        halo.setDrawMode(DrawMode.LINE);
        halo.setMaterial(new PhongMaterial(Color.WHITE));
        halo.setMouseTransparent(true);
        halo.translateXProperty().bind(sp.translateXProperty());
        halo.translateYProperty().bind(sp.translateYProperty());
        halo.translateZProperty().bind(sp.translateZProperty());
        nodeGroup.getChildren().add(halo);
    }

    private boolean linksRequested;

    /** Rebuilds the links once, after the current UI event has made all its changes. */
    private void requestLinks() {
        if (!linksRequested) {
            linksRequested = true;
            javafx.application.Platform.runLater(() -> {
                if (linksRequested) {
                    rebuildLinks();
                }
            });
        }
    }

    private void rebuildLinks() {
        linksRequested = false;
        linkGroup.getChildren().clear();
        routeGroup.getChildren().clear();
        linkShapes.clear();
        Plan plan = vm.tables().planProperty().get();
        Scenario s = vm.scenarioProperty().get();
        if (plan == null || s == null) {
            return;
        }
        Map<String, Node> byId = s.nodesById();
        double max = vm.maxCapacityBits();
        double r = extent * 0.003;
        LinkReport selected = vm.tables().selectedLinkProperty().get();
        RouteReport route = vm.tables().selectedRouteProperty().get();
        Set<String> routeHops = new HashSet<>();
        if (route != null && route.reachable()) {
            for (int i = 0; i + 1 < route.hops().size(); i++) {
                routeHops.add(route.hops().get(i) + "→" + route.hops().get(i + 1));
            }
        }
        boolean routesOnly = vm.tables().showRoutesOnlyProperty().get();
        Set<String> anyRouteHop = new HashSet<>();
        if (routesOnly) {
            for (RouteReport rr : plan.routes()) {
                for (int i = 0; i + 1 < rr.hops().size(); i++) {
                    anyRouteHop.add(rr.hops().get(i) + "→" + rr.hops().get(i + 1));
                }
            }
        }
        for (LinkReport l : plan.links()) {
            Node a = byId.get(l.from());
            Node b = byId.get(l.to());
            if (a == null || b == null) {
                continue;
            }
            String key = l.from() + "→" + l.to();
            if (routesOnly && !anyRouteHop.contains(key)) {
                continue;
            }
            boolean isSel = selected != null && selected.from().equals(l.from()) && selected.to().equals(l.to());
            boolean onRoute = routeHops.contains(key);
            boolean bottleneck = onRoute && l.from().equals(route.bottleneckFrom()) && l.to().equals(route.bottleneckTo());
            double radius = r * (bottleneck ? 4 : onRoute ? 2.6 : isSel ? 3 : 1);
            Color c = CapacityColours.of(l.capacityBits(), max);
            Cylinder cyl = segment(a.positionUm(), b.positionUm(), radius, material(c));
            cyl.setUserData(l);
            cyl.setId("link-" + key);
            cyl.setOnMouseClicked(e -> {
                if (e.isStillSincePress()) {
                    vm.tables().selectedLinkProperty().set(l);
                    e.consume();
                }
            });
            linkShapes.put(key, cyl);
            (onRoute || isSel ? routeGroup : linkGroup).getChildren().add(cyl);
            if (bottleneck || isSel) {
                Cylinder halo = segment(a.positionUm(), b.positionUm(), radius * 1.9,
                        new PhongMaterial(bottleneck ? BOTTLENECK : Color.WHITE));
                halo.setDrawMode(DrawMode.LINE);
                halo.setMouseTransparent(true);
                routeGroup.getChildren().add(halo);
            }
        }
    }

    private PhongMaterial material(Color c) {
        int key = (int) Math.round(c.getRed() * 63) << 12 | (int) Math.round(c.getGreen() * 63) << 6
                | (int) Math.round(c.getBlue() * 63);
        return materials.computeIfAbsent(key, k -> {
            PhongMaterial m = new PhongMaterial(c);
            m.setSpecularColor(Color.gray(0.2));
            return m;
        });
    }

    /** A cylinder from a to b (layout coordinates). */
    static Cylinder segment(Vec3 a, Vec3 b, double radius, PhongMaterial m) {
        Point3D p = fx(a);
        Point3D q = fx(b);
        Point3D d = q.subtract(p);
        double len = d.magnitude();
        Cylinder c = new Cylinder(radius, Math.max(len, 1e-9), 8);
        Point3D mid = p.midpoint(q);
        c.setTranslateX(mid.getX());
        c.setTranslateY(mid.getY());
        c.setTranslateZ(mid.getZ());
        Point3D yAxis = Rotate.Y_AXIS;
        Point3D axis = yAxis.crossProduct(d);
        double angle = yAxis.angle(d);
        if (axis.magnitude() > 1e-12) {
            c.getTransforms().add(new Rotate(angle, axis));
        } else if (d.getY() < 0) {
            c.getTransforms().add(new Rotate(180, Rotate.X_AXIS));
        }
        c.setMaterial(m);
        return c;
    }

    private void measure(Scenario s) {
        double[] lo = {Double.MAX_VALUE, Double.MAX_VALUE, Double.MAX_VALUE};
        double[] hi = {-Double.MAX_VALUE, -Double.MAX_VALUE, -Double.MAX_VALUE};
        java.util.function.Consumer<Vec3> take = v -> {
            double[] a = v.toArray();
            for (int i = 0; i < 3; i++) {
                lo[i] = Math.min(lo[i], a[i]);
                hi[i] = Math.max(hi[i], a[i]);
            }
        };
        if (s.volume() instanceof Volume.Box b) {
            take.accept(b.minUm());
            take.accept(b.maxUm());
        } else if (s.volume() instanceof Volume.Cylinder c) {
            take.accept(new Vec3(0, -c.radiusUm(), -c.radiusUm()));
            take.accept(new Vec3(c.lengthUm(), c.radiusUm(), c.radiusUm()));
        }
        for (Node n : s.nodes()) {
            Vec3 p = n.positionUm();
            take.accept(new Vec3(p.x() - n.radiusUm(), p.y() - n.radiusUm(), p.z() - n.radiusUm()));
            take.accept(new Vec3(p.x() + n.radiusUm(), p.y() + n.radiusUm(), p.z() + n.radiusUm()));
        }
        Vec3 c = new Vec3((lo[0] + hi[0]) / 2, (lo[1] + hi[1]) / 2, (lo[2] + hi[2]) / 2);
        centre = fx(c);
        extent = Math.max(1, Math.sqrt(Math.pow(hi[0] - lo[0], 2) + Math.pow(hi[1] - lo[1], 2)
                + Math.pow(hi[2] - lo[2], 2)) / 2);
    }

    // ------------------------------------------------------------------ interaction

    private void installControls() {
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
                case F -> fit();
                case DIGIT0, NUMPAD0 -> preset(Preset.PERSPECTIVE);
                case DIGIT1, NUMPAD1 -> preset(Preset.FRONT);
                case DIGIT2, NUMPAD2 -> preset(Preset.SIDE);
                case DIGIT3, NUMPAD3 -> preset(Preset.TOP);
                default -> {
                    return;
                }
            }
        }
        e.consume();
    }

    private void onNodePressed(MouseEvent e, Node n) {
        vm.editor().selectedNodeIdProperty().set(n.id());
        if (e.isShiftDown() && e.getButton() == MouseButton.PRIMARY) {
            draggedNode = n.id();
            // the sphere may have been moved since it was built (moveSpheres): start from the layout's position
            Node now = vm.editor().nodeById(n.id());
            dragStart = fx((now == null ? n : now).positionUm());
            dragMoved = false;
            pressX = e.getSceneX();
            pressY = e.getSceneY();
        }
        subScene.requestFocus();
    }

    private void onNodeDragged(MouseEvent e, Node n, Sphere sp) {
        if (!n.id().equals(draggedNode)) {
            return;
        }
        double s = orbit.worldPerPixel(subScene.getHeight());
        double dx = (e.getSceneX() - pressX) * s;
        double dy = (e.getSceneY() - pressY) * s;
        Point3D d = orbit.right().multiply(dx).add(orbit.up().multiply(dy));
        Vec3 dl = layout(d);
        Vec3 moved = switch (dragPlane.get()) {
            case XY -> new Vec3(dl.x(), dl.y(), 0);
            case XZ -> new Vec3(dl.x(), 0, dl.z());
            case YZ -> new Vec3(0, dl.y(), dl.z());
        };
        Point3D p = dragStart.add(fx(moved));
        sp.setTranslateX(p.getX());
        sp.setTranslateY(p.getY());
        sp.setTranslateZ(p.getZ());
        dragMoved = true;
        e.consume();
    }

    private void onNodeReleased(MouseEvent e, Node n, Sphere sp) {
        if (!n.id().equals(draggedNode)) {
            return;
        }
        draggedNode = null;
        if (dragMoved) {
            Vec3 target = layout(new Point3D(sp.getTranslateX(), sp.getTranslateY(), sp.getTranslateZ()));
            if (!vm.editor().moveNode(n.id(), round(target))) {
                rebuildNodesAndVolume();
            }
        }
        e.consume();
    }

    private static Vec3 round(Vec3 v) {
        return new Vec3(Math.round(v.x() * 10) / 10.0, Math.round(v.y() * 10) / 10.0, Math.round(v.z() * 10) / 10.0);
    }
}
