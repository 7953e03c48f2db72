package org.rungtone.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayInputStream;
import java.io.IOException;
import java.io.InputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.rungtone.testing.Cli;
import org.rungtone.testing.WavFixtures;

/**
 * {@code -} as SOURCE: the commands read a WAV file piped into standard input, name it "standard input" in
 * reports and errors, and take the sound's name from {@code --name} or the default "sound".
 */
class StandardInputSourceTest {
    @TempDir
    Path dir;

    private InputStream saved;

    @BeforeEach
    void keepStandardInput() {
        saved = System.in;
    }

    @AfterEach
    void restoreStandardInput() {
        System.setIn(saved);
    }

    private static void pipe(byte[] bytes) {
        System.setIn(new ByteArrayInputStream(bytes));
    }

    @Test
    void buildReadsAWavFromStandardInput() throws IOException {
        pipe(WavFixtures.sine16(22_050, 0.3, 440, 0.5));
        Path out = dir.resolve("out");
        Cli.Run r = Cli.run("build", "-", "--bits", "6", "--rate", "8k", "--out", out.toString());
        assertEquals(0, r.exitCode(), r.err());
        assertTrue(r.out().contains("source            standard input  (PCM 16-bit, 1 ch, 22050 Hz, 0.30 s)"),
                r.out());
        // without --name the C symbols take the default name
        assertTrue(Files.exists(out.resolve("sound.h")));
        assertTrue(Files.readString(out.resolve("sound.h")).contains("source: standard input (PCM 16-bit"));
        String json = Files.readString(out.resolve("report.json"));
        assertTrue(json.contains("\"standard_input\": true"), json);
        assertTrue(json.contains("\"path\": null"), json);
    }

    @Test
    void nameOptionNamesTheSound() throws IOException {
        pipe(WavFixtures.sine16(8000, 0.2, 440, 0.5));
        Path out = dir.resolve("named");
        Cli.Run r = Cli.run("build", "-", "--name", "door_chime", "--bits", "4", "--rate", "8k", "--out",
                out.toString(), "--quiet");
        assertEquals(0, r.exitCode(), r.err());
        assertTrue(Files.exists(out.resolve("door_chime.h")));
        assertFalse(Files.exists(out.resolve("sound.h")));
    }

    /** A µ-law WAV (ITU-T G.711), as voice prompts come, piped in: read and built like any other. */
    @Test
    void muLawVoicePromptFromStandardInput() throws IOException {
        byte[] codes = new byte[4000];
        for (int i = 0; i < codes.length; i++) {
            codes[i] = (byte) (0x80 + (i % 40 < 20 ? 0x10 : 0x70) + (i & 1) * 0x80);
        }
        pipe(WavFixtures.wav().raw(7, 8, 1, 8000, codes).bytes());
        Path out = dir.resolve("prompt");
        Cli.Run r = Cli.run("build", "-", "--name", "prompt", "--bits", "6", "--rate", "8k", "--out",
                out.toString());
        assertEquals(0, r.exitCode(), r.err());
        assertTrue(r.out().contains("standard input  (mu-law 8-bit, 1 ch, 8000 Hz, 0.50 s)"), r.out());
    }

    @Test
    void surveyReadsStandardInputOncePerRate() throws IOException {
        pipe(WavFixtures.sine16(22_050, 0.3, 440, 0.5));
        Path out = dir.resolve("survey");
        Cli.Run r = Cli.run("survey", "-", "--bits-list", "4,6", "--rates", "8k,11025", "--out", out.toString());
        assertEquals(0, r.exitCode(), r.err());
        assertTrue(r.out().contains("survey: standard input"), r.out());
        assertTrue(r.out().contains("source                 standard input  (PCM 16-bit"), r.out());
    }

    @Test
    void badStandardInputIsNamedInTheError() {
        pipe("this is not a WAV file".getBytes());
        Cli.Run r = Cli.run("build", "-", "--out", dir.resolve("x").toString());
        assertEquals(1, r.exitCode());
        assertEquals("rungtone: error: standard input: is not a WAV file (no RIFF header at byte 0)\n", r.err());
        assertFalse(Files.exists(dir.resolve("x").resolve("sound.h")));
    }

    @Test
    void emptyStandardInputIsNamedInTheError() {
        pipe(new byte[0]);
        Cli.Run r = Cli.run("build", "-", "--out", dir.resolve("y").toString());
        assertEquals(1, r.exitCode());
        assertEquals("rungtone: error: standard input: is too short to be a WAV file (0 bytes; a RIFF header"
                + " needs 12)\n", r.err());
    }
}
