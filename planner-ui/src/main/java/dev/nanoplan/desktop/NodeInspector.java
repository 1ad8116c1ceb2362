package dev.nanoplan.desktop;

import dev.nanoplan.geometry.Vec3;
import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.Role;
import javafx.beans.property.ObjectProperty;
import javafx.beans.property.SimpleObjectProperty;
import javafx.beans.property.SimpleStringProperty;
import javafx.beans.property.StringProperty;

/**
 * The editable fields of the selected node, as text the inspector binds to. {@link #toNode()}
 * parses them; a malformed number is refused with a message naming the field.
 */
public final class NodeInspector {

    private final StringProperty id = new SimpleStringProperty("");
    private final ObjectProperty<Role> role = new SimpleObjectProperty<>(Role.TRANSMITTER);
    private final StringProperty xUm = new SimpleStringProperty("");
    private final StringProperty yUm = new SimpleStringProperty("");
    private final StringProperty zUm = new SimpleStringProperty("");
    private final StringProperty radiusUm = new SimpleStringProperty("");
    private final StringProperty species = new SimpleStringProperty("");
    private final StringProperty emitsSpecies = new SimpleStringProperty("");
    private final StringProperty moleculesPerSymbol = new SimpleStringProperty("");

    /** Shows a node's values (or clears the fields when {@code n} is null). */
    public void load(Node n) {
        if (n == null) {
            id.set("");
            for (StringProperty p : new StringProperty[] {xUm, yUm, zUm, radiusUm, species, emitsSpecies,
                moleculesPerSymbol}) {
                p.set("");
            }
            return;
        }
        id.set(n.id());
        role.set(n.role());
        xUm.set(fmt(n.positionUm().x()));
        yUm.set(fmt(n.positionUm().y()));
        zUm.set(fmt(n.positionUm().z()));
        radiusUm.set(fmt(n.radiusUm()));
        species.set(n.species());
        emitsSpecies.set(n.emitsSpecies());
        moleculesPerSymbol.set(Long.toString(n.moleculesPerSymbol()));
    }

    /**
     * The node the fields describe.
     *
     * @throws IllegalArgumentException naming the field when a value does not parse or is out of range
     */
    public Node toNode() {
        Role r = role.get();
        String sp = species.get().trim();
        String emits = r == Role.RELAY && !emitsSpecies.get().isBlank() ? emitsSpecies.get().trim() : sp;
        long molecules = parseLong("molecules per symbol", moleculesPerSymbol.get());
        if (r == Role.RECEIVER) {
            molecules = 0;
        }
        return new Node(id.get(), r, new Vec3(parse("x", xUm.get()), parse("y", yUm.get()), parse("z", zUm.get())),
                parse("radius", radiusUm.get()), sp, emits, molecules);
    }

    private static String fmt(double v) {
        return Formats.field(v);
    }

    private static double parse(String field, String text) {
        try {
            double v = Double.parseDouble(text.trim());
            if (!Double.isFinite(v)) {
                throw new IllegalArgumentException(field + ": must be a finite number, got " + text);
            }
            return v;
        } catch (NumberFormatException e) {
            throw new IllegalArgumentException(field + ": not a number: '" + text + "'");
        }
    }

    private static long parseLong(String field, String text) {
        try {
            return Long.parseLong(text.trim());
        } catch (NumberFormatException e) {
            throw new IllegalArgumentException(field + ": not a whole number: '" + text + "'");
        }
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
}
