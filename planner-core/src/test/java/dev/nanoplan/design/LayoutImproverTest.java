package dev.nanoplan.design;

import static org.assertj.core.api.Assertions.assertThat;

import dev.nanoplan.geometry.Vec3;
import dev.nanoplan.geometry.Volume;
import dev.nanoplan.plan.NetworkPlanner;
import dev.nanoplan.plan.PlanOptions;
import dev.nanoplan.count.CountModelKind;
import dev.nanoplan.scenario.Demand;
import dev.nanoplan.scenario.Medium;
import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.Role;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.ScenarioReader;
import dev.nanoplan.scenario.ScenarioWriter;
import dev.nanoplan.scenario.Schedule;
import dev.nanoplan.scenario.Signalling;
import dev.nanoplan.scenario.Species;
import dev.nanoplan.scenario.SwarmGenerator;
import dev.nanoplan.scenario.Targets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.EnumSet;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.stream.LongStream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * {@link LayoutImprover}: never worse than the input, the species search against exhaustive enumeration,
 * the relay optimiser against a dense grid, and the constraints of every output. The independent
 * computation is always the full planner run from scratch ({@link NetworkPlanner#plan}) on the layouts
 * concerned, with the objective read from its plan.
 */
class LayoutImproverTest {

    @TempDir
    Path dir;

    static LongStream seeds() {
        return LongStream.of(3, 4, 5);
    }

    /** The objective of {@code s} from a plan from scratch. */
    private static Objective fromScratch(Scenario s) {
        return Assessment.of(NetworkPlanner.plan(s, PlanOptions.DEFAULT)).objective();
    }

    /** {@code s} with the first {@code k} nodes and every demand destination fixed. */
    private static Scenario withFixed(Scenario s, int k) {
        Set<String> fixed = new HashSet<>();
        s.demands().forEach(d -> fixed.add(d.to()));
        for (int i = 0; i < k && i < s.nodes().size(); i++) {
            fixed.add(s.nodes().get(i).id());
        }
        return LayoutEdits.mapNodes(s, n -> fixed.contains(n.id()) ? new Node(n.id(), n.role(), n.positionUm(),
                n.radiusUm(), n.species(), n.emitsSpecies(), n.moleculesPerSymbol(), true) : n);
    }

    @ParameterizedTest
    @MethodSource("seeds")
    void theResultIsNeverWorseAndKeepsEveryConstraint(long seed) throws Exception {
        Scenario s = withFixed(SwarmGenerator.generate(9, seed), 2);
        ImproveOptions o = ImproveOptions.defaults().withSeed(seed).withTimeLimit(10)
                .withAllowed(EnumSet.allOf(DesignMove.class)).withMaxNewRelays(1);
        Improvement r = LayoutImprover.improve(s, o);
        Objective before = fromScratch(s);
        Objective after = fromScratch(r.after());
        // source: the full planner from scratch on input and output (the search never accepts a worse layout)
        assertThat(after.compareTo(before)).isGreaterThanOrEqualTo(0);
        // source: the same from-scratch plan: the search's incremental assessment is the full plan's
        assertThat(after).isEqualTo(r.assessedAfter().objective());
        Map<String, Node> out = r.after().nodesById();
        for (Node n : s.nodes()) {
            if (n.fixed()) {
                // source: the node as read (fixed nodes are never moved or re-assigned)
                assertThat(out.get(n.id())).isEqualTo(n);
            }
        }
        Path f = dir.resolve("out-" + seed + ".json");
        ScenarioWriter.write(r.after(), f);
        // source: the file reader's validation (inside the volume, no overlaps, known species and ids)
        Scenario back = ScenarioReader.strict().read(f);
        assertThat(back).isEqualTo(r.after());
        for (Node n : back.nodes()) {
            assertThat(back.volume().containsBall(n.positionUm(), n.radiusUm())).isTrue();
        }
    }

    /** Two transmitter-receiver pairs side by side on one species; candidate species B. */
    private static Scenario twoPairs() {
        Species a = Species.ofDiffusion("A", 80, 1.0);
        Species b = Species.ofDiffusion("B", 80, 1.0);
        List<Node> nodes = List.of(
                Node.receiver("g1", new Vec3(0, 0, 0), 5, "A"),
                Node.receiver("g2", new Vec3(0, 30, 0), 5, "A"),
                Node.transmitter("t1", new Vec3(-14, 0, 0), 1, "A", 3000),
                Node.transmitter("t2", new Vec3(-14, 30, 0), 1, "A", 3000));
        nodes = nodes.stream().map(n -> new Node(n.id(), n.role(), n.positionUm(), n.radiusUm(), "A", "A",
                n.moleculesPerSymbol())).toList();
        return new Scenario("two pairs", new Volume.Open(), new Medium(310.15, 0.69,
                Medium.DEFAULT.flow(), 2.0), List.of(a), new Signalling(0.5, 4, 2, 0.5, CountModelKind.EXACT,
                        Schedule.ALL_ACTIVE), nodes, List.of(new Demand("t1", "g1"), new Demand("t2", "g2")),
                new Targets(1e-3, 1.0, 3600), List.of(b));
    }

    @Test
    void theSpeciesSearchFindsTheOptimumOfExhaustiveEnumeration() {
        Scenario s = twoPairs();
        Improvement r = LayoutImprover.improve(s, ImproveOptions.defaults().withTimeLimit(60)
                .withAllowed(EnumSet.of(DesignMove.SPECIES)));
        // exhaustive: every assignment of {A, B} to the four nodes, each planned from scratch
        Objective best = null;
        for (int mask = 0; mask < 16; mask++) {
            int m = mask;
            List<Node> nodes = new ArrayList<>();
            for (int i = 0; i < 4; i++) {
                Node n = s.nodes().get(i);
                String sp = ((m >> i) & 1) == 0 ? "A" : "B";
                nodes.add(LayoutEdits.withSpecies(n, sp, sp));
            }
            Objective o = fromScratch(LayoutEdits.withNodes(s, nodes));
            best = best == null || o.betterThan(best) ? o : best;
        }
        // source: brute-force enumeration of all 16 species assignments, planned from scratch
        assertThat(fromScratch(r.after())).isEqualTo(best);
        assertThat(best.betterThan(fromScratch(s))).as("the instance must leave room to improve").isTrue();
    }

    /**
     * Three transmitter-receiver pairs around a circle (receivers at 20 µm from the centre, transmitters 12 µm
     * inwards of them, so each transmitter is 12 µm from its receiver and 25 µm from the others), all on
     * species A, candidate species B with the same diffusion and half-life.
     */
    private static Scenario threePairs() {
        List<Node> nodes = new ArrayList<>();
        for (int i = 0; i < 3; i++) {
            double th = 2 * Math.PI * i / 3;
            nodes.add(new Node("g" + (i + 1), Role.RECEIVER, new Vec3(20 * Math.cos(th), 20 * Math.sin(th), 0), 5,
                    "A", "A", 0));
            nodes.add(new Node("t" + (i + 1), Role.TRANSMITTER, new Vec3(8 * Math.cos(th), 8 * Math.sin(th), 0), 1,
                    "A", "A", 300));
        }
        return new Scenario("three pairs", new Volume.Open(), new Medium(310.15, 0.69, Medium.DEFAULT.flow(), 2.0),
                List.of(Species.ofDiffusion("A", 80, 1.0)), new Signalling(0.5, 2, 2, 0.5, CountModelKind.EXACT,
                        Schedule.ALL_ACTIVE), nodes,
                List.of(new Demand("t1", "g1"), new Demand("t2", "g2"), new Demand("t3", "g3")),
                new Targets(1e-3, 0.5, 3600), List.of(Species.ofDiffusion("B", 80, 1.0)));
    }

    @Test
    void theSpeciesAndSlotSearchFindsTheOptimumOfExhaustiveEnumeration() {
        Scenario s = threePairs();
        Improvement r = LayoutImprover.improve(s, ImproveOptions.defaults().withTimeLimit(120)
                .withAllowed(EnumSet.of(DesignMove.SPECIES, DesignMove.SLOTS)));
        // exhaustive: every species of each pair (a receiver senses one species, so a pair shares it, as the
        // search's group moves keep it; pair 1 on A, since A and B have the same parameters and renaming them
        // changes no plan) and every slot 0..2 of each transmitter (frame <= 3), each planned from scratch
        Objective best = null;
        Objective bestAllActive = null;
        for (int mask = 0; mask < 4; mask++) {
            for (int code = 0; code < 27; code++) {
                List<Node> nodes = new ArrayList<>();
                Map<String, Integer> slots = new LinkedHashMap<>();
                for (int i = 0; i < 3; i++) {
                    String sp = i > 0 && ((mask >> (i - 1)) & 1) == 1 ? "B" : "A";
                    nodes.add(LayoutEdits.withSpecies(s.nodes().get(2 * i), sp, sp));
                    nodes.add(LayoutEdits.withSpecies(s.nodes().get(2 * i + 1), sp, sp));
                    slots.put("t" + (i + 1), (code / (i == 0 ? 1 : i == 1 ? 3 : 9)) % 3);
                }
                Objective o = fromScratch(LayoutEdits.withSlots(LayoutEdits.withNodes(s, nodes), 0, slots));
                best = best == null || o.betterThan(best) ? o : best;
                if (code == 0) {
                    bestAllActive = bestAllActive == null || o.betterThan(bestAllActive) ? o : bestAllActive;
                }
            }
        }
        // source: brute-force enumeration of all 4 x 27 species and slot assignments, planned from scratch
        assertThat(fromScratch(r.after())).isEqualTo(best);
        assertThat(best.betterThan(bestAllActive)).as("the instance must need slots, not species alone").isTrue();
        for (int i = 1; i <= 3; i++) {
            Integer slot = r.after().signalling().slots().get("t" + i);
            if (slot != null && slot != 0) {
                // source: the improved scenario's own slot plan (the change list names each new slot)
                assertThat(r.changes()).contains(new Change("t" + i, "slot", "0", slot.toString(), "slot " + slot));
            }
        }
    }

    @Test
    void oneRelayOnALineLandsWhereADenseGridPutsTheBestCascade() {
        Species a = Species.ofDiffusion("A", 80, 2.0);
        Species b = Species.ofDiffusion("B", 80, 2.0);
        Node src = Node.transmitter("s", new Vec3(0, 0, 0), 1, "A", 4000);
        Node gw = Node.receiver("gw", new Vec3(60, 0, 0), 4, "B");
        gw = new Node("gw", gw.role(), gw.positionUm(), 4, "B", "B", 0, true);
        src = new Node("s", src.role(), src.positionUm(), 1, "A", "A", 4000, true);
        Node relay = Node.relay("r", new Vec3(18, 0, 0), 4, "A", "B", 4000);
        Scenario s = new Scenario("line", new Volume.Open(), new Medium(310.15, 0.69, Medium.DEFAULT.flow(), 0.0),
                List.of(a, b), new Signalling(1.0, 4, 2, 0.5, CountModelKind.EXACT, Schedule.ALL_ACTIVE),
                List.of(gw, src, relay), List.of(new Demand("s", "gw")), new Targets(1e-3, 100.0, 3600));
        Improvement r = LayoutImprover.improve(s, ImproveOptions.defaults().withTimeLimit(120)
                .withAllowed(EnumSet.of(DesignMove.MOVE_RELAYS)));
        Vec3 found = r.after().nodesById().get("r").positionUm();
        // dense grid on the line, 0.25 µm apart, each point planned from scratch
        double bestX = Double.NaN;
        Objective best = null;
        for (double x = 8; x <= 52; x += 0.25) {
            double xx = x;
            Objective o = fromScratch(LayoutEdits.node(s, "r", n -> LayoutEdits.moved(n, new Vec3(xx, 0, 0))));
            if (best == null || o.betterThan(best)) {
                best = o;
                bestX = x;
            }
        }
        assertThat(Math.abs(bestX - 18)).as("the start must not already be the best").isGreaterThan(2.0);
        // source: dense grid search over relay positions with plans from scratch
        assertThat(Math.abs(found.x() - bestX)).isLessThanOrEqualTo(1.0);
        // source: symmetry of the line (the best relay sits on it)
        assertThat(Math.hypot(found.y(), found.z())).isLessThanOrEqualTo(1.0);
    }
}
