package dev.nanoplan.cli;

import dev.nanoplan.plan.NetworkPlanner;
import dev.nanoplan.plan.Plan;
import dev.nanoplan.plan.PlanComparison;
import dev.nanoplan.plan.PlanOptions;
import dev.nanoplan.report.Cautions;
import dev.nanoplan.report.ComparisonJson;
import dev.nanoplan.scenario.ScenarioReader;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/** {@code nanoplan compare A B}: plans two layouts and sets their demands side by side. */
@Command(name = "compare", mixinStandardHelpOptions = true, sortOptions = false,
        description = {"Plans two layouts and compares every demand: capacity, rate, latency, molecules per "
            + "delivered bit, bottleneck."})
public final class CompareCommand implements Callable<Integer> {

    @Spec
    CommandSpec spec;

    @Parameters(index = "0", paramLabel = "A", description = "First scenario file.")
    Path first;

    @Parameters(index = "1", paramLabel = "B", description = "Second scenario file.")
    Path second;

    @Option(names = "--json", description = "Print one JSON object on stdout.")
    boolean json;

    @Option(names = "--lenient", description = "Treat unknown fields in the scenarios as warnings, not errors.")
    boolean lenient;

    @Override
    public Integer call() {
        PrintWriter out = spec.commandLine().getOut();
        PrintWriter err = spec.commandLine().getErr();
        ScenarioReader.Result a = PlanCommand.ScenarioFiles.read(first, lenient, err);
        if (a == null) {
            return ErrorHandling.BAD_INPUT;
        }
        ScenarioReader.Result b = PlanCommand.ScenarioFiles.read(second, lenient, err);
        if (b == null) {
            return ErrorHandling.BAD_INPUT;
        }
        Plan pa;
        Plan pb;
        try (ProgressLine p = ProgressLine.of(err, "planning A " + first.getFileName())) {
            pa = NetworkPlanner.plan(a.scenario(), PlanOptions.DEFAULT.withProgress(p));
        }
        try (ProgressLine p = ProgressLine.of(err, "planning B " + second.getFileName())) {
            pb = NetworkPlanner.plan(b.scenario(), PlanOptions.DEFAULT.withProgress(p));
        }
        PlanComparison c = PlanComparison.of(pa, pb);
        if (json) {
            out.println(ComparisonJson.of(c).toString());
        } else {
            out.print(c.toText());
            out.println();
            out.println("Note: " + Cautions.SHORT);
        }
        out.flush();
        return 0;
    }
}
