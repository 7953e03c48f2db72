package org.rungtone.project;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.rungtone.testing.Cli;
import org.rungtone.testing.HeadlessBrowser;

/**
 * report.html of real builds rendered in headless chromium at a phone's width (390 px) and a desk's
 * (1280 px): nothing may stick out of the page outside a scroll box, every plot must load, and at the desk's
 * width no table needs its scroll box. Screenshots are kept in target/browser/ for review.
 */
class ReportInBrowserTest {
    private static final List<Integer> WIDTHS = List.of(390, 1280);
    private static final Path SHOTS = Path.of("target", "browser");

    @TempDir
    Path dir;

    private static void assertFits(Path report, String name, int images) throws IOException {
        List<HeadlessBrowser.Frame> frames = HeadlessBrowser.render(report, WIDTHS, SHOTS.resolve(name + ".png"));
        assertEquals(WIDTHS.size(), frames.size());
        for (int i = 0; i < frames.size(); i++) {
            HeadlessBrowser.Frame f = frames.get(i);
            String at = name + " at " + WIDTHS.get(i) + " px";
            assertEquals(WIDTHS.get(i), f.width(), at);
            assertEquals(List.of(), f.overflowing(), at + ": elements past the page's edge");
            assertEquals(List.of(), f.brokenImages(), at + ": images that did not load");
            assertEquals(f.width(), f.scrollWidth(), at + ": the page scrolls sideways");
            assertEquals(images, f.images(), at);
        }
        // a phone scrolls the wide tables inside their boxes; a desk shows them whole
        assertTrue(!frames.get(0).scrolling().isEmpty(), name + ": no table wider than a phone?");
        assertEquals(List.of(), frames.get(1).scrolling(), name + " at 1280 px: tables that need scrolling");
    }

    @Test
    void aFirmwareBuildOfAToneFitsAPhoneAndADesk() throws IOException {
        HeadlessBrowser.require();
        Path tone = dir.resolve("test-tone.rung");
        Files.writeString(tone, "duration 500ms\nrate 16kHz\nout -1dB * sine(1001Hz)\n");
        Path out = dir.resolve("out");
        Cli.Run r = Cli.run("build", tone.toString(), "--bits", "8", "--target", "avr", "--cpu-clock", "16MHz",
                "--pins", "PD0-PD7", "--out", out.toString(), "-q");
        assertEquals(0, r.exitCode(), r.err());
        assertTrue(Files.exists(out.resolve("spectrum.png")));
        // the error spectrum and the tone's spectrum
        assertFits(out.resolve("report.html"), "build-tone", 2);
    }

    @Test
    void aProjectOfTwoSoundsFitsAPhoneAndADesk() throws IOException {
        HeadlessBrowser.require();
        Path g = dir.resolve("greenhouse");
        Files.createDirectories(g);
        try (var s = Files.list(Path.of("examples", "greenhouse"))) {
            for (Path p : s.toList()) {
                Files.copy(p, g.resolve(p.getFileName()));
            }
        }
        Path out = dir.resolve("out");
        Cli.Run r = Cli.run("build", g.resolve("greenhouse.toml").toString(), "--out", out.toString(), "-q");
        assertEquals(0, r.exitCode(), r.err());
        // one error spectrum per sound
        assertFits(out.resolve("report.html"), "build-project", 2);
    }
}
