package dev.nanoplan.cli;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.nanoplan.plan.PlanOptions;
import dev.nanoplan.plan.SlotAssignment;
import dev.nanoplan.scenario.ScenarioReader;
import dev.nanoplan.scenario.ScenarioWriter;
import dev.nanoplan.scenario.Signalling;
import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/**
 * {@code nanoplan slots SCENARIO --out FILE [--max-frame K] [--max-evaluations N] [--json] [--lenient]}:
 * a slot plan with spatial reuse ({@link SlotAssignment}); writes the scenario with
 * {@code "schedule": "slots"} and every emitter's slot (atomically) and prints the frame and, per demand,
 * capacity and shared rate before and after. {@code --json} keys: {@code frame_slots}, {@code slots}
 * {node id: slot}, {@code conflict_edges}, {@code evaluations}, {@code out}, {@code demands} [{{@code from},
 * {@code to}, {@code capacity_before_bits}, {@code capacity_after_bits}, {@code shared_rate_before_bits_per_s},
 * {@code shared_rate_after_bits_per_s}}].
 */
@Command(name = "slots", mixinStandardHelpOptions = true, sortOptions = false,
        description = {"Assigns emitters to time slots so that emitters far apart send together (spatial reuse).",
            "Results are model estimates; not validated for clinical use."})
public final class SlotsCommand implements Callable<Integer> {

    /** Default budget of what-if plans of the local search. */
    static final int DEFAULT_EVALUATIONS = 60;

    @Spec
    CommandSpec spec;

    @Parameters(index = "0", paramLabel = "SCENARIO", description = "Scenario file (JSON, format nanoplan/1).")
    Path scenarioFile;

    @Option(names = "--out", paramLabel = "FILE", required = true,
            description = "Write the scenario with the slot plan here (atomically).")
    Path outFile;

    @Option(names = "--max-frame", paramLabel = "K", description = "At most K slots per frame (default: no cap).")
    Integer maxFrame;

    @Option(names = "--max-evaluations", paramLabel = "N",
            description = "At most N what-if plans in the local search (default " + DEFAULT_EVALUATIONS + ").")
    Integer maxEvaluations;

    @Option(names = "--json", description = "Print one JSON object on stdout (warnings go to stderr).")
    boolean json;

    @Option(names = "--lenient", description = "Treat unknown fields in the scenario as warnings, not errors.")
    boolean lenient;

    @Override
    public Integer call() throws IOException {
        PrintWriter out = spec.commandLine().getOut();
        PrintWriter err = spec.commandLine().getErr();
        if (maxFrame != null && (maxFrame < 1 || maxFrame > Signalling.MAX_FRAME_SLOTS)) {
            throw new BadInputException("--max-frame: must be in 1.." + Signalling.MAX_FRAME_SLOTS + ", got " + maxFrame);
        }
        if (maxEvaluations != null && maxEvaluations < 0) {
            throw new BadInputException("--max-evaluations: must be >= 0, got " + maxEvaluations);
        }
        if (Files.isDirectory(outFile)) {
            throw new BadInputException("--out: is a directory: " + outFile);
        }
        ScenarioReader.Result read = PlanCommand.ScenarioFiles.read(scenarioFile, lenient, err);
        if (read == null) {
            return ErrorHandling.BAD_INPUT;
        }
        PlanCommand.ScenarioFiles.printWarnings(scenarioFile, read, err);
        SlotAssignment.Result r = new SlotAssignment(PlanOptions.DEFAULT, maxFrame == null ? 0 : maxFrame,
                maxEvaluations == null ? DEFAULT_EVALUATIONS : maxEvaluations).assign(read.scenario());
        ScenarioWriter.write(r.scenario(), outFile);
        if (json) {
            out.println(toJson(r, outFile).toString());
        } else {
            out.print(text(r, outFile));
        }
        out.flush();
        return 0;
    }

    static ObjectNode toJson(SlotAssignment.Result r, Path file) {
        ObjectNode o = new ObjectMapper().createObjectNode();
        o.put("frame_slots", r.frameSlots());
        ObjectNode slots = o.putObject("slots");
        r.slots().forEach(slots::put);
        o.put("conflict_edges", r.conflictEdges());
        o.put("evaluations", r.evaluations());
        o.put("out", file.toString());
        ArrayNode demands = o.putArray("demands");
        for (SlotAssignment.DemandChange d : r.demands()) {
            ObjectNode x = demands.addObject();
            x.put("from", d.from());
            x.put("to", d.to());
            number(x, "capacity_before_bits", d.capacityBeforeBits());
            number(x, "capacity_after_bits", d.capacityAfterBits());
            number(x, "shared_rate_before_bits_per_s", d.sharedRateBeforeBitsPerS());
            number(x, "shared_rate_after_bits_per_s", d.sharedRateAfterBitsPerS());
        }
        return o;
    }

    private static void number(ObjectNode o, String key, double v) {
        if (Double.isFinite(v)) {
            o.put(key, v);
        } else {
            o.putNull(key);
        }
    }

    static String text(SlotAssignment.Result r, Path file) {
        StringBuilder sb = new StringBuilder();
        sb.append(String.format(Locale.ROOT, "Slot plan: frame of %d slot(s), %d conflict edge(s), %d what-if plan(s)%n",
                r.frameSlots(), r.conflictEdges(), r.evaluations()));
        StringBuilder bySlot = new StringBuilder();
        for (Map.Entry<String, Integer> e : r.slots().entrySet()) {
            bySlot.append(' ').append(e.getKey()).append('=').append(e.getValue());
        }
        sb.append("Slots:").append(bySlot).append('\n');
        sb.append(String.format(Locale.ROOT, "%-22s %12s %12s %14s %14s%n", "demand", "bits before", "bits after",
                "bit/s before", "bit/s after"));
        for (SlotAssignment.DemandChange d : r.demands()) {
            sb.append(String.format(Locale.ROOT, "%-22s %12.4f %12.4f %14.4g %14.4g%n", d.from() + " -> " + d.to(),
                    d.capacityBeforeBits(), d.capacityAfterBits(), d.sharedRateBeforeBitsPerS(),
                    d.sharedRateAfterBitsPerS()));
        }
        sb.append("wrote ").append(file).append('\n');
        return sb.toString();
    }
}
