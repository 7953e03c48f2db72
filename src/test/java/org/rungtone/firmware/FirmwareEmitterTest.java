package org.rungtone.firmware;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.function.UnaryOperator;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.rungtone.internal.AtomicFiles;
import org.rungtone.internal.InputError;
import org.rungtone.internal.Setting;
import org.rungtone.internal.SettingError;
import org.rungtone.quantize.Codes;

class FirmwareEmitterTest {
    @TempDir
    Path dir;

    private static Codes ramp(int bits, int n, double rate) {
        int[] c = new int[n];
        for (int i = 0; i < n; i++) {
            c[i] = (i * 5) % (1 << bits);
        }
        return Codes.of(bits, rate, c);
    }

    /** A small door-chime project: two 4-bit sounds on scattered pins, looped, packed. */
    private static FirmwareRequest.Builder chimeProject() {
        return FirmwareRequest.builder().name("Door Chime").toolVersion("0.1.0-test").pins("PA3,PA7,PC0,PC1")
                .storage(SampleStorage.PACKED).engine(PlaybackEngine.LOOP)
                .sound("ding", ramp(4, 24, 8000), 4, 20).sound("dong", ramp(4, 10, 8000))
                .setting("source: examples/greenhouse/chime.wav");
    }

    private static FirmwareRequest.Builder avrProject() {
        return FirmwareRequest.builder().family("avr").name("alarm").toolVersion("0.1.0-test").pins("PD2-PD7")
                .cpuClockHz(16e6).sound("warble", ramp(6, 16, 22050));
    }

    @Test
    void genericHeaderMatchesGolden() throws IOException {
        assertGolden("golden/generic_door_chime.h", FirmwareEmitter.render(chimeProject().build()).files()
                .get("door_chime.h"));
    }

    @Test
    void avrPlayerMatchesGolden() throws IOException {
        assertGolden("golden/avr_alarm.c", FirmwareEmitter.render(avrProject().build()).files().get("alarm.c"));
    }

    private static void assertGolden(String resource, String actual) throws IOException {
        String expected;
        try (InputStream in = FirmwareEmitterTest.class.getClassLoader().getResourceAsStream(resource)) {
            if (in == null) {
                AtomicFiles.writeString(Path.of("target", "golden-actual", resource), actual);
                throw new AssertionError(resource + " missing; actual output written under target/golden-actual");
            }
            expected = new String(in.readAllBytes(), StandardCharsets.UTF_8);
        }
        if (!expected.equals(actual)) {
            AtomicFiles.writeString(Path.of("target", "golden-actual", resource), actual);
        }
        assertEquals(expected, actual);
    }

    @Test
    void writesThreeFilesAndReports() {
        EmitResult r = FirmwareEmitter.emit(avrProject().build(), dir);
        assertEquals(List.of(dir.resolve("alarm.h"), dir.resolve("alarm.c"), dir.resolve("alarm_data.c")),
                r.files());
        r.files().forEach(f -> assertTrue(Files.isRegularFile(f)));
        assertEquals(PinStrategy.SHIFT, r.pinStrategy());
        assertEquals(725, r.timer().orElseThrow().reload());
        // 16 uint8_t samples + start and end of one sound as uint16_t
        assertEquals(16 + 4, r.flashBytes());
        assertTrue(r.report().contains("tick rate: 22.05 kHz requested; timer1 at 16 MHz: prescaler 1, OCR1A = 725"
                + " (726 cycles per tick), 22.0386 kHz (-518.5 ppm)"), r.report().toString());
        assertTrue(r.report().contains("pin strategy: shift and mask, one per port"));
    }

    @Test
    void outputIsDeterministic() {
        assertEquals(FirmwareEmitter.render(chimeProject().build()).files(),
                FirmwareEmitter.render(chimeProject().build()).files());
    }

