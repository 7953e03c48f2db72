package org.rungtone.cli;

import java.util.OptionalDouble;
import org.rungtone.cli.shell.Heading;
import org.rungtone.cli.shell.Section;
import org.rungtone.condition.ResamplerKind;
import org.rungtone.project.ConditioningSettings;
import org.rungtone.project.Defaults;
import picocli.CommandLine.ArgGroup;
import picocli.CommandLine.Option;

/**
 * The conditioning options that {@code build} and {@code survey} share: level (--gain or --normalize),
 * --keep-dc, --trim, --fade-in, --fade-out and --resampler.
 */
@Section(Heading.CONDITIONING)
public final class ConditioningOptions {
    /** Peak level when neither --gain nor --normalize is given, in dBFS. */

    @ArgGroup(exclusive = true)
    Level level;

    /** Either a fixed gain or a normalization target. */
    static final class Level {
        @Option(names = "--gain", paramLabel = "<dB>", converter = Converters.Decibels.class,
                description = "Fixed gain in dB instead of normalizing.")
        Double gainDb;

        @Option(names = "--normalize", paramLabel = "<dBFS>", converter = Converters.Decibels.class,
                description = "Scale so the peak reaches this level (default -1 dBFS).")
        Double normalizeDbfs;
    }

    @Option(names = "--keep-dc", description = "Do not subtract the source's mean.")
    boolean keepDc;

    @Option(names = "--trim", paramLabel = "<dBFS>", converter = Converters.Decibels.class,
            description = "Trim leading and trailing audio quieter than this, e.g. -50.")
    Double trimDbfs;

    @Option(names = "--fade-in", paramLabel = "<time>", converter = Converters.Seconds.class, defaultValue = "0",
            description = "Linear fade-in, e.g. 20ms.")
    double fadeIn;

    @Option(names = "--fade-out", paramLabel = "<time>", converter = Converters.Seconds.class, defaultValue = "0",
            description = "Linear fade-out, e.g. 50ms.")
    double fadeOut;

    @Option(names = "--resampler", paramLabel = "kaiser|tarsos", defaultValue = "kaiser",
            description = "kaiser: polyphase filter with its stopband below the target's quantization noise"
                    + " (default); tarsos: TarsosDSP's resampler, about 70 dB stopband.")
    ResamplerKind resampler;

    /** True unless --keep-dc. */
    boolean removeDc() {
        return !keepDc;
    }

    /** The --gain value, if given. */
    OptionalDouble gainDb() {
        return level != null && level.gainDb != null ? OptionalDouble.of(level.gainDb) : OptionalDouble.empty();
    }

    /** The --normalize value, its default when no --gain is given, or empty with --gain. */
    OptionalDouble normalizeDbfs() {
        if (gainDb().isPresent()) {
            return OptionalDouble.empty();
        }
        return OptionalDouble.of(level != null && level.normalizeDbfs != null ? level.normalizeDbfs
                : Defaults.NORMALIZE_DBFS);
    }

    /** The --trim threshold, if given. */
    OptionalDouble trimDbfs() {
        return trimDbfs == null ? OptionalDouble.empty() : OptionalDouble.of(trimDbfs);
    }

    /** The --resampler design. */
    ResamplerKind resampler() {
        return resampler;
    }

    /** The settings at a rate chosen elsewhere (each rate of a survey). */
    ConditioningSettings settings() {
        return new ConditioningSettings(OptionalDouble.empty(), removeDc(), trimDbfs(), gainDb(), normalizeDbfs(),
                fadeIn, fadeOut, resampler);
    }
}
