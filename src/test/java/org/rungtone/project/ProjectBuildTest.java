package org.rungtone.project;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.rungtone.testing.CToolchain;
import org.rungtone.testing.Cli;

/** Project files built end to end through the command line, as users run them. */
class ProjectBuildTest {
    @TempDir
    Path dir;

    Path copyExample(String folder) throws IOException {
        Path src = Path.of("examples", folder);
        Path dst = dir.resolve(folder);
        Files.createDirectories(dst);
        try (var s = Files.list(src)) {
            for (Path p : s.toList()) {
                Files.copy(p, dst.resolve(p.getFileName()));
            }
        }
        return dst;
    }

    @Test
    void greenhouseExampleBuildsAndItsAvrCodeCompiles() throws Exception {
        Path g = copyExample("greenhouse");
        Path out = dir.resolve("out");
        Cli.Run r = Cli.run("build", g.resolve("greenhouse.toml").toString(), "--out", out.toString());
        assertEquals(0, r.exitCode(), r.err());
        for (String f : List.of("greenhouse.h", "greenhouse.c", "greenhouse_data.c", "report.txt", "report.json",
                "door_chime/preview.wav", "frost_alarm/preview.wav", "door_chime/error-spectrum.png")) {
            assertTrue(Files.exists(out.resolve(f)), f);
        }
        String html = Files.readString(out.resolve("report.html"));
        long pngs;
        try (var files = Files.walk(out)) {
            pngs = files.filter(p -> p.toString().endsWith(".png")).count();
        }
        assertTrue(pngs >= 2, "plots written: " + pngs);
        assertEquals(pngs, html.split("data:image/png;base64,", -1).length - 1, "every plot embedded once");
        assertFalse(html.contains("src=\"http") || html.contains("href=\"http"), "readable offline");
        String report = Files.readString(out.resolve("report.txt"));
        assertTrue(report.contains("greenhouse_door_chime"), report);
        assertTrue(report.contains("Flash: 31,202 bytes for all sounds of a 32,000-byte budget"), report);
        CToolchain.require("avr-gcc");
        CToolchain.compileClean(out, CToolchain.cmd(List.of("avr-gcc", "-mmcu=atmega328p", "-Os"),
                CToolchain.cmd(CToolchain.STRICT, List.of("-c", "greenhouse.c", "greenhouse_data.c"))));
    }

    @Test
    void ventFanExampleLoopsItsSteadyHumAndItsAvrCodeCompiles() throws Exception {
        Path g = copyExample("vent-fan");
        Path out = dir.resolve("fan");
        Cli.Run r = Cli.run("build", g.resolve("vent-fan.toml").toString(), "--out", out.toString(), "-q");
        assertEquals(0, r.exitCode(), r.err());
        com.google.gson.JsonObject loop = com.google.gson.JsonParser.parseString(Files.readString(
                out.resolve("report.json"))).getAsJsonObject().getAsJsonArray("sounds").get(0).getAsJsonObject()
                .getAsJsonObject("auto_loop");
        // blade pass: 4 blades at 25 rev/s = 100 Hz, 120 samples at 12 kHz; the loop inside the steady
        // 0.4 .. 1.8 s and a whole number of blade passes
        assertEquals(120, loop.get("period_samples").getAsDouble(), 0.12);
        int start = loop.get("start_sample").getAsInt();
        int end = loop.get("end_sample").getAsInt();
        assertTrue(start >= 0.4 * 12_000 && end <= 1.8 * 12_000, loop::toString);
        assertEquals(0, (end - start) % 120, loop::toString);
        assertTrue(loop.get("seam_db").getAsDouble() < -40, loop::toString);
        assertTrue(Files.readString(out.resolve("vent_fan.h")).contains("loop " + start + " .. " + end));
        CToolchain.require("avr-gcc");
        CToolchain.compileClean(out, CToolchain.cmd(List.of("avr-gcc", "-mmcu=atmega328p", "-Os"),
                CToolchain.cmd(CToolchain.STRICT, List.of("-c", "vent_fan.c", "vent_fan_data.c"))));
    }

    @Test
    void aUnitProfileFixesTheBitDepth() throws IOException {
        Path g = copyExample("greenhouse");
        Cli.Run r = Cli.run("build", g.resolve("greenhouse.toml").toString(), "--bits", "5", "--out",
                dir.resolve("o5").toString());
        assertEquals(1, r.exitCode());
        assertTrue(r.err().endsWith("greenhouse-1.unit.toml has 6 bits but the project asks for 5\n"), r.err());
    }

