package org.rungtone.report;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.Base64;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalLong;
import org.jsoup.Jsoup;
import org.jsoup.nodes.Document;
import org.jsoup.nodes.Element;
import org.jsoup.select.Elements;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.rungtone.analysis.QualityReport;
import org.rungtone.analysis.ToneReport;
import org.rungtone.internal.InputError;
import org.rungtone.testing.FactsFixture;

class HtmlReportTest {
    private static final byte[] PNG_SIGNATURE = {(byte) 0x89, 'P', 'N', 'G', '\r', '\n', 0x1a, '\n'};

    @TempDir
    Path dir;

    private BuildSummary chime;
    private BuildSummary alarm;
    private Path transferPng;

    @BeforeEach
    void makeSummaries() {
        Path chimeOut = dir.resolve("door_chime");
        Path errorPlot = plot(chimeOut.resolve("error-spectrum.png"), "error");
        Path spectrumPlot = plot(chimeOut.resolve("spectrum.png"), "spectrum");
        List<QualityReport> chimeQuality = List.of(
                quality("ideal", 6, 0.0), quality("modelled", 6, 4.2), quality("compensated", 6, 1.3));
        ToneReport tone = new ToneReport(16_000, 4096, 1046.5, -0.9, 0.001, 37.6, 5.95, 37.5, 38.2, -44.7,
                false, 46.3, false, -38.9, List.of(new ToneReport.Harmonic(2, 2093.0, -52.1, true),
                        new ToneReport.Harmonic(3, 3150.0, -47.0, true)));
        chime = new BuildSummary("0.1.0", Path.of("sounds/door-chime.wav"), "PCM 16-bit, 2 ch, 44100 Hz, 1.50 s",
                "door_chime", 6, 16_000, 24_000, 1.5, "tpdf", "none", 1, "mixdown, resample 44.1k -> 16k",
                "kaiser, 5 dB", "r2r 6-bit, 5% parts, measured profile", 12, chimeQuality, "compensated",
                Optional.empty(), Optional.of(tone),
                new BuildSummary.PreviewInfo("2nd-order low-pass 6.4kHz", 48_000, 6_400, -1.32, 0.98),
                List.of("pins: PB0..PB5 (bit 0 on PB0)", "timer: timer1 CTC, OCR1A = 999 (16.000 kHz exact)"),
                24_000, List.of(chimeOut.resolve("door_chime.c"), chimeOut.resolve("preview.wav"), errorPlot,
                        spectrumPlot, chimeOut.resolve("report.txt")),
                List.of("12 samples clipped before quantization; lower --gain by 0.3 dB"),
                Map.of("decode", 12.0), Optional.empty(),
                FactsFixture.of(Path.of("sounds/door-chime.wav"), 44_100, 6, chimeOut));

        Path alarmOut = dir.resolve("freezer_alarm");
        Path alarmPlot = plot(alarmOut.resolve("error-spectrum.png"), "alarm error");
        alarm = new BuildSummary("0.1.0", Path.of("sounds/freezer-alarm.rung"), "script, 8000 Hz, 0.80 s",
                "freezer_alarm", 6, 8_000, 6_400, 0.8, "none", "second-order", 7, "none", "none",
                "ideal levels", 0, List.of(quality("ideal", 6, 0.0), quality("shaped", 6, -2.5)), "shaped",
                Optional.of(3.4), Optional.empty(), new BuildSummary.PreviewInfo("none", 48_000, 3_400, -1.58,
                        1.042), List.of(), 6_400, List.of(alarmPlot), List.of("alarm is louder than the chime"),
                Map.of(), Optional.empty(),
                FactsFixture.of(Path.of("sounds/freezer-alarm.rung"), 8_000, 6, alarmOut));
        transferPng = plot(dir.resolve("ladder/transfer.png"), "transfer");
    }

