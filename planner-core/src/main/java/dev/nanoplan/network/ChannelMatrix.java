package dev.nanoplan.network;

import java.util.ArrayList;
import java.util.Collections;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * The channel of a layout: taps[emitter][receiver][k] for every emitter → receiver pair that
 * shares a species and was not cut off as negligible, with how each was obtained (docs/architecture.md §2).
 *
 * <p>Stored sparsely (a layout of 10,000 nodes has far fewer relevant pairs than n²): by receiver,
 * in the order given. Build one from closed forms with {@link AnalyticChannel} or from given
 * (e.g. simulated or measured) taps with {@link #of(List)}.
 */
public final class ChannelMatrix {

    /** Source word of closed-form taps. */
    public static final String ANALYTIC = "analytic";
    /** Source word of taps from the particle simulator. */
    public static final String SIMULATED = "simulated";

    private final List<ChannelEntry> entries;
    private final Map<String, List<ChannelEntry>> byReceiver;
    private final Map<String, ChannelEntry> byPair;
    private final List<String> notes;

    private ChannelMatrix(List<ChannelEntry> entries, List<String> notes) {
        this.entries = List.copyOf(entries);
        this.notes = List.copyOf(notes);
        Map<String, List<ChannelEntry>> r = new LinkedHashMap<>();
        Map<String, ChannelEntry> p = new HashMap<>(entries.size() * 2);
        for (ChannelEntry e : this.entries) {
            r.computeIfAbsent(e.receiver(), k -> new ArrayList<>()).add(e);
            if (p.put(pairKey(e.emitter(), e.receiver()), e) != null) {
                throw new IllegalArgumentException("entries: pair " + e.emitter() + " -> " + e.receiver()
                        + " given twice");
            }
        }
        r.replaceAll((k, v) -> Collections.unmodifiableList(v));
        this.byReceiver = Collections.unmodifiableMap(r);
        this.byPair = p;
    }

    /**
     * A channel from given taps (e.g. {@value #SIMULATED} ones). Every pair at most once; all taps
     * of the same length is not required but usual.
     *
     * @throws IllegalArgumentException if a pair appears twice
     */
    public static ChannelMatrix of(List<ChannelEntry> entries) {
        return new ChannelMatrix(entries, List.of());
    }

    /** As {@link #of(List)}, with notes (e.g. the cutoff used) carried into the plan's warnings. */
    public static ChannelMatrix of(List<ChannelEntry> entries, List<String> notes) {
        return new ChannelMatrix(entries, notes);
    }

    private static String pairKey(String emitter, String receiver) {
        return emitter + '\u0000' + receiver;
    }

    /** All entries. */
    public List<ChannelEntry> entries() {
        return entries;
    }

    /** Entries whose receiver is {@code receiver} (empty if none). */
    public List<ChannelEntry> atReceiver(String receiver) {
        return byReceiver.getOrDefault(receiver, List.of());
    }

    /** Receivers that have at least one entry, in first-seen order. */
    public List<String> receivers() {
        return List.copyOf(byReceiver.keySet());
    }

    /** The entry of a pair, or null when the pair is absent (no shared species or cut off). */
    public ChannelEntry entry(String emitter, String receiver) {
        return byPair.get(pairKey(emitter, receiver));
    }

    /** Taps of a pair (a copy), or null when absent. */
    public double[] taps(String emitter, String receiver) {
        ChannelEntry e = entry(emitter, receiver);
        return e == null ? null : e.taps();
    }

    /** Notes about how the matrix was built (cutoffs, caveats). */
    public List<String> notes() {
        return notes;
    }

    /**
     * "analytic" when every entry is analytic, "simulated" when every entry is simulated, else
     * "mixed" ("analytic" for an empty matrix).
     */
    public String source() {
        boolean analytic = false;
        boolean other = false;
        String first = null;
        for (ChannelEntry e : entries) {
            if (first == null) {
                first = e.source();
            }
            if (e.source().equals(ANALYTIC)) {
                analytic = true;
            } else {
                other = true;
            }
            if (!e.source().equals(first)) {
                return "mixed";
            }
        }
        return first == null || (analytic && !other) ? ANALYTIC : first;
    }

    /** Number of pairs. */
    public int size() {
        return entries.size();
    }
}
