package org.rungtone.firmware;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;

/**
 * The report of an emission, one line per topic: target, engine, tick rate and timer, CPU cost per tick, pins
 * and strategy, port update order and glitch, storage, flash, sounds, DDS tuning, sweep. The same lines head every
 * emitted file as its parameters.
 */
final class EmitReport {
    /** Share of the CPU the report names the highest rate for, leaving the rest to the main program. */
    static final double CPU_SHARE_LIMIT = 0.25;

    private EmitReport() {
    }

    static List<String> lines(EmitPlan p) {
        List<String> out = new ArrayList<>();
        out.add("name: " + p.symbol);
        out.add(target(p));
        out.add(engine(p));
        out.add(tick(p));
        cpu(p).ifPresent(out::add);
        out.add("pins: " + p.pins.notation() + " on " + p.pins.portWidth() + "-bit ports: "
                + String.join(", ", p.pins.describeBits()));
        out.add(strategy(p));
        out.add(portUpdate(p));
        if (p.engine != PlaybackEngine.SWEEP) {
            out.add(storage(p));
        }
        out.add(flash(p));
        for (int i = 0; i < p.sounds.size(); i++) {
            out.add(sound(p, i));
        }
        if (p.engine == PlaybackEngine.DDS) {
            out.add(dds(p));
        }
        if (p.engine == PlaybackEngine.SWEEP) {
            out.add(sweep(p));
        }
        return out;
    }

    /**
     * Estimated CPU cycles between the writes of two ports on a Cortex-M3: a store to BSRR with the value
     * ready takes about 3 (STR 2 cycles plus address set-up). An estimate; 0 when unknown (generic port hook).
     */
    static int portGapCycles(EmitPlan p) {
        return p.family == TargetFamily.CORTEXM ? 3 : 0;
    }

    private static String target(EmitPlan p) {
        String clock = Double.isNaN(p.request.cpuClockHz()) ? "" : ", CPU clock " + Fmt.hz(p.request.cpuClockHz());
        switch (p.family) {
            case AVR:
                return "target: avr (8-bit AVR, ATmega328P register names)" + clock;
            case CORTEXM:
                return "target: cortexm (32-bit Cortex-M, GPIO with BSRR, STM32F4 default addresses)" + clock;
            case RP2040:
                return "target: rp2040 (Cortex-M0+, SIO GPIO_OUT_XOR, TIMER alarm on the 1 MHz microsecond count:"
                        + " the CPU clock does not set the tick)" + clock;
            default:
                return p.folder.equals(TargetFamily.GENERIC.folder())
                        ? "target: generic C99, pins through the port hook " + p.symbol + "_port_write()" + clock
                        : "target: " + p.folder + " (the user's own templates, driven like generic)" + clock;
        }
    }

    private static String engine(EmitPlan p) {
        switch (p.engine) {
            case CLIP:
                return "engine: clip, one-shot playback of " + count(p.sounds.size(), "sound");
            case LOOP:
                return "engine: loop, playback of " + count(p.sounds.size(), "sound") + " with loop points";
            case DDS:
                return "engine: dds, wavetable oscillator";
            default:
                return "engine: sweep, measurement steps through a list of codes";
        }
    }

    private static String tick(EmitPlan p) {
        if (p.timer.isEmpty()) {
            return "tick rate: " + Fmt.hz(p.tickRateHz) + " (call " + p.symbol + "_tick() from your timer"
                    + " interrupt at this rate)";
        }
        String s = "tick rate: " + Fmt.hz(p.requestedRateHz) + " requested; " + p.timer.get().describe();
        return p.family.timers().isEmpty() ? s + " (for your timer; the generic code does not program it)" : s;
    }

    /** The measured cost of a tick at the plan's rate, where the family has figures. */
    private static Optional<String> cpu(EmitPlan p) {
        Optional<TickCost> cost = TickCost.of(p);
        if (cost.isEmpty() || Double.isNaN(p.request.cpuClockHz())) {
            return Optional.empty();
        }
        TickCost c = cost.get();
        double clock = p.request.cpuClockHz();
        String line = String.format(Locale.ROOT, "cpu: at most %d cycles per tick = %.1f %% of the CPU at %s"
                + " (%s clock); rates up to %s keep it under %.0f %%; measured in simulation (ATmega328P,"
                + " avr-gcc -Os)", c.worstCycles(), 100 * c.cpuShare(clock, p.tickRateHz), Fmt.hz(p.tickRateHz, 4),
                Fmt.hz(clock), Fmt.hz(c.maxRateHz(clock, CPU_SHARE_LIMIT), 3), 100 * CPU_SHARE_LIMIT);
        boolean assembler = AvrFastTick.applies(p) || AvrTreadTick.applies(p);
        String how = assembler ? "; the interrupt is written in assembler" : "";
        return Optional.of((c.idleOff() ? line + "; the timer interrupt is off while nothing plays" : line) + how);
    }

