package org.rungtone.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.google.gson.JsonElement;
import com.google.gson.JsonObject;
import com.google.gson.JsonParser;
import com.google.gson.JsonPrimitive;
import java.io.ByteArrayInputStream;
import java.io.IOException;
import java.io.InputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.function.Consumer;
import java.util.stream.Stream;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import org.rungtone.calibrate.MeasurementPlan;
import org.rungtone.calibrate.RecordingSweep;
import org.rungtone.calibrate.SimulatedBoard;
import org.rungtone.calibrate.SyntheticRecording;
import org.rungtone.ladder.LadderSpec;
import org.rungtone.ladder.Spread;
import org.rungtone.ladder.Topology;
import org.rungtone.report.Json;
import org.rungtone.testing.Cli;
import org.rungtone.testing.JsonSchemas;
import org.rungtone.testing.WavFixtures;

/**
 * Every command's {@code --json} output, over a matrix of settings, against its JSON Schema in docs/schema/
 * (draft 2020-12, checked with networknt's json-schema-validator): builds of WAV files and scripts on the ideal,
 * a weighted and an R-2R ladder, with and without a unit profile and a player of each family, from standard
 * input; project builds with and without a player; surveys with and without a target; the ladder study with
 * and without Monte Carlo and design; calibrate plan (also for a meter of known count and for a recording), fit,
 * listen and simulate. The schemas are strict enough that a renamed field or a number written as a string fails.
 */
class JsonSchemaTest {
    private static final Path EXAMPLES = Path.of("examples").toAbsolutePath();
    private static final String WEIGHTED = EXAMPLES.resolve("ladders/door-chime-weighted.toml").toString();
    private static final String R2R = EXAMPLES.resolve("calibration/greenhouse-r2r.toml").toString();
    private static final String CUSTOM = EXAMPLES.resolve("ladders/freezer-alarm-custom.toml").toString();
    private static final String UNIT = EXAMPLES.resolve("greenhouse/greenhouse-1.unit.toml").toString();
    private static final String READINGS = EXAMPLES.resolve("calibration/greenhouse-1-readings.csv").toString();

    @TempDir
    static Path shared;

    private static Path tone;
    private static Path chord;
    private static Path recording;

    @BeforeAll
    static void sources() throws IOException {
        tone = shared.resolve("tone.wav");
        Files.write(tone, WavFixtures.sine16(22_050, 0.4, 440, 0.5));
        chord = shared.resolve("chord.wav");
        int n = 8820;
        double[] x = new double[2 * n];
        for (int i = 0; i < n; i++) {
            x[2 * i] = 0.3 * Math.sin(2 * Math.PI * 440 * i / 22_050.0) + 0.2 * Math.sin(2 * Math.PI * 660 * i
                    / 22_050.0);
            x[2 * i + 1] = 0.4 * Math.sin(2 * Math.PI * 550 * i / 22_050.0);
        }
        Files.write(chord, WavFixtures.wav().layout(WavFixtures.Layout.S24, 2, 22_050, x).bytes());
        // a 6-bit R-2R board of 1 % parts playing the recording sweep, held 20 ms, through a clean card
        LadderSpec six = LadderSpec.builder().topology(Topology.R2R).bits(6).tolerance(0.01).build();
        RecordingSweep sweep = RecordingSweep.of(MeasurementPlan.everyCode(six.levels()), 0.020);
        recording = SyntheticRecording.wav(shared.resolve("sweep.wav"), SyntheticRecording.record(sweep,
                SimulatedBoard.draw(six, Spread.uniform(), 5).levels().levels(), SyntheticRecording.card(48_000, 0.5,
                5.6e-5, 0.4, 0.3)), 48_000);
    }

    /** One command of the matrix: what it is, its arguments before {@code --out DIR --json}, its report. */
    record Case(String name, String report, List<String> args) {
        @Override
        public String toString() {
            return name;
        }
    }

    private static Arguments c(String name, String report, String... args) {
        return Arguments.of(new Case(name, report, List.of(args)));
    }

