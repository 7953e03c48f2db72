package org.rungtone.firmware;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Set;
import java.util.stream.Collectors;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.EnumSource;
import org.junit.jupiter.params.provider.MethodSource;
import org.rungtone.calibrate.MeasurementPlan;
import org.rungtone.calibrate.RecordingSweep;
import org.rungtone.codec.TreadEncoder;
import org.rungtone.codec.TreadStream;
import org.rungtone.codec.Weighting;
import org.rungtone.firmware.MockPortRun.Event;
import org.rungtone.ladder.LevelTable;
import org.rungtone.quantize.Codes;
import org.rungtone.quantize.Dither;
import org.rungtone.quantize.Quantizer;
import org.rungtone.source.Signal;

/**
 * Runs the generic player on the host against a mock port, and the rp2040 player against its registers in
 * memory: what reaches the pins must be exactly the quantizer's codes (clip, loop), the Java DDS reference
 * model (dds), or the sweep list at the right ticks; the rp2040 alarm must move on by the period, carrying
 * the fraction of a microsecond over.
 */
class HostReplayTest {
    @TempDir
    Path dir;

    /** A door-chime-like decaying two-tone clip, quantized with TPDF dither onto an ideal ladder. */
    static Codes chime(int bits, int samples) {
        return new Quantizer(LevelTable.ideal(bits, 5.0), Dither.TPDF, 42).apply(chimeSignal(samples)).codes();
    }

    /** The decaying two-tone clip at 8 kHz. */
    static Signal chimeSignal(int samples) {
        double rate = 8000;
        double[] x = new double[samples];
        for (int i = 0; i < samples; i++) {
            double t = i / rate;
            x[i] = Math.exp(-6 * t) * (0.6 * Math.sin(2 * Math.PI * 659.3 * t) + 0.35 * Math.sin(
                    2 * Math.PI * 523.3 * t));
        }
        return Signal.of(x, rate);
    }

    /**
     * The chime as a sound of {@code storage}: its quantized codes, or for a Tread store its stream encoded
     * onto the ideal ladder (the sound's codes are then what the reference decoder makes of it).
     */
    static SoundClip chimeClip(String name, SampleStorage storage, int bits, int samples, int loopStart,
            int loopEnd) {
        if (storage.codec().isEmpty()) {
            return new SoundClip(name, chime(bits, samples), loopStart, loopEnd);
        }
        Quantizer q = new Quantizer(LevelTable.ideal(bits, 5.0), Dither.TPDF, 42);
        TreadStream stream = new TreadEncoder(storage.codec().get(), q, Weighting.flat()).encode(
                chimeSignal(samples)).stream();
        return SoundClip.encoded(name, stream, loopStart, loopEnd);
    }

    static Stream<Arguments> pinMaps() {
        List<Arguments> out = new ArrayList<>();
        String[][] maps = {
            {"PB0-PB5", "8"},                  // contiguous: one shift
            {"PA3,PA7,PC0,PC1,PB2,PB1", "8"},      // scattered over three ports: lookup tables
            {"PB2-PB5,PD6,PD7", "8"},            // two ports, one shift each
            {"PA26-PA31", "32"},               // the top of a 32-bit port
            {"P1.7-P1.2", "16"},             // a numbered port, descending
            {"PA0-PA5,PB7,PB5,PB3,PB1,PC4,PC0", "8"} // 12 bits over three ports: scatter code
        };
        for (String[] m : maps) {
            for (SampleStorage s : SampleStorage.values()) {
                out.add(Arguments.of(m[0], Integer.parseInt(m[1]), s));
            }
        }
        return out.stream();
    }

    private static FirmwareRequest.Builder base(String pins, int width, SampleStorage storage) {
        return FirmwareRequest.builder().name("mock").toolVersion("test").pins(pins).portWidth(width)
                .storage(storage);
    }

    @ParameterizedTest(name = "{0} ({1}-bit ports), {2}")
    @MethodSource("pinMaps")
    void clipReachesThePinsExactly(String pins, int width, SampleStorage storage) {
        int bits = PinMap.parse(pins, width).bits();
        SoundClip clip = chimeClip("chime", storage, bits, 700, 0, 700);
        Codes codes = clip.codes();
        List<Event> events = MockPortRun.run(base(pins, width, storage).sound(clip).build(), dir,
                false, "0", "0", "0");
        assertEquals(1 << (bits - 1), events.get(0).code(), "init parks the ladder at the mid code");
        assertEquals(toList(codes.codes()), MockPortRun.tickCodes(events));
        assertNull(events.get(events.size() - 1).code(), "nothing is written once the clip is done");
    }

