package org.rungtone.project;

import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalDouble;
import org.rungtone.calibrate.OutputSpan;
import org.rungtone.condition.ResamplerKind;
import org.rungtone.firmware.PinStrategy;
import org.rungtone.firmware.PlaybackEngine;
import org.rungtone.firmware.SampleStorage;
import org.rungtone.firmware.TimerKind;
import org.rungtone.internal.InputError;
import org.rungtone.ladder.LadderTable;
import org.rungtone.quantize.Compensation;
import org.rungtone.quantize.Dither;
import org.rungtone.quantize.ErrorFilter;

/**
 * A project file as read: every value the user wrote, with nothing defaulted yet, so that command-line
 * overrides and defaults are applied in one place ({@link ProjectBuild}). Positions for error messages stay
 * with {@code file} and the raw ladder table.
 *
 * @param file the project file
 * @param name project name: the C symbol prefix of the shared code
 * @param outDir output folder, resolved against the file's folder
 * @param cOutDir folder of the C files, resolved against the file's folder, when apart from the output folder
 * @param seed random seed
 * @param unitProfile measured unit profile, resolved against the file's folder
 * @param compensation quantize onto the board's real levels
 * @param target target settings
 * @param ladder the raw [ladder] table, if any
 * @param quantize quantization settings
 * @param preview preview settings
 * @param sounds the sounds, in file order
 */
public record Project(Path file, String name, Optional<Path> outDir, Optional<Path> cOutDir, Optional<Long> seed,
        Optional<Path> unitProfile,
        Optional<Compensation> compensation, Target target, Optional<LadderTable> ladder, Quantize quantize,
        Preview preview, List<Sound> sounds) {

    /** Copies the sound list. */
    public Project {
        sounds = List.copyOf(sounds);
    }

    /**
     * The [target] table.
     *
     * @param family generic, avr, cortexm or rp2040; empty: sample arrays only
     * @param cpuClockHz CPU clock
     * @param timer timer name
     * @param pins pin list
     * @param portWidth port width for generic
     * @param pinStrategy auto, shift, table, scatter
     * @param storage unpacked, packed or a Tread store
     * @param engine clip, loop, dds
     * @param rateTolerancePpm allowed rate error
     * @param flashBudgetBytes flash budget
     * @param flashAttr attribute for bare arrays
     * @param ddsFrequencyHz DDS start frequency
     * @param ddsPhaseBits DDS accumulator width
     * @param lines line of each key, for conflict messages
     */
    public record Target(Optional<String> family, OptionalDouble cpuClockHz, Optional<TimerKind> timer,
            Optional<String> pins, Optional<Long> portWidth, Optional<PinStrategy> pinStrategy,
            Optional<SampleStorage> storage, Optional<PlaybackEngine> engine, OptionalDouble rateTolerancePpm,
            OptionalDouble flashBudgetBytes,
            Optional<String> flashAttr, OptionalDouble ddsFrequencyHz, Optional<Long> ddsPhaseBits,
            Map<String, Integer> lines) {
    }

    /**
     * The [quantize] table.
     *
     * @param bits bit depth
     * @param rateHz sample rate of every sound
     * @param dither dither kind
     * @param shaping none, first, second
     * @param span full or nominal
     * @param lines line of each key
     */
    public record Quantize(Optional<Long> bits, OptionalDouble rateHz, Optional<Dither> dither,
            Optional<ErrorFilter> shaping, Optional<OutputSpan> span, Map<String, Integer> lines) {
    }

    /**
     * The [preview] table.
     *
     * @param filter the reconstruction filter
     * @param rateHz preview WAV rate
     */
    public record Preview(Optional<org.rungtone.analysis.ReconstructionFilter> filter, OptionalDouble rateHz) {
    }

    /**
     * One [[sound]] table.
     *
     * @param index 1-based position in the file
     * @param line the line of the table's first key
     * @param name the sound's name (C symbol part)
     * @param source the source file, resolved against the project file's folder
     * @param rateHz this sound's rate (only without a player)
     * @param loop loop points
     * @param channel channel choice
     * @param gainDb fixed gain
     * @param normalizeDbfs normalization target
     * @param trimDbfs trim threshold
     * @param fadeInSeconds fade-in
     * @param fadeOutSeconds fade-out
     * @param keepDc keep the mean
     * @param resampler kaiser or tarsos
     * @param lines the line of each key of the table
     */
    public record Sound(int index, int line, String name, Path source, OptionalDouble rateHz,
            Optional<LoopSpan> loop, Optional<Long> channel, OptionalDouble gainDb, OptionalDouble normalizeDbfs,
            OptionalDouble trimDbfs, OptionalDouble fadeInSeconds, OptionalDouble fadeOutSeconds,
            Optional<Boolean> keepDc, Optional<ResamplerKind> resampler, Map<String, Integer> lines) {
        /** Copies the lines. */
        public Sound {
            lines = Map.copyOf(lines);
        }

        /**
         * An error about one of this sound's settings, as the file names it: {@code FILE:LINE:
         * sound[2].fade_in: detail}, at the key's line (the table's first line when the key is not written).
         */
        public InputError error(Path file, org.rungtone.internal.SettingError e) {
            String key = e.setting().key().substring(e.setting().key().indexOf('.') + 1);
            int at = lines.getOrDefault(key, line);
            return new InputError(file + (at > 0 ? ":" + at : "") + ": sound[" + index + "]." + key + ": "
                    + e.detail(s -> s.key().startsWith("sound.") ? s.key().substring("sound.".length()) : s.key()),
                    e);
        }
    }

    /**
     * "FILE:LINE" of the key that holds {@code s} ({@code [quantize] rate}, {@code [target] pins}), or "FILE"
     * when the file does not hold it (a default) or its line is not kept.
     */
    public String where(org.rungtone.internal.Setting s) {
        String section = s.key().substring(0, s.key().indexOf('.'));
        String key = s.key().substring(section.length() + 1);
        Map<String, Integer> lines = section.equals("quantize") ? quantize.lines()
                : section.equals("target") ? target.lines() : Map.of();
        Integer line = lines.get(key);
        return file + (line != null && line > 0 ? ":" + line : "");
    }
}
