package dev.nanoplan.desktop;

import dev.nanoplan.geometry.Vec3;
import dev.nanoplan.plan.SlotSchedule;
import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.ReceiverModel;
import dev.nanoplan.scenario.Role;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.Schedule;
import dev.nanoplan.scenario.Signalling;
import javafx.beans.property.BooleanProperty;
import javafx.beans.property.ObjectProperty;
import javafx.beans.property.ReadOnlyBooleanProperty;
import javafx.beans.property.ReadOnlyBooleanWrapper;
import javafx.beans.property.ReadOnlyStringProperty;
import javafx.beans.property.ReadOnlyStringWrapper;
import javafx.beans.property.SimpleBooleanProperty;
import javafx.beans.property.SimpleObjectProperty;
import javafx.beans.property.SimpleStringProperty;
import javafx.beans.property.StringProperty;

/**
 * The editable fields of the selected node, as text the inspector binds to: every field of the
 * file's node ({@code id}, {@code role}, {@code position_um}, {@code radius_um}, {@code species},
 * {@code emits_species}, {@code molecules_per_symbol}, {@code fixed}, {@code receiver} with
 * {@code binding_rate_um_per_s} or {@code sampling_offset_s}) and, under the {@code slots} schedule,
 * the emitter's {@code slot}. {@link #toEdit()} parses them; a malformed or out-of-range value is
 * refused with a one-line message naming the field as the file does ({@code nodes[3].radius_um ...}),
 * recorded in {@link #errors()} beside that field.
 */
public final class NodeInspector {

    /** Field keys of {@link #errors()}: the file's names under {@code nodes[i].}. */
    public static final String ID = "id";
    public static final String X = "position_um[0]";
    public static final String Y = "position_um[1]";
    public static final String Z = "position_um[2]";
    public static final String RADIUS = "radius_um";
    public static final String SPECIES = "species";
    public static final String EMITS = "emits_species";
    public static final String MOLECULES = "molecules_per_symbol";
    public static final String RECEIVER = "receiver";
    public static final String BINDING_RATE = "binding_rate_um_per_s";
    public static final String SAMPLING_OFFSET = "sampling_offset_s";
    public static final String SLOT = "slot";
    public static final String FIXED = "fixed";

    /** The node as edited and its slot (null when the schedule is not {@code slots} or the node does not emit). */
    public record Edit(Node node, Integer slot) {
    }

    private final StringProperty id = new SimpleStringProperty("");
    private final ObjectProperty<Role> role = new SimpleObjectProperty<>(Role.TRANSMITTER);
    private final StringProperty xUm = new SimpleStringProperty("");
    private final StringProperty yUm = new SimpleStringProperty("");
    private final StringProperty zUm = new SimpleStringProperty("");
    private final StringProperty radiusUm = new SimpleStringProperty("");
    private final StringProperty species = new SimpleStringProperty("");
    private final StringProperty emitsSpecies = new SimpleStringProperty("");
    private final StringProperty moleculesPerSymbol = new SimpleStringProperty("");
    private final BooleanProperty fixed = new SimpleBooleanProperty(false);
    private final ObjectProperty<ReceiverModel.Kind> receiver = new SimpleObjectProperty<>(ReceiverModel.Kind.ABSORBING);
    private final StringProperty bindingRateUmPerS = new SimpleStringProperty("");
    private final StringProperty samplingOffsetS = new SimpleStringProperty("");
    private final StringProperty slot = new SimpleStringProperty("");
    private final ReadOnlyBooleanWrapper slotsSchedule = new ReadOnlyBooleanWrapper(false);
    private final ReadOnlyStringWrapper slotHint = new ReadOnlyStringWrapper("");
    private final FieldErrors errors = new FieldErrors();
    /** "nodes[i]" of the loaded node, the prefix of every message. */
    private String at = "node";
    /** frame_slots of the loaded layout (0: not given). */
    private int frameSlots;

    /** An inspector with empty fields; a field's message goes as soon as the field is edited. */
    public NodeInspector() {
        errors.clearOnEdit(id, ID);
        errors.clearOnEdit(xUm, X);
        errors.clearOnEdit(yUm, Y);
        errors.clearOnEdit(zUm, Z);
        errors.clearOnEdit(radiusUm, RADIUS);
        errors.clearOnEdit(species, SPECIES);
        errors.clearOnEdit(emitsSpecies, EMITS);
        errors.clearOnEdit(moleculesPerSymbol, MOLECULES);
        errors.clearOnEdit(receiver, RECEIVER);
        errors.clearOnEdit(bindingRateUmPerS, BINDING_RATE);
        errors.clearOnEdit(samplingOffsetS, SAMPLING_OFFSET);
        errors.clearOnEdit(slot, SLOT);
    }

