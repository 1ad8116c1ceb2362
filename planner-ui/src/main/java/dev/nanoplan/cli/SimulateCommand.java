package dev.nanoplan.cli;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.nanoplan.engine.Engine;
import dev.nanoplan.report.Cautions;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.ScenarioException;
import dev.nanoplan.scenario.ScenarioReader;
import dev.nanoplan.sim.LinkComparison;
import dev.nanoplan.sim.ParticleSimulator;
import dev.nanoplan.sim.SimulatedChannel;
import dev.nanoplan.sim.SimulationComparison;
import dev.nanoplan.sim.SimulationProgress;
import dev.nanoplan.sim.SimulationSettings;
import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.OptionalDouble;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/**
 * {@code nanoplan simulate}: particle simulation of a scenario's channel and its comparison with
 * the closed forms. Parses, calls the core, prints. Ctrl-C stops cleanly and reports the blocks
 * that finished.
 */
@Command(name = "simulate", mixinStandardHelpOptions = true, sortOptions = false,
        description = {"Simulates the layout's channel with Brownian particles (walls, flow, shading, decay)",
            "and compares each link's hit probability F(T) with the open-medium closed form."})
public final class SimulateCommand implements Callable<Integer> {

    @Spec
    CommandSpec spec;

    @Parameters(index = "0", paramLabel = "SCENARIO", description = "Scenario file (JSON, nanoplan/1).")
    Path scenarioFile;

    @Option(names = "--molecules-per-emitter", defaultValue = "" + SimulationSettings.DEFAULT_MOLECULES_PER_EMITTER,
            description = "Molecules released by each emitter, default ${DEFAULT-VALUE}.")
    long moleculesPerEmitter;

    @Option(names = "--seed", defaultValue = "1", description = "Random seed, default ${DEFAULT-VALUE}.")
    long seed;

    @Option(names = "--dt", paramLabel = "S", description = "Time step (s); default: chosen from the geometry.")
    Double timeStepS;

    @Option(names = "--force-dt", description = "Accept a --dt above the accuracy bound (every output then warns).")
    boolean forceDt;

    @Option(names = "--threads", description = "Worker threads, default: the number of processors.")
    Integer threads;

    @Mixin
    EngineOptions engineOptions = new EngineOptions();

    @Option(names = "--json", description = "Print one JSON object on stdout.")
    boolean json;

    @Option(names = "--progress", description = "Show a progress bar on stderr even when it is not a terminal.")
    boolean progress;

    @Override
    public Integer call() throws Exception {
        if (moleculesPerEmitter <= 0) {
            throw new BadInputException("--molecules-per-emitter: must be > 0, got " + moleculesPerEmitter);
        }
        if (timeStepS != null) {
            LinkCommand.requirePositive("--dt", timeStepS);
        }
        int n = threads == null ? Runtime.getRuntime().availableProcessors() : threads;
        if (n < 1) {
            throw new BadInputException("--threads: must be >= 1, got " + n);
        }
        if (!Files.isRegularFile(scenarioFile)) {
            throw new BadInputException(scenarioFile + ": no such file");
        }
        Scenario scenario;
        try {
            scenario = ScenarioReader.strict().read(scenarioFile);
        } catch (ScenarioException e) {
            throw new BadInputException(scenarioFile + ": " + e.getMessage());
        }
        if (forceDt && timeStepS == null) {
            throw new BadInputException("--force-dt: needs --dt");
        }
        String stepWarning = ChannelOptions.stepWarning(scenario, timeStepS, forceDt);
        SimulationSettings settings = new SimulationSettings(moleculesPerEmitter, seed,
                timeStepS == null ? OptionalDouble.empty() : OptionalDouble.of(timeStepS), n);
        ParticleSimulator simulator = new ParticleSimulator(settings);
        double dt = simulator.timeStepS(scenario);

        PrintWriter err = spec.commandLine().getErr();
        boolean showProgress = progress || System.console() != null;
        try (Engine engine = engineOptions.open(n, err); SimulationRun run = new SimulationRun()) {
            SimulatedChannel channel = run.simulate(simulator, engine, scenario, err, showProgress, false);
            if (!channel.complete()) {
                err.println("nanoplan: simulation stopped; reporting the " + channel.moleculesSimulated()
                        + " molecules that finished");
                err.flush();
            }
            List<LinkComparison> links = SimulationComparison.compare(scenario, channel);
            PrintWriter out = spec.commandLine().getOut();
            if (stepWarning != null) {
                err.println("warning: " + stepWarning);
                err.flush();
            }
            if (json) {
                out.println(json(channel, links, dt, stepWarning));
            } else {
                out.print(text(scenario, channel, links, stepWarning));
            }
            out.flush();
            return 0;
        }
    }

    static String json(SimulatedChannel channel, List<LinkComparison> links, double dt) {
        return json(channel, links, dt, null);
    }

