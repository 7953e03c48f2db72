package org.rungtone.report;

import com.samskivert.mustache.Mustache;
import com.samskivert.mustache.Template;
import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalLong;
import java.util.Set;
import org.rungtone.analysis.QualityReport;
import org.rungtone.internal.AtomicFiles;
import org.rungtone.internal.Checks;
import org.rungtone.internal.FileNames;
import org.rungtone.internal.InputError;
import org.rungtone.internal.Units;

/**
 * The build report as one self-contained HTML page: effective settings, the figures of every sound, the
 * analog preview, the firmware summary, every PNG plot embedded as a {@code data:} URI with the alt text the
 * plot carries, relative links to the preview WAV files and the other output files, and the warnings. The
 * page loads nothing from anywhere (a Content-Security-Policy says so), needs no script, reads at a phone's
 * width (wide tables scroll in their own box), prints without forced page breaks, and is byte-identical for
 * the same page. Figures are formatted by {@link FigureText} and {@link SoundTables}, as in the text
 * reports. Layout lives in the JMustache template {@code report.html.mustache} beside this class; every
 * text value is HTML-escaped by the template engine.
 */
public final class HtmlReport {
    private static final Map<String, String> KNOWN_PLOTS = Map.of(
            "error-spectrum", "Error spectrum: what the board adds to the sound (output minus the aligned source),"
                    + " as a density per hertz, with the in-band cutoff and an ideal quantizer's error for the"
                    + " same dither marked",
            "spectrum", "Output spectrum of the single tone, with its harmonics and an ideal quantizer's noise"
                    + " floor for the same dither",
            "transfer", "Ladder transfer: output volts for every code",
            "dnl", "Differential non-linearity of every code step (LSB), with \u00b10.5 LSB and the -1 LSB"
                    + " monotonic limit",
            "inl", "Integral non-linearity of every code (LSB), with \u00b10.5 LSB",
            "monte-carlo", "Monte Carlo spread of boards built from toleranced parts",
            "survey-sinad", "SINAD against bit depth, one line per sample rate",
            "survey-sinad-flash", "SINAD against flash bytes, one line per sample rate",
            "survey-enob", "ENOB against bit depth, one line per sample rate",
            "survey-enob-flash", "ENOB against flash bytes, one line per sample rate");

    private HtmlReport() {
    }

    /**
     * Everything one report page shows.
     *
     * @param title what the page is about, e.g. the board's name ("greenhouse board")
     * @param toolVersion Rungtone version
     * @param settings the effective settings, in the order to show them
     * @param sounds one build summary per sound, in the order to show them
     * @param sections extra sections (ladder summary, calibration summary, ...), shown after the sounds
     * @param flashBytes total flash the build needs, in bytes
     * @param flashBudgetBytes the flash budget, when one is set
     * @param warnings project-level warnings, shown at the end
     * @param byline an optional line under the title (a date, a commit); the page adds none itself
     * @param files the output files of the whole job (C files, reports); those a sound lists are shown with
     *     the sound, the others in a section of their own
     */
    public record Page(String title, String toolVersion, List<Setting> settings, List<BuildSummary> sounds,
            List<Section> sections, long flashBytes, OptionalLong flashBudgetBytes, List<String> warnings,
            Optional<String> byline, List<Path> files) {

        /** Checks the figures and copies the lists. */
        public Page {
            Checks.checkArgument(!title.isBlank(), "report title must not be blank");
            Checks.checkArgument(flashBytes >= 0, "flash bytes must be >= 0: %d", flashBytes);
            Checks.checkArgument(flashBudgetBytes.isEmpty() || flashBudgetBytes.getAsLong() > 0,
                    "flash budget must be > 0 bytes: %d", flashBudgetBytes.orElse(0));
            settings = List.copyOf(settings);
            sounds = List.copyOf(sounds);
            for (BuildSummary s : sounds) {
                Checks.checkArgument(!s.quality().isEmpty(), "sound %s has no quality figures", s.symbol());
            }
            sections = List.copyOf(sections);
            warnings = List.copyOf(warnings);
            files = List.copyOf(files);
        }
    }

