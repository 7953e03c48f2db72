package org.rungtone.project;

import java.nio.file.Path;
import java.util.Objects;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.OptionalLong;
import org.rungtone.analysis.ReconstructionFilter;
import org.rungtone.codec.TreadFormat;
import org.rungtone.condition.ResamplerKind;
import org.rungtone.firmware.FirmwareRequest;
import org.rungtone.firmware.PlaybackEngine;
import org.rungtone.ladder.LadderSpec;
import org.rungtone.ladder.LevelTable;
import org.rungtone.quantize.Compensation;
import org.rungtone.quantize.Dither;
import org.rungtone.quantize.ErrorFilter;

/**
 * Everything one build of one sound needs, validated once, up front, in five parts. Immutable; made by
 * {@link #builder}, which starts from {@link Defaults}.
 *
 * @param symbol the C symbol prefix (already sanitized)
 * @param outDir where the outputs go
 * @param source where the sound comes from
 * @param conditioning how it is conditioned
 * @param quantize how it becomes codes
 * @param preview what the preview and the figures model after the DAC
 * @param firmware what is emitted around the samples
 */
public record BuildPlan(String symbol, Path outDir, SourceSettings source, ConditioningSettings conditioning,
        QuantizeSettings quantize, PreviewSettings preview, FirmwareSettings firmware) {

    /** Checks that every part is there. */
    public BuildPlan {
        Objects.requireNonNull(symbol, "symbol");
        Objects.requireNonNull(outDir, "outDir");
        Objects.requireNonNull(source, "source");
        Objects.requireNonNull(conditioning, "conditioning");
        Objects.requireNonNull(quantize, "quantize");
        Objects.requireNonNull(preview, "preview");
        Objects.requireNonNull(firmware, "firmware");
    }

    /** A builder for a plan of {@code source} whose outputs, prefixed {@code symbol}, go to {@code outDir}. */
    public static Builder builder(Path source, String symbol, Path outDir) {
        return new Builder(source, symbol, outDir);
    }

    /** The bit depth (shorthand for {@code quantize().bits()}). */
    public int bits() {
        return quantize.bits();
    }

    /** Collects the settings of a plan; every default lives here. */
    public static final class Builder {
        private final Path source;
        private final String symbol;
        private final Path outDir;
        private int channel;
        private OptionalDouble rateHz = OptionalDouble.empty();
        private boolean removeDc = true;
        private OptionalDouble trimDbfs = OptionalDouble.empty();
        private OptionalDouble gainDb = OptionalDouble.empty();
        private OptionalDouble normalizeDbfs = OptionalDouble.empty();
        private double fadeInSeconds;
        private double fadeOutSeconds;
        private ResamplerKind resampler = ResamplerKind.KAISER;
        private int bits = LadderSpec.DEFAULT_BITS;
        private Dither dither = Defaults.DITHER;
        private ErrorFilter shaping = Defaults.SHAPING;
        private long seed = Defaults.SEED;
        private Optional<LevelTable> board = Optional.empty();
        private Compensation compensation = Defaults.COMPENSATION;
        private ReconstructionFilter filter = Defaults.filter();
        private double previewRateHz = Defaults.PREVIEW_RATE_HZ;
        private double previewSeconds = Defaults.PREVIEW_SECONDS;
        private double fullScaleVolts = Defaults.FULL_SCALE_VOLTS;
        private Optional<FirmwareRequest> player = Optional.empty();
        private Optional<TreadFormat> codec = Optional.empty();
        private Optional<LoopSpan> loop = Optional.empty();
        private OptionalLong flashBudgetBytes = OptionalLong.empty();
        private String flashQualifier = "";
        private String name;
        private Optional<Path> cOutDir = Optional.empty();

        private Builder(Path source, String symbol, Path outDir) {
            this.source = source;
            this.symbol = symbol;
            this.outDir = outDir;
        }

        /** The sound's name as given, before it became a C symbol (default: the symbol itself). */
        public Builder name(String value) {
            name = value;
            return this;
        }

        /** 0 mixes all channels down (the default), 1..8 picks one. */
        public Builder channel(int value) {
            channel = value;
            return this;
        }

        /** Target sample rate; empty (the default) means the script's own, else 16 kHz. */
        public Builder rateHz(OptionalDouble value) {
            rateHz = value;
            return this;
        }

        /** Subtract the mean first (default true). */
        public Builder removeDc(boolean value) {
            removeDc = value;
            return this;
        }

        /** Trim leading and trailing audio below this level (default: no trimming). */
        public Builder trimDbfs(OptionalDouble value) {
            trimDbfs = value;
            return this;
        }

        /** Fixed gain (default none). */
        public Builder gainDb(OptionalDouble value) {
            gainDb = value;
            return this;
        }

        /** Peak normalization target (default none). */
        public Builder normalizeDbfs(OptionalDouble value) {
            normalizeDbfs = value;
            return this;
        }

        /** Fade-in and fade-out lengths (default 0). */
        public Builder fades(double inSeconds, double outSeconds) {
            fadeInSeconds = inSeconds;
            fadeOutSeconds = outSeconds;
            return this;
        }

        /** The resampler design (default kaiser). */
        public Builder resampler(ResamplerKind value) {
            resampler = value;
            return this;
        }

        /** DAC bit depth (default {@link LadderSpec#DEFAULT_BITS}). */
        public Builder bits(int value) {
            bits = value;
            return this;
        }

        /** Dither kind (default TPDF). */
        public Builder dither(Dither value) {
            dither = value;
            return this;
        }

        /** Error-feedback filter (default none). */
        public Builder shaping(ErrorFilter value) {
            shaping = value;
            return this;
        }

        /** Seed of every random process (default 1). */
        public Builder seed(long value) {
            seed = value;
            return this;
        }

        /** The board's real levels and whether to quantize onto them (default: the ideal ladder). */
        public Builder board(LevelTable levels, Compensation value) {
            board = Optional.of(levels);
            compensation = value;
            return this;
        }

        /** Reconstruction filter and preview WAV rate (default: none at 44.1 kHz). */
        public Builder preview(ReconstructionFilter value, double rateHzValue) {
            filter = value;
            previewRateHz = rateHzValue;
            return this;
        }

        /** Longest preview (default a minute); infinite for the whole sound. */
        public Builder previewSeconds(double value) {
            previewSeconds = value;
            return this;
        }

        /** Reference voltage of the ideal ladder (default 5 V). */
        public Builder fullScaleVolts(double value) {
            fullScaleVolts = value;
            return this;
        }

        /** The player around the samples (default: the sample array alone). */
        public Builder player(Optional<FirmwareRequest> value) {
            player = value;
            return this;
        }

        /**
         * The Tread format the codes are stored in (default: the player's storage, when it is a Tread one
         * and the player stores samples).
         */
        public Builder codec(Optional<TreadFormat> value) {
            codec = value;
            return this;
        }

        /** Loop points (default none). */
        public Builder loop(Optional<LoopSpan> value) {
            loop = value;
            return this;
        }

        /** Flash budget in bytes (default: no limit). */
        public Builder flashBudgetBytes(OptionalLong value) {
            flashBudgetBytes = value;
            return this;
        }

        /** Attribute that keeps a bare sample array in flash (default none). */
        public Builder flashQualifier(String value) {
            flashQualifier = value;
            return this;
        }

        /** The folder of the C files (default: the output folder). */
        public Builder cOutDir(Optional<Path> value) {
            cOutDir = value;
            return this;
        }

        /**
         * The validated plan.
         *
         * @throws org.rungtone.internal.SettingError naming the setting at fault
         */
        public BuildPlan build() {
            return new BuildPlan(symbol, outDir, new SourceSettings(source, channel, name == null ? symbol : name),
                    new ConditioningSettings(rateHz, removeDc, trimDbfs, gainDb, normalizeDbfs, fadeInSeconds,
                            fadeOutSeconds, resampler),
                    new QuantizeSettings(bits, dither, shaping, seed, board, compensation, codec.or(() -> player
                            .filter(p -> p.engine() != PlaybackEngine.SWEEP).flatMap(p -> p.storage().codec()))),
                    new PreviewSettings(filter, previewRateHz, previewSeconds, fullScaleVolts),
                    new FirmwareSettings(player, loop, flashBudgetBytes, flashQualifier, cOutDir));
        }
    }
}