    /** The JSON object; {@code warning} (a forced time step), when not null, goes into {@code warnings}. */
    static String json(SimulatedChannel channel, List<LinkComparison> links, double dt, String warning) {
        ObjectMapper mapper = new ObjectMapper();
        ObjectNode o = mapper.createObjectNode();
        o.put("molecules_per_emitter", channel.moleculesRequestedPerEmitter());
        o.put("seed", channel.seed());
        o.put("dt_s", dt);
        o.put("complete", channel.complete());
        ArrayNode arr = o.putArray("links");
        for (LinkComparison c : links) {
            ObjectNode l = arr.addObject();
            l.put("from", c.from());
            l.put("to", c.to());
            putFinite(l, "analytic_hit_probability", c.analyticHitProbability());
            putFinite(l, "simulated_hit_probability", c.simulatedHitProbability());
            putFinite(l, "standard_error", c.standardError());
            putFinite(l, "z_score", c.zScore());
            putFinite(l, "relative_difference", c.relativeDifference());
            l.put("flagged", c.flagged());
            l.put("reason", c.reason());
            l.put("insufficient_molecules", c.insufficient());
            if (c.insufficient() && c.minMoleculesPerEmitter() > 0) {
                l.put("min_molecules_per_emitter", c.minMoleculesPerEmitter());
            } else if (c.insufficient()) {
                l.putNull("min_molecules_per_emitter");
            }
            ArrayNode taps = l.putArray("simulated_taps");
            for (double p : c.simulatedTaps()) {
                taps.add(p);
            }
            ArrayNode se = l.putArray("simulated_taps_standard_error");
            for (double s : c.simulatedTapsStandardError()) {
                se.add(s);
            }
        }
        ArrayNode warnings = o.putArray("warnings");
        if (warning != null) {
            warnings.add(warning);
        }
        o.put("caution", Cautions.SHORT);
        return o.toString();
    }

    private static void putFinite(ObjectNode o, String key, double v) {
        if (Double.isFinite(v)) {
            o.put(key, v);
        } else {
            o.putNull(key);
        }
    }

    static String text(Scenario scenario, SimulatedChannel channel, List<LinkComparison> links) {
        return text(scenario, channel, links, null);
    }

    /** The text table; {@code warning} (a forced time step), when not null, is its first line. */
    static String text(Scenario scenario, SimulatedChannel channel, List<LinkComparison> links, String warning) {
        StringBuilder sb = new StringBuilder();
        if (warning != null) {
            sb.append("warning: ").append(warning).append(System.lineSeparator());
        }
        sb.append(String.format(Locale.ROOT, "particle simulation of \"%s\": %d molecules per emitter, seed %d, "
                + "dt %.3g s%s%n", scenario.name(), channel.moleculesRequestedPerEmitter(), channel.seed(),
                channel.timeStepS(), channel.complete() ? "" : " (stopped early: " + channel.moleculesSimulated()
                        + " molecules finished)"));
        sb.append(String.format(Locale.ROOT, "hit probability within the first symbol time T = %.4g s%n%n",
                channel.symbolTimeS()));
        sb.append(String.format(Locale.ROOT, "%-12s %-12s %12s %12s %10s %8s %9s  %s%n", "from", "to", "analytic",
                "simulated", "s.e.", "z", "rel.diff", "flag"));
        for (LinkComparison c : links) {
            sb.append(String.format(Locale.ROOT, "%-12s %-12s %12.5g %12.5g %10.2g %8.3g %8.3g%%  %s%n", c.from(),
                    c.to(), c.analyticHitProbability(), c.simulatedHitProbability(), c.standardError(), c.zScore(),
                    100 * c.relativeDifference(), c.flagged() ? "FLAG" : c.insufficient() ? "too few hits" : ""));
        }
        long flagged = links.stream().filter(LinkComparison::flagged).count();
        sb.append(System.lineSeparator());
        for (LinkComparison c : links) {
            if (c.insufficient()) {
                sb.append(c.from()).append(" -> ").append(c.to()).append(": ").append(c.reason())
                        .append(System.lineSeparator());
            }
        }
        if (flagged == 0) {
            sb.append("no link differs from the closed form by more than 5 % beyond 3 standard errors")
                    .append(System.lineSeparator());
        } else {
            for (LinkComparison c : links) {
                if (c.flagged()) {
                    sb.append("flagged ").append(c.from()).append(" -> ").append(c.to()).append(": ")
                            .append(c.reason()).append(System.lineSeparator());
                }
            }
        }
        sb.append(Cautions.SHORT).append(System.lineSeparator());
        return sb.toString();
    }

    /** Progress on stderr: molecules done, rate, ETA; redrawn at most 5 times a second. */
    static final class ProgressBar implements SimulationProgress {
        private final PrintWriter err;
        private final long startNanos = System.nanoTime();
        private long lastDrawNanos;
        private boolean drawn;

        ProgressBar(PrintWriter err) {
            this.err = err;
        }

        @Override
        public synchronized void update(long done, long total) {
            long now = System.nanoTime();
            if (drawn && now - lastDrawNanos < 200_000_000L && done < total) {
                return;
            }
            lastDrawNanos = now;
            drawn = true;
            double seconds = Math.max(1e-9, (now - startNanos) / 1e9);
            double rate = done / seconds;
            double eta = rate > 0 ? (total - done) / rate : Double.NaN;
            int width = 30;
            int filled = (int) Math.round(width * (double) done / Math.max(1, total));
            err.print(String.format(Locale.ROOT, "\r[%s%s] %d/%d molecules  %.3g/s  ETA %s ",
                    "#".repeat(filled), " ".repeat(width - filled), done, total, rate,
                    Double.isFinite(eta) ? String.format(Locale.ROOT, "%.0f s", eta) : "?"));
            err.flush();
        }

        synchronized void finish() {
            if (drawn) {
                err.println();
                err.flush();
            }
        }
    }
}
