package dev.nanoplan.arch;

import static com.tngtech.archunit.lang.syntax.ArchRuleDefinition.noClasses;
import static com.tngtech.archunit.library.Architectures.layeredArchitecture;
import static com.tngtech.archunit.library.dependencies.SlicesRuleDefinition.slices;

import com.tngtech.archunit.core.domain.JavaClasses;
import com.tngtech.archunit.core.importer.ClassFileImporter;
import com.tngtech.archunit.core.importer.ImportOption;
import com.tngtech.archunit.library.Architectures.LayeredArchitecture;
import com.tngtech.archunit.library.GeneralCodingRules;
import org.assertj.core.api.Assertions;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

/**
 * Architecture rules of the core (docs/architecture.md §3): the core computes, it never draws a
 * window, parses a command line or prints; its packages form layers without cycles.
 *
 * <p>The layers, bottom up (a package may use the layers below it, never one beside or above):
 * <ol>
 *   <li>{@code math} (log-space arithmetic) and {@code io} (atomic files): no other package;</li>
 *   <li>{@code geometry}, {@code physics}, {@code count}, {@code info}: only {@code math} and {@code io};</li>
 *   <li>{@code detect};</li>
 *   <li>{@code scenario};</li>
 *   <li>{@code network};</li>
 *   <li>{@code plan} and {@code sim}, which do not use each other;</li>
 *   <li>{@code design} (layout search over plans) and {@code tolerance} (fabrication tolerance studies, over
 *   {@code plan}), which do not use each other;</li>
 *   <li>{@code report};</li>
 *   <li>{@code cli} and {@code desktop} in planner-ui (the core never names them).</li>
 * </ol>
 * The edges the code has today (2026-12): physics → math; count → math; detect → count, info;
 * scenario → count, geometry, io, physics; network → count, detect, geometry, info, math, physics,
 * scenario; plan → count, detect, geometry, info, math, network, physics, scenario; design → geometry, plan,
 * scenario; sim →
 * geometry, io, network, physics, scenario; report → count, detect, geometry, io, network, plan,
 * scenario.
 */
class CoreArchitectureTest {

    /** Every package of the core, bottom up. */
    private static final String[] PACKAGES = {"math", "io", "engine", "geometry", "physics", "count", "info", "detect",
        "scenario", "network", "plan", "sim", "design", "tolerance", "report"};

    private static final String[] FOUNDATION = {"engine", "geometry", "physics", "count", "info"};

    private static JavaClasses core;

    @BeforeAll
    static void importCore() {
        core = new ClassFileImporter()
                .withImportOption(ImportOption.Predefined.DO_NOT_INCLUDE_TESTS)
                .importPackages("dev.nanoplan");
    }

    @Test
    void coreDoesNotUseJavaFx() {
        noClasses().should().dependOnClassesThat().resideInAnyPackage("javafx..")
                .because("planner-core is the UI-free library (docs/architecture.md §3)")
                .check(core);
    }

    @Test
    void coreDoesNotUsePicocli() {
        noClasses().should().dependOnClassesThat().resideInAnyPackage("picocli..")
                .because("the command line is a thin shell in planner-ui (docs/architecture.md §3)")
                .check(core);
    }

    @Test
    void coreDoesNotPrint() {
        GeneralCodingRules.NO_CLASSES_SHOULD_ACCESS_STANDARD_STREAMS
                .because("only the CLI writes to standard output (docs/architecture.md §3)")
                .check(core);
    }

    @Test
    void corePackagesHaveNoCycles() {
        slices().matching("dev.nanoplan.(*)..").should().beFreeOfCycles()
                .because("a cycle between packages hides which one is the lower layer (docs/architecture.md §3)")
                .check(core);
    }

    @Test
    void corePackagesRespectTheLayers() {
        layers()
                .whereLayer("math").mayNotAccessAnyLayer()
                .whereLayer("io").mayNotAccessAnyLayer()
                .whereLayer("engine").mayNotAccessAnyLayer()
                .whereLayer("geometry").mayOnlyAccessLayers("math", "io")
                .whereLayer("physics").mayOnlyAccessLayers("math", "io")
                .whereLayer("count").mayOnlyAccessLayers("math", "io")
                .whereLayer("info").mayOnlyAccessLayers("math", "io")
                .whereLayer("detect").mayOnlyAccessLayers(below())
                .whereLayer("scenario").mayOnlyAccessLayers(below("detect"))
                .whereLayer("network").mayOnlyAccessLayers(below("detect", "scenario"))
                .whereLayer("plan").mayOnlyAccessLayers(below("detect", "scenario", "network"))
                .whereLayer("sim").mayOnlyAccessLayers(below("detect", "scenario", "network"))
                .whereLayer("design").mayOnlyAccessLayers(below("detect", "scenario", "network", "plan"))
                .whereLayer("tolerance").mayOnlyAccessLayers(below("detect", "scenario", "network", "plan"))
                .whereLayer("report").mayOnlyAccessLayers(below("detect", "scenario", "network", "plan", "sim", "design",
                        "tolerance"))
                .because("each package uses only the layers below it (docs/architecture.md §3)")
                .check(core);
    }

    @Test
    void coreNeverNamesTheShells() {
        noClasses().should().dependOnClassesThat().resideInAnyPackage("dev.nanoplan.cli..", "dev.nanoplan.desktop..")
                .because("the command line and the desktop sit on top of the core (docs/architecture.md §3)")
                .check(core);
    }

    @Test
    void coreIsNotEmpty() {
        // guards against the rules above passing vacuously on an empty import
        Assertions.assertThat(core.size()).isGreaterThan(5);
        // every layer named in the rules holds classes (a renamed package would otherwise escape them)
        for (String p : PACKAGES) {
            Assertions.assertThat(core.stream().anyMatch(c -> c.getPackageName().startsWith("dev.nanoplan." + p)))
                    .as("classes in dev.nanoplan.%s", p).isTrue();
        }
    }

    private static LayeredArchitecture layers() {
        LayeredArchitecture layers = layeredArchitecture().consideringOnlyDependenciesInLayers();
        for (String p : PACKAGES) {
            layers = layers.layer(p).definedBy("dev.nanoplan." + p + "..");
        }
        return layers;
    }

    /** The bottom two layers plus {@code more}. */
    private static String[] below(String... more) {
        String[] out = new String[2 + FOUNDATION.length + more.length];
        out[0] = "math";
        out[1] = "io";
        System.arraycopy(FOUNDATION, 0, out, 2, FOUNDATION.length);
        System.arraycopy(more, 0, out, 2 + FOUNDATION.length, more.length);
        return out;
    }
}
