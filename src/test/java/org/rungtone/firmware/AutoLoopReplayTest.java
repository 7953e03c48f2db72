package org.rungtone.firmware;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.rungtone.analysis.LoopCrossfade;
import org.rungtone.analysis.LoopFinder;
import org.rungtone.analysis.SeamlessLoop;
import org.rungtone.ladder.LevelTable;
import org.rungtone.quantize.Codes;
import org.rungtone.quantize.Dither;
import org.rungtone.quantize.Quantizer;
import org.rungtone.source.Signal;
import org.rungtone.testing.SustainedSounds;

/**
 * The generic loop player, run on the host against a mock port ({@link MockPortRun}), with loop points found
 * by {@link LoopFinder} and the crossfade baked into the codes: the pins get the attack, the loop again and
 * again with the baked crossfade before every jump back, then, once released, the faded-back tail.
 */
class AutoLoopReplayTest {
    private static final double RATE = 8000;
    private static final int BITS = 8;

    @TempDir
    Path dir;

    /** Quantized without dither, so equal samples give equal codes. */
    private static Codes quantized(Signal s) {
        return new Quantizer(LevelTable.ideal(BITS, 5.0), Dither.NONE, 1).apply(s).codes();
    }

    @Test
    void thePlayerRepeatsTheFoundLoopWithItsBakedCrossfade() {
        // a 1 s organ tone at 8 kHz: 440 Hz, period 18.18 samples, 11 periods in 200 samples
        Signal organ = Signal.wrap(SustainedSounds.organ(440, RATE, 1, -70, 5), RATE);
        SeamlessLoop loop = LoopFinder.find(organ).orElseThrow();
        Codes plain = quantized(organ);
        Codes baked = quantized(LoopCrossfade.bake(organ, loop, organ.length()));
        int s = loop.start();
        int e = loop.end();
        int c = loop.crossfadeSamples();
        // the crossfade is in the codes: the last code of the loop is the code before the loop start
        assertEquals(plain.code(s - 1), baked.code(e - 1));
        int changed = 0;
        for (int i = e - c; i < e + c; i++) {
            changed += baked.code(i) != plain.code(i) ? 1 : 0;
        }
        assertTrue(changed > 0, "the crossfade changes codes around the loop end");
        for (int i = 0; i < e - c; i++) {
            assertEquals(plain.code(i), baked.code(i), "nothing before the crossfade changes");
        }

        int beforeRelease = e + 3 * loop.lengthSamples() + 100;
        FirmwareRequest r = FirmwareRequest.builder().name("mock").toolVersion("test").pins("PB0-PB7")
                .portWidth(8).storage(SampleStorage.PACKED).engine(PlaybackEngine.LOOP)
                .sound("organ", baked, s, e).build();
        List<Integer> got = MockPortRun.tickCodes(MockPortRun.run(r, dir, true, "0", "1",
                Integer.toString(beforeRelease)));

        List<Integer> want = new ArrayList<>();
        int pos = 0;
        boolean looping = true;
        while (pos < baked.length()) {
            want.add(baked.code(pos));
            pos++;
            if (want.size() == beforeRelease) {
                looping = false;
            }
            if (looping && pos == e) {
                pos = s;
            }
        }
        assertEquals(want, got);
        // every jump back plays the baked end, then the loop start: the pair the sound itself has at the start
        for (int pass = 1; pass <= 3; pass++) {
            int jump = e + (pass - 1) * loop.lengthSamples();
            assertEquals(List.of(plain.code(s - 1), plain.code(s)), got.subList(jump - 1, jump + 1));
        }
        // leaving the loop after release is the same pair: the tail starts with the loop start's continuation
        assertEquals(plain.code(s), baked.code(e));
    }
}
