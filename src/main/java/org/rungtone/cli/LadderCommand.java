package org.rungtone.cli;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.List;
import java.util.Optional;
import java.util.concurrent.Callable;
import org.rungtone.calibrate.UnitProfile;
import org.rungtone.cli.shell.Heading;
import org.rungtone.cli.shell.ProgressMeter;
import org.rungtone.cli.shell.Section;
import org.rungtone.internal.AtomicFiles;
import org.rungtone.internal.InputError;
import org.rungtone.internal.OutputFolder;
import org.rungtone.internal.Units;
import org.rungtone.ladder.LadderSpec;
import org.rungtone.ladder.LadderStudy;
import org.rungtone.ladder.MonteCarlo;
import org.rungtone.ladder.Spread;
import org.rungtone.project.Boards;
import org.rungtone.report.LadderFiles;
import org.rungtone.report.LadderReport;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;

/** {@code rungtone ladder}: analyse or design a resistor-ladder DAC. */
@Command(name = "ladder",
        header = "Model a ladder: every level, linearity, Monte Carlo spread, resistor picks.",
        mixinStandardHelpOptions = true, sortOptions = false,
        versionProvider = Version.Provider.class,
        description = {
            "Models a resistor-ladder DAC exactly, pins, load and buffer included, and prints its wiring,"
                + " the level of every code, linearity after IEEE 1658 (LSB, offset and gain error, DNL, INL,"
                + " monotonicity) and worst-case pin currents; with --monte-carlo, the spread over boards"
                + " built from real parts; with --design, preferred values that keep INL low. Writes"
                + " levels.csv and transfer, DNL and INL plots to --out."},
        footer = {"",
            "Example, a bench sweep generator (6-bit R-2R, 1%% parts, 3.3 V pins):",
            "  rungtone ladder --topology r2r --bits 6 --base-r 10k --tolerance 1%% \\",
            "      --logic-high 3.3V --monte-carlo 2000 --seed 7 \\",
            "      --design --series E24 --pin-limit 8mA --out sweep-ladder",
            "prints the wiring, every level, INL and DNL, the share of 2000 boards",
            "that are monotonic, and E24 values with the lowest INL; writes",
            "levels.csv and PNG plots into sweep-ladder/.",
            "From a file:",
            "  rungtone ladder --ladder examples/ladders/door-chime-weighted.toml",
            "",
            "Pin currents are model estimates for the DC state of each code. GPIO",
            "current limits (per pin and per port) differ between parts: the",
            "microcontroller's datasheet is the authority; --pin-limit only compares",
            "against the figure you give it."})
public final class LadderCommand implements Callable<Integer> {
    @Mixin
    CommonOptions common;

    @Mixin
    LadderOptions ladder;

    @Mixin
    UnitOptions unit;

    @Section(Heading.LADDER)
    @Option(names = "--bits", paramLabel = "N", description = "Bit depth 1..16 (default: the ladder's, else 8).")
    Integer bits;

    @Section(Heading.LADDER)
    @Option(names = "--pin-names", split = ",", paramLabel = "NAME",
            description = "Names of the pins driving bits 0.. for the wiring table, e.g. PB0,PB1 (default pin0..).")
    List<String> pinNames;

    @Option(names = "--all-levels", description = "Print every code's level (default: all up to 64 codes).")
    boolean allLevels;

    @Section(Heading.MONTE_CARLO)
    @Option(names = "--monte-carlo", paramLabel = "K",
            description = "Simulate K boards with resistor values drawn within tolerance.")
    Integer boards;

    @Section(Heading.MONTE_CARLO)
    @Option(names = "--seed", paramLabel = "N", description = "Seed of the Monte Carlo draws (default 1).")
    long seed = 1;

    @Section(Heading.MONTE_CARLO)
    @Option(names = "--gaussian-sigma", paramLabel = "<percent>",
            description = "Draw values from a Gaussian of this relative sigma instead of uniform within tolerance.")
    String gaussianSigma;

    @Section(Heading.LADDER)
    @Option(names = "--design", description = "Propose values from --series (default E24) that minimise worst INL.")
    boolean design;

    @Section(Heading.LADDER)
    @Option(names = "--pin-limit", paramLabel = "<amps>",
            description = "Warn when a pin sources or sinks more than this, such as 20mA; see the part's datasheet.")
    String pinLimit;

    @Option(names = "--out", paramLabel = "DIR", description = "Output folder (default ${DEFAULT-VALUE}).")
    Path out = Path.of("rungtone-out", "ladder");

    @Option(names = "--json", description = "Print JSON instead of text.")
    boolean json;

    @picocli.CommandLine.Spec
    CommandSpec spec;

    @Override
    public Integer call() {
        double limit = pinLimit == null ? Double.POSITIVE_INFINITY
                : parsed("--pin-limit", () -> Units.parse(pinLimit, "A"));
        if (pinLimit != null && !(limit > 0 && limit < Double.POSITIVE_INFINITY)) {
            throw new InputError("--pin-limit: must be a positive value, got " + pinLimit);
        }
        Spread spread = gaussianSigma == null ? Spread.uniform()
                : parsed("--gaussian-sigma", () -> Spread.parseGaussian(gaussianSigma));
        if (boards != null && (boards < 1 || boards > LadderStudy.MAX_BOARDS)) {
            throw new InputError("--monte-carlo: need 1.." + LadderStudy.MAX_BOARDS + " boards, got " + boards);
        }
        AtomicFiles.checkFolderUsable(out);
        Boards.Board board = unit.resolve(bits, ladder, true);
        LadderSpec ladderSpec = board.spec().orElseThrow();
        if (pinNames != null && pinNames.size() != ladderSpec.bits()) {
            throw new InputError("--pin-names: expected " + ladderSpec.bits() + " names for " + ladderSpec.bits()
                    + " bits, bit 0 first, got " + pinNames.size());
        }
        LadderStudy.Request request = new LadderStudy.Request(ladderSpec, pinNames == null ? List.of() : pinNames,
                limit, board.profile().map(UnitProfile::levels),
                Optional.ofNullable(boards).map(k -> new MonteCarlo(k, seed, spread)), design);
        PrintWriter err = spec.commandLine().getErr();
        LadderStudy study;
        try (ProgressMeter meter = ProgressMeter.onStandardError(err, common.quiet)) {
            study = request.run(done -> meter.show("Monte Carlo", boards + " boards", done / (double) boards));
        }
        if (!common.quiet) {
            board.warnings().forEach(w -> err.println("rungtone: warning: " + w));
        }
        List<String> files;
        try (OutputFolder folder = OutputFolder.open(out, "ladder")) {
            files = LadderFiles.write(out, study);
            folder.commit();
        }
        common.print(spec, json, () -> LadderReport.json(study, files, out, Version.get()),
                () -> LadderReport.text(study, allLevels, files));
        return 0;
    }

    /** The value {@code parse} reads, its error prefixed with the option that gave the text. */
    private static <T> T parsed(String option, java.util.function.Supplier<T> parse) {
        try {
            return parse.get();
        } catch (InputError e) {
            throw new InputError(option + ": " + e.getMessage(), e);
        }
    }
}
