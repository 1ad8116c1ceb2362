package dev.nanoplan.report;

import static org.assertj.core.api.Assertions.assertThat;

import dev.nanoplan.plan.LinkReport;
import dev.nanoplan.plan.Plan;
import java.io.StringReader;
import java.util.List;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVRecord;
import org.junit.jupiter.api.Test;

class PlanCsvTest {

    private static List<CSVRecord> parse(String csv) throws Exception {
        // Apache Commons CSV's RFC4180 format: the reference reader for RFC 4180 (Y. Shafranovich, 2005)
        return CSVFormat.RFC4180.builder().setHeader().setSkipHeaderRecord(true).get()
                .parse(new StringReader(csv)).getRecords();
    }

    @Test
    void parsesBackWithQuotedCommasQuotesAndNewlines() throws Exception {
        String odd = "s3, \"the odd one\"\nsecond line";
        Plan plan = PlanFixtures.demo(odd);
        String csv = PlanCsv.links(plan);
        List<CSVRecord> rows = parse(csv);
        assertThat(rows).hasSize(plan.links().size());
        for (int i = 0; i < rows.size(); i++) {
            CSVRecord r = rows.get(i);
            LinkReport l = plan.links().get(i);
            assertThat(r.size()).isEqualTo(PlanCsv.HEADER.split(",").length);
            assertThat(r.get("from")).isEqualTo(l.from());
            assertThat(r.get("to")).isEqualTo(l.to());
            assertThat(Double.parseDouble(r.get("capacity_bits"))).isEqualTo(l.capacityBits());
            assertThat(Double.parseDouble(r.get("error_probability"))).isEqualTo(l.errorProbability());
            assertThat(Long.parseLong(r.get("threshold"))).isEqualTo(l.threshold());
            assertThat(r.get("limited_by")).isEqualTo(l.limitedBy().id());
            assertThat(r.get("top_interferer")).isEqualTo(l.topInterferer());
            double[] taps = l.taps();
            String[] cells = r.get("taps").split(";");
            assertThat(cells).hasSize(taps.length);
            for (int k = 0; k < taps.length; k++) {
                assertThat(Double.parseDouble(cells[k])).isEqualTo(taps[k]);
            }
        }
        assertThat(rows.get(3).get("from")).isEqualTo(odd);
        // RFC 4180 §2 rule 6: a field holding a double quote is quoted and the quote doubled
        assertThat(csv).contains("\"s3, \"\"the odd one\"\"\nsecond line\"");
        // RFC 4180 §2 rule 1: lines end in CRLF
        assertThat(csv).startsWith(PlanCsv.HEADER + "\r\n");
    }

    @Test
    void missingAndNonFiniteValuesAreEmptyFields() throws Exception {
        var l = PlanFixtures.link("a", "b", "A", Double.NaN, 0.1, null, null, 0);
        assertThat(PlanCsv.field("plain")).isEqualTo("plain");
        assertThat(PlanCsv.field("a,b")).isEqualTo("\"a,b\"");
        String csv = PlanCsv.links(new Plan(PlanFixtures.demo("s3").scenario(), "analytic", List.of(l), List.of(),
                List.of(), List.of()));
        CSVRecord r = parse(csv).get(0);
        assertThat(r.get("capacity_bits")).isEmpty();
        assertThat(r.get("limited_by")).isEmpty();
        assertThat(r.get("top_interferer")).isEmpty();
        assertThat(r.get("model_caveat")).isEmpty();
    }
}
