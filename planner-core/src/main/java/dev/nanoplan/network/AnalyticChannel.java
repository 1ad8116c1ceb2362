package dev.nanoplan.network;

import dev.nanoplan.geometry.Vec3;
import dev.nanoplan.geometry.Volume;
import dev.nanoplan.physics.DecayingSphereHitting;
import dev.nanoplan.physics.HittingModel;
import dev.nanoplan.physics.OpenSphereHitting;
import dev.nanoplan.physics.PassiveSphereObservation;
import dev.nanoplan.physics.ReactiveSphereHitting;
import dev.nanoplan.physics.TapModel;
import dev.nanoplan.scenario.Flow;
import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.ReceiverModel;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.Species;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashMap;
import java.util.HashSet;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;
import java.util.concurrent.atomic.AtomicInteger;
import java.util.function.DoubleConsumer;
import java.util.stream.IntStream;
import org.apache.commons.numbers.gamma.Erfc;

/**
 * Builds a {@link ChannelMatrix} from the open-medium closed forms (docs/architecture.md §5.1–5.3): for each
 * emitter → receiver pair sharing a species, the hitting model of an absorbing sphere of the
 * receiver's radius r at centre distance d, with the species' D and half-life
 * ({@link OpenSphereHitting}, {@link DecayingSphereHitting}), sampled into taps p_0..p_L; a receiver
 * whose scenario model is reactive uses the Collins–Kimball sphere ({@link ReactiveSphereHitting}), a
 * passive one the probability of being inside at the sampling instants ({@link PassiveSphereObservation}).
 *
 * <p><b>Self pairs.</b> A relay that emits the species it senses does not count its own releases
 * (it knows what it sent): that pair is skipped, but its releases reach every other receiver.
 *
 * <p><b>Spatial cutoff.</b> A pair is skipped when N·F((L+1)T) &lt; {@code cutoffMolecules}, where
 * N is the emitter's molecules per "1" and F((L+1)T) = Σ_k p_k the fraction of one release counted
 * within the memory; N·F((L+1)T) bounds the pair's mean count per slot from above (all-active
 * schedule: at most one release of N per slot, each counted over L+1 slots), and is itself at most
 * N·r/d (for a passive receiver, whose taps may each reach F((L+1)T), at most (L+1)·N·r/d: a molecule
 * inside the sphere at t has reached it by t). Candidates come from a {@link SpatialGrid}: per species, the radius beyond which even the
 * largest emitter and receiver stay below the cutoff, N_max·(r_max/d)·erfc((d − r_max)/√(4D(L+1)T))
 * &lt; cutoff, is found by bisection, so a layout of n nodes costs O(n·neighbours), not O(n²).
 *
 * <p><b>Model caveats.</b> The closed forms ignore walls and flow: a pair is marked "walls" when
 * the emitter or the receiver lies within √(4DT(L+1)) (the diffusion length over the memory) of a
 * wall of a box or cylinder, "flow" when the medium flows (non-zero velocity), "walls+flow" for
 * both.
 */
public final class AnalyticChannel {

    private AnalyticChannel() {
    }

    /** Builds the analytic channel of a scenario; see the class comment for the cutoff. */
    public static ChannelMatrix build(Scenario scenario, double cutoffMolecules) {
        return build(scenario, cutoffMolecules, f -> { });
    }

