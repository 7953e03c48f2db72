package org.rungtone.firmware;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import org.rungtone.codec.TreadFormat;
import org.rungtone.codec.TreadState;
import org.rungtone.codec.TreadStream;
import org.rungtone.quantize.Codes;

class TickCostTest {
    private static FirmwareRequest.Builder avr(String pins, int bits) {
        return FirmwareRequest.builder().family("avr").name("t").toolVersion("test").pins(pins).cpuClockHz(16e6)
                .sound("s", Codes.of(bits, 16000, new int[] {0, 1, 2, 3}));
    }

    private static TickCost cost(FirmwareRequest r) {
        return TickCost.of(EmitPlan.of(r)).orElseThrow();
    }

    @Test
    void avrFiguresGrowWithStoragePortsAndLooping() {
        // whole-byte unpacked codes by shift or table: the assembler interrupt's figures
        assertEquals(new TickCost(60, 0, true), cost(avr("PD2-PD7", 6).build()));
        assertEquals(new TickCost(90, 2, true), cost(avr("PD2,PD7,PC0,PC1,PB2,PB1", 6).build()));
        assertEquals(new TickCost(70, 0, true), cost(avr("PD2-PD7", 6).engine(PlaybackEngine.LOOP).build()));
        assertEquals(new TickCost(110, 0, true), cost(avr("PD2-PD7", 6).storage(SampleStorage.PACKED).build()));
        assertEquals(new TickCost(95, 1, true), cost(avr("PD2-PD7,PB0-PB3", 10).build()));
        assertEquals(new TickCost(105, 2, true), cost(avr("PD2,PD7,PC0,PC1,PB2,PB1", 6).engine(PlaybackEngine.LOOP)
                .build()));
        assertEquals(new TickCost(140, 2, true), cost(avr("PD2,PD7,PC0,PC1,PB2,PB1", 6).engine(PlaybackEngine.LOOP)
                .storage(SampleStorage.PACKED).build()));
    }

    @Test
    void treadFiguresAreThoseOfTheirFormatAndEngine() {
        // measured by AvrSimulatorTest: the assembler tick, a one-port ladder of up to 8 bits, 16 kHz, ATmega328P
        assertEquals(new TickCost(115, 0, true), cost(tread(SampleStorage.TREAD2, PlaybackEngine.CLIP, "PD2-PD7")));
        assertEquals(new TickCost(130, 0, true), cost(tread(SampleStorage.TREAD3, PlaybackEngine.LOOP, "PD2-PD7")));
        assertEquals(new TickCost(120, 0, true), cost(tread(SampleStorage.TREAD4, PlaybackEngine.LOOP, "PD2-PD7")));
        // three ports by table
        assertEquals(new TickCost(150, 2, true), cost(tread(SampleStorage.TREAD3, PlaybackEngine.LOOP,
                "PD2,PD7,PC0,PC1,PB2,PB1")));
        // 16 kHz x 115 cycles of 16 MHz: 11.5 % of the CPU
        assertEquals(0.115, cost(tread(SampleStorage.TREAD4, PlaybackEngine.CLIP, "PD2-PD7")).cpuShare(16e6, 16000),
                1e-12);
    }

    @Test
    void treadCodesPastEightBitsHaveTheirOwnRows() {
        // the assembler tick with the 16-bit decoder: 11 bits over two ports, 12 over three
        assertEquals(new TickCost(190, 1, true), cost(wide(SampleStorage.TREAD3, 11, "PD2-PD7,PB0-PB4")));
        assertEquals(new TickCost(190, 2, true), cost(wide(SampleStorage.TREAD4, 12, "PD2-PD7,PB0-PB3,PC0-PC1")));
    }

    private static FirmwareRequest wide(SampleStorage storage, int bits, String pins) {
        SoundClip clip = HostReplayTest.chimeClip("s", storage, bits, 64, 0, 64);
        return FirmwareRequest.builder().family("avr").name("t").toolVersion("test").pins(pins).cpuClockHz(16e6)
                .storage(storage).engine(PlaybackEngine.LOOP).sound(clip).build();
    }

    @Test
    void treadScatterMapsKeepTheCompiledTick() {
        FirmwareRequest r = tread(SampleStorage.TREAD3, PlaybackEngine.LOOP, "PD2-PD7").toBuilder()
                .pinStrategy(PinStrategy.SCATTER).build();
        assertEquals(new TickCost(180, 0, true), cost(r));
    }

    @Test
    void treadWideIndicesAddTheCountsThirdByte() {
        // more than 65,535 samples in all: 32-bit indices
        SoundClip longer = SoundClip.encoded("l", TreadStream.of(TreadFormat.TREAD2, 6, 8000,
                new TreadState(32, 32, 0), new int[70_000]), 0, 70_000);
        FirmwareRequest r = tread(SampleStorage.TREAD2, PlaybackEngine.CLIP, "PD2-PD7").toBuilder().sound(longer)
                .build();
        assertEquals(new TickCost(115 + 5, 0, true), cost(r));
    }

    private static FirmwareRequest tread(SampleStorage storage, PlaybackEngine engine, String pins) {
        SoundClip clip = HostReplayTest.chimeClip("s", storage, 6, 64, 0, 64);
        return FirmwareRequest.builder().family("avr").name("t").toolVersion("test").pins(pins).cpuClockHz(16e6)
                .storage(storage).engine(engine).sound(clip).build();
    }

    @Test
    void scatterTermsPastOnePerPortAddToTheFigure() {
        // 12 bits over D, B, C, four terms per port: 3 ports (105) + 9 extra terms x 17 = 258
        TickCost c = cost(avr("PD2,PB0,PC0,PD3,PB1,PC1,PD4,PB2,PC2,PD5,PB3,PC3", 12).build());
        assertEquals(105 + 9 * 17, c.worstCycles());
    }

    @Test
    void onlyAvrHasFigures() {
        assertTrue(TickCost.of(EmitPlan.of(FirmwareRequest.builder().name("t").pins("PB0-PB5")
                .sound("s", Codes.of(6, 16000, new int[] {0, 1})).build())).isEmpty());
    }

    @Test
    void shareAndHighestRateFollowFromTheCycles() {
        TickCost c = new TickCost(80, 0, true);
        // 80 cycles x 16,000 ticks/s of 16,000,000 cycles/s = 8 %; 25 % of 16 MHz / 80 = 50 kHz
        assertEquals(0.08, c.cpuShare(16e6, 16000), 1e-12);
        assertEquals(50000, c.maxRateHz(16e6, 0.25), 1e-9);
    }
}
