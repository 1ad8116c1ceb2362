package dev.nanoplan.sim;

import dev.nanoplan.geometry.Volume;
import dev.nanoplan.network.AnalyticChannel;
import dev.nanoplan.physics.DecayingSphereHitting;
import dev.nanoplan.physics.TapModel;
import dev.nanoplan.scenario.Flow;
import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.Species;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;

/**
 * Compares each simulated link with the closed form for an absorbing sphere in an open medium
 * (S. Redner, <i>A Guide to First-Passage Processes</i>, 2001, ch. 6; with first-order decay as in
 * {@link DecayingSphereHitting}), at the first symbol time T; a reactive or passive receiver with its
 * own closed form ({@link AnalyticChannel#tapModel}: the Collins–Kimball sphere, or the passive
 * observer's tap 0, the fraction inside at the first sampling instant).
 *
 * <p>A link is flagged when the difference is both statistically clear (|z| &gt;
 * {@value #Z_LIMIT}) and practically relevant (|relative difference| &gt; {@value #RELATIVE_LIMIT}).
 * The reason names what the closed form ignores and could move the link that way: walls (reflect
 * molecules back, raise), flow (either way), other absorbers of the same species (shade, lower);
 * this is attribution by elimination, not a decomposition. A link with fewer than
 * {@link SimulationPrecision#MIN_HITS} hits in the first symbol is never flagged: it is marked
 * insufficient, with the molecules per emitter that would give enough hits. Cost O(links × L).
 */
public final class SimulationComparison {

    /** |z| above this is a clear difference. */
    public static final double Z_LIMIT = 3;
    /** |relative difference| above this matters. */
    public static final double RELATIVE_LIMIT = 0.05;

    private SimulationComparison() {
    }

    /**
     * One comparison per emitter → receiver pair whose receiver senses the emitter's species
     * (a relay's own releases excluded), in emitter then receiver order.
     *
     * @throws IllegalArgumentException if the channel does not belong to the scenario
     */
    public static List<LinkComparison> compare(Scenario scenario, SimulatedChannel channel) {
        Map<String, Node> nodes = scenario.nodesById();
        Map<String, Species> species = scenario.speciesByName();
        double symbolTimeS = scenario.signalling().symbolTimeS();
        List<LinkComparison> out = new ArrayList<>();
        for (EmitterRun run : channel.emitters()) {
            Node e = nodes.get(run.emitterId());
            if (e == null) {
                throw new IllegalArgumentException("channel: emitter " + run.emitterId() + " is not in the scenario");
            }
            Species s = species.get(e.emitsSpecies());
            long sameSpeciesAbsorbers = run.receivers().stream().filter(SimulatedTaps::senses).count();
            for (SimulatedTaps t : run.receivers()) {
                if (!t.senses()) {
                    continue;
                }
                Node r = nodes.get(t.receiverId());
                if (r == null) {
                    throw new IllegalArgumentException("channel: receiver " + t.receiverId() + " is not in the scenario");
                }
                double d = e.positionUm().distance(r.positionUm());
                TapModel model = r.receiver().isAbsorbing()
                        ? DecayingSphereHitting.of(d, r.radiusUm(), s.diffusionUm2PerS(), s.halfLifeS())
                        : AnalyticChannel.tapModel(d, r, s);
                double[] analyticTaps = model.taps(symbolTimeS, channel.isiMemorySymbols());
                double pa = analyticTaps[0];
                long m = t.moleculesSimulated();
                if (m == 0) {
                    out.add(new LinkComparison(e.id(), r.id(), pa, Double.NaN, Double.NaN, Double.NaN, Double.NaN,
                            false, "not simulated: the run stopped before any of this emitter's molecules finished",
                            new double[0], new double[0], analyticTaps, false, 0));
                    continue;
                }
                double ps = t.hitProbability();
                double nullSe = m == 0 ? 0 : Math.sqrt(pa * (1 - pa) / m);
                double z = nullSe > 0 ? (ps - pa) / nullSe : Double.NaN;
                double rel = pa > 0 ? (ps - pa) / pa : Double.NaN;
                long hits = t.absorbedPerSlot()[0];
                if (SimulationPrecision.insufficient(hits)) {
                    // too few hits for a standard error: no flag, no cause, no factor from noise
                    double p = SimulationPrecision.estimate(hits, m, pa);
                    out.add(new LinkComparison(e.id(), r.id(), pa, ps, t.hitProbabilityStandardError(), z, rel, false,
                            SimulationPrecision.describe(hits, m, p, "in the first symbol"), t.taps(),
                            t.tapsStandardError(), analyticTaps, true, SimulationPrecision.minimumMolecules(p)));
                    continue;
                }
                boolean flagged = Math.abs(z) > Z_LIMIT && Math.abs(rel) > RELATIVE_LIMIT;
                String reason = reason(scenario, flagged, z, rel, sameSpeciesAbsorbers - 1);
                out.add(new LinkComparison(e.id(), r.id(), pa, ps, t.hitProbabilityStandardError(), z, rel, flagged,
                        reason, t.taps(), t.tapsStandardError(), analyticTaps, false, 0));
            }
        }
        return out;
    }

    static String reason(Scenario scenario, boolean flagged, double z, double rel, long otherAbsorbers) {
        if (Double.isNaN(z)) {
            return "no statistics: no molecules simulated or the closed form gives 0 or 1";
        }
        String size = Math.abs(rel) < 10 ? String.format(Locale.ROOT, "%.0f %%", Math.abs(rel) * 100)
                : String.format(Locale.ROOT, "a factor %.3g", rel + 1);
        if (!flagged) {
            return Math.abs(z) <= Z_LIMIT
                    ? "agrees with the open-medium closed form within " + fmt(Z_LIMIT) + " s.e."
                    : "differs by " + size + ", within the " + fmt(RELATIVE_LIMIT * 100) + " % tolerance";
        }
        boolean walls = !(scenario.volume() instanceof Volume.Open);
        boolean flow = !(scenario.medium().flow() instanceof Flow.None);
        List<String> causes = new ArrayList<>();
        if (rel > 0) {
            if (walls) {
                causes.add("walls");
            }
            if (flow) {
                causes.add("flow");
            }
            if (causes.isEmpty()) {
                return "simulation exceeds the closed form by " + size
                        + " with nothing to explain it: try a smaller time step or more molecules";
            }
            return String.join(" and ", causes) + " " + verb(causes, "raise") + " this link by " + size;
        }
        if (otherAbsorbers > 0) {
            causes.add(otherAbsorbers == 1 ? "shading by 1 other receiver"
                    : "shading by " + otherAbsorbers + " other receivers");
        }
        if (flow) {
            causes.add("flow");
        }
        if (causes.isEmpty()) {
            return "simulation falls short of the closed form by " + size
                    + " with nothing to explain it: try a smaller time step or more molecules";
        }
        return String.join(" and ", causes) + " " + verb(causes, "lower") + " this link by " + size;
    }

    /** "walls raise", "flow raises", "shading ... and flow lower". */
    private static String verb(List<String> causes, String base) {
        return causes.size() == 1 && !causes.get(0).equals("walls") ? base + "s" : base;
    }

    private static String fmt(double v) {
        return v == Math.rint(v) ? Long.toString((long) v) : Double.toString(v);
    }
}