    static Stream<Arguments> matrix() {
        String t = "@tone";
        String ch = "@chord";
        return Stream.of(
                c("build: WAV on the ideal ladder, no player", "build", "build", t, "--bits", "6", "--rate", "8k"),
                c("build: tone with first-order shaping and an RC filter", "build", "build", t, "--bits", "5",
                        "--rate", "16k", "--shaping", "first", "--filter", "rc:5k"),
                c("build: stereo WAV, weighted ladder, avr player", "build", "build", ch, "--ladder", WEIGHTED,
                        "--rate", "8k", "--target", "avr", "--pins", "PD2-PD5", "--cpu-clock", "16MHz"),
                c("build: WAV, R-2R ladder, unit profile, packed cortexm player", "build", "build", ch, "--channel",
                        "2", "--unit", UNIT, "--rate", "11025", "--target", "cortexm", "--pins", "PA0-PA5",
                        "--cpu-clock", "72MHz", "--storage", "packed", "--filter", "lp2:4k", "--trim", "-60",
                        "--fade-out", "20ms"),
                c("build: R-2R ladder model, plain codes, rp2040 player", "build", "build", t, "--ladder", R2R,
                        "--compensation", "off", "--target", "rp2040", "--pins", "GPIO2-GPIO7", "--gain", "-3"),
                c("build: custom ladder, script clip, generic looped player", "build", "build",
                        EXAMPLES.resolve("scripts/freezer-warble-alarm.rung").toString(), "--ladder", CUSTOM,
                        "--rate", "8k", "--target", "generic", "--pins", "PB0-PB5", "--engine", "loop", "--loop",
                        "0:end", "--resampler", "tarsos"),
                c("build: wavetable script, dds cortexm player", "build", "build",
                        EXAMPLES.resolve("scripts/wavetable-256.rung").toString(), "--engine", "dds", "--target",
                        "cortexm", "--pins", "PA0-PA7", "--cpu-clock", "72MHz", "--dds-frequency", "440"),
                c("project: greenhouse, unit profile, avr looped player", "project", "build",
                        EXAMPLES.resolve("greenhouse/greenhouse.toml").toString()),
                c("project: greenhouse with command-line overrides", "project", "build",
                        EXAMPLES.resolve("greenhouse/greenhouse.toml").toString(), "--dither", "rpdf", "--seed", "4",
                        "--compensation", "off"),
                c("project: bench generator, dds", "project", "build",
                        EXAMPLES.resolve("bench-generator/bench-generator.toml").toString()),
                c("project: speech band, generic player", "project", "build",
                        EXAMPLES.resolve("speech-band/speech-band.toml").toString()),
                c("build: tone in a Tread store, avr player", "build", "build", t, "--bits", "6", "--rate", "8k",
                        "--storage", "tread3", "--target", "avr", "--pins", "PD2-PD7", "--cpu-clock", "16MHz"),
                c("project: vent fan, a loop found in the sound, avr player", "project", "build",
                        EXAMPLES.resolve("vent-fan/vent-fan.toml").toString()),
                c("project: no player, a flash budget", "project", "build", "@bare"),
                c("survey: target, budget, previews, filter", "survey", "survey", t, "--bits-list", "4,6",
                        "--rates", "8k,11025", "--target-sinad", "25", "--flash-budget", "8k", "--previews",
                        "--filter", "lp2:3.4k"),
                c("survey: Tread stores beside the plain codes", "survey", "survey", t, "--bits-list", "6",
                        "--rates", "8k", "--storage", "tread2,tread3", "--target-sinad", "20"),
                c("survey: no target, R-2R ladder", "survey", "survey", ch, "--ladder", R2R, "--bits-list", "6",
                        "--rates", "8k"),
                c("survey: ENOB target, packed, unit profile", "survey", "survey", t, "--unit", UNIT, "--bits-list",
                        "6", "--rates", "8k", "--target-enob", "4", "--packed", "--flash-budget", "4k"),
                c("ladder: weighted, Monte Carlo and design", "ladder", "ladder", "--ladder", WEIGHTED,
                        "--monte-carlo", "40", "--design", "--series", "E24", "--pin-limit", "1mA"),
                c("ladder: R-2R, unit profile, gaussian Monte Carlo", "ladder", "ladder", "--ladder", R2R, "--unit",
                        UNIT, "--monte-carlo", "20", "--gaussian-sigma", "1%"),
                c("ladder: custom, plain", "ladder", "ladder", "--ladder", CUSTOM),
                c("calibrate plan: avr sweep on a button", "calibrate-plan", "calibrate", "plan", "--ladder", R2R,
                        "--target", "avr", "--pins", "PD2-PD7", "--cpu-clock", "16MHz", "--button", "PB0"),
                c("calibrate plan: cortexm sweep held by time", "calibrate-plan", "calibrate", "plan", "--ladder",
                        R2R, "--target", "cortexm", "--pins", "PA0-PA5", "--cpu-clock", "72MHz", "--hold", "1s"),
                c("calibrate plan: 10 bits, no sweep program", "calibrate-plan", "calibrate", "plan", "--topology",
                        "r2r", "--bits", "10"),
                c("calibrate plan: a recording sweep for avr", "calibrate-plan", "calibrate", "plan", "--ladder",
                        R2R, "--recording", "--target", "avr", "--pins", "PD2-PD7", "--cpu-clock", "16MHz"),
                c("calibrate plan: 10 bits for a 3½-digit meter", "calibrate-plan", "calibrate", "plan",
                        "--topology", "weighted", "--bits", "10", "--meter-counts", "2000"),
                c("calibrate listen: a recorded sweep, one meter reading", "calibrate-listen", "calibrate", "listen",
                        "@recording", "--topology", "r2r", "--bits", "6", "--tolerance", "1%", "--hold", "20ms",
                        "--board", "b5", "--date", "2026-05-01", "--full-scale-reading", "4.98V"),
                c("calibrate fit: with the ladder", "calibrate-fit", "calibrate", "fit", READINGS, "--ladder", R2R,
                        "--board", "g1", "--date", "2026-05-01"),
                c("calibrate fit: without a ladder, meter step given", "calibrate-fit", "calibrate", "fit", READINGS,
                        "--resolution", "1mV", "--date", "2026-05-01"),
                c("calibrate simulate", "calibrate-simulate", "calibrate", "simulate", "--topology", "r2r", "--bits",
                        "6", "--tolerance", "5%", "--seed", "7", "--repeat", "2"));
    }

