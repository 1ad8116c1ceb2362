package dev.nanoplan.network;

import dev.nanoplan.geometry.Vec3;
import dev.nanoplan.geometry.Volume;
import dev.nanoplan.scenario.Flow;
import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.Species;
import java.util.ArrayList;
import java.util.Collection;
import java.util.List;
import java.util.Locale;
import java.util.Map;

/**
 * Whether the open-medium closed forms (docs/architecture.md §5.1–5.3: one absorbing sphere, a point
 * source, an unbounded still medium) hold for one emitter → receiver pair of a layout, and why. The
 * {@code auto} channel simulates exactly the emitters with a pair that fails.
 *
 * <p>Three tests over the memory horizon H = (L+1)·T, each a bound on how far the real catch of the
 * pair can be from the closed form F(d, H) (d the centre distance, D the species' diffusion
 * coefficient, r the receiver radius):
 * <ol>
 *   <li><b>Flow.</b> The Péclet number Pe = v_max·ℓ/D with ℓ = max(d, √(4DH)) (the link's length or the
 *       diffusion length over the memory, whichever is longer) and v_max the largest flow speed (|v| for
 *       uniform flow, 2u on the axis of Poiseuille flow) is at most {@value #MAX_PECLET}: advection
 *       moves a molecule less than a tenth of what diffusion does over the link (the usual reading of
 *       Pe ≪ 1, e.g. H. Bruus, <i>Theoretical Microfluidics</i>, Oxford, 2008, ch. 5; the 0.1 is our
 *       choice).</li>
 *   <li><b>Walls.</b> A reflecting plane returns the molecules that reach it as if released by a mirror
 *       image of the emitter (method of images; H. S. Carslaw and J. C. Jaeger, <i>Conduction of Heat
 *       in Solids</i>, 2nd ed., Oxford, 1959). The images' catch, Σ F(d′, H) over the planes (d′ the
 *       distance from the image to the receiver; a box has six planes, a cylinder its two ends and the
 *       tangent planes of its curved wall nearest the emitter and nearest the receiver), is at most
 *       {@value #MAX_RELATIVE_EFFECT} of F(d, H). First images only: a wall that matters by this test
 *       matters, one that passes it adds less than about that fraction.</li>
 *   <li><b>Other absorbers</b> of the species. A molecule that another absorber a takes (at most the
 *       pair's closed-form catch F(d_ea, H), read from the emitter's other entries) would otherwise have
 *       reached r with probability at most (r/ρ)·e^{−(ρ − r)√(λ/D)}, ρ = d_ar − r_a, the eventual
 *       catch of r from a's surface under decay at rate λ (Redner 2001, ch. 6; the lifetime left is
 *       again exponential). Their sum over the other absorbers, the most shading can remove, is at most
 *       {@value #MAX_RELATIVE_EFFECT} of F(d, H). Passive (transparent) receivers take nothing and do not
 *       count; for a passive receiver the bound per absorbed molecule is instead the most sampling counts
 *       it could still have given, (L + 1)·min(1, V·(3/(2πe))^{3/2}/(ρ − r)³) with V the observer's
 *       volume. For a reactive or passive receiver F(d, H) and the wall images' catch are the tap sums of
 *       its own closed form. Absorbers whose pair with the emitter was cut off
 *       (below the spatial cutoff) take too little to count.</li>
 * </ol>
 * A wall or shading effect above that fraction still passes when it moves the pair's mean count over the
 * memory, N·ΔF(H) at the emitter's largest release N, by at most {@value #MAX_COUNT_CHANGE} molecules
 * (far, faint pairs heard only as crosstalk; see {@link #MAX_COUNT_CHANGE}).
 * {@value #MAX_RELATIVE_EFFECT} is the tolerance {@code nanoplan simulate} uses to call a difference
 * practically relevant. Cost per pair: O(1) for flow, six or four closed-form evaluations for walls,
 * O(entries of the emitter) for shading.
 */
