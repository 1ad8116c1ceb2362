package dev.nanoplan.spark;

import dev.nanoplan.engine.EngineProgress;
import dev.nanoplan.engine.WorkUnits;
import java.util.Locale;
import java.util.function.Consumer;
import org.apache.spark.scheduler.SparkListener;
import org.apache.spark.scheduler.SparkListenerStageCompleted;
import org.apache.spark.scheduler.SparkListenerStageSubmitted;
import org.apache.spark.scheduler.SparkListenerTaskEnd;

/**
 * Stage and task progress of the running batch: a line per submitted and completed stage and per
 * finished task (at most one every half second) to the status sink, and finished tasks turned into
 * the batch's work ({@link WorkUnits#work} of a task's contiguous share of the units; a partition of
 * units [p·n/P, (p+1)·n/P) as Spark slices a range). Called on Spark's listener thread.
 */
final class TaskProgress extends SparkListener {

    private final Consumer<String> status;
    private EngineProgress progress = EngineProgress.NONE;
    private long[] partitionWork = new long[0];
    private long workTotal;
    private long workDone;
    private int tasksDone;
    private long lastNoteNanos;
    private long startNanos;

    TaskProgress(Consumer<String> status) {
        this.status = status;
    }

    synchronized void start(EngineProgress p, int units, int partitions, WorkUnits<?> work) {
        progress = p;
        partitionWork = new long[partitions];
        workTotal = 0;
        for (int part = 0; part < partitions; part++) {
            int from = (int) ((long) part * units / partitions);
            int to = (int) ((long) (part + 1) * units / partitions);
            for (int i = from; i < to; i++) {
                partitionWork[part] += work.work(i);
            }
            workTotal += partitionWork[part];
        }
        workDone = 0;
        tasksDone = 0;
        startNanos = System.nanoTime();
    }

    synchronized void stop() {
        progress = EngineProgress.NONE;
    }

    @Override
    public synchronized void onStageSubmitted(SparkListenerStageSubmitted e) {
        status.accept(String.format(Locale.ROOT, "spark: stage %d started, %d tasks", e.stageInfo().stageId(),
                e.stageInfo().numTasks()));
    }

    @Override
    public synchronized void onStageCompleted(SparkListenerStageCompleted e) {
        status.accept(String.format(Locale.ROOT, "spark: stage %d %s after %.1f s", e.stageInfo().stageId(),
                e.stageInfo().failureReason().isDefined() ? "failed" : "finished",
                (System.nanoTime() - startNanos) / 1e9));
    }

    @Override
    public synchronized void onTaskEnd(SparkListenerTaskEnd e) {
        if (!"Success".equals(e.reason().toString())) {
            return;
        }
        int part = e.taskInfo().partitionId();
        if (part >= 0 && part < partitionWork.length) {
            workDone += partitionWork[part];
            tasksDone++;
            progress.update(workDone, workTotal);
        }
        long now = System.nanoTime();
        if (now - lastNoteNanos > 500_000_000L || tasksDone == partitionWork.length) {
            lastNoteNanos = now;
            double s = (now - startNanos) / 1e9;
            double eta = workDone > 0 ? s * (workTotal - workDone) / workDone : Double.NaN;
            status.accept(String.format(Locale.ROOT, "spark: %d/%d tasks done, %.1f s, ETA %s", tasksDone,
                    partitionWork.length, s, Double.isFinite(eta) ? String.format(Locale.ROOT, "%.0f s", eta) : "?"));
        }
    }
}
