package dev.nanoplan.desktop;

import static com.tngtech.archunit.lang.syntax.ArchRuleDefinition.noClasses;
import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import com.tngtech.archunit.base.DescribedPredicate;
import com.tngtech.archunit.core.domain.JavaClass;
import com.tngtech.archunit.core.domain.JavaClasses;
import com.tngtech.archunit.core.importer.ClassFileImporter;
import com.tngtech.archunit.core.importer.ImportOption;
import com.tngtech.archunit.lang.ArchRule;
import java.util.Set;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

/**
 * Layer rules of the desktop (MVVM as in STYLE.md): the view models and the model classes beside
 * them hold state and commands and never touch a control, a scene or a window, nor a view class,
 * so they run in plain JUnit without a display; the window actions and the main view depend in
 * one direction only.
 */
class DesktopArchitectureTest {

    /** The desktop's non-view classes besides those named *ViewModel (nested classes follow their outer class). */
    static final Set<String> MODELS = Set.of("CorePlanService", "DemandComparison", "FieldErrors", "Formats", "LayoutEditor",
            "LabelDeclutter", "LayoutEdits", "LayoutGeometry", "LinkDetails", "NodeInspector", "PlanScheduler", "PlanService",
            "PlanTables", "RecentFiles", "RouteSummary", "ScenarioDocument", "ScenarioSettings", "SettingsText", "SlotAssigner",
            "SimulationFields", "SimulationRow", "SimulationRun", "SpeciesRow", "TableText", "ToleranceRow", "UndoStack");

    /** The view classes: they build controls and bind them to the models. */
    static final Set<String> VIEWS = Set.of("AppActions", "CapacityColours", "DesktopLauncher", "InspectorPane",
            "Legend", "LinkChartsView", "MainView", "NanoplanApp", "NodeLabels", "OrbitCamera", "PlanTablesView", "SceneControls",
            "SceneView", "SettingsPane", "Shapes3D", "SimulationView", "Snapshots", "StatusBar", "Widgets",
            "ToleranceView", "ImproveView", "SceneOverlays");

    private static JavaClasses desktop;

    @BeforeAll
    static void importDesktop() {
        desktop = new ClassFileImporter().withImportOption(ImportOption.Predefined.DO_NOT_INCLUDE_TESTS)
                .importPackages("dev.nanoplan.desktop");
    }

    static String outerName(JavaClass c) {
        String n = c.getName().substring(c.getPackageName().length() + 1);
        int dollar = n.indexOf('$');
        return dollar < 0 ? n : n.substring(0, dollar);
    }

    static final DescribedPredicate<JavaClass> MODEL = DescribedPredicate.describe("view models and models",
            c -> outerName(c).endsWith("ViewModel") || MODELS.contains(outerName(c)));

    static final DescribedPredicate<JavaClass> VIEW = DescribedPredicate.describe("desktop view classes",
            c -> c.getPackageName().equals("dev.nanoplan.desktop") && VIEWS.contains(outerName(c)));

    static ArchRule modelsStayOffTheScene(DescribedPredicate<JavaClass> which) {
        return noClasses().that(which).should().dependOnClassesThat().resideInAnyPackage("javafx.scene..",
                "javafx.stage..").orShould().dependOnClassesThat(VIEW)
                .because("view models never touch a control or a view, so they are tested without a window");
    }

    @Test
    void viewModelsAndModelsDependNeitherOnTheSceneGraphNorOnViews() {
        modelsStayOffTheScene(MODEL).check(desktop);
    }

    @Test
    void everyDesktopClassIsEitherAModelOrAView() {
        // a new class must be placed on one side, so the rule above cannot miss it
        for (JavaClass c : desktop) {
            String n = outerName(c);
            assertThat(MODEL.test(c) || VIEWS.contains(n)).as(n).isTrue();
            assertThat(MODEL.test(c) && VIEWS.contains(n)).as(n).isFalse();
        }
        assertThat(desktop.stream().filter(MODEL::test).map(DesktopArchitectureTest::outerName).distinct().count())
                .isGreaterThanOrEqualTo(MODELS.size() + 2);
    }

    @Test
    void theRuleCatchesAViewThatUsesTheSceneGraph() {
        // not vacuous: the same rule applied to the main view (which builds controls) fails
        DescribedPredicate<JavaClass> mainView = DescribedPredicate.describe("MainView",
                c -> outerName(c).equals("MainView"));
        assertThatThrownBy(() -> modelsStayOffTheScene(mainView).check(desktop)).isInstanceOf(AssertionError.class);
    }

    @Test
    void windowActionsDoNotKnowTheMainView() {
        noClasses().that().haveSimpleName("AppActions").should().dependOnClassesThat().haveSimpleName("MainView")
                .because("the main view uses the actions' menus, and layout replacement reaches the panes through "
                        + "the view model, so the dependency runs one way")
                .check(desktop);
    }
}
