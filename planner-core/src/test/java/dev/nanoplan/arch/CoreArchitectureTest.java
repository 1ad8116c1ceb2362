package dev.nanoplan.arch;

import static com.tngtech.archunit.lang.syntax.ArchRuleDefinition.noClasses;

import com.tngtech.archunit.core.domain.JavaClasses;
import com.tngtech.archunit.core.importer.ClassFileImporter;
import com.tngtech.archunit.core.importer.ImportOption;
import com.tngtech.archunit.library.GeneralCodingRules;
import org.assertj.core.api.Assertions;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

/**
 * Architecture rules of DESIGN.md §3 and STYLE.md: the core computes, it never draws a window,
 * parses a command line or prints.
 */
class CoreArchitectureTest {

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
                .because("planner-core is the UI-free library (DESIGN.md §3)")
                .check(core);
    }

    @Test
    void coreDoesNotUsePicocli() {
        noClasses().should().dependOnClassesThat().resideInAnyPackage("picocli..")
                .because("the command line is a thin shell in planner-ui (DESIGN.md §3)")
                .check(core);
    }

    @Test
    void coreDoesNotPrint() {
        GeneralCodingRules.NO_CLASSES_SHOULD_ACCESS_STANDARD_STREAMS
                .because("only the CLI writes to standard output (STYLE.md)")
                .check(core);
    }

    @Test
    void coreIsNotEmpty() {
        // guards against the rules above passing vacuously on an empty import
        Assertions.assertThat(core.size()).isGreaterThan(5);
    }
}