    /** One effective setting: key and value as the user would write them. */
    public record Setting(String key, String value) {
        /** The entries of an insertion-ordered map, values through {@link String#valueOf}. */
        public static List<Setting> of(Map<String, ?> ordered) {
            List<Setting> list = new ArrayList<>();
            ordered.forEach((k, v) -> list.add(new Setting(k, String.valueOf(v))));
            return list;
        }
    }

    /**
     * An extra section: a title, preformatted text (a ladder or calibration summary as the text report prints
     * it; may be empty) and plots.
     */
    public record Section(String title, String text, List<Figure> figures) {
        /** Copies the figure list. */
        public Section {
            figures = List.copyOf(figures);
        }

        /** A section of text only. */
        public Section(String title, String text) {
            this(title, text, List.of());
        }
    }

    /** A PNG file to embed, with its caption. */
    public record Figure(Path png, String caption) {
        /** A figure captioned from its file name (known plot names get a sentence). */
        public static Figure of(Path png) {
            return new Figure(png, defaultCaption(png));
        }
    }

    /**
     * Renders the page as HTML, reading and embedding every PNG it lists. File paths are shown as given.
     *
     * @throws InputError when a listed PNG cannot be read or is not a PNG
     */
    public static String render(Page page) {
        return render(page, Optional.empty());
    }

    /**
     * Renders the page and writes it atomically to {@code file}; listed files inside the report's folder are
     * shown relative to it, so the page reads the same wherever the folder is moved.
     *
     * @throws InputError when a listed PNG cannot be read or the file cannot be written
     */
    public static void write(Path file, Page page) {
        Path folder = file.toAbsolutePath().normalize().getParent();
        AtomicFiles.writeString(file, render(page, Optional.ofNullable(folder)));
    }

    /**
     * Compiles the page's template now, unless it is compiled: a build calls this while its plots are drawn on
     * the other core, so that writing the page later does not wait for it.
     */
    public static void prepare() {
        java.util.Objects.requireNonNull(Layout.TEMPLATE);
    }

    private static String render(Page page, Optional<Path> base) {
        return Layout.TEMPLATE.execute(new Context(base).page(page));
    }

    /** The compiled template, loaded once. */
    private static final class Layout {
        static final Template TEMPLATE = Mustache.compiler().escapeHTML(true).strictSections(true)
                .compile(load());

        private static String load() {
            try (InputStream in = HtmlReport.class.getResourceAsStream("report.html.mustache")) {
                if (in == null) {
                    throw new IllegalStateException("report.html.mustache is missing from this build");
                }
                return new String(in.readAllBytes(), StandardCharsets.UTF_8).replace("\r\n", "\n");
            } catch (IOException e) {
                throw new IllegalStateException("cannot read report.html.mustache", e);
            }
        }
    }

    /** Turns a page into the template's context: maps of strings, booleans and lists, no nulls. */
    private static final class Context {
        private final PageLinks links;
        private final Set<String> anchors = new HashSet<>();

        Context(Optional<Path> base) {
            this.links = new PageLinks(base);
        }

