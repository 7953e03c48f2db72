package org.rungtone.cli.shell;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.rungtone.cli.shell.CompletionTree.Kind;
import org.rungtone.cli.shell.CompletionTree.Opt;
import org.rungtone.cli.shell.CompletionTree.Values;

/**
 * A fish completion script: one {@code complete -c} line per subcommand, option and operand, each guarded by a
 * condition that compares the command path typed so far with the command it belongs to. The path comes from
 * a small function that walks the tokens before the cursor, skipping options' values; file names are offered
 * only where a file is taken.
 */
final class FishScript {
    private FishScript() {
    }

    /** The script for the tree's tool, naming the version that wrote it. */
    static String of(CompletionTree root, String version) {
        String tool = root.name();
        String fn = "__" + Words.identifier(tool);
        StringBuilder b = new StringBuilder();
        b.append(Words.scriptHeader("fish", tool, version))
                .append("# Save it as ~/.config/fish/completions/").append(tool).append(".fish, or load it with: ")
                .append(tool).append(" completion fish | source\n\n");
        lookups(b, root, fn);
        b.append(PATH.replace("__T", fn)).append('\n');
        b.append("complete -c ").append(tool).append(" -f\n");
        for (CompletionTree c : root.all()) {
            String when = " -n " + quoted(fn + "_at " + quoted(c.key()));
            b.append("\n# ").append(String.join(" ", c.path())).append('\n');
            for (CompletionTree sub : c.subcommands()) {
                b.append("complete -c ").append(tool).append(when).append(" -a ").append(Words.safe(sub.name()))
                        .append(" -d ").append(quoted(sub.summary())).append('\n');
            }
            for (Opt o : c.options()) {
                b.append("complete -c ").append(tool).append(when).append(names(o)).append(takes(o.values()))
                        .append(" -d ").append(quoted(o.summary())).append('\n');
            }
            if (c.maxOperands() > 0 && c.operands().kind() != Kind.TEXT) {
                b.append("complete -c ").append(tool).append(when).append(c.operands().kind() == Kind.FILE ? " -F"
                        : " -a " + quoted(String.join(" ", Words.safe(c.operands().words())))).append('\n');
            }
        }
        return b.toString();
    }

    private static void lookups(StringBuilder b, CompletionTree root, String fn) {
        Map<String, List<String>> commands = new LinkedHashMap<>();
        List<String> valued = new ArrayList<>();
        for (CompletionTree c : root.all()) {
            if (!c.subcommands().isEmpty()) {
                commands.put(c.key(), Words.safe(c.subcommands().stream().map(CompletionTree::name).toList()));
            }
            for (Opt o : c.options()) {
                if (o.values().kind() != Kind.NONE) {
                    o.names().forEach(name -> valued.add(quoted(c.key() + " " + Words.safe(name))));
                }
            }
        }
        b.append("# The subcommands of command path $path (the names below the tool's).\n")
                .append("function ").append(fn).append("_commands --argument-names path\n    switch \"$path\"\n");
        commands.forEach((key, names) -> b.append("        case ").append(quoted(key))
                .append("\n            printf '%s\\n' ").append(String.join(" ", names)).append('\n'));
        b.append("    end\nend\n\n# True when option $option of command path $path takes a value.\n")
                .append("function ").append(fn).append("_takes_value --argument-names path option\n")
                .append("    switch \"$path $option\"\n        case");
        for (int i = 0; i < valued.size(); i++) {
            b.append(i > 0 && i % 4 == 0 ? " \\\n            " : " ").append(valued.get(i));
        }
        b.append("\n            return 0\n    end\n    return 1\nend\n\n");
    }

    /** The option's names as {@code -s X -l NAME}. */
    private static String names(Opt o) {
        StringBuilder b = new StringBuilder();
        for (String name : Words.safe(o.names())) {
            b.append(name.startsWith("--") ? " -l " + name.substring(2) : " -s " + name.substring(1));
        }
        return b.toString();
    }

    /** What follows an option: a file ({@code -r -F}), one of the words ({@code -x -a}), or text ({@code -x}). */
    private static String takes(Values v) {
        return switch (v.kind()) {
            case NONE -> "";
            case FILE -> " -r -F";
            case WORDS -> " -x -a " + quoted(String.join(" ", Words.safe(v.words())));
            default -> " -x";
        };
    }

    /** {@code text} in fish's single quotes, where only a quote and a backslash are escaped. */
    private static String quoted(String text) {
        return "'" + text.replace("\\", "\\\\").replace("'", "\\'") + "'";
    }

    private static final String PATH = """
            # The command path typed so far: the subcommands among the tokens before the cursor, options' values
            # skipped (--rate 16k), up to the first operand.
            function __T_path
                set -l tokens (commandline -opc)
                set -e tokens[1]
                set -l path ''
                set -l skip 0
                set -l operands 0
                for word in $tokens
                    if test $skip = 1
                        set skip 0
                        continue
                    end
                    switch $word
                        case '-*=*'
                        case '-*'
                            if __T_takes_value "$path" $word
                                set skip 1
                            end
                        case '*'
                            if test $operands = 0; and contains -- $word (__T_commands "$path")
                                set path (string trim -- "$path $word")
                            else
                                set operands (math $operands + 1)
                            end
                    end
                end
                echo $path
            end

            # True when the command path typed so far is $want.
            function __T_at --argument-names want
                set -l have (__T_path)
                test "$have" = "$want"
            end
            """;
}
