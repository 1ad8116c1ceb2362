package dev.nanoplan.desktop;

import dev.nanoplan.geometry.Vec3;
import dev.nanoplan.plan.LinkReport;
import dev.nanoplan.plan.Plan;
import dev.nanoplan.plan.RouteReport;
import dev.nanoplan.report.Palette;
import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.Scenario;
import java.util.Collections;
import java.util.HashMap;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import javafx.application.Platform;
import javafx.beans.property.BooleanProperty;
import javafx.beans.property.ObjectProperty;
import javafx.beans.property.SimpleObjectProperty;
import javafx.geometry.Point3D;
import javafx.scene.AmbientLight;
import javafx.scene.Group;
import javafx.scene.PointLight;
import javafx.scene.SceneAntialiasing;
import javafx.scene.SubScene;
import javafx.scene.control.Label;
import javafx.scene.layout.Pane;
import javafx.scene.paint.Color;
import javafx.scene.paint.PhongMaterial;
import javafx.scene.shape.Cylinder;
import javafx.scene.shape.DrawMode;
import javafx.scene.shape.Sphere;
import javafx.scene.transform.Translate;

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
    public enum Preset { PERSPECTIVE, FRONT, SIDE, TOP, VOLUME }

    /** Smallest on-screen diameter of a node, in pixels, at the camera target's depth. */
    static final double MIN_NODE_DIAMETER_PX = 9;

    /** Plane a dragged node moves in (layout axes). */
    public enum DragPlane { XY, XZ, YZ }

    private static final Color BACKGROUND = Color.web("#141a22");
    private static final Color OUTLINE = Color.web("#7d93ad");
    private static final Color BOTTLENECK = Color.web(Palette.BOTTLENECK);

    private final PlannerViewModel vm;
    private final OrbitCamera orbit = new OrbitCamera();
    private final Group world = new Group();
    private final Group volumeGroup = new Group();
    private final Group linkGroup = new Group();
    private final Group routeGroup = new Group();
    private final Group nodeGroup = new Group();
    /** Drawn over the layout by other panes (weak links, improve ghosts: {@link SceneOverlays}). */
    private final Group overlayGroup = new Group();
    private final NodeLabels labels;
    private final SubScene subScene;
    private final Pane host = new Pane();
    private final Map<String, Sphere> spheres = new LinkedHashMap<>();
    private final Map<String, Cylinder> linkShapes = new LinkedHashMap<>();
    private final Map<Integer, PhongMaterial> materials = new HashMap<>();
    private final ObjectProperty<DragPlane> dragPlane = new SimpleObjectProperty<>(DragPlane.XY);
    /** The volume's and nodes' frame (outline thickness, the "Volume" preset). */
    private double extent = 100;
    private Point3D centre = Point3D.ZERO;
    /** The nodes' frame (Fit and the opening view). */
    private double nodesExtent = 100;
    private Point3D nodesCentre = Point3D.ZERO;
    private boolean framingVolume;
    private final SceneControls controls;

    public SceneView(PlannerViewModel vm) {
        this.vm = vm;
        AmbientLight ambient = new AmbientLight(Color.gray(0.5));
        PointLight key = new PointLight(Color.gray(0.75));
        key.getTransforms().add(new Translate(-2e4, -3e4, -2e4));
        world.getChildren().addAll(volumeGroup, linkGroup, routeGroup, nodeGroup, overlayGroup, ambient, key);
        subScene = new SubScene(world, 800, 600, true, SceneAntialiasing.BALANCED);
        subScene.setFill(BACKGROUND);
        subScene.setCamera(orbit.camera());
        subScene.setFocusTraversable(true);
        subScene.widthProperty().bind(host.widthProperty());
        subScene.heightProperty().bind(host.heightProperty());
        labels = new NodeLabels(orbit.camera());
        labels.layer().prefWidthProperty().bind(host.widthProperty());
        labels.layer().prefHeightProperty().bind(host.heightProperty());
        host.getChildren().addAll(subScene, labels.layer());
        orbit.addListener(this::cameraMoved);
        host.widthProperty().addListener((o, a, b) -> cameraMoved());
        host.heightProperty().addListener((o, a, b) -> cameraMoved());
        labels.shownProperty().addListener((o, a, b) -> placeLabels());
        host.setMinSize(200, 150);
        host.getStyleClass().add("scene-host");
        host.widthProperty().addListener((o, a, b) -> refitIfUntouched());
        host.heightProperty().addListener((o, a, b) -> refitIfUntouched());
        controls = new SceneControls(this, vm, orbit, subScene);
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

    /** A group other panes draw into, over the layout (cleared by them, never by the view). */
    Group overlay() {
        return overlayGroup;
    }

    /** The radius of a plain link's tube, µm: 0.3 % of the nodes' frame. */
    double linkRadius() {
        return nodesExtent * 0.003;
    }

    /** The volume outline (for tests). */
    Group volumeGroup() {
        return volumeGroup;
    }

    public OrbitCamera camera() {
        return orbit;
    }

    /** Whether node ids are drawn beside the nodes (decluttered). */
    public BooleanProperty showLabelsProperty() {
        return labels.shownProperty();
    }

    /** The id labels now shown, by node id (for tests). */
    Map<String, Label> visibleLabels() {
        return labels.visible();
    }

    public ObjectProperty<DragPlane> dragPlaneProperty() {
        return dragPlane;
    }

    /** One sphere per node of the layout, by node id (read-only view for tests). */
    public Map<String, Sphere> spheres() {
        return Collections.unmodifiableMap(spheres);
    }

    /** One cylinder per drawn link, by "from→to" (read-only view for tests). */
    public Map<String, Cylinder> linkShapes() {
        return Collections.unmodifiableMap(linkShapes);
    }

    private void refitIfUntouched() {
        if (!controls.userMovedCamera()) {
            if (framingVolume) {
                frameVolume();
            } else {
                fit();
            }
        }
    }

    /** Looks at the nodes (their bounding box with a margin) from the current direction. */
    public void fit() {
        framingVolume = false;
        orbit.fit(nodesCentre, nodesExtent, aspect());
    }

    private void frameVolume() {
        framingVolume = true;
        orbit.fit(centre, extent, aspect());
    }

    private double aspect() {
        return subScene.getWidth() / Math.max(1, subScene.getHeight());
    }

    /** Turns the camera to a preset direction and fits the nodes; VOLUME frames the whole volume in perspective. */
    public void preset(Preset p) {
        switch (p) {
            case FRONT -> orbit.orient(0, 0);
            case SIDE -> orbit.orient(-90, 0);
            case TOP -> orbit.orient(0, -90);
            default -> orbit.orient(-30, -28);
        }
        if (p == Preset.VOLUME) {
            frameVolume();
        } else {
            fit();
        }
    }

    // ------------------------------------------------------------------ size on screen and labels

    private void placeLabels() {
        labels.place(spheres);
    }

    private void cameraMoved() {
        resizeSpheres();
        placeLabels();
    }

    /**
     * Draws every node at least {@link #MIN_NODE_DIAMETER_PX} across at the target's depth: a body
     * smaller than that on screen is scaled up with the camera distance, a larger one keeps its size.
     */
    private void resizeSpheres() {
        Scenario s = vm.scenarioProperty().get();
        if (s == null) {
            return;
        }
        double minR = MIN_NODE_DIAMETER_PX / 2 * orbit.worldPerPixel(subScene.getHeight());
        for (Node n : s.nodes()) {
            Sphere sp = spheres.get(n.id());
            if (sp != null) {
                sp.setRadius(Math.max(n.radiusUm(), minR));
            }
        }
    }

    private static Point3D fx(Vec3 v) {
        return Shapes3D.fx(v);
    }

    private static Vec3 layout(Point3D p) {
        return Shapes3D.layout(p);
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
        placeLabels();
        return true;
    }

    /** Rebuilds the node spheres and the volume outline from the layout. */
    void rebuild() {
        rebuildNodesAndVolume();
    }

    private void rebuildNodesAndVolume() {
        Scenario s = vm.scenarioProperty().get();
        volumeGroup.getChildren().clear();
        nodeGroup.getChildren().clear();
        spheres.clear();
        labels.rebuild(List.of());
        if (s == null) {
            return;
        }
        measure(s);
        PhongMaterial outline = new PhongMaterial(OUTLINE);
        volumeGroup.getChildren().addAll(Shapes3D.outline(s.volume(), layout(nodesCentre), nodesExtent, outline));
        for (Node n : s.nodes()) {
            Sphere sp = new Sphere(n.radiusUm(), 24);
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
            sp.setOnMousePressed(e -> controls.onNodePressed(e, n));
            sp.setOnMouseDragged(e -> controls.onNodeDragged(e, n, sp));
            sp.setOnMouseReleased(e -> controls.onNodeReleased(e, n, sp));
            spheres.put(n.id(), sp);
            nodeGroup.getChildren().add(sp);
        }
        labels.rebuild(s.nodes().stream().map(Node::id).toList());
        halo = null;
        resizeSpheres();
        updateHalo();
        Platform.runLater(this::placeLabels);
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
        halo.radiusProperty().bind(sp.radiusProperty().multiply(1.8));
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
            Platform.runLater(() -> {
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
        double r = linkRadius();
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
            Color c = CapacityColours.of(l.mutualInformationBits(), max);
            Cylinder cyl = Shapes3D.segment(a.positionUm(), b.positionUm(), radius, material(c));
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
                Cylinder halo = Shapes3D.segment(a.positionUm(), b.positionUm(), radius * 1.9,
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

    private void measure(Scenario s) {
        LayoutGeometry.Frame f = LayoutGeometry.frame(s.volume(), s.nodes());
        centre = fx(f.centreUm());
        extent = f.extentUm();
        LayoutGeometry.Frame n = LayoutGeometry.nodesFrame(s.volume(), s.nodes());
        nodesCentre = fx(n.centreUm());
        nodesExtent = n.extentUm();
    }

}
