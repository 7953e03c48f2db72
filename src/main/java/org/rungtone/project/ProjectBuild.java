package org.rungtone.project;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.OptionalInt;
import java.util.OptionalLong;
import java.util.function.UnaryOperator;
import org.rungtone.calibrate.OutputSpan;
import org.rungtone.codec.TreadFormat;
import org.rungtone.condition.ResamplerKind;
import org.rungtone.firmware.CNames;
import org.rungtone.firmware.DdsSpec;
import org.rungtone.firmware.EmitResult;
import org.rungtone.firmware.FirmwareEmitter;
import org.rungtone.firmware.FirmwareFacts;
import org.rungtone.firmware.FirmwareRequest;
import org.rungtone.firmware.FlashBudget;
import org.rungtone.firmware.PlaybackEngine;
import org.rungtone.firmware.SampleStorage;
import org.rungtone.internal.AtomicFiles;
import org.rungtone.internal.InputError;
import org.rungtone.internal.OutputFolder;
import org.rungtone.internal.Setting;
import org.rungtone.internal.SettingError;
import org.rungtone.internal.Units;
import org.rungtone.ladder.LadderDescription;
import org.rungtone.ladder.LadderSpec;
import org.rungtone.ladder.LevelTable;
import org.rungtone.quantize.Compensation;
import org.rungtone.quantize.Dither;
import org.rungtone.quantize.ErrorFilter;
import org.rungtone.report.BuildSummary;
import org.rungtone.report.HtmlReport;
import org.rungtone.report.Json;
import org.rungtone.report.ProjectReport;
import org.rungtone.report.ProjectSetting;
import org.rungtone.report.ProjectSetting.Origin;
import org.rungtone.report.SoundPlots;

/**
 * Builds every sound of a {@link Project} into one set of outputs: one header for all sounds, shared player
 * code and one pin map (or a sample array per sound without a player), each sound's preview and plots in a
 * folder of its own, one report of all sounds and their flash. The command line wins over the file, the file
 * over defaults; the report lists each effective setting and where it came from.
 */
public final class ProjectBuild {
    /** The settings naming the output folder and the C files' own: in the report, never in the C files. */
    private static final String OUT_SETTING = "out";
    private static final String C_OUT_SETTING = "c_out";

    private final String toolVersion;
    private final OutputSpan span;
    private final BuildProgress progress;

    /** A project build stamping {@code toolVersion} into its outputs. */
    public ProjectBuild(String toolVersion) {
        this(toolVersion, OutputSpan.FULL, BuildProgress.NONE);
    }

    /**
     * A project build with the output span of compensated sounds that tells {@code progress} how far it has
     * got: "sound 2/3 door_chime: condition done" and the share of the whole project (every sound counts alike).
     */
    public ProjectBuild(String toolVersion, OutputSpan span, BuildProgress progress) {
        this.toolVersion = toolVersion;
        this.span = span;
        this.progress = progress;
    }

    /**
     * What the command line overrides. Empty values leave the file's settings alone.
     *
     * @param bits --bits
     * @param rateHz --rate
     * @param dither --dither
     * @param shaping --shaping
     * @param seed --seed
     * @param outDir --out
     * @param cOutDir --c-out
     * @param compensation --compensation
     * @param unit --unit, a measured unit profile that replaces the project's board
     * @param ladder the command line's ladder description, on top of the project's [ladder] table
     * @param firmware applies the firmware options given on the command line to a request builder
     * @param wantsPlayer the command line asked for a player
     */
    public record Overrides(OptionalInt bits, OptionalDouble rateHz, Optional<Dither> dither,
            Optional<ErrorFilter> shaping, Optional<Long> seed, Optional<Path> outDir, Optional<Path> cOutDir,
            Optional<Compensation> compensation, Optional<Path> unit, LadderDescription ladder,
            UnaryOperator<FirmwareRequest.Builder> firmware, boolean wantsPlayer) {
        /**
         * True when the command line may have given {@code s}: then an error about it names the option.
         * Firmware options are not told apart: with any of them, every {@code target} setting counts.
         */
        boolean gives(Setting s) {
            switch (s) {
                case BITS:
                    return bits.isPresent();
                case RATE:
                    return rateHz.isPresent();
                case DITHER:
                    return dither.isPresent();
                case SHAPING:
                    return shaping.isPresent();
                case SEED:
                    return seed.isPresent();
                case OUT:
                    return outDir.isPresent();
                case C_OUT:
                    return cOutDir.isPresent();
                case COMPENSATION:
                    return compensation.isPresent();
                case UNIT:
                    return unit.isPresent();
                default:
                    return s.key().startsWith("target.") && wantsPlayer;
            }
        }

        /** No overrides: the project as written. */
        public static Overrides none() {
            return new Overrides(OptionalInt.empty(), OptionalDouble.empty(), Optional.empty(), Optional.empty(),
                    Optional.empty(), Optional.empty(), Optional.empty(), Optional.empty(), Optional.empty(),
                    LadderDescription.none(), b -> b, false);
        }
    }