    /**
     * Figures of an ideal N-bit quantizer, SINAD = 6.02·N + 1.76 dB (W. R. Bennett, BSTJ 27, 1948), worsened
     * by {@code extraDb}, for a programme 3.01 dB below a full-scale sine: ENOB re signal (SINAD − 1.76)/6.02,
     * ENOB re full scale half a bit more (IEEE Std 1241: 3.01 dB / 6.02 dB per bit).
     */
    private static QualityReport quality(String label, int bits, double extraDb) {
        double sinad = 6.02 * bits + 1.76 - extraDb;
        return new QualityReport(label, 16_000, 24_000, 7_000, -3.01, sinad, sinad + 0.8, sinad + 2.1,
                (sinad - 1.76) / 6.02 + 0.5, -sinad, 1.0, 0.0, Optional.empty(), Optional.empty());
    }

    /** A plot whose description (its alt text on the page) is "{@code name} plot for the test". */
    private static Path plot(Path file, String name) {
        Plots.write(file, Plots.Chart.of(name, "x", "y", List.of(new Plots.Series(name, new double[] {0, 1, 2},
                new double[] {0, 1, 0}, Plots.Style.LINE)), List.of(), name + " plot for the test"));
        return file;
    }

    private HtmlReport.Page page(List<String> warnings, long flash, OptionalLong budget) {
        Map<String, Object> settings = new LinkedHashMap<>();
        settings.put("target", "avr");
        settings.put("cpu_clock", "16MHz");
        settings.put("ladder.topology", "r2r");
        settings.put("dither", "tpdf (from the command line)");
        return new HtmlReport.Page("greenhouse board", "0.1.0", HtmlReport.Setting.of(settings),
                List.of(chime, alarm),
                List.of(new HtmlReport.Section("Ladder", "bit  pin  R\n  0  PB0  20k\n",
                        List.of(HtmlReport.Figure.of(transferPng))),
                        new HtmlReport.Section("Calibration", "fitted from 64 measured codes")),
                flash, budget, warnings, Optional.empty(), List.of());
    }

    private static String f1(double v) {
        return String.format(Locale.ROOT, "%.1f", v);
    }

    private static String f2(double v) {
        return String.format(Locale.ROOT, "%.2f", v);
    }

    @Test
    void embedsEveryPlotAsAPngDataUriWithAltTextAndCaption() throws IOException {
        Document doc = Jsoup.parse(HtmlReport.render(page(List.of(), 30_400, OptionalLong.of(32_768))));
        List<Path> plots = new ArrayList<>();
        for (BuildSummary s : List.of(chime, alarm)) {
            s.files().stream().filter(f -> f.toString().endsWith(".png")).forEach(plots::add);
        }
        plots.add(transferPng);
        Elements images = doc.select("img");
        assertEquals(plots.size(), images.size());
        for (int i = 0; i < plots.size(); i++) {
            Element img = images.get(i);
            String src = img.attr("src");
            assertTrue(src.startsWith("data:image/png;base64,"), src.substring(0, 30));
            byte[] png = Base64.getDecoder().decode(src.substring(src.indexOf(',') + 1));
            assertArrayEquals(PNG_SIGNATURE, Arrays.copyOf(png, 8));
            assertArrayEquals(Files.readAllBytes(plots.get(i)), png, plots.get(i).toString());
            assertFalse(img.attr("alt").isBlank());
            assertEquals("800", img.attr("width"));
            assertEquals("480", img.attr("height"));
            Element caption = img.parent().selectFirst("figcaption");
            assertNotNull(caption);
            assertFalse(caption.text().isBlank());
        }
        assertTrue(doc.select("section#sound-door-chime figcaption").first().text()
                .startsWith("Error spectrum"));
        // the alt text is the description the plot carries (PngText)
        assertEquals("error plot for the test", images.get(0).attr("alt"));
        assertEquals("transfer plot for the test", images.last().attr("alt"));
    }

