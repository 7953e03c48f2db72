package org.rungtone.cli.shell;

import java.util.List;
import java.util.regex.Pattern;

/** Text going into a shell script: words checked to need no quoting, and descriptions made safe to quote. */
final class Words {
    /** Command names, option names and choice words: nothing a shell would read specially. */
    private static final Pattern SAFE = Pattern.compile("[A-Za-z0-9._+ -]*");

    private Words() {
    }

    /**
     * {@code word} unchanged, after checking that it needs no quoting in any shell.
     *
     * @throws IllegalStateException for a word with other characters (a new option's name or choice would
     *     otherwise break every script)
     */
    static String safe(String word) {
        if (!SAFE.matcher(word).matches()) {
            throw new IllegalStateException("not a plain word for a completion script: " + word);
        }
        return word;
    }

    /** Every word of {@code words}, checked ({@link #safe(String)}). */
    static List<String> safe(List<String> words) {
        words.forEach(Words::safe);
        return words;
    }

    /** A shell function name made from a command's name: letters, digits and underscores. */
    static String identifier(String name) {
        return name.replaceAll("[^A-Za-z0-9]", "_");
    }

    /** {@code text} inside single quotes, for bash and zsh: each quote closes, is escaped and reopens. */
    static String singleQuoted(String text) {
        return "'" + text.replace("'", "'\\''") + "'";
    }

    /** The first line of a completion script for {@code shell}: what it completes and the version that wrote it. */
    static String scriptHeader(String shell, String tool, String version) {
        return "# " + shell + " completion for " + tool + ", written by '" + tool + " completion " + shell
                + "' (version " + version + ").\n";
    }
}
