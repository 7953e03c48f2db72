package org.rungtone.cli;

import java.io.PrintWriter;
import java.util.concurrent.Callable;
import org.rungtone.cli.shell.Shell;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/**
 * {@code rungtone completion}: prints a shell completion script generated from the command model, so every
 * command, option and choice the tool knows completes on Tab. The script is the output, printed even with
 * {@code --quiet}, like {@code --json} output elsewhere.
 */
@Command(name = "completion",
        header = "Print a bash, zsh or fish completion script.", mixinStandardHelpOptions = true,
        description = "Print a completion script for bash, zsh or fish, generated from Rungtone's own commands"
            + " and options. Load it in the current shell, or save it where your shell loads completions.",
        footerHeading = "%nExamples:%n",
        footer = {"  source <(rungtone completion bash)",
            "  rungtone completion zsh > ~/.zfunc/_rungtone      (a folder on $fpath)",
            "  rungtone completion fish > ~/.config/fish/completions/rungtone.fish"})
public final class CompletionCommand implements Callable<Integer> {
    @Spec
    CommandSpec spec;

    @Mixin
    CommonOptions common;

    @Parameters(index = "0", arity = "0..1", paramLabel = "SHELL", defaultValue = "bash",
            description = "bash, zsh or fish (default ${DEFAULT-VALUE}).")
    Shell shell;

    @Override
    public Integer call() {
        PrintWriter out = spec.commandLine().getOut();
        out.print(shell.script(spec.root().commandLine(), Version.get()));
        out.flush();
        return 0;
    }
}
