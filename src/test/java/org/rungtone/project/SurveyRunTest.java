package org.rungtone.project;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.OptionalLong;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.rungtone.analysis.ReconstructionFilter;
import org.rungtone.analysis.SurveyRow;
import org.rungtone.analysis.SurveyTarget;
import org.rungtone.condition.ResamplerKind;
import org.rungtone.internal.Setting;
import org.rungtone.internal.SettingError;
import org.rungtone.ladder.LevelTable;
import org.rungtone.quantize.Dither;
import org.rungtone.quantize.ErrorFilter;
import org.rungtone.source.WavReader;
import org.rungtone.testing.WavFixtures;

/** The survey run as a library call: no command line, progress through the callback. */
class SurveyRunTest {
    @TempDir
    Path dir;

    private Path sine(double seconds) throws IOException {
        Path wav = dir.resolve("tone.wav");
        Files.write(wav, WavFixtures.sine16(44_100, seconds, 997, 0.5));
        return wav;
    }

    private SurveyRequest request(Path source, List<Integer> bits, List<Double> rates,
            ConditioningSettings conditions, boolean previews) {
        return new SurveyRequest(source, 0, new SurveyRequest.Cells(bits, rates, Dither.TPDF, ErrorFilter.NONE, 1),
                conditions, b -> LevelTable.ideal(b, 5.0), new SurveyRequest.Choice(OptionalLong.of(32_000),
                        Optional.of(SurveyTarget.sinadDb(30)), false), ReconstructionFilter.none(),
                new SurveyRequest.Output(dir.resolve("out"), previews, "9.9"));
    }

    private static ConditioningSettings normalized() {
        return new ConditioningSettings(OptionalDouble.empty(), true, OptionalDouble.empty(), OptionalDouble.empty(),
                OptionalDouble.of(-1.0), 0, 0, ResamplerKind.KAISER);
    }

    /** A callback's reports as "label done/total". */
    private static final class Reports implements SurveyRun.Progress {
        final List<String> seen = Collections.synchronizedList(new ArrayList<>());

        @Override
        public void update(String label, int done, int total) {
            seen.add(label + " " + done + "/" + total);
        }
    }

    @Test
    void reportsProgressThroughTheCallbackAndWritesTheReports() throws IOException {
        Reports progress = new Reports();
        SurveyRun.Result r = new SurveyRun(progress).run(request(sine(0.5), List.of(4, 6), List.of(8000.0, 16000.0),
                normalized(), true));
        // first the source read at the highest rate, in thousandths, up to all of it
        int reading = (int) progress.seen.stream().filter(s -> s.startsWith("reading ")).count();
        assertTrue(reading > 0, progress.seen.toString());
        assertEquals("reading 1000/1000", progress.seen.get(reading - 1));
        // then 2 depths x 2 rates: the survey's 4 cells from 0, then one preview per cell
        List<String> rest = progress.seen.subList(reading, progress.seen.size());
        assertEquals("survey 0/4", rest.get(0));
        assertEquals(List.of("survey 1/4", "survey 2/4", "survey 3/4", "survey 4/4"),
                rest.subList(1, 5).stream().sorted().toList());
        assertEquals(List.of("previews 1/4", "previews 2/4", "previews 3/4", "previews 4/4"),
                rest.subList(5, 9).stream().sorted().toList());
        assertEquals(List.of("writing reports 0/0"), rest.subList(9, rest.size()));

        Path out = dir.resolve("out");
        assertEquals(List.of(out.resolve("survey.txt"), out.resolve("survey.json"), out.resolve("survey-sinad.png"),
                out.resolve("survey-sinad-flash.png"), out.resolve("previews")), r.context().files());
        assertEquals(r.text(), Files.readString(out.resolve("survey.txt")));
        assertEquals(r.json(), Files.readString(out.resolve("survey.json")));
        for (SurveyRow row : r.survey().rows()) {
            WavReader.Decoded d = WavReader.read(out.resolve("previews").resolve(String.format(
                    java.util.Locale.ROOT, "b%02d-r%.0f.wav", row.bits(), row.rateHz())), 0);
            assertEquals(44_100, d.signal().sampleRateHz(), 0);
        }
        assertEquals(List.of("load and survey", "previews", "files"), new ArrayList<>(r.stageMillis().keySet()));
        assertEquals("DC removed, normalized to -1.0 dBFS", r.context().conditioning());
        // an ideal table's top code is one LSB below the reference: 5 V x 63/64 = 4.922 V at 6 bits
        assertEquals("ideal, 0V .. 4.922V at 6 bits", r.context().levels());
        assertEquals("9.9", r.context().toolVersion());
    }

    @Test
    void aWarningSharedByRatesIsListedOnceNamingThemAll() throws IOException {
        // A sine of amplitude 0.5 (-6 dBFS) stays below a -0.5 dBFS trim threshold at every rate.
        ConditioningSettings trim = new ConditioningSettings(OptionalDouble.empty(), true, OptionalDouble.of(-0.5),
                OptionalDouble.empty(), OptionalDouble.of(-1.0), 0, 0, ResamplerKind.KAISER);
        SurveyRun.Result r = new SurveyRun(SurveyRun.Progress.NONE).run(request(sine(0.5), List.of(4),
                List.of(8000.0, 16000.0), trim, false));
        assertEquals(List.of("at 8kHz, 16kHz: the whole source is below the -0.5 dBFS trim threshold; nothing was"
                + " trimmed"), r.context().warnings());
        assertEquals(List.of(dir.resolve("out").resolve("survey.txt"), dir.resolve("out").resolve("survey.json"),
                dir.resolve("out").resolve("survey-sinad.png"), dir.resolve("out").resolve("survey-sinad-flash.png")),
                r.context().files());
        assertFalse(Files.exists(dir.resolve("out").resolve("previews")));
    }

    @Test
    void aClipTooShortForARateNamesTheRatesSetting() throws IOException {
        // 1 ms at 44.1 kHz is 44 samples: 8 at 8 kHz, fewer than the 16 a cell needs.
        Path wav = sine(0.001);
        SettingError e = assertThrows(SettingError.class, () -> new SurveyRun(SurveyRun.Progress.NONE)
                .run(request(wav, List.of(4), List.of(8000.0), normalized(), false)));
        assertEquals(Setting.SURVEY_RATES, e.setting());
        assertEquals(wav + ": only 8 samples are left at 8kHz after conditioning; the survey needs at least 16"
                + " (use a longer clip or higher survey.rates)", e.getMessage());
        assertFalse(Files.exists(dir.resolve("out")), "nothing written");
    }

    @Test
    void theBoardsTablesAreAskedOncePerDepthInSurveyOrder() throws IOException {
        List<Integer> asked = new ArrayList<>();
        SurveyRequest base = request(sine(0.5), List.of(8, 4, 6), List.of(8000.0), normalized(), false);
        SurveyRequest counting = new SurveyRequest(base.source(), 0, base.cells(), base.conditioning(), b -> {
            asked.add(b);
            return LevelTable.ideal(b, 3.3);
        }, base.choice(), base.filter(), base.output());
        SurveyRun.Result r = new SurveyRun(SurveyRun.Progress.NONE).run(counting);
        assertEquals(List.of(8, 4, 6), asked);
        // the span of the deepest table, 8 bits: one LSB below the reference, 3.3 V x 255/256 = 3.287 V
        assertEquals("ideal, 0V .. 3.287V at 8 bits", r.context().levels());
        assertTrue(r.text().contains("levels                 ideal, 0V .. 3.287V at 8 bits"), r.text());
    }
}
