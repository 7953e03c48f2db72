package org.rungtone.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import java.util.stream.Stream;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;
import org.rungtone.testing.Cli;
import org.rungtone.testing.SustainedSounds;
import org.rungtone.testing.WavFixtures;
import org.rungtone.testing.WavFixtures.Layout;

/**
 * The bad-input catalogue (documented for users in docs/troubleshooting.md): every command given broken
 * files, impossible settings and unusable output paths. Each case must end with exit code 1 and exactly one
 * line on stderr, {@code rungtone: error: MESSAGE}, holding the expected wording; picocli usage errors end
 * with exit code 2, the same first line and a line pointing at {@code --help}. No case may print a stack
 * trace or leave any file or folder behind: the case folder holds the same files, byte for byte, afterwards.
 */
class BadInputCatalogueTest {
    private static final String PREFIX = "rungtone: error: ";

    @TempDir
    Path dir;

    /** Writes the case's inputs into a folder and returns the command line, which uses {@code out}. */
    interface Setup {
        List<String> args(Path dir) throws IOException;
    }

    /**
     * One catalogue entry.
     *
     * @param name what is wrong, for the test report
     * @param exitCode 1 for bad input, 2 for a picocli usage error
     * @param message a part of the one-line message that says what is wrong
     * @param setup writes the inputs and gives the arguments
     */
    record Case(String name, int exitCode, String message, Setup setup) {
        @Override
        public String toString() {
            return name;
        }
    }

    private static Case bad(String name, String message, Setup setup) {
        return new Case(name, 1, message, setup);
    }

    private static Case usage(String name, String message, Setup setup) {
        return new Case(name, 2, message, setup);
    }

    static Stream<Case> catalogue() {
        List<Case> c = new ArrayList<>();
        wavCases(c);
        scriptCases(c);
        ladderCases(c);
        pinAndTargetCases(c);
        outputCases(c);
        projectCases(c);
        optionCases(c);
        CalibrationCatalogue.add(c);
        return c.stream();
    }

    private static void wavCases(List<Case> c) {
        c.add(bad("build: WAV header cut off inside the fmt chunk", "is truncated or too short",
                d -> build(d, write(d, "cut.wav", head(tone(), 30)))));
        c.add(bad("build: zero-byte WAV file", "is too short to be a WAV file (0 bytes",
                d -> build(d, write(d, "zero.wav", new byte[0]))));
        c.add(bad("build: text renamed to .wav", "is not a WAV file (no RIFF header at byte 0)",
                d -> build(d, write(d, "notes.wav", "shopping list".getBytes(StandardCharsets.UTF_8)))));
        c.add(bad("build: RIFF file of another form", "is a RIFF file but not WAVE",
                d -> build(d, write(d, "movie.wav", riffOtherForm()))));
        c.add(bad("build: header lies about block align", "block align is 3 but 1 channel(s) of 16 bits need 2",
                d -> build(d, write(d, "align.wav", wav16().blockAlign(3).bytes()))));
        c.add(bad("build: data chunk before the fmt chunk", "comes before any fmt chunk",
                d -> build(d, write(d, "order.wav", wav16().dataBeforeFmt().bytes()))));
        c.add(bad("build: header claims 0 channels", "says it has 0 channels",
                d -> build(d, write(d, "nochan.wav", wav16().channels(0).blockAlign(2).bytes()))));
        c.add(bad("build: header claims 200 channels", "has 200 channels; Rungtone reads 1..8",
                d -> build(d, write(d, "many.wav", wav16().channels(200).blockAlign(400).bytes()))));
        c.add(bad("build: sample rate 0 Hz", "has an unusable sample rate of 0 Hz",
                d -> build(d, write(d, "rate0.wav", wav16().rate(0).bytes()))));
        c.add(bad("survey: absurd sample rate 4 GHz", "has an unusable sample rate of 4000000000 Hz",
                d -> survey(d, write(d, "rate4g.wav", wav16().rate(4_000_000_000L).bytes()))));
        c.add(bad("build: 7-bit PCM", "PCM with 7 bits per sample is not supported",
                d -> build(d, write(d, "seven.wav", wav16().tag(1).bytes7()))));
        c.add(bad("build: IMA ADPCM encoded WAV", "uses format tag 0x0011 (IMA ADPCM)",
                d -> build(d, write(d, "adpcm.wav", wav16().tag(0x11).bytes()))));
        c.add(bad("build: 16-bit A-law WAV", "A-law with 16 bits per sample is not supported (8)",
                d -> build(d, write(d, "alaw16.wav", wav16().tag(6).bytes()))));
        c.add(bad("build: data chunk of 0 bytes", "has no audio samples (empty data chunk)",
                d -> build(d, write(d, "empty.wav", WavFixtures.wav().layout(Layout.S16, 1, 8000, new double[0])
                        .bytes()))));
        c.add(bad("build: NaN float sample", "sample 2 of channel 1 (at 0.000 s) is NaN",
                d -> build(d, write(d, "nan.wav", floats(0.1, 0.2, Double.NaN, 0.3)))));
        c.add(bad("survey: infinite float sample", "sample 1 of channel 1 (at 0.000 s) is infinite",
                d -> survey(d, write(d, "inf.wav", floats(0.1, Double.POSITIVE_INFINITY, 0.2)))));
        c.add(bad("build: float64 stereo samples near the largest double", "sample 1 of channel 1 (at 0.000 s) is "
                + "-1.70e+308, far beyond full scale (1.0)", d -> build(d, write(d, "huge.wav", WavFixtures.wav()
                        .layout(Layout.F64, 2, 8000, new double[] {0.5, 0.5, -1.7e308, -1.7e308, 1.7e308, 1.7e308})
                        .bytes()))));
        c.add(bad("build: source file does not exist", "missing.wav: no such file",
                d -> build(d, d.resolve("missing.wav"))));
        c.add(bad("build: source is a folder", "is a folder, not a WAV file",
                d -> build(d, Files.createDirectory(d.resolve("sounds.wav")))));
    }

