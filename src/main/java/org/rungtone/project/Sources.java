package org.rungtone.project;

import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import org.rungtone.internal.FileNames;
import org.rungtone.internal.InputError;
import org.rungtone.internal.OutputFolder;
import org.rungtone.internal.Units;
import org.rungtone.report.SourceFacts;
import org.rungtone.script.RungScript;
import org.rungtone.source.SampleSource;
import org.rungtone.source.Signal;
import org.rungtone.source.WavReader;

/** Opens a source file of any kind Rungtone reads as mono samples. */
public final class Sources {
    private Sources() {
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
     * @param facts what was read, as values for machine-readable reports
     */
    public record Opened(SampleSource samples, String layout, List<String> warnings, double preferredRateHz,
            boolean wavetable, SourceFacts facts) implements AutoCloseable {
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
     * Opens a .wav file for reading by range (mixed down, or one channel), a WAV file on standard input for
     * the path {@code -}, or renders a .rung script (at {@code scriptRateHz}, or its own declared rate when
     * that is NaN).
     *
     * @throws InputError naming the file for anything unreadable
     */
    public static Opened open(Path source, int channel, double scriptRateHz, long seed) {
        String name = source.getFileName() == null ? "" : source.getFileName().toString().toLowerCase(Locale.ROOT);
        boolean stdin = FileNames.isStandardInput(source);
        if (stdin || name.endsWith(".wav") || name.endsWith(".wave")) {
            WavReader.Stream w = WavReader.open(stdin ? source : OutputFolder.staged(source), channel);
            String layout = w.format().describe() + (w.format().channels() > 1
                    ? (channel == 0 ? ", mixed down" : ", channel " + channel) : "");
            return new Opened(w, layout, w.warnings(), Double.NaN, false, SourceFacts.wav(source, w.format(), channel));
        }
        if (name.endsWith(".rung")) {
            RungScript script = RungScript.load(OutputFolder.staged(source));
            Signal s = script.render(scriptRateHz, seed);
            String layout = script.kind() == RungScript.Kind.CLIP
                    ? String.format(Locale.ROOT, "rung script, clip of %.3f s rendered at %s", script.durationSeconds(),
                            Units.format(s.sampleRateHz(), "Hz"))
                    : "rung script, single-cycle wavetable of " + script.tableLength() + " samples";
            boolean wavetable = script.kind() == RungScript.Kind.WAVETABLE;
            return new Opened(SampleSource.of(s), layout, List.of(), script.declaredRateHz().orElse(Double.NaN),
                    wavetable, SourceFacts.script(source, wavetable, s.sampleRateHz(), s.length()));
        }
        throw InputError.inFile(source, "is not a source Rungtone reads; give a .wav file or a .rung script");
    }
}
