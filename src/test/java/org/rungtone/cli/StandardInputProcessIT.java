package org.rungtone.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.google.gson.JsonObject;
import com.google.gson.JsonParser;
import java.io.IOException;
import java.io.OutputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.rungtone.testing.JsonSchemas;
import org.rungtone.testing.WavFixtures;

/** A WAV file piped into a real {@code rungtone build -} process, as a shell pipeline does it. */
class StandardInputProcessIT {
    @TempDir
    Path dir;

    @Test
    void pipedWavBuilds() throws IOException, InterruptedException {
        Path out = dir.resolve("out");
        List<String> cmd = List.of(Path.of(System.getProperty("java.home"), "bin", "java").toString(), "-cp",
                System.getProperty("java.class.path"), "org.rungtone.cli.Main", "build", "-", "--name", "piped",
                "--bits", "6", "--rate", "8k", "--out", out.toString(), "--json");
        Process p = new ProcessBuilder(cmd).redirectError(dir.resolve("stderr.txt").toFile()).start();
        try (OutputStream in = p.getOutputStream()) {
            in.write(WavFixtures.sine16(22_050, 0.5, 440, 0.5));
        }
        String json = new String(p.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
        assertTrue(p.waitFor(120, TimeUnit.SECONDS), "finished");
        assertEquals(0, p.exitValue(), Files.readString(dir.resolve("stderr.txt")));
        assertEquals(List.of(), JsonSchemas.problems("build", json));
        JsonObject source = JsonParser.parseString(json).getAsJsonObject().getAsJsonObject("source");
        assertTrue(source.get("standard_input").getAsBoolean());
        assertEquals(11_025, source.get("samples").getAsInt());
        assertTrue(Files.exists(out.resolve("piped.h")));
    }
}
