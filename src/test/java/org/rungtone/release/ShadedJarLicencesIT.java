package org.rungtone.release;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Enumeration;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import java.util.TreeSet;
import java.util.jar.JarEntry;
import java.util.jar.JarFile;
import org.junit.jupiter.api.Test;

/**
 * The shaded jar that {@code mvn package} built: every bundled library's licence (and notice) text is in it
 * under {@code META-INF/licenses/NAME/}, every class in it belongs to a library listed here (so a new
 * dependency without its licence fails), and the unused plotting exporters stay out, under the size goal.
 */
class ShadedJarLicencesIT {
    /** The package of each bundled library, by the folder that holds its licence. */
    private static final Map<String, String> LIBRARIES = Map.ofEntries(
            Map.entry("picocli/", "picocli"),
            Map.entry("org/apache/commons/math3/", "commons-math3"),
            Map.entry("be/tarsos/dsp/", "TarsosDSP"),
            Map.entry("com/samskivert/mustache/", "jmustache"),
            Map.entry("org/tomlj/", "tomlj"),
            Map.entry("org/antlr/v4/runtime/", "antlr4-runtime"),
            Map.entry("com/google/gson/", "gson"),
            Map.entry("org/apache/commons/csv/", "commons-csv"),
            Map.entry("org/apache/commons/io/", "commons-io"),
            Map.entry("org/apache/commons/codec/", "commons-codec"),
            Map.entry("org/knowm/xchart/", "xchart"));
    /** Licences whose libraries ship a NOTICE that must travel with them. */
    private static final List<String> NOTICES = List.of("picocli", "commons-math3", "commons-csv", "commons-io",
            "commons-codec", "xchart");
    /** The jar's size goal, bytes. */
    private static final long MAX_BYTES = 6L * 1024 * 1024;

    private static Path jar() {
        return Path.of(System.getProperty("rungtone.jar", "target/rungtone.jar"));
    }

    @Test
    void everyBundledLibraryCarriesItsLicence() throws IOException {
        try (JarFile jar = new JarFile(jar().toFile())) {
            Map<String, Integer> classesPerLibrary = new TreeMap<>();
            List<String> unknown = new ArrayList<>();
            for (Enumeration<JarEntry> e = jar.entries(); e.hasMoreElements();) {
                String name = e.nextElement().getName();
                if (!name.endsWith(".class") || name.startsWith("org/rungtone/") || name.startsWith("META-INF/")) {
                    continue;
                }
                String library = LIBRARIES.entrySet().stream().filter(l -> name.startsWith(l.getKey()))
                        .map(Map.Entry::getValue).findFirst().orElse(null);
                if (library == null) {
                    unknown.add(name);
                } else {
                    classesPerLibrary.merge(library, 1, Integer::sum);
                }
            }
            assertEquals(List.of(), unknown, "classes of a library this test does not know: add its licence"
                    + " under src/main/licenses/NAME/ and its package here");
            assertEquals(new TreeSet<>(LIBRARIES.values()), classesPerLibrary.keySet(), "bundled libraries");
            for (String library : classesPerLibrary.keySet()) {
                String licence = text(jar, "META-INF/licenses/" + library + "/LICENSE.txt");
                assertTrue(licence.length() > 1000, library + ": licence text too short");
                assertTrue(licence.contains("Redistribution") || licence.contains("Apache License")
                        || licence.contains("GNU GENERAL PUBLIC LICENSE"), library + ": not a licence text");
            }
            for (String library : NOTICES) {
                assertTrue(text(jar, "META-INF/licenses/" + library + "/NOTICE.txt").contains("Copyright"),
                        library + ": notice");
            }
            assertTrue(text(jar, "META-INF/LICENSE").contains("GNU GENERAL PUBLIC LICENSE"), "Rungtone's licence");
            assertTrue(text(jar, "META-INF/licenses/README.txt").contains("TarsosDSP"), "the list of libraries");
        }
    }

    @Test
    void theUnusedExportersStayOutAndTheJarMeetsItsSize() throws IOException {
        try (JarFile jar = new JarFile(jar().toFile())) {
            for (Enumeration<JarEntry> e = jar.entries(); e.hasMoreElements();) {
                String name = e.nextElement().getName();
                assertTrue(!name.startsWith("org/apache/pdfbox/") && !name.startsWith("org/apache/fontbox/")
                        && !name.startsWith("de/erichseifert/") && !name.startsWith("de/rototor/")
                        && !name.startsWith("com/madgag/") && !name.startsWith("org/checkerframework/"), name);
            }
            assertTrue(jar.getEntry("templates/avr/player.c.mustache") != null, "templates ship in the jar");
            assertTrue(jar.getEntry("examples/greenhouse/greenhouse.toml") != null, "the demo ships in the jar");
        }
        long size = Files.size(jar());
        assertTrue(size <= MAX_BYTES, "rungtone.jar is " + size + " bytes, over the goal of " + MAX_BYTES);
    }

    private static String text(JarFile jar, String name) throws IOException {
        JarEntry e = jar.getJarEntry(name);
        assertTrue(e != null, name + " missing from the jar");
        return new String(jar.getInputStream(e).readAllBytes(), StandardCharsets.UTF_8);
    }
}
