package org.rungtone.cli;

import java.nio.file.Path;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.OptionalInt;
import java.util.concurrent.Callable;
import org.rungtone.calibrate.OutputSpan;
import org.rungtone.cli.shell.Heading;
import org.rungtone.cli.shell.ProgressMeter;
import org.rungtone.cli.shell.Section;
import org.rungtone.firmware.CNames;
import org.rungtone.internal.FileNames;
import org.rungtone.internal.InputError;
import org.rungtone.project.Boards;
import org.rungtone.project.Build;
import org.rungtone.project.BuildPlan;
import org.rungtone.project.Project;
import org.rungtone.project.ProjectBuild;
import org.rungtone.project.ProjectFile;
import org.rungtone.quantize.Compensation;
import org.rungtone.quantize.Dither;
import org.rungtone.quantize.ErrorFilter;
import org.rungtone.report.BuildReport;
import org.rungtone.report.BuildSummary;
import org.rungtone.report.Json;
import org.rungtone.report.ProjectReport;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/** {@code rungtone build}: one source to C files and a report. */
@Command(name = "build",
        header = "Build a sound or a project into C files, a preview and a report.", mixinStandardHelpOptions = true,
        description = "Condition and quantize a WAV file or .rung script for an N-bit ladder DAC and write C files"
                + " and a report.",
        sortOptions = false,
        footerHeading = "%nExample:%n",
        footer = {"  rungtone build door-chime.wav --bits 6 --rate 16k --name door_chime",
            "  (writes door_chime.h, door_chime.c, report.txt and report.json",
            "   into rungtone-out/door_chime/)"})
public final class BuildCommand implements Callable<Integer> {
    @Spec
    picocli.CommandLine.Model.CommandSpec spec;

    @Mixin
    CommonOptions common;

    @Parameters(index = "0", paramLabel = "SOURCE",
            description = "A .wav file, a .rung script, or a project file (.toml) describing a board and its sounds.")
    Path source;

    @Section(Heading.QUANTIZING)
    @Option(names = "--bits", paramLabel = "<n>",
            description = "DAC bit depth, 1..16 (default: the ladder's, else 8).")
    Integer bits;

    @Section(Heading.CONDITIONING)
    @Option(names = "--rate", paramLabel = "<hz>", converter = Converters.Hertz.class,
            description = "Target sample rate, e.g. 16k, 8000 (default: the script's own rate, else 16 kHz).")
    Double rateHz;

    @Section(Heading.QUANTIZING)
    @Option(names = "--dither", paramLabel = "none|rpdf|tpdf", defaultValue = "tpdf",
            description = "Dither before quantizing (default ${DEFAULT-VALUE}).")
    Dither dither;

    @Section(Heading.QUANTIZING)
    @Option(names = "--shaping", paramLabel = "none|first|second", defaultValue = "none",
            description = "Error-feedback noise shaping: pushes quantization noise towards high frequencies"
                    + " (default ${DEFAULT-VALUE}).")
    ErrorFilter shaping;

    @Section(Heading.QUANTIZING)
    @Option(names = "--seed", paramLabel = "<n>", defaultValue = "1",
            description = "Seed for dither; the same inputs and seed give identical outputs"
                    + " (default ${DEFAULT-VALUE}).")
    long seed;

    @Option(names = "--name", paramLabel = "<symbol>",
            description = "C symbol prefix and output folder name (default: from the source file name).")
    String name;

    @Option(names = "--out", paramLabel = "<dir>", description = "Output folder (default ./rungtone-out/NAME).")
    Path out;

    @Option(names = "--c-out", paramLabel = "<dir>", description = "Folder of the C files (default: the --out folder).")
    Optional<Path> cOut = Optional.empty();

    @Section(Heading.INPUT)
    @Option(names = "--channel", paramLabel = "<n>", defaultValue = "0",
            description = "0 mixes all channels down (default); 1..8 picks one.")
    int channel;

    @Mixin
    ConditioningOptions conditioning;

    @Section(Heading.LADDER)
    @Option(names = "--full-scale", paramLabel = "<volts>", converter = Converters.Volts.class,
            defaultValue = "5V", description = "Reference voltage of the ideal ladder (default ${DEFAULT-VALUE}).")
    double fullScale;

    @Section(Heading.FIRMWARE)
    @Option(names = "--flash-attr", paramLabel = "<text>", defaultValue = "",
            description = "Attribute that keeps the sample array in flash, e.g. PROGMEM (default none).")
    String flashAttr;

    @Mixin
    LadderOptions ladder;

    @Section(Heading.QUANTIZING)
    @Option(names = "--compensation", paramLabel = "on|off", defaultValue = "on",
            description = "With a ladder or unit profile: quantize onto the board's real levels (on, default) or"
                    + " emit plain binary codes (off).")
    Compensation compensation;

    @Mixin
    UnitOptions unit;

    @Section(Heading.QUANTIZING)
    @Option(names = "--span", paramLabel = "full|nominal", defaultValue = "full",
            description = "With compensation: map full scale onto everything the board reaches (full, default)"
                    + " or onto the ideal ladder's span, for the same amplitude in volts on every board.")
    OutputSpan span;