    private static List<String> args(Case c, Path out) throws IOException {
        List<String> a = new ArrayList<>();
        for (String s : c.args()) {
            a.add(switch (s) {
                case "@tone" -> tone.toString();
                case "@chord" -> chord.toString();
                case "@recording" -> recording.toString();
                case "@bare" -> bareProject(out.resolveSibling(out.getFileName() + "-project")).toString();
                default -> s;
            });
        }
        a.addAll(List.of("--out", out.toString(), "--json"));
        return a;
    }

    /** A project of one sound without a player, with a flash budget. */
    private static Path bareProject(Path dir) throws IOException {
        Files.createDirectories(dir);
        Files.copy(tone, dir.resolve("tone.wav"));
        Path toml = dir.resolve("bare.toml");
        Files.writeString(toml, "[project]\nname = \"bare\"\n\n[target]\nflash_budget = \"64k\"\n\n[quantize]\n"
                + "bits = 5\nrate = \"8k\"\n\n[[sound]]\nname = \"tone\"\nsource = \"tone.wav\"\n");
        return toml;
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("matrix")
    void everyReportMatchesItsSchema(Case c, @TempDir Path dir) throws IOException {
        Path out = dir.resolve("out");
        Cli.Run r = Cli.run(args(c, out).toArray(new String[0]));
        assertEquals(0, r.exitCode(), r.err());
        assertValid(c.report(), r.out());
        JsonObject o = JsonParser.parseString(r.out()).getAsJsonObject();
        assertEquals(Json.SCHEMA_VERSION, o.get("schema_version").getAsInt());
        assertEquals(c.report(), o.get("report").getAsString());
        // the report file holds what was printed, but for the stage timings
        Optional<Path> file = Stream.of("report.json", "survey.json").map(out::resolve).filter(Files::exists)
                .findFirst();
        if (file.isPresent()) {
            JsonObject written = JsonParser.parseString(Files.readString(file.get())).getAsJsonObject();
            written.remove("stage_ms");
            o.remove("stage_ms");
            assertEquals(o, written);
        }
        // every file listed is relative to the output folder and is there
        for (JsonElement f : o.getAsJsonArray("files")) {
            assertFalse(Path.of(f.getAsString()).isAbsolute(), f.getAsString());
            assertTrue(Files.exists(out.resolve(f.getAsString())), f.getAsString());
        }
    }

    /** A WAV file of µ-law code words on standard input: the source says so. */
    @Test
    void standardInputBuildMatchesTheSchema(@TempDir Path dir) {
        byte[] codes = new byte[4000];
        for (int i = 0; i < codes.length; i++) {
            codes[i] = (byte) (0x90 + 0x20 * Math.sin(i * 0.3));
        }
        InputStream saved = System.in;
        try {
            System.setIn(new ByteArrayInputStream(WavFixtures.wav().raw(7, 8, 1, 8000, codes).bytes()));
            Cli.Run r = Cli.run("build", "-", "--bits", "6", "--rate", "8k", "--out", dir.toString(), "--json");
            assertEquals(0, r.exitCode(), r.err());
            assertValid("build", r.out());
            JsonObject source = JsonParser.parseString(r.out()).getAsJsonObject().getAsJsonObject("source");
            assertTrue(source.get("path").isJsonNull());
            assertTrue(source.get("standard_input").getAsBoolean());
            assertEquals("mu_law", source.get("encoding").getAsString());
            assertEquals(7, source.get("format_tag").getAsInt());
        } finally {
            System.setIn(saved);
        }
    }

    /** The schemas fail a renamed field, a number written as a string, an unknown field and a version-1 setting. */
    @Test
    void schemasRefuseRenamedAndStringTypedFields(@TempDir Path dir) throws IOException {
        Path out = dir.resolve("p");
        Cli.Run r = Cli.run("build", EXAMPLES.resolve("greenhouse/greenhouse.toml").toString(), "--out",
                out.toString(), "--json", "--quiet");
        assertEquals(0, r.exitCode(), r.err());
        String good = r.out();
        assertValid("project", good);
        assertInvalid("project", good, o -> o.add("schema_version", new JsonPrimitive(1)));
        assertInvalid("project", good, o -> o.getAsJsonObject("settings").add("bits",
                new JsonPrimitive("6  (board)")));
        assertInvalid("project", good, o -> sound(o).add("snr_db", sound(o).remove("sinad_db")));
        assertInvalid("project", good, o -> sound(o).add("bits", new JsonPrimitive("6")));
        assertInvalid("project", good, o -> sound(o).add("firmware", new com.google.gson.JsonArray()));
        assertInvalid("project", good, o -> o.getAsJsonObject("firmware").getAsJsonObject("tick")
                .add("achieved_hz", new JsonPrimitive("16 kHz")));
        assertInvalid("project", good, o -> o.getAsJsonObject("firmware").addProperty("timer_line",
                "timer1 at 16 MHz"));
        assertInvalid("project", good, o -> sound(o).getAsJsonArray("quality").get(0).getAsJsonObject()
                .add("enob_bits", new JsonPrimitive(5)));
        // the greenhouse player is the avr one: its tick cost is a fact of its own, with the CPU share at 16 MHz
        JsonObject cost = JsonParser.parseString(good).getAsJsonObject().getAsJsonObject("firmware")
                .getAsJsonObject("tick_cost");
        int worst = cost.get("worst_cycles").getAsInt();
        double tick = JsonParser.parseString(good).getAsJsonObject().getAsJsonObject("firmware")
                .getAsJsonObject("tick").get("achieved_hz").getAsDouble();
        assertEquals(worst * tick / 16e6, cost.get("cpu_share").getAsDouble(), 1e-12);
        assertTrue(worst > 40 && worst < 300, cost::toString);
        assertInvalid("project", good, o -> o.getAsJsonObject("firmware").getAsJsonObject("tick_cost")
                .addProperty("worst_cycles", "57 cycles"));
    }

    /** A project's C folder of its own is a setting of the JSON report, relative to the output folder. */
    @Test
    void aSeparateCFolderIsASetting(@TempDir Path dir) {
        Cli.Run r = Cli.run("build", EXAMPLES.resolve("greenhouse/greenhouse.toml").toString(), "--out",
                dir.resolve("report").toString(), "--c-out", dir.resolve("firmware").toString(), "--json", "-q");
        assertEquals(0, r.exitCode(), r.err());
        assertValid("project", r.out());
        JsonObject cOut = JsonParser.parseString(r.out()).getAsJsonObject().getAsJsonObject("settings")
                .getAsJsonObject("c_out");
        assertEquals("../firmware", cOut.get("value").getAsString());
        assertEquals("command_line", cOut.get("origin").getAsString());
    }

    /** docs/json.md names every field of every schema. */
    @Test
    void everySchemaFieldIsDocumented() throws IOException {
        String doc = Files.readString(Path.of("docs", "json.md"));
        List<String> missing = new ArrayList<>();
        try (Stream<Path> files = Files.list(JsonSchemas.FOLDER)) {
            for (Path f : files.sorted().toList()) {
                collectUndocumented(JsonParser.parseString(Files.readString(f)), doc, missing);
            }
        }
        assertEquals(List.of(), missing);
    }

    private static void collectUndocumented(JsonElement e, String doc, List<String> missing) {
        if (e.isJsonArray()) {
            e.getAsJsonArray().forEach(x -> collectUndocumented(x, doc, missing));
        } else if (e.isJsonObject()) {
            JsonObject o = e.getAsJsonObject();
            if (o.has("properties")) {
                for (String key : o.getAsJsonObject("properties").keySet()) {
                    if (!doc.contains("`" + key + "`")) {
                        missing.add(key);
                    }
                }
            }
            o.entrySet().forEach(x -> collectUndocumented(x.getValue(), doc, missing));
        }
    }

    private static JsonObject sound(JsonObject project) {
        return project.getAsJsonArray("sounds").get(0).getAsJsonObject();
    }

    private static void assertValid(String report, String json) {
        List<String> problems = JsonSchemas.problems(report, json);
        assertTrue(problems.isEmpty(), report + ": " + String.join("\n", problems) + "\n" + json);
    }

    private static void assertInvalid(String report, String json, Consumer<JsonObject> change) {
        JsonObject o = JsonParser.parseString(json).getAsJsonObject();
        change.accept(o);
        assertFalse(JsonSchemas.problems(report, o.toString()).isEmpty(), "accepted: " + o);
    }
}
