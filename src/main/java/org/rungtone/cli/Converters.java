package org.rungtone.cli;

import org.rungtone.analysis.ReconstructionFilter;
import org.rungtone.calibrate.OutputSpan;
import org.rungtone.condition.ResamplerKind;
import org.rungtone.firmware.PinStrategy;
import org.rungtone.firmware.PlaybackEngine;
import org.rungtone.firmware.SampleStorage;
import org.rungtone.firmware.TimerKind;
import org.rungtone.internal.InputError;
import org.rungtone.internal.SettingError;
import org.rungtone.quantize.Compensation;
import org.rungtone.quantize.ErrorFilter;
import org.rungtone.internal.Units;
import picocli.CommandLine.ITypeConverter;
import picocli.CommandLine.TypeConversionException;

/** Option converters for quantities with units; a bad value is a usage error (exit 2). */
final class Converters {
    private Converters() {
    }

    private static double parse(String text, String unit) {
        try {
            return Units.parse(text, unit);
        } catch (InputError e) {
            throw new TypeConversionException(e.getMessage());
        }
    }

    /** Hertz: 16k, 16kHz, 22050. */
    static final class Hertz implements ITypeConverter<Double> {
        @Override
        public Double convert(String value) {
            return parse(value, "Hz");
        }
    }

    /** Seconds: 250ms, 1.5s, 0.2. */
    static final class Seconds implements ITypeConverter<Double> {
        @Override
        public Double convert(String value) {
            return parse(value, "s");
        }
    }

    /** Volts: 5V, 3.3, 600mV. */
    static final class Volts implements ITypeConverter<Double> {
        @Override
        public Double convert(String value) {
            return parse(value, "V");
        }
    }

    /** Decibels: -1, -1dB, +6dB. */
    static final class Decibels implements ITypeConverter<Double> {
        @Override
        public Double convert(String value) {
            try {
                return Units.parseDecibels(value);
            } catch (InputError e) {
                throw new TypeConversionException(e.getMessage());
            }
        }
    }

    /** A reconstruction filter: none, rc:HZ or lp2:HZ[:Q] (see {@link ReconstructionFilter#parse}). */
    static final class Filter implements ITypeConverter<ReconstructionFilter> {
        @Override
        public ReconstructionFilter convert(String value) {
            try {
                return ReconstructionFilter.parse(value);
            } catch (InputError e) {
                throw new TypeConversionException(e.getMessage());
            }
        }
    }

    /** A byte count with optional k/M suffix (binary multiples are not used: 32k is 32,000). */
    static final class Bytes implements ITypeConverter<Long> {
        @Override
        public Long convert(String value) {
            String v = value.trim();
            if (v.endsWith("B")) {
                v = v.substring(0, v.length() - 1);
            }
            try {
                long n = Units.parseCount(v);
                if (n <= 0) {
                    throw new TypeConversionException("'" + value + "' must be a positive number of bytes");
                }
                return n;
            } catch (InputError e) {
                throw new TypeConversionException("'" + value + "' is not a byte count (e.g. 32000, 32k)");
            }
        }
    }

    /** A choice read by its type's own parser; an unknown word is a usage error naming the choices. */
    private static <T> T choice(String value, java.util.function.Function<String, T> parse) {
        try {
            return parse.apply(value);
        } catch (SettingError e) {
            throw new TypeConversionException(e.detail(OptionNames::of));
        } catch (InputError e) {
            throw new TypeConversionException(e.getMessage());
        }
    }

    /** Resampler design: kaiser, tarsos. */
    static final class Resampler implements ITypeConverter<ResamplerKind> {
        @Override
        public ResamplerKind convert(String value) {
            return choice(value, ResamplerKind::parse);
        }
    }

    /** Noise shaping: none, first, second. */
    static final class Shaping implements ITypeConverter<ErrorFilter> {
        @Override
        public ErrorFilter convert(String value) {
            return choice(value, ErrorFilter::parse);
        }
    }

    /** Output span: full, nominal. */
    static final class Span implements ITypeConverter<OutputSpan> {
        @Override
        public OutputSpan convert(String value) {
            return choice(value, OutputSpan::parse);
        }
    }

    /** Compensation: on, off. */
    static final class OnOff implements ITypeConverter<Compensation> {
        @Override
        public Compensation convert(String value) {
            return choice(value, Compensation::parse);
        }
    }

    /** Timer: timer0..2, systick, general16, general32. */
    static final class Timer implements ITypeConverter<TimerKind> {
        @Override
        public TimerKind convert(String value) {
            return choice(value, TimerKind::parse);
        }
    }

    /** Pin strategy: auto, shift, table, scatter. */
    static final class Strategy implements ITypeConverter<PinStrategy> {
        @Override
        public PinStrategy convert(String value) {
            return choice(value, PinStrategy::parse);
        }
    }

    /** Sample storage: unpacked, packed. */
    static final class Storage implements ITypeConverter<SampleStorage> {
        @Override
        public SampleStorage convert(String value) {
            return choice(value, SampleStorage::parse);
        }
    }

    /** Player engine: clip, loop, dds, sweep. */
    static final class Engine implements ITypeConverter<PlaybackEngine> {
        @Override
        public PlaybackEngine convert(String value) {
            return choice(value, PlaybackEngine::parse);
        }
    }
}
