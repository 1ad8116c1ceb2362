package dev.nanoplan.scenario;

import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * The per-node slot numbers of a {@code slots} schedule ({@link Signalling#slots()}), kept consistent with
 * the nodes of a scenario.
 *
 * <p>A scenario read from a file must give every emitter its slot ({@code ScenarioReader} names a missing
 * one). A scenario built in code (a desktop edit, a design aid adding a relay) may add, remove or change
 * emitters without knowing about slots, so {@link Scenario} passes its signalling through
 * {@link #reconcile(Signalling, List)}: slots of nodes that no longer emit are dropped, and a new emitter
 * takes the least-used slot of its species when {@code frame_slots} is fixed, else a slot of its own
 * (largest slot of its species + 1, which lengthens that species' frame and adds no crosstalk).
 */
public final class SlotPlan {

    private SlotPlan() {
    }

    /** Round-robin numbering: the emitters of each species get 0, 1, 2, … in file order. */
    public static Map<String, Integer> fileOrder(List<Node> nodes) {
        Map<String, Integer> slot = new LinkedHashMap<>();
        Map<String, Integer> next = new HashMap<>();
        for (Node n : nodes) {
            if (n.role().emits()) {
                int k = next.getOrDefault(n.emitsSpecies(), 0);
                slot.put(n.id(), k);
                next.put(n.emitsSpecies(), k + 1);
            }
        }
        return slot;
    }

    /**
     * The signalling with its slot plan fitted to {@code nodes} (see the class comment); the same object when
     * nothing changes or when the schedule is not {@code slots}.
     */
    public static Signalling reconcile(Signalling sig, List<Node> nodes) {
        if (sig.schedule() != Schedule.SLOTS) {
            return sig;
        }
        Map<String, Integer> kept = new LinkedHashMap<>();
        boolean changed = false;
        for (Node n : nodes) {
            Integer s = sig.slots().get(n.id());
            if (n.role().emits() && s != null) {
                kept.put(n.id(), s);
            }
        }
        changed |= kept.size() != sig.slots().size();
        for (Node n : nodes) {
            if (n.role().emits() && !kept.containsKey(n.id())) {
                kept.put(n.id(), freshSlot(sig.frameSlots(), n.emitsSpecies(), nodes, kept));
                changed = true;
            }
        }
        return changed ? sig.withSlots(sig.frameSlots(), kept) : sig;
    }

    private static int freshSlot(int frameSlots, String species, List<Node> nodes, Map<String, Integer> slots) {
        int[] uses = new int[Math.max(1, frameSlots)];
        int max = -1;
        for (Node n : nodes) {
            Integer s = slots.get(n.id());
            if (s != null && n.emitsSpecies().equals(species)) {
                max = Math.max(max, s);
                if (frameSlots > 0) {
                    uses[s]++;
                }
            }
        }
        if (frameSlots == 0) {
            return max + 1;
        }
        int best = 0;
        for (int s = 1; s < uses.length; s++) {
            best = uses[s] < uses[best] ? s : best;
        }
        return best;
    }
}
