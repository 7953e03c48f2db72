package org.rungtone.cli;

import java.util.OptionalInt;
import org.rungtone.calibrate.CodeChoice;
import org.rungtone.cli.shell.Heading;
import org.rungtone.cli.shell.Section;
import org.rungtone.internal.InputError;
import org.rungtone.ladder.LadderSpec;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;

/** The ladder and the choice of codes to measure, shared by 'calibrate plan' and 'calibrate simulate'. */
public final class PlanOptions {
    @Section(Heading.LADDER)
    @Option(names = "--bits", paramLabel = "N", description = "Bit depth 1..16 (default: the ladder's, else 8).")
    Integer bits;

    @Mixin
    LadderOptions ladder;

    @Section(Heading.MEASURING)
    @Option(names = "--verify", paramLabel = "K",
            description = "Check codes on top of the basis (default: every code up to 6 bits, else 2·N).")
    Integer verify;

    @Section(Heading.MEASURING)
    @Option(names = "--every-code", description = "Measure every code; the readings then are the profile.")
    boolean everyCode;

    /** Checks that the code choices do not contradict each other. */
    void check() {
        if (everyCode && verify != null) {
            throw new InputError("--every-code and --verify exclude each other; give one");
        }
    }

    /** The described ladder. */
    LadderSpec spec() {
        return ladder.spec(LadderOptions.bitsOrZero(bits));
    }

    /** The choice of codes to measure. */
    CodeChoice choice() {
        return new CodeChoice(everyCode, verify == null ? OptionalInt.empty() : OptionalInt.of(verify));
    }
}