    /**
     * The outcome.
     *
     * @param outDir the output folder
     * @param sounds one summary per sound
     * @param firmware the firmware report lines
     * @param flashBytes total flash of all sounds (and tables)
     * @param settings effective settings with their origin
     * @param files every file written
     * @param warnings project-level warnings
     * @param report what the reports show
     */
    public record Result(Path outDir, List<BuildSummary> sounds, List<String> firmware, long flashBytes,
            Map<String, String> settings, List<Path> files, List<String> warnings, ProjectReport.Input report) {
    }

    /**
     * Builds the project.
     *
     * @throws InputError naming the file, line and key, or the option, for anything the user can fix
     */
    public Result run(Project project, Overrides o) {
        try {
            return build(project, o);
        } catch (SettingError e) {
            if (o.gives(e.setting())) {
                throw e; // the command line names its option
            }
            throw new InputError(project.where(e.setting()) + ": " + e.setting().key() + ": "
                    + e.detail(Setting::key), e);
        }
    }

    /**
     * The settings every sound of the project shares, with command-line overrides applied, and each one's
     * value and origin for the reports.
     */
    private record Shared(Path outDir, Optional<Path> cOutDir, int bits, Dither dither, ErrorFilter shaping,
            long seed, Compensation compensation, Optional<LevelTable> board, OptionalDouble rateHz,
            Map<String, ProjectSetting> settings) {
    }

    /** What emission wrote and said. */
    private record Emitted(List<Path> files, List<String> firmwareLines, List<String> warnings, long flashBytes,
            Optional<FirmwareFacts> facts) {
    }

    private Result build(Project project, Overrides o) {
        Shared shared = settle(project, o);
        try (OutputFolder folder = OutputFolder.open(shared.outDir());
                CFolder c = CFolder.open(shared.outDir(), shared.cOutDir())) {
            Result r = build(project, o, shared, c.dir());
            c.commit();
            folder.commit();
            return r;
        }
    }

    private Result build(Project project, Overrides o, Shared shared, Path cDir) {
        Optional<FirmwareRequest> player = player(project, o, shared.settings());
        if (player.isPresent()) {
            checkOneRate(project, o, shared.rateHz());
        }
        java.util.concurrent.CompletableFuture<Void> plotsReady = org.rungtone.report.PlotWarmUp.start();
        // every sound's settings are checked before the first sound is rendered
        List<BuildPlan> plans = new ArrayList<>();
        Optional<TreadFormat> codec = player.filter(p -> p.engine() != PlaybackEngine.SWEEP)
                .flatMap(p -> p.storage().codec());
        for (Project.Sound s : project.sounds()) {
            try {
                plans.add(plan(project, s, o, shared, codec));
            } catch (SettingError e) {
                throw located(project, s, o, e);
            }
        }
        List<SoundRenderer.Rendered> rendered = new ArrayList<>();
        for (int i = 0; i < plans.size(); i++) {
            Project.Sound s = project.sounds().get(i);
            String label = String.format(Locale.ROOT, "sound %d/%d %s", s.index(), project.sounds().size(),
                    s.name());
            double before = i;
            BuildProgress sound = (step, share) -> progress.update(label + ": " + step,
                    (before + share / BuildStage.rendered()) / plans.size() * BuildStage.rendered());
            try {
                rendered.add(new SoundRenderer(span, sound).render(plans.get(i)));
            } catch (SettingError e) {
                throw located(project, s, o, e);
            }
        }
        progress.update("writing firmware, previews and reports", BuildStage.rendered());
        Emitted emitted = emit(project, player, shared, rendered, cDir);
        Jobs.join(plotsReady);
        Build build = new Build(toolVersion);
        List<Path> files = new ArrayList<>(emitted.files());
        List<BuildSummary> summaries = new ArrayList<>();
        // comparable plots of all sounds share their y ranges
        SoundPlots.Scales scales = SoundPlots.Scales.of(rendered.stream().map(Build::plotData).toList());
        for (SoundRenderer.Rendered r : rendered) {
            List<Path> assets = Build.writeAssets(r, r.plan().outDir(), scales);
            files.addAll(assets);
            SampleStorage storage = player.map(FirmwareRequest::storage).orElse(SampleStorage.UNPACKED);
            long soundBytes = storage.bytes(r.emitted().length(), r.plan().bits());
            summaries.add(build.summary(r, List.of(), Optional.empty(), soundBytes, assets, r.warnings(),
                    r.stageMillis()));
        }
        return writeReports(project, shared, summaries, emitted, files);
    }

