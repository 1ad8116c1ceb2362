package dev.nanoplan.cli;

import dev.nanoplan.network.ChannelMatrix;
import dev.nanoplan.plan.PlanOptions;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.sim.AutoChannel;
import dev.nanoplan.sim.ChannelCache;
import dev.nanoplan.sim.ParticleSimulator;
import dev.nanoplan.sim.SimulatedChannelMatrix;
import dev.nanoplan.sim.SimulatedChannels;
import dev.nanoplan.sim.SimulationSettings;
import dev.nanoplan.sim.TimeStepRule;
import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.OptionalDouble;
import picocli.CommandLine.Option;

/**
 * The channel options shared by {@code plan} and {@code compare} (a picocli mixin): {@code --channel
 * auto|analytic|simulated} (default auto: closed forms where they hold, the particle simulation for the
 * emitters whose links they do not cover, {@link AutoChannel}), the simulation settings and the cache.
 * Parses and checks; the core decides and computes.
 */
final class ChannelOptions {

    /** The default channel word. */
    static final String AUTO = "auto";

    @Option(names = "--channel", paramLabel = "auto|analytic|simulated", defaultValue = AUTO,
            description = {"auto (default): closed forms where they hold (open, still medium, no wall or other",
                "absorber close enough to matter), particle simulation for the other emitters; analytic: closed",
                "forms everywhere; simulated: every emitter simulated. Simulations are cached on disk."})
    String channel;

    @Option(names = "--molecules-per-emitter", paramLabel = "M",
            description = "Simulated emitters release M molecules each, default "
                    + SimulationSettings.DEFAULT_MOLECULES_PER_EMITTER + ".")
    Long moleculesPerEmitter;

    @Option(names = "--seed", paramLabel = "S", description = "Simulation random seed, default 1.")
    Long seed;

    @Option(names = "--dt", paramLabel = "S",
            description = "Simulation time step (s); default and largest allowed: the accuracy bound of the layout.")
    Double timeStepS;

    @Option(names = "--force-dt", description = "Accept a --dt above the accuracy bound (every output then warns).")
    boolean forceDt;

    @Option(names = "--threads", description = "Simulation worker threads, default: the processors.")
    Integer threads;

    @Option(names = "--cache-dir", paramLabel = "DIR",
            description = "Simulated channel cache (default: $NANOPLAN_CACHE_DIR, else .cache/nanoplan/channels in your home).")
    Path cacheDir;

    @Option(names = "--progress", description = "Draw the simulation progress bar even when stderr is not a terminal.")
    boolean progress;

    /** The warning every output carries when {@code --force-dt} let a step above the bound through, or null. */
    String forcedStepWarning;

    /**
     * Checks the options alone (before any file is read).
     *
     * @throws BadInputException naming the option
     */
    void check() {
        switch (channel) {
            case AUTO, ChannelMatrix.ANALYTIC, ChannelMatrix.SIMULATED -> { }
            default -> throw new BadInputException("--channel: must be auto, analytic or simulated, got " + channel);
        }
        if (channel.equals(ChannelMatrix.ANALYTIC)) {
            if (moleculesPerEmitter != null || seed != null || timeStepS != null || threads != null || cacheDir != null
                    || forceDt) {
                throw new BadInputException("--molecules-per-emitter, --seed, --dt, --force-dt, --threads and "
                        + "--cache-dir need --channel auto or simulated");
            }
            return;
        }
        if (moleculesPerEmitter != null && moleculesPerEmitter <= 0) {
            throw new BadInputException("--molecules-per-emitter: must be > 0, got " + moleculesPerEmitter);
        }
        if (timeStepS != null) {
            LinkCommand.requirePositive("--dt", timeStepS);
        }
        if (forceDt && timeStepS == null) {
            throw new BadInputException("--force-dt: needs --dt");
        }
        if (threads != null && threads < 1) {
            throw new BadInputException("--threads: must be >= 1, got " + threads);
        }
    }

    /**
     * Refuses a {@code --dt} above the scenario's accuracy bound unless {@code --force-dt}, which sets
     * {@link #forcedStepWarning}.
     *
     * @throws BadInputException one line with the largest allowed step
     */
    void checkStep(Scenario scenario) {
        String w = stepWarning(scenario, timeStepS, forceDt);
        if (w != null) {
            forcedStepWarning = w;
        }
    }

