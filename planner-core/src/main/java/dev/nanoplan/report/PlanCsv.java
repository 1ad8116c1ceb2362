package dev.nanoplan.report;

import dev.nanoplan.plan.LinkReport;
import dev.nanoplan.plan.Plan;
import java.util.List;
import java.util.StringJoiner;

/**
 * The link table of a plan as CSV (RFC 4180: CRLF line ends, a header row, fields holding a comma,
 * double quote, CR or LF are enclosed in double quotes with inner quotes doubled).
 *
 * <p>Columns: {@value #HEADER}. Numbers are written with {@link Double#toString} (shortest text
 * that reads back to the same double); a non-finite number or a missing value is an empty field.
 * {@code taps} holds p_0..p_L separated by semicolons. Cost O(total taps + links).
 */
public final class PlanCsv {

    /** The header row. */
    public static final String HEADER = "from,to,species,hit_probability,signal_mean,interference_mean,isi_mean,"
            + "background_mean,threshold,error_probability,log10_error_probability,min_error_threshold,"
            + "min_error_probability,mutual_information_bits,rate_bits_per_s,capacity_bits,capacity_prior_one,"
            + "count_blind,limited_by,top_interferer,top_interferer_share,model_caveat,taps";

    private static final String EOL = "\r\n";

    private PlanCsv() {
    }

    /** The link table, one row per link in the plan's order, after the header. */
    public static String links(Plan plan) {
        StringBuilder sb = new StringBuilder(HEADER).append(EOL);
        for (LinkReport l : plan.links()) {
            StringJoiner taps = new StringJoiner(";");
            for (double t : l.taps()) {
                taps.add(number(t));
            }
            List<String> row = List.of(l.from(), l.to(), l.species(), number(l.hitProbability()),
                    number(l.signalMean()), number(l.interferenceMean()), number(l.isiMean()),
                    number(l.backgroundMean()), Long.toString(l.threshold()), number(l.errorProbability()),
                    number(l.log10ErrorProbability()),
                    l.minErrorThreshold() < 0 ? "" : Long.toString(l.minErrorThreshold()),
                    number(l.minErrorProbability()), number(l.mutualInformationBits()), number(l.rateBitsPerS()),
                    number(l.capacityBits()), number(l.capacityPriorOne()), Boolean.toString(l.countBlind()),
                    l.limitedBy() == null ? "" : l.limitedBy().id(), nullToEmpty(l.topInterferer()),
                    number(l.topInterfererShare()), nullToEmpty(l.modelCaveat()), taps.toString());
            StringJoiner line = new StringJoiner(",");
            row.forEach(f -> line.add(field(f)));
            sb.append(line).append(EOL);
        }
        return sb.toString();
    }

    /** One field, quoted per RFC 4180 when it holds a comma, quote, CR or LF. */
    static String field(String s) {
        if (s.indexOf(',') >= 0 || s.indexOf('"') >= 0 || s.indexOf('\r') >= 0 || s.indexOf('\n') >= 0) {
            return '"' + s.replace("\"", "\"\"") + '"';
        }
        return s;
    }

    private static String number(double v) {
        return Double.isFinite(v) ? Double.toString(v) : "";
    }

    /** Not computed (null) reads as an empty field, like a non-finite number. */
    private static String number(Double v) {
        return v == null ? "" : number(v.doubleValue());
    }

    private static String nullToEmpty(String s) {
        return s == null ? "" : s;
    }
}