    @Test
    void playsTheChosenSoundOfAProject() {
        Codes a = chime(6, 300);
        Codes b = chime(6, 450);
        int[] bc = b.codes();
        for (int i = 0; i < bc.length; i++) {
            bc[i] = 63 - bc[i];
        }
        Codes inverted = Codes.of(6, 8000, bc);
        FirmwareRequest r = base("PD2-PD7", 8, SampleStorage.PACKED).sound("door", a).sound("alarm", inverted)
                .build();
        assertEquals(toList(bc), MockPortRun.tickCodes(MockPortRun.run(r, dir, false, "1", "0", "0")));
    }

    @ParameterizedTest(name = "{0}")
    @EnumSource(value = SampleStorage.class, names = {"PACKED", "TREAD2", "TREAD3", "TREAD4"})
    void loopRepeatsBetweenLoopPointsThenPlaysTheTailAfterRelease(SampleStorage storage) {
        int loopStart = 20;
        int loopEnd = 60;
        int beforeRelease = 250;
        SoundClip clip = chimeClip("chime", storage, 6, 100, loopStart, loopEnd);
        FirmwareRequest r = base("PA3,PA7,PC0,PC1,PB2,PB1", 8, storage).engine(PlaybackEngine.LOOP).sound(clip)
                .build();
        List<Integer> got = MockPortRun.tickCodes(MockPortRun.run(r, dir, true, "0", "1",
                Integer.toString(beforeRelease)));
        assertEquals(looped(clip.codes().codes(), loopStart, loopEnd, beforeRelease), got);
    }

    /**
     * The loop engine's order: samples up to the loop end, then the loop again and again; after
     * {@code beforeRelease} codes the loop is released and playback runs on from where it is to the end.
     */
    private static List<Integer> looped(int[] c, int loopStart, int loopEnd, int beforeRelease) {
        List<Integer> want = new ArrayList<>();
        int pos = 0;
        boolean looping = true;
        while (pos < c.length) {
            want.add(c[pos]);
            pos++;
            if (want.size() == beforeRelease) {
                looping = false;
            }
            if (looping && pos == loopEnd) {
                pos = loopStart;
            }
        }
        return want;
    }

    @ParameterizedTest(name = "{0}")
    @EnumSource(value = SampleStorage.class, names = {"TREAD2", "TREAD3", "TREAD4"})
    void treadStartsEverySoundAndLoopFromItsResetPoint(SampleStorage storage) {
        // three sounds, each from its own decoder state; the looped one's loop starts mid-sound, where the
        // decoder reloads the state the reference decoder has there
        SoundClip a = chimeClip("door", storage, 8, 300, 0, 300);
        SoundClip b = chimeClip("bell", storage, 8, 450, 131, 402);
        SoundClip c = chimeClip("buzz", storage, 8, 200, 7, 190);
        FirmwareRequest r = base("PB0-PB7", 8, storage).engine(PlaybackEngine.LOOP).sound(a).sound(b).sound(c)
                .build();
        assertEquals(looped(b.codes().codes(), 131, 402, 1000), MockPortRun.tickCodes(MockPortRun.run(r, dir,
                true, "1", "1", "1000")));
        assertEquals(looped(c.codes().codes(), 7, 190, 500), MockPortRun.tickCodes(MockPortRun.run(r, dir, true,
                "2", "1", "500")));
    }

    static Stream<Arguments> ddsCases() {
        return Stream.of(Arguments.of(32, 8, SampleStorage.UNPACKED, 441),
                Arguments.of(24, 8, SampleStorage.PACKED, 1234),
                Arguments.of(32, 12, SampleStorage.PACKED, 3001),
                Arguments.of(16, 10, SampleStorage.UNPACKED, 97));
    }

    @ParameterizedTest(name = "{0}-bit phase, {1}-bit codes, {2}, {3} Hz")
    @MethodSource("ddsCases")
    void ddsMatchesTheReferenceModel(int phaseBits, int bits, SampleStorage storage, int hz) {
        int[] table = Dds.sineTable(8, bits);
        String pins = bits == 8 ? "PB0-PB7" : bits == 10 ? "PB0-PB7,PC0,PC1" : "PA0-PA5,PB7,PB5,PB3,PB1,PC4,PC0";
        FirmwareRequest r = base(pins, 8, storage).engine(PlaybackEngine.DDS)
                .sound("sine", Codes.of(bits, 8000, table)).dds(new DdsSpec(phaseBits, 1000)).build();
        List<Event> events = MockPortRun.run(r, dir, false, Integer.toString(hz), "3000");
        long m = events.stream().filter(e -> e.kind() == 'M').findFirst().orElseThrow().value();
        // MT-085: M = round(f * 2^n / fs)
        assertEquals(Dds.tuningWord(hz, 8000, phaseBits), m);
        assertEquals(toList(new Dds(phaseBits, table).run(m, 3000)), MockPortRun.tickCodes(events));
    }

