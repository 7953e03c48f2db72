package org.rungtone.cli;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.google.gson.JsonArray;
import com.google.gson.JsonElement;
import com.google.gson.JsonObject;
import com.google.gson.JsonParser;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.Comparator;
import java.util.List;
import java.util.Locale;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import org.rungtone.source.WavReader;
import org.rungtone.testing.Cli;
import org.rungtone.testing.WavFixtures;

class SurveyCommandTest {
    /** A row of the printed table: bits, rate, four figures, two byte counts, fits, and the rest. */
    private static final String ROW = " +\\d+ +[\\d.]+ kHz +-?[\\d.]+ +-?[\\d.]+ +-?[\\d.]+ +-?[\\d.]+"
            + " +[\\d,]+ +[\\d,]+ +(yes|no).*";

    @TempDir
    Path dir;

    Path fixture() throws IOException {
        Path wav = dir.resolve("bell.wav");
        Files.write(wav, WavFixtures.sine16(44_100, 0.5, 997, 0.5));
        return wav;
    }

    private Cli.Run survey(Path out, String... extra) throws IOException {
        List<String> args = new ArrayList<>(List.of("survey", fixture().toString(), "--out", out.toString()));
        args.addAll(Arrays.asList(extra));
        return Cli.run(args.toArray(new String[0]));
    }

    private static List<String> tableRows(String out) {
        return out.lines().filter(l -> l.matches(ROW)).toList();
    }

    private static JsonObject json(Path file) throws IOException {
        return JsonParser.parseString(Files.readString(file)).getAsJsonObject();
    }

    @Test
    void writesTheFilesAndPrintsEveryCell() throws IOException {
        Path out = dir.resolve("out");
        Cli.Run r = survey(out, "--bits-list", "4,8", "--rates", "8k,16k", "--target-sinad", "40");
        assertEquals(0, r.exitCode(), r.err());
        assertEquals("", r.err(), "no progress output when stderr is not a terminal");
        try (Stream<Path> s = Files.list(out)) {
            assertEquals(List.of(".rungtone-survey-files", "survey-sinad-flash.png", "survey-sinad.png", "survey.json",
                    "survey.txt"),
                    s.map(p -> p.getFileName().toString()).sorted().toList(), "no temporary files left behind");
        }
        byte[] png = Files.readAllBytes(out.resolve("survey-sinad.png"));
        assertArrayEquals(new byte[] {(byte) 0x89, 'P', 'N', 'G'}, Arrays.copyOf(png, 4));
        assertEquals(r.out(), Files.readString(out.resolve("survey.txt")));
        List<String> rows = tableRows(r.out());
        assertEquals(4, rows.size(), r.out());
        assertTrue(rows.get(0).matches(" +4 +8 kHz .*"), rows.get(0));
        assertTrue(rows.get(3).matches(" +8 +16 kHz .*"), rows.get(3));
    }

