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
import org.rungtone.report.BuildFacts;
import org.rungtone.report.BuildReport;
import org.rungtone.report.BuildSummary;
import org.rungtone.report.ConditioningFacts;
import org.rungtone.report.HtmlReport;
import org.rungtone.report.Json;
import org.rungtone.report.PlotWarmUp;
import org.rungtone.report.SoundPlots;
import org.rungtone.source.WavWriter;

/**
 * Runs one {@link BuildPlan}: renders the sound ({@link SoundRenderer}), then emits C and writes the preview,
 * plots and reports. Each stage is a pure function; only the firmware and report writers touch files.
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
        CompletableFuture<Void> plotsReady = PlotWarmUp.start(); // the run's one warm-up, often started by Main
        SoundRenderer.Rendered r = new SoundRenderer(span, progress).render(plan);
        Stopwatch watch = new Stopwatch(progress);
        List<Path> files = new ArrayList<>();
        List<String> firmwareLines = new ArrayList<>();
        Optional<FirmwareFacts> firmwareFacts = Optional.empty();
        List<String> warnings = new ArrayList<>(r.warnings());
        // Every check that can refuse the build runs before the first file is written.
        FirmwareEmitter.Rendered firmware = plan.firmware().player().isPresent() ? player(plan, r) : null;
        long flash = firmware != null ? firmware.result().flashBytes() : checkedArrayBytes(plan, r);
        // The plots are drawn on another core while the C files and then the preview are written.
        CompletableFuture<List<Path>> plots = CompletableFuture.supplyAsync(() -> {
            Jobs.join(plotsReady);
            return SoundPlots.write(plan.outDir(), plotData(r), SoundPlots.Scales.none());
        });
        try {
            if (firmware != null) {
                EmitResult er = FirmwareEmitter.write(firmware, cDir);
                files.addAll(er.files());
                firmwareLines.addAll(er.report());
                firmwareFacts = Optional.of(er.facts());
                warnings.addAll(er.warnings());
            } else {
                files.addAll(emitArray(plan.symbol(), r, cDir));
            }
            watch.lap(BuildStage.EMIT);
            files.add(writePreview(r, plan.outDir()));
            HtmlReport.prepare();
        } catch (RuntimeException e) {
            // the staging folder goes once the plots are done with it
            plots.handle((done, failed) -> null).join();
            throw e;
        }
        files.addAll(Jobs.join(plots));
        watch.lap(BuildStage.PLOTS);
        Path txt = plan.outDir().resolve("report.txt");
        Path json = plan.outDir().resolve("report.json");
        Path html = plan.outDir().resolve("report.html");
        files.add(txt);
        files.add(json);
        files.add(html);
        Map<String, Double> laps = new LinkedHashMap<>(r.stageMillis());
        laps.putAll(watch.laps());
        BuildSummary summary = summary(r, firmwareLines, firmwareFacts, flash, files, warnings, laps);
        // the page (with its embedded plots) is written on another core while the text and JSON reports are
        Jobs.alongside(() -> {
            AtomicFiles.writeString(txt, BuildReport.text(summary));
            Json.write(json, BuildReport.json(summary));
        }, () -> HtmlReport.write(html, new HtmlReport.Page(plan.symbol(), toolVersion, List.of(), List.of(summary),
                List.of(), flash, plan.firmware().flashBudgetBytes(), List.of(), Optional.empty(), List.of())));
        return summary;
    }

    /** The player of a rendered sound, rendered but not written. */
    private FirmwareEmitter.Rendered player(BuildPlan plan, SoundRenderer.Rendered r) {
        FirmwareRequest.Builder fb = plan.firmware().player().get().toBuilder().name(plan.symbol())
                .toolVersion(toolVersion).settings(r.settings());
        fb.sound(clip(plan.symbol(), r));
        return FirmwareEmitter.render(fb.build());
    }

    /** Flash bytes of a rendered sound's bare sample array, checked against the budget. */
    private static long checkedArrayBytes(BuildPlan plan, SoundRenderer.Rendered r) {
        long flash = arrayBytes(r);
        OptionalLong budget = plan.firmware().flashBudgetBytes();
        if (budget.isPresent()) {
            FlashBudget.check(flash, budget.getAsLong(), FlashBudget.alternatives(r.emitted().length(), r.rateHz(),
                    plan.bits(), SampleStorage.UNPACKED, 0));
        }
        return flash;
    }

    /** The firmware clip of a rendered sound, with its loop points. */
    public static SoundClip clip(String name, SoundRenderer.Rendered r) {
        if (r.autoLoop().isPresent()) {
            return new SoundClip(name, r.emitted(), r.autoLoop().get().start(), r.autoLoop().get().end());
        }
        if (r.plan().firmware().loop().isPresent()) {
            int[] lp = r.plan().firmware().loop().get().samples(r.rateHz(), r.emitted().length());
            return new SoundClip(name, r.emitted(), lp[0], lp[1], r.stream());
        }
        return new SoundClip(name, r.emitted(), 0, r.emitted().length(), r.stream());
    }

    /** Flash bytes of a plain sample array. */
    public static long arrayBytes(SoundRenderer.Rendered r) {
        return (long) r.emitted().length() * (r.plan().bits() <= 8 ? 1 : 2);
    }

    /** Emits the plain sample array of a rendered sound. */
    public List<Path> emitArray(String symbol, SoundRenderer.Rendered r, Path dir) {
        return new SampleArrayEmitter(Templates.bundled()).emit(new SampleArrayEmitter.Request(symbol,
                r.emitted(), r.plan().firmware().flashQualifier(), toolVersion, r.settings()), dir);
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

    /** Writes preview.wav of a rendered sound into {@code dir}. */
    private static Path writePreview(SoundRenderer.Rendered r, Path dir) {
        Path previewFile = dir.resolve("preview.wav");
        WavWriter.write(previewFile, r.preview().signal(), WavWriter.Format.PCM16);
        return previewFile;
    }

    /** What the plots of a rendered sound draw. */
    public static SoundPlots.Data plotData(SoundRenderer.Rendered r) {
        BuildPlan plan = r.plan();
        return new SoundPlots.Data(plan.symbol(), plan.bits(), plan.quantize().dither(),
                plan.quantize().shaping().order() > 0, Optional.ofNullable(r.errorSpectrum()), r.inBandCutoffHz(),
                r.toneSpectrum(), r.tone());
    }
}
