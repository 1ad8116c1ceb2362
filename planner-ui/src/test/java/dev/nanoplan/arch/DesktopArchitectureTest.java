package dev.nanoplan.arch;

import static com.tngtech.archunit.lang.syntax.ArchRuleDefinition.noClasses;
import static com.tngtech.archunit.library.dependencies.SlicesRuleDefinition.slices;

import com.tngtech.archunit.base.DescribedPredicate;
import com.tngtech.archunit.core.domain.JavaClass;
import com.tngtech.archunit.core.domain.JavaClasses;
import com.tngtech.archunit.core.importer.ClassFileImporter;
import com.tngtech.archunit.core.importer.ImportOption;
import java.util.Set;
import org.assertj.core.api.Assertions;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

/**
 * Architecture rules of the shells (docs/architecture.md §3): the desktop follows
 * view / view-model / model (the view binds and forwards events; a view model never touches a
 * control, so it is tested as plain JUnit without a window), and the two shells have no cycle.
 */
class DesktopArchitectureTest {

    /** Desktop classes that hold state or logic for the views but are not views themselves (today's names). */
    private static final Set<String> MODELS = Set.of("CorePlanService", "DemandComparison", "Formats", "LinkDetails",
            "NodeInspector", "PlanService", "RecentFiles", "ScenarioSettings", "SimulationRow", "UndoStack");

    private static JavaClasses shells;

    @BeforeAll
    static void importShells() {
        shells = new ClassFileImporter()
                .withImportOption(ImportOption.Predefined.DO_NOT_INCLUDE_TESTS)
                .importPackages("dev.nanoplan.cli", "dev.nanoplan.desktop");
    }

    /** The outermost class that declares {@code c} (itself when top level). */
    private static JavaClass topLevel(JavaClass c) {
        JavaClass t = c;
        while (t.getEnclosingClass().isPresent()) {
            t = t.getEnclosingClass().get();
        }
        return t;
    }

    /** A view model: a desktop class (or one nested in it) named ...ViewModel, or one of {@link #MODELS}. */
    private static final DescribedPredicate<JavaClass> VIEW_MODEL = DescribedPredicate.describe(
            "desktop view models and models (…ViewModel, " + MODELS + ")", c -> {
                JavaClass t = topLevel(c);
                return t.getPackageName().startsWith("dev.nanoplan.desktop")
                        && (t.getSimpleName().endsWith("ViewModel") || MODELS.contains(t.getSimpleName()));
            });

    /** A view: named ...View, or using the scene graph or a stage itself. */
    private static final DescribedPredicate<JavaClass> VIEW = DescribedPredicate.describe(
            "desktop view classes (…View, or using javafx.scene / javafx.stage)", c -> {
                JavaClass t = topLevel(c);
                return t.getPackageName().startsWith("dev.nanoplan.desktop") && !VIEW_MODEL.test(t)
                        && (t.getSimpleName().endsWith("View") || usesSceneOrStage(c) || usesSceneOrStage(t));
            });

    private static boolean usesSceneOrStage(JavaClass c) {
        return c.getDirectDependenciesFromSelf().stream().map(d -> d.getTargetClass().getPackageName())
                .anyMatch(p -> p.startsWith("javafx.scene") || p.startsWith("javafx.stage"));
    }

    @Test
    void viewModelsDoNotUseTheSceneGraphOrAStage() {
        noClasses().that(VIEW_MODEL).should().dependOnClassesThat().resideInAnyPackage("javafx.scene..", "javafx.stage..")
                .because("a view model never touches a control, so it is tested without a window (docs/architecture.md §3)")
                .check(shells);
    }

    @Test
    void viewModelsDoNotUseViews() {
        noClasses().that(VIEW_MODEL).should().dependOnClassesThat(VIEW)
                .because("views depend on view models, never the other way (docs/architecture.md §3)")
                .check(shells);
    }

    @Test
    void theDesktopDoesNotUseTheCommandLine() {
        noClasses().that().resideInAPackage("dev.nanoplan.desktop..").should().dependOnClassesThat()
                .resideInAPackage("dev.nanoplan.cli..")
                .because("nanoplan ui starts the desktop, not the other way (docs/architecture.md §3)")
                .check(shells);
    }

    @Test
    void theShellsHaveNoCycles() {
        slices().matching("dev.nanoplan.(*)..").should().beFreeOfCycles().check(shells);
    }

    @Test
    void theRulesSeeViewModelsAndViews() {
        // guards against the rules above passing vacuously
        Assertions.assertThat(shells.stream().filter(VIEW_MODEL).count()).isGreaterThan(3);
        Assertions.assertThat(shells.stream().filter(VIEW).count()).isGreaterThan(3);
    }
}