    @Test
    void figuresFollowTheDitheredQuantizerAndTheChosenRowIsTheCheapestThatReaches() throws IOException {
        Path out = dir.resolve("out");
        // a reconstruction filter, so that the images of the held output do not swamp the heard figures
        Cli.Run r = survey(out, "--bits-list", "4,6,8", "--rates", "8k,16k", "--target-sinad", "30", "--filter",
                "lp2:3.4k", "--json");
        assertEquals(0, r.exitCode(), r.err());
        JsonObject o = JsonParser.parseString(r.out()).getAsJsonObject();
        assertEquals(o, json(out.resolve("survey.json")), "--json prints what survey.json holds");
        JsonArray rows = o.getAsJsonArray("rows");
        assertEquals(6, rows.size());
        double amplitude = Math.pow(10, -1 / 20.0);
        for (JsonElement e : rows) {
            JsonObject row = e.getAsJsonObject();
            int bits = row.get("bits").getAsInt();
            // TPDF-dithered ideal quantizer: error power LSB²/4 with LSB = 2/(2^N - 1) of the full scale
            // (Lipshitz, Wannamaker, Vanderkooy, JAES 40(5), 1992), against a sine normalized to -1 dBFS.
            double lsb = 2 / (Math.pow(2, bits) - 1);
            double expected = 10 * Math.log10(amplitude * amplitude / 2 / (lsb * lsb / 4));
            assertEquals(expected, row.get("sinad_db").getAsDouble(), 0.5, "SINAD at " + bits + " bits");
            int samples = row.get("samples").getAsInt();
            assertEquals(row.get("rate_hz").getAsDouble() / 2, samples, 1, "0.5 s of samples");
            assertEquals((long) samples * (bits <= 8 ? 1 : 2), row.get("flash_bytes_unpacked").getAsLong());
            assertEquals(((long) samples * bits + 7) / 8, row.get("flash_bytes_packed").getAsLong());
            // the target is checked against what the listener gets, not the at-rate SINAD
            assertEquals(row.get("heard_signal_to_error_db").getAsDouble() >= 30,
                    row.get("reaches_target").getAsBoolean(), row.toString());
        }
        JsonObject expected = rows.asList().stream().map(JsonElement::getAsJsonObject)
                .filter(x -> x.get("fits").getAsBoolean() && x.get("reaches_target").getAsBoolean())
                .min(Comparator.comparingLong((JsonObject x) -> x.get("flash_bytes_unpacked").getAsLong())
                        .thenComparingInt(x -> x.get("bits").getAsInt())
                        .thenComparingDouble(x -> x.get("rate_hz").getAsDouble()))
                .orElseThrow();
        // 6 bits: 32.0 dB at its rate by the formula above, the first depth past 30 dB; but at 8 kHz the
        // images around 7 kHz that pass the 3.4 kHz filter keep the heard figures below 30 dB at any depth,
        // so the cheapest setting that reaches the target is 6 bits at 16 kHz.
        assertEquals(6, expected.get("bits").getAsInt());
        assertEquals(16000, expected.get("rate_hz").getAsDouble(), 0);
        assertEquals(expected, o.getAsJsonObject("chosen"));
        assertEquals(1, rows.asList().stream().filter(x -> x.getAsJsonObject().get("chosen").getAsBoolean())
                .count());

        String text = Files.readString(out.resolve("survey.txt"));
        List<String> marked = tableRows(text).stream().filter(l -> l.endsWith("<- chosen")).toList();
        assertEquals(1, marked.size(), text);
        assertTrue(marked.get(0).matches(" +6 +16 kHz .*"), marked.get(0));
        assertTrue(text.contains("\nRecommended: 6 bits at 16 kHz (heard SNR "), text);
    }

    @Test
    void conditioningOptionsReachTheSurvey() throws IOException {
        Path out = dir.resolve("out");
        Cli.Run r = survey(out, "--bits-list", "8", "--rates", "8k", "--gain", "-6", "--json");
        assertEquals(0, r.exitCode(), r.err());
        JsonObject o = JsonParser.parseString(r.out()).getAsJsonObject();
        JsonObject conditioning = o.getAsJsonObject("conditioning");
        assertEquals("DC removed, gain -6.0 dB", conditioning.get("description").getAsString());
        assertEquals(-6, conditioning.get("gain_db").getAsDouble(), 0);
        assertTrue(conditioning.get("normalize_dbfs").isJsonNull());
        assertTrue(conditioning.get("dc_removed").getAsBoolean());
        // The fixture's 0.5 sine at -6 dB: amplitude 0.5·10^(-6/20); TPDF error power LSB²/4 as above.
        double amplitude = 0.5 * Math.pow(10, -6 / 20.0);
        double lsb = 2 / 255.0;
        double expected = 10 * Math.log10(amplitude * amplitude / 2 / (lsb * lsb / 4));
        assertEquals(expected, o.getAsJsonArray("rows").get(0).getAsJsonObject().get("sinad_db").getAsDouble(),
                0.5);
    }