    private static void scriptCases(List<Case> c) {
        c.add(bad("build: script syntax error", "syntax.rung:2:15: unexpected end of file",
                d -> build(d, script(d, "syntax.rung", "duration 1s\nout sine(440Hz\n"))));
        c.add(bad("build: script calls an unknown function", "unknown.rung:2:5: unknown function 'sinus'; did "
                + "you mean 'sin'?", d -> build(d, script(d, "unknown.rung", "duration 1s\nout sinus(440Hz)\n"))));
        c.add(bad("build: script passes too many arguments", "'sine' takes 1 or 2 arguments but got 3",
                d -> build(d, script(d, "args.rung", "duration 1s\nout sine(440Hz, 0, 1)\n"))));
        c.add(bad("build: script evaluates to NaN", "nan.rung:2:5: 'log' produced NaN (not a number) at t = 0s",
                d -> build(d, script(d, "nan.rung", "duration 1s\nout log(t - 1)\n"))));
        c.add(bad("survey: script divides by zero", "'/' produced infinity at t = 0s",
                d -> survey(d, script(d, "div.rung", "duration 1s\nout 1 / (t - t)\n"))));
        c.add(bad("build: script error on a line with terminal escapes", "esc.rung:2:7: unexpected character"
                + " '\\u001B'", d -> build(d, script(d, "esc.rung", "duration 1s\nout 1 \u001b[2J\u001b[31m\n"))));
        c.add(bad("build: script nested 100,000 parentheses deep", "deep.rung:2:", d -> build(d, script(d,
                "deep.rung", "duration 1s\nout " + "(".repeat(100_000) + "t" + ")".repeat(100_000) + "\n"))));
        c.add(bad("build: script whose named values chain 3,000 deep", "lets.rung:2874:19: the expression is nested"
                + " more than 256 levels deep here", d -> build(d, script(d, "lets.rung", letChain(3000)))));
        c.add(bad("build: script is not UTF-8", "is not UTF-8 text",
                d -> build(d, write(d, "latin.rung", new byte[] {'o', 'u', 't', ' ', (byte) 0xB5, '\n'}))));
    }

