package dev.nanoplan.cli;

import dev.nanoplan.engine.Engine;

import dev.nanoplan.io.AtomicFiles;
import dev.nanoplan.report.Cautions;
import dev.nanoplan.report.ToleranceReport;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.ScenarioException;
import dev.nanoplan.scenario.ScenarioReader;
import dev.nanoplan.tolerance.Sampler;
import dev.nanoplan.tolerance.Thresholds;
import dev.nanoplan.tolerance.ToleranceResult;
import dev.nanoplan.tolerance.ToleranceRunner;
import dev.nanoplan.tolerance.ToleranceStudy;
import java.io.IOException;
import java.io.PrintWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import java.util.concurrent.Callable;
import java.util.concurrent.CountDownLatch;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicLong;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/**
 * {@code nanoplan tolerance}: yields of a layout under its fabrication tolerances. Parses, runs the
 * core's study on a thread pool, prints. Ctrl-C stops handing out samples and reports the ones that
 * finished, marked partial.
 */
@Command(name = "tolerance", mixinStandardHelpOptions = true, sortOptions = false,
        description = {"Draws perturbed layouts from the scenario's \"tolerances\" and plans each: yields per link,",
            "demand and layout with Wilson intervals, weak links, their drivers and guard bands."})
public final class ToleranceCommand implements Callable<Integer> {

    @Spec
    CommandSpec spec;

    @Parameters(index = "0", paramLabel = "SCENARIO", description = "Scenario file (JSON, nanoplan/1).")
    Path scenarioFile;

    @Option(names = "--samples", defaultValue = "1000", description = "Perturbed layouts, default ${DEFAULT-VALUE}.")
    int samples;

    @Option(names = "--seed", defaultValue = "1", description = "Seed, default ${DEFAULT-VALUE}.")
    long seed;

    @Option(names = "--sampler", defaultValue = "sobol", description = "sobol (default) or random.")
    String sampler;

    @Option(names = "--thresholds", defaultValue = "design", description = "design (default) or recalibrated.")
    String thresholds;

    @Option(names = "--guard-samples", defaultValue = "20",
            description = "Samples per guard-band step, default ${DEFAULT-VALUE} (0: no guard bands).")
    int guardSamples;

    @Option(names = "--threads", description = "Worker threads, default: the number of processors.")
    Integer threads;

    @Mixin
    EngineOptions engineOptions = new EngineOptions();

    @Option(names = "--json", description = "Print one JSON object on stdout.")
    boolean json;

    @Option(names = "--out", paramLabel = "DIR", description = "Write tolerance.json, one CSV per link and tolerance.html.")
    Path out;