    /** Decides the shared settings: command line over project file over defaults. */
    private Shared settle(Project project, Overrides o) {
        Map<String, ProjectSetting> settings = new LinkedHashMap<>();
        Path outDir = o.outDir().or(project::outDir)
                .orElse(project.file().toAbsolutePath().getParent().resolve("rungtone-out").resolve(project.name()))
                .toAbsolutePath().normalize();
        settings.put(OUT_SETTING, ProjectSetting.shown(outDir, outDir.toString(), Origin.of(o.outDir().isPresent(),
                project.outDir().isPresent())));
        AtomicFiles.checkFolderUsable(outDir);
        Optional<Path> cOut = o.cOutDir().or(project::cOutDir).map(p -> p.toAbsolutePath().normalize());
        cOut.ifPresent(p -> settings.put(C_OUT_SETTING, ProjectSetting.shown(p, p.toString(),
                Origin.of(o.cOutDir().isPresent(), true))));
        Project.Quantize q = project.quantize();
        int fixedBits = o.bits().isPresent() ? o.bits().getAsInt() : q.bits().map(Long::intValue).orElse(0);
        Optional<LevelTable> board = Boards.ofProject(project, o.unit(), o.ladder(), fixedBits);
        int bits = fixedBits != 0 ? fixedBits : board.map(LevelTable::bits).orElse(LadderSpec.DEFAULT_BITS);
        settings.put("bits", ProjectSetting.shown(bits, Integer.toString(bits), fixedBits == 0 && board.isPresent()
                ? Origin.BOARD : Origin.of(o.bits().isPresent(), q.bits().isPresent())));
        Dither dither = o.dither().or(q::dither).orElse(Defaults.DITHER);
        settings.put("dither", shown(dither.label(), Origin.of(o.dither().isPresent(), q.dither().isPresent())));
        ErrorFilter shaping = o.shaping().or(q::shaping).orElse(Defaults.SHAPING);
        settings.put("shaping", shown(shaping.name(), Origin.of(o.shaping().isPresent(), q.shaping().isPresent())));
        long seed = o.seed().or(project::seed).orElse(Defaults.SEED);
        settings.put("seed", ProjectSetting.shown(seed, Long.toString(seed), Origin.of(o.seed().isPresent(),
                project.seed().isPresent())));
        Compensation compensation = o.compensation().or(project::compensation).orElse(Defaults.COMPENSATION);
        String levels = board.map(LevelTable::origin).orElse("ideal ladder");
        settings.put("levels", ProjectSetting.plain(levels, levels, board.isEmpty() ? Origin.DEFAULT
                : Origin.of(o.unit().isPresent() || o.ladder().given(), true)));
        if (board.isPresent() && span != OutputSpan.FULL) {
            settings.put("span", ProjectSetting.plain(span.key(), span.key(),
                    Origin.of(project.quantize().span().filter(span::equals).isEmpty(), true)));
        }
        if (board.isPresent()) {
            settings.put("compensation", shown(compensation.key(), Origin.of(o.compensation().isPresent(),
                    project.compensation().isPresent())));
        }
        OptionalDouble rate = o.rateHz().isPresent() ? o.rateHz() : q.rateHz();
        return new Shared(outDir, cOut, bits, dither, shaping, seed, compensation, board, rate, settings);
    }

    /**
     * An error about a setting found while building sound {@code s}, placed where the file sets it: a sound's
     * own setting (or its own rate) at its line in that sound's table, as {@code sound[2].fade_in}; anything
     * else as it is, for {@link #run} to place.
     */
    private static RuntimeException located(Project project, Project.Sound s, Overrides o, SettingError e) {
        boolean own = e.setting().key().startsWith("sound.")
                || e.setting() == Setting.RATE && s.rateHz().isPresent() && !o.gives(Setting.RATE);
        return own ? s.error(project.file(), e) : e;
    }

