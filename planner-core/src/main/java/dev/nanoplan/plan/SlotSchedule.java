package dev.nanoplan.plan;

import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.Schedule;
import dev.nanoplan.scenario.Signalling;
import dev.nanoplan.scenario.SlotPlan;
import java.util.HashMap;
import java.util.Map;

/**
 * What a slot schedule ({@link Schedule}) does to the taps a link hears and to its rate.
 *
 * <p><b>all-active</b> (docs/architecture.md §5.6): every emitter sends an i.i.d. symbol in every slot of
 * length T. A link hears its own taps p_0..p_L and every other emitter of the species with all of
 * its taps; rate = capacity / T. This class then changes nothing (frame of 1 slot).
 *
 * <p><b>round-robin</b> (time division within a species, the textbook remedy for crosstalk at the
 * cost of rate): the K emitters of a species (transmitters and relays emitting it, in file order)
 * get indices k = 0..K−1; emitter k sends one symbol in every slot s ≡ k (mod K) and releases
 * nothing in the other slots. A receiver decoding emitter k samples in k's slots, so its count
 * there is
 * <ul>
 *   <li>the current symbol through p_0, and k's own earlier symbols at lags K, 2K, … ≤ L:
 *       own taps p_0, p_K, p_{2K}, … ({@link #ownTaps(double[], int)});</li>
 *   <li>for every other emitter j of the species, its symbols sent l ≥ 1 slots earlier with
 *       l ≡ (k − j) (mod K), l ≤ L: taps p_{l0}, p_{l0+K}, … with l0 = (k − j) mod K, or K when that
 *       is 0 (it is never 0 for j ≠ k) ({@link #interfererTaps(double[], int, int, int)}); earlier
 *       and neighbours' symbols are i.i.d. with the prior exactly as under all-active. An
 *       interferer whose first lag l0 exceeds L contributes nothing;</li>
 *   <li>background over one slot (β·T), as before.</li>
 * </ul>
 * L = {@code isi_memory_symbols} keeps its meaning "the leftovers of how many earlier slots
 * count", so the channel taps p_0..p_L (analytic or simulated impulse responses of one release) are
 * the same; with round-robin L should cover a few frames of K slots, or leftovers of a link's own
 * earlier symbols and of most neighbours are cut off. A link carries one symbol per frame:
 * rate = capacity / (K·T); a route takes one frame per hop (latency Σ K_h·T) and its rate is
 * its end-to-end capacity over the longest frame of its hops.
 *
 * <p><b>slots</b> (slot plan with spatial reuse): emitter k carries its own slot number slot_k
 * ({@code nodes[].slot}); the frame K of a species is its largest slot + 1, or {@code frame_slots} when
 * given. Emitter k sends in the slots s ≡ slot_k (mod K); emitters that share a slot send together. A
 * receiver decoding k hears its own taps as under round-robin, and every other emitter j at the lags
 * l ≡ (slot_k − slot_j) (mod K), 0 ≤ l ≤ L — lag 0 (the current slot) only when they share the slot.
 * All-active is the case K = 1 (every lag counts), round-robin the case "each emitter of a species its
 * own slot in file order"; the same decimation serves all three ({@link #interfererTaps}).
 *
 * <p>Cost: {@link #of(Scenario)} O(nodes); the decimations O(L/K + 1). Immutable.
 */
public final class SlotSchedule {

    /** The all-active schedule: every frame is one slot and taps are kept as they are. */
    static final SlotSchedule ALL_ACTIVE = new SlotSchedule(Schedule.ALL_ACTIVE, Map.of(), Map.of());

    private final Schedule schedule;
    private final Map<String, Integer> slotOfEmitter;
    private final Map<String, Integer> framesOfSpecies;

    private SlotSchedule(Schedule schedule, Map<String, Integer> slotOfEmitter,
            Map<String, Integer> framesOfSpecies) {
        this.schedule = schedule;
        this.slotOfEmitter = slotOfEmitter;
        this.framesOfSpecies = framesOfSpecies;
    }

    /**
     * The schedule of a scenario: under round-robin the emitters of each species numbered in file order,
     * under slots the file's slot numbers.
     */
    public static SlotSchedule of(Scenario scenario) {
        Signalling sig = scenario.signalling();
        if (sig.schedule() == Schedule.ALL_ACTIVE) {
            return ALL_ACTIVE;
        }
        Map<String, Integer> slot = sig.schedule() == Schedule.SLOTS ? sig.slots()
                : SlotPlan.fileOrder(scenario.nodes());
        Map<String, Integer> frames = new HashMap<>();
        for (Node n : scenario.nodes()) {
            Integer k = slot.get(n.id());
            if (n.role().emits() && k != null) {
                frames.merge(n.emitsSpecies(), sig.frameSlots() > 0 ? sig.frameSlots() : k + 1, Math::max);
            }
        }
        return new SlotSchedule(sig.schedule(), Map.copyOf(slot), Map.copyOf(frames));
    }

