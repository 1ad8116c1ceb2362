package dev.nanoplan.count;

import java.util.ArrayList;
import java.util.List;

/**
 * The law of a slot count as a sum of independent {@link CountTerm}s. This is the model-free
 * description; a {@link CountModel} turns it into a probability mass function.
 */
public record CountLaw(List<CountTerm> terms) {

    public CountLaw {
        terms = List.copyOf(terms);
    }

    public static CountLaw of(CountTerm... terms) {
        return new CountLaw(List.of(terms));
    }

    /** A new law with one more independent term. */
    public CountLaw plus(CountTerm term) {
        List<CountTerm> t = new ArrayList<>(terms);
        t.add(term);
        return new CountLaw(t);
    }

    public double mean() {
        double m = 0;
        for (CountTerm t : terms) {
            m += t.mean();
        }
        return m;
    }

    public double variance() {
        double v = 0;
        for (CountTerm t : terms) {
            v += t.variance();
        }
        return v;
    }

    /** Largest possible value, saturating at {@link Long#MAX_VALUE}. */
    public long maxValue() {
        long max = 0;
        for (CountTerm t : terms) {
            long m = t.maxValue();
            if (m == Long.MAX_VALUE || max > Long.MAX_VALUE - m) {
                return Long.MAX_VALUE;
            }
            max += m;
        }
        return max;
    }
}
