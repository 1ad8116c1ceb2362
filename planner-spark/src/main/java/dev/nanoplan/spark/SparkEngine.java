package dev.nanoplan.spark;

import dev.nanoplan.engine.Engine;
import dev.nanoplan.engine.EngineProgress;
import dev.nanoplan.engine.EngineUnavailableException;
import dev.nanoplan.engine.UnitResults;
import dev.nanoplan.engine.WorkUnits;
import java.io.IOException;
import java.io.Serializable;
import java.net.InetSocketAddress;
import java.net.Socket;
import java.net.URI;
import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.concurrent.atomic.AtomicBoolean;
import java.util.function.BooleanSupplier;
import java.util.function.Consumer;
import java.util.stream.IntStream;
import org.apache.spark.SparkConf;
import org.apache.spark.api.java.JavaSparkContext;
import org.apache.spark.broadcast.Broadcast;

/**
 * Runs work units as a Spark job: an RDD of the unit indices 0..n−1 in contiguous partitions, the
 * {@link WorkUnits} (scenario file text, settings, seed) broadcast once to every executor, each index
 * mapped to its unit's result, and the results collected in index order. Since a unit is a pure
 * function of the broadcast inputs and its index, the results equal the local engine's whatever the
 * partitioning and the executors.
 *
 * <p>Progress: a {@link TaskProgress} listener prints stage and task counts to the status sink and
 * reports finished tasks as work. Cancellation cancels the job group; the result then holds no unit
 * (a Spark job returns all its results or none), and the caller reports an incomplete run.
 *
 * <p>Partitions: four per default-parallelism core (at most one per unit), so a slow unit does not
 * leave the other cores idle at the end.
 */
public final class SparkEngine implements Engine {

    private static final String JOB_GROUP = "nanoplan";

    private final JavaSparkContext context;
    private final boolean ownsContext;
    private final TaskProgress listener;

    private SparkEngine(JavaSparkContext context, boolean ownsContext, Consumer<String> status) {
        this.context = context;
        this.ownsContext = ownsContext;
        this.listener = new TaskProgress(status);
        context.sc().addSparkListener(listener);
    }

    /**
     * Starts a Spark context for {@code master}.
     *
     * @param master a Spark master URL, or null for spark-submit's ({@code spark.master}) or else {@code local[*]}
     * @param status one-line stage and task notes
     * @throws EngineUnavailableException if a standalone master does not accept connections within 5 s, or
     *     the context cannot start
     */
    public static SparkEngine start(String master, Consumer<String> status) {
        SparkConf conf = new SparkConf().setAppName("nanoplan");
        if (master != null) {
            conf.setMaster(master);
        } else if (!conf.contains("spark.master")) {
            conf.setMaster("local[*]");
        }
        conf.setIfMissing("spark.ui.enabled", "false");
        String url = conf.get("spark.master");
        checkReachable(url);
        try {
            return new SparkEngine(new JavaSparkContext(conf), true, status);
        } catch (RuntimeException e) {
            throw new EngineUnavailableException("--master " + url + ": Spark could not start: " + e.getMessage(), e);
        }
    }

    /** An engine over a context the caller owns (tests share one per class); {@link #close()} leaves it running. */
    public static SparkEngine over(JavaSparkContext context, Consumer<String> status) {
        return new SparkEngine(context, false, status);
    }

    /** For {@code spark://HOST:PORT[,HOST:PORT]}: a TCP connection to the first master, else a one-line error. */
    static void checkReachable(String master) {
        if (!master.startsWith("spark://")) {
            return;
        }
        String first = master.substring("spark://".length()).split(",")[0];
        URI uri = URI.create("spark://" + first);
        if (uri.getHost() == null || uri.getPort() < 0) {
            throw new EngineUnavailableException("--master " + master + ": expected spark://HOST:PORT", null);
        }
        try (Socket s = new Socket()) {
            s.connect(new InetSocketAddress(uri.getHost(), uri.getPort()), 5000);
        } catch (IOException e) {
            throw new EngineUnavailableException("--master " + master + ": cannot reach the Spark master ("
                    + e.getClass().getSimpleName() + (e.getMessage() == null ? "" : ": " + e.getMessage()) + ")", e);
        }
    }

    @Override
    public String name() {
        return "spark";
    }

    @Override
    public <R extends Serializable> UnitResults<R> run(WorkUnits<R> units, EngineProgress progress,
            BooleanSupplier cancelled) {
        int n = units.count();
        if (n == 0) {
            return new UnitResults<>(List.of());
        }
        int partitions = Math.max(1, Math.min(n, 4 * context.defaultParallelism()));
        Broadcast<WorkUnits<R>> shared = context.broadcast(units);
        AtomicBoolean running = new AtomicBoolean(true);
        Thread watcher = new Thread(() -> {
            while (running.get()) {
                if (cancelled.getAsBoolean()) {
                    context.cancelJobGroup(JOB_GROUP);
                    return;
                }
                try {
                    Thread.sleep(200);
                } catch (InterruptedException e) {
                    return;
                }
            }
        }, "nanoplan-spark-cancel");
        watcher.setDaemon(true);
        listener.start(progress, n, partitions, units);
        try {
            context.setJobGroup(JOB_GROUP, "nanoplan work units", true);
            watcher.start();
            List<Integer> indices = IntStream.range(0, n).boxed().toList();
            List<R> results = context.parallelize(indices, partitions)
                    .map(i -> shared.value().compute(i, () -> false))
                    .collect();
            return new UnitResults<>(results);
        } catch (RuntimeException e) {
            if (cancelled.getAsBoolean()) {
                return new UnitResults<>(new ArrayList<>(Collections.nCopies(n, (R) null)));
            }
            throw e;
        } finally {
            running.set(false);
            watcher.interrupt();
            listener.stop();
            context.clearJobGroup();
            shared.destroy();
        }
    }

    @Override
    public void close() {
        context.sc().removeSparkListener(listener);
        if (ownsContext) {
            context.stop();
        }
    }
}
