package org.dockgate.architecture;

import static com.tngtech.archunit.lang.syntax.ArchRuleDefinition.noClasses;
import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import com.tngtech.archunit.core.domain.JavaClasses;
import com.tngtech.archunit.core.importer.ClassFileImporter;
import com.tngtech.archunit.core.importer.ImportOption;
import com.tngtech.archunit.lang.ArchRule;
import com.tngtech.archunit.library.dependencies.SlicesRuleDefinition;
import org.junit.jupiter.api.Test;

/**
 * The metrology core stays framework-free: no Spring, Jakarta, JPA, servlet or Hibernate type, and no
 * feature module. Each rule is also run on a small test-only class that breaks it, to show the rule
 * can fail.
 */
class CoreArchitectureTest {

    static final String[] FORBIDDEN = {"org.springframework..", "jakarta..", "javax.persistence..",
        "javax.servlet..", "org.hibernate..", "tools.jackson..", "com.fasterxml.jackson.."};

    /** The rule for any package tree that must stay framework-free and free of the application's modules. */
    static ArchRule frameworkFree(String corePackage) {
        return noClasses().that().resideInAPackage(corePackage)
                .should().dependOnClassesThat().resideInAnyPackage(FORBIDDEN)
                .orShould().dependOnClassesThat(com.tngtech.archunit.base.DescribedPredicate.describe(
                        "are Dockgate classes outside core",
                        (com.tngtech.archunit.core.domain.JavaClass c) -> c.getPackageName().startsWith("org.dockgate")
                                && !c.getPackageName().startsWith(corePackage.replace("..", ""))))
                .because("the metrology core is plain Java that every feature calls, never the reverse");
    }

    static final JavaClasses PRODUCTION = new ClassFileImporter()
            .withImportOption(ImportOption.Predefined.DO_NOT_INCLUDE_TESTS)
            .importPackages("org.dockgate");

    @Test
    void coreDependsOnNoFrameworkAndNoFeature() {
        assertThat(PRODUCTION.stream().anyMatch(c -> c.getPackageName().startsWith("org.dockgate.core")))
                .as("the core package exists and is checked").isTrue();
        frameworkFree("org.dockgate.core..").check(PRODUCTION);
    }

    @Test
    void theRuleFailsOnADeliberateViolation() {
        JavaClasses fixture = new ClassFileImporter().importPackages("org.dockgate.architecture.fixture");
        assertThatThrownBy(() -> frameworkFree("org.dockgate.architecture.fixture.core..").check(fixture))
                .isInstanceOf(AssertionError.class)
                .hasMessageContaining("SpringTaintedMetric")
                .hasMessageContaining("FeatureTaintedMetric");
    }

    @Test
    void topLevelModulesHaveNoCycles() {
        SlicesRuleDefinition.slices().matching("org.dockgate.(*)..").should().beFreeOfCycles().check(PRODUCTION);
    }

    @Test
    void theCycleRuleFailsOnADeliberateCycle() {
        JavaClasses fixture = new ClassFileImporter().importPackages("org.dockgate.architecture.fixture");
        assertThatThrownBy(() -> SlicesRuleDefinition.slices()
                .matching("org.dockgate.architecture.fixture.(*)..").should().beFreeOfCycles().check(fixture))
                .isInstanceOf(AssertionError.class);
    }
}
