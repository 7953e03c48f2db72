package org.rungtone.report;

import java.nio.file.Path;
import java.util.Locale;
import java.util.Optional;
import java.util.OptionalInt;
import org.rungtone.source.WavFormat;

/**
 * What was read as a sound's source, as values for machine-readable reports.
 *
 * @param file the source file, or {@code -} for standard input
 * @param kind {@code wav}, {@code rung_clip} or {@code rung_wavetable}
 * @param wav the WAV file's layout, for a WAV source
 * @param channel the channel used, 1..C, or 0 when the channels were mixed down (or there is one)
 * @param rateHz the source's own sample rate (a script's rendering rate)
 * @param samples samples per channel
 */
public record SourceFacts(Path file, String kind, Optional<WavFormat> wav, int channel, double rateHz,
        long samples) {
    /** A WAV source. */
    public static SourceFacts wav(Path file, WavFormat format, int channel) {
        return new SourceFacts(file, "wav", Optional.of(format), format.channels() > 1 ? channel : 0,
                format.sampleRateHz(), format.frames());
    }

    /** A rendered .rung script: a clip, or a single-cycle wavetable. */
    public static SourceFacts script(Path file, boolean wavetable, double rateHz, long samples) {
        return new SourceFacts(file, wavetable ? "rung_wavetable" : "rung_clip", Optional.empty(), 0, rateHz,
                samples);
    }

    /** The source's duration in seconds. */
    public double durationSeconds() {
        return samples / rateHz;
    }

    /** The WAV encoding as reports name it ({@code pcm_s16}, {@code float32}, {@code mu_law}, ...). */
    public Optional<String> encoding() {
        return wav.map(f -> f.encoding().name().toLowerCase(Locale.ROOT));
    }

    /** Channels in the source (1 for a script). */
    public int channels() {
        return wav.map(WavFormat::channels).orElse(1);
    }

    /** Bits per sample of a WAV file's container and its valid bits. */
    public OptionalInt bitsPerSample() {
        return wav.map(f -> OptionalInt.of(f.bitsPerSample())).orElse(OptionalInt.empty());
    }
}
