package org.rungtone.cli;

import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.HashSet;
import java.util.Set;
import org.junit.jupiter.api.Test;
import org.rungtone.internal.Setting;
import picocli.CommandLine;

class OptionNamesTest {
    @Test
    void everySettingNamesAnOptionThatACommandHas() {
        Set<String> options = new HashSet<>();
        collect(Main.newCommandLine(), options);
        for (Setting s : Setting.values()) {
            String name = OptionNames.of(s);
            assertTrue(s == Setting.SOURCE ? name.equals("SOURCE") : options.contains(name),
                    s + " maps to " + name + ", which no command has");
        }
    }

    private static void collect(CommandLine cl, Set<String> options) {
        for (CommandLine.Model.OptionSpec o : cl.getCommandSpec().options()) {
            options.add(o.longestName());
        }
        for (CommandLine sub : cl.getSubcommands().values()) {
            collect(sub, options);
        }
    }
}
