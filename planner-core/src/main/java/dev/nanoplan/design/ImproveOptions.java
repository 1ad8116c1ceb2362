package dev.nanoplan.design;

import dev.nanoplan.plan.PlanOptions;
import java.util.EnumSet;
import java.util.Set;
import java.util.function.BooleanSupplier;
import java.util.function.Consumer;

/**
 * Settings of {@link LayoutImprover}.
 *
 * @param allowed            the parts of the layout the search may change, not empty
 * @param maxNewRelays       most relays the search may add (with {@link DesignMove#ADD_RELAYS}), ≥ 0
 * @param seed               seed of the randomised parts (the relay optimiser)
 * @param timeLimitS         wall-clock limit, s, &gt; 0 (infinite for none); the best layout so far is
 *                           returned when it is reached
 * @param planOptions        options of every re-plan
 * @param progress           told after every accepted change and every round
 * @param cancelled          true when the caller wants the best layout so far now
 */
public record ImproveOptions(Set<DesignMove> allowed, int maxNewRelays, long seed, double timeLimitS,
        PlanOptions planOptions, Consumer<Progress> progress, BooleanSupplier cancelled) {

    /** Progress of a search: assessments so far, the best objective, seconds used and left. */
    public record Progress(int evaluations, Objective best, double elapsedS, double remainingS, String step) {
    }

    public ImproveOptions {
        if (allowed == null || allowed.isEmpty()) {
            throw new IllegalArgumentException("allowed: must name at least one move");
        }
        allowed = Set.copyOf(EnumSet.copyOf(allowed));
        if (maxNewRelays < 0) {
            throw new IllegalArgumentException("maxNewRelays: must be >= 0, got " + maxNewRelays);
        }
        if (!(timeLimitS > 0)) {
            throw new IllegalArgumentException("timeLimitS: must be > 0, got " + timeLimitS);
        }
        if (planOptions == null || progress == null || cancelled == null) {
            throw new IllegalArgumentException("planOptions, progress and cancelled are required");
        }
    }

    /** The defaults: every move but adding relays, up to 2 new relays if allowed, seed 1, 60 s. */
    public static ImproveOptions defaults() {
        return new ImproveOptions(DesignMove.defaults(), 2, 1, 60, PlanOptions.DEFAULT, p -> { }, () -> false);
    }

    public ImproveOptions withAllowed(Set<DesignMove> moves) {
        return new ImproveOptions(moves, maxNewRelays, seed, timeLimitS, planOptions, progress, cancelled);
    }

    public ImproveOptions withMaxNewRelays(int r) {
        return new ImproveOptions(allowed, r, seed, timeLimitS, planOptions, progress, cancelled);
    }

    public ImproveOptions withSeed(long s) {
        return new ImproveOptions(allowed, maxNewRelays, s, timeLimitS, planOptions, progress, cancelled);
    }

    public ImproveOptions withTimeLimit(double seconds) {
        return new ImproveOptions(allowed, maxNewRelays, seed, seconds, planOptions, progress, cancelled);
    }

    public ImproveOptions withProgress(Consumer<Progress> callback) {
        return new ImproveOptions(allowed, maxNewRelays, seed, timeLimitS, planOptions, callback, cancelled);
    }

    public ImproveOptions withCancel(BooleanSupplier flag) {
        return new ImproveOptions(allowed, maxNewRelays, seed, timeLimitS, planOptions, progress, flag);
    }
}
