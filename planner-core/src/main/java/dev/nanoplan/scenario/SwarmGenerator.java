package dev.nanoplan.scenario;

import dev.nanoplan.geometry.Vec3;
import dev.nanoplan.geometry.Volume;
import java.util.ArrayList;
import java.util.List;
import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.simple.RandomSource;

/**
 * Generates large random but valid layouts for scale tests and demos (invented data).
 *
 * <p>Nodes sit one per cell of a cubic lattice of pitch {@value #PITCH_UM} µm, jittered inside
 * their cell so that no two bodies can overlap and every body stays inside the box; the box is the
 * smallest lattice cube with at least n cells, so the density stays near one machine per
 * (30 µm)³ ≈ 3.7·10⁴ per mm³ whatever n is. Node 0 is the gateway {@code gw} (receiver of species
 * B, near the centre); node 1 is a relay (A → B); node 2 a transmitter; the rest are drawn with
 * probabilities 0.70 transmitter (A, 20 % of them B), 0.10 relay (A → B), 0.20 receiver (A or B).
 * Species A: D = 120 µm²/s, stable; species B: D = 300 µm²/s, half-life 60 s. Every transmitter
 * has a demand to {@code gw}. Symbol time 1 s, other settings at their defaults.
 *
 * <p>Deterministic for a given (n, seed) (XO_RO_SHI_RO_128_PP); O(n) time and memory.
 */
public final class SwarmGenerator {

    /** Lattice pitch in µm. */
    static final double PITCH_UM = 30.0;
    /** Largest body radius in µm (the gateway). */
    static final double MAX_RADIUS_UM = 8.0;

    private SwarmGenerator() {
    }

    /**
     * A random valid layout.
     *
     * @param nodes number of nodes, ≥ 3 (so both species and every role appear)
     * @param seed random seed
     * @return a validated scenario with {@code nodes} nodes
     * @throws IllegalArgumentException if {@code nodes < 3} or {@code nodes > 10_000_000}
     */
    public static Scenario generate(int nodes, long seed) {
        if (nodes < 3 || nodes > 10_000_000) {
            throw new IllegalArgumentException("nodes must be in 3..10000000, got " + nodes);
        }
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(seed);
        int k = (int) Math.ceil(Math.cbrt(nodes) - 1e-9);
        while ((long) k * k * k < nodes) {
            k++;
        }
        int cells = k * k * k;
        int[] order = new int[cells];
        for (int i = 0; i < cells; i++) {
            order[i] = i;
        }
        // Gateway takes the central cell; the others a random subset (partial Fisher–Yates).
        int centre = (k / 2) * k * k + (k / 2) * k + k / 2;
        swap(order, 0, centre);
        for (int i = 1; i < nodes; i++) {
            swap(order, i, i + rng.nextInt(cells - i));
        }

        List<Node> list = new ArrayList<>(nodes);
        List<Demand> demands = new ArrayList<>();
        for (int i = 0; i < nodes; i++) {
            int cell = order[i];
            int cx = cell / (k * k);
            int cy = (cell / k) % k;
            int cz = cell % k;
            double u = rng.nextDouble();
            Role role = i == 0 ? Role.RECEIVER : i == 1 ? Role.RELAY : i == 2 ? Role.TRANSMITTER
                    : u < 0.70 ? Role.TRANSMITTER : u < 0.80 ? Role.RELAY : Role.RECEIVER;
            double radius = i == 0 ? MAX_RADIUS_UM
                    : role == Role.TRANSMITTER ? round(1 + 2 * rng.nextDouble())
                    : role == Role.RELAY ? round(4 + 2 * rng.nextDouble())
                    : round(3 + 5 * rng.nextDouble());
            Vec3 pos = new Vec3(jitter(cx, radius, rng), jitter(cy, radius, rng), jitter(cz, radius, rng));
            String id = i == 0 ? "gw" : role.id().charAt(0) + Integer.toString(i);
            Node n;
            if (role == Role.TRANSMITTER) {
                String sp = i != 2 && rng.nextDouble() < 0.2 ? "B" : "A";
                long molecules = Math.round(Math.pow(10, 3 + 2 * rng.nextDouble()));
                n = Node.transmitter(id, pos, radius, sp, molecules);
                demands.add(new Demand(id, "gw"));
            } else if (role == Role.RELAY) {
                n = Node.relay(id, pos, radius, "A", "B", 5000);
            } else {
                n = Node.receiver(id, pos, radius, i == 0 || rng.nextBoolean() ? "B" : "A");
            }
            list.add(n);
        }
        double side = k * PITCH_UM;
        return new Scenario("swarm of " + nodes + " (seed " + seed + ")",
                new Volume.Box(Vec3.ZERO, new Vec3(side, side, side)), Medium.DEFAULT,
                List.of(Species.stable("A", 120.0), Species.ofDiffusion("B", 300.0, 60.0)),
                Signalling.withSymbolTime(1.0), list, demands, Targets.DEFAULT);
    }

    /** A coordinate inside lattice cell {@code c}, keeping a ball of radius r within the cell. */
    private static double jitter(int c, double radius, UniformRandomProvider rng) {
        double slack = PITCH_UM / 2 - radius - 0.01;
        return round((c + 0.5) * PITCH_UM + slack * (2 * rng.nextDouble() - 1));
    }

    /** Rounds to 0.01 µm so files stay readable. */
    private static double round(double v) {
        return Math.round(v * 100) / 100.0;
    }

    private static void swap(int[] a, int i, int j) {
        int t = a[i];
        a[i] = a[j];
        a[j] = t;
    }
}
