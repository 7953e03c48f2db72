package org.rungtone.cli.shell;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import java.util.Map;
import java.util.OptionalInt;
import picocli.CommandLine;

/** What a command knows of the terminal it runs in: whether standard error is one, and how wide help may be. */
public final class Terminal {
    /** picocli's narrowest help. */
    private static final int NARROWEST = 55;
    /** The width of lines when nothing tells the terminal's. */
    static final int DEFAULT_COLUMNS = 80;

    private Terminal() {
    }

    /**
     * True when standard error is a terminal. Java 17 cannot ask that directly ({@code System.console()} is
     * about standard input and output), so on Linux this reads where {@code /proc/self/fd/2} points, on other
     * POSIX systems it asks the shell ({@code test -t 2}, which costs a process start), and on Windows it
     * takes the console's word.
     */
    public static boolean stderrIsTerminal() {
        Path fd = Path.of("/proc/self/fd/2");
        if (Files.isSymbolicLink(fd)) {
            try {
                String target = Files.readSymbolicLink(fd).toString();
                return target.startsWith("/dev/pts/") || target.startsWith("/dev/tty")
                        || target.equals("/dev/console");
            } catch (IOException | SecurityException e) {
                return false;
            }
        }
        if (System.getProperty("os.name", "").toLowerCase(Locale.ROOT).startsWith("windows")) {
            return System.console() != null;
        }
        try {
            Process p = new ProcessBuilder("sh", "-c", "test -t 2").redirectError(ProcessBuilder.Redirect.INHERIT)
                    .redirectOutput(ProcessBuilder.Redirect.DISCARD).start();
            return p.waitFor() == 0;
        } catch (IOException e) {
            return false;
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            return false;
        }
    }

    /**
     * Makes help as wide as the terminal: {@code COLUMNS} when it is set, else the terminal's own width when
     * standard output is a terminal (picocli asks {@code stty} only when help is printed), else 80 columns.
     * Applies to the commands {@code cl} has now.
     */
    public static void fitHelp(CommandLine cl, Map<String, String> env) {
        OptionalInt columns = columns(env);
        if (columns.isPresent()) {
            cl.setUsageHelpWidth(Math.max(NARROWEST, columns.getAsInt()));
        } else {
            cl.setUsageHelpAutoWidth(true);
        }
    }

    /** The {@code COLUMNS} variable as a width, when it holds a positive number. */
    static OptionalInt columns(Map<String, String> env) {
        String text = env.get("COLUMNS");
        if (text == null) {
            return OptionalInt.empty();
        }
        try {
            int n = Integer.parseInt(text.trim());
            return n > 0 ? OptionalInt.of(n) : OptionalInt.empty();
        } catch (NumberFormatException e) {
            return OptionalInt.empty();
        }
    }
}