    private static void ladderCases(List<Case> c) {
        c.add(bad("build: zero-ohm ladder resistor", "--resistors: bit 1 needs a positive, finite resistance, "
                + "got 0", d -> build(d, wavFile(d), "--topology", "weighted", "--resistors", "80k,0,20k")));
        c.add(bad("ladder: negative resistor", "--resistors: bit 0 needs a positive, finite resistance, got -10k",
                d -> ladder(d, "--topology", "custom", "--resistors=-10k,20k")));
        c.add(bad("ladder: 20 bits", "--bits: bit depth must be 1..16, got 20", d -> ladder(d, "--bits", "20")));
        c.add(bad("build: 0 bits", "--bits: bit depth must be 1..16, got 0", d -> build(d, wavFile(d), "--bits",
                "0")));
        c.add(bad("build: per-bit list shorter than the bits", "--resistors: expected 4 values for 4 bits, got 3",
                d -> build(d, wavFile(d), "--topology", "custom", "--bits", "4", "--resistors", "10k,20k,40k")));
        c.add(bad("ladder: buffer swing with no span", "--out-max: 2V must be above out_min (2V)",
                d -> ladder(d, "--out-min", "2V", "--out-max", "2V")));
        c.add(bad("ladder: logic high equal to logic low", "--logic-high: must be above logic_low (0V), got 0V",
                d -> ladder(d, "--logic-high", "0V")));
        c.add(bad("ladder: tolerance of 150 %", "--tolerance: must be 0% to 50%, got 150%",
                d -> ladder(d, "--tolerance", "150%")));
        c.add(bad("ladder: ladder file with a zero base resistor", "board.toml:3: ladder.base_r: must be a "
                + "positive, finite resistance, got 0", d -> ladder(d, "--ladder", text(d, "board.toml",
                        "[ladder]\ntopology = \"r2r\"\nbase_r = \"0\"\n").toString())));
        c.add(bad("ladder: r2r base resistor of 1e300 ohms", "--base-r: must be 0.1 ohm to 1e12 ohm, got 1e+300",
                d -> ladder(d, "--topology", "r2r", "--base-r", "1e300")));
        c.add(bad("ladder: load of 1e-300 ohms", "--load: must be 0.1 ohm to 1e12 ohm, or inf for none, got 1e-300",
                d -> ladder(d, "--load", "1e-300")));
        c.add(bad("ladder: 0 bits", "--bits: bit depth must be 1..16, got 0", d -> ladder(d, "--bits", "0")));
        c.add(bad("calibrate plan: 0 bits", "--bits: bit depth must be 1..16, got 0",
                d -> List.of("calibrate", "plan", "--bits", "0", "--out", d.resolve("out").toString())));
        c.add(bad("calibrate simulate: 0 bits", "--bits: bit depth must be 1..16, got 0",
                d -> List.of("calibrate", "simulate", "--bits", "0", "--out", d.resolve("out").toString())));
        c.add(bad("calibrate fit: 0 bits", "--bits: bit depth must be 1..16, got 0",
                d -> List.of("calibrate", "fit", text(d, "readings.csv", "code,volts\n0,0\n1,1\n").toString(),
                        "--bits", "0", "--out", d.resolve("out").toString())));
        c.add(bad("calibrate fit: every reading the same", "flat.csv: the readings give no usable profile: every"
                + " code has the same level, 2.5V", d -> List.of("calibrate", "fit", text(d, "flat.csv",
                        "code,binary,measured\n0,00,2.5\n1,01,2.5\n2,10,2.5\n3,11,2.5\n").toString(), "--out",
                        d.resolve("out").toString())));
        c.add(bad("build: flat unit profile", "flat.unit.toml:9: levels.volts: every code has the same level, 2.5V",
                d -> build(d, wavFile(d), "--unit", profile(d, "flat.unit.toml", "2.5, 2.5, 2.5, 2.5").toString())));
        c.add(bad("ladder: negated unit profile", "swapped.unit.toml:9: levels.volts: code 3 is 3.75V below code 0"
                + " (0V), but the levels must rise", d -> ladder(d, "--unit", profile(d, "swapped.unit.toml",
                        "0, -1.25, -2.5, -3.75").toString())));
        c.add(bad("ladder: unit profile beyond any voltage", "huge.unit.toml:9: levels.volts: the level of code 1,"
                + " -1.00e+308 V, is not a plausible board level", d -> ladder(d, "--unit", profile(d,
                        "huge.unit.toml", "0, -1e308, 1e308, 3").toString())));
        c.add(bad("ladder: ladder file that is not text", "is not UTF-8 text",
                d -> ladder(d, "--ladder", write(d, "board.toml", new byte[] {(byte) 0xFF, (byte) 0xFE, 0, 1})
                        .toString())));
    }

