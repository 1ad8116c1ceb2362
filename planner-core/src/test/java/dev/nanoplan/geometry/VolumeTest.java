package dev.nanoplan.geometry;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import org.junit.jupiter.api.Test;

class VolumeTest {

    @Test
    void boxContainsBallsUpToTouchingTheWalls() {
        Volume.Box box = new Volume.Box(new Vec3(-10, 0, 0), new Vec3(10, 20, 30));
        assertThat(box.containsBall(new Vec3(0, 10, 15), 10)).isTrue();
        assertThat(box.containsBall(new Vec3(0, 10, 15), 10.0001)).isFalse();
        assertThat(box.containsBall(new Vec3(-9, 10, 15), 2)).isFalse();
        assertThat(box.containsBall(new Vec3(0, 10, 29), 1)).isTrue();
    }

    @Test
    void cylinderAxisIsXFromZeroToLength() {
        Volume.Cylinder c = new Volume.Cylinder(10, 100);
        assertThat(c.containsBall(new Vec3(5, 0, 0), 5)).isTrue();
        assertThat(c.containsBall(new Vec3(4, 0, 0), 5)).isFalse();
        assertThat(c.containsBall(new Vec3(95, 0, 0), 5)).isTrue();
        assertThat(c.containsBall(new Vec3(96, 0, 0), 5)).isFalse();
        // 3-4-5 triangle: the ball's farthest point from the axis is at 5 + 5 = 10 = R.
        assertThat(c.containsBall(new Vec3(50, 3, 4), 5)).isTrue();
        assertThat(c.containsBall(new Vec3(50, 3, 4), 5.01)).isFalse();
    }

    @Test
    void openSpaceContainsEverything() {
        assertThat(new Volume.Open().containsBall(new Vec3(1e12, -1e12, 0), 1e6)).isTrue();
    }

    @Test
    void invalidShapesAreRejected() {
        assertThatThrownBy(() -> new Volume.Box(Vec3.ZERO, new Vec3(1, 0, 1)))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("maxUm");
        assertThatThrownBy(() -> new Volume.Cylinder(0, 1)).hasMessageContaining("radiusUm");
        assertThatThrownBy(() -> new Vec3(Double.NaN, 0, 0)).hasMessageContaining("finite");
    }

    @Test
    void distanceIsEuclidean() {
        assertThat(new Vec3(1, 2, 3).distance(new Vec3(4, 6, 15))).isEqualTo(13.0);
    }
}