    @Test
    void jsonHasTheDocumentedStableFields() throws IOException {
        Path out = dir.resolve("out");
        Cli.Run r = survey(out, "--bits-list", "6", "--rates", "8k", "--target-enob", "4", "--flash-budget", "32k",
                "--packed", "--filter", "lp2:3k", "--json");
        assertEquals(0, r.exitCode(), r.err());
        JsonObject o = JsonParser.parseString(r.out()).getAsJsonObject();
        for (String f : List.of("schema_version", "report", "tool", "version", "source", "conditioning", "resampler",
                "levels", "dither", "shaping", "seed", "filter", "target", "flash_budget_bytes", "packed", "rows",
                "chosen", "recommendation", "files", "warnings")) {
            assertTrue(o.has(f), f);
        }
        assertEquals(32_000, o.get("flash_budget_bytes").getAsLong());
        assertTrue(o.get("packed").getAsBoolean());
        assertEquals("enob_full_scale_bits", o.getAsJsonObject("target").get("figure").getAsString());
        JsonObject row = o.getAsJsonArray("rows").get(0).getAsJsonObject();
        assertEquals(List.of("bits", "rate_hz", "samples", "sinad_db", "in_band_snr_db", "a_weighted_snr_db",
                "enob_full_scale_bits", "heard_signal_to_error_db", "heard_a_weighted_signal_to_error_db",
                "clipped_samples", "flash_bytes_unpacked", "flash_bytes_packed", "fits", "reaches_target", "chosen",
                "storage", "preview"), new ArrayList<>(row.keySet()));
    }

    @Test
    void aBudgetTooSmallLeavesNothingChosen() throws IOException {
        // 0.5 s at 8 kHz is 4000 samples: 6 bits take 4000 bytes unpacked, 3000 bit-packed.
        Path out = dir.resolve("tight");
        // with a 3 kHz filter, 6 bits at 8 kHz are heard at about 29 dB: a 25 dB target
        Cli.Run r = survey(out, "--bits-list", "6,8", "--rates", "8k", "--target-sinad", "25", "--flash-budget",
                "3500", "--filter", "lp2:3k");
        assertEquals(0, r.exitCode(), r.err());
        assertFalse(r.out().contains("<- chosen"), r.out());
        assertTrue(r.out().contains("Nothing reaches SINAD >= 25.00 dB within the 3,500 bytes unpacked budget;"
                + " the smallest setting that reaches it, 6 bits at 8 kHz, needs 4,000 bytes unpacked."), r.out());
        assertTrue(json(out.resolve("survey.json")).get("chosen").isJsonNull());

        Cli.Run packed = survey(dir.resolve("packed"), "--bits-list", "6,8", "--rates", "8k", "--target-sinad", "25",
                "--flash-budget", "3500", "--packed", "--filter", "lp2:3k");
        assertEquals(0, packed.exitCode(), packed.err());
        assertTrue(packed.out().contains("Recommended: 6 bits at 8 kHz (heard SNR "), packed.out());
        assertTrue(packed.out().contains("3,000 bytes bit-packed)."), packed.out());
    }

    @Test
    void previewsAreWrittenPerCell() throws IOException {
        Path out = dir.resolve("out");
        Cli.Run r = survey(out, "--bits-list", "4,6", "--rates", "8k", "--previews", "--filter", "lp2:3.4k",
                "--quiet");
        assertEquals(0, r.exitCode(), r.err());
        assertEquals("", r.out(), "--quiet prints nothing");
        for (String name : List.of("b04-r8000.wav", "b06-r8000.wav")) {
            WavReader.Decoded d = WavReader.read(out.resolve("previews").resolve(name), 0);
            assertEquals(44_100, d.signal().sampleRateHz(), 0);
            assertEquals(22_050, d.signal().length(), 2, name);
            assertEquals("PCM 16-bit", d.format().describe().substring(0, 10));
        }
        JsonObject o = json(out.resolve("survey.json"));
        assertEquals("previews/b06-r8000.wav",
                o.getAsJsonArray("rows").get(1).getAsJsonObject().get("preview").getAsString());
        JsonObject filter = o.getAsJsonObject("filter");
        assertEquals("second_order", filter.get("kind").getAsString());
        assertEquals(3400, filter.get("cutoff_hz").getAsDouble(), 0);
        assertTrue(filter.get("description").getAsString().startsWith("2nd order 3400 Hz"), filter.toString());
    }

