package org.rungtone.firmware;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.rungtone.internal.Checks;
import org.rungtone.internal.InputError;
import org.rungtone.internal.Setting;
import org.rungtone.internal.SettingError;
import org.rungtone.quantize.Codes;

/**
 * A {@link FirmwareRequest} checked and resolved: family, symbol, pin map and strategy, timer setting,
 * sample layout and table sizes. Every user error surfaces here, before any file is written.
 */
final class EmitPlan {
    /** Fewer CPU cycles than this between ticks draws a warning (common practice, no source). */
    private static final long MIN_CYCLES_PER_TICK = 200;

    final FirmwareRequest request;
    final TargetFamily family;
    final String folder;
    final String symbol;
    final String macro;
    final PlaybackEngine engine;
    final int bits;
    final PinMap pins;
    final PinStrategy strategy;
    final Optional<Pin> button;
    final double requestedRateHz;
    final Optional<TimerSetting> timer;
    final double tickRateHz;
    /** The achieved tick rate as an exact fraction. */
    final TickRate tickRate;
    final List<SoundClip> sounds;
    final List<String> soundSymbols;
    final int[] samples;
    final long[] soundStarts;
    final SampleStorage storage;
    /** The Tread part of a Tread store (clip and loop engines), else null. */
    final TreadPlan tread;
    final boolean wideIndex;
    final long sampleBytes;
    /** True when the sample table is too big for an avr-gcc array and is defined in assembler. */
    final boolean samplesInAssembler;
    final long soundTableBytes;
    final long pinTableBytes;
    final long sweepBytes;
    final long ddsTuningWord;
    final List<String> warnings = new ArrayList<>();

    private EmitPlan(FirmwareRequest r) {
        request = r;
        Setting.NAME.check(r.name() != null, "is required: it prefixes every C symbol, e.g. %s chime",
                Setting.NAME.ref());
        symbol = CNames.symbol(r.name());
        macro = CNames.macro(symbol);
        String[] resolved = resolveFamily(r);
        family = TargetFamily.parse(resolved[0]);
        folder = resolved[1];
        engine = r.engine();
        sounds = engine == PlaybackEngine.SWEEP ? List.of() : r.sounds();
        checkEngineInputs(r);
        bits = engine == PlaybackEngine.SWEEP ? r.sweep().orElseThrow().bits() : sounds.get(0).codes().bits();
        soundSymbols = soundSymbols(sounds);
        requestedRateHz = engine == PlaybackEngine.SWEEP ? SweepSpec.TICK_HZ : commonRate(sounds);

        int width = r.portWidth().orElse(r.pinMap().map(PinMap::portWidth).orElse(family.defaultPortWidth()));
        Setting.PORT_WIDTH.check(family.portWidths().contains(width), "%d is not available for target %s; use %s",
                width, family.folder(), family.portWidths());
        PinMap map = r.pinMap().orElseGet(() -> PinMap.parse(r.pins().orElseThrow(() -> Setting.PINS.error(
                "is required: list one pin per code bit, bit 0 first, e.g. PB0-PB%d", bits - 1)), width));
        Setting.PINS.check(map.portWidth() == width, "was parsed for %d-bit ports, but the target uses %d",
                map.portWidth(), width);
        for (Pin p : map.pins()) {
            checkPinName(Setting.PINS, map.notation(), p);
        }
        map.requireBits(bits);
        pins = map;
        strategy = map.resolve(r.pinStrategy());
        button = resolveButton(r, map, width);

        timer = solveTimer(r);
        tickRateHz = timer.map(TimerSetting::achievedHz).orElse(requestedRateHz);
        tickRate = timer.map(TickRate::of).orElseGet(() -> TickRate.ofHz(requestedRateHz));

        samples = concat();
        soundStarts = starts();
        storage = r.storage();
        tread = storage.codec().filter(f -> engine != PlaybackEngine.SWEEP)
                .map(f -> TreadPlan.of(f, engine, sounds, bits)).orElse(null);
        long total = samples.length;
        Checks.checkInput(total * bits < (1L << 32), "%d samples of %d bits are more than the player can"
                + " address (2^32 bits); shorten the sounds", total, bits);
        wideIndex = engine != PlaybackEngine.DDS && total > 65535;
        sampleBytes = storage.bytes(total, bits);
        samplesInAssembler = family == TargetFamily.AVR && AssemblerTable.needed(sampleBytes);
        int arrays = engine == PlaybackEngine.LOOP ? 4 : 2;
        soundTableBytes = isClip() ? (long) sounds.size() * arrays * (wideIndex ? 4 : 2) : 0;
        pinTableBytes = strategy == PinStrategy.TABLE ? map.tableBytes() : 0;
        sweepBytes = r.sweep().filter(s -> engine == PlaybackEngine.SWEEP)
                .map(s -> (long) s.codes().length * (bits <= 8 ? 1 : 2)).orElse(0L);
        ddsTuningWord = engine == PlaybackEngine.DDS ? ddsTuning(r.dds()) : 0;
        checkSizes();
        collectWarnings();
    }

