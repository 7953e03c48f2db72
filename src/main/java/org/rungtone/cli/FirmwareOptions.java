package org.rungtone.cli;

import java.nio.file.Path;
import java.util.Optional;
import java.util.OptionalLong;
import org.rungtone.cli.shell.Choices;
import org.rungtone.cli.shell.Heading;
import org.rungtone.cli.shell.Section;
import org.rungtone.firmware.DdsSpec;
import org.rungtone.firmware.FirmwareRequest;
import org.rungtone.firmware.PinStrategy;
import org.rungtone.firmware.PlaybackEngine;
import org.rungtone.firmware.SampleStorage;
import org.rungtone.firmware.Templates;
import org.rungtone.firmware.TimerKind;
import org.rungtone.internal.InputError;
import org.rungtone.project.LoopSpan;
import picocli.CommandLine.Option;

/**
 * The firmware options shared by build and calibrate: target family, clock, timer, pins, storage, engine,
 * flash budget. Without --target, --pins or --engine only the sample array is emitted.
 */
@Section(Heading.FIRMWARE)
public final class FirmwareOptions {
    @Option(names = "--target", paramLabel = "generic|avr|cortexm|rp2040", completionCandidates = Choices.Targets.class,
            description = "Emit a complete player for this target family (default: only the sample array,"
                    + " or 'generic' when --pins is given).")
    String target;

    @Option(names = "--pins", paramLabel = "<pins>",
            description = "One pin per code bit, bit 0 (LSB) first, as the part's datasheet names them: PB0-PB5,"
                    + " PA3,PA7,PC0,PC1, P1.0-P1.7, GPIO2-GPIO7.")
    String pins;

    @Option(names = "--cpu-clock", paramLabel = "<hz>", converter = Converters.Hertz.class,
            description = "CPU or timer clock, e.g. 16MHz; the timer reload is computed from it (rp2040: not"
                    + " needed, its alarm counts microseconds).")
    Double cpuClockHz;

    @Option(names = "--timer", paramLabel = "<timer>",
            description = "timer0, timer1, timer2 (avr); systick, general16, general32 (cortexm: a general-purpose"
                    + " timer with a 16- or 32-bit counter); alarm (rp2040).")
    TimerKind timer;

    @Option(names = "--rate-tolerance", paramLabel = "<ppm>",
            description = "Largest sample-rate error the timer may have, in ppm (default 1000).")
    Double rateTolerancePpm;

    @Option(names = "--port-width", paramLabel = "<bits>", description = "Port width for the generic target: 8,"
            + " 16 or 32.")
    Integer portWidth;

    @Option(names = "--pin-strategy", paramLabel = "auto|shift|table|scatter",
            description = "How codes become port values (default auto: shift when the pins allow it).")
    PinStrategy pinStrategy;

    @Option(names = "--storage", paramLabel = "unpacked|packed|tread2|tread3|tread4",
            description = "Samples one per byte/word, bit-packed, or Tread codes of 2-4 bits (default unpacked).")
    SampleStorage storage;

    @Option(names = "--engine", paramLabel = "clip|loop|dds|sweep",
            description = "Player engine: one-shot clip, looped clip, DDS wavetable oscillator (default clip).")
    PlaybackEngine engine;

    @Option(names = "--loop", paramLabel = "START:END|auto", description = "Loop points of a looped sound, in"
            + " samples (1200:9600) or times (0.25s:end), or auto: a seamless loop found in a sustained sound.")
    String loop;

    @Option(names = "--dds-frequency", paramLabel = "<hz>", converter = Converters.Hertz.class,
            description = "Start frequency of the DDS oscillator (default 1 kHz).")
    Double ddsFrequencyHz;

    @Option(names = "--dds-phase-bits", paramLabel = "<n>",
            description = "Width of the DDS phase accumulator (default 32).")
    Integer ddsPhaseBits;

    @Option(names = "--flash-budget", paramLabel = "<bytes>", converter = Converters.Bytes.class,
            description = "Refuse to build when the samples need more flash than this, e.g. 28k.")
    Long flashBudget;

    @Option(names = "--templates", paramLabel = "<dir>",
            description = "Render from your own template folder (same layout as templates/).")
    Path templates;

    /** True when the user asked for a player, not only the sample array. */
    boolean wantsPlayer() {
        return target != null || pins != null || engine != null || timer != null || cpuClockHz != null
                || ddsFrequencyHz != null || ddsPhaseBits != null;
    }

    /** The loop points, when given. */
    Optional<LoopSpan> loopSpan() {
        return Optional.ofNullable(loop).map(LoopSpan::parse);
    }

    /** The flash budget in bytes, when given. */
    OptionalLong flashBudgetBytes() {
        return flashBudget == null ? OptionalLong.empty() : OptionalLong.of(flashBudget);
    }

    /** Applies only the options given on the command line to {@code b} (project files: the options win). */
    FirmwareRequest.Builder applyGiven(FirmwareRequest.Builder b) {
        if (target != null) {
            b.family(target);
        }
        if (templates != null) {
            b.templates(Templates.fromFolder(templates));
        }
        if (cpuClockHz != null) {
            b.cpuClockHz(cpuClockHz);
        }
        if (timer != null) {
            b.timer(timer);
        }
        if (rateTolerancePpm != null) {
            b.rateTolerancePpm(rateTolerancePpm);
        }
        if (pins != null) {
            b.pins(pins);
        }
        if (portWidth != null) {
            b.portWidth(portWidth);
        }
        if (pinStrategy != null) {
            b.pinStrategy(pinStrategy);
        }
        if (storage != null) {
            b.storage(storage);
        }
        if (engine != null) {
            b.engine(engine);
        }
        if (ddsPhaseBits != null || ddsFrequencyHz != null) {
            if (b.engine() != PlaybackEngine.DDS) {
                throw new InputError("--dds-frequency and --dds-phase-bits set up the dds engine; add --engine dds"
                        + " (or engine = \"dds\" in the project's [target] table)");
            }
            // each DDS option given replaces only its own setting (a project's other one stays)
            DdsSpec now = b.dds();
            b.dds(new DdsSpec(ddsPhaseBits == null ? now.phaseBits() : ddsPhaseBits,
                    ddsFrequencyHz == null ? now.frequencyHz() : ddsFrequencyHz));
        }
        if (flashBudget != null) {
            b.flashBudgetBytes(flashBudget);
        }
        return b;
    }

    /**
     * A request template holding every firmware setting but the sounds, name and version, or empty when only
     * the sample array is wanted.
     */
    Optional<FirmwareRequest> request() {
        if (!wantsPlayer()) {
            return Optional.empty();
        }
        FirmwareRequest.Builder b = applyGiven(FirmwareRequest.builder().family("generic"));
        if (engine == null) {
            b.engine(loop != null ? PlaybackEngine.LOOP : PlaybackEngine.CLIP);
        }
        return Optional.of(b.build());
    }
}
