package dev.nanoplan.design;

import java.util.ArrayList;
import java.util.List;

/**
 * The values of one swept field: a list {@code a,b,c} or a range {@code start:stop:step} (stop
 * included when the steps land on it within a millionth of a step; each value is start + i·step, not a
 * running sum, so rounding does not drift).
 */
public final class SweepSpec {

    /** Most values one field may take (a guard against a mistyped step). */
    public static final int MAX_VALUES = 10_000;

    private SweepSpec() {
    }

    /**
     * Parses a SPEC.
     *
     * @throws IllegalArgumentException naming the spec when it is not a list of finite numbers or a
     *     range with step &gt; 0 and stop ≥ start
     */
    public static List<Double> parse(String spec) {
        if (spec == null || spec.isBlank()) {
            throw new IllegalArgumentException("SPEC: empty");
        }
        if (spec.contains(":")) {
            String[] p = spec.split(":", -1);
            if (p.length != 3) {
                throw new IllegalArgumentException(spec + ": a range is start:stop:step");
            }
            double start = number(spec, p[0]);
            double stop = number(spec, p[1]);
            double step = number(spec, p[2]);
            if (!(step > 0)) {
                throw new IllegalArgumentException(spec + ": step must be > 0, got " + p[2].trim());
            }
            if (stop < start) {
                throw new IllegalArgumentException(spec + ": stop must be >= start");
            }
            double count = Math.floor((stop - start) / step + 1e-6) + 1;
            if (count > MAX_VALUES) {
                throw new IllegalArgumentException(spec + ": more than " + MAX_VALUES + " values");
            }
            List<Double> out = new ArrayList<>();
            for (int i = 0; i < (int) count; i++) {
                out.add(start + i * step);
            }
            return out;
        }
        List<Double> out = new ArrayList<>();
        for (String v : spec.split(",", -1)) {
            out.add(number(spec, v));
        }
        if (out.size() > MAX_VALUES) {
            throw new IllegalArgumentException(spec + ": more than " + MAX_VALUES + " values");
        }
        return out;
    }

    private static double number(String spec, String v) {
        double d;
        try {
            d = Double.parseDouble(v.trim());
        } catch (NumberFormatException e) {
            throw new IllegalArgumentException(spec + ": not a number: \"" + v.trim() + "\"");
        }
        if (!Double.isFinite(d)) {
            throw new IllegalArgumentException(spec + ": not a finite number: \"" + v.trim() + "\"");
        }
        return d;
    }
}
