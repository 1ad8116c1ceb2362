package dev.nanoplan.plan;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import dev.nanoplan.network.AnalyticChannel;
import dev.nanoplan.network.ChannelEntry;
import dev.nanoplan.network.ChannelMatrix;
import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.ScenarioReader;
import dev.nanoplan.scenario.SwarmGenerator;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * The preview plan against the exact plan of the same layouts: the bundled scenarios and generated
 * swarms. The reference is {@link NetworkPlanner} (exact count laws), itself tested against published
 * formulas and Commons Statistics elsewhere.
 *
 * <p>Measured (2026-12-04, this code: on/off terms down to 0.1 % of the shared variance kept apart as a
 * reduced mixture): culture-tank max 0.0040 / median 0.0015 bit (16 links; before, with at most four
 * terms kept, max 0.31 bit and s05 -> relay-w 0.0175 against 0.0620 bit), swarm(160, 7) max 0.063 bit.
 * Earlier (2026-12-02, before that change): culture-tank max 0.31 / median 0.12 bit (16 links, none covered), relay-chain-direct 0.010 bit,
 * relay-chain-relayed max 0.009 / median 0 bit, vessel-segment max 0.0013 bit, swarm(100, 42) max
 * 0.0097 / median 0.0005 bit (23 links), swarm(160, 7) max 0.063 / median 0.0013 bit (37 links, one
 * link of 0.010 bit only in the exact plan). Same routes (hops) for every demand of these layouts.
 */
class PreviewPlannerTest {

    static Stream<Path> bundled() throws Exception {
        Path dir = Path.of("").toAbsolutePath();
        while (!Files.isDirectory(dir.resolve("scenarios"))) {
            dir = dir.getParent();
        }
        return Files.list(dir.resolve("scenarios")).filter(p -> p.toString().endsWith(".json")
                && !p.getFileName().toString().contains("schema")).sorted().toList().stream();
    }

    static Stream<Scenario> layouts() throws Exception {
        List<Scenario> out = new ArrayList<>();
        for (Path p : bundled().toList()) {
            Scenario s = ScenarioReader.strict().read(p);
            if (PreviewPlanner.supports(s)) {
                out.add(s);
            }
        }
        out.add(SwarmGenerator.generate(100, 42));
        out.add(SwarmGenerator.generate(160, 7));
        out.add(SwarmGenerator.generate(60, 4));
        return out.stream();
    }

    /**
     * Tolerance for "covered" links, those whose normally treated part is near normal (Lyapunov ratio
     * at most {@link #LYAPUNOV_LIMIT}, see {@link #lyapunovRatio}): 0.1 bit. Not a published bound (the
     * normal approximation has none for capacity); it is about 1.5× the largest difference measured on
     * these layouts (0.063 bit, t81 -> r131 of swarm(160, 7)), so a change that breaks the moments or the
     * tails fails it (checked once by doubling every variance in the tails: links of both swarms then
     * differ by 0.10 bit; dropping only the own-leftover variance is not caught, it is small there). The culture tank's links are not covered (L ≈ 1.7–2.1: a few
     * relays and sensors dominate the count) and their differences, up to 0.31 bit, are only reported.
     */
    static final double COVERED_TOLERANCE_BITS = 0.1;
    /** Links whose normally treated part has a Lyapunov ratio at most this are "covered". */
    static final double LYAPUNOV_LIMIT = 0.5;

    @ParameterizedTest
    @MethodSource("layouts")
    void previewAgreesWithTheExactPlanOnRoutesAndOnLinksWithoutManyStrongInterferers(Scenario s) {
        Plan exact = NetworkPlanner.plan(s, PlanOptions.DEFAULT);
        Plan preview = PreviewPlanner.plan(s, PlanOptions.DEFAULT);

        assertThat(PreviewPlanner.isPreview(preview)).isTrue();
        assertThat(PreviewPlanner.isPreview(exact)).isFalse();
        double stated = PreviewPlanner.deviationBits(preview);
        assertThat(stated).isEqualTo(preview.links().isEmpty() ? 0 : PreviewDeviation.bandBits(s.signalling().levels()));
        assertThat(preview.budgets()).isEmpty();
        assertThat(preview.routes()).hasSize(exact.routes().size());
        for (int i = 0; i < exact.routes().size(); i++) {
            RouteReport e = exact.routes().get(i);
            RouteReport p = preview.routes().get(i);
            // the same demand, found or missed alike; on these layouts the widest routes are the same
            assertThat(p.from() + p.to()).isEqualTo(e.from() + e.to());
            assertThat(p.hops()).as("route %s -> %s", e.from(), e.to()).isEqualTo(e.hops());
            // data-processing inequality (Cover & Thomas 2006, Thm 2.8.1): cascade <= weakest hop
            assertThat(p.endToEndCapacityBits()).isLessThanOrEqualTo(p.bottleneckCapacityBits() + 1e-12);
        }

        ChannelMatrix channel = AnalyticChannel.build(s, PlanOptions.DEFAULT.cutoffMolecules());
        Map<String, LinkReport> prev = new HashMap<>();
        preview.links().forEach(l -> prev.put(l.from() + "->" + l.to(), l));
        List<Double> covered = new ArrayList<>();
        List<Double> all = new ArrayList<>();
        int missing = 0;
        // both plans report the operating point: mutual information at the file's prior
        for (LinkReport e : exact.links()) {
            LinkReport p = prev.get(e.from() + "->" + e.to());
            if (p == null) {
                missing++;
                // a link the preview leaves out must be weak in the exact plan too
                assertThat(e.mutualInformationBits()).as("%s->%s", e.from(), e.to()).isLessThan(0.1);
                continue;
            }
            double d = Math.abs(p.mutualInformationBits() - e.mutualInformationBits());
            all.add(d);
            // the band the preview states in its first warning holds on every link (reference: the exact plan)
            assertThat(d).as("%s->%s exact %.4f preview %.4f, stated band", e.from(), e.to(),
                    e.mutualInformationBits(), p.mutualInformationBits()).isLessThanOrEqualTo(stated);
            if (lyapunovRatio(s, channel, e, NormalReceiverEvaluator.strongTerms(s.signalling().levels())) <= LYAPUNOV_LIMIT) {
                covered.add(d);
                assertThat(d).as("%s->%s exact %.4f preview %.4f", e.from(), e.to(), e.mutualInformationBits(),
                        p.mutualInformationBits()).isLessThanOrEqualTo(COVERED_TOLERANCE_BITS);
            }
        }
        System.out.printf(Locale.ROOT, "preview vs exact, %s: %d links, all max %.4f median %.4f bit; "
                + "%d covered max %.4f median %.4f bit; %d only in the exact plan%n", s.name(), all.size(), max(all),
                median(all), covered.size(), max(covered), median(covered), missing);
        // the preview reports no link the exact plan drops far below the floor
        for (LinkReport p : preview.links()) {
            boolean inExact = exact.links().stream().anyMatch(e -> e.from().equals(p.from()) && e.to().equals(p.to()));
            if (!inExact) {
                assertThat(p.mutualInformationBits()).as("%s->%s", p.from(), p.to()).isLessThan(0.1);
            }
        }
    }