    /** The build plan of one sound. */
    private static BuildPlan plan(Project project, Project.Sound s, Overrides o, Shared shared,
            Optional<TreadFormat> codec) {
        OptionalDouble rate = o.rateHz().isPresent() ? o.rateHz() : s.rateHz().isPresent() ? s.rateHz()
                : shared.rateHz();
        String symbol = CNames.symbol(project.name()) + "_" + CNames.symbol(s.name());
        Project.Preview pv = project.preview();
        BuildPlan.Builder plan = BuildPlan.builder(s.source(), symbol,
                        shared.outDir().resolve(CNames.symbol(s.name())))
                .channel(s.channel().map(Long::intValue).orElse(0)).name(s.name()).bits(shared.bits()).rateHz(rate)
                .dither(shared.dither()).shaping(shared.shaping()).seed(shared.seed())
                .removeDc(!s.keepDc().orElse(false)).trimDbfs(s.trimDbfs()).gainDb(s.gainDb())
                .normalizeDbfs(s.gainDb().isPresent() ? OptionalDouble.empty()
                        : OptionalDouble.of(s.normalizeDbfs().orElse(Defaults.NORMALIZE_DBFS)))
                .fades(s.fadeInSeconds().orElse(0), s.fadeOutSeconds().orElse(0))
                .resampler(s.resampler().orElse(ResamplerKind.KAISER))
                .flashQualifier(project.target().flashAttr().orElse(""))
                .preview(pv.filter().orElse(Defaults.filter()), pv.rateHz().orElse(Defaults.PREVIEW_RATE_HZ))
                .loop(s.loop()).codec(codec);
        shared.board().ifPresent(levels -> plan.board(levels, shared.compensation()));
        return plan.build();
    }

    /** Emits one player for every sound, or each sound's bare sample array. */
    private Emitted emit(Project project, Optional<FirmwareRequest> player, Shared shared,
            List<SoundRenderer.Rendered> rendered, Path cDir) {
        String prefix = CNames.symbol(project.name());
        if (player.isPresent()) {
            FirmwareRequest.Builder fb = player.get().toBuilder().name(prefix).toolVersion(toolVersion);
            for (Map.Entry<String, String> e : ProjectSetting.texts(shared.settings()).entrySet()) {
                if (!e.getKey().equals(OUT_SETTING) && !e.getKey().equals(C_OUT_SETTING)) {
                    fb.setting(e.getKey() + ": " + e.getValue());
                }
            }
            for (int i = 0; i < rendered.size(); i++) {
                Project.Sound s = project.sounds().get(i);
                try {
                    fb.sound(Build.clip(s.name(), rendered.get(i)));
                } catch (SettingError e) {
                    throw located(project, s, Overrides.none(), e);
                }
            }
            EmitResult er = FirmwareEmitter.emit(fb.build(), cDir);
            return new Emitted(er.files(), er.report(), er.warnings(), er.flashBytes(), Optional.of(er.facts()));
        }
        long flash = 0;
        for (SoundRenderer.Rendered r : rendered) {
            flash += Build.arrayBytes(r);
        }
        long budget = (long) project.target().flashBudgetBytes().orElse(0);
        int bits = shared.bits();
        if (budget > 0) {
            FlashBudget.check(flash, budget, FlashBudget.alternatives(flash * 8 / Math.max(8, bits <= 8 ? 8 : 16),
                    rendered.get(0).rateHz(), bits, SampleStorage.UNPACKED, 0));
        }
        List<Path> files = new ArrayList<>();
        Build build = new Build(toolVersion);
        for (SoundRenderer.Rendered r : rendered) {
            files.addAll(build.emitArray(r.plan().symbol(), r, cDir));
        }
        return new Emitted(files, List.of(), List.of(), flash, Optional.empty());
    }

    /** Writes report.txt, report.json and report.html of the whole project. */
    private Result writeReports(Project project, Shared shared, List<BuildSummary> summaries, Emitted emitted,
            List<Path> files) {
        Path outDir = shared.outDir();
        Path txt = outDir.resolve("report.txt");
        Path json = outDir.resolve("report.json");
        Path html = outDir.resolve("report.html");
        files.add(txt);
        files.add(json);
        files.add(html);
        long budget = (long) project.target().flashBudgetBytes().orElse(0);
        List<String> warnings = emitted.warnings();
        ProjectReport.Input in = new ProjectReport.Input(toolVersion, project.file(), project.name(),
                shared.settings(), summaries, emitted.firmwareLines(), emitted.flashBytes(), budget, files, warnings,
                emitted.facts(), outDir);
        Result result = new Result(outDir, summaries, emitted.firmwareLines(), emitted.flashBytes(),
                ProjectSetting.texts(shared.settings()), files, warnings, in);
        AtomicFiles.writeString(txt, ProjectReport.text(in));
        Json.write(json, ProjectReport.json(in));
        HtmlReport.write(html, new HtmlReport.Page(project.name() + " (" + project.file().getFileName() + ")",
                toolVersion, HtmlReport.Setting.of(result.settings()), summaries, List.of(), emitted.flashBytes(),
                budget > 0 ? OptionalLong.of(budget) : OptionalLong.empty(), ProjectReport.warningsOf(in),
                Optional.empty(), files));
        return result;
    }

