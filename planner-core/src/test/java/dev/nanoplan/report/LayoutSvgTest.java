package dev.nanoplan.report;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import dev.nanoplan.geometry.Vec3;
import dev.nanoplan.geometry.Volume;
import dev.nanoplan.plan.Plan;
import dev.nanoplan.scenario.Medium;
import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.Role;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.Signalling;
import dev.nanoplan.scenario.Species;
import dev.nanoplan.scenario.Targets;
import java.io.StringReader;
import java.util.List;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import javax.xml.parsers.DocumentBuilderFactory;
import org.junit.jupiter.api.Test;
import org.xml.sax.InputSource;

class LayoutSvgTest {

    private static Plan single(Volume volume, Vec3 at) {
        Scenario s = new Scenario("one", volume, Medium.DEFAULT, List.of(Species.stable("A", 80)),
                Signalling.withSymbolTime(1), List.of(Node.transmitter("t", at, 2, "A", 10)), List.of(),
                Targets.DEFAULT);
        return new Plan(s, "analytic", List.of(), List.of(), List.of(), List.of());
    }

    @Test
    void nodeLandsOnTheHandComputedPixel() {
        Plan p = single(new Volume.Box(new Vec3(0, 0, 0), new Vec3(400, 200, 100)), new Vec3(100, 50, 25));
        // Hand computation from the documented layout: plot width 480 − 2·40 = 400 px for 400 µm,
        // so 1 px/µm; plot height 200 px; left edge 40, bottom row 34 + 200 = 234.
        // x = 40 + 100 = 140, y = 234 − 50 = 184.
        String top = LayoutSvg.render(p, LayoutSvg.View.TOP, 480, 600, 10);
        assertThat(top).contains("<circle cx=\"140.00\" cy=\"184.00\" r=\"3.50\"");
        assertThat(top).contains("width=\"480\" height=\"318\"");
        // Side view: z spans 100 µm (100 px) in a plot raised to the 120 px minimum and centred:
        // bottom row 34 + 120 − 10 = 144; y = 144 − 25 = 119.
        String side = LayoutSvg.render(p, LayoutSvg.View.SIDE, 480, 600, 10);
        assertThat(side).contains("<circle cx=\"140.00\" cy=\"119.00\"");
        assertThat(side).contains("height=\"238\"");
    }

    @Test
    void cylinderIsCentredOnItsAxis() {
        Plan p = single(new Volume.Cylinder(50, 1000), new Vec3(500, 0, 0));
        LayoutSvg.Transform t = LayoutSvg.transform(p.scenario(), LayoutSvg.View.TOP, 1080, 600);
        // 1000 µm over 1000 px: 1 px/µm; extent −50..50 in y, plot raised to 120 px, centred
        assertThat(t.pxPerUm()).isEqualTo(1.0);
        assertThat(t.xPx(500)).isEqualTo(540.0);
        assertThat(t.yPx(0)).isCloseTo(34 + 60, within(1e-12));
    }

    @Test
    void zoomsToNodesCrowdedInALargeVolume() {
        Plan p = PlanFixtures.demo("s3");
        LayoutSvg.Transform whole = LayoutSvg.transform(p.scenario(), LayoutSvg.View.SIDE, 640, 620, false);
        LayoutSvg.Transform zoom = LayoutSvg.transform(p.scenario(), LayoutSvg.View.SIDE, 640, 620, true);
        // side view: nodes at z 80..120 in a 200 µm tall box; padded by 10 µm radius + 10 % of the
        // 260 µm x span = 36 µm → z 44..156 µm, 112 µm of 200: below half the area, so zoomed
        assertThat(whole.spanVUm()).isEqualTo(200.0);
        assertThat(zoom.spanVUm()).isCloseTo(112.0, within(1e-9));
        assertThat(zoom.pxPerUm()).isGreaterThan(whole.pxPerUm());
        assertThat(LayoutSvg.render(p, LayoutSvg.View.SIDE)).contains("zoomed to the nodes; box 400 × 400 × 200 µm");
    }