    @Test
    void namesAPlotWithoutADescriptionByItsOwnerAndFile() throws IOException {
        Path bare = dir.resolve("ladder/fit_residuals.png");
        java.awt.image.BufferedImage image = new java.awt.image.BufferedImage(4, 3,
                java.awt.image.BufferedImage.TYPE_INT_RGB);
        javax.imageio.ImageIO.write(image, "png", bare.toFile());
        HtmlReport.Page p = new HtmlReport.Page("board", "0.1.0", List.of(), List.of(),
                List.of(new HtmlReport.Section("Fit", "", List.of(HtmlReport.Figure.of(bare)))), 0,
                OptionalLong.empty(), List.of(), Optional.empty(), List.of());
        Element img = Jsoup.parse(HtmlReport.render(p)).selectFirst("img");
        assertEquals("Fit: fit residuals plot", img.attr("alt"));
        assertEquals("4", img.attr("width"));
    }

    @Test
    void captionsPlotsFromTheirNames() {
        assertEquals("Ladder transfer: output volts for every code",
                HtmlReport.Figure.of(Path.of("out/transfer.png")).caption());
        assertEquals("Fit residuals", HtmlReport.Figure.of(Path.of("fit_residuals.PNG")).caption());
    }

    @Test
    void showsEveryQualityFigureOfEverySound() {
        Document doc = Jsoup.parse(HtmlReport.render(page(List.of(), 30_400, OptionalLong.empty())));
        for (BuildSummary s : List.of(chime, alarm)) {
            Element section = doc.getElementById("sound-" + s.symbol().replace('_', '-'));
            assertNotNull(section, s.symbol());
            Elements rows = section.select("table.figures").first().select("tbody tr");
            assertEquals(s.quality().size(), rows.size());
            for (int i = 0; i < rows.size(); i++) {
                QualityReport q = s.quality().get(i);
                List<String> cells = rows.get(i).select("td").eachText();
                assertEquals(List.of(q.label(), f1(q.sinadDb()), f1(q.inBandSnrDb()), f1(q.aWeightedSnrDb()),
                        f2(q.enobFullScaleBits()), f2(q.enobSignalBits())), cells);
            }
            assertTrue(rows.last().hasClass("emitted"));
        }
        // 6-bit ideal: 6.02·6 + 1.76 = 37.88 dB (Bennett, BSTJ 1948), ENOB exactly 6 (IEEE Std 1241)
        Elements overview = doc.select("section#overview tbody tr");
        assertEquals(List.of("door_chime", "door-chime.wav", "6", "16kHz", "1.500 s", "24,000 bytes",
                "compensated", "36.6", "6.28", "-", "1"), overview.get(0).select("td").eachText());
        assertEquals("37.9", doc.select("section#sound-freezer-alarm table.figures td").get(1).text());
        String tone = doc.select("section#sound-door-chime").text();
        assertTrue(tone.contains("SFDR 46.3 dB"), tone);
        // ENOB re signal from the fit's 37.6 dB; re full scale adds the tone's 0.9 dB below full scale
        assertTrue(tone.contains("ENOB (re signal) 5.95 bits"), tone);
        assertTrue(tone.contains("ENOB (re full scale) 6.10 bits"), tone);
        assertTrue(tone.contains("3 3.15kHz -47.0"), tone);
        assertTrue(tone.contains("zero-order-hold droop -1.32 dB at 6.4kHz"), tone);
        assertTrue(doc.select("section#sound-door-chime pre").text()
                .contains("timer: timer1 CTC, OCR1A = 999"));
        assertTrue(doc.select("section#sound-freezer-alarm").text()
                .contains("Noise shaping (second-order) wins 3.4 dB of in-band SNR"));
    }