    @Mixin
    FirmwareOptions firmware;

    @Mixin
    PreviewOptions preview;

    @Option(names = "--json", description = "Print the report as JSON instead of text.")
    boolean json;

    @Override
    public Integer call() {
        LadderOptions.bitsOrZero(bits);
        if (ProjectFile.isProjectFile(source)) {
            return buildProject();
        }
        Boards.Board board = unit.resolve(bits, ladder, false);
        BuildPlan plan = plan(board);
        if (!common.quiet) {
            board.warnings().forEach(w -> spec.commandLine().getErr().println("rungtone: warning: " + w));
        }
        BuildSummary summary;
        try (ProgressMeter meter = ProgressMeter.onStandardError(spec.commandLine().getErr(), common.quiet)) {
            summary = new Build(Version.get(), span, (step, done) -> meter.show("building " + plan.symbol(), step,
                    done)).run(plan);
        }
        common.print(spec, json, () -> Json.toJson(BuildReport.json(summary)), () -> BuildReport.text(summary));
        if (common.verbose) {
            spec.commandLine().getErr().println(BuildReport.timings(summary));
        }
        return 0;
    }

    private int buildProject() {
        CommandLine.ParseResult pr = spec.commandLine().getParseResult();
        for (String single : new String[] {"--name", "--channel", "--loop", "--flash-attr", "--gain", "--normalize",
            "--trim", "--fade-in", "--fade-out", "--keep-dc", "--resampler"}) {
            if (pr.hasMatchedOption(single)) {
                throw new InputError(single + " sets one sound; in a project file put it in that sound's"
                        + " [[sound]] table");
            }
        }
        // Options a project build would otherwise drop without a word.
        for (String[] moved : new String[][] {{"--filter", "set filter in the project's [preview] table"},
            {"--preview-rate", "set rate in the project's [preview] table"},
            {"--preview-length", "a project's previews always hold the first 60 s of each sound"},
            {"--full-scale", "a project's levels come from its [ladder] table, or a 5 V ideal ladder"}}) {
            if (pr.hasMatchedOption(moved[0])) {
                throw new InputError(moved[0] + " does not apply to a project file; " + moved[1]);
            }
        }
        Project project = ProjectFile.load(source);
        ProjectBuild.Overrides o = new ProjectBuild.Overrides(
                bits == null ? OptionalInt.empty() : OptionalInt.of(bits),
                rateHz == null ? OptionalDouble.empty() : OptionalDouble.of(rateHz),
                pr.hasMatchedOption("--dither") ? Optional.of(dither) : Optional.empty(),
                pr.hasMatchedOption("--shaping") ? Optional.of(shaping) : Optional.empty(),
                pr.hasMatchedOption("--seed") ? Optional.of(seed) : Optional.empty(), Optional.ofNullable(out),
                cOut, pr.hasMatchedOption("--compensation") ? Optional.of(compensation) : Optional.empty(),
                unit.path(), ladder, firmware::applyGiven, firmware.wantsPlayer());
        ProjectBuild.Result r;
        OutputSpan chosen = pr.hasMatchedOption("--span") ? span : project.quantize().span().orElse(OutputSpan.FULL);
        try (ProgressMeter meter = ProgressMeter.onStandardError(spec.commandLine().getErr(), common.quiet)) {
            r = new ProjectBuild(Version.get(), chosen, (step, done) -> meter.show("building", step, done))
                    .run(project, o);
        }
        ProjectReport.Input in = r.report();
        common.print(spec, json, () -> Json.toJson(ProjectReport.json(in)), () -> ProjectReport.text(in));
        return 0;
    }

    BuildPlan plan(Boards.Board board) {
        String given = name != null ? name : FileNames.stem(source, "sound");
        String symbol = CNames.symbol(given);
        BuildPlan.Builder plan = BuildPlan.builder(source, symbol, out != null ? out : Path.of("rungtone-out", symbol))
                .channel(channel).name(given).bits(bits != null ? bits : board.bits())
                .rateHz(rateHz == null ? OptionalDouble.empty() : OptionalDouble.of(rateHz)).dither(dither)
                .shaping(shaping).seed(seed).removeDc(conditioning.removeDc()).trimDbfs(conditioning.trimDbfs())
                .gainDb(conditioning.gainDb()).normalizeDbfs(conditioning.normalizeDbfs())
                .fades(conditioning.fadeIn, conditioning.fadeOut).resampler(conditioning.resampler())
                .fullScaleVolts(fullScale).flashQualifier(flashAttr).player(firmware.request())
                .loop(firmware.loopSpan()).flashBudgetBytes(firmware.flashBudgetBytes()).cOutDir(cOut)
                .preview(preview.filter(), preview.previewRateHz).previewSeconds(preview.previewSeconds());
        board.levels().ifPresent(levels -> plan.board(levels, compensation));
        return plan.build();
    }
}
