package dev.nanoplan.desktop;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.data.Offset.offset;

import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.ScenarioReader;
import dev.nanoplan.scenario.Tolerances;
import dev.nanoplan.tolerance.Sampler;
import dev.nanoplan.tolerance.Thresholds;
import dev.nanoplan.tolerance.ToleranceResult;
import dev.nanoplan.tolerance.ToleranceRunner;
import dev.nanoplan.tolerance.ToleranceStudy;
import dev.nanoplan.geometry.Vec3;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.ScheduledExecutorService;
import java.util.concurrent.TimeUnit;
import java.util.stream.IntStream;
import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.simple.RandomSource;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.Timeout;

/**
 * The Tolerance tab's view model without a window, on the bundled two-relay chain with the demo
 * spreads: its rows against planner-core's study run directly with the same seed, the intervals it
 * shows against the Wilson score formula written out here, the histogram's bins, the "no tolerances"
 * path, Cancel (partial result) and the outlines cleared by an edit.
 */
@Timeout(120)
class ToleranceViewModelTest {

    static final Path SCENARIOS = Path.of("..", "scenarios");

    ScheduledExecutorService planning;
    ExecutorService worker;
    PlannerViewModel planner;
    ToleranceViewModel tol;

    @BeforeEach
    void setUp() throws Exception {
        planning = PlannerViewModel.daemonScheduler();
        planner = new PlannerViewModel(new FakePlans(), Runnable::run, planning, 0, new RecentFiles(null));
        worker = Executors.newSingleThreadExecutor();
        tol = new ToleranceViewModel(planner, Runnable::run, worker, 1);
        planner.load(ScenarioReader.strict().read(SCENARIOS.resolve("relay-chain-relayed.json")), null);
    }

    @AfterEach
    void tearDown() {
        planning.shutdownNow();
        worker.shutdownNow();
    }

    @Test
    void aLayoutWithoutTolerancesIsSaidSoAndTheDemoDefaultsCanBeStoredAsOneEdit() {
        assertThat(tol.noTolerancesProperty().get()).isTrue();
        assertThat(tol.toleranceFields()).allSatisfy(f -> assertThat(f.get()).isEqualTo("0"));
        tol.useDemoDefaults();
        assertThat(tol.toleranceFields()).extracting(f -> f.get()).containsExactly("2", "5", "10", "5", "0.5");
        assertThat(tol.storeInLayout()).isTrue();
        assertThat(planner.scenarioProperty().get().tolerances()).isEqualTo(ToleranceViewModel.DEMO);
        assertThat(tol.noTolerancesProperty().get()).isFalse();
        assertThat(planner.undo()).isTrue();
        assertThat(planner.scenarioProperty().get().tolerances()).isEqualTo(Tolerances.NONE);
        assertThat(tol.noTolerancesProperty().get()).isTrue();
    }

    @Test
    void aBadFieldIsRefusedNamingIt() {
        tol.toleranceFields().get(0).set("-1");
        assertThat(tol.run()).isFalse();
        assertThat(tol.statusProperty().get()).startsWith("not started: position_sd_um");
        tol.toleranceFields().get(0).set("1");
        tol.samplesProperty().set("0");
        assertThat(tol.run()).isFalse();
        assertThat(tol.statusProperty().get()).contains("samples");
    }

