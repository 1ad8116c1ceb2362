package dev.nanoplan.count;

/** Turns a {@link CountLaw} into a probability mass function over a window of counts. */
public interface CountModel {

    /** The pmf of the law; mass outside the returned window is recorded in the result. */
    CountPmf pmf(CountLaw law);
}