    /**
     * The --dt guard shared with {@code simulate}: null when {@code dt} is absent or within the bound, the
     * warning when it is above and forced.
     *
     * @throws BadInputException when it is above and not forced
     */
    static String stepWarning(Scenario scenario, Double dt, boolean force) {
        if (dt == null || !TimeStepRule.breaksBound(scenario, dt)) {
            return null;
        }
        double largest = TimeStepRule.automaticTimeStepS(scenario);
        if (!force) {
            throw new BadInputException(String.format(Locale.ROOT, "--dt: %.4g s breaks the accuracy bound of this "
                    + "layout (%s); the largest allowed step is %.4g s (--force-dt to run anyway)", dt,
                    TimeStepRule.BOUND_TEXT, largest));
        }
        return String.format(Locale.ROOT, "--force-dt: dt %.4g s is above the accuracy bound (largest allowed %.4g s); "
                + "simulated taps may be badly wrong", dt, largest);
    }

    /**
     * The channel to plan {@code scenario} on: null for the planner's analytic default (also when auto
     * finds nothing to simulate: the same channel), else the auto or simulated channel; null with
     * {@code stopped[0]} set when a simulation was stopped (Ctrl-C). Progress and cache use go to
     * {@code err}.
     */
    ChannelMatrix channel(Scenario scenario, PlanOptions options, Map<String, String> environment, PrintWriter err,
            boolean[] stopped) throws IOException {
        if (channel.equals(ChannelMatrix.ANALYTIC)) {
            return null;
        }
        SimulationSettings settings = new SimulationSettings(
                moleculesPerEmitter == null ? SimulationSettings.DEFAULT_MOLECULES_PER_EMITTER : moleculesPerEmitter,
                seed == null ? 1 : seed, timeStepS == null ? OptionalDouble.empty() : OptionalDouble.of(timeStepS),
                threads == null ? Runtime.getRuntime().availableProcessors() : threads);
        ChannelCache cache = new ChannelCache(cacheDir != null ? cacheDir
                : ChannelCache.defaultDirectory(environment, System.getProperty("user.home")));
        boolean bar = progress || System.console() != null;
        SimulatedChannels.MissListener onMiss = dt -> {
            err.println(String.format(Locale.ROOT, "simulated channel: cache miss; simulating %d molecules per "
                    + "emitter, seed %d, dt %.3g s", settings.moleculesPerEmitter(), settings.seed(), dt));
            err.flush();
        };
        SimulatedChannels.Obtained got;
        ChannelMatrix out;
        try (SimulationRun run = new SimulationRun()) {
            if (channel.equals(AUTO)) {
                AutoChannel.Decision decision = AutoChannel.decide(scenario, options.cutoffMolecules());
                if (decision.analyticOnly()) {
                    return null;
                }
                err.println("auto channel: the closed forms do not cover " + decision.toSimulate().size()
                        + " emitter(s); simulating " + String.join(", ", decision.toSimulate().keySet()) + " ("
                        + decision.toSimulate().values().iterator().next() + ")");
                err.flush();
                AutoChannel.Result r = AutoChannel.obtain(scenario, options.cutoffMolecules(), settings, cache,
                        (s, st) -> run.simulate(new ParticleSimulator(st), s, err, bar, !bar), () -> false, onMiss);
                got = r.obtained();
                out = r.channel();
            } else {
                got = SimulatedChannels.obtain(scenario, settings, cache, false,
                        s -> run.simulate(new ParticleSimulator(settings), s, err, bar, !bar), () -> false, onMiss);
                out = got.channel().complete() ? SimulatedChannelMatrix.of(got.channel()) : null;
            }
            if (!got.channel().complete()) {
                err.println("nanoplan: simulation stopped after " + got.channel().moleculesSimulated()
                        + " molecules; no plan computed and nothing cached");
                err.flush();
                stopped[0] = true;
                return null;
            }
        }
        got.throwStoreFailure();
        if (got.fromCache()) {
            err.println("simulated channel: cache hit (" + got.file() + "), no simulation run");
        } else {
            err.println("simulated channel: stored in " + got.file());
        }
        err.flush();
        if (forcedStepWarning != null) {
            err.println("warning: " + forcedStepWarning);
            err.flush();
            out = withNote(out, forcedStepWarning);
        }
        return out;
    }

    /** The channel with one more note first (its notes become the plan's warnings). */
    private static ChannelMatrix withNote(ChannelMatrix m, String note) {
        List<String> notes = new ArrayList<>();
        notes.add(note);
        notes.addAll(m.notes());
        return ChannelMatrix.of(m.entries(), notes);
    }
}
