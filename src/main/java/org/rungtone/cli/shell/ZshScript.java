package org.rungtone.cli.shell;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.rungtone.cli.shell.CompletionTree.Kind;
import org.rungtone.cli.shell.CompletionTree.Opt;
import org.rungtone.cli.shell.CompletionTree.Values;

/**
 * A zsh completion script on zsh's own completion system: one function per command, each a call of
 * {@code _arguments} with an entry per option (its description, and {@code _files} or the words it takes);
 * a command with subcommands offers them with {@code _describe} and hands the rest of the line to the chosen
 * one. The file works both ways zsh loads completions: saved as {@code _TOOL} in a folder on {@code $fpath}
 * (its {@code #compdef} line registers it), or sourced, when it registers itself with {@code compdef}.
 */
final class ZshScript {
    private ZshScript() {
    }

    /** The script for the tree's tool, naming the version that wrote it. */
    static String of(CompletionTree root, String version) {
        String tool = root.name();
        StringBuilder b = new StringBuilder();
        b.append("#compdef ").append(tool).append('\n')
                .append(Words.scriptHeader("zsh", tool, version))
                .append("# Save it as _").append(tool).append(" in a folder on $fpath, or load it with: source <(")
                .append(tool).append(" completion zsh)\n\n");
        for (CompletionTree c : root.all()) {
            function(b, c);
        }
        String fn = function(root);
        b.append("if [ \"$funcstack[1]\" = \"").append(fn).append("\" ]; then\n    ").append(fn).append(" \"$@\"\n")
                .append("else\n    (( $+functions[compdef] )) || { autoload -Uz compinit && compinit }\n")
                .append("    compdef ").append(fn).append(' ').append(tool).append("\nfi\n");
        return b.toString();
    }

    private static String function(CompletionTree c) {
        return "_" + Words.identifier(String.join("_", c.path()));
    }

    private static void function(StringBuilder b, CompletionTree c) {
        boolean branches = !c.subcommands().isEmpty();
        b.append(function(c)).append("() {\n");
        if (branches) {
            b.append("    local curcontext=\"$curcontext\" state line ret=1\n");
        }
        List<String> specs = new ArrayList<>();
        for (Opt o : c.options()) {
            specs.addAll(specs(o));
        }
        if (branches) {
            specs.add("'1: :->command'");
            specs.add("'*:: :->argument'");
        } else if (c.maxOperands() > 0) {
            specs.add("'" + (c.maxOperands() > 1 ? "*" : "1") + ":" + label(c.operands(), c.operandLabel()) + "'");
        }
        b.append("    _arguments ").append(branches ? "-C " : "").append("-s -S");
        for (String spec : specs) {
            b.append(" \\\n        ").append(spec);
        }
        b.append(branches ? " && ret=0\n" : "\n");
        if (branches) {
            dispatch(b, c);
        }
        b.append("}\n\n");
    }

    /** The subcommand choice and the hand-over to the chosen subcommand's function. */
    private static void dispatch(StringBuilder b, CompletionTree c) {
        b.append("    case $state in\n        command)\n            local -a commands\n            commands=(\n");
        for (CompletionTree sub : c.subcommands()) {
            b.append("                ").append(Words.singleQuoted(Words.safe(sub.name()) + ":"
                    + description(sub.summary()).replace(":", "\\:"))).append('\n');
        }
        b.append("            )\n            _describe -t commands '").append(Words.safe(c.name()))
                .append(" command' commands && ret=0\n            ;;\n        argument)\n")
                .append("            curcontext=\"${curcontext%:*:*}:").append(Words.safe(String.join("-", c.path())))
                .append("-$words[1]:\"\n            case $words[1] in\n");
        for (CompletionTree sub : c.subcommands()) {
            b.append("                ").append(sub.name()).append(") ").append(function(sub))
                    .append(" && ret=0 ;;\n");
        }
        b.append("            esac\n            ;;\n    esac\n    return ret\n");
    }

    /** One {@code _arguments} entry per name of the option; names of one option exclude each other. */
    private static List<String> specs(Opt o) {
        List<String> specs = new ArrayList<>();
        String exclude = o.names().size() > 1 ? "(" + String.join(" ", Words.safe(o.names())) + ")" : "";
        String text = "[" + description(o.summary()) + "]";
        for (String name : o.names()) {
            String spec;
            if (o.values().kind() == Kind.NONE) {
                spec = exclude + name + text;
            } else {
                String bare = name.replaceFirst("^-+", "");
                spec = exclude + name + (name.startsWith("--") ? "=" : "+") + text + ":"
                        + label(o.values(), bare);
            }
            specs.add(Words.singleQuoted(spec));
        }
        return specs;
    }

    /** "message:action" for what is taken: file names, one of the words, or free text (a message only). */
    private static String label(Values v, String message) {
        String m = message.toLowerCase(Locale.ROOT).replaceAll("[^a-z0-9.-]", "");
        return switch (v.kind()) {
            case FILE -> m + ":_files";
            case WORDS -> m + ":(" + String.join(" ", Words.safe(v.words())) + ")";
            default -> m + ": ";
        };
    }

    /** A description for an {@code _arguments} bracket: brackets and backslashes would end or escape it. */
    private static String description(String summary) {
        return summary.replace('[', '(').replace(']', ')').replace("\\", "");
    }
}
