package org.rungtone.cli.shell;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import picocli.CommandLine;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Model.OptionSpec;

/** "Did you mean": the nearest of a command's own options, or of its subcommands, to a word it does not know. */
public final class Mistyped {
    private Mistyped() {
    }

    /**
     * One line for an unknown option or subcommand, naming the nearest known ones when any is close:
     * {@code unknown option '--bitz'; did you mean --bits?}. Empty when the unmatched words are neither (an
     * extra file name, say), for which picocli's own message is the clearer one.
     */
    public static Optional<String> message(CommandLine.UnmatchedArgumentException e) {
        CommandSpec spec = e.getCommandLine().getCommandSpec();
        List<String> unmatched = e.getUnmatched();
        for (String arg : unmatched) {
            if (isOption(arg)) {
                String name = arg.contains("=") ? arg.substring(0, arg.indexOf('=')) : arg;
                return Optional.of("unknown option '" + name + "'" + hint(Spelling.nearest(name, options(spec))));
            }
        }
        if (unmatched.isEmpty() || spec.subcommands().isEmpty()) {
            return Optional.empty();
        }
        String word = unmatched.get(0);
        return Optional.of("unknown command '" + word + "'" + hint(Spelling.nearest(word, commands(spec))));
    }

    private static boolean isOption(String arg) {
        return arg.length() > 1 && arg.charAt(0) == '-' && !Character.isDigit(arg.charAt(1));
    }

    private static List<String> options(CommandSpec spec) {
        List<String> names = new ArrayList<>();
        for (OptionSpec o : spec.options()) {
            if (!o.hidden()) {
                names.addAll(List.of(o.names()));
            }
        }
        return names;
    }

    private static List<String> commands(CommandSpec spec) {
        List<String> names = new ArrayList<>();
        spec.subcommands().forEach((name, sub) -> {
            if (!sub.getCommandSpec().usageMessage().hidden()) {
                names.add(name);
            }
        });
        return names;
    }

    private static String hint(List<String> nearest) {
        if (nearest.isEmpty()) {
            return "";
        }
        int last = nearest.size() - 1;
        String alternatives = last == 0 ? nearest.get(0)
                : String.join(", ", nearest.subList(0, last)) + " or " + nearest.get(last);
        return "; did you mean " + alternatives + "?";
    }
}
