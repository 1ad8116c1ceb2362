package dev.nanoplan.cli;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializationFeature;
import dev.nanoplan.io.AtomicFiles;
import dev.nanoplan.network.ChannelMatrix;
import dev.nanoplan.plan.NetworkPlanner;
import dev.nanoplan.plan.Plan;
import dev.nanoplan.plan.PlanOptions;
import dev.nanoplan.report.PlanCsv;
import dev.nanoplan.report.PlanHtml;
import dev.nanoplan.report.PlanJson;
import dev.nanoplan.report.PlanText;
import dev.nanoplan.scenario.ScenarioException;
import dev.nanoplan.scenario.ScenarioProblem;
import dev.nanoplan.scenario.ScenarioReader;
import java.io.IOException;
import java.io.PrintWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Map;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/**
 * {@code nanoplan plan SCENARIO [--json] [--out DIR] [--capacity-floor-bits X] [--lenient]
 * [--channel auto|analytic|simulated [--molecules-per-emitter M] [--seed S] [--dt S [--force-dt]] [--cache-dir DIR]]}:
 * plans the whole layout on the auto channel (closed forms where they hold, simulated taps for the other
 * emitters, read from the simulated-channel cache when the same physics, M, seed and Δt were simulated
 * before), or on closed-form or simulated taps only ({@link ChannelOptions}). Prints the text summary, or with {@code --json} one JSON object (docs/architecture.md §4.3)
 * and nothing else on stdout; {@code --out DIR} also writes {@code plan.json}, {@code links.csv} and
 * {@code report.html} there, each atomically.
 */
@Command(name = "plan", mixinStandardHelpOptions = true, sortOptions = false,
        description = {"Plans a layout: every link, a route per demand with its bottleneck, molecule budgets.",
            "Results are model estimates; not validated for clinical use."})
public final class PlanCommand implements Callable<Integer> {

    /** Names of the files written by {@code --out}. */
    static final String JSON_FILE = "plan.json";
    static final String CSV_FILE = "links.csv";
    static final String HTML_FILE = "report.html";

    @Spec
    CommandSpec spec;

    @Parameters(index = "0", paramLabel = "SCENARIO", description = "Scenario file (JSON, format nanoplan/1).")
    Path scenarioFile;

    @Option(names = "--json", description = "Print one JSON object on stdout (progress and warnings go to stderr).")
    boolean json;

    @Option(names = "--out", paramLabel = "DIR", description = "Also write plan.json, links.csv and report.html into DIR.")
    Path outDir;

    @Option(names = "--capacity-floor-bits", paramLabel = "X",
            description = "Drop links carrying less than X bits/symbol (default: the planner's).")
    Double capacityFloorBits;

    @Option(names = "--budgets", paramLabel = "MODE", description = "Molecule budgets: joint (default; all route "
            + "emitters together, power control) or independent (each alone, the others at their file budgets).")
    String budgets = "joint";

    @Option(names = "--lenient", description = "Treat unknown fields in the scenario as warnings, not errors.")
    boolean lenient;

    @Mixin
    ChannelOptions channelOptions = new ChannelOptions();

    /** Environment (a field so tests can replace it). */
    Map<String, String> environment = System.getenv();

