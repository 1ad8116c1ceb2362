package dev.nanoplan.plan;

import dev.nanoplan.count.CountModelKind;
import dev.nanoplan.network.LinkEvaluation;
import dev.nanoplan.network.LinkEvaluator;
import dev.nanoplan.network.LinkSpec;
import dev.nanoplan.physics.DecayingSphereHitting;
import dev.nanoplan.physics.HittingModel;
import dev.nanoplan.physics.OpenSphereHitting;
import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.Species;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

/**
 * TEMP placeholder for the desktop branch (drop at merge; the planner branch owns this file):
 * isolated links (no crosstalk), Poisson counts, direct-or-widest routes, no budgets.
 */
public final class NetworkPlanner {

    private NetworkPlanner() {
    }

    /** TEMP. */
    public static Plan plan(Scenario s, PlanOptions options) {
        Map<String, Species> sp = s.speciesByName();
        double t = s.signalling().symbolTimeS();
        int mem = s.signalling().isiMemorySymbols();
        List<LinkReport> links = new ArrayList<>();
        for (Node e : s.nodes()) {
            if (!e.role().emits()) {
                continue;
            }
            for (Node r : s.nodes()) {
                if (r == e || !r.role().absorbs() || !r.species().equals(e.emitsSpecies())) {
                    continue;
                }
                double d = e.positionUm().distance(r.positionUm());
                if (d <= r.radiusUm()) {
                    continue;
                }
                Species x = sp.get(r.species());
                HittingModel hm = x.isStable() ? OpenSphereHitting.of(d, r.radiusUm(), x.diffusionUm2PerS())
                        : DecayingSphereHitting.of(d, r.radiusUm(), x.diffusionUm2PerS(), x.halfLifeS());
                double[] taps = hm.taps(t, mem);
                LinkEvaluation ev = LinkEvaluator.evaluate(LinkSpec.binary(taps, 0, e.moleculesPerSymbol(),
                        s.signalling().priorOne(), s.medium().backgroundMoleculesPerS() * t, CountModelKind.POISSON, t));
                if (ev.capacityBits() < options.capacityFloorBits()) {
                    continue;
                }
                Impairment lim = ev.isiMeanMolecules() > ev.signalMeanMolecules() ? Impairment.ISI
                        : ev.backgroundMeanMolecules() > ev.signalMeanMolecules() ? Impairment.NOISE : Impairment.SIGNAL;
                links.add(new LinkReport(e.id(), r.id(), r.species(), taps[0], taps, ev.signalMeanMolecules(), 0,
                        ev.isiMeanMolecules(), ev.backgroundMeanMolecules(), ev.binary().miThreshold(),
                        ev.minErrorProbability(), ev.log10ErrorProbability(), ev.capacityBits(), ev.rateBitsPerS(),
                        ev.binary().e0AtCapacity(), ev.binary().e1AtCapacity(), lim, null, 0, null));
            }
        }
        List<RouteReport> routes = new ArrayList<>();
        for (var dm : s.demands()) {
            Map<String, Double> width = new HashMap<>();
            Map<String, String> prev = new HashMap<>();
            width.put(dm.from(), Double.POSITIVE_INFINITY);
            for (int it = 0; it < s.nodes().size(); it++) {
                for (LinkReport l : links) {
                    Double w = width.get(l.from());
                    if (w == null) {
                        continue;
                    }
                    double nw = Math.min(w, l.capacityBits());
                    if (nw > width.getOrDefault(l.to(), -1.0)) {
                        width.put(l.to(), nw);
                        prev.put(l.to(), l.from());
                    }
                }
            }
            LinkReport direct = links.stream().filter(l -> l.from().equals(dm.from()) && l.to().equals(dm.to()))
                    .findFirst().orElse(null);
            if (!width.containsKey(dm.to())) {
                routes.add(new RouteReport(dm.from(), dm.to(), List.of(), 0, null, null, 0, 0, 0, null, null,
                        "no route"));
                continue;
            }
            List<String> hops = new ArrayList<>();
            for (String v = dm.to(); v != null; v = prev.get(v)) {
                hops.add(0, v);
                if (v.equals(dm.from())) {
                    break;
                }
            }
            LinkReport worst = null;
            for (int i = 0; i + 1 < hops.size(); i++) {
                String a = hops.get(i);
                String b = hops.get(i + 1);
                LinkReport l = links.stream().filter(x -> x.from().equals(a) && x.to().equals(b)).findFirst().get();
                if (worst == null || l.capacityBits() < worst.capacityBits()) {
                    worst = l;
                }
            }
            routes.add(new RouteReport(dm.from(), dm.to(), hops, worst.capacityBits(), worst.from(), worst.to(),
                    worst.capacityBits(), worst.capacityBits() / t, (hops.size() - 1) * t,
                    direct == null ? null : direct.capacityBits(), worst.limitedBy(), "placeholder advice"));
        }
        return new Plan(s, "analytic", links, routes, List.of(), List.of("placeholder planner"));
    }
}