public final class ChannelApplicability {

    /** Largest Péclet number at which flow is negligible. */
    public static final double MAX_PECLET = 0.1;
    /** Largest relative change of the catch (walls add, shading removes) the closed form may ignore. */
    public static final double MAX_RELATIVE_EFFECT = 0.05;
    /**
     * Any change of the mean count over the memory below this many molecules is ignored: it moves the
     * pair's count law by at most that much in total variation (each tap changes by δ_k with Σ|δ_k| the
     * change of the catch, and TV(Bin(N, p), Bin(N, p′)) ≤ N·|p − p′| by the coupling inequality; D. A.
     * Levin, Y. Peres and E. L. Wilmer, <i>Markov Chains and Mixing Times</i>, AMS, 2009, Prop. 4.7), so no probability the plan derives
     * from that count moves by more.
     */
    public static final double MAX_COUNT_CHANGE = 0.01;

    /**
     * The verdict on one pair.
     *
     * @param covered true when the closed form holds by all three tests
     * @param reason  the tests' figures in words, e.g. "flow: Péclet number 2.4e+02 &gt; 0.1"
     */
    public record Verdict(boolean covered, String reason) {
    }

    private final Scenario scenario;
    private final Map<String, Node> nodes;
    private final Map<String, Species> species;
    private final double horizonS;
    private final double maxSpeedUmPerS;

    private ChannelApplicability(Scenario scenario) {
        this.scenario = scenario;
        this.nodes = scenario.nodesById();
        this.species = scenario.speciesByName();
        this.horizonS = scenario.signalling().symbolTimeS() * (scenario.signalling().isiMemorySymbols() + 1);
        this.maxSpeedUmPerS = maxSpeedUmPerS(scenario.medium().flow());
    }

    /** The tests for {@code scenario}. */
    public static ChannelApplicability of(Scenario scenario) {
        if (scenario == null) {
            throw new IllegalArgumentException("scenario: required");
        }
        return new ChannelApplicability(scenario);
    }

    /** Largest flow speed in µm/s: |v| for uniform flow, 2u on the axis of Poiseuille flow, 0 without flow. */
    public static double maxSpeedUmPerS(Flow flow) {
        if (flow instanceof Flow.Uniform u) {
            return u.velocityUmPerS().norm();
        }
        if (flow instanceof Flow.Poiseuille p) {
            return 2 * Math.abs(p.meanSpeedUmPerS());
        }
        return 0;
    }

    /** Pe = v_max·max(d, √(4DH))/D of a pair at centre distance {@code distanceUm} for species {@code sp}. */
    public double peclet(double distanceUm, Species sp) {
        double d = sp.diffusionUm2PerS();
        return maxSpeedUmPerS * Math.max(distanceUm, Math.sqrt(4 * d * horizonS)) / d;
    }

    /**
     * Whether flow alone rules out the closed form for every pair of an emitter of {@code sp} (Pe at the
     * diffusion length over the memory above {@value #MAX_PECLET}): then even pairs below the analytic
     * cutoff may be reached, carried by the flow.
     */
    public boolean flowRulesOut(Species sp) {
        return peclet(0, sp) > MAX_PECLET;
    }