    @Test
    void theRowsAreTheCoreStudyOfTheSameSeedAndTheIntervalsWilsons() throws Exception {
        tol.useDemoDefaults();
        tol.samplesProperty().set("12");
        tol.seedProperty().set("7");
        tol.samplerProperty().set(Sampler.RANDOM);
        assertThat(tol.run()).isTrue();
        assertThat(tol.finished().get(100, TimeUnit.SECONDS)).isEqualTo(ToleranceViewModel.Outcome.COMPLETE);

        Scenario s = ToleranceViewModel.withTolerances(planner.scenarioProperty().get(), ToleranceViewModel.DEMO);
        ToleranceResult direct = new ToleranceRunner(new ToleranceStudy(s, Sampler.RANDOM, 7, Thresholds.DESIGN), 1,
                ToleranceViewModel.GUARD_SAMPLES).run(12, d -> { });
        // the same links, the weak ones first in the core's order (likeliest failure first), then the rest
        List<ToleranceResult.LinkYield> expected = new ArrayList<>();
        direct.weakLinks().forEach(i -> expected.add(direct.links().get(i)));
        for (int l = 0; l < direct.links().size(); l++) {
            if (!direct.weakLinks().contains(l)) {
                expected.add(direct.links().get(l));
            }
        }
        assertThat(tol.links()).extracting(ToleranceRow::link).containsExactlyElementsOf(expected);
        assertThat(tol.links()).extracting(ToleranceRow::weakRank).startsWith(
                IntStream.rangeClosed(1, direct.weakLinks().size()).boxed().toArray(Integer[]::new));
        assertThat(tol.demands()).extracting(ToleranceRow::yield)
                .containsExactlyElementsOf(direct.demands().stream().map(ToleranceResult.DemandYield::yield).toList());
        for (ToleranceRow r : tol.links()) {
            double n = 12;
            double k = Math.round(r.yield() * n);
            double z = 1.959963984540054;
            // E. B. Wilson, "Probable inference, the law of succession, and statistical inference",
            // JASA 22 (1927): centre (p + z²/2n)/(1 + z²/n), half-width z√(p(1−p)/n + z²/4n²)/(1 + z²/n)
            double p = k / n;
            double centre = (p + z * z / (2 * n)) / (1 + z * z / n);
            double half = z * Math.sqrt(p * (1 - p) / n + z * z / (4 * n * n)) / (1 + z * z / n);
            assertThat(r.interval().get(0)).isCloseTo(Math.max(0, centre - half), offset(1e-12));
            assertThat(r.interval().get(1)).isCloseTo(Math.min(1, centre + half), offset(1e-12));
            assertThat(r.intervalText()).isEqualTo(Formats.sig(r.interval().get(0)) + " – " + Formats.sig(r.interval().get(1)));
        }
        // weak links for the 3D view: the core's, likeliest failure first, failure = 1 − yield
        assertThat(tol.weakLinks()).extracting(w -> w.from() + "→" + w.to()).containsExactlyElementsOf(
                direct.weakLinks().stream().map(i -> direct.links().get(i).from() + "→" + direct.links().get(i).to()).toList());
        assertThat(tol.weakLinks()).allSatisfy(w -> assertThat(w.failureProbability()).isPositive());
        // the selected link's histogram holds every sample of it
        assertThat(tol.selectedLinkProperty().get()).isNotNull();
        assertThat(tol.histogram().stream().mapToInt(ToleranceViewModel.Bin::count).sum()).isEqualTo(12);

        // an edit clears the outlines (they belong to the studied layout) and marks the rows stale
        planner.editor().moveNode("relay1", planner.scenarioProperty().get().nodesById().get("relay1").positionUm()
                .plus(new Vec3(1, 0, 0)));
        assertThat(tol.weakLinks()).isEmpty();
        assertThat(tol.staleProperty().get()).isTrue();
    }

    @Test
    void cancelShowsTheFinishedSamplesMarkedPartial() throws Exception {
        tol.useDemoDefaults();
        tol.samplesProperty().set("100000");
        // cancel as soon as the first samples are reported
        tol.progressProperty().addListener((o, a, b) -> {
            if (b.doubleValue() > 0) {
                tol.cancel();
            }
        });
        assertThat(tol.run()).isTrue();
        assertThat(tol.finished().get(100, TimeUnit.SECONDS)).isEqualTo(ToleranceViewModel.Outcome.PARTIAL);
        assertThat(tol.result().partial()).isTrue();
        assertThat(tol.result().samples()).isBetween(1, 99_999);
        assertThat(tol.statusProperty().get()).startsWith("partial (cancelled)");
        assertThat(tol.links()).allSatisfy(r -> assertThat(r.guardBand(true).text())
                .isIn("not needed", "not sized"));
    }

    @Test
    void binsHaveEqualWidthsAndHoldEveryValueOnce() {
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(42L);
        List<Double> values = rng.doubles(400).boxed().toList();
        List<ToleranceViewModel.Bin> bins = ToleranceViewModel.bins(values, 20);
        // common practice: about √n equal-width bins spanning [min, max]
        assertThat(bins).hasSize(20);
        double width = bins.get(0).highBits() - bins.get(0).lowBits();
        assertThat(bins).allSatisfy(b -> assertThat(b.highBits() - b.lowBits()).isCloseTo(width,
                offset(1e-12)));
        for (ToleranceViewModel.Bin b : bins) {
            long inside = values.stream().filter(v -> v >= b.lowBits() && (v < b.highBits()
                    || b == bins.get(bins.size() - 1))).count();
            assertThat(b.count()).isEqualTo((int) inside);
        }
        assertThat(ToleranceViewModel.bins(List.of(0.5, 0.5, 0.5), 20)).containsExactly(
                new ToleranceViewModel.Bin(0.5, 0.5, 3));
    }
}
