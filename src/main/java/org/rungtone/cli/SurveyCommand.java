package org.rungtone.cli;

import java.nio.file.Path;
import java.util.Optional;
import java.util.OptionalLong;
import java.util.concurrent.Callable;
import org.rungtone.analysis.ReconstructionFilter;
import org.rungtone.analysis.SurveyTarget;
import org.rungtone.cli.shell.Choices;
import org.rungtone.cli.shell.Heading;
import org.rungtone.cli.shell.ProgressMeter;
import org.rungtone.cli.shell.Section;
import org.rungtone.firmware.CNames;
import org.rungtone.internal.FileNames;
import org.rungtone.internal.Setting;
import org.rungtone.internal.SettingError;
import org.rungtone.project.Boards;
import org.rungtone.project.Defaults;
import org.rungtone.project.SurveyLists;
import org.rungtone.project.SurveyRequest;
import org.rungtone.project.SurveyRun;
import org.rungtone.quantize.Dither;
import org.rungtone.quantize.ErrorFilter;
import org.rungtone.report.SurveyReport;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/** {@code rungtone survey}: quality and flash cost of one source over bit depths × sample rates. */
@Command(name = "survey",
        header = "Tabulate quality and flash cost over bit depths x sample rates.", mixinStandardHelpOptions = true,
        description = {"Tabulate quality and flash cost over bit depths x sample rates.",
            "Quantizes a sound at every setting and measures SINAD, in-band and A-weighted"
                + " SNR, ENOB and what the listener hears; marks the setting with the fewest flash"
                + " bytes whose heard figures reach a target within a flash budget. Writes survey.txt,"
                + " survey.json, two plots (against bit depth and against flash bytes) and, with"
                + " --previews, a 44.1 kHz WAV per cell to listen to."},
        sortOptions = false,
        footerHeading = "%nExample:%n",
        footer = {"  rungtone survey door-chime.wav --bits-list 4..10 --rates 8k,16k \\",
            "      --flash-budget 32k --target-sinad 40",
            "  (7 bit depths x 2 rates; marks the smallest setting with SINAD >= 40 dB",
            "   that fits 32,000 bytes; files go to rungtone-out/survey-door_chime/)"})
public final class SurveyCommand implements Callable<Integer> {
    @Spec
    CommandSpec spec;

    @Mixin
    CommonOptions common;

    @Parameters(index = "0", paramLabel = "SOURCE", description = "A .wav file or a .rung script (rendered at"
            + " the highest surveyed rate).")
    Path source;

    @Section(Heading.QUANTIZING)
    @Option(names = "--bits-list", paramLabel = "<list>", defaultValue = "1..12",
            converter = Converters.BitDepths.class,
            description = "Bit depths: ranges and single depths, comma separated, e.g. 4..10 or 4,6,8"
                    + " (default ${DEFAULT-VALUE}).")
    SurveyLists.BitList bitList;

    @Section(Heading.CONDITIONING)
    @Option(names = "--rates", paramLabel = "<list>", defaultValue = "8k,11.025k,16k,22.05k",
            converter = Converters.Rates.class,
            description = "Sample rates, a comma list (default ${DEFAULT-VALUE}).")
    SurveyLists.RateList rateList;

    @Section(Heading.QUANTIZING)
    @Option(names = "--dither", paramLabel = "none|rpdf|tpdf", defaultValue = "tpdf",
            description = "Dither before quantizing (default ${DEFAULT-VALUE}).")
    Dither dither;

    @Section(Heading.QUANTIZING)
    @Option(names = "--shaping", paramLabel = "none|first|second", defaultValue = "none",
            description = "Error-feedback noise shaping (default ${DEFAULT-VALUE}).")
    ErrorFilter shaping;

    @Section(Heading.QUANTIZING)
    @Option(names = "--seed", paramLabel = "<n>", defaultValue = "1",
            description = "Seed for dither; every cell uses it (default ${DEFAULT-VALUE}).")
    long seed;

