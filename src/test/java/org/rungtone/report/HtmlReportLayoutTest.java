package org.rungtone.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalLong;
import org.jsoup.Jsoup;
import org.jsoup.nodes.Document;
import org.jsoup.nodes.Element;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.rungtone.analysis.QualityReport;
import org.rungtone.testing.FactsFixture;

/** How report.html lays itself out for phones and paper, links its files, and rounds like the text report. */
class HtmlReportLayoutTest {
    @TempDir
    Path dir;

    private static QualityReport quality(double sinad) {
        return new QualityReport("ideal", 16_000, 24_000, 7_000, -3.01, sinad, sinad + 0.8, sinad + 2.1,
                (sinad - 1.76) / 6.02 + 0.5, -sinad, 1.0, 0.0, Optional.empty(), Optional.empty());
    }

    private BuildSummary sound(String symbol, List<Path> files) {
        return new BuildSummary("0.1.0", Path.of(symbol + ".wav"), "PCM 16-bit, 1 ch, 16000 Hz, 1.00 s", symbol, 6,
                16_000, 16_000, 1.0, "tpdf", "none", 1, "none", "kaiser", "ideal levels", 0,
                List.of(quality(37.9)), "ideal", Optional.empty(), Optional.empty(),
                new BuildSummary.PreviewInfo("none", 44_100, 6_000, -1.3, 0.9), List.of(), 12_000, files,
                List.of(), Map.of(), Optional.empty(), FactsFixture.of(Path.of(symbol + ".wav"), 16_000, 6, dir));
    }

    private static Path touch(Path f) throws IOException {
        Files.createDirectories(f.getParent());
        Files.writeString(f, "x");
        return f;
    }

    private static Path plot(Path f) {
        Plots.write(f, Plots.Chart.of("t", "x", "y", List.of(new Plots.Series("s", new double[] {0, 1},
                new double[] {0, 1}, Plots.Style.LINE)), List.of(), "Error spectrum of " + f.getParent()
                .getFileName() + ", 0\u20138 kHz, dBFS/Hz"));
        return f;
    }

    /** A two-sound project page written to dir/report.html, with the project's own files. */
    private Document project() throws IOException {
        Path chimeDir = dir.resolve("door chime");
        List<Path> chimeFiles = List.of(touch(chimeDir.resolve("preview.wav")), plot(chimeDir.resolve(
                "error-spectrum.png")));
        List<Path> alarmFiles = List.of(touch(dir.resolve("frost_alarm/preview.wav")));
        List<Path> all = List.of(touch(dir.resolve("greenhouse.h")), touch(dir.resolve("greenhouse.c")),
                chimeFiles.get(0), chimeFiles.get(1), alarmFiles.get(0), touch(dir.resolve("report.txt")));
        HtmlReport.Page page = new HtmlReport.Page("greenhouse", "0.1.0", List.of(),
                List.of(sound("door_chime", chimeFiles), sound("frost_alarm", alarmFiles)), List.of(), 31_202,
                OptionalLong.of(32_000), List.of(), Optional.empty(), all);
        Path html = dir.resolve("report.html");
        HtmlReport.write(html, page);
        return Jsoup.parse(Files.readString(html, StandardCharsets.UTF_8));
    }

    @Test
    void everyTableScrollsInItsOwnBox() throws IOException {
        Document doc = project();
        assertFalse(doc.select("table").isEmpty());
        for (Element table : doc.select("table")) {
            assertTrue(table.parent().hasClass("scroll"), table.outerHtml().substring(0, 60));
        }
        String css = doc.selectFirst("style").data();
        assertTrue(css.contains(".scroll { overflow-x: auto;"), css);
        assertTrue(css.contains("figure img { display: block; width: 100%; max-width: 100%; height: auto;"), css);
        assertTrue(doc.selectFirst("meta[name=viewport]").attr("content").contains("width=device-width"));
    }

    @Test
    void printsWithoutForcedPageBreaks() throws IOException {
        String css = project().selectFirst("style").data();
        String print = css.substring(css.indexOf("@media print"));
        assertFalse(css.contains("break-before: page") || css.contains("page-break-before: always"), print);
        // figures stay whole; big blocks (tables, listings) may break across pages instead of leaving a gap
        assertTrue(css.contains("figure { margin: 1rem 0 1.4rem; break-inside: avoid;"), css);
        assertFalse(print.contains("table, pre { break-inside: avoid"), print);
        assertTrue(print.contains(".scroll, pre { overflow: visible; }"), print);
    }

    @Test
    void linksEveryFileRelativelyAndEachPreviewWithItsSound() throws IOException {
        Document doc = project();
        for (Element a : doc.select("a[href]")) {
            String href = a.attr("href");
            if (!href.startsWith("#")) {
                assertFalse(href.startsWith("/") || href.contains("//"), href);
                Path target = dir.resolve(java.net.URLDecoder.decode(href, StandardCharsets.UTF_8));
                assertTrue(Files.isRegularFile(target), href);
            }
        }
        assertEquals(List.of("door%20chime/preview.wav"),
                doc.select("section#sound-door-chime p:contains(Listen) a").eachAttr("href"));
        assertEquals(List.of("door chime/preview.wav", "door chime/error-spectrum.png"),
                doc.select("section#sound-door-chime ul.files a").eachText());
        assertEquals("door%20chime/error-spectrum.png",
                doc.selectFirst("section#sound-door-chime figcaption a").attr("href"));
        // the project's own files, each once, apart from the sounds'
        assertEquals(List.of("greenhouse.h", "greenhouse.c", "report.txt"),
                doc.select("section#files ul.files a").eachAttr("href"));
        assertEquals("Files", doc.selectFirst("nav a[href=#files]").text());
    }

    @Test
    void altTextsSayWhatEachPlotShows() throws IOException {
        assertEquals("Error spectrum of door chime, 0\u20138 kHz, dBFS/Hz",
                project().selectFirst("section#sound-door-chime img").attr("alt"));
    }

    @Test
    void roundsTheFlashShareAsTheTextReportDoes() throws IOException {
        // 31,202 of 32,000 bytes = 97.506 %: one decimal in both reports
        Document doc = project();
        assertTrue(doc.selectFirst("header").text().contains("31,202 bytes of flash (97.5 % of the budget)"),
                doc.selectFirst("header").text());
        ProjectReport.Input in = new ProjectReport.Input("0.1.0", Path.of("greenhouse.toml"), "greenhouse",
                Map.of(), List.of(), List.of(), 31_202, 32_000, List.of(), List.of(), Optional.empty(), dir);
        assertTrue(ProjectReport.text(in).contains("Flash: 31,202 bytes for all sounds of a 32,000-byte budget"
                + " (97.5 %)"), ProjectReport.text(in));
        assertEquals("97.5 %", FigureText.budgetShare(31_202, 32_000));
    }

    @Test
    void showsTheSameSettingsAsTheTextReport() {
        BuildSummary s = sound("door_chime", List.of());
        String text = BuildReport.text(s);
        for (HtmlReport.Setting row : SoundTables.settings(s, "  ")) {
            assertTrue(text.contains(row.value()), row.toString());
        }
        assertEquals(SoundTables.settings(s, "  ").stream().map(r -> r.value().replace("  (", " (")).toList(),
                SoundTables.settings(s).stream().map(HtmlReport.Setting::value).toList());
    }
}
