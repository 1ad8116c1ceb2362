package dev.nanoplan.network;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import dev.nanoplan.physics.PassiveSphereObservation;
import dev.nanoplan.plan.LinkReport;
import dev.nanoplan.plan.NetworkPlanner;
import dev.nanoplan.plan.Plan;
import dev.nanoplan.plan.PlanOptions;
import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.ReceiverModel;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.ScenarioException;
import dev.nanoplan.scenario.ScenarioReader;
import java.io.ByteArrayInputStream;
import java.nio.charset.StandardCharsets;
import java.util.List;
import org.apache.commons.math3.analysis.integration.IterativeLegendreGaussIntegrator;
import org.junit.jupiter.api.Test;

/** The scenario's receiver models in the analytic channel, the shading test and the planner. */
class ReceiverModelChannelTest {

    /** s1 → gw over 30 µm; a second receiver "bl" (radius 8) sits between them; t2 → bl. */
    private static final String FILE = """
            {"format": "nanoplan/1", "name": "receiver models",
             "volume": {"shape": "open"},
             "species": [{"name": "A", "diffusion_um2_per_s": 80.0, "half_life_s": 2.0}],
             "signalling": {"symbol_time_s": 0.5, "isi_memory_symbols": 4},
             "nodes": [
               {"id": "s1", "role": "transmitter", "position_um": [0, 0, 0], "radius_um": 1,
                "species": "A", "molecules_per_symbol": 3000},
               {"id": "t2", "role": "transmitter", "position_um": [15, 25, 0], "radius_um": 1,
                "species": "A", "molecules_per_symbol": 3000},
               {"id": "gw", "role": "receiver", "position_um": [30, 0, 0], "radius_um": 5, "species": "A"GW},
               {"id": "bl", "role": "receiver", "position_um": [15, 0, 0], "radius_um": 8, "species": "A"BL}],
             "demands": [{"from": "s1", "to": "gw"}, {"from": "t2", "to": "bl"}]}
            """;

    private static Scenario read(String gw, String bl) throws ScenarioException {
        String text = FILE.replace("GW", gw).replace("BL", bl);
        return ScenarioReader.strict().read(new ByteArrayInputStream(text.getBytes(StandardCharsets.UTF_8)));
    }

    @Test
    void passiveTapsAreTheGreensFunctionOverTheBallAtTheSamplingInstants() throws Exception {
        Scenario s = read(", \"receiver\": \"passive\", \"sampling_offset_s\": 0.3", "");
        ChannelMatrix m = AnalyticChannel.build(s, 1e-9);
        double[] taps = m.taps("s1", "gw");
        // source: the closed form of the passive observer, PassiveSphereObservation (same d, r, D, half-life, offset)
        assertThat(taps).containsExactly(PassiveSphereObservation.of(30, 5, 80.0, 2.0, 0.3).taps(0.5, 4));
        // source: independent quadrature (Commons Math Gauss–Legendre) of the free-space Green's function over the
        // ball, reduced to the radial integral P(t) = 1/(d·s·√π)·∫₀ʳ ρ[e^{−(d−ρ)²/s²} − e^{−(d+ρ)²/s²}]dρ,
        // s = √(4Dt), times the survival e^{−λt} (A. Noel, K. C. Cheung, R. Schober, IEEE Trans. NanoBiosci. 13(1), 2014)
        IterativeLegendreGaussIntegrator q = new IterativeLegendreGaussIntegrator(16, 1e-13, 1e-300);
        double d = 30;
        for (int k = 0; k < taps.length; k++) {
            double t = k * 0.5 + 0.3;
            double s2 = 4 * 80.0 * t;
            double integral = q.integrate(100_000, rho -> rho * (Math.exp(-(d - rho) * (d - rho) / s2)
                    - Math.exp(-(d + rho) * (d + rho) / s2)), 0, 5);
            double expected = integral / (d * Math.sqrt(s2 * Math.PI)) * Math.exp(-Math.log(2) / 2.0 * t);
            assertThat(taps[k]).isCloseTo(expected, within(1e-10 * expected));
        }
    }

