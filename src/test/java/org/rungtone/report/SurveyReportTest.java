package org.rungtone.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.google.gson.JsonObject;
import com.google.gson.JsonParser;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.junit.jupiter.api.Test;
import org.rungtone.analysis.SurveyResult;
import org.rungtone.analysis.SurveyRow;
import org.rungtone.analysis.SurveyTarget;
import org.rungtone.testing.FactsFixture;

class SurveyReportTest {
    private static final List<String> ROW_FIELDS = List.of("bits", "rate_hz", "samples", "sinad_db",
            "in_band_snr_db", "a_weighted_snr_db", "enob_full_scale_bits", "heard_signal_to_error_db",
            "heard_a_weighted_signal_to_error_db", "clipped_samples", "flash_bytes_unpacked", "flash_bytes_packed",
            "fits", "reaches_target", "chosen", "storage", "preview");

    /**
     * A cell of a 1 s clip; flash bytes follow from the rate and depth as in SurveyRow, ENOB from SINAD as
     * (SINAD − 1.76)/6.02 (IEEE Std 1241-2010).
     */
    private static SurveyRow row(int bits, double rate, double sinad, boolean fits, boolean reaches,
            boolean chosen) {
        int n = (int) rate;
        return new SurveyRow(bits, rate, n, sinad, sinad + 0.5, sinad - 0.3, (sinad - 1.76) / 6.02, 0,
                SurveyRow.unpackedBytes(n, bits), SurveyRow.packedBytes(n, bits), fits, reaches, chosen, Double.NaN,
                Double.NaN, Optional.empty());
    }

    private static SurveyReport.Context context(boolean previews) {
        return new SurveyReport.Context("9.9", Path.of("sounds/chime.wav"), "PCM 16-bit, 1 ch, 44100 Hz, 1.00 s",
                "DC removed", "kaiser", "ideal", "tpdf", "none", 1, "none", previews,
                List.of(Path.of("out/survey.txt")), List.of("a warning"),
                FactsFixture.survey(Path.of("sounds/chime.wav"), 8, Path.of("out")));
    }

    private static SurveyResult withChoice() {
        List<SurveyRow> rows = List.of(row(4, 8000, 25.8, true, false, false),
                row(8, 8000, 49.9, true, true, true),
                row(4, 11025, 25.8, true, false, false),
                row(8, 11025, 49.9, false, true, false));
        return new SurveyResult(rows, SurveyTarget.sinadDb(40), 10_000L, false);
    }

    private static List<String> tableRows(String table) {
        List<String> lines = new ArrayList<>(List.of(table.split("\n")));
        return lines.subList(2, lines.size());
    }

    @Test
    void tableHasOneLinePerCellAndMarksOnlyTheChosenRow() {
        String table = SurveyReport.table(withChoice());
        List<String> rows = tableRows(table);
        assertEquals(4, rows.size(), table);
        assertTrue(table.lines().findFirst().orElseThrow().contains("meets target"), table);
        assertTrue(rows.get(1).matches(" +8 +8 kHz +49\\.9 +50\\.4 +49\\.6 +8\\.00 +8,000 +8,000 +yes +yes +"
                + "<- chosen"), rows.get(1));
        assertTrue(rows.get(3).matches(" +8 +11\\.025 kHz +49\\.9 .* +11,025 +11,025 +no +yes"), rows.get(3));
        assertEquals(1, table.split(SurveyReport.CHOSEN_MARK, -1).length - 1, table);
        for (String line : table.split("\n")) {
            assertFalse(line.endsWith(" "), "no trailing spaces: '" + line + "'");
        }
    }

    @Test
    void tableWithoutTargetHasNoTargetOrMarkColumn() {
        SurveyResult r = new SurveyResult(List.of(row(6, 16000, 37.9, true, false, false)), null, null, false);
        String table = SurveyReport.table(r);
        assertFalse(table.contains("meets target"), table);
        assertTrue(table.lines().findFirst().orElseThrow().endsWith("fits"), table);
        assertEquals("No target given, so nothing is recommended; give a SINAD or ENOB target.",
                SurveyReport.recommendation(r));
    }

    @Test
    void recommendationNamesTheChosenSetting() {
        assertEquals("Recommended: 8 bits at 8 kHz (SINAD 49.9 dB, ENOB re full scale 8.00 bits, 8,000 bytes"
                + " unpacked).",
                SurveyReport.recommendation(withChoice()));
    }

    @Test
    void recommendationSaysWhenTheBudgetIsTooSmall() {
        List<SurveyRow> rows = List.of(row(4, 8000, 25.8, true, false, false),
                row(8, 8000, 49.9, false, true, false), row(10, 8000, 62.0, false, true, false));
        SurveyResult r = new SurveyResult(rows, SurveyTarget.sinadDb(40), 5_000L, true);
        assertEquals("Nothing reaches SINAD >= 40.00 dB within the 5,000 bytes bit-packed budget; the smallest"
                + " setting that reaches it, 8 bits at 8 kHz, needs 8,000 bytes bit-packed.",
                SurveyReport.recommendation(r));
    }

