package org.rungtone.firmware;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Collections;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.CompletableFuture;
import java.util.concurrent.CompletionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.stream.Stream;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;
import org.rungtone.codec.TreadFormat;
import org.rungtone.codec.TreadState;
import org.rungtone.codec.TreadStream;
import org.rungtone.internal.AtomicFiles;
import org.rungtone.quantize.Codes;
import org.rungtone.testing.AvrSimulator;
import org.rungtone.testing.AvrTrace;
import org.rungtone.testing.AvrTrace.Interrupt;
import org.rungtone.testing.AvrTrace.Write;
import org.rungtone.testing.CToolchain;

/**
 * Runs emitted AVR players, built with avr-gcc for the ATmega328P at 16 MHz, in simavr and checks them at
 * the pins: the code the port writes put on the ladder at every tick is the sample array, pins outside the
 * map keep their levels, the interrupt comes every timer period the build reports, the pins change the
 * same number of cycles after every interrupt, and once the sound has ended the interrupt switches itself
 * off. Each build's interrupt length and glitch window (first to last port write of a tick) are measured,
 * checked against the figures the build report prints ({@link TickCost}) and printed as a table; the dds and
 * sweep engines are measured too.
 */
class AvrSimulatorTest {
    /** Levels main() gives the pins outside the map before the player starts; they must never change. */
    static final int PORT_PATTERN = 0xA5;
    static final int DDR_PATTERN = 0x5A;
    /** ATmega328P ports and the pins they have: PC7 does not exist (datasheet, "Pin Configurations"). */
    static final Map<String, Integer> PORT_PINS = new LinkedHashMap<>(Map.of("B", 0xFF, "C", 0x7F,
            "D", 0xFF));
    /** The idle loop is one RJMP (2 cycles): the interrupt waits for it at most one cycle. */
    private static final int ENTRY_JITTER_CYCLES = 1;
    private static final int CLIP_SAMPLES = 240;
    private static final int LOOP_SAMPLES = 200;
    private static final int LOOP_START = 40;
    private static final int LOOP_END = 160;
    private static final int LOOP_TICKS = 400;
    private static final int TICKS_AFTER_END = 12;
    /** Ticks main() waits before it releases a loop: in the second pass of the loop. */
    private static final int RELEASE_AFTER_TICKS = 250;
    /** Codes of the other sound of a {@link Variant#WIDE} build: more than 16-bit indices reach. */
    private static final int WIDE_OTHER_SAMPLES = 66_000;
    private static final int COST_ONLY_TICKS = 300;
    /** Twelve bits, one per pin, taking turns over ports D, B and C: four scatter terms per port. */
    private static final String SCATTERED_12 = "PD2,PB0,PC0,PD3,PB1,PC1,PD4,PB2,PC2,PD5,PB3,PC3";
    /**
     * main()'s release of a loop: after {@link #RELEASE_AFTER_TICKS} timer periods (each seen as TCNT1
     * passing half its period), a third into a period, far from any interrupt, between markers 4 and 5.
     */
    private static final String RELEASE = String.join("\n    ",
            "for (uint16_t n = 0u; n < " + RELEASE_AFTER_TICKS + "u; n++) {",
            "    while (TCNT1 < 500u) {", "    }", "    while (TCNT1 >= 500u) {", "    }", "}",
            "while (TCNT1 < 300u) {", "}", "GPIOR0 = 4u;", "player_release();", "GPIOR0 = 5u");

    private static final Map<String, String> TABLE = Collections.synchronizedMap(new LinkedHashMap<>());
    private static final Map<Build, CompletableFuture<Run>> RUNS = new HashMap<>();
    private static ExecutorService pool;

    @TempDir
    static Path root;

