package dev.nanoplan.desktop;

import static org.assertj.core.api.Assertions.assertThat;

import dev.nanoplan.geometry.Vec3;
import dev.nanoplan.geometry.Volume;
import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.ScenarioReader;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import javafx.geometry.Point3D;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * The 3D view's "Fit": the nodes' bounding box, seen by the orbit camera after a fit, lies inside
 * the camera's view frustum and fills a good part of it. Checked with the pinhole projection (R. Hartley
 * and A. Zisserman, "Multiple View Geometry in Computer Vision", 2nd ed., 2003, §6.1: a point at
 * (x, y, z) in camera coordinates is seen when |y| / z ≤ tan(vertical field of view / 2) and
 * |x| / z ≤ aspect · tan(vertical field of view / 2)), independently of how the fit computes its distance.
 */
class SceneFramingTest {

    static final Path TANK = Path.of("..", "scenarios", "culture-tank.json");

    @ParameterizedTest(name = "yaw {0}, pitch {1}, aspect {2}")
    @CsvSource({"-30, -28, 0.77", "-30, -28, 1.6", "0, 0, 0.5", "-90, 0, 1.0", "0, -90, 2.0", "45, 60, 0.3"})
    void theNodesBoxFitsTheFrustumAndFillsItWhenTheViewFitsTheNodes(double yawDeg, double pitchDeg, double aspect)
            throws Exception {
        Scenario s = new ScenarioReader(false).read(TANK);
        LayoutGeometry.Frame f = LayoutGeometry.nodesFrame(s.volume(), s.nodes());
        OrbitCamera orbit = new OrbitCamera();
        orbit.orient(yawDeg, pitchDeg);
        orbit.fit(Shapes3D.fx(f.centreUm()), f.extentUm(), aspect);

        double tanV = Math.tan(Math.toRadians(OrbitCamera.FIELD_OF_VIEW_DEG / 2));
        double tanH = tanV * aspect;
        double largestFraction = 0;
        for (Vec3 corner : corners(s.nodes())) {
            Point3D c = orbit.camera().sceneToLocal(Shapes3D.fx(corner));
            // Hartley and Zisserman §6.1: in front of the camera and inside both half-angles
            assertThat(c.getZ()).isPositive();
            assertThat(Math.abs(c.getX()) / c.getZ()).isLessThanOrEqualTo(tanH);
            assertThat(Math.abs(c.getY()) / c.getZ()).isLessThanOrEqualTo(tanV);
            largestFraction = Math.max(largestFraction,
                    Math.max(Math.abs(c.getX()) / c.getZ() / tanH, Math.abs(c.getY()) / c.getZ() / tanV));
        }
        // the nodes are framed, not the 1000 µm tank around them: some corner reaches a third of the way to the edge
        assertThat(largestFraction).isGreaterThan(0.33);
    }

    @ParameterizedTest(name = "aspect {0}")
    @CsvSource({"0.77", "1.6"})
    void theVolumePresetFramesTheWholeTank(double aspect) throws Exception {
        Scenario s = new ScenarioReader(false).read(TANK);
        LayoutGeometry.Frame nodes = LayoutGeometry.nodesFrame(s.volume(), s.nodes());
        LayoutGeometry.Frame all = LayoutGeometry.frame(s.volume(), s.nodes());
        // from the tank file: the box is much larger than the cluster of nodes, so the two frames differ
        assertThat(all.extentUm()).isGreaterThan(2 * nodes.extentUm());
        OrbitCamera orbit = new OrbitCamera();
        orbit.orient(-30, -28);
        orbit.fit(Shapes3D.fx(all.centreUm()), all.extentUm(), aspect);
        double tanV = Math.tan(Math.toRadians(OrbitCamera.FIELD_OF_VIEW_DEG / 2));
        Volume.Box box = (Volume.Box) s.volume();
        for (Vec3 corner : boxCorners(box.minUm(), box.maxUm())) {
            Point3D c = orbit.camera().sceneToLocal(Shapes3D.fx(corner));
            // Hartley and Zisserman §6.1
            assertThat(c.getZ()).isPositive();
            assertThat(Math.abs(c.getX()) / c.getZ()).isLessThanOrEqualTo(tanV * aspect);
            assertThat(Math.abs(c.getY()) / c.getZ()).isLessThanOrEqualTo(tanV);
        }
    }

    /** The 8 corners of the box around every node's sphere. */
    private static List<Vec3> corners(List<Node> nodes) {
        double[] lo = {Double.MAX_VALUE, Double.MAX_VALUE, Double.MAX_VALUE};
        double[] hi = {-Double.MAX_VALUE, -Double.MAX_VALUE, -Double.MAX_VALUE};
        for (Node n : nodes) {
            double[] p = n.positionUm().toArray();
            for (int i = 0; i < 3; i++) {
                lo[i] = Math.min(lo[i], p[i] - n.radiusUm());
                hi[i] = Math.max(hi[i], p[i] + n.radiusUm());
            }
        }
        return boxCorners(new Vec3(lo[0], lo[1], lo[2]), new Vec3(hi[0], hi[1], hi[2]));
    }

    private static List<Vec3> boxCorners(Vec3 lo, Vec3 hi) {
        List<Vec3> out = new ArrayList<>();
        for (double x : new double[] {lo.x(), hi.x()}) {
            for (double y : new double[] {lo.y(), hi.y()}) {
                for (double z : new double[] {lo.z(), hi.z()}) {
                    out.add(new Vec3(x, y, z));
                }
            }
        }
        return out;
    }
}
