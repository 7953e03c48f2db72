package org.rungtone.firmware;

import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import java.util.Optional;
import org.rungtone.quantize.Codes;

/**
 * Everything {@link FirmwareEmitter} needs: target family, clock and timer, pin map, sample storage,
 * playback engine and the sounds. Immutable; build with {@link #builder()}. Values are checked when emitted,
 * so one bad value gives one clear error there.
 */
public final class FirmwareRequest {
    private final String family;
    private final Templates templates;
    private final String name;
    private final String toolVersion;
    private final double cpuClockHz;
    private final TimerKind timer;
    private final double rateTolerancePpm;
    private final String pins;
    private final PinMap pinMap;
    private final Integer portWidth;
    private final PinStrategy pinStrategy;
    private final SampleStorage storage;
    private final PlaybackEngine engine;
    private final List<SoundClip> sounds;
    private final DdsSpec dds;
    private final SweepSpec sweep;
    private final long flashBudgetBytes;
    private final List<String> settings;

    private FirmwareRequest(Builder b) {
        family = b.family;
        templates = b.templates;
        name = b.name;
        toolVersion = b.toolVersion;
        cpuClockHz = b.cpuClockHz;
        timer = b.timer;
        rateTolerancePpm = b.rateTolerancePpm;
        pins = b.pins;
        pinMap = b.pinMap;
        portWidth = b.portWidth;
        pinStrategy = b.pinStrategy;
        storage = b.storage;
        engine = b.engine;
        sounds = List.copyOf(b.sounds);
        dds = b.dds;
        sweep = b.sweep;
        flashBudgetBytes = b.flashBudgetBytes;
        settings = List.copyOf(b.settings);
    }

    /** A builder with the defaults: generic family, clip engine, unpacked storage, automatic pin strategy. */
    public static Builder builder() {
        return new Builder();
    }

    /** A builder holding this request's values. */
    public Builder toBuilder() {
        return new Builder(this);
    }

    /** Target family name as the user gave it ({@code generic}, {@code avr}, {@code cortexm}). */
    public String family() {
        return family;
    }

    /** Where templates come from. */
    public Templates templates() {
        return templates;
    }

    /** The user's name setting, made into the symbol prefix. */
    public String name() {
        return name;
    }

    /** Rungtone version written into every file. */
    public String toolVersion() {
        return toolVersion;
    }

    /** CPU (timer input) clock in hertz, or NaN when not given. */
    public double cpuClockHz() {
        return cpuClockHz;
    }

    /** The timer, when chosen; else the family's default. */
    public Optional<TimerKind> timer() {
        return Optional.ofNullable(timer);
    }

    /** Largest accepted sample-rate error in ppm. */
    public double rateTolerancePpm() {
        return rateTolerancePpm;
    }

    /** The pin list as text, when given as text. */
    public Optional<String> pins() {
        return Optional.ofNullable(pins);
    }

    /** The pin map, when given parsed. */
    public Optional<PinMap> pinMap() {
        return Optional.ofNullable(pinMap);
    }

    /** Port width for parsing {@link #pins()}, when given; else the family's default. */
    public Optional<Integer> portWidth() {
        return Optional.ofNullable(portWidth);
    }

    /** Requested pin strategy. */
    public PinStrategy pinStrategy() {
        return pinStrategy;
    }

    /** Sample layout. */
    public SampleStorage storage() {
        return storage;
    }

    /** Playback engine. */
    public PlaybackEngine engine() {
        return engine;
    }

    /** The sounds (clip and loop: all sounds; dds: the wavetable). */
    public List<SoundClip> sounds() {
        return sounds;
    }

    /** DDS settings. */
    public DdsSpec dds() {
        return dds;
    }

    /** The sweep, for the sweep engine. */
    public Optional<SweepSpec> sweep() {
        return Optional.ofNullable(sweep);
    }

    /** Flash budget for the emitted tables in bytes; 0 for none. */
    public long flashBudgetBytes() {
        return flashBudgetBytes;
    }

    /** Extra "key: value" lines for the header comments (source file, dither, ...). */
    public List<String> settings() {
        return settings;
    }

    @Override
    public String toString() {
        return "FirmwareRequest[" + family + ", " + engine.optionName() + ", " + sounds.size() + " sound(s)]";
    }

    /** Collects the values of a {@link FirmwareRequest}. */
    public static final class Builder {
        private String family = TargetFamily.GENERIC.folder();
        private Templates templates = Templates.bundled();
        private String name;
        private String toolVersion = "dev";
        private double cpuClockHz = Double.NaN;
        private TimerKind timer;
        private double rateTolerancePpm = TimerSolver.DEFAULT_TOLERANCE_PPM;
        private String pins;
        private PinMap pinMap;
        private Integer portWidth;
        private PinStrategy pinStrategy = PinStrategy.AUTO;
        private SampleStorage storage = SampleStorage.UNPACKED;
        private PlaybackEngine engine = PlaybackEngine.CLIP;
        private final List<SoundClip> sounds = new ArrayList<>();
        private DdsSpec dds = DdsSpec.of(DdsSpec.DEFAULT_FREQUENCY_HZ);
        private SweepSpec sweep;
        private long flashBudgetBytes;
        private final List<String> settings = new ArrayList<>();

