package org.rungtone.cli.shell;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.rungtone.cli.Main;
import org.rungtone.cli.shell.CompletionTree.Kind;
import org.rungtone.cli.shell.CompletionTree.Opt;
import org.rungtone.firmware.TargetFamily;
import org.rungtone.ladder.ESeries;
import org.rungtone.ladder.Topology;
import picocli.CommandLine;
import picocli.CommandLine.Model.OptionSpec;

/** Every word completion offers is one its option takes, spelt as the option's help spells it. */
class ChoiceWordsTest {
    private static final CommandLine ROOT = Main.newCommandLine();
    private static final CompletionTree TREE = CompletionTree.read(ROOT);

    /** The command line of {@code c}. */
    private static CommandLine commandLine(CompletionTree c) {
        CommandLine cl = ROOT;
        for (String name : c.path().subList(1, c.path().size())) {
            cl = cl.getSubcommands().get(name);
        }
        return cl;
    }

    private static List<String[]> choices() {
        List<String[]> found = new ArrayList<>();
        for (CompletionTree c : TREE.all()) {
            for (Opt o : c.options()) {
                if (o.values().kind() == Kind.WORDS) {
                    found.add(new String[] {c.key(), o.names().get(o.names().size() - 1)});
                }
            }
        }
        return found;
    }

    @Test
    void theChoiceOptionsAreThoseTheDocsList() {
        List<String> options = choices().stream().map(c -> c[0] + " " + c[1]).filter(s -> s.startsWith("build "))
                .toList();
        assertEquals(List.of("build --dither", "build --shaping", "build --resampler", "build --topology",
                "build --series", "build --compensation", "build --span", "build --target", "build --timer",
                "build --pin-strategy", "build --storage", "build --engine"), options);
    }

    @Test
    void everyWordIsAcceptedByItsOption() {
        for (String[] choice : choices()) {
            CompletionTree c = TREE.all().stream().filter(t -> t.key().equals(choice[0])).findFirst().orElseThrow();
            Opt o = c.options().stream().filter(x -> x.names().contains(choice[1])).findFirst().orElseThrow();
            for (String word : o.values().words()) {
                List<String> args = new ArrayList<>(c.path().subList(1, c.path().size()));
                args.addAll(List.of(choice[1], word));
                if (!commandLine(c).getCommandSpec().positionalParameters().isEmpty()) {
                    args.add("operand");
                }
                // the converter takes it (a usage error otherwise) ...
                ROOT.parseArgs(args.toArray(String[]::new));
                // ... and so does the stage, for options typed as text
                switch (choice[1]) {
                    case "--target" -> TargetFamily.parse(word);
                    case "--topology" -> Topology.parse(word);
                    case "--series" -> ESeries.parse(word);
                    default -> { }
                }
            }
        }
    }

    @Test
    void wordsAreSpeltAsTheHelpSpellsThem() {
        for (String[] choice : choices()) {
            CompletionTree c = TREE.all().stream().filter(t -> t.key().equals(choice[0])).findFirst().orElseThrow();
            List<String> words = c.options().stream().filter(x -> x.names().contains(choice[1])).findFirst()
                    .orElseThrow().values().words();
            OptionSpec spec = commandLine(c).getCommandSpec().findOption(choice[1]);
            String label = spec.paramLabel();
            String where = choice[0] + " " + choice[1];
            if (label.matches("[a-z0-9]+(\\|[a-z0-9]+)+")) {
                assertEquals(Arrays.asList(label.split("\\|")), words, where);
            } else if (choice[1].equals("--series")) {
                // IEC 60063:2015 names the series E6, E12, E24, E48, E96, E192
                assertEquals(List.of("E6", "E12", "E24", "E48", "E96", "E192"), words, where);
            } else {
                String help = label + " " + String.join(" ", spec.description());
                words.forEach(w -> assertTrue(help.contains(w), where + ": " + w + " not in its help"));
            }
            words.forEach(w -> assertFalse(w.isEmpty(), where));
        }
    }
}