    @Override
    public Integer call() throws IOException {
        PrintWriter out = spec.commandLine().getOut();
        PrintWriter err = spec.commandLine().getErr();
        PlanOptions options = PlanOptions.DEFAULT;
        if (capacityFloorBits != null) {
            if (!(capacityFloorBits >= 0 && capacityFloorBits < 1)) {
                throw new BadInputException("--capacity-floor-bits: must be in [0, 1) bit/symbol, got "
                        + capacityFloorBits);
            }
            options = options.withFloor(capacityFloorBits);
        }
        if (!budgets.equals("joint") && !budgets.equals("independent")) {
            throw new BadInputException("--budgets: must be joint or independent, got " + budgets);
        }
        options = options.withJointBudgets(budgets.equals("joint"));
        channelOptions.check();
        ScenarioReader.Result read = ScenarioFiles.read(scenarioFile, lenient, err);
        if (read == null) {
            return ErrorHandling.BAD_INPUT;
        }
        if (outDir != null) {
            OutputPaths.folder("--out", outDir);
        }
        ScenarioFiles.printWarnings(scenarioFile, read, err);
        int levels = read.scenario().signalling().levels();
        if (levels > 2) {
            // said before the long work starts (measured on the culture tank, 2 shared cores, 2026-12-05)
            err.println("note: levels " + levels + ": every link, budget and advice step runs a multi-level threshold "
                    + "search; the 17-node culture tank needs about 1 min of CPU with 3 levels, 3 min with 4 and many "
                    + "minutes with 16 (progress and time left follow)");
        }
        channelOptions.checkStep(read.scenario());
        boolean[] stopped = new boolean[1];
        ChannelMatrix matrix = channelOptions.channel(read.scenario(), options, environment, err, stopped);
        if (stopped[0]) {
            return ErrorHandling.INTERNAL;
        }
        if (matrix != null) {
            options = options.withChannel(matrix);
        }
        Plan plan;
        try (ProgressLine progressLine = ProgressLine.of(err, "planning " + scenarioFile.getFileName())) {
            plan = NetworkPlanner.plan(read.scenario(), options.withProgress(progressLine));
        }
        if (json) {
            out.println(PlanJson.of(plan).toString());
            for (String w : plan.warnings()) {
                err.println("warning: " + w);
            }
        } else {
            out.print(PlanText.render(plan));
        }
        out.flush();
        if (outDir != null) {
            write(plan, outDir);
            (json ? err : out).println("wrote " + outDir.resolve(JSON_FILE) + ", " + outDir.resolve(CSV_FILE)
                    + ", " + outDir.resolve(HTML_FILE));
        }
        out.flush();
        err.flush();
        return 0;
    }

    /** Writes the three report files into {@code dir} (created if needed), each atomically. */
    static void write(Plan plan, Path dir) throws IOException {
        ObjectMapper pretty = new ObjectMapper().enable(SerializationFeature.INDENT_OUTPUT);
        AtomicFiles.write(dir.resolve(JSON_FILE),
                (pretty.writeValueAsString(PlanJson.of(plan)) + "\n").getBytes(StandardCharsets.UTF_8));
        AtomicFiles.write(dir.resolve(CSV_FILE), PlanCsv.links(plan).getBytes(StandardCharsets.UTF_8));
        AtomicFiles.write(dir.resolve(HTML_FILE), PlanHtml.render(plan).getBytes(StandardCharsets.UTF_8));
    }

    /** Reading a scenario file for a subcommand, with the error format shared by plan and validate. */
    static final class ScenarioFiles {

        private ScenarioFiles() {
        }

        /**
         * Reads and validates; on problems prints them to {@code err}, one per line prefixed with the
         * file name, and returns null.
         *
         * @throws BadInputException if the file does not exist (one line)
         */
        static ScenarioReader.Result read(Path file, boolean lenient, PrintWriter err) {
            if (!Files.exists(file)) {
                throw new BadInputException("no such file: " + file);
            }
            if (!Files.isReadable(file)) {
                throw new BadInputException("cannot read file (permission denied): " + file);
            }
            if (Files.isDirectory(file)) {
                throw new BadInputException("is a directory, not a scenario file: " + file);
            }
            try {
                return new ScenarioReader(lenient).load(file);
            } catch (ScenarioException e) {
                for (ScenarioProblem p : e.problems()) {
                    err.println(file + ": " + p);
                }
                err.flush();
                return null;
            }
        }

        static void printWarnings(Path file, ScenarioReader.Result read, PrintWriter to) {
            for (ScenarioProblem w : read.warnings()) {
                to.println(file + ": warning: " + w);
            }
        }
    }
}