    @Test
    void speechBandExampleBuildsAndItsGenericCodeCompiles() throws Exception {
        Path g = copyExample("speech-band");
        Path out = dir.resolve("speech");
        Cli.Run r = Cli.run("build", g.resolve("speech-band.toml").toString(), "--out", out.toString(), "-q");
        assertEquals(0, r.exitCode(), r.err());
        String json = Files.readString(out.resolve("report.json"));
        // ITU-T G.711 telephone sampling: 8 kHz
        assertTrue(json.contains("\"rate_hz\": 8000.0"), json);
        CToolchain.require("gcc");
        CToolchain.compileClean(out, CToolchain.cmd(List.of("gcc"), CToolchain.cmd(CToolchain.STRICT,
                List.of("-c", "vent_voice.c", "vent_voice_data.c"))));
    }

    @Test
    void benchGeneratorExampleBuildsADdsPlayerForCortexM() throws Exception {
        Path g = copyExample("bench-generator");
        Path out = dir.resolve("bench");
        Cli.Run r = Cli.run("build", g.resolve("bench-generator.toml").toString(), "--out", out.toString());
        assertEquals(0, r.exitCode(), r.err());
        // DDS: M = round(f * 2^n / fs) = round(1000 * 2^32 / 48000) = 89478485 (Analog Devices MT-085)
        assertTrue(r.out().contains("tuning word M = 89478485"), r.out());
        CToolchain.require("arm-none-eabi-gcc");
        CToolchain.compileClean(out, CToolchain.cmd(List.of("arm-none-eabi-gcc", "-mcpu=cortex-m3", "-mthumb",
                "-ffreestanding", "-Os"), CToolchain.cmd(CToolchain.STRICT, List.of("-c", "bench_gen.c",
                        "bench_gen_data.c"))));
    }

    @Test
    void commandLineOverridesTheFileAndTheReportSaysSo() throws IOException {
        Path g = copyExample("greenhouse");
        Path toml = g.resolve("greenhouse.toml");
        // without the measured profile, so that the ladder can take another bit depth
        Files.writeString(toml, Files.readString(toml).replaceFirst("(?m)^unit = .*$", ""));
        Path out = dir.resolve("o2");
        Cli.Run r = Cli.run("build", g.resolve("greenhouse.toml").toString(), "--out", out.toString(), "--bits",
                "5", "--dither", "none", "--target", "generic", "--pins", "PA0-PA4", "--json");
        assertEquals(0, r.exitCode(), r.err());
        // each setting's value and origin are fields of their own
        com.google.gson.JsonObject settings = com.google.gson.JsonParser.parseString(r.out()).getAsJsonObject()
                .getAsJsonObject("settings");
        assertEquals(5, settings.getAsJsonObject("bits").get("value").getAsInt());
        assertEquals("command_line", settings.getAsJsonObject("bits").get("origin").getAsString());
        assertEquals("none", settings.getAsJsonObject("dither").get("value").getAsString());
        assertEquals("command_line", settings.getAsJsonObject("dither").get("origin").getAsString());
        assertEquals(1, settings.getAsJsonObject("seed").get("value").getAsLong());
        assertEquals("project_file", settings.getAsJsonObject("seed").get("origin").getAsString());
        assertEquals("none", settings.getAsJsonObject("shaping").get("value").getAsString());
        assertEquals("default", settings.getAsJsonObject("shaping").get("origin").getAsString());
        assertEquals("generic", settings.getAsJsonObject("target").get("value").getAsString());
        assertEquals("command_line", settings.getAsJsonObject("target").get("origin").getAsString());
        assertEquals("PA0-PA4", settings.getAsJsonObject("pins").get("value").getAsString());
        assertTrue(Files.readString(out.resolve("report.txt")).matches("(?s).*\\n  bits +5  \\(command line\\)\\n.*"),
                "the text report keeps its words");
        assertTrue(Files.readString(out.resolve("greenhouse.h")).contains("generic"));
    }

    @Test
    void soundsAtDifferentRatesConflictWithOnePlayer() throws IOException {
        Path g = copyExample("greenhouse");
        Path toml = g.resolve("greenhouse.toml");
        Files.writeString(toml, Files.readString(toml).replace("loop   = \"0:end\"",
                "loop   = \"0:end\"\nrate   = \"8k\""));
        Path out = dir.resolve("o3");
        Cli.Run r = Cli.run("build", toml.toString(), "--out", out.toString());
        assertEquals(1, r.exitCode(), r.err());
        assertTrue(r.err().contains("greenhouse.toml:") && r.err().contains("sound[2].rate: 8kHz conflicts with"
                + " sound 'door_chime' at 16kHz"), r.err());
        assertFalse(Files.exists(out));
    }