        private Builder() {
        }

        private Builder(FirmwareRequest r) {
            family = r.family;
            templates = r.templates;
            name = r.name;
            toolVersion = r.toolVersion;
            cpuClockHz = r.cpuClockHz;
            timer = r.timer;
            rateTolerancePpm = r.rateTolerancePpm;
            pins = r.pins;
            pinMap = r.pinMap;
            portWidth = r.portWidth;
            pinStrategy = r.pinStrategy;
            storage = r.storage;
            engine = r.engine;
            sounds.addAll(r.sounds);
            dds = r.dds;
            sweep = r.sweep;
            flashBudgetBytes = r.flashBudgetBytes;
            settings.addAll(r.settings);
        }

        /** Target family: {@code generic}, {@code avr}, {@code cortexm}, or a folder of the user's templates. */
        public Builder family(String value) {
            family = Objects.requireNonNull(value);
            return this;
        }

        /** Template source; bundled by default. */
        public Builder templates(Templates value) {
            templates = Objects.requireNonNull(value);
            return this;
        }

        /** The name from which the C symbol prefix is made. */
        public Builder name(String value) {
            name = value;
            return this;
        }

        /** Rungtone version for the header comments. */
        public Builder toolVersion(String value) {
            toolVersion = Objects.requireNonNull(value);
            return this;
        }

        /** CPU clock (timer input clock) in hertz; needed by avr and cortexm. */
        public Builder cpuClockHz(double value) {
            cpuClockHz = value;
            return this;
        }

        /** Timer to program; null for the family's default. */
        public Builder timer(TimerKind value) {
            timer = value;
            return this;
        }

        /** Largest accepted error of the achieved sample rate, in ppm. */
        public Builder rateTolerancePpm(double value) {
            rateTolerancePpm = value;
            return this;
        }

        /** Pin list in {@link PinMap} notation, parsed at the family's (or the given) port width. */
        public Builder pins(String value) {
            pins = value;
            pinMap = null;
            return this;
        }

        /** An already parsed pin map. */
        public Builder pinMap(PinMap value) {
            pinMap = value;
            pins = null;
            return this;
        }

        /** Port register width for {@link #pins(String)}; null for the family's default. */
        public Builder portWidth(Integer value) {
            portWidth = value;
            return this;
        }

        /** Pin strategy; {@link PinStrategy#AUTO} by default. */
        public Builder pinStrategy(PinStrategy value) {
            pinStrategy = Objects.requireNonNull(value);
            return this;
        }

        /** Sample storage; unpacked by default. */
        public Builder storage(SampleStorage value) {
            storage = Objects.requireNonNull(value);
            return this;
        }

        /** Playback engine; clip by default. */
        public Builder engine(PlaybackEngine value) {
            engine = Objects.requireNonNull(value);
            return this;
        }

        /** Adds a sound that loops as a whole. */
        public Builder sound(String soundName, Codes codes) {
            sounds.add(SoundClip.of(soundName, codes));
            return this;
        }

        /** Adds a sound with loop points (samples; end exclusive). */
        public Builder sound(String soundName, Codes codes, int loopStart, int loopEnd) {
            sounds.add(new SoundClip(soundName, codes, loopStart, loopEnd));
            return this;
        }

        /** Adds a sound. */
        public Builder sound(SoundClip sound) {
            sounds.add(Objects.requireNonNull(sound));
            return this;
        }

        /** The engine so far. */
        public PlaybackEngine engine() {
            return engine;
        }

        /** The DDS settings so far (the defaults, or the request's this builder started from). */
        public DdsSpec dds() {
            return dds;
        }

        /** DDS settings (the dds engine uses the one sound as its wavetable). */
        public Builder dds(DdsSpec value) {
            dds = Objects.requireNonNull(value);
            return this;
        }

        /** The sweep for the sweep engine; also selects that engine. */
        public Builder sweep(SweepSpec value) {
            sweep = Objects.requireNonNull(value);
            engine = PlaybackEngine.SWEEP;
            return this;
        }

        /** Flash budget for the tables in bytes; 0 for none. */
        public Builder flashBudgetBytes(long value) {
            flashBudgetBytes = value;
            return this;
        }

        /** Adds one "key: value" line to the header comments. */
        public Builder setting(String line) {
            settings.add(Objects.requireNonNull(line));
            return this;
        }

        /** Adds "key: value" lines to the header comments. */
        public Builder settings(List<String> lines) {
            settings.addAll(lines);
            return this;
        }

        /** The request. */
        public FirmwareRequest build() {
            return new FirmwareRequest(this);
        }
    }
}
