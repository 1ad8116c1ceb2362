package dev.nanoplan.desktop;

import dev.nanoplan.geometry.Vec3;
import dev.nanoplan.geometry.Volume;
import java.util.ArrayList;
import java.util.List;
import javafx.geometry.Point3D;
import javafx.scene.paint.Color;
import javafx.scene.paint.PhongMaterial;
import javafx.scene.shape.Cylinder;
import javafx.scene.transform.Rotate;

/**
 * 3D shapes of the view in layout coordinates: the axis swap between the layout (z up) and
 * JavaFX (y down), a cylinder between two points, and the outline of a volume.
 */
final class Shapes3D {

    private Shapes3D() {
    }

    /** Layout (x, y, z up) to JavaFX 3D (x, y down, z into the screen). */
    static Point3D fx(Vec3 v) {
        return new Point3D(v.x(), -v.z(), v.y());
    }

    /** JavaFX 3D back to layout coordinates. */
    static Vec3 layout(Point3D p) {
        return new Vec3(p.getX(), p.getZ(), -p.getY());
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

    /**
     * The outline of {@code v}: a box's 12 edges, a cylinder's end and middle rings with 8 lines
     * along it, or for an open medium three axes of half the extent through the centre.
     *
     * @param centreUm the layout's frame centre
     * @param extentUm the layout's frame half-diagonal; lines are 0.25 % of it thick
     */
    static List<Cylinder> outline(Volume v, Vec3 centreUm, double extentUm, PhongMaterial outline) {
        List<Cylinder> out = new ArrayList<>();
        double line = extentUm * 0.0025;
        if (v instanceof Volume.Box b) {
            Vec3 lo = b.minUm();
            Vec3 hi = b.maxUm();
            double[] xs = {lo.x(), hi.x()};
            double[] ys = {lo.y(), hi.y()};
            double[] zs = {lo.z(), hi.z()};
            for (double y : ys) {
                for (double z : zs) {
                    out.add(segment(new Vec3(lo.x(), y, z), new Vec3(hi.x(), y, z), line, outline));
                }
            }
            for (double x : xs) {
                for (double z : zs) {
                    out.add(segment(new Vec3(x, lo.y(), z), new Vec3(x, hi.y(), z), line, outline));
                }
            }
            for (double x : xs) {
                for (double y : ys) {
                    out.add(segment(new Vec3(x, y, lo.z()), new Vec3(x, y, hi.z()), line, outline));
                }
            }
        } else if (v instanceof Volume.Cylinder c) {
            int n = 64;
            double r = c.radiusUm();
            for (double x : new double[] {0, c.lengthUm() / 2, c.lengthUm()}) {
                for (int i = 0; i < n; i++) {
                    double a0 = 2 * Math.PI * i / n;
                    double a1 = 2 * Math.PI * (i + 1) / n;
                    out.add(segment(new Vec3(x, r * Math.cos(a0), r * Math.sin(a0)),
                            new Vec3(x, r * Math.cos(a1), r * Math.sin(a1)), x == c.lengthUm() / 2 ? line / 2 : line,
                            outline));
                }
            }
            for (int i = 0; i < 8; i++) {
                double a = 2 * Math.PI * i / 8;
                out.add(segment(new Vec3(0, r * Math.cos(a), r * Math.sin(a)),
                        new Vec3(c.lengthUm(), r * Math.cos(a), r * Math.sin(a)), line / 2, outline));
            }
        } else {
            // open medium: three axes through the layout's centre, a tenth of the extent long
            Vec3 o = centreUm;
            double l = extentUm * 0.5;
            out.addAll(List.of(
                    segment(o, new Vec3(o.x() + l, o.y(), o.z()), line, new PhongMaterial(Color.web("#c0504d"))),
                    segment(o, new Vec3(o.x(), o.y() + l, o.z()), line, new PhongMaterial(Color.web("#4f9d5d"))),
                    segment(o, new Vec3(o.x(), o.y(), o.z() + l), line, new PhongMaterial(Color.web("#4f7dc0")))));
        }
        return out;
    }
}