    /** What a build varies: nothing, its sounds' length, how main() plays it, the pin strategy, the sweep. */
    enum Variant {
        /** main() plays sound 1 (or loops it) and idles. */
        PLAIN,
        /** The pins are written by scatter terms even where a shift would do. */
        SCATTER,
        /** The other sound is long enough for 32-bit sample indices. */
        WIDE,
        /** main() loops sound 1 and releases it after some {@link #RELEASE_AFTER_TICKS} ticks. */
        RELEASED,
        /** A sweep for a sound card's recording (its longer branch: which hold comes next). */
        RECORDING
    }

    /** One AVR build: pins, storage, engine, sample rate, timer and how main() plays it. */
    record Build(String pins, SampleStorage storage, PlaybackEngine engine, int rateHz, TimerKind timer,
            Variant variant) {
        Build(String pins, SampleStorage storage, PlaybackEngine engine, int rateHz, TimerKind timer) {
            this(pins, storage, engine, rateHz, timer, Variant.PLAIN);
        }

        @Override
        public String toString() {
            return String.format(Locale.ROOT, "%-48s %-8s %-5s %5d Hz %s", pins
                    + (variant == Variant.PLAIN ? "" : " (" + variant.name().toLowerCase(Locale.ROOT) + ")"),
                    storage.optionName(), engine.optionName(), rateHz, timer.optionName());
        }

        boolean recording() {
            return variant == Variant.RECORDING;
        }

        boolean isClip() {
            return engine == PlaybackEngine.CLIP || engine == PlaybackEngine.LOOP;
        }
    }

    /**
     * A simulated build.
     *
     * @param result what the emitter reported
     * @param period CPU cycles per tick of the solved timer
     * @param played the codes of the sound main() starts
     * @param trace what the program did in the simulator
     */
    record Run(EmitResult result, long period, int[] played, AvrTrace trace) {
    }

    static Stream<Build> builds() {
        List<Build> out = new ArrayList<>();
        // One port, and the same six bits scattered over three ports. Pins as the datasheet names them.
        for (String pins : List.of("PD2-PD7", "PD2,PD7,PC0,PC1,PB2,PB1")) {
            for (SampleStorage storage : SampleStorage.values()) {
                for (PlaybackEngine engine : List.of(PlaybackEngine.CLIP, PlaybackEngine.LOOP)) {
                    // the Tread stores at the rate of the compression goals only
                    for (int rate : storage.codec().isPresent() ? new int[] {16000} : new int[] {8000, 22050}) {
                        out.add(new Build(pins, storage, engine, rate, TimerKind.AVR_TIMER1));
                    }
                }
            }
        }
        // A whole port (plain OUT), and ten bits over two ports on an 8-bit timer with a prescaler.
        out.add(new Build("PD0-PD7", SampleStorage.UNPACKED, PlaybackEngine.CLIP, 8000, TimerKind.AVR_TIMER1));
        out.add(new Build("PD0-PD7", SampleStorage.PACKED, PlaybackEngine.LOOP, 8000, TimerKind.AVR_TIMER1));
        // Packed narrow codes whose shifts are longest: 4 bits (four-place window shift) and 3 bits.
        out.add(new Build("PB0-PB3", SampleStorage.PACKED, PlaybackEngine.LOOP, 8000, TimerKind.AVR_TIMER1));
        out.add(new Build("PB0-PB2", SampleStorage.PACKED, PlaybackEngine.CLIP, 8000, TimerKind.AVR_TIMER1));
        out.add(new Build("PD2-PD7,PB0-PB3", SampleStorage.PACKED, PlaybackEngine.CLIP, 16000,
                TimerKind.AVR_TIMER0));
        out.add(new Build("PD2-PD7,PB0-PB3", SampleStorage.UNPACKED, PlaybackEngine.LOOP, 16000,
                TimerKind.AVR_TIMER2));
        // The worst cases of the cost table: 5-bit packed, 11 bits on two ports, twelve scattered bits.
        out.add(new Build("PB0-PB4", SampleStorage.PACKED, PlaybackEngine.LOOP, 8000, TimerKind.AVR_TIMER1));
        out.add(new Build("PD2-PD7,PB0-PB4", SampleStorage.UNPACKED, PlaybackEngine.CLIP, 8000,
                TimerKind.AVR_TIMER1));
        out.add(new Build("PD2-PD7,PB0-PB4", SampleStorage.PACKED, PlaybackEngine.LOOP, 8000,
                TimerKind.AVR_TIMER1));
        out.add(new Build(SCATTERED_12, SampleStorage.PACKED, PlaybackEngine.CLIP, 8000, TimerKind.AVR_TIMER1));
        // The assembler ticks' cases: 7 bits by shift over two and three ports, 6 by table on one and two ports.
        for (String pins : List.of("PD5-PD7,PB0-PB3", "PD5-PD7,PB0-PB1,PC0-PC1", "PD2,PD7,PD3,PD6,PD4,PD5",
                "PD2,PD7,PB2,PB1,PD3,PB0")) {
            for (PlaybackEngine engine : List.of(PlaybackEngine.CLIP, PlaybackEngine.LOOP)) {
                for (SampleStorage storage : List.of(SampleStorage.UNPACKED, SampleStorage.PACKED)) {
                    out.add(new Build(pins, storage, engine, 16000, TimerKind.AVR_TIMER1));
                }
            }
        }
        out.addAll(treadBuilds());
        return out.stream();
    }

