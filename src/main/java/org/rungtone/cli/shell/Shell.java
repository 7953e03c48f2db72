package org.rungtone.cli.shell;

import picocli.CommandLine;

/** The shells Rungtone writes completion scripts for. */
public enum Shell {
    /** GNU bash, through {@code complete -F}. */
    BASH,
    /** zsh, through its completion system ({@code compdef}, {@code _arguments}). */
    ZSH,
    /** fish, through {@code complete -c}. */
    FISH;

    /** The completion script for the commands below {@code root}, naming the tool's {@code version}. */
    public String script(CommandLine root, String version) {
        CompletionTree tree = CompletionTree.read(root);
        return switch (this) {
            case BASH -> BashScript.of(tree, version);
            case ZSH -> ZshScript.of(tree, version);
            case FISH -> FishScript.of(tree, version);
        };
    }
}