    /**
     * Checks and resolves a request.
     *
     * @throws InputError for the first problem found
     */
    static EmitPlan of(FirmwareRequest request) {
        return new EmitPlan(request);
    }

    boolean isClip() {
        return engine == PlaybackEngine.CLIP || engine == PlaybackEngine.LOOP;
    }

    long totalBytes() {
        return sampleBytes + soundTableBytes + pinTableBytes + sweepBytes + decoderBytes();
    }

    /** Flash bytes of the Tread decoder's tables and reset points (0 for the other stores). */
    long decoderBytes() {
        return tread == null ? 0 : tread.tableBytes();
    }

    /** Table bits k of the DDS wavetable. */
    int ddsTableBits() {
        return Integer.numberOfTrailingZeros(samples.length);
    }

    private static String[] resolveFamily(FirmwareRequest r) {
        String name = r.family().trim();
        try {
            TargetFamily f = TargetFamily.parse(name);
            return new String[] {f.folder(), f.folder()};
        } catch (InputError e) {
            // A user's own template folder may add a family; it is driven like the generic one.
            if (!name.isEmpty() && name.matches("[A-Za-z0-9_-]+")
                    && r.templates().exists(name, "player.c.mustache")) {
                return new String[] {TargetFamily.GENERIC.folder(), name};
            }
            throw e;
        }
    }

    private void checkEngineInputs(FirmwareRequest r) {
        switch (engine) {
            case CLIP:
            case LOOP:
                Checks.checkInput(!sounds.isEmpty(), "no sound to emit: give at least one sound");
                Checks.checkInput(sounds.size() <= 255, "at most 255 sounds per player: %d", sounds.size());
                break;
            case DDS:
                Checks.checkInput(sounds.size() == 1, "the dds engine takes exactly one wavetable: %d sounds"
                        + " given", sounds.size());
                int n = sounds.get(0).codes().length();
                Checks.checkInput(n >= 2 && n <= 65536 && Integer.bitCount(n) == 1, "the dds wavetable '%s'"
                        + " has %d samples; it needs a power of two from 2 to 65536 (one period)",
                        sounds.get(0).name(), n);
                Setting.DDS_PHASE_BITS.check(r.dds().phaseBits() >= Integer.numberOfTrailingZeros(n), "%d is"
                        + " fewer than the %d bits that index the %d-entry table", r.dds().phaseBits(),
                        Integer.numberOfTrailingZeros(n), n);
                break;
            default:
                Checks.checkInput(r.sweep().isPresent(), "the sweep engine needs a sweep (codes and a hold"
                        + " time or button)");
        }
        for (int i = 1; i < sounds.size(); i++) {
            Codes a = sounds.get(0).codes();
            Codes b = sounds.get(i).codes();
            Checks.checkInput(a.bits() == b.bits(), "sounds '%s' (%d bits) and '%s' (%d bits) differ in bit"
                    + " depth; one player drives one ladder", sounds.get(0).name(), a.bits(),
                    sounds.get(i).name(), b.bits());
        }
    }

    private List<String> soundSymbols(List<SoundClip> list) {
        List<String> out = new ArrayList<>();
        Map<String, String> seen = new HashMap<>();
        for (SoundClip s : list) {
            String sym;
            try {
                sym = CNames.symbol(s.name());
            } catch (InputError e) {
                throw new InputError("sound name '" + s.name() + "' cannot become a C identifier; use letters,"
                        + " digits and underscores, not a C keyword, at most 40 characters, e.g. door_chime", e);
            }
            Checks.checkInput(!sym.equals("count"), "sound name '%s' would clash with %s_SOUND_COUNT; rename the"
                    + " sound", s.name(), macro);
            String before = seen.put(sym, s.name());
            Checks.checkInput(before == null, "sounds '%s' and '%s' both become the C name '%s'; rename one",
                    before, s.name(), sym);
            out.add(sym);
        }
        return out;
    }

