package dev.nanoplan.cli;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.nanoplan.design.Assessment;
import dev.nanoplan.design.Change;
import dev.nanoplan.design.DesignMove;
import dev.nanoplan.design.ImproveOptions;
import dev.nanoplan.design.Improvement;
import dev.nanoplan.design.LayoutImprover;
import dev.nanoplan.design.Objective;
import dev.nanoplan.geometry.Vec3;
import dev.nanoplan.io.AtomicFiles;
import dev.nanoplan.plan.NetworkPlanner;
import dev.nanoplan.plan.Plan;
import dev.nanoplan.plan.PlanOptions;
import dev.nanoplan.report.PlanHtml;
import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.ScenarioReader;
import dev.nanoplan.scenario.ScenarioWriter;
import java.io.IOException;
import java.io.PrintWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.EnumSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;
import java.util.concurrent.Callable;
import java.util.concurrent.CountDownLatch;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicBoolean;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/**
 * {@code nanoplan improve SCENARIO --out FILE [--allow species,slots,budgets,move-relays,add-relays]
 * [--max-new-relays R] [--seed S] [--time-limit-s X] [--json] [--report DIR]}: searches for a layout
 * on which more demands meet their targets ({@link LayoutImprover}), writes it atomically, and prints
 * the objective before and after, the changes in plain words and each demand before and after.
 * Progress goes to stderr; Ctrl-C or the time limit ends the search with the best layout so far.
 */
@Command(name = "improve", mixinStandardHelpOptions = true, sortOptions = false,
        description = {"Searches species, molecule budgets and relay positions (and new relays if allowed) for a",
            "layout on which more demands meet their targets; never returns a worse layout.",
            "A model-based proposal: check walls and flow with `simulate`. Not validated for clinical use."})
public final class ImproveCommand implements Callable<Integer> {

    /** The report file written by {@code --report}. */
    static final String HTML_FILE = "report.html";

    @Spec
    CommandSpec spec;

    @Parameters(index = "0", paramLabel = "SCENARIO", description = "Scenario file (JSON, format nanoplan/1).")
    Path scenarioFile;

    @Option(names = "--out", paramLabel = "FILE", required = true, description = "Where to write the improved scenario.")
    Path outFile;

    @Option(names = "--allow", paramLabel = "MOVES", split = ",",
            description = "What may change: species, slots, budgets, move-relays, add-relays "
                    + "(default: all but add-relays).")
    List<String> allow;

    @Option(names = "--max-new-relays", paramLabel = "R", defaultValue = "2",
            description = "Most relays added with add-relays (default ${DEFAULT-VALUE}).")
    int maxNewRelays;

    @Option(names = "--seed", paramLabel = "S", defaultValue = "1", description = "Seed of the relay optimiser (default 1).")
    long seed;

    @Option(names = "--time-limit-s", paramLabel = "X", defaultValue = "60",
            description = "Stop after X seconds with the best layout so far (default ${DEFAULT-VALUE}).")
    double timeLimitS;

    @Option(names = "--json", description = "Print one JSON object on stdout (progress goes to stderr).")
    boolean json;

    @Option(names = "--report", paramLabel = "DIR",
            description = "Also write report.html of the improved layout into DIR (moved nodes' old places as ghosts).")
    Path reportDir;

    @Option(names = "--lenient", description = "Treat unknown fields in the scenario as warnings, not errors.")
    boolean lenient;

    @Override
    public Integer call() throws IOException {
        PrintWriter out = spec.commandLine().getOut();
        PrintWriter err = spec.commandLine().getErr();
        Set<DesignMove> moves = moves();
        if (maxNewRelays < 0) {
            throw new BadInputException("--max-new-relays: must be >= 0, got " + maxNewRelays);
        }
        if (!(timeLimitS > 0) || Double.isInfinite(timeLimitS)) {
            throw new BadInputException("--time-limit-s: must be a finite number > 0, got " + timeLimitS);
        }
        if (Files.isDirectory(outFile)) {
            throw new BadInputException("--out: is a directory, not a file: " + outFile);
        }
        if (reportDir != null && Files.exists(reportDir) && !Files.isDirectory(reportDir)) {
            throw new BadInputException("--report: not a directory: " + reportDir);
        }
        ScenarioReader.Result read = PlanCommand.ScenarioFiles.read(scenarioFile, lenient, err);
        if (read == null) {
            return ErrorHandling.BAD_INPUT;
        }
        PlanCommand.ScenarioFiles.printWarnings(scenarioFile, read, err);
        AtomicBoolean cancelled = new AtomicBoolean();
        CountDownLatch written = new CountDownLatch(1);
        Thread hook = new Thread(() -> {
            cancelled.set(true);
            try {
                written.await(60, TimeUnit.SECONDS);
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
            }
        }, "nanoplan-improve-stop");
        Runtime.getRuntime().addShutdownHook(hook);
        try {
            ImproveOptions options = ImproveOptions.defaults().withAllowed(moves).withMaxNewRelays(maxNewRelays)
                    .withSeed(seed).withTimeLimit(timeLimitS).withCancel(cancelled::get)
                    .withProgress(p -> progress(err, p));
            Improvement result = LayoutImprover.improve(read.scenario(), options);
            ScenarioWriter.write(result.after(), outFile);
            if (json) {
                out.println(json(result, seed).toString());
            } else {
                out.print(text(result, moves));
            }
            out.flush();
            if (reportDir != null) {
                Files.createDirectories(reportDir);
                Plan plan = NetworkPlanner.plan(result.after(), PlanOptions.DEFAULT);
                AtomicFiles.write(reportDir.resolve(HTML_FILE),
                        PlanHtml.render(plan, ghosts(result)).getBytes(StandardCharsets.UTF_8));
            }
            (json ? err : out).println("wrote " + outFile + (reportDir == null ? "" : " and "
                    + reportDir.resolve(HTML_FILE)));
            out.flush();
            err.flush();
            return 0;
        } finally {
            written.countDown();
            try {
                Runtime.getRuntime().removeShutdownHook(hook);
            } catch (IllegalStateException shuttingDown) {
                // the JVM is stopping: the hook waited for the write above
            }
        }
    }

