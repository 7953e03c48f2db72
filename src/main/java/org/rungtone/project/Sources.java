package org.rungtone.project;

import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import org.rungtone.internal.InputError;
import org.rungtone.internal.Units;
import org.rungtone.script.RungScript;
import org.rungtone.source.SampleSource;
import org.rungtone.source.Signal;
import org.rungtone.source.WavFormat;
import org.rungtone.source.WavReader;

/** Loads a source file of any kind Rungtone reads into a mono {@link Signal}. */
public final class Sources {
    private Sources() {
    }

    /**
     * A loaded source.
     *
     * @param signal the mono signal at the source's own rate
     * @param layout a one-line description of what was read
     * @param warnings non-fatal problems
     * @param preferredRateHz the rate the source asks to be played at (a script's declared rate), NaN if none
     * @param wavetable true for a single-cycle wavetable: no resampling, trimming or fades apply
     */
    public record Loaded(Signal signal, String layout, List<String> warnings, double preferredRateHz,
            boolean wavetable) {
        /** Copies the warnings. */
        public Loaded {
            warnings = List.copyOf(warnings);
        }
    }

    /**
     * A source opened for reading by range: a WAV file is decoded on demand (its samples are never held
     * whole), a script is rendered into memory. Close it after use.
     *
     * @param samples the mono samples at the source's own rate
     * @param layout a one-line description of what was read
     * @param warnings non-fatal problems
     * @param preferredRateHz the rate the source asks to be played at (a script's declared rate), NaN if none
     * @param wavetable true for a single-cycle wavetable: no resampling, trimming or fades apply
     */
    public record Opened(SampleSource samples, String layout, List<String> warnings, double preferredRateHz,
            boolean wavetable) implements AutoCloseable {
        /** Copies the warnings. */
        public Opened {
            warnings = List.copyOf(warnings);
        }

        @Override
        public void close() {
            samples.close();
        }
    }

    /**
     * Opens a .wav file for reading by range (mixed down, or one channel) or renders a .rung script as
     * {@link #load} does.
     *
     * @throws InputError naming the file for anything unreadable
     */
    public static Opened open(Path source, int channel, double scriptRateHz, long seed) {
        if (isWav(source)) {
            WavReader.Stream w = WavReader.open(source, channel);
            return new Opened(w, layout(w.format(), channel), w.warnings(), Double.NaN, false);
        }
        Loaded l = load(source, channel, scriptRateHz, seed);
        return new Opened(SampleSource.of(l.signal()), l.layout(), l.warnings(), l.preferredRateHz(),
                l.wavetable());
    }

    private static boolean isWav(Path source) {
        String name = source.getFileName() == null ? "" : source.getFileName().toString().toLowerCase(Locale.ROOT);
        return name.endsWith(".wav") || name.endsWith(".wave");
    }

    private static String layout(WavFormat format, int channel) {
        return format.describe() + (format.channels() > 1 ? (channel == 0 ? ", mixed down" : ", channel " + channel)
                : "");
    }

    /**
     * Loads a .wav file (mixed down, or one channel) or a .rung script (rendered at {@code scriptRateHz}, or
     * its own declared rate when that is NaN).
     *
     * @throws InputError naming the file for anything unreadable
     */
    public static Loaded load(Path source, int channel, double scriptRateHz, long seed) {
        if (isWav(source)) {
            WavReader.Decoded d = WavReader.read(source, channel);
            return new Loaded(d.signal(), layout(d.format(), channel), d.warnings(), Double.NaN, false);
        }
        String name = source.getFileName() == null ? "" : source.getFileName().toString().toLowerCase(Locale.ROOT);
        if (name.endsWith(".rung")) {
            RungScript script = RungScript.load(source);
            Signal s = script.render(scriptRateHz, seed);
            String layout = script.kind() == RungScript.Kind.CLIP
                    ? String.format(Locale.ROOT, "rung script, clip of %.3f s rendered at %s", script.durationSeconds(),
                            Units.format(s.sampleRateHz(), "Hz"))
                    : "rung script, single-cycle wavetable of " + script.tableLength() + " samples";
            return new Loaded(s, layout, List.of(), script.declaredRateHz().orElse(Double.NaN),
                    script.kind() == RungScript.Kind.WAVETABLE);
        }
        throw InputError.inFile(source, "is not a source Rungtone reads; give a .wav file or a .rung script");
    }
}