    @Test
    void sweepHoldsEachCodeForTheGivenTicks() {
        int[] codes = {0, 63, 1, 62, 32};
        FirmwareRequest r = base("PB0,PB1,PD7,PD6,PC0,PC1", 8, SampleStorage.UNPACKED)
                .sweep(SweepSpec.holding(6, codes, 3)).build();
        List<Event> events = MockPortRun.run(r, dir, false);
        Event start = events.stream().filter(e -> e.kind() == 'S').findFirst().orElseThrow();
        assertEquals(codes[0], start.code());
        List<int[]> writes = tickWrites(events);
        // code k (k >= 1) goes out in tick 3k - 1 (0-based): each code is held exactly 3 ticks
        assertEquals(List.of("2:63", "5:1", "8:62", "11:32"), format(writes));
        assertEquals(15, events.stream().filter(e -> e.kind() == 'T').count(), "done after 5 x 3 ticks");
    }

    @Test
    void sweepAdvancesOnDebouncedPresses() {
        int[] codes = {5, 40, 17};
        FirmwareRequest r = base("PB0-PB5", 8, SampleStorage.UNPACKED)
                .sweep(SweepSpec.onButton(6, codes, "PD2")).build();
        // presses (tick ranges): long, a 5-tick bounce, long, long
        List<Event> events = MockPortRun.run(r, dir, false, "100", "160", "300", "305", "400", "460", "600",
                "700");
        int debounce = SweepSpec.DEBOUNCE_MILLIS; // ticks at 1 kHz
        assertEquals(List.of((100 + debounce - 1) + ":40", (400 + debounce - 1) + ":17"),
                format(tickWrites(events)));
        long ticks = events.stream().filter(e -> e.kind() == 'T').count();
        assertEquals(600 + debounce, ticks, "the press after the last code ends the sweep");
    }

    static Stream<Arguments> recordingTargets() {
        return Stream.of(Arguments.of("generic", "PB0,PB1,PD7,PD6,PC0,PC1"), Arguments.of("rp2040", "GPIO2-GPIO7"));
    }

    @ParameterizedTest(name = "{0} {1}")
    @MethodSource("recordingTargets")
    void recordingSweepPutsThePatternsAndThePlanOnThePinsAtTheirTicks(String family, String pins) {
        // every 6-bit code held 30 ms, with 3 returns to code 0, between the two 31-step patterns of 20 ms
        RecordingSweep sweep = RecordingSweep.of(MeasurementPlan.everyCode(LevelTable.ideal(6, 5.0)), 0.030);
        int[] steps = sweep.stepCodes();
        FirmwareRequest r = FirmwareRequest.builder().family(family).name("mock").toolVersion("test").pins(pins)
                .portWidth(family.equals("rp2040") ? 32 : 8).storage(SampleStorage.UNPACKED)
                .sweep(SweepSpec.recording(6, steps, 30, sweep.patternSteps(), RecordingSweep.PATTERN_TICKS))
                .build();
        List<Event> events = MockPortRun.run(r, dir, false);
        assertEquals(steps[0], events.stream().filter(e -> e.kind() == 'S').findFirst().orElseThrow().code());
        // step i (i >= 1) begins at tick start[i]; it goes out in the tick of that index counted from 1
        long[] start = sweep.stepStartTicks();
        List<String> want = new ArrayList<>();
        for (int i = 1; i < steps.length; i++) {
            want.add((start[i] - 1) + ":" + steps[i]);
        }
        assertEquals(want, format(tickWrites(events)));
        assertEquals(start[steps.length], events.stream().filter(e -> e.kind() == 'T').count(),
                "done when the last pattern step has been held");
        assertEquals(62 * 20 + (64 + 3) * 30, start[steps.length], "two patterns of 31 x 20 ticks, 67 steps x 30");
    }

    static Stream<Arguments> rp2040PinMaps() {
        List<Arguments> out = new ArrayList<>();
        for (String pins : List.of("GPIO2-GPIO7", "GPIO29,GPIO0,GPIO15,GPIO16,GPIO3,GPIO2",
                "GPIO0-GPIO5,GPIO27,GPIO25,GPIO23,GPIO21,GPIO19,GPIO17")) {
            for (SampleStorage s : SampleStorage.values()) {
                out.add(Arguments.of(pins, s));
            }
        }
        return out.stream();
    }

