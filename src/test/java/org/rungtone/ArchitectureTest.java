package org.rungtone;

import static com.tngtech.archunit.lang.syntax.ArchRuleDefinition.noClasses;
import static com.tngtech.archunit.library.Architectures.layeredArchitecture;
import static com.tngtech.archunit.library.dependencies.SlicesRuleDefinition.slices;

import com.tngtech.archunit.core.importer.ImportOption;
import com.tngtech.archunit.junit.AnalyzeClasses;
import com.tngtech.archunit.junit.ArchTest;
import com.tngtech.archunit.lang.ArchRule;

/**
 * The package layers of DESIGN.md, checked on the compiled main classes (the generated parser included).
 *
 * <p>Data flows source/script → condition → quantize → codec → calibrate → analysis → firmware → report → project →
 * cli, and a package may use only the packages listed for it below (besides itself, the JDK and third-party
 * libraries). Where the flow leaves a choice, today's imports decide:
 * <ul>
 * <li>{@code ladder} is a root of the flow like {@code source} (DESIGN.md: "network model | measured unit
 * profile ──&gt; LevelTable") and uses none of our stages: {@code quantize} maps onto its {@code LevelTable},
 * so {@code ladder} sits below {@code quantize}, not after it;</li>
 * <li>{@code script} turns scripts into a {@code source.Signal}, so it may use {@code source}, never the reverse;</li>
 * <li>{@code calibrate} may use {@code ladder} (it fits a ladder's levels); {@code report} may use
 * {@code firmware} and {@code analysis}; {@code project} may use both {@code firmware} and {@code report}.</li>
 * </ul>
 *
 * <table>
 * <caption>Allowed dependencies between our packages</caption>
 * <tr><th>package</th><th>may use</th><th>used today</th></tr>
 * <tr><td>internal</td><td>none of ours</td><td>none</td></tr>
 * <tr><td>source</td><td>internal</td><td>internal</td></tr>
 * <tr><td>ladder</td><td>internal</td><td>internal</td></tr>
 * <tr><td>script (with ast, eval, parser)</td><td>source, internal</td><td>source, internal</td></tr>
 * <tr><td>condition</td><td>script, source, internal</td><td>source, internal</td></tr>
 * <tr><td>quantize</td><td>condition, script, source, ladder, internal</td><td>ladder, source, internal</td></tr>
 * <tr><td>codec</td><td>quantize and everything quantize may use</td><td>quantize, ladder, source, internal</td></tr>
 * <tr><td>calibrate</td><td>codec, quantize, condition, script, source, ladder, internal</td>
 * <td>ladder, internal</td></tr>
 * <tr><td>analysis</td><td>calibrate and everything calibrate may use</td>
 * <td>codec, condition, quantize, ladder, source, internal</td></tr>
 * <tr><td>firmware</td><td>analysis and everything analysis may use</td><td>codec, quantize, internal</td></tr>
 * <tr><td>report</td><td>firmware and everything firmware may use</td><td>analysis, internal</td></tr>
 * <tr><td>project</td><td>report and everything report may use</td><td>all of the above</td></tr>
 * <tr><td>cli</td><td>everything; nothing uses cli</td><td>all of the above</td></tr>
 * </table>
 *
 * <p>Besides the layers: no package cycles, each sub-package ({@code script.ast}, {@code script.eval},
 * {@code script.parser}) counted as its own slice; the generated {@code script.parser} is used only by
 * {@code script} itself (its {@code RungScript} facade), the tree in {@code script.ast} never depends on it;
 * only {@code cli} uses picocli. Every main class must sit in one of the packages above, so a new package
 * has to be placed in this table.
 */
@AnalyzeClasses(packages = "org.rungtone", importOptions = ImportOption.DoNotIncludeTests.class)
final class ArchitectureTest {
    private static final String[] BELOW_ANALYSIS = {"calibrate", "codec", "quantize", "condition", "script",
        "source", "ladder", "internal"};

    @ArchTest
    static final ArchRule PACKAGES_USE_ONLY_THE_LAYERS_BEFORE_THEM = layeredArchitecture()
            .consideringOnlyDependenciesInLayers()
            .layer("internal").definedBy("org.rungtone.internal..")
            .layer("source").definedBy("org.rungtone.source..")
            .layer("ladder").definedBy("org.rungtone.ladder..")
            .layer("script").definedBy("org.rungtone.script..")
            .layer("condition").definedBy("org.rungtone.condition..")
            .layer("quantize").definedBy("org.rungtone.quantize..")
            .layer("codec").definedBy("org.rungtone.codec..")
            .layer("calibrate").definedBy("org.rungtone.calibrate..")
            .layer("analysis").definedBy("org.rungtone.analysis..")
            .layer("firmware").definedBy("org.rungtone.firmware..")
            .layer("report").definedBy("org.rungtone.report..")
            .layer("project").definedBy("org.rungtone.project..")
            .layer("cli").definedBy("org.rungtone.cli..")
            .whereLayer("internal").mayNotAccessAnyLayer()
            .whereLayer("source").mayOnlyAccessLayers("internal")
            .whereLayer("ladder").mayOnlyAccessLayers("internal")
            .whereLayer("script").mayOnlyAccessLayers("source", "internal")
            .whereLayer("condition").mayOnlyAccessLayers("script", "source", "internal")
            .whereLayer("quantize").mayOnlyAccessLayers("condition", "script", "source", "ladder", "internal")
            .whereLayer("codec").mayOnlyAccessLayers("quantize", "condition", "script", "source", "ladder",
                    "internal")
            .whereLayer("calibrate").mayOnlyAccessLayers("codec", "quantize", "condition", "script", "source",
                    "ladder", "internal")
            .whereLayer("analysis").mayOnlyAccessLayers(BELOW_ANALYSIS)
            .whereLayer("firmware").mayOnlyAccessLayers(plus("analysis"))
            .whereLayer("report").mayOnlyAccessLayers(plus("firmware", "analysis"))
            .whereLayer("project").mayOnlyAccessLayers(plus("report", "firmware", "analysis"))
            .whereLayer("cli").mayNotBeAccessedByAnyLayer()
            .ensureAllClassesAreContainedInArchitecture();

    @ArchTest
    static final ArchRule NO_PACKAGE_CYCLES = slices().matching("org.rungtone.(**)").should().beFreeOfCycles();

    @ArchTest
    static final ArchRule GENERATED_PARSER_ONLY_BEHIND_THE_FACADE = noClasses()
            .that().resideOutsideOfPackages("org.rungtone.script", "org.rungtone.script.parser")
            .should().dependOnClassesThat().resideInAPackage("org.rungtone.script.parser")
            .because("the JavaCC parser is generated: RungScript in org.rungtone.script is its only door");

    @ArchTest
    static final ArchRule ONLY_CLI_USES_PICOCLI = noClasses()
            .that().resideOutsideOfPackage("org.rungtone.cli..")
            .should().dependOnClassesThat().resideInAPackage("picocli..");

    private ArchitectureTest() {
    }

    private static String[] plus(String... layers) {
        String[] all = new String[layers.length + BELOW_ANALYSIS.length];
        System.arraycopy(layers, 0, all, 0, layers.length);
        System.arraycopy(BELOW_ANALYSIS, 0, all, layers.length, BELOW_ANALYSIS.length);
        return all;
    }
}