    private static String strategy(EmitPlan p) {
        String forced = p.request.pinStrategy() == PinStrategy.AUTO ? "" : " (forced)";
        switch (p.strategy) {
            case SHIFT:
                return "pin strategy: shift and mask, one per port" + forced;
            case TABLE:
                return "pin strategy: lookup table, " + p.pins.ports().size() + " port(s) x "
                        + Fmt.bytes(1L << p.bits) + " entries x " + p.pins.portWidth() / 8 + " byte(s) = "
                        + Fmt.bytes(p.pins.tableBytes()) + " bytes" + forced;
            default:
                String why = p.request.pinStrategy() == PinStrategy.AUTO ? " (no table above "
                        + PinMap.AUTO_TABLE_MAX_BITS + " bits)" : forced;
                return "pin strategy: bit scatter, " + PinCode.termCount(p.pins) + " mask-and-shift terms" + why;
        }
    }

    private static String portUpdate(EmitPlan p) {
        List<String> ports = p.pins.ports();
        String how;
        switch (p.family) {
            case AVR:
                how = "PORTx written directly where the ladder owns the whole port, else masked"
                        + " read-modify-write; other pins keep their levels";
                break;
            case CORTEXM:
                how = "one BSRR write per port sets and resets the ladder pins at once; other pins untouched";
                break;
            case RP2040:
                how = "one GPIO_OUT_XOR write toggles the ladder pins that change, all at once; other pins"
                        + " untouched";
                break;
            default:
                how = "one port-hook call per port with the ladder-pin mask";
        }
        if (ports.size() == 1) {
            return "port update: port " + ports.get(0) + ", " + how;
        }
        return "port update: ports " + String.join(" then ", ports) + " in this fixed order, " + gaps(p)
                + "; in between, the ladder shows a mix of the old and new code (a short glitch); " + how;
    }

    /** The time between the port writes of one update, in words. */
    private static String gaps(EmitPlan p) {
        Optional<TickCost> cost = TickCost.of(p);
        if (cost.isPresent()) {
            int w = cost.get().windowCycles();
            return "the values computed first and written back to back: " + w + " cycle" + (w == 1 ? "" : "s")
                    + nanos(p, w) + " from the first write to the last (measured in simulation)";
        }
        if (portGapCycles(p) == 0) {
            return "the gap between writes depends on your port hook";
        }
        List<String> ports = p.pins.ports();
        StringBuilder gaps = new StringBuilder();
        for (int i = 1; i < ports.size(); i++) {
            if (gaps.length() > 0) {
                gaps.append(", ");
            }
            gaps.append(ports.get(i - 1)).append(" to ").append(ports.get(i)).append(" about ")
                    .append(portGapCycles(p)).append(" cycles").append(nanos(p, portGapCycles(p)));
        }
        return gaps.toString();
    }

    private static String nanos(EmitPlan p, int cycles) {
        return Double.isNaN(p.request.cpuClockHz()) ? ""
                : String.format(Locale.ROOT, " (%.0f ns)", cycles / p.request.cpuClockHz() * 1e9);
    }

