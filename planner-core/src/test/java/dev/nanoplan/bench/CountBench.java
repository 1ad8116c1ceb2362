package dev.nanoplan.bench;

import dev.nanoplan.count.BinomialTerm;
import dev.nanoplan.count.CountLaw;
import dev.nanoplan.count.CountPmf;
import dev.nanoplan.count.CountTerm;
import dev.nanoplan.count.ExactCountModel;
import dev.nanoplan.count.LogTails;
import dev.nanoplan.count.MixtureTerm;
import dev.nanoplan.count.PoissonTerm;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.TimeUnit;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;

/**
 * Exact count model timings. Run e.g.
 * {@code java -cp target/test-classes:target/classes:<deps> org.openjdk.jmh.Main CountBench -f 1 -wi 2 -i 3}.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.MICROSECONDS)
public class CountBench {

    private static final int N = 1_000_000;

    private CountLaw single;
    private CountLaw isi50;

    @Setup
    public void setup() {
        single = CountLaw.of(new BinomialTerm(N, 0.3), new PoissonTerm(20));
        // taps of a plausible decaying shape, p_k = 0.3·(k+1)^{-3/2}·0.5 for k ≥ 1 (ISI tail of
        // an absorbing receiver falls like k^{-3/2}); earlier symbols 0/1 with prior 1/2, "0" = no release
        List<CountTerm> terms = new ArrayList<>();
        terms.add(new BinomialTerm(N, 0.3));
        for (int k = 1; k <= 50; k++) {
            double pk = 0.15 * Math.pow(k + 1, -1.5);
            terms.add(MixtureTerm.of(0.5, new BinomialTerm(0, pk), new BinomialTerm(N, pk)));
        }
        terms.add(new PoissonTerm(20));
        isi50 = new CountLaw(terms);
    }

    @Benchmark
    public CountPmf singleBinomialPlusBackground() {
        return ExactCountModel.DEFAULT.pmf(single);
    }

    @Benchmark
    public CountPmf fiftyIsiTerms() {
        return ExactCountModel.DEFAULT.pmf(isi50);
    }

    @Benchmark
    public double logUpperTailSingleDeep() {
        return LogTails.logUpperTail(single, 310_000);
    }
}
