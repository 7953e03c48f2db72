package org.rungtone.project;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import java.util.Optional;
import java.util.OptionalLong;
import java.util.function.IntFunction;
import org.rungtone.analysis.ReconstructionFilter;
import org.rungtone.analysis.SurveyTarget;
import org.rungtone.codec.TreadFormat;
import org.rungtone.firmware.SampleStorage;
import org.rungtone.internal.Setting;
import org.rungtone.ladder.LevelTable;
import org.rungtone.quantize.Dither;
import org.rungtone.quantize.ErrorFilter;

/**
 * Everything one survey needs, as {@link SurveyRun} takes it: the source, the cells and how each is
 * quantized, how the source is conditioned, the board's level table at each depth, how a setting is chosen,
 * the reconstruction filter and where the reports go. Immutable; the channel is checked here, everything
 * else where it is used.
 *
 * @param source the WAV file or .rung script (a script is rendered at the highest surveyed rate)
 * @param channel 0 to mix all channels down, 1..8 to pick one
 * @param cells the bit depths × sample rates and how every cell is quantized
 * @param conditioning how the source is conditioned to each rate (its own rate is not used)
 * @param tables the board's level table at a bit depth (called once per depth, in survey order)
 * @param choice the flash budget and the target that pick the recommended setting
 * @param filter the reconstruction filter after the ladder, for previews and the in-band cutoff
 * @param output where the reports go and what they hold
 */
public record SurveyRequest(Path source, int channel, Cells cells, ConditioningSettings conditioning,
        IntFunction<LevelTable> tables, Choice choice, ReconstructionFilter filter, Output output) {

    /**
     * Checks the channel.
     *
     * @throws org.rungtone.internal.SettingError when the channel is outside 0..8
     */
    public SurveyRequest {
        Objects.requireNonNull(source, "source");
        Objects.requireNonNull(cells, "cells");
        Objects.requireNonNull(conditioning, "conditioning");
        Objects.requireNonNull(tables, "tables");
        Objects.requireNonNull(choice, "choice");
        Objects.requireNonNull(filter, "filter");
        Objects.requireNonNull(output, "output");
        Setting.CHANNEL.check(channel >= 0 && channel <= 8, "must be 0 (mix down) or 1..8: %d", channel);
    }

    /**
     * The grid and how each of its cells is quantized.
     *
     * @param bitDepths bit depths, in survey order
     * @param ratesHz sample rates in hertz, in survey order
     * @param dither dither of every cell
     * @param shaping error-feedback filter of every cell
     * @param seed seed of every cell's dither (and of a script's noise)
     */
    public record Cells(List<Integer> bitDepths, List<Double> ratesHz, Dither dither, ErrorFilter shaping,
            long seed) {
        /** Copies the lists. */
        public Cells {
            bitDepths = List.copyOf(bitDepths);
            ratesHz = List.copyOf(ratesHz);
            Objects.requireNonNull(dither, "dither");
            Objects.requireNonNull(shaping, "shaping");
        }
    }

    /**
     * What picks the recommended setting.
     *
     * @param flashBudgetBytes flash available for the samples, if limited
     * @param target the least acceptable quality, if any (without one nothing is recommended)
     * @param packed judge the budget and the choice by bit-packed bytes instead of unpacked ones
     * @param codecs the Tread stores surveyed besides the plain codes
     */
    public record Choice(OptionalLong flashBudgetBytes, Optional<SurveyTarget> target, boolean packed,
            List<TreadFormat> codecs) {
        /**
         * Checks the budget.
         *
         * @throws org.rungtone.internal.SettingError when the budget is negative
         */
        public Choice {
            flashBudgetBytes.ifPresent(b -> Setting.FLASH_BUDGET.check(b >= 0, "must not be negative: %d", b));
            Objects.requireNonNull(target, "target");
            codecs = List.copyOf(codecs);
        }

        /** A choice among the plain codes alone. */
        public Choice(OptionalLong flashBudgetBytes, Optional<SurveyTarget> target, boolean packed) {
            this(flashBudgetBytes, target, packed, List.of());
        }

        /**
         * The choice among the given storages: the Tread ones are surveyed as well; {@code packed}, or packed
         * among them, counts the plain codes bit-packed.
         */
        public static Choice of(OptionalLong flashBudgetBytes, Optional<SurveyTarget> target, boolean packed,
                List<SampleStorage> storages) {
            List<TreadFormat> codecs = new ArrayList<>();
            storages.forEach(s -> s.codec().filter(f -> !codecs.contains(f)).ifPresent(codecs::add));
            return new Choice(flashBudgetBytes, target, packed || storages.contains(SampleStorage.PACKED), codecs);
        }
    }

    /**
     * Where the reports go and what they hold.
     *
     * @param folder the output folder: survey.txt, survey.json, survey-sinad.png and previews/
     * @param previews write a 16-bit preview WAV per cell into previews/
     * @param toolVersion the version stamped into the reports
     */
    public record Output(Path folder, boolean previews, String toolVersion) {
        /** Checks for nulls. */
        public Output {
            Objects.requireNonNull(folder, "folder");
            Objects.requireNonNull(toolVersion, "toolVersion");
        }
    }
}