    private static String storage(EmitPlan p) {
        SampleStorage other = p.storage == SampleStorage.PACKED ? SampleStorage.UNPACKED : SampleStorage.PACKED;
        long otherBytes = other.bytes(p.samples.length, p.bits);
        if (p.tread != null) {
            double seconds = p.samples.length / p.requestedRateHz;
            long bytes = p.sampleBytes + p.decoderBytes();
            return String.format(Locale.ROOT, "storage: %s: %s bytes of stream + %s bytes of decoder tables and %s"
                    + " for %s samples (%.2f s): %.3f s per kilobyte (%s: %s bytes, %.3f s per kilobyte)",
                    p.storage.describe(p.bits), Fmt.bytes(p.sampleBytes), Fmt.bytes(p.decoderBytes()),
                    count(p.tread.resets().size(), "reset point"), Fmt.bytes(p.samples.length), seconds,
                    1000 * seconds / bytes, other.describe(p.bits), Fmt.bytes(otherBytes), 1000 * seconds / otherBytes);
        }
        return "storage: " + p.storage.describe(p.bits) + ", " + Fmt.bytes(p.sampleBytes) + " bytes for "
                + Fmt.bytes(p.samples.length) + " samples (" + other.describe(p.bits) + ": "
                + Fmt.bytes(otherBytes) + " bytes)";
    }

    private static String flash(EmitPlan p) {
        StringBuilder b = new StringBuilder("flash (tables, without code): ");
        List<String> parts = new ArrayList<>();
        if (p.sampleBytes > 0) {
            parts.add("samples " + Fmt.bytes(p.sampleBytes));
        }
        if (p.soundTableBytes > 0) {
            parts.add("sound table " + Fmt.bytes(p.soundTableBytes));
        }
        if (p.pinTableBytes > 0) {
            parts.add("pin tables " + Fmt.bytes(p.pinTableBytes));
        }
        if (p.sweepBytes > 0) {
            parts.add("sweep codes " + Fmt.bytes(p.sweepBytes));
        }
        if (p.decoderBytes() > 0) {
            parts.add("decoder tables " + Fmt.bytes(p.decoderBytes()));
        }
        b.append(String.join(" + ", parts)).append(" = ").append(Fmt.bytes(p.totalBytes())).append(" bytes");
        long budget = p.request.flashBudgetBytes();
        if (budget > 0) {
            b.append("; flash budget ").append(Fmt.bytes(budget)).append(" bytes, ")
                    .append(Fmt.bytes(budget - p.totalBytes())).append(" left");
        }
        return b.toString();
    }

    private static String sound(EmitPlan p, int i) {
        SoundClip s = p.sounds.get(i);
        String line = String.format(Locale.ROOT, "sound %d %s: %s samples, %.1f ms, from index %d", i,
                p.soundSymbols.get(i), Fmt.bytes(s.codes().length()), 1000.0 * s.codes().length()
                        / s.codes().sampleRateHz(), p.soundStarts[i]);
        if (p.engine == PlaybackEngine.LOOP) {
            line += ", loop " + s.loopStart() + " .. " + s.loopEnd() + (s.loopsWhole() ? " (whole sound)" : "");
        }
        return line;
    }

    private static String dds(EmitPlan p) {
        DdsSpec d = p.request.dds();
        double actual = Dds.actualHz(p.ddsTuningWord, p.tickRateHz, d.phaseBits());
        return String.format(Locale.ROOT, "dds: %d-bit phase accumulator, %d-entry table, resolution f_s/2^%d"
                + " = %s; %s requested: tuning word M = %d, actual %s (%s Hz off)", d.phaseBits(),
                p.samples.length, d.phaseBits(), Fmt.hz(Dds.resolutionHz(p.tickRateHz, d.phaseBits()), 4),
                Fmt.hz(d.frequencyHz()), p.ddsTuningWord, Fmt.hz(actual, 9),
                String.format(Locale.ROOT, "%+.6f", actual - d.frequencyHz()));
    }

    private static String sweep(EmitPlan p) {
        SweepSpec s = p.request.sweep().orElseThrow();
        String mode = p.button.isPresent() ? "advancing on each press of " + p.button.get().name()
                + " (active low, pull-up, " + SweepSpec.DEBOUNCE_MILLIS + " ms debounce)"
                : "each held " + Fmt.plain(s.holdMillis(), 3) + " ms (" + s.holdTicks() + " ticks)"
                        + (s.patternSteps() > 0 ? ", between a start and an end pattern of " + s.patternSteps()
                                + " steps of " + s.patternTicks() + " ticks for a recording" : "");
        String what = s.patternSteps() > 0 ? "step" : "code";
        return "sweep: " + count(s.codes().length - 2 * s.patternSteps(), what) + " at "
                + Fmt.hz(SweepSpec.TICK_HZ) + " ticks, " + mode;
    }

    private static String count(int n, String what) {
        return n + " " + what + (n == 1 ? "" : "s");
    }
}
