package org.rungtone.cli;

import java.io.PrintWriter;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.Callable;
import picocli.AutoComplete;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/**
 * {@code rungtone completion}: prints a shell completion script generated from the command model, so every
 * command, option and enum value the tool knows completes on Tab. The script is the output, printed even with
 * {@code --quiet}, like {@code --json} output elsewhere.
 */
@Command(name = "completion",
        header = "Print a bash or zsh completion script.", mixinStandardHelpOptions = true,
        description = {"Print a completion script for bash or zsh, generated from Rungtone's own commands and",
            "options. Load it in the current shell, or save it where your shell loads completions."},
        footerHeading = "%nExamples:%n",
        footer = {"  source <(rungtone completion)",
            "  rungtone completion > ~/.local/share/bash-completion/completions/rungtone",
            "  (zsh: run 'autoload -U +X bashcompinit && bashcompinit' first, or let the script do it)"})
public final class CompletionCommand implements Callable<Integer> {
    /** Shells the script serves; both get the same script, which sets zsh up through bashcompinit. */
    enum Shell {
        BASH, ZSH
    }

    /** The shell names as users type them, for help and for completion. */
    static final class ShellNames extends ArrayList<String> {
        private static final long serialVersionUID = 1L;

        ShellNames() {
            super(List.of("bash", "zsh"));
        }
    }

    @Spec
    CommandLine.Model.CommandSpec spec;

    @Mixin
    CommonOptions common;

    @Option(names = "--shell", paramLabel = "<shell>", defaultValue = "bash",
            completionCandidates = ShellNames.class,
            description = "Shell to complete for: ${COMPLETION-CANDIDATES} (default ${DEFAULT-VALUE}).")
    Shell shell;

    @Override
    public Integer call() {
        CommandLine root = spec.root().commandLine();
        PrintWriter out = spec.commandLine().getOut();
        out.print(AutoComplete.bash(root.getCommandName(), root));
        out.flush();
        return 0;
    }
}
