package org.rungtone.firmware;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.OptionalLong;

/**
 * What an emission chose and computed, as values for machine-readable reports: the same facts the report
 * lines of {@link EmitResult#report()} put into words.
 *
 * @param name the C symbol prefix
 * @param family the target family's folder: {@code avr}, {@code cortexm}, {@code rp2040}, {@code generic}, or
 *     the name of the user's own template folder
 * @param cpuClockHz the CPU clock, when given
 * @param engine {@code clip}, {@code loop}, {@code dds} or {@code sweep}
 * @param tick the tick rate and the timer that makes it
 * @param pins the pins, their order of writes and the strategy
 * @param storage how samples are stored (empty for the sweep program, which stores codes)
 * @param flash bytes of the emitted tables, without code
 * @param sounds every sound, in the order of its id
 * @param dds the oscillator's tuning, for the dds engine
 * @param sweep the measurement sweep, for the sweep engine
 * @param tickCost the measured worst-case cost of one tick, where the family has figures
 */
public record FirmwareFacts(String name, String family, OptionalDouble cpuClockHz, String engine, Tick tick,
        Pins pins, Optional<Storage> storage, Flash flash, List<Sound> sounds, Optional<Oscillator> dds,
        Optional<Sweep> sweep, Optional<TickCost> tickCost) {
    /** Copies the list. */
    public FirmwareFacts {
        sounds = List.copyOf(sounds);
    }

    /**
     * The tick rate.
     *
     * @param requestedHz the rate asked for
     * @param achievedHz the rate the timer gives (equal to the requested one without a timer)
     * @param timerProgrammed true when the emitted code programs the timer itself
     * @param timer the solved timer, when the target has one or one was named
     */
    public record Tick(double requestedHz, double achievedHz, boolean timerProgrammed, Optional<Timer> timer) {
    }

    /**
     * A solved timer (see {@link TimerSetting}).
     *
     * @param name the timer's option name ({@code timer1}, {@code tim2}, {@code alarm0}, ...)
     * @param clockHz its input clock (1 MHz for the microsecond alarm)
     * @param prescaler its clock divider
     * @param reloadRegister the register that holds the period
     * @param reload the value written there
     * @param cyclesPerTick input clock cycles between interrupts
     * @param errorPpm (achieved − requested) / requested in parts per million
     */
    public record Timer(String name, double clockHz, int prescaler, String reloadRegister, long reload,
            long cyclesPerTick, double errorPpm) {
    }

    /**
     * The pins.
     *
     * @param notation the pin list as written ({@code PD2-PD7})
     * @param portWidthBits the width of the target's ports
     * @param byBit the pin of every code bit, bit 0 (LSB) first
     * @param strategy how codes become port values: {@code shift}, {@code table} or {@code scatter}
     * @param strategyForced true when the request named the strategy
     * @param writeOrder the ports in the order the tick writes them
     * @param gapCycles estimated CPU cycles between the writes of two consecutive ports (one entry fewer
     *     than ports; 0 where unknown)
     */
    public record Pins(String notation, int portWidthBits, List<String> byBit, String strategy,
            boolean strategyForced, List<String> writeOrder, List<Integer> gapCycles) {
        /** Copies the lists. */
        public Pins {
            byBit = List.copyOf(byBit);
            writeOrder = List.copyOf(writeOrder);
            gapCycles = List.copyOf(gapCycles);
        }
    }

    /**
     * Sample storage.
     *
     * @param layout {@code unpacked} or {@code packed}
     * @param bytes bytes of sample data
     * @param samples samples stored
     * @param otherLayoutBytes what the other layout would take
     */
    public record Storage(String layout, long bytes, long samples, long otherLayoutBytes) {
    }

    /**
     * Flash of the emitted tables.
     *
     * @param sampleBytes samples
     * @param soundTableBytes the table of sound starts, lengths and loops
     * @param pinTableBytes per-port lookup tables
     * @param sweepCodeBytes the sweep program's codes
     * @param totalBytes all of them
     * @param budgetBytes the flash budget, when given
     */
    public record Flash(long sampleBytes, long soundTableBytes, long pinTableBytes, long sweepCodeBytes,
            long totalBytes, OptionalLong budgetBytes) {
    }

    /**
     * One sound.
     *
     * @param id its index, the value of its id constant
     * @param symbol its C name
     * @param samples its length in samples
     * @param durationSeconds its length in seconds
     * @param startIndex its first sample in the sample array
     * @param loop its loop points, for the loop engine
     */
    public record Sound(int id, String symbol, int samples, double durationSeconds, long startIndex,
            Optional<Loop> loop) {
    }

    /**
     * Loop points.
     *
     * @param start first sample of the loop
     * @param end one past its last sample
     * @param whole true when the loop is the whole sound
     */
    public record Loop(int start, int end, boolean whole) {
    }

    /**
     * The oscillator's tuning (Analog Devices MT-085: f_out = M · f_s / 2^n).
     *
     * @param phaseBits n, bits of the phase accumulator
     * @param tableEntries entries of the wavetable
     * @param resolutionHz f_s / 2^n
     * @param requestedHz the frequency asked for
     * @param tuningWord M
     * @param actualHz the frequency M gives
     */
    public record Oscillator(int phaseBits, int tableEntries, double resolutionHz, double requestedHz, long tuningWord,
            double actualHz) {
    }

    /**
     * The measurement sweep.
     *
     * @param codes codes in the sweep
     * @param tickHz its tick rate
     * @param holdMillis how long each code is held, when it steps by time
     * @param holdTicks the same in ticks
     * @param buttonPin the pin whose button steps it, when it steps by button
     * @param debounceMillis the button's debounce time
     */
    public record Sweep(int codes, double tickHz, OptionalDouble holdMillis, OptionalLong holdTicks,
            Optional<String> buttonPin, int debounceMillis) {
    }

    /** The facts of a checked plan. */
    static FirmwareFacts of(EmitPlan p) {
        FirmwareRequest r = p.request;
        OptionalDouble clock = Double.isNaN(r.cpuClockHz()) ? OptionalDouble.empty()
                : OptionalDouble.of(r.cpuClockHz());
        Optional<Timer> timer = p.timer.map(t -> new Timer(t.kind().optionName(), t.clockHz(), t.prescaler(),
                t.kind().reloadRegister(), t.reload(), t.cyclesPerTick(), t.errorPpm()));
        Tick tick = new Tick(p.requestedRateHz, p.tickRateHz, p.timer.isPresent() && !p.family.timers().isEmpty(),
                timer);
        return new FirmwareFacts(p.symbol, p.folder, clock, p.engine.name().toLowerCase(java.util.Locale.ROOT),
                tick, pins(p), storage(p), new Flash(p.sampleBytes, p.soundTableBytes, p.pinTableBytes,
                        p.sweepBytes, p.totalBytes(), r.flashBudgetBytes() > 0 ? OptionalLong.of(r.flashBudgetBytes())
                        : OptionalLong.empty()), sounds(p), dds(p), sweep(p), TickCost.of(p));
    }

    private static Pins pins(EmitPlan p) {
        List<String> byBit = new ArrayList<>();
        for (Pin pin : p.pins.pins()) {
            byBit.add(pin.name());
        }
        List<String> ports = p.pins.ports();
        List<Integer> gaps = new ArrayList<>();
        for (int i = 1; i < ports.size(); i++) {
            gaps.add(EmitReport.portGapCycles(p));
        }
        return new Pins(p.pins.notation(), p.pins.portWidth(), byBit, p.strategy.optionName(),
                p.request.pinStrategy() != PinStrategy.AUTO, ports, gaps);
    }

    private static Optional<Storage> storage(EmitPlan p) {
        if (p.engine == PlaybackEngine.SWEEP) {
            return Optional.empty();
        }
        SampleStorage other = p.storage == SampleStorage.PACKED ? SampleStorage.UNPACKED : SampleStorage.PACKED;
        return Optional.of(new Storage(p.storage.optionName(), p.sampleBytes, p.samples.length,
                other.bytes(p.samples.length, p.bits)));
    }

    private static List<Sound> sounds(EmitPlan p) {
        List<Sound> out = new ArrayList<>();
        for (int i = 0; i < p.sounds.size(); i++) {
            SoundClip s = p.sounds.get(i);
            Optional<Loop> loop = p.engine == PlaybackEngine.LOOP
                    ? Optional.of(new Loop(s.loopStart(), s.loopEnd(), s.loopsWhole())) : Optional.empty();
            out.add(new Sound(i, p.soundSymbols.get(i), s.codes().length(),
                    s.codes().length() / s.codes().sampleRateHz(), p.soundStarts[i], loop));
        }
        return out;
    }

    private static Optional<Oscillator> dds(EmitPlan p) {
        if (p.engine != PlaybackEngine.DDS) {
            return Optional.empty();
        }
        DdsSpec d = p.request.dds();
        return Optional.of(new Oscillator(d.phaseBits(), p.samples.length,
                Dds.resolutionHz(p.tickRateHz, d.phaseBits()), d.frequencyHz(), p.ddsTuningWord,
                Dds.actualHz(p.ddsTuningWord, p.tickRateHz, d.phaseBits())));
    }

    private static Optional<Sweep> sweep(EmitPlan p) {
        if (p.engine != PlaybackEngine.SWEEP) {
            return Optional.empty();
        }
        SweepSpec s = p.request.sweep().orElseThrow();
        boolean button = p.button.isPresent();
        return Optional.of(new Sweep(s.codes().length, SweepSpec.TICK_HZ,
                button ? OptionalDouble.empty() : OptionalDouble.of(s.holdMillis()),
                button ? OptionalLong.empty() : OptionalLong.of(s.holdTicks()),
                p.button.map(Pin::name), SweepSpec.DEBOUNCE_MILLIS));
    }
}
