package org.rungtone.cli.shell;

import java.lang.reflect.Field;
import java.util.ArrayList;
import java.util.EnumMap;
import java.util.List;
import java.util.Map;
import picocli.CommandLine;
import picocli.CommandLine.Help;
import picocli.CommandLine.Model.OptionSpec;

/**
 * Lists a command's options under headings ({@link Heading}) in its help, when its options name headings
 * ({@link Section}): positional parameters first, under "Input", then each heading's options in the command's
 * order. A command whose options name no heading of their own keeps picocli's plain list.
 */
public final class HelpSections {
    private HelpSections() {
    }

    /** The two sections this replaces; a class rather than lambdas, so a run without help links none. */
    private enum Renderer implements CommandLine.IHelpSectionRenderer {
        /** Positional parameters: moved under "Input" when there are headings. */
        PARAMETERS,
        /** Options: under their headings. */
        OPTIONS;

        @Override
        public String render(Help help) {
            if (this == OPTIONS) {
                return options(help);
            }
            return grouped(help).isEmpty() ? help.parameterList() : "";
        }
    }

    /** Uses the headings in the help of {@code cl} and of every subcommand it has now. */
    public static void install(CommandLine cl) {
        Map<String, CommandLine.IHelpSectionRenderer> sections = cl.getHelpSectionMap();
        sections.put(CommandLine.Model.UsageMessageSpec.SECTION_KEY_PARAMETER_LIST, Renderer.PARAMETERS);
        sections.put(CommandLine.Model.UsageMessageSpec.SECTION_KEY_OPTION_LIST, Renderer.OPTIONS);
        cl.setHelpSectionMap(sections);
        for (CommandLine sub : cl.getSubcommands().values()) {
            install(sub);
        }
    }

    private static String options(Help help) {
        Map<Heading, List<OptionSpec>> grouped = grouped(help);
        if (grouped.isEmpty()) {
            return help.optionList();
        }
        StringBuilder b = new StringBuilder();
        grouped.forEach((heading, options) -> {
            b.append(help.createHeading("%n" + heading.title() + ":%n"));
            if (heading == Heading.INPUT) {
                b.append(help.parameterList());
            }
            b.append(help.optionListExcludingGroups(options));
        });
        return b.toString();
    }

    /**
     * The visible options under their headings, in heading order, with the positional parameters opening
     * "Input"; empty when no option names a heading of its own.
     */
    private static Map<Heading, List<OptionSpec>> grouped(Help help) {
        Map<Heading, List<OptionSpec>> grouped = new EnumMap<>(Heading.class);
        for (OptionSpec o : help.commandSpec().options()) {
            if (!o.hidden()) {
                grouped.computeIfAbsent(heading(o), h -> new ArrayList<>()).add(o);
            }
        }
        if (grouped.keySet().stream().allMatch(h -> h == Heading.OUTPUT)) {
            return Map.of();
        }
        if (!help.commandSpec().positionalParameters().isEmpty()) {
            grouped.computeIfAbsent(Heading.INPUT, h -> new ArrayList<>());
        }
        return grouped;
    }

    /** The option's own heading, else its class's (or an enclosing class's), else {@link Heading#OUTPUT}. */
    private static Heading heading(OptionSpec o) {
        if (o.userObject() instanceof Field field) {
            Section own = field.getAnnotation(Section.class);
            if (own != null) {
                return own.value();
            }
            for (Class<?> c = field.getDeclaringClass(); c != null; c = c.getEnclosingClass()) {
                Section shared = c.getAnnotation(Section.class);
                if (shared != null) {
                    return shared.value();
                }
            }
        }
        return Heading.OUTPUT;
    }
}
