package org.rungtone.project;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalLong;
import java.util.concurrent.CompletableFuture;
import org.rungtone.calibrate.OutputSpan;
import org.rungtone.firmware.EmitResult;
import org.rungtone.firmware.FirmwareEmitter;
import org.rungtone.firmware.FirmwareFacts;
import org.rungtone.firmware.FirmwareRequest;
import org.rungtone.firmware.FlashBudget;
import org.rungtone.firmware.SampleArrayEmitter;
import org.rungtone.firmware.SampleStorage;
import org.rungtone.firmware.SoundClip;
import org.rungtone.firmware.Templates;
import org.rungtone.internal.AtomicFiles;
import org.rungtone.internal.InputError;
import org.rungtone.internal.OutputFolder;
import org.rungtone.quantize.Codes;
import org.rungtone.report.BuildFacts;
import org.rungtone.report.BuildReport;
import org.rungtone.report.BuildSummary;
import org.rungtone.report.ConditioningFacts;
import org.rungtone.report.HtmlReport;
import org.rungtone.report.Json;
import org.rungtone.report.SoundPlots;
import org.rungtone.source.WavWriter;

/**
 * Runs one {@link BuildPlan}: renders the sound ({@link SoundRenderer}), emits C and writes the preview, plots
 * and reports; the C files and plots on other cores as soon as the sound's codes and figures are known
 * ({@link EarlyOutputs}). Each stage is a pure function; only the firmware and report writers touch files.
 */
public final class Build {
    private final String toolVersion;
    private final OutputSpan span;
    private final BuildProgress progress;

    /** A build that stamps {@code toolVersion} into its outputs; compensation uses the board's full span. */
    public Build(String toolVersion) {
        this(toolVersion, OutputSpan.FULL, BuildProgress.NONE);
    }

    /**
     * A build whose compensated quantization maps full scale onto {@code span} of the board's levels, and
     * that tells {@code progress} how far it has got: every stage it finishes ("open done", "condition done",
     * ...) and, while a WAV file is decoded (during "condition"), how much of it is read.
     */
    public Build(String toolVersion, OutputSpan span, BuildProgress progress) {
        this.toolVersion = toolVersion;
        this.span = span;
        this.progress = progress;
    }

    /**
     * Runs the plan and writes every output into the plan's folder (the C files into their own, when given),
     * replacing each folder's previous outputs as a whole ({@link OutputFolder}).
     *
     * @throws InputError for anything the user can fix; the folders are then as they were
     */
    public BuildSummary run(BuildPlan plan) {
        try (OutputFolder folder = OutputFolder.open(plan.outDir());
                CFolder c = CFolder.open(plan.outDir(), plan.firmware().cOutDir())) {
            BuildSummary summary = write(plan, c.dir());
            c.commit();
            folder.commit();
            return summary;
        }
    }

    private BuildSummary write(BuildPlan plan, Path cDir) {
        // The C files and the plots are written on other cores as soon as what they hold is known, while the
        // figures, the preview and the listener figures still render.
        EarlyOutputs early = new EarlyOutputs(plan.outDir(), coded -> emit(coded, cDir));
        try {
            return write(plan, early, new SoundRenderer(span, progress, early).render(plan));
        } catch (RuntimeException e) {
            // the staging folders go once the other cores are done with them
            early.settle();
            throw e;
        }
    }