    static Stream<Arguments> badInputs() {
        return Stream.of(
                Arguments.of(List.of("--bits-list", "4..x"), 2, "'4..x' is not a bit depth or a range like 4..10"),
                Arguments.of(List.of("--bits-list", "8..4"), 2, "the range '8..4' runs backwards; write 4..8"),
                Arguments.of(List.of("--bits-list", "0,4"), 1, "--bits-list 0,4: bit depth must be 1..16: 0"),
                Arguments.of(List.of("--bits-list", "4..6,6"), 1, "6 appears twice; give each depth once"),
                Arguments.of(List.of("--rates", "8k,5V"), 2, "'5V' is not a frequency"),
                Arguments.of(List.of("--rates", "8k,8000"), 1, "8kHz appears twice; give each rate once"),
                Arguments.of(List.of("--rates", "500k"), 1, "a sample rate must be 1 Hz..384 kHz: 500kHz"),
                Arguments.of(List.of("--target-sinad", "40", "--target-enob", "6"), 1,
                        "give one target, --target-sinad or --target-enob, not both"),
                Arguments.of(List.of("--target-sinad", "40", "--target-sinad", "50"), 2,
                        "option '--target-sinad' (<dB>) should be specified only once"),
                Arguments.of(List.of("--flash-budget", "0"), 2, "'0' must be a positive number of bytes"),
                Arguments.of(List.of("--flash-budget", "-5"), 2, "'-5' must be a positive number of bytes"),
                Arguments.of(List.of("--flash-budget", "32q"), 2, "'32q' is not a byte count"),
                Arguments.of(List.of("--filter", "lp3:4k"), 2, "'lp3:4k' is not a filter"),
                Arguments.of(List.of("--channel", "9"), 1, "--channel must be 0 (mix down) or 1..8: 9"));
    }

    @ParameterizedTest
    @MethodSource("badInputs")
    void badInputGivesOneLineAndNoFiles(List<String> extra, int exitCode, String message) throws IOException {
        Path out = dir.resolve("out");
        Cli.Run r = survey(out, extra.toArray(new String[0]));
        assertEquals(exitCode, r.exitCode(), r.err());
        List<String> lines = r.err().lines().toList();
        assertTrue(lines.get(0).startsWith("rungtone: error: "), r.err());
        assertTrue(lines.get(0).contains(message), r.err());
        // Usage errors add picocli's pointer to --help; input errors are the one line alone.
        assertEquals(exitCode == 2 ? List.of("Try 'rungtone survey --help' for the options.") : List.of(),
                lines.subList(1, lines.size()), r.err());
        assertFalse(r.err().contains("Exception"), r.err());
        assertEquals("", r.out());
        assertFalse(Files.exists(out), "no output folder");
    }

    @Test
    void aClipTooShortForARateIsBadInput() throws IOException {
        Path wav = dir.resolve("click.wav");
        Files.write(wav, WavFixtures.sine16(44_100, 0.001, 997, 0.5));
        Path out = dir.resolve("out");
        Cli.Run r = Cli.run("survey", wav.toString(), "--rates", "8k", "--bits-list", "4", "--out", out.toString());
        assertEquals(1, r.exitCode(), r.err());
        assertEquals(String.format(Locale.ROOT, "rungtone: error: %s: only 8 samples are left at 8kHz after"
                + " conditioning; the survey needs at least 16 (use a longer clip or higher --rates)%n", wav), r.err());
        assertFalse(Files.exists(out));
    }

    @Test
    void missingSourceIsBadInput() {
        Path out = dir.resolve("out");
        Cli.Run r = Cli.run("survey", dir.resolve("nope.wav").toString(), "--out", out.toString());
        assertEquals(1, r.exitCode());
        assertTrue(r.err().startsWith("rungtone: error: ") && r.err().contains("nope.wav: no such file"), r.err());
        assertFalse(Files.exists(out));
    }

    @Test
    void helpShowsAWorkedExample() {
        Cli.Run r = Cli.run("survey", "--help");
        assertEquals(0, r.exitCode());
        assertTrue(r.out().contains("Example:\n  rungtone survey door-chime.wav --bits-list 4..10"), r.out());
        Cli.Run top = Cli.run("--help");
        assertTrue(top.out().matches("(?s).*\\n  survey +Tabulate quality and flash cost.*"), top.out());
    }
}
