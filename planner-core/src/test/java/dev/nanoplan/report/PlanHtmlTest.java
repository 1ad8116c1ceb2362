package dev.nanoplan.report;

import static org.assertj.core.api.Assertions.assertThat;

import dev.nanoplan.plan.Plan;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;

class PlanHtmlTest {

    private static final String EVIL = "<script>alert('x')</script>";

    @Test
    void showsTheCautionsAssumptionsAndBothViews() {
        String html = PlanHtml.render(PlanFixtures.demo("s3"));
        // docs/architecture.md §6: the cautions are shown, in full, in every human-readable output
        for (String c : Cautions.FULL) {
            assertThat(html).contains(PlanHtml.esc(c));
        }
        for (String a : Cautions.ASSUMPTIONS) {
            assertThat(html).contains(PlanHtml.esc(a));
        }
        assertThat(html).startsWith("<!DOCTYPE html>").contains("Top view (x–y)").contains("Side view (x–z)");
        assertThat(html.split("<svg ", -1)).hasSize(3);
        assertThat(html).contains("s1 → relay → gw").contains("unreachable").contains("lengthen the symbol time");
        // an error probability below the double range shows its log10
        assertThat(html).contains("10^-412.5");
    }

    @Test
    void escapesEveryUserString() {
        Plan p = PlanFixtures.demo(EVIL);
        String html = PlanHtml.render(p);
        assertThat(html).doesNotContainIgnoringCase("<script");
        assertThat(html).contains("&lt;script&gt;alert(&#39;x&#39;)&lt;/script&gt;");
        assertThat(html).contains("Demo tank, &quot;quoted&quot; &amp; &lt;b&gt;bold&lt;/b&gt;");
        assertThat(html).contains("add a relay, a &quot;&lt;b&gt;&quot; hint");
        assertThat(html).doesNotContain("<b>");
    }

    @Test
    void putsTheAdviceUnderEachRouteAndNoSentinelInTheBudgets() {
        Plan p = PlanFixtures.demo("s3");
        String html = PlanHtml.render(p);
        // one full-width advice row per route (seven columns)
        assertThat(html.split("<tr class=\"advice\"><td colspan=\"7\">", -1)).hasSize(p.routes().size() + 1);
        // units in the link table's headers; a budget without a value is a dash with its reason, never -1
        assertThat(html).contains("Signal (molecules)", "ISI (molecules)", "Crosstalk (molecules)")
                .doesNotContain(">-1<");
    }

    @Test
    void givesEveryBudgetColumnAtLeast150Pixels() {
        String html = PlanHtml.render(PlanFixtures.demo("s3"));
        // issue 11's reading check at 1,300 px wide (a headless Chromium screenshot showed the node ids
        // broken over two lines): the budgets table, like the routes table, keeps each column ≥ 150 px
        assertThat(html).contains("<table class=\"budgets\">")
                .contains("table.budgets th, table.budgets td { min-width: 150px; }");
    }

    @Test
    void isSelfContained() {
        String html = PlanHtml.render(PlanFixtures.demo("s3"));
        // no fetched resource: no src/href attributes, no @import or url() other than in-page gradients
        assertThat(html).doesNotContainPattern(Pattern.compile("\\s(src|href)\\s*=", Pattern.CASE_INSENSITIVE));
        assertThat(html).doesNotContain("@import");
        assertThat(Pattern.compile("url\\((?!#)").matcher(html).find()).isFalse();
        // the only URI is the SVG namespace name, which browsers never fetch
        assertThat(html.replace("http://www.w3.org/2000/svg", "")).doesNotContain("http://").doesNotContain("https://");
    }

    @Test
    void capsTheLinkTable() {
        Plan grid = PlanFixtures.grid(30);
        String html = PlanHtml.render(grid);
        int rows = html.split("<tr><td>n", -1).length - 1;
        // 30 × 30 grid: 435 links; the routes table's rows are of class "route", so only link rows count
        assertThat(grid.links()).hasSizeGreaterThan(PlanHtml.MAX_LINK_ROWS);
        assertThat(rows).isEqualTo(PlanHtml.MAX_LINK_ROWS);
        assertThat(html).contains("The 200 most informative links of " + grid.links().size());
    }
}