    private Set<DesignMove> moves() {
        if (allow == null || allow.isEmpty()) {
            return DesignMove.defaults();
        }
        Set<DesignMove> out = EnumSet.noneOf(DesignMove.class);
        for (String a : allow) {
            try {
                out.add(DesignMove.parse(a.trim()));
            } catch (IllegalArgumentException e) {
                throw new BadInputException("--allow: " + e.getMessage());
            }
        }
        return out;
    }

    private static void progress(PrintWriter err, ImproveOptions.Progress p) {
        err.println(String.format(Locale.ROOT, "improve: %d evaluations, %.1f s (at most %.0f s left): %s; best: %s",
                p.evaluations(), p.elapsedS(), p.remainingS(), p.step(), p.best().describe()));
        err.flush();
    }

    /** Old centres of the moved nodes. */
    static Map<String, Vec3> ghosts(Improvement r) {
        Map<String, Node> before = r.before().nodesById();
        Map<String, Vec3> out = new LinkedHashMap<>();
        for (Node n : r.after().nodes()) {
            Node o = before.get(n.id());
            if (o != null && !o.positionUm().equals(n.positionUm())) {
                out.put(n.id(), o.positionUm());
            }
        }
        return out;
    }

    static String text(Improvement r, Set<DesignMove> moves) {
        StringBuilder sb = new StringBuilder();
        sb.append("Objective (lexicographic: demands meeting both targets, then the smallest shared rate, then "
                + "molecules per second)\n");
        sb.append("  before: ").append(r.assessedBefore().objective().describe()).append('\n');
        sb.append("  after:  ").append(r.assessedAfter().objective().describe()).append('\n');
        sb.append(String.format(Locale.ROOT, "%d layouts evaluated in %.1f s%s%n", r.evaluations(), r.seconds(),
                r.stoppedEarly() ? " (stopped early: time limit or Ctrl-C; best so far)" : ""));
        sb.append("\nChanges\n");
        if (r.changes().isEmpty()) {
            sb.append("  none: no allowed change made the layout better\n");
        }
        for (Change c : r.changes()) {
            sb.append("  ").append(c.describe()).append('\n');
        }
        sb.append("\nDemands (meets = every hop's error within the target and shared rate >= the rate target)\n");
        sb.append(String.format(Locale.ROOT, "  %-18s %-8s %-8s %14s %14s%n", "demand", "before", "after",
                "rate before", "rate after"));
        for (int i = 0; i < r.assessedAfter().demands().size(); i++) {
            Assessment.DemandOutcome b = r.assessedBefore().demands().get(i);
            Assessment.DemandOutcome a = r.assessedAfter().demands().get(i);
            sb.append(String.format(Locale.ROOT, "  %-18s %-8s %-8s %12.4g/s %12.4g/s%n", a.from() + " -> " + a.to(),
                    b.meetsTargets() ? "meets" : "misses", a.meetsTargets() ? "meets" : "misses",
                    b.sharedRateBitsPerS(), a.sharedRateBitsPerS()));
        }
        sb.append("\nA model-based proposal: check walls and flow with `nanoplan simulate`; not validated for "
                + "clinical use.\n");
        return sb.toString();
    }

    static ObjectNode json(Improvement r, long seed) {
        ObjectMapper m = new ObjectMapper();
        ObjectNode o = m.createObjectNode();
        o.set("objective_before", objective(m, r.assessedBefore().objective()));
        o.set("objective_after", objective(m, r.assessedAfter().objective()));
        ArrayNode changes = o.putArray("changes");
        for (Change c : r.changes()) {
            ObjectNode e = changes.addObject();
            e.put("node", c.node());
            e.put("field", c.field());
            e.put("from", c.from());
            e.put("to", c.to());
            e.put("reason", c.reason());
        }
        ArrayNode demands = o.putArray("demands");
        for (int i = 0; i < r.assessedAfter().demands().size(); i++) {
            Assessment.DemandOutcome b = r.assessedBefore().demands().get(i);
            Assessment.DemandOutcome a = r.assessedAfter().demands().get(i);
            ObjectNode d = demands.addObject();
            d.put("from", a.from());
            d.put("to", a.to());
            d.put("meets_targets_before", b.meetsTargets());
            d.put("meets_targets_after", a.meetsTargets());
            d.put("shared_rate_before_bits_per_s", b.sharedRateBitsPerS());
            d.put("shared_rate_after_bits_per_s", a.sharedRateBitsPerS());
        }
        o.put("evaluations", r.evaluations());
        o.put("seconds", r.seconds());
        o.put("seed", seed);
        o.put("stopped_early", r.stoppedEarly());
        return o;
    }

    private static ObjectNode objective(ObjectMapper m, Objective obj) {
        ObjectNode o = m.createObjectNode();
        o.put("demands_meeting_targets", obj.demandsMeetingTargets());
        o.put("min_shared_rate_bits_per_s", obj.minSharedRateBitsPerS());
        o.put("molecules_per_s", obj.moleculesPerS());
        return o;
    }
}
