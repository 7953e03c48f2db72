package org.rungtone.testing;

import java.nio.file.Path;
import java.util.Optional;
import java.util.OptionalDouble;
import org.rungtone.analysis.ReconstructionFilter;
import org.rungtone.condition.ResamplerKind;
import org.rungtone.ladder.LevelTable;
import org.rungtone.report.BuildFacts;
import org.rungtone.report.ConditioningFacts;
import org.rungtone.report.SourceFacts;
import org.rungtone.report.SurveyReport;
import org.rungtone.source.WavFormat;

/** Facts of builds and surveys made up for report tests: a one-channel source on an ideal ladder, no player. */
public final class FactsFixture {
    private FactsFixture() {
    }

    /** Facts of a {@code bits}-bit sound read from {@code source} at {@code rateHz}, reported in {@code outDir}. */
    public static BuildFacts of(Path source, double rateHz, int bits, Path outDir) {
        return new BuildFacts(SourceFacts.script(source, false, rateHz, (long) rateHz), conditioning(),
                ResamplerKind.KAISER, ideal(bits), false, false, ReconstructionFilter.none(), Optional.empty(), outDir);
    }

    /** Facts of a survey of a 1 s, 44.1 kHz 16-bit mono WAV file up to {@code bits} bits. */
    public static SurveyReport.Facts survey(Path source, int bits, Path outDir) {
        WavFormat wav = new WavFormat(1, WavFormat.Encoding.PCM_S16, 1, 44_100, 16, 16, 2, 44_100);
        return new SurveyReport.Facts(SourceFacts.wav(source, wav, 0), conditioning(), ResamplerKind.KAISER,
                ideal(bits), ReconstructionFilter.none(), outDir);
    }

    private static ConditioningFacts conditioning() {
        return new ConditioningFacts(true, OptionalDouble.empty(), OptionalDouble.empty(), OptionalDouble.of(-1), 0,
                0, Optional.empty());
    }

    /** An ideal ladder of {@code bits} bits from 0 to 5 V. */
    public static LevelTable ideal(int bits) {
        double[] volts = new double[1 << bits];
        for (int i = 0; i < volts.length; i++) {
            volts[i] = 5.0 * i / (volts.length - 1);
        }
        return LevelTable.of(bits, volts, "ideal");
    }
}
