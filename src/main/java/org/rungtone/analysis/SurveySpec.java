package org.rungtone.analysis;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.OptionalLong;
import java.util.function.DoubleUnaryOperator;
import java.util.function.IntFunction;
import org.rungtone.codec.TreadFormat;
import org.rungtone.internal.Checks;
import org.rungtone.ladder.LevelTable;
import org.rungtone.quantize.Dither;
import org.rungtone.quantize.ErrorFilter;

/**
 * What a {@link Survey} explores: bit depths × sample rates, how each cell is quantized (dither, shaping,
 * seed, level table per bit depth), how it is judged (in-band cutoff per rate, target) and what it may cost
 * (flash budget, packed or unpacked samples) and which Tread stores to survey as well. Immutable; build with
 * {@link #builder()}.
 *
 * <p>Defaults: bits 1..12; rates 8, 11.025, 16 and 22.05 kHz; TPDF dither; no shaping; seed 0; ideal
 * tables; in-band cutoff {@link AnalogModel#inBandTopHz} without a filter, min(rate/2, 20 kHz); no budget;
 * no target; unpacked bytes; no Tread stores; one thread per core.
 */
public final class SurveySpec {
    private final List<Integer> bitDepths;
    private final List<Double> ratesHz;
    private final Dither dither;
    private final ErrorFilter shaping;
    private final long seed;
    private final IntFunction<LevelTable> tables;
    private final DoubleUnaryOperator inBandCutoffHz;
    private final long flashBudgetBytes;
    private final SurveyTarget target;
    private final boolean packed;
    private final List<TreadFormat> codecs;
    private final int threads;

    private SurveySpec(Builder b) {
        Checks.checkInput(!b.bitDepths.isEmpty(), "the survey needs at least one bit depth");
        Checks.checkInput(!b.ratesHz.isEmpty(), "the survey needs at least one sample rate");
        for (int bits : b.bitDepths) {
            Checks.checkBits(bits);
        }
        for (double rate : b.ratesHz) {
            Checks.checkPositive(rate, "survey sample rate");
        }
        Checks.checkInput(b.bitDepths.stream().distinct().count() == b.bitDepths.size(),
                "survey bit depths repeat: %s", b.bitDepths);
        Checks.checkInput(b.ratesHz.stream().distinct().count() == b.ratesHz.size(),
                "survey sample rates repeat: %s", b.ratesHz);
        Checks.checkArgument(b.threads >= 1, "threads must be at least 1: %d", b.threads);
        bitDepths = List.copyOf(b.bitDepths);
        ratesHz = List.copyOf(b.ratesHz);
        dither = b.dither;
        shaping = b.shaping;
        seed = b.seed;
        tables = b.tables;
        inBandCutoffHz = b.inBandCutoffHz;
        flashBudgetBytes = b.flashBudgetBytes;
        target = b.target;
        packed = b.packed;
        codecs = List.copyOf(b.codecs);
        threads = b.threads;
    }

    /** A builder with the defaults. */
    public static Builder builder() {
        return new Builder();
    }

    /** A builder starting from this spec. */
    public Builder toBuilder() {
        Builder b = new Builder();
        b.bitDepths = new ArrayList<>(bitDepths);
        b.ratesHz = new ArrayList<>(ratesHz);
        b.dither = dither;
        b.shaping = shaping;
        b.seed = seed;
        b.tables = tables;
        b.inBandCutoffHz = inBandCutoffHz;
        b.flashBudgetBytes = flashBudgetBytes;
        b.target = target;
        b.packed = packed;
        b.codecs = new ArrayList<>(codecs);
        b.threads = threads;
        return b;
    }

    /** Bit depths, in survey order. */
    public List<Integer> bitDepths() {
        return bitDepths;
    }

    /** Sample rates in hertz, in survey order. */
    public List<Double> ratesHz() {
        return ratesHz;
    }

    /** Dither of every cell. */
    public Dither dither() {
        return dither;
    }

    /** Error-feedback filter of every cell. */
    public ErrorFilter shaping() {
        return shaping;
    }

    /** Seed of every cell's dither. */
    public long seed() {
        return seed;
    }

    /** The level table for a bit depth (ideal or modelled). */
    public IntFunction<LevelTable> tables() {
        return tables;
    }