    @Test
    void aSettingErrorNamesTheProjectLineOrTheOptionWhereItWasTyped() throws IOException {
        Path g = copyExample("greenhouse");
        Path toml = g.resolve("greenhouse.toml");
        Files.writeString(toml, Files.readString(toml).replace("rate   = \"16k\"", "rate   = \"500k\""));
        Path out = dir.resolve("o4");
        Cli.Run fromFile = Cli.run("build", toml.toString(), "--out", out.toString());
        assertEquals(1, fromFile.exitCode(), fromFile.err());
        assertEquals("rungtone: error: " + toml + ":35: quantize.rate: must be 1 Hz..384 kHz: 500000.0\n",
                fromFile.err());
        Cli.Run fromOption = Cli.run("build", toml.toString(), "--out", out.toString(), "--rate", "400k");
        assertEquals(1, fromOption.exitCode(), fromOption.err());
        assertEquals("rungtone: error: --rate must be 1 Hz..384 kHz: 400000.0\n", fromOption.err());
        assertFalse(Files.exists(out));
    }

    @Test
    void aSoundsOwnSettingErrorNamesItsLineInThatSoundsTable() throws IOException {
        Files.write(dir.resolve("tone.wav"), org.rungtone.testing.WavFixtures.sine16(16_000, 1.6, 440, 0.5));
        String head = "[project]\nname = \"bench\"\nout = \"out\"\n\n[quantize]\nrate = \"8k\"\n\n[[sound]]\n"
                + "name = \"first\"\nsource = \"tone.wav\"\n\n[[sound]]\nname = \"second\"\nsource = \"tone.wav\"\n";
        // the second sound's own rate, not the shared [quantize] rate, and not reported as --rate
        Path toml = Files.writeString(dir.resolve("p.toml"), head + "rate = nan\n");
        assertEquals("rungtone: error: " + toml + ":15: sound[2].rate: must be 1 Hz..384 kHz: NaN\n",
                Cli.run("build", toml.toString()).err());
        // found only once the sound's length is known, still placed at its line
        Files.writeString(toml, head + "fade_out = \"1s\"\nfade_in = \"1s\"\n");
        assertEquals("rungtone: error: " + toml + ":16: sound[2].fade_in: 1s and fade_out 1s together are longer"
                + " than the sound (1.6s) and would overlap; make them add up to at most 1.6s\n",
                Cli.run("build", toml.toString()).err());
        String player = "[target]\nfamily = \"avr\"\ncpu_clock = \"16MHz\"\npins = \"PD2-PD7\"\n\n";
        Files.writeString(toml, head.replace("[quantize]\n", player + "[quantize]\nbits = 6\n")
                + "loop = \"5s:end\"\n");
        assertEquals("rungtone: error: " + toml + ":21: sound[2].loop: start 5s is at or past the sound's end (1.6s,"
                + " 12800 samples); the loop must start inside the sound\n", Cli.run("build", toml.toString()).err());
        assertFalse(Files.exists(dir.resolve("out")));
    }

    @Test
    void singleSoundOptionsAreRefusedForProjects() throws IOException {
        Path g = copyExample("greenhouse");
        Cli.Run r = Cli.run("build", g.resolve("greenhouse.toml").toString(), "--trim", "-50");
        assertEquals(1, r.exitCode());
        assertEquals("rungtone: error: --trim sets one sound; in a project file put it in that sound's [[sound]]"
                + " table\n", r.err());
    }

    @Test
    void initWritesAProjectThatBuildsAndRefusesToClobber() throws IOException {
        Path toml = dir.resolve("bell.toml");
        Files.copy(Path.of("examples/greenhouse/door-chime.wav"), dir.resolve("sound.wav"));
        for (String target : List.of("generic", "avr", "cortexm")) {
            Cli.Run init = Cli.run("init", toml.toString(), "--target", target, "--force", "--quiet");
            assertEquals(0, init.exitCode(), init.err());
            Project p = ProjectFile.load(toml);
            assertEquals("bell", p.name());
            Cli.Run b = Cli.run("build", toml.toString(), "--out", dir.resolve("out-" + target).toString(), "-q");
            assertEquals(0, b.exitCode(), target + ": " + b.err());
        }
        Cli.Run again = Cli.run("init", toml.toString());
        assertEquals(1, again.exitCode());
        assertEquals("rungtone: error: " + toml + ": already exists; use --force to overwrite it\n", again.err());
    }

    @Test
    void demoRunsEndToEnd() throws IOException {
        Path out = dir.resolve("demo");
        Cli.Run r = Cli.run("demo", "--out", out.toString());
        assertEquals(0, r.exitCode(), r.err());
        assertTrue(Files.exists(out.resolve("greenhouse.h")));
        assertTrue(Files.exists(out.resolve("scenario/greenhouse.toml")));
        assertTrue(r.out().contains("Demo done."), r.out());
    }
}