    /**
     * Builds the analytic channel, reporting the fraction of receivers done to {@code progress}
     * (called from worker threads, values in [0, 1], not necessarily increasing between threads).
     *
     * @param cutoffMolecules pairs with N·F((L+1)T) below this are skipped; ≥ 0 (0 keeps every pair
     *                        with a non-zero tap)
     */
    public static ChannelMatrix build(Scenario scenario, double cutoffMolecules, DoubleConsumer progress) {
        if (!(cutoffMolecules >= 0) || Double.isInfinite(cutoffMolecules)) {
            throw new IllegalArgumentException("cutoffMolecules: must be finite and >= 0, got " + cutoffMolecules);
        }
        double symbolTimeS = scenario.signalling().symbolTimeS();
        int memory = scenario.signalling().isiMemorySymbols();
        double horizonS = symbolTimeS * (memory + 1);
        Map<String, Species> species = scenario.speciesByName();
        List<Node> nodes = scenario.nodes();
        boolean flows = flows(scenario.medium().flow());

        Map<String, List<Integer>> emittersBySpecies = new HashMap<>();
        for (int i = 0; i < nodes.size(); i++) {
            Node n = nodes.get(i);
            if (n.role().emits()) {
                emittersBySpecies.computeIfAbsent(n.emitsSpecies(), k -> new ArrayList<>()).add(i);
            }
        }
        double maxRadius = 0;
        Set<String> passiveSpecies = new HashSet<>();
        for (Node n : nodes) {
            if (n.role().absorbs()) {
                maxRadius = Math.max(maxRadius, n.radiusUm());
                if (!n.absorbs()) {
                    passiveSpecies.add(n.species());
                }
            }
        }
        Map<String, SpatialGrid> grids = new HashMap<>();
        Map<String, Double> reach = new HashMap<>();
        List<String> notes = new ArrayList<>();
        for (Map.Entry<String, List<Integer>> e : emittersBySpecies.entrySet()) {
            long maxN = 0;
            List<Vec3> pts = new ArrayList<>();
            for (int i : e.getValue()) {
                maxN = Math.max(maxN, nodes.get(i).moleculesPerSymbol());
                pts.add(nodes.get(i).positionUm());
            }
            double diff = species.get(e.getKey()).diffusionUm2PerS();
            long slots = passiveSpecies.contains(e.getKey()) ? memory + 1L : 1L;
            double rho = reachUm(maxN * slots, maxRadius, diff, horizonS, cutoffMolecules);
            reach.put(e.getKey(), rho);
            double cell = Double.isFinite(rho) ? Math.max(rho / 2, 1.0) : 1e6;
            grids.put(e.getKey(), new SpatialGrid(pts, cell));
            notes.add(String.format(Locale.ROOT, "species %s: pairs farther than %.1f µm (or below %.3g molecules "
                    + "over the memory) are treated as silent", e.getKey(), rho, cutoffMolecules));
        }

        List<Integer> receivers = new ArrayList<>();
        for (int i = 0; i < nodes.size(); i++) {
            if (nodes.get(i).role().absorbs()) {
                receivers.add(i);
            }
        }
        AtomicInteger done = new AtomicInteger();
        int total = Math.max(1, receivers.size());
        @SuppressWarnings("unchecked")
        List<ChannelEntry>[] perReceiver = new List[receivers.size()];
        int[] keptLags = new int[receivers.size()];
        double[] droppedBound = new double[receivers.size()];
        IntStream.range(0, receivers.size()).parallel().forEach(ri -> {
            Node rx = nodes.get(receivers.get(ri));
            List<ChannelEntry> list = new ArrayList<>();
            List<Integer> emitters = emittersBySpecies.get(rx.species());
            if (emitters != null) {
                Species sp = species.get(rx.species());
                double wallReach = Math.sqrt(4 * sp.diffusionUm2PerS() * horizonS);
                boolean rxNearWall = nearWall(scenario.volume(), rx.positionUm(), wallReach);
                List<Integer> found = new ArrayList<>();
                grids.get(rx.species()).forEachWithin(rx.positionUm(), reach.get(rx.species()), found::add);
                found.sort(null);
                for (int local : found) {
                    Node tx = nodes.get(emitters.get(local));
                    if (tx.id().equals(rx.id())) {
                        continue; // a relay does not count its own releases
                    }
                    double d = tx.positionUm().distance(rx.positionUm());
                    TapModel model = tapModel(d, rx, sp);
                    double[] taps = null;
                    double counted;
                    if (model instanceof HittingModel h) {
                        counted = h.cumulative(horizonS);
                    } else {
                        taps = model.taps(symbolTimeS, memory);
                        counted = Arrays.stream(taps).sum();
                    }
                    if (tx.moleculesPerSymbol() * counted < cutoffMolecules) {
                        continue;
                    }
                    if (taps == null) {
                        taps = model.taps(symbolTimeS, memory);
                    }
                    int len = IsiTail.kept(taps, tx.moleculesPerSymbol());
                    droppedBound[ri] += IsiTail.droppedBound(taps, len, tx.moleculesPerSymbol());
                    keptLags[ri] = Math.max(keptLags[ri], len - 1);
                    taps = IsiTail.truncate(taps, tx.moleculesPerSymbol());
                    boolean walls = rxNearWall || nearWall(scenario.volume(), tx.positionUm(), wallReach);
                    String caveat = walls && flows ? "walls+flow" : walls ? "walls" : flows ? "flow" : null;
                    list.add(new ChannelEntry(tx.id(), rx.id(), rx.species(), taps, ChannelMatrix.ANALYTIC, caveat));
                }
            }
            perReceiver[ri] = list;
            progress.accept(done.incrementAndGet() / (double) total);
        });
        List<ChannelEntry> all = new ArrayList<>();
        for (List<ChannelEntry> l : perReceiver) {
            all.addAll(l);
        }
        int kept = Arrays.stream(keptLags).max().orElse(0);
        if (memory > IsiTail.ALWAYS_KEPT && kept < memory) {
            notes.add(String.format(Locale.ROOT, "ISI memory %d symbols: leftovers beyond lag %d dropped (at most %.3g "
                    + "molecules counted per receiver and slot at the file's molecules, so every count distribution and "
                    + "error probability moves by at most that much; union bound)", memory, kept,
                    Arrays.stream(droppedBound).max().orElse(0)));
        }
        return ChannelMatrix.of(withVerdicts(scenario, all), notes);
    }