    private static double commonRate(List<SoundClip> list) {
        double rate = list.get(0).codes().sampleRateHz();
        for (SoundClip s : list) {
            Refusal.check(Setting.RATE, s.codes().sampleRateHz() == rate, "sounds '%s' (%s) and '%s' (%s) differ"
                    + " in sample rate; resample them to one %s", list.get(0).name(), Fmt.hz(rate), s.name(),
                    Fmt.hz(s.codes().sampleRateHz()), Setting.RATE.ref());
        }
        return rate;
    }

    private Optional<Pin> resolveButton(FirmwareRequest r, PinMap map, int width) {
        if (engine != PlaybackEngine.SWEEP || r.sweep().orElseThrow().buttonPin().isEmpty()) {
            return Optional.empty();
        }
        String text = r.sweep().orElseThrow().buttonPin().get();
        PinMap one;
        try {
            one = PinMap.parse(text, width);
        } catch (SettingError e) {
            // the pin rules are the ladder's; the value is the button's
            throw e.setting() == Setting.PINS ? e.about(Setting.BUTTON) : e;
        }
        Setting.BUTTON.check(one.bits() == 1, "'%s' must name one pin, e.g. PD2", text);
        Pin b = one.pin(0);
        checkPinName(Setting.BUTTON, text, b);
        int bit = map.pins().indexOf(b);
        Setting.BUTTON.check(bit < 0, "%s is also ladder bit %d in %s; choose a free pin", b.name(), bit,
                Setting.PINS.ref());
        return Optional.of(b);
    }

    /**
     * Checks that the family names its pins as {@code pin} is written: by port letter on avr and cortexm,
     * GPIO0..GPIO29 on rp2040.
     */
    private void checkPinName(Setting setting, String text, Pin pin) {
        boolean letter = !pin.numberedPort() && !pin.bankPin();
        if (family.letterPortsOnly() && setting == Setting.BUTTON) {
            setting.check(letter, "%s: target %s names its ports by letter; write e.g. PD2", text,
                    family.folder());
        } else if (family.letterPortsOnly()) {
            setting.check(letter, "%s: target %s names its ports by letter (PORTB, GPIOB); write e.g. PB0"
                    + " instead of %s", text, family.folder(), pin.name());
        }
        if (family.gpioBankOnly()) {
            setting.check(pin.bankPin(), "%s: target %s names its pins GPIO0..GPIO%d; write e.g. GPIO2 instead"
                    + " of %s", text, family.folder(), family.lastGpio(), pin.name());
            setting.check(pin.pin() <= family.lastGpio(), "%s: %s is not a pin of target %s (GPIO0..GPIO%d)",
                    text, pin.name(), family.folder(), family.lastGpio());
        }
    }

    private Optional<TimerSetting> solveTimer(FirmwareRequest r) {
        if (family.timers().isEmpty()) {
            // generic: the user's timer; solve only as a hint when both clock and timer are given
            if (r.timer().isPresent() && !Double.isNaN(r.cpuClockHz())) {
                return Optional.of(TimerSolver.solve(r.cpuClockHz(), r.timer().get(), requestedRateHz,
                        r.rateTolerancePpm()));
            }
            return Optional.empty();
        }
        Setting.CPU_CLOCK.check(!family.needsCpuClock() || !Double.isNaN(r.cpuClockHz()), "is required for"
                + " target %s (the clock that drives the timer, e.g. 16MHz)", family.folder());
        TimerKind kind = r.timer().orElse(family.defaultTimer());
        if (!family.timers().contains(kind)) {
            List<String> names = new ArrayList<>();
            family.timers().forEach(t -> names.add(t.optionName()));
            throw Setting.TIMER.error("%s is not available on target %s; use %s", kind.optionName(),
                    family.folder(), String.join(", ", names));
        }
        // the microsecond alarm counts its own 1 MHz whatever the CPU clock
        double clock = kind.microsecondAlarm() ? AlarmPeriod.COUNT_HZ : r.cpuClockHz();
        return Optional.of(TimerSolver.solve(clock, kind, requestedRateHz, r.rateTolerancePpm()));
    }

    /** CPU cycles between ticks; for the microsecond alarm only known from a given CPU clock, else max. */
    private long cpuCyclesPerTick() {
        TimerSetting t = timer.orElseThrow();
        if (!t.kind().microsecondAlarm()) {
            return t.cyclesPerTick();
        }
        return Double.isNaN(request.cpuClockHz()) ? Long.MAX_VALUE : Math.round(request.cpuClockHz() / tickRateHz);
    }