    @Test
    void roundRobinLayoutsGetNoPreview() throws Exception {
        Path rr = bundled().filter(p -> p.getFileName().toString().equals("culture-tank-round-robin.json"))
                .findFirst().orElseThrow();
        Scenario s = ScenarioReader.strict().read(rr);
        assertThat(PreviewPlanner.supports(s)).isFalse();
        assertThatThrownBy(() -> PreviewPlanner.plan(s, PlanOptions.DEFAULT))
                .isInstanceOf(IllegalArgumentException.class).hasMessageStartingWith("signalling.schedule:");
    }

    @Test
    void theToleranceIsNotVacuousOnTheDraggedSwarm() {
        // the claim behind the tolerance must not be vacuous on the layout the desktop bench drags
        Scenario s = SwarmGenerator.generate(100, 42);
        Plan exact = NetworkPlanner.plan(s, PlanOptions.DEFAULT);
        ChannelMatrix channel = AnalyticChannel.build(s, PlanOptions.DEFAULT.cutoffMolecules());
        long coveredLinks = exact.links().stream()
                .filter(l -> lyapunovRatio(s, channel, l, NormalReceiverEvaluator.strongTerms(2)) <= LYAPUNOV_LIMIT).count();
        assertThat(coveredLinks).isGreaterThanOrEqualTo(exact.links().size() * 3 / 4);
    }

    /**
     * Lyapunov ratio of the part of the link's count that the preview treats as one normal law:
     * every per-slot term at the receiver except the link's own current symbol and the
     * {@code kept} terms with the largest on/off spread (those the preview keeps as a mixture),
     * L = Σ_t ρ_t / (Σ_t v_t + background)^{3/2}, with v_t the variance of a term and ρ_t the third
     * absolute central moment of its on/off part, w(1 − w)((1 − w)² + w²)·swing³ for prior w of the top
     * level (a scaled Bernoulli variable; the binomial spread of each level adds variance but little
     * skew). By the Berry–Esseen inequality for independent non-identical summands the normal law's
     * distribution-function error is at most 0.5600·L (I. Shevtsova, "An improvement of convergence
     * rate estimates in the Lyapunov theorem", Doklady Mathematics 82, 2010) — up to the neglected
     * binomial skew, so L ranks links by how far from normal their count is, which is what the test
     * needs.
     */
    static double lyapunovRatio(Scenario s, ChannelMatrix channel, LinkReport link, int kept) {
        Map<String, Node> nodes = s.nodesById();
        double[] w = LinkContext.weights(s.signalling());
        double top = w[w.length - 1];
        double var = link.backgroundMean();
        List<double[]> onOff = new ArrayList<>();
        for (ChannelEntry e : channel.atReceiver(link.to())) {
            long[] lv = LinkContext.levelsOf(s.signalling(), nodes.get(e.emitter()).moleculesPerSymbol());
            double a = 0;
            double b = 0;
            for (int j = 0; j < lv.length; j++) {
                a += w[j] * lv[j];
                b += w[j] * (double) lv[j] * lv[j];
            }
            long swing = lv[lv.length - 1] - lv[0];
            double[] taps = e.taps();
            for (int k = 0; k < taps.length; k++) {
                if (e.emitter().equals(link.from()) && k == 0) {
                    continue;
                }
                double p = taps[k];
                double spread = p * p * Math.max(0, b - a * a);
                double within = p * (1 - p) * a;
                double x = swing * p;
                onOff.add(new double[] {spread, within, top * (1 - top) * ((1 - top) * (1 - top) + top * top) * x * x * x});
            }
        }
        onOff.sort((x, y) -> Double.compare(y[0], x[0]));
        double rho = 0;
        for (int i = 0; i < onOff.size(); i++) {
            double[] t = onOff.get(i);
            if (i < kept) {
                continue;
            }
            var += t[0] + t[1];
            rho += t[2];
        }
        return var > 0 ? rho / Math.pow(var, 1.5) : 0;
    }

    static double max(List<Double> d) {
        return d.stream().mapToDouble(Double::doubleValue).max().orElse(0);
    }

    static double median(List<Double> d) {
        double[] a = d.stream().mapToDouble(Double::doubleValue).sorted().toArray();
        return a.length == 0 ? 0 : a[a.length / 2];
    }
}