    /**
     * Tread builds besides the first ones: the assembler tick's cases (one port by table, two ports by shift
     * and by table, three by shift, 8-bit codes on a whole port; codes of 9 to 12 bits, the 16-bit decoder, by
     * shift and by table over two and three ports), twelve bits scattered over three ports and the byte decoder
     * on a scatter map (the compiled tick), wide indices, and released loops.
     */
    private static List<Build> treadBuilds() {
        List<Build> out = new ArrayList<>();
        List<SampleStorage> tread = List.of(SampleStorage.TREAD2, SampleStorage.TREAD3, SampleStorage.TREAD4);
        for (String pins : List.of("PD2,PD7,PD3,PD6,PD4,PD5", "PD5-PD7,PB0-PB3", "PD2,PD7,PB2,PB1,PD3,PB0",
                "PD5-PD7,PB0-PB1,PC0-PC1", "PD0-PD7", "PD2-PD7,PB0-PB4", "PD2-PD7,PB0-PB3,PC0-PC1",
                "PD2,PD7,PB2,PB1,PD3,PB0,PD4,PB3,PD5,PB4", "PD2,PD7,PB2,PB1,PD3,PB0,PC0,PC1,PC2", SCATTERED_12)) {
            for (SampleStorage storage : tread) {
                for (PlaybackEngine engine : List.of(PlaybackEngine.CLIP, PlaybackEngine.LOOP)) {
                    out.add(new Build(pins, storage, engine, 16000, TimerKind.AVR_TIMER1));
                }
            }
        }
        for (SampleStorage storage : tread) {
            // the compiled byte decoder, which scatter maps still use
            for (PlaybackEngine engine : List.of(PlaybackEngine.CLIP, PlaybackEngine.LOOP)) {
                out.add(new Build("PD2-PD7", storage, engine, 16000, TimerKind.AVR_TIMER1, Variant.SCATTER));
            }
            for (String pins : List.of("PD2-PD7", "PD2,PD7,PC0,PC1,PB2,PB1", "PD2-PD7,PB0-PB4")) {
                out.add(new Build(pins, storage, PlaybackEngine.LOOP, 16000, TimerKind.AVR_TIMER1,
                        Variant.RELEASED));
            }
        }
        for (PlaybackEngine engine : List.of(PlaybackEngine.CLIP, PlaybackEngine.LOOP)) {
            out.add(new Build("PD2-PD7", SampleStorage.TREAD3, engine, 16000, TimerKind.AVR_TIMER1, Variant.WIDE));
            out.add(new Build("PD2,PD7,PC0,PC1,PB2,PB1", SampleStorage.TREAD2, engine, 16000, TimerKind.AVR_TIMER1,
                    Variant.WIDE));
        }
        return out;
    }

