package org.rungtone.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Test;
import org.rungtone.internal.Units;
import org.rungtone.project.Defaults;
import org.rungtone.quantize.Compensation;
import org.rungtone.quantize.Dither;
import org.rungtone.quantize.ErrorFilter;
import picocli.CommandLine;

/** The defaults the help shows are the library's ({@link Defaults}): one place decides them. */
class OptionDefaultsTest {
    private static String defaultOf(String command, String option) {
        return Main.newCommandLine().getSubcommands().get(command).getCommandSpec().findOption(option)
                .defaultValue();
    }

    @Test
    void buildAndSurveyShowTheLibrarysDefaults() {
        for (String command : new String[] {"build", "survey"}) {
            String dither = defaultOf(command, "--dither").toUpperCase(java.util.Locale.ROOT);
            assertEquals(Defaults.DITHER, Dither.valueOf(dither), command);
            assertEquals(Defaults.SHAPING, ErrorFilter.parse(defaultOf(command, "--shaping")), command);
            assertEquals(Defaults.SEED, Long.parseLong(defaultOf(command, "--seed")), command);
        }
        assertEquals(Defaults.COMPENSATION, Compensation.parse(defaultOf("build", "--compensation")));
        assertEquals(Defaults.FULL_SCALE_VOLTS, Units.parse(defaultOf("build", "--full-scale"), "V"), 0);
        assertEquals(Defaults.PREVIEW_RATE_HZ, Units.parse(defaultOf("build", "--preview-rate"), "Hz"), 0);
        assertEquals(Defaults.PREVIEW_SECONDS, Units.parse(defaultOf("build", "--preview-length"), "s"), 0);
        CommandLine.Model.OptionSpec filter = Main.newCommandLine().getSubcommands().get("build").getCommandSpec()
                .findOption("--filter");
        assertEquals(Defaults.filter().describe(), org.rungtone.analysis.ReconstructionFilter
                .parse(filter.defaultValue()).describe());
    }
}
