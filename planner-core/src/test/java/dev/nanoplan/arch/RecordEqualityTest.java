package dev.nanoplan.arch;

import static org.assertj.core.api.Assertions.assertThat;

import com.tngtech.archunit.core.importer.ClassFileImporter;
import com.tngtech.archunit.core.importer.ImportOption;
import dev.nanoplan.detect.BinaryDetection;
import dev.nanoplan.detect.FirstThresholdSweep;
import dev.nanoplan.detect.MultiLevelQuantizer;
import dev.nanoplan.detect.MultiLevelResult;
import dev.nanoplan.info.BlahutArimoto;
import dev.nanoplan.network.ChannelEntry;
import dev.nanoplan.plan.Impairment;
import dev.nanoplan.plan.LinkReport;
import java.lang.reflect.RecordComponent;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Set;
import java.util.function.Supplier;
import org.junit.jupiter.api.Test;

/**
 * A record's generated equals compares arrays by identity, so a record holding an array must
 * declare its own equals (and hashCode) comparing every component by content.
 */
class RecordEqualityTest {

    /**
     * Records allowed to keep identity equality for their arrays: {@code ParticleSimulator$EmitterPlan}
     * (private per-run constants, never compared).
     */
    private static final Set<String> ALLOWED = Set.of("dev.nanoplan.sim.ParticleSimulator$EmitterPlan");

    /** Curves of a three-threshold binary detection (first threshold at curve index 0). */
    private static final double[] MI = {0, 0.5, 0};
    private static final double[] ERROR = {0.5, 0.1, 0.5};

    @Test
    void recordsHoldingArraysDeclareEquals() throws ReflectiveOperationException {
        List<String> missing = new ArrayList<>();
        int withArrays = 0;
        for (var c : new ClassFileImporter().withImportOption(ImportOption.Predefined.DO_NOT_INCLUDE_TESTS)
                .importPackages("dev.nanoplan")) {
            Class<?> type = Class.forName(c.getName(), false, getClass().getClassLoader());
            if (!type.isRecord() || Arrays.stream(type.getRecordComponents())
                    .map(RecordComponent::getType).noneMatch(Class::isArray)) {
                continue;
            }
            withArrays++;
            boolean declares = Arrays.stream(type.getDeclaredMethods()).anyMatch(m -> m.getName().equals("equals")
                    && m.getParameterCount() == 1 && m.getParameterTypes()[0] == Object.class);
            if (!declares && !ALLOWED.contains(type.getName())) {
                missing.add(type.getName());
            }
        }
        // guards against a vacuous pass
        assertThat(withArrays).isGreaterThan(5);
        assertThat(missing).as("records holding arrays without their own equals").isEmpty();
    }

    @Test
    void linkReportsDifferingInAnyComponentAreNotEqual() {
        LinkReport a = link(100, null);
        // equal content, distinct arrays
        assertThat(link(100, null)).isEqualTo(a).hasSameHashCodeAs(a);
        // the signal mean and the caveat were not compared before
        assertThat(link(101, null)).isNotEqualTo(a);
        assertThat(link(100, "walls")).isNotEqualTo(a);
    }

    @Test
    void channelEntriesDifferingOnlyInTheirCaveatAreNotEqual() {
        ChannelEntry a = new ChannelEntry("tx", "rx", "A", new double[] {0.1, 0.05}, "analytic", null);
        assertThat(new ChannelEntry("tx", "rx", "A", new double[] {0.1, 0.05}, "analytic", null)).isEqualTo(a);
        assertThat(new ChannelEntry("tx", "rx", "A", new double[] {0.1, 0.05}, "analytic", "walls")).isNotEqualTo(a);
    }

