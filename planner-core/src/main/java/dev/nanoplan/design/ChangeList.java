package dev.nanoplan.design;

import dev.nanoplan.geometry.Vec3;
import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.Role;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.Schedule;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;

/**
 * The changes between two layouts of the same demands, in plain words: a moved node ("moved 12.3 µm
 * towards gw", towards the node whose distance shrank most), a new species ("species A → C"), a new
 * emitted species, a new slot ("slot 2", under the slots schedule; the slot before is 0 under all-active
 * and the file order under round-robin), new molecules per symbol ("1,800 → 2,600 molecules per symbol"),
 * a new node.
 */
final class ChangeList {

    /** Moves shorter than this are not listed, µm. */
    private static final double MIN_MOVE_UM = 1e-6;

    private ChangeList() {
    }

    /** Every change from {@code before} to {@code after}, in the order of {@code after}'s nodes. */
    static List<Change> of(Scenario before, Scenario after) {
        Map<String, Node> old = before.nodesById();
        List<Change> out = new ArrayList<>();
        boolean slotted = after.signalling().schedule() == Schedule.SLOTS;
        Map<String, Integer> slotsBefore = LayoutEdits.slotsOf(before);
        for (Node n : after.nodes()) {
            Node o = old.get(n.id());
            if (o == null) {
                out.add(new Change(n.id(), "node", null, position(n.positionUm()), String.format(Locale.ROOT,
                        "new %s at %s (absorbs %s, emits %s, %,d molecules per symbol)", n.role().id(),
                        position(n.positionUm()), n.species(), n.emitsSpecies(), n.moleculesPerSymbol())));
                continue;
            }
            double moved = o.positionUm().distance(n.positionUm());
            if (moved > MIN_MOVE_UM) {
                out.add(new Change(n.id(), "position_um", position(o.positionUm()), position(n.positionUm()),
                        String.format(Locale.ROOT, "moved %.1f µm%s", moved, towards(after, o, n))));
            }
            if (!o.species().equals(n.species())) {
                out.add(new Change(n.id(), "species", o.species(), n.species(),
                        "species " + o.species() + " → " + n.species()));
            }
            if (!o.emitsSpecies().equals(n.emitsSpecies()) && n.role() == Role.RELAY) {
                out.add(new Change(n.id(), "emits_species", o.emitsSpecies(), n.emitsSpecies(),
                        "emits " + o.emitsSpecies() + " → " + n.emitsSpecies()));
            }
            Integer slotBefore = slotsBefore.get(n.id());
            Integer slotAfter = after.signalling().slots().get(n.id());
            if (slotted && slotAfter != null && (slotBefore == null || !slotBefore.equals(slotAfter))) {
                out.add(new Change(n.id(), "slot", slotBefore == null ? null : slotBefore.toString(),
                        slotAfter.toString(), "slot " + slotAfter));
            }
            if (o.moleculesPerSymbol() != n.moleculesPerSymbol()) {
                out.add(new Change(n.id(), "molecules_per_symbol", Long.toString(o.moleculesPerSymbol()),
                        Long.toString(n.moleculesPerSymbol()), String.format(Locale.ROOT,
                                "%,d → %,d molecules per symbol", o.moleculesPerSymbol(), n.moleculesPerSymbol())));
            }
        }
        return out;
    }

    /** " towards X" for the other node whose distance to the moved one shrank most, or "". */
    private static String towards(Scenario after, Node was, Node now) {
        String best = null;
        double gain = 0;
        for (Node m : after.nodes()) {
            if (m.id().equals(now.id())) {
                continue;
            }
            double g = was.positionUm().distance(m.positionUm()) - now.positionUm().distance(m.positionUm());
            if (g > gain) {
                gain = g;
                best = m.id();
            }
        }
        return best == null ? "" : " towards " + best;
    }

    private static String position(Vec3 p) {
        return String.format(Locale.ROOT, "[%.2f, %.2f, %.2f]", p.x(), p.y(), p.z());
    }
}
