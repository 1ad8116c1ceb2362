package dev.nanoplan.bench;

import dev.nanoplan.count.CountModelKind;
import dev.nanoplan.network.LinkCapacity;
import dev.nanoplan.network.LinkEvaluation;
import dev.nanoplan.network.LinkEvaluator;
import dev.nanoplan.network.LinkSpec;
import dev.nanoplan.physics.OpenSphereHitting;
import java.util.concurrent.TimeUnit;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.Warmup;

/**
 * One whole link (count pmfs, threshold search, capacity) at N = 10⁶ molecules, exact count
 * model: without ISI (target ≤ 1 ms) and with ISI memory 50 (target ≤ 20 ms); and the consistent
 * capacity of the ISI link on top (own leftovers re-weighted at every prior the search tries).
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.MICROSECONDS)
@Warmup(iterations = 3, time = 2)
@Measurement(iterations = 5, time = 2)
@Fork(1)
public class LinkBench {

    private LinkSpec noIsi;
    private LinkSpec isi50;

    @Setup
    public void setUp() {
        // an invented geometry: receiver r = 5 µm at 15 µm, D = 100 µm²/s, T = 0.5 s
        OpenSphereHitting h = OpenSphereHitting.of(15, 5, 100);
        noIsi = LinkSpec.binary(h.taps(0.5, 0), 0, 1_000_000, 0.5, 0, CountModelKind.EXACT, 0.5);
        isi50 = LinkSpec.binary(h.taps(0.5, 50), 0, 1_000_000, 0.5, 0, CountModelKind.EXACT, 0.5);
    }

    @Benchmark
    public LinkEvaluation millionMoleculesNoIsi() {
        return LinkEvaluator.evaluate(noIsi);
    }

    @Benchmark
    public LinkEvaluation millionMoleculesIsi50() {
        return LinkEvaluator.evaluate(isi50);
    }

    @Benchmark
    public LinkCapacity millionMoleculesIsi50Capacity() {
        return LinkEvaluator.evaluate(isi50).capacity();
    }

    @Benchmark
    public LinkCapacity millionMoleculesNoIsiCapacity() {
        return LinkEvaluator.evaluate(noIsi).capacity();
    }
}
