package dev.nanoplan.count;

import java.util.ArrayList;
import java.util.List;

/** Turns a {@link CountLaw} into a probability mass function over a window of counts. */
public interface CountModel {

    /** The pmf of the law; mass outside the returned window is recorded in the result. */
    CountPmf pmf(CountLaw law);

    /**
     * The pmfs of {@code own.get(i) + shared} for every i: the laws of a slot count given each
     * sent level, which share everything but the current symbol (leftovers, crosstalk,
     * background). Models that can reuse the shared part override this.
     */
    default List<CountPmf> pmfs(CountLaw shared, List<CountLaw> own) {
        List<CountPmf> out = new ArrayList<>(own.size());
        for (CountLaw o : own) {
            List<CountTerm> all = new ArrayList<>(o.terms());
            all.addAll(shared.terms());
            out.add(pmf(new CountLaw(all)));
        }
        return out;
    }
}
