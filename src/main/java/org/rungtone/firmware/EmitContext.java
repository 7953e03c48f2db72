package org.rungtone.firmware;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;

/**
 * The template context of an {@link EmitPlan}: every value the templates show, already formatted, so the
 * templates stay logic-free layout. Keys are documented by the templates that use them.
 */
final class EmitContext {
    private static final int PER_LINE = 16;
    private static final String INDENT = "    ";

    private EmitContext() {
    }

    /** The shared context; {@link #forFile} adds the per-file keys. */
    static Map<String, Object> build(EmitPlan p, List<String> parameters) {
        Map<String, Object> c = new LinkedHashMap<>();
        c.put("toolVersion", p.request.toolVersion());
        List<String> params = new ArrayList<>();
        for (String s : parameters) {
            params.add(s.replace("*/", "* /"));
        }
        c.put("parameters", params);
        c.put("symbol", p.symbol);
        c.put("macro", p.macro);
        c.put("guard", p.macro + "_H");
        c.put("bits", p.bits);
        int digits = CLiterals.hexDigits(p.bits);
        c.put("maxCode", CLiterals.hex((1L << p.bits) - 1, digits));
        c.put("midCode", CLiterals.hex(1L << (p.bits - 1), digits));
        c.put("tickRateHz", Math.round(p.requestedRateHz));
        c.put("timerNote", p.timer.filter(t -> !p.family.timers().isEmpty())
                .map(t -> "the timer makes " + Fmt.plain(t.achievedHz(), 3) + " Hz").orElse(null));
        c.put("ownTimer", !p.family.timers().isEmpty());
        c.put("flashNote", p.family == TargetFamily.AVR ? "PROGMEM" : null);
        c.put("flashAttr", " " + p.macro + "_FLASH");
        c.put("flash", p.macro + "_FLASH ");
        c.put("caution", false);
        putPorts(p, c);
        putEngine(p, c);
        putSamples(p, c);
        putTimer(p, c);
        return c;
    }

    /** The context for one file: the shared one plus its name, role and whether it carries the caution. */
    static Map<String, Object> forFile(Map<String, Object> shared, String fileName, String role,
            boolean caution) {
        Map<String, Object> c = new LinkedHashMap<>(shared);
        c.put("fileName", fileName);
        c.put("fileRole", role);
        c.put("caution", caution);
        return c;
    }

    private static void putPorts(EmitPlan p, Map<String, Object> c) {
        PinMap map = p.pins;
        int width = map.portWidth();
        c.put("portType", width == 8 ? "uint8_t" : width == 16 ? "uint16_t" : "uint32_t");
        c.put("portCount", map.ports().size());
        c.put("multiPort", map.ports().size() > 1);
        c.put("portOrder", String.join(", ", map.ports()));
        c.put("strategyText", strategyText(p));
        List<Map<String, Object>> ports = new ArrayList<>();
        List<Map<String, Object>> tables = new ArrayList<>();
        int index = 0;
        for (String port : map.ports()) {
            Map<String, Object> m = new LinkedHashMap<>();
            long mask = map.mask(port);
            m.put("name", port);
            m.put("lower", PinCode.lower(port));
            m.put("index", index++);
            m.put("maskHex", CLiterals.hex(mask, width / 4));
            List<String> names = new ArrayList<>();
            for (Pin pin : map.pins()) {
                if (pin.port().equals(port)) {
                    names.add(pin.name() + " = bit " + map.pins().indexOf(pin));
                }
            }
            m.put("pinList", String.join(", ", names));
            m.put("compute", PinCode.compute(map, p.strategy, port, p.symbol, p.macro));
            m.put("fullPort", mask == (1L << width) - 1);
            long moderMask = 0;
            long moderOut = 0;
            for (int pin = 0; pin < 16; pin++) {
                if ((mask >> pin & 1) != 0) {
                    moderMask |= 3L << (2 * pin);
                    moderOut |= 1L << (2 * pin);
                }
            }
            m.put("moder2Mask", CLiterals.hex(moderMask, 8));
            m.put("moderOut", CLiterals.hex(moderOut, 8));
            ports.add(m);
            if (p.strategy == PinStrategy.TABLE) {
                Map<String, Object> t = new LinkedHashMap<>(m);
                t.put("table", CLiterals.arrayBody(PinCode.table(map, port), width / 4, width > 16 ? 8 : PER_LINE,
                        INDENT));
                tables.add(t);
            }
        }
        c.put("ports", ports);
        c.put("pinTables", tables);
        List<Map<String, Object>> gpio = new ArrayList<>();
        long clockBits = 0;
        List<String> gpioNames = new ArrayList<>(map.ports());
        p.button.filter(b -> !gpioNames.contains(b.port())).ifPresent(b -> gpioNames.add(b.port()));
        for (String port : gpioNames) {
            int offset = port.charAt(0) - 'A';
            clockBits |= 1L << offset;
            gpio.add(Map.of("name", port, "offset", offset));
        }
        c.put("gpioPorts", gpio);
        c.put("gpioClockBits", CLiterals.hex(clockBits, 8));
        c.put("button", p.button.isPresent());
        p.button.ifPresent(b -> {
            c.put("buttonPin", b.name());
            c.put("buttonPort", b.port());
            c.put("buttonBit", b.pin());
            c.put("buttonModerMask", CLiterals.hex(3L << (2 * b.pin()), 8));
            c.put("buttonPullUp", CLiterals.hex(1L << (2 * b.pin()), 8));
        });
    }

