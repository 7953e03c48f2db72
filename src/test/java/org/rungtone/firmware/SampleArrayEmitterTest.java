package org.rungtone.firmware;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.rungtone.quantize.Codes;

class SampleArrayEmitterTest {
    @TempDir
    Path dir;

    @Test
    void emitsOneSoundsArrayThatCompiles() throws IOException {
        Codes codes = Codes.of(10, 8000, new int[] {0, 1023, 512, 17});
        List<Path> files = new SampleArrayEmitter(Templates.bundled()).emit(new SampleArrayEmitter.Request(
                "toy_beep", codes, "", "test", List.of("source: toy.wav")), dir);
        assertEquals(List.of(dir.resolve("toy_beep.h"), dir.resolve("toy_beep.c")), files);
        String h = Files.readString(files.get(0));
        assertTrue(h.contains("#define TOY_BEEP_LENGTH 4u"), h);
        assertTrue(h.contains("extern const uint16_t toy_beep_samples[TOY_BEEP_LENGTH];"), h);
        assertTrue(Files.readString(files.get(1)).contains("    0x000, 0x3FF, 0x200, 0x011\n"));
        CToolchain.require("gcc");
        CToolchain.compileClean(dir, CToolchain.cmd(List.of("gcc"), CToolchain.cmd(CToolchain.STRICT,
                List.of("-c", "toy_beep.c"))));
    }
}
