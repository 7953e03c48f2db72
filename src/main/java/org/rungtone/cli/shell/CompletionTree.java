package org.rungtone.cli.shell;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import picocli.CommandLine;
import picocli.CommandLine.Model.ArgSpec;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Model.OptionSpec;
import picocli.CommandLine.Model.PositionalParamSpec;

/**
 * The commands as a completion script offers them, read once from picocli's command model: each command's
 * subcommands, options and operands, and what every option takes (nothing, free text, a file name, or one of
 * fixed words). Hidden options and commands are left out.
 *
 * @param path the command names from the tool's own down: {@code [rungtone, calibrate, plan]}
 * @param summary the first sentence of the command's help
 * @param options the options, in the command's order
 * @param operands what the positional parameters take ({@link Kind#NONE} when there are none)
 * @param operandLabel the first positional parameter's label in help, e.g. {@code SOURCE} ("" when none)
 * @param maxOperands how many positional parameters the command takes at most
 * @param subcommands the subcommands, in help order
 */
record CompletionTree(List<String> path, String summary, List<Opt> options, Values operands, String operandLabel,
        int maxOperands, List<CompletionTree> subcommands) {
    /** Most operands counted: enough for any command, small enough for a script's arithmetic. */
    private static final int MANY = 99;
    /** A full stop that ends a sentence: another sentence starts after it. */
    private static final Pattern SENTENCE_END = Pattern.compile("\\. [A-Z]");

    /** What an option or operand takes. */
    enum Kind {
        /** Nothing: a flag. */
        NONE,
        /** Free text: a number, a quantity, a name. */
        TEXT,
        /** A file or folder name. */
        FILE,
        /** One of fixed words. */
        WORDS
    }

    /**
     * An option.
     *
     * @param names every name, short ones first as declared: {@code [-q, --quiet]}
     * @param summary the first sentence of its description
     * @param values what it takes
     */
    record Opt(List<String> names, String summary, Values values) {
    }

    /**
     * What an option or operand takes.
     *
     * @param kind nothing, text, a file name or fixed words
     * @param words the words, for {@link Kind#WORDS}
     */
    record Values(Kind kind, List<String> words) {
        static final Values NONE = new Values(Kind.NONE, List.of());
    }

    /** The tree below {@code root}, as its command model stands. */
    static CompletionTree read(CommandLine root) {
        return read(root, List.of(root.getCommandName()));
    }

    private static CompletionTree read(CommandLine cl, List<String> path) {
        CommandSpec spec = cl.getCommandSpec();
        List<Opt> options = new ArrayList<>();
        for (OptionSpec o : spec.options()) {
            if (!o.hidden()) {
                options.add(new Opt(List.of(o.names()), summary(o.description()), values(o, cl)));
            }
        }
        Values operands = Values.NONE;
        String label = "";
        int most = 0;
        for (PositionalParamSpec p : spec.positionalParameters()) {
            if (!p.hidden()) {
                if (label.isEmpty()) {
                    operands = values(p, cl);
                    label = p.paramLabel();
                }
                most = Math.min(MANY, most + p.arity().max());
            }
        }
        List<CompletionTree> subcommands = new ArrayList<>();
        cl.getSubcommands().forEach((name, sub) -> {
            if (!sub.getCommandSpec().usageMessage().hidden() && sub.getCommandName().equals(name)) {
                List<String> below = new ArrayList<>(path);
                below.add(name);
                subcommands.add(read(sub, below));
            }
        });
        String[] header = spec.usageMessage().header();
        return new CompletionTree(List.copyOf(path), summary(header.length > 0 ? header
                : spec.usageMessage().description()), options, operands, label, most, subcommands);
    }

    /** What {@code arg} of command {@code cl} takes; the help command's operand is a sibling command's name. */
    private static Values values(ArgSpec arg, CommandLine cl) {
        if (arg.arity().max() == 0) {
            return Values.NONE;
        }
        if (arg.isPositional() && cl.getCommand() instanceof CommandLine.HelpCommand && cl.getParent() != null) {
            return new Values(Kind.WORDS, List.copyOf(cl.getParent().getSubcommands().keySet()));
        }
        List<String> words = ChoiceWords.of(arg);
        if (!words.isEmpty()) {
            return new Values(Kind.WORDS, words);
        }
        Class<?> type = arg.type();
        return Path.class.isAssignableFrom(type) || type == java.io.File.class ? new Values(Kind.FILE, List.of())
                : new Values(Kind.TEXT, List.of());
    }

    /**
     * The first sentence of a description, its format escapes ({@code %%}, {@code %n}) resolved: up to a full
     * stop before a capital letter, so "e.g. 16k" stays inside the sentence.
     */
    static String summary(String[] description) {
        String text = String.join(" ", description).replace("%n", " ").replace("%%", "%").replaceAll("\\s+", " ")
                .trim();
        Matcher end = SENTENCE_END.matcher(text);
        return end.find() ? text.substring(0, end.start() + 1) : text;
    }

    /** The command's names below the tool's, space-separated: "" for the tool, "calibrate plan". */
    String key() {
        return String.join(" ", path.subList(1, path.size()));
    }

    /** The command's own name. */
    String name() {
        return path.get(path.size() - 1);
    }

    /** This command and every command below it, parents first. */
    List<CompletionTree> all() {
        List<CompletionTree> all = new ArrayList<>();
        all.add(this);
        for (CompletionTree sub : subcommands) {
            all.addAll(sub.all());
        }
        return all;
    }
}
