package dev.nanoplan.count;

import java.util.Locale;

/** The count models a user can choose by name. */
public enum CountModelKind {
    /** Exact convolution of the terms' distributions. */
    EXACT,
    /** Poisson with the law's mean. */
    POISSON,
    /** Moment-matched normal, integrated over unit cells (continuity correction). */
    GAUSSIAN;

    /** Parses {@code exact | poisson | gaussian} (case-insensitive). */
    public static CountModelKind parse(String name) {
        for (CountModelKind k : values()) {
            if (k.name().equalsIgnoreCase(name.trim())) {
                return k;
            }
        }
        throw new IllegalArgumentException("unknown count model '" + name
                + "', expected one of exact, poisson, gaussian");
    }

    public String id() {
        return name().toLowerCase(Locale.ROOT);
    }
}
