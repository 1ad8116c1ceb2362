package dev.nanoplan.cli;

import dev.nanoplan.network.ChannelMatrix;
import dev.nanoplan.plan.NetworkPlanner;
import dev.nanoplan.plan.Plan;
import dev.nanoplan.plan.PlanComparison;
import dev.nanoplan.plan.PlanOptions;
import dev.nanoplan.report.Cautions;
import dev.nanoplan.report.ComparisonJson;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.ScenarioReader;
import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/**
 * {@code nanoplan compare A B}: plans two layouts (on the auto channel by default, {@link ChannelOptions})
 * and sets their demands side by side.
 */
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

    @Mixin
    ChannelOptions channelOptions = new ChannelOptions();

    @Override
    public Integer call() throws IOException {
        PrintWriter out = spec.commandLine().getOut();
        PrintWriter err = spec.commandLine().getErr();
        channelOptions.check();
        ScenarioReader.Result a = PlanCommand.ScenarioFiles.read(first, lenient, err);
        if (a == null) {
            return ErrorHandling.BAD_INPUT;
        }
        ScenarioReader.Result b = PlanCommand.ScenarioFiles.read(second, lenient, err);
        if (b == null) {
            return ErrorHandling.BAD_INPUT;
        }
        Plan pa = plan(a.scenario(), err, "planning A " + first.getFileName());
        Plan pb = plan(b.scenario(), err, "planning B " + second.getFileName());
        if (pa == null || pb == null) {
            return ErrorHandling.INTERNAL;
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

    /** The plan on the chosen channel (auto by default), or null when a simulation was stopped. */
    private Plan plan(Scenario scenario, PrintWriter err, String what) throws IOException {
        channelOptions.checkStep(scenario);
        boolean[] stopped = new boolean[1];
        ChannelMatrix matrix = channelOptions.channel(scenario, PlanOptions.DEFAULT, System.getenv(), err, stopped);
        if (stopped[0]) {
            return null;
        }
        PlanOptions options = matrix == null ? PlanOptions.DEFAULT : PlanOptions.DEFAULT.withChannel(matrix);
        try (ProgressLine p = ProgressLine.of(err, what)) {
            return NetworkPlanner.plan(scenario, options.withProgress(p));
        }
    }
}