        Map<String, Object> page(Page page) {
            Map<String, Object> m = new LinkedHashMap<>();
            m.put("title", page.title());
            m.put("version", page.toolVersion());
            m.put("hasByline", page.byline().isPresent());
            m.put("byline", page.byline().orElse(""));
            m.put("settings", SoundTables.rows(page.settings()));
            m.put("hasSettings", !page.settings().isEmpty());
            List<Map<String, Object>> sounds = new ArrayList<>();
            for (BuildSummary s : page.sounds()) {
                sounds.add(sound(s));
            }
            m.put("sounds", sounds);
            m.put("hasSounds", !sounds.isEmpty());
            m.put("soundCount", sounds.size() == 1 ? "1 sound" : sounds.size() + " sounds");
            m.put("flash", flash(page.flashBytes(), page.flashBudgetBytes()));
            List<Map<String, Object>> sections = new ArrayList<>();
            for (Section sec : page.sections()) {
                Map<String, Object> sm = new LinkedHashMap<>();
                sm.put("anchor", anchor("section-" + sec.title()));
                sm.put("title", sec.title());
                sm.put("hasText", !sec.text().isBlank());
                sm.put("text", stripTrailingNewlines(sec.text()));
                sm.put("figures", figures(sec.figures(), sec.title()));
                sections.add(sm);
            }
            m.put("sections", sections);
            m.put("warnings", page.warnings());
            m.put("hasWarnings", !page.warnings().isEmpty());
            m.put("definitions", FigureText.definitions());
            List<Map<String, Object>> files = otherFiles(page);
            m.put("files", files);
            m.put("hasFiles", !files.isEmpty());
            return m;
        }

        /** The page's files that no sound lists, as links. */
        private List<Map<String, Object>> otherFiles(Page page) {
            Set<Path> listed = new HashSet<>();
            page.sounds().forEach(s -> listed.addAll(s.files()));
            List<Map<String, Object>> files = new ArrayList<>();
            for (Path f : page.files()) {
                if (!listed.contains(f)) {
                    files.add(links.link(f));
                }
            }
            return files;
        }

        private Map<String, Object> sound(BuildSummary s) {
            Map<String, Object> m = new LinkedHashMap<>();
            m.put("anchor", anchor("sound-" + s.symbol()));
            m.put("symbol", s.symbol());
            m.put("sourceName", FileNames.display(s.source()));
            m.put("sourceLayout", s.sourceLayout());
            m.put("bits", Integer.toString(s.bits()));
            m.put("rate", Units.format(s.rateHz(), "Hz"));
            m.put("duration", String.format(Locale.ROOT, "%.3f s", s.durationSeconds()));
            m.put("flashBytes", bytes(s.flashBytes()));
            QualityReport emitted = s.emitted();
            m.put("emittedCase", s.emittedCase());
            m.put("emittedSinad", FigureText.f1(emitted.sinadDb()));
            m.put("emittedEnob", FigureText.f2(emitted.enobFullScaleBits()));
            m.put("emittedListener", emitted.listener().map(l -> FigureText.f1(l.snrDb())).orElse("-"));
            m.put("settings", SoundTables.rows(SoundTables.settings(s)));
            m.put("cutoff", Units.format(s.quality().get(0).inBandCutoffHz(), "Hz"));
            m.put("quality", SoundTables.quality(s.quality()));
            m.put("hasShaping", s.shapingGainDb().isPresent());
            m.put("shaping", s.shapingGainDb().map(g -> String.format(Locale.ROOT,
                    "Noise shaping (%s) %s %.1f dB of in-band SNR against flat quantization.", s.shaping(),
                    g >= 0 ? "wins" : "loses", Math.abs(g))).orElse(""));
            m.put("hasListener", emitted.listener().isPresent());
            m.put("listener", SoundTables.rows(SoundTables.listener(emitted)));
            m.put("listenerScope", emitted.listener().map(FigureText::listenerScope).orElse(""));
            m.put("hasTone", s.tone().isPresent());
            m.put("tone", s.tone().map(SoundTables::tone).orElse(Map.of()));
            m.put("preview", SoundTables.rows(SoundTables.preview(s.preview())));
            List<Map<String, Object>> wavs = new ArrayList<>();
            for (Path f : s.files()) {
                if (hasExtension(f, ".wav")) {
                    wavs.add(links.link(f));
                }
            }
            m.put("wavs", wavs);
            m.put("hasWavs", !wavs.isEmpty());
            m.put("hasFirmware", !s.firmware().isEmpty());
            m.put("firmware", String.join("\n", s.firmware()));
            List<Figure> plots = new ArrayList<>();
            for (Path f : s.files()) {
                if (hasExtension(f, ".png")) {
                    plots.add(Figure.of(f));
                }
            }
            m.put("figures", figures(plots, s.symbol()));
            m.put("hasFigures", !plots.isEmpty());
            List<Map<String, Object>> files = new ArrayList<>();
            for (Path f : s.files()) {
                files.add(links.link(f));
            }
            m.put("files", files);
            m.put("hasFiles", !files.isEmpty());
            List<String> warnings = FigureText.soundWarnings(s);
            m.put("warnings", warnings);
            m.put("hasWarnings", !warnings.isEmpty());
            m.put("warningsAnchor", anchor("sound-" + s.symbol() + "-warnings"));
            m.put("warningCount", Integer.toString(warnings.size()));
            m.put("warningPhrase", warnings.size() == 1 ? "1 warning" : warnings.size() + " warnings");
            return m;
        }

