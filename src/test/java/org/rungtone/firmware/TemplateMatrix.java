package org.rungtone.firmware;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.rungtone.quantize.Codes;

/**
 * The requests that exercise every template of a family: contiguous, scattered, multi-port and wide pin maps
 * (plus forced strategies), packed and unpacked storage and one Tread store per pin case (tread2, tread3 and
 * tread4 in turn, clip and loop engines: Tread cannot serve the dds engine), every engine, the sweep with and
 * without a button and for a recording, and the family's timers in turn. Each request has its own symbol
 * prefix ({@code c000}, {@code c001}, ...), so one family's files can be compiled in one run.
 */
final class TemplateMatrix {
    /** Engine and storage combinations per pin case: three engines twice, three sweeps, two Tread engines. */
    static final int CASES_PER_PIN_MAP = 11;

    private TemplateMatrix() {
    }

    /** A pin case: map, port width, forced strategy. */
    private record PinCase(String pins, int width, PinStrategy strategy) {
    }

    /**
     * One combination.
     *
     * @param name the symbol prefix
     * @param engine clip, loop, dds, sweep, button (a sweep advanced by a button) or record (a sweep for a
     *     recording)
     */
    record Case(String name, String engine, FirmwareRequest request) {
    }

    private static List<PinCase> pinCases(TargetFamily family) {
        List<PinCase> out = new ArrayList<>();
        if (family == TargetFamily.CORTEXM) {
            out.add(new PinCase("PB0-PB5", 16, PinStrategy.AUTO));
            out.add(new PinCase("PA3,PA7,PC0,PC1,PB2,PB1", 16, PinStrategy.AUTO));
            out.add(new PinCase("PB10-PB15,PC0,PC1", 16, PinStrategy.AUTO));
            out.add(new PinCase("PA0-PA5,PB15,PB13,PB3,PB1,PC4,PC0", 16, PinStrategy.AUTO));
        } else if (family == TargetFamily.AVR) {
            // ports B, C and D, as on the ATmega328P
            out.add(new PinCase("PB0-PB5", 8, PinStrategy.AUTO));
            out.add(new PinCase("PD2,PD7,PC0,PC1,PB2,PB1", 8, PinStrategy.AUTO));
            out.add(new PinCase("PB2-PB5,PD6,PD7", 8, PinStrategy.AUTO));
            out.add(new PinCase("PD0-PD5,PB7,PB5,PB3,PB1,PC4,PC0", 8, PinStrategy.AUTO));
            out.add(new PinCase("PD0-PD7", 8, PinStrategy.AUTO));
        } else if (family == TargetFamily.RP2040) {
            // one bank, GPIO0..GPIO29
            out.add(new PinCase("GPIO2-GPIO7", 32, PinStrategy.AUTO));
            out.add(new PinCase("GPIO29,GPIO0,GPIO15,GPIO16,GPIO3,GPIO2", 32, PinStrategy.AUTO));
            out.add(new PinCase("GPIO10-GPIO15,GPIO20,GPIO21", 32, PinStrategy.AUTO));
            out.add(new PinCase("GPIO0-GPIO5,GPIO27,GPIO25,GPIO23,GPIO21,GPIO19,GPIO17", 32, PinStrategy.AUTO));
        } else {
            out.add(new PinCase("PB0-PB5", 8, PinStrategy.AUTO));
            out.add(new PinCase("PA3,PA7,PC0,PC1,PB2,PB1", 8, PinStrategy.AUTO));
            out.add(new PinCase("PB2-PB5,PD6,PD7", 8, PinStrategy.AUTO));
            out.add(new PinCase("PA0-PA5,PB7,PB5,PB3,PB1,PC4,PC0", 8, PinStrategy.AUTO));
        }
        out.add(new PinCase(out.get(0).pins(), out.get(0).width(), PinStrategy.TABLE));
        out.add(new PinCase(out.get(1).pins(), out.get(1).width(), PinStrategy.SCATTER));
        if (family == TargetFamily.GENERIC) {
            out.add(new PinCase("PA26-PA31,PB0,PB31", 32, PinStrategy.AUTO));
            out.add(new PinCase("PA26-PA31,PB0,PB31", 32, PinStrategy.TABLE));
            out.add(new PinCase("P1.0-P1.3,P2.7,P2.6", 16, PinStrategy.AUTO));
        }
        return out;
    }