    @Test
    void showsTheSettingsSectionsAndFlash() {
        Document doc = Jsoup.parse(HtmlReport.render(page(List.of(), 30_400, OptionalLong.of(32_768))));
        assertEquals("greenhouse board", doc.selectFirst("h1").text());
        List<String> rows = doc.select("section#settings tr").eachText();
        assertEquals(List.of("target avr", "cpu_clock 16MHz", "ladder.topology r2r",
                "dither tpdf (from the command line)"), rows);
        assertEquals("bit  pin  R\n  0  PB0  20k", doc.selectFirst("section#section-ladder pre").wholeText());
        assertTrue(doc.selectFirst("section#section-calibration").text().contains("64 measured codes"));
        // 30400 / 32768 = 92.8 %
        assertTrue(doc.selectFirst("section#overview").text().contains(
                "30,400 bytes used of a budget of 32,768 bytes (92.8 %): 2,368 bytes to spare."),
                doc.selectFirst("section#overview").text());
        assertEquals("width: 92.8%", doc.selectFirst(".bar span").attr("style"));

        Document over = Jsoup.parse(HtmlReport.render(page(List.of(), 40_000, OptionalLong.of(32_768))));
        assertEquals("over budget by 7,232 bytes", over.selectFirst(".over-text").text());
        assertEquals("width: 100.0%", over.selectFirst(".bar.over span").attr("style"));
    }

    @Test
    void listsEveryWarningAtTheEnd() {
        List<String> projectWarnings = List.of("flash is 92.8 % of the budget", "two sounds share pin PB3");
        Document doc = Jsoup.parse(HtmlReport.render(page(projectWarnings, 30_400, OptionalLong.empty())));
        assertEquals(projectWarnings, doc.select("section#warnings ul.warnings li").eachText());
        assertEquals(chime.warnings(), doc.select("section#sound-door-chime ul.warnings li").eachText());
        List<String> alarmWarnings = doc.select("section#sound-freezer-alarm ul.warnings li").eachText();
        assertEquals(List.of("alarm is louder than the chime",
                "the preview's filter rings 4.2 % past full scale; the preview WAV clips there"), alarmWarnings);
        // each sound's warnings close its section
        Element last = doc.selectFirst("section#sound-door-chime").children().last();
        assertTrue(last.hasClass("warnings"), last.outerHtml());
        assertEquals(List.of("1 warning for door_chime", "2 warnings for freezer_alarm"),
                doc.select("section#warnings p a").eachText());
    }

    @Test
    void loadsNothingFromOutsideThePage() {
        String html = HtmlReport.render(page(List.of("w"), 1, OptionalLong.empty()));
        Document doc = Jsoup.parse(html);
        assertTrue(doc.select("script, link, iframe, object, embed").isEmpty());
        for (Element e : doc.select("[src]")) {
            assertTrue(e.attr("src").startsWith("data:image/png;base64,"), e.attr("src"));
        }
        for (Element e : doc.select("[href]")) {
            assertTrue(e.attr("href").startsWith("#"), e.attr("href"));
            assertNotNull(doc.getElementById(e.attr("href").substring(1)), e.attr("href"));
        }
        assertFalse(html.contains("url("));
        assertFalse(html.contains("http:") || html.contains("https:") || html.contains("src=\"//"));
        assertEquals("default-src 'none'; img-src data:; style-src 'unsafe-inline'",
                doc.selectFirst("meta[http-equiv=Content-Security-Policy]").attr("content"));
    }

    @Test
    void keepsEveryIdUniqueAndEveryLinkResolved() {
        HtmlReport.Page p = new HtmlReport.Page("board", "0.1.0", List.of(), List.of(chime, chime, alarm),
                List.of(new HtmlReport.Section("Ladder", "a"), new HtmlReport.Section("ladder!", "b")), 0,
                OptionalLong.empty(), List.of(), Optional.empty(), List.of());
        Document doc = Jsoup.parse(HtmlReport.render(p));
        List<String> ids = doc.select("[id]").eachAttr("id");
        assertEquals(ids.size(), ids.stream().distinct().count(), ids.toString());
        assertTrue(ids.containsAll(List.of("sound-door-chime", "sound-door-chime-2", "section-ladder",
                "section-ladder-2")), ids.toString());
        for (Element e : doc.select("[href]")) {
            assertNotNull(doc.getElementById(e.attr("href").substring(1)), e.attr("href"));
        }
    }