    private static void pinAndTargetCases(List<Case> c) {
        c.add(bad("build: the same pin twice", "pin PB0 at column 5 is already bit 0; each pin may appear once",
                d -> build(d, wavFile(d), "--target", "avr", "--cpu-clock", "16MHz", "--bits", "6", "--pins",
                        "PB0,PB0,PB1,PB2,PB3,PB4")));
        c.add(bad("build: pin beyond the port width", "pin PB9 at column 5 is beyond the 8-bit port (pins 0-7)",
                d -> build(d, wavFile(d), "--target", "generic", "--bits", "10", "--port-width", "8",
                        "--pins", "PB0-PB9")));
        c.add(bad("build: a port letter without its P", "--pins 'D2-D7': write port pins the way the datasheet"
                + " names them: PD2-PD7", d -> build(d, wavFile(d), "--target", "avr", "--cpu-clock", "16MHz",
                        "--bits", "6", "--pins", "D2-D7")));
        c.add(bad("build: fewer pins than bits", "--pins PB0-PB3 lists 4 pins but the codes have 6 bits",
                d -> build(d, wavFile(d), "--target", "avr", "--cpu-clock", "16MHz", "--bits", "6", "--pins",
                        "PB0-PB3")));
        c.add(bad("build: unknown target family", "--target 'pic' is unknown; known target families: generic, "
                + "avr, cortexm, rp2040", d -> build(d, wavFile(d), "--target", "pic")));
        c.add(bad("build: rate the timer cannot reach", "--rate 16 kHz is too fast for timer1",
                d -> build(d, wavFile(d), "--target", "avr", "--pins", "PB0-PB5", "--bits", "6", "--cpu-clock",
                        "1kHz", "--rate", "16k")));
        // 5 s at 16 kHz, 8 bits: 80,000 bytes of samples, past the 64 KiB pgm_read_byte reaches on an AVR
        c.add(bad("build: AVR tables beyond 64 KiB", "the tables need 80,008 bytes, more than the 65,536 bytes"
                + " that pgm_read_byte can reach; use --storage packed, a lower --rate, fewer --bits or a shorter"
                + " sound", d -> build(d, write(d, "siren.wav", WavFixtures.sine16(16_000, 5.0, 440, 0.5)),
                        "--target", "avr", "--cpu-clock", "16MHz", "--bits", "8", "--rate", "16k", "--pins",
                        "PD0-PD7")));
        c.add(bad("build: AVR tables beyond 64 KiB, already packed", "more than the 65,536 bytes that"
                + " pgm_read_byte can reach; use a lower --rate, fewer --bits or a shorter sound",
                d -> build(d, write(d, "siren.wav", WavFixtures.sine16(16_000, 5.0, 440, 0.5)), "--target", "avr",
                        "--cpu-clock", "16MHz", "--bits", "8", "--rate", "16k", "--pins", "PD0-PD7", "--storage",
                        "packed")));
        c.add(bad("build: DDS option without the dds engine", "--dds-frequency and --dds-phase-bits set up the"
                + " dds engine; add --engine dds", d -> build(d, wavFile(d), "--dds-frequency", "440")));
        c.add(bad("build: --flash-attr that ends the declaration", "--flash-attr 'PROGMEM; int evil = 1; /*' is not"
                + " a C attribute: ';' at column 8 is not allowed", d -> build(d, wavFile(d), "--flash-attr",
                        "PROGMEM; int evil = 1; /*")));
        c.add(bad("build: --flash-attr with a line break", "--flash-attr 'PROGMEM\\n#define x' is not a C"
                + " attribute: '\\n' at column 8", d -> build(d, wavFile(d), "--flash-attr", "PROGMEM\n#define x")));
        c.add(bad("build: --flash-attr with an unclosed group", "the '(' at column 15 is never closed",
                d -> build(d, wavFile(d), "--flash-attr", "__attribute__((section(\".x\")")));
        c.add(bad("project: flash_attr with a brace", "p.toml:6: target.flash_attr: '} x' is not a C attribute",
                d -> project(d, "[project]\nname = \"bench\"\nout = \"out\"\n\n[target]\nflash_attr = \"} x\"\n"
                        + "\n[[sound]]\nname = \"tone\"\nsource = \"tone.wav\"\n")));
        c.add(bad("build: samples over the flash budget", "1,590 bytes over the 10-byte flash budget"
                + " (--flash-budget); no smaller bit depth or rate fits either",
                d -> build(d, wavFile(d), "--flash-budget", "10")));
        treadCases(c);
    }

    private static void treadCases(List<Case> c) {
        c.add(bad("build: Tread on a sound shorter than its block", "--storage tread3 needs at least one block of"
                + " 8 samples; the sound has 5; use a longer sound, or --storage packed",
                d -> build(d, write(d, "blip.wav", WavFixtures.sine16(16_000, 5 / 16_000.0, 440, 0.5)), "--target",
                        "generic", "--pins", "PB0-PB5", "--bits", "6", "--rate", "16k", "--storage", "tread3")));
        c.add(bad("build: Tread to a ladder above its 12 bits", "--bits 14 is above the 12-bit limit of tread3"
                + " storage; use at most 12 bits, or --storage packed", d -> build(d, wavFile(d), "--target",
                        "generic", "--pins", "PB0-PB7,PC0-PC5", "--bits", "14", "--storage", "tread3")));
        c.add(bad("build: Tread to a ladder no wider than its codes", "--bits 4 is too few for tread4 storage,"
                + " which stores 4 bits per sample itself; use at least 5 bits, or --storage packed",
                d -> build(d, wavFile(d), "--target", "generic", "--pins", "PB0-PB3", "--bits", "4", "--storage",
                        "tread4")));
        c.add(bad("build: Tread for the dds engine", "the dds engine reads its wavetable at any phase, but a Tread"
                + " stream (--storage tread2) decodes only forwards; use --storage unpacked or packed",
                d -> build(d, script(d, "organ.rung", "wavetable 256 samples\nout sine(1Hz)\n"), "--target",
                        "generic", "--pins", "PB0-PB5", "--bits", "6", "--engine", "dds", "--storage", "tread2")));
        c.add(bad("project: Tread above its ladder limit", "p.toml:10: quantize.bits: 13 is above the 12-bit limit of"
                + " tread2 storage; use at most 12 bits, or target.storage packed", d -> project(d,
                        "[project]\nname = \"bench\"\nout = \"out\"\n\n[target]\npins = \"PB0-PB7,PC0-PC4\"\n"
                        + "storage = \"tread2\"\n\n[quantize]\nbits = 13\n\n"
                        + "[[sound]]\nname = \"tone\"\nsource = \"tone.wav\"\n")));
    }