    @Test
    void recommendationNamesTheBestWhenNothingReachesTheTarget() {
        List<SurveyRow> rows = List.of(row(4, 8000, 25.8, true, false, false),
                row(6, 8000, 37.9, true, false, false));
        SurveyResult r = new SurveyResult(rows, SurveyTarget.enobBits(9), null, false);
        assertEquals("No surveyed setting reaches ENOB >= 9.000 bits; the best is 6 bits at 8 kHz with SINAD"
                + " 37.9 dB, ENOB re full scale 6.00 bits.", SurveyReport.recommendation(r));
    }

    @Test
    void jsonHasTheDocumentedFieldNames() {
        JsonObject o = JsonParser.parseString(Json.toJson(SurveyReport.json(withChoice(), context(true))))
                .getAsJsonObject();
        assertEquals(List.of("schema_version", "report", "tool", "version", "source", "conditioning", "resampler",
                "levels", "dither", "shaping", "seed", "filter", "target", "flash_budget_bytes", "packed", "rows",
                "chosen", "recommendation", "files", "warnings"), new ArrayList<>(o.keySet()));
        assertEquals(Json.SCHEMA_VERSION, o.get("schema_version").getAsInt());
        assertEquals("survey", o.get("report").getAsString());
        assertEquals("../sounds/chime.wav", o.getAsJsonObject("source").get("path").getAsString());
        assertEquals(44_100, o.getAsJsonObject("source").get("rate_hz").getAsDouble(), 0);
        assertEquals(List.of("survey.txt"), List.of(o.getAsJsonArray("files").get(0).getAsString()));
        assertEquals("sinad_db", o.getAsJsonObject("target").get("figure").getAsString());
        assertEquals(40, o.getAsJsonObject("target").get("value").getAsDouble(), 0);
        assertEquals(10_000, o.get("flash_budget_bytes").getAsLong());
        JsonObject first = o.getAsJsonArray("rows").get(0).getAsJsonObject();
        assertEquals(ROW_FIELDS, new ArrayList<>(first.keySet()));
        assertEquals("previews/b04-r8000.wav", first.get("preview").getAsString());
        assertEquals(8, o.getAsJsonObject("chosen").get("bits").getAsInt());
        assertEquals(4, o.getAsJsonArray("rows").size());
    }

    @Test
    void jsonGivesNullForWhatWasNotGiven() {
        SurveyResult r = new SurveyResult(List.of(row(6, 16000, Double.POSITIVE_INFINITY, true, false, false)),
                null, null, false);
        JsonObject o = JsonParser.parseString(Json.toJson(SurveyReport.json(r, context(false))))
                .getAsJsonObject();
        assertTrue(o.get("target").isJsonNull());
        assertTrue(o.get("flash_budget_bytes").isJsonNull());
        assertTrue(o.get("chosen").isJsonNull());
        JsonObject first = o.getAsJsonArray("rows").get(0).getAsJsonObject();
        assertEquals(ROW_FIELDS, new ArrayList<>(first.keySet()));
        assertTrue(first.get("preview").isJsonNull(), "no previews written");
        // an infinite SINAD (no error at all) is not a JSON number: null
        assertTrue(first.get("sinad_db").isJsonNull());
    }

    @Test
    void timingsAreOneLineInStageOrder() {
        Map<String, Double> laps = new LinkedHashMap<>();
        laps.put("load and survey", 812.4);
        laps.put("previews", 0.2);
        laps.put("files", 39.6);
        assertEquals("stage timings: load and survey 812 ms, previews 0 ms, files 40 ms", SurveyReport.timings(laps));
    }

    @Test
    void previewNamesCarryDepthAndRate() {
        assertEquals("b06-r16000.wav", SurveyReport.previewFileName(row(6, 16000, 30, true, false, false)));
        assertEquals("b12-r11025.wav", SurveyReport.previewFileName(row(12, 11025, 30, true, false, false)));
        assertEquals("b04-r8000.5.wav", SurveyReport.previewFileName(row(4, 8000.5, 30, true, false, false)));
    }

    @Test
    void textReportCarriesSettingsTableRecommendationAndWarnings() {
        String text = SurveyReport.text(withChoice(), context(false));
        assertTrue(text.startsWith("Rungtone 9.9 survey: chime.wav\n"), text);
        assertTrue(text.contains("flash budget           10,000 bytes, counting unpacked bytes"), text);
        assertTrue(text.contains(SurveyReport.table(withChoice())), text);
        assertTrue(text.contains("\nRecommended: 8 bits at 8 kHz"), text);
        assertTrue(text.endsWith("Warnings:\n  - a warning\n"), text);
    }
}
