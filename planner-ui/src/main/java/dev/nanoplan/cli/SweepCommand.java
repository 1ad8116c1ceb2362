package dev.nanoplan.cli;

import dev.nanoplan.design.SweepPath;
import dev.nanoplan.design.SweepPoint;
import dev.nanoplan.design.SweepPoints;
import dev.nanoplan.design.SweepResult;
import dev.nanoplan.design.SweepSpec;
import dev.nanoplan.engine.Engine;
import dev.nanoplan.engine.UnitResults;
import dev.nanoplan.io.AtomicFiles;
import dev.nanoplan.report.Cautions;
import dev.nanoplan.report.SweepReport;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.ScenarioException;
import dev.nanoplan.scenario.ScenarioReader;
import java.io.IOException;
import java.io.PrintWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/**
 * {@code nanoplan sweep}: plans every point of a grid of scenario field values and marks the Pareto
 * front. Parses, runs the core's {@link SweepPoints} on the chosen engine, prints or writes.
 */
@Command(name = "sweep", mixinStandardHelpOptions = true, sortOptions = false,
        description = {"Plans the scenario at every point of a grid of field values: demands meeting targets,",
            "smallest shared rate, smallest end-to-end information, molecules/s, latency; Pareto front marked."})
public final class SweepCommand implements Callable<Integer> {

    @Spec
    CommandSpec spec;

    @Parameters(index = "0", paramLabel = "SCENARIO", description = "Scenario file (JSON, nanoplan/1).")
    Path scenarioFile;

    @Option(names = "--vary", paramLabel = "PATH=SPEC", required = true,
            description = {"A field and its values, repeatable; the first --vary varies slowest.",
                "PATH e.g. signalling.symbol_time_s, nodes[relay-w].molecules_per_symbol,",
                "nodes[relay-w].position_um[0], species[A].diffusion_um2_per_s.",
                "SPEC: a list a,b,c or a range start:stop:step."})
    List<String> vary;

    @Option(names = "--threads", description = "Worker threads of the local engine, default: the number of processors.")
    Integer threads;

    @Mixin
    EngineOptions engineOptions = new EngineOptions();

    @Option(names = "--json", description = "Print one JSON object on stdout.")
    boolean json;

    @Option(names = "--out", paramLabel = "DIR", description = "Write sweep.json, sweep.csv and sweep.html.")
    Path out;

    @Override
    public Integer call() throws Exception {
        int n = threads == null ? Runtime.getRuntime().availableProcessors() : threads;
        if (n < 1) {
            throw new BadInputException("--threads: must be >= 1, got " + n);
        }
        List<SweepPath> paths = new ArrayList<>();
        List<List<Double>> values = new ArrayList<>();
        for (String v : vary) {
            int eq = v.indexOf('=');
            if (eq < 0) {
                throw new BadInputException("--vary " + v + ": expected PATH=SPEC");
            }
            try {
                paths.add(SweepPath.parse(v.substring(0, eq).trim()));
                values.add(SweepSpec.parse(v.substring(eq + 1).trim()));
            } catch (IllegalArgumentException e) {
                throw new BadInputException("--vary " + e.getMessage());
            }
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
        SweepPoints units;
        try {
            units = new SweepPoints(Files.readString(scenarioFile), paths, values);
        } catch (IllegalArgumentException e) {
            throw new BadInputException(e.getMessage().startsWith("--vary") ? e.getMessage() : "--vary " + e.getMessage());
        }
        PrintWriter err = spec.commandLine().getErr();
        UnitResults<SweepPoint> results;
        try (Engine engine = engineOptions.open(n, err);
                ProgressLine progress = ProgressLine.of(err, "sweeping " + units.count() + " points")) {
            results = engine.run(units, (done, total) -> progress.accept(total == 0 ? 1 : (double) done / total),
                    () -> false);
        } catch (IllegalArgumentException e) {
            throw new BadInputException("--vary: " + e.getMessage());
        }
        List<String> fields = paths.stream().map(SweepPath::text).toList();
        SweepResult r = SweepResult.of(fields, results.finished());
        if (out != null) {
            write(scenario, r);
        }
        PrintWriter o = spec.commandLine().getOut();
        o.print(json ? SweepReport.json(r).toString() + System.lineSeparator() : text(r));
        o.flush();
        return 0;
    }

    private void write(Scenario scenario, SweepResult r) throws IOException {
        Files.createDirectories(out);
        AtomicFiles.write(out.resolve("sweep.json"),
                o -> o.write(SweepReport.json(r).toPrettyString().getBytes(StandardCharsets.UTF_8)));
        AtomicFiles.write(out.resolve("sweep.csv"), o -> o.write(SweepReport.csv(r).getBytes(StandardCharsets.UTF_8)));
        AtomicFiles.write(out.resolve("sweep.html"),
                o -> o.write(SweepReport.html(scenario.name(), r).getBytes(StandardCharsets.UTF_8)));
    }

    static String text(SweepResult r) {
        StringBuilder b = new StringBuilder();
        String nl = System.lineSeparator();
        b.append("sweep: ").append(r.points().size()).append(" points over ").append(String.join(", ", r.fields()))
                .append(nl).append(nl);
        for (String f : r.fields()) {
            b.append(String.format(Locale.ROOT, "%14s ", f.length() > 14 ? "…" + f.substring(f.length() - 13) : f));
        }
        b.append(String.format(Locale.ROOT, "%8s %12s %12s %12s %10s  %s%s", "demands", "min bit/s", "min e2e bits",
                "molecules/s", "latency s", "pareto", nl));
        for (int i = 0; i < r.points().size(); i++) {
            SweepPoint p = r.points().get(i);
            for (double v : p.values()) {
                b.append(String.format(Locale.ROOT, "%14.6g ", v));
            }
            b.append(String.format(Locale.ROOT, "%8d %12.4g %12.4g %12.4g %10s  %s%s", p.demandsMeetingTargets(),
                    p.minSharedRateBitsPerS(), p.minEndToEndCapacityBits(), p.moleculesPerS(),
                    p.maxLatencyS() == null ? "-" : String.format(Locale.ROOT, "%.3g", p.maxLatencyS()),
                    r.pareto().get(i) ? "*" : "", nl));
        }
        int best = r.best();
        if (best >= 0) {
            b.append(nl).append("best point: ").append(r.points().get(best).values()).append(nl);
        }
        b.append(nl).append(Cautions.SHORT).append(nl);
        return b.toString();
    }
}