    @Section(Heading.INPUT)
    @Option(names = "--channel", paramLabel = "<n>", defaultValue = "0",
            description = "0 mixes all channels down (default); 1..8 picks one.")
    int channel;

    @Mixin
    ConditioningOptions conditioning;

    @Mixin
    LadderOptions ladder;

    @Mixin
    UnitOptions unit;

    @Section(Heading.CHOICE)
    @Option(names = "--flash-budget", paramLabel = "<bytes>", converter = Converters.Bytes.class,
            description = "Flash available for the samples, e.g. 32000 or 32k.")
    Long flashBudget;

    @Section(Heading.CHOICE)
    @Option(names = "--target-sinad", paramLabel = "<dB>", converter = Converters.Decibels.class,
            description = "Least acceptable full-band SINAD in dB, e.g. 40.")
    Double targetSinadDb;

    @Section(Heading.CHOICE)
    @Option(names = "--target-enob", paramLabel = "<bits>",
            description = "Least acceptable effective number of bits, e.g. 6.5 (instead of --target-sinad).")
    Double targetEnobBits;

    @Section(Heading.CHOICE)
    @Option(names = "--packed", description = "Judge the budget and the choice by bit-packed bytes.")
    boolean packed;

    @Option(names = "--storage", paramLabel = "<list>", split = ",", completionCandidates = Choices.TreadStores.class,
            description = "Survey these Tread stores too,"
            + " e.g. tread2,tread3,tread4 (packed here counts the plain codes bit-packed, as --packed does).")
    java.util.List<org.rungtone.firmware.SampleStorage> storages = new java.util.ArrayList<>();

    @Option(names = "--previews", description = "Write a 16-bit preview WAV per cell into OUT/previews/.")
    boolean previews;

    @Option(names = "--filter", paramLabel = "<filter>", defaultValue = "none",
            description = "Reconstruction filter after the ladder, for previews and the in-band cutoff: none,"
                    + " rc:<hz> (first-order RC) or lp2:<hz>[:<q>] (second order, Q 0.707 unless given).")
    ReconstructionFilter filter;

    @Option(names = "--out", paramLabel = "<dir>",
            description = "Output folder (default ./rungtone-out/survey-NAME).")
    Path out;

    @Option(names = "--json", description = "Print the report as JSON instead of text.")
    boolean json;

    @Override
    public Integer call() {
        SurveyRequest.Cells cells = new SurveyRequest.Cells(bitList.expand(), rateList.checked(), dither, shaping,
                seed);
        Path folder = out != null ? out
                : Path.of("rungtone-out", "survey-" + CNames.symbol(FileNames.stem(source, "sound")));
        SurveyRequest request = new SurveyRequest(source, channel, cells, conditioning.settings(),
                Boards.perDepth(unit.path(), ladder, Defaults.FULL_SCALE_VOLTS),
                SurveyRequest.Choice.of(flashBudget == null ? OptionalLong.empty() : OptionalLong.of(flashBudget),
                        target(), packed, storages), filter, new SurveyRequest.Output(folder, previews, Version.get()));
        SurveyRun.Result result;
        try (ProgressMeter meter = ProgressMeter.onStandardError(spec.commandLine().getErr(), common.quiet)) {
            result = new SurveyRun((step, done, total) -> meter.show(step, "", total == 0 ? Double.NaN
                    : done / (double) total)).run(request);
        }
        common.print(spec, json, () -> result.json(), () -> result.text());
        if (common.verbose) {
            spec.commandLine().getErr().println(SurveyReport.timings(result.stageMillis()));
        }
        return 0;
    }

    /** The one target given, if any. */
    private Optional<SurveyTarget> target() {
        if (targetSinadDb != null && targetEnobBits != null) {
            throw new SettingError(Setting.TARGET_SINAD, "give one target, " + Setting.TARGET_SINAD.ref() + " or "
                    + Setting.TARGET_ENOB.ref() + ", not both", null);
        }
        return Optional.ofNullable(targetSinadDb).map(SurveyTarget::sinadDb)
                .or(() -> Optional.ofNullable(targetEnobBits).map(SurveyTarget::enobBits));
    }
}