    @Test
    void multiLevelResultsDifferingInAnyComponentAreNotEqual() {
        Supplier<MultiLevelResult> base = () -> new MultiLevelResult(new long[] {3}, new double[] {0.5, 0.5}, 0.5,
                channel(0.1), new long[] {4}, 0.4, 0.6, 1, true, 0.0);
        assertEqualContentEqualAndEachChangeUnequal(base, List.of(
                new MultiLevelResult(new long[] {2}, new double[] {0.5, 0.5}, 0.5,
                        channel(0.1), new long[] {4}, 0.4, 0.6, 1, true, 0.0),
                new MultiLevelResult(new long[] {3}, new double[] {0.4, 0.6}, 0.5,
                        channel(0.1), new long[] {4}, 0.4, 0.6, 1, true, 0.0),
                new MultiLevelResult(new long[] {3}, new double[] {0.5, 0.5}, 0.55,
                        channel(0.1), new long[] {4}, 0.4, 0.6, 1, true, 0.0),
                new MultiLevelResult(new long[] {3}, new double[] {0.5, 0.5}, 0.5,
                        new double[][] {{0.9, 0.1}, {0.3, 0.7}}, new long[] {4}, 0.4, 0.6, 1, true, 0.0),
                new MultiLevelResult(new long[] {3}, new double[] {0.5, 0.5}, 0.5,
                        channel(0.1), new long[] {5}, 0.4, 0.6, 1, true, 0.0),
                new MultiLevelResult(new long[] {3}, new double[] {0.5, 0.5}, 0.5,
                        channel(0.1), new long[] {4}, 0.45, 0.6, 1, true, 0.0),
                new MultiLevelResult(new long[] {3}, new double[] {0.5, 0.5}, 0.5,
                        channel(0.1), new long[] {4}, 0.4, 0.65, 1, true, 0.0),
                new MultiLevelResult(new long[] {3}, new double[] {0.5, 0.5}, 0.5,
                        channel(0.1), new long[] {4}, 0.4, 0.6, 2, true, 0.0),
                new MultiLevelResult(new long[] {3}, new double[] {0.5, 0.5}, 0.5,
                        channel(0.1), new long[] {4}, 0.4, 0.6, 1, false, 0.0),
                new MultiLevelResult(new long[] {3}, new double[] {0.5, 0.5}, 0.5,
                        channel(0.1), new long[] {4}, 0.4, 0.6, 1, true, 0.01)));
        // an uncertified gap (NaN) equals itself, as in a record's generated equals
        MultiLevelResult uncertified = new MultiLevelResult(new long[] {3}, new double[] {0.5, 0.5}, 0.5,
                channel(0.1), new long[] {4}, 0.4, 0.6, 1, true, Double.NaN);
        assertThat(new MultiLevelResult(new long[] {3}, new double[] {0.5, 0.5}, 0.5,
                channel(0.1), new long[] {4}, 0.4, 0.6, 1, true, Double.NaN))
                .isEqualTo(uncertified).hasSameHashCodeAs(uncertified);
    }

    @Test
    void quantizationsDifferingInAnyComponentAreNotEqual() {
        Supplier<MultiLevelQuantizer.Quantization> base = () -> new MultiLevelQuantizer.Quantization(
                new long[] {3}, 0.5, channel(0.1), true);
        assertEqualContentEqualAndEachChangeUnequal(base, List.of(
                new MultiLevelQuantizer.Quantization(new long[] {4}, 0.5, channel(0.1), true),
                new MultiLevelQuantizer.Quantization(new long[] {3}, 0.6, channel(0.1), true),
                new MultiLevelQuantizer.Quantization(new long[] {3}, 0.5, channel(0.2), true),
                new MultiLevelQuantizer.Quantization(new long[] {3}, 0.5, channel(0.1), false)));
    }