    @Test
    void passiveReceiverDoesNotShade() throws Exception {
        Scenario absorbing = read("", "");
        Scenario passive = read("", ", \"receiver\": \"passive\"");
        ChannelMatrix ma = AnalyticChannel.build(absorbing, 1e-9);
        ChannelMatrix mp = AnalyticChannel.build(passive, 1e-9);
        List<ChannelEntry> fromS1a = ma.entries().stream().filter(e -> e.emitter().equals("s1")).toList();
        List<ChannelEntry> fromS1p = mp.entries().stream().filter(e -> e.emitter().equals("s1")).toList();
        Node gw = absorbing.nodesById().get("gw");
        // source: the shading bound of ChannelApplicability (an absorber of radius 8 on the line takes a large part)
        assertThat(ChannelApplicability.of(absorbing).shadingCatch(absorbing.nodesById().get("s1"), gw,
                absorbing.speciesByName().get("A"), fromS1a)).isGreaterThan(0.05 * ma.entry("s1", "gw").tapSum());
        // source: the passive model's meaning (transparent; removes nothing, so it cannot shade)
        assertThat(ChannelApplicability.of(passive).shadingCatch(passive.nodesById().get("s1"), gw,
                passive.speciesByName().get("A"), fromS1p)).isZero();
        assertThat(mp.entry("s1", "gw").channelReason()).doesNotContain("other absorbers take");
        assertThat(AnalyticChannel.covered(ma.entry("s1", "gw"))).isFalse();
    }

    @Test
    void reactiveReceiverWithHugeRatePlansLikeTheAbsorbingOne() throws Exception {
        Plan absorbing = NetworkPlanner.plan(read("", ""), PlanOptions.DEFAULT);
        Plan reactive = NetworkPlanner.plan(read(", \"receiver\": \"reactive\", \"binding_rate_um_per_s\": 1e12",
                ", \"receiver\": \"reactive\", \"binding_rate_um_per_s\": 1e12"), PlanOptions.DEFAULT);
        // source: the Collins–Kimball limit κ → ∞ is the perfect absorber (F. C. Collins and G. E. Kimball,
        // J. Colloid Sci. 4, 1949): the capture factor κr/(κr + D) differs from 1 by D/(κr) ≈ 1.6e-11 here
        assertThat(reactive.links()).hasSameSizeAs(absorbing.links()).isNotEmpty();
        for (int i = 0; i < absorbing.links().size(); i++) {
            LinkReport a = absorbing.links().get(i);
            LinkReport r = reactive.links().get(i);
            assertThat(r.from() + r.to()).isEqualTo(a.from() + a.to());
            assertThat(r.threshold()).isEqualTo(a.threshold());
            assertThat(r.mutualInformationBits()).isCloseTo(a.mutualInformationBits(),
                    within(1e-7 * Math.max(1e-300, a.mutualInformationBits())));
            assertThat(r.taps()).containsExactly(a.taps(), within(1e-8 * a.taps()[0]));
        }
    }

    @Test
    void slowBindingCountsLessThanTheAbsorber() throws Exception {
        ChannelMatrix a = AnalyticChannel.build(read("", ""), 1e-9);
        ChannelMatrix r = AnalyticChannel.build(read(", \"receiver\": \"reactive\", \"binding_rate_um_per_s\": 1", ""), 1e-9);
        // source: the reactive capture factor κr/(κr + D) = 5/85 without decay (Collins and Kimball 1949); with decay
        // and finite memory the ratio of the catches stays below it
        double ratio = r.entry("s1", "gw").tapSum() / a.entry("s1", "gw").tapSum();
        assertThat(ratio).isLessThan(5.0 / 85).isGreaterThan(0);
    }
}