    @Test
    void escapesText() {
        String evil = "<script>alert(\"x\")</script> & <b>";
        BuildSummary s = new BuildSummary("0.1.0", Path.of("a.wav"), evil, "snd", 4, 8000, 8, 0.001, "none",
                "none", 0, evil, "none", "ideal", 0, List.of(quality(evil, 4, 0)), evil, Optional.empty(),
                Optional.empty(), new BuildSummary.PreviewInfo(evil, 8000, 3400, -1.5, 0.5), List.of(evil), 8,
                List.of(), List.of(evil), Map.of(), Optional.empty(),
                FactsFixture.of(Path.of("a.wav"), 8000, 4, dir));
        HtmlReport.Page p = new HtmlReport.Page(evil, "0.1.0", List.of(new HtmlReport.Setting(evil, evil)),
                List.of(s), List.of(new HtmlReport.Section(evil, evil)), 8, OptionalLong.empty(), List.of(evil),
                Optional.of(evil), List.of());
        String html = HtmlReport.render(p);
        assertFalse(html.contains("<script"), html);
        assertFalse(html.contains("<b>"));
        Document doc = Jsoup.parse(html);
        assertTrue(doc.select("script, b").isEmpty());
        assertEquals(evil, doc.selectFirst("h1").text());
        assertEquals(evil + " | Rungtone build report", doc.title());
        assertEquals(List.of(evil), doc.select("section#warnings ul.warnings li").eachText());
        assertEquals(evil, doc.selectFirst("section#sound-snd pre").wholeText());
    }

    @Test
    void isTheSameOnEveryRender() {
        HtmlReport.Page p = page(List.of("w"), 30_400, OptionalLong.of(32_768));
        String html = HtmlReport.render(p);
        assertEquals(html, HtmlReport.render(p));
        assertFalse(html.contains("\r"));
    }

    @Test
    void writesAtomicallyWithPathsRelativeToTheReport() throws IOException {
        Path file = dir.resolve("report.html");
        HtmlReport.write(file, page(List.of(), 30_400, OptionalLong.empty()));
        Document doc = Jsoup.parse(Files.readString(file, StandardCharsets.UTF_8));
        assertEquals(List.of("door_chime/door_chime.c", "door_chime/preview.wav",
                "door_chime/error-spectrum.png", "door_chime/spectrum.png", "door_chime/report.txt"),
                doc.select("section#sound-door-chime ul.files li").eachText());
        assertTrue(doc.selectFirst("section#section-ladder figcaption").text()
                .endsWith("(ladder/transfer.png)"));
        try (var listing = Files.list(dir)) {
            assertTrue(listing.noneMatch(f -> f.getFileName().toString().endsWith(".part")));
        }
    }

    @Test
    void namesAPlotThatCannotBeEmbedded() throws IOException {
        Path missing = dir.resolve("gone.png");
        HtmlReport.Page p = new HtmlReport.Page("board", "0.1.0", List.of(), List.of(),
                List.of(new HtmlReport.Section("plots", "", List.of(HtmlReport.Figure.of(missing)))), 0,
                OptionalLong.empty(), List.of(), Optional.empty(), List.of());
        InputError e = assertThrows(InputError.class, () -> HtmlReport.render(p));
        assertEquals(missing + ": cannot read this plot for report.html (NoSuchFileException);"
                + " rebuild to write it again", e.getMessage());

        Files.writeString(missing, "not an image");
        e = assertThrows(InputError.class, () -> HtmlReport.render(p));
        assertEquals(missing + ": not a PNG image; report.html embeds PNG plots only", e.getMessage());
    }
}