    private static void outputCases(List<Case> c) {
        c.add(bad("build: failed rebuild keeps the previous outputs", "over the 10-byte flash budget",
                d -> {
                    Files.createDirectories(d.resolve("out"));
                    text(d, "out/tone.c", "/* from the last good build */\n");
                    text(d, "out/report.txt", "last good report\n");
                    return build(d, wavFile(d), "--flash-budget", "10");
                }));
        c.add(bad("build: --out below a regular file", "output folder cannot be created",
                d -> List.of("build", wavFile(d).toString(), "--out", text(d, "notes.txt", "x").resolve("out")
                        .toString())));
        c.add(bad("survey: --out is a regular file", "output folder cannot be created",
                d -> List.of("survey", wavFile(d).toString(), "--out", text(d, "out", "x").toString())));
        c.add(bad("ladder: --out below a regular file", "output folder cannot be created",
                d -> List.of("ladder", "--out", text(d, "notes.txt", "x").resolve("ladder").toString())));
        c.add(bad("demo: --out is a regular file", "output folder cannot be created",
                d -> List.of("demo", "--out", text(d, "demo", "x").toString())));
        c.add(bad("init: file already exists", "already exists; use --force to overwrite it",
                d -> List.of("init", text(d, "board.toml", "# mine\n").toString())));
        c.add(bad("init: folder of the file is a regular file", "cannot be written",
                d -> List.of("init", text(d, "notes.txt", "x").resolve("board.toml").toString())));
    }

    private static void projectCases(List<Case> c) {
        String head = "[project]\nname = \"bench\"\nout = \"out\"\n";
        String sound = "\n[[sound]]\nname = \"tone\"\nsource = \"tone.wav\"\n";
        c.add(bad("project: file is not UTF-8 text", "p.toml: is not UTF-8 text",
                d -> {
                    wavFile(d);
                    return List.of("build", write(d, "p.toml", new byte[] {'#', ' ', (byte) 0xB5, '\n'})
                            .toString());
                }));
        c.add(bad("project: invalid TOML", "p.toml:1:9: not valid TOML",
                d -> project(d, "[project\nname = \"x\"\n")));
        c.add(bad("project: unknown key", "p.toml:8: sound[1].colour: unknown key",
                d -> project(d, head + sound + "colour = \"red\"\n")));
        c.add(bad("project: wrong type", "p.toml:4: project.seed: expected a whole number, got the string \"one\"",
                d -> project(d, head + "seed = \"one\"\n" + sound)));
        c.add(bad("project: gain and normalize together", "sound[1].gain: conflicts with normalize (line 9)",
                d -> project(d, head + sound + "gain = 3\nnormalize = -1\n")));
        c.add(bad("project: flash_attr with a target family", "target.flash_attr: applies only to bare sample "
                + "arrays", d -> project(d, head + "\n[target]\nfamily = \"avr\"\npins = \"PD2-PD7\"\n"
                        + "flash_attr = \"PROGMEM\"\n" + sound)));
        c.add(bad("project: a preview option on the command line", "--filter does not apply to a project file;"
                + " set filter in the project's [preview] table", d -> withArgs(project(d, head + sound),
                        "--filter", "rc:3k")));
        c.add(bad("project: --full-scale on the command line", "--full-scale does not apply to a project file",
                d -> withArgs(project(d, head + sound), "--full-scale", "3.3V")));
        c.add(bad("project: two sounds with one C name", "sound[2].name: 'tone' gives the C name 'tone', which "
                + "another sound already has", d -> project(d, head + sound + sound)));
        c.add(bad("project: no sounds", "p.toml: the project has no sounds", d -> project(d, head)));
        c.add(bad("project: impossible ladder", "p.toml:6: ladder.bits: bit depth must be 1..16, got 40",
                d -> project(d, head + "\n[ladder]\nbits = 40\n" + sound)));
        c.add(bad("project: sound name too long for a C symbol", "p.toml:6: sound[1].name: the name '"
                + "x".repeat(50) + "' is too long for a C symbol prefix", d -> project(d, head
                        + "\n[[sound]]\nname = \"" + "x".repeat(50) + "\"\nsource = \"tone.wav\"\n")));
        c.add(bad("project: long name with an escaped line break", "sound[1].name: the name '" + "y".repeat(20)
                + "\\r" + "y".repeat(25) + "' is too long", d -> project(d, head + "\n[[sound]]\nname = \""
                        + "y".repeat(20) + "\\r" + "y".repeat(25) + "\"\nsource = \"tone.wav\"\n")));
        c.add(bad("project: broken escape in a table name", "p.toml:1:7: not valid TOML: Invalid escape sequence",
                d -> project(d, "[ = \"u\\E]\"]\n")));
        c.add(bad("project: arrays nested thousands deep", "p.toml: arrays or tables are nested too deeply",
                d -> project(d, head + "a = " + "[".repeat(5000) + "]".repeat(5000) + "\n" + sound)));
        c.add(bad("project: quoted ladder key that is no name", "p.toml:6: ladder.bits ~: unknown key",
                d -> project(d, head + "\n[ladder]\n'bits ~' = 4\n" + sound)));
        c.add(bad("project: sound file missing", "tone.wav: no such file",
                d -> List.of("build", text(d, "p.toml", head + sound).toString())));
        c.add(bad("project: out below a regular file", "output folder cannot be created",
                d -> project(d, "[project]\nname = \"bench\"\nout = \"notes.txt/out\"\n" + sound, "notes.txt")));
        c.add(bad("project: out is a regular file", "notes.txt is a file; choose another output folder"
                + " (project.out)", d -> project(d, "[project]\nname = \"bench\"\nout = \"notes.txt\"\n" + sound,
                        "notes.txt")));
        c.add(bad("project: samples over the flash budget", "p.toml:6: target.flash_budget: the samples need"
                + " 1,600 bytes, 1,590 bytes over the 10-byte flash budget (target.flash_budget)",
                d -> project(d, head + "\n[target]\nflash_budget = 10\n" + sound)));
        c.add(bad("project: 0 bits", "p.toml:6: quantize.bits: must be 1..16, got 0",
                d -> project(d, head + "\n[quantize]\nbits = 0\n" + sound)));
        c.add(bad("project: [quantize] rate = nan", "p.toml:6: quantize.rate: must be 1 Hz..384 kHz: NaN",
                d -> project(d, head + "\n[quantize]\nrate = nan\n" + sound)));
        c.add(bad("project: [quantize] rate = \"-16k\"", "p.toml:6: quantize.rate: must be 1 Hz..384 kHz: -16000.0",
                d -> project(d, head + "\n[quantize]\nrate = \"-16k\"\n" + sound)));
        c.add(bad("project: a sound's rate = inf", "p.toml:8: sound[1].rate: must be 1 Hz..384 kHz: Infinity",
                d -> project(d, head + sound + "rate = inf\n")));
        c.add(bad("project: a sound's fade-in longer than the sound", "p.toml:8: sound[1].fade_in: 10s is longer"
                + " than the sound (100ms); make it at most 100ms", d -> project(d, head + sound
                        + "fade_in = \"10s\"\n")));
        c.add(bad("project: a sound's gain = nan", "p.toml:8: sound[1].gain: must be within ±120 dB: NaN",
                d -> project(d, head + sound + "gain = nan\n")));
        c.add(bad("project: --bits 0 on the command line", "--bits: bit depth must be 1..16, got 0",
                d -> {
                    List<String> a = new ArrayList<>(project(d, head + sound));
                    a.addAll(List.of("--bits", "0"));
                    return a;
                }));
    }