    @Test
    void reportsTheGlitchBetweenPorts() {
        FirmwareRequest r = avrProject().pins("PB0-PB2,PD5-PD7").build();
        List<String> report = FirmwareEmitter.render(r).result().report();
        // both values are computed first, then two OUT instructions (1 cycle each, AVR instruction set
        // manual) follow each other: 1 cycle at 16 MHz = 62.5 ns, as AvrSimulatorTest measures
        assertTrue(report.stream().anyMatch(l -> l.startsWith("port update: ports B then D in this fixed order,"
                + " the values computed first and written back to back: 1 cycle (63 ns) from the first write to"
                + " the last (measured in simulation);")), report.toString());
    }

    @Test
    void reportsTheCpuCostOfATick() {
        List<String> report = FirmwareEmitter.render(avrProject().build()).result().report();
        // 60 cycles (unpacked, one port, the assembler interrupt) at 22038.567 Hz of 16 MHz:
        // 60 * 22038.567 / 16e6 = 8.26 %; 25 % of 16 MHz / 60 cycles = 66.67 kHz
        assertTrue(report.contains("cpu: at most 60 cycles per tick = 8.3 % of the CPU at 22.04 kHz (16 MHz"
                + " clock); rates up to 66.7 kHz keep it under 25 %; measured in simulation (ATmega328P, avr-gcc"
                + " -Os); the timer interrupt is off while nothing plays; the interrupt is written in assembler"),
                report.toString());
    }

    @Test
    void reportsTheAssemblerTickOfATreadStore() {
        FirmwareRequest r = FirmwareRequest.builder().family("avr").name("t").toolVersion("test").pins("PD2-PD7")
                .cpuClockHz(16e6).storage(SampleStorage.TREAD3)
                .sound(HostReplayTest.chimeClip("s", SampleStorage.TREAD3, 6, 64, 0, 64)).build();
        List<String> report = FirmwareEmitter.render(r).result().report();
        // 125 cycles (tread3, clip, one port; AvrSimulatorTest) at 8 kHz of 16 MHz: 6.25 %
        assertTrue(report.stream().anyMatch(l -> l.startsWith("cpu: at most 125 cycles per tick = 6.3 % of the CPU")
                && l.endsWith("; the interrupt is written in assembler")), report.toString());
    }

    @Test
    void reportsTableSizeAndDdsTuning() {
        FirmwareRequest r = FirmwareRequest.builder().name("sweepgen").pins("PA3,PA7,PC0,PC1,PB2,PB1")
                .engine(PlaybackEngine.DDS).sound("sine", Codes.of(6, 16000, Dds.sineTable(8, 6)))
                .dds(DdsSpec.of(440)).build();
        List<String> report = FirmwareEmitter.render(r).result().report();
        assertTrue(report.contains("pin strategy: lookup table, 3 port(s) x 64 entries x 1 byte(s) = 192 bytes"),
                report.toString());
        // M = round(440 * 2^32 / 16000) = 118,111,601 (118,111,600.64); f = M * 16000 / 2^32
        assertTrue(report.stream().anyMatch(l -> l.startsWith("dds: 32-bit phase accumulator, 256-entry table,"
                + " resolution f_s/2^32 = 3.725 µHz; 440 Hz requested: tuning word M = 118111601, actual"
                + " 440.000001 Hz")), report.toString());
    }

    @Test
    void headerListsEveryParameterAndTheCaution() {
        String h = FirmwareEmitter.render(chimeProject().build()).files().get("door_chime.h");
        assertTrue(h.contains("Licence of this file: MIT"));
        assertTrue(h.contains("generated by Rungtone 0.1.0-test"));
        assertTrue(h.contains(" *   source: examples/greenhouse/chime.wav"));
        assertTrue(h.contains("Never drive a speaker directly from the pins or from a bare op-amp output"));
        assertTrue(h.contains("#define DOOR_CHIME_SOUND_DING 0u"));
        assertTrue(h.contains("#define DOOR_CHIME_SOUND_DONG 1u"));
    }