    private static FirmwareRequest.Builder rp2040(String pins, SampleStorage storage) {
        return FirmwareRequest.builder().family("rp2040").name("mock").toolVersion("test").pins(pins)
                .storage(storage);
    }

    @ParameterizedTest(name = "rp2040 {0}, {1}")
    @MethodSource("rp2040PinMaps")
    void rp2040ClipReachesThePinsExactly(String pins, SampleStorage storage) {
        int bits = PinMap.parse(pins, 32).bits();
        SoundClip clip = chimeClip("chime", storage, bits, 700, 0, 700);
        Codes codes = clip.codes();
        List<Event> events = MockPortRun.run(rp2040(pins, storage).sound(clip).build(), dir, false,
                "0", "0", "0");
        assertEquals(1 << (bits - 1), events.get(0).code(), "init parks the ladder at the mid code");
        assertEquals(toList(codes.codes()), MockPortRun.tickCodes(events));
        // 8 kHz is 125 whole microseconds: every tick moves the alarm on by exactly that
        assertEquals(Set.of(125L), alarmSteps(events).stream().collect(Collectors.toSet()));
    }

    @Test
    void rp2040AlarmCarriesTheFractionOfAMicrosecond() {
        // 22.05 kHz: 10^6 / 22050 = 45 155/441 us; every 441 ticks take exactly 20,000 us (441 x 45 + 155)
        Codes codes = Codes.of(6, 22_050, chime(6, 2 * 441 + 10).codes());
        List<Long> steps = alarmSteps(MockPortRun.run(rp2040("GPIO2-GPIO7", SampleStorage.UNPACKED)
                .sound("chime", codes).build(), dir, false, "0", "0", "0"));
        assertEquals(Set.of(45L, 46L), steps.stream().collect(Collectors.toSet()));
        assertEquals(20_000L, steps.subList(0, 441).stream().mapToLong(Long::longValue).sum());
        assertEquals(20_000L, steps.subList(441, 882).stream().mapToLong(Long::longValue).sum());
        assertEquals(155L, steps.subList(0, 441).stream().filter(d -> d == 46L).count());
    }

    @Test
    void rp2040DdsMatchesTheReferenceModelAtTheAlarmsRate() {
        int[] table = Dds.sineTable(8, 8);
        FirmwareRequest r = rp2040("GPIO8-GPIO15", SampleStorage.PACKED).engine(PlaybackEngine.DDS)
                .sound("sine", Codes.of(8, 22_050, table)).dds(new DdsSpec(32, 1000)).build();
        List<Event> events = MockPortRun.run(r, dir, false, "441", "2000");
        long m = events.stream().filter(e -> e.kind() == 'M').findFirst().orElseThrow().value();
        // MT-085 at the rate the alarm averages, 22.05 kHz exactly
        assertEquals(Dds.tuningWord(441, 22_050, 32), m);
        assertEquals(toList(new Dds(32, table).run(m, 2000)), MockPortRun.tickCodes(events));
    }

    @Test
    void rp2040SweepAdvancesOnDebouncedPressesOfItsButton() {
        int[] codes = {5, 40, 17};
        FirmwareRequest r = rp2040("GPIO2-GPIO7", SampleStorage.UNPACKED)
                .sweep(SweepSpec.onButton(6, codes, "GPIO28")).build();
        List<Event> events = MockPortRun.run(r, dir, false, "100", "160", "300", "305", "400", "460", "600",
                "700");
        int debounce = SweepSpec.DEBOUNCE_MILLIS;
        assertEquals(List.of((100 + debounce - 1) + ":40", (400 + debounce - 1) + ":17"),
                format(tickWrites(events)));
        assertEquals(Set.of(1000L), alarmSteps(events).stream().collect(Collectors.toSet()), "1 kHz sweep ticks");
    }

    /** The microseconds the rp2040 alarm moved on at each tick. */
    private static List<Long> alarmSteps(List<Event> events) {
        List<Long> out = new ArrayList<>();
        for (Event e : events) {
            if (e.kind() == 'A') {
                out.add(e.value());
            }
        }
        return out;
    }

    private static List<int[]> tickWrites(List<Event> events) {
        List<int[]> out = new ArrayList<>();
        for (Event e : events) {
            if (e.kind() == 'T' && e.code() != null) {
                out.add(new int[] {e.tick(), e.code()});
            }
        }
        return out;
    }

    private static List<String> format(List<int[]> writes) {
        List<String> out = new ArrayList<>();
        writes.forEach(w -> out.add(w[0] + ":" + w[1]));
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
