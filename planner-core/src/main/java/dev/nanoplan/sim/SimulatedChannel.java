package dev.nanoplan.sim;

import java.util.List;
import java.util.Optional;

/**
 * Result of a particle simulation: per emitter, per receiver, the simulated taps p̂_0..p̂_L of a
 * single release at t = 0, with standard errors (see {@link SimulatedTaps}).
 *
 * @param emitterIds emitters (transmitters and relays) in scenario order
 * @param receiverIds receivers and relays in scenario order
 * @param symbolTimeS T, s
 * @param isiMemorySymbols L; each histogram has L + 1 slots
 * @param timeStepS Δt actually used, s (T is a whole number of steps)
 * @param seed master seed
 * @param moleculesRequestedPerEmitter M asked for
 * @param complete false if the run was cancelled; then {@link EmitterRun#moleculesSimulated()}
 *     says what finished
 * @param emitters one run per emitter, in emitter order
 */
public record SimulatedChannel(List<String> emitterIds, List<String> receiverIds, double symbolTimeS,
        int isiMemorySymbols, double timeStepS, long seed, long moleculesRequestedPerEmitter, boolean complete,
        List<EmitterRun> emitters) {

    /** @throws IllegalArgumentException if the lists do not match */
    public SimulatedChannel {
        emitterIds = List.copyOf(emitterIds);
        receiverIds = List.copyOf(receiverIds);
        emitters = List.copyOf(emitters);
        if (emitters.size() != emitterIds.size()) {
            throw new IllegalArgumentException("emitters: expected " + emitterIds.size() + " runs, got "
                    + emitters.size());
        }
    }

    /** The simulated taps of emitter {@code from} at receiver {@code to}, if both exist. */
    public Optional<SimulatedTaps> taps(String from, String to) {
        int e = emitterIds.indexOf(from);
        int r = receiverIds.indexOf(to);
        if (e < 0 || r < 0) {
            return Optional.empty();
        }
        return Optional.of(emitters.get(e).receivers().get(r));
    }

    /** Molecules simulated over all emitters. */
    public long moleculesSimulated() {
        return emitters.stream().mapToLong(EmitterRun::moleculesSimulated).sum();
    }

    /** Molecule-steps computed over all emitters. */
    public long moleculeSteps() {
        return emitters.stream().mapToLong(EmitterRun::moleculeSteps).sum();
    }
}