    /** Builds of the dds and sweep engines, whose cost is measured (their codes are tested elsewhere). */
    static Stream<Build> costOnlyBuilds() {
        List<Build> out = new ArrayList<>();
        for (String pins : List.of("PB0-PB4", "PD2-PD7,PB0-PB4", "PD2,PD7,PC0,PC1,PB2,PB1", SCATTERED_12)) {
            for (SampleStorage storage : List.of(SampleStorage.UNPACKED, SampleStorage.PACKED)) {
                out.add(new Build(pins, storage, PlaybackEngine.DDS, 8000, TimerKind.AVR_TIMER1));
            }
            out.add(new Build(pins, SampleStorage.UNPACKED, PlaybackEngine.SWEEP, 1000, TimerKind.AVR_TIMER1));
            out.add(new Build(pins, SampleStorage.UNPACKED, PlaybackEngine.SWEEP, 1000, TimerKind.AVR_TIMER1,
                    Variant.RECORDING));
        }
        return out.stream();
    }

    /** Codes that visit many levels and flip every bit often: i * 37 + offset, modulo 2^bits. */
    static int[] codes(int bits, int length, int offset) {
        int[] c = new int[length];
        for (int i = 0; i < length; i++) {
            c[i] = (i * 37 + offset) & ((1 << bits) - 1);
        }
        return c;
    }

