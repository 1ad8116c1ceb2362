package dev.nanoplan.scenario;

import dev.nanoplan.geometry.Vec3;

/**
 * One nanomachine.
 *
 * <p>A transmitter is a point source at {@code positionUm} (its radius only matters for overlap
 * checks and drawing); a receiver is a sphere that absorbs molecules of {@code species} and is
 * transparent to every other species; a relay absorbs {@code species} and emits
 * {@code emitsSpecies} from its centre.
 *
 * @param id unique, non-empty identifier
 * @param role transmitter, receiver or relay
 * @param positionUm centre in µm
 * @param radiusUm body radius in µm, finite and > 0
 * @param species for a transmitter the species it releases; for a receiver or relay the species it
 *     absorbs
 * @param emitsSpecies the species the node releases: equal to {@code species} for transmitters and
 *     receivers (a receiver releases nothing), for relays the file's {@code emits_species}
 *     (default {@code species})
 * @param moleculesPerSymbol molecules released for the highest level ("1" in binary); ≥ 1 for
 *     transmitters and relays, ≥ 0 for receivers (file default 0 for receivers, required otherwise)
 * @param fixed true when design aids ({@code nanoplan improve}) must never move or re-assign this node
 *     (file {@code fixed}, default false)
 * @param receiver how a receiver or relay counts its species (file {@code receiver}, default
 *     {@link ReceiverModel#ABSORBING}); must be absorbing for a transmitter
 */
public record Node(String id, Role role, Vec3 positionUm, double radiusUm, String species, String emitsSpecies,
        long moleculesPerSymbol, boolean fixed, ReceiverModel receiver) {

    /** @throws IllegalArgumentException if a value is out of range or inconsistent with the role */
    public Node {
        Checks.nonBlank("id", id);
        Checks.required("role", role);
        Checks.required("positionUm", positionUm);
        Checks.positive("radiusUm", radiusUm);
        Checks.nonBlank("species", species);
        Checks.nonBlank("emitsSpecies", emitsSpecies);
        if (role != Role.RELAY && !emitsSpecies.equals(species)) {
            throw new IllegalArgumentException("emitsSpecies may differ from species only for relays, node " + id);
        }
        if (moleculesPerSymbol < (role.emits() ? 1 : 0)) {
            throw new IllegalArgumentException("moleculesPerSymbol must be >= " + (role.emits() ? 1 : 0)
                    + " for a " + role.id() + ", got " + moleculesPerSymbol);
        }
        Checks.required("receiver", receiver);
        if (!role.absorbs() && !receiver.isAbsorbing()) {
            throw new IllegalArgumentException("receiver: only receivers and relays have a receiver model, node " + id);
        }
    }

    /** A node with the default absorbing receiver model. */
    public Node(String id, Role role, Vec3 positionUm, double radiusUm, String species, String emitsSpecies,
            long moleculesPerSymbol, boolean fixed) {
        this(id, role, positionUm, radiusUm, species, emitsSpecies, moleculesPerSymbol, fixed, ReceiverModel.ABSORBING);
    }

    /** This node with receiver model {@code model}. */
    public Node withReceiver(ReceiverModel model) {
        return new Node(id, role, positionUm, radiusUm, species, emitsSpecies, moleculesPerSymbol, fixed, model);
    }

    /**
     * Whether this node takes the molecules of its {@code species} out of the medium: receivers and relays
     * except passive (transparent) observers, which count molecules without removing them.
     */
    public boolean absorbs() {
        return role.absorbs() && receiver.absorbs();
    }

    /** A node that design aids may change ({@code fixed} false). */
    public Node(String id, Role role, Vec3 positionUm, double radiusUm, String species, String emitsSpecies,
            long moleculesPerSymbol) {
        this(id, role, positionUm, radiusUm, species, emitsSpecies, moleculesPerSymbol, false);
    }

    /** A transmitter of {@code species}. */
    public static Node transmitter(String id, Vec3 positionUm, double radiusUm, String species,
            long moleculesPerSymbol) {
        return new Node(id, Role.TRANSMITTER, positionUm, radiusUm, species, species, moleculesPerSymbol);
    }

    /** A receiver of {@code species}. */
    public static Node receiver(String id, Vec3 positionUm, double radiusUm, String species) {
        return new Node(id, Role.RECEIVER, positionUm, radiusUm, species, species, 0);
    }

    /** A relay absorbing {@code species} and emitting {@code emitsSpecies}. */
    public static Node relay(String id, Vec3 positionUm, double radiusUm, String species, String emitsSpecies,
            long moleculesPerSymbol) {
        return new Node(id, Role.RELAY, positionUm, radiusUm, species, emitsSpecies, moleculesPerSymbol);
    }
}
