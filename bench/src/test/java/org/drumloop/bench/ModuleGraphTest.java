package org.drumloop.bench;

import static com.tngtech.archunit.lang.syntax.ArchRuleDefinition.classes;
import static com.tngtech.archunit.lang.syntax.ArchRuleDefinition.noClasses;
import static com.tngtech.archunit.library.dependencies.SlicesRuleDefinition.slices;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;

import com.tngtech.archunit.core.domain.JavaClasses;
import com.tngtech.archunit.core.importer.ClassFileImporter;
import com.tngtech.archunit.core.importer.ImportOption;
import com.tngtech.archunit.lang.ArchRule;
import com.tngtech.archunit.lang.EvaluationResult;

import org.drumloop.core.graphcheck.UsesALibrary;
import org.drumloop.core.graphcheck.UsesThePlant;
import org.drumloop.modbus.graphcheck.UsesThePlantAndTheBench;
import org.drumloop.plant.graphcheck.UsesTheFirmware;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

/**
 * The module graph of DEVELOPERS.md, checked on the compiled classes of every module (main code
 * only): the firmware ({@code org.drumloop.core}) and the plant ({@code org.drumloop.plant}) use
 * the JDK and themselves alone, no other module of ours and no library; the bridge
 * ({@code org.drumloop.modbus}) knows the firmware's I/O types but never the plant or the bench;
 * and no modules depend on each other in a cycle. Each rule is also shown to catch a class that
 * breaks it (the {@code graphcheck} classes of this module's tests).
 */
class ModuleGraphTest {
    static final ArchRule FIRMWARE_USES_THE_JDK_ONLY = classes().that().resideInAPackage("org.drumloop.core..")
            .should().onlyDependOnClassesThat().resideInAnyPackage("org.drumloop.core..", "java..")
            .because("controller-core depends on nothing of ours and no library");

    static final ArchRule PLANT_USES_THE_JDK_ONLY = classes().that().resideInAPackage("org.drumloop.plant..")
            .should().onlyDependOnClassesThat().resideInAnyPackage("org.drumloop.plant..", "java..")
            .because("plant-sim depends on nothing of ours and no library");

    static final ArchRule BRIDGE_NEVER_KNOWS_THE_PHYSICS_OR_THE_BENCH = noClasses().that()
            .resideInAPackage("org.drumloop.modbus..")
            .should().dependOnClassesThat().resideInAnyPackage("org.drumloop.plant..", "org.drumloop.bench..")
            .because("modbus-bridge knows the controller's I/O types and the channel map, never the physics");

    static final ArchRule NO_CYCLES = slices().matching("org.drumloop.(*)..").should().beFreeOfCycles();

    private static JavaClasses shipped;

    @BeforeAll
    static void importTheModules() {
        shipped = new ClassFileImporter().withImportOption(ImportOption.Predefined.DO_NOT_INCLUDE_TESTS)
                .importPackages("org.drumloop");
    }

    @Test
    void theShippedModulesKeepTheirDependencies() {
        // all four modules are on this module's class path
        for (String p : List.of("org.drumloop.core", "org.drumloop.plant", "org.drumloop.modbus", "org.drumloop.bench")) {
            assertTrue(shipped.containPackage(p), "no classes of " + p + " imported");
        }
        FIRMWARE_USES_THE_JDK_ONLY.check(shipped);
        PLANT_USES_THE_JDK_ONLY.check(shipped);
        BRIDGE_NEVER_KNOWS_THE_PHYSICS_OR_THE_BENCH.check(shipped);
        NO_CYCLES.check(shipped);
    }

    @Test
    void eachRuleCatchesAClassThatBreaksIt() {
        JavaClasses bad = new ClassFileImporter().importClasses(UsesALibrary.class, UsesThePlant.class,
                UsesTheFirmware.class, UsesThePlantAndTheBench.class);
        assertViolations(FIRMWARE_USES_THE_JDK_ONLY.evaluate(bad), "UsesALibrary", "UsesThePlant");
        assertViolations(PLANT_USES_THE_JDK_ONLY.evaluate(bad), "UsesTheFirmware");
        assertViolations(BRIDGE_NEVER_KNOWS_THE_PHYSICS_OR_THE_BENCH.evaluate(bad), "UsesThePlantAndTheBench");
    }

    private static void assertViolations(EvaluationResult r, String... classes) {
        assertTrue(r.hasViolation());
        String report = r.getFailureReport().toString();
        for (String c : classes) {
            assertTrue(report.contains(c), c + " not reported: " + report);
        }
    }
}