        private static Map<String, Object> flash(long total, OptionalLong budget) {
            Map<String, Object> m = new LinkedHashMap<>();
            m.put("total", bytes(total));
            m.put("hasBudget", budget.isPresent());
            if (budget.isPresent()) {
                long b = budget.getAsLong();
                double percent = 100.0 * total / b;
                m.put("budget", bytes(b));
                m.put("percent", FigureText.budgetShare(total, b));
                m.put("barWidth", String.format(Locale.ROOT, "%.1f", Math.min(100, percent)));
                m.put("over", total > b);
                m.put("margin", total > b ? "over budget by " + bytes(total - b)
                        : bytes(b - total) + " to spare");
            }
            return m;
        }

        private List<Map<String, Object>> figures(List<Figure> figures, String owner) {
            List<Map<String, Object>> list = new ArrayList<>();
            for (Figure f : figures) {
                EmbeddedPng png = EmbeddedPng.read(f.png());
                Map<String, Object> m = new LinkedHashMap<>();
                m.put("data", png.base64());
                m.put("width", Integer.toString(png.width()));
                m.put("height", Integer.toString(png.height()));
                m.put("caption", f.caption());
                m.put("alt", png.description().orElse(owner + ": " + plotName(f.png()) + " plot"));
                m.put("file", links.link(f.png()));
                list.add(m);
            }
            return list;
        }

        /** An id made of [a-z0-9-] from {@code text}, unique within the page. */
        private String anchor(String text) {
            String id = text.toLowerCase(Locale.ROOT).replaceAll("[^a-z0-9]+", "-").replaceAll("^-|-$", "");
            String unique = id;
            for (int n = 2; !anchors.add(unique); n++) {
                unique = id + "-" + n;
            }
            return unique;
        }

    }

    private static boolean hasExtension(Path f, String extension) {
        Path name = f.getFileName();
        return name != null && name.toString().toLowerCase(Locale.ROOT).endsWith(extension);
    }

    private static String defaultCaption(Path png) {
        String known = KNOWN_PLOTS.get(stem(png).toLowerCase(Locale.ROOT));
        if (known != null) {
            return known;
        }
        String words = plotName(png);
        return Character.toUpperCase(words.charAt(0)) + words.substring(1);
    }

    /** The file name without ".png", dashes and underscores as spaces: "error spectrum". */
    private static String plotName(Path png) {
        String words = stem(png).replaceAll("[-_]+", " ").trim();
        return words.isEmpty() ? String.valueOf(png.getFileName()) : words;
    }

    private static String stem(Path png) {
        return String.valueOf(png.getFileName()).replaceFirst("(?i)\\.png$", "");
    }

    private static String stripTrailingNewlines(String text) {
        return text.replaceAll("\\n+$", "");
    }

    private static String bytes(long n) {
        return String.format(Locale.ROOT, "%,d bytes", n);
    }
}