    @Test
    void openMediumUsesThePaddedNodeExtent() {
        Plan p = single(new Volume.Open(), new Vec3(-7, 3, 11));
        LayoutSvg.Transform t = LayoutSvg.transform(p.scenario(), LayoutSvg.View.TOP, 480, 600);
        // one node: span 0 → padded by its radius (2) and 1 µm on each side
        assertThat(t.spanUUm()).isEqualTo(6.0);
        assertThat(t.xPx(-7)).isCloseTo(240.0, within(1e-9));
        assertThat(LayoutSvg.render(p, LayoutSvg.View.TOP)).contains("stroke-dasharray=\"6 4\"");
    }

    @Test
    void drawsRoutesOnTopAndIsWellFormedXml() throws Exception {
        String svg = LayoutSvg.render(PlanFixtures.demo("<script>x</script>"), LayoutSvg.View.TOP);
        // three reachable routes, hops s1→relay, relay→gw, s2→relay, odd→gw: four distinct hops
        // each hop is outlined in the route colour under its capacity colour
        assertThat(count(svg, "stroke=\"" + LayoutSvg.ROUTE_COLOUR + "\" stroke-width=\"6.00\"")).isEqualTo(4);
        assertThat(svg).doesNotContain("<script>").contains("&lt;script&gt;x&lt;/script&gt;");
        // parses as XML (W3C, Extensible Markup Language 1.0, 2008): escaping and nesting are right
        DocumentBuilderFactory.newInstance().newDocumentBuilder().parse(new InputSource(new StringReader(svg)));
    }

    @Test
    void largeLayoutsDrawOnlyRouteHopsAndTheStrongestLinks() {
        Plan grid = PlanFixtures.grid(100);
        assertThat(grid.scenario().nodes()).hasSize(10_000);
        String svg = LayoutSvg.render(grid, LayoutSvg.View.TOP, 660, 620, 50);
        String links = svg.substring(svg.indexOf("<g class=\"links\""), svg.indexOf("<g class=\"routes\""));
        assertThat(count(links, "<line ")).isEqualTo(50);
        // the strongest link (i = j = 98: capacity (98·100 + 98)/10⁴ = 0.9898) is among them, drawn last
        assertThat(links).endsWith("stroke=\"" + LayoutSvg.capacityColour(0.9898)
                + "\" stroke-width=\"1.40\" stroke-opacity=\"0.90\"/>\n</g>\n");
        assertThat(svg).contains("showing route hops + the 50 strongest of " + grid.links().size() + " links");
        assertThat(svg).doesNotContain(">n0_0<");
    }

    @Test
    void colourRampIsViridisAndClamps() {
        // matplotlib's viridis listed map (van der Walt and Smith 2015): index 0 (0.267, 0.005, 0.329),
        // 128 of 256 (0.128, 0.567, 0.551) and 255 (0.993, 0.906, 0.144), as #rrggbb
        assertThat(LayoutSvg.capacityColour(0)).isEqualTo("#440154");
        assertThat(LayoutSvg.capacityColour(0.5)).isEqualTo("#21918c");
        assertThat(LayoutSvg.capacityColour(1)).isEqualTo("#fde725");
        assertThat(LayoutSvg.capacityColour(7)).isEqualTo("#fde725");
        assertThat(LayoutSvg.capacityColour(Double.NaN)).isEqualTo("#440154");
    }

    @Test
    void roleAndRouteColoursAreOkabeIto() {
        // M. Okabe and K. Ito, "Color Universal Design", 2008: sky blue (86,180,233), orange (230,159,0),
        // reddish purple (204,121,167), vermilion (213,94,0)
        assertThat(Palette.role(Role.TRANSMITTER)).isEqualTo("#56b4e9");
        assertThat(Palette.role(Role.RECEIVER)).isEqualTo("#e69f00");
        assertThat(Palette.role(Role.RELAY)).isEqualTo("#cc79a7");
        assertThat(LayoutSvg.ROUTE_COLOUR).isEqualTo("#d55e00");
    }

    @Test
    void scaleBarLengthsAreOneTwoFive() {
        assertThat(LayoutSvg.niceLength(80)).isEqualTo(50);
        assertThat(LayoutSvg.niceLength(0.3)).isCloseTo(0.2, within(1e-15));
        assertThat(LayoutSvg.niceLength(100)).isEqualTo(100);
        assertThat(LayoutSvg.niceLength(1999)).isEqualTo(1000);
    }

    private static int count(String s, String needle) {
        Matcher m = Pattern.compile(Pattern.quote(needle)).matcher(s);
        int n = 0;
        while (m.find()) {
            n++;
        }
        return n;
    }
}