    private static String strategyText(EmitPlan p) {
        switch (p.strategy) {
            case SHIFT:
                return "one mask and shift per port";
            case TABLE:
                return "one table read per port";
            default:
                return PinCode.termCount(p.pins) + " mask-and-shift terms";
        }
    }

    private static void putEngine(EmitPlan p, Map<String, Object> c) {
        c.put("clip", p.isClip());
        c.put("looping", p.engine == PlaybackEngine.LOOP);
        c.put("dds", p.engine == PlaybackEngine.DDS);
        c.put("sweep", p.engine == PlaybackEngine.SWEEP);
        c.put("soundCount", p.sounds.size());
        List<Map<String, Object>> sounds = new ArrayList<>();
        for (int i = 0; i < p.sounds.size(); i++) {
            SoundClip s = p.sounds.get(i);
            Map<String, Object> m = new LinkedHashMap<>();
            m.put("soundMacro", CNames.macro(p.soundSymbols.get(i)));
            m.put("id", i);
            m.put("lengthText", Fmt.bytes(s.codes().length()));
            m.put("durationMs", String.format(Locale.ROOT, "%.1f", 1000.0 * s.codes().length()
                    / s.codes().sampleRateHz()));
            m.put("loopStart", s.loopStart());
            m.put("loopEnd", s.loopEnd());
            sounds.add(m);
        }
        c.put("sounds", sounds);
        StringBuilder starts = new StringBuilder();
        StringBuilder ends = new StringBuilder();
        StringBuilder loopStarts = new StringBuilder();
        StringBuilder loopEnds = new StringBuilder();
        for (int i = 0; i < p.sounds.size(); i++) {
            String sep = i == 0 ? "" : ", ";
            long at = p.soundStarts[i];
            SoundClip s = p.sounds.get(i);
            starts.append(sep).append(at).append('u');
            ends.append(sep).append(at + s.codes().length()).append('u');
            loopStarts.append(sep).append(at + s.loopStart()).append('u');
            loopEnds.append(sep).append(at + s.loopEnd()).append('u');
        }
        c.put("soundStarts", starts.toString());
        c.put("soundEnds", ends.toString());
        c.put("loopStarts", loopStarts.toString());
        c.put("loopEnds", loopEnds.toString());
        if (p.engine == PlaybackEngine.DDS) {
            int n = p.request.dds().phaseBits();
            c.put("phaseBits", n);
            c.put("phaseMask", CLiterals.hex((1L << n) - 1, 8));
            c.put("tableBits", p.ddsTableBits());
            c.put("tickRateMilliHz", Math.round(p.tickRateHz * 1000));
            c.put("initialTuningWord", p.ddsTuningWord);
            c.put("initialNote", Fmt.hz(p.request.dds().frequencyHz()) + " requested, "
                    + Fmt.hz(Dds.actualHz(p.ddsTuningWord, p.tickRateHz, n), 9) + " actual");
        }
        p.request.sweep().filter(s -> p.engine == PlaybackEngine.SWEEP).ifPresent(s -> {
            c.put("sweepCount", s.codes().length);
            c.put("holdTicks", p.button.isPresent() ? null : s.holdTicks());
            c.put("debounceTicks", s.debounceTicks());
            c.put("sweepModeText", p.button.isPresent() ? "the next on each press of " + p.button.get().name()
                    : "each held " + s.holdTicks() + " ticks");
            c.put("sweepType", p.bits <= 8 ? "uint8_t" : "uint16_t");
            c.put("sweepData", CLiterals.arrayBody(s.codes(), CLiterals.hexDigits(p.bits), PER_LINE, INDENT));
        });
    }