    /**
     * The entries with the verdict of {@link ChannelApplicability} as their reason ("closed form holds:
     * …" or the failed tests), in the same order. O(Σ over emitters of their entries²).
     */
    private static List<ChannelEntry> withVerdicts(Scenario scenario, List<ChannelEntry> entries) {
        ChannelApplicability tests = ChannelApplicability.of(scenario);
        Map<String, Node> nodes = scenario.nodesById();
        Map<String, List<ChannelEntry>> byEmitter = new HashMap<>();
        for (ChannelEntry e : entries) {
            byEmitter.computeIfAbsent(e.emitter(), k -> new ArrayList<>()).add(e);
        }
        ChannelEntry[] out = new ChannelEntry[entries.size()];
        IntStream.range(0, out.length).parallel().forEach(i -> {
            ChannelEntry e = entries.get(i);
            ChannelApplicability.Verdict v = tests.verdict(nodes.get(e.emitter()), nodes.get(e.receiver()),
                    e.tapSum(), byEmitter.get(e.emitter()));
            out[i] = e.withReason(e.source(), v.covered() ? v.reason() : NOT_COVERED + v.reason());
        });
        return List.of(out);
    }

    /** Prefix of the reason of a closed-form entry that fails {@link ChannelApplicability}. */
    public static final String NOT_COVERED = "closed form outside its validity: ";

    /** Whether an analytic entry passed {@link ChannelApplicability} (its reason does not start with {@link #NOT_COVERED}). */
    public static boolean covered(ChannelEntry entry) {
        return entry.channelReason() == null || !entry.channelReason().startsWith(NOT_COVERED);
    }

    /** The open or decaying absorbing-sphere model of one pair. */
    public static HittingModel model(double distanceUm, double radiusUm, Species species) {
        return species.isStable()
                ? OpenSphereHitting.of(distanceUm, radiusUm, species.diffusionUm2PerS())
                : DecayingSphereHitting.of(distanceUm, radiusUm, species.diffusionUm2PerS(), species.halfLifeS());
    }

    /**
     * The tap model of one pair for the receiver's scenario model: the absorbing sphere of
     * {@link #model}, the reactive sphere with the receiver's binding rate, or the passive observer with
     * its sampling offset; each with the species' decay.
     */
    public static TapModel tapModel(double distanceUm, Node receiver, Species species) {
        ReceiverModel rm = receiver.receiver();
        double halfLife = species.halfLifeS(); // +∞: stable
        return switch (rm.kind()) {
            case ABSORBING -> model(distanceUm, receiver.radiusUm(), species);
            case REACTIVE -> ReactiveSphereHitting.of(distanceUm, receiver.radiusUm(), species.diffusionUm2PerS(),
                    rm.bindingRateUmPerS(), halfLife);
            case PASSIVE -> PassiveSphereObservation.of(distanceUm, receiver.radiusUm(), species.diffusionUm2PerS(),
                    halfLife, rm.samplingOffsetS());
        };
    }

    /** Whether the medium moves (any non-zero velocity). */
    static boolean flows(Flow flow) {
        if (flow instanceof Flow.Uniform u) {
            return u.velocityUmPerS().norm() > 0;
        }
        if (flow instanceof Flow.Poiseuille p) {
            return p.meanSpeedUmPerS() > 0;
        }
        return false;
    }

    /** Whether {@code p} lies within {@code reachUm} of a wall of the volume. */
    static boolean nearWall(Volume volume, Vec3 p, double reachUm) {
        if (volume instanceof Volume.Box b) {
            double m = Math.min(Math.min(p.x() - b.minUm().x(), b.maxUm().x() - p.x()),
                    Math.min(Math.min(p.y() - b.minUm().y(), b.maxUm().y() - p.y()),
                            Math.min(p.z() - b.minUm().z(), b.maxUm().z() - p.z())));
            return m < reachUm;
        }
        if (volume instanceof Volume.Cylinder c) {
            double m = Math.min(Math.min(p.x(), c.lengthUm() - p.x()), c.radiusUm() - Math.hypot(p.y(), p.z()));
            return m < reachUm;
        }
        return false;
    }

    /**
     * Distance beyond which N·(r/d)·erfc((d − r)/√(4Dt)) &lt; cutoff (bisection; the bound is
     * decreasing in d for d &gt; r). +∞ when the cutoff is 0.
     */
    static double reachUm(long moleculesMax, double radiusUm, double diffusionUm2PerS, double horizonS,
            double cutoff) {
        if (cutoff <= 0) {
            return Double.POSITIVE_INFINITY;
        }
        double scale = Math.sqrt(4 * diffusionUm2PerS * horizonS);
        double lo = radiusUm;
        double hi = Math.max(2 * radiusUm, scale);
        while (bound(moleculesMax, radiusUm, hi, scale) >= cutoff) {
            lo = hi;
            hi *= 2;
        }
        for (int i = 0; i < 100 && hi - lo > 1e-6 * hi; i++) {
            double mid = 0.5 * (lo + hi);
            if (bound(moleculesMax, radiusUm, mid, scale) >= cutoff) {
                lo = mid;
            } else {
                hi = mid;
            }
        }
        return hi;
    }

    private static double bound(long n, double r, double d, double scale) {
        return n * (r / d) * Erfc.value((d - r) / scale);
    }
}
