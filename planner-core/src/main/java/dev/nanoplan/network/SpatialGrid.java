package dev.nanoplan.network;

import dev.nanoplan.geometry.Vec3;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.function.IntConsumer;

/**
 * Uniform grid over points (a cell list, e.g. M. P. Allen and D. J. Tildesley, <i>Computer
 * Simulation of Liquids</i>, 1987, §5.3.2) for fixed-radius neighbour queries.
 *
 * <p>Building costs O(n); a query of radius ρ visits the cells overlapping the cube of side 2ρ
 * around the centre, so with cell size c and roughly uniform density it costs
 * O((2ρ/c + 1)³ + points found). Cells are kept in a hash map, so empty space costs nothing.
 */
public final class SpatialGrid {

    private final double cellUm;
    private final Vec3[] points;
    private final Map<Long, List<Integer>> cells = new HashMap<>();

    /**
     * @param pointsUm positions in µm
     * @param cellUm   cell edge in µm, finite and &gt; 0
     */
    public SpatialGrid(List<Vec3> pointsUm, double cellUm) {
        if (!(cellUm > 0) || Double.isInfinite(cellUm)) {
            throw new IllegalArgumentException("cellUm: must be finite and > 0, got " + cellUm);
        }
        this.cellUm = cellUm;
        this.points = pointsUm.toArray(new Vec3[0]);
        for (int i = 0; i < points.length; i++) {
            cells.computeIfAbsent(key(cell(points[i].x()), cell(points[i].y()), cell(points[i].z())),
                    k -> new ArrayList<>(4)).add(i);
        }
    }

    private long cell(double v) {
        return (long) Math.floor(v / cellUm);
    }

    private static long key(long i, long j, long k) {
        return ((i & 0x1FFFFF) << 42) | ((j & 0x1FFFFF) << 21) | (k & 0x1FFFFF);
    }

    /**
     * Calls {@code action} with the index of every point within {@code radiusUm} of {@code centreUm}
     * (distance ≤ radius), in no particular order.
     */
    public void forEachWithin(Vec3 centreUm, double radiusUm, IntConsumer action) {
        long cells1D = (long) Math.ceil(2 * radiusUm / cellUm) + 1;
        if (cells1D * cells1D * cells1D > 4L * points.length + 64) {
            // the query covers more cells than there are points: scan everything
            for (int i = 0; i < points.length; i++) {
                if (points[i].distance(centreUm) <= radiusUm) {
                    action.accept(i);
                }
            }
            return;
        }
        long x0 = cell(centreUm.x() - radiusUm);
        long x1 = cell(centreUm.x() + radiusUm);
        long y0 = cell(centreUm.y() - radiusUm);
        long y1 = cell(centreUm.y() + radiusUm);
        long z0 = cell(centreUm.z() - radiusUm);
        long z1 = cell(centreUm.z() + radiusUm);
        for (long i = x0; i <= x1; i++) {
            for (long j = y0; j <= y1; j++) {
                for (long k = z0; k <= z1; k++) {
                    List<Integer> list = cells.get(key(i, j, k));
                    if (list == null) {
                        continue;
                    }
                    for (int idx : list) {
                        if (points[idx].distance(centreUm) <= radiusUm) {
                            action.accept(idx);
                        }
                    }
                }
            }
        }
    }
}