    /**
     * A sound of {@link #codes}: those codes, or for a Tread store a stream of them as b-bit codes from the
     * mid code, whose decoded codes (the reference decoder's) hit both ends of the ladder and every step index.
     */
    static SoundClip clip(String name, Build b, int bits, int length, int offset, int loopStart, int loopEnd) {
        if (b.storage().codec().isEmpty()) {
            return new SoundClip(name, Codes.of(bits, b.rateHz(), codes(bits, length, offset)), loopStart, loopEnd);
        }
        TreadFormat f = b.storage().codec().get();
        TreadStream s = TreadStream.of(f, bits, b.rateHz(), new TreadState(1 << (bits - 1), 1 << (bits - 1),
                offset % (f.maxIndex(bits) + 1)), codes(f.codeBits(), length, offset));
        return SoundClip.encoded(name, s, loopStart, loopEnd);
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("builds")
    void playerPutsEverySampleOnThePinsAtTheTimerRate(Build b) {
        Run r = prepared(b);
        PinMap map = PinMap.parse(b.pins(), 8);
        boolean released = b.variant() == Variant.RELEASED;
        boolean loop = b.engine() == PlaybackEngine.LOOP && !released;
        assertEquals(Math.round(16e6 / b.rateHz()), r.period(), "the timer period is the nearest to the rate");
        AvrTicks t = AvrTicks.of(r.trace(), map);
        assertEquals(1 << (map.bits() - 1), t.initCode, "init parks the ladder mid-range");
        long release = released ? r.trace().marker("GPIOR0", 4) : 0;
        List<Integer> want = released ? releasedAt(r.played(), t.playing.stream()
                .filter(i -> i.entryCycle() < release).count()) : loop ? looped(r.played(), t.codes.size())
                : toList(r.played());
        if (loop) {
            assertTrue(t.codes.size() >= LOOP_TICKS, "looping for the whole run: " + t.codes.size() + " ticks");
        } else {
            // the interrupt after the last code finds the sound ended and switches itself off
            assertEquals(1, t.after.size(), "interrupts after the end");
        }
        assertEquals(want, t.codes, "codes at the pins, tick by tick");
        // The first tick may wait for the end of play()'s critical section: periods count from the second.
        assertTickPeriod(t.playing.subList(1, t.playing.size()), r.period());
        assertEquals(1, t.playing.stream().map(i -> firstWriteOffset(r.trace(), i)).distinct().count(),
                "the pins change the same number of cycles after every interrupt");
        record(b, r, t.playing, t.window, t.after.size());
        assertWithinReport(r, t.playing, t.window);
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("costOnlyBuilds")
    void ddsAndSweepStayWithinTheReportedCost(Build b) {
        Run r = prepared(b);
        PinMap map = PinMap.parse(b.pins(), 8);
        long started = r.trace().marker("GPIOR0", 3);
        List<Interrupt> ticks = r.trace().interrupts().stream().filter(i -> i.entryCycle() > started).toList();
        assertTrue(ticks.size() >= COST_ONLY_TICKS - 4, "interrupts measured: " + ticks.size());
        long window = 0;
        for (Interrupt i : ticks) {
            List<Write> w = r.trace().writes().stream().filter(i::contains)
                    .filter(x -> x.register().startsWith("PORT")).toList();
            if (!w.isEmpty()) {
                assertEquals(map.ports().size(), w.size(), "one write per ladder port at " + i);
                window = Math.max(window, w.get(w.size() - 1).cycle() - w.get(0).cycle());
            }
        }
        record(b, r, ticks, window, 0);
        assertWithinReport(r, ticks, window);
    }

    /**
     * The measured worst tick and glitch window are at most what the build report prints: the figures of
     * {@link TickCost} stay honest.
     */
    private static void assertWithinReport(Run r, List<Interrupt> ticks, long window) {
        TickCost cost = r.result().tickCost().orElseThrow();
        long worst = ticks.stream().mapToLong(Interrupt::cycles).max().orElseThrow();
        assertTrue(worst <= cost.worstCycles(), "a tick took " + worst + " cycles; the report says at most "
                + cost.worstCycles());
        assertTrue(window <= cost.windowCycles(), "the ports were written within " + window + " cycles; the"
                + " report says " + cost.windowCycles());
        String line = "cpu: at most " + cost.worstCycles() + " cycles per tick";
        assertTrue(r.result().report().stream().anyMatch(l -> l.startsWith(line)), r.result().report().toString());
    }

    /**
     * The run of {@code b}. The first call starts every build of the matrix on two threads (emit, avr-gcc,
     * simulation), so the compilers of two builds run side by side; later calls wait for their own.
     */
    private static Run prepared(Build b) {
        CToolchain.require("avr-gcc");
        AvrSimulator sim = AvrSimulator.get();
        synchronized (RUNS) {
            if (pool == null) {
                pool = Executors.newFixedThreadPool(2);
                for (Build each : Stream.concat(builds(), costOnlyBuilds()).toList()) {
                    Path dir = root.resolve("build" + RUNS.size());
                    RUNS.put(each, CompletableFuture.supplyAsync(() -> simulate(each, sim, dir), pool));
                }
            }
        }
        try {
            return RUNS.get(b).join();
        } catch (CompletionException e) {
            if (e.getCause() instanceof Error error) {
                throw error;
            }
            throw e;
        }
    }

    /**
     * Emits {@code b} with a main() that starts it (sound 1 of a clip, the oscillator, the sweep), compiles it
     * and runs it in the simulator.
     */
    private static Run simulate(Build b, AvrSimulator sim, Path dir) {
        PinMap map = PinMap.parse(b.pins(), 8);
        int bits = map.bits();
        boolean loop = b.engine() == PlaybackEngine.LOOP;
        int[] played = codes(bits, loop ? LOOP_SAMPLES : CLIP_SAMPLES, 5);
        FirmwareRequest.Builder request = FirmwareRequest.builder().family("avr").name("player").toolVersion("test")
                .pins(b.pins()).storage(b.storage()).engine(b.engine()).timer(b.timer()).cpuClockHz(16e6)
                .pinStrategy(b.variant() == Variant.SCATTER ? PinStrategy.SCATTER : PinStrategy.AUTO);
        String start = "player_start()";
        long ticks = COST_ONLY_TICKS;
        switch (b.engine()) {
            case DDS:
                request.sound("wave", Codes.of(bits, b.rateHz(), codes(bits, 256, 5))).dds(DdsSpec.of(440));
                break;
            case SWEEP:
                // a recording sweep of one-tick steps takes its longer branch (which hold comes next) every tick
                request.sweep(b.recording() ? SweepSpec.recording(bits, codes(bits, 64, 5), 1, 8, 1)
                        : SweepSpec.holding(bits, codes(bits, 64, 5), 1));
                break;
            default:
                int other = b.variant() == Variant.WIDE ? WIDE_OTHER_SAMPLES : 50;
                request.sound(clip("other", b, bits, other, 11, 0, other));
                SoundClip clip = loop ? clip("played", b, bits, played.length, 5, LOOP_START, LOOP_END)
                        : clip("played", b, bits, played.length, 5, 0, played.length);
                request.sound(clip);
                played = clip.codes().codes();
                start = (loop ? "player_loop" : "player_play") + "(1u)";
                ticks = loop && b.variant() != Variant.RELEASED ? LOOP_TICKS : played.length + TICKS_AFTER_END;
                if (b.variant() == Variant.RELEASED) {
                    start += ";\n    " + RELEASE;
                    ticks += RELEASE_AFTER_TICKS;
                }
        }
        EmitResult result = FirmwareEmitter.emit(request.build(), dir);
        long period = result.timer().orElseThrow().cyclesPerTick();
        AtomicFiles.writeString(dir.resolve("main.c"), mainProgram(map, start));
        CToolchain.compileClean(dir, CToolchain.cmd(CToolchain.cmd(AvrSimulator.AVR_GCC, CToolchain.STRICT),
                List.of("-o", "player.elf", "main.c", "player.c", "player_data.c")));
        return new Run(result, period, played, sim.run(dir.resolve("player.elf"), (ticks + 4) * period + 20_000));
    }

    @Test
    void harnessCountsABareInterruptAsTheDatasheetDoes() {
        CToolchain.require("avr-gcc");
        AvrSimulator sim = AvrSimulator.get();
        Path dir = root.resolve("bare");
        AtomicFiles.writeString(dir.resolve("bare.c"), """
                #include <avr/io.h>
                #include <avr/interrupt.h>
                ISR(TIMER1_COMPA_vect, ISR_NAKED)
                {
                    reti();
                }
                int main(void)
                {
                    TCCR1A = 0u;
                    TCCR1B = (uint8_t)(_BV(WGM12) | _BV(CS10));
                    OCR1A = 999u;
                    TIMSK1 = _BV(OCIE1A);
                    sei();
                    for (;;) {
                    }
                }
                """);
        CToolchain.compileClean(dir, CToolchain.cmd(AvrSimulator.AVR_GCC, List.of("-o", "bare.elf", "bare.c")));
        AvrTrace trace = sim.run(dir.resolve("bare.elf"), 20_000);
        // ATmega328P datasheet: 4-cycle interrupt response; AVR instruction set manual: JMP 3 cycles (the
        // vector), RETI 4 cycles (16-bit program counter). CTC period = (OCR1A + 1) * prescaler = 1000.
        assertTrue(trace.interrupts().size() >= 15, "interrupts: " + trace.interrupts().size());
        trace.interrupts().forEach(i -> assertEquals(4 + 3 + 4, i.cycles(), "bare interrupt at " + i));
        assertTickPeriod(trace.interrupts(), 1000);
    }

    @AfterAll
    static void printTable() {
        if (pool != null) {
            pool.shutdownNow();
        }
        if (TABLE.isEmpty()) {
            return;
        }
        StringBuilder s = new StringBuilder(String.format(Locale.ROOT, "%n[rungtone firmware tests] ATmega328P"
                + " timer interrupt in simavr, cycles including the 4-cycle response; window: first to last port"
                + " write of a tick; after end: interrupts once the sound ended%n%-48s %-8s %-5s %8s %-6s"
                + " %-8s %6s %6s %7s %7s %6s %9s%n", "pins", "storage", "eng.", "rate", "timer", "strategy",
                "tick", "worst", "mean", "report", "window", "after end"));
        TABLE.values().forEach(s::append);
        System.out.print(s);
    }

    private static void record(Build b, Run r, List<Interrupt> ticks, long window, int afterEnd) {
        long worst = ticks.stream().mapToLong(Interrupt::cycles).max().orElseThrow();
        double mean = ticks.stream().mapToLong(Interrupt::cycles).average().orElseThrow();
        String report = r.result().tickCost().map(c -> Integer.toString(c.worstCycles())).orElse("-");
        TABLE.put(b.toString(), String.format(Locale.ROOT, "%s %-8s %6d %6d %7.1f %7s %6d %9s%n", b,
                r.result().pinStrategy().name().toLowerCase(Locale.ROOT), r.period(), worst, mean, report, window,
                b.isClip() ? Integer.toString(afterEnd) : "-"));
    }

    /** A program that sets the other pins to a pattern, starts the player with {@code start} and idles. */
    private static String mainProgram(PinMap map, String start) {
        StringBuilder setup = new StringBuilder();
        PORT_PINS.forEach((port, pins) -> {
            int free = pins & ~(int) map.mask(port);
            setup.append(String.format(Locale.ROOT, "    PORT%s = 0x%02Xu;%n    DDR%s = 0x%02Xu;%n", port,
                    PORT_PATTERN & free, port, DDR_PATTERN & free));
        });
        return "#include <avr/io.h>\n#include \"player.h\"\n\nint main(void)\n{\n" + setup
                + "    GPIOR0 = 1u;\n    player_init();\n    GPIOR0 = 2u;\n    " + start + ";\n"
                + "    GPIOR0 = 3u;\n    for (;;) {\n    }\n}\n";
    }

    /** Each interrupt starts within the idle loop's jitter of one timer period after the one before. */
    private static void assertTickPeriod(List<Interrupt> interrupts, long period) {
        for (int i = 1; i < interrupts.size(); i++) {
            long gap = interrupts.get(i).entryCycle() - interrupts.get(i - 1).entryCycle();
            assertTrue(Math.abs(gap - period) <= ENTRY_JITTER_CYCLES, "interrupt " + i + " came " + gap
                    + " cycles after the one before; the timer period is " + period);
        }
        long span = interrupts.get(interrupts.size() - 1).entryCycle() - interrupts.get(0).entryCycle();
        assertTrue(Math.abs(span - (interrupts.size() - 1) * period) <= ENTRY_JITTER_CYCLES,
                "mean interrupt period " + span + " / " + (interrupts.size() - 1));
    }

    private static long firstWriteOffset(AvrTrace trace, Interrupt i) {
        return trace.writes().stream().filter(i::contains).mapToLong(Write::cycle).min().orElseThrow()
                - i.entryCycle();
    }

    /**
     * The loop engine's order with a release after {@code before} codes: looping until then, then on from
     * where it is to the end of the sound.
     */
    private static List<Integer> releasedAt(int[] samples, long before) {
        List<Integer> out = new ArrayList<>();
        int pos = 0;
        for (long i = 0; i < before; i++) {
            out.add(samples[pos]);
            pos = pos + 1 == LOOP_END ? LOOP_START : pos + 1;
        }
        for (; pos < samples.length; pos++) {
            out.add(samples[pos]);
        }
        return out;
    }

    /** The loop engine's order: samples up to the loop end, then the loop again and again. */
    private static List<Integer> looped(int[] samples, int ticks) {
        List<Integer> out = new ArrayList<>(ticks);
        int pos = 0;
        while (out.size() < ticks) {
            out.add(samples[pos]);
            pos = pos + 1 == LOOP_END ? LOOP_START : pos + 1;
        }
        return out;
    }

    private static List<Integer> toList(int[] a) {
        List<Integer> out = new ArrayList<>(a.length);
        for (int v : a) {
            out.add(v);
        }
        return out;
    }
}
