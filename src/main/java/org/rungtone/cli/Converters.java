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
import org.rungtone.internal.Units;
import org.rungtone.project.SurveyLists;
import org.rungtone.quantize.Compensation;
import org.rungtone.quantize.ErrorFilter;
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

    /** Registers the typed choices' converters: each type's own parser; an unknown word is a usage error. */
    static void registerChoices(picocli.CommandLine cl) {
        cl.registerConverter(ResamplerKind.class, v -> choice(v, ResamplerKind::parse));
        cl.registerConverter(ErrorFilter.class, v -> choice(v, ErrorFilter::parse));
        cl.registerConverter(OutputSpan.class, v -> choice(v, OutputSpan::parse));
        cl.registerConverter(Compensation.class, v -> choice(v, Compensation::parse));
        cl.registerConverter(TimerKind.class, v -> choice(v, TimerKind::parse));
        cl.registerConverter(PinStrategy.class, v -> choice(v, PinStrategy::parse));
        cl.registerConverter(SampleStorage.class, v -> choice(v, SampleStorage::parse));
        cl.registerConverter(PlaybackEngine.class, v -> choice(v, PlaybackEngine::parse));
        cl.registerConverter(ReconstructionFilter.class, v -> choice(v, ReconstructionFilter::parse));
    }

    /** A survey's bit depths: "1..12", "4,6,8". */
    static final class BitDepths implements ITypeConverter<SurveyLists.BitList> {
        @Override
        public SurveyLists.BitList convert(String value) {
            try {
                return SurveyLists.BitList.parse(value);
            } catch (IllegalArgumentException e) {
                throw new TypeConversionException(e.getMessage());
            }
        }
    }

    /** A survey's rates: "8k,11.025k,16kHz". */
    static final class Rates implements ITypeConverter<SurveyLists.RateList> {
        @Override
        public SurveyLists.RateList convert(String value) {
            try {
                return SurveyLists.RateList.parse(value);
            } catch (IllegalArgumentException e) {
                throw new TypeConversionException(e.getMessage());
            }
        }
    }

    private static <T> T choice(String value, java.util.function.Function<String, T> parse) {
        try {
            return parse.apply(value);
        } catch (SettingError e) {
            throw new TypeConversionException(e.detail(OptionNames::of));
        } catch (InputError e) {
            throw new TypeConversionException(e.getMessage());
        }
    }
}