    /** In-band cutoff in hertz for a rate. */
    public DoubleUnaryOperator inBandCutoffHz() {
        return inBandCutoffHz;
    }

    /** The flash budget in bytes, if any. */
    public OptionalLong flashBudgetBytes() {
        return flashBudgetBytes < 0 ? OptionalLong.empty() : OptionalLong.of(flashBudgetBytes);
    }

    /** The target, if any. */
    public Optional<SurveyTarget> target() {
        return Optional.ofNullable(target);
    }

    /** True when budget and choice count bit-packed bytes rather than unpacked ones. */
    public boolean packed() {
        return packed;
    }

    /** The Tread stores surveyed besides the plain codes, in survey order. */
    public List<TreadFormat> codecs() {
        return codecs;
    }

    /** Worker threads. */
    public int threads() {
        return threads;
    }

    /** Collects the settings of a {@link SurveySpec}. */
    public static final class Builder {
        private List<Integer> bitDepths = defaultBits();
        private List<Double> ratesHz = List.of(8000.0, 11025.0, 16000.0, 22050.0);
        private Dither dither = Dither.TPDF;
        private ErrorFilter shaping = ErrorFilter.NONE;
        private long seed;
        private IntFunction<LevelTable> tables = bits -> LevelTable.ideal(bits, 1.0);
        private DoubleUnaryOperator inBandCutoffHz = rate -> Math.min(rate / 2, AnalogModel.AUDIO_BAND_TOP_HZ);
        private long flashBudgetBytes = -1;
        private SurveyTarget target;
        private boolean packed;
        private List<TreadFormat> codecs = List.of();
        private int threads = Runtime.getRuntime().availableProcessors();

        private Builder() {
        }

        private static List<Integer> defaultBits() {
            List<Integer> bits = new ArrayList<>();
            for (int b = 1; b <= 12; b++) {
                bits.add(b);
            }
            return bits;
        }

        /** Bit depths to survey. */
        public Builder bitDepths(List<Integer> value) {
            bitDepths = new ArrayList<>(value);
            return this;
        }

        /** Sample rates to survey, in hertz. */
        public Builder ratesHz(List<Double> value) {
            ratesHz = new ArrayList<>(value);
            return this;
        }

        /** Dither of every cell. */
        public Builder dither(Dither value) {
            dither = value;
            return this;
        }

        /** Error-feedback filter of every cell. */
        public Builder shaping(ErrorFilter value) {
            shaping = value;
            return this;
        }

        /** Seed of every cell's dither. */
        public Builder seed(long value) {
            seed = value;
            return this;
        }

        /** Level table per bit depth (called once per depth, on the calling thread). */
        public Builder tables(IntFunction<LevelTable> value) {
            tables = value;
            return this;
        }

        /** In-band cutoff per rate, in hertz. */
        public Builder inBandCutoffHz(DoubleUnaryOperator value) {
            inBandCutoffHz = value;
            return this;
        }

        /** Flash budget in bytes. */
        public Builder flashBudgetBytes(long value) {
            Checks.checkInput(value >= 0, "the flash budget must not be negative: %d", value);
            flashBudgetBytes = value;
            return this;
        }

        /** Removes the flash budget. */
        public Builder noFlashBudget() {
            flashBudgetBytes = -1;
            return this;
        }

        /** The quality target, or null for none. */
        public Builder target(SurveyTarget value) {
            target = value;
            return this;
        }

        /** Count bit-packed bytes (true) or unpacked ones (false). */
        public Builder packed(boolean value) {
            packed = value;
            return this;
        }

        /**
         * Tread stores to survey as well: each cell whose depth the store decodes to ({@link
         * TreadFormat#minLadderBits()} .. 12) gets a row of it.
         */
        public Builder codecs(List<TreadFormat> value) {
            codecs = new ArrayList<>(value);
            return this;
        }

        /** Worker threads. */
        public Builder threads(int value) {
            threads = value;
            return this;
        }

        /**
         * The spec.
         *
         * @throws org.rungtone.internal.InputError when a bit depth or rate is out of range or repeats
         */
        public SurveySpec build() {
            return new SurveySpec(this);
        }
    }
}