    @Test
    void userTemplatesCanAddAFamily() throws IOException {
        Path t = dir.resolve("templates");
        for (String f : List.of("player.h.mustache", "player.c.mustache", "data.c.mustache")) {
            AtomicFiles.writeString(t.resolve("pic").resolve(f), "/* pic " + f + " for {{symbol}} */\n");
        }
        FirmwareRequest r = chimeProject().family("pic").templates(Templates.fromFolder(t)).build();
        FirmwareEmitter.Rendered out = FirmwareEmitter.render(r);
        assertEquals("/* pic player.c.mustache for door_chime */\n", out.files().get("door_chime.c"));
        assertTrue(out.result().report().contains(
                "target: pic (the user's own templates, driven like generic)"));
    }

    @Test
    void templatesWithWindowsLineEndingsGiveTheSameC() throws IOException {
        // a checkout or an editor that writes \r\n must not change the emitted bytes
        Path t = dir.resolve("crlf");
        try (var files = Files.walk(Path.of("templates"))) {
            for (Path p : files.filter(Files::isRegularFile).toList()) {
                AtomicFiles.writeString(t.resolve(Path.of("templates").relativize(p).toString()),
                        Files.readString(p).replace("\n", "\r\n"));
            }
        }
        assertEquals(FirmwareEmitter.render(avrProject().build()).files(),
                FirmwareEmitter.render(avrProject().templates(Templates.fromFolder(t)).build()).files());
    }

    @Test
    void aMissingUserTemplateNamesTheTemplatesSetting() throws IOException {
        Path t = dir.resolve("templates");
        AtomicFiles.writeString(t.resolve("pic").resolve("player.c.mustache"), "{{> common/header}}\n");
        SettingError e = assertThrows(SettingError.class, () -> FirmwareEmitter.render(chimeProject().family("pic")
                .templates(Templates.fromFolder(t)).build()));
        assertEquals(Setting.TEMPLATES, e.setting());
        assertEquals(t.resolve("pic/player.h.mustache") + ": template not found in --templates folder (copy the"
                + " bundled templates folder and edit it)", e.render(TimerSolverTest::optionName));
        AtomicFiles.writeString(t.resolve("pic").resolve("player.h.mustache"), "{{> common/header}}\n");
        e = assertThrows(SettingError.class, () -> FirmwareEmitter.render(chimeProject().family("pic")
                .templates(Templates.fromFolder(t)).build()));
        assertEquals(t.resolve("common/header.mustache") + ": template not found in target.templates folder (copy"
                + " the bundled templates folder and edit it)", e.getMessage());
    }

    // Bad input: one clear line each, and nothing written.

    private void assertRefused(String message, UnaryOperator<FirmwareRequest.Builder> change,
            FirmwareRequest.Builder base) {
        Path out = dir.resolve("out");
        InputError e = assertThrows(InputError.class, () -> FirmwareEmitter.emit(change.apply(base).build(), out));
        assertEquals(message, e.getMessage());
        assertFalse(e.getMessage().contains("\n"));
        assertFalse(Files.exists(out), "nothing may be written");
    }

    private static FirmwareRequest.Builder rp2040Project() {
        return FirmwareRequest.builder().family("rp2040").name("bell").toolVersion("0.1.0-test").pins("GPIO2-GPIO7")
                .sound("ding", ramp(6, 16, 22050));
    }

    @Test
    void rp2040NeedsNoCpuClockAndReportsItsAlarm() {
        EmitResult r = FirmwareEmitter.render(rp2040Project().build()).result();
        assertTrue(r.report().contains("target: rp2040 (Cortex-M0+, SIO GPIO_OUT_XOR, TIMER alarm on the 1 MHz"
                + " microsecond count: the CPU clock does not set the tick)"), r.report().toString());
        assertTrue(r.report().contains("tick rate: 22.05 kHz requested; alarm on the 1 MHz microsecond count:"
                + " ALARM0 += 45 155/441 µs (45 or 46 µs apart) per tick, 22.05 kHz on average (+0.0 ppm)"),
                r.report().toString());
        assertTrue(r.report().contains("port update: port GPIO, one GPIO_OUT_XOR write toggles the ladder pins that"
                + " change, all at once; other pins untouched"), r.report().toString());
        assertEquals(List.of(), r.warnings());
        // with a CPU clock the report names it, and the cycles per tick are checked against it
        List<String> warnings = FirmwareEmitter.render(rp2040Project().cpuClockHz(4e6).build()).result()
                .warnings();
        assertEquals(List.of("only 181 CPU cycles per tick: the interrupt may not finish in time; lower the sample"
                + " rate or raise the CPU clock"), warnings);
    }

