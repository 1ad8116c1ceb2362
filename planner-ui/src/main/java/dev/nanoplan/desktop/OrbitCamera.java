package dev.nanoplan.desktop;

import javafx.beans.InvalidationListener;
import javafx.geometry.Point3D;
import javafx.scene.PerspectiveCamera;
import javafx.scene.transform.Rotate;
import javafx.scene.transform.Translate;

/**
 * A camera that orbits a target point: yaw about the vertical, pitch about the camera's right
 * axis, at a distance. World coordinates are JavaFX's (y down); the scene maps the layout's z
 * axis to −y so "up" on screen is +z of the layout.
 */
public final class OrbitCamera {

    /** Vertical field of view in degrees. */
    public static final double FIELD_OF_VIEW_DEG = 35;

    private final PerspectiveCamera camera = new PerspectiveCamera(true);
    private final Translate target = new Translate();
    private final Rotate yaw = new Rotate(0, Rotate.Y_AXIS);
    private final Rotate pitch = new Rotate(0, Rotate.X_AXIS);
    private final Translate back = new Translate(0, 0, -1000);

    public OrbitCamera() {
        camera.setFieldOfView(FIELD_OF_VIEW_DEG);
        camera.setNearClip(0.5);
        camera.setFarClip(1e6);
        camera.getTransforms().addAll(target, yaw, pitch, back);
    }

    /** Calls {@code onChange} whenever the target, the orientation or the distance changes. */
    public void addListener(Runnable onChange) {
        InvalidationListener l = o -> onChange.run();
        target.xProperty().addListener(l);
        target.yProperty().addListener(l);
        target.zProperty().addListener(l);
        yaw.angleProperty().addListener(l);
        pitch.angleProperty().addListener(l);
        back.zProperty().addListener(l);
    }

    public PerspectiveCamera camera() {
        return camera;
    }

    /** Sets the orientation in degrees: yaw about the vertical, pitch (negative looks down). */
    public void orient(double yawDeg, double pitchDeg) {
        yaw.setAngle(yawDeg);
        pitch.setAngle(Math.max(-90, Math.min(90, pitchDeg)));
    }

    /** Turns by the given angles in degrees. */
    public void orbit(double dYawDeg, double dPitchDeg) {
        orient(yaw.getAngle() + dYawDeg, pitch.getAngle() + dPitchDeg);
    }

    /** Multiplies the distance by {@code factor} (less than 1 zooms in). */
    public void zoom(double factor) {
        back.setZ(Math.max(-5e5, Math.min(-1, back.getZ() * factor)));
    }

    /** Moves the target by screen-space amounts in pixels, for a viewport {@code heightPx} high. */
    public void pan(double dxPx, double dyPx, double heightPx) {
        double s = worldPerPixel(heightPx);
        Point3D r = right();
        Point3D u = up();
        target.setX(target.getX() - (r.getX() * dxPx + u.getX() * dyPx) * s);
        target.setY(target.getY() - (r.getY() * dxPx + u.getY() * dyPx) * s);
        target.setZ(target.getZ() - (r.getZ() * dxPx + u.getZ() * dyPx) * s);
    }

    /**
     * Looks at {@code centre} from far enough to see a sphere of radius {@code extent} in a
     * viewport of the given width/height ratio (the field of view is vertical, so a narrow
     * viewport needs more distance).
     */
    public void fit(Point3D centre, double extent, double aspect) {
        target.setX(centre.getX());
        target.setY(centre.getY());
        target.setZ(centre.getZ());
        double halfV = Math.toRadians(FIELD_OF_VIEW_DEG / 2);
        double a = aspect > 0 && Double.isFinite(aspect) ? aspect : 1;
        double half = Math.min(halfV, Math.atan(Math.tan(halfV) * a));
        back.setZ(-Math.max(1, extent / Math.sin(half) * 1.05));
    }

    /** World units per screen pixel at the target's depth. */
    public double worldPerPixel(double heightPx) {
        return 2 * -back.getZ() * Math.tan(Math.toRadians(FIELD_OF_VIEW_DEG / 2)) / Math.max(1, heightPx);
    }

    /** Camera's right direction in world coordinates. */
    public Point3D right() {
        return camera.localToScene(1, 0, 0).subtract(camera.localToScene(0, 0, 0)).normalize();
    }

    /** Camera's down direction on screen (JavaFX y), in world coordinates. */
    public Point3D up() {
        return camera.localToScene(0, 1, 0).subtract(camera.localToScene(0, 0, 0)).normalize();
    }

    public double yawDeg() {
        return yaw.getAngle();
    }

    public double pitchDeg() {
        return pitch.getAngle();
    }

    public double distance() {
        return -back.getZ();
    }
}