    private BuildSummary write(BuildPlan plan, EarlyOutputs early, SoundRenderer.Rendered r) {
        Stopwatch watch = new Stopwatch(progress);
        // the preview is written on another core while the C files are finished
        CompletableFuture<Path> preview = CompletableFuture.supplyAsync(() -> writePreview(r, plan.outDir()));
        Emitted emitted;
        try {
            emitted = early.firmware();
        } catch (RuntimeException e) {
            preview.handle((done, failed) -> null).join();
            throw e;
        }
        watch.lap(BuildStage.EMIT);
        List<Path> files = new ArrayList<>(emitted.files());
        files.add(Jobs.join(preview));
        files.addAll(early.plots());
        watch.lap(BuildStage.PLOTS);
        Path txt = plan.outDir().resolve("report.txt");
        Path json = plan.outDir().resolve("report.json");
        Path html = plan.outDir().resolve("report.html");
        files.add(txt);
        files.add(json);
        files.add(html);
        Map<String, Double> laps = new LinkedHashMap<>(r.stageMillis());
        laps.putAll(watch.laps());
        List<String> warnings = new ArrayList<>(r.warnings());
        warnings.addAll(emitted.warnings());
        long flash = emitted.flashBytes();
        BuildSummary summary = summary(r, emitted.lines(), emitted.facts(), flash, files, warnings, laps);
        // the page (with its embedded plots) is written on another core while the text and JSON reports are
        Jobs.alongside(() -> {
            AtomicFiles.writeString(txt, BuildReport.text(summary));
            Json.write(json, BuildReport.json(summary));
        }, () -> HtmlReport.write(html, new HtmlReport.Page(plan.symbol(), toolVersion, List.of(), List.of(summary),
                List.of(), flash, plan.firmware().flashBudgetBytes(), List.of(), Optional.empty(), List.of())));
        return summary;
    }

    /**
     * What writing a sound's C files gave.
     *
     * @param files the files written
     * @param lines the player's report lines (none for a bare sample array)
     * @param facts the player's facts, when one was emitted
     * @param warnings what the user should know about the firmware
     * @param flashBytes flash the sound's firmware takes
     */
    record Emitted(List<Path> files, List<String> lines, Optional<FirmwareFacts> facts, List<String> warnings,
            long flashBytes) {
    }

    /**
     * Writes the C files of a sound's codes into {@code cDir}: its player or its bare sample array. Every
     * check that can refuse the build runs before the first of them is written.
     */
    private Emitted emit(SoundRenderer.Coded c, Path cDir) {
        BuildPlan plan = c.plan();
        if (plan.firmware().player().isPresent()) {
            FirmwareEmitter.Rendered firmware = player(c);
            EmitResult er = FirmwareEmitter.write(firmware, cDir);
            return new Emitted(er.files(), er.report(), Optional.of(er.facts()), er.warnings(),
                    firmware.result().flashBytes());
        }
        long flash = checkedArrayBytes(c);
        return new Emitted(emitArray(plan.symbol(), c, cDir), List.of(), Optional.empty(), List.of(), flash);
    }

    /** The player of a sound, rendered but not written. */
    private FirmwareEmitter.Rendered player(SoundRenderer.Coded c) {
        BuildPlan plan = c.plan();
        FirmwareRequest.Builder fb = plan.firmware().player().get().toBuilder().name(plan.symbol())
                .toolVersion(toolVersion).settings(c.settings());
        fb.sound(clip(plan.symbol(), c));
        return FirmwareEmitter.render(fb.build());
    }

    /** Flash bytes of a sound's bare sample array, checked against the budget. */
    private static long checkedArrayBytes(SoundRenderer.Coded c) {
        BuildPlan plan = c.plan();
        long flash = arrayBytes(plan, c.emitted());
        OptionalLong budget = plan.firmware().flashBudgetBytes();
        if (budget.isPresent()) {
            FlashBudget.check(flash, budget.getAsLong(), FlashBudget.alternatives(c.emitted().length(), c.rateHz(),
                    plan.bits(), SampleStorage.UNPACKED, 0));
        }
        return flash;
    }

    /** The firmware clip of a rendered sound, with its loop points. */
    public static SoundClip clip(String name, SoundRenderer.Rendered r) {
        return clip(name, r.coded());
    }

