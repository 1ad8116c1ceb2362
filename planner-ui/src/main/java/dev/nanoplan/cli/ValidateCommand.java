package dev.nanoplan.cli;

import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.ScenarioReader;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/**
 * {@code nanoplan validate SCENARIO [--lenient]}: only the checks of docs/architecture.md §4.1. Prints
 * {@code ok: <name>: N nodes, M demands} (and any warnings) with exit status 0, or every problem on
 * stderr, prefixed with the file name, with exit status 2.
 */
@Command(name = "validate", mixinStandardHelpOptions = true,
        description = "Checks a scenario file: fields, units, ranges, ids, overlaps, nodes inside the volume.")
public final class ValidateCommand implements Callable<Integer> {

    @Spec
    CommandSpec spec;

    @Parameters(index = "0", paramLabel = "SCENARIO", description = "Scenario file (JSON, format nanoplan/1).")
    Path scenarioFile;

    @Option(names = "--lenient", description = "Treat unknown fields as warnings, not errors.")
    boolean lenient;

    @Override
    public Integer call() {
        PrintWriter out = spec.commandLine().getOut();
        PrintWriter err = spec.commandLine().getErr();
        ScenarioReader.Result read = PlanCommand.ScenarioFiles.read(scenarioFile, lenient, err);
        if (read == null) {
            return ErrorHandling.BAD_INPUT;
        }
        Scenario s = read.scenario();
        String name = s.name().isBlank() ? "(unnamed)" : s.name();
        out.println("ok: " + name + ": " + s.nodes().size() + " nodes, " + s.demands().size() + " demands");
        PlanCommand.ScenarioFiles.printWarnings(scenarioFile, read, out);
        out.flush();
        return 0;
    }
}