    /** Shows a node's values (or clears the fields when {@code n} is null), without slot. */
    public void load(Node n) {
        load(null, n);
    }

    /**
     * Shows the node {@code n} of layout {@code s} (or clears the fields when {@code n} is null): its
     * fields, its index for messages, and under the {@code slots} schedule its slot and frame.
     */
    public void load(Scenario s, Node n) {
        errors.clear();
        slotsSchedule.set(s != null && s.signalling().schedule() == Schedule.SLOTS);
        frameSlots = s == null ? 0 : s.signalling().frameSlots();
        if (n == null) {
            id.set("");
            for (StringProperty p : new StringProperty[] {xUm, yUm, zUm, radiusUm, species, emitsSpecies,
                moleculesPerSymbol, bindingRateUmPerS, samplingOffsetS, slot}) {
                p.set("");
            }
            fixed.set(false);
            receiver.set(ReceiverModel.Kind.ABSORBING);
            slotHint.set("");
            at = "node";
            return;
        }
        at = s == null ? "node " + n.id() : "nodes[" + s.nodes().indexOf(n) + "]";
        id.set(n.id());
        role.set(n.role());
        xUm.set(fmt(n.positionUm().x()));
        yUm.set(fmt(n.positionUm().y()));
        zUm.set(fmt(n.positionUm().z()));
        radiusUm.set(fmt(n.radiusUm()));
        species.set(n.species());
        emitsSpecies.set(n.emitsSpecies());
        moleculesPerSymbol.set(Long.toString(n.moleculesPerSymbol()));
        fixed.set(n.fixed());
        ReceiverModel rm = n.receiver();
        receiver.set(rm.kind());
        bindingRateUmPerS.set(rm.bindingRateUmPerS() == null ? "" : fmt(rm.bindingRateUmPerS()));
        samplingOffsetS.set(rm.samplingOffsetS() == null ? "" : fmt(rm.samplingOffsetS()));
        Integer sl = s == null ? null : s.signalling().slots().get(n.id());
        slot.set(sl == null ? "" : Integer.toString(sl));
        slotHint.set(!slotsSchedule.get() || !n.role().emits() ? ""
                : frameSlots > 0 ? "0.." + (frameSlots - 1) + " (frame_slots " + frameSlots + ")"
                : frameOf(s, n.emitsSpecies()));
    }

    private static String frameOf(Scenario s, String species) {
        int k = SlotSchedule.of(s).frameSlots(species);
        return "frame of " + species + ": " + k + (k == 1 ? " slot" : " slots");
    }

    /**
     * The node the fields describe.
     *
     * @throws IllegalArgumentException naming the field when a value does not parse or is out of range
     */
    public Node toNode() {
        return toEdit().node();
    }

    /**
     * The node the fields describe and its slot. Every malformed field is recorded in {@link #errors()};
     * the first is thrown.
     *
     * @throws FieldErrors.FieldException naming the field when a value does not parse or is out of range
     */
    public Edit toEdit() {
        errors.clear();
        try {
            return parse();
        } catch (FieldErrors.FieldException e) {
            errors.record(new FieldErrors.FieldException(key(e.field()), e.getMessage()));
            throw e;
        }
    }