    @Test
    void rp2040RefusesPinsItDoesNotHave() {
        assertRefused("target.pins PB0-PB5: target rp2040 names its pins GPIO0..GPIO29; write e.g. GPIO2 instead of"
                + " PB0", b -> b.pins("PB0-PB5"), rp2040Project());
        assertRefused("target.pins GPIO26-GPIO31: GPIO30 is not a pin of target rp2040 (GPIO0..GPIO29)",
                b -> b.pins("GPIO26-GPIO31"), rp2040Project());
        assertRefused("sweep.button PC5: target rp2040 names its pins GPIO0..GPIO29; write e.g. GPIO2 instead of"
                + " PC5", b -> b.sweep(SweepSpec.onButton(6, new int[] {1, 2}, "PC5")), rp2040Project());
        assertRefused("target.pins GPIO2-GPIO7: target avr names its ports by letter (PORTB, GPIOB); write e.g."
                + " PB0 instead of GPIO2", b -> b.pins("GPIO2-GPIO7"), avrProject());
    }

    @Test
    void refusesDuplicatePins() {
        assertRefused("target.pins 'PD2-PD6,PD4': pin PD4 at column 9 is already bit 2; each pin may appear once",
                b -> b.pins("PD2-PD6,PD4"), avrProject());
    }

    @Test
    void refusesAPinBeyondThePortWidth() {
        assertRefused("target.pins 'PD3-PD8': pin PD8 at column 5 is beyond the 8-bit port (pins 0-7)",
                b -> b.pins("PD3-PD8"), avrProject());
    }

    @Test
    void refusesMoreBitsThanPins() {
        assertRefused("target.pins PD2-PD6 lists 5 pins but the codes have 6 bits; list exactly one pin per bit,"
                + " bit 0 first", b -> b.pins("PD2-PD6"), avrProject());
    }

    @Test
    void refusesPinsWrittenWithoutTheirPortPrefix() {
        assertRefused("target.pins 'D2-D7': write port pins the way the datasheet names them: PD2-PD7",
                b -> b.pins("D2-D7"), avrProject());
        assertRefused("sweep.button 'D2': write port pins the way the datasheet names them: PD2",
                b -> b.pins("PB0-PB5").sweep(SweepSpec.onButton(6, new int[] {1, 2}, "D2")), avrProject());
    }

    @Test
    void refusesAnUnknownTarget() {
        assertRefused("target.family 'pic' is unknown; known target families: generic, avr, cortexm, rp2040",
                b -> b.family("pic"), avrProject());
    }

    @Test
    void refusesARateTheClockCannotMake() {
        // timer0 at 16 MHz is no slower than 16 MHz / (1024 * 256) = 61.04 Hz
        assertRefused("quantize.rate 40 Hz is too slow for timer0 (8-bit, prescalers 1/8/64/256/1024) at a 16 MHz"
                + " clock: the slowest is 61.0352 Hz; choose a wider target.timer or a higher quantize.rate",
                b -> FirmwareRequest.builder().family("avr").name("alarm").pins("PD2-PD7").cpuClockHz(16e6)
                        .timer(TimerKind.AVR_TIMER0).sound("hum", ramp(6, 16, 40)), avrProject());
        assertRefused("quantize.rate 22.05 kHz cannot be made within 100 ppm by timer1 (16-bit, prescalers"
                + " 1/8/64/256/1024) at a 16 MHz clock: the closest is 22.0386 kHz (-518.5 ppm, prescaler 1,"
                + " OCR1A = 725); use quantize.rate 22038.567 or raise target.rate_tolerance",
                b -> b.rateTolerancePpm(100), avrProject());
    }

