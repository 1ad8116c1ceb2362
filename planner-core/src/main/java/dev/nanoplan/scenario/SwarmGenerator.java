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

    /** Gateway-to-gateway pitch of {@link #designed} in µm. */
    static final double CELL_PITCH_UM = 200.0;
    /** Nodes per full cell of {@link #designed}: gateway, 4 relays with 5 sensors each, 2 sensors at the gateway. */
    static final int CELL_NODES = 1 + 4 * (1 + 5) + 2;

    /**
     * A random layout built the way a device engineer builds one (invented data): cells of a
     * gateway with relays and sensor groups, as in {@code scenarios/culture-tank.json}, repeated on a
     * cubic lattice of cells {@value #CELL_PITCH_UM} µm apart, so that most demands route.
     *
     * <p>Each cell (jittered by up to ±10 µm) holds, in this order: the gateway {@code gwC}
     * (receiver of species B, radius 10 µm) at its centre; four relays {@code rC_j} (A → B, radius
     * 8 µm, 30,000 molecules) 45–55 µm from it along ±x and ±y; five sensors per relay
     * (transmitters of A, radius 2 µm, 3,000–5,000 molecules) 16–24 µm from the relay, one outward
     * and four across (±the other horizontal axis, ±z); two sensors of B 18–24 µm above and below
     * the gateway (1,500–2,500 molecules). Every sensor has a demand to its own cell's gateway; the
     * last cell holds what is left of {@code nodes} in the order above ({@value #CELL_NODES} nodes per
     * full cell). Species A: D = 120 µm²/s, half-life 1 s; B: D = 300 µm²/s, half-life 2 s; symbol
     * time 1 s, background 1 molecule/s, other settings at their defaults. The cell pitch leaves
     * cells coupled only by weak crosstalk (the decaying species reach the next cell at the 10⁻³
     * level); no bodies overlap (closest centres 16 µm for radii 8 + 2).
     *
     * <p>Deterministic for a given (n, seed) (XO_RO_SHI_RO_128_PP); O(n) time and memory.
     *
     * @param nodes number of nodes, ≥ 3
     * @param seed random seed
     * @return a validated scenario with {@code nodes} nodes
     * @throws IllegalArgumentException if {@code nodes < 3} or {@code nodes > 10_000_000}
     */
    public static Scenario designed(int nodes, long seed) {
        if (nodes < 3 || nodes > 10_000_000) {
            throw new IllegalArgumentException("nodes must be in 3..10000000, got " + nodes);
        }
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(seed);
        int cellCount = (nodes + CELL_NODES - 1) / CELL_NODES;
        int k = 1;
        while ((long) k * k * k < cellCount) {
            k++;
        }
        List<Node> list = new ArrayList<>(nodes);
        List<Demand> demands = new ArrayList<>();
        Vec3[] axes = {new Vec3(1, 0, 0), new Vec3(-1, 0, 0), new Vec3(0, 1, 0), new Vec3(0, -1, 0)};
        for (int c = 0; c < cellCount && list.size() < nodes; c++) {
            Vec3 centre = new Vec3(cellCoordinate(c / (k * k), rng), cellCoordinate((c / k) % k, rng),
                    cellCoordinate(c % k, rng));
            String gw = "gw" + c;
            list.add(Node.receiver(gw, centre, 10.0, "B"));
            for (int j = 0; j < axes.length && list.size() < nodes; j++) {
                Vec3 out = axes[j];
                Vec3 across = new Vec3(out.y(), out.x(), 0);
                Vec3 relay = at(centre, out, 45 + 10 * rng.nextDouble());
                list.add(Node.relay("r" + c + "_" + j, relay, 8.0, "A", "B", 30_000));
                Vec3[] dirs = {out, across, new Vec3(-across.x(), -across.y(), 0), new Vec3(0, 0, 1), new Vec3(0, 0, -1)};
                for (int i = 0; i < dirs.length && list.size() < nodes; i++) {
                    String id = "s" + c + "_" + j + "_" + i;
                    list.add(Node.transmitter(id, at(relay, dirs[i], 16 + 8 * rng.nextDouble()), 2.0, "A",
                            Math.round(3000 + 2000 * rng.nextDouble())));
                    demands.add(new Demand(id, gw));
                }
            }
            for (int i = 0; i < 2 && list.size() < nodes; i++) {
                String id = "b" + c + "_" + i;
                list.add(Node.transmitter(id, at(centre, new Vec3(0, 0, i == 0 ? 1 : -1), 18 + 6 * rng.nextDouble()),
                        2.0, "B", Math.round(1500 + 1000 * rng.nextDouble())));
                demands.add(new Demand(id, gw));
            }
        }
        double side = k * CELL_PITCH_UM;
        return new Scenario("designed swarm of " + nodes + " (seed " + seed + ")",
                new Volume.Box(Vec3.ZERO, new Vec3(side, side, side)), new Medium(Medium.DEFAULT_TEMPERATURE_K,
                Medium.DEFAULT_VISCOSITY_MPA_S, Medium.DEFAULT.flow(), 1.0),
                List.of(Species.ofDiffusion("A", 120.0, 1.0), Species.ofDiffusion("B", 300.0, 2.0)),
                Signalling.withSymbolTime(1.0), list, demands, Targets.DEFAULT);
    }

    /** Centre coordinate of cell index {@code c} along one axis, jittered by up to ±10 µm. */
    private static double cellCoordinate(int c, UniformRandomProvider rng) {
        return round((c + 0.5) * CELL_PITCH_UM + 10 * (2 * rng.nextDouble() - 1));
    }

    /** {@code from} moved {@code distanceUm} along the unit vector {@code dir}, rounded to 0.01 µm. */
    private static Vec3 at(Vec3 from, Vec3 dir, double distanceUm) {
        return new Vec3(round(from.x() + dir.x() * distanceUm), round(from.y() + dir.y() * distanceUm),
                round(from.z() + dir.z() * distanceUm));
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
