package org.rungtone.firmware;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.rungtone.internal.AtomicFiles;
import org.rungtone.quantize.Codes;
import org.rungtone.testing.CToolchain;

/**
 * The DDS tuning word of a frequency is the same whichever way it is made: the build's initial word
 * ({@code NAME_INITIAL_TUNING_WORD}), the emitted {@code NAME_set_frequency_millihz()} and
 * {@code NAME_set_frequency_hz()} run on the host, and the Java reference {@link Dds#tuningWord(double, double,
 * int)} at the tick rate the build reports, M = round(f · 2^n / f_s) (Analog Devices MT-085). Tick rates:
 * 22.05 and 48 kHz as given, and as timer1 of a 16 MHz AVR makes them: 16 MHz / 726 = 22038.567 Hz and
 * 16 MHz / 333 = 48048.048 Hz (+1001 ppm). Rounding those to the millihertz, as the setters once did, put
 * them 4 words (1 kHz at 22.05 kHz) away from the initial word.
 */
class DdsSetterTest {
    private static final double[] FREQUENCIES_HZ = {1, 440, 1000, 10_000};
    private static final int[] PHASE_BITS = {32, 24};

    @TempDir
    Path dir;

    /** One player: its symbol, start frequency, phase bits and the tick rate its build reports. */
    private record Player(String name, double hz, int phaseBits, double tickRateHz) {
    }

    @Test
    void initialWordSettersAndJavaAgree() {
        CToolchain.require("gcc");
        List<Player> players = new ArrayList<>();
        StringBuilder main = new StringBuilder("#include <stdio.h>\n");
        StringBuilder calls = new StringBuilder();
        List<String> sources = new ArrayList<>();
        for (double rate : new double[] {22_050, 48_000}) {
            for (boolean timer : new boolean[] {false, true}) {
                for (int n : PHASE_BITS) {
                    for (double f : FREQUENCIES_HZ) {
                        String name = String.format(Locale.ROOT, "d%02d", players.size());
                        FirmwareRequest.Builder b = FirmwareRequest.builder().name(name).toolVersion("test")
                                .pins("PB0-PB5").engine(PlaybackEngine.DDS)
                                .sound("sine", Codes.of(6, rate, Dds.sineTable(8, 6))).dds(new DdsSpec(n, f));
                        if (timer) {
                            // the generic player with the timer a 16 MHz AVR would use: its rate, not the request
                            b.cpuClockHz(16e6).timer(TimerKind.AVR_TIMER1).rateTolerancePpm(2000);
                        }
                        EmitResult r = FirmwareEmitter.emit(b.build(), dir);
                        double tick = r.timer().map(TimerSetting::achievedHz).orElse(rate);
                        players.add(new Player(name, f, n, tick));
                        main.append("#include \"").append(name).append(".h\"\n");
                        main.append(String.format(Locale.ROOT, "void %s_port_write(uint8_t p, %s_port_t v,"
                                + " %s_port_t m) { (void)p; (void)v; (void)m; }%n", name, name, name));
                        calls.append(String.format(Locale.ROOT, "    printf(\"%%lu %%lu %%lu\\n\", (unsigned long)"
                                + "%s_INITIAL_TUNING_WORD, (unsigned long)%s_set_frequency_millihz(%du),"
                                + " (unsigned long)%s_set_frequency_hz(%du));%n", name.toUpperCase(Locale.ROOT),
                                name, (int) (f * 1000), name, (int) f));
                        sources.add(name + ".c");
                        sources.add(name + "_data.c");
                    }
                }
            }
        }
        main.append("int main(void)\n{\n").append(calls).append("    return 0;\n}\n");
        AtomicFiles.writeString(dir.resolve("main.c"), main.toString());
        List<String> cc = CToolchain.cmd(List.of("gcc", "-O1", "-o", "words"), CToolchain.STRICT);
        cc.add("main.c");
        cc.addAll(sources);
        CToolchain.compileClean(dir, cc);
        String[] lines = CToolchain.run(dir, List.of("./words")).split("\n");
        assertEquals(players.size(), lines.length);
        for (int i = 0; i < players.size(); i++) {
            Player p = players.get(i);
            long java = Dds.tuningWord(p.hz(), p.tickRateHz(), p.phaseBits());
            String want = java + " " + java + " " + java;
            assertEquals(want, lines[i], p.toString());
        }
    }

    @Test
    void exactWordMatchesMt085() {
        // 16 MHz / 726 cycles: f_s = 22038.567493... Hz. 1 kHz: 1000 * 2^32 / f_s = 194,884,141.06; the tick
        // rate rounded to 22038.567 Hz gave 194,884,145.42, 4 words off.
        assertEquals(194_884_141L, Dds.tuningWord(1_000_000, 16_000_000, 726, 32));
        assertEquals(Dds.tuningWord(1000, 16e6 / 726, 32), Dds.tuningWord(1_000_000, 16_000_000, 726, 32));
        // 440 Hz: 85,749,022.06
        assertEquals(85_749_022L, Dds.tuningWord(440_000, 16_000_000, 726, 32));
        // 1 kHz at 8 kHz, n = 4: 2 exactly; 250 Hz: 0.5, a tie, rounds up to 1
        assertEquals(2L, Dds.tuningWord(1_000_000, 8000, 1, 4));
        assertEquals(1L, Dds.tuningWord(250_000, 8000, 1, 4));
        // at the tick rate the word wraps modulo 2^n: 2^16 is 0
        assertEquals(0L, Dds.tuningWord(8_000_000, 8000, 1, 16));
    }
}