    @Override
    public Integer call() throws Exception {
        if (samples < 1) {
            throw new BadInputException("--samples: must be >= 1, got " + samples);
        }
        if (guardSamples < 0) {
            throw new BadInputException("--guard-samples: must be >= 0, got " + guardSamples);
        }
        int n = threads == null ? Runtime.getRuntime().availableProcessors() : threads;
        if (n < 1) {
            throw new BadInputException("--threads: must be >= 1, got " + n);
        }
        Sampler sam;
        Thresholds thr;
        try {
            sam = Sampler.parse(sampler);
        } catch (IllegalArgumentException e) {
            throw new BadInputException("--sampler: " + e.getMessage());
        }
        try {
            thr = Thresholds.parse(thresholds);
        } catch (IllegalArgumentException e) {
            throw new BadInputException("--thresholds: " + e.getMessage());
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
        PrintWriter err = spec.commandLine().getErr();
        if (scenario.tolerances().none()) {
            err.println("nanoplan: warning: the scenario has no tolerances; every sample is the nominal layout");
        }
        ToleranceStudy study;
        try {
            study = new ToleranceStudy(scenario, sam, seed, thr);
        } catch (IllegalArgumentException e) {
            throw new BadInputException(scenarioFile + ": " + e.getMessage());
        }
        ToleranceRunner runner = new ToleranceRunner(study, n, guardSamples);
        CountDownLatch reported = new CountDownLatch(1);
        Thread hook = new Thread(() -> {
            runner.cancel();
            try {
                reported.await(30, TimeUnit.SECONDS);
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
            }
        }, "nanoplan-tolerance-stop");
        Runtime.getRuntime().addShutdownHook(hook);
        try {
            long start = System.nanoTime();
            AtomicLong samplesDone = new AtomicLong(start);
            ToleranceResult r;
            try {
                try (Engine engine = engineOptions.open(n, err)) {
                    r = runner.run(engine, samples, done -> {
                        progress(err, done, samples, start);
                        if (done == samples) {
                            samplesDone.set(System.nanoTime());
                        }
                    }, (done, total) -> guardProgress(err, done, total, samplesDone.get()));
                }
            } catch (IllegalArgumentException e) {
                throw new BadInputException(scenarioFile + ": " + e.getMessage());
            }
            err.println();
            if (r.partial()) {
                err.println("nanoplan: stopped; reporting the " + r.samples() + " samples that finished (partial)");
            }
            err.flush();
            if (out != null) {
                write(scenario, r);
            }
            PrintWriter o = spec.commandLine().getOut();
            o.print(json ? ToleranceReport.json(r).toString() + System.lineSeparator() : text(r));
            o.flush();
            return 0;
        } finally {
            reported.countDown();
            try {
                Runtime.getRuntime().removeShutdownHook(hook);
            } catch (IllegalStateException shuttingDown) {
                // the hook is running and waited for the report above
            }
        }
    }

    private static synchronized void progress(PrintWriter err, int done, int total, long start) {
        double s = (System.nanoTime() - start) / 1e9;
        double eta = done > 0 ? s / done * (total - done) : Double.NaN;
        if (done == total || done % Math.max(1, total / 100) == 0) {
            err.print(String.format(Locale.ROOT, "\r%d/%d samples  %.1f s  ETA %s ", done, total, s,
                    Double.isFinite(eta) ? String.format(Locale.ROOT, "%.0f s", eta) : "?"));
            err.flush();
        }
    }

    private static synchronized void guardProgress(PrintWriter err, long done, long total, long start) {
        double s = (System.nanoTime() - start) / 1e9;
        double eta = done > 0 ? s / done * (total - done) : Double.NaN;
        err.print(String.format(Locale.ROOT, "%sguard bands: %d/%d weak links  %.1f s  ETA %s ", done == 1 ? "\n" : "\r",
                done, total, s, Double.isFinite(eta) ? String.format(Locale.ROOT, "%.0f s", eta) : "?"));
        err.flush();
    }

    private void write(Scenario scenario, ToleranceResult r) throws IOException {
        Files.createDirectories(out);
        AtomicFiles.write(out.resolve("tolerance.json"),
                o -> o.write(ToleranceReport.json(r).toPrettyString().getBytes(StandardCharsets.UTF_8)));
        for (ToleranceResult.LinkYield l : r.links()) {
            AtomicFiles.write(out.resolve("link-" + l.from() + "-" + l.to() + ".csv"),
                    o -> o.write(ToleranceReport.csv(l).getBytes(StandardCharsets.UTF_8)));
        }
        AtomicFiles.write(out.resolve("tolerance.html"),
                o -> o.write(ToleranceReport.html(scenario, r).getBytes(StandardCharsets.UTF_8)));
    }

    static String text(ToleranceResult r) {
        StringBuilder b = new StringBuilder();
        String nl = System.lineSeparator();
        b.append(String.format(Locale.ROOT, "tolerance study: %d samples%s, sampler %s, seed %d, thresholds %s, "
                + "%d redraws%s", r.samples(), r.partial() ? " (partial)" : "", r.sampler().id(), r.seed(),
                r.thresholds().id(), r.redraws(), nl));
        b.append(String.format(Locale.ROOT, "layout yield %.3f  [%.3f, %.3f]%s%s", r.layoutYield(),
                r.layoutInterval().get(0), r.layoutInterval().get(1), nl, nl));
        b.append(String.format(Locale.ROOT, "%-22s %7s %17s %23s%s", "link", "yield", "95% interval",
                "bits P5/P50/P95", nl));
        for (ToleranceResult.LinkYield l : r.links()) {
            b.append(String.format(Locale.ROOT, "%-22s %7.3f  [%.3f, %.3f]  %6.3f %6.3f %6.3f%s",
                    l.from() + " -> " + l.to(), l.yield(), l.yieldInterval().get(0), l.yieldInterval().get(1),
                    l.capacityP5Bits(), l.capacityP50Bits(), l.capacityP95Bits(), nl));
        }
        b.append(nl).append(String.format(Locale.ROOT, "%-22s %7s %17s%s", "demand", "yield", "95% interval", nl));
        for (ToleranceResult.DemandYield d : r.demands()) {
            b.append(String.format(Locale.ROOT, "%-22s %7.3f  [%.3f, %.3f]%s", d.from() + " -> " + d.to(), d.yield(),
                    d.yieldInterval().get(0), d.yieldInterval().get(1), nl));
        }
        b.append(nl).append("weak links, likeliest failure first (drivers: ")
                .append(r.driversMethod().equals("src") ? "squared standardised regression coefficients"
                        : "first-order Sobol' indices").append(" of log10 error):").append(nl);
        for (int i : r.weakLinks()) {
            ToleranceResult.LinkYield l = r.links().get(i);
            b.append(String.format(Locale.ROOT, "  %s -> %s  yield %.3f  guard band %s molecules/symbol%s", l.from(),
                    l.to(), l.yield(), l.guardBandMoleculesPerSymbol() == null ? "not reached"
                            : l.guardBandMoleculesPerSymbol().toString(), nl));
            for (ToleranceResult.Driver d : l.drivers()) {
                b.append(String.format(Locale.ROOT, "      %-28s %.3f%s", d.tolerance(), d.index(), nl));
            }
        }
        b.append(nl).append("Tolerances are your assumptions; yields are model estimates. ").append(Cautions.SHORT)
                .append(nl);
        return b.toString();
    }
}