    /** Equal when the schedule, every emitter's slot and every species' frame are equal. */
    @Override
    public boolean equals(Object o) {
        return o instanceof SlotSchedule s && schedule == s.schedule && slotOfEmitter.equals(s.slotOfEmitter)
                && framesOfSpecies.equals(s.framesOfSpecies);
    }

    @Override
    public int hashCode() {
        return (schedule.hashCode() * 31 + slotOfEmitter.hashCode()) * 31 + framesOfSpecies.hashCode();
    }

    /** The schedule. */
    public Schedule schedule() {
        return schedule;
    }

    /**
     * Whether every emitter sends in every slot (then nothing changes): the all-active schedule, or a slot plan
     * whose every frame is one slot (evaluated exactly as all-active, so the two give identical plans).
     */
    public boolean allActive() {
        return schedule == Schedule.ALL_ACTIVE || schedule == Schedule.SLOTS && longestFrame() == 1;
    }

    /**
     * Slots per frame K of a species: its number of emitters under round-robin (at least 1), its largest
     * slot + 1 or the file's {@code frame_slots} under slots, 1 under all-active.
     */
    public int frameSlots(String species) {
        return allActive() ? 1 : Math.max(1, framesOfSpecies.getOrDefault(species, 1));
    }

    /** The longest frame over every species (1 under all-active). */
    public int longestFrame() {
        int k = 1;
        for (int f : framesOfSpecies.values()) {
            k = Math.max(k, f);
        }
        return k;
    }

    /**
     * Slot k (0..K−1) of an emitter: its index among the emitters of its species under round-robin, its
     * file slot under slots, 0 under all-active.
     *
     * @throws IllegalArgumentException if the node is no emitter of the scenario (round-robin, slots)
     */
    public int slotOf(String emitterId) {
        if (allActive()) {
            return 0;
        }
        Integer k = slotOfEmitter.get(emitterId);
        if (k == null) {
            throw new IllegalArgumentException("emitter: " + emitterId + " is not an emitter of the scenario");
        }
        return k;
    }

    /** The taps the link from {@code emitterId} hears of its own symbols (a copy under all-active). */
    double[] own(String species, double[] taps) {
        return allActive() ? taps.clone() : ownTaps(taps, frameSlots(species));
    }

    /**
     * The taps of {@code interfererId} (another emitter) heard by a receiver decoding {@code emitterId} (a
     * copy under all-active; possibly empty under round-robin and slots).
     */
    double[] interferer(String species, String emitterId, String interfererId, double[] taps) {
        return allActive() ? taps.clone()
                : interfererTaps(taps, frameSlots(species), slotOf(emitterId), slotOf(interfererId));
    }

    /**
     * Own taps under round-robin: p_0, p_K, p_{2K}, … for lags mK ≤ L = taps.length − 1.
     *
     * @param taps       p_0..p_L, at least one
     * @param frameSlots K ≥ 1
     * @return ⌊L/K⌋ + 1 taps; equal to {@code taps} when K = 1
     */
    public static double[] ownTaps(double[] taps, int frameSlots) {
        check(taps, frameSlots);
        int lastLag = taps.length - 1;
        double[] out = new double[lastLag / frameSlots + 1];
        for (int m = 0; m < out.length; m++) {
            out[m] = taps[m * frameSlots];
        }
        return out;
    }

    /**
     * First lag at which another emitter j's symbols land in emitter k's slots: (k − j) mod K, which is 0
     * when the two share a slot (they send together). k and j are slot numbers.
     *
     * @throws IllegalArgumentException unless 0 ≤ k, j &lt; K
     */
    public static int firstLag(int frameSlots, int k, int j) {
        if (frameSlots < 1) {
            throw new IllegalArgumentException("frameSlots: must be >= 1, got " + frameSlots);
        }
        if (k < 0 || k >= frameSlots || j < 0 || j >= frameSlots) {
            throw new IllegalArgumentException("k, j: must be in 0.." + (frameSlots - 1) + ", got " + k + ", " + j);
        }
        return Math.floorMod(k - j, frameSlots);
    }

    /**
     * Taps of another emitter j (slot j) heard in emitter k's slots (slot k): p_{l0}, p_{l0+K}, … for
     * lags ≤ L = taps.length − 1, with l0 = {@link #firstLag(int, int, int)}; empty when l0 &gt; L. With
     * K = 1 these are all the taps (all-active).
     */
    public static double[] interfererTaps(double[] taps, int frameSlots, int k, int j) {
        check(taps, frameSlots);
        int l0 = firstLag(frameSlots, k, j);
        int lastLag = taps.length - 1;
        if (l0 > lastLag) {
            return new double[0];
        }
        double[] out = new double[(lastLag - l0) / frameSlots + 1];
        for (int m = 0; m < out.length; m++) {
            out[m] = taps[l0 + m * frameSlots];
        }
        return out;
    }

    private static void check(double[] taps, int frameSlots) {
        if (taps == null || taps.length == 0) {
            throw new IllegalArgumentException("taps: at least one tap is needed");
        }
        if (frameSlots < 1) {
            throw new IllegalArgumentException("frameSlots: must be >= 1, got " + frameSlots);
        }
    }
}
