package org.rungtone.firmware;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.rungtone.ladder.LevelTable;
import org.rungtone.quantize.Codes;
import org.rungtone.quantize.Dither;
import org.rungtone.quantize.Quantizer;
import org.rungtone.source.Signal;
import org.rungtone.testing.CToolchain;

class SampleArrayEmitterTest {
    @TempDir
    Path dir;

    static Codes codes(int bits, int n) {
        double[] x = new double[n];
        for (int i = 0; i < n; i++) {
            x[i] = 0.9 * Math.sin(i * 0.05) + 0.05 * Math.sin(i * 1.7);
        }
        return new Quantizer(LevelTable.ideal(bits, 5), Dither.TPDF, 9).apply(Signal.wrap(x, 16_000)).codes();
    }

    @ParameterizedTest
    @ValueSource(ints = {1, 6, 8, 9, 12, 16})
    void emittedArrayCompilesStrictlyAndHoldsTheQuantizersCodes(int bits) throws Exception {
        Codes codes = codes(bits, 1234);
        List<Path> files = new SampleArrayEmitter(Templates.bundled()).emit(new SampleArrayEmitter.Request(
                "door_chime", codes, "", "test", List.of("bits: " + bits, "note: has */ inside")), dir);
        assertEquals(List.of(dir.resolve("door_chime.h"), dir.resolve("door_chime.c")), files);
        Files.writeString(dir.resolve("main.c"), String.join("\n",
                "#include <stdio.h>",
                "#include \"door_chime.h\"",
                "int main(void) {",
                "    unsigned long i;",
                "    printf(\"%lu %lu %lu\\n\", (unsigned long) DOOR_CHIME_LENGTH,"
                        + " (unsigned long) DOOR_CHIME_SAMPLE_RATE_HZ, (unsigned long) DOOR_CHIME_BITS);",
                "    for (i = 0; i < DOOR_CHIME_LENGTH; i++) {",
                "        printf(\"%u\\n\", (unsigned) door_chime_samples[i]);",
                "    }",
                "    return 0;",
                "}", ""));
        CToolchain.require("gcc");
        CToolchain.Result cc = CToolchain.exec(dir, CToolchain.cmd(List.of("gcc"), CToolchain.cmd(CToolchain.STRICT,
                List.of("-O1", "-o", "dump", "main.c", "door_chime.c"))));
        assertEquals(0, cc.exitCode(), cc.output());
        assertEquals("", cc.output());
        CToolchain.Result run = CToolchain.exec(dir, List.of("./dump"));
        String[] lines = run.output().split("\n");
        assertEquals("1234 16000 " + bits, lines[0]);
        assertEquals(1235, lines.length);
        for (int i = 0; i < codes.length(); i++) {
            assertEquals(codes.code(i), Integer.parseInt(lines[i + 1]), "sample " + i);
        }
    }

    @Test
    void writesSixteenValuesALineInFixedWidthHex() throws Exception {
        Codes codes = Codes.of(6, 8000, new int[] {0, 1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12, 13, 14, 15, 63, 32});
        new SampleArrayEmitter(Templates.bundled()).emit(new SampleArrayEmitter.Request("t", codes, "PROGMEM",
                "test", List.of()), dir);
        String c = Files.readString(dir.resolve("t.c"));
        assertTrue(c.contains("const uint8_t t_samples[T_LENGTH] T_FLASH = {\n"
                + "    0x00, 0x01, 0x02, 0x03, 0x04, 0x05, 0x06, 0x07, 0x08, 0x09, 0x0A, 0x0B, 0x0C, 0x0D, 0x0E,"
                + " 0x0F,\n    0x3F, 0x20\n};\n"), c);
        String h = Files.readString(dir.resolve("t.h"));
        assertTrue(h.contains("#define T_FLASH PROGMEM\n"), h);
        assertTrue(h.contains("Licence of this file: MIT."), h);
    }

    @Test
    void emitsTenBitCodesAsUint16InThreeHexDigits() throws Exception {
        Codes codes = Codes.of(10, 8000, new int[] {0, 1023, 512, 17});
        List<Path> files = new SampleArrayEmitter(Templates.bundled()).emit(new SampleArrayEmitter.Request(
                "toy_beep", codes, "", "test", List.of("source: toy.wav")), dir);
        String h = Files.readString(files.get(0));
        assertTrue(h.contains("#define TOY_BEEP_LENGTH 4u"), h);
        assertTrue(h.contains("extern const uint16_t toy_beep_samples[TOY_BEEP_LENGTH];"), h);
        assertTrue(Files.readString(files.get(1)).contains("    0x000, 0x3FF, 0x200, 0x011\n"));
    }
}