    private static void putSamples(EmitPlan p, Map<String, Object> c) {
        boolean has = p.engine != PlaybackEngine.SWEEP;
        boolean packed = p.storage == SampleStorage.PACKED;
        c.put("hasSamples", has);
        c.put("packed", packed);
        c.put("indexType", p.wideIndex ? "uint32_t" : "uint16_t");
        c.put("sampleType", p.bits <= 8 ? "uint8_t" : "uint16_t");
        c.put("sampleCount", p.samples.length);
        c.put("sampleBytes", p.sampleBytes);
        int g = gcd(p.bits, 8);
        boolean second = 8 - g + p.bits > 8;
        boolean third = 8 - g + p.bits > 16;
        c.put("secondByte", second);
        c.put("thirdByte", third);
        c.put("wordType", third ? "uint32_t" : "uint16_t");
        List<String> ranges = new ArrayList<>();
        if (p.isClip()) {
            for (int i = 0; i < p.sounds.size(); i++) {
                ranges.add(p.soundSymbols.get(i) + " is samples " + p.soundStarts[i] + " .. "
                        + (p.soundStarts[i] + p.sounds.get(i).codes().length() - 1));
            }
        }
        c.put("soundRanges", ranges);
        if (has) {
            // Streamed to the file: a long sound's array is never one string.
            c.put("sampleData", (Templates.Streamed) out -> {
                if (packed) {
                    CLiterals.writeArrayBody(SamplePacking.pack(p.samples, p.bits), PER_LINE, INDENT, out);
                } else {
                    CLiterals.writeArrayBody(p.samples, CLiterals.hexDigits(p.bits), PER_LINE, INDENT, out);
                }
            });
        }
        boolean wordSamples = !packed && p.bits > 8;
        c.put("readSample", wordSamples ? "pgm_read_word" : "pgm_read_byte");
        c.put("readIndex", p.wideIndex ? "pgm_read_dword" : "pgm_read_word");
        c.put("readSweep", p.bits > 8 ? "pgm_read_word" : "pgm_read_byte");
    }

    private static void putTimer(EmitPlan p, Map<String, Object> c) {
        double clock = p.request.cpuClockHz();
        c.put("cpuClockHz", Double.isNaN(clock) ? 0 : Math.round(clock));
        c.put("cpuClockText", Double.isNaN(clock) ? "" : Fmt.hz(clock));
        TimerSetting t = p.timer.orElse(null);
        TimerKind k = t == null ? null : t.kind();
        c.put("timer0", k == TimerKind.AVR_TIMER0);
        c.put("timer1", k == TimerKind.AVR_TIMER1);
        c.put("timer2", k == TimerKind.AVR_TIMER2);
        c.put("systick", k == TimerKind.SYSTICK);
        c.put("tim", k == TimerKind.GENERAL16 || k == TimerKind.GENERAL32);
        if (t == null) {
            return;
        }
        c.put("timerText", t.describe());
        c.put("timerReload", t.reload());
        c.put("timerPrescaler", t.prescaler());
        c.put("cyclesPerTick", t.cyclesPerTick());
        if (k == TimerKind.AVR_TIMER0 || k == TimerKind.AVR_TIMER1 || k == TimerKind.AVR_TIMER2) {
            c.put("csBits", avrClockSelect(k, t.prescaler()));
            c.put("vector", "TIMER" + k.optionName().charAt(5) + "_COMPA_vect");
        }
        // STM32F4 defaults (RM0090): TIM2 is 32-bit at 0x40000000, IRQ 28; TIM3 16-bit at 0x40000400, IRQ 29.
        boolean wide = k == TimerKind.GENERAL32;
        c.put("timName", wide ? "TIM2" : "TIM3");
        c.put("timBase", wide ? "0x40000000" : "0x40000400");
        c.put("timIrq", wide ? 28 : 29);
        c.put("timClockBit", wide ? 0 : 1);
    }

    /**
     * The CSn2:0 clock-select bits for a prescaler, as in the ATmega328P datasheet tables "Clock Select Bit
     * Description": timers 0 and 1 select 1, 8, 64, 256, 1024 with values 1..5; timer 2 selects 1, 8, 32,
     * 64, 128, 256, 1024 with values 1..7.
     */
    static String avrClockSelect(TimerKind k, int prescaler) {
        // the timer's prescalers in ascending order are exactly the datasheet's clock-select values 1, 2, ...
        int[] order = k.prescalers().toArray();
        int value = 0;
        for (int i = 0; i < order.length; i++) {
            if (order[i] == prescaler) {
                value = i + 1;
            }
        }
        char n = k.optionName().charAt(5);
        List<String> bits = new ArrayList<>();
        for (int b = 2; b >= 0; b--) {
            if ((value >> b & 1) != 0) {
                bits.add("_BV(CS" + n + b + ")");
            }
        }
        return bits.size() == 1 ? bits.get(0) : "(" + String.join(" | ", bits) + ")";
    }

    private static int gcd(int a, int b) {
        return b == 0 ? a : gcd(b, a % b);
    }
}