    private static SoundClip clip(String name, SoundRenderer.Coded c) {
        if (c.autoLoop().isPresent()) {
            return new SoundClip(name, c.emitted(), c.autoLoop().get().start(), c.autoLoop().get().end());
        }
        if (c.plan().firmware().loop().isPresent()) {
            int[] lp = c.plan().firmware().loop().get().samples(c.rateHz(), c.emitted().length());
            return new SoundClip(name, c.emitted(), lp[0], lp[1], c.stream());
        }
        return new SoundClip(name, c.emitted(), 0, c.emitted().length(), c.stream());
    }

    /** Flash bytes of a plain sample array. */
    public static long arrayBytes(SoundRenderer.Rendered r) {
        return arrayBytes(r.plan(), r.emitted());
    }

    private static long arrayBytes(BuildPlan plan, Codes emitted) {
        return (long) emitted.length() * (plan.bits() <= 8 ? 1 : 2);
    }

    /** Emits the plain sample array of a rendered sound. */
    public List<Path> emitArray(String symbol, SoundRenderer.Rendered r, Path dir) {
        return emitArray(symbol, r.coded(), dir);
    }

    private List<Path> emitArray(String symbol, SoundRenderer.Coded c, Path dir) {
        return new SampleArrayEmitter(Templates.bundled()).emit(new SampleArrayEmitter.Request(symbol,
                c.emitted(), c.plan().firmware().flashQualifier(), toolVersion, c.settings()), dir);
    }

    /** The summary of a rendered sound with what emission added (the player's facts, when one was emitted). */
    public BuildSummary summary(SoundRenderer.Rendered r, List<String> firmwareLines,
            Optional<FirmwareFacts> firmwareFacts, long flash, List<Path> files, List<String> warnings,
            Map<String, Double> stageMillis) {
        BuildPlan plan = r.plan();
        QuantizeSettings q = plan.quantize();
        BuildFacts facts = new BuildFacts(r.source(), ConditioningFacts.of(plan.conditioning().at(r.rateHz()),
                r.conditioned()), plan.conditioning().resampler(), r.played(), q.board().isPresent(),
                q.board().isPresent() && q.compensate(), plan.preview().filter(), firmwareFacts, plan.outDir());
        return new BuildSummary(toolVersion, plan.source().file(), r.layout(), plan.symbol(), plan.bits(),
                r.rateHz(), r.emitted().length(), r.emitted().length() / r.rateHz(), q.dither().label(),
                q.shaping().name(), q.seed(), SoundRenderer.describe(plan, r.conditioned()),
                r.conditioned().resampler(),
                r.played().origin(), r.clippedSamples(), r.quality(), r.quality().get(r.quality().size() - 1)
                        .label(), r.shapingGainDb(), r.tone(),
                new BuildSummary.PreviewInfo(plan.preview().filter().describe(), plan.preview().rateHz(),
                        r.preview().passbandTopHz(), r.preview().zohDroopDb(), r.preview().peak()),
                firmwareLines, flash, files, warnings, stageMillis, r.autoLoop(), facts);
    }

    /** Writes preview.wav and the plots of a rendered sound into {@code dir}, the plots on {@code scales}. */
    public static List<Path> writeAssets(SoundRenderer.Rendered r, Path dir, SoundPlots.Scales scales) {
        List<Path> files = new ArrayList<>();
        files.add(writePreview(r, dir));
        files.addAll(SoundPlots.write(dir, plotData(r), scales));
        return files;
    }

    private static Path writePreview(SoundRenderer.Rendered r, Path dir) {
        Path previewFile = dir.resolve("preview.wav");
        WavWriter.write(previewFile, r.preview().signal(), WavWriter.Format.PCM16);
        return previewFile;
    }

    /** What the plots of a rendered sound draw. */
    public static SoundPlots.Data plotData(SoundRenderer.Rendered r) {
        return SoundRenderer.plotData(r.plan(), Optional.ofNullable(r.errorSpectrum()), r.inBandCutoffHz(),
                r.toneSpectrum(), r.tone());
    }
}
