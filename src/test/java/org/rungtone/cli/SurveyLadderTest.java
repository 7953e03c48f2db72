package org.rungtone.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.rungtone.testing.Cli;
import org.rungtone.testing.WavFixtures;

/** The survey on a modelled ladder instead of the ideal one. */
class SurveyLadderTest {
    @TempDir
    Path dir;

    @Test
    void surveysAModelledLadderAtEveryDepth() throws IOException {
        Path wav = dir.resolve("tone.wav");
        Files.write(wav, WavFixtures.sine16(16_000, 0.5, 440, 0.5));
        Cli.Run r = Cli.run("survey", wav.toString(), "--bits-list", "4,6", "--rates", "8k", "--topology", "r2r",
                "--logic-high", "3.3V", "--out", dir.resolve("s").toString());
        assertEquals(0, r.exitCode(), r.err());
        // an R-2R ladder tops out one LSB below the reference: 3.3 V x 63/64 = 3.248 V at 6 bits (Horowitz & Hill)
        assertTrue(r.out().contains("modelled r2r, 5% parts, 0V .. 3.248V at 6 bits"), r.out());
    }

    @Test
    void aResistorListFixesTheDepth() throws IOException {
        Path wav = dir.resolve("tone.wav");
        Files.write(wav, WavFixtures.sine16(16_000, 0.5, 440, 0.5));
        Cli.Run r = Cli.run("survey", wav.toString(), "--bits-list", "4,6", "--rates", "8k", "--resistors",
                "80k,40k,20k,10k", "--out", dir.resolve("s2").toString());
        assertEquals(1, r.exitCode(), r.err());
        assertEquals("rungtone: error: the ladder lists 4 resistors, so it can only be surveyed at 4 bits; give"
                + " base_r instead of resistors to survey other depths\n", r.err());
        assertTrue(!Files.exists(dir.resolve("s2")));
    }
}