    private static void optionCases(List<Case> c) {
        c.add(bad("build: --rate 0", "--rate must be 1 Hz..384 kHz", d -> build(d, wavFile(d), "--rate", "0")));
        c.add(bad("build: --fade-in longer than the sound", "--fade-in 10s is longer than the sound (1.6s); make it"
                + " at most 1.6s", d -> build(d, longTone(d), "--fade-in", "10s")));
        c.add(bad("build: --fade-out longer than the sound", "--fade-out 10s is longer than the sound (1.6s)",
                d -> build(d, longTone(d), "--fade-out", "10s")));
        c.add(bad("build: fades that together overlap", "--fade-in 1s and --fade-out 1s together are longer than the"
                + " sound (1.6s) and would overlap", d -> build(d, longTone(d), "--fade-in", "1s", "--fade-out",
                        "1s")));
        c.add(bad("survey: --fade-in longer than the sound", "--fade-in 10s is longer than the sound (1.6s)",
                d -> survey(d, longTone(d), "--fade-in", "10s")));
        c.add(bad("build: --gain of 200 dB", "--gain must be within ±120 dB: 200.0",
                d -> build(d, wavFile(d), "--gain", "200")));
        c.add(bad("build: loop start past the sound's end", "--loop start 5s is at or past the sound's end (1.6s,"
                + " 25600 samples); the loop must start inside the sound", d -> build(d, longTone(d), "--target",
                        "avr", "--cpu-clock", "16MHz", "--bits", "6", "--pins", "PD2-PD7", "--engine", "loop",
                        "--loop", "5s:end")));
        c.add(bad("build: --loop auto on white noise", "noise.wav: no repeating section found; give --loop"
                + " START:END", d -> build(d, noise(d), "--target", "avr", "--cpu-clock", "16MHz", "--bits", "6",
                        "--pins", "PD2-PD7", "--loop", "auto")));
        c.add(bad("build: --loop auto on a tone that dies away", "bell.wav: no repeating section found; give"
                + " --loop START:END", d -> build(d, bell(d), "--loop", "auto")));
        c.add(bad("build: --loop auto on a wavetable", "cycle.rung: a wavetable is one cycle that the dds engine"
                + " repeats by itself; --loop auto finds loops in sustained sounds: leave it out",
                d -> build(d, script(d, "cycle.rung", "wavetable 256 samples\nout sine(1Hz)\n"), "--loop",
                        "auto")));
        c.add(bad("project: loop = \"auto\" on white noise", "noise.wav: no repeating section found; give loop"
                + " START:END", d -> {
                    noise(d);
                    return List.of("build", text(d, "p.toml", "[project]\nname = \"bench\"\nout = \"out\"\n\n"
                            + "[[sound]]\nname = \"fan\"\nsource = \"noise.wav\"\nloop = \"auto\"\n").toString());
                }));
        c.add(bad("survey: bit depth 0 in --bits-list", "--bits-list 0..20: bit depth must be 1..16: 0",
                d -> survey(d, wavFile(d), "--bits-list", "0..20")));
        c.add(bad("survey: two quality targets", "give one target, --target-sinad or --target-enob, not both",
                d -> survey(d, wavFile(d), "--target-sinad", "40", "--target-enob", "6")));
        c.add(bad("ladder: Monte Carlo of 0 boards", "--monte-carlo: need 1..2000000 boards, got 0",
                d -> ladder(d, "--monte-carlo", "0")));
        c.add(bad("ladder: Monte Carlo of a billion boards", "--monte-carlo: need 1..2000000 boards, got 1000000000",
                d -> ladder(d, "--monte-carlo", "1000000000")));
        c.add(usage("build: --bits is not a number (usage error)", "Invalid value for option '--bits'",
                d -> build(d, wavFile(d), "--bits", "six")));
        c.add(usage("build: no source given (usage error)", "Missing required parameter",
                d -> List.of("build", "--out", d.resolve("out").toString())));
        c.add(usage("survey: unknown dither (usage error)", "Invalid value for option '--dither'",
                d -> survey(d, wavFile(d), "--dither", "loud")));
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("catalogue")
    void failsWithOneClearLineAndLeavesNothingBehind(Case c) throws IOException {
        Path work = Files.createDirectory(dir.resolve("case"));
        List<String> args = c.setup().args(work);
        Map<String, String> before = snapshot(work);

        Cli.Run r = Cli.run(args.toArray(String[]::new));

        List<String> lines = r.err().lines().toList();
        assertEquals(c.exitCode(), r.exitCode(), r.err());
        assertFalse(lines.isEmpty(), "no message");
        assertTrue(lines.get(0).startsWith(PREFIX), r.err());
        assertTrue(lines.get(0).contains(c.message()), () -> "expected '" + c.message() + "' in " + r.err());
        if (c.exitCode() == 1 && lines.get(0).matches("rungtone: error: \\S+\\.rung:\\d+:\\d+: .*")) {
            // a script error shows its line and a caret under the column (issue 3), nothing more
            assertEquals(3, lines.size(), () -> "script error with excerpt:\n" + r.err());
            assertTrue(lines.get(2).trim().endsWith("^"), r.err());
            // the echoed script line is escaped like the message: a terminal shows it rather than obeying it
            assertTrue(lines.get(1).chars().noneMatch(ch -> ch < 0x20 && ch != '\t' || ch >= 0x7f && ch <= 0x9f),
                    r.err());
        } else if (c.exitCode() == 1) {
            assertEquals(1, lines.size(), () -> "more than one line:\n" + r.err());
        } else {
            assertTrue(lines.get(lines.size() - 1).matches("Try 'rungtone \\w+ --help' for the options\\."),
                    r.err());
        }
        assertFalse(r.err().contains("Exception") || r.out().contains("Exception"), r.err() + r.out());
        assertFalse(r.err().contains("\tat "), "stack trace");
        assertEquals("", r.out(), "nothing on stdout when failing");
        assertEquals(before, snapshot(work), "files were added, removed or changed");
    }

    /** Every path below {@code folder} with its size and a hash of its bytes ("dir" for folders). */
    private static Map<String, String> snapshot(Path folder) throws IOException {
        Map<String, String> m = new TreeMap<>();
        try (Stream<Path> s = Files.walk(folder)) {
            for (Path p : s.toList()) {
                String v = Files.isDirectory(p) ? "dir"
                        : Files.size(p) + ":" + java.util.Arrays.hashCode(Files.readAllBytes(p));
                m.put(folder.relativize(p).toString(), v);
            }
        }
        return m;
    }

    // ---- inputs ----

    private static List<String> build(Path d, Path source, String... more) {
        return command("build", d, source, more);
    }

    private static List<String> survey(Path d, Path source, String... more) {
        List<String> a = command("survey", d, source, more);
        if (!a.contains("--bits-list")) {
            a.addAll(List.of("--bits-list", "4,6", "--rates", "8k"));
        }
        return a;
    }

    private static List<String> command(String name, Path d, Path source, String... more) {
        List<String> a = new ArrayList<>(List.of(name, source.toString(), "--out", d.resolve("out").toString()));
        a.addAll(List.of(more));
        return a;
    }

    private static List<String> ladder(Path d, String... more) {
        List<String> a = new ArrayList<>(List.of("ladder", "--out", d.resolve("out").toString()));
        a.addAll(List.of(more));
        return a;
    }

    private static List<String> project(Path d, String toml, String... files) throws IOException {
        wavFile(d);
        for (String f : files) {
            text(d, f, "x");
        }
        return List.of("build", text(d, "p.toml", toml).toString());
    }

    private static List<String> withArgs(List<String> args, String... more) {
        List<String> all = new java.util.ArrayList<>(args);
        all.addAll(List.of(more));
        return all;
    }

    private static Path write(Path d, String name, byte[] bytes) throws IOException {
        return Files.write(d.resolve(name), bytes);
    }

    private static Path text(Path d, String name, String text) throws IOException {
        return Files.writeString(d.resolve(name), text);
    }

    /** A hand-made 2-bit unit profile whose four levels stand on line 9. */
    private static Path profile(Path d, String name, String levels) throws IOException {
        return text(d, name, "[unit]\nboard = \"b\"\ndate = \"2026-05-01\"\nbits = 2\n\n[levels]\nvolts = [\n"
                + "    # codes 0..3\n    " + levels + ",\n]\n");
    }

    /** A clip whose output is the last of {@code n} named values, each defined by the one before. */
    private static String letChain(int n) {
        StringBuilder b = new StringBuilder("duration 10ms\nlet a0 = t\n");
        for (int i = 1; i < n; i++) {
            b.append("let a").append(i).append(" = a").append(i - 1).append(" + 0.000001\n");
        }
        return b.append("out 0.001 * a").append(n - 1).append('\n').toString();
    }

    private static Path script(Path d, String name, String text) throws IOException {
        return text(d, name, text);
    }

    /** A short valid tone, tone.wav: 0.1 s at 16 kHz, 1,600 samples. */
    private static Path wavFile(Path d) throws IOException {
        return write(d, "tone.wav", tone());
    }

    /** A 1.6 s tone at 16 kHz, chirp.wav: 25,600 samples. */
    private static Path longTone(Path d) throws IOException {
        return write(d, "chirp.wav", WavFixtures.sine16(16_000, 1.6, 440, 0.5));
    }

    /** A second of white noise at 16 kHz, noise.wav: nothing in it repeats. */
    private static Path noise(Path d) throws IOException {
        return write(d, "noise.wav", WavFixtures.wav().layout(Layout.S16, 1, 16_000,
                SustainedSounds.noise(0.5, 16_000, 1, 7)).bytes());
    }

    /** A struck bell at 523 Hz dying away by 26 dB a second for 2 s, bell.wav: no stretch keeps its level. */
    private static Path bell(Path d) throws IOException {
        double[] x = new double[32_000];
        for (int i = 0; i < x.length; i++) {
            x[i] = 0.8 * Math.exp(-3.0 * i / 16_000) * Math.sin(2 * Math.PI * 523.3 * i / 16_000);
        }
        return write(d, "bell.wav", WavFixtures.wav().layout(Layout.S16, 1, 16_000, x).bytes());
    }

    private static byte[] tone() {
        return WavFixtures.sine16(16_000, 0.1, 440, 0.5);
    }

    private static byte[] head(byte[] b, int n) {
        return java.util.Arrays.copyOf(b, n);
    }

    private static Wav16 wav16() {
        return new Wav16();
    }

    /** A 16-bit mono fixture whose header fields can be made to lie. */
    private static final class Wav16 {
        private final WavFixtures.Builder b = WavFixtures.wav().layout(Layout.S16, 1, 8000, new double[] {0, 0.5,
            -0.5, 0.25});

        Wav16 blockAlign(int a) {
            b.blockAlign(a);
            return this;
        }

        Wav16 channels(int ch) {
            b.channels(ch);
            return this;
        }

        Wav16 rate(long r) {
            b.rate(r);
            return this;
        }

        Wav16 tag(int t) {
            b.tag(t);
            return this;
        }

        Wav16 dataBeforeFmt() {
            b.dataBeforeFmt();
            return this;
        }

        byte[] bytes() {
            return b.bytes();
        }

        /** The header says 7 bits per sample (block align 1). */
        byte[] bytes7() {
            byte[] w = b.bytes();
            w[32] = 1; // block align
            w[34] = 7; // bits per sample
            return w;
        }
    }

    private static byte[] riffOtherForm() {
        byte[] w = tone();
        w[8] = 'A';
        w[9] = 'V';
        w[10] = 'I';
        w[11] = ' ';
        return w;
    }

    private static byte[] floats(double... samples) {
        return WavFixtures.wav().layout(Layout.F32, 1, 8000, samples).bytes();
    }
}