    /**
     * The verdict on the pair {@code emitter} → {@code receiver}.
     *
     * @param catchOverMemory the pair's closed-form catch F(d, H) (the entry's tap sum)
     * @param sameEmitter     the emitter's entries at every receiver (this pair's may be among them; it
     *                        is skipped), whose tap sums are the other absorbers' catches
     */
    public Verdict verdict(Node emitter, Node receiver, double catchOverMemory, Collection<ChannelEntry> sameEmitter) {
        Species sp = species.get(receiver.species());
        double d = emitter.positionUm().distance(receiver.positionUm());
        List<String> fails = new ArrayList<>();
        List<String> holds = new ArrayList<>();
        double pe = peclet(d, sp);
        if (pe > MAX_PECLET) {
            fails.add(String.format(Locale.ROOT, "flow: Péclet number %.3g > %s", pe, MAX_PECLET));
        } else if (pe > 0) {
            holds.add(String.format(Locale.ROOT, "Péclet number %.3g", pe));
        }
        if (!(scenario.volume() instanceof Volume.Open)) {
            judge("walls add", wallCatch(emitter, receiver, sp), catchOverMemory, emitter, fails, holds);
        }
        judge("other absorbers take up to", shadingCatch(emitter, receiver, sp, sameEmitter), catchOverMemory,
                emitter, fails, holds);
        if (!fails.isEmpty()) {
            return new Verdict(false, String.join("; ", fails));
        }
        if (holds.isEmpty()) {
            return new Verdict(true, "closed form holds: open still medium, no other absorber in reach");
        }
        return new Verdict(true, "closed form holds: " + (maxSpeedUmPerS > 0 ? "" : "still medium, ")
                + String.join(", ", holds));
    }

    /**
     * Sorts one effect (an extra or missing catch {@code effect} against the closed form's {@code base})
     * into the failed or the passed tests: it fails when it is above {@value #MAX_RELATIVE_EFFECT} of
     * {@code base} and moves the mean count over the memory by more than {@value #MAX_COUNT_CHANGE}
     * molecules at the emitter's largest release.
     */
    private static void judge(String what, double effect, double base, Node emitter, List<String> fails,
            List<String> holds) {
        if (effect <= 0) {
            return;
        }
        double rel = relative(effect, base);
        double molecules = effect * emitter.moleculesPerSymbol();
        if (rel > MAX_RELATIVE_EFFECT && molecules > MAX_COUNT_CHANGE) {
            fails.add(String.format(Locale.ROOT, "%s %s > %s (%.3g molecules)", what, percent(rel),
                    percent(MAX_RELATIVE_EFFECT), molecules));
        } else if (rel > MAX_RELATIVE_EFFECT) {
            holds.add(String.format(Locale.ROOT, "%s %s but only %.2g molecules", what, percent(rel), molecules));
        } else {
            holds.add(what + " " + percent(rel));
        }
    }

    private static double relative(double extra, double base) {
        if (extra <= 0) {
            return 0;
        }
        return base > 0 ? extra / base : Double.POSITIVE_INFINITY;
    }

    private static String percent(double fraction) {
        if (Double.isInfinite(fraction)) {
            return "more than the closed form's catch";
        }
        double pc = 100 * fraction;
        return pc >= 9.95 ? String.format(Locale.ROOT, "%.0f %%", pc) : String.format(Locale.ROOT, "%.2g %%", pc);
    }

    /** Σ over the first images of the emitter in the walls of their closed-form catch at the receiver. */
    double wallCatch(Node emitter, Node receiver, Species sp) {
        Vec3 e = emitter.positionUm();
        Vec3 r = receiver.positionUm();
        List<Vec3> images = new ArrayList<>();
        if (scenario.volume() instanceof Volume.Box b) {
            images.add(new Vec3(2 * b.minUm().x() - e.x(), e.y(), e.z()));
            images.add(new Vec3(2 * b.maxUm().x() - e.x(), e.y(), e.z()));
            images.add(new Vec3(e.x(), 2 * b.minUm().y() - e.y(), e.z()));
            images.add(new Vec3(e.x(), 2 * b.maxUm().y() - e.y(), e.z()));
            images.add(new Vec3(e.x(), e.y(), 2 * b.minUm().z() - e.z()));
            images.add(new Vec3(e.x(), e.y(), 2 * b.maxUm().z() - e.z()));
        } else if (scenario.volume() instanceof Volume.Cylinder c) {
            images.add(new Vec3(-e.x(), e.y(), e.z()));
            images.add(new Vec3(2 * c.lengthUm() - e.x(), e.y(), e.z()));
            images.add(curvedImage(e, e, c.radiusUm()));
            images.add(curvedImage(e, r, c.radiusUm()));
        }
        double sum = 0;
        for (Vec3 image : images) {
            double dist = image.distance(r);
            if (dist > receiver.radiusUm()) {
                sum += catchOverMemory(dist, receiver, sp);
            }
        }
        return sum;
    }