    private Edit parse() {
        Role r = role.get();
        String sp = species.get() == null ? "" : species.get().trim();
        String emits = r == Role.RELAY && emitsSpecies.get() != null && !emitsSpecies.get().isBlank()
                ? emitsSpecies.get().trim() : sp;
        double x = errors.number(X, path(X), xUm.get());
        double y = errors.number(Y, path(Y), yUm.get());
        double z = errors.number(Z, path(Z), zUm.get());
        double radius = errors.number(RADIUS, path(RADIUS), radiusUm.get());
        long molecules = r == Role.RECEIVER ? 0 : errors.whole(MOLECULES, path(MOLECULES), moleculesPerSymbol.get());
        ReceiverModel.Kind kind = r.absorbs() ? receiver.get() : ReceiverModel.Kind.ABSORBING;
        Double binding = kind == ReceiverModel.Kind.REACTIVE ? errors.number(BINDING_RATE, path(BINDING_RATE), bindingRateUmPerS.get())
                : null;
        String offsetText = SettingsText.trim(samplingOffsetS.get());
        Double offset = kind == ReceiverModel.Kind.PASSIVE && !offsetText.isEmpty()
                ? errors.number(SAMPLING_OFFSET, path(SAMPLING_OFFSET), offsetText) : null;
        Integer sl = slotsSchedule.get() && r.emits() ? (int) Math.max(-1, Math.min(Integer.MAX_VALUE,
                errors.whole(SLOT, path(SLOT), slot.get()))) : null;
        errors.throwFirst();
        int limit = frameSlots > 0 ? frameSlots : Signalling.MAX_FRAME_SLOTS;
        if (sl != null && (sl < 0 || sl >= limit)) {
            throw new FieldErrors.FieldException(path(SLOT), path(SLOT) + " must be in 0.." + (limit - 1)
                    + (frameSlots > 0 ? " (frame_slots " + frameSlots + ")" : "") + ", got " + slot.get().trim());
        }
        ReceiverModel model;
        try {
            model = new ReceiverModel(kind, binding, offset);
        } catch (IllegalArgumentException e) {
            throw FieldErrors.translate(at, path(RECEIVER), e);
        }
        try {
            return new Edit(new Node(id.get() == null ? "" : id.get().trim(), r, new Vec3(x, y, z), radius, sp, emits,
                    molecules, fixed.get(), model), sl);
        } catch (IllegalArgumentException e) {
            throw FieldErrors.translate(at, path(ID), e);
        }
    }

    /** The key of {@link #errors()} of a file path of the loaded node ({@code nodes[3].radius_um} → {@code radius_um}). */
    private String key(String path) {
        return path.startsWith(at + ".") ? path.substring(at.length() + 1) : path;
    }

    /** The file path of field {@code key} of the loaded node, e.g. {@code nodes[3].radius_um}. */
    public String path(String key) {
        return at + "." + key;
    }

    /**
     * Places a refusal of the whole layout (the scenario's {@code path: message} lines) beside this
     * node's field when its first problem is about this node; else nothing is marked.
     */
    void placeLayoutProblem(IllegalArgumentException e) {
        FieldErrors.FieldException f = FieldErrors.fromProblems(e);
        if (f.field().startsWith(at + ".")) {
            String key = key(f.field());
            // position_um problems (outside the volume, overlaps) are marked at x
            errors.record(new FieldErrors.FieldException(key.startsWith("position_um") && !key.contains("[") ? X : key,
                    f.getMessage()));
        }
    }

    private static String fmt(double v) {
        return Formats.field(v);
    }

    /**
     * The message beside each refused field after {@link #toEdit()}, keyed by the field's name under the
     * node ({@link #RADIUS}, …); each message names the full file path ({@code nodes[3].radius_um}).
     */
    public FieldErrors errors() {
        return errors;
    }

    public StringProperty idProperty() {
        return id;
    }

    public ObjectProperty<Role> roleProperty() {
        return role;
    }

    public StringProperty xUmProperty() {
        return xUm;
    }

    public StringProperty yUmProperty() {
        return yUm;
    }

    public StringProperty zUmProperty() {
        return zUm;
    }

    public StringProperty radiusUmProperty() {
        return radiusUm;
    }

    public StringProperty speciesProperty() {
        return species;
    }

    public StringProperty emitsSpeciesProperty() {
        return emitsSpecies;
    }

    public StringProperty moleculesPerSymbolProperty() {
        return moleculesPerSymbol;
    }

    /** The file's {@code fixed}: design aids never move or re-assign the node. */
    public BooleanProperty fixedProperty() {
        return fixed;
    }

    /** The receiver model (receivers and relays; a transmitter is always absorbing). */
    public ObjectProperty<ReceiverModel.Kind> receiverProperty() {
        return receiver;
    }

    /** κ in µm/s, used by a reactive receiver only. */
    public StringProperty bindingRateUmPerSProperty() {
        return bindingRateUmPerS;
    }

    /** Sampling instant after each slot starts in s, passive receivers only; blank = the end of the slot. */
    public StringProperty samplingOffsetSProperty() {
        return samplingOffsetS;
    }

    /** The emitter's slot under the {@code slots} schedule. */
    public StringProperty slotProperty() {
        return slot;
    }

    /** Whether the loaded layout's schedule is {@code slots} (the slot field is shown then). */
    public ReadOnlyBooleanProperty slotsScheduleProperty() {
        return slotsSchedule.getReadOnlyProperty();
    }

    /** The allowed slots of the loaded node, e.g. {@code 0..3 (frame_slots 4)}. */
    public ReadOnlyStringProperty slotHintProperty() {
        return slotHint.getReadOnlyProperty();
    }
}
