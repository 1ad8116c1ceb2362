package dev.nanoplan.plan;

import static org.assertj.core.api.Assertions.assertThat;

import dev.nanoplan.geometry.Vec3;
import dev.nanoplan.network.ChannelMatrix;
import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.Role;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.Schedule;
import dev.nanoplan.scenario.Signalling;
import dev.nanoplan.scenario.Species;
import dev.nanoplan.scenario.SwarmGenerator;
import java.util.ArrayList;
import java.util.List;
import java.util.function.Function;
import java.util.stream.LongStream;
import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.simple.RandomSource;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * {@link IncrementalPlanner}: after seeded random edits (one node's position, radius, molecules or
 * species; one species' diffusion; the schedule) the re-plan equals the full plan of the edited
 * scenario, compared as the JSON text of {@link dev.nanoplan.report.PlanJson} (the independent
 * computation is the full planner run from scratch on the edited scenario).
 */
class IncrementalPlannerTest {

    static LongStream seeds() {
        return LongStream.of(11, 12, 13, 14);
    }

    @ParameterizedTest
    @MethodSource("seeds")
    void previewReplanEqualsTheFullPreviewAfterRandomEdits(long seed) throws Exception {
        Scenario s = seed % 2 == 0 ? SwarmGenerator.designed(110, seed) : SwarmGenerator.generate(100, seed);
        replanAndCompare(IncrementalPlanner.preview(s, PlanOptions.DEFAULT), seed, 6, false,
                e -> PreviewPlanner.plan(e, PlanOptions.DEFAULT));
    }

    @ParameterizedTest
    @MethodSource("seeds")
    void exactReplanEqualsTheFullPlanAfterRandomEdits(long seed) throws Exception {
        Scenario s = SwarmGenerator.generate(20, seed);
        replanAndCompare(IncrementalPlanner.exact(s, PlanOptions.DEFAULT), seed, 3, true,
                e -> NetworkPlanner.plan(e, PlanOptions.DEFAULT));
    }

    /** {@code edits} random edits in a row, each re-planned and compared with {@code full} of the edited scenario. */
    private static void replanAndCompare(IncrementalPlanner planner, long seed, int edits, boolean schedules,
            Function<Scenario, Plan> full) throws Exception {
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(seed);
        Scenario s = planner.scenario();
        for (int i = 0; i < edits; i++) {
            s = edit(s, rng, schedules);
            Plan incremental = planner.replan(s);
            // source: the full planner run from scratch on the edited scenario
            assertThat(PlanGoldenTest.render(incremental)).as("edit %d of seed %d", i, seed)
                    .isEqualTo(PlanGoldenTest.render(full.apply(s)));
        }
    }

    /**
     * The what-if of the advice check: after each seeded random edit of the planned scenario it equals
     * the plan without budgets or advice computed from scratch, and the planner stays where it was.
     */
    @ParameterizedTest
    @MethodSource("seeds")
    void aWhatIfEqualsTheFromScratchPlanWithoutBudgetsAndLeavesThePlannerAsItWas(long seed) throws Exception {
        boolean exact = seed % 2 == 1;
        ReceiverEvaluator evaluator = exact ? ExactReceiverEvaluator.INSTANCE : NormalReceiverEvaluator.INSTANCE;
        Scenario s = exact ? SwarmGenerator.generate(20, seed) : SwarmGenerator.designed(110, seed);
        IncrementalPlanner planner = exact ? IncrementalPlanner.exact(s, PlanOptions.DEFAULT)
                : IncrementalPlanner.preview(s, PlanOptions.DEFAULT);
        String planned = PlanGoldenTest.render(planner.plan());
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(seed);
        for (int i = 0; i < 3; i++) {
            Scenario edited = edit(s, rng, exact);
            // source: the same what-if from scratch, every receiver of the edited scenario evaluated afresh
            assertThat(PlanGoldenTest.render(planner.whatIf(edited))).as("edit %d of seed %d", i, seed)
                    .isEqualTo(PlanGoldenTest.render(whatIfFromScratch(edited, evaluator)));
        }
        assertThat(planner.scenario()).isSameAs(s);
        assertThat(PlanGoldenTest.render(planner.plan())).isEqualTo(planned);
    }

    /** The budgets a layout search sizes from the kept links are the full plan's, joint and independent. */
    @ParameterizedTest
    @MethodSource("seeds")
    void theBudgetsFromTheKeptLinksAreTheFullPlansBudgets(long seed) throws Exception {
        Scenario s = SwarmGenerator.generate(20, seed);
        IncrementalPlanner planner = IncrementalPlanner.exactWithoutBudgets(s, PlanOptions.DEFAULT);
        Scenario edited = edit(s, RandomSource.XO_RO_SHI_RO_128_PP.create(seed), false);
        planner.advance(edited);
        boolean joint = seed % 2 == 0;
        // source: the full planner run from scratch on the edited scenario (its budgets are what the search reads)
        assertThat(planner.withBudgets(joint, f -> { }).budgets())
                .isEqualTo(NetworkPlanner.plan(edited, PlanOptions.DEFAULT.withJointBudgets(joint)).budgets());
    }

    /** The plan without budgets or advice ({@link PlanPipeline#whatIf}), every receiver evaluated afresh. */
    static Plan whatIfFromScratch(Scenario s, ReceiverEvaluator evaluator) {
        PlanInputs in = PlanInputs.of(s, PlanOptions.DEFAULT);
        ChannelMatrix channel = PlanPipeline.channel(in, f -> { });
        return PlanPipeline.whatIf(in, channel, PlanPipeline.evaluate(in, channel, channel.receivers(), evaluator,
                f -> { }), evaluator);
    }

    @Test
    void aMovedSensorReEvaluatesOnlyTheReceiversWithinTheCutoffOfItsOldAndNewPlace() throws Exception {
        Scenario s = SwarmGenerator.designed(270, 5);
        IncrementalPlanner planner = IncrementalPlanner.preview(s, PlanOptions.DEFAULT);
        int receivers = planner.lastReevaluatedReceivers();
        Node sensor = s.nodesById().get("s0_0_0");
        Scenario moved = withNode(s, new Node(sensor.id(), sensor.role(), sensor.positionUm().plus(new Vec3(0, 0, 3)),
                sensor.radiusUm(), sensor.species(), sensor.emitsSpecies(), sensor.moleculesPerSymbol()));
        Plan p = planner.replan(moved);
        // source: brute force — the receivers that hear the sensor (channel entries) before or after the move
        long hearing = dev.nanoplan.network.AnalyticChannel.build(moved, PlanOptions.DEFAULT_CUTOFF_MOLECULES)
                .entries().stream().filter(e -> e.emitter().equals(sensor.id())).count();
        assertThat(planner.lastReevaluatedReceivers()).isEqualTo((int) hearing).isLessThan(receivers);
        assertThat(PlanGoldenTest.render(p)).isEqualTo(PlanGoldenTest.render(PreviewPlanner.plan(moved,
                PlanOptions.DEFAULT)));
    }

    /** One random valid edit (redrawn while the edited scenario is invalid, e.g. overlapping bodies). */
    static Scenario edit(Scenario s, UniformRandomProvider rng, boolean schedules) {
        for (int attempt = 0; attempt < 100; attempt++) {
            try {
                return tryEdit(s, rng, schedules);
            } catch (IllegalArgumentException invalid) {
                // draw another edit
            }
        }
        throw new IllegalStateException("no valid edit in 100 draws");
    }

    private static Scenario tryEdit(Scenario s, UniformRandomProvider rng, boolean schedules) {
        int kind = rng.nextInt(schedules ? 6 : 5);
        Node n = s.nodes().get(rng.nextInt(s.nodes().size()));
        switch (kind) {
            case 0: {
                Vec3 step = new Vec3(20 * rng.nextDouble() - 10, 20 * rng.nextDouble() - 10, 20 * rng.nextDouble() - 10);
                return withNode(s, new Node(n.id(), n.role(), n.positionUm().plus(step), n.radiusUm(), n.species(),
                        n.emitsSpecies(), n.moleculesPerSymbol()));
            }
            case 1:
                return withNode(s, new Node(n.id(), n.role(), n.positionUm(), n.radiusUm() * (0.7 + 0.6 * rng.nextDouble()),
                        n.species(), n.emitsSpecies(), n.moleculesPerSymbol()));
            case 2:
                if (!n.role().emits()) {
                    throw new IllegalArgumentException("not an emitter");
                }
                return withNode(s, new Node(n.id(), n.role(), n.positionUm(), n.radiusUm(), n.species(),
                        n.emitsSpecies(), Math.max(1, Math.round(n.moleculesPerSymbol() * (0.3 + 2 * rng.nextDouble())))));
            case 3: {
                String other = s.species().get(rng.nextInt(s.species().size())).name();
                String emits = n.role() == Role.RELAY ? n.emitsSpecies() : other;
                return withNode(s, new Node(n.id(), n.role(), n.positionUm(), n.radiusUm(), other, emits,
                        n.moleculesPerSymbol()));
            }
            case 4: {
                List<Species> species = new ArrayList<>(s.species());
                int i = rng.nextInt(species.size());
                Species sp = species.get(i);
                species.set(i, Species.ofDiffusion(sp.name(), sp.diffusionUm2PerS() * (0.6 + 0.8 * rng.nextDouble()),
                        sp.halfLifeS()));
                return new Scenario(s.name(), s.volume(), s.medium(), species, s.signalling(), s.nodes(), s.demands(),
                        s.targets());
            }
            default: {
                Signalling g = s.signalling();
                Schedule next = g.schedule() == Schedule.ALL_ACTIVE ? Schedule.ROUND_ROBIN : Schedule.ALL_ACTIVE;
                return new Scenario(s.name(), s.volume(), s.medium(), s.species(), new Signalling(g.symbolTimeS(),
                        g.isiMemorySymbols(), g.levels(), g.priorOne(), g.countModel(), next), s.nodes(), s.demands(),
                        s.targets());
            }
        }
    }

    static Scenario withNode(Scenario s, Node replaced) {
        List<Node> nodes = new ArrayList<>(s.nodes());
        nodes.replaceAll(n -> n.id().equals(replaced.id()) ? replaced : n);
        return new Scenario(s.name(), s.volume(), s.medium(), s.species(), s.signalling(), nodes, s.demands(),
                s.targets());
    }
}