    @Test
    void refusesATimerTheFamilyDoesNotHave() {
        assertRefused("target.timer systick is not available on target avr; use timer1, timer0, timer2",
                b -> b.timer(TimerKind.SYSTICK), avrProject());
        assertRefused("target.cpu_clock is required for target avr (the clock that drives the timer, e.g. 16MHz)",
                b -> b.cpuClockHz(Double.NaN), avrProject());
    }

    @Test
    void refusesAnOverBudgetBuildAndProposesASetting() {
        // 16,000 unpacked 8-bit samples at 16 kHz plus a 4-byte sound table. The largest smaller setting:
        // 11,025 samples at 11.025 kHz, 7 bits packed: ceil(11,025 * 7 / 8) + 4 = 9,651 bytes.
        assertRefused("the samples need 16,004 bytes, 6,004 bytes over the 10,000-byte flash budget"
                + " (target.flash_budget); 7-bit packed at 11.025 kHz would fit (9,651 bytes)",
                b -> FirmwareRequest.builder().name("chime").pins("PB0-PB7")
                        .sound("chime", ramp(8, 16000, 16000)).flashBudgetBytes(10000), avrProject());
    }

    @Test
    void refusesNamesThatCannotBecomeCIdentifiers() {
        assertRefused("sound.name '***' has no letters or digits to make a C symbol from; use e.g. sound.name"
                + " door_chime",
                b -> b.name("***"), avrProject());
        assertRefused("sound.name 'int' would make the C keyword 'int'; choose another name, e.g. int_sound",
                b -> b.name("int"), avrProject());
        assertRefused("sound name '!' cannot become a C identifier; use letters, digits and underscores, not a C"
                + " keyword, at most 40 characters, e.g. door_chime", b -> b.sound("!", ramp(6, 16, 22050)),
                avrProject());
        assertRefused("sound name 'Count' would clash with DOOR_CHIME_SOUND_COUNT; rename the sound",
                b -> b.sound("Count", ramp(4, 4, 8000)), chimeProject());
        assertRefused("sounds 'ding' and 'Ding' both become the C name 'ding'; rename one",
                b -> b.sound("Ding", ramp(4, 4, 8000)), chimeProject());
    }

    @Test
    void refusesMismatchedSounds() {
        assertRefused("sounds 'ding' (8 kHz) and 'fast' (16 kHz) differ in sample rate; resample them to one"
                + " quantize.rate",
                b -> b.sound("fast", ramp(4, 4, 16000)), chimeProject());
        assertRefused("the dds wavetable 'wave' has 100 samples; it needs a power of two from 2 to 65536 (one"
                + " period)", b -> FirmwareRequest.builder().name("osc").pins("PB0-PB5").engine(PlaybackEngine.DDS)
                        .sound("wave", ramp(6, 100, 8000)), chimeProject());
    }

    @Test
    void aButtonRefusedByThePinRulesNamesTheButton() {
        SettingError e = assertThrows(SettingError.class, () -> FirmwareEmitter.render(avrProject()
                .sweep(SweepSpec.onButton(6, new int[] {1, 2}, "PD9")).build()));
        assertEquals(Setting.BUTTON, e.setting());
        assertEquals("--button 'PD9': pin PD9 at column 1 is beyond the 8-bit port (pins 0-7)",
                e.render(TimerSolverTest::optionName));
    }

    @Test
    void refusesAButtonOnALadderPin() {
        assertRefused("sweep.button PD3 is also ladder bit 1 in target.pins; choose a free pin",
                b -> b.sweep(SweepSpec.onButton(6, new int[] {1, 2}, "PD3")), avrProject());
    }
}