    @Test
    void binaryDetectionsDifferingInAnyComponentAreNotEqual() {
        Supplier<BinaryDetection> base = () -> detection(1, 0.5, 1, 0.1, 1, 0.5, 0.5, 0.1, 0.1, 0, MI.clone(),
                ERROR.clone());
        assertEqualContentEqualAndEachChangeUnequal(base, List.of(
                detection(2, 0.5, 1, 0.1, 1, 0.5, 0.5, 0.1, 0.1, 0, MI.clone(), ERROR.clone()),
                detection(1, 0.6, 1, 0.1, 1, 0.5, 0.5, 0.1, 0.1, 0, MI.clone(), ERROR.clone()),
                detection(1, 0.5, 2, 0.1, 1, 0.5, 0.5, 0.1, 0.1, 0, MI.clone(), ERROR.clone()),
                detection(1, 0.5, 1, 0.2, 1, 0.5, 0.5, 0.1, 0.1, 0, MI.clone(), ERROR.clone()),
                detection(1, 0.5, 1, 0.1, 2, 0.5, 0.5, 0.1, 0.1, 0, MI.clone(), ERROR.clone()),
                detection(1, 0.5, 1, 0.1, 1, 0.6, 0.5, 0.1, 0.1, 0, MI.clone(), ERROR.clone()),
                detection(1, 0.5, 1, 0.1, 1, 0.5, 0.6, 0.1, 0.1, 0, MI.clone(), ERROR.clone()),
                detection(1, 0.5, 1, 0.1, 1, 0.5, 0.5, 0.2, 0.1, 0, MI.clone(), ERROR.clone()),
                detection(1, 0.5, 1, 0.1, 1, 0.5, 0.5, 0.1, 0.2, 0, MI.clone(), ERROR.clone()),
                detection(1, 0.5, 1, 0.1, 1, 0.5, 0.5, 0.1, 0.1, 1, MI.clone(), ERROR.clone()),
                detection(1, 0.5, 1, 0.1, 1, 0.5, 0.5, 0.1, 0.1, 0, new double[] {0, 0.4, 0}, ERROR.clone()),
                detection(1, 0.5, 1, 0.1, 1, 0.5, 0.5, 0.1, 0.1, 0, MI.clone(), new double[] {0.5, 0.2, 0.5})));
    }

    @Test
    void curvesDifferingInAnyComponentAreNotEqual() {
        Supplier<FirstThresholdSweep.Curve> base = () -> new FirstThresholdSweep.Curve(2, new double[] {0.1, 0.3});
        assertEqualContentEqualAndEachChangeUnequal(base, List.of(
                new FirstThresholdSweep.Curve(3, new double[] {0.1, 0.3}),
                new FirstThresholdSweep.Curve(2, new double[] {0.1, 0.2}),
                new FirstThresholdSweep.Curve(2, new double[] {0.1, 0.3, 0.2})));
    }

    @Test
    void blahutArimotoResultsDifferingInAnyComponentAreNotEqual() {
        Supplier<BlahutArimoto.Result> base =
                () -> new BlahutArimoto.Result(0.5, 1e-9, new double[] {0.4, 0.6}, 7, true);
        assertEqualContentEqualAndEachChangeUnequal(base, List.of(
                new BlahutArimoto.Result(0.6, 1e-9, new double[] {0.4, 0.6}, 7, true),
                new BlahutArimoto.Result(0.5, 1e-8, new double[] {0.4, 0.6}, 7, true),
                new BlahutArimoto.Result(0.5, 1e-9, new double[] {0.5, 0.5}, 7, true),
                new BlahutArimoto.Result(0.5, 1e-9, new double[] {0.4, 0.6}, 8, true),
                new BlahutArimoto.Result(0.5, 1e-9, new double[] {0.4, 0.6}, 7, false)));
    }

    /**
     * Two instances built from equal content in distinct arrays are equal with equal hash codes, and
     * each of {@code changed} (the same content with one component changed) is not equal to them.
     */
    private static <T> void assertEqualContentEqualAndEachChangeUnequal(Supplier<T> base, List<T> changed) {
        T a = base.get();
        T b = base.get();
        assertThat(b).isNotSameAs(a).isEqualTo(a).hasSameHashCodeAs(a).hasToString(a.toString());
        for (T c : changed) {
            assertThat(c).as("changed in one component: %s", c).isNotEqualTo(a);
        }
    }

    /** A two-level channel whose first row is (1 − e, e). */
    private static double[][] channel(double e) {
        return new double[][] {{1 - e, e}, {0.2, 0.8}};
    }

    private static BinaryDetection detection(long miThreshold, double mi, long minErrorThreshold, double minError,
            long capacityThreshold, double capacity, double prior, double e0, double e1, long first, double[] miCurve,
            double[] errorCurve) {
        return new BinaryDetection(miThreshold, mi, minErrorThreshold, minError, capacityThreshold, capacity, prior,
                e0, e1, first, miCurve, errorCurve);
    }

    private static LinkReport link(double signalMean, String caveat) {
        return new LinkReport("tx", "rx", "A", 0.1, new double[] {0.1, 0.05}, signalMean, 3, 2, 0, 40, 0.01, -2, 38,
                0.009, 0.9, 3, 0.95, 0.4, 0.01, 0.01, false, Impairment.SIGNAL, null, 0, caveat);
    }
}
