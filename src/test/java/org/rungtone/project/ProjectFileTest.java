package org.rungtone.project;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.nio.file.Path;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import org.rungtone.internal.InputError;

class ProjectFileTest {
    static final Path FILE = Path.of("board.toml");
    static final String HEAD = "[project]\nname = \"board\"\n";
    static final String SOUND = "\n[[sound]]\nname = \"chime\"\nsource = \"chime.wav\"\n";

    @Test
    void readsEverySection() {
        Project p = ProjectFile.parse(HEAD + "seed = 7\n[target]\nfamily = \"avr\"\ncpu_clock = \"16MHz\"\n"
                + "pins = \"PD2-PD7\"\nflash_budget = \"28k\"\n[quantize]\nbits = 6\nrate = \"16k\"\n"
                + "dither = \"rpdf\"\n[preview]\nfilter = \"lp2:6k\"\n" + SOUND + "loop = \"0.1s:end\"\n"
                + "fade_in = \"5ms\"\n[[sound]]\nname = \"alarm\"\nsource = \"alarm.rung\"\n", FILE);
        assertEquals("board", p.name());
        assertEquals(7L, p.seed().orElseThrow());
        assertEquals(16e6, p.target().cpuClockHz().getAsDouble(), 0);
        assertEquals(28_000, p.target().flashBudgetBytes().getAsDouble(), 0);
        assertEquals(6L, p.quantize().bits().orElseThrow());
        assertEquals(16_000, p.quantize().rateHz().getAsDouble(), 0);
        assertEquals(6000, p.preview().filter().orElseThrow().cutoffHz(), 0);
        assertEquals(2, p.sounds().size());
        assertEquals(0.005, p.sounds().get(0).fadeInSeconds().getAsDouble(), 1e-12);
        assertEquals(0.1, p.sounds().get(0).loop().orElseThrow().start(), 1e-12);
        assertEquals(FILE.toAbsolutePath().getParent().resolve("alarm.rung"), p.sounds().get(1).source());
    }

    static Stream<Arguments> errors() {
        return Stream.of(
                Arguments.of("unknown key", HEAD + "sed = 1\n" + SOUND,
                        "board.toml:3: project.sed: unknown key; did you mean 'seed'? (known: name, out, c_out,"
                                + " seed, unit, compensation)"),
                Arguments.of("wrong type", HEAD + "[quantize]\nbits = \"six\"\n" + SOUND,
                        "board.toml:4: quantize.bits: expected a whole number, got the string \"six\""),
                Arguments.of("out of range", HEAD + "[quantize]\nbits = 20\n" + SOUND,
                        "board.toml:4: quantize.bits: must be 1..16, got 20"),
                Arguments.of("bad unit", HEAD + "[quantize]\nrate = \"16kV\"\n" + SOUND,
                        "board.toml:4: quantize.rate: '16kV' is not a frequency (e.g. 16kHz, 8000, 22.05k)"),
                Arguments.of("bad choice", HEAD + "[target]\nfamily = \"pic\"\n" + SOUND,
                        "board.toml:4: target.family: 'pic' is not one of generic, avr, cortexm, rp2040"),
                Arguments.of("unknown sound key", HEAD + SOUND + "rte = \"8k\"\n",
                        "board.toml:7: sound[1].rte: unknown key; did you mean 'rate'? (known: name, source, loop,"
                                + " rate, channel, gain, normalize, trim, fade_in, fade_out, keep_dc, resampler)"),
                Arguments.of("conflict", HEAD + SOUND + "gain = 3\nnormalize = -1\n",
                        "board.toml:7: sound[1].gain: conflicts with normalize (line 8); keep one"),
                Arguments.of("missing source", HEAD + "[[sound]]\nname = \"x\"\n",
                        "board.toml: sound[1].source: is required: a .wav file or .rung script, relative to the"
                                + " project file"),
                Arguments.of("no sounds", HEAD, "board.toml: the project has no sounds; add one or more"
                        + " [[sound]] tables with name and source"),
                Arguments.of("duplicate sound", HEAD + SOUND + "[[sound]]\nname = \"Chime\"\nsource = \"b.wav\"\n",
                        "board.toml:8: sound[2].name: 'Chime' gives the C name 'chime', which another sound"
                                + " already has"),
                Arguments.of("bad toml", HEAD + "seed = = 1\n", "board.toml:3:8: not valid TOML: Unexpected '=',"
                        + " expected ', \", ''', \"\"\", a number, a boolean, a date/time, an array, or a table"),
                Arguments.of("unknown table", HEAD + "[targte]\nfamily = \"avr\"\n" + SOUND,
                        "board.toml:3: targte: unknown key; did you mean 'target'? (known: project, target, ladder,"
                                + " quantize, preview, sound)"),
                Arguments.of("bad filter", HEAD + "[preview]\nfilter = \"lp3:5k\"\n" + SOUND,
                        "board.toml:4: preview.filter: 'lp3:5k' is not a filter; write none, rc:3.4k or"
                                + " lp2:3.4k[:0.707]"),
                Arguments.of("attr that is code", HEAD + "[target]\nflash_attr = \"PROGMEM; int x\"\n" + SOUND,
                        "board.toml:4: target.flash_attr: 'PROGMEM; int x' is not a C attribute: ';' at column 8"
                                + " is not allowed; write identifiers and __attribute__((...)), e.g. PROGMEM or"
                                + " __attribute__((section(\".rodata\")))"),
                Arguments.of("attr with player", HEAD + "[target]\npins = \"PB0-PB5\"\nflash_attr = \"PROGMEM\"\n"
                        + SOUND, "board.toml:5: target.flash_attr: applies only to bare sample arrays; a player's"
                        + " family places its tables in flash itself (remove flash_attr or family/pins)"));
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("errors")
    void everyErrorNamesFileLineAndKey(String what, String text, String message) {
        assertEquals(message, assertThrows(InputError.class, () -> ProjectFile.parse(text, FILE)).getMessage());
    }
}
