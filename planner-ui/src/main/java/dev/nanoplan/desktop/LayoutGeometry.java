package dev.nanoplan.desktop;

import dev.nanoplan.geometry.Vec3;
import dev.nanoplan.geometry.Volume;
import dev.nanoplan.scenario.Node;
import java.util.ArrayList;
import java.util.List;

/**
 * Geometry the desktop needs around a layout, in layout coordinates (µm): where a new node goes,
 * the places tried around it, and the frame (centre and half-diagonal) the 3D view looks at.
 * Plain arithmetic on {@link Vec3}; no JavaFX.
 */
final class LayoutGeometry {

    /** The frame of a layout: the centre of its bounding box and half the box's diagonal (≥ 1 µm). */
    record Frame(Vec3 centreUm, double extentUm) {
    }

    /** The 26 unit directions to the neighbours of a cell in a 3 × 3 × 3 grid, after {@link Vec3#ZERO}. */
    private static final List<Vec3> DIRECTIONS = directions();

    /** Margin around the nodes' box, as a fraction of its half-diagonal. */
    static final double NODES_MARGIN = 0.15;

    private LayoutGeometry() {
    }

    /**
     * Where a new node is put first: the centre of a box, the middle of a cylinder's axis (which
     * runs along +x from 0), or the mean of the node centres in an open medium (the origin when
     * there are no nodes).
     */
    static Vec3 centre(Volume v, List<Node> nodes) {
        if (v instanceof Volume.Box b) {
            return new Vec3((b.minUm().x() + b.maxUm().x()) / 2, (b.minUm().y() + b.maxUm().y()) / 2,
                    (b.minUm().z() + b.maxUm().z()) / 2);
        }
        if (v instanceof Volume.Cylinder c) {
            return new Vec3(c.lengthUm() / 2, 0, 0);
        }
        double x = 0;
        double y = 0;
        double z = 0;
        for (Node n : nodes) {
            x += n.positionUm().x();
            y += n.positionUm().y();
            z += n.positionUm().z();
        }
        int k = Math.max(1, nodes.size());
        return new Vec3(x / k, y / k, z / k);
    }

    /**
     * Candidate places around {@code aroundUm}, nearest ring first: the point itself, then for
     * ring r = 1 … rings − 1 the 26 points at distance r × stepUm along the grid directions.
     */
    static List<Vec3> candidates(Vec3 aroundUm, double stepUm, int rings) {
        List<Vec3> out = new ArrayList<>();
        out.add(aroundUm);
        for (int ring = 1; ring < rings; ring++) {
            for (int k = 1; k < DIRECTIONS.size(); k++) {
                Vec3 dir = DIRECTIONS.get(k);
                out.add(new Vec3(aroundUm.x() + dir.x() * stepUm * ring, aroundUm.y() + dir.y() * stepUm * ring,
                        aroundUm.z() + dir.z() * stepUm * ring));
            }
        }
        return out;
    }

    /**
     * The frame the 3D view opens on and "Fit" returns to: the bounding box of the nodes' spheres
     * grown by {@link #NODES_MARGIN} on every side (at least 1 µm), whatever the volume around them.
     */
    static Frame nodesFrame(Volume v, List<Node> nodes) {
        if (nodes.isEmpty()) {
            return frame(v, nodes);
        }
        Frame f = frame(new Volume.Open(), nodes);
        return new Frame(f.centreUm(), f.extentUm() * (1 + NODES_MARGIN));
    }

    /**
     * The frame of the volume (box corners, or the cylinder's bounding box) and of every node's
     * sphere together; an open medium is framed by its nodes alone. The "Volume" preset looks at it.
     */
    static Frame frame(Volume v, List<Node> nodes) {
        double[] lo = {Double.MAX_VALUE, Double.MAX_VALUE, Double.MAX_VALUE};
        double[] hi = {-Double.MAX_VALUE, -Double.MAX_VALUE, -Double.MAX_VALUE};
        List<Vec3> points = new ArrayList<>();
        if (v instanceof Volume.Box b) {
            points.add(b.minUm());
            points.add(b.maxUm());
        } else if (v instanceof Volume.Cylinder c) {
            points.add(new Vec3(0, -c.radiusUm(), -c.radiusUm()));
            points.add(new Vec3(c.lengthUm(), c.radiusUm(), c.radiusUm()));
        }
        for (Node n : nodes) {
            Vec3 p = n.positionUm();
            double r = n.radiusUm();
            points.add(new Vec3(p.x() - r, p.y() - r, p.z() - r));
            points.add(new Vec3(p.x() + r, p.y() + r, p.z() + r));
        }
        for (Vec3 p : points) {
            double[] a = p.toArray();
            for (int i = 0; i < 3; i++) {
                lo[i] = Math.min(lo[i], a[i]);
                hi[i] = Math.max(hi[i], a[i]);
            }
        }
        Vec3 c = new Vec3((lo[0] + hi[0]) / 2, (lo[1] + hi[1]) / 2, (lo[2] + hi[2]) / 2);
        double extent = Math.max(1, Math.sqrt(Math.pow(hi[0] - lo[0], 2) + Math.pow(hi[1] - lo[1], 2)
                + Math.pow(hi[2] - lo[2], 2)) / 2);
        return new Frame(c, extent);
    }

    private static List<Vec3> directions() {
        List<Vec3> d = new ArrayList<>();
        d.add(Vec3.ZERO);
        for (int x = -1; x <= 1; x++) {
            for (int y = -1; y <= 1; y++) {
                for (int z = -1; z <= 1; z++) {
                    if (x != 0 || y != 0 || z != 0) {
                        double n = Math.sqrt(x * x + y * y + z * z);
                        d.add(new Vec3(x / n, y / n, z / n));
                    }
                }
            }
        }
        return List.copyOf(d);
    }
}