    private static String buttonPin(TargetFamily family, PinCase pc) {
        if (family == TargetFamily.AVR) {
            return "PC5";
        }
        if (family == TargetFamily.RP2040) {
            return "GPIO28";
        }
        return pc.pins().startsWith("P1.") ? "P3.0" : "PE5";
    }

    /** Every combination for {@code family}, numbered from {@code c000}. */
    static List<Case> cases(TargetFamily family) {
        List<Case> out = new ArrayList<>();
        // generic programs no timer; every other case there names one, so the timer hint is rendered too
        List<TimerKind> timers = family.timers().isEmpty() ? List.of(TimerKind.GENERAL16) : family.timers();
        int n = 0;
        List<PinCase> pinCases = pinCases(family);
        for (int p = 0; p < pinCases.size(); p++) {
            PinCase pc = pinCases.get(p);
            int bits = PinMap.parse(pc.pins(), pc.width()).bits();
            SampleStorage tread = List.of(SampleStorage.TREAD2, SampleStorage.TREAD3, SampleStorage.TREAD4).get(p % 3);
            for (SampleStorage storage : List.of(SampleStorage.UNPACKED, SampleStorage.PACKED, tread)) {
                // the sweep stores no samples: its code does not depend on the storage
                List<String> engines = storage == SampleStorage.UNPACKED
                        ? List.of("clip", "loop", "dds", "sweep", "button", "record")
                        : storage == SampleStorage.PACKED ? List.of("clip", "loop", "dds") : List.of("clip", "loop");
                for (String engine : engines) {
                    String name = String.format(Locale.ROOT, "c%03d", n);
                    FirmwareRequest.Builder b = FirmwareRequest.builder().family(family.folder()).name(name)
                            .toolVersion("test").pins(pc.pins()).portWidth(pc.width()).pinStrategy(pc.strategy())
                            .storage(storage).cpuClockHz(16e6);
                    if (family != TargetFamily.GENERIC || n % 2 == 1) {
                        b.timer(timers.get(n % timers.size()));
                    }
                    // rp2040's alarm carries a fraction of a microsecond at 22.05 kHz, not at 8 kHz (125 us)
                    double ddsRate = family == TargetFamily.RP2040 ? 22_050 : 8000;
                    out.add(new Case(name, engine, withEngine(b, engine, bits, buttonPin(family, pc), ddsRate,
                            storage).build()));
                    n++;
                }
            }
        }
        return out;
    }

    private static FirmwareRequest.Builder withEngine(FirmwareRequest.Builder b, String engine, int bits,
            String button, double ddsRate, SampleStorage storage) {
        switch (engine) {
            case "clip":
                return b.sound(HostReplayTest.chimeClip("door", storage, bits, 200, 0, 200))
                        .sound(HostReplayTest.chimeClip("bell", storage, bits, 120, 0, 120));
            case "loop":
                return b.engine(PlaybackEngine.LOOP).sound(HostReplayTest.chimeClip("warble", storage, bits, 300, 50,
                        250));
            case "dds":
                return b.engine(PlaybackEngine.DDS).sound("sine", Codes.of(bits, ddsRate, Dds.sineTable(6, bits)))
                        .dds(DdsSpec.of(440));
            case "sweep":
                return b.sweep(SweepSpec.holding(bits, new int[] {0, (1 << bits) - 1, 1}, 500));
            case "record":
                return b.sweep(SweepSpec.recording(bits, new int[] {0, (1 << bits) - 1, 0, 1, 2, 0, (1 << bits) - 1},
                        40, 2, 20));
            default:
                return b.sweep(SweepSpec.onButton(bits, new int[] {0, 3, 1 << (bits - 1)}, button));
        }
    }
}
