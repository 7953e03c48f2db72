package org.rungtone.cli;

import java.util.Optional;
import java.util.OptionalInt;
import org.rungtone.calibrate.CodeChoice;
import org.rungtone.calibrate.MeterRanges;
import org.rungtone.cli.shell.Heading;
import org.rungtone.cli.shell.Section;
import org.rungtone.ladder.LadderSpec;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;

/** The ladder and the choice of codes to measure, shared by 'calibrate plan', 'simulate' and 'listen'. */
public final class PlanOptions {
    @Section(Heading.LADDER)
    @Option(names = "--bits", paramLabel = "N", description = "Bit depth 1..16 (default: the ladder's, else 8).")
    Integer bits;

    @Mixin
    LadderOptions ladder;

    @Section(Heading.MEASURING)
    @Option(names = "--verify", paramLabel = "K", description = "Check codes on top of the basis (default: every code"
            + " up to 6 bits, or up to 10 for a recording; else 2·N).")
    Integer verify;

    @Section(Heading.MEASURING)
    @Option(names = "--every-code", description = "Measure every code; the measured levels then are the profile.")
    boolean everyCode;

    @Option(names = "--meter-counts", paramLabel = "N", description = "Choose the check codes for a meter of N"
            + " counts (2000 for 3½ digits, 20000 for 4½), most of them on its finer ranges.")
    String meterCounts;

    @Option(names = "--fixed-range", description = "The meter stays on one range (default: autoranging).")
    boolean fixedRange;

    /** The described ladder. */
    LadderSpec spec() {
        return ladder.spec(LadderOptions.bitsOrZero(bits));
    }

    /** The choice of codes to measure. */
    CodeChoice choice() {
        return new CodeChoice(everyCode, verify == null ? OptionalInt.empty() : OptionalInt.of(verify),
                Optional.ofNullable(meterCounts).map(c -> MeterRanges.parse(c, !fixedRange)));
    }
}