    /**
     * The closed-form catch over the memory of a release at {@code distanceUm}: F(d, H) of the absorbing
     * sphere, or the tap sum of the receiver's own model (reactive sphere, passive observer), the same
     * quantity the pair's entry holds.
     */
    private double catchOverMemory(double distanceUm, Node receiver, Species sp) {
        if (receiver.receiver().isAbsorbing()) {
            return AnalyticChannel.model(distanceUm, receiver.radiusUm(), sp).cumulative(horizonS);
        }
        double sum = 0;
        for (double p : AnalyticChannel.tapModel(distanceUm, receiver, sp).taps(scenario.signalling().symbolTimeS(),
                scenario.signalling().isiMemorySymbols())) {
            sum += p;
        }
        return sum;
    }

    /**
     * The emitter mirrored in the plane tangent to the cylinder's curved wall at the wall point nearest
     * {@code towards} (radially outwards from the axis; +y when {@code towards} is on the axis).
     */
    private static Vec3 curvedImage(Vec3 e, Vec3 towards, double radiusUm) {
        double rho = Math.hypot(towards.y(), towards.z());
        double uy = rho > 0 ? towards.y() / rho : 1;
        double uz = rho > 0 ? towards.z() / rho : 0;
        // signed distance of e from the tangent plane {p : p·u = R}, measured inwards
        double gap = radiusUm - (e.y() * uy + e.z() * uz);
        return new Vec3(e.x(), e.y() + 2 * gap * uy, e.z() + 2 * gap * uz);
    }

    /**
     * The most sampling counts a passive observer of radius r gets from one molecule that starts at
     * distance ρ from its centre: at each of the L + 1 sampling instants the chance to be inside is at
     * most the ball's volume times the peak free-space Green's function at the gap ρ − r,
     * max_t (4πDt)^{−3/2}·e^{−(ρ−r)²/(4Dt)} = (3/(2πe))^{3/2}/(ρ − r)³ (at 4Dt = 2(ρ − r)²/3; Carslaw and
     * Jaeger 1959), capped at 1; decay only lowers it.
     */
    private double passiveCountsBound(double rhoUm, double radiusUm) {
        double gap = rhoUm - radiusUm;
        double volume = 4.0 / 3 * Math.PI * radiusUm * radiusUm * radiusUm;
        double perSample = gap > 0 ? Math.min(1, volume * Math.pow(3 / (2 * Math.PI * Math.E), 1.5) / (gap * gap * gap))
                : 1;
        return (scenario.signalling().isiMemorySymbols() + 1) * perSample;
    }

    /** Bound on the catch other absorbers take from the pair (class comment, test 3). */
    double shadingCatch(Node emitter, Node receiver, Species sp, Collection<ChannelEntry> sameEmitter) {
        double root = sp.isStable() ? 0 : Math.sqrt(sp.decayRatePerS() / sp.diffusionUm2PerS());
        double sum = 0;
        for (ChannelEntry o : sameEmitter) {
            if (o.receiver().equals(receiver.id())) {
                continue;
            }
            Node a = nodes.get(o.receiver());
            if (!a.absorbs()) {
                continue; // a passive observer is transparent: it takes nothing
            }
            double rho = Math.max(a.positionUm().distance(receiver.positionUm()) - a.radiusUm(), receiver.radiusUm());
            sum += o.tapSum() * (receiver.absorbs()
                    ? receiver.radiusUm() / rho * Math.exp(-(rho - receiver.radiusUm()) * root)
                    : passiveCountsBound(rho, receiver.radiusUm()));
        }
        return sum;
    }
}