    private static ProjectSetting shown(String value, Origin origin) {
        return ProjectSetting.shown(value, value, origin);
    }

    private static void checkOneRate(Project p, Overrides o, OptionalDouble projectRate) {
        if (o.rateHz().isPresent()) {
            return;
        }
        Double first = null;
        String firstName = null;
        for (Project.Sound s : p.sounds()) {
            double r = s.rateHz().isPresent() ? s.rateHz().getAsDouble()
                    : projectRate.orElse(Defaults.RATE_HZ);
            if (first == null) {
                first = r;
                firstName = s.name();
            } else if (r != first) {
                throw new InputError(p.file() + ":" + s.line() + ": sound[" + s.index() + "].rate: "
                        + Units.format(r, "Hz") + " conflicts with sound '" + firstName + "' at "
                        + Units.format(first, "Hz") + "; one player has one sample rate: set [quantize] rate"
                        + " and remove the per-sound rates, or build without [target]");
            }
        }
    }

    private static Optional<FirmwareRequest> player(Project p, Overrides o, Map<String, ProjectSetting> settings) {
        Project.Target t = p.target();
        boolean fileWants = t.family().isPresent() || t.pins().isPresent();
        if (!fileWants && !o.wantsPlayer()) {
            if (t.flashBudgetBytes().isPresent()) {
                double budget = t.flashBudgetBytes().getAsDouble();
                settings.put("flash budget", ProjectSetting.plain((long) budget, Units.format(budget, "B"),
                        Origin.PROJECT_FILE));
            }
            return Optional.empty();
        }
        FirmwareRequest.Builder b = FirmwareRequest.builder().family(t.family().orElse("generic"));
        t.cpuClockHz().ifPresent(b::cpuClockHz);
        t.timer().ifPresent(b::timer);
        t.rateTolerancePpm().ifPresent(b::rateTolerancePpm);
        t.pins().ifPresent(b::pins);
        t.portWidth().ifPresent(x -> b.portWidth(x.intValue()));
        t.pinStrategy().ifPresent(b::pinStrategy);
        t.storage().ifPresent(b::storage);
        boolean anyLoop = p.sounds().stream().anyMatch(s -> s.loop().isPresent());
        PlaybackEngine engine = t.engine().orElse(anyLoop ? PlaybackEngine.LOOP : PlaybackEngine.CLIP);
        b.engine(engine);
        if (engine == PlaybackEngine.DDS) {
            b.dds(new DdsSpec(t.ddsPhaseBits().map(Long::intValue).orElse(DdsSpec.DEFAULT_PHASE_BITS),
                    t.ddsFrequencyHz().orElse(DdsSpec.DEFAULT_FREQUENCY_HZ)));
        }
        t.flashBudgetBytes().ifPresent(x -> b.flashBudgetBytes((long) x));
        FirmwareRequest r = o.firmware().apply(b).build();
        settings.put("target", ProjectSetting.plain(r.family(), r.family() + r.pins().map(x -> ", pins " + x)
                .orElse(""), origin(t.family(), "generic", r.family())));
        settings.put("pins", ProjectSetting.jsonOnly(r.pins().orElse(null), origin(t.pins(), null,
                r.pins().orElse(null))));
        String engineKey = r.engine().name().toLowerCase(Locale.ROOT);
        settings.put("engine", ProjectSetting.plain(engineKey, engineKey, origin(t.engine(), engine, r.engine())));
        return Optional.of(r);
    }

    /** Where a target setting came from: the command line when it changed the file's value or the default. */
    private static <T> Origin origin(Optional<T> inFile, T byDefault, T used) {
        return !java.util.Objects.equals(inFile.orElse(byDefault), used) ? Origin.COMMAND_LINE
                : Origin.of(false, inFile.isPresent());
    }
}