    private int[] concat() {
        long total = 0;
        for (SoundClip s : sounds) {
            total += s.codes().length();
        }
        Checks.checkInput(total <= Integer.MAX_VALUE - 8, "too many samples in one player: %d", total);
        int[] all = new int[(int) total];
        int at = 0;
        for (SoundClip s : sounds) {
            int[] c = s.codes().unsafeCodes();
            System.arraycopy(c, 0, all, at, c.length);
            at += c.length;
        }
        return all;
    }

    private long[] starts() {
        long[] out = new long[sounds.size()];
        long at = 0;
        for (int i = 0; i < out.length; i++) {
            out[i] = at;
            at += sounds.get(i).codes().length();
        }
        return out;
    }

    /**
     * The start frequency's tuning word, from the exact tick rate and the frequency to the millihertz, as
     * the emitted {@code NAME_set_frequency_millihz()} computes it, so the two agree.
     */
    private long ddsTuning(DdsSpec dds) {
        Setting.DDS_FREQUENCY.check(dds.frequencyHz() < tickRateHz, "%s is not below the tick rate %s",
                Fmt.hz(dds.frequencyHz()), Fmt.hz(tickRateHz));
        Setting.RATE.check(tickRate.fitsDdsArithmetic(), "%s is exactly %d/%d Hz, a fraction too fine for the"
                + " dds engine's 64-bit arithmetic; choose a rate the timer makes in fewer clock cycles",
                Fmt.hz(tickRateHz), tickRate.numerator(), tickRate.denominator());
        return Dds.tuningWord(Math.round(dds.frequencyHz() * 1000), tickRate.numerator(), tickRate.denominator(),
                dds.phaseBits());
    }

    private void checkSizes() {
        long total = totalBytes();
        if (total > family.maxTableBytes()) {
            // the first fix the message proposes is the setting it is about
            boolean packed = storage != SampleStorage.UNPACKED;
            throw Refusal.of(packed ? Setting.RATE : Setting.STORAGE, "target %s: the tables need %s bytes, more"
                    + " than the %s bytes that pgm_read_byte can reach; use %sa lower %s, fewer %s or a shorter"
                    + " sound", family.folder(), Fmt.bytes(total), Fmt.bytes(family.maxTableBytes()),
                    packed ? "" : Setting.STORAGE.ref() + " packed, ", Setting.RATE.ref(), Setting.BITS.ref());
        }
        Checks.checkInput(family != TargetFamily.AVR || !AssemblerTable.needed(sweepBytes), "target %s: the"
                + " sweep's %s codes take %s bytes, more than the %s bytes avr-gcc allows one array; sweep fewer"
                + " codes", family.folder(), Fmt.bytes(sweepBytes / (bits <= 8 ? 1 : 2)), Fmt.bytes(sweepBytes),
                Fmt.bytes(AssemblerTable.MAX_C_OBJECT_BYTES));
        long budget = request.flashBudgetBytes();
        if (budget > 0) {
            long fixed = soundTableBytes + pinTableBytes + sweepBytes + decoderBytes();
            List<FlashBudget.Candidate> candidates = isClip() ? FlashBudget.alternatives(samples.length,
                    requestedRateHz, bits, storage, fixed) : List.of();
            FlashBudget.check(total, budget, candidates);
        }
    }

    private void collectWarnings() {
        if (timer.isPresent() && !family.timers().isEmpty() && cpuCyclesPerTick() < MIN_CYCLES_PER_TICK) {
            warnings.add("only " + cpuCyclesPerTick() + " CPU cycles per tick: the interrupt may not"
                    + " finish in time; lower the sample rate or raise the CPU clock");
        }
        if (timer.map(TimerSetting::kind).orElse(null) == TimerKind.AVR_TIMER0) {
            warnings.add("timer0 also runs the Arduino core's millis() and delay(); they stop working");
        }
        if (family != TargetFamily.GENERIC && timer.map(TimerSetting::kind).orElse(null) == TimerKind.SYSTICK) {
            warnings.add("SysTick is taken by the player: an RTOS or HAL tick that uses it loses its rate");
        }
        if (engine == PlaybackEngine.DDS && request.dds().frequencyHz() >= tickRateHz / 2) {
            warnings.add("the DDS start frequency " + Fmt.hz(request.dds().frequencyHz()) + " is at or above half"
                    + " the tick rate: it aliases");
        }
    }
}
