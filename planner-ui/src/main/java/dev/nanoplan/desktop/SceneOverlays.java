package dev.nanoplan.desktop;

import dev.nanoplan.geometry.Vec3;
import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.Scenario;
import java.util.Map;
import javafx.collections.ListChangeListener;
import javafx.geometry.Point3D;
import javafx.scene.Group;
import javafx.scene.paint.Color;
import javafx.scene.paint.PhongMaterial;
import javafx.scene.shape.Cylinder;
import javafx.scene.shape.DrawMode;
import javafx.scene.shape.Sphere;

/**
 * What the Tolerance and Improve tabs draw over the 3D view, in {@link SceneView#overlay()}: each weak
 * link of the last tolerance study outlined as a wire tube, thicker for a likelier failure (cleared by
 * the view model when the layout changes), and the ticked changes of an improve proposal as wire ghosts
 * where they would put nodes, with arrows from the nodes' present (old) positions; an added node is a
 * ghost alone. The layout itself changes only on Apply, so the solid sphere marks the old position
 * (a ghost drawn there would hide inside it).
 *
 * <p>Ids for tests: {@code weak-FROM→TO}, {@code ghost-NODE}, {@code arrow-NODE}.
 */
final class SceneOverlays {

    private static final Color WEAK = Color.web("#f2c14e");
    private static final Color GHOST = Color.web("#b8c7d9");
    private static final Color ARROW = Color.web("#4fe3b5");

    private final SceneView scene;
    private final PlannerViewModel planner;
    private final ToleranceViewModel tolerance;
    private final ImproveViewModel improve;
    private final Group weak = new Group();
    private final Group ghosts = new Group();

    SceneOverlays(SceneView scene, PlannerViewModel planner, ToleranceViewModel tolerance, ImproveViewModel improve) {
        this.scene = scene;
        this.planner = planner;
        this.tolerance = tolerance;
        this.improve = improve;
        scene.overlay().getChildren().addAll(weak, ghosts);
        tolerance.weakLinks().addListener((ListChangeListener<ToleranceViewModel.WeakLink>) c -> drawWeakLinks());
        improve.ghosts().addListener((ListChangeListener<ImproveViewModel.Ghost>) c -> drawGhosts());
    }

    /** The outlines of weak links, by id (for tests). */
    Group weakLinks() {
        return weak;
    }

    /** The ghosts and arrows, by id (for tests). */
    Group ghosts() {
        return ghosts;
    }

    private void drawWeakLinks() {
        weak.getChildren().clear();
        Scenario s = planner.scenarioProperty().get();
        if (s == null) {
            return;
        }
        Map<String, Node> nodes = s.nodesById();
        PhongMaterial m = new PhongMaterial(WEAK);
        for (ToleranceViewModel.WeakLink w : tolerance.weakLinks()) {
            Node a = nodes.get(w.from());
            Node b = nodes.get(w.to());
            if (a == null || b == null) {
                continue;
            }
            // 2.5× a plain link's radius for a link that almost always works, up to 8.5× for one that always fails
            double r = scene.linkRadius() * (2.5 + 6 * w.failureProbability());
            Cylinder c = Shapes3D.segment(a.positionUm(), b.positionUm(), r, m);
            c.setDrawMode(DrawMode.LINE);
            c.setMouseTransparent(true);
            c.setId("weak-" + w.from() + "→" + w.to());
            c.setUserData(w);
            weak.getChildren().add(c);
        }
    }

    private void drawGhosts() {
        ghosts.getChildren().clear();
        PhongMaterial ghost = new PhongMaterial(GHOST);
        PhongMaterial arrow = new PhongMaterial(ARROW);
        double shaft = scene.linkRadius() * 1.6;
        for (ImproveViewModel.Ghost g : improve.ghosts()) {
            Sphere drawn = scene.spheres().get(g.node());
            double radius = Math.max(g.radiusUm(), drawn == null ? 0 : drawn.getRadius());
            Vec3 at = g.toUm();
            Sphere sp = new Sphere(Math.max(radius, shaft * 3), 16);
            Point3D p = Shapes3D.fx(at);
            sp.setTranslateX(p.getX());
            sp.setTranslateY(p.getY());
            sp.setTranslateZ(p.getZ());
            sp.setDrawMode(DrawMode.LINE);
            sp.setMaterial(ghost);
            sp.setMouseTransparent(true);
            sp.setId("ghost-" + g.node());
            ghosts.getChildren().add(sp);
            if (g.fromUm() == null || g.fromUm().distance(g.toUm()) == 0) {
                continue;
            }
            Vec3 from = g.fromUm();
            Vec3 to = g.toUm();
            double len = from.distance(to);
            double head = Math.min(0.3 * len, shaft * 10);
            Vec3 neck = point(from, to, 1 - head / len);
            Cylinder body = Shapes3D.segment(from, neck, shaft, arrow);
            body.setId("arrow-" + g.node());
            Cylinder tip = Shapes3D.segment(neck, to, shaft * 3, arrow);
            body.setMouseTransparent(true);
            tip.setMouseTransparent(true);
            ghosts.getChildren().addAll(body, tip);
        }
    }

    private static Vec3 point(Vec3 a, Vec3 b, double t) {
        return new Vec3(a.x() + t * (b.x() - a.x()), a.y() + t * (b.y() - a.y()), a.z() + t * (b.z() - a.z()));
    }
}
